package segment

import (
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

// TestCollocationLinearMatchesLogSpace runs two collocation samplers from
// the same state with the same random stream, one drawing groupings with
// probabilities and one in log space, and checks that they make the same
// moves, at temperature 1 and while annealing (the exact-posterior harness
// checks temperature 1 only), with and without nuclei.
func TestCollocationLinearMatchesLogSpace(t *testing.T) {
	text := "abcabcab\nbcab\ncabcaabc\naabbccabcab\nab\nbbcabca\ncabcabcabcabcabc\nabcabcabcabcabcabcabcabcabcabcabcabcab"
	for _, nuclei := range []bool{false, true} {
		for _, temp := range []float64{1, 2.5, 10} {
			var segs [2][]bool
			var groups [2][]bool
			var rates [2]float64
			for k, logSpace := range []bool{false, true} {
				c, err := ReadCorpus(strings.NewReader(text), "t", ReadOptions{})
				if err != nil {
					t.Fatal(err)
				}
				c.IndexSpans(6)
				rng := rand.New(rand.NewPCG(3, 5))
				ub := UniformBase{WordEnd: 0.4, Units: len(c.Inventory)}
				seg := RandomSegmentation(c, 0.4, rng)
				if nuclei {
					if ub.Nuclei, err = NewNuclei(c, []string{"a"}); err != nil {
						t.Fatal(err)
					}
					ub.Nuclei.Repair(seg)
				}
				m := NewCollocations(c, PitmanYor{0.2, 3}, PitmanYor{0.3, 2}, ub, 0.5)
				g := NewCollocationSampler(seg, nil, m, 6, rng)
				g.logSpace = logSpace
				for range 5 {
					g.Sweep(temp, rng)
				}
				segs[k], groups[k], rates[k] = seg.Boundary, g.Groups, g.AcceptanceRate()
			}
			if !slices.Equal(segs[0], segs[1]) || !slices.Equal(groups[0], groups[1]) || rates[0] != rates[1] {
				t.Errorf("nuclei %v T %v: the linear and log-space lattices made different moves (acceptance %v, %v)", nuclei, temp, rates[0], rates[1])
			}
		}
	}
}
