package segment_test

import (
	"math"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// TestLogProbEstimate compares the estimate with ExactLogJoint, the sum
// over every seating arrangement, on a tiny corpus: equal for the
// Dirichlet-process unigram model, whose predictive ignores the seating,
// and within a small tolerance after many draws where the seating matters
// (Pitman-Yor discounts, the bigram model). Unbiasedness is in linear
// space, so the log of the mean of many draws comes close to the exact
// value.
func TestLogProbEstimate(t *testing.T) {
	c := tinyCorpus(t, "abab", "abba", "ba")
	seg := &Segmentation{Corpus: c, Boundary: make([]bool, len(c.Units))}
	for _, i := range []int{2, 6, 7, 9} { // ab|ab, ab|b|a, b|a
		seg.Boundary[i] = true
	}
	for _, tc := range []struct {
		name      string
		model     string
		discounts float64
		draws     int
		tol       float64
	}{
		{"unigram DP", "unigram", 0, 1, 1e-9},
		{"unigram PY", "unigram", 0.4, 5000, 0.03},
		{"bigram DP", "bigram", 0, 5000, 0.03},
		{"bigram PY", "bigram", 0.3, 5000, 0.03},
	} {
		t.Run(tc.name, func(t *testing.T) {
			cfg := DefaultConfig()
			cfg.Model = tc.model
			h := Hyper{Alpha0: 2, Alpha1: 3, Discount0: tc.discounts, Discount1: tc.discounts, WordEnd: 0.4}
			order := 1
			if tc.model == "bigram" {
				order = 2
			}
			m := NewWords(c, order, PitmanYor{h.Discount0, h.Alpha0}, PitmanYor{h.Discount1, h.Alpha1},
				UniformBase{WordEnd: h.WordEnd, Units: len(c.Inventory)})
			m.Rho = cfg.Rho
			want := m.ExactLogJoint(seg)
			got := LogProbEstimate(seg, cfg, h, tc.draws, rand.New(rand.NewPCG(1, 2)))
			if math.Abs(got-want) > tc.tol {
				t.Errorf("estimate %.5f, exact %.5f", got, want)
			}
		})
	}
}

// TestFitHyper: the unigram concentration follows the number of tables a
// segmentation needs (the posterior of alpha given k tables among n
// customers rises with k, Escobar & West 1995; from memory), so a
// segmentation of all-distinct words fits a larger alpha0 than one word
// repeated; fixed hyperparameters stay as given.
func TestFitHyper(t *testing.T) {
	c := tinyCorpus(t, "abcdefgh", "ijklmnop", "abababab", "abababab")
	distinct := &Segmentation{Corpus: c, Boundary: make([]bool, len(c.Units))}
	repeated := &Segmentation{Corpus: c, Boundary: make([]bool, len(c.Units))}
	for i := range c.Units {
		distinct.Boundary[i] = i < 16 // every unit of the first two lines a word
		repeated.Boundary[i] = i%8 == 0 || (i >= 16 && i%2 == 0)
	}
	cfg := DefaultConfig()
	cfg.Fixed.WordEnd = true
	h := Hyper{Alpha0: 5, WordEnd: 0.5}
	rng := rand.New(rand.NewPCG(3, 4))
	var a [2]float64
	for k, s := range []*Segmentation{distinct, repeated} {
		for range 20 {
			a[k] += FitHyper(s, cfg, h, 50, rng).Alpha0 / 20
		}
	}
	if !(a[0] > 2*a[1]) {
		t.Errorf("alpha0 fitted to distinct words %.2f, to a repeated word %.2f", a[0], a[1])
	}
	cfg.Fixed.Alpha0 = true
	if got := FitHyper(distinct, cfg, h, 50, rng); got.Alpha0 != 5 || got.WordEnd != 0.5 {
		t.Errorf("fixed hyperparameters moved: %+v", got)
	}
}
