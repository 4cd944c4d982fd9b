package segment_test

import (
	"math/rand/v2"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// TestTypesSpanIndex interns random spans, with rollbacks, in two tables:
// one over a corpus with a span index and one over the same text without.
// They must give out the same IDs and agree on every lookup, whether the
// span is short enough for the index or not.
func TestTypesSpanIndex(t *testing.T) {
	text := "abcab\naab\nbcabcabca\nc\nabcabc\n"
	read := func() *Corpus {
		c, err := ReadCorpus(strings.NewReader(text), "t", ReadOptions{})
		if err != nil {
			t.Fatal(err)
		}
		return c
	}
	for _, max := range []int{1, 2, 4, 32} {
		plain, indexed := read(), read()
		indexed.IndexSpans(max)
		a, b := NewTypes(), NewTypes()
		rng := rand.New(rand.NewPCG(uint64(max), 3))
		randomSpan := func() (int, int) {
			u := rng.IntN(plain.Len())
			s, e := plain.Utterance(u)
			i := s + rng.IntN(e-s)
			return i, i + 1 + rng.IntN(e-i)
		}
		for step := 0; step < 2000; step++ {
			s, e := randomSpan()
			switch rng.IntN(4) {
			case 0:
				n := rng.IntN(a.Len() + 1)
				a.Truncate(n)
				b.Truncate(n)
			case 1:
				ida, oka := a.Lookup(plain, s, e)
				idb, okb := b.Lookup(indexed, s, e)
				if oka != okb || (oka && ida != idb) {
					t.Fatalf("max %d step %d: Lookup(%d, %d) = %d, %v without the index, %d, %v with it", max, step, s, e, ida, oka, idb, okb)
				}
			default:
				ida, newa := a.Intern(plain, s, e)
				idb, newb := b.Intern(indexed, s, e)
				if ida != idb || newa != newb {
					t.Fatalf("max %d step %d: Intern(%d, %d) = %d, %v without the index, %d, %v with it", max, step, s, e, ida, newa, idb, newb)
				}
			}
		}
		if a.Len() != b.Len() {
			t.Fatalf("max %d: %d types without the index, %d with it", max, a.Len(), b.Len())
		}
	}
}
