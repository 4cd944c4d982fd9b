package segment

// spanForms numbers the distinct unit strings of a corpus's short spans,
// so that finding the word type of a span is three array reads instead of
// hashing its units and probing a table: profiling the blocked sampler,
// which asks for the type of every span up to the longest word of every
// utterance, put more than half its time in those lookups.
//
// Span [p, p+k) of one utterance, 1 <= k <= max, has form
// ids[off[p]+k-1]; equal unit strings have equal forms wherever they occur.
type spanForms struct {
	max int
	off []int32 // len(Units)+1 entries; off[p+1]-off[p] spans start at p
	ids []int32
	n   int // number of distinct forms
}

// IndexSpans numbers the spans of c of up to max units within each
// utterance (see spanForms). Word-type tables first used afterwards use
// the index; it is built once, by the first call. Calls may run
// concurrently (several runs learning from one corpus at once): the
// others wait for the first, and a table first used while the index is
// being built does without it, which changes its speed, not its results.
func (c *Corpus) IndexSpans(max int) {
	if c.forms.Load() != nil || max < 1 {
		return
	}
	c.indexMu.Lock()
	defer c.indexMu.Unlock()
	if c.forms.Load() != nil {
		return
	}
	f := &spanForms{max: max, off: make([]int32, len(c.Units)+1)}
	total := 0
	for u := 0; u < c.Len(); u++ {
		s, e := c.Utterance(u)
		for p := s; p < e; p++ {
			f.off[p] = int32(total)
			total += min(max, e-p)
		}
	}
	f.off[len(c.Units)] = int32(total)
	f.ids = make([]int32, total)
	seen := NewTypes() // a scratch table: its IDs are the forms
	for u := 0; u < c.Len(); u++ {
		s, e := c.Utterance(u)
		for p := s; p < e; p++ {
			o := f.off[p]
			for k := 1; k <= min(max, e-p); k++ {
				id, _ := seen.Intern(c, p, p+k)
				f.ids[int(o)+k-1] = int32(id)
			}
		}
	}
	f.n = seen.Len()
	c.forms.Store(f)
}

// form returns the form of span [start, end), or -1 if the span is not
// indexed (too long, or f is nil).
func (f *spanForms) form(start, end int) int32 {
	if o := f.entry(start, end); o >= 0 {
		return f.ids[o]
	}
	return -1
}

// entry returns the index in ids of span [start, end), or -1 if the span
// is not indexed.
func (f *spanForms) entry(start, end int) int {
	if f == nil {
		return -1
	}
	k := int32(end - start)
	o := f.off[start]
	if k < 1 || k > f.off[start+1]-o {
		return -1
	}
	return int(o + k - 1)
}
