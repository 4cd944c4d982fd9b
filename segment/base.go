package segment

import (
	"math"
	"math/rand/v2"
)

// Base is a base distribution P0 over words: the probability of a word
// type before any word has been seen.
type Base interface {
	// LogProb returns log P0 of the unit span [start, end) of c.
	LogProb(c *Corpus, start, end int) float64
}

// UniformBase is the base distribution of Goldwater, Griffiths & Johnson
// (2009): P0(w) = p#(1-p#)^(|w|-1) * prod_i p(u_i), with every unit equally
// likely. It is a proper distribution over all non-empty unit strings.
type UniformBase struct {
	// WordEnd is p#, the probability that a word ends after each unit.
	WordEnd float64
	// Units is the number of units in the inventory.
	Units int
	// Nuclei, when not nil, restricts P0 to words holding a syllable
	// nucleus, renormalised over them.
	Nuclei *Nuclei
	// Shapes, when not nil (it needs Nuclei), replaces the length and
	// units of a word by its syllable skeleton: k syllables with
	// probability p#(1-p#)^(k-1), and the shape's runs of units (see
	// Phonotactics).
	Shapes *Phonotactics
}

// LogProb implements Base.
func (b UniformBase) LogProb(c *Corpus, start, end int) float64 {
	if b.Shapes != nil {
		k, shape := b.Shapes.Span(c, start, end)
		if k == 0 {
			return math.Inf(-1)
		}
		return math.Log(b.WordEnd) + float64(k-1)*math.Log1p(-b.WordEnd) + shape
	}
	n := float64(end - start)
	lp := math.Log(b.WordEnd) + (n-1)*math.Log1p(-b.WordEnd) - n*math.Log(float64(b.Units))
	if b.Nuclei != nil {
		if !b.Nuclei.Has(start, end) {
			return math.Inf(-1)
		}
		lp -= b.Nuclei.logMass(b.WordEnd, b.Units)
	}
	return lp
}

// drawWordEnd draws p# from its conditional given the base's tables:
// tables words of extra units beyond their first in all. Under a Beta(1,1)
// prior the conditional is Beta(1 + tables, 1 + extra); with nuclei the
// renormalisation adds -tables log(mass), so it is slice-sampled instead.
func (b UniformBase) drawWordEnd(tables, extra float64, rng *rand.Rand) float64 {
	if b.Nuclei == nil || b.Shapes != nil {
		return betaDraw(1+tables, 1+extra, rng)
	}
	logf := func(p float64) float64 {
		return tables*math.Log(p) + extra*math.Log1p(-p) - tables*b.Nuclei.logMass(p, b.Units)
	}
	return sliceSample(b.WordEnd, logf, 0.1, 1e-6, 1-1e-6, rng)
}

// steps returns how many times the word [start, end) did not end where it
// could have, the exponent of 1-p# in its base probability: its units
// beyond the first, or with Shapes its syllables beyond the first.
func (b UniformBase) steps(c *Corpus, start, end int) int {
	if b.Shapes != nil {
		k, _ := b.Shapes.Span(c, start, end)
		return max(k-1, 0)
	}
	return end - start - 1
}

// prob returns P0 of the span [start, end) of c, as exp(LogProb) but
// without the logarithms where the shape table holds them.
func (b UniformBase) prob(c *Corpus, start, end int) float64 {
	if b.Shapes == nil {
		return math.Exp(b.LogProb(c, start, end))
	}
	k, p := b.Shapes.spanProb(c, start, end)
	if k == 0 {
		return 0
	}
	p *= b.WordEnd
	for range k - 1 {
		p *= 1 - b.WordEnd
	}
	return p
}
