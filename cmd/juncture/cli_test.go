package main

import (
	"bytes"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// runStatus runs the juncture binary in dir and returns its standard
// output, standard error and exit status.
func runStatus(t *testing.T, dir string, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	cmd := exec.Command(binary, args...)
	cmd.Dir = dir
	var out, errOut bytes.Buffer
	cmd.Stdout, cmd.Stderr = &out, &errOut
	err := cmd.Run()
	var ee *exec.ExitError
	switch {
	case errors.As(err, &ee):
		code = ee.ExitCode()
	case err != nil:
		t.Fatalf("juncture %v: %v", args, err)
	}
	return out.String(), errOut.String(), code
}

// TestCommandLineMistakes: a mistake on the command line is an error on
// standard error that says what is wrong, exit status 1, and nothing on
// standard output, which may be redirected into a data file (common
// practice for Unix filters; STYLE.md: stdout is data, chatter goes to
// stderr). No mistake may end in a panic.
func TestCommandLineMistakes(t *testing.T) {
	dir := t.TempDir()
	os.WriteFile(filepath.Join(dir, "in.txt"), []byte("kitumo\nbaropa\n"), 0o644)
	os.WriteFile(filepath.Join(dir, "gold.txt"), []byte("kitu mo\nba ropa\n"), 0o644)
	for _, tc := range []struct {
		args []string
		want string // in standard error
	}{
		{[]string{"learn", "-q", "--iteration", "5", "in.txt"}, "flag provided but not defined: -iteration"},
		{[]string{"learn", "-q", "--iterations", "abc", "in.txt"}, `invalid value "abc" for flag -iterations`},
		{[]string{"learn", "-q", "--seed", "-1", "in.txt"}, `invalid value "-1" for flag -seed`},
		{[]string{"learn", "in.txt", "-q", "--iterations", "5"}, `flags go before INPUT: "-q" comes after it`},
		{[]string{"score", "gold.txt"}, "--reference"},
		{[]string{"score", "--jsn", "-r", "gold.txt", "gold.txt"}, "flag provided but not defined: -jsn"},
		{[]string{"score", "-r", "gold.txt", "gold.txt", "--json"}, `flags go before PREDICTED: "--json" comes after it`},
		{[]string{"score", "-r", "-", "-"}, "standard input can be read only once"},
		{[]string{"demo", "-q", "--top", "-1"}, "--top must be at least 0, got -1"},
		{[]string{"learn", "-q", "--state", "st", "--resume", "--transcript-column", "ipa"}, "--transcript-column cannot be changed on --resume"},
		{[]string{"learn", "-q", "--nuclei", "i u e", "in.txt"}, `nucleus "e" is not a unit of in.txt`},
		{[]string{"learn", "-q", "--nuclei", "u", "in.txt"}, "in.txt:2: no unit of the line is a nucleus (u)"},
		{[]string{"learn", "-q", "--nuclei", "a", "--base", "ngram", "in.txt"}, "nuclei work with the uniform base only"},
		{[]string{"learn", "-q", "--phonotactics", "in.txt"}, "phonotactics need the syllable nuclei"},
		{[]string{"learn", "-q", "--model", "collocation", "--sampler", "boundary", "in.txt"}, "collocation model has its own blocked sampler"},
	} {
		stdout, stderr, code := runStatus(t, dir, tc.args...)
		if code != 1 || stdout != "" || !strings.Contains(stderr, tc.want) || strings.Contains(stderr, "panic") {
			t.Errorf("juncture %s: exit %d, stdout %q, stderr %q; want exit 1, no stdout, an error with %q",
				strings.Join(tc.args, " "), code, stdout, stderr, tc.want)
		}
	}
}

// TestLearnChecksOutputsFirst: an output that cannot be written, or that
// would overwrite an input, is an error before any sampling, so a long run
// is not lost at its end; the state directory is not even created.
func TestLearnChecksOutputsFirst(t *testing.T) {
	dir := t.TempDir()
	in := "kitumo\nbaropa\n"
	os.WriteFile(filepath.Join(dir, "in.txt"), []byte(in), 0o644)
	os.WriteFile(filepath.Join(dir, "tr.txt"), []byte("stone big\nhand\n"), 0o644)
	os.WriteFile(filepath.Join(dir, "afile"), nil, 0o644)
	os.Mkdir(filepath.Join(dir, "adir"), 0o755)
	for _, tc := range []struct {
		flags []string
		want  string
	}{
		{[]string{"--out", "missing/words.txt"}, "--out missing/words.txt: stat missing: no such file or directory"},
		{[]string{"--posteriors", "missing/gaps.tsv"}, "--posteriors missing/gaps.tsv: stat missing"},
		{[]string{"--lexicon", "afile/lex.tsv"}, "--lexicon afile/lex.tsv: afile is not a directory"},
		{[]string{"--out", "adir"}, "--out adir: is a directory"},
		{[]string{"--out", "in.txt"}, "--out in.txt would overwrite INPUT"},
		{[]string{"--out", "./in.txt"}, "--out ./in.txt would overwrite INPUT"},
		{[]string{"--translations", "tr.txt", "--lexicon", "tr.txt"}, "--lexicon tr.txt would overwrite --translations"},
		{[]string{"--out", "w.txt", "--posteriors", "w.txt"}, "--posteriors w.txt would overwrite --out"},
	} {
		args := append(append([]string{"learn", "-q", "--iterations", "5", "--state", "st"}, tc.flags...), "in.txt")
		stdout, stderr, code := runStatus(t, dir, args...)
		if code != 1 || stdout != "" || !strings.Contains(stderr, tc.want) {
			t.Errorf("juncture %s: exit %d, stdout %q, stderr %q; want exit 1 and an error with %q",
				strings.Join(args, " "), code, stdout, stderr, tc.want)
		}
		if _, err := os.Stat(filepath.Join(dir, "st")); err == nil {
			t.Errorf("juncture %s: the state directory was created before the outputs were checked", strings.Join(args, " "))
			os.RemoveAll(filepath.Join(dir, "st"))
		}
		if got := string(mustRead(t, filepath.Join(dir, "in.txt"))); got != in {
			t.Fatalf("juncture %s: INPUT overwritten with %q", strings.Join(args, " "), got)
		}
	}
}

// TestLearnHelp: the help states what a flag left unset does, not a
// zero the program never uses, and names the values a flag takes.
func TestLearnHelp(t *testing.T) {
	help, _, code := runStatus(t, "", "learn", "--help")
	if code != 0 {
		t.Fatalf("learn --help: exit %d", code)
	}
	lines := map[string]string{}
	for _, l := range strings.Split(help, "\n") {
		if f := strings.Fields(l); len(f) > 0 && strings.HasPrefix(f[0], "--") {
			lines[f[0]] = l
		}
	}
	for _, tc := range []struct {
		flag, want, not string
	}{
		{"--alpha0", "(default: sampled)", "(default: 0)"},
		{"--alpha1", "(default: sampled)", "(default: 0)"},
		{"--word-end", "(default: sampled)", "(default: 0)"},
		{"--discount0", "(default: 0, sampled with --pitman-yor)", "(default: 0)\n"},
		{"--discount1", "(default: 0, sampled with --pitman-yor)", "(default: 0)\n"},
		{"--converge", "(default: off)", "(default: 0)"},
		{"--pitman-yor", "(default: false)", "(default: 0, Dirichlet processes)"},
		{"--proposal", "(unigram", "\x00"},
		{"--posteriors", "line, offset, unit, left, right, probability", "\x00"},
		{"--translations", "glosses", "\x00"},
	} {
		l, ok := lines[tc.flag]
		if !ok {
			t.Errorf("%s missing from learn --help", tc.flag)
			continue
		}
		if !strings.Contains(l, tc.want) || strings.Contains(l+"\n", tc.not) {
			t.Errorf("learn --help: %q; want %q, not %q", l, tc.want, tc.not)
		}
	}
}

// TestLearnUnitsFile: the --units file is read the way transcripts are (a
// byte order mark at its start is dropped, as segment.ReadCorpus does), and
// a mistake in it is an error naming that file and its line.
func TestLearnUnitsFile(t *testing.T) {
	dir := t.TempDir()
	os.WriteFile(filepath.Join(dir, "in.txt"), []byte("kitumo\nbaropa\n"), 0o644)
	units := "k\ni\nt\nu\nm\no\nb\na\nr\np\n"
	for _, tc := range []struct {
		name, content string
		want          string // in standard error; "" for success
	}{
		{"plain.txt", units, ""},
		{"crlf.txt", strings.ReplaceAll(units, "\n", "\r\n"), ""},
		{"bom.txt", "\uFEFF" + units, ""},
		{"bad.txt", "k\n\ni\nt\xff\n" + units, "bad.txt:4: invalid UTF-8"},
		{"empty.txt", "\n \n", "empty.txt: no units"},
	} {
		os.WriteFile(filepath.Join(dir, tc.name), []byte(tc.content), 0o644)
		stdout, stderr, code := runStatus(t, dir, "learn", "-q", "--iterations", "3", "--units", tc.name, "in.txt")
		switch {
		case tc.want == "" && code != 0:
			t.Errorf("--units %s: exit %d: %s", tc.name, code, stderr)
		case tc.want == "" && strings.ReplaceAll(stdout, " ", "") != "kitumo\nbaropa\n":
			t.Errorf("--units %s: output %q", tc.name, stdout)
		case tc.want != "" && (code != 1 || !strings.Contains(stderr, tc.want)):
			t.Errorf("--units %s: exit %d, stderr %q; want an error with %q", tc.name, code, stderr, tc.want)
		}
	}
}
