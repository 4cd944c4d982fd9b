package segment

// WordType is an interned word: an index into a Types table.
type WordType int32

// Types interns word types by their unit sequence. Looking up a known type
// does not allocate; a new type allocates its key once and keeps its ID for
// the life of the table, so IDs stay valid while counts come and go.
type Types struct {
	ids map[string]WordType
	// Length[t] is the length of type t in units.
	Length []int32
	// First[t] is a position in the corpus where type t was first seen,
	// so its text can be recovered.
	First []int32
	// LogBase[t] is the log base probability of type t, filled by the model
	// that owns the table.
	LogBase []float64
}

// NewTypes returns an empty table.
func NewTypes() *Types { return &Types{ids: make(map[string]WordType)} }

// Len returns the number of types ever interned.
func (t *Types) Len() int { return len(t.Length) }

// Lookup returns the type of the unit span [start, end) of c, if interned.
func (t *Types) Lookup(c *Corpus, start, end int) (WordType, bool) {
	id, ok := t.ids[string(c.Key(start, end))]
	return id, ok
}

// Intern returns the type of the unit span [start, end) of c, adding it if
// new. The second result reports whether it was new.
func (t *Types) Intern(c *Corpus, start, end int) (WordType, bool) {
	if id, ok := t.ids[string(c.Key(start, end))]; ok {
		return id, false
	}
	id := WordType(len(t.Length))
	t.ids[string(c.Key(start, end))] = id
	t.Length = append(t.Length, int32(end-start))
	t.First = append(t.First, int32(start))
	t.LogBase = append(t.LogBase, 0)
	return id, true
}

// Text returns the text of type id in corpus c.
func (t *Types) Text(c *Corpus, id WordType) string {
	s := int(t.First[id])
	return c.Text(s, s+int(t.Length[id]))
}
