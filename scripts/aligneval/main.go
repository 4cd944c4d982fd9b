// Command aligneval measures what the translation prior (package align)
// does on the UDHR corpora of data/eval/udhr: it learns each language's
// segmentation with and without the prior, over several seeds, scores it
// against the gold words, and judges the glosses of the resulting lexicon
// against Debian's FreeDict bilingual dictionaries. It prints a markdown
// report.
//
// Usage (scripts/align-eval.sh installs the dictionaries and runs it):
//
//	go run ./scripts/aligneval [flags]
//
// The learner is configured as 'juncture learn' configures it (defaults,
// alpha0 3000 for the bigram model, burn-in 4/5 of the iterations), and
// the translation factor is built as 'juncture learn --translations' builds
// it: align.NewFactor(tokens, 1, words, 10, min-count) at every block. A
// weight of 0 means no factor at all: the run without the prior, which
// every other weight is compared with, seed for seed. -direction chooses
// the factor: forward is the one above; reverse (align.NewReverseFactor,
// P(words | translation), Brown et al.'s direction), ratio (reverse over
// the words' background) and both (forward times reverse) are built the
// same way, from the segmentation at every block with beta 1, 10 EM
// iterations and min-count, as are units (a token aligned to a unit of
// the utterance, not to a word: align.FactorOptions.Size), loo (each
// utterance scored with the table without its own counts:
// LeaveOneOut) and units-loo (both).
//
// Glosses come from lexicon.AddGlosses with its defaults on the decoded
// segmentation. Precision is measured on discovered types seen at least
// -gloss-min times; see Judge for the matching rules and GlossCounts for
// what is counted. The same is done on the gold segmentation, as a
// ceiling for the glossing step alone.
//
// Output does not depend on -procs: every run has its own random sources
// (segment.Run), and results are reported in a fixed order.
//
// The translation unit is the corpus line, a paragraph in data/eval/udhr.
// scripts/udhr-eval.sh --cut sentences|clauses DIR builds the same
// corpora cut where both sides have as many pieces; pass DIR as -data.
package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"time"
	"unicode/utf8"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
	"github.com/juncture-project/juncture/segment/score"
)

// options are the command-line settings.
type options struct {
	dataDir, dictDir, dictSet, out, details, stopWords string

	langs              []string
	seeds              []uint64
	models, samplers   []string
	directions         []string
	weights            []float64
	minCounts          []int
	iterations, chains int
	block              int
	procs              int
	glossMin, minStem  int
	nullUnits          float64
	glossesOnly        bool
	nuclei, pitmanYor  bool
	phonotactics       bool
	contrast           bool
	mismatch           bool
	commandLine        string
}

// Setting is one learner configuration. Weight 0 is the run without the
// translation prior; MinCount and Direction are then irrelevant and zero.
type Setting struct {
	Model, Sampler string
	Weight         float64
	MinCount       int
	// Direction is the translation factor's: see directions. The empty
	// string is forward.
	Direction string
}

// directions describes the translation factors -direction chooses from.
var directions = map[string]string{
	"forward":   "IBM Model 1 P(translation | words), as 'juncture learn' builds it (align.NewFactor)",
	"reverse":   "IBM Model 1 P(words | translation), Brown et al.'s direction (align.NewReverseFactor)",
	"ratio":     "reverse divided by each word's background probability (align.Reverse.Ratio)",
	"both":      "the product of forward and reverse",
	"units":     "forward with each token aligned to a unit of the utterance (or NULL) uniformly, not to a word (align.FactorOptions.Size)",
	"loo":       "forward with each utterance scored by the table estimated without it (align.FactorOptions.LeaveOneOut)",
	"units-loo": "units and loo together",
}

func (s Setting) baseline() bool { return s.Weight == 0 }

func (s Setting) String() string {
	if s.baseline() {
		return fmt.Sprintf("%s/%s, no prior", s.Model, s.Sampler)
	}
	d := ""
	if s.Direction != "" && s.Direction != "forward" {
		d = ", " + s.Direction
	}
	return fmt.Sprintf("%s/%s, weight %g, min-count %d%s", s.Model, s.Sampler, s.Weight, s.MinCount, d)
}

// config returns the learner settings of s for one seed.
func (s Setting) config(o *options, seed uint64) segment.Config {
	cfg := segment.DefaultConfig()
	cfg.Model = s.Model
	if cfg.Model == "bigram" {
		cfg.Alpha0 = 3000 // as 'juncture learn' starts the bigram model
	}
	cfg.Sampler = s.Sampler
	cfg.Iterations = o.iterations
	cfg.Burnin = o.iterations * 4 / 5
	if o.block > 0 {
		cfg.Block = o.block
	}
	cfg.Chains = o.chains
	cfg.Seed = seed
	cfg.TranslationWeight = s.Weight
	if !s.baseline() {
		cfg.TranslationMinCount = s.MinCount
	}
	return cfg
}

// Outcome is what one run gives.
type Outcome struct {
	Scores score.Scores
	Gloss  GlossCounts
	// Contrast is set with -contrast.
	Contrast Contrast
}

func main() {
	o, err := parseFlags(os.Args[1:])
	if err != nil {
		fmt.Fprintln(os.Stderr, "aligneval:", err)
		os.Exit(2)
	}
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	if err := run(ctx, o); err != nil {
		fmt.Fprintln(os.Stderr, "aligneval:", err)
		os.Exit(1)
	}
}

func parseFlags(args []string) (*options, error) {
	fs := flag.NewFlagSet("aligneval", flag.ContinueOnError)
	o := &options{}
	d := segment.DefaultConfig()
	var langs, seeds, models, samplers, weights, minCounts, dirs string
	fs.StringVar(&o.dataDir, "data", "", "directory holding one corpus per language (default: data/eval/udhr of the checkout)")
	fs.StringVar(&o.dictDir, "dict-dir", debianDictDir, "directory of the FreeDict dictd files")
	fs.StringVar(&o.dictSet, "dicts", "all", "dictionaries judging glosses: all (both directions where Debian has them) or one (one per language)")
	fs.StringVar(&langs, "langs", "spa,tur,ind,swh,fin", "languages, comma-separated")
	fs.StringVar(&seeds, "seeds", "1,2,3", "seeds, comma-separated; every setting runs with each")
	fs.StringVar(&models, "model", d.Model, "word models, comma-separated (unigram, bigram)")
	// The committed results were made with the boundary sampler, which
	// learn's "auto" also picks for the bigram model on these paragraphs.
	fs.StringVar(&samplers, "sampler", "boundary", "samplers, comma-separated (boundary, blocked, auto)")
	fs.StringVar(&weights, "weights", "0,1", "translation weights, comma-separated; 0 is the run without the prior and is always included")
	fs.StringVar(&minCounts, "min-count", strconv.Itoa(d.TranslationMinCount), "translation min-counts, comma-separated")
	fs.StringVar(&dirs, "direction", "forward", "translation factors, comma-separated: forward (P(translation | words)), reverse (P(words | translation)), ratio (reverse over the words' background) both (forward times reverse), units (forward, a token aligned to a unit), loo (forward, each utterance scored without its own counts) or units-loo")
	fs.Float64Var(&o.nullUnits, "null-units", 1, "with -direction units or units-loo: NULL's size in units")
	fs.IntVar(&o.iterations, "iterations", 300, "sweeps per chain")
	fs.IntVar(&o.block, "block", 0, "sweeps between re-estimations of the translation table (0: learn's default)")
	fs.IntVar(&o.chains, "chains", d.Chains, "chains per run")
	fs.IntVar(&o.procs, "procs", runtime.GOMAXPROCS(0), "most chains running at once")
	fs.IntVar(&o.glossMin, "gloss-min", 5, "judge the glosses of types seen at least this many times")
	fs.IntVar(&o.minStem, "min-stem", 4, "a spelling without a dictionary entry takes that of its longest prefix of at least this many characters (0: exact entries only)")
	fs.StringVar(&o.stopWords, "stop-words", "", "English words to drop from the translations the prior sees (glosses see them all), one per line, from `FILE`")
	fs.StringVar(&o.out, "out", "", "write the markdown report to `FILE` (atomically) instead of standard output")
	fs.StringVar(&o.details, "details", "", "write how each type of the gold segmentation's lexicon was judged to `FILE` (TSV)")
	fs.BoolVar(&o.nuclei, "nuclei", false, "make each language's IPA vowel letters (the units of its corpus that begin with one) syllable nuclei: every word must hold one")
	fs.BoolVar(&o.pitmanYor, "pitman-yor", false, "sample Pitman-Yor discounts instead of fixing them at 0")
	fs.BoolVar(&o.phonotactics, "phonotactics", false, "with -nuclei: the syllable-skeleton base whose word edges are learned from utterance edges")
	fs.BoolVar(&o.mismatch, "mismatch", false, "a control: the prior sees each line with the translation of the line half the corpus away (glosses keep the right ones)")
	fs.BoolVar(&o.contrast, "contrast", false, "also report how each run's word model and translation likelihood rate the gold segmentation against the learned one")
	fs.BoolVar(&o.glossesOnly, "glosses-only", false, "judge the glosses of the gold segmentation only; learn nothing")
	fs.Usage = func() {
		fmt.Fprintf(fs.Output(), "usage: aligneval [flags]\n\nLearns each UDHR corpus with and without the translation prior and writes a markdown report.\n\n")
		fs.PrintDefaults()
	}
	if err := fs.Parse(args); err != nil {
		return nil, err
	}
	if fs.NArg() > 0 {
		return nil, fmt.Errorf("unexpected arguments %q", fs.Args())
	}
	o.commandLine = strings.Join(append([]string{"aligneval"}, args...), " ")
	o.langs = splitList(langs)
	o.models = splitList(models)
	o.samplers = splitList(samplers)
	o.directions = splitList(dirs)
	for _, d := range o.directions {
		if directions[d] == "" {
			return nil, fmt.Errorf("-direction: unknown %q (forward, reverse, ratio, both, units, loo, units-loo)", d)
		}
	}
	var err error
	if o.seeds, err = parseList(seeds, func(s string) (uint64, error) { return strconv.ParseUint(s, 10, 64) }); err != nil {
		return nil, fmt.Errorf("-seeds: %w", err)
	}
	if o.weights, err = parseList(weights, func(s string) (float64, error) {
		w, err := strconv.ParseFloat(s, 64)
		if err == nil && !(w >= 0) {
			err = fmt.Errorf("weight %v is negative", w)
		}
		return w, err
	}); err != nil {
		return nil, fmt.Errorf("-weights: %w", err)
	}
	if o.minCounts, err = parseList(minCounts, strconv.Atoi); err != nil {
		return nil, fmt.Errorf("-min-count: %w", err)
	}
	switch {
	case len(o.langs) == 0 || len(o.seeds) == 0 || len(o.models) == 0 || len(o.samplers) == 0 || len(o.minCounts) == 0 || len(o.directions) == 0:
		return nil, errors.New("-langs, -seeds, -model, -sampler, -min-count and -direction need at least one value each")
	case o.procs < 1:
		return nil, fmt.Errorf("-procs must be at least 1, got %d", o.procs)
	case o.glossMin < 1:
		return nil, fmt.Errorf("-gloss-min must be at least 1, got %d", o.glossMin)
	case dictionaries[o.dictSet] == nil:
		return nil, fmt.Errorf("-dicts must be all or one, got %q", o.dictSet)
	}
	for _, m := range o.minCounts {
		if m < 0 {
			return nil, fmt.Errorf("-min-count: %d is negative", m)
		}
	}
	return o, nil
}

func splitList(s string) []string {
	var out []string
	for _, f := range strings.Split(s, ",") {
		if f = strings.TrimSpace(f); f != "" {
			out = append(out, f)
		}
	}
	return out
}

func parseList[T any](s string, parse func(string) (T, error)) ([]T, error) {
	var out []T
	for _, f := range splitList(s) {
		v, err := parse(f)
		if err != nil {
			return nil, err
		}
		out = append(out, v)
	}
	return out, nil
}

// settings returns the configurations to run: for each model and sampler
// the run without the prior, then one per direction, positive weight and
// min-count.
func (o *options) settings() []Setting {
	var out []Setting
	for _, m := range o.models {
		for _, s := range o.samplers {
			out = append(out, Setting{Model: m, Sampler: s})
			for _, w := range o.weights {
				if w == 0 {
					continue
				}
				for _, d := range o.directions {
					for _, mc := range o.minCounts {
						out = append(out, Setting{Model: m, Sampler: s, Weight: w, MinCount: mc, Direction: d})
					}
				}
			}
		}
	}
	return out
}

// findDataDir returns data/eval/udhr of the checkout holding the working
// directory.
func findDataDir() (string, error) {
	wd, err := os.Getwd()
	if err != nil {
		return "", err
	}
	for d := wd; ; d = filepath.Dir(d) {
		if _, err := os.Stat(filepath.Join(d, "go.mod")); err == nil {
			return filepath.Join(d, "data", "eval", "udhr"), nil
		}
		if filepath.Dir(d) == d {
			return "", fmt.Errorf("no go.mod at or above %s: give -data", wd)
		}
	}
}

// Report is everything the markdown report shows.
type Report struct {
	Options     *options
	Settings    []Setting
	Langs       []string
	Dicts       [][]string // per language, the databases used
	Units       []string   // per language, the size of the translation units
	Reference   []GlossCounts
	Outcomes    [][][]Outcome // [setting][language][seed]
	Elapsed     time.Duration
	MaxParallel int
}

func run(ctx context.Context, o *options) error {
	rep, err := buildReport(ctx, o)
	if err != nil {
		return err
	}
	if o.out == "" {
		return rep.WriteMarkdown(os.Stdout)
	}
	return atomicfile.Write(o.out, rep.WriteMarkdown)
}

// buildReport loads the corpora and dictionaries, judges the glosses of
// the gold segmentations, and learns every setting unless o.glossesOnly.
func buildReport(ctx context.Context, o *options) (*Report, error) {
	start := time.Now()
	if o.dataDir == "" {
		var err error
		if o.dataDir, err = findDataDir(); err != nil {
			return nil, err
		}
	}
	var stop map[string]bool
	if o.stopWords != "" {
		f, err := os.Open(o.stopWords)
		if err != nil {
			return nil, err
		}
		stop, err = align.ReadStopWords(f, o.stopWords)
		f.Close()
		if err != nil {
			return nil, err
		}
	}
	rep := &Report{Options: o, Langs: o.langs}
	langs := make([]*Language, len(o.langs))
	judges := make([]*Judge, len(o.langs))
	var details strings.Builder
	for i, code := range o.langs {
		l, err := LoadLanguage(filepath.Join(o.dataDir, code), stop)
		if err != nil {
			return nil, err
		}
		if o.mismatch {
			l.PriorTokens = mismatched(l.PriorTokens)
		}
		j, used, err := LoadJudge(o.dictDir, o.dictSet, code, o.minStem)
		if err != nil {
			return nil, err
		}
		langs[i], judges[i] = l, j
		rep.Dicts = append(rep.Dicts, used)
		tokens, most := 0, 0
		for _, t := range l.Tokens {
			tokens += len(t)
			most = max(most, len(t))
		}
		rep.Units = append(rep.Units, fmt.Sprintf("%d lines, %.1f English tokens per line (at most %d), %d lines with a sentence break inside",
			l.Corpus.Len(), float64(tokens)/float64(l.Corpus.Len()), most, l.SentenceBreaks))
		var detail func(glossDetail)
		if o.details != "" {
			detail = func(d glossDetail) { writeDetail(&details, code, d) }
		}
		rep.Reference = append(rep.Reference, EvalGlosses(l.Reference, nil, l.ReferenceTokens, l.Spellings, j, o.glossMin, detail))
	}
	if o.details != "" {
		err := atomicfile.Write(o.details, func(w io.Writer) error {
			_, err := io.WriteString(w, "language\tform\tcount\tspellings\tstatus\tglosses\n"+details.String())
			return err
		})
		if err != nil {
			return nil, err
		}
	}
	if !o.glossesOnly {
		rep.Settings = o.settings()
		var err error
		if rep.Outcomes, rep.MaxParallel, err = runAll(ctx, o, rep.Settings, langs, judges); err != nil {
			return nil, err
		}
	}
	rep.Elapsed = time.Since(start)
	return rep, nil
}

// job is one learning run.
type job struct {
	setting, lang, seed int
}

// runAll runs every setting on every language with every seed, at most
// o.procs chains at a time, and returns the outcomes by setting, language
// and seed, and how many runs went at once.
func runAll(ctx context.Context, o *options, settings []Setting, langs []*Language, judges []*Judge) ([][][]Outcome, int, error) {
	out := make([][][]Outcome, len(settings))
	var jobs []job
	for s := range settings {
		out[s] = make([][]Outcome, len(langs))
		for l := range langs {
			out[s][l] = make([]Outcome, len(o.seeds))
			for k := range o.seeds {
				jobs = append(jobs, job{s, l, k})
			}
		}
	}
	workers := max(1, o.procs/o.chains)
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()
	next := make(chan job)
	var (
		wg       sync.WaitGroup
		mu       sync.Mutex
		firstErr error
		done     int
	)
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for jb := range next {
				t := time.Now()
				s, l := settings[jb.setting], langs[jb.lang]
				res, err := runOne(ctx, o, s, l, judges[jb.lang], o.seeds[jb.seed])
				mu.Lock()
				if err != nil {
					if firstErr == nil {
						firstErr = fmt.Errorf("%s, %s, seed %d: %w", l.Code, s, o.seeds[jb.seed], err)
						cancel()
					}
				} else {
					out[jb.setting][jb.lang][jb.seed] = res
					done++
					fmt.Fprintf(os.Stderr, "aligneval: [%d/%d] %s, %s, seed %d: token F %.3f, boundary P %.3f R %.3f, P@1 %.2f (%d judged) in %s\n",
						done, len(jobs), l.Code, s, o.seeds[jb.seed], res.Scores.Token.F, res.Scores.Boundary.Precision, res.Scores.Boundary.Recall, res.Gloss.P1(), res.Gloss.Judged, time.Since(t).Round(time.Second))
				}
				mu.Unlock()
			}
		}()
	}
	for _, jb := range jobs {
		if ctx.Err() != nil {
			break
		}
		next <- jb
	}
	close(next)
	wg.Wait()
	if firstErr != nil {
		return nil, 0, firstErr
	}
	if err := ctx.Err(); err != nil {
		return nil, 0, err
	}
	return out, workers, nil
}

// runOne learns l under s with one seed and scores the result.
func runOne(ctx context.Context, o *options, s Setting, l *Language, j *Judge, seed uint64) (Outcome, error) {
	cfg := s.config(o, seed)
	if o.nuclei {
		cfg.Nuclei = ipaVowels(l.Corpus)
		cfg.Phonotactics = o.phonotactics
	}
	if o.pitmanYor {
		cfg.Fixed.Discount0, cfg.Fixed.Discount1 = false, false
	}
	var opts segment.RunOptions
	if !s.baseline() {
		opts.Factor = translationFactor(l.PriorTokens, cfg, s.Direction, o.nullUnits)
	}
	res, err := segment.Run(ctx, l.Corpus, cfg, nil, opts)
	if err != nil {
		return Outcome{}, err
	}
	pred := make([][]string, l.Corpus.Len())
	for u := range pred {
		pred[u] = res.Decoded.WordStrings(u)
	}
	sc, err := score.Compare(l.Gold, pred)
	if err != nil {
		return Outcome{}, err
	}
	out := Outcome{Scores: sc, Gloss: EvalGlosses(res.Decoded, res.Posterior, l.Tokens, l.Spellings, j, o.glossMin, nil)}
	if o.contrast {
		out.Contrast = contrast(l, cfg, res.Chains[0].Hyper, res.Decoded, seed)
	}
	return out, nil
}

// translationFactor builds the translation factor of the direction. The
// forward one is exactly what 'juncture learn --translations' builds
// (cmd/juncture/translations.go): the table is re-estimated by 10 EM
// iterations from the segmentation at the start of every block, with
// smoothing beta = 1. The others are built the same way.
func translationFactor(tokens [][]string, cfg segment.Config, direction string, nullUnits float64) segment.FactorBuilder {
	minCount := cfg.TranslationMinCount
	return func(words [][]int32, length func(int32) int) segment.UtteranceFactor {
		switch direction {
		case "units", "loo", "units-loo":
			o := align.FactorOptions{Beta: 1, Iterations: 10, MinOccurrences: minCount, LeaveOneOut: direction != "units"}
			if direction != "loo" {
				o.Size = func(w int32) float64 { return float64(length(w)) }
				o.NullSize = nullUnits
			}
			return align.NewFactorWith(tokens, words, o)
		case "reverse", "ratio":
			return align.NewReverseFactor(tokens, 1, words, 10, minCount, direction == "ratio")
		case "both":
			return productFactor{
				align.NewFactor(tokens, 1, words, 10, minCount),
				align.NewReverseFactor(tokens, 1, words, 10, minCount, false),
			}
		}
		return align.NewFactor(tokens, 1, words, 10, minCount)
	}
}

// productFactor is the product of two factors: its log is their sum.
type productFactor [2]segment.UtteranceFactor

func (p productFactor) SplitDelta(u int, w, w1, w2 int32) float64 {
	return p[0].SplitDelta(u, w, w1, w2) + p[1].SplitDelta(u, w, w1, w2)
}

func (p productFactor) JoinDelta(u int, w1, w2, w int32) float64 {
	return p[0].JoinDelta(u, w1, w2, w) + p[1].JoinDelta(u, w1, w2, w)
}

func (p productFactor) Split(u int, w, w1, w2 int32) {
	p[0].Split(u, w, w1, w2)
	p[1].Split(u, w, w1, w2)
}

func (p productFactor) Join(u int, w1, w2, w int32) {
	p[0].Join(u, w1, w2, w)
	p[1].Join(u, w1, w2, w)
}

func (p productFactor) Delta(u int, words []int32) float64 {
	return p[0].Delta(u, words) + p[1].Delta(u, words)
}

func (p productFactor) Set(u int, words []int32) {
	p[0].Set(u, words)
	p[1].Set(u, words)
}

// ipaVowelLetters are the vowel letters of the IPA chart (International
// Phonetic Association), with the r-coloured ɚ and ɝ.
const ipaVowelLetters = "iyɨʉɯuɪʏʊeøɘɵɤoəɛœɜɞʌɔæɐaɶɑɒɚɝ"

// ipaVowels returns the units of c that begin with an IPA vowel letter,
// such as a or aː: the nuclei of -nuclei.
func ipaVowels(c *segment.Corpus) []string {
	var out []string
	for _, u := range c.Inventory {
		if r, _ := utf8.DecodeRuneInString(u); strings.ContainsRune(ipaVowelLetters, r) {
			out = append(out, u)
		}
	}
	return out
}

// mismatched returns the translations rotated by half their number, so
// that no line of more than one keeps its own: with them the prior keeps
// its form (the same tokens, the same lengths, the same table sizes) but
// says nothing true about any line, which separates what a factor gains
// from the translations' content from what it gains from its shape alone.
func mismatched(tokens [][]string) [][]string {
	n := len(tokens)
	out := make([][]string, n)
	for u := range tokens {
		out[u] = tokens[(u+n/2)%n]
	}
	return out
}
