package segment

import (
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
// probability the first time it is seen.
func (m *Words) Intern(start, end int) WordType {
	id, isNew := m.Types.Intern(m.Corpus, start, end)
	if isNew {
		m.Types.LogBase[id] = m.Base.LogProb(m.Corpus, start, end)
	}
	return id
}

// logBase returns log P0 of w as the unigram level sees it.
func (m *Words) logBase(w WordType) float64 {
	if m.Order == 1 {
		return m.Types.LogBase[w]
	}
	if w == End {
		return math.Log(m.EndBase)
	}
	return math.Log1p(-m.EndBase) + m.Types.LogBase[w]
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
// probability just before it was added.
func (m *Words) add(prev, w WordType, rng *rand.Rand, j *journal) float64 {
	if w != End {
		m.tokens++
	}
	lu := m.logUnigram(w)
	if m.Order == 1 {
		if m.uni.add(0, w, m.logBase(w), rng, j) {
			m.addBase(w)
		}
		return lu
	}
	ctx := contextOf(prev)
	lp := m.bi.logPredictive(ctx, w, lu)
	if m.bi.add(ctx, w, lu, rng, j) && m.uni.add(0, w, m.logBase(w), rng, j) {
		m.addBase(w)
	}
	return lp
}

// remove takes away one token of w after prev and returns its log
// predictive probability just after it was removed.
func (m *Words) remove(prev, w WordType, rng *rand.Rand, j *journal) float64 {
	if w != End {
		m.tokens--
	}
	if m.Order == 1 {
		if m.uni.remove(0, w, rng, j) {
			m.removeBase(w)
		}
		return m.logUnigram(w)
	}
	ctx := contextOf(prev)
	if m.bi.remove(ctx, w, rng, j) && m.uni.remove(0, w, rng, j) {
		m.removeBase(w)
	}
	return m.LogPredictive(prev, w)
}

// addBase and removeBase tell an adaptive base about tables opened and
// closed at the unigram level. The uniform base needs no counts.
func (m *Words) addBase(w WordType)    {}
func (m *Words) removeBase(w WordType) {}

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

// AddSegmentation seats every word of s, in corpus order.
func (m *Words) AddSegmentation(s *Segmentation, rng *rand.Rand) {
	for u := 0; u < m.Corpus.Len(); u++ {
		prev := End
		s.Words(u, func(a, b int) {
			w := m.Intern(a, b)
			m.add(prev, w, rng, nil)
			prev = w
		})
		if m.Order == 2 {
			m.add(prev, End, rng, nil)
		}
	}
}

// LogJoint returns the log probability of the segmentation together with
// the current seating arrangement: each level's seating probability plus
// the base probability of every unigram-level table, plus the utterance-end
// term. It is what the sampler's traces show; see ExactLogJoint for the
// probability of the segmentation alone.
func (m *Words) LogJoint() float64 {
	lp := m.uni.logSeatingProb(m.Unigram.Discount, m.Unigram.Concentration)
	if m.Order == 2 {
		lp += m.bi.logSeatingProb(m.Bigram.Discount, m.Bigram.Concentration)
	}
	for i, w := range m.uni.dishes { // slice order: reproducible sums
		lp += float64(m.uni.seats[i].tables) * m.logBase(w)
	}
	return lp + m.logEnds(m.tokens)
}
