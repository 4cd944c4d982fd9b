package main

import (
	"bytes"
	"context"
	"math"
	"math/rand/v2"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
)

func TestSummarize(t *testing.T) {
	s := Summarize([]float64{0.2, 0.4, 0.3})
	if math.Abs(s.Mean-0.3) > 1e-12 || s.Min != 0.2 || s.Max != 0.4 || s.N != 3 {
		t.Errorf("got %+v", s)
	}
	if got := s.format(false); got != "0.300 [0.200, 0.400]" {
		t.Errorf("format = %q", got)
	}
	if got := Summarize([]float64{-0.0125}).format(true); got != "-0.013" && got != "-0.012" {
		t.Errorf("signed format = %q", got)
	}
	if got := Summarize([]float64{0.01, -0.02}).format(true); got != "-0.005 [-0.020, +0.010]" {
		t.Errorf("signed range = %q", got)
	}
}

func TestGlossCounts(t *testing.T) {
	c := GlossCounts{Types: 10, Glossed: 9, Real: 7, Judged: 5, Hit1: 2, Hit3: 4}
	if c.NonWords() != 2 || c.P1() != 0.4 || c.P3() != 0.8 || c.P1Strict() != 2.0/7 {
		t.Errorf("%+v: non-words %d, P@1 %v, P@3 %v, strict %v", c, c.NonWords(), c.P1(), c.P3(), c.P1Strict())
	}
	if (GlossCounts{}).P1() != 0 {
		t.Error("P@1 of nothing judged is not 0")
	}
}

func TestParseFlags(t *testing.T) {
	o, err := parseFlags([]string{"-langs", "spa, fin", "-weights", "0,0.3,1", "-min-count", "5,10", "-model", "unigram,bigram"})
	if err != nil {
		t.Fatal(err)
	}
	got := o.settings()
	if len(got) != 2*(1+2*2) || !got[0].baseline() || got[1] != (Setting{"unigram", "boundary", 0.3, 5, "forward"}) || got[5].Model != "bigram" {
		t.Errorf("settings %v", got)
	}
	o, err = parseFlags([]string{"-weights", "1", "-min-count", "3", "-direction", "forward,reverse"})
	if err != nil {
		t.Fatal(err)
	}
	if got := o.settings(); len(got) != 3 || got[2].Direction != "reverse" || got[2].String() != "unigram/boundary, weight 1, min-count 3, reverse" {
		t.Errorf("settings %v", got)
	}
	for _, args := range [][]string{
		{"-weights", "0,-1"},
		{"-seeds", "x"},
		{"-dicts", "some"},
		{"-procs", "0"},
		{"-langs", ""},
		{"-direction", "sideways"},
		{"-direction", ""},
		{"extra"},
	} {
		if _, err := parseFlags(args); err == nil {
			t.Errorf("parseFlags(%q) gave no error", args)
		}
	}
}

// TestRunDeterministic learns the Spanish corpus briefly with and without
// the prior and checks that the outcomes do not depend on how many runs go
// at once, and that the report has a row per setting and language.
func TestRunDeterministic(t *testing.T) {
	if testing.Short() {
		t.Skip("learns on real data")
	}
	dir := t.TempDir()
	// A two-entry Spanish-English dictionary in both directions.
	writeDictd(t, dir, "freedict-spa-eng", []string{"de", "derecho"}, []string{"de /dˈe/\n1. from, of\n", "derecho /deɾˈetʃo/\nright\n"})
	writeDictd(t, dir, "freedict-eng-spa", []string{"the"}, []string{"the /ð/\nel, la, las, lo, los\n"})
	var outcomes [][][]Outcome
	for _, procs := range []string{"1", "3"} {
		o, err := parseFlags([]string{"-data", "../../data/eval/udhr", "-langs", "spa", "-dict-dir", dir,
			"-iterations", "4", "-seeds", "1,2", "-weights", "0,1", "-min-count", "2", "-procs", procs})
		if err != nil {
			t.Fatal(err)
		}
		var buf bytes.Buffer
		rep, err := buildReport(context.Background(), o)
		if err != nil {
			t.Fatal(err)
		}
		if err := rep.WriteMarkdown(&buf); err != nil {
			t.Fatal(err)
		}
		if outcomes != nil && !reflect.DeepEqual(rep.Outcomes, outcomes) {
			t.Errorf("-procs %s changed the outcomes", procs)
		}
		outcomes = rep.Outcomes
		md := buf.String()
		for _, want := range []string{
			"| unigram/boundary, no prior | spa |",
			"| unigram/boundary, weight 1, min-count 2 | all |",
			"| gold segmentation | spa |",
			"- spa: spa-eng (forward, 2 index rows); eng-spa (reverse, 1 index rows)",
		} {
			if !strings.Contains(md, want) {
				t.Errorf("report lacks %q:\n%s", want, md)
			}
		}
	}
	for _, byLang := range outcomes {
		for _, o := range byLang[0] {
			if o.Scores.Utterances != 60 || o.Gloss.Types == 0 {
				t.Errorf("outcome %+v", o)
			}
		}
	}
}

// TestProductFactor: the product's changes are the sums of its factors',
// and its moves keep both factors' running totals equal to a computation
// from scratch.
func TestProductFactor(t *testing.T) {
	translations := [][]string{{"right", "of", "everyone"}, {"everyone", "has"}, {"freedom", "of", "thought"}}
	words := [][]int32{{0, 1, 2}, {2, 3}, {4, 1, 5}}
	fw := align.NewFactor(translations, 1, words, 5, 0)
	rv := align.NewReverseFactor(translations, 1, words, 5, 0, false)
	p := productFactor{fw, rv}
	rng := rand.New(rand.NewPCG(1, 2))
	for range 50 {
		u := rng.IntN(len(words))
		ws := words[u]
		i := rng.IntN(len(ws))
		w1, w2 := int32(rng.IntN(8)), int32(rng.IntN(8))
		if d, want := p.SplitDelta(u, ws[i], w1, w2), fw.SplitDelta(u, ws[i], w1, w2)+rv.SplitDelta(u, ws[i], w1, w2); d != want {
			t.Fatalf("SplitDelta %v, sum of factors %v", d, want)
		}
		after := slices.Concat(ws[:i], []int32{w1, w2}, ws[i+1:])
		if d, want := p.Delta(u, after), fw.Delta(u, after)+rv.Delta(u, after); d != want {
			t.Fatalf("Delta %v, sum of factors %v", d, want)
		}
		p.Split(u, ws[i], w1, w2)
		words[u] = after
		if d, want := p.JoinDelta(u, w1, w2, ws[i]), fw.JoinDelta(u, w1, w2, ws[i])+rv.JoinDelta(u, w1, w2, ws[i]); d != want {
			t.Fatalf("JoinDelta %v, sum of factors %v", d, want)
		}
		if len(after) > 4 {
			p.Join(u, w1, w2, ws[i])
			words[u] = ws
		}
	}
	for u := range words {
		if got, want := fw.LogProb(u), fw.Model().LogProb(u, words[u]); math.Abs(got-want) > 1e-9 {
			t.Errorf("line %d: forward total %v, from scratch %v", u, got, want)
		}
		if got, want := rv.LogProb(u), rv.Model().LogProb(u, words[u]); math.Abs(got-want) > 1e-9 {
			t.Errorf("line %d: reverse total %v, from scratch %v", u, got, want)
		}
	}
}

// TestIPAVowels: the units that begin with an IPA vowel letter, long
// vowels included, and no consonant.
func TestIPAVowels(t *testing.T) {
	c, err := segment.ReadCorpus(strings.NewReader("kaːtɛʃiŋ\nbuə"), "t", segment.ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	got := ipaVowels(c)
	want := map[string]bool{"aː": true, "ɛ": true, "i": true, "u": true, "ə": true}
	if len(got) != len(want) {
		t.Fatalf("ipaVowels = %q, want the units of %v", got, want)
	}
	for _, u := range got {
		if !want[u] {
			t.Errorf("ipaVowels gave %q, not a vowel unit", u)
		}
	}
}

// TestMismatched: every line of more than one gets another line's
// translation, and every translation is used once.
func TestMismatched(t *testing.T) {
	for n := 2; n <= 7; n++ {
		tokens := make([][]string, n)
		for u := range tokens {
			tokens[u] = []string{strconv.Itoa(u)}
		}
		got := mismatched(tokens)
		seen := map[string]bool{}
		for u, ts := range got {
			if ts[0] == strconv.Itoa(u) {
				t.Errorf("n=%d: line %d keeps its own translation", n, u)
			}
			seen[ts[0]] = true
		}
		if len(seen) != n {
			t.Errorf("n=%d: %d distinct translations used", n, len(seen))
		}
	}
}
