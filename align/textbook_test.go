package align_test

import (
	"math"
	"testing"

	"github.com/juncture-project/juncture/align"
)

// TestTextbookEM checks EM without the NULL word against the worked example
// in Koehn, Statistical Machine Translation (Cambridge University Press
// 2010), chapter 4, section 4.2: the corpus "das Haus / the house", "das
// Buch / the book", "ein Buch / a book", and the table t(e|f) after the
// first three iterations, printed to four places. The book's figure number
// and values are recalled from memory; they also agree with an exact
// rational computation of the same EM. The direction matches ours: the
// German words generate the English tokens.
func TestTextbookEM(t *testing.T) {
	words := [][]string{{"das", "Haus"}, {"das", "Buch"}, {"ein", "Buch"}}
	tokens := [][]string{{"the", "house"}, {"the", "book"}, {"a", "book"}}
	ids := map[string]int32{"das": 0, "Haus": 1, "Buch": 2, "ein": 3}
	wordIDs := make([][]int32, len(words))
	for u, ws := range words {
		for _, w := range ws {
			wordIDs[u] = append(wordIDs[u], ids[w])
		}
	}
	m := align.NewModel(tokens, 0)
	m.NoNull = true

	type cell struct{ e, f string }
	iterations := []map[cell]float64{
		{ // iteration 1
			{"the", "das"}: 0.5, {"book", "das"}: 0.25, {"house", "das"}: 0.25,
			{"the", "Buch"}: 0.25, {"book", "Buch"}: 0.5, {"a", "Buch"}: 0.25,
			{"book", "ein"}: 0.5, {"a", "ein"}: 0.5,
			{"the", "Haus"}: 0.5, {"house", "Haus"}: 0.5,
		},
		{ // iteration 2
			{"the", "das"}: 0.6364, {"book", "das"}: 0.1818, {"house", "das"}: 0.1818,
			{"the", "Buch"}: 0.1818, {"book", "Buch"}: 0.6364, {"a", "Buch"}: 0.1818,
			{"book", "ein"}: 0.4286, {"a", "ein"}: 0.5714,
			{"the", "Haus"}: 0.4286, {"house", "Haus"}: 0.5714,
		},
		{ // iteration 3
			{"the", "das"}: 0.7479, {"book", "das"}: 0.1208, {"house", "das"}: 0.1313,
			{"the", "Buch"}: 0.1208, {"book", "Buch"}: 0.7479, {"a", "Buch"}: 0.1313,
			{"book", "ein"}: 0.3466, {"a", "ein"}: 0.6534,
			{"the", "Haus"}: 0.3466, {"house", "Haus"}: 0.6534,
		},
	}
	for it, want := range iterations {
		m.Estimate(wordIDs, 1)
		for c, p := range want {
			e, _ := m.ID(c.e)
			if got := m.Prob(e, ids[c.f]); math.Abs(got-p) > 0.00005 {
				t.Errorf("iteration %d: t(%s|%s) = %.4f, book %.4f", it+1, c.e, c.f, got, p)
			}
		}
	}
	// The book's table ends with the limit: each German word translates
	// to its English word with probability 1. EM approaches it slowly.
	m.Estimate(wordIDs, 2000)
	for _, c := range []cell{{"the", "das"}, {"house", "Haus"}, {"book", "Buch"}, {"a", "ein"}} {
		e, _ := m.ID(c.e)
		if got := m.Prob(e, ids[c.f]); got < 0.99 {
			t.Errorf("after 2003 iterations t(%s|%s) = %.4f, book's limit 1", c.e, c.f, got)
		}
	}
}
