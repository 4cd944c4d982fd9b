package segment

import "math"

// ExactLogJoint returns log P(s) under m's model and parameters, summed
// over every seating arrangement of the Chinese restaurant franchise. Its
// cost grows exponentially with the number of tokens: it exists so tests
// can compare samplers with the exact posterior on tiny corpora. m's own
// counts are not used or changed.
func (m *Words) ExactLogJoint(s *Segmentation) float64 {
	f := NewWords(s.Corpus, m.Order, m.Unigram, m.Bigram, m.Base)
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
	base := func(cont func() float64) float64 { return m.logBase(c.w) + cont() }
	uni := func(cont func() float64) float64 { return m.enumAdd(m.uni, 0, c.w, base, cont) }
	if m.Order == 1 {
		return uni(rest)
	}
	return m.enumAdd(m.bi, contextOf(c.prev), c.w, uni, rest)
}

// enumAdd sums over the ways of seating one customer of dish w in context
// ctx of r: at each existing table size, or at a new table whose dish the
// parent must then supply. cont continues with the remaining customers.
func (m *Words) enumAdd(r *restaurants, ctx int32, w WordType,
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
	r.seatAt(ctx, r.seating(ctx, w, false), 0)
	v := parent(cont)
	r.unseatAt(ctx, r.seating(ctx, w, false), 1)
	return logAddExp(acc, lw+v)
}
