package align

import (
	"fmt"
	"math"
)

// Sums keeps, for every translation token e_j of every utterance, the
// running sum
//
//	S_j = t(e_j|NULL) + sum_i t(e_j|w_i)
//
// over the words of the current segmentation, and each utterance's word
// count k, so that log P(e|w) = sum_j log S_j - m log(k+1) changes by
//
//	sum_j log(S'_j / S_j) - m (log(k'+1) - log(k+1))
//
// when a sampler splits a word w into w1 w2 (S'_j = S_j - t(e_j|w) +
// t(e_j|w1) + t(e_j|w2), k' = k+1) or joins two (the reverse). Each such
// change costs O(m) table lookups and allocates nothing.
//
// A Sums caches the table: after Estimate, Reset or a change of Beta or
// NoNull, call Recompute. Using a stale Sums panics. Updates accumulate
// rounding error of about one ulp of S_j each; Recompute also clears it.
// A Sums must not be used from several goroutines at once. With NoNull
// and Beta = 0 a token that no word explains has S_j = 0, so log P = -Inf
// and changes from that state are NaN.
type Sums struct {
	m       *Model
	s       []float64 // s[i] is S_j of the token m.tokens[i]
	k       []int32   // k[u] is the number of words of utterance u
	z       []float64 // z[u] is the normaliser of utterance u's alignment prior
	version uint64
	beta    float64
	noNull  bool
}

// NewSums returns the sums of m for the segmentation words, words[u] being
// the word ids of utterance u.
func (m *Model) NewSums(words [][]int32) *Sums {
	s := &Sums{m: m, s: make([]float64, len(m.tokens)), k: make([]int32, m.Len()), z: make([]float64, m.Len())}
	s.Recompute(words)
	return s
}

// Recompute sets every utterance's sums from words under the current
// table.
func (s *Sums) Recompute(words [][]int32) {
	s.m.checkUtterances(words)
	s.version, s.beta, s.noNull = s.m.version, s.m.Beta, s.m.NoNull
	for u, ws := range words {
		s.Set(u, ws)
	}
}

// Set recomputes utterance u's sums for its words ws, as after a change
// that is not one split or join (a blocked sampler's new segmentation of
// the utterance). It does not allocate.
func (s *Sums) Set(u int, ws []int32) {
	s.check()
	m := s.m
	sums := s.s[m.starts[u]:m.starts[u+1]]
	null := m.columnIn(u, Null)
	for j, e := range m.Tokens(u) {
		sums[j] = m.weighted(null, e, j)
	}
	for _, w := range ws {
		c := m.columnIn(u, w)
		for j, e := range m.Tokens(u) {
			sums[j] += m.weighted(c, e, j)
		}
	}
	s.k[u] = int32(len(ws))
	s.z[u] = m.norm(ws)
}

// Words returns the number of words k of utterance u.
func (s *Sums) Words(u int) int { return int(s.k[u]) }

// LogProb returns log P(e_u | w) for utterance u from its sums: the value
// Model.LogProb gives for the current words, up to rounding.
func (s *Sums) LogProb(u int) float64 {
	s.check()
	m := s.m
	lp := 0.0
	for _, sj := range s.s[m.starts[u]:m.starts[u+1]] {
		lp += math.Log(sj)
	}
	return lp - float64(m.starts[u+1]-m.starts[u])*math.Log(s.z[u])
}

// SplitDelta returns the change of log P(e_u | w) if one occurrence of
// word w in utterance u became the two words w1 and w2. Sums are not
// changed.
func (s *Sums) SplitDelta(u int, w, w1, w2 int32) float64 {
	return s.replace(u, [2]int32{w}, 1, [2]int32{w1, w2}, 2, false)
}

// JoinDelta returns the change of log P(e_u | w) if one occurrence each of
// words w1 and w2 in utterance u became the single word w. Sums are not
// changed.
func (s *Sums) JoinDelta(u int, w1, w2, w int32) float64 {
	return s.replace(u, [2]int32{w1, w2}, 2, [2]int32{w}, 1, false)
}

// Split updates utterance u's sums after one occurrence of w became w1 w2.
func (s *Sums) Split(u int, w, w1, w2 int32) {
	s.replace(u, [2]int32{w}, 1, [2]int32{w1, w2}, 2, true)
}

// Join updates utterance u's sums after w1 and w2 became w.
func (s *Sums) Join(u int, w1, w2, w int32) {
	s.replace(u, [2]int32{w1, w2}, 2, [2]int32{w}, 1, true)
}

// replace computes, and if apply stores, the sums of utterance u with
// nOut words out replaced by nIn words in. Without apply it returns the
// change of log P; with apply it returns 0.
func (s *Sums) replace(u int, out [2]int32, nOut int, in [2]int32, nIn int, apply bool) float64 {
	s.check()
	m := s.m
	k := int(s.k[u]) - nOut + nIn
	if int(s.k[u]) < nOut {
		panic(fmt.Sprintf("align: utterance %d has %d words, cannot remove %d", u, s.k[u], nOut))
	}
	var cols [4]column
	for i := range nOut {
		cols[i] = m.columnIn(u, out[i])
	}
	for i := range nIn {
		cols[2+i] = m.columnIn(u, in[i])
	}
	z := s.z[u]
	if m.Size == nil {
		z = float64(m.positions(k))
	} else {
		for i := range nOut {
			z -= cols[i].size
		}
		for i := range nIn {
			z += cols[2+i].size
		}
	}
	sums := s.s[m.starts[u]:m.starts[u+1]]
	tokens := m.Tokens(u)
	if apply {
		for j, e := range tokens {
			sums[j] = s.updated(sums[j], e, j, &cols, nOut, nIn)
		}
		s.k[u] = int32(k)
		s.z[u] = z
		return 0
	}
	// Multiply the ratios S'_j / S_j, each with the normaliser's ratio
	// Z/Z' ((k+1)/(k'+1) for Model 1), and take one logarithm,
	// renormalising before the product could leave the range of float64.
	norm := s.z[u] / z
	lp, prod := 0.0, 1.0
	for j, e := range tokens {
		prod *= s.updated(sums[j], e, j, &cols, nOut, nIn) / sums[j] * norm
		if prod < 0x1p-500 || prod > 0x1p500 {
			lp += math.Log(prod)
			prod = 1
		}
	}
	return lp + math.Log(prod)
}

// updated returns S_j for token e after the replacement described by cols
// (out words in cols[:nOut], in words in cols[2:2+nIn]). A result below 0,
// which only rounding can give, is 0.
func (s *Sums) updated(sj float64, e int32, j int, cols *[4]column, nOut, nIn int) float64 {
	m := s.m
	for i := range nOut {
		sj -= m.weighted(cols[i], e, j)
	}
	for i := range nIn {
		sj += m.weighted(cols[2+i], e, j)
	}
	return max(sj, 0)
}

// check panics if the table changed since the sums were computed.
func (s *Sums) check() {
	if s.version != s.m.version || s.beta != s.m.Beta || s.noNull != s.m.NoNull {
		panic("align: Sums used after the table changed; call Recompute")
	}
}

// Check compares every utterance's sums and word count with a computation
// from scratch for words, with relative tolerance tol, and reports the
// first difference. Tests call it after sequences of updates.
func (s *Sums) Check(words [][]int32, tol float64) error {
	s.check()
	m := s.m
	m.checkUtterances(words)
	for u, ws := range words {
		if int(s.k[u]) != len(ws) {
			return fmt.Errorf("utterance %d: %d words counted, %d given", u, s.k[u], len(ws))
		}
		for j, e := range m.Tokens(u) {
			want := m.weighted(m.columnIn(u, Null), e, j)
			for _, w := range ws {
				want += m.weighted(m.columnIn(u, w), e, j)
			}
			got := s.s[m.starts[u]+j]
			if math.Abs(got-want) > tol*math.Abs(want) {
				return fmt.Errorf("utterance %d token %d (%q): running sum %v, from scratch %v", u, j, m.Word(e), got, want)
			}
		}
	}
	return nil
}
