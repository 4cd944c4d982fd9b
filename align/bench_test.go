package align

import (
	"math/rand/v2"
	"testing"
)

// benchCorpus is a synthetic corpus of the size DESIGN section 5 mentions
// (a few thousand short lines): 5,000 utterances of 1..8 words from 3,000
// types, translations from 1,500 tokens, fitted with 5 EM iterations,
// with the full table or, with loo, the leave-one-out one.
func benchCorpus(b *testing.B, loo bool) (*Model, [][]int32, *Sums) {
	rng := rand.New(rand.NewPCG(11, 12))
	words, translations := randomCorpus(rng, 5000, 3000, 1500, 8)
	m := NewModel(translations, 1)
	m.LeaveOneOut = loo
	m.Estimate(words, 5)
	return m, words, m.NewSums(words)
}

// tables runs f as sub-benchmarks on the full and the leave-one-out
// table, so their costs can be compared.
func tables(b *testing.B, f func(b *testing.B, loo bool)) {
	b.Run("table=full", func(b *testing.B) { f(b, false) })
	b.Run("table=leave-one-out", func(b *testing.B) { f(b, true) })
}

// move is a split of word w of utterance u into w1 w2, or a join of w1
// w2 into w.
type move struct {
	u         int
	w, w1, w2 int32
}

// benchMoves returns random moves in utterances with a translation: half
// into known types, half into types the table has not seen, as a boundary
// sampler proposes. For joins, w1 and w2 are adjacent words of u.
func benchMoves(m *Model, words [][]int32, n int, join bool) []move {
	rng := rand.New(rand.NewPCG(13, 14))
	ms := make([]move, 0, n)
	for len(ms) < n {
		u := rng.IntN(len(words))
		ws := words[u]
		if len(m.Tokens(u)) == 0 || (join && len(ws) < 2) {
			continue
		}
		fresh := func() int32 {
			if rng.IntN(2) == 0 {
				return 3000 + int32(rng.IntN(1000))
			}
			return int32(rng.IntN(3000))
		}
		if join {
			i := rng.IntN(len(ws) - 1)
			ms = append(ms, move{u: u, w: fresh(), w1: ws[i], w2: ws[i+1]})
		} else {
			ms = append(ms, move{u: u, w: ws[rng.IntN(len(ws))], w1: fresh(), w2: fresh()})
		}
	}
	return ms
}

func BenchmarkSplitDelta(b *testing.B) { benchDelta(b, false) }

func BenchmarkJoinDelta(b *testing.B) { benchDelta(b, true) }

// benchDelta measures SplitDelta, or JoinDelta with join, on random moves.
func benchDelta(b *testing.B, join bool) {
	tables(b, func(b *testing.B, loo bool) {
		m, words, s := benchCorpus(b, loo)
		ms := benchMoves(m, words, 4096, join)
		b.ReportAllocs()
		sink := 0.0
		for i := 0; b.Loop(); i++ {
			mv := &ms[i%len(ms)]
			if join {
				sink += s.JoinDelta(mv.u, mv.w1, mv.w2, mv.w)
			} else {
				sink += s.SplitDelta(mv.u, mv.w, mv.w1, mv.w2)
			}
		}
		_ = sink
	})
}

// BenchmarkSplitJoin applies a split and undoes it with a join: the cost
// of an accepted move and its reversal.
func BenchmarkSplitJoin(b *testing.B) {
	tables(b, func(b *testing.B, loo bool) {
		m, words, s := benchCorpus(b, loo)
		ms := benchMoves(m, words, 4096, false)
		b.ReportAllocs()
		for i := 0; b.Loop(); i++ {
			mv := &ms[i%len(ms)]
			s.Split(mv.u, mv.w, mv.w1, mv.w2)
			s.Join(mv.u, mv.w1, mv.w2, mv.w)
		}
	})
}

// BenchmarkLogProb is the from-scratch score of one utterance, for
// comparison with the incremental deltas.
func BenchmarkLogProb(b *testing.B) {
	tables(b, func(b *testing.B, loo bool) {
		m, words, _ := benchCorpus(b, loo)
		b.ReportAllocs()
		sink := 0.0
		for i := 0; b.Loop(); i++ {
			u := i % len(words)
			sink += m.LogProb(u, words[u])
		}
		_ = sink
	})
}

// BenchmarkEstimate is one EM iteration over the whole corpus.
func BenchmarkEstimate(b *testing.B) {
	tables(b, func(b *testing.B, loo bool) {
		m, words, _ := benchCorpus(b, loo)
		b.ReportAllocs()
		for b.Loop() {
			m.Estimate(words, 1)
		}
	})
}
