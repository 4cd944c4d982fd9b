package segment_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// TestNgramBaseEmptyIsUniform checks that a unit model with no customers
// gives every symbol, end symbol included, the uniform probability
// 1/(V+1) at the bottom of the hierarchy (Teh 2006: an empty restaurant's
// predictive is its parent's).
func TestNgramBaseEmptyIsUniform(t *testing.T) {
	c := tinyCorpus(t, "abcab", "ca")
	V := len(c.Inventory)
	for order := 1; order <= 4; order++ {
		b := NewNgramBase(V, order, nil)
		for _, span := range [][2]int{{0, 1}, {0, 5}, {1, 4}, {5, 7}} {
			n := span[1] - span[0]
			want := float64(n+1) * math.Log(1/float64(V+1))
			if got := b.LogProb(c, span[0], span[1]); math.Abs(got-want) > 1e-12 {
				t.Errorf("order %d, %q: LogProb = %v, want %v", order, c.Text(span[0], span[1]), got, want)
			}
		}
	}
}

// TestNgramBaseFirstWord checks, on a case worked by hand, the probability
// of a first word "abc" under a bigram word model with an order-2 unit
// model, the model's joint after seating it, and the unit model's
// predictive afterwards. Every seating here is forced (each customer is the
// first of its dish in its context), so ExactLogJoint and LogJoint agree.
func TestNgramBaseFirstWord(t *testing.T) {
	c := tinyCorpus(t, "abc")
	const (
		d0, a0 = 0.3, 1.5 // unit model, empty context
		d1, a1 = 0.6, 0.7 // unit model, one-unit contexts
		D0, A0 = 0.2, 2.0 // word model, unigram level
		e      = 0.25     // EndBase
	)
	levels := []PitmanYor{{Discount: d0, Concentration: a0}, {Discount: d1, Concentration: a1}}
	newModel := func() *Words {
		m := NewWords(c, 2, PitmanYor{Discount: D0, Concentration: A0}, PitmanYor{Discount: 0.4, Concentration: 1},
			NewNgramBase(3, 2, levels))
		m.EndBase = e
		return m
	}
	// V = 3 units, so the uniform bottom gives 1/4. Seating "abc": a after
	// the word start finds every restaurant empty; b after a finds context
	// [a] empty and the empty context holding one table (of a), so
	// P(b) = (a0 + d0)(1/4) / (1 + a0); likewise c and the end symbol with
	// 2 and 3 tables in the empty context.
	pWord := 0.25 * (a0 + d0) * 0.25 / (1 + a0) * (a0 + 2*d0) * 0.25 / (2 + a0) * (a0 + 3*d0) * 0.25 / (3 + a0)
	// Word level: P(abc | $) = (1-e) P0(abc); P($ | abc) = (A0 + D0) e / (1 + A0)
	// since the unigram level then holds one table (of abc).
	want := math.Log((1 - e) * pWord * (A0 + D0) * e / (1 + A0))

	m := newModel()
	s := NewSegmentation(c)
	if got := m.ExactLogJoint(s); math.Abs(got-want) > 1e-12 {
		t.Errorf("ExactLogJoint = %v, want %v", got, want)
	}
	m.AddSegmentation(s, rand.New(rand.NewPCG(1, 2)))
	if err := m.Check(); err != nil {
		t.Fatal(err)
	}
	if got := m.LogJoint(); math.Abs(got-want) > 1e-12 {
		t.Errorf("LogJoint = %v, want %v", got, want)
	}

	// Now the empty context holds one table each of a, b, c and the end
	// symbol: P_0(x) = (1 - d0 + (a0 + 4 d0)/4) / (4 + a0) for all four.
	// Contexts [#], [a], [b], [c] hold one table of a, b, c, end.
	p0 := (1 - d0 + (a0+4*d0)/4) / (4 + a0)
	join := (1 - d1 + (a1+d1)*p0) / (1 + a1)
	fresh := (a1 + d1) * p0 / (1 + a1)
	b := m.Base.(*NgramBase)
	for _, tc := range []struct {
		start, end int
		want       float64
	}{
		{0, 2, join * join * fresh}, // "ab": a|#, b|a seen; end|b unseen
		{0, 1, join * fresh},        // "a": a|# seen; end|a unseen
		{1, 3, fresh * join * join}, // "bc": b|# unseen; c|b, end|c seen
	} {
		if got := b.LogProb(c, tc.start, tc.end); math.Abs(got-math.Log(tc.want)) > 1e-12 {
			t.Errorf("after seating abc: LogProb(%q) = %v, want %v", c.Text(tc.start, tc.end), got, math.Log(tc.want))
		}
	}
	if cu, tb := b.Counts(); cu != 8 || tb != 8 {
		t.Errorf("Counts = %d customers, %d tables; want 8, 8", cu, tb)
	}
}

// TestNgramBaseExactPosterior runs the word models with a unit-model base
// through the exact posterior harness: the enumeration sums over the
// seatings of the unit customers too.
func TestNgramBaseExactPosterior(t *testing.T) {
	cases := []struct {
		lines  []string
		order  int // word model
		uni    PitmanYor
		bi     PitmanYor
		levels []PitmanYor // unit model, len = its order
	}{
		{[]string{"abab", "ab"}, 1, PitmanYor{0.5, 1}, PitmanYor{}, []PitmanYor{{0.5, 1}, {0.3, 2}}},
		{[]string{"abab", "ba"}, 2, PitmanYor{0.3, 1}, PitmanYor{0.5, 1}, []PitmanYor{{0.2, 1}, {0.7, 0.5}}},
		{[]string{"aab", "ba"}, 1, PitmanYor{0, 1}, PitmanYor{}, []PitmanYor{{0, 1}, {0, 1}}},
		{[]string{"aab", "ba"}, 2, PitmanYor{0.5, 2}, PitmanYor{0.2, 1}, []PitmanYor{{0.6, 0.5}, {0.4, 1}}},
		{[]string{"aab", "ba"}, 1, PitmanYor{0.4, 1}, PitmanYor{}, []PitmanYor{{0.8, 0.2}}},
		{[]string{"abba"}, 2, PitmanYor{0.5, 1}, PitmanYor{0.5, 1}, []PitmanYor{{0.5, 1}, {0.5, 1}, {0.5, 1}}},
	}
	for i, tc := range cases {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			t.Parallel() // own corpus and random source
			c := tinyCorpus(t, tc.lines...)
			base := NewNgramBase(len(c.Inventory), len(tc.levels), tc.levels)
			m := NewWords(c, tc.order, tc.uni, tc.bi, base)
			checkGibbsExact(t, m, rand.New(rand.NewPCG(uint64(i), 17)), 10000)
			if err := m.Check(); err != nil {
				t.Error(err)
			}
		})
	}
}

// TestNgramBaseEmptiesAfterSampling samples for a while, checking the
// seating invariants after every sweep, then removes every word: the unit
// model must be left with no customers and uniform predictions.
func TestNgramBaseEmptiesAfterSampling(t *testing.T) {
	c := tinyCorpus(t, "tanamiku", "kutana", "mikutanami", "namikuta", "tatata", "kukumi")
	for _, order := range []int{1, 2} {
		for _, unitOrder := range []int{1, 3} {
			t.Run(fmt.Sprintf("words%d/units%d", order, unitOrder), func(t *testing.T) {
				t.Parallel() // own corpus and random source
				b := NewNgramBase(len(c.Inventory), unitOrder, nil)
				m := NewWords(c, order, PitmanYor{0.5, 1}, PitmanYor{0.5, 1}, b)
				rng := rand.New(rand.NewPCG(uint64(order), uint64(unitOrder)))
				g := NewWordsGibbs(RandomSegmentation(c, 0.5, rng), m, rng)
				if err := m.Check(); err != nil {
					t.Fatalf("after seating: %v", err)
				}
				for sweep := 0; sweep < 30; sweep++ {
					g.Sweep(1, rng)
					if err := m.Check(); err != nil {
						t.Fatalf("sweep %d: %v", sweep, err)
					}
				}
				if cu, _ := b.Counts(); cu == 0 {
					t.Fatal("the unit model has no customers while words are seated")
				}
				m.RemoveSegmentation(g.Seg, rng)
				if err := m.Check(); err != nil {
					t.Fatalf("after removing every word: %v", err)
				}
				if cu, tb := b.Counts(); cu != 0 || tb != 0 {
					t.Errorf("after removing every word: %d customers, %d tables", cu, tb)
				}
				want := 5 * math.Log(1/float64(len(c.Inventory)+1))
				if got := b.LogProb(c, 0, 4); math.Abs(got-want) > 1e-12 {
					t.Errorf("after removing every word: LogProb = %v, want uniform %v", got, want)
				}
			})
		}
	}
}

// TestNgramBaseLogProbDoesNotAllocate checks that reading the unit model
// looks its contexts up without allocating (DESIGN.md section 2: no
// per-word allocation in the sampler).
func TestNgramBaseLogProbDoesNotAllocate(t *testing.T) {
	c := tinyCorpus(t, "tanamiku", "kutana")
	b := NewNgramBase(len(c.Inventory), 3, nil)
	m := NewWords(c, 1, PitmanYor{0.5, 1}, PitmanYor{}, b)
	m.AddSegmentation(RandomSegmentation(c, 0.3, rand.New(rand.NewPCG(3, 4))), rand.New(rand.NewPCG(5, 6)))
	if allocs := testing.AllocsPerRun(100, func() { b.LogProb(c, 2, 7) }); allocs != 0 {
		t.Errorf("LogProb allocates %v times per call", allocs)
	}
}
