package align

import (
	"math"
	"math/rand/v2"
	"testing"
)

// looModel returns a LeaveOneOut model of a random corpus after EM.
func looModel(t *testing.T, seed uint64, beta float64) (*Model, [][]int32) {
	t.Helper()
	rng := rand.New(rand.NewPCG(seed, 11))
	words, translations := randomCorpus(rng, 60, 20, 15, 5)
	m := NewModel(translations, beta)
	m.LeaveOneOut = true
	m.Estimate(words, 4)
	return m, words
}

// ownCount returns utterance u's share of n(e, w) recorded by the last
// E-step, 0 if e is not among u's tokens.
func ownCount(m *Model, u int, w, e int32) float64 {
	o := &m.own[u]
	row := o.null
	if w != Null {
		i := o.index(w)
		if i < 0 {
			return 0
		}
		n := len(m.Tokens(u))
		row = o.count[i*n : (i+1)*n]
	}
	for j, f := range m.Tokens(u) {
		if f == e {
			return row[j]
		}
	}
	return 0
}

// TestLeaveOneOutCountsAddUp checks that the utterances' own counts are a
// partition of the table's: for every word (NULL included) and token,
// their sum over utterances is n(e, w), as the E-step's counts are sums
// over utterances of the alignment posteriors.
func TestLeaveOneOutCountsAddUp(t *testing.T) {
	m, words := looModel(t, 1, 0.5)
	for _, w := range seenWords(m, words) {
		for e := range int32(m.VocabSize()) {
			var sum float64
			for u := range words {
				if len(m.Tokens(u)) > 0 {
					sum += ownCount(m, u, w, e)
				}
			}
			n := m.Count(e, w)
			if math.Abs(sum-n) > 1e-9*max(1, n) {
				t.Fatalf("word %d token %d: own counts sum to %.12g, table has %.12g", w, e, sum, n)
			}
		}
	}
}

// TestLeaveOneOutNormalised checks that the table an utterance sees is a
// distribution over the vocabulary for each of its words: removing its
// counts from numerators and denominator alike keeps every row summing
// to 1.
func TestLeaveOneOutNormalised(t *testing.T) {
	m, words := looModel(t, 2, 1)
	for u, ws := range words {
		if len(m.Tokens(u)) == 0 {
			continue
		}
		for _, w := range append([]int32{Null}, ws...) {
			c := m.columnIn(u, w)
			sum := 0.0
			for e := range int32(m.VocabSize()) {
				if c.own == nil {
					sum += m.probIn(c, e)
				} else {
					sum += m.probOut(c, e, ownCount(m, u, w, e))
				}
			}
			if math.Abs(sum-1) > 1e-12 {
				t.Fatalf("utterance %d word %d: row sums to %.15f", u, w, sum)
			}
		}
	}
}

// TestLeaveOneOutUnique checks the point of leaving one out: a word seen
// in one utterance only says nothing there, so the utterance's log
// probability is that of the background p(e) for it, whatever EM
// learned, while the table itself still holds what EM learned.
func TestLeaveOneOutUnique(t *testing.T) {
	translations := [][]string{{"sun", "big"}, {"sun"}, {"moon"}}
	words := [][]int32{{0, 1}, {0}, {2}} // word 2 occurs only in utterance 2
	m := NewModel(translations, 1)
	m.LeaveOneOut = true
	m.Estimate(words, 5)
	moon, _ := m.ID("moon")
	// NULL's own share in utterance 2 is removed too; compute the
	// expected value from the definitions.
	null := m.columnIn(2, Null)
	want := math.Log((m.weighted(null, moon, 0) + m.Prior(moon)) / 2)
	if got := m.LogProb(2, words[2]); math.Abs(got-want) > 1e-12 {
		t.Errorf("LogProb of the unique word's utterance %.15g, want %.15g", got, want)
	}
	if p := m.Prob(moon, 2); p <= m.Prior(moon) {
		t.Errorf("t(moon|w2) = %g: the full table should have learned it (prior %g)", p, m.Prior(moon))
	}
	m.LeaveOneOut = false
	if got := m.LogProb(2, words[2]); got <= want {
		t.Errorf("without LeaveOneOut, LogProb %g should exceed the background's %g", got, want)
	}
}

// TestSizeOne checks that Size only reweighs: every word and NULL of size
// c, for any c, is Model 1 as published.
func TestSizeOne(t *testing.T) {
	rng := rand.New(rand.NewPCG(4, 5))
	words, translations := randomCorpus(rng, 40, 20, 15, 5)
	plain := NewModel(translations, 0.5)
	plain.Estimate(words, 4)
	for _, c := range []float64{1, 3.5} {
		sized := NewModel(translations, 0.5)
		sized.Size = func(int32) float64 { return c }
		sized.NullSize = c
		sized.Estimate(words, 4)
		for u, ws := range words {
			a, b := plain.LogProb(u, ws), sized.LogProb(u, ws)
			if math.Abs(a-b) > 1e-9*max(1, math.Abs(a)) {
				t.Fatalf("size %g, utterance %d: LogProb %.15g, Model 1 %.15g", c, u, b, a)
			}
		}
	}
}

// TestSizeSplitFree checks why Size is the length in units: splitting a
// word into two parts that predict the translation exactly as the whole
// does leaves P(e | w) unchanged, where Model 1 charges for the extra
// position.
func TestSizeSplitFree(t *testing.T) {
	translations := [][]string{{"water"}, {"water"}, {"water", "cold"}}
	// Word 0 is "ab" (2 units); words 1 and 2 are "a" and "b". All three
	// are unseen by EM (no utterance holds them), so they predict p(e).
	words := [][]int32{{3}, {3}, {3, 4}}
	length := map[int32]float64{0: 2, 1: 1, 2: 1, 3: 1, 4: 1}
	m := NewModel(translations, 1)
	m.Size = func(w int32) float64 { return length[w] }
	m.Estimate(words, 3)
	u := 2
	whole := m.LogProb(u, []int32{0, 4})
	split := m.LogProb(u, []int32{1, 2, 4})
	if math.Abs(whole-split) > 1e-12 {
		t.Errorf("sized: whole %.15g, split %.15g; want equal", whole, split)
	}
	m1 := NewModel(translations, 1)
	m1.Estimate(words, 3)
	if a, b := m1.LogProb(u, []int32{0, 4}), m1.LogProb(u, []int32{1, 2, 4}); math.Abs(a-b) < 1e-6 {
		t.Errorf("Model 1: whole %.15g, split %.15g; want different", a, b)
	}
}

// TestResetForgetsOwn checks that Reset drops the own counts too: after
// it every word predicts p(e) in every utterance.
func TestResetForgetsOwn(t *testing.T) {
	m, words := looModel(t, 3, 0.5)
	m.Reset()
	s := m.NewSums(words)
	if err := s.Check(words, 1e-12); err != nil {
		t.Fatal(err)
	}
	for u, ws := range words {
		want := 0.0
		for _, e := range m.Tokens(u) {
			want += math.Log(m.Prior(e))
		}
		if got := m.LogProb(u, ws); math.Abs(got-want) > 1e-9*max(1, math.Abs(want)) {
			t.Fatalf("utterance %d after Reset: LogProb %.15g, background %.15g", u, got, want)
		}
	}
}
