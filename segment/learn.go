package segment

import (
	"context"
	"fmt"
	"math/rand/v2"
)

// Config says how to learn a segmentation.
type Config struct {
	// Model names the word model: "unigram" or "bigram".
	Model string
	// Iterations is the number of sweeps over the corpus.
	Iterations int
	// Alpha0 is the concentration of the unigram word distribution G0.
	Alpha0 float64
	// Alpha1 is the concentration of each bigram successor distribution.
	Alpha1 float64
	// Discount0 and Discount1 are the Pitman-Yor discounts of the unigram
	// and bigram levels; zero gives Dirichlet processes.
	Discount0, Discount1 float64
	// WordEnd is p#, the base distribution's word-end probability.
	WordEnd float64
	// Rho is the Beta prior's pseudo-count on utterance ends.
	Rho float64
	// InitialBoundary is the probability of a boundary at each free gap
	// in the random first segmentation.
	InitialBoundary float64
	// Seed fixes every random choice.
	Seed uint64
	// Schedule gives the temperature of each iteration; nil means Annealed.
	Schedule Schedule
	// Progress, when not nil, is called after every iteration.
	Progress func(iteration int, logProb float64)
}

// DefaultConfig returns the published defaults of the unigram model
// (Goldwater, Griffiths & Johnson 2009: alpha0 = 20, p# = 0.5, rho = 2).
func DefaultConfig() Config {
	return Config{Model: "unigram", Iterations: 2000, Alpha0: 20, Alpha1: 100, WordEnd: 0.5, Rho: 2, InitialBoundary: 0.5, Seed: 1}
}

// Validate reports the first setting that is out of range.
func (cfg Config) Validate() error {
	switch {
	case cfg.Model != "unigram" && cfg.Model != "bigram":
		return fmt.Errorf("unknown model %q (want unigram or bigram)", cfg.Model)
	case cfg.Iterations < 1:
		return fmt.Errorf("iterations must be at least 1, got %d", cfg.Iterations)
	case !(cfg.Discount0 >= 0 && cfg.Discount0 < 1) || !(cfg.Discount1 >= 0 && cfg.Discount1 < 1):
		return fmt.Errorf("discounts must be in [0,1), got %v and %v", cfg.Discount0, cfg.Discount1)
	case !(cfg.Alpha0 > 0) || !(cfg.Alpha1 > 0):
		return fmt.Errorf("concentrations must be positive, got alpha0 %v, alpha1 %v", cfg.Alpha0, cfg.Alpha1)
	case !(cfg.WordEnd > 0 && cfg.WordEnd < 1):
		return fmt.Errorf("word-end probability must be in (0,1), got %v", cfg.WordEnd)
	case !(cfg.Rho > 0):
		return fmt.Errorf("rho must be positive, got %v", cfg.Rho)
	case !(cfg.InitialBoundary >= 0 && cfg.InitialBoundary <= 1):
		return fmt.Errorf("initial boundary probability must be in [0,1], got %v", cfg.InitialBoundary)
	}
	return nil
}

// NewRand returns the random source of chain index of a run with seed.
// Every random choice of a run comes from sources made here, so a run
// depends on its seed and nothing else.
func NewRand(seed uint64, chain int) *rand.Rand {
	return rand.New(rand.NewPCG(seed, 0x9E3779B97F4A7C15^uint64(chain)))
}

// Learn samples a segmentation of c under cfg and returns the last sample.
// It stops early with ctx's error if ctx is cancelled.
func Learn(ctx context.Context, c *Corpus, cfg Config) (*Segmentation, error) {
	if err := cfg.Validate(); err != nil {
		return nil, err
	}
	schedule := cfg.Schedule
	if schedule == nil {
		schedule = Annealed
	}
	rng := NewRand(cfg.Seed, 0)
	seg := RandomSegmentation(c, cfg.InitialBoundary, rng)
	base := UniformBase{WordEnd: cfg.WordEnd, Units: max(1, len(c.Inventory))}
	order := 1
	if cfg.Model == "bigram" {
		order = 2
	}
	m := NewWords(c, order, PitmanYor{cfg.Discount0, cfg.Alpha0}, PitmanYor{cfg.Discount1, cfg.Alpha1}, base)
	m.Rho = cfg.Rho
	g := NewWordsGibbs(seg, m, rng)
	for it := 0; it < cfg.Iterations; it++ {
		if err := ctx.Err(); err != nil {
			return nil, err
		}
		g.Sweep(schedule(it, cfg.Iterations), rng)
		if cfg.Progress != nil {
			cfg.Progress(it+1, g.Model.LogJoint())
		}
	}
	return seg, nil
}
