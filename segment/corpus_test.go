package segment_test

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"slices"
	"strings"
	"testing"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
)

var update = flag.Bool("update", false, "rewrite golden files")

// TestCorpusLines checks line handling (DESIGN section 2): empty lines are
// skipped but keep their numbers, LF and CRLF endings and a missing final
// newline read the same, and a byte order mark at the start is not text
// (Unicode Standard, section 23.8, "Specials"; recalled from memory).
func TestCorpusLines(t *testing.T) {
	tests := []struct {
		name   string
		in     string
		opts   ReadOptions
		units  [][]string
		lines  []int
		starts []int
	}{
		{"empty input", "", ReadOptions{}, nil, nil, []int{0}},
		{"only newlines", "\n\r\n\n", ReadOptions{}, nil, nil, []int{0}},
		{"one line no newline", "ab", ReadOptions{}, [][]string{{"a", "b"}}, []int{1}, []int{0, 2}},
		{"one line newline", "ab\n", ReadOptions{}, [][]string{{"a", "b"}}, []int{1}, []int{0, 2}},
		{"empty lines keep numbers", "\nab\n\n\ncd\nef", ReadOptions{},
			[][]string{{"a", "b"}, {"c", "d"}, {"e", "f"}}, []int{2, 5, 6}, []int{0, 2, 4, 6}},
		{"crlf", "ab\r\n\r\ncd\r\n", ReadOptions{}, [][]string{{"a", "b"}, {"c", "d"}}, []int{1, 3}, []int{0, 2, 4}},
		{"crlf no final newline", "ab\r\ncd", ReadOptions{}, [][]string{{"a", "b"}, {"c", "d"}}, []int{1, 2}, []int{0, 2, 4}},
		{"blank lines skipped", "ab\n \t \ncd", ReadOptions{}, [][]string{{"a", "b"}, {"c", "d"}}, []int{1, 3}, []int{0, 2, 4}},
		{"ignored-only lines skipped", "ab\n\u02c8.\ncd", ReadOptions{Ignore: "\u02c8."},
			[][]string{{"a", "b"}, {"c", "d"}}, []int{1, 3}, []int{0, 2, 4}},
		{"byte order mark", "\ufeffab\ncd", ReadOptions{}, [][]string{{"a", "b"}, {"c", "d"}}, []int{1, 2}, []int{0, 2, 4}},
		{"byte order mark then empty line", "\ufeff\nab", ReadOptions{}, [][]string{{"a", "b"}}, []int{2}, []int{0, 2}},
		{"units shared across lines", "aba\nba", ReadOptions{}, [][]string{{"a", "b", "a"}, {"b", "a"}}, []int{1, 2}, []int{0, 3, 5}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			c, err := ReadCorpus(strings.NewReader(tt.in), "lines.txt", tt.opts)
			if err != nil {
				t.Fatal(err)
			}
			if c.Name != "lines.txt" {
				t.Errorf("Name = %q", c.Name)
			}
			if got := utteranceUnits(c); !slices.EqualFunc(got, tt.units, slices.Equal[[]string]) {
				t.Errorf("units = %+q, want %+q", got, tt.units)
			}
			if c.Len() != len(tt.units) {
				t.Errorf("Len() = %d, want %d", c.Len(), len(tt.units))
			}
			if !slices.Equal(c.Lines, tt.lines) {
				t.Errorf("Lines = %v, want %v", c.Lines, tt.lines)
			}
			if !slices.Equal(c.Starts, tt.starts) {
				t.Errorf("Starts = %v, want %v", c.Starts, tt.starts)
			}
			if c.Locks != nil {
				t.Errorf("Locks = %v, want nil without SpacesAreBoundaries", c.Locks)
			}
		})
	}
}

// TestCorpusInterning checks that equal unit texts share one Unit and that
// Key, Text and UnitID agree with the inventory.
func TestCorpusInterning(t *testing.T) {
	c, err := ReadCorpus(strings.NewReader("t\u0361\u0283at\u0361\u0283a\na\u0303t\u0361\u0283"), "intern.txt", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if want := []string{"t\u0361\u0283", "a", "\u00e3"}; !slices.Equal(c.Inventory, want) {
		t.Fatalf("Inventory = %+q, want %+q", c.Inventory, want)
	}
	if want := []Unit{0, 1, 0, 1, 2, 0}; !slices.Equal(c.Units, want) {
		t.Errorf("Units = %v, want %v", c.Units, want)
	}
	if id, ok := c.UnitID("\u00e3"); !ok || id != 2 {
		t.Errorf("UnitID(ã) = %d, %v", id, ok)
	}
	if _, ok := c.UnitID("a\u0303"); ok {
		t.Errorf("UnitID finds the decomposed form; the inventory holds NFC text only")
	}
	if got := c.Text(0, 4); got != "t\u0361\u0283at\u0361\u0283a" {
		t.Errorf("Text(0, 4) = %q", got)
	}
	// Spans with the same units have the same key; different spans differ.
	if !bytes.Equal(c.Key(0, 2), c.Key(2, 4)) {
		t.Errorf("Key(0,2) = %v != Key(2,4) = %v", c.Key(0, 2), c.Key(2, 4))
	}
	if bytes.Equal(c.Key(0, 2), c.Key(1, 3)) || bytes.Equal(c.Key(0, 1), c.Key(0, 2)) {
		t.Errorf("different spans share a key")
	}
	if s, e := c.Utterance(1); s != 4 || e != 6 {
		t.Errorf("Utterance(1) = %d, %d, want 4, 6", s, e)
	}
}

// TestCorpusSpacesAreBoundaries checks that with SpacesAreBoundaries a run
// of spaces or tabs between units locks one Boundary, that leading and
// trailing white space locks nothing, and that without it spaces are
// ignored (DESIGN section 2).
func TestCorpusSpacesAreBoundaries(t *testing.T) {
	in := "  ab  c\td \n\ne\tf\ng"
	c, err := ReadCorpus(strings.NewReader(in), "pauses.txt", ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	F, B := Free, Boundary
	if want := []Lock{F, F, B, B, F, B, F}; !slices.Equal(c.Locks, want) {
		t.Errorf("Locks = %v, want %v", c.Locks, want)
	}
	if want := []int{1, 3, 4}; !slices.Equal(c.Lines, want) {
		t.Errorf("Lines = %v, want %v", c.Lines, want)
	}
	for i := range c.Units {
		if c.LockAt(i) != c.Locks[i] {
			t.Errorf("LockAt(%d) = %v, Locks[%d] = %v", i, c.LockAt(i), i, c.Locks[i])
		}
	}

	// Without the option the same text has no locks at all.
	d, err := ReadCorpus(strings.NewReader(in), "pauses.txt", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if d.Locks != nil || !slices.Equal(d.Units, c.Units) {
		t.Errorf("without SpacesAreBoundaries: Locks %v, Units %v; want nil, %v", d.Locks, d.Units, c.Units)
	}
	for i := range d.Units {
		if d.LockAt(i) != Free {
			t.Errorf("LockAt(%d) = %v without locks", i, d.LockAt(i))
		}
	}

	// With the option but no inner white space there is nothing to lock.
	e, err := ReadCorpus(strings.NewReader(" ab \ncd\t"), "pauses.txt", ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	if e.Locks != nil {
		t.Errorf("Locks = %v, want nil", e.Locks)
	}

	// Ignored characters between spaces do not split a pause in two.
	g, err := ReadCorpus(strings.NewReader("a . b,c"), "pauses.txt", ReadOptions{SpacesAreBoundaries: true, Ignore: ".,"})
	if err != nil {
		t.Fatal(err)
	}
	if want := []Lock{F, B, F}; !slices.Equal(g.Locks, want) {
		t.Errorf("Locks = %v, want %v", g.Locks, want)
	}
}

// TestCorpusErrors checks that each kind of bad input is an error that
// names file:line:column (DESIGN section 2), wraps the package's sentinel
// error and is a *PositionError.
func TestCorpusErrors(t *testing.T) {
	tests := []struct {
		name   string
		in     string
		target error
		line   int
		col    int
	}{
		{"invalid byte", "ab\ncd\xffe", ErrInvalidUTF8, 2, 3},
		{"truncated sequence at end", "ab\nc\xe2\x82", ErrInvalidUTF8, 2, 2},
		{"surrogate half", "\xed\xa0\x80", ErrInvalidUTF8, 1, 1},
		{"overlong encoding", "a\xc0\xaf", ErrInvalidUTF8, 1, 2},
		// Columns count characters of the NFC line: "e U+0301" is one.
		{"invalid after decomposed", "e\u0301e\u0301\xff", ErrInvalidUTF8, 1, 3},
		{"invalid after empty lines", "\n\n\r\n  \xfe", ErrInvalidUTF8, 4, 3},
		{"NUL", "ab\x00", ErrNUL, 1, 3},
		{"NUL after crlf", "ab\r\n\x00c", ErrNUL, 2, 1},
		{"NUL after multibyte", "\u00e3\u0283\x00", ErrNUL, 1, 3},
		{"first error wins", "a\x00\n\xff", ErrNUL, 1, 2},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			c, err := ReadCorpus(strings.NewReader(tt.in), "bad.txt", ReadOptions{})
			if c != nil {
				t.Errorf("got a corpus with an error")
			}
			checkPositionError(t, err, tt.target, fmt.Sprintf("bad.txt:%d:%d: ", tt.line, tt.col), tt.line, tt.col)
		})
	}
}

// TestCorpusLineLimit checks MaxLineBytes exactly: a line of MaxLineBytes
// bytes is read whatever its ending, one byte more is an error pointing at
// the first character past the limit.
func TestCorpusLineLimit(t *testing.T) {
	long := strings.Repeat("a", MaxLineBytes)
	for _, ending := range []string{"", "\n", "\r\n"} {
		next := ending + "b" // a line after the long one
		if ending == "" {
			next = "" // the long line ends the input
		}
		c, err := ReadCorpus(strings.NewReader("b\n"+long+next), "limit.txt", ReadOptions{})
		if err != nil {
			t.Errorf("line of MaxLineBytes with ending %q: %v", ending, err)
		} else if c.Len() < 2 || c.Starts[2]-c.Starts[1] != MaxLineBytes {
			t.Errorf("line of MaxLineBytes with ending %q: %d utterances, Starts %v", ending, c.Len(), c.Starts)
		}

		_, err = ReadCorpus(strings.NewReader("b\n"+long+"a"+next), "limit.txt", ReadOptions{})
		checkPositionError(t, err, ErrLineTooLong, fmt.Sprintf("limit.txt:2:%d: ", MaxLineBytes+1), 2, MaxLineBytes+1)
	}

	// Two-byte characters: byte MaxLineBytes (0-based) starts character
	// MaxLineBytes/2, column MaxLineBytes/2+1.
	wide := strings.Repeat("\u00e3", MaxLineBytes/2+1)
	_, err := ReadCorpus(strings.NewReader(wide), "limit.txt", ReadOptions{})
	checkPositionError(t, err, ErrLineTooLong, "limit.txt:1:", 1, MaxLineBytes/2+1)

	// Decomposed characters (3 bytes, one NFC character each): the limit
	// falls between e and U+0301 of the character at 0-based index
	// MaxLineBytes/3, so the column is MaxLineBytes/3+1.
	if MaxLineBytes%3 != 1 {
		t.Fatalf("test assumes MaxLineBytes %% 3 == 1")
	}
	decomposed := strings.Repeat("e\u0301", MaxLineBytes/3+1)
	_, err = ReadCorpus(strings.NewReader(decomposed), "limit.txt", ReadOptions{})
	checkPositionError(t, err, ErrLineTooLong, "limit.txt:1:", 1, MaxLineBytes/3+1)
}

// TestCorpusTooManyUnits checks that the MaxUnits+1st distinct unit is an
// error, not a panic. Plane 15 private-use characters U+F0000..U+FFFFD have
// no decompositions and general category Co (UnicodeData.txt), so each is
// a unit of its own.
func TestCorpusTooManyUnits(t *testing.T) {
	var b strings.Builder
	for r := rune(0xF0000); r <= 0xFFFFD; r++ {
		b.WriteRune(r)
	}
	private := b.String() // MaxUnits-2 distinct units
	if n := utf8.RuneCountInString(private); n != MaxUnits-2 {
		t.Fatalf("%d private-use characters", n)
	}
	c, err := ReadCorpus(strings.NewReader(private+"\nab"), "many.txt", ReadOptions{})
	if err != nil {
		t.Fatalf("exactly MaxUnits units: %v", err)
	}
	if len(c.Inventory) != MaxUnits {
		t.Errorf("%d units", len(c.Inventory))
	}
	_, err = ReadCorpus(strings.NewReader(private+"\n\nab a c"), "many.txt", ReadOptions{})
	checkPositionError(t, err, ErrTooManyUnit, "many.txt:3:6: ", 3, 6)
}

// TestCorpusAddUtterance checks the programmatic way to build a corpus.
func TestCorpusAddUtterance(t *testing.T) {
	c := NewCorpus("added")
	if c.Len() != 0 || !slices.Equal(c.Starts, []int{0}) {
		t.Fatalf("new corpus: Len %d, Starts %v", c.Len(), c.Starts)
	}
	if err := c.AddUtterance([]string{"t\u0361\u0283", "a"}, 1); err != nil {
		t.Fatal(err)
	}
	if err := c.AddUtterance([]string{"a", "t\u0361\u0283", "b"}, 3); err != nil {
		t.Fatal(err)
	}
	if want := []Unit{0, 1, 1, 0, 2}; !slices.Equal(c.Units, want) {
		t.Errorf("Units = %v, want %v", c.Units, want)
	}
	if !slices.Equal(c.Starts, []int{0, 2, 5}) || !slices.Equal(c.Lines, []int{1, 3}) {
		t.Errorf("Starts %v, Lines %v", c.Starts, c.Lines)
	}
	for _, bad := range [][]string{nil, {}, {"a", ""}, {"a b"}, {"a\t"}, {"\n"}} {
		if err := c.AddUtterance(bad, 9); err == nil {
			t.Errorf("AddUtterance(%q) accepted", bad)
		} else if !strings.HasPrefix(err.Error(), "added:9: ") {
			t.Errorf("AddUtterance(%q): error %q does not name added:9", bad, err)
		}
	}
	if c.Len() != 2 || len(c.Units) != 5 || len(c.Inventory) != 3 {
		t.Errorf("rejected utterances changed the corpus: Len %d, %d units, inventory %d", c.Len(), len(c.Units), len(c.Inventory))
	}

	// A corpus read with locks keeps one lock per unit.
	d, err := ReadCorpus(strings.NewReader("a b"), "locks", ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	if err := d.AddUtterance([]string{"c", "d"}, 2); err != nil {
		t.Fatal(err)
	}
	if want := []Lock{Free, Boundary, Free, Free}; !slices.Equal(d.Locks, want) {
		t.Errorf("Locks = %v, want %v", d.Locks, want)
	}
}

// TestCorpusAddUtteranceTooManyUnits checks that several new units in one
// utterance are counted together against MaxUnits.
func TestCorpusAddUtteranceTooManyUnits(t *testing.T) {
	c := NewCorpus("many")
	units := make([]string, MaxUnits-1)
	for i := range units {
		units[i] = fmt.Sprint(i)
	}
	if err := c.AddUtterance(units, 1); err != nil {
		t.Fatal(err)
	}
	err := c.AddUtterance([]string{"x", "y"}, 2)
	if !errors.Is(err, ErrTooManyUnit) {
		t.Fatalf("two new units past MaxUnits-1: %v, want ErrTooManyUnit", err)
	}
	if c.Len() != 1 || len(c.Inventory) != MaxUnits-1 {
		t.Errorf("failed AddUtterance changed the corpus")
	}
	if err := c.AddUtterance([]string{"x", "x", "0"}, 2); err != nil {
		t.Errorf("one new unit up to MaxUnits: %v", err)
	}
}

// TestCorpusEnglishRoundTrip reads the phonemic English corpus of
// shared/corpora (skipped when absent) with spaces as boundaries and checks
// the figures its SOURCE.md gives (28,354 utterances, 96,644 word tokens,
// one ASCII character per phoneme, words separated by one space) and that
// writing the locked segmentation reproduces the file byte for byte.
func TestCorpusEnglishRoundTrip(t *testing.T) {
	const path = "../../shared/corpora/cds-english/gold.txt"
	data, err := os.ReadFile(path)
	if errors.Is(err, os.ErrNotExist) {
		t.Skip("shared corpus absent")
	}
	if err != nil {
		t.Fatal(err)
	}
	c, err := ReadCorpus(bytes.NewReader(data), path, ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	if c.Len() != 28354 {
		t.Errorf("%d utterances, SOURCE.md says 28,354", c.Len())
	}
	s := NewSegmentation(c)
	words := 0
	for u := 0; u < c.Len(); u++ {
		s.Words(u, func(int, int) { words++ })
	}
	if words != 96644 {
		t.Errorf("%d word tokens, SOURCE.md says 96,644", words)
	}
	for i, u := range c.Inventory {
		if len(u) != 1 || u[0] >= utf8.RuneSelf {
			t.Errorf("unit %d is %q, not one ASCII character", i, u)
		}
	}
	var out bytes.Buffer
	if err := s.Write(&out); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(out.Bytes(), data) {
		t.Errorf("writing the corpus back does not reproduce %s", path)
	}
}

// goldenCases are the inputs under testdata/corpus with the options each
// is read with. An inventory file is named with the unit option.
var goldenCases = []struct {
	file   string
	units  string // inventory file in testdata/corpus, one unit a line
	ignore string
	spaces bool
}{
	{file: "ascii.txt"},
	{file: "ascii.txt", spaces: true},
	{file: "ipa.txt"},
	{file: "ipa.txt", spaces: true, ignore: "\u02c8\u02cc.,?"},
	{file: "inventory.txt", units: "inventory.units", ignore: "\u02c8\u02cc.,"},
	{file: "unknown.txt", units: "inventory.units", ignore: "\u02c8\u02cc.,"},
	{file: "invalid.txt"},
	{file: "nul.txt"},
}

// TestCorpusGolden reads each input of goldenCases and compares a listing
// of its utterances (line number, then the units of each utterance joined
// by "·", a space where a Boundary is locked) and its inventory, or its
// error, with a golden file. Regenerate with
//
//	go test ./segment/ -run Golden -update
func TestCorpusGolden(t *testing.T) {
	for _, gc := range goldenCases {
		golden := strings.TrimSuffix(gc.file, ".txt")
		if gc.units != "" {
			golden += "-units"
		}
		if gc.spaces {
			golden += "-spaces"
		}
		if gc.ignore != "" {
			golden += "-ignore"
		}
		golden = filepath.Join("testdata", "corpus", golden+".golden")
		t.Run(filepath.Base(golden), func(t *testing.T) {
			opts := ReadOptions{Ignore: gc.ignore, SpacesAreBoundaries: gc.spaces}
			if gc.units != "" {
				opts.Inventory = readInventoryFile(t, filepath.Join("testdata", "corpus", gc.units))
			}
			f, err := os.Open(filepath.Join("testdata", "corpus", gc.file))
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			c, err := ReadCorpus(f, gc.file, opts)
			got := listCorpus(c, err)
			if *update {
				if err := atomicfile.WriteBytes(golden, []byte(got)); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(golden)
			if err != nil {
				t.Fatalf("%v (run with -update to create)", err)
			}
			if got != string(want) {
				t.Errorf("%s differs:\n--- got\n%s--- want\n%s", golden, got, want)
			}
		})
	}
}

// readInventoryFile reads an inventory, one unit a line, blank lines skipped.
func readInventoryFile(t *testing.T, name string) *Inventory {
	t.Helper()
	data, err := os.ReadFile(name)
	if err != nil {
		t.Fatal(err)
	}
	var units []string
	for _, l := range strings.Split(string(data), "\n") {
		if l = strings.TrimSpace(l); l != "" {
			units = append(units, l)
		}
	}
	inv, err := NewInventory(units)
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return inv
}

// listCorpus renders a corpus or a read error for a golden file.
func listCorpus(c *Corpus, err error) string {
	if err != nil {
		return "error: " + err.Error() + "\n"
	}
	var b strings.Builder
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		fmt.Fprintf(&b, "%d\t", c.Lines[u])
		for i := start; i < end; i++ {
			if i > start {
				if c.LockAt(i) == Boundary {
					b.WriteString(" ")
				} else {
					b.WriteString("·")
				}
			}
			b.WriteString(c.Inventory[c.Units[i]])
		}
		b.WriteString("\n")
	}
	fmt.Fprintf(&b, "inventory (%d):", len(c.Inventory))
	for _, u := range c.Inventory {
		fmt.Fprintf(&b, " %s", u)
	}
	b.WriteString("\n")
	return b.String()
}

// fuzzInventory is the inventory of FuzzReadCorpus's inventory mode.
var fuzzInventory = []string{"t", "ts", "ts\u02b0", "a", "a\u02d0", "a\u0303", "\u0283", "t\u0361\u0283", "k", "k\u02b7", "@", "^", "#"}

// fuzzError matches the start of a positioned error message.
var fuzzError = regexp.MustCompile(`^fuzz\.txt:[1-9][0-9]*:[1-9][0-9]*: `)

// FuzzReadCorpus checks ReadCorpus on arbitrary input: it never panics; a
// corpus it returns is well formed and holds exactly the input's text
// (after NFC, less white space and ignored characters); an error names
// fuzz.txt:line:column. mode picks the options: bit 0 spaces are
// boundaries, bit 1 ignore, bit 2 inventory.
func FuzzReadCorpus(f *testing.F) {
	seeds := []string{
		"", "\n", "ab\r\ncd", "hIz D^ kIti\n\nW@ts D&t", "t\u0361\u0283a\u02c8k\u02b7a\u02d0 a\u0303\n",
		"\ufeffts\u02b0a, ta.", "a\xffb", "a\x00", "\u0303\u02b0a", "t\u0361 \u0283", "\r\r\n\t",
	}
	for _, s := range seeds {
		for mode := range uint8(8) {
			f.Add([]byte(s), mode)
		}
	}
	inv, err := NewInventory(fuzzInventory)
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, data []byte, mode uint8) {
		opts := ReadOptions{SpacesAreBoundaries: mode&1 != 0}
		if mode&2 != 0 {
			opts.Ignore = "\u02c8\u02cc.,"
		}
		if mode&4 != 0 {
			opts.Inventory = inv
		}
		c, err := ReadCorpus(bytes.NewReader(data), "fuzz.txt", opts)
		lines := fuzzLines(data)
		if err != nil {
			checkFuzzError(t, err, lines)
			return
		}
		checkFuzzCorpus(t, c, lines, opts)
	})
}

// fuzzLines splits input as DESIGN section 2 describes: a leading byte
// order mark dropped, lines ended by "\n" or "\r\n".
func fuzzLines(data []byte) [][]byte {
	data = bytes.TrimPrefix(data, []byte("\ufeff"))
	if len(data) == 0 {
		return nil
	}
	lines := bytes.Split(data, []byte("\n"))
	if len(lines[len(lines)-1]) == 0 {
		lines = lines[:len(lines)-1] // final newline
	}
	for i, l := range lines {
		lines[i] = bytes.TrimSuffix(l, []byte("\r"))
	}
	return lines
}

func checkFuzzError(t *testing.T, err error, lines [][]byte) {
	if !fuzzError.MatchString(err.Error()) {
		t.Fatalf("error %q does not start with fuzz.txt:line:col", err)
	}
	var pe *PositionError
	if !errors.As(err, &pe) {
		t.Fatalf("error %q is not a *PositionError", err)
	}
	if pe.Line > len(lines) {
		t.Fatalf("error %q past the last line %d", err, len(lines))
	}
	line := lines[pe.Line-1]
	if pe.Column > utf8.RuneCount(norm.NFC.Bytes(line))+1 {
		t.Fatalf("error %q past the end of its line %q", err, line)
	}
	// Earlier lines were valid; this one is wrong in the way it says.
	for i, l := range lines[:pe.Line-1] {
		if !utf8.Valid(l) || bytes.IndexByte(l, 0) >= 0 || len(l) > MaxLineBytes {
			t.Fatalf("error %q, but line %d is already bad", err, i+1)
		}
	}
	switch {
	case errors.Is(err, ErrInvalidUTF8):
		if utf8.Valid(line) {
			t.Fatalf("error %q on valid UTF-8 %q", err, line)
		}
	case errors.Is(err, ErrNUL):
		if bytes.IndexByte(line, 0) < 0 {
			t.Fatalf("error %q on a line without NUL", err)
		}
	case errors.Is(err, ErrLineTooLong):
		if len(line) <= MaxLineBytes {
			t.Fatalf("error %q on a line of %d bytes", err, len(line))
		}
	case errors.Is(err, ErrUnknownUnit):
	default:
		t.Fatalf("unexpected error %q", err)
	}
}

func checkFuzzCorpus(t *testing.T, c *Corpus, lines [][]byte, opts ReadOptions) {
	if c.Len() != len(c.Lines) || len(c.Starts) != c.Len()+1 || c.Starts[0] != 0 || c.Starts[c.Len()] != len(c.Units) {
		t.Fatalf("inconsistent corpus: Len %d, %d Lines, Starts %v, %d units", c.Len(), len(c.Lines), c.Starts, len(c.Units))
	}
	if c.Locks != nil && len(c.Locks) != len(c.Units) {
		t.Fatalf("%d locks for %d units", len(c.Locks), len(c.Units))
	}
	seen := map[string]bool{}
	for _, u := range c.Inventory {
		if u == "" || strings.ContainsAny(u, " \t") || seen[u] || !norm.NFC.IsNormalString(u) {
			t.Fatalf("bad or repeated unit %q", u)
		}
		seen[u] = true
	}
	for _, id := range c.Units {
		if int(id) >= len(c.Inventory) {
			t.Fatalf("unit %d outside an inventory of %d", id, len(c.Inventory))
		}
	}
	next := 0 // next utterance to match
	for n, raw := range lines {
		want := fuzzExpected(raw, opts)
		if want == "" {
			continue
		}
		if next >= c.Len() || c.Lines[next] != n+1 {
			t.Fatalf("line %d (%q) has text %q but no utterance", n+1, raw, want)
		}
		start, end := c.Utterance(next)
		if start >= end {
			t.Fatalf("utterance %d is empty", next)
		}
		var got strings.Builder
		for i := start; i < end; i++ {
			if i > start && c.LockAt(i) == Boundary {
				got.WriteByte(' ')
			}
			got.WriteString(c.Inventory[c.Units[i]])
		}
		if c.LockAt(start) != Free {
			t.Fatalf("utterance %d starts with lock %v", next, c.LockAt(start))
		}
		if got.String() != want {
			t.Fatalf("line %d %q: units give %q, want %q", n+1, raw, got.String(), want)
		}
		next++
	}
	if next != c.Len() {
		t.Fatalf("%d utterances, %d lines with text", c.Len(), next)
	}
}

// fuzzExpected returns the text a line should read as: NFC, ignored
// characters removed, and spaces and tabs removed or, with
// SpacesAreBoundaries, runs of them collapsed to one space and trimmed.
func fuzzExpected(raw []byte, opts ReadOptions) string {
	s := strings.Map(func(r rune) rune {
		if strings.ContainsRune(opts.Ignore, r) {
			return -1
		}
		if r == '\t' {
			return ' '
		}
		return r
	}, norm.NFC.String(string(raw)))
	if !opts.SpacesAreBoundaries {
		return strings.ReplaceAll(s, " ", "")
	}
	return strings.Join(strings.FieldsFunc(s, func(r rune) bool { return r == ' ' }), " ")
}
