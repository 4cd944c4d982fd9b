package main

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
	"golang.org/x/text/unicode/norm"
)

// Language is one evaluation corpus of data/eval/udhr: the unsegmented
// transcripts, the reference words and the English translation of each
// line, and the spellings behind each phonemic word form.
type Language struct {
	Code string
	// Corpus is input.txt; Tokens[u] are the English tokens of its
	// utterance u, PriorTokens[u] the same without the stop words (what
	// the translation prior sees; glosses see Tokens), and Gold[u] the
	// reference words.
	Corpus      *segment.Corpus
	Tokens      [][]string
	PriorTokens [][]string
	Gold        [][]string
	// Reference is gold.txt read with its spaces as boundaries, the
	// segmentation a perfect learner would find; ReferenceTokens pairs its
	// utterances with their translations.
	Reference       *segment.Segmentation
	ReferenceTokens [][]string
	// Spellings maps a phonemic form to the spellings it stands for
	// (lexicon.tsv; homophones have several).
	Spellings map[string][]string
	// SentenceBreaks counts the translation lines with a sentence break
	// inside (". ", "; " or ": " before more text): the lines a
	// sentence-level alignment could split.
	SentenceBreaks int
}

// hasSentenceBreak reports whether line has ". ", "; " or ": " with
// text after it.
func hasSentenceBreak(line string) bool {
	line = strings.TrimSpace(line)
	for _, sep := range []string{". ", "; ", ": "} {
		if i := strings.Index(line, sep); i >= 0 && strings.TrimSpace(line[i+len(sep):]) != "" {
			return true
		}
	}
	return false
}

// LoadLanguage reads dir (data/eval/udhr/LANG). stop, if not nil, lists
// English tokens to drop from the translations the prior sees.
func LoadLanguage(dir string, stop map[string]bool) (*Language, error) {
	l := &Language{Code: filepath.Base(dir)}
	var err error
	if l.Corpus, err = readCorpus(filepath.Join(dir, "input.txt"), segment.ReadOptions{}); err != nil {
		return nil, err
	}
	name := filepath.Join(dir, "english.txt")
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	tr, err := align.ReadTranslations(f, name, nil)
	f.Close()
	if err != nil {
		return nil, err
	}
	if l.Tokens, err = tr.Select(l.Corpus.Lines); err != nil {
		return nil, err
	}
	l.PriorTokens = align.WithoutStopWords(l.Tokens, stop)
	raw, err := os.ReadFile(name)
	if err != nil {
		return nil, err
	}
	for _, line := range strings.Split(string(raw), "\n") {
		if hasSentenceBreak(line) {
			l.SentenceBreaks++
		}
	}
	goldName := filepath.Join(dir, "gold.txt")
	if l.Gold, err = readGold(goldName, l.Corpus.Lines); err != nil {
		return nil, err
	}
	ref, err := readCorpus(goldName, segment.ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		return nil, err
	}
	l.Reference = segment.NewSegmentation(ref)
	if l.ReferenceTokens, err = tr.Select(ref.Lines); err != nil {
		return nil, err
	}
	if l.Spellings, err = readLexicon(filepath.Join(dir, "lexicon.tsv")); err != nil {
		return nil, err
	}
	return l, nil
}

func readCorpus(name string, opts segment.ReadOptions) (*segment.Corpus, error) {
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	c, err := segment.ReadCorpus(f, name, opts)
	if err != nil {
		return nil, err
	}
	if c.Len() == 0 {
		return nil, fmt.Errorf("%s: no utterances", name)
	}
	return c, nil
}

// readGold returns the reference words of the given 1-based lines.
func readGold(name string, lines []int) ([][]string, error) {
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	utts, goldLines, err := score.ReadSegmented(f, name)
	if err != nil {
		return nil, err
	}
	byLine := make(map[int][]string, len(utts))
	for i, l := range goldLines {
		byLine[l] = utts[i]
	}
	out := make([][]string, len(lines))
	for i, l := range lines {
		words, ok := byLine[l]
		if !ok {
			return nil, fmt.Errorf("%s:%d: no reference words for this transcript line", name, l)
		}
		out[i] = words
	}
	return out, nil
}

// readLexicon reads spelling<TAB>phonemic form rows into form -> spellings.
func readLexicon(name string) (map[string][]string, error) {
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	m := map[string][]string{}
	sc := bufio.NewScanner(f)
	for line := 1; sc.Scan(); line++ {
		text := sc.Text()
		if text == "" {
			continue
		}
		spelling, form, ok := strings.Cut(text, "\t")
		if !ok || spelling == "" || form == "" || strings.Contains(form, "\t") {
			return nil, fmt.Errorf("%s:%d: want spelling<TAB>phonemic form", name, line)
		}
		form = norm.NFC.String(form)
		m[form] = append(m[form], norm.NFC.String(spelling))
	}
	if err := sc.Err(); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	return m, nil
}
