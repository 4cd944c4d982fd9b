package align

// Factor is the translation prior as a sampler sees it: log P(e_u | words)
// of every utterance u under a fixed translation table, kept as running
// sums so a split or join costs O(tokens), plus Delta for a whole new
// segmentation of one utterance. It satisfies segment.UtteranceFactor.
type Factor struct {
	*Sums
	model *Model
}

// NewFactor estimates a translation table from the current segmentation
// (words[u] are the word ids of utterance u) by iterations of EM from the
// prior, and returns the factor for it. The table is a function of the
// segmentation alone, so a sampler that rebuilds it at fixed points stays
// reproducible. Words seen fewer than minOccurrences times predict only the
// background (see Model.MinOccurrences).
func NewFactor(translations [][]string, beta float64, words [][]int32, iterations, minOccurrences int) *Factor {
	return NewFactorWith(translations, words, FactorOptions{Beta: beta, Iterations: iterations, MinOccurrences: minOccurrences})
}

// FactorOptions are the settings of NewFactorWith: the Model fields of the
// same names, and the number of EM iterations.
type FactorOptions struct {
	Beta           float64
	Iterations     int
	MinOccurrences int
	Size           func(w int32) float64
	NullSize       float64
	LeaveOneOut    bool
}

// NewFactorWith is NewFactor with every setting of the model.
func NewFactorWith(translations [][]string, words [][]int32, o FactorOptions) *Factor {
	m := NewModel(translations, o.Beta)
	m.Size, m.NullSize, m.LeaveOneOut = o.Size, o.NullSize, o.LeaveOneOut
	m.Estimate(words, o.Iterations)
	m.MinOccurrences = o.MinOccurrences
	return &Factor{Sums: m.NewSums(words), model: m}
}

// Model returns the table behind f.
func (f *Factor) Model() *Model { return f.model }

// Delta returns log P(e_u | words) minus log P(e_u | current words).
func (f *Factor) Delta(u int, words []int32) float64 {
	return f.model.LogProb(u, words) - f.Sums.LogProb(u)
}
