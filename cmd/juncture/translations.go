package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"maps"
	"os"
	"slices"
	"strings"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
	"github.com/urfave/cli/v2"
)

// translationFlags are the flags of the translation prior.
func translationFlags() []cli.Flag {
	d := segment.DefaultConfig()
	return []cli.Flag{
		&cli.StringFlag{Name: "translations", Usage: "free translations, line-aligned with INPUT, from `FILE`: they give the --lexicon its glosses and, with --translation-weight above 0, favour words that recur with the same translation words"},
		&cli.Float64Flag{Name: "translation-weight", Value: d.TranslationWeight, Usage: "exponent of the translation factor on segmenting; 0 uses translations for glosses only (on the UDHR corpora weight 1 raised the bigram model's token F by 0.02 and lowered the unigram model's; see README.md)"},
		&cli.IntFlag{Name: "translation-min-count", Value: d.TranslationMinCount, Usage: "a word's translation associations count only once it has been seen this many times"},
		&cli.BoolFlag{Name: "translation-leave-one-out", Value: d.TranslationLeaveOneOut, Usage: "score each line's translation with the table learned from the other lines (--translation-leave-one-out=false: from all lines, the published IBM Model 1 table)"},
		&cli.StringFlag{Name: "stop-words", Usage: "translation words the translation factor ignores, one per line, from `FILE` (# starts a comment; glosses still see them; data/stopwords/english.txt is one for English)"},
		&cli.BoolFlag{Name: "tsv", Usage: "INPUT is tab-separated with a header row holding a transcript and a translation column"},
		&cli.StringFlag{Name: "transcript-column", Value: "transcript", Usage: "with --tsv: the header `NAME` of the transcript column"},
		&cli.StringFlag{Name: "translation-column", Value: "translation", Usage: "with --tsv: the header `NAME` of the translation column"},
	}
}

// lineCounter counts the lines passing through a reader, the way
// ReadCorpus numbers them (a last line without a newline counts).
type lineCounter struct {
	r     io.Reader
	lines int
	last  byte
}

func (lc *lineCounter) Read(p []byte) (int, error) {
	n, err := lc.r.Read(p)
	lc.lines += bytes.Count(p[:n], []byte{'\n'})
	if n > 0 {
		lc.last = p[n-1]
	}
	return n, err
}

func (lc *lineCounter) total() int {
	if lc.last != 0 && lc.last != '\n' {
		return lc.lines + 1
	}
	return lc.lines
}

// readInput reads INPUT (plain transcripts, or --tsv) and, when the run has
// them, each utterance's translation tokens.
func readInput(ctx *cli.Context) (*segment.Corpus, [][]string, error) {
	input, err := oneArgument(ctx, "INPUT")
	if err != nil {
		return nil, nil, err
	}
	opts, err := readOptions(ctx)
	if err != nil {
		return nil, nil, err
	}
	r, name, err := openInput(input)
	if err != nil {
		return nil, nil, err
	}
	defer r.Close()
	if ctx.Bool("tsv") {
		if ctx.IsSet("translations") {
			return nil, nil, errors.New("--tsv takes the translations from INPUT; drop --translations")
		}
		return readTSV(r, name, opts, align.TSVColumns{
			Transcript: ctx.String("transcript-column"), Translation: ctx.String("translation-column")})
	}
	lc := &lineCounter{r: r}
	c, err := segment.ReadCorpus(lc, name, opts)
	if err != nil {
		return nil, nil, err
	}
	if c.Len() == 0 {
		return nil, nil, fmt.Errorf("%s: no utterances", name)
	}
	tname := ctx.String("translations")
	if tname == "" {
		return c, nil, nil
	}
	f, err := os.Open(tname)
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	tr, err := align.ReadTranslations(f, tname, nil)
	if err != nil {
		return nil, nil, err
	}
	if tr.Len() != lc.total() {
		return nil, nil, fmt.Errorf("%s has %d lines but %s has %d: translations must be line-aligned with the transcripts",
			name, lc.total(), tname, tr.Len())
	}
	tokens, err := tr.Select(c.Lines)
	return c, tokens, err
}

// readTSV reads transcripts and translations from one tab-separated file.
func readTSV(r io.Reader, name string, opts segment.ReadOptions, cols align.TSVColumns) (*segment.Corpus, [][]string, error) {
	bt, err := align.ReadTSV(r, name, cols, nil)
	if err != nil {
		return nil, nil, err
	}
	c, err := segment.ReadCorpus(strings.NewReader(strings.Join(bt.Transcripts, "\n")), name, opts)
	if err != nil {
		var pe *segment.PositionError
		if errors.As(err, &pe) && pe.Line >= 1 && pe.Line <= len(bt.Lines) {
			pe.Line = bt.Lines[pe.Line-1] // row number -> file line
		}
		return nil, nil, err
	}
	if c.Len() == 0 {
		return nil, nil, fmt.Errorf("%s: no utterances", name)
	}
	tokens, err := bt.Translations.Select(c.Lines) // rows, 1-based
	if err != nil {
		return nil, nil, err
	}
	for u := range c.Lines {
		c.Lines[u] = bt.Lines[c.Lines[u]-1]
	}
	return c, tokens, nil
}

// readStopWords returns the sorted words of the --stop-words file, nil
// without one.
func readStopWords(ctx *cli.Context) ([]string, error) {
	name := ctx.String("stop-words")
	if name == "" {
		return nil, nil
	}
	f, err := os.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	stop, err := align.ReadStopWords(f, name)
	if err != nil {
		return nil, err
	}
	return slices.Sorted(maps.Keys(stop)), nil
}

// translationFactor returns the factor builder of the translation prior
// for translation tokens (all of them: the stop words of cfg are dropped
// here). The table is re-estimated by 10 EM iterations from the
// segmentation at the start of every block, with smoothing beta = 1.
func translationFactor(tokens [][]string, cfg segment.Config) segment.FactorBuilder {
	if tokens == nil || cfg.TranslationWeight == 0 {
		return nil // glosses only: the factor would multiply by 1
	}
	if len(cfg.TranslationStopWords) > 0 {
		stop := make(map[string]bool, len(cfg.TranslationStopWords))
		for _, w := range cfg.TranslationStopWords {
			stop[w] = true
		}
		tokens = align.WithoutStopWords(tokens, stop)
	}
	o := align.FactorOptions{Beta: 1, Iterations: 10, MinOccurrences: cfg.TranslationMinCount, LeaveOneOut: cfg.TranslationLeaveOneOut}
	return func(words [][]int32, _ func(int32) int) segment.UtteranceFactor {
		return align.NewFactorWith(tokens, words, o)
	}
}
