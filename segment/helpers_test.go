package segment_test

import (
	"math/rand/v2"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
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

// sweepChain adapts a sampler to the exact harness: a step is one sweep at
// temperature 1.
type sweepChain struct {
	g interface {
		Sweep(temperature float64, rng *rand.Rand)
	}
	seg *Segmentation
	rng *rand.Rand
}

func (c *sweepChain) Step()                  { c.g.Sweep(1, c.rng) }
func (c *sweepChain) Current() *Segmentation { return c.seg }

// truncatedPosterior returns the exact posterior of the model with the
// given log joint, truncated to words of at most maxLen units (0: no
// limit), leaving out segmentations of negligible probability.
func truncatedPosterior(c *Corpus, maxLen int, logJoint func(*Segmentation) float64) map[string]float64 {
	post := exact.Posterior(c, func(s *Segmentation) float64 {
		if maxLen > 0 && longestWord(s) > maxLen {
			return -1e300
		}
		return logJoint(s)
	})
	for k, p := range post {
		if p < 1e-200 {
			delete(post, k)
		}
	}
	return post
}
