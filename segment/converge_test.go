package segment

import (
	"math"
	"testing"
)

// TestRhat checks the potential scale reduction factor on sequences worked
// by hand: two sequences (1,2,3) and (3,4,5): means 2 and 4, W = 1,
// B/n = 2, so R = sqrt((2/3 + 2) / 1) = sqrt(8/3) (Gelman & Rubin 1992).
func TestRhat(t *testing.T) {
	got := rhat([][]float64{{1, 2, 3}, {3, 4, 5}})
	if want := math.Sqrt(8.0 / 3); math.Abs(got-want) > 1e-12 {
		t.Errorf("rhat = %v, want %v", got, want)
	}
	// Identical sequences: R = sqrt((n-1)/n).
	got = rhat([][]float64{{1, 2, 3, 4}, {1, 2, 3, 4}})
	if want := math.Sqrt(3.0 / 4); math.Abs(got-want) > 1e-12 {
		t.Errorf("rhat of identical sequences = %v, want %v", got, want)
	}
}
