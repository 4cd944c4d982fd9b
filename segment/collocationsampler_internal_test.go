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

// TestIndexedLatticesMatchGeneral checks that the span-index fast paths
// of the word and collocation lattices give the general loops' values to
// the bit, with and without the phonotactic base, after sweeps have
// seated words and collocations.
func TestIndexedLatticesMatchGeneral(t *testing.T) {
	text := "abcabcab\nbcab\ncabcaabc\naabbccabcab\nab\nbbcabca\ncabcabcabcabcabc"
	for _, shapes := range []bool{false, true} {
		c, err := ReadCorpus(strings.NewReader(text), "t", ReadOptions{})
		if err != nil {
			t.Fatal(err)
		}
		c.IndexSpans(MaxCollocationLength)
		rng := rand.New(rand.NewPCG(7, 9))
		nuc, err := NewNuclei(c, []string{"a"})
		if err != nil {
			t.Fatal(err)
		}
		ub := UniformBase{WordEnd: 0.4, Units: len(c.Inventory), Nuclei: nuc}
		if shapes {
			ub.Shapes = NewPhonotactics(c, nuc, 20, MaxCollocationLength)
		}
		seg := RandomSegmentation(c, 0.4, rng)
		nuc.Repair(seg)
		m := NewCollocations(c, PitmanYor{0.2, 3}, PitmanYor{0.3, 2}, ub, 0.5)
		g := NewCollocationSampler(seg, nil, m, 6, rng)
		for range 5 {
			g.Sweep(1, rng)
		}
		for u := 0; u < c.Len(); u++ {
			us, ue := c.Utterance(u)
			L, Kw := ue-us, 6
			Kg := max(L, Kw)
			var wp, lx [2][]float64
			for k, general := range []bool{false, true} {
				g.general = general
				g.wordLattice(us, ue, Kw)
				g.inner = growFloats(g.inner, (L+1)*(Kg+1))
				for i := 0; i < L; i++ {
					g.innerFrom(i, L, Kw, Kg)
				}
				g.lx = growFloats(g.lx, (L+1)*(Kg+1))
				if general || !g.collocationLatticeIndexed(us, ue, Kg, 0.3, 1.7, 0.9) {
					g.collocationLattice(us, ue, Kg, 0.3, 1.7, 0.9)
				}
				wp[k] = slices.Clone(g.wp[:L*(Kw+1)])
				lx[k] = slices.Clone(g.lx[:L*(Kg+1)])
			}
			for i := 0; i < L; i++ {
				wp[1][i*(Kw+1)] = wp[0][i*(Kw+1)] // column 0 is never read
				lx[1][i*(Kg+1)] = lx[0][i*(Kg+1)]
			}
			if !slices.Equal(wp[0], wp[1]) {
				t.Errorf("shapes %v, utterance %d: word lattices differ:\n%v\n%v", shapes, u, wp[0], wp[1])
			}
			if !slices.Equal(lx[0], lx[1]) {
				t.Errorf("shapes %v, utterance %d: collocation lattices differ:\n%v\n%v", shapes, u, lx[0], lx[1])
			}
		}
		g.general = false
	}
}
