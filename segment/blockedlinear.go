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

	// The continuation of the utterance, a word-independent factor (see
	// unigramProposal).
	h := m.Rho / 2
	N := float64(m.tokens)
	cont := (N - float64(m.utterances-1) + h) / (N + m.Rho)
	up := g.newUniLinear(ub, K, cont, inv)

	term := g.term
	invc := g.fwd // invc[t] = 1/c_t
	invc[0] = 1
	// dead[t]: no word can end at t (a base restricted to words with a
	// nucleus gives some positions forward probability 0). Such a t keeps
	// c_t = 1 and starts no word.
	if cap(g.dead) < L+1 {
		g.dead = make([]bool, L+1, 2*(L+1))
	}
	dead := g.dead[:L+1]
	dead[0] = false
	logZ := 0.0
	for t := 1; t <= L; t++ {
		raw, ratio := 0.0, 1.0
		for k := 1; k < W; k++ {
			x := 0.0
			if k <= t {
				if k > 1 {
					ratio *= invc[t-k+1]
				}
				if !dead[t-k] && spanOK(c, us, ue, us+t-k, us+t) {
					_, _, x, _ = up.prob(m, us+t-k, us+t)
					raw += x * ratio
				}
			}
			term[t*W+k] = x
		}
		dead[t] = raw == 0 && t < L
		if dead[t] {
			invc[t] = 1
			continue
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

// uniLinear computes unigram-level predictive probabilities of spans for
// a model with a UniformBase, times a word-independent factor, and their
// powers 1/T. A span never seated costs no power: its probability depends
// on its length only, so those powers are computed once per length.
type uniLinear struct {
	p0, p0inv     []float64 // by length k: the new-table probability, and its power
	d, newW, norm float64
	scale, inv    float64
	r             *restaurants
	nuc           *Nuclei // a span without a nucleus has base probability 0
	shapes        *Phonotactics
	// With shapes, p0 is indexed by syllables, not units, and a span's
	// new-table probability is p0[k] times its shape probability.
}

// newUniLinear prepares uniLinear for words of up to K units, with every
// probability multiplied by scale and powers taken to inv.
func (g *BlockedSampler) newUniLinear(ub UniformBase, K int, scale, inv float64) uniLinear {
	m := g.Model
	share := 1.0
	if m.Order == 2 {
		share = 1 - m.EndBase
	}
	if cap(g.p0) < K+1 {
		g.p0, g.p0inv = make([]float64, K+1, 2*(K+1)), make([]float64, K+1, 2*(K+1))
	}
	u := uniLinear{p0: g.p0[:K+1], p0inv: g.p0inv[:K+1], r: m.uni, scale: scale, inv: inv, nuc: ub.Nuclei, shapes: ub.Shapes}
	tot, tables := m.uni.totals(0)
	u.d = m.uni.params.Discount
	u.norm = scale / (tot + m.uni.params.Concentration)
	u.newW = m.uni.params.Concentration + u.d*tables
	if tot == 0 {
		u.norm, u.newW = scale, 1
	}
	q := (1 - ub.WordEnd) / float64(ub.Units)
	v := share * ub.WordEnd / float64(ub.Units)
	if ub.Shapes != nil {
		q, v = 1-ub.WordEnd, share*ub.WordEnd
	} else if ub.Nuclei != nil {
		v /= math.Exp(ub.Nuclei.logMass(ub.WordEnd, ub.Units)) // renormalised over words with a nucleus
	}
	for k := 1; k <= K; k++ {
		u.p0[k] = u.newW * v
		u.p0inv[k] = powInv(u.p0[k]*u.norm, inv)
		v *= q
	}
	return u
}

// Flags of BlockedSampler.live.
const (
	liveWord    uint8 = 1
	liveContext uint8 = 2
)

// prob returns the type of span [a, b) (-2 if not interned), its
// unigram-level predictive probability times the scale, that to the power
// inv, and whether the type has unigram-level customers.
func (u *uniLinear) prob(m *Words, a, b int) (w WordType, x, xInv float64, seated bool) {
	k := b - a
	p0, p0inv := u.p0[k], u.p0inv[k]
	if u.shapes != nil {
		syl, shape := u.shapes.spanProb(m.Corpus, a, b)
		p0 = u.p0[syl] * shape
	} else if u.nuc != nil && !u.nuc.Has(a, b) {
		p0, p0inv = 0, 0
	}
	w = m.lookupSpan(a, b)
	if w >= 0 {
		if ds := u.r.seating(0, w, false); ds != nil && ds.customers > 0 {
			x = (p0 + float64(ds.customers) - u.d*float64(ds.tables)) * u.norm
			return w, x, powInv(x, u.inv), true
		}
	}
	if u.shapes != nil { // the new-table term depends on the span, not its length only
		p0inv = powInv(p0*u.norm, u.inv)
	}
	return w, p0 * u.norm, p0inv, false
}

// powInv returns x^inv, skipping the work at temperature 1.
func powInv(x, inv float64) float64 {
	if inv == 1 {
		return x
	}
	return math.Exp(inv * math.Log(x))
}

// bigramProposalLinear is bigramProposal computed with probabilities, for
// a model whose base is a UniformBase, scaled as in unigramProposalLinear:
// with c_t the sum over k of the scaled forward variables at t, a word
// [t-k, t) enters with weight term * prod_{t-k<i<t} 1/c_i, and
// log Z = sum_t log c_t + log sum_k f[L][k] P(End | k). ok is false, with
// newB untouched, if the sums leave the floating-point range.
func (g *BlockedSampler) bigramProposalLinear(ub UniformBase, us, ue, K int, inv float64, newB []bool, rng *rand.Rand) (logQOld, logQNew float64, ok bool) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	W := K + 1
	up := g.newUniLinear(ub, K, 1, inv)
	ids, uni, term, fwd := g.ids, g.uni, g.term, g.fwd
	uniInv, newInv, live := g.uniInv, g.newInv, g.live
	for t := 1; t <= L; t++ {
		for k := 1; k < W; k++ {
			idx := t*W + k
			ids[idx], uni[idx], uniInv[idx], newInv[idx], live[idx] = -2, 0, 0, 1, 0
			if k <= t && spanOK(c, us, ue, us+t-k, us+t) {
				var seated, ctxSeated bool
				ids[idx], uni[idx], uniInv[idx], seated = up.prob(m, us+t-k, us+t)
				newInv[idx], ctxSeated = g.newTableInv(ids[idx], inv)
				if seated {
					live[idx] |= liveWord
				}
				if ctxSeated {
					live[idx] |= liveContext
				}
			}
		}
	}
	g.startInv, _ = g.newTableInv(End, inv)
	invc := g.invc[:1] // invc[t] = 1/c_t
	invc[0] = 1
	logZ := 0.0
	for t := 1; t <= L; t++ {
		sum, ratio := 0.0, 1.0
		for k := 1; k < W; k++ {
			idx := t*W + k
			if k > 1 && k <= t {
				ratio *= invc[t-k+1]
			}
			raw := 0.0
			if k <= t && uni[idx] > 0 {
				if k == t {
					x := g.bigramTermLinear(t, k, 0, W, inv)
					term[idx*W] = x
					raw = x
				} else {
					term[idx*W] = 0
					for j := 1; j < W; j++ {
						x := 0.0
						if j <= t-k && fwd[(t-k)*W+j] > 0 {
							x = g.bigramTermLinear(t, k, j, W, inv)
							raw += fwd[(t-k)*W+j] * x
						}
						term[idx*W+j] = x
					}
				}
				raw *= ratio
			}
			fwd[idx] = raw
			sum += raw
		}
		if sum == 0 && t < L { // no word can end at t (see unigramProposalLinear)
			invc = append(invc, 1)
			continue
		}
		if !(sum > 0) || math.IsInf(sum, 1) || math.IsInf(ratio, 1) {
			return 0, 0, false
		}
		for k := 1; k < W; k++ {
			fwd[t*W+k] /= sum
		}
		invc = append(invc, 1/sum) // within capacity: growScratch sized it
		logZ += math.Log(sum)
	}

	// The End word after the last word of length k.
	ends := g.cum[:W]
	endUni := math.Exp(m.logUnigram(End))
	total := 0.0
	for k := 1; k < W; k++ {
		ends[k] = 0
		if fwd[L*W+k] > 0 {
			ends[k] = powInv(g.endTermLinear(L, k, W, endUni), inv)
			total += fwd[L*W+k] * ends[k]
		}
	}
	if !(total > 0) || math.IsInf(total, 1) {
		return 0, 0, false
	}
	logZ += math.Log(total)

	// Backward sampling.
	k := pickProduct(fwd[L*W:L*W+W], ends, total, rng)
	logQNew = math.Log(ends[k])
	for t := L; ; {
		idx := t*W + k
		if k == t {
			logQNew += math.Log(term[idx*W])
			break
		}
		n := min(W, t-k+1)
		prevFwd, terms := fwd[(t-k)*W:(t-k)*W+n], term[idx*W:idx*W+n]
		tot := 0.0
		for j := 1; j < n; j++ {
			tot += prevFwd[j] * terms[j]
		}
		j := pickProduct(prevFwd, terms, tot, rng)
		logQNew += math.Log(terms[j])
		t -= k
		newB[t] = true
		k = j
	}
	logQNew -= logZ

	// The old segmentation: walk its words.
	prevLen := 0
	logQOld = g.oldLogQ(us, ue, K, func(t, k int) float64 {
		x := 0.0
		if uni[t*W+k] > 0 {
			x = term[(t*W+k)*W+prevLen]
		}
		prevLen = k
		return math.Log(x)
	})
	logQOld += math.Log(ends[prevLen])
	return logQOld - logZ, logQNew, true
}

// bigramTermLinear is bigramTerm as a probability, raised to inv. Only a
// word already seated after its context needs a power of its own; any
// other's probability is the context's new-table weight times the
// unigram-level probability, whose powers are cached per context and per
// span.
func (g *BlockedSampler) bigramTermLinear(t, k, j, W int, inv float64) float64 {
	idx := t*W + k
	prev, ctxInv, ctxLive := End, g.startInv, true
	if j > 0 {
		p := (t-k)*W + j
		prev, ctxInv, ctxLive = g.ids[p], g.newInv[p], g.live[p]&liveContext != 0
	}
	if ctxLive && g.live[idx]&liveWord != 0 {
		if w := g.ids[idx]; w >= 0 {
			r := g.Model.bi
			ctx := contextOf(prev)
			if ds := r.seating(ctx, w, false); ds != nil && ds.customers > 0 {
				return powInv(r.predictive(ctx, w, g.uni[idx]), inv)
			}
		}
	}
	return ctxInv * g.uniInv[idx]
}

// newTableInv returns ((a + d T_ctx) / (C_ctx + a))^inv for the context of
// word prev, the bigram level's weight on its parent there: 1 for a
// context without customers, or a word never interned (-2). seated says
// whether the context has customers.
func (g *BlockedSampler) newTableInv(prev WordType, inv float64) (x float64, seated bool) {
	if prev == -2 {
		return 1, false
	}
	r := g.Model.bi
	c, tt := r.totals(contextOf(prev))
	if c == 0 {
		return 1, false
	}
	d, a := r.params.Discount, r.params.Concentration
	return powInv((a+d*tt)/(c+a), inv), true
}

// endTermLinear is endTerm as a probability, given P_uni(End).
func (g *BlockedSampler) endTermLinear(L, k, W int, endUni float64) float64 {
	if w := g.ids[L*W+k]; w != -2 {
		return g.Model.bi.predictive(contextOf(w), End, endUni)
	}
	return endUni
}

// pickProduct draws j in [1, len(a)) with probability a[j]*b[j]/total.
func pickProduct(a, b []float64, total float64, rng *rand.Rand) int {
	u := rng.Float64() * total
	last := 0
	for j := 1; j < len(a); j++ {
		x := a[j] * b[j]
		if x == 0 {
			continue
		}
		last = j
		if u -= x; u < 0 {
			return j
		}
	}
	return last // rounding
}
