package segment_test

import (
	"fmt"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

// TestBlockedExactPosterior runs the blocked sampler through the exact
// posterior harness for both orders, with and without discounts, with and
// without a word-length limit (the limit truncates the model: the exact
// posterior is then renormalised over segmentations within it).
func TestBlockedExactPosterior(t *testing.T) {
	cases := []struct {
		lines   []string
		order   int
		uni, bi PitmanYor
		maxLen  int
		uniProp bool
	}{
		{[]string{"abab", "ab", "ba"}, 1, PitmanYor{0, 2}, PitmanYor{}, 0, false},
		{[]string{"abab", "ab", "ba"}, 1, PitmanYor{0.5, 1}, PitmanYor{}, 0, false},
		{[]string{"aaaa", "aa"}, 1, PitmanYor{0.3, 0.5}, PitmanYor{}, 2, false},
		{[]string{"abab", "ab"}, 2, PitmanYor{0, 1}, PitmanYor{0, 1}, 0, false},
		{[]string{"aab", "ab"}, 2, PitmanYor{0.5, 1}, PitmanYor{0.3, 2}, 0, false},
		{[]string{"abba", "ba"}, 2, PitmanYor{0.2, 3}, PitmanYor{0.6, 0.5}, 3, false},
		{[]string{"aab", "ab"}, 2, PitmanYor{0.5, 1}, PitmanYor{0.3, 2}, 0, true},
		{[]string{"abba", "ba"}, 2, PitmanYor{0.2, 3}, PitmanYor{0.6, 0.5}, 3, true},
	}
	for i, tc := range cases {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, tc.lines...)
			if i%2 == 1 {
				c.IndexSpans(3) // the index for short spans, hashing for longer ones
			}
			base := UniformBase{WordEnd: 0.5, Units: len(c.Inventory)}
			m := NewWords(c, tc.order, tc.uni, tc.bi, base)
			post := truncatedPosterior(c, tc.maxLen, m.ExactLogJoint)
			rng := rand.New(rand.NewPCG(uint64(i), 11))
			seg := RandomSegmentation(c, 1, rng) // every gap a boundary: within any limit
			g := NewBlockedSampler(seg, m, tc.maxLen, rng)
			g.UnigramProposal = tc.uniProp
			// The bigram cases hop slowly between modes (an utterance can
			// only leave "a b a b" when its neighbour's seating allows),
			// so samples are thinned more to keep them nearly independent.
			thin := 5
			if tc.order == 2 {
				thin = 25
			}
			counts := exact.Sample(&sweepChain{g, seg, rng}, 100, thin, 20000)
			r := exact.ChiSquare(post, counts)
			if r.P < 1e-3 {
				t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
			}
			t.Logf("%v (acceptance %.2f)", r, g.AcceptanceRate())
		})
	}
}

func longestWord(s *Segmentation) int {
	n := 0
	for u := 0; u < s.Corpus.Len(); u++ {
		s.Words(u, func(a, b int) { n = max(n, b-a) })
	}
	return n
}
