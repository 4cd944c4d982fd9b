package align

import (
	"cmp"
	"math"
	"slices"
)

// Gloss is a translation token associated with a word type, for the
// lexicon.
type Gloss struct {
	Word  string  // the translation token
	Score float64 // n(e,w) log(t(e|w) / p(e)), in nats; see Glosses
	Prob  float64 // t(e|w)
	Count float64 // n(e,w), expected aligned tokens
}

// Glosses returns up to k translation tokens most associated with word w
// (or Null), best first, from the last Estimate. A word seen fewer than
// minCount times in utterances with a translation (see Occurrences) gets
// none: its table is mostly prior.
//
// The score of token e is
//
//	n(e,w) log(t(e|w) / p(e)),
//
// the expected number of tokens e aligned to w times the log ratio of w's
// prediction of e to e's background frequency: how many nats the aligned
// tokens gain when w predicts them instead of the background. It is our
// choice, in the spirit of Dunning's (1993) log-likelihood ratio for word
// association. It favours pairs that are both frequent and specific:
// t(e|w) alone ranks frequent tokens ("the") first for every rare word,
// and the ratio alone ranks a token seen once with w first. Only tokens
// with a positive score are returned; ties go to the token that sorts
// first.
func (m *Model) Glosses(w int32, k, minCount int) []Gloss {
	if k <= 0 || m.Occurrences(w) < minCount || m.Occurrences(w) == 0 {
		return nil
	}
	c := m.column(w)
	var gs []Gloss
	add := func(e int32, n float64) {
		if n <= 0 {
			return
		}
		t := m.probIn(c, e)
		if score := n * math.Log(t/m.prior[e]); score > 0 {
			gs = append(gs, Gloss{Word: m.vocab[e], Score: score, Prob: t, Count: n})
		}
	}
	if w == Null {
		for e, n := range m.null {
			add(int32(e), n)
		}
	} else {
		for _, e := range m.row(w) {
			add(e, m.pair[pairKey(w, e)])
		}
	}
	slices.SortFunc(gs, func(a, b Gloss) int {
		if c := cmp.Compare(b.Score, a.Score); c != 0 {
			return c
		}
		return cmp.Compare(a.Word, b.Word)
	})
	if len(gs) > k {
		gs = gs[:k:k]
	}
	return gs
}
