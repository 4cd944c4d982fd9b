package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/juncture-project/juncture/lexicon"
	"github.com/juncture-project/juncture/segment"
)

// GlossCounts are the counts behind gloss precision for one segmentation.
//
// Of the discovered types seen at least the minimum number of times
// (Types), Glossed got at least one gloss. Of those, Real are phonemic
// forms of gold words (lexicon.tsv) and the rest are not words at all;
// Judged are the real ones whose spelling has a dictionary entry. Hit1
// counts judged types whose first gloss is a translation, Hit3 those with
// a translation among their first three.
type GlossCounts struct {
	Types, Glossed, Real, Judged, Hit1, Hit3 int
}

// Add adds o's counts to c.
func (c *GlossCounts) Add(o GlossCounts) {
	c.Types += o.Types
	c.Glossed += o.Glossed
	c.Real += o.Real
	c.Judged += o.Judged
	c.Hit1 += o.Hit1
	c.Hit3 += o.Hit3
}

// NonWords returns the glossed types that are no gold word.
func (c GlossCounts) NonWords() int { return c.Glossed - c.Real }

// P1 is precision at 1 over judged types; P3 the share of judged types
// with a correct gloss among the first three; P1Strict is precision at 1
// counting glossed non-words as wrong (types without a dictionary entry
// are still left out: nothing can be said of them).
func (c GlossCounts) P1() float64       { return ratio(c.Hit1, c.Judged) }
func (c GlossCounts) P3() float64       { return ratio(c.Hit3, c.Judged) }
func (c GlossCounts) P1Strict() float64 { return ratio(c.Hit1, c.Judged+c.NonWords()) }

func ratio(n, d int) float64 {
	if d == 0 {
		return 0
	}
	return float64(n) / float64(d)
}

// glossDetail is how one type was judged, for the details file.
type glossDetail struct {
	Form      string
	Count     int
	Spellings []string
	Known     bool
	Glosses   []string
	Correct   []bool
}

// EvalGlosses builds the lexicon of seg, glosses it from tokens with the
// lexicon's defaults, and judges the glosses of the types seen at least
// minCount times. detail, if not nil, is called for each such type.
func EvalGlosses(seg *segment.Segmentation, posterior []float64, tokens [][]string, spellings map[string][]string, j *Judge, minCount int, detail func(glossDetail)) GlossCounts {
	entries := lexicon.Build(seg, posterior)
	lexicon.AddGlosses(entries, seg, tokens, lexicon.DefaultGlossOptions())
	var c GlossCounts
	for _, e := range entries {
		if e.Count < minCount {
			continue
		}
		c.Types++
		d := glossDetail{Form: e.Form, Count: e.Count, Spellings: spellings[e.Form]}
		for _, g := range e.Glosses {
			d.Glosses = append(d.Glosses, g.Word)
		}
		if len(e.Glosses) > 0 {
			c.Glossed++
			if len(d.Spellings) > 0 {
				c.Real++
				d.Known = j.Known(d.Spellings)
			}
		}
		if d.Known {
			c.Judged++
			for k, g := range d.Glosses {
				ok := j.Correct(d.Spellings, g)
				d.Correct = append(d.Correct, ok)
				if ok && k == 0 {
					c.Hit1++
				}
			}
			for k := 0; k < min(3, len(d.Correct)); k++ {
				if d.Correct[k] {
					c.Hit3++
					break
				}
			}
		}
		if detail != nil {
			detail(d)
		}
	}
	return c
}

// writeDetail writes one judged type as a tab-separated row: language,
// form, count, spellings, whether a dictionary has it, and the glosses
// with + (a translation) or - after each.
func writeDetail(w io.Writer, lang string, d glossDetail) error {
	var gs []string
	for k, g := range d.Glosses {
		mark := ""
		if k < len(d.Correct) {
			mark = "-"
			if d.Correct[k] {
				mark = "+"
			}
		}
		gs = append(gs, g+mark)
	}
	status := "non-word"
	switch {
	case len(d.Glosses) == 0:
		status = "no-gloss"
	case len(d.Spellings) > 0 && d.Known:
		status = "judged"
	case len(d.Spellings) > 0:
		status = "not-in-dictionary"
	}
	_, err := fmt.Fprintf(w, "%s\t%s\t%d\t%s\t%s\t%s\n", lang, d.Form, d.Count, strings.Join(d.Spellings, ","), status, strings.Join(gs, " "))
	return err
}
