// Package demo embeds the demo corpus of juncture: transcriptions of
// Kelaru, a language invented for the demo, with gold word boundaries, free
// English translations and a lexicon. The language, its community and every
// sentence are made up (see README.md in this directory); nothing here
// describes a real language.
//
// The files are made by scripts/demogen:
//
//	go run ./scripts/demogen -out data/demo -seed 1
package demo

import (
	"bufio"
	"bytes"
	"embed"
	"fmt"
	"io"
	"io/fs"
	"strings"
	"unicode/utf8"
)

//go:embed input.txt gold.txt translations.txt lexicon.tsv README.md
var files embed.FS

// read returns a fresh copy of an embedded file. The files are embedded
// at build time, so a missing one is a programmer mistake.
func read(name string) []byte {
	b, err := files.ReadFile(name)
	if err != nil {
		panic("demo: " + err.Error())
	}
	return b
}

// Input returns the transcriptions without word boundaries, one utterance
// a line: what a user gives to juncture.
func Input() []byte { return read("input.txt") }

// Gold returns the reference segmentation: the lines of Input with single
// spaces between words.
func Gold() []byte { return read("gold.txt") }

// Translations returns a free English translation of each line of Input.
func Translations() []byte { return read("translations.txt") }

// Lexicon returns the lexicon file: form, gloss and part of speech
// separated by tabs, one word a line.
func Lexicon() []byte { return read("lexicon.tsv") }

// Readme returns the description of the invented language and corpus.
func Readme() []byte { return read("README.md") }

// FS returns the embedded files, named input.txt, gold.txt,
// translations.txt, lexicon.tsv and README.md.
func FS() fs.FS { return files }

// Entry is one word of the lexicon.
type Entry struct {
	Form  string // phonemic form, as in the transcriptions
	Gloss string // English gloss, or a Leipzig abbreviation such as PST
	POS   string // part of speech
}

// Entries returns the parsed lexicon.
func Entries() []Entry {
	e, err := ParseLexicon("lexicon.tsv", bytes.NewReader(Lexicon()))
	if err != nil {
		panic("demo: embedded lexicon: " + err.Error())
	}
	return e
}

// ParseLexicon reads a lexicon in the format of lexicon.tsv: one word a
// line with three non-empty fields (form, gloss, part of speech) separated
// by tabs. Empty lines are skipped and CRLF line ends accepted. A form
// listed twice is an error. name is used in error messages, which give
// name:line.
func ParseLexicon(name string, r io.Reader) ([]Entry, error) {
	var out []Entry
	seen := make(map[string]int)
	sc := bufio.NewScanner(r)
	line := 0
	for sc.Scan() {
		line++
		text := sc.Text()
		if text == "" {
			continue
		}
		if !utf8.ValidString(text) {
			return nil, fmt.Errorf("%s:%d: invalid UTF-8", name, line)
		}
		if strings.ContainsRune(text, '\r') {
			return nil, fmt.Errorf("%s:%d: carriage return inside the line", name, line)
		}
		f := strings.Split(text, "\t")
		if len(f) != 3 {
			return nil, fmt.Errorf("%s:%d: %d tab-separated fields, want 3 (form, gloss, part of speech)", name, line, len(f))
		}
		for i, what := range []string{"form", "gloss", "part of speech"} {
			if strings.TrimSpace(f[i]) == "" {
				return nil, fmt.Errorf("%s:%d: empty %s", name, line, what)
			}
		}
		if strings.Contains(f[0], " ") {
			return nil, fmt.Errorf("%s:%d: form %q contains a space", name, line, f[0])
		}
		if first, dup := seen[f[0]]; dup {
			return nil, fmt.Errorf("%s:%d: form %q already listed on line %d", name, line, f[0], first)
		}
		seen[f[0]] = line
		out = append(out, Entry{Form: f[0], Gloss: f[1], POS: f[2]})
	}
	if err := sc.Err(); err != nil {
		return nil, fmt.Errorf("%s:%d: %w", name, line+1, err)
	}
	return out, nil
}
