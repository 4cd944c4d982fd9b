package segment

import (
	"math"
	"sort"
)

// Phonotactics is a model of word shapes for the base distribution: a word
// is read as its syllable skeleton
//
//	C_0 N_1 C_1 N_2 ... N_k C_k
//
// where each N_i is one nucleus unit (see Nuclei) and C_0 .. C_k are the
// runs of other units before, between and after them, any of them
// possibly empty. The reading is unique, so with k geometric,
//
//	P0(w) = p# (1-p#)^(k-1) P_I(C_0) P_F(C_k) prod_i P_N(N_i) prod_{0<i<k} P_M(C_i)
//
// is a proper distribution over the words holding a nucleus. Which runs of
// consonants may begin and end words is what segmentation most needs from
// phonotactics, and utterance edges are word edges whatever the
// segmentation (the utterance-edge cue of Brent & Cartwright 1996, Cognition
// 61; cited from memory): P_I is
// estimated from the runs that begin utterances, P_F from those that end
// them, P_N from every nucleus and P_M from the runs between two nuclei
// inside utterances. Each is a Dirichlet-smoothed relative frequency, the
// predictive distribution of a Dirichlet process given those counts,
//
//	P(r) = (n(r) + beta G(r)) / (n + beta),
//
// with G a geometric length (ratio 1/2) and uniform units: a run never seen
// at an utterance edge keeps a small probability there. beta is given
// (DefaultPhonotacticsBeta) or fitted to each distribution's counts by
// maximum marginal likelihood.
//
// A Phonotactics is fixed once built, so chains may share it. It holds
// the syllable count and shape probability (every factor of P0 but the
// geometric one) of every span of the corpus's span index
// (Corpus.IndexSpans), so the lattices look a span up in two array reads.
type Phonotactics struct {
	nuclei                          *Nuclei
	initial, final, medial, nucleus runModel

	// By span-index entry (see spanForms): the log shape probability, its
	// exponential, and the syllable count (0: no nucleus).
	forms    *spanForms
	logShape []float64
	shape    []float64
	count    []uint8
}

// DefaultPhonotacticsBeta is the smoothing concentration of every run
// distribution unless set otherwise: a prior constant, chosen on the
// English development corpus among 1, 20, 200 and the maximum-likelihood
// fit (which puts the medial runs' beta near 600), and confirmed on the
// five UDHR languages, which took no part in the choice (see README.md).
// The fit trusts the utterance edges less than segmentation needs: the
// word types a segmentation finds favour concentrations in the hundreds
// too, yet token F is higher at 20.
const DefaultPhonotacticsBeta = 20

// runModel is one Dirichlet-smoothed distribution over runs of units,
// keyed by the runs' corpus keys (2 bytes a unit).
type runModel struct {
	beta     float64 // concentration on G
	counts   map[string]float64
	total    float64
	alphabet int  // units a run may hold
	single   bool // runs of this kind are one unit long
	// logp caches logProb of every counted run once beta is set (see
	// freeze): filling the span table asks for the same few thousand runs
	// millions of times.
	logp map[string]float64
}

// freeze fills r.logp; r is read-only afterwards, so chains may share it.
func (r *runModel) freeze() {
	r.logp = make(map[string]float64, len(r.counts))
	for k, n := range r.counts {
		r.logp[k] = r.rawLogProb(n, len(k)/2)
	}
}

// NewPhonotactics estimates the run distributions of c under nuclei n,
// each smoothed with concentration beta, or with its own beta fitted by
// maximum marginal likelihood if beta <= 0, and fills the span table for
// c's span index (building the index for spans of up to maxSpan units if c
// has none).
func NewPhonotactics(c *Corpus, n *Nuclei, beta float64, maxSpan int) *Phonotactics {
	others := max(n.Others, 1)
	p := &Phonotactics{nuclei: n,
		initial: runModel{counts: map[string]float64{}, alphabet: others},
		final:   runModel{counts: map[string]float64{}, alphabet: others},
		medial:  runModel{counts: map[string]float64{}, alphabet: others},
		nucleus: runModel{counts: map[string]float64{}, alphabet: max(len(c.Inventory)-n.Others, 1), single: true},
	}
	for u := 0; u < c.Len(); u++ {
		s, e := c.Utterance(u)
		p.skeleton(c, s, e, func(r *runModel, x, y int) { r.add(c.Key(x, y)) })
	}
	for _, r := range p.models() {
		r.beta = beta
		if beta <= 0 {
			r.fitBeta()
		}
		r.freeze()
	}
	c.IndexSpans(maxSpan)
	f := c.forms.Load()
	p.forms = f
	p.logShape = make([]float64, len(f.ids))
	p.shape = make([]float64, len(f.ids))
	p.count = make([]uint8, len(f.ids))
	for u := 0; u < c.Len(); u++ {
		s, e := c.Utterance(u)
		for a := s; a < e; a++ {
			o := int(f.off[a])
			for k := 1; k <= int(f.off[a+1])-o; k++ {
				syl, lp := p.parse(c, a, a+k)
				p.logShape[o+k-1] = lp
				p.shape[o+k-1] = math.Exp(lp)
				p.count[o+k-1] = uint8(min(syl, math.MaxUint8))
			}
		}
	}
	return p
}

func (p *Phonotactics) models() []*runModel {
	return []*runModel{&p.initial, &p.final, &p.medial, &p.nucleus}
}

// skeleton reads span [a, b) as C_0 N_1 C_1 ... N_k C_k, calls visit with
// each part's distribution and span in order, and returns k; it calls
// nothing if k = 0.
func (p *Phonotactics) skeleton(c *Corpus, a, b int, visit func(r *runModel, x, y int)) int {
	is := p.nuclei.is
	next := func(x int) int {
		for x < b && !is[c.Units[x]] {
			x++
		}
		return x
	}
	n := next(a)
	if n == b {
		return 0
	}
	visit(&p.initial, a, n)
	k := 0
	for {
		k++
		visit(&p.nucleus, n, n+1)
		m := next(n + 1)
		if m == b {
			visit(&p.final, n+1, b)
			return k
		}
		visit(&p.medial, n+1, m)
		n = m
	}
}

// parse returns the syllable count k of span [a, b) and the log of its
// shape probability; k = 0 (and -Inf) means the span holds no nucleus.
func (p *Phonotactics) parse(c *Corpus, a, b int) (k int, logp float64) {
	k = p.skeleton(c, a, b, func(r *runModel, x, y int) { logp += r.logProb(c.Key(x, y)) })
	if k == 0 {
		return 0, math.Inf(-1)
	}
	return k, logp
}

// Span returns the syllable count and log shape probability of [a, b)
// (0 and -Inf without a nucleus).
func (p *Phonotactics) Span(c *Corpus, a, b int) (k int, logp float64) {
	if o := p.forms.entry(a, b); o >= 0 {
		if p.count[o] == 0 {
			return 0, math.Inf(-1)
		}
		return int(p.count[o]), p.logShape[o]
	}
	return p.parse(c, a, b)
}

// spanProb is Span with the shape probability itself (0 without a
// nucleus).
func (p *Phonotactics) spanProb(c *Corpus, a, b int) (k int, shape float64) {
	if o := p.forms.entry(a, b); o >= 0 {
		return int(p.count[o]), p.shape[o]
	}
	k, lp := p.parse(c, a, b)
	return k, math.Exp(lp)
}

func (r *runModel) add(key []byte) {
	r.counts[string(key)]++
	r.total++
}

// logProb returns log P(run) for the run with the given key.
func (r *runModel) logProb(key []byte) float64 {
	if lp, ok := r.logp[string(key)]; ok {
		return lp
	}
	return r.rawLogProb(r.counts[string(key)], len(key)/2)
}

// rawLogProb returns log P(run) for a run of the given units counted n
// times.
func (r *runModel) rawLogProb(n float64, units int) float64 {
	return math.Log(n+r.beta*math.Exp(r.logG(units))) - math.Log(r.total+r.beta)
}

// logG returns log G(run) for a run of units units: a geometric length with
// ratio 1/2 (or always one unit) and units uniform over the alphabet.
func (r *runModel) logG(units int) float64 {
	lg := -float64(units) * math.Log(float64(r.alphabet))
	if !r.single {
		lg += float64(units+1) * math.Log(0.5)
	}
	return lg
}

// logEvidence returns the log marginal likelihood of the counts under a
// Dirichlet process with concentration beta and base G (the
// Dirichlet-multinomial of the runs seen; the order of the observations is
// fixed, so no multinomial coefficient):
//
//	log Gamma(beta) - log Gamma(n + beta) + sum_r [log Gamma(n_r + beta G(r)) - log Gamma(beta G(r))].
func (r *runModel) logEvidence(beta float64, keys []string) float64 {
	lg := func(x float64) float64 { v, _ := math.Lgamma(x); return v }
	e := lg(beta) - lg(r.total+beta)
	for _, k := range keys {
		bg := beta * math.Exp(r.logG(len(k)/2))
		e += lg(r.counts[k]+bg) - lg(bg)
	}
	return e
}

// fitBeta sets r.beta to the concentration in [1e-3, 1e6] that maximises
// the evidence of r's counts (type II maximum likelihood): a grid in log
// beta, then golden-section search around the best point.
func (r *runModel) fitBeta() {
	keys := make([]string, 0, len(r.counts))
	for k := range r.counts {
		keys = append(keys, k)
	}
	sort.Strings(keys) // a fixed summation order: the same bits every run
	f := func(lb float64) float64 { return r.logEvidence(math.Exp(lb), keys) }
	lo, hi := math.Log(1e-3), math.Log(1e6)
	best, bestF := lo, f(lo)
	const step = 0.5
	for x := lo + step; x <= hi; x += step {
		if v := f(x); v > bestF {
			best, bestF = x, v
		}
	}
	a, b := math.Max(lo, best-step), math.Min(hi, best+step)
	const phi = 0.6180339887498949
	for range 40 {
		x1, x2 := b-phi*(b-a), a+phi*(b-a)
		if f(x1) >= f(x2) {
			b = x2
		} else {
			a = x1
		}
	}
	r.beta = math.Exp((a + b) / 2)
}
