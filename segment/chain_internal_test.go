package segment

import (
	"encoding/json"
	"math"
	"testing"
)

// TestFiniteForJSON: a trace point of a state with probability 0 still
// encodes, and finite values pass through unchanged.
func TestFiniteForJSON(t *testing.T) {
	for _, tc := range []struct{ in, want float64 }{
		{math.Inf(-1), -math.MaxFloat64},
		{math.Inf(1), math.MaxFloat64},
		{-12.5, -12.5},
		{0, 0},
	} {
		got := finiteForJSON(tc.in)
		if got != tc.want {
			t.Errorf("finiteForJSON(%v) = %v, want %v", tc.in, got, tc.want)
		}
		if _, err := json.Marshal(TracePoint{LogProb: got}); err != nil {
			t.Errorf("trace point with log probability %v: %v", tc.in, err)
		}
	}
}
