package segment_test

import (
	"errors"
	"slices"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// unitTexts reads text as a corpus and returns the unit texts of every
// utterance, one slice per utterance.
func unitTexts(t *testing.T, text string, opts ReadOptions) [][]string {
	t.Helper()
	c, err := ReadCorpus(strings.NewReader(text), "units.txt", opts)
	if err != nil {
		t.Fatalf("ReadCorpus(%q): %v", text, err)
	}
	return utteranceUnits(c)
}

// utteranceUnits returns the unit texts of every utterance of c.
func utteranceUnits(c *Corpus) [][]string {
	var out [][]string
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		var us []string
		for _, id := range c.Units[start:end] {
			us = append(us, c.Inventory[id])
		}
		out = append(out, us)
	}
	return out
}

// TestDefaultUnits checks the default split into units, DESIGN section 2:
// one base character plus the combining marks, tie bars and spacing
// modifier letters (U+02B0..U+02FF) that attach to it. Character classes
// are those of the Unicode Character Database (UnicodeData.txt general
// category Mn for U+0303, U+0361, U+035C; block "Spacing Modifier
// Letters" for U+02B0..U+02FF); NFC results follow UAX #15 and the
// decompositions in UnicodeData.txt (U+00E3 = U+0061 U+0303).
func TestDefaultUnits(t *testing.T) {
	tests := []struct {
		name string
		in   string
		opts ReadOptions
		want []string
	}{
		// The ASCII alphabet of shared/corpora/cds-english (SOURCE.md: one
		// ASCII character per phoneme) uses these symbols and capitals.
		{"ascii symbols", "@#$%&^~*+|!-369", ReadOptions{}, strings.Split("@#$%&^~*+|!-369", "")},
		{"ascii capitals", "DTSZNGWOYIEU", ReadOptions{}, strings.Split("DTSZNGWOYIEU", "")},
		{"ascii words, spaces ignored", "hIz D^ kIti", ReadOptions{}, strings.Split("hIzD^kIti", "")},
		{"tabs ignored", "a\tb \t c", ReadOptions{}, []string{"a", "b", "c"}},

		// NFC: decomposed and composed input give the same unit.
		{"nfc composed", "\u00e3ma", ReadOptions{}, []string{"\u00e3", "m", "a"}},
		{"nfc decomposed", "a\u0303ma", ReadOptions{}, []string{"\u00e3", "m", "a"}},
		// No precomposed form: the mark attaches to its base.
		{"mark without precomposed form", "\u025b\u0303n", ReadOptions{}, []string{"\u025b\u0303", "n"}},
		// Canonical ordering (UAX #15): U+0331 (ccc 220) sorts before U+0303
		// (ccc 230), then a + U+0303 composes to U+00E3 because U+0331 does
		// not block it.
		{"nfc reorders marks", "a\u0303\u0331", ReadOptions{}, []string{"\u00e3\u0331"}},
		{"nfc reorders marks other order", "a\u0331\u0303", ReadOptions{}, []string{"\u00e3\u0331"}},
		{"syllabic mark below", "n\u0329", ReadOptions{}, []string{"n\u0329"}},

		// Tie bars (U+0361 above, U+035C below) join both neighbours.
		{"tie bar above", "t\u0361\u0283a", ReadOptions{}, []string{"t\u0361\u0283", "a"}},
		{"tie bar below", "d\u035c\u0292i", ReadOptions{}, []string{"d\u035c\u0292", "i"}},
		{"tie bar then modifier", "t\u0361s\u02b0a", ReadOptions{}, []string{"t\u0361s\u02b0", "a"}},
		{"tie bar at line end", "at\u0361", ReadOptions{}, []string{"a", "t\u0361"}},
		{"tie bar before space", "t\u0361 \u0283", ReadOptions{}, []string{"t\u0361", "\u0283"}},

		// Spacing modifier letters written after a segment.
		{"aspiration", "t\u02b0a", ReadOptions{}, []string{"t\u02b0", "a"}},
		{"labialisation", "k\u02b7a", ReadOptions{}, []string{"k\u02b7", "a"}},
		{"length", "a\u02d0m", ReadOptions{}, []string{"a\u02d0", "m"}},
		{"palatalisation", "n\u02b2a", ReadOptions{}, []string{"n\u02b2", "a"}},
		{"ejective", "k\u02bca", ReadOptions{}, []string{"k\u02bc", "a"}},
		{"tone letters", "ma\u02e5\u02e9", ReadOptions{}, []string{"m", "a\u02e5\u02e9"}},
		{"two modifiers", "k\u02b7\u02b0a\u02d0", ReadOptions{}, []string{"k\u02b7\u02b0", "a\u02d0"}},
		{"modifier at line start", "\u02b0a", ReadOptions{}, []string{"\u02b0", "a"}},
		{"mark at line start", "\u0303a", ReadOptions{}, []string{"\u0303", "a"}},
		{"mark after ignored space", "a \u0303", ReadOptions{}, []string{"a", "\u0303"}},

		// Stress marks are written before a syllable: they stand alone.
		{"stress marks stand alone", "\u02ccata\u02c8ma", ReadOptions{},
			[]string{"\u02cc", "a", "t", "a", "\u02c8", "m", "a"}},
		{"ignore stress and punctuation", "\u02ccata\u02c8ma, ta.", ReadOptions{Ignore: "\u02c8\u02cc.,"},
			[]string{"a", "t", "a", "m", "a", "t", "a"}},
		{"ignore drops an attached character", "a\u02d0ma\u02d0", ReadOptions{Ignore: "\u02d0"},
			[]string{"a", "m", "a"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := unitTexts(t, tt.in, tt.opts)
			if len(got) != 1 || !slices.Equal(got[0], tt.want) {
				t.Errorf("units of %+q = %+q, want [%+q]", tt.in, got, tt.want)
			}
		})
	}
}

// TestDefaultUnitsNFCEquivalent checks that canonically equivalent inputs
// (UAX #15) give identical corpora: same inventory, same units.
func TestDefaultUnitsNFCEquivalent(t *testing.T) {
	pairs := [][2]string{
		{"\u00e3\u00e9\u00f1", "a\u0303e\u0301n\u0303"},
		{"\u1ebd\u0303", "e\u0303\u0303"},
		{"\u01d8", "u\u0308\u0301"}, // U+01D8 = U+00FC U+0301 = u U+0308 U+0301
		{"\u00c5", "\u212b"},        // ANGSTROM SIGN is a singleton decomposition to U+00C5
	}
	for _, p := range pairs {
		a := unitTexts(t, p[0], ReadOptions{})
		b := unitTexts(t, p[1], ReadOptions{})
		if !slices.EqualFunc(a, b, slices.Equal[[]string]) {
			t.Errorf("%+q gives %+q but %+q gives %+q", p[0], a, p[1], b)
		}
	}
}

// TestUnitsInventory checks --units splitting: longest match first, NFC
// on both sides, ignored characters dropped (DESIGN section 2).
func TestUnitsInventory(t *testing.T) {
	inv, err := NewInventory([]string{"t", "ts", "ts\u02b0", "a", "s", "a\u0303", "\u028e"})
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name   string
		in     string
		ignore string
		want   []string
	}{
		{"longest first", "ts\u02b0atsata", "", []string{"ts\u02b0", "a", "ts", "a", "t", "a"}},
		{"falls back to shorter", "tsa ta", "", []string{"ts", "a", "t", "a"}},
		{"decomposed input matches", "a\u0303ts", "", []string{"a\u0303", "ts"}},
		{"composed input matches", "\u00e3\u028e", "", []string{"a\u0303", "\u028e"}},
		{"ignore stress and punctuation", "\u02c8tsa.ta, \u02ccsa", "\u02c8\u02cc.,", []string{"ts", "a", "t", "a", "s", "a"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got := unitTexts(t, tt.in, ReadOptions{Inventory: inv, Ignore: tt.ignore})
			want := make([]string, len(tt.want))
			for i, u := range tt.want {
				want[i] = nfc(u)
			}
			if len(got) != 1 || !slices.Equal(got[0], want) {
				t.Errorf("units of %+q = %+q, want [%+q]", tt.in, got, want)
			}
		})
	}
}

// nfc spells out the NFC forms used in these tests, so the expectation
// does not come from the library under test: U+0061 U+0303 composes to
// U+00E3 (UnicodeData.txt); the other strings are already NFC.
func nfc(s string) string {
	return strings.ReplaceAll(s, "a\u0303", "\u00e3")
}

// TestUnitsInventoryLeftover checks that a character outside the
// inventory is an error naming file:line:column, with the column counted
// in characters of the normalised line, 1-based (DESIGN section 2).
func TestUnitsInventoryLeftover(t *testing.T) {
	inv, err := NewInventory([]string{"t", "ts", "ts\u02b0", "a", "\u00e3"})
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name   string
		in     string
		ignore string
		want   string // prefix of the message
		line   int
		col    int
	}{
		{"first line", "tax", "", "inv.txt:1:3: ", 1, 3},
		{"after empty lines", "ta\n\n  ts\u02b0x", "", "inv.txt:3:6: ", 3, 6},
		// x is the 5th character of the NFC line ã t s ʰ x (byte 8 of
		// the raw line, character 6 before normalisation).
		{"columns count NFC characters", "ta\na\u0303ts\u02b0x", "", "inv.txt:2:5: ", 2, 5},
		{"stress mark without ignore", "\u02c8ta", "", "inv.txt:1:1: ", 1, 1},
		{"ignored characters still counted", "\u02c8t.a?", "\u02c8.", "inv.txt:1:5: ", 1, 5},
		{"modifier alone", "ta\u02b0", "", "inv.txt:1:3: ", 1, 3},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ReadCorpus(strings.NewReader(tt.in), "inv.txt", ReadOptions{Inventory: inv, Ignore: tt.ignore})
			checkPositionError(t, err, ErrUnknownUnit, tt.want, tt.line, tt.col)
		})
	}
}

// checkPositionError checks that err is a *PositionError wrapping target,
// at line:col, whose message starts with prefix.
func checkPositionError(t *testing.T, err, target error, prefix string, line, col int) {
	t.Helper()
	if err == nil {
		t.Fatalf("no error, want %v", target)
	}
	if !errors.Is(err, target) {
		t.Errorf("error %q is not %v", err, target)
	}
	var pe *PositionError
	if !errors.As(err, &pe) {
		t.Fatalf("error %q (%T) is not a *PositionError", err, err)
	}
	if pe.Line != line || pe.Column != col {
		t.Errorf("error %q at %d:%d, want %d:%d", err, pe.Line, pe.Column, line, col)
	}
	if !strings.HasPrefix(err.Error(), prefix) {
		t.Errorf("error %q does not start with %q", err, prefix)
	}
}

func TestUnitsNewInventory(t *testing.T) {
	inv, err := NewInventory([]string{"ts", "a\u0303", "t", "ts", "\u00e3"})
	if err != nil {
		t.Fatal(err)
	}
	// Sorted, duplicates (also NFC duplicates) merged.
	if got, want := inv.Units(), []string{"t", "ts", "\u00e3"}; !slices.Equal(got, want) {
		t.Errorf("Units() = %+q, want %+q", got, want)
	}
	for _, bad := range [][]string{{""}, {"t", "t s"}, {"t\tt"}, {"a\xff"}} {
		if _, err := NewInventory(bad); err == nil {
			t.Errorf("NewInventory(%q) accepted", bad)
		}
	}
	if _, err := NewInventory([]string{"a\xff"}); !errors.Is(err, ErrInvalidUTF8) {
		t.Errorf("NewInventory(invalid UTF-8): %v, want ErrInvalidUTF8", err)
	}
}
