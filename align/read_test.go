package align

import (
	"errors"
	"reflect"
	"strings"
	"testing"
)

func TestReadTranslations(t *testing.T) {
	stop := map[string]bool{"the": true, "a": true}
	tests := []struct {
		name, in string
		stop     map[string]bool
		want     [][]string
	}{
		{"empty file", "", nil, nil},
		{"one line without newline", "The dog.", nil, [][]string{{"the", "dog"}}},
		{"empty lines keep their place", "The dog.\n\n  \nA cat\n", nil,
			[][]string{{"the", "dog"}, nil, nil, {"a", "cat"}}},
		{"CRLF and byte order mark", "\uFEFFThe dog.\r\nA cat\r\n", nil, [][]string{{"the", "dog"}, {"a", "cat"}}},
		{"stop words", "The dog saw a cat\nthe\n", stop, [][]string{{"dog", "saw", "cat"}, {}}},
		{"hash is punctuation", "# not a comment\n", nil, [][]string{{"not", "a", "comment"}}},
		{"trailing empty line counts", "x\n\n", nil, [][]string{{"x"}, nil}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			tr, err := ReadTranslations(strings.NewReader(tt.in), "tr.txt", tt.stop)
			if err != nil {
				t.Fatal(err)
			}
			if tr.Len() != len(tt.want) {
				t.Fatalf("Len() = %d, want %d", tr.Len(), len(tt.want))
			}
			for i := range tt.want {
				if len(tr.Tokens[i]) != len(tt.want[i]) || (len(tt.want[i]) > 0 && !reflect.DeepEqual(tr.Tokens[i], tt.want[i])) {
					t.Errorf("line %d: %q, want %q", i+1, tr.Tokens[i], tt.want[i])
				}
			}
		})
	}
}

func TestReadTranslationsErrors(t *testing.T) {
	tests := []struct {
		name, in  string
		line, col int
		err       error
	}{
		{"invalid UTF-8", "ok\nab\xffc\n", 2, 3, ErrInvalidUTF8},
		{"NUL", "a\x00", 1, 2, ErrNUL},
		// The column counts characters of the NFC line: e + U+0301 is one.
		{"column after combining sequence", "e\u0301\x00", 1, 2, ErrNUL},
		{"line too long", "x\n" + strings.Repeat("a", MaxLineBytes+1) + "\n", 2, MaxLineBytes + 1, ErrLineTooLong},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := ReadTranslations(strings.NewReader(tt.in), "tr.txt", nil)
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v, want a *ParseError", err)
			}
			if pe.Name != "tr.txt" || pe.Line != tt.line || pe.Column != tt.col || !errors.Is(err, tt.err) {
				t.Errorf("error %v, want tr.txt:%d:%d: %v", err, tt.line, tt.col, tt.err)
			}
		})
	}
	if _, err := ReadTranslations(strings.NewReader(strings.Repeat("a", MaxLineBytes)), "tr.txt", nil); err != nil {
		t.Errorf("a line of exactly MaxLineBytes: %v", err)
	}
}

func TestSelect(t *testing.T) {
	tr, err := ReadTranslations(strings.NewReader("one\n\nthree\n"), "tr.txt", nil)
	if err != nil {
		t.Fatal(err)
	}
	got, err := tr.Select([]int{1, 3})
	if err != nil {
		t.Fatal(err)
	}
	if want := [][]string{{"one"}, {"three"}}; !reflect.DeepEqual(got, want) {
		t.Errorf("Select = %q, want %q", got, want)
	}
	_, err = tr.Select([]int{1, 4})
	if err == nil || !strings.Contains(err.Error(), "tr.txt is short") || !strings.Contains(err.Error(), "line 4") {
		t.Errorf("selecting past the end: error %v, want one saying tr.txt is short", err)
	}
	if _, err := tr.Select([]int{0}); err == nil {
		t.Error("selecting line 0: no error")
	}
}

func TestReadStopWords(t *testing.T) {
	in := "# English function words\nThe\n  a  # article\n\nDON’T\n"
	stop, err := ReadStopWords(strings.NewReader(in), "stop.txt")
	if err != nil {
		t.Fatal(err)
	}
	want := map[string]bool{"the": true, "a": true, "don't": true}
	if !reflect.DeepEqual(stop, want) {
		t.Errorf("ReadStopWords = %v, want %v", stop, want)
	}

	errs := []struct{ in, want string }{
		{"the\n  New York\n", "stop.txt:2:3: stop word \"New York\" is 2 tokens"},
		{"the\n--\n", "stop.txt:2:1: stop word \"--\" has no letters or digits"},
		{"th\xffe\n", "stop.txt:1:3: invalid UTF-8"},
	}
	for _, e := range errs {
		_, err := ReadStopWords(strings.NewReader(e.in), "stop.txt")
		if err == nil || !strings.HasPrefix(err.Error(), e.want) {
			t.Errorf("ReadStopWords(%q): error %v, want %s...", e.in, err, e.want)
		}
	}
}

func TestWithoutStopWords(t *testing.T) {
	tokens := [][]string{{"the", "dog", "of", "the", "house"}, {}, {"the"}, {"cat"}}
	stop := map[string]bool{"the": true, "of": true}
	got := WithoutStopWords(tokens, stop)
	want := [][]string{{"dog", "house"}, {}, {}, {"cat"}}
	if !reflect.DeepEqual(got, want) {
		t.Errorf("WithoutStopWords = %q, want %q", got, want)
	}
	if tokens[0][0] != "the" || len(tokens[0]) != 5 {
		t.Errorf("input changed: %q", tokens[0])
	}
	if got := WithoutStopWords(tokens, nil); !reflect.DeepEqual(got, tokens) {
		t.Errorf("with no stop words: %q", got)
	}
}
