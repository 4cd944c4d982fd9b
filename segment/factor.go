package segment

// UtteranceFactor is an extra factor F_u(words) on the probability of each
// utterance's words, such as the likelihood of the utterance's free
// translation under a translation model (package align). The samplers
// target P(segmentation) * prod_u F_u^Weight, where F is held fixed during
// a block of sweeps and rebuilt from the current segmentation between
// blocks. Word ids are the sampler's WordType values.
type UtteranceFactor interface {
	// SplitDelta returns log F_u after splitting word w of utterance u into
	// w1 w2, minus log F_u now; JoinDelta the reverse change.
	SplitDelta(u int, w, w1, w2 int32) float64
	JoinDelta(u int, w1, w2, w int32) float64
	// Split and Join apply those changes.
	Split(u int, w, w1, w2 int32)
	Join(u int, w1, w2, w int32)
	// Delta returns log F_u(words) minus log F_u now.
	Delta(u int, words []int32) float64
	// Set makes words the current words of utterance u.
	Set(u int, words []int32)
}

// FactorBuilder builds the factor for a chain's block from the current
// segmentation's words per utterance (words[u] are WordType values);
// length(w) is the length in units of any WordType the block's sampler
// uses, including types interned after the call. It is called from the
// chain's goroutine and must return a factor of its own.
type FactorBuilder func(words [][]int32, length func(w int32) int) UtteranceFactor

// utteranceWords returns the word types of every utterance of s, interned
// in m.
func utteranceWords(s *Segmentation, m *Words) [][]int32 {
	words := make([][]int32, s.Corpus.Len())
	for u := range words {
		s.Words(u, func(a, b int) { words[u] = append(words[u], int32(m.Intern(a, b))) })
	}
	return words
}
