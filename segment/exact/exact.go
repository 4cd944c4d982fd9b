// Package exact computes exact posteriors over every segmentation of a tiny
// corpus and checks samplers against them with a chi-square test.
//
// It is the shared harness of STYLE.md: every model and sampler in juncture
// must reproduce the exact posterior P(segmentation | corpus), obtained by
// enumerating all 2^(free gaps) segmentations and normalising their joint
// probabilities.
package exact

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/juncture-project/juncture/segment"
	"gonum.org/v1/gonum/stat/distuv"
)

// MaxGaps is the most free gaps Enumerate accepts (2^MaxGaps segmentations).
const MaxGaps = 20

// freeGaps returns the positions of c that a sampler may change.
func freeGaps(c *segment.Corpus) []int {
	var gaps []int
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		for i := start + 1; i < end; i++ {
			if c.LockAt(i) == segment.Free {
				gaps = append(gaps, i)
			}
		}
	}
	return gaps
}

// Enumerate calls f with every segmentation of c that keeps c's locks. The
// segmentation passed to f is reused between calls.
func Enumerate(c *segment.Corpus, f func(*segment.Segmentation)) {
	gaps := freeGaps(c)
	if len(gaps) > MaxGaps {
		panic(fmt.Sprintf("exact: %d free gaps, at most %d", len(gaps), MaxGaps))
	}
	s := segment.NewSegmentation(c)
	for mask := 0; mask < 1<<len(gaps); mask++ {
		for j, i := range gaps {
			s.Boundary[i] = mask&(1<<j) != 0
		}
		f(s)
	}
}

// Key returns a string naming the segmentation s: its utterances' words
// joined by spaces, utterances separated by " | ".
func Key(s *segment.Segmentation) string {
	var b strings.Builder
	for u := 0; u < s.Corpus.Len(); u++ {
		if u > 0 {
			b.WriteString(" | ")
		}
		b.WriteString(strings.Join(s.WordStrings(u), " "))
	}
	return b.String()
}

// Posterior returns P(segmentation | corpus) for every segmentation of c,
// keyed by Key, given a function computing the log joint probability.
func Posterior(c *segment.Corpus, logJoint func(*segment.Segmentation) float64) map[string]float64 {
	logs := map[string]float64{}
	max := math.Inf(-1)
	Enumerate(c, func(s *segment.Segmentation) {
		lp := logJoint(s)
		logs[Key(s)] = lp
		max = math.Max(max, lp)
	})
	total := 0.0
	for _, lp := range logs {
		total += math.Exp(lp - max)
	}
	post := make(map[string]float64, len(logs))
	for k, lp := range logs {
		post[k] = math.Exp(lp-max) / total
	}
	return post
}

// Result is the outcome of a chi-square goodness-of-fit test.
type Result struct {
	Stat    float64 // Pearson's X^2
	DF      int     // degrees of freedom: bins - 1
	P       float64 // upper tail probability of X^2 under chi-square(DF)
	Samples int
	// Worst lists the bins contributing most to Stat, for messages.
	Worst []string
}

func (r Result) String() string {
	return fmt.Sprintf("X^2=%.2f df=%d p=%.3g n=%d; largest contributions: %s",
		r.Stat, r.DF, r.P, r.Samples, strings.Join(r.Worst, "; "))
}

// ChiSquare compares counts of sampled segmentations with the exact
// posterior by Pearson's chi-square test. Bins whose expected count is below
// 5 are pooled into one bin (common practice for Pearson's test). A sample
// outside the posterior's support is reported with P = 0.
func ChiSquare(post map[string]float64, counts map[string]int) Result {
	n := 0
	for k, c := range counts {
		if post[k] == 0 {
			return Result{Stat: math.Inf(1), P: 0, Samples: c, Worst: []string{"outside support: " + k}}
		}
		n += c
	}
	keys := make([]string, 0, len(post))
	for k := range post {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	type bin struct {
		name     string
		obs, exp float64
	}
	var bins []bin
	pooled := bin{name: "(pooled small bins)"}
	for _, k := range keys {
		e := post[k] * float64(n)
		if e < 5 {
			pooled.obs += float64(counts[k])
			pooled.exp += e
			continue
		}
		bins = append(bins, bin{k, float64(counts[k]), e})
	}
	if pooled.exp > 0 {
		bins = append(bins, pooled)
	}
	r := Result{Samples: n, DF: len(bins) - 1}
	contrib := make([]float64, len(bins))
	for i, b := range bins {
		d := b.obs - b.exp
		contrib[i] = d * d / b.exp
		r.Stat += contrib[i]
	}
	if r.DF < 1 {
		r.P = 1
		return r
	}
	r.P = distuv.ChiSquared{K: float64(r.DF)}.Survival(r.Stat)
	order := make([]int, len(bins))
	for i := range order {
		order[i] = i
	}
	sort.Slice(order, func(a, b int) bool { return contrib[order[a]] > contrib[order[b]] })
	for _, i := range order[:min(3, len(order))] {
		b := bins[i]
		r.Worst = append(r.Worst, fmt.Sprintf("%q obs %.0f exp %.1f", b.name, b.obs, b.exp))
	}
	return r
}

// Chain is a sampler at temperature 1 as the harness sees it.
type Chain interface {
	// Step advances the chain by one sweep.
	Step()
	// Current returns the chain's current segmentation.
	Current() *segment.Segmentation
}

// Sample runs chain for burn sweeps, then records its state every thin
// sweeps until it has n samples, and returns the counts by Key.
func Sample(chain Chain, burn, thin, n int) map[string]int {
	for i := 0; i < burn; i++ {
		chain.Step()
	}
	counts := map[string]int{}
	for k := 0; k < n; k++ {
		for i := 0; i < thin; i++ {
			chain.Step()
		}
		counts[Key(chain.Current())]++
	}
	return counts
}
