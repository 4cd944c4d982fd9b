package segment

import (
	"math"
	"math/rand/v2"
	"sort"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"
)

// TestSliceSampleMatchesDistribution draws from known densities with the
// slice sampler and compares with their CDFs by a Kolmogorov-Smirnov
// statistic (gonum's distuv gives the closed forms).
func TestSliceSampleMatchesDistribution(t *testing.T) {
	cases := []struct {
		name string
		dist interface {
			LogProb(float64) float64
			CDF(float64) float64
		}
		lo, hi float64
		start  float64
	}{
		{"beta(2,5)", distuv.Beta{Alpha: 2, Beta: 5}, 0, 1, 0.5},
		{"gamma(3,2)", distuv.Gamma{Alpha: 3, Beta: 2}, 0, math.Inf(1), 1},
		{"normal(1,2)", distuv.Normal{Mu: 1, Sigma: 2}, math.Inf(-1), math.Inf(1), 0},
	}
	for _, tc := range cases {
		rng := rand.New(rand.NewPCG(1, 2))
		const n, thin = 4000, 5
		xs := make([]float64, n)
		x := tc.start
		for i := range xs {
			for k := 0; k < thin; k++ {
				x = sliceSample(x, tc.dist.LogProb, 1, tc.lo, tc.hi, rng)
			}
			xs[i] = x
		}
		sort.Float64s(xs)
		d := 0.0
		for i, v := range xs {
			f := tc.dist.CDF(v)
			d = math.Max(d, math.Max(math.Abs(f-float64(i)/n), math.Abs(f-float64(i+1)/n)))
		}
		// 1.95/sqrt(n) is the 0.1% critical value of the one-sample KS
		// statistic (asymptotic, Kolmogorov distribution; common practice).
		if crit := 1.95 / math.Sqrt(n); d > crit {
			t.Errorf("%s: KS distance %.4f > %.4f", tc.name, d, crit)
		}
	}
}

// TestSeatingLikelihoodMatchesEPPF: the hyperparameter likelihood computed
// from pooled statistics must differ from the full seating probability
// only by a constant in (d, a).
func TestSeatingLikelihoodMatchesEPPF(t *testing.T) {
	c := NewCorpus("x")
	m := NewWords(c, 2, PitmanYor{0.3, 2}, PitmanYor{0.5, 1}, UniformBase{WordEnd: 0.5, Units: 5})
	rng := rand.New(rand.NewPCG(3, 3))
	// Seat customers directly: 6 contexts, 10 dishes.
	for i := 0; i < 400; i++ {
		ctx := int32(rng.IntN(6))
		w := WordType(rng.IntN(10))
		m.bi.add(ctx, w, math.Log(0.1), rng, nil)
	}
	st := m.bi.stats()
	ref := m.bi.logSeatingProb(0.5, 1) - st.logLikelihood(0.5, 1)
	for _, p := range [][2]float64{{0, 1}, {0.1, 0.5}, {0.7, 30}, {0.9, 0.01}} {
		diff := m.bi.logSeatingProb(p[0], p[1]) - st.logLikelihood(p[0], p[1])
		if math.Abs(diff-ref) > 1e-8 {
			t.Errorf("d=%v a=%v: full - pooled = %v, want constant %v", p[0], p[1], diff, ref)
		}
	}
}

// TestHyperparameterRecovery seats customers from a Pitman-Yor process
// with known parameters and checks that sampling recovers them.
func TestHyperparameterRecovery(t *testing.T) {
	for _, truth := range []PitmanYor{{0.6, 5}, {0.2, 50}} {
		rng := rand.New(rand.NewPCG(5, uint64(truth.Concentration)))
		r := newRestaurants(&PitmanYor{truth.Discount, truth.Concentration})
		// 40 contexts of 300 customers; the base never repeats a dish, so
		// every new table gets a dish of its own.
		next := WordType(0)
		for ctx := int32(0); ctx < 40; ctx++ {
			var dishes []WordType // each dish has exactly one table
			for i := 0; i < 300; i++ {
				c, tables := r.totals(ctx)
				if c == 0 || rng.Float64()*(c+truth.Concentration) < truth.Concentration+truth.Discount*tables {
					r.seatAt(ctx, r.seating(ctx, next, true), 0)
					dishes = append(dishes, next)
					next++
					continue
				}
				// Join a table in proportion to size - d.
				u := rng.Float64() * (c - truth.Discount*tables)
				for _, w := range dishes {
					ds := r.seating(ctx, w, false)
					u -= float64(ds.customers) - truth.Discount
					if u < 0 {
						r.seatAt(ctx, ds, ds.customers)
						break
					}
				}
			}
		}
		p := PitmanYor{0.5, 1}
		var sd, sa float64
		const draws = 200
		for i := 0; i < 50+draws; i++ {
			sampleLevel(r, &p, false, false, rng)
			if i >= 50 {
				sd += p.Discount
				sa += math.Log(p.Concentration)
			}
		}
		d, a := sd/draws, math.Exp(sa/draws)
		if math.Abs(d-truth.Discount) > 0.08 || math.Abs(math.Log(a/truth.Concentration)) > 0.5 {
			t.Errorf("truth %+v: posterior mean d %.3f, a %.3f", truth, d, a)
		}
	}
}
