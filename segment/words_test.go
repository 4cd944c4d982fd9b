package segment_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

type wordsChain struct {
	g   *WordsGibbs
	rng *rand.Rand
}

func (c *wordsChain) Step()                  { c.g.Sweep(1, c.rng) }
func (c *wordsChain) Current() *Segmentation { return c.g.Seg }

// checkGibbsExact runs the gap sampler on m from a random segmentation
// and compares n thinned samples with the exact posterior of m's model by
// a chi-square test; it returns the sampler for further checks.
func checkGibbsExact(t *testing.T, m *Words, rng *rand.Rand, n int) *WordsGibbs {
	t.Helper()
	post := exact.Posterior(m.Corpus, m.ExactLogJoint)
	g := NewWordsGibbs(RandomSegmentation(m.Corpus, 0.5, rng), m, rng)
	counts := exact.Sample(&wordsChain{g, rng}, 100, 10, n)
	r := exact.ChiSquare(post, counts)
	if r.P < 1e-3 {
		t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
	}
	t.Logf("%v (acceptance %.2f)", r, g.AcceptanceRate())
	return g
}

// TestWordsExactMatchesUnigram checks the franchise enumeration against
// the closed form of the Dirichlet-process unigram model: with no discount
// the seating sums must give the Polya-urn marginal.
func TestWordsExactMatchesUnigram(t *testing.T) {
	c := tinyCorpus(t, "abab", "ab", "ba")
	base := UniformBase{WordEnd: 0.4, Units: len(c.Inventory)}
	m := NewWords(c, 1, PitmanYor{Concentration: 3}, PitmanYor{}, base)
	rng := rand.New(rand.NewPCG(1, 1))
	for trial := 0; trial < 10; trial++ {
		s := RandomSegmentation(c, 0.5, rng)
		want := unigramLogJoint(3, 2, base)(s)
		if got := m.ExactLogJoint(s); math.Abs(got-want) > 1e-9 {
			t.Fatalf("%s: enumeration %v, closed form %v", exact.Key(s), got, want)
		}
	}
}

// TestWordsSingleWordIsBase checks the enumeration on a case worked by
// hand: the first customer of an empty Pitman-Yor restaurant always opens a
// table, so its probability is the parent's.
func TestWordsSingleWordIsBase(t *testing.T) {
	c := tinyCorpus(t, "abc")
	base := UniformBase{WordEnd: 0.3, Units: 3}
	for _, d := range []float64{0, 0.5} {
		m := NewWords(c, 2, PitmanYor{Discount: d, Concentration: 1}, PitmanYor{Discount: d, Concentration: 2}, base)
		m.EndBase = 0.2
		s := NewSegmentation(c)
		// One word w then End: P(w|$) = (1-e)P0(w); P($|w) = e after w
		// opened a new unigram table, since G0 then has 1 customer w:
		// P($) = (a0 + d0) e / (1 + a0).
		lp0 := base.LogProb(c, 0, 3)
		want := math.Log(0.8) + lp0 + math.Log((1+d)*0.2/(1+1))
		if got := m.ExactLogJoint(s); math.Abs(got-want) > 1e-12 {
			t.Errorf("d=%v: ExactLogJoint = %v, want %v", d, got, want)
		}
	}
}

// TestWordsGibbsExactPosterior runs every order and discount through the
// exact posterior harness.
func TestWordsGibbsExactPosterior(t *testing.T) {
	cases := []struct {
		lines   []string
		order   int
		uni     PitmanYor
		bi      PitmanYor
		wordEnd float64
	}{
		{[]string{"abab", "ab", "ba"}, 1, PitmanYor{0, 2}, PitmanYor{}, 0.5},
		{[]string{"abab", "ab", "ba"}, 1, PitmanYor{0.5, 1}, PitmanYor{}, 0.5},
		{[]string{"aaaa", "aa"}, 1, PitmanYor{0.8, 0.5}, PitmanYor{}, 0.3},
		{[]string{"abab", "ab"}, 2, PitmanYor{0, 1}, PitmanYor{0, 1}, 0.5},
		{[]string{"aab", "ab"}, 2, PitmanYor{0.5, 1}, PitmanYor{0.3, 2}, 0.4},
		{[]string{"abba", "ba"}, 2, PitmanYor{0.2, 3}, PitmanYor{0.6, 0.5}, 0.6},
	}
	for i, tc := range cases {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, tc.lines...)
			base := UniformBase{WordEnd: tc.wordEnd, Units: len(c.Inventory)}
			m := NewWords(c, tc.order, tc.uni, tc.bi, base)
			checkGibbsExact(t, m, rand.New(rand.NewPCG(uint64(i), 9)), 20000)
		})
	}
}
