package main

import (
	"bytes"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
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
	flags := []string{"--model", "bigram", "--iterations", "60", "--block", "4", "--chains", "2", "--seed", "3"}
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
