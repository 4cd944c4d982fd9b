package demo

import (
	"bytes"
	"fmt"
	"reflect"
	"strings"
	"testing"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

// The checks below are the corpus's own contract (DESIGN.md §2 and §9:
// UTF-8 in NFC, one utterance a line, words separated by single ASCII
// spaces, translations line-aligned); the lexicon format is the one
// README.md documents.

// lines splits a file into lines, failing on a missing final newline.
func lines(t *testing.T, name string, b []byte) []string {
	t.Helper()
	if len(b) == 0 || b[len(b)-1] != '\n' {
		t.Fatalf("%s: empty or no final newline", name)
	}
	return strings.Split(string(b[:len(b)-1]), "\n")
}

func TestFilesAreNFC(t *testing.T) {
	for name, b := range map[string][]byte{
		"input.txt": Input(), "gold.txt": Gold(), "translations.txt": Translations(),
		"lexicon.tsv": Lexicon(), "README.md": Readme(),
	} {
		if !utf8.Valid(b) {
			t.Errorf("%s: invalid UTF-8", name)
		}
		if !norm.NFC.IsNormal(b) {
			t.Errorf("%s: not in normalisation form C", name)
		}
		if bytes.ContainsRune(b, '\r') || bytes.ContainsRune(b, 0) {
			t.Errorf("%s: contains CR or NUL", name)
		}
	}
}

func TestLinesAgree(t *testing.T) {
	input := lines(t, "input.txt", Input())
	gold := lines(t, "gold.txt", Gold())
	trans := lines(t, "translations.txt", Translations())
	if len(input) != len(gold) || len(gold) != len(trans) {
		t.Fatalf("line counts differ: input %d, gold %d, translations %d", len(input), len(gold), len(trans))
	}
	for i := range gold {
		n := i + 1
		g := gold[i]
		if g == "" || strings.TrimSpace(g) != g || strings.Contains(g, "  ") || strings.ContainsAny(g, "\t") {
			t.Errorf("gold.txt:%d: %q: want words separated by single spaces", n, g)
		}
		if want := strings.ReplaceAll(g, " ", ""); input[i] != want {
			t.Errorf("input.txt:%d: %q, want gold without spaces %q", n, input[i], want)
		}
		if strings.TrimSpace(trans[i]) == "" {
			t.Errorf("translations.txt:%d: empty", n)
		}
	}
}

func TestGoldWordsInLexicon(t *testing.T) {
	lex := make(map[string]bool)
	for _, e := range Entries() {
		lex[e.Form] = true
	}
	for i, g := range lines(t, "gold.txt", Gold()) {
		for _, w := range strings.Split(g, " ") {
			if !lex[w] {
				t.Errorf("gold.txt:%d: word %q is not in lexicon.tsv", i+1, w)
			}
		}
	}
}

// TestCorpusIsLearnable checks the properties the demo relies on: words
// recur, and some words begin others, so that segmenting is neither
// trivial nor hopeless.
func TestCorpusIsLearnable(t *testing.T) {
	counts := make(map[string]int)
	tokens := 0
	for _, g := range lines(t, "gold.txt", Gold()) {
		for _, w := range strings.Split(g, " ") {
			counts[w]++
			tokens++
		}
	}
	if len(counts) == 0 || tokens/len(counts) < 5 {
		t.Errorf("%d tokens of %d types: words hardly recur", tokens, len(counts))
	}
	prefixes := 0
	for w := range counts {
		for v := range counts {
			if v != w && strings.HasPrefix(v, w) {
				prefixes++
				break
			}
		}
	}
	if prefixes < 10 {
		t.Errorf("only %d word types begin another type", prefixes)
	}
}

func TestReadmeCounts(t *testing.T) {
	readme := string(Readme())
	n := len(lines(t, "gold.txt", Gold()))
	if want := fmt.Sprintf("| utterances | %d ", n); !strings.Contains(readme, want) {
		t.Errorf("README.md does not report %d utterances", n)
	}
	if !strings.Contains(readme, "invented") {
		t.Error("README.md does not say that the language is invented")
	}
}

func TestReturnsCopies(t *testing.T) {
	a := Gold()
	a[0] ^= 0xff
	if bytes.Equal(a, Gold()) {
		t.Error("Gold returns shared memory: a caller's change is visible")
	}
}

func TestParseLexicon(t *testing.T) {
	tests := []struct {
		name, in string
		want     []Entry
		err      string // substring of the error; "" for none
	}{
		{"two entries", "na\tI\tpronoun\nke\tPST\tparticle\n",
			[]Entry{{"na", "I", "pronoun"}, {"ke", "PST", "particle"}}, ""},
		{"empty lines skipped", "\nna\tI\tpronoun\n\n", []Entry{{"na", "I", "pronoun"}}, ""},
		{"no final newline", "na\tI\tpronoun", []Entry{{"na", "I", "pronoun"}}, ""},
		{"empty input", "", nil, ""},
		{"two fields", "na\tI\n", nil, "x:1: 2 tab-separated fields"},
		{"four fields", "na\tI\tpronoun\textra\n", nil, "x:1: 4 tab-separated fields"},
		{"empty gloss", "na\t\tpronoun\n", nil, "x:1: empty gloss"},
		{"blank form", " \tI\tpronoun\n", nil, "x:1: empty form"},
		{"space in form", "na ŋ\twe\tpronoun\n", nil, "x:1: form"},
		{"duplicate", "na\tI\tpronoun\nti\tyou\tpronoun\nna\tme\tpronoun\n", nil, "x:3: form \"na\" already listed on line 1"},
		{"invalid UTF-8", "n\xffa\tI\tpronoun\n", nil, "x:1: invalid UTF-8"},
		{"CRLF", "na\tI\tpronoun\r\n", []Entry{{"na", "I", "pronoun"}}, ""},
		{"inner CR", "na\tI\tpro\r\r\n", nil, "x:1: carriage return"},
	}
	for _, tt := range tests {
		got, err := ParseLexicon("x", strings.NewReader(tt.in))
		if tt.err != "" {
			if err == nil || !strings.Contains(err.Error(), tt.err) {
				t.Errorf("%s: error %v, want one containing %q", tt.name, err, tt.err)
			}
			continue
		}
		if err != nil || !reflect.DeepEqual(got, tt.want) {
			t.Errorf("%s: got %v, %v; want %v", tt.name, got, err, tt.want)
		}
	}
}

func FuzzParseLexicon(f *testing.F) {
	f.Add([]byte("na\tI\tpronoun\nke\tPST\tparticle\n"))
	f.Add([]byte("na\tI\n"))
	f.Add([]byte("\n\n\t\t\n"))
	f.Add(Lexicon())
	f.Fuzz(func(t *testing.T, in []byte) {
		entries, err := ParseLexicon("fuzz", bytes.NewReader(in))
		if err != nil {
			return
		}
		// What parses writes back in the same format and parses the same.
		var b bytes.Buffer
		for _, e := range entries {
			if e.Form == "" || e.Gloss == "" || e.POS == "" {
				t.Fatalf("entry %q has an empty field", e)
			}
			fmt.Fprintf(&b, "%s\t%s\t%s\n", e.Form, e.Gloss, e.POS)
		}
		again, err := ParseLexicon("again", &b)
		if err != nil {
			t.Fatalf("re-parsing the written entries: %v", err)
		}
		if !reflect.DeepEqual(entries, again) && !(len(entries) == 0 && len(again) == 0) {
			t.Fatalf("round trip changed %q to %q", entries, again)
		}
	})
}

func ExampleEntries() {
	for _, e := range Entries() {
		if e.Form == "ni" || e.Form == "kumo" {
			fmt.Printf("%s\t%s\t%s\n", e.Form, e.Gloss, e.POS)
		}
	}
	// Output:
	// kumo	cook	verb
	// ni	OBJ	postposition
}
