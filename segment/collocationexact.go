package segment

import "math"

// ExactLogJoint returns log P(s) under m's model and parameters, summed
// over every grouping of s's words into collocations and every seating of
// both levels. Its cost grows exponentially with the number of words: it
// exists so tests can compare the sampler with the exact posterior on tiny
// corpora. m's own counts are not used or changed.
func (m *Collocations) ExactLogJoint(s *Segmentation) float64 {
	c := s.Corpus
	var gaps []int // word boundaries inside utterances: each may start a collocation
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		for i := start + 1; i < end; i++ {
			if s.Boundary[i] {
				gaps = append(gaps, i)
			}
		}
	}
	if len(gaps) > 20 {
		panic("segment: ExactLogJoint needs a tiny corpus")
	}
	groups := make([]bool, len(c.Units))
	acc := math.Inf(-1)
	for mask := 0; mask < 1<<len(gaps); mask++ {
		for j, i := range gaps {
			groups[i] = mask&(1<<j) != 0
		}
		f := NewCollocations(c, m.Word, m.Group, m.Base, m.GroupEnd)
		f.Rho = m.Rho
		var dishes []WordType
		var ends []int
		for u := 0; u < c.Len(); u++ {
			ends = groupsOf(s, groups, u, ends, func(a int, ends []int) {
				dishes = append(dishes, f.internDish(a, ends))
			})
		}
		acc = logAddExp(acc, f.seatGroups(dishes, 0)+f.logEnds(len(dishes)))
	}
	return acc
}

// seatGroups returns the log of the sum, over all seatings of the
// collocation customers ds[k:] and of the words of the tables they open,
// of their probability given the seating so far.
func (m *Collocations) seatGroups(ds []WordType, k int) float64 {
	if k == len(ds) {
		return 0
	}
	d := ds[k]
	parent := func(cont func() float64) float64 {
		ws := m.dishWordsOf(d)
		return m.logLengthTerm(len(ws)) + m.seatWords(ws, 0, cont)
	}
	return enumAdd(m.groups, 0, d, parent, func() float64 { return m.seatGroups(ds, k+1) })
}

// seatWords sums over the seatings of the word customers ws[k:], each term
// times exp(cont()) evaluated in that seating.
func (m *Collocations) seatWords(ws []WordType, k int, cont func() float64) float64 {
	if k == len(ws) {
		return cont()
	}
	w := ws[k]
	base := func(next func() float64) float64 { return m.Types.LogBase[w] + next() }
	return enumAdd(m.words, 0, w, base, func() float64 { return m.seatWords(ws, k+1, cont) })
}
