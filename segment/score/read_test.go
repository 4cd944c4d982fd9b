package score

import (
	"bytes"
	"errors"
	"reflect"
	"strings"
	"testing"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

func TestReadSegmented(t *testing.T) {
	for _, tc := range []struct {
		name  string
		input string
		words [][]string
		lines []int
	}{
		{"single spaces", "ab c\nd ef\n", [][]string{{"ab", "c"}, {"d", "ef"}}, []int{1, 2}},
		{"no final newline", "ab c\nd", [][]string{{"ab", "c"}, {"d"}}, []int{1, 2}},
		{"empty lines keep numbers", "\nab\n\n  \t\nc\n\n", [][]string{{"ab"}, {"c"}}, []int{2, 5}},
		{"runs of spaces and tabs", "  ab \t c  \n", [][]string{{"ab", "c"}}, []int{1}},
		{"CRLF", "ab c\r\nd\r\n", [][]string{{"ab", "c"}, {"d"}}, []int{1, 2}},
		{"CR inside a line", "ab\rc\n", [][]string{{"ab", "c"}}, []int{1}},
		{"byte order mark", "\uFEFFab c\n", [][]string{{"ab", "c"}}, []int{1}},
		{"IPA", "ʃa tʰə\n", [][]string{{"ʃa", "tʰə"}}, []int{1}},
		// NFC composes e + U+0301 into U+00E9 (Unicode Standard Annex #15).
		{"NFC", "e\u0301 a\u0300b\n", [][]string{{"\u00e9", "\u00e0b"}}, []int{1}},
		{"ASCII phoneme symbols", "@# $%&^~*+|!-369 A\n", [][]string{{"@#", "$%&^~*+|!-369", "A"}}, []int{1}},
		{"empty input", "", nil, nil},
		{"only blank lines", "\n\r\n \n", nil, nil},
	} {
		t.Run(tc.name, func(t *testing.T) {
			words, lines, err := ReadSegmented(strings.NewReader(tc.input), "gold.txt")
			if err != nil {
				t.Fatal(err)
			}
			if !reflect.DeepEqual(words, tc.words) || !reflect.DeepEqual(lines, tc.lines) {
				t.Errorf("got %q %v, want %q %v", words, lines, tc.words, tc.lines)
			}
		})
	}
}

func TestReadSegmentedErrors(t *testing.T) {
	for _, tc := range []struct {
		name    string
		input   string
		want    error
		message string
	}{
		{"invalid UTF-8", "ab\nʃa \xff c\n", ErrInvalidUTF8, "gold.txt:2:4: invalid UTF-8"},
		{"truncated sequence at end", "abc \xc3", ErrInvalidUTF8, "gold.txt:1:5: invalid UTF-8"},
		{"NUL", "\n\nab\x00c\n", ErrNUL, "gold.txt:3:3: NUL character"},
		{"column after a byte order mark", "\uFEFFa\x00", ErrNUL, "gold.txt:1:2: NUL character"},
		{"line too long", "a\n" + strings.Repeat("b", MaxLineBytes+1) + "\nc\n", ErrLineTooLong, "gold.txt:2: line longer than"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, _, err := ReadSegmented(strings.NewReader(tc.input), "gold.txt")
			if !errors.Is(err, tc.want) {
				t.Fatalf("error %v, want %v", err, tc.want)
			}
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Errorf("error %T is not a *ParseError", err)
			}
			if !strings.HasPrefix(err.Error(), tc.message) {
				t.Errorf("error %q, want prefix %q", err, tc.message)
			}
		})
	}
}

func TestReadSegmentedLongestLine(t *testing.T) {
	line := strings.Repeat("b", MaxLineBytes)
	words, _, err := ReadSegmented(strings.NewReader(line+"\r\n"+line), "gold.txt")
	if err != nil {
		t.Fatal(err)
	}
	if len(words) != 2 || words[0][0] != line || words[1][0] != line {
		t.Errorf("lines of MaxLineBytes bytes not read back whole")
	}
}

type failingReader struct{ err error }

func (r failingReader) Read([]byte) (int, error) { return 0, r.err }

func TestReadSegmentedReadError(t *testing.T) {
	boom := errors.New("boom")
	_, _, err := ReadSegmented(failingReader{boom}, "gold.txt")
	if !errors.Is(err, boom) || !strings.HasPrefix(err.Error(), "gold.txt:1: ") {
		t.Errorf("error %v, want gold.txt:1: boom", err)
	}
}

func FuzzReadSegmented(f *testing.F) {
	f.Add([]byte("ab c\nd ef\n"))
	f.Add([]byte("\uFEFF  ʃa\ttʰə\r\n\n e\u0301\n"))
	f.Add([]byte("a\x00b\n\xff"))
	f.Fuzz(func(t *testing.T, input []byte) {
		words, lines, err := ReadSegmented(bytes.NewReader(input), "in")
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) || !strings.HasPrefix(err.Error(), "in:") {
				t.Fatalf("error %q is not a ParseError naming the file", err)
			}
			return
		}
		if len(words) != len(lines) {
			t.Fatalf("%d utterances, %d line numbers", len(words), len(lines))
		}
		for i, u := range words {
			if len(u) == 0 {
				t.Fatalf("utterance %d is empty", i)
			}
			if i > 0 && lines[i] <= lines[i-1] {
				t.Fatalf("line numbers not increasing: %v", lines)
			}
			for _, w := range u {
				if w == "" || !utf8.ValidString(w) || strings.ContainsAny(w, " \t\r\n\x00") {
					t.Fatalf("bad word %q", w)
				}
			}
		}
		// Writing the words back with single spaces reads back the same,
		// already normalised, and line for line.
		var buf bytes.Buffer
		for _, u := range words {
			buf.WriteString(strings.Join(u, " "))
			buf.WriteByte('\n')
		}
		if !norm.NFC.IsNormal(buf.Bytes()) {
			t.Fatalf("output is not NFC: %q", buf.Bytes())
		}
		again, againLines, err := ReadSegmented(&buf, "out")
		if err != nil {
			t.Fatal(err)
		}
		if !reflect.DeepEqual(again, words) || len(againLines) != len(lines) {
			t.Fatalf("read %q, wrote and read back %q", words, again)
		}
	})
}
