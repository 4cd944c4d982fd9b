package lexicon

import (
	"fmt"
	"io"
	"strconv"
	"strings"
)

// WriteTSV writes entries as tab-separated values with a header row:
// form, count, confidence (3 decimals), glosses (translation words best
// first, each with its probability t(e|w) in parentheses, separated by
// "; ") and lines (the example lines' numbers, separated by commas). A
// spreadsheet opens it as it is; an empty glosses cell means too little
// evidence or no translations.
func WriteTSV(w io.Writer, entries []Entry) error {
	if _, err := io.WriteString(w, "form\tcount\tconfidence\tglosses\tlines\n"); err != nil {
		return err
	}
	var b strings.Builder
	for _, e := range entries {
		b.Reset()
		fmt.Fprintf(&b, "%s\t%d\t%.3f\t", e.Form, e.Count, e.Confidence)
		for i, g := range e.Glosses {
			if i > 0 {
				b.WriteString("; ")
			}
			fmt.Fprintf(&b, "%s (%.2f)", g.Word, g.Prob)
		}
		b.WriteByte('\t')
		for i, l := range e.Lines {
			if i > 0 {
				b.WriteByte(',')
			}
			b.WriteString(strconv.Itoa(l))
		}
		b.WriteByte('\n')
		if _, err := io.WriteString(w, b.String()); err != nil {
			return err
		}
	}
	return nil
}
