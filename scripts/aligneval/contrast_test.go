package main

import (
	"math"
	"testing"

	"github.com/juncture-project/juncture/segment"
)

// TestContrast checks the signs and zero of the gold-against-learned
// comparison on the Spanish corpus: gold against itself differs by
// nothing (the Dirichlet-process unigram estimate is exact), and gold
// against one word per line is far better explained by the translations,
// since a whole line is a word seen once and predicts only the background.
func TestContrast(t *testing.T) {
	l, err := LoadLanguage("../../data/eval/udhr/spa", nil)
	if err != nil {
		t.Fatal(err)
	}
	cfg := segment.DefaultConfig()
	h := segment.Hyper{Alpha0: cfg.Alpha0, Alpha1: cfg.Alpha1, WordEnd: cfg.WordEnd}
	same := contrast(l, cfg, h, l.Reference, 1)
	if math.Abs(same.Words) > 1e-6 || same.Translation != 0 {
		t.Errorf("gold against itself: %+v", same)
	}
	lines := &segment.Segmentation{Corpus: l.Corpus, Boundary: make([]bool, len(l.Corpus.Units))}
	for u := range l.Corpus.Len() {
		start, _ := l.Corpus.Utterance(u)
		lines.Boundary[start] = true
	}
	c := contrast(l, cfg, h, lines, 1)
	if !(c.Translation > 100) {
		t.Errorf("gold against whole lines: translation %+.1f nats, want gold far ahead", c.Translation)
	}
}
