package align

import (
	"errors"
	"slices"
	"strings"
	"testing"
	"unicode"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

var fuzzSeeds = []string{
	"",
	"The house is small.",
	"Straße İzmir ΟΔΥΣΣΕΥΣ don't ‘q’ 3.5 1,000 well-known",
	"e\u0301te\u0301 co\u00ADoperate ab\u200Bcd می\u200cخواهم \u0301x",
	"a\u00AD\u0301 '\u0301 x'\u0301y 1.\u0301 2,,3 ..4",
	"line one\n\nline three\r\n",
	"\uFEFFbom\n# comment\n",
	"ab\xffc",
	"a\x00b",
	"id\ttext\tfree\n1\tkalu\tThe dog\n\n2\tpo\"to\tA cat\n",
	"text\tfree\nx\n",
}

// FuzzTokenize checks Tokenize's promises: tokens are non-empty, valid,
// NFC, free of separators, start with a word character, are fixed points
// of Tokenize, and re-tokenising the joined tokens gives them back.
func FuzzTokenize(f *testing.F) {
	for _, s := range fuzzSeeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		tokens := Tokenize(s)
		for _, tok := range tokens {
			if tok == "" || !utf8.ValidString(tok) || !norm.NFC.IsNormalString(tok) {
				t.Fatalf("Tokenize(%q): token %q empty, invalid or not NFC", s, tok)
			}
			if strings.IndexFunc(tok, unicode.IsSpace) >= 0 {
				t.Fatalf("Tokenize(%q): token %q has white space", s, tok)
			}
			if r, _ := utf8.DecodeRuneInString(tok); !isWordChar(r) {
				t.Fatalf("Tokenize(%q): token %q starts with %U", s, tok, r)
			}
			if again := Tokenize(tok); len(again) != 1 || again[0] != tok {
				t.Fatalf("Tokenize(%q): token %q re-tokenises to %q", s, tok, again)
			}
		}
		if again := Tokenize(strings.Join(tokens, " ")); !slices.Equal(again, tokens) {
			t.Fatalf("Tokenize(%q) = %q, but the joined tokens give %q", s, tokens, again)
		}
	})
}

// validText reports whether s is text every reader must accept: valid
// UTF-8, no NUL, lines within MaxLineBytes.
func validText(s string) bool {
	if !utf8.ValidString(s) || strings.ContainsRune(s, 0) {
		return false
	}
	for _, line := range strings.Split(s, "\n") {
		if len(line) > MaxLineBytes {
			return false
		}
	}
	return true
}

// lines splits s as the readers do.
func lines(s string) []string {
	s = strings.TrimPrefix(s, byteOrderMark)
	if s == "" {
		return nil
	}
	ls := strings.Split(strings.TrimSuffix(s, "\n"), "\n")
	for i, l := range ls {
		ls[i] = strings.TrimSuffix(l, "\r")
	}
	return ls
}

func FuzzReadTranslations(f *testing.F) {
	for _, s := range fuzzSeeds {
		f.Add(s)
	}
	stop := map[string]bool{"the": true}
	f.Fuzz(func(t *testing.T, s string) {
		tr, err := ReadTranslations(strings.NewReader(s), "f.txt", stop)
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line < 1 || pe.Column < 1 {
				t.Fatalf("error %v is not a positioned *ParseError", err)
			}
			if validText(s) {
				t.Fatalf("valid text rejected: %v", err)
			}
			return
		}
		want := lines(s)
		if tr.Len() != len(want) {
			t.Fatalf("%d lines read, %d in the input", tr.Len(), len(want))
		}
		for i, l := range want {
			w := dropStopWords(Tokenize(l), stop)
			if !slices.Equal(tr.Tokens[i], w) {
				t.Fatalf("line %d: %q, Tokenize gives %q", i+1, tr.Tokens[i], w)
			}
		}
	})
}

func FuzzReadStopWords(f *testing.F) {
	for _, s := range fuzzSeeds {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		stop, err := ReadStopWords(strings.NewReader(s), "stop.txt")
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line < 1 || pe.Column < 1 {
				t.Fatalf("error %v is not a positioned *ParseError", err)
			}
			return
		}
		for w := range stop {
			if tok := Tokenize(w); len(tok) != 1 || tok[0] != w {
				t.Fatalf("stop word %q is not a token", w)
			}
		}
	})
}

func FuzzReadTSV(f *testing.F) {
	for _, s := range fuzzSeeds {
		f.Add(s)
	}
	cols := TSVColumns{Transcript: "text", Translation: "free"}
	f.Fuzz(func(t *testing.T, s string) {
		b, err := ReadTSV(strings.NewReader(s), "f.tsv", cols, nil)
		if err != nil {
			if !strings.HasPrefix(err.Error(), "f.tsv:") {
				t.Fatalf("error %v does not name the file", err)
			}
			return
		}
		n := len(b.Transcripts)
		if b.Translations.Len() != n || len(b.Lines) != n {
			t.Fatalf("%d transcripts, %d translations, %d lines", n, b.Translations.Len(), len(b.Lines))
		}
		ls := lines(s)
		for i := range n {
			if b.Lines[i] < 2 || (i > 0 && b.Lines[i] <= b.Lines[i-1]) || b.Lines[i] > len(ls) {
				t.Fatalf("row %d on line %d", i+1, b.Lines[i])
			}
			if !strings.Contains(ls[b.Lines[i]-1], b.Transcripts[i]) || strings.ContainsAny(b.Transcripts[i], "\t\n") {
				t.Fatalf("row %d: transcript %q not a field of line %q", i+1, b.Transcripts[i], ls[b.Lines[i]-1])
			}
		}
	})
}
