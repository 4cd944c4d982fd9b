package segment

import "math"

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
}

// LogProb implements Base.
func (b UniformBase) LogProb(c *Corpus, start, end int) float64 {
	n := float64(end - start)
	return math.Log(b.WordEnd) + (n-1)*math.Log1p(-b.WordEnd) - n*math.Log(float64(b.Units))
}
