package align

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// TestReverseWorked checks the reverse table and factor on a corpus small
// enough to do by hand: translations "dog" and "dog cat", words 0 and 0 1,
// Beta 1, one EM iteration. Worked by hand with fractions (then checked
// with Python's fractions module): N = 3, p(0) = 2/3, p(1) = 1/3; the
// first E-step spreads each word evenly over its positions, giving n(0,NULL)
// = n(0,dog) = 1/2 + 1/3, n(0,cat) = 1/3, n(1,.) = 1/3 each, n(NULL) =
// n(dog) = 7/6, n(cat) = 2/3; so t(0|NULL) = t(0|dog) = (5/6 + 2/3) /
// (13/6) = 9/13, t(0|cat) = 3/5, t(1|NULL) = t(1|dog) = 4/13, t(1|cat) =
// 2/5. Word 0 in line 1 has factor (9/13 + 9/13 + 3/5)/3 = 43/65, word 1
// (4/13 + 4/13 + 2/5)/3 = 22/65. With a threshold of 2, word 1 is rare:
// p_rare = (1+1)/((1+1) 3) = 1/3.
func TestReverseWorked(t *testing.T) {
	translations := [][]string{{"dog"}, {"dog", "cat"}}
	words := [][]int32{{0}, {0, 1}}
	const fresh = 7 // a word id the table has never seen
	type prob struct {
		w    int32
		e    string // "" is NULL
		want float64
	}
	for _, tc := range []struct {
		name     string
		minOcc   int
		ratio    bool
		probs    []prob
		line0    []int32
		want0    float64 // the factor of line 0 with words line0
		want1    float64 // the factor of line 1 with words 0 1
		wantRare float64
	}{
		{
			name:  "plain",
			probs: []prob{{0, "", 9. / 13}, {0, "dog", 9. / 13}, {0, "cat", 3. / 5}, {1, "", 4. / 13}, {1, "dog", 4. / 13}, {1, "cat", 2. / 5}, {fresh, "cat", 1. / 3}},
			line0: []int32{1},
			want0: 4. / 13,             // (4/13 + 4/13)/2
			want1: 43. / 65 * 22. / 65, // = 946/4225
			// No word is rare: p_rare = 1/N.
			wantRare: 1. / 3,
		},
		{
			name:     "rare",
			minOcc:   2,
			probs:    []prob{{0, "cat", 3. / 5}, {1, "", 1. / 3}, {1, "cat", 1. / 3}, {fresh, "dog", 1. / 3}},
			line0:    []int32{0, fresh},
			want0:    9. / 13 * 1. / 3, // (9/13 + 9/13)/2 times p_rare
			want1:    43. / 65 * 1. / 3,
			wantRare: 1. / 3,
		},
		{
			name:   "ratio",
			minOcc: 2,
			ratio:  true,
			line0:  []int32{0, fresh},
			want0:  (9. / 13) / (2. / 3),  // = 27/26; the fresh word contributes 1
			want1:  (43. / 65) / (2. / 3), // = 129/130; so does the rare one
			// Background is not affected by Ratio.
			wantRare: 1. / 3,
		},
	} {
		t.Run(tc.name, func(t *testing.T) {
			f := NewReverseFactor(translations, 1, words, 1, tc.minOcc, tc.ratio)
			r := f.Model()
			for _, p := range tc.probs {
				e := Null
				if p.e != "" {
					e, _ = r.ID(p.e)
				}
				if got := r.Prob(p.w, e); math.Abs(got-p.want) > 1e-15 {
					t.Errorf("t(%d|%q) = %v, want %v", p.w, p.e, got, p.want)
				}
			}
			if got := r.Background(fresh); math.Abs(got-tc.wantRare) > 1e-15 {
				t.Errorf("p_rare = %v, want %v", got, tc.wantRare)
			}
			if got := math.Exp(f.LogProb(1)); math.Abs(got-tc.want1) > 1e-14 {
				t.Errorf("line 1: factor %v, want %v", got, tc.want1)
			}
			if got := math.Exp(r.LogProb(0, tc.line0)); math.Abs(got-tc.want0) > 1e-14 {
				t.Errorf("line 0 with %v: factor %v, want %v", tc.line0, got, tc.want0)
			}
		})
	}
}

// TestReverseEmptyTranslation: a line without a translation has factor 1
// and is left out of the counts.
func TestReverseEmptyTranslation(t *testing.T) {
	f := NewReverseFactor([][]string{{"dog"}, nil}, 1, [][]int32{{0}, {1, 1}}, 3, 0, false)
	if got := f.LogProb(1); got != 0 {
		t.Errorf("log factor of the empty line %v, want 0", got)
	}
	if d := f.SplitDelta(1, 1, 2, 3); d != 0 {
		t.Errorf("split in the empty line changes the factor by %v", d)
	}
	// Word 1 appears only in the empty line, so it is unseen: p_rare = 1/N
	// with N = 1.
	if got := f.Model().Background(1); got != 1 {
		t.Errorf("p(1) = %v, want 1", got)
	}
}

// TestReverseNormalised: with no rare-word rule, t(.|e) sums to 1 over the
// words seen, for every token and NULL, after any number of iterations
// (the M-step's counts and smoothing both sum to n(e) and Beta).
func TestReverseNormalised(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 12))
	words, translations := randomCorpus(rng, 60, 25, 20, 6)
	for _, iterations := range []int{0, 1, 7} {
		r := NewReverse(translations, 0.5, 0)
		r.Estimate(words, iterations)
		var seen []int32
		for w := range r.count {
			if r.count[w] > 0 {
				seen = append(seen, int32(w))
			}
		}
		for e := Null; int(e) < r.tokens.VocabSize(); e++ {
			sum := 0.0
			for _, w := range seen {
				sum += r.Prob(w, e)
			}
			if math.Abs(sum-1) > 1e-12 {
				t.Errorf("%d iterations: sum over words of t(w|%d) = %v", iterations, e, sum)
			}
		}
	}
}

// TestReverseFactorMoves applies random splits and joins, with old and
// fresh word ids, and checks each predicted change against LogProb
// recomputed from scratch, the running totals too, and Delta.
func TestReverseFactorMoves(t *testing.T) {
	for _, tc := range []struct {
		minOcc int
		ratio  bool
	}{{0, false}, {3, false}, {3, true}} {
		rng := rand.New(rand.NewPCG(5, uint64(tc.minOcc)))
		words, translations := randomCorpus(rng, 50, 30, 25, 6)
		f := NewReverseFactor(translations, 1, words, 5, tc.minOcc, tc.ratio)
		r := f.Model()
		for step := range 3000 {
			u := rng.IntN(len(words))
			ws := words[u]
			before := r.LogProb(u, ws)
			after, predicted := randomMove(rng, f, u, ws)
			words[u] = after
			want := r.LogProb(u, after) - before
			if math.Abs(predicted-want) > 1e-9*max(1, math.Abs(want)) {
				t.Fatalf("%+v step %d: predicted change %.15g, from scratch %.15g", tc, step, predicted, want)
			}
			if got := f.LogProb(u); math.Abs(got-r.LogProb(u, after)) > 1e-9*max(1, math.Abs(got)) {
				t.Fatalf("%+v step %d: running total %.15g, from scratch %.15g", tc, step, got, r.LogProb(u, after))
			}
			// Delta of a whole new segmentation, then Set.
			if step%10 == 0 {
				other := words[rng.IntN(len(words))]
				if d, want := f.Delta(u, other), r.LogProb(u, other)-r.LogProb(u, after); math.Abs(d-want) > 1e-9*max(1, math.Abs(want)) {
					t.Fatalf("%+v step %d: Delta %.15g, from scratch %.15g", tc, step, d, want)
				}
				words[u] = slices.Clone(other)
				f.Set(u, words[u])
			}
		}
	}
}
