package align

// ReverseFactor is the translation prior in Brown et al.'s direction as a
// sampler sees it: log P(words_u | e_u) of every utterance u under a fixed
// Reverse table. The factor is a sum over words, so a split or join
// changes three terms and costs O(tokens) table lookups; Delta, for a
// whole new segmentation of one utterance, costs O(words * tokens). It
// satisfies segment.UtteranceFactor.
//
// A ReverseFactor must not be used from several goroutines at once. The
// running totals of Split and Join accumulate rounding error of about one
// ulp per move; Set clears an utterance's.
type ReverseFactor struct {
	model *Reverse
	cur   []float64 // cur[u] is log P(words_u | e_u) for the current words
}

// NewReverseFactor estimates a Reverse table from the current segmentation
// (words[u] are the word ids of utterance u) by iterations of EM with
// smoothing beta and the rare-word threshold minOccurrences, and returns
// the factor for it. The table is a function of the segmentation alone.
// With ratio, each word's factor is divided by its background probability
// (see Reverse.Ratio).
func NewReverseFactor(translations [][]string, beta float64, words [][]int32, iterations, minOccurrences int, ratio bool) *ReverseFactor {
	r := NewReverse(translations, beta, minOccurrences)
	r.Ratio = ratio
	r.Estimate(words, iterations)
	f := &ReverseFactor{model: r, cur: make([]float64, r.Len())}
	for u, ws := range words {
		f.Set(u, ws)
	}
	return f
}

// Model returns the table behind f.
func (f *ReverseFactor) Model() *Reverse { return f.model }

// LogProb returns log P(words_u | e_u) for utterance u's current words.
func (f *ReverseFactor) LogProb(u int) float64 { return f.cur[u] }

// Set makes words the current words of utterance u.
func (f *ReverseFactor) Set(u int, words []int32) { f.cur[u] = f.model.LogProb(u, words) }

// Delta returns log P(words | e_u) minus log P(current words | e_u).
func (f *ReverseFactor) Delta(u int, words []int32) float64 {
	return f.model.LogProb(u, words) - f.cur[u]
}

// SplitDelta returns the change of log P(words_u | e_u) if one occurrence
// of word w in utterance u became the two words w1 and w2.
func (f *ReverseFactor) SplitDelta(u int, w, w1, w2 int32) float64 {
	if len(f.model.Tokens(u)) == 0 {
		return 0
	}
	r := f.model
	return r.logWord(u, w1) + r.logWord(u, w2) - r.logWord(u, w)
}

// JoinDelta returns the change of log P(words_u | e_u) if one occurrence
// each of words w1 and w2 in utterance u became the single word w.
func (f *ReverseFactor) JoinDelta(u int, w1, w2, w int32) float64 {
	return -f.SplitDelta(u, w, w1, w2)
}

// Split updates utterance u's total after one occurrence of w became w1 w2.
func (f *ReverseFactor) Split(u int, w, w1, w2 int32) { f.cur[u] += f.SplitDelta(u, w, w1, w2) }

// Join updates utterance u's total after w1 and w2 became w.
func (f *ReverseFactor) Join(u int, w1, w2, w int32) { f.cur[u] += f.JoinDelta(u, w1, w2, w) }
