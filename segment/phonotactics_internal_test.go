package segment

import (
	"encoding/binary"
	"math"
	"testing"
)

// TestRunModelNormalised: every run distribution sums to 1 over all runs
// (here over every run of up to 20 units of a two-unit alphabet, where the
// tail left out is below 1e-6), whichever counts it was built from.
func TestRunModelNormalised(t *testing.T) {
	key := func(units ...uint16) []byte {
		b := make([]byte, 2*len(units))
		for i, u := range units {
			binary.LittleEndian.PutUint16(b[2*i:], u)
		}
		return b
	}
	for _, single := range []bool{false, true} {
		r := runModel{counts: map[string]float64{}, alphabet: 2, single: single, beta: 3}
		if single {
			r.add(key(0))
			r.add(key(0))
			r.add(key(1))
		} else {
			r.add(nil)
			r.add(key(0, 1))
			r.add(key(0, 1))
			r.add(key(1, 1, 0))
		}
		total := 0.0
		maxLen := 20
		if single {
			maxLen = 1
		}
		minLen := 0
		if single {
			minLen = 1
		}
		for n := minLen; n <= maxLen; n++ {
			for bits := 0; bits < 1<<n; bits++ {
				units := make([]uint16, n)
				for i := range units {
					units[i] = uint16(bits >> i & 1)
				}
				total += math.Exp(r.logProb(key(units...)))
			}
		}
		if math.Abs(total-1) > 1e-6 {
			t.Errorf("single=%v: sums to %v, want 1", single, total)
		}
	}
}

// TestFitBeta: the fitted concentration maximises the evidence, checked
// against a fine grid.
func TestFitBeta(t *testing.T) {
	r := runModel{counts: map[string]float64{}, alphabet: 5}
	for i, n := range []int{40, 12, 7, 3, 1, 1} {
		k := make([]byte, 2*(i%3))
		k = append(k, byte(i), 0)
		for range n {
			r.add(k)
		}
	}
	r.fitBeta()
	keys := make([]string, 0, len(r.counts))
	for k := range r.counts {
		keys = append(keys, k)
	}
	best := r.logEvidence(r.beta, keys)
	for lb := math.Log(1e-3); lb < math.Log(1e6); lb += 0.01 {
		if e := r.logEvidence(math.Exp(lb), keys); e > best+1e-9 {
			t.Fatalf("evidence %v at beta %v beats the fitted beta %v (%v)", e, math.Exp(lb), r.beta, best)
		}
	}
	t.Logf("beta %.4g, log evidence %.6g", r.beta, best)
}
