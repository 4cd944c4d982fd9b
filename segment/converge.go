package segment

import "math"

// Converged reports whether sampling may stop: at least two blocks of
// samples after burn-in, and the potential scale reduction factor of the
// chains' word counts over those iterations below cfg.Converge. (The word
// count summarises the segmentation itself; the log probability also
// moves with the seating, which is redrawn at every block, and with the
// hyperparameters.) With
// one chain the chain is split into halves (split R-hat; Gelman et al.
// 2013, Bayesian Data Analysis, 3rd ed., sec. 11.4); with several, each
// chain is split too. With several chains their boundary posteriors must
// also agree: the mean absolute difference between any two chains' boundary
// frequencies, over free gaps, below (cfg.Converge - 1).
func Converged(cfg Config, states []*ChainState) bool {
	var halves [][]float64
	for _, st := range states {
		var lp []float64
		for _, tp := range st.Trace {
			if tp.Iteration > cfg.Burnin {
				lp = append(lp, float64(tp.Words))
			}
		}
		if len(lp) < 2*cfg.Block || len(lp) < 4 {
			return false
		}
		h := len(lp) / 2
		halves = append(halves, lp[len(lp)-2*h:len(lp)-h], lp[len(lp)-h:])
	}
	if rhat(halves) >= cfg.Converge {
		return false
	}
	for i := range states {
		for j := i + 1; j < len(states); j++ {
			if posteriorDistance(states[i], states[j]) >= cfg.Converge-1 {
				return false
			}
		}
	}
	return true
}

// rhat returns the potential scale reduction factor of equal-length
// sequences (Gelman & Rubin 1992): sqrt(((n-1)/n W + B/n) / W), with W the
// mean within-sequence variance and B/n the variance of the sequence means.
func rhat(seqs [][]float64) float64 {
	m := float64(len(seqs))
	n := float64(len(seqs[0]))
	means := make([]float64, len(seqs))
	grand, W := 0.0, 0.0
	for k, s := range seqs {
		for _, x := range s {
			means[k] += x
		}
		means[k] /= n
		grand += means[k]
		v := 0.0
		for _, x := range s {
			v += (x - means[k]) * (x - means[k])
		}
		W += v / (n - 1)
	}
	grand /= m
	W /= m
	Bn := 0.0
	for _, mu := range means {
		Bn += (mu - grand) * (mu - grand)
	}
	Bn /= m - 1
	if W == 0 {
		if Bn == 0 {
			return 1
		}
		return math.Inf(1)
	}
	return math.Sqrt(((n-1)/n*W + Bn) / W)
}

// posteriorDistance returns the mean absolute difference of two chains'
// boundary frequencies, over positions that are not boundaries in every
// sample of both (utterance starts and locked boundaries are).
func posteriorDistance(a, b *ChainState) float64 {
	if a.Samples == 0 || b.Samples == 0 {
		return math.Inf(1)
	}
	sum, n := 0.0, 0
	for i := range a.BoundaryCounts {
		pa := float64(a.BoundaryCounts[i]) / float64(a.Samples)
		pb := float64(b.BoundaryCounts[i]) / float64(b.Samples)
		if pa == 1 && pb == 1 {
			continue // utterance starts and certain boundaries
		}
		sum += math.Abs(pa - pb)
		n++
	}
	if n == 0 {
		return 0
	}
	return sum / float64(n)
}
