package segment_test

import (
	"fmt"
	"math/rand/v2"
	"testing"

	"github.com/juncture-project/juncture/align"
	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

var (
	_ UtteranceFactor = (*align.Factor)(nil)
	_ UtteranceFactor = (*align.ReverseFactor)(nil)
)

type factorChain struct {
	step func()
	seg  *Segmentation
}

func (c factorChain) Step()                  { c.step() }
func (c factorChain) Current() *Segmentation { return c.seg }

// logProbTable is the fixed table behind a translation factor, as the
// exact posterior needs it.
type logProbTable interface {
	LogProb(u int, words []int32) float64
}

// TestTranslationFactorExactPosterior: with a fixed IBM Model 1 table the
// target is P(segmentation) * prod_u F_u(words)^weight, where F_u is
// P(translation_u | words) (align.Factor) or, in Brown et al.'s
// direction, P(words | translation_u) (align.ReverseFactor, also with its
// rare-word rule and its ratio to the background); both samplers must
// reproduce it on tiny parallel corpora, also with the forward table's
// alignment prior by word length and with each utterance's own counts
// left out of the table it is scored with. The boundary sampler uses
// SplitDelta and JoinDelta, the blocked one Delta and Set.
func TestTranslationFactorExactPosterior(t *testing.T) {
	lines := []string{"abab", "ab", "ba"}
	translations := [][]string{{"dog", "dog"}, {"dog"}, {"cat"}}
	for i, tc := range []struct {
		direction string
		order     int
		sampler   string
		weight    float64
		minOcc    int
		ratio     bool
		sized     bool // forward: alignment prior by length in units
		loo       bool // forward: leave each utterance's own counts out
	}{
		{"forward", 1, "boundary", 1, 0, false, false, false}, {"forward", 1, "blocked", 2, 0, false, false, false},
		{"forward", 2, "boundary", 1, 0, false, false, false}, {"forward", 2, "blocked", 0.5, 0, false, false, false},
		{"reverse", 1, "boundary", 1, 0, false, false, false}, {"reverse", 1, "blocked", 2, 2, false, false, false},
		{"reverse", 1, "boundary", 1, 2, true, false, false}, {"reverse", 2, "boundary", 1, 0, false, false, false},
		{"reverse", 2, "blocked", 0.5, 0, true, false, false},
		{"forward", 1, "boundary", 1, 0, false, true, false}, {"forward", 2, "blocked", 1, 0, false, true, false},
		{"forward", 1, "blocked", 1, 0, false, false, true}, {"forward", 2, "boundary", 1, 0, false, false, true},
		{"forward", 1, "boundary", 2, 0, false, true, true},
	} {
		t.Run(fmt.Sprint(tc.direction, i), func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, lines...)
			base := UniformBase{WordEnd: 0.5, Units: len(c.Inventory)}
			m := NewWords(c, tc.order, PitmanYor{0.2, 2}, PitmanYor{0.1, 3}, base)
			rng := rand.New(rand.NewPCG(uint64(i), 13))
			seg := RandomSegmentation(c, 1, rng)
			ids := func(s *Segmentation) [][]int32 {
				words := make([][]int32, c.Len())
				for u := range words {
					s.Words(u, func(a, b int) { words[u] = append(words[u], int32(m.Intern(a, b))) })
				}
				return words
			}
			var f UtteranceFactor
			var table logProbTable
			if tc.direction == "reverse" {
				rf := align.NewReverseFactor(translations, 1, ids(seg), 5, tc.minOcc, tc.ratio)
				f, table = rf, rf.Model()
			} else {
				o := align.FactorOptions{Beta: 1, Iterations: 5, MinOccurrences: tc.minOcc, LeaveOneOut: tc.loo}
				if tc.sized {
					o.Size = func(w int32) float64 { return float64(m.Types.Length[w]) }
				}
				ff := align.NewFactorWith(translations, ids(seg), o)
				f, table = ff, ff.Model()
			}
			var step func()
			if tc.sampler == "blocked" {
				g := NewBlockedSampler(seg, m, 0, rng)
				g.Factor, g.Weight = f, tc.weight
				step = func() { g.Sweep(1, rng) }
			} else {
				g := NewWordsGibbs(seg, m, rng)
				g.Factor, g.Weight = f, tc.weight
				step = func() { g.Sweep(1, rng) }
			}
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
