package segment

import (
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

// TestLinearLatticesMatchLogSpace checks the probability-space lattices
// against the log-space ones they replace: given the same model state and
// random stream, both must draw the same segmentation with the same
// proposal probabilities, at temperature 1 and while annealing (where the
// exact-posterior harness cannot check the bigram model: its tempered
// seating is not a tempered posterior over segmentations).
func TestLinearLatticesMatchLogSpace(t *testing.T) {
	text := "abcabcab\nbcab\ncabcaabc\naabbccabcab\nab\nbbcabca\ncabcabcabcabcabc"
	for _, order := range []int{1, 2} {
		for _, kind := range []float64{0, 0.4, -1, -2} { // a discount; -1: none, a base restricted to words with "a"; -2: and its phonotactics
			for _, temp := range []float64{1, 2.5, 10} {
				d := kind
				c, err := ReadCorpus(strings.NewReader(text), "t", ReadOptions{})
				if err != nil {
					t.Fatal(err)
				}
				c.IndexSpans(4)
				rng := rand.New(rand.NewPCG(uint64(order), 5))
				ub := UniformBase{WordEnd: 0.4, Units: len(c.Inventory)}
				seg := RandomSegmentation(c, 0.4, rng)
				if d < 0 {
					if ub.Nuclei, err = NewNuclei(c, []string{"a"}); err != nil {
						t.Fatal(err)
					}
					if d == -2 {
						ub.Shapes = NewPhonotactics(c, ub.Nuclei, 2, 4)
					}
					d = 0
					ub.Nuclei.Repair(seg)
				}
				m := NewWords(c, order, PitmanYor{d, 3}, PitmanYor{d / 2, 2}, ub)
				g := NewBlockedSampler(seg, m, 5, rng)
				for range 3 { // a state with repeated words
					g.Sweep(1, rng)
				}
				for u := 0; u < c.Len(); u++ {
					us, ue := c.Utterance(u)
					K := g.maxLen(us, ue)
					inv := 1 / temp
					for _, uniProp := range []bool{false, true} {
						if order == 1 && !uniProp {
							continue
						}
						newB := g.growScratch(ue-us, K)
						r1 := rand.New(rand.NewPCG(uint64(u), 9))
						var q1old, q1new, q2old, q2new float64
						if uniProp {
							q1old, q1new = g.unigramProposal(us, ue, K, inv, newB, r1)
						} else {
							q1old, q1new = g.bigramProposal(us, ue, K, inv, newB, r1)
						}
						want := slices.Clone(newB)
						newB = g.growScratch(ue-us, K)
						r2 := rand.New(rand.NewPCG(uint64(u), 9))
						ok := false
						if uniProp {
							q2old, q2new, ok = g.unigramProposalLinear(ub, us, ue, K, inv, newB, r2)
						} else {
							q2old, q2new, ok = g.bigramProposalLinear(ub, us, ue, K, inv, newB, r2)
						}
						if !ok {
							t.Fatalf("order %d T %v utterance %d: the linear lattice fell back", order, temp, u)
						}
						if !slices.Equal(want, newB) {
							t.Errorf("order %d d %v T %v utterance %d: drew %v in log space, %v with probabilities", order, d, temp, u, want, newB)
						}
						for _, p := range [][2]float64{{q1old, q2old}, {q1new, q2new}} {
							if math.Abs(p[0]-p[1]) > 1e-9*math.Max(1, math.Abs(p[0])) {
								t.Errorf("order %d d %v T %v utterance %d: log q %v in log space, %v with probabilities", order, d, temp, u, p[0], p[1])
							}
						}
					}
				}
			}
		}
	}
}
