package segment

import (
	"math"
	"math/rand/v2"
)

// sliceSample draws one new value of x from the density proportional to
// exp(logf) on (lo, hi) by univariate slice sampling with stepping out and
// shrinkage (Neal 2003, "Slice sampling", Annals of Statistics 31, figs. 3
// and 5). w is the initial bracket width. x must lie in (lo, hi) with
// logf(x) finite.
func sliceSample(x float64, logf func(float64) float64, w, lo, hi float64, rng *rand.Rand) float64 {
	const maxSteps = 32
	logy := logf(x) + math.Log(1-rng.Float64()) // log(u*f(x)), u in (0,1]
	l := x - w*rng.Float64()
	r := l + w
	for j := 0; j < maxSteps && l > lo && logf(l) > logy; j++ {
		l -= w
	}
	for j := 0; j < maxSteps && r < hi && logf(r) > logy; j++ {
		r += w
	}
	l, r = math.Max(l, lo), math.Min(r, hi)
	for k := 0; k < 200; k++ {
		x1 := l + rng.Float64()*(r-l)
		if x1 > lo && x1 < hi && logf(x1) > logy {
			return x1
		}
		if x1 < x {
			l = x1
		} else {
			r = x1
		}
	}
	return x // the bracket collapsed onto x: keep it
}
