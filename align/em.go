package align

import (
	"fmt"
	"slices"
)

// Estimate runs iterations of EM on the table, starting from the current
// one (from p(e) after NewModel or Reset), with words[u] the word ids of
// utterance u under the current segmentation. Ids are any non-negative
// int32s; the table's memory grows with the largest, so they should be
// dense, as interned word types are.
//
// The E-step gives each token e_j of utterance u the posterior probability
// of being aligned to each position i (NULL included),
//
//	P(a_j = i | e, w) = t(e_j|w_i) / (t(e_j|NULL) + sum_i' t(e_j|w_i')),
//
// and n(e,w) sums these over every token e and every occurrence of w: the
// expected counts of Brown et al. (1993), section 4.1, where the sum over
// alignments factorises into a product over tokens (section number from
// memory). The M-step is the table formula of Model, read from
// the new counts. A word repeated in an utterance counts once per
// occurrence, and so does a repeated token.
//
// The E-step runs over utterances in order, so the table does not depend
// on map order or goroutines. Estimate panics if len(words) is not
// m.Len(), if an id is negative, or if Beta is negative or NaN.
func (m *Model) Estimate(words [][]int32, iterations int) {
	m.checkUtterances(words)
	if !(m.Beta >= 0) {
		panic(fmt.Sprintf("align: Beta %v, want >= 0", m.Beta))
	}
	maxWord := int32(-1)
	for _, ws := range words {
		for _, w := range ws {
			checkWord(w)
			maxWord = max(maxWord, w)
		}
	}
	if iterations <= 0 {
		return
	}
	m.countOccurrences(words, int(maxWord)+2)
	for it := range iterations {
		m.step(words, int(maxWord)+2, m.LeaveOneOut && it == iterations-1)
	}
	m.buildRows()
}

// Reset forgets the counts: every word's table becomes p(e) again.
func (m *Model) Reset() {
	clear(m.pair)
	m.total = m.total[:1]
	m.total[0] = 0
	clear(m.null)
	m.occurrences = m.occurrences[:0]
	m.own = m.own[:0]
	m.buildRows()
}

// countOccurrences sets m.occurrences from words; columns is the largest
// word id plus 2.
func (m *Model) countOccurrences(words [][]int32, columns int) {
	m.occurrences = resize(m.occurrences, columns)
	clear(m.occurrences)
	for u, ws := range words {
		if len(m.Tokens(u)) == 0 {
			continue
		}
		m.occurrences[0]++
		for _, w := range ws {
			m.occurrences[w+1]++
		}
	}
}

// step is one EM iteration: the E-step reads the current table and
// collects counts into the next-table buffers, which then become current.
// With record, each utterance's own counts are kept for LeaveOneOut.
func (m *Model) step(words [][]int32, columns int, record bool) {
	clear(m.nextPair)
	m.nextTotal = resize(m.nextTotal, columns)
	clear(m.nextTotal)
	clear(m.nextNull)
	null := m.column(Null)
	for u, ws := range words {
		tokens := m.Tokens(u)
		if len(tokens) == 0 {
			continue
		}
		t := resize(m.scratch, len(ws))
		cols := resize(m.cols, len(ws))
		m.scratch, m.cols = t, cols
		for i, w := range ws {
			cols[i] = m.column(w)
		}
		var o *own
		if record {
			o = m.recordOwn(u, ws)
		}
		for j, e := range tokens {
			tNull := m.weighted(null, e, j)
			s := tNull
			for i := range ws {
				t[i] = m.weighted(cols[i], e, j)
				s += t[i]
			}
			if s == 0 {
				// No word can generate e: only possible with NoNull
				// and Beta = 0. The token adds no counts.
				continue
			}
			if !m.NoNull {
				c := tNull / s
				m.nextNull[e] += c
				m.nextTotal[0] += c
				if o != nil {
					o.null[j] += c
					o.nullTotal += c
				}
			}
			for i, w := range ws {
				c := t[i] / s
				m.nextPair[pairKey(w, e)] += c
				m.nextTotal[w+1] += c
				if o != nil {
					k := o.index(w)
					o.count[k*len(tokens)+j] += c
					o.total[k] += c
				}
			}
		}
		if o != nil {
			o.spread(tokens)
		}
	}
	m.pair, m.nextPair = m.nextPair, m.pair
	m.total, m.nextTotal = m.nextTotal, m.total
	m.null, m.nextNull = m.nextNull, m.null
	m.version++
}

// buildRows indexes the pairs with counts by word, each row sorted by
// token, for Glosses.
func (m *Model) buildRows() {
	m.version++
	n := len(m.total) // words + NULL
	m.rowStart = resize(m.rowStart, n+1)
	clear(m.rowStart)
	for key := range m.pair {
		m.rowStart[key>>32+2]++ // word w's row starts at rowStart[w+1]
	}
	for i := 1; i <= n; i++ {
		m.rowStart[i] += m.rowStart[i-1]
	}
	m.rowE = resize(m.rowE, len(m.pair))
	fill := slices.Clone(m.rowStart)
	for key := range m.pair {
		w := key >> 32
		m.rowE[fill[w+1]] = int32(uint32(key))
		fill[w+1]++
	}
	for i := 1; i < n; i++ {
		slices.Sort(m.rowE[m.rowStart[i]:m.rowStart[i+1]])
	}
}

// row returns the tokens with a count for word w >= 0, in increasing order.
func (m *Model) row(w int32) []int32 {
	i := int(w) + 1
	if i+1 >= len(m.rowStart) {
		return nil
	}
	return m.rowE[m.rowStart[i]:m.rowStart[i+1]]
}

// resize returns s with length n, reusing its memory when it can. The
// contents are not cleared.
func resize[T any](s []T, n int) []T {
	if cap(s) >= n {
		return s[:n]
	}
	return make([]T, n)
}
