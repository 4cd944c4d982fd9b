// Package lexicon turns a segmentation into a first lexicon: every
// discovered word type with its frequency, how sure the segmenter is of its
// edges, and example lines, so a linguist can check it with speakers.
package lexicon

import (
	"sort"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
)

// MaxExamples is the number of example lines kept per entry.
const MaxExamples = 3

// Entry is one word type of a lexicon.
type Entry struct {
	// Form is the word as written in the transcripts (units concatenated).
	Form string `json:"form"`
	// Count is the number of tokens in the segmentation.
	Count int `json:"count"`
	// Confidence is the mean, over tokens, of the lower of the boundary
	// probabilities at the token's two edges: how sure the sampler is that
	// this stretch is a word where it occurs. 1 where no posterior is known.
	Confidence float64 `json:"confidence"`
	// Lines are source line numbers of the first MaxExamples tokens.
	Lines []int `json:"lines"`
	// Glosses are the translation words most associated with the word,
	// best first (see AddGlosses); none without enough evidence.
	Glosses []align.Gloss `json:"glosses,omitempty"`
}

// Build returns the lexicon of seg, most frequent first (ties by form).
// posterior, if not nil, gives the boundary probability before each unit.
func Build(seg *segment.Segmentation, posterior []float64) []Entry {
	c := seg.Corpus
	index := map[string]int{}
	var entries []Entry
	for u := 0; u < c.Len(); u++ {
		_, end := c.Utterance(u)
		seg.Words(u, func(a, b int) {
			form := c.Text(a, b)
			k, ok := index[form]
			if !ok {
				k = len(entries)
				index[form] = k
				entries = append(entries, Entry{Form: form})
			}
			e := &entries[k]
			e.Count++
			conf := 1.0
			if posterior != nil {
				conf = posterior[a]
				if b < end {
					conf = min(conf, posterior[b])
				}
			}
			e.Confidence += conf
			if len(e.Lines) < MaxExamples {
				e.Lines = append(e.Lines, c.Lines[u])
			}
		})
	}
	for i := range entries {
		entries[i].Confidence /= float64(entries[i].Count)
	}
	sort.Slice(entries, func(i, j int) bool {
		if entries[i].Count != entries[j].Count {
			return entries[i].Count > entries[j].Count
		}
		return entries[i].Form < entries[j].Form
	})
	return entries
}
