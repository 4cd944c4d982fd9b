package align

import (
	"reflect"
	"strings"
	"testing"
)

func TestReadTSV(t *testing.T) {
	in := "\uFEFFid\t text \tgloss\tfree\n" +
		"1\tka\"lu mi\tx\tThe dog sleeps.\r\n" +
		"\n" +
		"2\t\tx\t\n" +
		"3\tpo#to\t\tA cat!\n"
	cols := TSVColumns{Transcript: "text", Translation: "free"}
	b, err := ReadTSV(strings.NewReader(in), "c.tsv", cols, map[string]bool{"the": true})
	if err != nil {
		t.Fatal(err)
	}
	if want := []string{"ka\"lu mi", "", "po#to"}; !reflect.DeepEqual(b.Transcripts, want) {
		t.Errorf("Transcripts = %q, want %q", b.Transcripts, want)
	}
	if want := []int{2, 4, 5}; !reflect.DeepEqual(b.Lines, want) {
		t.Errorf("Lines = %v, want %v", b.Lines, want)
	}
	want := [][]string{{"dog", "sleeps"}, nil, {"a", "cat"}}
	if b.Translations.Len() != len(want) {
		t.Fatalf("%d translations, want %d", b.Translations.Len(), len(want))
	}
	for i, w := range want {
		if got := b.Translations.Tokens[i]; len(got) != len(w) || (len(w) > 0 && !reflect.DeepEqual(got, w)) {
			t.Errorf("row %d: %q, want %q", i+1, got, w)
		}
	}
	// Rows are selected by row number, as a transcript reader fed the
	// Transcripts one per line numbers them.
	sel, err := b.Translations.Select([]int{1, 3})
	if err != nil || !reflect.DeepEqual(sel, [][]string{want[0], want[2]}) {
		t.Errorf("Select = %q, %v", sel, err)
	}
}

func TestReadTSVErrors(t *testing.T) {
	cols := TSVColumns{Transcript: "text", Translation: "free"}
	tests := []struct {
		name, in string
		cols     TSVColumns
		want     string
	}{
		{"empty", "", cols, "c.tsv: empty file"},
		{"missing column", "text\tgloss\n", cols, `c.tsv:1: no column "free" in the header (it has "text", "gloss")`},
		{"duplicate column", "text\tfree\ttext\n", cols, `c.tsv:1: column "text" appears twice`},
		{"same column twice", "text\n", TSVColumns{"text", "text"}, `c.tsv: transcript and translation are both column "text"`},
		{"short row", "text\tfree\nabc\n", cols, "c.tsv:2:4: row has 1 fields, the header 2"},
		{"long row", "text\tfree\nab\tc d\te\n", cols, "c.tsv:2:7: row has 3 fields, the header 2"},
		{"invalid UTF-8", "text\tfree\nab\tc\xff\n", cols, "c.tsv:2:5: invalid UTF-8"},
		{"NUL in header", "te\x00xt\tfree\n", cols, "c.tsv:1:3: NUL character"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ReadTSV(strings.NewReader(tt.in), "c.tsv", tt.cols, nil)
			if err == nil || !strings.HasPrefix(err.Error(), tt.want) {
				t.Errorf("error %v, want %s...", err, tt.want)
			}
		})
	}
}
