package main

import (
	"io"
	"strings"
	"unicode"

	"golang.org/x/text/width"
)

// displayWidth returns the number of terminal columns s takes: combining
// and enclosing marks and format characters take none (the tie bar of t͡ʃ
// sits over its neighbours), East Asian wide and fullwidth characters two,
// everything else one.
func displayWidth(s string) int {
	n := 0
	for _, r := range s {
		switch {
		case unicode.In(r, unicode.Mn, unicode.Me, unicode.Cf):
		case width.LookupRune(r).Kind() == width.EastAsianWide || width.LookupRune(r).Kind() == width.EastAsianFullwidth:
			n += 2
		default:
			n++
		}
	}
	return n
}

// writeColumns writes rows as left-aligned columns, each line starting
// with indent and the columns gap spaces apart, measuring cells with
// displayWidth. text/tabwriter counts every code point as a column, so
// transcriptions with combining marks drifted out of line.
func writeColumns(w io.Writer, indent string, gap int, rows [][]string) error {
	var widths []int
	for _, row := range rows {
		for i, cell := range row {
			if i == len(widths) {
				widths = append(widths, 0)
			}
			widths[i] = max(widths[i], displayWidth(cell))
		}
	}
	var b strings.Builder
	for _, row := range rows {
		b.WriteString(indent)
		for i, cell := range row {
			b.WriteString(cell)
			if i < len(row)-1 {
				b.WriteString(strings.Repeat(" ", widths[i]-displayWidth(cell)+gap))
			}
		}
		b.WriteByte('\n')
	}
	_, err := io.WriteString(w, b.String())
	return err
}
