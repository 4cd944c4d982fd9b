package segment_test

import (
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// tinyCorpus reads lines (one utterance each) into a Corpus.
func tinyCorpus(t testing.TB, lines ...string) *Corpus {
	t.Helper()
	c, err := ReadCorpus(strings.NewReader(strings.Join(lines, "\n")), "tiny", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	return c
}
