package score

// WindowDiff returns the WindowDiff error rate of Pevzner & Hearst (2002) of
// hyp against ref: the fraction of windows of k consecutive gaps in which
// the two segmentations have different numbers of boundaries. ref and hyp
// have one entry per gap between adjacent positions, true for a boundary;
// there are len(ref)-k+1 windows. The encoding and the window count are
// those of NLTK's nltk.metrics.segmentation.windowdiff. WindowDiff panics
// unless the lengths agree and 1 <= k <= len(ref).
func WindowDiff(ref, hyp []bool, k int) float64 {
	return windowErrors(ref, hyp, k, func(r, h int) bool { return r != h })
}

// Pk returns the Pk error rate of Beeferman, Berger & Lafferty (1999) of hyp
// against ref: the fraction of windows of k consecutive gaps in which one
// segmentation has a boundary and the other has none, that is, where the
// two disagree whether the positions at the window's ends lie in the same
// segment. The encoding is that of WindowDiff, and of NLTK's
// nltk.metrics.segmentation.pk. Pk panics unless the lengths agree and
// 1 <= k <= len(ref).
func Pk(ref, hyp []bool, k int) float64 {
	return windowErrors(ref, hyp, k, func(r, h int) bool { return (r > 0) != (h > 0) })
}

// windowErrors slides a window of k gaps over ref and hyp, keeping the
// number of boundaries of each inside it, and returns the fraction of
// windows for which differ reports an error.
func windowErrors(ref, hyp []bool, k int, differ func(r, h int) bool) float64 {
	if len(ref) != len(hyp) {
		panic("score: segmentations of different lengths")
	}
	if k < 1 || k > len(ref) {
		panic("score: window outside 1..length")
	}
	r, h := 0, 0
	for i := range k {
		r += b2i(ref[i])
		h += b2i(hyp[i])
	}
	errs := 0
	for i := 0; ; i++ {
		if differ(r, h) {
			errs++
		}
		if i+k == len(ref) {
			break
		}
		r += b2i(ref[i+k]) - b2i(ref[i])
		h += b2i(hyp[i+k]) - b2i(hyp[i])
	}
	return float64(errs) / float64(len(ref)-k+1)
}

func b2i(b bool) int {
	if b {
		return 1
	}
	return 0
}
