package score

import (
	"strings"
	"testing"
)

// gaps turns a string of '0' and '1' into boundary indicators.
func gaps(s string) []bool {
	out := make([]bool, len(s))
	for i, c := range s {
		out[i] = c == '1'
	}
	return out
}

// TestWindowDiffPk checks the worked examples in the documentation of NLTK
// 3.8, nltk/metrics/segmentation.py (the windowdiff and pk docstrings), and
// small cases computed by hand. The pk docstring prints its three values
// rounded to 0.50, 0.50 and 0.00; the exact values below were counted by
// hand: of the 399 windows of 2 gaps over "0100"*100, 200 hold a boundary.
func TestWindowDiffPk(t *testing.T) {
	for _, tc := range []struct {
		name       string
		ref, hyp   string
		k          int
		windowDiff float64
		pk         float64
	}{
		{"nltk windowdiff s1 s1", "000100000010", "000100000010", 3, 0, 0},
		{"nltk windowdiff s1 s2", "000100000010", "000010000100", 3, 0.3, 0.3},
		{"nltk windowdiff s2 s3", "000010000100", "100000010000", 3, 0.8, 0.8},
		{"nltk pk all boundaries", strings.Repeat("0100", 100), strings.Repeat("1", 400), 2, 1, 199.0 / 399},
		{"nltk pk no boundaries", strings.Repeat("0100", 100), strings.Repeat("0", 400), 2, 200.0 / 399, 200.0 / 399},
		{"nltk pk identical", strings.Repeat("0100", 100), strings.Repeat("0100", 100), 2, 0, 0},
		// By hand: windows of 2 over 0110 and 0100 are 01|01, 11|10, 10|00.
		{"near miss", "0110", "0100", 2, 2.0 / 3, 1.0 / 3},
		{"whole sequence one window", "101", "010", 3, 1, 0},
		{"single gap", "1", "0", 1, 1, 1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			ref, hyp := gaps(tc.ref), gaps(tc.hyp)
			if got := WindowDiff(ref, hyp, tc.k); !approxEqual(got, tc.windowDiff) {
				t.Errorf("WindowDiff = %v, want %v", got, tc.windowDiff)
			}
			if got := Pk(ref, hyp, tc.k); !approxEqual(got, tc.pk) {
				t.Errorf("Pk = %v, want %v", got, tc.pk)
			}
		})
	}
}

func approxEqual(a, b float64) bool { return a-b <= 1e-12 && b-a <= 1e-12 }

func TestWindowPanics(t *testing.T) {
	for _, tc := range []struct {
		name     string
		ref, hyp string
		k        int
	}{
		{"lengths differ", "010", "01", 1},
		{"window zero", "010", "010", 0},
		{"window too wide", "010", "010", 4},
		{"no gaps", "", "", 1},
	} {
		t.Run(tc.name, func(t *testing.T) {
			defer func() {
				if recover() == nil {
					t.Error("no panic")
				}
			}()
			WindowDiff(gaps(tc.ref), gaps(tc.hyp), tc.k)
		})
	}
}
