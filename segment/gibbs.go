package segment

import (
	"math"
	"math/rand/v2"
)

// UnigramGibbs is the boundary-by-boundary Gibbs sampler of Goldwater,
// Griffiths & Johnson (2009) for the Unigram model: each free gap in turn
// is resampled from its conditional distribution given every other gap.
type UnigramGibbs struct {
	Seg   *Segmentation
	Model *Unigram
}

// NewUnigramGibbs counts s into m and returns a sampler over both.
// m must be empty.
func NewUnigramGibbs(s *Segmentation, m *Unigram) *UnigramGibbs {
	if m.tokens != 0 {
		panic("segment: NewUnigramGibbs needs an empty model")
	}
	m.AddSegmentation(s)
	return &UnigramGibbs{Seg: s, Model: m}
}

// Sweep resamples every free gap once, in corpus order, with probabilities
// raised to the power 1/temperature (temperature 1 is plain Gibbs sampling).
func (g *UnigramGibbs) Sweep(temperature float64, rng *rand.Rand) {
	c := g.Seg.Corpus
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		for i := start + 1; i < end; i++ {
			if c.LockAt(i) != Free {
				continue
			}
			g.resample(i, start, end, temperature, rng)
		}
	}
}

// resample draws the gap before unit i of the utterance [ustart, uend).
func (g *UnigramGibbs) resample(i, ustart, uend int, temperature float64, rng *rand.Rand) {
	b := g.Seg.Boundary
	m := g.Model
	left := i - 1
	for left > ustart && !b[left] {
		left--
	}
	right := i + 1
	for right < uend && !b[right] {
		right++
	}
	whole := m.Intern(left, right)
	first := m.Intern(left, i)
	second := m.Intern(i, right)
	if b[i] {
		m.Remove(first)
		m.Remove(second)
	} else {
		m.Remove(whole)
	}

	// Counts now exclude the affected words: n tokens, U utterances.
	n := float64(m.tokens)
	U := float64(m.utterances)
	h := m.Rho / 2
	logDen0 := math.Log(n + m.Alpha)
	// Join: one word, then the utterance-end factor for n+1 tokens.
	logJoin := m.logNumerator(whole, 0) - logDen0
	// Split: two words; the second sees the first. One more token means one
	// more "continue" decision: (C + rho/2) / (N + rho) with C = N - U
	// continues among the N = n+1 tokens of the joined hypothesis.
	extra := 0
	if first == second {
		extra = 1
	}
	logSplit := m.logNumerator(first, 0) - logDen0 +
		m.logNumerator(second, extra) - math.Log(n+1+m.Alpha) +
		math.Log(n+1-U+h) - math.Log(n+1+m.Rho)

	d := (logSplit - logJoin) / temperature
	// P(split) = 1 / (1 + exp(-d)).
	split := rng.Float64()*(1+math.Exp(-d)) < 1
	b[i] = split
	if split {
		m.Add(first)
		m.Add(second)
	} else {
		m.Add(whole)
	}
}
