// Package eval holds the evaluation corpora that scripts/ rebuilds from
// registry packages. Its only code is this test, which checks that the
// committed files are consistent with each other and with the transcript
// conventions of DESIGN.md section 2.
package eval

import (
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"unicode"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

// udhrLanguages are the corpora scripts/udhr-eval.sh writes under udhr/.
var udhrLanguages = []string{"spa", "tur", "ind", "swh", "fin"}

// corpus is one language's files, each split into lines.
type corpus struct {
	gold, input, english, lexicon []string
}

// counts are the figures a SOURCE.md states in its Counts table.
type counts struct {
	lines, tokens, types, spellings int
}

// readLines reads a UTF-8 text file of newline-terminated lines. It rejects
// invalid UTF-8, text not in NFC (transcripts are NFC-normalised on
// reading, DESIGN.md section 2), carriage returns, NUL bytes and a missing
// final newline.
func readLines(path string) ([]string, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return splitLines(path, data)
}

func splitLines(name string, data []byte) ([]string, error) {
	if len(data) == 0 {
		return nil, fmt.Errorf("%s: empty file", name)
	}
	if data[len(data)-1] != '\n' {
		return nil, fmt.Errorf("%s: no newline at end of file", name)
	}
	lines := strings.Split(string(data[:len(data)-1]), "\n")
	for i, line := range lines {
		switch {
		case !utf8.ValidString(line):
			return nil, fmt.Errorf("%s:%d: invalid UTF-8", name, i+1)
		case !norm.NFC.IsNormalString(line):
			return nil, fmt.Errorf("%s:%d: not in NFC", name, i+1)
		case strings.ContainsAny(line, "\r\x00"):
			return nil, fmt.Errorf("%s:%d: carriage return or NUL", name, i+1)
		case strings.TrimSpace(line) == "":
			return nil, fmt.Errorf("%s:%d: blank line", name, i+1)
		}
	}
	return lines, nil
}

// check reports the first inconsistency between a corpus's files: line
// counts differ; a gold line is not words separated by single ASCII spaces
// (the segmented-line contract, DESIGN.md section 2); an input line is not
// its gold line without the spaces; the lexicon is not sorted unique
// spelling<TAB>form rows; a gold word has no lexicon row, or a row's form
// never occurs in gold. It returns the counts it measured.
func (c corpus) check() (counts, error) {
	var n counts
	if len(c.input) != len(c.gold) || len(c.english) != len(c.gold) {
		return n, fmt.Errorf("line counts differ: gold %d, input %d, english %d",
			len(c.gold), len(c.input), len(c.english))
	}
	goldWords := make(map[string]bool)
	for i, line := range c.gold {
		words := strings.Split(line, " ")
		for j, w := range words {
			if w == "" {
				return n, fmt.Errorf("gold:%d: empty word %d (leading, trailing or double space)", i+1, j+1)
			}
			if strings.IndexFunc(w, unicode.IsSpace) >= 0 {
				return n, fmt.Errorf("gold:%d: word %q contains white space", i+1, w)
			}
			goldWords[w] = true
		}
		n.tokens += len(words)
		if want := strings.ReplaceAll(line, " ", ""); c.input[i] != want {
			return n, fmt.Errorf("input:%d: %q is not gold without spaces %q", i+1, c.input[i], want)
		}
	}
	n.lines = len(c.gold)
	n.types = len(goldWords)

	forms := make(map[string]bool)
	previous := ""
	for i, row := range c.lexicon {
		fields := strings.Split(row, "\t")
		if len(fields) != 2 || fields[0] == "" || fields[1] == "" {
			return n, fmt.Errorf("lexicon:%d: want spelling<TAB>form, got %q", i+1, row)
		}
		spelling, form := fields[0], fields[1]
		if i > 0 && spelling <= previous {
			return n, fmt.Errorf("lexicon:%d: %q not after %q (rows must be sorted and unique)", i+1, spelling, previous)
		}
		previous = spelling
		if !goldWords[form] {
			return n, fmt.Errorf("lexicon:%d: form %q of %q does not occur in gold", i+1, form, spelling)
		}
		forms[form] = true
	}
	n.spellings = len(c.lexicon)
	for i, line := range c.gold {
		for _, w := range strings.Split(line, " ") {
			if !forms[w] {
				return n, fmt.Errorf("gold:%d: word %q has no lexicon row", i+1, w)
			}
		}
	}
	return n, nil
}

// sourceCount matches a row of the Counts table in SOURCE.md.
var sourceCount = regexp.MustCompile(`(?m)^\| (lines|gold tokens|gold types \(phonemic forms\)|spelling types \(lexicon rows\)) \| ([0-9]+) \|$`)

// readSourceCounts returns the counts a SOURCE.md states.
func readSourceCounts(path string) (counts, error) {
	var n counts
	data, err := os.ReadFile(path)
	if err != nil {
		return n, err
	}
	found := 0
	for _, m := range sourceCount.FindAllSubmatch(data, -1) {
		v, err := strconv.Atoi(string(m[2]))
		if err != nil {
			return n, fmt.Errorf("%s: %s: %w", path, m[1], err)
		}
		switch string(m[1]) {
		case "lines":
			n.lines = v
		case "gold tokens":
			n.tokens = v
		case "gold types (phonemic forms)":
			n.types = v
		case "spelling types (lexicon rows)":
			n.spellings = v
		}
		found++
	}
	if found != 4 {
		return n, fmt.Errorf("%s: found %d of the 4 count rows", path, found)
	}
	return n, nil
}

func readCorpus(dir string) (corpus, error) {
	var c corpus
	for _, f := range []struct {
		name  string
		lines *[]string
	}{
		{"gold.txt", &c.gold},
		{"input.txt", &c.input},
		{"english.txt", &c.english},
		{"lexicon.tsv", &c.lexicon},
	} {
		lines, err := readLines(filepath.Join(dir, f.name))
		if err != nil {
			return c, err
		}
		*f.lines = lines
	}
	return c, nil
}

// TestUDHR checks the committed corpora under udhr/ and that each SOURCE.md
// states the counts the files have.
func TestUDHR(t *testing.T) {
	for _, lang := range udhrLanguages {
		t.Run(lang, func(t *testing.T) {
			dir := filepath.Join("udhr", lang)
			c, err := readCorpus(dir)
			if err != nil {
				t.Fatal(err)
			}
			got, err := c.check()
			if err != nil {
				t.Fatalf("%s: %v", dir, err)
			}
			if got.lines == 0 || got.tokens == 0 {
				t.Fatalf("%s: empty corpus: %+v", dir, got)
			}
			stated, err := readSourceCounts(filepath.Join(dir, "SOURCE.md"))
			if err != nil {
				t.Fatal(err)
			}
			if got != stated {
				t.Errorf("%s: files have %+v, SOURCE.md states %+v", dir, got, stated)
			}
		})
	}
}

// TestCheckFindsErrors shows that each consistency check can fail: every
// case breaks one rule of a small valid corpus.
func TestCheckFindsErrors(t *testing.T) {
	valid := func() corpus {
		return corpus{
			gold:    []string{"la paθ", "el mundo la paθ"},
			input:   []string{"lapaθ", "elmundolapaθ"},
			english: []string{"peace", "the world peace"},
			lexicon: []string{"el\tel", "la\tla", "mundo\tmundo", "paz\tpaθ"},
		}
	}
	if n, err := valid().check(); err != nil || n != (counts{lines: 2, tokens: 6, types: 4, spellings: 4}) {
		t.Fatalf("valid corpus: counts %+v, error %v", n, err)
	}
	tests := []struct {
		name   string
		mutate func(*corpus)
		want   string
	}{
		{"short english", func(c *corpus) { c.english = c.english[:1] }, "line counts differ"},
		{"short input", func(c *corpus) { c.input = c.input[:1] }, "line counts differ"},
		{"double space", func(c *corpus) { c.gold[0] = "la  paθ"; c.input[0] = "lapaθ" }, "empty word"},
		{"trailing space", func(c *corpus) { c.gold[0] = "la paθ " }, "empty word"},
		{"tab in word", func(c *corpus) { c.gold[0] = "la\tpaθ" }, "white space"},
		{"input differs", func(c *corpus) { c.input[1] = "elmundolapas" }, "not gold without spaces"},
		{"missing lexicon row", func(c *corpus) { c.lexicon = c.lexicon[1:] }, "no lexicon row"},
		{"unsorted lexicon", func(c *corpus) { c.lexicon[0], c.lexicon[1] = c.lexicon[1], c.lexicon[0] }, "sorted"},
		{"duplicate spelling", func(c *corpus) { c.lexicon[1] = "el\tla" }, "sorted"},
		{"one field", func(c *corpus) { c.lexicon[0] = "el" }, "spelling<TAB>form"},
		{"unused form", func(c *corpus) { c.lexicon = append(c.lexicon, "zz\tzz") }, "does not occur in gold"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			c := valid()
			tt.mutate(&c)
			_, err := c.check()
			if err == nil || !strings.Contains(err.Error(), tt.want) {
				t.Errorf("error %v, want one containing %q", err, tt.want)
			}
		})
	}
}

// TestSplitLinesFindsErrors shows that the file-level checks can fail.
func TestSplitLinesFindsErrors(t *testing.T) {
	tests := []struct {
		name string
		data []byte
		want string // "" for no error
	}{
		{"valid", []byte("paθ\nla\n"), ""},
		{"empty", nil, "empty file"},
		{"no final newline", []byte("paθ"), "no newline"},
		{"invalid UTF-8", []byte("pa\xffθ\n"), "invalid UTF-8"},
		// "e" followed by U+0301 COMBINING ACUTE ACCENT composes to U+00E9 in NFC.
		{"decomposed", []byte("cafe\u0301\n"), "not in NFC"},
		{"carriage return", []byte("paθ\r\n"), "carriage return"},
		{"blank line", []byte("paθ\n\nla\n"), "blank line"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := splitLines("x.txt", tt.data)
			switch {
			case tt.want == "" && err != nil:
				t.Errorf("unexpected error %v", err)
			case tt.want != "" && (err == nil || !strings.Contains(err.Error(), tt.want)):
				t.Errorf("error %v, want one containing %q", err, tt.want)
			}
		})
	}
}
