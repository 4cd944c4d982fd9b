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
}

// LogProb implements Base.
func (b UniformBase) LogProb(c *Corpus, start, end int) float64 {
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
	if b.Nuclei == nil {
		return betaDraw(1+tables, 1+extra, rng)
	}
	logf := func(p float64) float64 {
		return tables*math.Log(p) + extra*math.Log1p(-p) - tables*b.Nuclei.logMass(p, b.Units)
	}
	return sliceSample(b.WordEnd, logf, 0.1, 1e-6, 1-1e-6, rng)
}
