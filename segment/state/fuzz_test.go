package state

import (
	"reflect"
	"testing"
)

// FuzzDecodeCorpus: the state directory's corpus reader never panics, and
// a corpus it accepts survives another encode and decode unchanged, so a
// resumed run sees exactly the corpus that was saved.
func FuzzDecodeCorpus(f *testing.F) {
	f.Add([]byte("1\tt a b\t...\n3\tk i\t.|\n"))
	f.Add([]byte("2\tt͡ʃ aː\t.=\n"))
	f.Add([]byte(""))
	f.Add([]byte("x\ta\t.\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		c, err := decodeCorpus(data, "corpus.tsv")
		if err != nil {
			return
		}
		again, err := decodeCorpus(encodeCorpus(c), "again")
		if err != nil {
			t.Fatalf("re-encoded corpus is unreadable: %v", err)
		}
		if !reflect.DeepEqual(again.Units, c.Units) || !reflect.DeepEqual(again.Inventory, c.Inventory) ||
			!reflect.DeepEqual(again.Lines, c.Lines) || !reflect.DeepEqual(again.Locks, c.Locks) {
			t.Fatalf("corpus changed on a second round trip")
		}
	})
}
