package main

import (
	"bytes"
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"runtime"
	"slices"
	"testing"

	"github.com/juncture-project/juncture/scripts/internal/evalcorpus"
	"github.com/juncture-project/juncture/segment/score"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

// TestMain lets the test binary stand in for the program as the child
// process of runChild.
func TestMain(m *testing.M) {
	if len(os.Args) == 2 && os.Args[1] == childArg {
		if err := childMain(os.Stdin, os.Stdout); err != nil {
			fmt.Fprintln(os.Stderr, err)
			os.Exit(1)
		}
		os.Exit(0)
	}
	os.Exit(m.Run())
}

func TestParseConfigs(t *testing.T) {
	tests := []struct {
		in   string
		want []runConfig
		err  bool
	}{
		{in: "unigram/boundary", want: []runConfig{{"unigram", "boundary", "uniform"}}},
		{in: "unigram/boundary, bigram/blocked/ngram", want: []runConfig{{"unigram", "boundary", "uniform"}, {"bigram", "blocked", "ngram"}}},
		{in: "unigram", err: true},
		{in: "a/b/c/d", err: true},
	}
	for _, tt := range tests {
		got, err := parseConfigs(tt.in)
		if (err != nil) != tt.err || !slices.Equal(got, tt.want) {
			t.Errorf("parseConfigs(%q) = %v, %v; want %v, error %v", tt.in, got, err, tt.want, tt.err)
		}
	}
}

func TestParseFlags(t *testing.T) {
	o, err := parseFlags([]string{"-iterations", "10", "-seeds", "3,1", "-scale", "1,4", "-tsv"}, &bytes.Buffer{})
	if err != nil {
		t.Fatal(err)
	}
	if o.burnin != 8 || !slices.Equal(o.seeds, []uint64{3, 1}) || !slices.Equal(o.scales, []int{1, 4}) || o.format != "tsv" {
		t.Errorf("parsed %+v", o)
	}
	cfg := o.config(runConfig{"bigram", "blocked", "uniform"}, 3)
	if cfg.Alpha0 != 3000 || cfg.Seed != 3 || cfg.Iterations != 10 || cfg.Burnin != 8 || cfg.Sampler != "blocked" {
		t.Errorf("bigram config %+v", cfg)
	}
	// A start from the reference segmentation is sampled at temperature 1:
	// annealing from temperature 10 would destroy it in the first sweeps.
	o, err = parseFlags([]string{"-iterations", "10", "-start", "gold"}, &bytes.Buffer{})
	if err != nil {
		t.Fatal(err)
	}
	if cfg := o.config(runConfig{"unigram", "blocked", "uniform"}, 1); cfg.Burnin != 0 || o.start != "gold" {
		t.Errorf("-start gold: burn-in %d, start %q", cfg.Burnin, o.start)
	}
	for _, args := range [][]string{
		{"-json", "-tsv"},
		{"-scale", "0,4"},
		{"-seeds", "x"},
		{"-configs", "trigram/boundary"},
		{"-configs", "unigram/boundary/letters"},
		{"-iterations", "5", "-burnin", "5"},
		{"extra"},
	} {
		if _, err := parseFlags(args, &bytes.Buffer{}); err == nil {
			t.Errorf("parseFlags(%q): no error", args)
		}
	}
}

func TestSummarize(t *testing.T) {
	tests := []struct {
		xs   []float64
		want stat
	}{
		{nil, stat{}},
		{[]float64{0.5}, stat{0.5, 0}},
		// Sample variance of 1,2,3,4: (2.25+0.25+0.25+2.25)/3 = 5/3.
		{[]float64{1, 2, 3, 4}, stat{2.5, math.Sqrt(5.0 / 3)}},
	}
	for _, tt := range tests {
		got := summarize(tt.xs)
		if math.Abs(got.Mean-tt.want.Mean) > 1e-12 || math.Abs(got.SD-tt.want.SD) > 1e-12 {
			t.Errorf("summarize(%v) = %+v, want %+v", tt.xs, got, tt.want)
		}
	}
}

// fakeResult is a result of learning with the given token F (boundary and
// lexicon F derived from it) or, with f < 0, of a scale run.
func fakeResult(corpus, model, sampler string, scale int, seed uint64, units int, f, seconds float64, peakKB int64) result {
	j := job{Mode: "learn", Source: evalcorpus.Source{Name: corpus}, Scale: scale}
	j.Config = (&options{iterations: 100, burnin: 80, chains: 1, maxWordLen: 24}).config(runConfig{model, sampler, "uniform"}, seed)
	r := result{Job: j, Utterances: units / 10, Units: units, Seconds: seconds, SecondsPerSweep: seconds / 100, CPUSecondsPerSweep: seconds / 200, PeakKB: peakKB}
	if f >= 0 {
		r.Scores = &score.Scores{Token: score.PRF{F: f}, Boundary: score.PRF{F: f + 0.2}, Lexicon: score.PRF{F: f / 2}}
		r.Scores.Counts.Token.Predicted = units / 3
		r.LogJoint = -f * float64(units)
	} else {
		r.Job.Mode = "scale"
	}
	return r
}

func learnResults() []result {
	return []result{
		fakeResult("cds-english", "unigram", "boundary", 1, 1, 1000, 0.60, 10, 20480),
		fakeResult("cds-english", "unigram", "boundary", 1, 2, 1000, 0.64, 12, 20480),
		fakeResult("cds-english", "bigram", "blocked", 1, 1, 1000, 0.70, 30, 40960),
		fakeResult("cds-english", "bigram", "blocked", 1, 2, 1000, 0.72, 34, 43008),
		fakeResult("udhr/spa", "unigram", "boundary", 1, 1, 500, 0.20, 1, 10240),
		fakeResult("udhr/spa", "unigram", "boundary", 1, 2, 500, 0.30, 1.5, 10240),
	}
}

func scaleResults() []result {
	return []result{
		fakeResult("udhr/spa", "unigram", "boundary", 1, 1, 1000, -1, 1, 10240),
		fakeResult("udhr/spa", "unigram", "boundary", 4, 1, 4000, -1, 4.4, 20480),
		fakeResult("udhr/spa", "unigram", "boundary", 16, 1, 16000, -1, 20, 61440),
		fakeResult("udhr/spa", "unigram", "blocked", 1, 1, 1000, -1, 3, 10240),
		fakeResult("udhr/spa", "unigram", "blocked", 4, 1, 4000, -1, 12, 20480),
	}
}

func TestAggregate(t *testing.T) {
	rows := aggregate(learnResults())
	if len(rows) != 3 {
		t.Fatalf("%d rows, want 3", len(rows))
	}
	r := rows[0]
	if r.Corpus != "cds-english" || r.Model != "unigram" || !slices.Equal(r.Seeds, []uint64{1, 2}) {
		t.Errorf("first row %+v", r)
	}
	if math.Abs(r.TokenF.Mean-0.62) > 1e-12 || math.Abs(r.Seconds.Mean-11) > 1e-12 || r.PeakMiB.Mean != 20 || r.Ratio != 0 {
		t.Errorf("first row token F %+v, seconds %+v, peak %+v, ratio %v", *r.TokenF, r.Seconds, r.PeakMiB, r.Ratio)
	}
	rows = aggregate(scaleResults())
	// Per unit per sweep: 1/1000/100 s at 1x; 4.4/4000/100 at 4x (1.1
	// times); 20/16000/100 at 16x (1.25 times); blocked 12/4000 against
	// 3/1000 (1.0).
	want := []float64{1, 1.1, 1.25, 1, 1}
	for i, r := range rows {
		if r.TokenF != nil || math.Abs(r.Ratio-want[i]) > 1e-9 || math.Abs(r.CPURatio-want[i]) > 1e-9 {
			t.Errorf("scale row %d: ratio %v, CPU ratio %v, want %v (token F %v)", i, r.Ratio, r.CPURatio, want[i], r.TokenF)
		}
	}
}

func TestWriteRows(t *testing.T) {
	tests := []struct {
		name, mode, format string
		results            []result
	}{
		{"learn.txt", "learn", "text", learnResults()},
		{"learn.tsv", "learn", "tsv", learnResults()},
		{"learn.json", "learn", "json", learnResults()},
		{"scale.txt", "scale", "text", scaleResults()},
		{"scale.tsv", "scale", "tsv", scaleResults()},
		{"single-seed.txt", "learn", "text", learnResults()[2:3]},
	}
	for _, tt := range tests {
		var buf bytes.Buffer
		if err := writeRows(&buf, aggregate(tt.results), tt.mode, tt.format); err != nil {
			t.Fatal(err)
		}
		path := filepath.Join("testdata", tt.name)
		if *update {
			if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		want, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		if !bytes.Equal(buf.Bytes(), want) {
			t.Errorf("%s: got\n%s\nwant\n%s", tt.name, buf.Bytes(), want)
		}
	}
	if err := writeRows(&bytes.Buffer{}, nil, "learn", "xml"); err == nil {
		t.Error("no error for an unknown format")
	}
}

// TestRunChild runs a learn job and a scale job on a tiny corpus in a
// child process (this test binary, through TestMain).
func TestRunChild(t *testing.T) {
	dir := t.TempDir()
	gold := filepath.Join(dir, "gold.txt")
	text := "the dog\nthe cat\na dog\nthe dog saw a cat\na cat saw the dog\n"
	if err := os.WriteFile(gold, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	self, err := os.Executable()
	if err != nil {
		t.Fatal(err)
	}
	o := &options{iterations: 4, burnin: 2, chains: 2, maxWordLen: 8}
	for _, mode := range []string{"learn", "scale"} {
		j := job{Mode: mode, Source: evalcorpus.Source{Name: "tiny", Gold: gold}, Lines: 4, Scale: 3,
			Config: o.config(runConfig{"bigram", "blocked", "uniform"}, 1)}
		res, err := runChild(self, j, os.Stderr)
		if err != nil {
			t.Fatalf("%s: %v", mode, err)
		}
		utts, units := 4, 6+6+4+13 // "thedog thecat adog thedogsawacat"
		if mode == "scale" {
			utts, units = 12, 3*29
		}
		if res.Utterances != utts || res.Units != units {
			t.Errorf("%s: %d utterances, %d units; want %d, %d", mode, res.Utterances, res.Units, utts, units)
		}
		if (res.Scores != nil) != (mode == "learn") {
			t.Errorf("%s: scores %v", mode, res.Scores)
		}
		if res.Scores != nil && res.Scores.Utterances != 4 {
			t.Errorf("%s: scored %d utterances, want 4", mode, res.Scores.Utterances)
		}
		if !(res.SecondsPerSweep > 0 && res.SecondsPerSweep <= res.Seconds) {
			t.Errorf("%s: %v s per sweep of %v s", mode, res.SecondsPerSweep, res.Seconds)
		}
		if !(res.LogJoint < 0) {
			t.Errorf("%s: log joint %v, want a log probability below 0", mode, res.LogJoint)
		}
		if res.CPUSecondsPerSweep < 0 || res.CPUSecondsPerSweep > res.SecondsPerSweep*float64(runtime.NumCPU())+0.05 {
			t.Errorf("%s: %v CPU s per sweep with %v s wall on %d CPUs", mode, res.CPUSecondsPerSweep, res.SecondsPerSweep, runtime.NumCPU())
		}
		if runtime.GOOS == "linux" && res.PeakKB <= 0 {
			t.Errorf("%s: peak memory %d KiB", mode, res.PeakKB)
		}
	}
	j := job{Mode: "learn", Source: evalcorpus.Source{Name: "missing", Gold: filepath.Join(dir, "none.txt")},
		Config: o.config(runConfig{"unigram", "boundary", "uniform"}, 1)}
	if _, err := runChild(self, j, &bytes.Buffer{}); err == nil {
		t.Error("no error for a missing corpus")
	}
}
