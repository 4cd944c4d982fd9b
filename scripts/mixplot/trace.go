package main

import (
	"fmt"
	"time"

	"github.com/juncture-project/juncture/segment"
)

// settings say what to trace: the model and its fixed hyperparameters,
// the sweeps, and the seed.
type settings struct {
	Model         string  // "unigram" or "bigram"
	Base          string  // "uniform" or "ngram"
	NgramOrder    int     // of the "ngram" base
	Alpha0        float64 // unigram concentration
	Alpha1        float64 // bigram concentration
	WordEnd       float64 // p# of the uniform base
	Rho           float64 // utterance-end prior (unigram)
	MaxWordLength int     // blocked sampler's longest word, in units
	Sweeps        int     // sweeps per sampler
	// Seconds stops a sampler once its clock passes it (0: no limit). It
	// makes the number of sweeps depend on the machine's speed.
	Seconds float64
	Seed    uint64
}

// point is the state of a chain after a sweep.
type point struct {
	Sweep int
	// Seconds is the wall-clock time spent building the model and
	// sweeping, up to this point; computing LogProb is not counted.
	Seconds float64
	// LogProb is Words.LogJoint: the log joint probability of the
	// segmentation and the seating.
	LogProb float64
}

// newModel builds an empty model as s describes, with its hyperparameters
// fixed at s's values for the whole trace.
func newModel(c *segment.Corpus, s settings) *segment.Words {
	order := 1
	if s.Model == "bigram" {
		order = 2
	}
	units := max(1, len(c.Inventory))
	var base segment.Base = segment.UniformBase{WordEnd: s.WordEnd, Units: units}
	if s.Base == "ngram" {
		base = segment.NewNgramBase(units, s.NgramOrder, segment.DefaultNgramLevels(s.NgramOrder))
	}
	m := segment.NewWords(c, order, segment.PitmanYor{Concentration: s.Alpha0},
		segment.PitmanYor{Concentration: s.Alpha1}, base)
	m.Rho = s.Rho
	return m
}

// trace runs sampler ("boundary" or "blocked") from the segmentation
// initial (not modified) at temperature 1 and returns the log joint
// probability after building the model (sweep 0) and after every sweep.
// The random source is the same for both samplers: seed s.Seed, stream 1.
func trace(c *segment.Corpus, initial []bool, sampler string, s settings) ([]point, error) {
	seg := &segment.Segmentation{Corpus: c, Boundary: append([]bool(nil), initial...)}
	rng := segment.NewRand(s.Seed, 1)
	start := time.Now()
	m := newModel(c, s)
	var sweep func()
	switch sampler {
	case "boundary":
		g := segment.NewWordsGibbs(seg, m, rng)
		sweep = func() { g.Sweep(1, rng) }
	case "blocked":
		g := segment.NewBlockedSampler(seg, m, s.MaxWordLength, rng)
		sweep = func() { g.Sweep(1, rng) }
	default:
		return nil, fmt.Errorf("unknown sampler %q", sampler)
	}
	elapsed := time.Since(start).Seconds()
	points := []point{{Sweep: 0, Seconds: elapsed, LogProb: m.LogJoint()}}
	for k := 1; k <= s.Sweeps && (s.Seconds <= 0 || elapsed < s.Seconds); k++ {
		t := time.Now()
		sweep()
		elapsed += time.Since(t).Seconds()
		points = append(points, point{Sweep: k, Seconds: elapsed, LogProb: m.LogJoint()})
	}
	return points, nil
}
