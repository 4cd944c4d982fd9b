// Command demogen writes the demo corpus of juncture: transcripts of
// Kelaru, a language invented for the demo, with gold word boundaries and
// free English translations.
//
// Usage, from the repository root:
//
//	go run ./scripts/demogen -out data/demo -seed 1
//
// It writes gold.txt (words separated by single spaces, one utterance a
// line), input.txt (the same lines without spaces), translations.txt
// (English, line-aligned), lexicon.tsv (form, gloss, part of speech) and
// README.md. The same seed gives the same bytes: every random choice comes
// from one explicit PCG source, and nothing iterates over a map.
//
// Nothing here describes a real language or community; the phonology,
// lexicon, grammar, names and translations are made up.
package main

import (
	"bytes"
	"flag"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"
)

// The corpus in data/demo is made with these settings.
const (
	defaultSeed       = 1
	defaultUtterances = 720
)

func main() {
	out := flag.String("out", "data/demo", "directory to write the corpus into")
	seed := flag.Uint64("seed", defaultSeed, "seed of the random source")
	n := flag.Int("n", defaultUtterances, "number of utterances")
	flag.Parse()
	if flag.NArg() > 0 {
		fmt.Fprintln(os.Stderr, "demogen: unexpected arguments:", flag.Args())
		os.Exit(2)
	}
	files, err := build(*seed, *n)
	if err == nil {
		err = writeAll(*out, files)
	}
	if err != nil {
		fmt.Fprintln(os.Stderr, "demogen:", err)
		os.Exit(1)
	}
}

// file is one output file.
type file struct {
	name string
	data []byte
}

// pcgStream is the second PCG seed word; the first is the -seed flag.
const pcgStream = 0x6b656c617275 // "kelaru"

// build generates n utterances from seed and returns the output files.
func build(seed uint64, n int) ([]file, error) {
	if n < 1 {
		return nil, fmt.Errorf("number of utterances %d: must be positive", n)
	}
	lex, err := checkLexicon()
	if err != nil {
		return nil, err
	}
	g := &generator{r: rand.New(rand.NewPCG(seed, pcgStream))}
	var gold, input, english bytes.Buffer
	utts := make([]utterance, n)
	for i := range utts {
		u := g.utterance()
		for _, w := range u.words {
			if _, ok := lex[w]; !ok {
				return nil, fmt.Errorf("utterance %d: word %q is not in the lexicon", i+1, w)
			}
		}
		if len(u.words) == 0 || strings.TrimSpace(u.english) == "" {
			return nil, fmt.Errorf("utterance %d: empty", i+1)
		}
		utts[i] = u
		gold.WriteString(strings.Join(u.words, " ") + "\n")
		input.WriteString(strings.Join(u.words, "") + "\n")
		english.WriteString(u.english + "\n")
	}
	st, err := measure(utts, lex)
	if err != nil {
		return nil, err
	}
	return []file{
		{"gold.txt", gold.Bytes()},
		{"input.txt", input.Bytes()},
		{"translations.txt", english.Bytes()},
		{"lexicon.tsv", lexiconTSV()},
		{"README.md", readme(seed, n, st)},
	}, nil
}

// checkLexicon checks that every form fits the phonology and is listed
// once, and returns the forms as a set.
func checkLexicon() (map[string]word, error) {
	lex := make(map[string]word)
	for _, w := range lexiconWords() {
		if _, err := syllables(w.form); err != nil {
			return nil, fmt.Errorf("lexicon: %s %q: %w", w.pos, w.gloss, err)
		}
		if old, dup := lex[w.form]; dup {
			return nil, fmt.Errorf("lexicon: %q is both %q and %q", w.form, old.gloss, w.gloss)
		}
		lex[w.form] = w
	}
	return lex, nil
}

// lexiconTSV returns the lexicon file: form, gloss and part of speech
// separated by tabs, one word a line, sorted by form.
func lexiconTSV() []byte {
	words := lexiconWords()
	slices.SortFunc(words, func(a, b word) int { return strings.Compare(a.form, b.form) })
	var b bytes.Buffer
	for _, w := range words {
		fmt.Fprintf(&b, "%s\t%s\t%s\n", w.form, w.gloss, w.pos)
	}
	return b.Bytes()
}

// writeAll writes files into dir, each through a temporary file renamed
// into place, so that a reader never sees a half-written file.
func writeAll(dir string, files []file) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	for _, f := range files {
		if err := writeAtomic(filepath.Join(dir, f.name), f.data); err != nil {
			return err
		}
	}
	return nil
}

func writeAtomic(path string, data []byte) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".tmp*")
	if err != nil {
		return err
	}
	defer os.Remove(tmp.Name()) // fails harmlessly after the rename
	if _, err := tmp.Write(data); err != nil {
		tmp.Close()
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Sync(); err != nil {
		tmp.Close()
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Chmod(0o644); err != nil {
		tmp.Close()
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Close(); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	return nil
}
