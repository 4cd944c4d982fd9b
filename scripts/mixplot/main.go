// Command mixplot compares how fast the two samplers climb towards the
// posterior: it runs the boundary sampler (one gap at a time) and the
// blocked sampler (one utterance at a time) on the same corpus, model and
// seed, from the same random first segmentation, and plots the log joint
// probability of segmentation and seating (segment.Words.LogJoint) against
// wall-clock seconds for both, as a PNG.
//
// Usage, from anywhere in the checkout:
//
//	go run ./scripts/mixplot -out mixing.png
//	go run ./scripts/mixplot -corpus udhr/spa -model unigram -sweeps 100 -out spa.png -tsv spa.tsv
//
// Both samplers run at temperature 1 with the hyperparameters fixed at
// their usual starting values (alpha0 20 for the unigram model, 3000 for
// the bigram model; alpha1 100; p# 0.5; rho 2), so the log joint is the
// same function for both throughout and the curves compare the samplers
// alone: with annealing the curves would follow the temperature schedule,
// and with sampled hyperparameters each chain's target would move. The
// clock counts building the model from the first segmentation and the
// sweeps, not computing the log joint.
//
// The English corpus ../shared/corpora/cds-english/gold.txt (spaces
// removed) is the default; without it mixplot falls back to udhr/spa and
// says so. Given the seed, every sampled state, and so every log joint
// after every sweep, is determined; only the times vary, and with -seconds
// the number of sweeps. The plot is written atomically.
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"

	"github.com/juncture-project/juncture/scripts/internal/evalcorpus"
	"github.com/juncture-project/juncture/segment"
)

func main() {
	if err := run(os.Args[1:], os.Stderr); err != nil {
		fmt.Fprintln(os.Stderr, "mixplot:", err)
		if errors.Is(err, flag.ErrHelp) {
			os.Exit(2)
		}
		os.Exit(1)
	}
}

// samplers are the samplers compared, in plotting order.
var samplers = []string{"boundary", "blocked"}

func run(args []string, stderr io.Writer) error {
	d := segment.DefaultConfig()
	fs := flag.NewFlagSet("mixplot", flag.ContinueOnError)
	fs.SetOutput(stderr)
	corpus := fs.String("corpus", evalcorpus.EnglishName, "corpus `NAME`: cds-english or udhr/LANG")
	lines := fs.Int("lines", 2000, "use the first `N` utterances (0: all)")
	model := fs.String("model", "bigram", "word model: unigram or bigram")
	base := fs.String("base", d.Base, "base distribution: uniform or ngram")
	seed := fs.Uint64("seed", 1, "random seed")
	sweeps := fs.Int("sweeps", 200, "sweeps per sampler")
	seconds := fs.Float64("seconds", 0, "also stop a sampler once it has run this many seconds (0: no limit; makes the number of sweeps depend on the machine)")
	maxWordLen := fs.Int("max-word-length", d.MaxWordLength, "blocked sampler: longest word proposed, in units (0: no limit)")
	alpha0 := fs.Float64("alpha0", 0, "unigram concentration (default 20 for the unigram model, 3000 for the bigram model)")
	alpha1 := fs.Float64("alpha1", d.Alpha1, "bigram concentration")
	wordEnd := fs.Float64("word-end", d.WordEnd, "word-end probability p# of the uniform base")
	out := fs.String("out", "mixing.png", "write the plot to `FILE` (PNG)")
	tsv := fs.String("tsv", "", "also write the traces to `FILE` as TSV (sampler, sweep, seconds, log joint)")
	root := fs.String("root", "", "repository root (default: the nearest directory at or above the working directory holding go.mod)")
	fs.Usage = func() {
		fmt.Fprintln(fs.Output(), "Usage: mixplot [flags]\n\nPlots the log joint probability against wall-clock seconds for the boundary\nand the blocked sampler on the same corpus, model and seed.\n\nFlags:")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return err
	}
	if fs.NArg() > 0 {
		return fmt.Errorf("unexpected arguments: %q", fs.Args())
	}
	s := settings{Model: *model, Base: *base, NgramOrder: d.NgramOrder, Alpha0: *alpha0, Alpha1: *alpha1,
		WordEnd: *wordEnd, Rho: d.Rho, MaxWordLength: *maxWordLen, Sweeps: *sweeps, Seconds: *seconds, Seed: *seed}
	if s.Alpha0 == 0 {
		s.Alpha0 = 20
		if s.Model == "bigram" {
			s.Alpha0 = 3000
		}
	}
	if err := s.validate(); err != nil {
		return err
	}

	if *root == "" {
		wd, err := os.Getwd()
		if err != nil {
			return err
		}
		if *root, err = evalcorpus.Root(wd); err != nil {
			return err
		}
	}
	all, missing, err := evalcorpus.Find(*root)
	if err != nil {
		return err
	}
	src, err := pick(all, *corpus, missing, stderr)
	if err != nil {
		return err
	}
	utts, err := evalcorpus.Load(src, *lines)
	if err != nil {
		return err
	}
	c, err := evalcorpus.Corpus(src.Name, utts)
	if err != nil {
		return err
	}
	initial := segment.RandomSegmentation(c, d.InitialBoundary, segment.NewRand(s.Seed, 0)).Boundary

	traces := make([][]point, len(samplers))
	for i, name := range samplers {
		if traces[i], err = trace(c, initial, name, s); err != nil {
			return err
		}
		t := traces[i]
		last := t[len(t)-1]
		fmt.Fprintf(stderr, "mixplot: %s: %d sweeps in %.1f s, log joint %.1f after building, %.1f at the end\n",
			name, last.Sweep, last.Seconds, t[0].LogProb, last.LogProb)
	}
	title := fmt.Sprintf("%s, %d utterances, %s model, %s base, seed %d", src.Name, c.Len(), s.Model, s.Base, s.Seed)
	if err := writePlot(*out, title, samplers, traces); err != nil {
		return err
	}
	if *tsv != "" {
		if err := writeTSV(*tsv, samplers, traces); err != nil {
			return err
		}
	}
	return nil
}

// pick returns the source named name, falling back from the English
// corpus, when absent, to udhr/spa.
func pick(sources []evalcorpus.Source, name string, missing []string, stderr io.Writer) (evalcorpus.Source, error) {
	selected, skipped, err := evalcorpus.Select(sources, name)
	if err != nil {
		return evalcorpus.Source{}, err
	}
	if len(skipped) > 0 {
		for _, m := range missing {
			fmt.Fprintln(stderr, "mixplot:", m)
		}
		fmt.Fprintln(stderr, "mixplot: using udhr/spa instead")
		if selected, _, err = evalcorpus.Select(sources, "udhr/spa"); err != nil {
			return evalcorpus.Source{}, err
		}
	}
	if len(selected) != 1 {
		return evalcorpus.Source{}, fmt.Errorf("-corpus: give exactly one corpus, not %q", name)
	}
	return selected[0], nil
}

// validate reports the first setting out of range.
func (s settings) validate() error {
	switch {
	case s.Model != "unigram" && s.Model != "bigram":
		return fmt.Errorf("unknown model %q (want unigram or bigram)", s.Model)
	case s.Base != "uniform" && s.Base != "ngram":
		return fmt.Errorf("unknown base %q (want uniform or ngram)", s.Base)
	case s.Sweeps < 1:
		return fmt.Errorf("sweeps must be at least 1, got %d", s.Sweeps)
	case s.MaxWordLength < 0:
		return fmt.Errorf("maximum word length must be 0 (none) or positive, got %d", s.MaxWordLength)
	case !(s.Alpha0 > 0) || !(s.Alpha1 > 0):
		return fmt.Errorf("concentrations must be positive, got alpha0 %v, alpha1 %v", s.Alpha0, s.Alpha1)
	case !(s.WordEnd > 0 && s.WordEnd < 1):
		return fmt.Errorf("word-end probability must be in (0,1), got %v", s.WordEnd)
	}
	return nil
}
