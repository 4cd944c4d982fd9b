package main

import (
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/juncture-project/juncture/lexicon"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
	"github.com/juncture-project/juncture/segment/state"
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
			"Hyperparameters (alpha0, alpha1, word-end, and with --pitman-yor the discounts)\n" +
			"are sampled from vague priors; giving one on the command line fixes it there.\n\n" +
			"With --state DIR the run keeps checkpoints in DIR; after an interruption,\n" +
			"'juncture learn --state DIR --resume' continues it and ends with exactly the output\n" +
			"an uninterrupted run gives.\n\n" +
			"Examples:\n" +
			"   juncture learn --seed 3 --out words.txt transcripts.txt\n" +
			"   juncture learn --model bigram --chains 2 --posteriors gaps.tsv transcripts.txt\n" +
			"   juncture learn --model collocation --nuclei \"a e i o u\" transcripts.txt",
		Flags: append([]cli.Flag{
			&cli.StringFlag{Name: "model", Value: d.Model, Usage: "word model: unigram, bigram (hierarchical: each word's successors back off to the unigram), or collocation (utterances are sequences of collocations, recurring groups of words, drawn from a process over word sequences whose words come from a unigram; --alpha0/--discount0 then set the word level, --alpha1/--discount1 the collocation level)"},
			&cli.StringFlag{Name: "base", Value: d.Base, Usage: "distribution of new word forms: uniform (all units equally likely) or ngram (learns which units follow which)"},
			&cli.IntFlag{Name: "ngram-order", Value: d.NgramOrder, Usage: "order of the ngram base (units of context + 1)"},
			&cli.StringFlag{Name: "sampler", Value: d.Sampler, Usage: "boundary (Gibbs sampling one gap at a time), blocked (one utterance at a time, forward filtering and backward sampling), or auto: blocked, except boundary for the bigram model without --nuclei when utterances average more than 12 units (long utterances make bigram lattices expensive)"},
			&cli.StringFlag{Name: "proposal", Value: d.Proposal, Usage: "blocked sampler with the bigram model: draw whole-utterance proposals from the bigram model itself (bigram), or from its unigram level (unigram: cheaper sweeps, but many more rejections, so slower to mix)"},
			&cli.StringFlag{Name: "nuclei", Usage: "units that can be syllable nuclei (usually the vowels), separated by spaces, e.g. \"a e i o u\": every word must then hold one (uniform base). Leave unset for languages with words without vowels"},
			&cli.BoolFlag{Name: "phonotactics", Usage: "with --nuclei: read each word as syllables (a nucleus with the runs of other units around it) and prefer words that begin and end with the runs of units that begin and end utterances"},
			&cli.Float64Flag{Name: "phonotactics-beta", Value: d.PhonotacticsBeta, Usage: "with --phonotactics: how strongly the run distributions are smoothed toward an uninformed one, in pseudo-counts (0: fit each to the corpus by maximum marginal likelihood)"},
			&cli.IntFlag{Name: "max-word-length", Value: d.MaxWordLength, Usage: "blocked sampler: longest word proposed, in units (0: no limit)"},
			&cli.IntFlag{Name: "iterations", Value: d.Iterations, Usage: "sweeps over the corpus per chain (each sampler visits every gap or utterance once per sweep)"},
			&cli.IntFlag{Name: "burnin", Usage: "sweeps before samples count towards boundary probabilities; annealing from temperature 10 to 1 runs over them", DefaultText: "half of --iterations; with --converge at most 50"},
			&cli.Float64Flag{Name: "converge", Usage: "stop sampling once the chains agree, checked every --block sweeps after burn-in (at least two blocks of samples): split R-hat of their word counts below `RHAT` (e.g. 1.05) and, with several chains, boundary probabilities within RHAT-1 of each other; --iterations is then a cap", DefaultText: "off"},
			&cli.IntFlag{Name: "chains", Value: d.Chains, Usage: "independent chains, run in parallel and pooled"},
			&cli.Uint64Flag{Name: "seed", Value: d.Seed, Usage: "random seed; the same input, settings and seed give the same output"},
			&cli.Float64Flag{Name: "alpha0", Usage: "fix the unigram concentration (sampled otherwise; starts at 20, bigram 3000)", DefaultText: "sampled"},
			&cli.Float64Flag{Name: "alpha1", Usage: "fix the bigram concentration (sampled otherwise; starts at 100)", DefaultText: "sampled"},
			&cli.BoolFlag{Name: "pitman-yor", Usage: "sample Pitman-Yor discounts for the word levels instead of fixing them at 0 (Dirichlet processes)"},
			&cli.Float64Flag{Name: "discount0", Usage: "fix the unigram Pitman-Yor discount at this value", DefaultText: "0, sampled with --pitman-yor"},
			&cli.Float64Flag{Name: "discount1", Usage: "fix the bigram Pitman-Yor discount at this value", DefaultText: "0, sampled with --pitman-yor"},
			&cli.Float64Flag{Name: "word-end", Usage: "fix the base distribution's word-end probability p# (sampled otherwise; starts at 0.5)", DefaultText: "sampled"},
			&cli.StringFlag{Name: "out", Aliases: []string{"o"}, Usage: "write the segmentation to `FILE` (atomically) instead of standard output"},
			&cli.StringFlag{Name: "posteriors", Usage: "write every gap's boundary probability to `FILE` as TSV (columns line, offset, unit, left, right, probability)"},
			&cli.StringFlag{Name: "lexicon", Usage: "write the lexicon of the segmentation to `FILE` (TSV: form, count, confidence, glosses from --translations, example lines)"},
			&cli.StringFlag{Name: "state", Usage: "keep the run's settings, corpus, checkpoints and results in `DIR`"},
			&cli.BoolFlag{Name: "resume", Usage: "continue the run in --state DIR from its last checkpoint (INPUT and model flags are taken from DIR)"},
			&cli.IntFlag{Name: "block", Value: d.Block, Usage: "sweeps between checkpoints (each chain's model is rebuilt from its sample at every block)"},
			&cli.BoolFlag{Name: "quiet", Aliases: []string{"q"}, Usage: "no progress bar"},
		}, append(unitFlags(), translationFlags()...)...),
		Action: runLearn,
	}
}

// learnConfig builds the run's settings from the flags.
func learnConfig(ctx *cli.Context) (segment.Config, error) {
	cfg := segment.DefaultConfig()
	cfg.Model = ctx.String("model")
	if cfg.Model == "bigram" {
		cfg.Alpha0 = 3000
	}
	cfg.Base = ctx.String("base")
	cfg.NgramOrder = ctx.Int("ngram-order")
	cfg.Sampler = ctx.String("sampler")
	cfg.Proposal = ctx.String("proposal")
	cfg.MaxWordLength = ctx.Int("max-word-length")
	cfg.Iterations = ctx.Int("iterations")
	cfg.Converge = ctx.Float64("converge")
	cfg.Burnin = segment.DefaultBurnin(cfg.Iterations)
	if cfg.Converge > 0 {
		// --iterations is a cap then: anneal as a default run does, not
		// over half of the cap.
		cfg.Burnin = min(cfg.Burnin, segment.DefaultConfig().Burnin)
	}
	if ctx.IsSet("burnin") {
		cfg.Burnin = ctx.Int("burnin")
	}
	cfg.Chains = ctx.Int("chains")
	cfg.Block = ctx.Int("block")
	cfg.Seed = ctx.Uint64("seed")
	if ctx.Bool("pitman-yor") {
		cfg.Fixed.Discount0, cfg.Fixed.Discount1 = false, false
	}
	set := func(name string, v *float64, fixed *bool) {
		if ctx.IsSet(name) {
			*v, *fixed = ctx.Float64(name), true
		}
	}
	set("alpha0", &cfg.Alpha0, &cfg.Fixed.Alpha0)
	set("alpha1", &cfg.Alpha1, &cfg.Fixed.Alpha1)
	set("discount0", &cfg.Discount0, &cfg.Fixed.Discount0)
	set("discount1", &cfg.Discount1, &cfg.Fixed.Discount1)
	set("word-end", &cfg.WordEnd, &cfg.Fixed.WordEnd)
	cfg.Nuclei = strings.Fields(ctx.String("nuclei"))
	cfg.Phonotactics = ctx.Bool("phonotactics")
	cfg.PhonotacticsBeta = ctx.Float64("phonotactics-beta")
	cfg.TranslationWeight = ctx.Float64("translation-weight")
	cfg.TranslationMinCount = ctx.Int("translation-min-count")
	cfg.TranslationLeaveOneOut = ctx.Bool("translation-leave-one-out")
	stop, err := readStopWords(ctx)
	if err != nil {
		return cfg, err
	}
	cfg.TranslationStopWords = stop
	return cfg, cfg.Validate()
}

// resumeFlags are the learn flags that --resume accepts: what to write
// and where, not how to learn.
var resumeFlags = map[string]bool{"state": true, "resume": true, "out": true, "posteriors": true, "lexicon": true, "quiet": true}

func runLearn(ctx *cli.Context) error {
	dir := ctx.String("state")
	var (
		c      *segment.Corpus
		cfg    segment.Config
		states []*segment.ChainState
		tokens [][]string
		err    error
	)
	inputs := []namedPath{{"--translations", ctx.String("translations")}, {"--units", ctx.String("units")}, {"--stop-words", ctx.String("stop-words")}}
	if !ctx.Bool("resume") {
		inputs = append(inputs, namedPath{"INPUT", ctx.Args().First()})
	}
	if err := checkOutputs(ctx, inputs); err != nil {
		return err
	}
	if ctx.Bool("resume") {
		if dir == "" {
			return errors.New("--resume needs --state DIR")
		}
		// Every setting comes from DIR; only where the results go may be
		// given again. Deriving the list from the flags keeps a new flag
		// from being silently ignored on --resume.
		for _, fl := range ctx.Command.Flags {
			f := fl.Names()[0]
			if !resumeFlags[f] && ctx.IsSet(f) {
				return fmt.Errorf("--%s cannot be changed on --resume: the settings come from %s", f, dir)
			}
		}
		if ctx.NArg() > 0 {
			return fmt.Errorf("--resume reads the corpus from %s; give no INPUT", dir)
		}
		var settings state.Settings
		c, settings, states, err = state.Open(dir)
		if err != nil {
			return err
		}
		cfg = settings.Config
		if tokens, err = state.Translations(dir, c); err != nil {
			return err
		}
		for i, st := range states {
			if st == nil { // killed before this chain's first checkpoint
				states[i] = segment.InitialState(c, cfg, i)
			}
		}
	} else {
		if cfg, err = learnConfig(ctx); err != nil {
			return err
		}
		if c, tokens, err = readInput(ctx); err != nil {
			return err
		}
		if dir != "" {
			if err := state.Create(dir, c, cfg, ctx.Args().First(), tokens); err != nil {
				return err
			}
		}
	}
	done := 0
	for _, st := range states {
		done += st.Iteration
	}
	bar := newProgress(ctx.App.ErrWriter, cfg.Iterations*cfg.Chains-done,
		fmt.Sprintf("%s, %d utterances, %d chain(s)", cfg.Model, c.Len(), cfg.Chains), ctx.Bool("quiet"))
	var progress func()
	if bar != nil {
		progress = func() { bar.Add(1) }
	}
	var checkpoint func(*segment.ChainState) error
	if dir != "" {
		checkpoint = func(st *segment.ChainState) error { return state.SaveChain(dir, st) }
	}
	res, err := segment.Run(ctx.Context, c, cfg, states, segment.RunOptions{Progress: progress, Checkpoint: checkpoint, Factor: translationFactor(tokens, cfg)})
	if err != nil {
		return err
	}
	if dir != "" {
		if err := state.SaveResult(dir, res); err != nil {
			return err
		}
	}
	if p := ctx.String("posteriors"); p != "" {
		if err := atomicfile.Write(p, func(w io.Writer) error { return state.WritePosteriors(w, c, res.Posterior) }); err != nil {
			return err
		}
	}
	if p := ctx.String("lexicon"); p != "" {
		lex := lexicon.Build(res.Decoded, res.Posterior)
		if tokens != nil {
			lexicon.AddGlosses(lex, res.Decoded, tokens, lexicon.DefaultGlossOptions())
		}
		if err := atomicfile.Write(p, func(w io.Writer) error { return lexicon.WriteTSV(w, lex) }); err != nil {
			return err
		}
	}
	return writeOutput(ctx, res.Decoded.Write)
}
