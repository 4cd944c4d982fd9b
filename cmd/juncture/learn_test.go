package main

import (
	"bytes"
	"compress/gzip"
	"encoding/json"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"testing"
	"time"
)

// testCorpus writes a small synthetic transcript (a made-up vocabulary,
// seeded) for tests of the command's mechanics.
func testCorpus(t *testing.T, n int) string {
	vocab := []string{"ba", "kitu", "mo", "lesa", "ni", "ropa", "e", "tumbi", "ŋa", "tʰo"}
	rng := rand.New(rand.NewPCG(7, 7))
	var b strings.Builder
	for i := 0; i < n; i++ {
		for j := 1 + rng.IntN(4); j > 0; j-- {
			b.WriteString(vocab[rng.IntN(len(vocab))])
		}
		b.WriteByte('\n')
	}
	path := filepath.Join(t.TempDir(), "input.txt")
	if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// TestLearnSameSeedSameBytes: same input and seed give byte-identical
// output; another seed is allowed to differ.
func TestLearnSameSeedSameBytes(t *testing.T) {
	in := testCorpus(t, 80)
	args := []string{"learn", "-q", "--iterations", "30", "--chains", "2", "--seed", "9", in}
	a := run(t, nil, args...)
	b := run(t, nil, args...)
	if !bytes.Equal(a, b) {
		t.Fatal("same seed gave different output")
	}
	if len(bytes.Split(bytes.TrimSpace(a), []byte("\n"))) != 80 {
		t.Fatalf("want 80 output lines, got:\n%s", a)
	}
	if got := bytes.ReplaceAll(a, []byte(" "), nil); !bytes.Equal(got, mustRead(t, in)) {
		t.Fatal("output without spaces differs from the input")
	}
}

// TestLearnConverge: with --converge, --iterations is a cap and the
// burn-in is that of a default run, so an easy corpus stops early, and the
// state records it.
func TestLearnConverge(t *testing.T) {
	in := testCorpus(t, 80)
	dir := filepath.Join(t.TempDir(), "state")
	run(t, nil, "learn", "-q", "--iterations", "1000", "--block", "10", "--converge", "1.5", "--state", dir, in)
	var settings struct {
		Config struct {
			Burnin int `json:"burnin"`
		} `json:"config"`
	}
	if err := json.Unmarshal(mustRead(t, filepath.Join(dir, "settings.json")), &settings); err != nil {
		t.Fatal(err)
	}
	if settings.Config.Burnin != 50 {
		t.Errorf("burn-in %d with --converge, want 50", settings.Config.Burnin)
	}
	zr, err := gzip.NewReader(bytes.NewReader(mustRead(t, filepath.Join(dir, "chain-0.json.gz"))))
	if err != nil {
		t.Fatal(err)
	}
	var chain struct {
		Iteration int  `json:"iteration"`
		Stopped   bool `json:"stopped"`
	}
	if err := json.NewDecoder(zr).Decode(&chain); err != nil {
		t.Fatal(err)
	}
	if !chain.Stopped || chain.Iteration >= 1000 || chain.Iteration < 70 {
		t.Errorf("chain at sweep %d, stopped %v; want a stop between 70 and 1000", chain.Iteration, chain.Stopped)
	}
}

func mustRead(t *testing.T, path string) []byte {
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// TestLearnResumeAfterKill kills a real learning process at several
// moments and checks that resuming gives the uninterrupted run's output,
// posteriors and traces byte for byte.
func TestLearnResumeAfterKill(t *testing.T) {
	if testing.Short() {
		t.Skip("kills real processes")
	}
	in := testCorpus(t, 300)
	for _, model := range []string{"bigram", "collocation"} {
		t.Run(model, func(t *testing.T) { killAndResume(t, in, "--model", model) })
	}
	// With a translation factor the resumed run must rebuild it from the
	// state alone: translations, stop words and table settings.
	dir := t.TempDir()
	tr, stop := filepath.Join(dir, "tr.txt"), filepath.Join(dir, "stop.txt")
	var b strings.Builder
	for _, line := range strings.Split(strings.TrimSpace(string(mustRead(t, in))), "\n") {
		b.WriteString("the " + strconv.Itoa(len(line)%7) + " and w" + strconv.Itoa(strings.Count(line, "a")) + "\n")
	}
	os.WriteFile(tr, []byte(b.String()), 0o644)
	os.WriteFile(stop, []byte("the\nand\n"), 0o644)
	t.Run("bigram-translations", func(t *testing.T) {
		killAndResume(t, in, "--model", "bigram", "--translations", tr, "--translation-weight", "1", "--translation-min-count", "2", "--stop-words", stop)
	})
}

func killAndResume(t *testing.T, in string, model ...string) {
	flags := append(model, "--iterations", "60", "--block", "4", "--chains", "2", "--seed", "3")
	ref := t.TempDir()
	want := run(t, nil, append(append([]string{"learn", "-q", "--state", ref}, flags...), in)...)
	for _, delay := range []time.Duration{30 * time.Millisecond, 150 * time.Millisecond, 400 * time.Millisecond, 900 * time.Millisecond} {
		dir := t.TempDir()
		cmd := exec.Command(binary, append(append([]string{"learn", "-q", "--state", dir}, flags...), in)...)
		if err := cmd.Start(); err != nil {
			t.Fatal(err)
		}
		time.Sleep(delay)
		cmd.Process.Signal(syscall.SIGKILL)
		cmd.Wait()
		var got []byte
		if _, err := os.Stat(filepath.Join(dir, "settings.json")); err != nil {
			// Killed before the run was set up: nothing to resume, start again.
			got = run(t, nil, append(append([]string{"learn", "-q", "--state", dir}, flags...), in)...)
		} else {
			got = run(t, nil, "learn", "-q", "--state", dir, "--resume")
		}
		if !bytes.Equal(got, want) {
			t.Errorf("killed after %v: resumed output differs from an uninterrupted run", delay)
		}
		for _, f := range []string{"posteriors.tsv", "segmentation.txt", "chain-0.json.gz", "chain-1.json.gz"} {
			if !bytes.Equal(mustRead(t, filepath.Join(dir, f)), mustRead(t, filepath.Join(ref, f))) {
				t.Errorf("killed after %v: %s differs after resume", delay, f)
			}
		}
	}
}

// TestLearnLexicon: --lexicon writes one row per word type of the output,
// counts summing to its tokens, and glosses from --translations for words
// that always come with the same translation word.
func TestLearnLexicon(t *testing.T) {
	dir := t.TempDir()
	in, tr := filepath.Join(dir, "in.txt"), filepath.Join(dir, "tr.txt")
	var src, eng strings.Builder
	words := map[string]string{"kitu": "stone", "lesa": "water", "mo": "big", "ropa": "hand"}
	forms := []string{"kitu", "lesa", "mo", "ropa"}
	rng := rand.New(rand.NewPCG(3, 3))
	for i := 0; i < 120; i++ {
		a, b := forms[rng.IntN(4)], forms[rng.IntN(4)]
		src.WriteString(a + b + "\n")
		eng.WriteString("the " + words[a] + " and " + words[b] + "\n")
	}
	os.WriteFile(in, []byte(src.String()), 0o644)
	os.WriteFile(tr, []byte(eng.String()), 0o644)
	lex := filepath.Join(dir, "lex.tsv")
	out := run(t, nil, "learn", "-q", "--iterations", "40", "--translations", tr, "--lexicon", lex, in)
	rows := strings.Split(strings.TrimSpace(string(mustRead(t, lex))), "\n")
	if rows[0] != "form\tcount\tconfidence\tglosses\tlines" {
		t.Fatalf("header %q", rows[0])
	}
	tokens, total := map[string]int{}, 0
	for _, w := range strings.Fields(string(out)) {
		tokens[w]++
		total++
	}
	sum := 0
	for _, r := range rows[1:] {
		f := strings.Split(r, "\t")
		if len(f) != 5 {
			t.Fatalf("row %q has %d fields", r, len(f))
		}
		n, _ := strconv.Atoi(f[1])
		if n != tokens[f[0]] {
			t.Errorf("%s: count %d in the lexicon, %d in the output", f[0], n, tokens[f[0]])
		}
		sum += n
		if g, ok := words[f[0]]; ok && !strings.HasPrefix(f[3], g+" (") {
			t.Errorf("%s: glosses %q, want %s first", f[0], f[3], g)
		}
	}
	if sum != total || len(rows)-1 != len(tokens) {
		t.Errorf("lexicon has %d rows and %d tokens; the output %d types and %d tokens", len(rows)-1, sum, len(tokens), total)
	}
}

// TestLearnStopWordsRecorded: the stop words and the table setting are
// part of the run's settings, so --resume rebuilds the same factor, and
// the state keeps the whole translations, which the glosses read.
func TestLearnStopWordsRecorded(t *testing.T) {
	dir := t.TempDir()
	in, tr, stop := filepath.Join(dir, "in.txt"), filepath.Join(dir, "tr.txt"), filepath.Join(dir, "stop.txt")
	var src, eng strings.Builder
	for i := range 60 {
		if i%2 == 0 {
			src.WriteString("kitulesa\n")
			eng.WriteString("stone of water\n")
		} else {
			src.WriteString("lesa\n")
			eng.WriteString("water\n")
		}
	}
	os.WriteFile(in, []byte(src.String()), 0o644)
	os.WriteFile(tr, []byte(eng.String()), 0o644)
	os.WriteFile(stop, []byte("# test\nof\nThe\n"), 0o644)
	state, lex := filepath.Join(dir, "state"), filepath.Join(dir, "lex.tsv")
	run(t, nil, "learn", "-q", "--iterations", "20", "--translations", tr, "--translation-weight", "1",
		"--stop-words", stop, "--state", state, "--lexicon", lex, in)
	var settings struct {
		Config struct {
			StopWords   []string `json:"translation_stop_words"`
			LeaveOneOut *bool    `json:"translation_leave_one_out"`
		} `json:"config"`
	}
	if err := json.Unmarshal(mustRead(t, filepath.Join(state, "settings.json")), &settings); err != nil {
		t.Fatal(err)
	}
	if got := strings.Join(settings.Config.StopWords, ","); got != "of,the" {
		t.Errorf("recorded stop words %q, want of,the", got)
	}
	if settings.Config.LeaveOneOut == nil {
		t.Error("translation_leave_one_out not recorded")
	}
	if !bytes.Contains(mustRead(t, filepath.Join(state, "translations.txt")), []byte("of")) {
		t.Error("the state's translations lost the stop words the glosses need")
	}
}
