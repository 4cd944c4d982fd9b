package score

import (
	"encoding/json"
	"fmt"
	"io"
	"text/tabwriter"
)

// JSON returns s as exactly one JSON object followed by a newline. The keys
// utterances, boundary, token and lexicon come first, in that order, as
// DESIGN.md section 6 fixes them; windowdiff, pk, window, characters and
// counts follow.
func (s Scores) JSON() []byte {
	b, err := json.Marshal(s)
	if err != nil {
		// Scores holds only ints and finite floats.
		panic("score: " + err.Error())
	}
	return append(b, '\n')
}

// WriteTable writes s to w as an aligned, human-readable table.
func (s Scores) WriteTable(w io.Writer) error {
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "\tprecision\trecall\tF\tcorrect\tpredicted\treference\n")
	for _, row := range []struct {
		name  string
		prf   PRF
		tally Tally
	}{
		{"boundary", s.Boundary, s.Counts.Boundary},
		{"token", s.Token, s.Counts.Token},
		{"lexicon", s.Lexicon, s.Counts.Lexicon},
	} {
		fmt.Fprintf(tw, "%s\t%.4f\t%.4f\t%.4f\t%d\t%d\t%d\n", row.name,
			row.prf.Precision, row.prf.Recall, row.prf.F,
			row.tally.Correct, row.tally.Predicted, row.tally.Reference)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	tw = tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "\nutterances\t%d\n", s.Utterances)
	fmt.Fprintf(tw, "characters\t%d\n", s.Characters)
	fmt.Fprintf(tw, "windowdiff\t%.4f\t(window %d)\n", s.WindowDiff, s.Window)
	fmt.Fprintf(tw, "pk\t%.4f\t(window %d)\n", s.Pk, s.Window)
	return tw.Flush()
}
