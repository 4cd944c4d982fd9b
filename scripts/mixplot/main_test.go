package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/juncture-project/juncture/scripts/internal/evalcorpus"
	"github.com/juncture-project/juncture/segment"
)

func tinyCorpus(t *testing.T) *segment.Corpus {
	t.Helper()
	var utts []evalcorpus.Utterance
	for _, line := range []string{"thedog", "thecat", "adog", "thedogsawacat", "acatsawthedog", "lookatthedog"} {
		utts = append(utts, evalcorpus.Utterance{Text: line})
	}
	c, err := evalcorpus.Corpus("tiny", utts)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

func testSettings(model string) settings {
	return settings{Model: model, Base: "uniform", NgramOrder: 3, Alpha0: 20, Alpha1: 100, WordEnd: 0.5, Rho: 2,
		MaxWordLength: 0, Sweeps: 5, Seed: 3}
}

// TestTrace checks that both samplers start from the same state (same
// segmentation, same seating draws), record every sweep, leave the initial
// segmentation alone, and give the same log joints when run again.
func TestTrace(t *testing.T) {
	c := tinyCorpus(t)
	for _, model := range []string{"unigram", "bigram"} {
		s := testSettings(model)
		initial := segment.RandomSegmentation(c, 0.5, segment.NewRand(s.Seed, 0)).Boundary
		kept := append([]bool(nil), initial...)
		var first []float64
		for _, name := range samplers {
			pts, err := trace(c, initial, name, s)
			if err != nil {
				t.Fatal(err)
			}
			if len(pts) != s.Sweeps+1 {
				t.Fatalf("%s %s: %d points, want %d", model, name, len(pts), s.Sweeps+1)
			}
			for k, pt := range pts {
				if pt.Sweep != k || math.IsNaN(pt.LogProb) || math.IsInf(pt.LogProb, 0) || pt.LogProb >= 0 {
					t.Errorf("%s %s: point %d = %+v", model, name, k, pt)
				}
				if k > 0 && pt.Seconds < pts[k-1].Seconds {
					t.Errorf("%s %s: clock went back at sweep %d", model, name, k)
				}
			}
			first = append(first, pts[0].LogProb)
			again, err := trace(c, initial, name, s)
			if err != nil {
				t.Fatal(err)
			}
			for k := range pts {
				if again[k].LogProb != pts[k].LogProb {
					t.Errorf("%s %s: sweep %d gave log joint %v, then %v", model, name, k, pts[k].LogProb, again[k].LogProb)
				}
			}
		}
		if first[0] != first[1] {
			t.Errorf("%s: samplers start from log joints %v", model, first)
		}
		for i := range kept {
			if kept[i] != initial[i] {
				t.Fatalf("%s: trace changed the initial segmentation", model)
			}
		}
	}
	if _, err := trace(c, make([]bool, len(c.Units)), "other", testSettings("unigram")); err == nil {
		t.Error("no error for an unknown sampler")
	}
}

func TestValidate(t *testing.T) {
	good := testSettings("bigram")
	if err := good.validate(); err != nil {
		t.Fatal(err)
	}
	for _, change := range []func(*settings){
		func(s *settings) { s.Model = "trigram" },
		func(s *settings) { s.Base = "letters" },
		func(s *settings) { s.Sweeps = 0 },
		func(s *settings) { s.MaxWordLength = -1 },
		func(s *settings) { s.Alpha0 = 0 },
		func(s *settings) { s.WordEnd = 1 },
	} {
		s := good
		change(&s)
		if s.validate() == nil {
			t.Errorf("no error for %+v", s)
		}
	}
}

func TestFormatTSV(t *testing.T) {
	traces := [][]point{
		{{0, 0.001, -100.25}, {1, 0.5, -90}},
		{{0, 0.002, -100.25}},
	}
	got := formatTSV([]string{"boundary", "blocked"}, traces)
	want := "sampler\tsweep\tseconds\tlog_joint\n" +
		"boundary\t0\t0.001000\t-100.2500\n" +
		"boundary\t1\t0.500000\t-90.0000\n" +
		"blocked\t0\t0.002000\t-100.2500\n"
	if got != want {
		t.Errorf("got\n%s\nwant\n%s", got, want)
	}
}

func TestShortTicks(t *testing.T) {
	for _, tk := range (shortTicks{}).Ticks(0, 0.7) {
		if strings.Contains(tk.Label, "0000") {
			t.Errorf("tick label %q", tk.Label)
		}
	}
}

// TestRun draws the plot and writes the TSV for a few sweeps of the
// first lines of a UDHR corpus of the repository.
func TestRun(t *testing.T) {
	dir := t.TempDir()
	png, tsv := filepath.Join(dir, "mix.png"), filepath.Join(dir, "mix.tsv")
	var stderr bytes.Buffer
	err := run([]string{"-corpus", "udhr/spa", "-lines", "3", "-model", "unigram", "-sweeps", "2",
		"-out", png, "-tsv", tsv}, &stderr)
	if err != nil {
		t.Fatalf("%v\n%s", err, stderr.String())
	}
	data, err := os.ReadFile(png)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(data, []byte("\x89PNG\r\n\x1a\n")) {
		t.Errorf("%s is not a PNG", png)
	}
	text, err := os.ReadFile(tsv)
	if err != nil {
		t.Fatal(err)
	}
	if n := strings.Count(string(text), "\n"); n != 1+2*3 {
		t.Errorf("TSV has %d lines, want 7:\n%s", n, text)
	}
	if err := run([]string{"-corpus", "udhr/none"}, &bytes.Buffer{}); err == nil {
		t.Error("no error for an unknown corpus")
	}
}
