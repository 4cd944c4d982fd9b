package align_test

import (
	"encoding/json"
	"math"
	"os"
	"testing"

	"github.com/juncture-project/juncture/align"
)

// nltkFixture is align/testdata/ibm1_nltk.json, written by
// scripts/align-fixture.sh from Debian's python3-nltk.
type nltkFixture struct {
	Versions struct {
		NLTK string `json:"nltk"`
	} `json:"versions"`
	Corpora []struct {
		Name       string `json:"name"`
		Iterations int    `json:"iterations"`
		Pairs      []struct {
			Words  []string `json:"words"`
			Tokens []string `json:"tokens"`
		} `json:"pairs"`
		Table    [][3]any `json:"table"` // token, word or null, t(token|word)
		LogProbs []struct {
			Pair    int     `json:"pair"`
			LogProb float64 `json:"logprob"`
		} `json:"logprobs"`
	} `json:"corpora"`
}

// fit interns the words of pairs and fits an unsmoothed model, as NLTK's
// IBMModel1 does.
func fit(t *testing.T, words, tokens [][]string, iterations int) (*align.Model, [][]int32, map[string]int32) {
	t.Helper()
	ids := map[string]int32{}
	wordIDs := make([][]int32, len(words))
	for u, ws := range words {
		for _, w := range ws {
			id, ok := ids[w]
			if !ok {
				id = int32(len(ids))
				ids[w] = id
			}
			wordIDs[u] = append(wordIDs[u], id)
		}
	}
	m := align.NewModel(tokens, 0)
	m.Estimate(wordIDs, iterations)
	return m, wordIDs, ids
}

// TestNLTK checks the translation table and P(tokens | words) against NLTK
// 3.8's nltk.translate.IBMModel1 (the fixture records the version): plain
// EM, Beta = 0, agreeing to 1e-9 relative.
func TestNLTK(t *testing.T) {
	data, err := os.ReadFile("testdata/ibm1_nltk.json")
	if err != nil {
		t.Fatal(err)
	}
	var fx nltkFixture
	if err := json.Unmarshal(data, &fx); err != nil {
		t.Fatal(err)
	}
	if len(fx.Corpora) == 0 || fx.Versions.NLTK == "" {
		t.Fatal("fixture has no corpora or no NLTK version")
	}
	for _, c := range fx.Corpora {
		t.Run(c.Name, func(t *testing.T) {
			var words, tokens [][]string
			for _, p := range c.Pairs {
				words = append(words, p.Words)
				tokens = append(tokens, p.Tokens)
			}
			m, wordIDs, ids := fit(t, words, tokens, c.Iterations)
			worst := 0.0
			cells := map[[2]int32]bool{}
			for _, row := range c.Table {
				e, ok := m.ID(row[0].(string))
				if !ok {
					t.Fatalf("token %q not in the model", row[0])
				}
				w := align.Null
				if row[1] != nil {
					w = ids[row[1].(string)]
				}
				want := row[2].(float64)
				got := m.Prob(e, w)
				rel := math.Abs(got-want) / want
				worst = max(worst, rel)
				if rel > 1e-9 {
					t.Errorf("t(%s|%v) = %.17g, NLTK %.17g", row[0], row[1], got, want)
				}
				cells[[2]int32{e, w}] = true
			}
			// The model has counts exactly for the pairs NLTK has.
			for e := int32(0); e < int32(m.VocabSize()); e++ {
				for w := align.Null; w < int32(len(ids)); w++ {
					if has := m.Count(e, w) > 0; has != cells[[2]int32{e, w}] {
						t.Errorf("n(%s|%d) = %g, NLTK has the pair: %v", m.Word(e), w, m.Count(e, w), !has)
					}
				}
			}
			sums := m.NewSums(wordIDs)
			for _, lp := range c.LogProbs {
				got := m.LogProb(lp.Pair, wordIDs[lp.Pair])
				if d := math.Abs(got - lp.LogProb); d > 1e-9 {
					t.Errorf("pair %d: log P = %.17g, NLTK alignment sum %.17g", lp.Pair, got, lp.LogProb)
				}
				if d := math.Abs(sums.LogProb(lp.Pair) - lp.LogProb); d > 1e-9 {
					t.Errorf("pair %d: Sums log P = %.17g, NLTK alignment sum %.17g", lp.Pair, sums.LogProb(lp.Pair), lp.LogProb)
				}
			}
			t.Logf("%d table cells, %d log-probabilities; worst relative difference %.2g",
				len(c.Table), len(c.LogProbs), worst)
		})
	}
}

// TestNLTKDocstring checks the values printed in the IBMModel1 docstring
// of NLTK 3.8 (nltk/translate/ibm1.py), rounded to three places there:
// German is the translation and English the words. An outside source apart
// from the fixture.
func TestNLTKDocstring(t *testing.T) {
	words := [][]string{
		{"the", "house", "is", "small"}, {"the", "house", "is", "big"}, {"the", "book", "is", "small"},
		{"the", "house"}, {"the", "book"}, {"a", "book"},
	}
	tokens := [][]string{
		{"klein", "ist", "das", "haus"}, {"das", "haus", "ist", "ja", "groß"}, {"das", "buch", "ist", "ja", "klein"},
		{"das", "haus"}, {"das", "buch"}, {"ein", "buch"},
	}
	m, _, ids := fit(t, words, tokens, 5)
	id := func(s string) int32 { e, _ := m.ID(s); return e }
	for _, c := range []struct {
		token string
		word  int32
		want  float64
	}{
		{"buch", ids["book"], 0.889},
		{"das", ids["book"], 0.062},
		{"buch", align.Null, 0.113},
		{"ja", align.Null, 0.073},
	} {
		if got := m.Prob(id(c.token), c.word); math.Abs(got-c.want) > 0.0005 {
			t.Errorf("t(%s|%d) = %.4f, NLTK docstring %.3f", c.token, c.word, got, c.want)
		}
	}
}
