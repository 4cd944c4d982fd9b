package segment

import "math"

// Unigram is the Dirichlet-process unigram word model of Goldwater,
// Griffiths & Johnson (2009), with the word distribution G ~ DP(Alpha, P0)
// integrated out. Each word is followed by the end of its utterance with a
// probability that has a Beta(Rho/2, Rho/2) prior, also integrated out.
//
// The predictive probability of the next word w given n earlier tokens of
// which n_w are w is (n_w + Alpha*P0(w)) / (n + Alpha) (Blackwell &
// MacQueen 1973); the joint probability of all tokens is the product of
// these predictives in any order.
type Unigram struct {
	// Alpha is the concentration alpha0 of the Dirichlet process.
	Alpha float64
	// Rho is the total pseudo-count of the Beta prior on utterance ends.
	Rho float64
	// Base is P0.
	Base Base

	Corpus *Corpus
	Types  *Types

	count      []int32 // count[t]: tokens of type t
	tokens     int     // all tokens
	utterances int     // utterances with at least one unit
}

// NewUnigram returns an empty model over c's words.
func NewUnigram(c *Corpus, alpha, rho float64, base Base) *Unigram {
	return &Unigram{Alpha: alpha, Rho: rho, Base: base, Corpus: c, Types: NewTypes(), utterances: c.Len()}
}

// Intern returns the type of span [start, end), computing its base
// probability the first time it is seen.
func (m *Unigram) Intern(start, end int) WordType {
	id, isNew := m.Types.Intern(m.Corpus, start, end)
	if isNew {
		m.Types.LogBase[id] = m.Base.LogProb(m.Corpus, start, end)
		m.count = append(m.count, 0)
	}
	return id
}

// Add counts one token of type t.
func (m *Unigram) Add(t WordType) { m.count[t]++; m.tokens++ }

// Remove uncounts one token of type t.
func (m *Unigram) Remove(t WordType) {
	if m.count[t] == 0 {
		panic("segment: Remove of a type with no tokens")
	}
	m.count[t]--
	m.tokens--
}

// Count returns the number of tokens of type t.
func (m *Unigram) Count(t WordType) int { return int(m.count[t]) }

// Tokens returns the number of word tokens counted.
func (m *Unigram) Tokens() int { return m.tokens }

// AddSegmentation counts every word of s.
func (m *Unigram) AddSegmentation(s *Segmentation) {
	for u := 0; u < m.Corpus.Len(); u++ {
		s.Words(u, func(a, b int) { m.Add(m.Intern(a, b)) })
	}
}

// logNumerator returns log(n_t + extra + Alpha*P0(t)).
func (m *Unigram) logNumerator(t WordType, extra int) float64 {
	la := math.Log(m.Alpha) + m.Types.LogBase[t]
	n := float64(int(m.count[t]) + extra)
	if n == 0 {
		return la
	}
	return logAddExp(math.Log(n), la)
}

// LogPredictive returns the log probability that the next token is of type
// t given the counted tokens: log((n_t + Alpha*P0(t)) / (n + Alpha)).
func (m *Unigram) LogPredictive(t WordType) float64 {
	return m.logNumerator(t, 0) - math.Log(float64(m.tokens)+m.Alpha)
}

// LogJoint returns the log probability of the counted segmentation:
//
//	sum_w [lgamma(n_w + a P0(w)) - lgamma(a P0(w))] + lgamma(a) - lgamma(N + a)
//	+ log B(U + rho/2, N - U + rho/2) - log B(rho/2, rho/2)
//
// the product of the Polya-urn predictives above (Blackwell & MacQueen 1973)
// times the Beta-Bernoulli marginal of the utterance-end decisions.
func (m *Unigram) LogJoint() float64 {
	lp := 0.0
	for t, n := range m.count {
		if n == 0 {
			continue
		}
		ap := m.Alpha * math.Exp(m.Types.LogBase[t])
		if ap == 0 { // underflow: use lgamma(n+x)-lgamma(x) ~ log x + lgamma(n) for tiny x
			lp += math.Log(m.Alpha) + m.Types.LogBase[t] + lgamma(float64(n))
			continue
		}
		lp += lgamma(float64(n)+ap) - lgamma(ap)
	}
	N := float64(m.tokens)
	lp += lgamma(m.Alpha) - lgamma(N+m.Alpha)
	U := float64(m.utterances)
	h := m.Rho / 2
	lp += lbeta(U+h, N-U+h) - lbeta(h, h)
	return lp
}

func lgamma(x float64) float64 { v, _ := math.Lgamma(x); return v }

func lbeta(a, b float64) float64 { return lgamma(a) + lgamma(b) - lgamma(a+b) }

// logAddExp returns log(exp(a) + exp(b)) without overflow.
func logAddExp(a, b float64) float64 {
	if a < b {
		a, b = b, a
	}
	if math.IsInf(b, -1) {
		return a
	}
	return a + math.Log1p(math.Exp(b-a))
}
