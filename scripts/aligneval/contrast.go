package main

import (
	"bufio"
	"fmt"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/segment"
)

// contrastDraws is the number of seatings segment.LogProbEstimate
// averages over for each segmentation, and contrastRounds the number of
// hyperparameter resamplings that fit them to the gold segmentation.
const (
	contrastDraws  = 10
	contrastRounds = 200
)

// Contrast is how one run's model rates the gold segmentation against the
// one it learned (decoded). Words is log P(gold) - log P(learned) under the
// word model with the chain's final hyperparameters
// (segment.LogProbEstimate); WordsRefit the same with gold rated under
// hyperparameters fitted to it (segment.FitHyper, from the chain's).
// Translation is the same difference for the translations, each
// segmentation scored with the leave-one-out table it gives (10 EM
// iterations, beta 1), as the factor sees a segmentation at the start of
// a block. A prior of weight w prefers gold when Words + w Translation > 0.
type Contrast struct {
	Words, WordsRefit, Translation float64
}

// contrast returns the Contrast of a run of cfg on l that learned
// learned, with hyperparameters h.
func contrast(l *Language, cfg segment.Config, h segment.Hyper, learned *segment.Segmentation, seed uint64) Contrast {
	rng := segment.NewRand(seed, 7)
	gold := segment.LogProbEstimate(l.Reference, cfg, h, contrastDraws, rng)
	got := segment.LogProbEstimate(learned, cfg, h, contrastDraws, rng)
	hg := segment.FitHyper(l.Reference, cfg, h, contrastRounds, rng)
	goldRefit := segment.LogProbEstimate(l.Reference, cfg, hg, contrastDraws, rng)
	return Contrast{
		Words:       gold - got,
		WordsRefit:  goldRefit - got,
		Translation: translationLogLik(l, l.Reference, cfg.TranslationMinCount) - translationLogLik(l, learned, cfg.TranslationMinCount),
	}
}

// translationLogLik returns log P(translations | words of s) under the
// leave-one-out IBM Model 1 table estimated from s, as the forward
// leave-one-out factor scores s.
func translationLogLik(l *Language, s *segment.Segmentation, minCount int) float64 {
	ids := map[string]int32{}
	words := make([][]int32, s.Corpus.Len())
	for u := range words {
		for _, w := range s.WordStrings(u) {
			id, ok := ids[w]
			if !ok {
				id = int32(len(ids))
				ids[w] = id
			}
			words[u] = append(words[u], id)
		}
	}
	m := align.NewModel(l.PriorTokens, 1)
	m.LeaveOneOut = true
	m.Estimate(words, 10)
	m.MinOccurrences = minCount
	return m.LogLikelihood(words)
}

// writeContrast writes the section of the report that compares gold with
// the learned segmentations.
func (r *Report) writeContrast(w *bufio.Writer) {
	fmt.Fprintf(w, "## Gold against learned\n\n")
	fmt.Fprintf(w, "How each run's model rates the gold segmentation against the one it decoded, in nats: Δ log P(words)\n")
	fmt.Fprintf(w, "is log P(gold) - log P(learned) under the word model with the chain's final hyperparameters\n")
	fmt.Fprintf(w, "(segment.LogProbEstimate, %d seatings), Δ log P(translation) the same for the English lines, each\n", contrastDraws)
	fmt.Fprintf(w, "scored with the leave-one-out table of its own segmentation (min-count of the setting, 10 for runs\n")
	fmt.Fprintf(w, "without the prior). A translation factor of weight w prefers gold when Δ words + w Δ translation > 0;\n")
	fmt.Fprintf(w, "\"break-even weight\" is -Δ words / Δ translation of the means, where the translation side favours gold\n")
	fmt.Fprintf(w, "and the word model does not. \"refit\" rates gold under hyperparameters fitted to it (segment.FitHyper,\n")
	fmt.Fprintf(w, "%d resamplings), the learned segmentation under the chain's.\n\n", contrastRounds)
	fmt.Fprintf(w, "| setting | language | Δ log P(words) | Δ log P(words), refit | Δ log P(translation) | break-even weight | refit |\n| --- | --- | ---: | ---: | ---: | ---: | ---: |\n")
	for s, set := range r.Settings {
		for l, code := range r.Langs {
			var ws, wr, ts []float64
			for k := range r.Options.seeds {
				c := r.Outcomes[s][l][k].Contrast
				ws = append(ws, c.Words)
				wr = append(wr, c.WordsRefit)
				ts = append(ts, c.Translation)
			}
			sw, sr, st := Summarize(ws), Summarize(wr), Summarize(ts)
			fmt.Fprintf(w, "| %s | %s | %s | %s | %s | %s | %s |\n", set, code, sw.formatWith("%+.0f"), sr.formatWith("%+.0f"),
				st.formatWith("%+.0f"), breakEven(sw, st), breakEven(sr, st))
		}
	}
	fmt.Fprintln(w)
}

// breakEven returns the weight at which the translation side's mean
// preference for gold outweighs the word model's mean preference against
// it, or a dash when either side already leans the other way.
func breakEven(words, translation Summary) string {
	if !(translation.Mean > 0 && words.Mean < 0) {
		return "—"
	}
	return fmt.Sprintf("%.1f", -words.Mean/translation.Mean)
}
