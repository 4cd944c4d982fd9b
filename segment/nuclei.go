package segment

import (
	"fmt"
	"math"
	"strings"
)

// Nuclei records which units can be syllable nuclei, so that a base
// distribution can allow only words holding one: every word has at least
// one syllable, and every syllable a nucleus, usually a vowel (common
// practice in phonology; some languages have words without vowels, so the
// constraint is the user's choice). It indexes one corpus: Has answers for
// any span in constant time.
type Nuclei struct {
	// Units lists the nucleus units, as given.
	Units []string
	// Others is the number of units of the inventory that are not nuclei.
	Others int
	before []int32 // before[i]: nucleus units among the corpus's first i
	is     []bool  // by unit ID
}

// NewNuclei indexes c for the given nucleus units. Each must be a unit of
// c: a unit that never occurs is most likely a typo that would make the
// constraint stricter than meant.
func NewNuclei(c *Corpus, units []string) (*Nuclei, error) {
	is := make([]bool, len(c.Inventory))
	for _, u := range units {
		id, ok := c.UnitID(u)
		if !ok {
			return nil, fmt.Errorf("nucleus %q is not a unit of %s", u, c.Name)
		}
		is[id] = true
	}
	n := &Nuclei{Units: units, Others: len(c.Inventory), before: make([]int32, len(c.Units)+1), is: is}
	for _, v := range is {
		if v {
			n.Others--
		}
	}
	for i, u := range c.Units {
		n.before[i+1] = n.before[i]
		if is[u] {
			n.before[i+1]++
		}
	}
	return n, nil
}

// Has reports whether the span [start, end) holds a nucleus.
func (n *Nuclei) Has(start, end int) bool { return n.before[end] > n.before[start] }

// logMass returns log of the share of P0's mass left to words with a
// nucleus: 1 minus the mass of the non-empty strings of other units,
//
//	sum_k p#(1-p#)^(k-1) r^k = p# r / (1 - (1-p#) r),  r = Others/V,
//
// so that the restricted base, P0 over this, is a proper distribution.
func (n *Nuclei) logMass(wordEnd float64, units int) float64 {
	r := float64(n.Others) / float64(units)
	return math.Log1p(-wordEnd * r / (1 - (1-wordEnd)*r))
}

// Check returns an error naming the first line of c that no segmentation
// can split into words with nuclei: a line without any nucleus, or a word
// fixed by its line's locks that has none.
func (n *Nuclei) Check(c *Corpus) error {
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		if !n.Has(start, end) {
			return fmt.Errorf("%s:%d: no unit of the line is a nucleus (%s); every word must hold one", c.Name, c.Lines[u], strings.Join(n.Units, " "))
		}
		if c.Locks == nil {
			continue
		}
		// Between two Boundary locks (or line edges) with no free gap in
		// between, the words are fixed.
		a := start
		for i := start + 1; i <= end; i++ {
			if i < end && c.Locks[i] != Boundary {
				continue
			}
			fixed := true
			for k := a + 1; k < i; k++ {
				fixed = fixed && c.Locks[k] == Joined
			}
			if fixed && !n.Has(a, i) {
				return fmt.Errorf("%s:%d: the hand-split word %q has no nucleus (%s)", c.Name, c.Lines[u], c.Text(a, i), strings.Join(n.Units, " "))
			}
			a = i
		}
	}
	return nil
}

// Repair removes boundaries of s until every word holds a nucleus where
// locks allow: a word without one joins the next word, or the previous
// one at the end of its line. A start state that breaks the constraint
// would never leave it (its words' tables, of probability 0, keep
// customers), so chains start from a repaired one.
func (n *Nuclei) Repair(s *Segmentation) {
	c := s.Corpus
	free := func(i int) bool { return c.Locks == nil || c.Locks[i] != Boundary }
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		a := start // start of the current word
		for i := start + 1; i < end; i++ {
			if !s.Boundary[i] {
				continue
			}
			if !n.Has(a, i) && free(i) {
				s.Boundary[i] = false // the word runs on into the next
				continue
			}
			a = i
		}
		if a > start && !n.Has(a, end) && free(a) {
			s.Boundary[a] = false // the last word joins the one before
		}
	}
}
