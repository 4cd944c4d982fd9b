package segment

import (
	"bytes"
	"hash/maphash"
)

// WordType is an interned word: an index into a Types table.
type WordType int32

// Types interns word types by their unit sequence. A type is found by a
// hash of its span of the corpus's unit keys in an open-addressing table
// whose entries are checked against the span itself, so neither looking up
// nor adding a type allocates (beyond amortised growth of the table).
// Types are never removed, so IDs stay valid while counts come and go.
type Types struct {
	// Length[t] is the length of type t in units.
	Length []int32
	// First[t] is a position in the corpus where type t was first seen,
	// so its text can be recovered.
	First []int32
	// LogBase[t] is the log base probability of type t, filled by the model
	// that owns the table.
	LogBase []float64

	hashes []uint64 // hashes[t]: hash of type t's key
	slots  []int32  // open addressing: type+1, or 0 for empty
	corpus *Corpus  // the corpus whose spans First points into

	// forms is the corpus's span index when the table was first used
	// (nil if it had none); formType[f] is then the type of form f plus
	// one, or 0. Every type is in the hash table too; spans the index
	// covers are looked up through it.
	forms    *spanForms
	formType []int32
	// formHas has bit f set when formType[f] > 0. Most spans a lattice
	// asks about are no type at all, and formType, one int32 per form
	// (millions), misses the cache at random; the bitmap, 32 times
	// smaller, mostly does not, so a miss costs a bit test.
	formHas []uint64
}

// typeSeed makes hashes differ between processes, which only changes the
// table's layout, never the IDs given out.
var typeSeed = maphash.MakeSeed()

// NewTypes returns an empty table.
func NewTypes() *Types { return &Types{slots: make([]int32, 64)} }

// Len returns the number of types ever interned.
func (t *Types) Len() int { return len(t.Length) }

// find returns the slot where the key with hash h is or would go, and the
// type found there (-1 if none).
func (t *Types) find(c *Corpus, key []byte, h uint64) (slot int, id WordType) {
	mask := len(t.slots) - 1
	for i := int(h) & mask; ; i = (i + 1) & mask {
		e := t.slots[i]
		if e == 0 {
			return i, -1
		}
		id := WordType(e - 1)
		if t.hashes[id] == h && int(t.Length[id]) == len(key)/2 {
			s := int(t.First[id])
			if bytes.Equal(t.corpus.Key(s, s+int(t.Length[id])), key) {
				return i, id
			}
		}
	}
}

// Lookup returns the type of the unit span [start, end) of c, if interned.
func (t *Types) Lookup(c *Corpus, start, end int) (WordType, bool) {
	if t.corpus == nil {
		return -1, false
	}
	if f := t.forms.form(start, end); f >= 0 {
		if t.formHas[f>>6]&(1<<(f&63)) == 0 {
			return -1, false
		}
		return WordType(t.formType[f] - 1), true
	}
	key := c.Key(start, end)
	_, id := t.find(c, key, maphash.Bytes(typeSeed, key))
	return id, id >= 0
}

// Intern returns the type of the unit span [start, end) of c, adding it if
// new. The second result reports whether it was new. All spans interned in
// one table must come from the same corpus.
func (t *Types) Intern(c *Corpus, start, end int) (WordType, bool) {
	if t.corpus == nil {
		t.corpus = c
		if t.forms = c.forms.Load(); t.forms != nil {
			t.formType = make([]int32, t.forms.n)
			t.formHas = make([]uint64, (t.forms.n+63)/64)
		}
	} else if t.corpus != c {
		panic("segment: Types used with two corpora")
	}
	f := t.forms.form(start, end)
	if f >= 0 && t.formHas[f>>6]&(1<<(f&63)) != 0 {
		return WordType(t.formType[f] - 1), false
	}
	key := c.Key(start, end)
	h := maphash.Bytes(typeSeed, key)
	slot, id := t.find(c, key, h)
	if id >= 0 {
		return id, false
	}
	id = WordType(len(t.Length))
	t.Length = append(t.Length, int32(end-start))
	t.First = append(t.First, int32(start))
	t.LogBase = append(t.LogBase, 0)
	t.hashes = append(t.hashes, h)
	t.slots[slot] = int32(id) + 1
	if f >= 0 {
		t.formType[f] = int32(id) + 1
		t.formHas[f>>6] |= 1 << (f & 63)
	}
	if 2*len(t.Length) > len(t.slots) {
		t.grow()
	}
	return id, true
}

// grow doubles the table and reinserts every type.
func (t *Types) grow() {
	t.slots = make([]int32, 2*len(t.slots))
	mask := len(t.slots) - 1
	for id, h := range t.hashes {
		i := int(h) & mask
		for t.slots[i] != 0 {
			i = (i + 1) & mask
		}
		t.slots[i] = int32(id) + 1
	}
}

// Text returns the text of type id in corpus c.
func (t *Types) Text(c *Corpus, id WordType) string {
	s := int(t.First[id])
	return c.Text(s, s+int(t.Length[id]))
}

// Truncate forgets every type with an ID of n or more: the types added
// since Len was n, as when a proposal that introduced them is rejected.
// With linear probing, removing the most recently added keys in reverse
// order of insertion leaves every other key's probe sequence intact (no
// key added before them ever probed past their slots), so their slots are
// simply cleared. The IDs will be given out again.
func (t *Types) Truncate(n int) {
	if n >= len(t.Length) {
		return
	}
	mask := len(t.slots) - 1
	for id := len(t.Length) - 1; id >= n; id-- {
		s := int(t.First[id])
		if f := t.forms.form(s, s+int(t.Length[id])); f >= 0 {
			t.formType[f] = 0
			t.formHas[f>>6] &^= 1 << (f & 63)
		}
		for i := int(t.hashes[id]) & mask; ; i = (i + 1) & mask {
			if t.slots[i] == int32(id)+1 {
				t.slots[i] = 0
				break
			}
		}
	}
	t.Length, t.First, t.LogBase, t.hashes = t.Length[:n], t.First[:n], t.LogBase[:n], t.hashes[:n]
}
