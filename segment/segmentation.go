package segment

import (
	"bufio"
	"io"
	"math/rand/v2"
)

// Segmentation marks word boundaries in a Corpus. Boundary[i] says whether a
// word starts at unit position i. Utterance-initial positions are always
// true.
type Segmentation struct {
	Corpus   *Corpus
	Boundary []bool
}

// NewSegmentation returns a segmentation of c with boundaries only at
// utterance starts and at positions locked as boundaries.
func NewSegmentation(c *Corpus) *Segmentation {
	s := &Segmentation{Corpus: c, Boundary: make([]bool, len(c.Units))}
	for i := range s.Boundary {
		s.Boundary[i] = c.LockAt(i) == Boundary
	}
	for u := 0; u < c.Len(); u++ {
		s.Boundary[c.Starts[u]] = true
	}
	return s
}

// RandomSegmentation returns a segmentation of c in which every free gap is
// a boundary with probability p, drawn from rng.
func RandomSegmentation(c *Corpus, p float64, rng *rand.Rand) *Segmentation {
	s := NewSegmentation(c)
	for i := range s.Boundary {
		if !s.Boundary[i] && c.LockAt(i) == Free && rng.Float64() < p {
			s.Boundary[i] = true
		}
	}
	return s
}

// Clone returns a deep copy of s's boundaries on the same corpus.
func (s *Segmentation) Clone() *Segmentation {
	return &Segmentation{Corpus: s.Corpus, Boundary: append([]bool(nil), s.Boundary...)}
}

// Words calls f with the span of each word of utterance u, in order.
func (s *Segmentation) Words(u int, f func(start, end int)) {
	start, end := s.Corpus.Utterance(u)
	w := start
	for i := start + 1; i < end; i++ {
		if s.Boundary[i] {
			f(w, i)
			w = i
		}
	}
	if end > start {
		f(w, end)
	}
}

// WordStrings returns the words of utterance u as text.
func (s *Segmentation) WordStrings(u int) []string {
	var out []string
	s.Words(u, func(a, b int) { out = append(out, s.Corpus.Text(a, b)) })
	return out
}

// Write writes one line per utterance, words separated by single spaces
// (DESIGN section 2, contract).
func (s *Segmentation) Write(w io.Writer) error {
	bw := bufio.NewWriter(w)
	c := s.Corpus
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		for i := start; i < end; i++ {
			if i > start && s.Boundary[i] {
				bw.WriteByte(' ')
			}
			bw.WriteString(c.Inventory[c.Units[i]])
		}
		bw.WriteByte('\n')
	}
	return bw.Flush()
}
