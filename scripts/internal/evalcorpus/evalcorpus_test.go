package evalcorpus

import (
	"math/rand/v2"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
)

func writeFile(t *testing.T, path, text string) {
	t.Helper()
	if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
}

// fakeRoot lays out a repository root with two UDHR-style corpora and,
// when english is set, the English corpus beside it.
func fakeRoot(t *testing.T, english bool) string {
	t.Helper()
	top := t.TempDir()
	root := filepath.Join(top, "main")
	for _, lang := range []string{"xb", "xa"} {
		dir := filepath.Join(root, "data", "eval", "udhr", lang)
		writeFile(t, filepath.Join(dir, "gold.txt"), "ab c\n\nde f g\n")
		writeFile(t, filepath.Join(dir, "input.txt"), "abc\n\ndefg\n")
	}
	// A directory without input.txt is not a corpus.
	writeFile(t, filepath.Join(root, "data", "eval", "udhr", "xc", "gold.txt"), "a\n")
	if english {
		writeFile(t, filepath.Join(top, "shared", "corpora", "cds-english", "gold.txt"), "hi D^ kIti\nlUk\nWts D*t\n")
	}
	return root
}

func TestFind(t *testing.T) {
	for _, english := range []bool{true, false} {
		sources, missing, err := Find(fakeRoot(t, english))
		if err != nil {
			t.Fatal(err)
		}
		var names []string
		for _, s := range sources {
			names = append(names, s.Name)
		}
		want := []string{"udhr/xa", "udhr/xb"}
		if english {
			want = append([]string{EnglishName}, want...)
		}
		if !slices.Equal(names, want) {
			t.Errorf("english %v: names %q, want %q", english, names, want)
		}
		if english == (len(missing) > 0) {
			t.Errorf("english %v: missing %q", english, missing)
		}
	}
}

func TestSelect(t *testing.T) {
	sources := []Source{{Name: "udhr/xa"}, {Name: "udhr/xb"}}
	tests := []struct {
		names   string
		want    []string
		skipped []string
		err     bool
	}{
		{names: "all", want: []string{"udhr/xa", "udhr/xb"}},
		{names: "", want: []string{"udhr/xa", "udhr/xb"}},
		{names: "udhr/xb, udhr/xa", want: []string{"udhr/xb", "udhr/xa"}},
		{names: "cds-english,udhr/xa", want: []string{"udhr/xa"}, skipped: []string{EnglishName}},
		{names: "udhr/zz", err: true},
	}
	for _, tt := range tests {
		got, skipped, err := Select(sources, tt.names)
		if (err != nil) != tt.err {
			t.Errorf("Select(%q): error %v, want error %v", tt.names, err, tt.err)
			continue
		}
		var names []string
		for _, s := range got {
			names = append(names, s.Name)
		}
		if !slices.Equal(names, tt.want) || !slices.Equal(skipped, tt.skipped) {
			t.Errorf("Select(%q) = %q, skipped %q; want %q, %q", tt.names, names, skipped, tt.want, tt.skipped)
		}
	}
}

func TestLoad(t *testing.T) {
	root := fakeRoot(t, true)
	sources, _, err := Find(root)
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		src   Source
		lines int
		want  []Utterance
	}{
		{sources[0], 0, []Utterance{{"hiD^kIti", []string{"hi", "D^", "kIti"}}, {"lUk", []string{"lUk"}}, {"WtsD*t", []string{"Wts", "D*t"}}}},
		{sources[0], 2, []Utterance{{"hiD^kIti", []string{"hi", "D^", "kIti"}}, {"lUk", []string{"lUk"}}}},
		{sources[1], 0, []Utterance{{"abc", []string{"ab", "c"}}, {"defg", []string{"de", "f", "g"}}}},
		{sources[1], 1, []Utterance{{"abc", []string{"ab", "c"}}}},
	}
	for _, tt := range tests {
		got, err := Load(tt.src, tt.lines)
		if err != nil {
			t.Fatal(err)
		}
		if !slices.EqualFunc(got, tt.want, func(a, b Utterance) bool { return a.Text == b.Text && slices.Equal(a.Ref, b.Ref) }) {
			t.Errorf("Load(%s, %d) = %q, want %q", tt.src.Name, tt.lines, got, tt.want)
		}
	}
}

func TestLoadMismatch(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, filepath.Join(dir, "gold.txt"), "ab c\nde\n")
	writeFile(t, filepath.Join(dir, "input.txt"), "abc\ndf\n")
	_, err := Load(Source{Name: "x", Gold: filepath.Join(dir, "gold.txt"), Input: filepath.Join(dir, "input.txt")}, 0)
	if err == nil || !strings.Contains(err.Error(), "utterance 2") {
		t.Errorf("error %v, want one naming utterance 2", err)
	}
	writeFile(t, filepath.Join(dir, "input.txt"), "abc\n")
	if _, err := Load(Source{Name: "x", Gold: filepath.Join(dir, "gold.txt"), Input: filepath.Join(dir, "input.txt")}, 0); err == nil {
		t.Error("no error for files of different lengths")
	}
}

func TestScale(t *testing.T) {
	var utts []Utterance
	for i := range 20 {
		utts = append(utts, Utterance{Text: strings.Repeat("a", i+1)})
	}
	for _, k := range []int{1, 4, 16} {
		got := Scale(utts, k, rand.New(rand.NewPCG(7, 1)))
		if len(got) != k*len(utts) {
			t.Fatalf("k %d: %d utterances, want %d", k, len(got), k*len(utts))
		}
		count := map[string]int{}
		for _, u := range got {
			count[u.Text]++
		}
		for _, u := range utts {
			if count[u.Text] != k {
				t.Errorf("k %d: %q occurs %d times, want %d", k, u.Text, count[u.Text], k)
			}
		}
		again := Scale(utts, k, rand.New(rand.NewPCG(7, 1)))
		if !slices.EqualFunc(got, again, func(a, b Utterance) bool { return a.Text == b.Text }) {
			t.Errorf("k %d: same seed gave different orders", k)
		}
		if k == 4 {
			other := Scale(utts, k, rand.New(rand.NewPCG(8, 1)))
			if slices.EqualFunc(got, other, func(a, b Utterance) bool { return a.Text == b.Text }) {
				t.Errorf("k %d: seeds 7 and 8 gave the same order", k)
			}
		}
	}
	if utts[3].Text != "aaaa" {
		t.Error("Scale changed its input")
	}
}

func TestCorpusAndScore(t *testing.T) {
	utts := []Utterance{{"abc", []string{"ab", "c"}}, {"defg", []string{"de", "f", "g"}}}
	c, err := Corpus("t", utts)
	if err != nil {
		t.Fatal(err)
	}
	if c.Len() != 2 || len(c.Units) != 7 {
		t.Fatalf("corpus has %d utterances, %d units; want 2, 7", c.Len(), len(c.Units))
	}
	seg := segment.NewSegmentation(c)
	for _, i := range []int{2, 5, 6} { // ab|c de|f|g
		seg.Boundary[i] = true
	}
	s, err := Score(seg, utts)
	if err != nil {
		t.Fatal(err)
	}
	if s.Token.F != 1 || s.Boundary.F != 1 || s.Lexicon.F != 1 {
		t.Errorf("perfect segmentation scored %+v", s)
	}
	// No boundaries: tokens "abc" and "defg" match nothing; boundary
	// recall 0 (3 reference boundaries inside utterances).
	s, err = Score(segment.NewSegmentation(c), utts)
	if err != nil {
		t.Fatal(err)
	}
	if s.Token.F != 0 || s.Counts.Boundary != (score.Tally{Correct: 0, Predicted: 0, Reference: 3}) {
		t.Errorf("unsegmented corpus scored %+v", s)
	}
	if _, err := Score(seg, utts[:1]); err == nil {
		t.Error("no error for a length mismatch")
	}
}

func TestGoldBoundaries(t *testing.T) {
	utts := []Utterance{{"abcd", []string{"ab", "cd"}}, {"efg", []string{"efg"}}, {"hij", []string{"h", "i", "j"}}}
	got, err := GoldBoundaries("t", utts)
	if err != nil {
		t.Fatal(err)
	}
	want := []bool{true, false, true, false, true, false, false, true, true, true}
	if !slices.Equal(got, want) {
		t.Errorf("got %v, want %v", got, want)
	}
}
