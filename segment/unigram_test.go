package segment_test

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	. "github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/exact"
)

// unigramChain adapts UnigramGibbs to the exact harness at temperature 1.
type unigramChain struct {
	g   *UnigramGibbs
	rng *rand.Rand
}

func (c *unigramChain) Step()                  { c.g.Sweep(1, c.rng) }
func (c *unigramChain) Current() *Segmentation { return c.g.Seg }
func unigramLogJoint(alpha, rho float64, base Base) func(*Segmentation) float64 {
	return func(s *Segmentation) float64 {
		m := NewUnigram(s.Corpus, alpha, rho, base)
		m.AddSegmentation(s)
		return m.LogJoint()
	}
}

// TestUnigramGibbsExactPosterior checks the sampler's stationary
// distribution against the exact posterior by enumeration.
func TestUnigramGibbsExactPosterior(t *testing.T) {
	cases := []struct {
		lines       []string
		alpha, pEnd float64
		rho         float64
	}{
		{[]string{"abab", "ab", "ba"}, 1, 0.5, 2},
		{[]string{"abab", "ab", "ba"}, 20, 0.5, 2},
		{[]string{"aaaa", "aa"}, 0.5, 0.3, 2},
		{[]string{"abcab", "cab", "ab"}, 5, 0.8, 1},
		{[]string{"dogdo", "gdog"}, 2, 0.5, 4},
	}
	for i, tc := range cases {
		t.Run(fmt.Sprint(i), func(t *testing.T) {
			c := tinyCorpus(t, tc.lines...)
			base := UniformBase{WordEnd: tc.pEnd, Units: len(c.Inventory)}
			post := exact.Posterior(c, unigramLogJoint(tc.alpha, tc.rho, base))
			rng := rand.New(rand.NewPCG(uint64(i), 7))
			g := NewUnigramGibbs(RandomSegmentation(c, 0.5, rng), NewUnigram(c, tc.alpha, tc.rho, base))
			counts := exact.Sample(&unigramChain{g, rng}, 100, 3, 20000)
			r := exact.ChiSquare(post, counts)
			if r.P < 1e-3 {
				t.Errorf("sampled segmentations differ from the exact posterior: %v", r)
			}
		})
	}
}

// TestExactHarnessRejectsWrongSampler makes sure the harness can fail: a
// sampler run at temperature 2 has the wrong stationary distribution.
func TestExactHarnessRejectsWrongSampler(t *testing.T) {
	c := tinyCorpus(t, "abab", "ab", "ba")
	base := UniformBase{WordEnd: 0.5, Units: len(c.Inventory)}
	post := exact.Posterior(c, unigramLogJoint(1, 2, base))
	rng := rand.New(rand.NewPCG(1, 2))
	g := NewUnigramGibbs(RandomSegmentation(c, 0.5, rng), NewUnigram(c, 1, 2, base))
	counts := exact.Sample(hotChain{g, rng}, 100, 3, 20000)
	if r := exact.ChiSquare(post, counts); r.P > 1e-6 {
		t.Errorf("harness accepted a sampler at temperature 2: %v", r)
	}
}

type hotChain struct {
	g   *UnigramGibbs
	rng *rand.Rand
}

func (c hotChain) Step()                  { c.g.Sweep(2, c.rng) }
func (c hotChain) Current() *Segmentation { return c.g.Seg }

// TestUnigramLogJointChainRule checks LogJoint against the product of the
// sequential predictive probabilities (n_w + a P0(w)) / (n + a) times the
// Beta-Bernoulli utterance-end terms, computed token by token.
func TestUnigramLogJointChainRule(t *testing.T) {
	c := tinyCorpus(t, "abcab", "cab", "ab", "abab")
	rng := rand.New(rand.NewPCG(3, 4))
	for trial := 0; trial < 20; trial++ {
		s := RandomSegmentation(c, 0.4, rng)
		base := UniformBase{WordEnd: 0.4, Units: len(c.Inventory)}
		m := NewUnigram(c, 3, 2, base)
		want := 0.0
		ends, conts := 0.0, 0.0
		for u := 0; u < c.Len(); u++ {
			words := 0
			s.Words(u, func(int, int) { words++ })
			k := 0
			s.Words(u, func(a, b int) {
				w := m.Intern(a, b)
				want += math.Log((float64(m.Count(w)) + 3*math.Exp(m.Types.LogBase[w])) / (float64(m.Tokens()) + 3))
				m.Add(w)
				k++
				if k == words { // utterance ends: P(end) = (ends + rho/2) / (decisions + rho)
					want += math.Log((ends + 1) / (ends + conts + 2))
					ends++
				} else {
					want += math.Log((conts + 1) / (ends + conts + 2))
					conts++
				}
			})
		}
		if got := m.LogJoint(); math.Abs(got-want) > 1e-9 {
			t.Fatalf("LogJoint = %v, chain rule gives %v", got, want)
		}
	}
}

// TestUnigramEwensSamplingFormula checks the model's partition probability
// against the Ewens sampling formula (Ewens 1972; Pitman 2006, ch. 2):
// for a base distribution with vanishing atoms, the probability of a
// sequence of n tokens with K types of sizes n_1..n_K, divided by the base
// probabilities of the K types, tends to a^K prod (n_k-1)! / (a)_n, where
// (a)_n is the rising factorial.
func TestUnigramEwensSamplingFormula(t *testing.T) {
	// Long words over a large inventory make P0 tiny (about 1e-60).
	c := tinyCorpus(t, "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ")
	base := UniformBase{WordEnd: 0.01, Units: 1000}
	s := NewSegmentation(c)
	// Words: 4 types of sizes 3, 2, 1, 1, made by reusing spans is not
	// possible in one line, so compare counts directly through Add.
	for _, alpha := range []float64{0.5, 1, 7.5} {
		m := NewUnigram(c, alpha, 2, base)
		sizes := []int{3, 2, 1, 1}
		spans := [][2]int{{0, 10}, {10, 20}, {20, 30}, {30, 40}}
		sumLogBase := 0.0
		n := 0
		for k, size := range sizes {
			w := m.Intern(spans[k][0], spans[k][1])
			sumLogBase += m.Types.LogBase[w]
			for j := 0; j < size; j++ {
				m.Add(w)
			}
			n += size
		}
		_ = s
		// Remove the utterance-end part: LogJoint includes it for U=1.
		h := m.Rho / 2
		endPart := lbeta(1+h, float64(n)-1+h) - lbeta(h, h)
		got := m.LogJoint() - endPart - sumLogBase
		want := float64(len(sizes)) * math.Log(alpha)
		for _, size := range sizes {
			want += lgamma(float64(size))
		}
		want -= lgamma(alpha+float64(n)) - lgamma(alpha)
		if math.Abs(got-want) > 1e-9 {
			t.Errorf("alpha %v: log P / prod P0 = %v, Ewens sampling formula gives %v", alpha, got, want)
		}
	}
}

// TestUnigramExpectedTypes draws token sequences from the model's
// predictive distribution and compares the mean number of types with the
// closed form E[K_n] = sum_{i<n} a/(a+i) for the Chinese restaurant process
// (Ewens 1972; Pitman 2006, ch. 3).
func TestUnigramExpectedTypes(t *testing.T) {
	const n, reps = 50, 4000
	for _, alpha := range []float64{1, 10} {
		want := 0.0
		for i := 0; i < n; i++ {
			want += alpha / (alpha + float64(i))
		}
		rng := rand.New(rand.NewPCG(11, uint64(alpha)))
		sum, sumSq := 0.0, 0.0
		for r := 0; r < reps; r++ {
			k := float64(crpTypes(alpha, n, rng))
			sum += k
			sumSq += k * k
		}
		mean := sum / reps
		se := math.Sqrt((sumSq/reps - mean*mean) / reps)
		if math.Abs(mean-want) > 4*se {
			t.Errorf("alpha %v: mean types %.3f, closed form %.3f (se %.3f)", alpha, mean, want, se)
		}
	}
}

// crpTypes draws n tokens from a Unigram model's predictive distribution
// whose base never repeats a word, and returns the number of types.
func crpTypes(alpha float64, n int, rng *rand.Rand) int {
	// A corpus of n distinct one-unit words stands for n fresh base draws.
	units := make([]string, n)
	for i := range units {
		units[i] = fmt.Sprintf("u%d", i)
	}
	c := NewCorpus("crp")
	if err := c.AddUtterance(units, 1); err != nil {
		panic(err)
	}
	m := NewUnigram(c, alpha, 2, UniformBase{WordEnd: 0.5, Units: 1e9})
	var seen []WordType
	for i := 0; i < n; i++ {
		// P(existing type w) is the model's predictive; the rest of the
		// mass, about a / (i + a) as atoms are tiny, goes to a new word.
		x := rng.Float64()
		var w WordType = -1
		for _, cand := range seen {
			x -= math.Exp(m.LogPredictive(cand))
			if x < 0 {
				w = cand
				break
			}
		}
		if w < 0 {
			w = m.Intern(i, i+1)
			seen = append(seen, w)
		}
		m.Add(w)
	}
	return len(seen)
}

func lgamma(x float64) float64 { v, _ := math.Lgamma(x); return v }

func lbeta(a, b float64) float64 { return lgamma(a) + lgamma(b) - lgamma(a+b) }
