package segment_test

import (
	"fmt"
	"math"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// TestPhonotacticsShape checks the syllable reading of a few words against
// probabilities worked out by hand from the run counts of the corpus.
func TestPhonotacticsShape(t *testing.T) {
	// Utterances: "stab" (initial st, nucleus a, final b), "ab" (initial
	// empty, final b), "tasta" (initial t, medial st, final empty).
	c := tinyCorpus(t, "stab", "ab", "tasta")
	nuc, err := NewNuclei(c, []string{"a"})
	if err != nil {
		t.Fatal(err)
	}
	const beta = 2
	p := NewPhonotactics(c, nuc, beta, 8)
	// Run distributions: (n(r) + beta G(r)) / (n + beta), G geometric
	// with ratio 1/2 (empty runs allowed) and uniform over the 3 other
	// units s t b; nuclei are single units.
	gEdge := func(k int) float64 { return math.Pow(0.5, float64(k+1)) / math.Pow(3, float64(k)) }
	pInit := func(n float64, k int) float64 { return (n + beta*gEdge(k)) / (3 + beta) }
	pFin := pInit
	pMed := func(n float64, k int) float64 { return (n + beta*gEdge(k)) / (1 + beta) }
	pNuc := func(n float64, k int) float64 { return (n + beta) / (4 + beta) } // one nucleus unit: G = 1
	cases := []struct {
		a, b int // span of the corpus "stab|ab|tasta"
		k    int
		want float64
	}{
		{0, 4, 1, pInit(1, 2) * pNuc(4, 1) * pFin(2, 1)},                            // stab
		{2, 4, 1, pInit(1, 0) * pNuc(4, 1) * pFin(2, 1)},                            // ab
		{1, 3, 1, pInit(1, 1) * pNuc(4, 1) * pFin(1, 0)},                            // ta
		{6, 11, 2, pInit(1, 1) * pNuc(4, 1) * pMed(1, 2) * pNuc(4, 1) * pFin(1, 0)}, // tasta
		{7, 10, 1, pInit(1, 0) * pNuc(4, 1) * pFin(0, 2)},                           // ast
		{0, 2, 0, 0}, // st
	}
	for _, tc := range cases {
		k, lp := p.Span(c, tc.a, tc.b)
		if k != tc.k || math.Abs(math.Exp(lp)-tc.want) > 1e-12*tc.want {
			t.Errorf("%q: k %d, P %v; want k %d, P %v", c.Text(tc.a, tc.b), k, math.Exp(lp), tc.k, tc.want)
		}
	}
}

// TestPhonotacticsExactPosterior runs the samplers with the syllable
// skeleton base through the exact posterior harness, with a given
// smoothing and, for the blocked bigram sampler, a fitted one (the
// samplers do not care where the base's values come from, so one kind
// suffices there).
func TestPhonotacticsExactPosterior(t *testing.T) {
	for _, tc := range []struct {
		beta  float64
		kinds []string
	}{
		{1, []string{"unigram/blocked", "bigram/blocked", "unigram/boundary", "bigram/boundary", "collocation"}},
		{0, []string{"bigram/blocked"}},
	} {
		t.Run(fmt.Sprintf("beta=%v", tc.beta), func(t *testing.T) {
			checkRestrictedExact(t, tc.kinds, 5, func(c *Corpus, nuc *Nuclei) UniformBase {
				return UniformBase{WordEnd: 0.4, Units: len(c.Inventory), Nuclei: nuc, Shapes: NewPhonotactics(c, nuc, tc.beta, 8)}
			})
		})
	}
}
