package main

import (
	"fmt"
	"io"

	"github.com/juncture-project/juncture/segment"
	"github.com/urfave/cli/v2"
)

func learnCommand() *cli.Command {
	d := segment.DefaultConfig()
	return &cli.Command{
		Name:      "learn",
		Usage:     "propose word boundaries for unsegmented transcripts",
		ArgsUsage: "INPUT",
		Description: "Reads INPUT (a file, or - for standard input): one utterance per line, no word\n" +
			"boundaries. Writes one segmented line per utterance, words separated by single\n" +
			"spaces, to standard output or --out. A progress bar goes to standard error.\n\n" +
			"Example:\n   juncture learn --seed 3 --iterations 1000 --out words.txt transcripts.txt",
		Flags: append([]cli.Flag{
			&cli.StringFlag{Name: "model", Value: d.Model, Usage: "word model: unigram or bigram (hierarchical)"},
			&cli.IntFlag{Name: "iterations", Value: d.Iterations, Usage: "Gibbs sweeps over the corpus (annealed from temperature 10 to 1)"},
			&cli.Uint64Flag{Name: "seed", Value: d.Seed, Usage: "random seed; the same input and seed give the same output"},
			&cli.Float64Flag{Name: "alpha0", Value: d.Alpha0, Usage: "Dirichlet-process concentration: larger values favour new word types"},
			&cli.Float64Flag{Name: "alpha1", Value: d.Alpha1, Usage: "bigram model: concentration of each word's successor distribution"},
			&cli.Float64Flag{Name: "discount0", Usage: "Pitman-Yor discount of the unigram level (0: Dirichlet process)"},
			&cli.Float64Flag{Name: "discount1", Usage: "Pitman-Yor discount of the bigram level (0: Dirichlet process)"},
			&cli.Float64Flag{Name: "word-end", Value: d.WordEnd, Usage: "base distribution's probability p# of ending a word after each unit"},
			&cli.Float64Flag{Name: "rho", Value: d.Rho, Usage: "pseudo-count of the Beta prior on utterance ends"},
			&cli.StringFlag{Name: "out", Aliases: []string{"o"}, Usage: "write the segmentation to `FILE` (atomically) instead of standard output"},
			&cli.BoolFlag{Name: "quiet", Aliases: []string{"q"}, Usage: "no progress bar"},
		}, unitFlags()...),
		Action: runLearn,
	}
}

func runLearn(ctx *cli.Context) error {
	c, err := readCorpusArg(ctx)
	if err != nil {
		return err
	}
	cfg := segment.DefaultConfig()
	cfg.Model = ctx.String("model")
	cfg.Iterations = ctx.Int("iterations")
	cfg.Seed = ctx.Uint64("seed")
	cfg.Alpha0 = ctx.Float64("alpha0")
	cfg.Alpha1 = ctx.Float64("alpha1")
	cfg.Discount0 = ctx.Float64("discount0")
	cfg.Discount1 = ctx.Float64("discount1")
	cfg.WordEnd = ctx.Float64("word-end")
	cfg.Rho = ctx.Float64("rho")
	if err := cfg.Validate(); err != nil {
		return err
	}
	bar := newProgress(ctx.App.ErrWriter, cfg.Iterations, fmt.Sprintf("learning %d utterances", c.Len()), ctx.Bool("quiet"))
	if bar != nil {
		cfg.Progress = func(int, float64) { bar.Add(1) }
	}
	seg, err := segment.Learn(ctx.Context, c, cfg)
	if err != nil {
		return err
	}
	return writeOutput(ctx, func(w io.Writer) error { return seg.Write(w) })
}
