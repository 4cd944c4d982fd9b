package score

import (
	"encoding/json"
	"math"
	"os"
	"testing"
)

// referenceFixture is testdata/reference.json, written by
// scripts/score-fixture.sh: scores computed by scikit-learn
// (precision_recall_fscore_support, boundary P/R/F) and NLTK
// (nltk.metrics.scores for token and lexicon P/R/F,
// nltk.metrics.segmentation for WindowDiff and Pk).
type referenceFixture struct {
	Versions map[string]any `json:"versions"`
	Cases    []struct {
		Name       string     `json:"name"`
		Reference  [][]string `json:"reference"`
		Predicted  [][]string `json:"predicted"`
		Utterances int        `json:"utterances"`
		Characters int        `json:"characters"`
		Boundary   PRF        `json:"boundary"`
		Token      PRF        `json:"token"`
		Lexicon    PRF        `json:"lexicon"`
		WindowDiff float64    `json:"windowdiff"`
		Pk         float64    `json:"pk"`
		Window     int        `json:"window"`
	} `json:"cases"`
}

func TestReferenceLibraries(t *testing.T) {
	data, err := os.ReadFile("testdata/reference.json")
	if err != nil {
		t.Fatal(err)
	}
	var fx referenceFixture
	if err := json.Unmarshal(data, &fx); err != nil {
		t.Fatal(err)
	}
	if len(fx.Cases) < 200 {
		t.Fatalf("fixture has %d cases, want at least 200; regenerate with scripts/score-fixture.sh", len(fx.Cases))
	}
	for _, key := range []string{"sklearn", "nltk"} {
		if fx.Versions[key] == nil {
			t.Errorf("fixture does not record the %s version", key)
		}
	}
	const tol = 1e-12
	for _, c := range fx.Cases {
		got, err := Compare(c.Reference, c.Predicted)
		if err != nil {
			t.Errorf("%s: %v", c.Name, err)
			continue
		}
		if got.Utterances != c.Utterances || got.Characters != c.Characters || got.Window != c.Window {
			t.Errorf("%s: utterances, characters, window = %d, %d, %d; fixture has %d, %d, %d",
				c.Name, got.Utterances, got.Characters, got.Window, c.Utterances, c.Characters, c.Window)
		}
		for _, m := range []struct {
			name      string
			got, want float64
		}{
			{"boundary precision", got.Boundary.Precision, c.Boundary.Precision},
			{"boundary recall", got.Boundary.Recall, c.Boundary.Recall},
			{"boundary F", got.Boundary.F, c.Boundary.F},
			{"token precision", got.Token.Precision, c.Token.Precision},
			{"token recall", got.Token.Recall, c.Token.Recall},
			{"token F", got.Token.F, c.Token.F},
			{"lexicon precision", got.Lexicon.Precision, c.Lexicon.Precision},
			{"lexicon recall", got.Lexicon.Recall, c.Lexicon.Recall},
			{"lexicon F", got.Lexicon.F, c.Lexicon.F},
			{"windowdiff", got.WindowDiff, c.WindowDiff},
			{"pk", got.Pk, c.Pk},
		} {
			if math.Abs(m.got-m.want) > tol {
				t.Errorf("%s: %s = %.17g, reference library gives %.17g", c.Name, m.name, m.got, m.want)
			}
		}
	}
}
