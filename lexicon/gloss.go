package lexicon

import (
	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
)

// GlossOptions says how glosses are estimated.
type GlossOptions struct {
	// Beta is the Dirichlet smoothing of the translation table.
	Beta float64
	// Iterations of EM on the final segmentation.
	Iterations int
	// PerWord is the most glosses kept per entry.
	PerWord int
	// MinCount is the fewest tokens with a translation a word needs for
	// any gloss: below it, no gloss rather than a guess.
	MinCount int
}

// DefaultGlossOptions returns the defaults: beta 1, 20 EM iterations, up
// to 3 glosses, words seen at least 3 times.
func DefaultGlossOptions() GlossOptions {
	return GlossOptions{Beta: 1, Iterations: 20, PerWord: 3, MinCount: 3}
}

// AddGlosses estimates an IBM Model 1 translation table from seg's words
// and the utterances' translation tokens (translations[u] for utterance
// u), and gives each entry its most associated translation words.
func AddGlosses(entries []Entry, seg *segment.Segmentation, translations [][]string, opts GlossOptions) {
	c := seg.Corpus
	ids := map[string]int32{}
	for i, e := range entries {
		ids[e.Form] = int32(i)
	}
	words := make([][]int32, c.Len())
	for u := range words {
		seg.Words(u, func(a, b int) { words[u] = append(words[u], ids[c.Text(a, b)]) })
	}
	m := align.NewModel(translations, opts.Beta)
	m.Estimate(words, opts.Iterations)
	for i := range entries {
		entries[i].Glosses = m.Glosses(int32(i), opts.PerWord, opts.MinCount)
	}
}
