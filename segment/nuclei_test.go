package segment_test

import (
	"math"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

func TestNucleiCheck(t *testing.T) {
	cases := []struct {
		lines  []string
		spaces bool // spaces are certain boundaries (locks)
		nuclei []string
		want   string // substring of the error, "" for none
	}{
		{[]string{"bata", "ka"}, false, []string{"a"}, ""},
		{[]string{"bata", "pst"}, false, []string{"a"}, "tiny:2: no unit of the line is a nucleus (a)"},
		{[]string{"bata", "ka"}, false, []string{"a", "o"}, `nucleus "o" is not a unit of tiny`},
		{[]string{"ba t ka"}, true, []string{"a"}, `tiny:1: the hand-split word "t" has no nucleus`},
		{[]string{"ba tka"}, true, []string{"a"}, ""}, // "t" can join "ka"
	}
	for _, tc := range cases {
		c, err := ReadCorpus(strings.NewReader(strings.Join(tc.lines, "\n")), "tiny", ReadOptions{SpacesAreBoundaries: tc.spaces})
		if err != nil {
			t.Fatal(err)
		}
		nuc, err := NewNuclei(c, tc.nuclei)
		if err == nil {
			err = nuc.Check(c)
		}
		switch {
		case tc.want == "" && err != nil:
			t.Errorf("%q: unexpected error %v", tc.lines, err)
		case tc.want != "" && (err == nil || !strings.Contains(err.Error(), tc.want)):
			t.Errorf("%q: error %v, want one containing %q", tc.lines, err, tc.want)
		}
	}
}

// TestNucleiRepair: from any start, every word holds a nucleus afterwards,
// and only boundaries were removed.
func TestNucleiRepair(t *testing.T) {
	c := tinyCorpus(t, "stabrakstis", "tsa", "ast", "pataka")
	nuc, err := NewNuclei(c, []string{"a", "i"})
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range []float64{0, 0.3, 0.7, 1} {
		s := RandomSegmentation(c, p, NewRand(7, 0))
		before := append([]bool(nil), s.Boundary...)
		nuc.Repair(s)
		for i := range s.Boundary {
			if s.Boundary[i] && !before[i] {
				t.Errorf("p=%v: repair added a boundary at %d", p, i)
			}
		}
		for u := 0; u < c.Len(); u++ {
			s.Words(u, func(a, b int) {
				if !nuc.Has(a, b) {
					t.Errorf("p=%v: word %q has no nucleus after repair", p, c.Text(a, b))
				}
			})
		}
	}
}

// TestNucleiBaseNormalised: restricted to words with a nucleus and
// renormalised, the uniform base sums to 1 over all strings (summed here
// by length up to where the tail is negligible).
func TestNucleiBaseNormalised(t *testing.T) {
	c := tinyCorpus(t, "abcae") // inventory a b c e: 2 nuclei, 2 others
	nuc, err := NewNuclei(c, []string{"a", "e"})
	if err != nil {
		t.Fatal(err)
	}
	for _, pEnd := range []float64{0.1, 0.5, 0.9} {
		b := UniformBase{WordEnd: pEnd, Units: 4, Nuclei: nuc}
		free := UniformBase{WordEnd: pEnd, Units: 4}
		// A string of k units has a nucleus unless all k are others: of
		// the 4^k strings, 4^k - 2^k. The span [0, k) of "abcae" has one,
		// so b.LogProb gives the probability of each such string.
		total := 0.0
		for k := 1; k <= 5; k++ {
			total += (math.Pow(4, float64(k)) - math.Pow(2, float64(k))) * math.Exp(b.LogProb(c, 0, k))
		}
		for k := 6; k < 400; k++ { // same probability per length as the free base, renormalised
			lp := free.LogProb(c, 0, 1) + float64(k-1)*math.Log1p(-pEnd) - float64(k-1)*math.Log(4)
			ratio := math.Exp(b.LogProb(c, 0, 1) - free.LogProb(c, 0, 1))
			total += (math.Pow(4, float64(k)) - math.Pow(2, float64(k))) * math.Exp(lp) * ratio
		}
		if math.Abs(total-1) > 1e-9 {
			t.Errorf("p#=%v: restricted base sums to %v, want 1", pEnd, total)
		}
		if !math.IsInf(b.LogProb(c, 1, 3), -1) { // "bc"
			t.Errorf("p#=%v: a word without a nucleus has log P0 %v, want -Inf", pEnd, b.LogProb(c, 1, 3))
		}
	}
}

// TestNucleiExactPosterior runs the samplers with a nucleus-restricted
// base through the exact posterior harness: the blocked sampler (whose
// lattices fall back to log space with nuclei) for both orders, the
// boundary sampler, and the collocation sampler.
func TestNucleiExactPosterior(t *testing.T) {
	checkRestrictedExact(t, []string{"unigram/blocked", "bigram/blocked", "unigram/boundary", "collocation"}, 3,
		func(c *Corpus, nuc *Nuclei) UniformBase {
			return UniformBase{WordEnd: 0.4, Units: len(c.Inventory), Nuclei: nuc}
		})
}

// checkRestrictedExact runs each kind of sampler (model/sampler, or
// collocation) with the base that base makes for nuclei "a" on a tiny
// corpus through the exact posterior harness, random source seeded with
// seed.
func checkRestrictedExact(t *testing.T, kinds []string, seed uint64, base func(*Corpus, *Nuclei) UniformBase) {
	lines := []string{"bataba", "taba", "ab"}
	for _, kind := range kinds {
		t.Run(kind, func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, lines...)
			nuc, err := NewNuclei(c, []string{"a"})
			if err != nil {
				t.Fatal(err)
			}
			base := base(c, nuc)
			rng := NewRand(seed, 1)
			seg := RandomSegmentation(c, 1, rng)
			nuc.Repair(seg)
			var post map[string]float64
			var chain *sweepChain
			switch kind {
			case "collocation":
				m := NewCollocations(c, PitmanYor{0, 1}, PitmanYor{0.3, 1}, base, 0.5)
				post = truncatedPosterior(c, 0, m.ExactLogJoint)
				chain = &sweepChain{NewCollocationSampler(seg, nil, m, 0, rng), seg, rng}
			default:
				order := 1
				if strings.HasPrefix(kind, "bigram") {
					order = 2
				}
				m := NewWords(c, order, PitmanYor{0, 2}, PitmanYor{0, 1}, base)
				post = truncatedPosterior(c, 0, m.ExactLogJoint)
				if strings.HasSuffix(kind, "boundary") {
					chain = &sweepChain{NewWordsGibbs(seg, m, rng), seg, rng}
				} else {
					chain = &sweepChain{NewBlockedSampler(seg, m, 0, rng), seg, rng}
				}
			}
			for k := range post {
				if strings.Contains(" "+strings.ReplaceAll(k, "|", " ")+" ", " b ") || strings.Contains(" "+k+" ", " t ") {
					t.Fatalf("segmentation %q with a word without a nucleus has probability %v", k, post[k])
				}
			}
			thin := 10
			if strings.HasPrefix(kind, "bigram") {
				thin = 25 // as in TestBlockedExactPosterior: the bigram chain hops between modes slowly
			}
			r := exact.ChiSquare(post, exact.Sample(chain, 100, thin, 20000))
			if r.P < 1e-3 {
				t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
			}
			t.Log(r)
		})
	}
}
