package score

import (
	"bytes"
	"encoding/json"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

// golden compares got with testdata/name, or rewrites the file with -update.
func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		tmp := path + ".tmp"
		if err := os.WriteFile(tmp, got, 0o644); err != nil {
			t.Fatal(err)
		}
		if err := os.Rename(tmp, path); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs (run go test -update to accept):\ngot:\n%s\nwant:\n%s", path, got, want)
	}
}

func goldenScores(t *testing.T) Scores {
	t.Helper()
	gold, _, err := ReadSegmented(strings.NewReader("ʃa tʰə ʃa\nna mi na\n\nmi ʃa\n"), "gold")
	if err != nil {
		t.Fatal(err)
	}
	pred, _, err := ReadSegmented(strings.NewReader("ʃa tʰəʃa\nnami na\n\nmi ʃ a\n"), "pred")
	if err != nil {
		t.Fatal(err)
	}
	s, err := Compare(gold, pred)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

func TestJSONGolden(t *testing.T) {
	golden(t, "scores.json.golden", goldenScores(t).JSON())
}

func TestTableGolden(t *testing.T) {
	var buf bytes.Buffer
	if err := goldenScores(t).WriteTable(&buf); err != nil {
		t.Fatal(err)
	}
	golden(t, "scores.table.golden", buf.Bytes())
}

// TestJSONContract checks the shape DESIGN.md section 6 fixes: one object
// whose first keys are utterances, boundary, token and lexicon, the last
// three objects with keys precision, recall and f.
func TestJSONContract(t *testing.T) {
	out := goldenScores(t).JSON()
	dec := json.NewDecoder(bytes.NewReader(out))
	var keys []string
	var object map[string]json.RawMessage
	if err := dec.Decode(&object); err != nil {
		t.Fatal(err)
	}
	if dec.More() {
		t.Fatal("more than one JSON value")
	}
	dec = json.NewDecoder(bytes.NewReader(out))
	if tok, err := dec.Token(); err != nil || tok != json.Delim('{') {
		t.Fatalf("output does not start an object: %v %v", tok, err)
	}
	for dec.More() {
		tok, err := dec.Token()
		if err != nil {
			t.Fatal(err)
		}
		keys = append(keys, tok.(string))
		var skip json.RawMessage
		if err := dec.Decode(&skip); err != nil {
			t.Fatal(err)
		}
	}
	if got := strings.Join(keys[:4], " "); got != "utterances boundary token lexicon" {
		t.Errorf("first keys %q", got)
	}
	for _, k := range []string{"boundary", "token", "lexicon"} {
		var prf map[string]float64
		if err := json.Unmarshal(object[k], &prf); err != nil {
			t.Fatalf("%s: %v", k, err)
		}
		if len(prf) != 3 || !hasKeys(prf, "precision", "recall", "f") {
			t.Errorf("%s has keys %v, want precision, recall, f", k, prf)
		}
	}
	if !bytes.HasSuffix(out, []byte("}\n")) || bytes.Count(out, []byte("\n")) != 1 {
		t.Errorf("output is not one line: %q", out)
	}
}

func hasKeys(m map[string]float64, keys ...string) bool {
	for _, k := range keys {
		if _, ok := m[k]; !ok {
			return false
		}
	}
	return true
}
