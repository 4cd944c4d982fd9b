package align

import (
	"fmt"
	"math"
)

// Null is the id of the NULL word, which generates the translation tokens
// that no word of the utterance accounts for (Brown et al. 1993, section
// 4.1; section number from memory). Every utterance has it implicitly; the
// word ids given to a Model are non-negative.
const Null int32 = -1

// Model is IBM Model 1 (Brown, Della Pietra, Della Pietra & Mercer 1993,
// "The mathematics of statistical machine translation: parameter
// estimation", Computational Linguistics 19(2), section 4.1 with the NULL
// word; section number from memory) for the free translations of a corpus,
// one per utterance. For utterance words w_1..w_k and translation tokens e_1..e_m,
//
//	P(e | w) = prod_j (t(e_j|NULL) + sum_i t(e_j|w_i)) / (k+1)
//
// without a length term (see the package documentation). The translation
// table is
//
//	t(e|w) = (n(e,w) + Beta p(e)) / (n(w) + Beta)
//
// where n(e,w) is the expected number of tokens e aligned to word w in the
// last E-step of Estimate, n(w) = sum_e n(e,w), and p(e) is the frequency
// of e among all translation tokens. Given the expected counts, this is
// the posterior mean of t(.|w) under a Dirichlet(Beta p(.)) prior and its
// mode under Dirichlet(Beta p(.) + 1); with the latter, Estimate is MAP-EM
// and no iteration decreases log P(e|w) + sum_w sum_e Beta p(e) log t(e|w)
// (Dempster, Laird & Rubin 1977). With Beta = 0 it is the maximum-likelihood EM of Brown et al.
// A word with no counts, including one never seen, has t(e|w) = p(e), the
// limit as n(w) -> 0 for any Beta; for the first E-step that is the same as
// the usual uniform start, since either way every alignment of a token is
// equally likely.
//
// A Model's read methods may be called from several goroutines; Estimate
// and Reset may not run concurrently with anything else.
type Model struct {
	// Beta is the strength of the Dirichlet smoothing toward p(e), in
	// pseudo-tokens per word; 0 gives maximum-likelihood tables. It is
	// read on every lookup, so changing it changes the table at once.
	Beta float64
	// NoNull leaves out the NULL word: every token must be explained by a
	// word of its utterance, and the normaliser is 1/k. This is Model 1 as
	// some textbooks first present it, kept for comparison.
	NoNull bool
	// MinOccurrences, when above zero, makes words seen fewer times by the
	// last Estimate predict only the background p(e): a word seen once
	// would otherwise claim its own utterance's translation tokens (its
	// counts come from that very utterance) and reward any segmentation
	// that makes chunks unique. Only well-attested words speak.
	MinOccurrences int

	vocab  []string // vocab[e] is the token with id e
	ids    map[string]int32
	tokens []int32 // every utterance's token ids, end to end
	starts []int   // utterance u's tokens are tokens[starts[u]:starts[u+1]]
	prior  []float64

	// The table: expected counts from the last E-step. A hash map of
	// pairs measured faster for the sampler's lookups than binary search
	// in sorted per-word rows (about 1.7 times, BenchmarkSplitDelta), so
	// rows are kept only to list a word's pairs for Glosses.
	pair        map[uint64]float64 // n(e,w) for w >= 0, by pairKey
	total       []float64          // total[w+1] = n(w); total[0] = n(NULL)
	null        []float64          // null[e] = n(e,NULL)
	occurrences []int32            // occurrences[w+1]: tokens of w in utterances with a translation; [0]: such utterances
	rowStart    []int32            // word w's tokens with a count are rowE[rowStart[w+1]:rowStart[w+2]], increasing
	rowE        []int32
	version     uint64 // counts changes of the table, so a stale Sums is caught

	// Buffers reused by Estimate.
	nextPair  map[uint64]float64
	nextTotal []float64
	nextNull  []float64
	scratch   []float64
	cols      []column
}

// NewModel returns a model of the given translations, one token list per
// utterance in the order the segmentation will give the words, with Beta
// set to beta. The tokens are interned; the table starts with no counts, so
// t(e|w) = p(e) until Estimate is called.
func NewModel(translations [][]string, beta float64) *Model {
	m := &Model{
		Beta:     beta,
		ids:      map[string]int32{},
		starts:   make([]int, 1, len(translations)+1),
		pair:     map[uint64]float64{},
		nextPair: map[uint64]float64{},
		total:    []float64{0},
	}
	var freq []float64
	for _, tokens := range translations {
		for _, tok := range tokens {
			e, ok := m.ids[tok]
			if !ok {
				if len(m.vocab) == math.MaxInt32 {
					panic("align: more than MaxInt32 translation words")
				}
				e = int32(len(m.vocab))
				m.ids[tok] = e
				m.vocab = append(m.vocab, tok)
				freq = append(freq, 0)
			}
			m.tokens = append(m.tokens, e)
			freq[e]++
		}
		m.starts = append(m.starts, len(m.tokens))
	}
	for e := range freq {
		freq[e] /= float64(len(m.tokens))
	}
	m.prior = freq
	m.null = make([]float64, len(m.vocab))
	m.nextNull = make([]float64, len(m.vocab))
	m.buildRows()
	return m
}

// Len returns the number of utterances.
func (m *Model) Len() int { return len(m.starts) - 1 }

// Tokens returns the token ids of utterance u's translation. The slice
// belongs to the model.
func (m *Model) Tokens(u int) []int32 { return m.tokens[m.starts[u]:m.starts[u+1]] }

// VocabSize returns the number of distinct translation tokens.
func (m *Model) VocabSize() int { return len(m.vocab) }

// Word returns the translation token with id e.
func (m *Model) Word(e int32) string { return m.vocab[e] }

// ID returns the id of translation token tok, if the translations have it.
func (m *Model) ID(tok string) (int32, bool) {
	e, ok := m.ids[tok]
	return e, ok
}

// Prior returns p(e), the frequency of token e among all translation
// tokens: the smoothing target and the table of a word with no counts.
func (m *Model) Prior(e int32) float64 { return m.prior[e] }

// Prob returns t(e|w), the probability that word w (or Null) generates
// translation token e.
func (m *Model) Prob(e, w int32) float64 { return m.probIn(m.column(w), e) }

// Count returns n(e,w), the expected number of tokens e aligned to word w
// (or Null) in the last E-step.
func (m *Model) Count(e, w int32) float64 {
	if w == Null {
		return m.null[e]
	}
	checkWord(w)
	if int(w)+1 >= len(m.total) {
		return 0
	}
	return m.pair[pairKey(w, e)]
}

// Occurrences returns how many tokens of word w the last Estimate saw in
// utterances with a non-empty translation: the evidence behind w's table.
// For Null it is the number of such utterances.
func (m *Model) Occurrences(w int32) int {
	if w != Null {
		checkWord(w)
	}
	if i := int(w) + 1; i < len(m.occurrences) {
		return int(m.occurrences[i])
	}
	return 0
}

// LogProb returns log P(e_u | words) for utterance u's translation e_u
// under the current table: the sum over tokens of log S_j, with S_j =
// t(e_j|NULL) + sum_i t(e_j|w_i), minus m log(k+1). It is 0 for an empty
// translation. words are the word ids of the utterance, in any order.
func (m *Model) LogProb(u int, words []int32) float64 {
	return m.LogProbTokens(m.Tokens(u), words)
}

// LogProbTokens returns log P(tokens | words) under the current table, for
// any token ids of the model's vocabulary: LogProb for a translation that
// is not one of the model's utterances.
func (m *Model) LogProbTokens(tokens, words []int32) float64 {
	lp := 0.0
	for _, e := range tokens {
		s := 0.0
		if !m.NoNull {
			s = m.Prob(e, Null)
		}
		for _, w := range words {
			checkWord(w)
			s += m.probIn(m.column(w), e)
		}
		lp += math.Log(s)
	}
	return lp - float64(len(tokens))*m.logNorm(len(words))
}

// LogLikelihood returns the sum of LogProb over all utterances, words[u]
// being the words of utterance u.
func (m *Model) LogLikelihood(words [][]int32) float64 {
	m.checkUtterances(words)
	lp := 0.0
	for u, ws := range words {
		lp += m.LogProb(u, ws)
	}
	return lp
}

// positions returns the number of positions a token can align to in an
// utterance of k words: k+1 with NULL, k without.
func (m *Model) positions(k int) int {
	if m.NoNull {
		return k
	}
	return k + 1
}

// logNorm returns the log of positions(k), the normaliser of each token.
func (m *Model) logNorm(k int) float64 { return math.Log(float64(m.positions(k))) }

// column is what a lookup of t(.|w) needs to know about word w.
type column struct {
	w     int32
	seen  bool    // n(w) > 0
	denom float64 // n(w) + Beta
}

// column returns word w's column of the table.
func (m *Model) column(w int32) column {
	if w != Null {
		checkWord(w)
	}
	i := int(w) + 1
	if i >= len(m.total) || m.total[i] == 0 {
		return column{w: w}
	}
	if w != Null && m.MinOccurrences > 0 && m.Occurrences(w) < m.MinOccurrences {
		return column{w: w}
	}
	return column{w: w, seen: true, denom: m.total[i] + m.Beta}
}

// probIn returns t(e|w) for w's column c.
func (m *Model) probIn(c column, e int32) float64 {
	p := m.prior[e]
	if !c.seen {
		return p
	}
	var n float64
	if c.w == Null {
		n = m.null[e]
	} else {
		n = m.pair[pairKey(c.w, e)]
	}
	return (n + m.Beta*p) / c.denom
}

// pairKey returns the key of n(e,w) for a word w >= 0.
func pairKey(w, e int32) uint64 { return uint64(uint32(w))<<32 | uint64(uint32(e)) }

// checkWord panics if w is not a valid word id.
func checkWord(w int32) {
	if w < 0 {
		panic(fmt.Sprintf("align: word id %d is negative", w))
	}
}

// checkUtterances panics unless words has one entry per utterance.
func (m *Model) checkUtterances(words [][]int32) {
	if len(words) != m.Len() {
		panic(fmt.Sprintf("align: %d utterances of words for %d translations", len(words), m.Len()))
	}
}
