package segment_test

import (
	"fmt"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

// TestCollocationExactPosterior runs the collocation sampler (blocked
// utterance moves and table relabelling) through the exact posterior
// harness, with and without discounts and a word-length limit.
func TestCollocationExactPosterior(t *testing.T) {
	cases := []struct {
		lines       []string
		word, group PitmanYor
		groupEnd    float64
		maxLen      int
		skip        bool
	}{
		{[]string{"abab", "ab", "ba"}, PitmanYor{0, 2}, PitmanYor{0, 1}, 0.5, 0, false},
		{[]string{"abab", "ab", "ba"}, PitmanYor{0, 2}, PitmanYor{0, 1}, 0.5, 0, true},
		{[]string{"abab", "abab", "ab"}, PitmanYor{0.4, 1}, PitmanYor{0.3, 0.5}, 0.3, 0, false},
		{[]string{"aabb", "ab"}, PitmanYor{0, 1}, PitmanYor{0.5, 2}, 0.7, 2, false},
	}
	for i, tc := range cases {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, tc.lines...)
			base := UniformBase{WordEnd: 0.5, Units: len(c.Inventory)}
			m := NewCollocations(c, tc.word, tc.group, base, tc.groupEnd)
			post := truncatedPosterior(c, tc.maxLen, m.ExactLogJoint)
			rng := rand.New(rand.NewPCG(uint64(i), 13))
			seg := RandomSegmentation(c, 1, rng)
			g := NewCollocationSampler(seg, nil, m, tc.maxLen, rng)
			g.SkipRelabel = tc.skip
			counts := exact.Sample(&sweepChain{g, seg, rng}, 100, 10, 20000)
			if err := g.Check(); err != nil {
				t.Fatal(err)
			}
			r := exact.ChiSquare(post, counts)
			if r.P < 1e-3 {
				t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
			}
			t.Logf("%v (acceptance %.2f)", r, g.AcceptanceRate())
		})
	}
}
