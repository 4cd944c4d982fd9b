package main

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/juncture-project/juncture/segment/score"
)

// Summary is the mean and range of one measure over seeds.
type Summary struct {
	Mean, Min, Max float64
	N              int
}

// Summarize returns the mean, minimum and maximum of xs.
func Summarize(xs []float64) Summary {
	s := Summary{Min: math.Inf(1), Max: math.Inf(-1), N: len(xs)}
	if len(xs) == 0 {
		return Summary{}
	}
	for _, x := range xs {
		s.Mean += x
		s.Min = min(s.Min, x)
		s.Max = max(s.Max, x)
	}
	s.Mean /= float64(len(xs))
	return s
}

// format writes s as "mean [min, max]" (the mean alone for one value),
// with a sign when signed.
func (s Summary) format(signed bool) string {
	f := "%.3f"
	if signed {
		f = "%+.3f"
	}
	return s.formatWith(f)
}

// formatWith writes s as "mean [min, max]" with the verb f for each
// number (the mean alone for one value).
func (s Summary) formatWith(f string) string {
	if s.N <= 1 {
		return fmt.Sprintf(f, s.Mean)
	}
	return fmt.Sprintf(f+" ["+f+", "+f+"]", s.Mean, s.Min, s.Max)
}

// measure picks one number from a run's scores.
type measure func(score.Scores) float64

var segmentationMeasures = []struct {
	name string
	get  measure
}{
	{"token F", func(s score.Scores) float64 { return s.Token.F }},
	{"boundary F", func(s score.Scores) float64 { return s.Boundary.F }},
	{"lexicon F", func(s score.Scores) float64 { return s.Lexicon.F }},
}

// baselineOf returns the index of the setting without the prior that s is
// compared with.
func (r *Report) baselineOf(s int) int {
	for i, b := range r.Settings {
		if b.baseline() && b.Model == r.Settings[s].Model && b.Sampler == r.Settings[s].Sampler {
			return i
		}
	}
	panic("aligneval: no baseline for " + r.Settings[s].String())
}

// perSeed returns f of each seed for setting s and language l, or, with l
// = -1, the mean over languages of each seed.
func (r *Report) perSeed(s, l int, f measure) []float64 {
	out := make([]float64, len(r.Options.seeds))
	for k := range out {
		if l >= 0 {
			out[k] = f(r.Outcomes[s][l][k].Scores)
			continue
		}
		for l := range r.Langs {
			out[k] += f(r.Outcomes[s][l][k].Scores)
		}
		out[k] /= float64(len(r.Langs))
	}
	return out
}

// glossPerSeed returns the gloss counts of each seed for setting s and
// language l, or, with l = -1, pooled over languages.
func (r *Report) glossPerSeed(s, l int) []GlossCounts {
	out := make([]GlossCounts, len(r.Options.seeds))
	for k := range out {
		for ll := range r.Langs {
			if l < 0 || l == ll {
				out[k].Add(r.Outcomes[s][ll][k].Gloss)
			}
		}
	}
	return out
}

func diff(a, b []float64) []float64 {
	out := make([]float64, len(a))
	for i := range a {
		out[i] = a[i] - b[i]
	}
	return out
}

func glossMeasure(cs []GlossCounts, f func(GlossCounts) float64) []float64 {
	out := make([]float64, len(cs))
	for i, c := range cs {
		out[i] = f(c)
	}
	return out
}

// meanCount formats the mean of a count over seeds.
func meanCount(cs []GlossCounts, f func(GlossCounts) int) string {
	sum := 0
	for _, c := range cs {
		sum += f(c)
	}
	if sum%len(cs) == 0 {
		return strconv.Itoa(sum / len(cs))
	}
	return fmt.Sprintf("%.1f", float64(sum)/float64(len(cs)))
}

// WriteMarkdown writes the report.
func (r *Report) WriteMarkdown(w io.Writer) error {
	bw := bufio.NewWriter(w)
	o := r.Options
	p := func(format string, args ...any) { fmt.Fprintf(bw, format, args...) }
	p("# Translation prior and glosses on the UDHR corpora\n\n")
	p("Made by `%s`", o.commandLine)
	if r.Settings != nil {
		seeds := make([]string, len(o.seeds))
		for i, s := range o.seeds {
			seeds[i] = strconv.FormatUint(s, 10)
		}
		p(": %d sweeps per chain (burn-in %d), %d chain(s) per run, seeds %s; %d runs, %d at a time, %s.\n\n",
			o.iterations, o.iterations*4/5, o.chains, strings.Join(seeds, ", "),
			len(r.Settings)*len(r.Langs)*len(o.seeds), r.MaxParallel, r.Elapsed.Round(1e9))
		p("Each cell is the mean over seeds with [minimum, maximum]. A Δ column is the setting minus the run\n")
		p("without the prior with the same model, sampler and seed. The row \"all\" takes, for each seed, the\n")
		p("mean of the languages (glosses: the counts pooled over languages).\n\n")
		if o.mismatch {
			p("**Control (-mismatch):** the prior sees each line paired with the translation of the line half the\n")
			p("corpus away, so it keeps its form but says nothing true about any line; glosses use the right ones.\n\n")
		}
		p("Translation units (one paragraph per line):\n\n")
		for l, code := range r.Langs {
			p("- %s: %s\n", code, r.Units[l])
		}
		p("\n")
		r.writeSegmentation(bw)
		if o.contrast {
			r.writeContrast(bw)
		}
	} else {
		p(": glosses of the gold segmentation only.\n\n")
	}
	r.writeGlosses(bw)
	return bw.Flush()
}

func (r *Report) writeSegmentation(w *bufio.Writer) {
	fmt.Fprintf(w, "## Segmentation\n\n| setting | language |")
	for _, m := range segmentationMeasures {
		fmt.Fprintf(w, " %s | Δ %s |", m.name, m.name)
	}
	fmt.Fprintf(w, "\n| --- | --- |%s\n", strings.Repeat(" ---: | ---: |", len(segmentationMeasures)))
	for s, set := range r.Settings {
		base := r.baselineOf(s)
		for i := 0; i <= len(r.Langs); i++ { // languages, then "all"
			l, name := i, "all"
			if i == len(r.Langs) {
				l = -1
			} else {
				name = r.Langs[i]
			}
			fmt.Fprintf(w, "| %s | %s |", set, name)
			for _, m := range segmentationMeasures {
				xs := r.perSeed(s, l, m.get)
				d := "—"
				if !set.baseline() {
					d = Summarize(diff(xs, r.perSeed(base, l, m.get))).format(true)
				}
				fmt.Fprintf(w, " %s | %s |", Summarize(xs).format(false), d)
			}
			fmt.Fprintln(w)
		}
	}
	fmt.Fprintln(w)
}

func (r *Report) writeGlosses(w *bufio.Writer) {
	o := r.Options
	fmt.Fprintf(w, "## Glosses\n\n")
	fmt.Fprintf(w, "Types are the discovered word types seen at least %d times in a decoded segmentation, glossed by\n", o.glossMin)
	fmt.Fprintf(w, "lexicon.AddGlosses with its defaults. A glossed type whose phonemic form is no gold word (not in\n")
	fmt.Fprintf(w, "lexicon.tsv) is a non-word; a gold word is judged when one of its spellings has an entry in the\n")
	fmt.Fprintf(w, "dictionaries (exactly, or through its longest prefix of at least %d characters that has one;\n", o.minStem)
	fmt.Fprintf(w, "0 means exact entries only). P@1: the first gloss is a translation, over judged types. P@3: one of\n")
	fmt.Fprintf(w, "the first three is. P@1 strict: as P@1, counting non-words as wrong. A gloss is a translation when it\n")
	fmt.Fprintf(w, "equals, up to a regular English ending (-s, -es, -ies, -ed, -ing), a word of one of the spelling's\n")
	fmt.Fprintf(w, "translations (items of the translation lines, a leading \"to\" or article dropped; read in reverse,\n")
	fmt.Fprintf(w, "the one-word English headwords with the spelling in a translation item of at most %d words).\n\n", maxReverseItemTokens)
	fmt.Fprintf(w, "Dictionaries (%s, from %s):\n\n", o.dictSet, o.dictDir)
	for l, code := range r.Langs {
		fmt.Fprintf(w, "- %s: %s\n", code, strings.Join(r.Dicts[l], "; "))
	}
	fmt.Fprintf(w, "\n| setting | language | types | glossed | non-words | judged | P@1 | P@3 | P@1 strict | Δ P@1 | Δ P@3 |\n")
	fmt.Fprintf(w, "| --- | --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: |\n")
	row := func(set, lang string, cs []GlossCounts, d1, d3 string) {
		fmt.Fprintf(w, "| %s | %s | %s | %s | %s | %s | %s | %s | %s | %s | %s |\n", set, lang,
			meanCount(cs, func(c GlossCounts) int { return c.Types }),
			meanCount(cs, func(c GlossCounts) int { return c.Glossed }),
			meanCount(cs, GlossCounts.NonWords),
			meanCount(cs, func(c GlossCounts) int { return c.Judged }),
			Summarize(glossMeasure(cs, GlossCounts.P1)).format(false),
			Summarize(glossMeasure(cs, GlossCounts.P3)).format(false),
			Summarize(glossMeasure(cs, GlossCounts.P1Strict)).format(false), d1, d3)
	}
	var all GlossCounts
	for l, code := range r.Langs {
		row("gold segmentation", code, []GlossCounts{r.Reference[l]}, "—", "—")
		all.Add(r.Reference[l])
	}
	row("gold segmentation", "all", []GlossCounts{all}, "—", "—")
	for s, set := range r.Settings {
		base := r.baselineOf(s)
		for i := 0; i <= len(r.Langs); i++ {
			l, name := i, "all"
			if i == len(r.Langs) {
				l = -1
			} else {
				name = r.Langs[i]
			}
			cs := r.glossPerSeed(s, l)
			d1, d3 := "—", "—"
			if !set.baseline() {
				bs := r.glossPerSeed(base, l)
				d1 = Summarize(diff(glossMeasure(cs, GlossCounts.P1), glossMeasure(bs, GlossCounts.P1))).format(true)
				d3 = Summarize(diff(glossMeasure(cs, GlossCounts.P3), glossMeasure(bs, GlossCounts.P3))).format(true)
			}
			row(set.String(), name, cs, d1, d3)
		}
	}
	fmt.Fprintln(w)
}
