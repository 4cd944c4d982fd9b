package score

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
	"unicode/utf8"
)

// words splits a segmented corpus written with "|" between lines and " "
// between words, for short test tables.
func words(corpus string) [][]string {
	if corpus == "" {
		return nil
	}
	var out [][]string
	for _, line := range strings.Split(corpus, "|") {
		out = append(out, strings.Fields(line))
	}
	return out
}

// TestCompareHandComputed checks small cases worked out by hand from the
// definitions in the package documentation (DESIGN.md section 6; WindowDiff
// from Pevzner & Hearst 2002, Pk from Beeferman, Berger & Lafferty 1999).
func TestCompareHandComputed(t *testing.T) {
	for _, tc := range []struct {
		name      string
		ref, pred string
		want      Scores
	}{{
		// Gaps (after characters 1..4): ref 0110, pred 0100; k = (5+3)/6 = 1.
		name: "under-segmented", ref: "ab c de", pred: "ab cde",
		want: Scores{
			Utterances: 1, Characters: 5, Window: 1,
			Boundary:   PRF{1, 0.5, 2.0 / 3},
			Token:      PRF{0.5, 1.0 / 3, 0.4},
			Lexicon:    PRF{0.5, 1.0 / 3, 0.4},
			WindowDiff: 0.25, Pk: 0.25,
			Counts: Counts{Tally{1, 1, 2}, Tally{1, 2, 3}, Tally{1, 2, 3}},
		},
	}, {
		// Gaps: ref 1 1 0, pred 0 1 1 (the middle one is the utterance edge).
		name: "two lines, opposite", ref: "a b|cd", pred: "ab|c d",
		want: Scores{
			Utterances: 2, Characters: 4, Window: 1,
			WindowDiff: 2.0 / 3, Pk: 2.0 / 3,
			Counts: Counts{Tally{0, 1, 1}, Tally{0, 3, 3}, Tally{0, 3, 3}},
		},
	}, {
		// Gaps: ref 111, pred 010.
		name: "repeated words", ref: "a a a a", pred: "aa aa",
		want: Scores{
			Utterances: 1, Characters: 4, Window: 1,
			Boundary:   PRF{1, 1.0 / 3, 0.5},
			WindowDiff: 2.0 / 3, Pk: 2.0 / 3,
			Counts: Counts{Tally{1, 1, 3}, Tally{0, 2, 4}, Tally{0, 1, 1}},
		},
	}, {
		// Same word types, different tokens. Gaps: ref 01 1 10, pred 10 1 10.
		name: "shared types", ref: "ab c|c ab", pred: "a bc|c ab",
		want: Scores{
			Utterances: 2, Characters: 6, Window: 1,
			Boundary:   PRF{0.5, 0.5, 0.5},
			Token:      PRF{0.5, 0.5, 0.5},
			Lexicon:    PRF{0.5, 1, 2.0 / 3},
			WindowDiff: 0.4, Pk: 0.4,
			Counts: Counts{Tally{1, 2, 2}, Tally{2, 4, 4}, Tally{2, 4, 2}},
		},
	}, {
		// k = (4+1)/2 = 2; gaps ref 000, pred 010; both windows differ.
		name: "window of two", ref: "abcd", pred: "ab cd",
		want: Scores{
			Utterances: 1, Characters: 4, Window: 2,
			WindowDiff: 1, Pk: 1,
			Counts: Counts{Tally{0, 1, 0}, Tally{0, 2, 1}, Tally{0, 2, 1}},
		},
	}, {
		// Offsets count runes: ʃ a t ʰ ə. Gaps: ref 0100, pred 1000.
		name: "multi-byte characters", ref: "ʃa tʰə", pred: "ʃ atʰə",
		want: Scores{
			Utterances: 1, Characters: 5, Window: 1,
			WindowDiff: 0.5, Pk: 0.5,
			Counts: Counts{Tally{0, 1, 1}, Tally{0, 2, 2}, Tally{0, 2, 2}},
		},
	}, {
		// No word-internal boundary anywhere: boundary scores are 0/0 = 0.
		name: "identical, one word per line", ref: "abc|de", pred: "abc|de",
		want: Scores{
			Utterances: 2, Characters: 5, Window: 1,
			Token:   PRF{1, 1, 1},
			Lexicon: PRF{1, 1, 1},
			Counts:  Counts{Tally{0, 0, 0}, Tally{2, 2, 2}, Tally{2, 2, 2}},
		},
	}, {
		// One character: no gaps, so no window.
		name: "one character", ref: "a", pred: "a",
		want: Scores{
			Utterances: 1, Characters: 1,
			Token:   PRF{1, 1, 1},
			Lexicon: PRF{1, 1, 1},
			Counts:  Counts{Tally{0, 0, 0}, Tally{1, 1, 1}, Tally{1, 1, 1}},
		},
	}, {
		name: "empty corpus", ref: "", pred: "",
	}} {
		t.Run(tc.name, func(t *testing.T) {
			got, err := Compare(words(tc.ref), words(tc.pred))
			if err != nil {
				t.Fatal(err)
			}
			if !scoresClose(got, tc.want, 1e-15) {
				t.Errorf("got  %s\nwant %s", got.JSON(), tc.want.JSON())
			}
		})
	}
}

func scoresClose(a, b Scores, tol float64) bool {
	near := func(x, y float64) bool { return math.Abs(x-y) <= tol }
	prfClose := func(x, y PRF) bool {
		return near(x.Precision, y.Precision) && near(x.Recall, y.Recall) && near(x.F, y.F)
	}
	return a.Utterances == b.Utterances && a.Characters == b.Characters && a.Window == b.Window &&
		a.Counts == b.Counts && prfClose(a.Boundary, b.Boundary) && prfClose(a.Token, b.Token) &&
		prfClose(a.Lexicon, b.Lexicon) && near(a.WindowDiff, b.WindowDiff) && near(a.Pk, b.Pk)
}

func TestCompareErrors(t *testing.T) {
	for _, tc := range []struct {
		name      string
		ref, pred [][]string
		want      error
		line      int // 0 for an error about no line in particular
		message   string
	}{{
		name: "line count",
		ref:  words("a b|c"), pred: words("ab"),
		want: ErrLineCount, message: "2 in the reference, 1 in the prediction",
	}, {
		name: "different text on line 3",
		ref:  words("a b|c|dexf"), pred: words("ab|c|de yf"),
		want: ErrTextMismatch, line: 3, message: "line 3: reference and prediction spell different text (first difference at character 3)",
	}, {
		name: "prediction shorter",
		ref:  words("ab c"), pred: words("ab"),
		want: ErrTextMismatch, line: 1, message: "line 1: reference and prediction spell different text (first difference at character 3)",
	}, {
		name: "difference after a multi-byte character",
		ref:  words("ʃa tʰə"), pred: words("ʃa tʰa"),
		want: ErrTextMismatch, line: 1, message: "line 1: reference and prediction spell different text (first difference at character 5)",
	}, {
		name: "text split differently but different",
		ref:  [][]string{{"ab"}, {"c"}}, pred: [][]string{{"ab"}, {"", "c"}},
		want: ErrBadWord, line: 2, message: `line 2: prediction: word 1 "": word is empty or contains a space`,
	}, {
		name: "space inside a word",
		ref:  [][]string{{"a b"}}, pred: [][]string{{"a", "b"}},
		want: ErrBadWord, line: 1, message: `line 1: reference: word 1 "a b"`,
	}} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Compare(tc.ref, tc.pred)
			if !errors.Is(err, tc.want) {
				t.Fatalf("error %v, want %v", err, tc.want)
			}
			if !strings.Contains(err.Error(), tc.message) {
				t.Errorf("error %q does not contain %q", err, tc.message)
			}
			var le *LineError
			if errors.As(err, &le) != (tc.line > 0) || tc.line > 0 && le.Line != tc.line {
				t.Errorf("error %#v, want a *LineError for line %d", err, tc.line)
			}
		})
	}
}

// TestTallyPRF checks the zero-denominator convention, which matches
// scikit-learn's precision_recall_fscore_support(..., zero_division=0).
func TestTallyPRF(t *testing.T) {
	for _, tc := range []struct {
		tally Tally
		want  PRF
	}{
		{Tally{0, 0, 0}, PRF{0, 0, 0}},
		{Tally{0, 3, 0}, PRF{0, 0, 0}},
		{Tally{0, 0, 3}, PRF{0, 0, 0}},
		{Tally{0, 2, 3}, PRF{0, 0, 0}},
		{Tally{2, 2, 2}, PRF{1, 1, 1}},
		{Tally{1, 4, 2}, PRF{0.25, 0.5, 1.0 / 3}},
	} {
		if got := tc.tally.PRF(); got != tc.want {
			t.Errorf("%+v.PRF() = %+v, want %+v", tc.tally, got, tc.want)
		}
	}
}

// segmentation cuts text into lines at '\n' and into words where the bits of
// mask, used cyclically, say so. Spaces are dropped.
func segmentation(text string, mask []byte) [][]string {
	var out [][]string
	bit := 0
	for _, line := range strings.Split(strings.ReplaceAll(text, " ", ""), "\n") {
		ws := []string{}
		start := 0
		for i := range line {
			if i > start && len(mask) > 0 && mask[bit/8%len(mask)]&(1<<(bit%8)) != 0 {
				ws = append(ws, line[start:i])
				start = i
			}
			bit++
		}
		if start < len(line) {
			ws = append(ws, line[start:])
		}
		out = append(out, ws)
	}
	return out
}

func inUnit(x float64) bool { return x >= 0 && x <= 1 }

func checkRanges(t *testing.T, s Scores) {
	t.Helper()
	for _, x := range []float64{s.Boundary.Precision, s.Boundary.Recall, s.Boundary.F,
		s.Token.Precision, s.Token.Recall, s.Token.F,
		s.Lexicon.Precision, s.Lexicon.Recall, s.Lexicon.F, s.WindowDiff, s.Pk} {
		if !inUnit(x) {
			t.Fatalf("score %v outside [0,1] in %s", x, s.JSON())
		}
	}
	for _, c := range []Tally{s.Counts.Boundary, s.Counts.Token, s.Counts.Lexicon} {
		if c.Correct < 0 || c.Correct > c.Predicted || c.Correct > c.Reference {
			t.Fatalf("inconsistent counts %+v in %s", c, s.JSON())
		}
	}
}

func FuzzCompare(f *testing.F) {
	f.Add("abcde\nfg", []byte{0x05}, []byte{0x12}, "a b", "ab")
	f.Add("ʃatʰə\ne\u0301a", []byte{0xff}, []byte{}, "x y|z", "x y\nz")
	f.Add("a\n\nb", []byte{}, []byte{0xaa}, "", "")
	f.Fuzz(func(t *testing.T, text string, refMask, predMask []byte, rawRef, rawPred string) {
		// Arbitrary input must give a result or an error, never a panic.
		if s, err := Compare(segmentation(rawRef, []byte{0x11}), words(rawPred)); err == nil {
			checkRanges(t, s)
		}

		if !utf8.ValidString(text) {
			return // segmentation cuts at rune starts only for valid text
		}
		ref, pred := segmentation(text, refMask), segmentation(text, predMask)
		s, err := Compare(ref, pred)
		if err != nil {
			t.Fatalf("Compare(%q, %q): %v", ref, pred, err)
		}
		checkRanges(t, s)

		// Swapping the two swaps precision and recall; WindowDiff and Pk
		// are symmetric for a given window (which the reference sets).
		r, err := Compare(pred, ref)
		if err != nil {
			t.Fatal(err)
		}
		swap := func(p PRF) PRF { return PRF{p.Recall, p.Precision, p.F} }
		if r.Boundary != swap(s.Boundary) || r.Token != swap(s.Token) || r.Lexicon != swap(s.Lexicon) ||
			r.Window == s.Window && (r.WindowDiff != s.WindowDiff || r.Pk != s.Pk) {
			t.Errorf("not symmetric:\n%s%s", s.JSON(), r.JSON())
		}

		// A segmentation compared with itself scores 1 wherever the
		// reference has something to find, and has no window errors.
		id, err := Compare(ref, ref)
		if err != nil {
			t.Fatal(err)
		}
		checkRanges(t, id)
		for _, m := range []struct {
			prf PRF
			n   int
		}{{id.Boundary, id.Counts.Boundary.Reference}, {id.Token, id.Counts.Token.Reference}, {id.Lexicon, id.Counts.Lexicon.Reference}} {
			want := PRF{1, 1, 1}
			if m.n == 0 {
				want = PRF{}
			}
			if m.prf != want {
				t.Errorf("identical input: %+v, want %+v (%d reference items)", m.prf, want, m.n)
			}
		}
		if id.WindowDiff != 0 || id.Pk != 0 {
			t.Errorf("identical input: windowdiff %v, pk %v", id.WindowDiff, id.Pk)
		}
	})
}

// BenchmarkCompare scores a corpus of 10,000 random lines of about 20
// characters against a perturbed copy.
func BenchmarkCompare(b *testing.B) {
	rng := rand.New(rand.NewPCG(1, 2))
	var ref, pred [][]string
	for range 10000 {
		var text strings.Builder
		for range 10 + rng.IntN(20) {
			text.WriteByte("ptkaiu"[rng.IntN(6)])
		}
		refMask, predMask := make([]byte, 4), make([]byte, 4)
		for i := range refMask {
			refMask[i] = byte(rng.Uint32() & rng.Uint32())
			predMask[i] = refMask[i] ^ byte(rng.Uint32()&rng.Uint32()&rng.Uint32())
		}
		ref = append(ref, segmentation(text.String(), refMask)...)
		pred = append(pred, segmentation(text.String(), predMask)...)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Compare(ref, pred); err != nil {
			b.Fatal(err)
		}
	}
}
