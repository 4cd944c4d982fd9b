package main

import (
	"bytes"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

func writeFile(t *testing.T, name, content string) string {
	path := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(path, []byte(content), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// TestScoreJSONContract checks the shape DESIGN section 6 fixes for
// --json: one object with these keys and numbers in [0,1].
func TestScoreJSONContract(t *testing.T) {
	ref := writeFile(t, "ref.txt", "ab c\nd ef\n")
	pred := writeFile(t, "pred.txt", "a bc\nd ef\n")
	out := run(t, nil, "score", "--json", "--reference", ref, pred)
	var v struct {
		Utterances int `json:"utterances"`
		Boundary   struct{ Precision, Recall, F *float64 }
		Token      struct{ Precision, Recall, F *float64 }
		Lexicon    struct{ Precision, Recall, F *float64 }
	}
	if err := json.Unmarshal(out, &v); err != nil {
		t.Fatalf("not one JSON object: %v\n%s", err, out)
	}
	if v.Utterances != 2 || v.Token.F == nil || v.Boundary.Precision == nil || v.Lexicon.Recall == nil {
		t.Fatalf("missing keys: %s", out)
	}
	// Boundaries: ref {2, 4}, pred {1, 4} (offsets after removing spaces,
	// line by line): 1 of 2 right; tokens: d, ef right of 4.
	if *v.Boundary.Precision != 0.5 || *v.Token.Precision != 0.5 {
		t.Errorf("unexpected scores: %s", out)
	}
}

// TestScoreMismatchNamesBothFiles: a line whose text differs is an error
// naming the line in both files.
func TestScoreMismatchNamesBothFiles(t *testing.T) {
	ref := writeFile(t, "ref.txt", "ab c\n\nd ef\n")
	pred := writeFile(t, "pred.txt", "ab c\nd eg\n")
	cmd := exec.Command(binary, "score", "-r", ref, pred)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Run(); err == nil {
		t.Fatal("mismatched texts were accepted")
	}
	msg := stderr.String()
	if !strings.Contains(msg, "ref.txt:3") || !strings.Contains(msg, "pred.txt:2") {
		t.Errorf("error does not name both lines: %s", msg)
	}
}

// TestDemoRuns runs the demo briefly: it must score the invented corpus
// and list glosses learned from its translations.
func TestDemoRuns(t *testing.T) {
	out := string(run(t, nil, "demo", "-q", "--iterations", "30", "--chains", "1"))
	for _, want := range []string{"Kelaru", "boundary", "token", "lexicon", "glosses learned"} {
		if !strings.Contains(out, want) {
			t.Errorf("demo output lacks %q:\n%s", want, out)
		}
	}
}

// TestLearnTranslationsLineCount: translations must be line-aligned.
func TestLearnTranslationsLineCount(t *testing.T) {
	in := writeFile(t, "in.txt", "abab\nbaba\n")
	tr := writeFile(t, "tr.txt", "one\n")
	cmd := exec.Command(binary, "learn", "-q", "--iterations", "5", "--translations", tr, in)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Run(); err == nil {
		t.Fatal("short translations accepted")
	}
	if msg := stderr.String(); !strings.Contains(msg, "in.txt has 2 lines") || !strings.Contains(msg, "tr.txt has 1") {
		t.Errorf("error does not name both files and counts: %s", msg)
	}
}

// TestLearnBadInputNamesPosition: invalid UTF-8 is reported at
// file:line:column.
func TestLearnBadInputNamesPosition(t *testing.T) {
	in := writeFile(t, "in.txt", "abab\nba\xffba\n")
	cmd := exec.Command(binary, "learn", "-q", in)
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Run(); err == nil {
		t.Fatal("invalid UTF-8 accepted")
	}
	if msg := stderr.String(); !strings.Contains(msg, "in.txt:2:3") {
		t.Errorf("error does not name file:line:column: %s", msg)
	}
}
