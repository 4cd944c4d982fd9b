package segment

import (
	"fmt"
	"math"
	"math/rand/v2"

	"gonum.org/v1/gonum/floats"
)

// LogProbEstimate returns an estimate of log P(s), the probability of
// segmentation s under the word model of cfg (unigram or bigram) with
// hyperparameters h, summed over seating arrangements: the log of the mean,
// over draws, of the product of every token's predictive probability as
// the words of s are seated afresh in corpus order, each token's seat drawn
// given the tokens before it. Each product is an unbiased estimate of P(s)
// (sequential importance sampling with the predictive seating as
// proposal; common practice), so their mean is too, and its
// log errs low by no more than the spread of the products. For the
// Dirichlet-process unigram model with a uniform base no predictive
// depends on the seating and the estimate is exact.
//
// It compares the model's preference for two segmentations of a corpus
// too large for ExactLogJoint, such as a learned one and the reference.
// LogProbEstimate panics for the collocation model or draws < 1.
func LogProbEstimate(s *Segmentation, cfg Config, h Hyper, draws int, rng *rand.Rand) float64 {
	if cfg.Model != "unigram" && cfg.Model != "bigram" {
		panic(fmt.Sprintf("segment: LogProbEstimate of the %s model", cfg.Model))
	}
	if draws < 1 {
		panic("segment: LogProbEstimate needs at least one draw")
	}
	lps := make([]float64, draws)
	for d := range lps {
		m := newModel(s.Corpus, cfg, h)
		lps[d] = m.AddSegmentation(s, rng)
		lps[d] += m.logEnds(m.tokens)
	}
	return floats.LogSumExp(lps) - math.Log(float64(draws))
}

// FitHyper returns the hyperparameters of cfg's word model after rounds
// of resampling those cfg.Fixed leaves free, starting from h, with the
// words of s seated once in corpus order and held: roughly the values a
// chain held at s would settle on. With LogProbEstimate it rates a
// segmentation under parameters suited to it, not to another one.
func FitHyper(s *Segmentation, cfg Config, h Hyper, rounds int, rng *rand.Rand) Hyper {
	if cfg.Model != "unigram" && cfg.Model != "bigram" {
		panic(fmt.Sprintf("segment: FitHyper of the %s model", cfg.Model))
	}
	m := newModel(s.Corpus, cfg, h)
	m.AddSegmentation(s, rng)
	for range rounds {
		m.SampleHyperparameters(cfg.Fixed, rng)
	}
	return m.hyper()
}
