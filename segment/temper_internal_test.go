package segment

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestTemperWeight compares temperWeight with math.Pow over the whole
// range of positive floats and the temperatures annealing uses.
func TestTemperWeight(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	worst := 0.0
	for range 200000 {
		v := math.Exp(-rng.Float64() * 700) // down to 1e-304
		switch rng.IntN(10) {
		case 0:
			v = 1 + rng.Float64()*1e3
		case 1:
			v = math.Ldexp(1+rng.Float64(), -1023-rng.IntN(40)) // subnormal
		}
		inv := 0.1 + 0.9*rng.Float64()
		// The reference takes logarithms of normal numbers only: for
		// subnormal arguments both math.Log and math.Pow are far off.
		lv := math.Log(v)
		if v < 0x1p-1022 {
			lv = math.Log(v*0x1p64) - 64*math.Ln2
		}
		got, want := temperWeight(v, inv), math.Exp(inv*lv)
		if rel := math.Abs(got-want) / want; rel > worst {
			worst = rel
		}
	}
	if worst > 1e-7 {
		t.Errorf("worst relative error %g, want <= 1e-7", worst)
	}
	for _, c := range []struct{ v, inv, want float64 }{
		{0, 0.5, 0},
		{1, 0.3, 1},
		{4, 0.5, 2},
		{0x1p-1040, 0.5, 0x1p-520}, // subnormal
		{math.Sqrt2, 1, math.Sqrt2},
		{0.25, 1, 0.25},
	} {
		if got := temperWeight(c.v, c.inv); math.Abs(got-c.want) > 1e-7*c.want {
			t.Errorf("temperWeight(%g, %g) = %g, want %g", c.v, c.inv, got, c.want)
		}
	}
}

// temperInputs returns weights of the range the grouping lattice holds.
func temperInputs() []float64 {
	vs := make([]float64, 1024)
	rng := rand.New(rand.NewPCG(1, 2))
	for i := range vs {
		vs[i] = math.Exp(-rng.Float64() * 50)
	}
	return vs
}

func BenchmarkTemperWeight(b *testing.B) {
	vs, s := temperInputs(), 0.0
	for i := 0; b.Loop(); i++ {
		s += temperWeight(vs[i&1023], 0.37)
	}
	_ = s
}

// BenchmarkTemperExpLog is what temperWeight replaces.
func BenchmarkTemperExpLog(b *testing.B) {
	vs, s := temperInputs(), 0.0
	for i := 0; b.Loop(); i++ {
		s += math.Exp(0.37 * math.Log(vs[i&1023]))
	}
	_ = s
}
