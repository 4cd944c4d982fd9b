package segment

import "math"

// ExactLogJoint returns log P(s) under m's model and parameters, summed
// over every seating arrangement of the Chinese restaurant franchise. Its
// cost grows exponentially with the number of tokens: it exists so tests
// can compare samplers with the exact posterior on tiny corpora; with an
// adaptive base the sum runs over the base's seatings too, every unit of a
// unigram-level table's word being a customer. m's own counts are not used
// or changed.
func (m *Words) ExactLogJoint(s *Segmentation) float64 {
	base := m.Base
	if nb := m.ngram(); nb != nil {
		base = nb.empty()
	}
	f := NewWords(s.Corpus, m.Order, m.Unigram, m.Bigram, base)
	f.Rho, f.EndBase = m.Rho, m.EndBase
	var cs []customer
	tokens := 0
	for u := 0; u < s.Corpus.Len(); u++ {
		prev := End
		s.Words(u, func(a, b int) {
			w := f.Intern(a, b)
			cs = append(cs, customer{prev, w})
			prev = w
			tokens++
		})
		if f.Order == 2 {
			cs = append(cs, customer{prev, End})
		}
	}
	return f.seatAll(cs, 0) + f.logEnds(tokens)
}

// seatAll returns the log of the sum, over all seatings of customers
// cs[k:], of their probability given the seating so far.
func (m *Words) seatAll(cs []customer, k int) float64 {
	if k == len(cs) {
		return 0
	}
	c := cs[k]
	rest := func() float64 { return m.seatAll(cs, k+1) }
	base := func(cont func() float64) float64 {
		if nb := m.ngram(); nb != nil && c.w != End {
			s, e := m.span(c.w)
			return m.logShare(c.w) + nb.enumWord(m.Corpus, s, s, e, cont)
		}
		return m.logBase(c.w) + cont()
	}
	uni := func(cont func() float64) float64 { return enumAdd(m.uni, 0, c.w, base, cont) }
	if m.Order == 1 {
		return uni(rest)
	}
	return enumAdd(m.bi, contextOf(c.prev), c.w, uni, rest)
}

// enumWord returns the log of the sum, over all seatings of the customers
// of positions i..end of the word [start, end) of c (its units from i on,
// then the end symbol), of their probability given the seating so far,
// each term times exp(cont()) evaluated in that seating.
func (b *NgramBase) enumWord(c *Corpus, start, i, end int, cont func() float64) float64 {
	if i > end {
		return cont()
	}
	next := func() float64 { return b.enumWord(c, start, i+1, end, cont) }
	return b.enumSymbol(c, start, i, len(b.levels)-1, symbolAt(c, i, end), next)
}

// enumSymbol sums over the seatings of one customer of dish in its level-k
// context and, through new tables, in the contexts it backs off to.
func (b *NgramBase) enumSymbol(c *Corpus, start, i, k int, dish WordType, cont func() float64) float64 {
	parent := func(cont func() float64) float64 {
		if k == 0 {
			return b.logUniform + cont()
		}
		return b.enumSymbol(c, start, i, k-1, dish, cont)
	}
	return enumAdd(b.levels[k], b.context(c, start, i, k), dish, parent, cont)
}

// enumAdd sums over the ways of seating one customer of dish w in context
// ctx of r: at each existing table size, or at a new table whose dish the
// parent must then supply. cont continues with the remaining customers.
func enumAdd(r *restaurants, ctx int32, w WordType,
	parent func(cont func() float64) float64, cont func() float64) float64 {
	d, a := r.params.Discount, r.params.Concentration
	r.seating(ctx, w, true)
	c, t := r.totals(ctx)
	denom := math.Log(c + a)
	sizes := append([]sizeCount(nil), r.seating(ctx, w, false).hist...)
	acc := math.Inf(-1)
	for _, sc := range sizes {
		lw := math.Log(float64(sc.Tables)*(float64(sc.Size)-d)) - denom
		r.seatAt(ctx, r.seating(ctx, w, false), sc.Size)
		v := cont()
		r.unseatAt(ctx, r.seating(ctx, w, false), sc.Size+1)
		acc = logAddExp(acc, lw+v)
	}
	lw := math.Log(a+d*t) - denom
	if c == 0 {
		lw = 0 // the first customer opens a table, also when a = 0
	}
	r.seatAt(ctx, r.seating(ctx, w, false), 0)
	v := parent(cont)
	r.unseatAt(ctx, r.seating(ctx, w, false), 1)
	return logAddExp(acc, lw+v)
}
