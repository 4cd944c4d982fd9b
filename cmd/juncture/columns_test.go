package main

import (
	"bytes"
	"strings"
	"testing"
)

func TestDisplayWidth(t *testing.T) {
	tests := []struct {
		s    string
		want int
	}{
		{"", 0},
		{"kitu", 4},
		{"t͡ʃimi", 5},   // U+0361 combining double inverted breve: no column
		{"kʷe", 3},      // U+02B7 modifier letter: a column of its own
		{"tʰeliŋ", 6},   // U+02B0 likewise
		{"é", 1},        // e + U+0301 combining acute
		{"\u200dab", 2}, // zero width joiner (format)
		{"言葉", 4},       // East Asian wide
	}
	for _, tt := range tests {
		if got := displayWidth(tt.s); got != tt.want {
			t.Errorf("displayWidth(%q) = %d, want %d", tt.s, got, tt.want)
		}
	}
}

// TestWriteColumnsAligns: the second column starts at the same display
// column on every line, whatever combining marks the first holds.
func TestWriteColumnsAligns(t *testing.T) {
	rows := [][]string{{"t͡ʃimi ni", "a"}, {"kʷe lo", "b"}, {"é", "c"}, {"word", "last"}}
	var b bytes.Buffer
	if err := writeColumns(&b, "  ", 2, rows); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSuffix(b.String(), "\n"), "\n")
	if len(lines) != len(rows) {
		t.Fatalf("%d lines, want %d:\n%s", len(lines), len(rows), b.String())
	}
	for i, line := range lines {
		last := rows[i][1]
		if !strings.HasSuffix(line, last) {
			t.Fatalf("line %q does not end with %q", line, last)
		}
		if col := displayWidth(strings.TrimSuffix(line, last)); col != 2+8+2 {
			t.Errorf("line %d: second column at display column %d, want 12:\n%s", i, col, b.String())
		}
	}
}
