package segment

import (
	"math"
	"math/rand/v2"
)

// BlockedSampler resamples one whole utterance at a time (Mochihashi,
// Yamada & Ueda 2009): the utterance's words are removed from the model,
// a segmentation is drawn by forward filtering and backward sampling under
// the predictive probabilities of the remaining corpus, and a
// Metropolis-Hastings test corrects for the proposal ignoring repeats
// within the utterance:
//
//	accept with min(1, [pi(new)/q(new)] / [pi(old)/q(old)])
//
// where pi is the product of sequential predictives of the utterance's
// words (as in WordsGibbs) and q the proposal probability.
//
// Words longer than MaxWordLength units are never proposed (unless locks
// force them); with MaxWordLength at least the longest utterance the
// sampler is exact for the model, otherwise for the model truncated to
// shorter words.
type BlockedSampler struct {
	Seg           *Segmentation
	Model         *Words
	MaxWordLength int
	// UnigramProposal makes the bigram model draw proposals from its
	// unigram level G0 alone: a lattice K times cheaper, at the cost of
	// more rejections; the Metropolis-Hastings test keeps it exact.
	UnigramProposal bool
	// Factor, when not nil, multiplies the target by Factor^Weight; the
	// proposal ignores it and the Metropolis-Hastings test corrects.
	Factor UtteranceFactor
	Weight float64

	journal journal
	marks   []int
	acceptance

	// Scratch space reused across utterances, so sweeps do not allocate
	// once it has grown to the longest utterance.
	words    []customer
	newWords []int32
	// Order 1: fwd[t] = log sum over segmentations of units [0,t) whose
	// last word ends at t. Order 2: fwd[t*(K+1)+k] for a last word of
	// length k ending at t.
	fwd  []float64
	term []float64  // log word terms: order 1 [t][k]; order 2 [t][k][j]
	uni  []float64  // order 2: log unigram predictive of span [t-k, t), [t][k]
	ids  []WordType // type of span [t-k, t) or -2 if not interned, [t][k]
	cum  []float64
	cum2 []float64
	// Probability-space lattices (blockedlinear.go): the unigram-level
	// new-table probability by word length and its power 1/T; per span,
	// the unigram-level probability to the power 1/T and the new-table
	// weight to the power 1/T of the context it makes; the latter for the
	// utterance start.
	p0, p0inv      []float64
	uniInv, newInv []float64
	// live[idx] says what a span can take part in at the bigram level:
	// liveWord if its word has unigram-level customers, liveContext if
	// the context it makes has bigram-level customers. A (context, word)
	// seat with customers needs both, so the lattice looks up no other.
	live     []uint8
	startInv float64
	invc     []float64 // bigram: 1/c_t, the scale factors by position
	dead     []bool    // unigram: positions where no word can end
	newB     []bool
}

// NewBlockedSampler seats s in m and returns a blocked sampler over both.
// m must be empty.
func NewBlockedSampler(s *Segmentation, m *Words, maxWordLength int, rng *rand.Rand) *BlockedSampler {
	if m.tokens != 0 {
		panic("segment: NewBlockedSampler needs an empty model")
	}
	m.AddSegmentation(s, rng)
	return &BlockedSampler{Seg: s, Model: m, MaxWordLength: maxWordLength}
}

// Sweep resamples every utterance once, in corpus order. At temperature
// T the proposal's word terms and the target are raised to the power 1/T.
func (g *BlockedSampler) Sweep(temperature float64, rng *rand.Rand) {
	c := g.Seg.Corpus
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		if end-start > 1 {
			g.resample(u, start, end, temperature, rng)
		}
	}
}

// logUtteranceEnds returns, for Order 1, the log probability of the
// utterance-end decisions of one utterance of n words given the others
// (whose tokens are the model's current ones): n-1 continues and one end
// under the Beta-Bernoulli predictive,
//
//	prod_{i<n-1} (C+i+h)/(N+i+rho) * (E+h)/(N+n-1+rho),  h = rho/2,
//
// with N tokens, E = U-1 ends and C = N-E continues among the others.
func (m *Words) logUtteranceEnds(n int) float64 {
	if m.Order != 1 {
		return 0
	}
	return logEndsGiven(n, m.tokens, m.utterances, m.Rho)
}

// logEndsGiven is the Beta-Bernoulli term above for an utterance of n
// tokens given the others' tokens of a corpus of the given size.
func logEndsGiven(n, tokens, utterances int, rho float64) float64 {
	if n == 0 {
		return 0
	}
	h := rho / 2
	N := float64(tokens)
	E := float64(utterances - 1)
	C := N - E
	k := float64(n - 1)
	return lgamma(C+k+h) - lgamma(C+h) + math.Log(E+h) - (lgamma(N+k+1+rho) - lgamma(N+rho))
}

// lookupSpan returns the type of span [a, b) if it is interned, else -2.
func (m *Words) lookupSpan(a, b int) WordType {
	if id, ok := m.Types.Lookup(m.Corpus, a, b); ok {
		return id
	}
	return -2
}

// logUnigramSpan returns the type of span [a, b) (-2 if not interned)
// and its log predictive probability at the unigram level, without
// interning it.
func (m *Words) logUnigramSpan(a, b int) (WordType, float64) {
	w := m.lookupSpan(a, b)
	if w >= 0 {
		return w, m.logUnigram(w)
	}
	lb := m.logShare(0) + m.Base.LogProb(m.Corpus, a, b)
	c, t := m.uni.totals(0)
	p := m.uni.params
	return w, math.Log(p.Concentration+p.Discount*t) + lb - math.Log(c+p.Concentration)
}

// resample proposes a new segmentation of the utterance [us, ue).
func (g *BlockedSampler) resample(u, us, ue int, temperature float64, rng *rand.Rand) {
	m := g.Model
	b := g.Seg.Boundary
	L := ue - us
	K := g.maxLen(us, ue)
	inv := 1 / temperature

	// Remove the current words, reading off their predictives.
	g.words = g.words[:0]
	prev := End
	w0 := us
	for i := us + 1; i <= ue; i++ {
		if i == ue || b[i] {
			w := m.Intern(w0, i)
			g.words = append(g.words, customer{prev, w})
			prev, w0 = w, i
		}
	}
	if m.Order == 2 {
		g.words = append(g.words, customer{prev, End})
	}
	g.journal.reset()
	tokensBefore := m.tokens
	logOld := 0.0
	for k := len(g.words) - 1; k >= 0; k-- {
		logOld += m.remove(g.words[k].prev, g.words[k].w, rng, &g.journal)
	}
	logOld += m.logUtteranceEnds(tokensBefore - m.tokens)

	// Forward filtering.
	var logQOld, logQNew float64
	newB := g.growScratch(L, K)
	if m.Order == 1 || g.UnigramProposal {
		ok := false
		if ub, uniform := m.Base.(UniformBase); uniform {
			logQOld, logQNew, ok = g.unigramProposalLinear(ub, us, ue, K, inv, newB, rng)
		}
		if !ok {
			logQOld, logQNew = g.unigramProposal(us, ue, K, inv, newB, rng)
		}
	} else {
		ok := false
		if ub, uniform := m.Base.(UniformBase); uniform {
			logQOld, logQNew, ok = g.bigramProposalLinear(ub, us, ue, K, inv, newB, rng)
		}
		if !ok {
			logQOld, logQNew = g.bigramProposal(us, ue, K, inv, newB, rng)
		}
	}

	// Seat the proposal, multiplying its predictives.
	g.marks = m.mark(g.marks)
	tokensMid := m.tokens
	logNew := 0.0
	prev = End
	w0 = us
	g.newWords = g.newWords[:0]
	for i := us + 1; i <= ue; i++ {
		if i == ue || newB[i-us] {
			w := m.Intern(w0, i)
			logNew += m.add(prev, w, rng, &g.journal)
			g.newWords = append(g.newWords, int32(w))
			prev, w0 = w, i
		}
	}
	if m.Order == 2 {
		logNew += m.add(prev, End, rng, &g.journal)
	}
	m.tokens, tokensMid = tokensMid, m.tokens // the end term sees the other utterances only
	logNew += m.logUtteranceEnds(tokensMid - m.tokens)
	m.tokens = tokensMid

	if g.Factor != nil {
		logNew += g.Weight * g.Factor.Delta(u, g.newWords)
	}
	g.steps++
	logRatio := (logNew*inv - logQNew) - (logOld*inv - logQOld)
	if logRatio >= 0 || math.Log(rng.Float64()) < logRatio {
		if g.Factor != nil {
			g.Factor.Set(u, g.newWords)
		}
		for i := us + 1; i < ue; i++ {
			b[i] = newB[i-us]
		}
		g.accepts++
		g.journal.releaseEmpty()
		return
	}
	g.journal.undo()
	m.tokens = tokensBefore
	m.forget(g.marks)
}

// maxLen returns the longest word the proposal allows in [us, ue): the
// sampler's limit, or longer where locks join more units.
func (g *BlockedSampler) maxLen(us, ue int) int {
	return longestProposed(g.Seg.Corpus, g.MaxWordLength, us, ue)
}

// longestProposed returns the longest word a blocked proposal may make in
// the utterance [us, ue) of c under the word-length limit (0: none): the
// limit, or longer where locks join more units.
func longestProposed(c *Corpus, limit, us, ue int) int {
	K := limit
	if K <= 0 || K > ue-us {
		K = ue - us
	}
	if c.Locks == nil {
		return K
	}
	run := 1
	for i := us + 1; i < ue; i++ {
		if c.Locks[i] == Joined {
			run++
			K = max(K, run)
		} else {
			run = 1
		}
	}
	return min(K, ue-us)
}

// spanOK reports whether a word may cover [a, b) of the utterance
// [us, ue) given locks: no Boundary lock strictly inside and no Joined lock
// at an edge inside the utterance.
func spanOK(c *Corpus, us, ue, a, b int) bool {
	if c.Locks == nil {
		return true
	}
	if a > us && c.Locks[a] == Joined {
		return false
	}
	if b < ue && c.Locks[b] == Joined {
		return false
	}
	for i := a + 1; i < b; i++ {
		if c.Locks[i] == Boundary {
			return false
		}
	}
	return true
}

// growScratch sizes the scratch buffers for an utterance of L units with
// words up to K units, and returns the proposal's boundary buffer (index i
// for the gap before unit us+i; index 0 unused).
func (g *BlockedSampler) growScratch(L, K int) []bool {
	n := (L + 1) * (K + 1)
	grow := func(s []float64, n int) []float64 {
		if cap(s) < n {
			return make([]float64, n, 2*n)
		}
		return s[:n]
	}
	g.fwd = grow(g.fwd, n)
	g.cum = grow(g.cum, K+1)
	g.cum2 = grow(g.cum2, K+1)
	if g.Model.Order == 1 || g.UnigramProposal {
		g.term = grow(g.term, n)
	}
	if g.Model.Order == 2 {
		g.term = grow(g.term, n*(K+1))
		g.uni = grow(g.uni, n)
		g.uniInv = grow(g.uniInv, n)
		g.newInv = grow(g.newInv, n)
		g.invc = grow(g.invc, L+1)
		if cap(g.live) < n {
			g.live = make([]uint8, n, 2*n)
		}
		g.live = g.live[:n]
	}
	if cap(g.ids) < n {
		g.ids = make([]WordType, n, 2*n)
	}
	g.ids = g.ids[:n]
	if cap(g.newB) < L+1 {
		g.newB = make([]bool, L+1, 2*(L+1))
	}
	g.newB = g.newB[:L+1]
	for i := range g.newB {
		g.newB[i] = false
	}
	return g.newB
}

// pick draws index k with probability proportional to exp(w[k]) over the
// entries that are finite, given their log-sum-exp total.
func pick(w []float64, total float64, rng *rand.Rand) int {
	u := rng.Float64()
	last := -1
	for k, v := range w {
		if math.IsInf(v, -1) {
			continue
		}
		u -= math.Exp(v - total)
		last = k
		if u < 0 {
			return k
		}
	}
	return last // rounding
}

// unigramProposal fills newB with a segmentation of [us, ue) drawn by
// forward filtering, backward sampling, and returns the log proposal
// probabilities of the old (current Seg) and new segmentations.
func (g *BlockedSampler) unigramProposal(us, ue, K int, inv float64, newB []bool, rng *rand.Rand) (logQOld, logQNew float64) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	// Per-word Beta-Bernoulli factor for "the utterance goes on", from the
	// other utterances; the final word's end factor is the same for every
	// segmentation and cancels.
	h := m.Rho / 2
	N := float64(m.tokens)
	logCont := math.Log(N-float64(m.utterances-1)+h) - math.Log(N+m.Rho)
	W := K + 1
	g.fwd[0] = 0
	for t := 1; t <= L; t++ {
		acc := math.Inf(-1)
		for k := 1; k <= W-1; k++ {
			v := math.Inf(-1)
			if k <= t && spanOK(c, us, ue, us+t-k, us+t) {
				_, lu := m.logUnigramSpan(us+t-k, us+t)
				v = inv * (lu + logCont)
				acc = logAddExp(acc, g.fwd[t-k]+v)
			}
			g.term[t*W+k] = v
		}
		g.fwd[t] = acc
	}
	logZ := g.fwd[L]
	// Backward sampling.
	for t := L; t > 0; {
		w := g.cum[:W]
		w[0] = math.Inf(-1)
		for k := 1; k < W; k++ {
			w[k] = math.Inf(-1)
			if k <= t {
				w[k] = g.fwd[t-k] + g.term[t*W+k]
			}
		}
		k := pick(w, g.fwd[t], rng)
		logQNew += g.term[t*W+k]
		t -= k
		if t > 0 {
			newB[t] = true
		}
	}
	logQNew -= logZ
	// The old segmentation's proposal probability.
	logQOld = g.oldLogQ(us, ue, K, func(t, k int) float64 {
		if !spanOK(c, us, ue, us+t-k, us+t) {
			return math.Inf(-1)
		}
		return g.term[t*W+k]
	})
	return logQOld - logZ, logQNew
}

// oldLogQ returns the sum of wordLogQ(t, k) over the words of the current
// segmentation of [us, ue), each ending t units into the utterance and k
// units long, or -Inf if one is longer than K.
func (g *BlockedSampler) oldLogQ(us, ue, K int, wordLogQ func(t, k int) float64) float64 {
	b := g.Seg.Boundary
	sum := 0.0
	w0 := us
	for i := us + 1; i <= ue; i++ {
		if i == ue || b[i] {
			k := i - w0
			if k > K {
				return math.Inf(-1)
			}
			sum += wordLogQ(i-us, k)
			w0 = i
		}
	}
	return sum
}

// bigramTerm returns log P(span [t-k, t) | previous word of length j) for
// the utterance starting at us, from the cached types and unigram terms
// (j = 0: the utterance start).
func (g *BlockedSampler) bigramTerm(t, k, j, W int) float64 {
	m := g.Model
	w := g.ids[t*W+k]
	lu := g.uni[t*W+k]
	prev := End
	if j > 0 {
		prev = g.ids[(t-k)*W+j]
	}
	p := m.bi.params
	if prev == -2 {
		return lu // an unseen context has no customers: P = P_uni
	}
	ctx := contextOf(prev)
	c, tt := m.bi.totals(ctx)
	if w == -2 {
		return math.Log(p.Concentration+p.Discount*tt) + lu - math.Log(c+p.Concentration)
	}
	return m.bi.logPredictive(ctx, w, lu)
}

// bigramProposal is unigramProposal for the bigram model: the forward
// variables are indexed by the length of the last word.
func (g *BlockedSampler) bigramProposal(us, ue, K int, inv float64, newB []bool, rng *rand.Rand) (logQOld, logQNew float64) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	W := K + 1
	for t := 1; t <= L; t++ {
		for k := 1; k < W; k++ {
			g.ids[t*W+k], g.uni[t*W+k] = -2, math.Inf(-1)
			if k <= t && spanOK(c, us, ue, us+t-k, us+t) {
				g.ids[t*W+k], g.uni[t*W+k] = m.logUnigramSpan(us+t-k, us+t)
			}
		}
	}
	negInf := math.Inf(-1)
	for t := 1; t <= L; t++ {
		for k := 1; k < W; k++ {
			idx := t*W + k
			g.fwd[idx] = negInf
			if k > t || math.IsInf(g.uni[idx], -1) {
				for j := 0; j < W; j++ {
					g.term[idx*W+j] = negInf
				}
				continue
			}
			acc := negInf
			for j := 0; j < W; j++ {
				v := negInf
				switch {
				case j == 0 && k == t:
					v = inv * g.bigramTerm(t, k, 0, W)
					acc = logAddExp(acc, v)
				case j > 0 && j <= t-k && !math.IsInf(g.fwd[(t-k)*W+j], -1):
					v = inv * g.bigramTerm(t, k, j, W)
					acc = logAddExp(acc, g.fwd[(t-k)*W+j]+v)
				}
				g.term[idx*W+j] = v
			}
			g.fwd[idx] = acc
		}
	}
	// The End word after the last word of length k.
	ends := g.cum[:W]
	ends[0] = negInf
	logZ := negInf
	for k := 1; k < W; k++ {
		ends[k] = negInf
		if !math.IsInf(g.fwd[L*W+k], -1) {
			ends[k] = inv * g.endTerm(L, k, W)
			logZ = logAddExp(logZ, g.fwd[L*W+k]+ends[k])
		}
	}
	// Backward sampling.
	w := g.cum2[:W]
	for k := 0; k < W; k++ {
		w[k] = negInf
		if !math.IsInf(ends[k], -1) {
			w[k] = g.fwd[L*W+k] + ends[k]
		}
	}
	k := pick(w, logZ, rng)
	logQNew = ends[k]
	for t := L; ; {
		if k == t {
			logQNew += g.term[(t*W+k)*W]
			break
		}
		idx := t*W + k
		for j := 0; j < W; j++ {
			w[j] = negInf
			if j > 0 && j <= t-k && !math.IsInf(g.term[idx*W+j], -1) {
				w[j] = g.fwd[(t-k)*W+j] + g.term[idx*W+j]
			}
		}
		j := pick(w, g.fwd[idx], rng)
		logQNew += g.term[idx*W+j]
		t -= k
		newB[t] = true
		k = j
	}
	logQNew -= logZ
	// The old segmentation: walk its words.
	b := g.Seg.Boundary
	prevLen := 0
	w0 := us
	for i := us + 1; i <= ue; i++ {
		if i == ue || b[i] {
			k := i - w0
			t := i - us
			if k > K || math.IsInf(g.uni[t*W+k], -1) {
				return negInf, logQNew
			}
			logQOld += g.term[(t*W+k)*W+prevLen]
			prevLen, w0 = k, i
		}
	}
	logQOld += ends[prevLen]
	return logQOld - logZ, logQNew
}

// endTerm returns log P(End | last word [L-k, L)).
func (g *BlockedSampler) endTerm(L, k, W int) float64 {
	m := g.Model
	w := g.ids[L*W+k]
	lu := m.logUnigram(End)
	if w == -2 {
		return lu
	}
	return m.bi.logPredictive(contextOf(w), End, lu)
}
