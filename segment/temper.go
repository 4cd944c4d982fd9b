package segment

import "math"

// temperWeight returns v^inv for v >= 0 and 0 < inv <= 1, to about 1e-8
// relative error, several times faster than math.Exp(inv*math.Log(v)).
// The collocation sampler raises every weight of its grouping lattice to
// the power 1/T in annealed sweeps, and profiling put a tenth of a
// two-chain English run in those two calls. The result only shapes a
// Metropolis-Hastings proposal whose probabilities are computed from the
// same values, so its error changes how often proposals are accepted,
// never what the sampler converges to.
//
// ln v is read from the exponent and mantissa, with the mantissa m moved
// into [1/sqrt 2, sqrt 2) and ln m = 2 atanh((m-1)/(m+1)) summed to s^7;
// exp is taken by splitting off a multiple of ln 2 and summing the
// Taylor series of the rest, |r| <= ln(2)/2, to r^7. Both are textbook
// reductions (common practice); the error bounds are the first omitted
// terms, 2s^9/9 < 3e-8 and r^8/8! < 5e-9. (math.Log itself is not used for
// subnormal v: on amd64 it returns about ln 2^-1023 for all of them.)
func temperWeight(v, inv float64) float64 {
	const ln2 = math.Ln2
	if !(v > 0) || v > math.MaxFloat64 { // 0, +Inf or NaN
		return math.Max(v, 0)
	}
	e := 0
	if v < 0x1p-1022 { // subnormal: scale into the normal range
		v *= 0x1p64
		e = -64
	}
	b := math.Float64bits(v)
	e += int(b>>52) - 1023
	m := math.Float64frombits(b&(1<<52-1) | 1023<<52) // [1, 2)
	if m > math.Sqrt2 {
		m *= 0.5
		e++
	}
	s := (m - 1) / (m + 1)
	s2 := s * s
	lnm := 2 * s * (1 + s2*(1.0/3+s2*(1.0/5+s2*(1.0/7))))
	y := inv * (float64(e)*ln2 + lnm)
	n := math.Floor(y/ln2 + 0.5)
	r := y - n*ln2
	p := 1 + r*(1+r*(1.0/2+r*(1.0/6+r*(1.0/24+r*(1.0/120+r*(1.0/720+r*(1.0/5040)))))))
	if k := int(n); k >= -1021 && k <= 1023 {
		return p * math.Float64frombits(uint64(k+1023)<<52)
	}
	return math.Ldexp(p, int(n))
}
