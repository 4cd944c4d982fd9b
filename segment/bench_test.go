package segment_test

import (
	"math/rand/v2"
	"os"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// benchCorpus reads the English child-directed corpus when present
// (../shared/corpora, never committed), else the UDHR Spanish corpus.
func benchCorpus(b *testing.B) *Corpus {
	for _, path := range []string{"../../shared/corpora/cds-english/gold.txt", "../data/eval/udhr/spa/gold.txt"} {
		f, err := os.Open(path)
		if err != nil {
			continue
		}
		defer f.Close()
		c, err := ReadCorpus(f, path, ReadOptions{})
		if err != nil {
			b.Fatal(err)
		}
		c.IndexSpans(24) // as Run does
		return c
	}
	b.Skip("no corpus")
	return nil
}

// benchmarkSweep measures one Gibbs sweep at temperature 1 after a short
// warm-up, per sweep; -benchmem shows allocations per sweep.
func benchmarkSweep(b *testing.B, order int, d float64) {
	c := benchCorpus(b)
	rng := rand.New(rand.NewPCG(1, 2))
	m := NewWords(c, order, PitmanYor{d, 1000}, PitmanYor{d, 100}, UniformBase{WordEnd: 0.5, Units: len(c.Inventory)})
	g := NewWordsGibbs(RandomSegmentation(c, 0.3, rng), m, rng)
	for i := 0; i < 3; i++ {
		g.Sweep(1, rng)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		g.Sweep(1, rng)
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(c.Units)), "ns/unit")
}

func BenchmarkSweepUnigram(b *testing.B)  { benchmarkSweep(b, 1, 0) }
func BenchmarkSweepBigram(b *testing.B)   { benchmarkSweep(b, 2, 0) }
func BenchmarkSweepBigramPY(b *testing.B) { benchmarkSweep(b, 2, 0.3) }

// benchmarkBlocked measures one blocked sweep (whole utterances).
func benchmarkBlocked(b *testing.B, order, maxLen int, uniProp bool) {
	c := benchCorpus(b)
	rng := rand.New(rand.NewPCG(1, 2))
	m := NewWords(c, order, PitmanYor{0, 1000}, PitmanYor{0, 100}, UniformBase{WordEnd: 0.5, Units: len(c.Inventory)})
	g := NewBlockedSampler(RandomSegmentation(c, 0.3, rng), m, maxLen, rng)
	g.UnigramProposal = uniProp
	for i := 0; i < 2; i++ {
		g.Sweep(1, rng)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		g.Sweep(1, rng)
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(c.Units)), "ns/unit")
	b.ReportMetric(g.AcceptanceRate(), "accept")
}

func BenchmarkBlockedUnigram(b *testing.B)           { benchmarkBlocked(b, 1, 16, false) }
func BenchmarkBlockedBigram(b *testing.B)            { benchmarkBlocked(b, 2, 16, false) }
func BenchmarkBlockedBigramUniProposal(b *testing.B) { benchmarkBlocked(b, 2, 16, true) }
