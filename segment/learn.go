package segment

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"sync"
)

// Config says how to learn a segmentation.
type Config struct {
	// Model names the word model: "unigram" or "bigram".
	Model string `json:"model"`
	// Base names the base distribution over word forms: "uniform" (every
	// unit equally likely, a geometric length) or "ngram" (a hierarchical
	// Pitman-Yor model over units that learns the phonotactics).
	Base string `json:"base"`
	// NgramOrder is the order of the "ngram" base.
	NgramOrder int `json:"ngram_order,omitempty"`
	// Sampler names the sampler: "boundary" (one gap at a time),
	// "blocked" (one utterance at a time) or "auto" (see SamplerFor).
	Sampler string `json:"sampler"`
	// Proposal names what the blocked sampler draws proposals from with
	// the bigram model: "bigram" (the bigram predictives) or "unigram"
	// (the unigram level, a lattice MaxWordLength times smaller; the
	// Metropolis-Hastings test corrects). On the English corpus unigram
	// proposals made sweeps 4 times cheaper but mixed so badly that 100
	// sweeps reached token F 0.40 against 0.61 with bigram proposals.
	Proposal string `json:"proposal,omitempty"`
	// MaxWordLength caps the words the blocked sampler proposes, in units
	// (0: no cap).
	MaxWordLength int `json:"max_word_length"`
	// Iterations is the number of sweeps over the corpus per chain.
	Iterations int `json:"iterations"`
	// Burnin is the number of sweeps before samples are kept; the
	// annealing schedule runs over it.
	Burnin int `json:"burnin"`
	// Chains is the number of independent chains.
	Chains int `json:"chains"`
	// Block is the number of sweeps between rebuilds of a chain's model
	// from its segmentation; checkpoints are taken at block ends.
	Block int `json:"block"`
	// Alpha0 is the concentration of the unigram word distribution G0.
	Alpha0 float64 `json:"alpha0"`
	// Alpha1 is the concentration of each bigram successor distribution.
	Alpha1 float64 `json:"alpha1"`
	// Discount0 and Discount1 are the Pitman-Yor discounts of the unigram
	// and bigram levels; zero gives Dirichlet processes.
	Discount0 float64 `json:"discount0"`
	Discount1 float64 `json:"discount1"`
	// WordEnd is p#, the base distribution's word-end probability.
	WordEnd float64 `json:"word_end"`
	// Rho is the Beta prior's pseudo-count on utterance ends (unigram).
	Rho float64 `json:"rho"`
	// Fixed lists the hyperparameters that are not sampled; the values
	// above are then used throughout, else they are starting values.
	Fixed Fixed `json:"fixed"`
	// Converge, when above 1, ends sampling early once the chains agree:
	// see Converged. Iterations is then a cap.
	Converge float64 `json:"converge,omitempty"`
	// TranslationWeight is the exponent of the translation factor, when
	// the run has one (RunOptions.Factor). The default, 0, leaves
	// segmenting to the word model: on the five UDHR corpora (3 seeds,
	// 300 sweeps, leave-one-out table, with or without English stop
	// words) weight 1 raised the bigram model's mean token F by 0.020
	// (after 1000 sweeps by 0.005, weight 2 by 0.020) but lowered the
	// unigram model's, and left the bigram model with the
	// syllable-skeleton base, the best of them, where it was (-0.002;
	// +0.007 at weight 0.5), whose learned segmentations the
	// translations already explain better than the reference does.
	TranslationWeight float64 `json:"translation_weight"`
	// TranslationMinCount is the fewest tokens a word needs before its
	// translation associations count (see align.Model.MinOccurrences).
	TranslationMinCount int `json:"translation_min_count"`
	// TranslationLeaveOneOut scores each utterance's translation with the
	// table estimated without that utterance's own counts (see
	// align.Model.LeaveOneOut), so a chunk is not rewarded for explaining
	// the very translation its table row was learned from.
	TranslationLeaveOneOut bool `json:"translation_leave_one_out"`
	// TranslationStopWords are translation tokens the factor ignores,
	// sorted; glosses still see them.
	TranslationStopWords []string `json:"translation_stop_words,omitempty"`
	// InitialBoundary is the probability of a boundary at each free gap
	// in the random first segmentation.
	InitialBoundary float64 `json:"initial_boundary"`
	// Nuclei lists the units that can be syllable nuclei; when not empty,
	// every word must hold one (see Nuclei). Uniform base only.
	Nuclei []string `json:"nuclei,omitempty"`
	// Phonotactics, with Nuclei, gives the uniform base the syllable
	// skeleton of Phonotactics instead of a length and units: words begin
	// and end with runs of units seen at utterance edges.
	Phonotactics bool `json:"phonotactics,omitempty"`
	// PhonotacticsBeta is the smoothing concentration of the run
	// distributions of Phonotactics (DefaultPhonotacticsBeta unless set);
	// 0 fits each by maximum marginal likelihood on its counts.
	PhonotacticsBeta float64 `json:"phonotactics_beta,omitempty"`
	// Seed fixes every random choice.
	Seed uint64 `json:"seed"`
	// Schedule gives the temperature of each burn-in iteration; nil means
	// Annealed.
	Schedule Schedule `json:"-"`
}

// DefaultConfig returns the defaults: the unigram model with the starting
// values of Goldwater, Griffiths & Johnson (2009) (alpha0 = 20, p# = 0.5,
// rho = 2; for the bigram model alpha0 = 3000 and alpha1 = 100 are
// better starts), the concentrations and p# sampled, and the discounts
// fixed at 0 (Dirichlet processes). Sampled discounts drift on the English
// corpus: the bigram level went to d = 0.58 with alpha1 = 0.6 and token F
// fell from 0.71 to 0.62-0.66, over-segmenting. The sampler is "auto" (see
// SamplerFor) and runs 100 sweeps, the first half annealed (see
// DefaultBurnin).
func DefaultConfig() Config {
	return Config{Model: "unigram", Base: "uniform", NgramOrder: 3, Sampler: "auto", Proposal: "bigram", MaxWordLength: 24, Iterations: 100, Burnin: DefaultBurnin(100), Chains: 1, Block: 50,
		Alpha0: 20, Alpha1: 100, WordEnd: 0.5, Rho: 2, InitialBoundary: 0.5, Seed: 1, Fixed: Fixed{Discount0: true, Discount1: true}, TranslationWeight: 0, TranslationMinCount: 10, TranslationLeaveOneOut: true,
		PhonotacticsBeta: DefaultPhonotacticsBeta}
}

// DefaultBurnin returns the default burn-in, the annealed sweeps, for a
// run of the given number of sweeps: half of them. With blocked sampling
// on the English corpus, a short annealing lost nothing: the unigram model
// reached token F 0.580 after 10 sweeps (8 annealed) and 0.597-0.602 after
// 60 (40 annealed), against 0.592-0.596 after 200 (160 annealed); the
// bigram model 0.610-0.619 after 80 (40 annealed), against 0.604-0.607
// after 200 (160 annealed), in a third of the time (seeds 1-3).
func DefaultBurnin(iterations int) int { return iterations / 2 }

// Validate reports the first setting that is out of range.
func (cfg Config) Validate() error {
	switch {
	case cfg.Model != "unigram" && cfg.Model != "bigram" && cfg.Model != "collocation":
		return fmt.Errorf("unknown model %q (want unigram, bigram or collocation)", cfg.Model)
	case cfg.Phonotactics && len(cfg.Nuclei) == 0:
		return fmt.Errorf("phonotactics need the syllable nuclei")
	case cfg.PhonotacticsBeta < 0 || math.IsInf(cfg.PhonotacticsBeta, 0) || math.IsNaN(cfg.PhonotacticsBeta):
		return fmt.Errorf("phonotactics beta must be a finite number >= 0, got %v", cfg.PhonotacticsBeta)
	case len(cfg.Nuclei) > 0 && cfg.Base != "uniform":
		return fmt.Errorf("nuclei work with the uniform base only, not %q", cfg.Base)
	case cfg.Model == "collocation" && cfg.Base != "uniform":
		return fmt.Errorf("the collocation model has the uniform base only, not %q", cfg.Base)
	case cfg.Model == "collocation" && cfg.Sampler == "boundary":
		return fmt.Errorf("the collocation model has its own blocked sampler, not the boundary sampler")
	case cfg.Model == "collocation" && cfg.TranslationWeight > 0:
		return fmt.Errorf("the collocation model takes no translation factor (weight %v)", cfg.TranslationWeight)
	case cfg.Base != "uniform" && cfg.Base != "ngram":
		return fmt.Errorf("unknown base %q (want uniform or ngram)", cfg.Base)
	case cfg.NgramOrder < 1 || cfg.NgramOrder > 8: // checked with any base: a bad value is a typo
		return fmt.Errorf("n-gram order must be 1 to 8, got %d", cfg.NgramOrder)
	case cfg.Sampler != "boundary" && cfg.Sampler != "blocked" && cfg.Sampler != "auto":
		return fmt.Errorf("unknown sampler %q (want boundary, blocked or auto)", cfg.Sampler)
	case cfg.Proposal != "" && cfg.Proposal != "unigram" && cfg.Proposal != "bigram":
		return fmt.Errorf("unknown proposal %q (want unigram or bigram)", cfg.Proposal)
	case cfg.MaxWordLength < 0:
		return fmt.Errorf("maximum word length must be 0 (none) or positive, got %d", cfg.MaxWordLength)
	case cfg.Iterations < 1:
		return fmt.Errorf("iterations must be at least 1, got %d", cfg.Iterations)
	case cfg.Burnin < 0 || cfg.Burnin >= cfg.Iterations:
		return fmt.Errorf("burn-in must be in [0, iterations), got %d of %d", cfg.Burnin, cfg.Iterations)
	case cfg.Chains < 1:
		return fmt.Errorf("chains must be at least 1, got %d", cfg.Chains)
	case cfg.Block < 1:
		return fmt.Errorf("block must be at least 1, got %d", cfg.Block)
	case !(cfg.Discount0 >= 0 && cfg.Discount0 < 1) || !(cfg.Discount1 >= 0 && cfg.Discount1 < 1):
		return fmt.Errorf("discounts must be in [0,1), got %v and %v", cfg.Discount0, cfg.Discount1)
	case !(cfg.Alpha0 > 0) || !(cfg.Alpha1 > 0) || math.IsInf(cfg.Alpha0, 1) || math.IsInf(cfg.Alpha1, 1):
		return fmt.Errorf("concentrations must be positive and finite, got alpha0 %v, alpha1 %v", cfg.Alpha0, cfg.Alpha1)
	case !(cfg.WordEnd > 0 && cfg.WordEnd < 1):
		return fmt.Errorf("word-end probability must be in (0,1), got %v", cfg.WordEnd)
	case !(cfg.Rho > 0):
		return fmt.Errorf("rho must be positive, got %v", cfg.Rho)
	case cfg.Converge != 0 && !(cfg.Converge > 1):
		return fmt.Errorf("convergence threshold must be above 1 (a potential scale reduction), got %v", cfg.Converge)
	case !(cfg.TranslationWeight >= 0):
		return fmt.Errorf("translation weight must be at least 0, got %v", cfg.TranslationWeight)
	case cfg.TranslationMinCount < 0:
		return fmt.Errorf("translation min-count must be at least 0, got %d", cfg.TranslationMinCount)
	case !(cfg.InitialBoundary >= 0 && cfg.InitialBoundary <= 1):
		return fmt.Errorf("initial boundary probability must be in [0,1], got %v", cfg.InitialBoundary)
	}
	return nil
}

// NewRand returns a random source for stream of a run with seed.
func NewRand(seed uint64, stream int) *rand.Rand {
	return rand.New(rand.NewPCG(seed, 0x9E3779B97F4A7C15^uint64(stream)))
}

// Result is the outcome of learning.
type Result struct {
	// Posterior[i] is the fraction of kept samples, over all chains, with
	// a boundary before unit i.
	Posterior []float64
	// Decoded has a boundary wherever Posterior exceeds 1/2 (the minimum
	// Bayes risk decision for boundary F), and wherever locked.
	Decoded *Segmentation
	// Chains holds each chain's final state, in index order.
	Chains []*ChainState
}

// RunOptions are the parts of a run that are not settings.
type RunOptions struct {
	// Progress is called after every sweep of any chain (serialised).
	Progress func()
	// Checkpoint is called after every block of a chain, possibly
	// concurrently for different chains.
	Checkpoint func(*ChainState) error
	// Factor, when not nil, builds an extra factor on each utterance's
	// words (a translation prior) at the start of every block.
	Factor FactorBuilder
}

// Run learns from c under cfg, starting each chain from states[i] when
// given (a resumed run) or from a fresh random segmentation. Chains run in
// parallel goroutines, each with its own random sources, so the result
// does not depend on the number of threads.
func Run(ctx context.Context, c *Corpus, cfg Config, states []*ChainState, opts RunOptions) (*Result, error) {
	if err := cfg.Validate(); err != nil {
		return nil, err
	}
	if len(cfg.Nuclei) > 0 {
		nuc, err := NewNuclei(c, cfg.Nuclei)
		if err != nil {
			return nil, err
		}
		if err := nuc.Check(c); err != nil {
			return nil, err
		}
	}
	if states == nil {
		states = make([]*ChainState, cfg.Chains)
		for i := range states {
			states[i] = InitialState(c, cfg, i)
		}
	}
	if len(states) != cfg.Chains {
		return nil, fmt.Errorf("have %d chain states for %d chains", len(states), cfg.Chains)
	}
	c.IndexSpans(spanIndexLength(cfg))
	var mu sync.Mutex
	tick := func() {
		if opts.Progress != nil {
			mu.Lock()
			opts.Progress()
			mu.Unlock()
		}
	}
	// Chains advance block by block in lockstep, so that a stopping
	// decision sees every chain at the same iteration and does not depend
	// on thread timing.
	errs := make([]error, len(states))
	for !finished(cfg, states) {
		var wg sync.WaitGroup
		for i, st := range states {
			if st.Iteration >= cfg.Iterations {
				continue
			}
			wg.Add(1)
			go func() {
				defer wg.Done()
				errs[i] = runOneBlock(ctx, c, cfg, st, tick, opts)
			}()
		}
		wg.Wait()
		for _, err := range errs {
			if err != nil {
				return nil, err
			}
		}
		if cfg.Converge > 0 && Converged(cfg, states) {
			for _, st := range states {
				st.Stopped = true
			}
			if opts.Checkpoint != nil {
				for _, st := range states {
					if err := opts.Checkpoint(st); err != nil {
						return nil, err
					}
				}
			}
		}
	}
	return Decode(c, states), nil
}

// Decode combines the chains' boundary counts into posteriors and the
// minimum Bayes risk segmentation.
func Decode(c *Corpus, states []*ChainState) *Result {
	post := make([]float64, len(c.Units))
	samples := 0
	for _, st := range states {
		samples += st.Samples
	}
	seg := NewSegmentation(c)
	for i := range post {
		n := 0
		for _, st := range states {
			n += int(st.BoundaryCounts[i])
		}
		if samples > 0 {
			post[i] = float64(n) / float64(samples)
		}
		switch {
		case seg.Boundary[i]: // utterance start or locked boundary
			post[i] = 1
		case c.LockAt(i) == Joined:
			post[i] = 0
		case post[i] > 0.5:
			seg.Boundary[i] = true
		}
	}
	return &Result{Posterior: post, Decoded: seg, Chains: states}
}

// finished reports whether every chain is done.
func finished(cfg Config, states []*ChainState) bool {
	for _, st := range states {
		if st.Iteration < cfg.Iterations && !st.Stopped {
			return false
		}
	}
	return true
}

// spanIndexLength is the longest span the corpus index covers: the
// blocked sampler's longest word, at most 32 units, so that the index of
// a corpus of long utterances stays within 32 entries per unit; for the
// collocation model MaxCollocationLength, since its lattices look up the
// collocation string of every span up to that length (the index of the
// English corpus grows by 2% over 24 units, while a hashed lookup of the
// longer spans took a tenth of the collocation sampler's time).
func spanIndexLength(cfg Config) int {
	if cfg.Model == "collocation" {
		return MaxCollocationLength
	}
	if k := cfg.MaxWordLength; k > 0 && k < 32 {
		return k
	}
	return 32
}

// BlockedBigramMaxMeanLength is the longest mean utterance, in units, for
// which the "auto" sampler picks the blocked sampler for the bigram model.
// A bigram lattice costs about min(L, K)^2 per unit of an utterance of L
// units, a boundary sweep a constant: on the English corpus (mean 10.4
// units) a blocked bigram sweep costs 0.39 s against 0.71 s and mixes
// faster; on the demo (17 units) 200 blocked sweeps took 3.2 s against
// 2.2 s, on UDHR paragraphs (about 150 units) 6.8 s against 1.9 s, with
// no better accuracy.
const BlockedBigramMaxMeanLength = 12

// SamplerFor returns the sampler a run of cfg on c uses: cfg.Sampler, or
// for "auto" the blocked sampler, except for the bigram model without
// nuclei on corpora whose utterances average more than
// BlockedBigramMaxMeanLength units. With nuclei the blocked sampler wins
// there too: on the demo (bigram, 200 sweeps, 2 chains, seeds 1-3) token F
// 0.943 / 0.922 / 0.935 against 0.865 / 0.878 / 0.864 for the boundary
// sampler, in the same time (6.2 s against 6.0 s), as spans without a
// nucleus drop out of the lattice while gap flips must pass through words
// the constraint forbids.
func (cfg Config) SamplerFor(c *Corpus) string {
	if cfg.Sampler != "auto" {
		return cfg.Sampler
	}
	if cfg.Model == "bigram" && len(cfg.Nuclei) == 0 && c.Len() > 0 && len(c.Units) > BlockedBigramMaxMeanLength*c.Len() {
		return "boundary"
	}
	return "blocked"
}
