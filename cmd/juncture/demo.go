package main

import (
	"bytes"
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/data/demo"
	"github.com/juncture-project/juncture/lexicon"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
	"github.com/urfave/cli/v2"
)

func demoCommand() *cli.Command {
	return &cli.Command{
		Name:  "demo",
		Usage: "run the whole job on the embedded demo corpus of an invented language",
		Description: "Learns word boundaries for 720 transcribed utterances of Kelaru, a language\n" +
			"invented for this demo (see data/demo/README.md), scores the result against the\n" +
			"corpus's gold segmentation and lists the most frequent words found, with how sure\n" +
			"the sampler is of their edges and whether the invented lexicon has them.",
		Flags: []cli.Flag{
			&cli.StringFlag{Name: "model", Value: "bigram", Usage: "word model: unigram, bigram or collocation"},
			&cli.StringFlag{Name: "nuclei", Value: "i e a o u aː", Usage: "units that can be syllable nuclei, separated by spaces (Kelaru's vowels); every word must hold one. Empty: no constraint"},
			&cli.BoolFlag{Name: "phonotactics", Usage: "with --nuclei: prefer words that begin and end with the runs of units that begin and end utterances"},
			&cli.Float64Flag{Name: "translation-weight", Value: 0, Usage: "weight of the English translations as a prior on segmenting (0: used for glosses only)"},
			&cli.IntFlag{Name: "iterations", Value: 200, Usage: "Gibbs sweeps per chain"},
			&cli.IntFlag{Name: "chains", Value: 2, Usage: "independent chains, pooled"},
			&cli.Uint64Flag{Name: "seed", Value: 1, Usage: "random seed"},
			&cli.IntFlag{Name: "top", Value: 20, Usage: "how many of the most frequent words to list"},
			&cli.BoolFlag{Name: "quiet", Aliases: []string{"q"}, Usage: "no progress bar"},
		},
		Action: runDemo,
	}
}

func runDemo(ctx *cli.Context) error {
	out := ctx.App.Writer
	if top := ctx.Int("top"); top < 0 {
		return fmt.Errorf("--top must be at least 0, got %d", top)
	}
	c, err := segment.ReadCorpus(bytes.NewReader(demo.Input()), "demo/input.txt", segment.ReadOptions{})
	if err != nil {
		return err
	}
	cfg := segment.DefaultConfig()
	cfg.Model = ctx.String("model")
	if cfg.Model == "bigram" {
		cfg.Alpha0 = 3000
	}
	cfg.Nuclei = strings.Fields(ctx.String("nuclei"))
	cfg.Phonotactics = ctx.Bool("phonotactics")
	cfg.Iterations = ctx.Int("iterations")
	cfg.Burnin = cfg.Iterations * 4 / 5
	cfg.Chains = ctx.Int("chains")
	cfg.Seed = ctx.Uint64("seed")
	if err := cfg.Validate(); err != nil {
		return err
	}
	fmt.Fprintf(out, "Kelaru demo: %d utterances of an invented language (%d units, %d distinct).\n",
		c.Len(), len(c.Units), len(c.Inventory))
	cfg.TranslationWeight = ctx.Float64("translation-weight")
	if err := cfg.Validate(); err != nil {
		return err
	}
	tr, err := align.ReadTranslations(bytes.NewReader(demo.Translations()), "demo/translations.txt", nil)
	if err != nil {
		return err
	}
	tokens, err := tr.Select(c.Lines)
	if err != nil {
		return err
	}
	var factor segment.FactorBuilder
	if cfg.TranslationWeight > 0 {
		factor = translationFactor(tokens, cfg)
	}
	fmt.Fprintf(out, "Learning with the %s model, %d chain(s) of %d sweeps", cfg.Model, cfg.Chains, cfg.Iterations)
	if len(cfg.Nuclei) > 0 {
		fmt.Fprintf(out, ", every word holding one of %s", strings.Join(cfg.Nuclei, " "))
	}
	fmt.Fprintln(out, "...")
	bar := newProgress(ctx.App.ErrWriter, cfg.Iterations*cfg.Chains, "learning", ctx.Bool("quiet"))
	var progress func()
	if bar != nil {
		progress = func() { bar.Add(1) }
	}
	res, err := segment.Run(ctx.Context, c, cfg, nil, segment.RunOptions{Progress: progress, Factor: factor})
	if err != nil {
		return err
	}

	gold, _, err := score.ReadSegmented(bytes.NewReader(demo.Gold()), "demo/gold.txt")
	if err != nil {
		return err
	}
	pred := make([][]string, c.Len())
	for u := range pred {
		pred[u] = res.Decoded.WordStrings(u)
	}
	s, err := score.Compare(gold, pred)
	if err != nil {
		return err
	}
	fmt.Fprintln(out, "\nAgainst the gold segmentation:")
	if err := s.WriteTable(out); err != nil {
		return err
	}

	fmt.Fprintln(out, "\nFirst utterances, as segmented (gold on the right):")
	var rows [][]string
	for u := 0; u < min(5, c.Len()); u++ {
		rows = append(rows, []string{strings.Join(pred[u], " "), strings.Join(gold[u], " ")})
	}
	if err := writeColumns(out, "  ", 4, rows); err != nil {
		return err
	}

	entries := demo.Entries()
	gloss := map[string]string{}
	for _, e := range entries {
		gloss[e.Form] = e.Gloss
	}
	lex := lexicon.Build(res.Decoded, res.Posterior)
	lexicon.AddGlosses(lex, res.Decoded, tokens, lexicon.DefaultGlossOptions())
	fmt.Fprintf(out, "\n%d word types found. The %d most frequent:\n", len(lex), min(ctx.Int("top"), len(lex)))
	return writeDemoLexicon(out, lex[:min(ctx.Int("top"), len(lex))], gloss)
}

func writeDemoLexicon(w io.Writer, lex []lexicon.Entry, gloss map[string]string) error {
	rows := [][]string{{"word", "count", "confidence", "glosses learned from the translations", "in the invented lexicon"}}
	for _, e := range lex {
		known := "no"
		if g, ok := gloss[e.Form]; ok {
			known = "yes: " + g
		}
		var learned []string
		for _, g := range e.Glosses {
			learned = append(learned, g.Word)
		}
		if len(learned) == 0 {
			learned = []string{"-"}
		}
		rows = append(rows, []string{e.Form, strconv.Itoa(e.Count), strconv.FormatFloat(e.Confidence, 'f', 2, 64), strings.Join(learned, ", "), known})
	}
	return writeColumns(w, "  ", 2, rows)
}
