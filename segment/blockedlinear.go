package segment

import (
	"math"
	"math/rand/v2"
)

// unigramProposalLinear is unigramProposal computed with probabilities
// instead of their logarithms, for a model whose base is a UniformBase (so
// P0 depends on a word's length only). It returns ok = false, leaving newB
// untouched, when the scaled recursion leaves the floating-point range;
// the caller then falls back to the log-space version.
//
// The forward variables are kept scaled: with c_t the ratio of the forward
// sums at t and t-1, every scaled variable is 1, and a word [t-k, t) enters
// position t's sum with weight p(t,k) * prod_{t-k<i<t} 1/c_i. The products
// are built one factor at a time as k grows, so the lattice needs no
// exponentials or logarithms at temperature 1: profiling showed them (and
// hash lookups) to be most of a blocked sweep's cost. log Z = sum_t log c_t.
func (g *BlockedSampler) unigramProposalLinear(ub UniformBase, us, ue, K int, inv float64, newB []bool, rng *rand.Rand) (logQOld, logQNew float64, ok bool) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	W := K + 1

	// Word-independent factors: the continuation of the utterance (order
	// 1, see unigramProposal), the base's share, the base by length.
	share := 1.0
	if m.Order == 2 {
		share = 1 - m.EndBase
	}
	h := m.Rho / 2
	N := float64(m.tokens)
	cont := (N - float64(m.utterances-1) + h) / (N + m.Rho)
	p0 := g.cum[:W] // p0[k]: share * P0 of a word of k units
	q := (1 - ub.WordEnd) / float64(ub.Units)
	v := share * ub.WordEnd / float64(ub.Units)
	for k := 1; k < W; k++ {
		p0[k] = v
		v *= q
	}
	r := m.uni
	d, a := r.params.Discount, r.params.Concentration
	tot, tables := r.totals(0)
	norm := 1 / (tot + a)
	newW := a + d*tables
	if tot == 0 {
		norm, newW = 1, 1
	}

	term := g.term
	invc := g.fwd // invc[t] = 1/c_t
	invc[0] = 1
	logZ := 0.0
	for t := 1; t <= L; t++ {
		raw, ratio := 0.0, 1.0
		for k := 1; k < W; k++ {
			x := 0.0
			if k <= t {
				if k > 1 {
					ratio *= invc[t-k+1]
				}
				if spanOK(c, us, ue, us+t-k, us+t) {
					x = newW * p0[k]
					if w := m.lookupSpan(us+t-k, us+t); w >= 0 {
						if ds := r.seating(0, w, false); ds != nil && ds.customers > 0 {
							x += float64(ds.customers) - d*float64(ds.tables)
						}
					}
					x *= norm * cont
					if inv != 1 {
						x = math.Exp(inv * math.Log(x))
					}
					raw += x * ratio
				}
			}
			term[t*W+k] = x
		}
		if !(raw > 0) || math.IsInf(raw, 1) || math.IsInf(ratio, 1) {
			return 0, 0, false
		}
		invc[t] = 1 / raw
		logZ += math.Log(raw)
	}

	// Backward sampling: at t, k has probability
	// p(t,k) prod_{t-k<i<=t} 1/c_i, and these sum to 1.
	for t := L; t > 0; {
		u := rng.Float64()
		ratio := invc[t]
		k, last := 0, 0
		for j := 1; j < W && j <= t; j++ {
			if j > 1 {
				ratio *= invc[t-j+1]
			}
			x := term[t*W+j]
			if x == 0 {
				continue
			}
			last = j
			u -= x * ratio
			if u < 0 {
				k = j
				break
			}
		}
		if k == 0 {
			k = last // rounding
		}
		logQNew += math.Log(term[t*W+k])
		t -= k
		if t > 0 {
			newB[t] = true
		}
	}
	logQNew -= logZ

	// The old segmentation's proposal probability (log 0 = -Inf for a
	// word the lattice excludes).
	logQOld = g.oldLogQ(us, ue, K, func(t, k int) float64 { return math.Log(term[t*W+k]) })
	return logQOld - logZ, logQNew, true
}
