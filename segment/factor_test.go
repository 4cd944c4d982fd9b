package segment_test

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/juncture-project/juncture/align"
	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

type factorChain struct {
	step func()
	seg  *Segmentation
}

func (c factorChain) Step()                  { c.step() }
func (c factorChain) Current() *Segmentation { return c.seg }

// TestTranslationFactorExactPosterior: with a fixed IBM Model 1 table the
// target is P(segmentation) * prod_u P(translation_u | words)^weight; both
// samplers must reproduce it on tiny parallel corpora.
func TestTranslationFactorExactPosterior(t *testing.T) {
	lines := []string{"abab", "ab", "ba"}
	translations := [][]string{{"dog", "dog"}, {"dog"}, {"cat"}}
	for i, tc := range []struct {
		order   int
		sampler string
		weight  float64
	}{
		{1, "boundary", 1}, {1, "blocked", 2}, {2, "boundary", 1}, {2, "blocked", 0.5},
	} {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			c := tinyCorpus(t, lines...)
			base := UniformBase{WordEnd: 0.5, Units: len(c.Inventory)}
			m := NewWords(c, tc.order, PitmanYor{0.2, 2}, PitmanYor{0.1, 3}, base)
			rng := rand.New(rand.NewPCG(uint64(i), 13))
			seg := RandomSegmentation(c, 1, rng)
			var step func()
			var f *align.Factor
			ids := func(s *Segmentation) [][]int32 {
				words := make([][]int32, c.Len())
				for u := range words {
					s.Words(u, func(a, b int) { words[u] = append(words[u], int32(m.Intern(a, b))) })
				}
				return words
			}
			if tc.sampler == "blocked" {
				g := NewBlockedSampler(seg, m, 0, rng)
				f = align.NewFactor(translations, 1, ids(seg), 5, 0)
				g.Factor, g.Weight = f, tc.weight
				step = func() { g.Sweep(1, rng) }
			} else {
				g := NewWordsGibbs(seg, m, rng)
				f = align.NewFactor(translations, 1, ids(seg), 5, 0)
				g.Factor, g.Weight = f, tc.weight
				step = func() { g.Sweep(1, rng) }
			}
			table := f.Model()
			post := exact.Posterior(c, func(s *Segmentation) float64 {
				lp := m.ExactLogJoint(s)
				for u, ws := range ids(s) {
					lp += tc.weight * table.LogProb(u, ws)
				}
				return lp
			})
			thin := 5
			if tc.order == 2 {
				thin = 25
			}
			counts := exact.Sample(factorChain{step, seg}, 100, thin, 20000)
			r := exact.ChiSquare(post, counts)
			if r.P < 1e-3 {
				t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
			}
			t.Logf("%v", r)
		})
	}
}
