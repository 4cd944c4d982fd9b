package segment_test

import (
	"fmt"
	"math/rand/v2"
	"os"
	"strings"
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
	timeSweeps(b, g, rng, len(c.Units))
}

// sweeper is what the benchmarks time.
type sweeper interface{ Sweep(float64, *rand.Rand) }

// timeSweeps times b.N sweeps of g at temperature 1 over a corpus of
// units units, reporting allocations and nanoseconds per unit per sweep.
func timeSweeps(b *testing.B, g sweeper, rng *rand.Rand, units int) {
	timeSweepsAt(b, g, rng, units, 1)
}

// timeSweepsAt is timeSweeps at the given temperature.
func timeSweepsAt(b *testing.B, g sweeper, rng *rand.Rand, units int, temperature float64) {
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		g.Sweep(temperature, rng)
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(units), "ns/unit")
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
	timeSweeps(b, g, rng, len(c.Units))
	b.ReportMetric(g.AcceptanceRate(), "accept")
}

func BenchmarkBlockedUnigram(b *testing.B)           { benchmarkBlocked(b, 1, 16, false) }
func BenchmarkBlockedBigram(b *testing.B)            { benchmarkBlocked(b, 2, 16, false) }
func BenchmarkBlockedBigramUniProposal(b *testing.B) { benchmarkBlocked(b, 2, 16, true) }

// benchmarkCollocation measures one sweep of the collocation sampler
// (blocked moves and relabelling) with the 16 Klattese vowels as nuclei, as
// the README's collocation runs use, optionally with the phonotactic base.
func benchmarkCollocation(b *testing.B, phonotactics bool, temperature float64) {
	c := benchCorpus(b)
	nuc, err := NewNuclei(c, strings.Fields("i I e E @ a c o U u ^ x R Y W O"))
	if err != nil {
		b.Skip("not the English corpus")
	}
	rng := rand.New(rand.NewPCG(1, 2))
	ub := UniformBase{WordEnd: 0.5, Units: len(c.Inventory), Nuclei: nuc}
	c.IndexSpans(MaxCollocationLength) // as learning does for this model
	if phonotactics {
		ub.Shapes = NewPhonotactics(c, nuc, 0, MaxCollocationLength)
	}
	seg := RandomSegmentation(c, 0.3, rng)
	nuc.Repair(seg)
	m := NewCollocations(c, PitmanYor{0.3, 200}, PitmanYor{0.3, 1000}, ub, 0.5)
	g := NewCollocationSampler(seg, nil, m, 24, rng)
	for i := 0; i < 2; i++ {
		g.Sweep(temperature, rng)
	}
	timeSweepsAt(b, g, rng, len(c.Units), temperature)
	b.ReportMetric(g.AcceptanceRate(), "accept")
}

func BenchmarkCollocation(b *testing.B)             { benchmarkCollocation(b, false, 1) }
func BenchmarkCollocationPhonotactics(b *testing.B) { benchmarkCollocation(b, true, 1) }

// BenchmarkCollocationAnnealed is BenchmarkCollocationPhonotactics at
// temperature 3, where every grouping-lattice weight is tempered, as in
// the first sweeps of a run's burn-in.
func BenchmarkCollocationAnnealed(b *testing.B) { benchmarkCollocation(b, true, 3) }

// BenchmarkScale measures one sweep at temperature 1 over k shuffled
// copies of the English corpus (when present), starting from its reference
// segmentation, for every model and sampler: ns/unit should not grow with
// k (linear cost). Starting near the posterior matters: from a random
// segmentation every copy is cut differently, so the lexicon and the
// restaurants grow with k and larger corpora look dearer per unit.
func BenchmarkScale(b *testing.B) {
	data, err := os.ReadFile("../../shared/corpora/cds-english/gold.txt")
	if err != nil {
		b.Skip("no English corpus")
	}
	lines := strings.Split(strings.TrimSpace(string(data)), "\n")
	for _, k := range []int{1, 16} {
		for _, order := range []int{1, 2} {
			for _, blocked := range []bool{false, true} {
				name := fmt.Sprintf("x%d/order%d/boundary", k, order)
				if blocked {
					name = fmt.Sprintf("x%d/order%d/blocked", k, order)
				}
				b.Run(name, func(b *testing.B) {
					rng := rand.New(rand.NewPCG(1, 2))
					var all []string
					for range k {
						all = append(all, lines...)
					}
					rng.Shuffle(len(all), func(i, j int) { all[i], all[j] = all[j], all[i] })
					c, err := ReadCorpus(strings.NewReader(strings.Join(all, "\n")), "x", ReadOptions{SpacesAreBoundaries: true})
					if err != nil {
						b.Fatal(err)
					}
					seg := NewSegmentation(c) // the reference: spaces locked as boundaries
					c.Locks = nil             // then every gap free
					c.IndexSpans(24)
					// Hyperparameters near those sampled given the reference.
					m := NewWords(c, order, PitmanYor{0, 2500}, PitmanYor{0, 60}, UniformBase{WordEnd: 0.22, Units: len(c.Inventory)})
					var g sweeper
					if blocked {
						g = NewBlockedSampler(seg, m, 24, rng)
					} else {
						g = NewWordsGibbs(seg, m, rng)
					}
					g.Sweep(1, rng)
					timeSweeps(b, g, rng, len(c.Units))
				})
			}
		}
	}
}
