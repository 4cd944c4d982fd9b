package main

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite data/demo with the generator's output")

// demoDir is the committed corpus, relative to this package.
var demoDir = filepath.Join("..", "..", "data", "demo")

// TestCommittedCorpus checks that data/demo is exactly what the generator
// makes with the settings its README names, so that a change to the
// generator cannot leave a stale corpus behind. With -update it rewrites
// data/demo instead.
func TestCommittedCorpus(t *testing.T) {
	files, err := build(defaultSeed, defaultUtterances)
	if err != nil {
		t.Fatal(err)
	}
	if *update {
		if err := writeAll(demoDir, files); err != nil {
			t.Fatal(err)
		}
	}
	for _, f := range files {
		got, err := os.ReadFile(filepath.Join(demoDir, f.name))
		if err != nil {
			t.Fatalf("%v (regenerate with: go run ./scripts/demogen -out data/demo -seed 1)", err)
		}
		if !bytes.Equal(got, f.data) {
			t.Errorf("%s differs from the generator's output; regenerate with: go run ./scripts/demogen -out data/demo -seed 1", f.name)
		}
	}
}

// TestDeterministic checks that a seed gives the same bytes every time and
// that another seed gives another corpus.
func TestDeterministic(t *testing.T) {
	a, err := build(7, 150)
	if err != nil {
		t.Fatal(err)
	}
	b, err := build(7, 150)
	if err != nil {
		t.Fatal(err)
	}
	c, err := build(8, 150)
	if err != nil {
		t.Fatal(err)
	}
	for i := range a {
		if !bytes.Equal(a[i].data, b[i].data) {
			t.Errorf("%s: two runs with seed 7 differ", a[i].name)
		}
	}
	if bytes.Equal(a[0].data, c[0].data) {
		t.Errorf("%s: seeds 7 and 8 give the same corpus", a[0].name)
	}
}

func TestBuildRejectsNoUtterances(t *testing.T) {
	if _, err := build(1, 0); err == nil {
		t.Error("build(1, 0): no error")
	}
}

// TestManySeeds runs the grammar on many seeds: every word it produces must
// be in the lexicon (build checks that) and every translation must be a
// sentence.
func TestManySeeds(t *testing.T) {
	for seed := uint64(100); seed < 120; seed++ {
		files, err := build(seed, 300)
		if err != nil {
			t.Fatalf("seed %d: %v", seed, err)
		}
		for _, line := range strings.Split(strings.TrimSuffix(string(files[2].data), "\n"), "\n") {
			if !strings.HasSuffix(line, ".") && !strings.HasSuffix(line, "?") {
				t.Errorf("seed %d: translation %q does not end a sentence", seed, line)
			}
			if strings.Contains(line, "  ") || strings.Contains(line, " ,") || strings.Contains(line, " .") || strings.Contains(line, " ?") {
				t.Errorf("seed %d: translation %q has stray spaces", seed, line)
			}
		}
	}
}

func TestLexicon(t *testing.T) {
	lex, err := checkLexicon()
	if err != nil {
		t.Fatal(err)
	}
	// The brief asks for a lexicon of about 120 to 180 words.
	if n := len(lex); n < 120 || n > 180 {
		t.Errorf("lexicon has %d words, want 120..180", n)
	}
	lines := strings.Split(strings.TrimSuffix(string(lexiconTSV()), "\n"), "\n")
	if !slices.IsSorted(lines) {
		t.Error("lexicon.tsv is not sorted")
	}
	for _, l := range lines {
		if f := strings.Split(l, "\t"); len(f) != 3 || f[0] == "" || f[1] == "" || f[2] == "" {
			t.Errorf("lexicon line %q: want three non-empty fields", l)
		}
	}
}

func TestUnits(t *testing.T) {
	tests := []struct {
		form string
		want []string
	}{
		{"t͡ʃaːpʰ", []string{"t͡ʃ", "aː", "pʰ"}},
		{"kʷira", []string{"kʷ", "i", "r", "a"}},
		{"tʰaŋ", []string{"tʰ", "a", "ŋ"}},
		{"ta", []string{"t", "a"}},
	}
	for _, tt := range tests {
		got, err := units(tt.form)
		if err != nil || !slices.Equal(got, tt.want) {
			t.Errorf("units(%q) = %q, %v; want %q", tt.form, got, err, tt.want)
		}
	}
	if _, err := units("xa"); err == nil {
		t.Error(`units("xa"): no error for a letter outside the inventory`)
	}
}

func TestSyllables(t *testing.T) {
	tests := []struct {
		form string
		want []string // nil: an error
	}{
		{"ka", []string{"ka"}},
		{"kaka", []string{"ka", "ka"}},
		{"nuŋgol", []string{"nuŋ", "gol"}},
		{"kiret", []string{"ki", "ret"}},
		{"seraːn", []string{"se", "raːn"}},
		{"t͡ʃoba", []string{"t͡ʃo", "ba"}},
		{"aka", nil},  // no onset
		{"kta", nil},  // onset without a vowel
		{"tapʰ", nil}, // aspirated coda
		{"tangu", []string{"tan", "gu"}},
		{"takʷ", nil}, // labialised coda
		{"", nil},
		{"kʷ", nil},
		{"taa", nil}, // hiatus: second syllable has no onset
	}
	for _, tt := range tests {
		got, err := syllables(tt.form)
		if tt.want == nil {
			if err == nil {
				t.Errorf("syllables(%q) = %q; want an error", tt.form, got)
			}
			continue
		}
		if err != nil || !slices.Equal(got, tt.want) {
			t.Errorf("syllables(%q) = %q, %v; want %q", tt.form, got, err, tt.want)
		}
	}
}

// TestEnglishVerbGroups checks the English verb forms against the rules of
// English grammar (do-support in negatives and questions, "will" for the
// future, "be" + -ing for the progressive); source: common practice.
func TestEnglishVerbGroups(t *testing.T) {
	eat := &verb{base: "eat", s3: "eats", past: "ate", ing: "eating"}
	tests := []struct {
		name        string
		c           clause
		subj        phrase
		statement   string
		question    string
		whoQuestion string
	}{
		{"past", clause{v: eat, tense: past}, phrase{subj: "she", person: 3},
			"she ate", "did she eat", "who ate"},
		{"past negative", clause{v: eat, tense: past, negative: true}, phrase{subj: "she", person: 3},
			"she did not eat", "did she eat", "who did not eat"},
		{"habitual", clause{v: eat}, phrase{subj: "she", person: 3},
			"she eats", "does she eat", "who eats"},
		{"habitual plural negative", clause{v: eat, negative: true}, phrase{subj: "we", person: 1, plural: true},
			"we do not eat", "do we eat", "who does not eat"},
		{"progressive", clause{v: eat, progressive: true}, phrase{subj: "I", person: 1},
			"I am eating", "am I eating", "who is eating"},
		{"future", clause{v: eat, tense: future}, phrase{subj: "they", person: 3, plural: true},
			"they will eat", "will they eat", "who will eat"},
		{"copula past plural", clause{predEN: "tired", tense: past}, phrase{subj: "you", person: 2},
			"you were tired", "were you tired", "who was tired"},
		{"copula future negative", clause{predEN: "big", tense: future, negative: true}, phrase{subj: "it", person: 3},
			"it will not be big", "will it be big", "who will not be big"},
	}
	for _, tt := range tests {
		c := tt.c
		c.subject = &tt.subj
		if got := join(c.statement()); got != tt.statement {
			t.Errorf("%s: statement %q, want %q", tt.name, got, tt.statement)
		}
		if got := join(c.question("")); got != tt.question {
			t.Errorf("%s: question %q, want %q", tt.name, got, tt.question)
		}
		if got := join(c.whoQuestion()); got != tt.whoQuestion {
			t.Errorf("%s: who-question %q, want %q", tt.name, got, tt.whoQuestion)
		}
	}
}

func TestSentence(t *testing.T) {
	tests := []struct {
		words []string
		end   string
		want  string
	}{
		{[]string{"she", "ate", "a", "egg"}, ".", "She ate an egg."},
		{[]string{"a", "old", "man", "came"}, ".", "An old man came."},
		{[]string{"", "did", "you", "see", "a", "fish"}, "?", "Did you see a fish?"},
	}
	for _, tt := range tests {
		if got := sentence(tt.words, tt.end); got != tt.want {
			t.Errorf("sentence(%q) = %q, want %q", tt.words, got, tt.want)
		}
	}
}
