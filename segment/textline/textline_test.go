package textline

import (
	"bufio"
	"errors"
	"io"
	"strings"
	"testing"
)

func TestRead(t *testing.T) {
	tests := []struct {
		in   string
		want []string
	}{
		{"a\nb\n", []string{"a", "b"}},
		{"a\r\nb", []string{"a", "b"}},
		{"\n\n", []string{"", ""}},
		{"", nil},
		{"x\r", []string{"x"}},
	}
	for _, tc := range tests {
		br := bufio.NewReaderSize(strings.NewReader(tc.in), 16)
		var got []string
		for {
			line, err := Read(br)
			if line == nil && err == io.EOF {
				break
			}
			if err != nil && err != io.EOF {
				t.Fatalf("%q: %v", tc.in, err)
			}
			got = append(got, string(line))
			if err == io.EOF {
				break
			}
		}
		if strings.Join(got, "|") != strings.Join(tc.want, "|") || len(got) != len(tc.want) {
			t.Errorf("%q: got %q, want %q", tc.in, got, tc.want)
		}
	}
}

func TestReadLimit(t *testing.T) {
	for _, n := range []int{MaxBytes, MaxBytes + 1} {
		for _, end := range []string{"\n", "\r\n", ""} {
			br := bufio.NewReaderSize(strings.NewReader(strings.Repeat("a", n)+end), 4096)
			_, err := Read(br)
			if tooLong := errors.Is(err, ErrTooLong); tooLong != (n > MaxBytes) {
				t.Errorf("%d bytes + %q: err = %v", n, end, err)
			}
		}
	}
}

// TestCheck: columns count characters of the NFC line, so a decomposed
// "é" before the fault counts once.
func TestCheck(t *testing.T) {
	tests := []struct {
		in  string
		col int
		err error
	}{
		{"abc", 0, nil},
		{"ab\xffc", 3, ErrInvalidUTF8},
		{"e\u0301x\x00", 3, ErrNUL},
		{"\xff", 1, ErrInvalidUTF8},
	}
	for _, tc := range tests {
		col, err := Check([]byte(tc.in))
		if col != tc.col || !errors.Is(err, tc.err) || (tc.err == nil) != (err == nil) {
			t.Errorf("Check(%q) = %d, %v; want %d, %v", tc.in, col, err, tc.col, tc.err)
		}
	}
}
