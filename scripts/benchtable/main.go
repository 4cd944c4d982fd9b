// Command benchtable runs learning configurations on the evaluation corpora
// and prints a table of accuracy, time and memory: for each corpus, model,
// base and sampler, the token, boundary and lexicon F of the decoded
// segmentation against the reference, the wall-clock seconds of learning,
// and the peak resident memory.
//
// Usage, from anywhere in the checkout:
//
//	go run ./scripts/benchtable [flags]
//	go run ./scripts/benchtable -configs bigram/blocked -iterations 1000 -seeds 1,2,3
//	go run ./scripts/benchtable -scale 1,4,16 -lines 2000 -iterations 20
//
// Corpora are the English corpus ../shared/corpora/cds-english/gold.txt
// beside the repository (read in place, never copied; skipped with a
// message when absent), learned from its lines with the spaces removed and
// scored against the lines as they are, and each data/eval/udhr/LANG
// (input.txt learned, gold.txt the reference).
//
// Each run is a separate process (the program starts itself again), so the
// peak resident set size the kernel reports for it (getrusage's ru_maxrss)
// is that run's alone: reading the corpus, learning, decoding and scoring.
// The seconds are those of segment.Run only. Settings are
// segment.DefaultConfig with the model, base and sampler of the
// configuration, the burn-in at 4/5 of the iterations and, for the bigram
// model, alpha0 starting at 3000, as `juncture learn` does; every
// hyperparameter is sampled.
//
// With -seeds 1,2,3 every configuration runs once per seed and the table
// gives the mean and the sample standard deviation over seeds (mean±sd).
//
// With -scale 1,4,16 the program measures how cost grows with corpus size
// instead: each corpus (cut to -lines) is repeated k times in an order
// shuffled by a PCG source seeded with the run's seed, and the table gives
// seconds per sweep (the wall-clock time from the end of the first sweep
// to the end of the last, over the sweeps between: hyperparameter
// sampling, traces and block rebuilds included, the first model building
// and decoding not), nanoseconds per unit per sweep, their ratio to the
// smallest scale (1.0 for cost linear in corpus size; ratios above 1.3 are
// reported on standard error) and peak memory. The 1x corpus is shuffled
// too, so scales differ only in size. Give -iterations of at least 20 or
// so: the annealing schedule and the first blocks make short runs
// unrepresentative.
//
// Everything but the times and memory is determined by the seeds.
package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"strconv"
	"strings"

	"github.com/juncture-project/juncture/scripts/internal/evalcorpus"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
)

func main() {
	if len(os.Args) == 2 && os.Args[1] == childArg {
		if err := childMain(os.Stdin, os.Stdout); err != nil {
			fmt.Fprintln(os.Stderr, "benchtable (child):", err)
			os.Exit(1)
		}
		return
	}
	if err := run(os.Args[1:], os.Stdout, os.Stderr); err != nil {
		fmt.Fprintln(os.Stderr, "benchtable:", err)
		if errors.Is(err, flag.ErrHelp) {
			os.Exit(2)
		}
		os.Exit(1)
	}
}

// options are the parsed flags.
type options struct {
	configs    []runConfig
	iterations int
	burnin     int
	chains     int
	maxWordLen int
	seeds      []uint64
	corpora    string
	lines      int
	scales     []int
	start      string
	format     string
	out        string
	root       string
}

// runConfig is one configuration of the -configs list.
type runConfig struct {
	Model, Sampler, Base string
}

func parseFlags(args []string, stderr io.Writer) (*options, error) {
	fs := flag.NewFlagSet("benchtable", flag.ContinueOnError)
	fs.SetOutput(stderr)
	configs := fs.String("configs", "unigram/boundary,bigram/boundary,bigram/blocked", "comma-separated `MODEL/SAMPLER[/BASE]` configurations (models unigram, bigram, collocation (blocked only); samplers boundary, blocked; bases uniform, ngram)")
	iterations := fs.Int("iterations", 200, "sweeps per chain")
	burnin := fs.Int("burnin", -1, "sweeps of burn-in, annealed (default 4/5 of -iterations)")
	chains := fs.Int("chains", 1, "chains per run (run in parallel and pooled)")
	maxWordLen := fs.Int("max-word-length", segment.DefaultConfig().MaxWordLength, "blocked sampler: longest word proposed, in units (0: no limit)")
	seeds := fs.String("seeds", "1", "comma-separated random `SEEDS`; the table gives mean±sd over them")
	corpora := fs.String("corpora", "all", "comma-separated corpus `NAMES` (cds-english, udhr/fin, ...) or all")
	lines := fs.Int("lines", 0, "use the first `N` utterances of each corpus (0: all)")
	start := fs.String("start", "random", "first segmentation of each chain: random, or gold (the reference, sampled at temperature 1 without burn-in: the cost per sweep near the posterior, where the lexicon does not grow with copies of the corpus as a random segmentation's does)")
	scales := fs.String("scale", "", "measure cost against corpus size at these comma-separated multiples (e.g. 1,4,16) instead of accuracy")
	jsonOut := fs.Bool("json", false, "print JSON instead of a table")
	tsvOut := fs.Bool("tsv", false, "print tab-separated values with a header instead of a table")
	out := fs.String("out", "", "write the table to `FILE` (atomically) instead of standard output")
	root := fs.String("root", "", "repository root (default: the nearest directory at or above the working directory holding go.mod)")
	fs.Usage = func() {
		fmt.Fprintln(fs.Output(), "Usage: benchtable [flags]\n\nRuns learning configurations on the evaluation corpora and prints F scores,\nseconds and peak memory, or with -scale the cost per sweep against corpus size.\n\nFlags:")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return nil, err
	}
	if fs.NArg() > 0 {
		return nil, fmt.Errorf("unexpected arguments: %q", fs.Args())
	}
	o := &options{iterations: *iterations, burnin: *burnin, chains: *chains, maxWordLen: *maxWordLen,
		corpora: *corpora, lines: *lines, out: *out, root: *root, format: "text"}
	switch {
	case *jsonOut && *tsvOut:
		return nil, errors.New("give at most one of -json and -tsv")
	case *jsonOut:
		o.format = "json"
	case *tsvOut:
		o.format = "tsv"
	}
	switch *start {
	case "random":
	case "gold":
		o.burnin = 0
	default:
		return nil, fmt.Errorf("-start: want random or gold, got %q", *start)
	}
	o.start = *start
	if o.burnin < 0 {
		o.burnin = o.iterations * 4 / 5
	}
	var err error
	if o.configs, err = parseConfigs(*configs); err != nil {
		return nil, err
	}
	if o.seeds, err = parseList(*seeds, func(s string) (uint64, error) { return strconv.ParseUint(s, 10, 64) }); err != nil {
		return nil, fmt.Errorf("-seeds: %w", err)
	}
	if *scales != "" {
		if o.scales, err = parseList(*scales, strconv.Atoi); err != nil {
			return nil, fmt.Errorf("-scale: %w", err)
		}
		for _, k := range o.scales {
			if k < 1 {
				return nil, fmt.Errorf("-scale: multiples must be at least 1, got %d", k)
			}
		}
	}
	for _, rc := range o.configs {
		if err := o.config(rc, o.seeds[0]).Validate(); err != nil {
			return nil, fmt.Errorf("configuration %s: %w", rc, err)
		}
	}
	return o, nil
}

func (rc runConfig) String() string { return rc.Model + "/" + rc.Sampler + "/" + rc.Base }

// parseConfigs parses a comma-separated list of MODEL/SAMPLER[/BASE].
func parseConfigs(s string) ([]runConfig, error) {
	var out []runConfig
	for item := range strings.SplitSeq(s, ",") {
		parts := strings.Split(strings.TrimSpace(item), "/")
		if len(parts) < 2 || len(parts) > 3 {
			return nil, fmt.Errorf("-configs: %q is not MODEL/SAMPLER or MODEL/SAMPLER/BASE", item)
		}
		rc := runConfig{Model: parts[0], Sampler: parts[1], Base: "uniform"}
		if len(parts) == 3 {
			rc.Base = parts[2]
		}
		out = append(out, rc)
	}
	return out, nil
}

// parseList parses a non-empty comma-separated list.
func parseList[T any](s string, parse func(string) (T, error)) ([]T, error) {
	var out []T
	for item := range strings.SplitSeq(s, ",") {
		v, err := parse(strings.TrimSpace(item))
		if err != nil {
			return nil, err
		}
		out = append(out, v)
	}
	return out, nil
}

// config returns the learner's settings for rc with seed.
func (o *options) config(rc runConfig, seed uint64) segment.Config {
	cfg := segment.DefaultConfig()
	cfg.Model, cfg.Sampler, cfg.Base = rc.Model, rc.Sampler, rc.Base
	if cfg.Model == "bigram" {
		cfg.Alpha0 = 3000 // as `juncture learn` starts it
	}
	cfg.Iterations, cfg.Burnin, cfg.Chains = o.iterations, o.burnin, o.chains
	cfg.MaxWordLength = o.maxWordLen
	cfg.Seed = seed
	return cfg
}

func run(args []string, stdout, stderr io.Writer) error {
	o, err := parseFlags(args, stderr)
	if err != nil {
		return err
	}
	if o.root == "" {
		wd, err := os.Getwd()
		if err != nil {
			return err
		}
		if o.root, err = evalcorpus.Root(wd); err != nil {
			return err
		}
	}
	all, missing, err := evalcorpus.Find(o.root)
	if err != nil {
		return err
	}
	sources, skipped, err := evalcorpus.Select(all, o.corpora)
	if err != nil {
		return err
	}
	if o.corpora == "all" || o.corpora == "" || len(skipped) > 0 {
		for _, m := range missing { // only the English corpus can be missing
			fmt.Fprintln(stderr, "benchtable:", m)
		}
	}
	if len(sources) == 0 {
		return errors.New("no corpora to run on")
	}
	self, err := os.Executable()
	if err != nil {
		return err
	}

	mode, scales := "learn", []int{1}
	if o.scales != nil {
		mode, scales = "scale", o.scales
	}
	var results []result
	for _, src := range sources {
		for _, rc := range o.configs {
			for _, k := range scales {
				for _, seed := range o.seeds {
					j := job{Mode: mode, Source: src, Lines: o.lines, Scale: k, Start: o.start, Config: o.config(rc, seed)}
					res, err := runChild(self, j, stderr)
					if err != nil {
						return fmt.Errorf("%s %s scale %d seed %d: %w", src.Name, rc, k, seed, err)
					}
					fmt.Fprintln(stderr, res.summary())
					results = append(results, res)
				}
			}
		}
	}
	rows := aggregate(results)
	var buf bytes.Buffer
	if err := writeRows(&buf, rows, mode, o.format); err != nil {
		return err
	}
	if mode == "scale" {
		for _, r := range rows {
			if r.Ratio > linearTolerance || r.CPURatio > linearTolerance {
				fmt.Fprintf(stderr, "benchtable: %s %s/%s/%s at %dx costs %.2f times (CPU time: %.2f times) as much per unit as at the smallest scale (more than %.1f)\n",
					r.Corpus, r.Model, r.Sampler, r.Base, r.Scale, r.Ratio, r.CPURatio, linearTolerance)
			}
		}
	}
	if o.out == "" {
		_, err = stdout.Write(buf.Bytes())
		return err
	}
	return atomicfile.WriteBytes(o.out, buf.Bytes())
}

// linearTolerance is the largest ratio of per-unit cost to that at the
// smallest scale still read as linear scaling (the Speed issue's bound).
const linearTolerance = 1.3
