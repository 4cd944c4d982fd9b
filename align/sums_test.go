package align

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"
)

// TestSumsRandomMoves applies random splits and joins, with word ids old
// and new, and checks every predicted change of log P against LogProb
// recomputed from scratch, and the running sums against Check.
func TestSumsRandomMoves(t *testing.T) {
	for i, tc := range []struct {
		beta       float64
		noNull     bool
		sized, loo bool
		nullSize   float64
	}{
		{beta: 0}, {beta: 0.5}, {beta: 10}, {beta: 0.5, noNull: true},
		{beta: 0.5, sized: true}, {beta: 0.5, sized: true, nullSize: 2.5},
		{beta: 0.5, loo: true}, {beta: 0, loo: true}, {beta: 1, sized: true, loo: true},
	} {
		rng := rand.New(rand.NewPCG(7, uint64(tc.beta*10)+uint64(i)<<8))
		words, translations := randomCorpus(rng, 50, 30, 25, 6)
		m := NewModel(translations, tc.beta)
		m.NoNull = tc.noNull
		if tc.sized {
			m.Size, m.NullSize = testSize, tc.nullSize
		}
		m.LeaveOneOut = tc.loo
		m.Estimate(words, 5)
		s := m.NewSums(words)
		for step := range 5000 {
			u := rng.IntN(len(words))
			ws := words[u]
			before := m.LogProb(u, ws)
			after, predicted := randomMove(rng, s, u, ws)
			words[u] = after
			want := m.LogProb(u, after) - before
			if math.Abs(predicted-want) > 1e-9*max(1, math.Abs(want)) {
				t.Fatalf("beta %g NoNull %v step %d: predicted change %.15g, from scratch %.15g",
					tc.beta, tc.noNull, step, predicted, want)
			}
			if got := s.LogProb(u); math.Abs(got-m.LogProb(u, after)) > 1e-9*max(1, math.Abs(got)) {
				t.Fatalf("step %d: Sums.LogProb %.15g, from scratch %.15g", step, got, m.LogProb(u, after))
			}
			if s.Words(u) != len(after) {
				t.Fatalf("step %d: %d words counted, %d", step, s.Words(u), len(after))
			}
		}
		if err := s.Check(words, 1e-9); err != nil {
			t.Errorf("case %d: %v", i, err)
		}
		// Re-estimating makes the sums stale; Recompute restores them.
		m.Estimate(words, 1)
		s.Recompute(words)
		if err := s.Check(words, 1e-15); err != nil {
			t.Errorf("after Recompute: %v", err)
		}
	}
}

// TestSumsSet checks Set against a fresh Sums.
func TestSumsSet(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	words, translations := randomCorpus(rng, 20, 10, 8, 5)
	m := NewModel(translations, 1)
	m.Estimate(words, 3)
	s := m.NewSums(words)
	words[4] = []int32{9, 1, 1, 50}
	s.Set(4, words[4])
	if err := s.Check(words, 1e-15); err != nil {
		t.Error(err)
	}
}

// TestSumsCheckFails makes sure Check can fail.
func TestSumsCheckFails(t *testing.T) {
	m := NewModel([][]string{{"a", "b"}, {"a"}}, 1)
	words := [][]int32{{0, 1}, {0}}
	m.Estimate(words, 2)
	s := m.NewSums(words)
	s.Split(0, 0, 2, 3) // words not updated to match
	if s.Check(words, 1e-9) == nil {
		t.Error("Check missed a word-count mismatch")
	}
	s = m.NewSums(words)
	if err := s.Check([][]int32{{0, 2}, {0}}, 1e-9); err == nil {
		t.Error("Check missed different words")
	}
}

// TestNoAllocs checks that the sampler's hot path does not allocate.
// AllocsPerRun counts allocations, not time.
func TestNoAllocs(t *testing.T) {
	for _, sizedLOO := range []bool{false, true} {
		t.Run(fmt.Sprintf("sized+leave-one-out=%v", sizedLOO), func(t *testing.T) { testNoAllocs(t, sizedLOO) })
	}
}

func testNoAllocs(t *testing.T, sizedLOO bool) {
	rng := rand.New(rand.NewPCG(5, 6))
	words, translations := randomCorpus(rng, 30, 20, 15, 5)
	m := NewModel(translations, 1)
	if sizedLOO {
		m.Size, m.LeaveOneOut = testSize, true
	}
	m.Estimate(words, 3)
	s := m.NewSums(words)
	u := 0
	for len(m.Tokens(u)) == 0 || len(words[u]) < 2 {
		u++
	}
	ws := words[u]
	for name, f := range map[string]func(){
		"SplitDelta":    func() { s.SplitDelta(u, ws[0], 3, 99) },
		"JoinDelta":     func() { s.JoinDelta(u, ws[0], ws[1], 7) },
		"Split+Join":    func() { s.Split(u, ws[0], 3, 99); s.Join(u, 3, 99, ws[0]) },
		"Sums.LogProb":  func() { s.LogProb(u) },
		"Set":           func() { s.Set(u, ws) },
		"Model.LogProb": func() { m.LogProb(u, ws) },
		"Prob":          func() { m.Prob(m.Tokens(u)[0], ws[0]) },
	} {
		if n := testing.AllocsPerRun(100, f); n != 0 {
			t.Errorf("%s: %v allocations per call", name, n)
		}
	}
}
