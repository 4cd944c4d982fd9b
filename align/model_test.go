package align

import (
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// TestNormalisation checks that P(e | w) with no length term sums to 1
// over all V^m token sequences of each length m: Model 1's product of
// per-token mixtures, each of which sums to 1 over the vocabulary (Brown et
// al. 1993). It fails if the normaliser or the table is wrong.
func TestNormalisation(t *testing.T) {
	translations := [][]string{{"a", "b"}, {"c"}, {"a", "a", "c"}, {"b"}}
	words := [][]int32{{0, 1}, {2}, {0, 2, 2}, {1, 3}}
	for _, tc := range []struct {
		beta          float64
		noNull, sized bool
	}{{0, false, false}, {0.5, false, false}, {4, false, false}, {0.5, true, false}, {0.5, false, true}, {0.5, true, true}} {
		m := NewModel(translations, tc.beta)
		m.NoNull = tc.noNull
		if tc.sized {
			m.Size, m.NullSize = testSize, 1.5
		}
		m.Estimate(words, 3)
		for _, ws := range [][]int32{{0}, {0, 1}, {2, 2, 7}, {1, 3, 0, 2}} {
			for length := 1; length <= 4; length++ {
				seq := make([]int32, length)
				total := 0.0
				for {
					total += math.Exp(m.LogProbTokens(seq, ws))
					i := 0
					for i < length && seq[i] == int32(m.VocabSize())-1 {
						seq[i] = 0
						i++
					}
					if i == length {
						break
					}
					seq[i]++
				}
				if math.Abs(total-1) > 1e-12 {
					t.Errorf("beta %g, NoNull %v, sized %v, words %v: sum over %d-token translations %.15f, want 1",
						tc.beta, tc.noNull, tc.sized, ws, length, total)
				}
			}
		}
	}
}

// objective returns the log posterior up to a constant that EM with the
// table formula of Model increases: log P(e | w) + sum over seen words w
// (and NULL) of sum_e Beta p(e) log t(e|w), the log Dirichlet(Beta p + 1)
// density without its normaliser.
func objective(m *Model, words [][]int32) float64 {
	lp := m.LogLikelihood(words)
	if m.Beta == 0 {
		return lp
	}
	for _, w := range seenWords(m, words) {
		for e := range int32(m.VocabSize()) {
			lp += m.Beta * m.Prior(e) * math.Log(m.Prob(e, w))
		}
	}
	return lp
}

// TestEMMonotone checks that each EM iteration does not decrease the log
// likelihood (Beta = 0) or the log posterior (Beta > 0): Dempster, Laird &
// Rubin (1977), theorem 1 (number from memory). A wrong E-step or M-step
// soon breaks it.
// With Size the E-step weighs each alignment by its prior, so the
// theorem holds for that model too.
func TestEMMonotone(t *testing.T) {
	for _, tc := range []struct {
		beta  float64
		sized bool
	}{{0, false}, {0.3, false}, {5, false}, {1, true}} {
		beta, sized := tc.beta, tc.sized
		rng := rand.New(rand.NewPCG(1, uint64(beta*10)))
		words, translations := randomCorpus(rng, 80, 25, 20, 5)
		m := NewModel(translations, beta)
		if sized {
			m.Size = testSize
		}
		prev := objective(m, words)
		for it := range 30 {
			m.Estimate(words, 1)
			cur := objective(m, words)
			if cur < prev-1e-9*math.Abs(prev) {
				t.Errorf("beta %g: iteration %d lowered the objective from %.12g to %.12g", beta, it+1, prev, cur)
			}
			prev = cur
		}
	}
}

// TestTable checks the table against its definition after EM: t(e|w) =
// (n(e,w) + Beta p(e)) / (n(w) + Beta), each row sums to 1, an unseen word
// predicts p(e), and the expected counts add up to the number of tokens
// (each token's alignment posterior sums to 1).
func TestTable(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 3))
	words, translations := randomCorpus(rng, 60, 15, 12, 4)
	m := NewModel(translations, 0.7)
	m.Estimate(words, 4)

	tokens := 0
	for _, tr := range translations {
		tokens += len(tr)
	}
	countSum := 0.0
	for _, w := range append(seenWords(m, words), 1000) {
		nw, rowSum := 0.0, 0.0
		for e := range int32(m.VocabSize()) {
			nw += m.Count(e, w)
		}
		countSum += nw
		for e := range int32(m.VocabSize()) {
			want := (m.Count(e, w) + m.Beta*m.Prior(e)) / (nw + m.Beta)
			if got := m.Prob(e, w); math.Abs(got-want) > 1e-12 {
				t.Errorf("t(%s|%d) = %g, formula %g", m.Word(e), w, got, want)
			}
			rowSum += m.Prob(e, w)
		}
		if math.Abs(rowSum-1) > 1e-12 {
			t.Errorf("row of word %d sums to %.15f", w, rowSum)
		}
	}
	if math.Abs(countSum-float64(tokens)) > 1e-9 {
		t.Errorf("expected counts sum to %g, %d tokens", countSum, tokens)
	}
	prior := 0.0
	for e := range int32(m.VocabSize()) {
		prior += m.Prior(e)
		if m.Prob(e, 1000) != m.Prior(e) {
			t.Errorf("unseen word: t(%s) = %g, p(e) = %g", m.Word(e), m.Prob(e, 1000), m.Prior(e))
		}
	}
	if math.Abs(prior-1) > 1e-12 {
		t.Errorf("p(e) sums to %g", prior)
	}

	m.Reset()
	for e := range int32(m.VocabSize()) {
		if m.Prob(e, Null) != m.Prior(e) || m.Prob(e, words[0][0]) != m.Prior(e) || m.Count(e, words[0][0]) != 0 {
			t.Fatalf("after Reset, t(%s|.) is not p(e)", m.Word(e))
		}
	}
	if m.Occurrences(words[0][0]) != 0 {
		t.Errorf("after Reset, %d occurrences", m.Occurrences(words[0][0]))
	}
}

// TestFirstIterationUniform checks the claim that starting from p(e)
// instead of NLTK's uniform table changes nothing: after one iteration each
// word's counts are its share of tokens under uniform alignment, 1/(k+1)
// per token and occurrence.
func TestFirstIterationUniform(t *testing.T) {
	translations := [][]string{{"x", "y", "x"}, {"y"}}
	words := [][]int32{{0, 1, 1}, {1}}
	m := NewModel(translations, 0)
	m.Estimate(words, 1)
	x, _ := m.ID("x")
	y, _ := m.ID("y")
	for _, c := range []struct {
		e, w int32
		want float64
	}{
		{x, 0, 2.0 / 4}, {y, 0, 1.0 / 4}, {x, 1, 2 * 2.0 / 4}, {y, 1, 2*1.0/4 + 0.5},
		{x, Null, 2.0 / 4}, {y, Null, 1.0/4 + 0.5},
	} {
		if got := m.Count(c.e, c.w); math.Abs(got-c.want) > 1e-15 {
			t.Errorf("n(%s,%d) = %g, want %g", m.Word(c.e), c.w, got, c.want)
		}
	}
}

func TestPanics(t *testing.T) {
	m := NewModel([][]string{{"a"}, {"b"}}, 1)
	words := [][]int32{{0}, {1}}
	for name, f := range map[string]func(){
		"wrong number of utterances": func() { m.Estimate(words[:1], 1) },
		"negative word id":           func() { m.Estimate([][]int32{{0}, {-2}}, 1) },
		"negative Beta":              func() { m2 := NewModel([][]string{{"a"}}, -1); m2.Estimate([][]int32{{0}}, 1) },
		"stale Sums": func() {
			s := m.NewSums(words)
			m.Estimate(words, 1)
			s.SplitDelta(0, 0, 1, 2)
		},
		"Sums after Beta changed": func() {
			s := m.NewSums(words)
			m.Beta = 2
			s.LogProb(0)
		},
		"join in a one-word utterance": func() {
			m.Beta = 1
			s := m.NewSums(words)
			s.JoinDelta(0, 0, 0, 1)
		},
	} {
		t.Run(name, func(t *testing.T) {
			defer func() {
				r := recover()
				if s, ok := r.(string); !ok || !strings.HasPrefix(s, "align: ") {
					t.Errorf("panic %v, want an align: message", r)
				}
			}()
			f()
		})
	}
}

func TestGlosses(t *testing.T) {
	// Word 0 comes with "house", word 1 with "book", and "the" is in
	// every translation; word 2 is seen once.
	translations := [][]string{
		{"the", "house"}, {"the", "book"}, {"the", "house", "book"}, {"the", "house"},
		{"the", "book"}, {"the", "big", "house"}, {"the", "book"}, {"the", "house", "old"},
	}
	words := [][]int32{{0}, {1}, {0, 1}, {3, 0}, {1, 3}, {2, 0}, {1}, {0, 3}}
	m := NewModel(translations, 0.5)
	m.Estimate(words, 20)

	for _, c := range []struct {
		w     int32
		first string
	}{{0, "house"}, {1, "book"}, {Null, "the"}} {
		gs := m.Glosses(c.w, 10, 2)
		if len(gs) == 0 || gs[0].Word != c.first {
			t.Errorf("Glosses(%d) = %+v, want %q first", c.w, gs, c.first)
			continue
		}
		for i, g := range gs {
			e, _ := m.ID(g.Word)
			want := m.Count(e, c.w) * math.Log(m.Prob(e, c.w)/m.Prior(e))
			if g.Score <= 0 || math.Abs(g.Score-want) > 1e-12 || g.Prob != m.Prob(e, c.w) || g.Count != m.Count(e, c.w) {
				t.Errorf("Glosses(%d)[%d] = %+v, score formula %g", c.w, i, g, want)
			}
			if i > 0 && g.Score > gs[i-1].Score {
				t.Errorf("Glosses(%d) not sorted: %+v", c.w, gs)
			}
		}
	}
	if m.Occurrences(2) != 1 || m.Glosses(2, 10, 2) != nil {
		t.Errorf("word seen %d times got glosses %+v with minCount 2", m.Occurrences(2), m.Glosses(2, 10, 2))
	}
	if gs := m.Glosses(2, 10, 1); len(gs) == 0 {
		t.Error("word seen once has no glosses with minCount 1")
	}
	if gs := m.Glosses(0, 1, 0); len(gs) != 1 {
		t.Errorf("Glosses with k = 1 gave %d", len(gs))
	}
	if gs := m.Glosses(99, 3, 0); gs != nil {
		t.Errorf("unseen word has glosses %+v", gs)
	}
}
