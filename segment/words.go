package segment

import (
	"fmt"
	"math"
	"math/rand/v2"
)

// End is the boundary word of the bigram model: it starts every utterance
// as a context and ends it as a word.
const End WordType = -1

// Words is the family of hierarchical word models: a unigram (Order 1) or
// bigram (Order 2) Pitman-Yor process over words whose base is P0. With
// zero discounts, Order 1 is the Dirichlet-process unigram model and Order 2
// the hierarchical Dirichlet-process bigram model of Goldwater, Griffiths &
// Johnson (2009): each word's successor distribution is DP(alpha1, G0) with
// G0 ~ DP(alpha0, P0) shared. Nonzero discounts give the Pitman-Yor variants
// (Teh 2006). Seating is tracked exactly as a Chinese restaurant franchise.
//
// Utterance ends: in Order 1 each word ends its utterance with a
// probability that has a Beta(Rho/2, Rho/2) prior, integrated out; in Order
// 2 the boundary word End is a dish like any other, with base probability
// EndBase, and the other words share the rest: (1-EndBase) P0(w).
//
// Base may be adaptive (an *NgramBase): its own customers are the units of
// the dishes of the unigram-level tables, seated when a table opens and
// removed when it closes, so P0 is read from the base's current state.
type Words struct {
	Order   int
	Unigram PitmanYor // alpha0 and d0 of G0
	Bigram  PitmanYor // alpha1 and d1 of each successor distribution
	Base    Base
	Rho     float64 // Order 1
	EndBase float64 // Order 2

	Corpus *Corpus
	Types  *Types

	uni, bi    *restaurants
	tokens     int // word tokens, End excluded
	utterances int

	// baseStamp[w] is 1 + the adaptive base's version when
	// Types.LogBase[w] was computed; 0 means never.
	baseStamp []uint64
}

// NewWords returns an empty model of the given order over c's words.
func NewWords(c *Corpus, order int, uni, bi PitmanYor, base Base) *Words {
	if order != 1 && order != 2 {
		panic("segment: Words order must be 1 or 2")
	}
	m := &Words{Order: order, Unigram: uni, Bigram: bi, Base: base, Rho: 2, EndBase: 0.5,
		Corpus: c, Types: NewTypes(), utterances: c.Len()}
	m.uni = newRestaurants(&m.Unigram)
	m.bi = newRestaurants(&m.Bigram)
	return m
}

// Intern returns the type of span [start, end), computing its base
// probability the first time it is seen (with an adaptive base, when it is
// first needed).
func (m *Words) Intern(start, end int) WordType {
	id, isNew := m.Types.Intern(m.Corpus, start, end)
	if isNew && m.ngram() == nil {
		m.Types.LogBase[id] = m.Base.LogProb(m.Corpus, start, end)
	}
	return id
}

// mark records how many types and seats there are, so that a rejected
// proposal can be rolled back with forget; marks is reused.
func (m *Words) mark(marks []int) []int {
	marks = append(marks[:0], m.Types.Len(), m.uni.markSeats(), m.bi.markSeats())
	if nb := m.ngram(); nb != nil {
		for _, r := range nb.levels {
			marks = append(marks, r.markSeats())
		}
	}
	return marks
}

// forget drops the types and seats created since marks were taken, after
// a rejected proposal has been undone (every such seat is empty by then).
// Proposed words that were never accepted thus leave no trace, which
// keeps the tables small and the sweeps free of allocation. The
// base-probability cache entries of dropped type IDs are reset, as the IDs
// will be given out again.
func (m *Words) forget(marks []int) {
	m.Types.Truncate(marks[0])
	for i := marks[0]; i < len(m.baseStamp); i++ {
		m.baseStamp[i] = 0
	}
	m.uni.dropSeats(marks[1])
	m.bi.dropSeats(marks[2])
	if nb := m.ngram(); nb != nil {
		for k, r := range nb.levels {
			r.dropSeats(marks[3+k])
		}
	}
}

// ngram returns the base if it is an adaptive unit model, else nil.
func (m *Words) ngram() *NgramBase {
	nb, _ := m.Base.(*NgramBase)
	return nb
}

// span returns a corpus span holding word w.
func (m *Words) span(w WordType) (start, end int) {
	s := int(m.Types.First[w])
	return s, s + int(m.Types.Length[w])
}

// wordLength returns the length in units of word type w, for a
// FactorBuilder.
func (m *Words) wordLength(w int32) int { return int(m.Types.Length[w]) }

// logP0 returns log P0(w) for a word other than End. With an adaptive base
// it is the base's current predictive probability, cached in
// Types.LogBase until the base changes.
func (m *Words) logP0(w WordType) float64 {
	nb := m.ngram()
	if nb == nil {
		return m.Types.LogBase[w]
	}
	for len(m.baseStamp) < m.Types.Len() {
		m.baseStamp = append(m.baseStamp, 0)
	}
	if v := nb.version() + 1; m.baseStamp[w] != v {
		s, e := m.span(w)
		m.Types.LogBase[w] = nb.LogProb(m.Corpus, s, e)
		m.baseStamp[w] = v
	}
	return m.Types.LogBase[w]
}

// logShare returns the log of the share of the unigram level's base that
// goes to w's kind of word: 1 in Order 1; EndBase for End and 1-EndBase
// for the others in Order 2.
func (m *Words) logShare(w WordType) float64 {
	switch {
	case m.Order == 1:
		return 0
	case w == End:
		return math.Log(m.EndBase)
	}
	return math.Log1p(-m.EndBase)
}

// logBase returns log P0 of w as the unigram level sees it.
func (m *Words) logBase(w WordType) float64 {
	if w == End {
		return m.logShare(w)
	}
	return m.logShare(w) + m.logP0(w)
}

func contextOf(prev WordType) int32 { return int32(prev) + 1 } // End -> 0

// logUnigram returns log G0(w) predictive.
func (m *Words) logUnigram(w WordType) float64 {
	return m.uni.logPredictive(0, w, m.logBase(w))
}

// LogPredictive returns the log predictive probability of word w after
// prev (prev is ignored by Order 1).
func (m *Words) LogPredictive(prev, w WordType) float64 {
	if m.Order == 1 {
		return m.logUnigram(w)
	}
	return m.bi.logPredictive(contextOf(prev), w, m.logUnigram(w))
}

// add seats one token of w after prev and returns its log predictive
// probability just before it was added, times the adaptive base's
// correction if a unigram-level table opened (see addBase). Probabilities
// are multiplied in linear space and logged once: a base probability that
// underflows (a word of a few hundred units) gives -Inf, which a sampler
// treats as impossible.
func (m *Words) add(prev, w WordType, rng *rand.Rand, j *journal) float64 {
	if w != End {
		m.tokens++
	}
	pb := math.Exp(m.logBase(w))
	if m.Order == 1 {
		p, opened := m.uni.addCustomer(0, w, pb, rng, j)
		lp := math.Log(p)
		if opened {
			lp += m.addBase(w, rng, j)
		}
		return lp
	}
	ctx := contextOf(prev)
	p, opened := m.bi.addCustomer(ctx, w, m.uni.predictive(0, w, pb), rng, j)
	lp := math.Log(p)
	if opened {
		if _, opened0 := m.uni.addCustomer(0, w, pb, rng, j); opened0 {
			lp += m.addBase(w, rng, j)
		}
	}
	return lp
}

// remove takes away one token of w after prev and returns its log
// predictive probability just after it was removed, times the adaptive
// base's correction if a unigram-level table closed (see removeBase): the
// value add would return for the same token and seating.
func (m *Words) remove(prev, w WordType, rng *rand.Rand, j *journal) float64 {
	if w != End {
		m.tokens--
	}
	if m.Order == 1 {
		ds, closed := m.uni.removeCustomer(0, w, rng, j)
		corr := 0.0
		if closed {
			corr = m.removeBase(w, rng, j)
		}
		return math.Log(m.uni.predictiveAt(0, ds, math.Exp(m.logBase(w)))) + corr
	}
	ctx := contextOf(prev)
	ds, closed := m.bi.removeCustomer(ctx, w, rng, j)
	corr := 0.0
	if closed {
		if _, closed0 := m.uni.removeCustomer(0, w, rng, j); closed0 {
			corr = m.removeBase(w, rng, j)
		}
	}
	pu := m.uni.predictive(0, w, math.Exp(m.logBase(w)))
	return math.Log(m.bi.predictiveAt(ctx, ds, pu)) + corr
}

// addBase tells an adaptive base that a unigram-level table of w has
// opened: w's units become its customers, seated through j. The uniform
// base needs no counts.
//
// It returns log(P0seq(w) / P0(w)). The predictive probabilities above used
// P0(w), every unit's probability read from the state before w; but the
// probability of generating w along the seating path taken is P0seq(w), the
// product of each unit's probability just before it was seated, which
// differs when w's own units share restaurants. Seating the word level with
// P0 is then a proposal whose weight, joint over proposal probability, is
// the word-level predictive times P0seq/P0; with these factors the
// sampler's product of sequential terms stays the exact
// Metropolis-Hastings ratio for the joint of segmentation and all seatings,
// the unit customers counting as customers like the words.
func (m *Words) addBase(w WordType, rng *rand.Rand, j *journal) float64 {
	nb := m.ngram()
	if nb == nil || w == End {
		return 0
	}
	before := m.logP0(w)
	s, e := m.span(w)
	return nb.addWord(m.Corpus, s, e, rng, j) - before
}

// removeBase tells an adaptive base that a unigram-level table of w has
// closed: w's units leave, in reverse order. It returns log(P0seq(w) /
// P0(w)) read in reverse: the probabilities of the units as they leave,
// over P0(w) once they have left.
func (m *Words) removeBase(w WordType, rng *rand.Rand, j *journal) float64 {
	nb := m.ngram()
	if nb == nil || w == End {
		return 0
	}
	s, e := m.span(w)
	seq := nb.removeWord(m.Corpus, s, e, rng, j)
	return seq - m.logP0(w)
}

// logEnds returns the log Beta-Bernoulli probability of the Order 1
// utterance-end decisions for n tokens in U utterances.
func (m *Words) logEnds(n int) float64 {
	if m.Order != 1 {
		return 0
	}
	h := m.Rho / 2
	U := float64(m.utterances)
	return lbeta(U+h, float64(n)-U+h) - lbeta(h, h)
}

// AddSegmentation seats every word of s, in corpus order, and returns
// the sum of their log predictive probabilities as they were seated (see
// add). m must hold no other words of the same utterances.
func (m *Words) AddSegmentation(s *Segmentation, rng *rand.Rand) float64 {
	lp := 0.0
	for u := 0; u < m.Corpus.Len(); u++ {
		prev := End
		s.Words(u, func(a, b int) {
			w := m.Intern(a, b)
			lp += m.add(prev, w, rng, nil)
			prev = w
		})
		if m.Order == 2 {
			lp += m.add(prev, End, rng, nil)
		}
	}
	return lp
}

// RemoveSegmentation takes away every word of s, in reverse corpus order;
// s must be a segmentation that was added.
func (m *Words) RemoveSegmentation(s *Segmentation, rng *rand.Rand) {
	var ws []WordType
	for u := m.Corpus.Len() - 1; u >= 0; u-- {
		ws = append(ws[:0], End)
		s.Words(u, func(a, b int) { ws = append(ws, m.Intern(a, b)) })
		if m.Order == 2 {
			m.remove(ws[len(ws)-1], End, rng, nil)
		}
		for k := len(ws) - 1; k > 0; k-- {
			m.remove(ws[k-1], ws[k], rng, nil)
		}
	}
}

// LogJoint returns the log probability of the segmentation together with
// the current seating arrangement: each level's seating probability plus
// the base probability of every unigram-level table, plus the utterance-end
// term. With an adaptive base, a table contributes only its share of the
// base (logShare) and the base's own seating and dishes are added instead
// of P0. It is what the sampler's traces show; see ExactLogJoint for the
// probability of the segmentation alone.
func (m *Words) LogJoint() float64 {
	lp := m.uni.logSeatingProb(m.Unigram.Discount, m.Unigram.Concentration)
	if m.Order == 2 {
		lp += m.bi.logSeatingProb(m.Bigram.Discount, m.Bigram.Concentration)
	}
	nb := m.ngram()
	for i, w := range m.uni.dishes { // slice order: reproducible sums
		if t := m.uni.seats[i].tables; t > 0 {
			if nb != nil {
				lp += float64(t) * m.logShare(w)
			} else {
				lp += float64(t) * m.logBase(w)
			}
		}
	}
	if nb != nil {
		lp += nb.logJoint()
	}
	return lp + m.logEnds(m.tokens)
}

// Check verifies the seating's invariants: each level's histograms agree
// with its totals, the unigram level's customers of each word are its
// tables at the bigram level (Order 2), the token count matches, and an
// adaptive base is consistent and seats exactly the units of the
// unigram-level tables' words. Tests call it after mutations.
func (m *Words) Check() error {
	if err := m.uni.check(); err != nil {
		return fmt.Errorf("unigram level: %w", err)
	}
	words := m.uni
	if m.Order == 2 {
		if err := m.bi.check(); err != nil {
			return fmt.Errorf("bigram level: %w", err)
		}
		want := map[uint64]int32{}
		m.bi.forEach(func(_ int32, w WordType, ds *dishSeating) { want[seatKey(0, w)] += ds.tables })
		if err := m.uni.checkCustomers(want); err != nil {
			return fmt.Errorf("unigram level against the bigram tables: %w", err)
		}
		words = m.bi
	}
	tokens := 0
	words.forEach(func(_ int32, w WordType, ds *dishSeating) {
		if w != End {
			tokens += int(ds.customers)
		}
	})
	if tokens != m.tokens {
		return fmt.Errorf("%d word customers, token count %d", tokens, m.tokens)
	}
	nb := m.ngram()
	if nb == nil {
		return nil
	}
	if err := nb.Check(); err != nil {
		return err
	}
	return nb.checkWords(m.Corpus, func(f func(start, end int, tables int32)) {
		m.uni.forEach(func(_ int32, w WordType, ds *dishSeating) {
			if w != End && ds.tables > 0 {
				s, e := m.span(w)
				f(s, e, ds.tables)
			}
		})
	})
}
