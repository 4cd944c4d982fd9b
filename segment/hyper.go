package segment

import (
	"math"
	"math/rand/v2"
	"slices"
)

// Hyperparameter priors, vague and stated here once:
//   - each concentration a: log-uniform on [MinConcentration,
//     MaxConcentration], the scale-invariant choice when nothing is known
//     of the order of magnitude (common practice);
//   - each discount d: uniform on [0, MaxDiscount], i.e. Beta(1,1) as in
//     Teh (2006), kept away from 1;
//   - p#: Beta(1,1).
const (
	MinConcentration = 1e-2
	MaxConcentration = 1e6
	MaxDiscount      = 0.95
)

// Fixed says which hyperparameters are not sampled.
type Fixed struct {
	Alpha0, Alpha1, Discount0, Discount1, WordEnd bool
	// GroupEnd fixes the collocation model's g.
	GroupEnd bool `json:",omitempty"`
}

// seatingStats are the sufficient statistics of a level's seating for its
// hyperparameters: per-context customer and table totals and the histogram
// of table sizes pooled over all dishes.
type seatingStats struct {
	ctxCustomers, ctxTables []float64
	sizes                   []int32   // distinct table sizes, ascending
	tables                  []float64 // tables[i]: number of tables of sizes[i]
}

func (r *restaurants) stats() seatingStats {
	var s seatingStats
	for ctx := range r.customers {
		if r.customers[ctx] > 0 {
			s.ctxCustomers = append(s.ctxCustomers, float64(r.customers[ctx]))
			s.ctxTables = append(s.ctxTables, float64(r.tables[ctx]))
		}
	}
	bySize := map[int32]float64{}
	for i := range r.seats {
		for _, sc := range r.seats[i].hist {
			bySize[sc.Size] += float64(sc.Tables)
		}
	}
	for size := range bySize {
		s.sizes = append(s.sizes, size)
	}
	slices.Sort(s.sizes) // a fixed order keeps float sums reproducible
	for _, size := range s.sizes {
		s.tables = append(s.tables, bySize[size])
	}
	return s
}

// logLikelihood returns log P(seating | d, a) up to terms free of d and a,
// from the Pitman-Yor exchangeable partition probability function (Pitman
// 1995; Teh 2006, eq. 11):
//
//	sum_u [ sum_{k=1}^{t_u-1} log(a + k d) - log Gamma(a + c_u) + log Gamma(a + 1) ]
//	+ sum_tables [ log Gamma(size - d) - log Gamma(1 - d) ]
func (s *seatingStats) logLikelihood(d, a float64) float64 {
	lp := 0.0
	for i, c := range s.ctxCustomers {
		t := s.ctxTables[i]
		if d > 0 {
			// sum_{k=1}^{t-1} log(a + k d) = (t-1) log d + lgamma(a/d + t) - lgamma(a/d + 1)
			lp += (t-1)*math.Log(d) + lgamma(a/d+t) - lgamma(a/d+1)
		} else {
			lp += (t - 1) * math.Log(a)
		}
		lp += lgamma(a+1) - lgamma(a+c)
	}
	if d > 0 {
		lg := lgamma(1 - d)
		for i, size := range s.sizes {
			lp += s.tables[i] * (lgamma(float64(size)-d) - lg)
		}
	}
	return lp
}

// sampleLevel resamples the discount and concentration of one level by
// slice sampling under the priors above, given its seating.
func sampleLevel(r *restaurants, p *PitmanYor, fixD, fixA bool, rng *rand.Rand) {
	if len(r.seats) == 0 {
		return
	}
	st := r.stats()
	ll := st.logLikelihood
	if !fixD {
		a := p.Concentration
		p.Discount = sliceSample(math.Max(p.Discount, 1e-6), func(d float64) float64 { return ll(d, a) }, 0.1, 0, MaxDiscount, rng)
	}
	if !fixA {
		d := p.Discount
		// Sample log a: the log-uniform prior is flat in log a.
		la := sliceSample(math.Log(p.Concentration), func(la float64) float64 { return ll(d, math.Exp(la)) },
			1, math.Log(MinConcentration), math.Log(MaxConcentration), rng)
		p.Concentration = math.Exp(la)
	}
}

// SampleHyperparameters resamples every hyperparameter of m not marked
// fixed, given the current seating.
func (m *Words) SampleHyperparameters(fixed Fixed, rng *rand.Rand) {
	sampleLevel(m.uni, &m.Unigram, fixed.Discount0, fixed.Alpha0, rng)
	if m.Order == 2 {
		sampleLevel(m.bi, &m.Bigram, fixed.Discount1, fixed.Alpha1, rng)
	}
	switch b := m.Base.(type) {
	case UniformBase:
		if !fixed.WordEnd {
			m.sampleWordEnd(b, rng)
		}
	case *NgramBase:
		for k, r := range b.levels {
			sampleLevel(r, &b.Levels[k], false, false, rng)
		}
	}
}

// sampleWordEnd draws p# from its conditional given the unigram level's
// tables (see resampleWordEnd).
func (m *Words) sampleWordEnd(ub UniformBase, rng *rand.Rand) {
	m.Base = resampleWordEnd(ub, m.uni, m.Types, m.Corpus, rng)
}

// resampleWordEnd returns ub with p# drawn from its conditional given the
// tables of r, whose dishes are words (End excluded), and refreshes the
// types' cached base probabilities. Every table of word w contributes
// p#(1-p#)^(|w|-1) to the base factor, so under a Beta(1,1) prior p# |
// seating ~ Beta(1 + T, 1 + sum (|w|-1)) over the T word tables (see
// UniformBase.drawWordEnd for the base with nuclei).
func resampleWordEnd(ub UniformBase, r *restaurants, types *Types, c *Corpus, rng *rand.Rand) UniformBase {
	tables, extra := 0.0, 0.0
	for i := range r.seats {
		w := r.dishes[i]
		if w == End || r.seats[i].tables == 0 {
			continue // End, or an empty seat (perhaps of a forgotten type)
		}
		t := float64(r.seats[i].tables)
		tables += t
		s := int(types.First[w])
		extra += t * float64(ub.steps(c, s, s+int(types.Length[w])))
	}
	ub.WordEnd = ub.drawWordEnd(tables, extra, rng)
	for t := range types.Length {
		s := int(types.First[t])
		types.LogBase[t] = ub.LogProb(c, s, s+int(types.Length[t]))
	}
	return ub
}
