package align

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"slices"
	"strings"
	"unicode/utf8"

	"github.com/juncture-project/juncture/segment/textline"
	"golang.org/x/text/unicode/norm"
)

// MaxLineBytes is the longest line accepted in a translation, stop-word
// or TSV file, in bytes. It is the transcript reader's limit.
const MaxLineBytes = textline.MaxBytes

// Errors reported by the readers, wrapped in a *ParseError.
var (
	ErrInvalidUTF8 = textline.ErrInvalidUTF8
	ErrNUL         = textline.ErrNUL
	ErrLineTooLong = textline.ErrTooLong
)

// ParseError is an error at a place in a named file, in the form of the
// transcript reader's errors: name:line:column.
type ParseError = textline.PositionError

// Translations holds the tokens of a file of free translations, one per
// line, aligned with the lines of a transcript file.
type Translations struct {
	// Name is the file the translations were read from, for messages.
	Name string
	// Tokens[i] holds the tokens of line i+1; an empty line has none.
	Tokens [][]string
}

// Len returns the number of lines.
func (t *Translations) Len() int { return len(t.Tokens) }

// Select returns the token lists of the given 1-based source lines, in
// order. Transcript readers skip empty lines but keep their numbers
// (segment.Corpus.Lines), so Select(corpus.Lines) pairs each utterance with
// the translation on the same line. A line past the end is an error saying
// that the translation file is short. The result shares the token lists of
// t.
func (t *Translations) Select(lines []int) ([][]string, error) {
	out := make([][]string, len(lines))
	for i, l := range lines {
		if l < 1 || l > len(t.Tokens) {
			if l < 1 {
				return nil, fmt.Errorf("%s: no line %d", t.Name, l)
			}
			return nil, fmt.Errorf("%s is short: it has %d lines, line %d is needed", t.Name, len(t.Tokens), l)
		}
		out[i] = t.Tokens[l-1]
	}
	return out, nil
}

// ReadTranslations reads free translations, one per line, from r and
// tokenises each with Tokenize, dropping tokens in stop (keys as Tokenize
// writes them, such as ReadStopWords returns; stop may be nil). name is used
// in messages. Every line, empty or not, gives one entry, so line numbers
// match the transcript's. A byte order mark at the start is dropped; invalid
// UTF-8, a NUL or a line over MaxLineBytes is a *ParseError. Translations
// have no comment syntax: a "#" is punctuation like any other.
func ReadTranslations(r io.Reader, name string, stop map[string]bool) (*Translations, error) {
	t := &Translations{Name: name}
	err := eachLine(r, name, func(line string, _ int) error {
		t.Tokens = append(t.Tokens, dropStopWords(Tokenize(line), stop))
		return nil
	})
	if err != nil {
		return nil, err
	}
	return t, nil
}

// dropStopWords removes the tokens in stop from tokens, in place.
func dropStopWords(tokens []string, stop map[string]bool) []string {
	if len(stop) == 0 {
		return tokens
	}
	kept := tokens[:0]
	for _, tok := range tokens {
		if !stop[tok] {
			kept = append(kept, tok)
		}
	}
	return kept
}

// WithoutStopWords returns a copy of tokens, one token list per
// utterance, without the tokens in stop. It serves to keep frequent
// function words out of the translation prior, where they would align
// with every word, while glosses still see them (a function word's best
// gloss is often one).
func WithoutStopWords(tokens [][]string, stop map[string]bool) [][]string {
	out := make([][]string, len(tokens))
	for u, toks := range tokens {
		out[u] = dropStopWords(slices.Clone(toks), stop)
	}
	return out
}

// ReadStopWords reads a stop-word list: one word per line, "#" and the rest
// of its line a comment, blank lines ignored. Each word is tokenised as
// Tokenize does, so the keys match tokens of ReadTranslations whatever case
// or apostrophe the list uses. A line that gives more than one token
// ("New York") is an error: the model sees single tokens only. So is a
// line of punctuation alone, which would silently stop nothing.
func ReadStopWords(r io.Reader, name string) (map[string]bool, error) {
	stop := map[string]bool{}
	err := eachLine(r, name, func(line string, lineNo int) error {
		if i := strings.IndexByte(line, '#'); i >= 0 {
			line = line[:i]
		}
		if strings.TrimSpace(line) == "" {
			return nil
		}
		tokens := Tokenize(line)
		if len(tokens) == 1 {
			stop[tokens[0]] = true
			return nil
		}
		word := strings.TrimSpace(line)
		col := charColumn([]byte(line), strings.Index(line, word))
		if len(tokens) == 0 {
			return &ParseError{Name: name, Line: lineNo, Column: col, Err: fmt.Errorf("stop word %q has no letters or digits", word)}
		}
		return &ParseError{Name: name, Line: lineNo, Column: col, Err: fmt.Errorf("stop word %q is %d tokens, want one per line", word, len(tokens))}
	})
	if err != nil {
		return nil, err
	}
	return stop, nil
}

// eachLine calls f with every line of r and its 1-based number, after
// checking it is valid UTF-8 without NUL and at most MaxLineBytes long.
// Line endings ("\n" or "\r\n") are removed, and a byte order mark at the
// start of r is dropped (the Unicode Standard treats it as an encoding
// signature in UTF-8). An error from f is returned as it is.
func eachLine(r io.Reader, name string, f func(line string, lineNo int) error) error {
	br := bufio.NewReaderSize(r, 64*1024)
	if bom, err := br.Peek(len(byteOrderMark)); err == nil && string(bom) == byteOrderMark {
		br.Discard(len(byteOrderMark))
	}
	for lineNo := 1; ; lineNo++ {
		line, err := textline.Read(br)
		if err == io.EOF && line == nil {
			return nil
		}
		if err != nil && err != io.EOF {
			if errors.Is(err, ErrLineTooLong) {
				i := MaxLineBytes
				for i > 0 && !utf8.RuneStart(line[i]) {
					i--
				}
				return &ParseError{Name: name, Line: lineNo, Column: charColumn(line, i), Err: err}
			}
			return fmt.Errorf("%s:%d: %w", name, lineNo, err)
		}
		if perr := checkText(line); perr != nil {
			perr.Name, perr.Line = name, lineNo
			return perr
		}
		if ferr := f(string(line), lineNo); ferr != nil {
			return ferr
		}
		if err == io.EOF {
			return nil
		}
	}
}

// byteOrderMark is U+FEFF encoded in UTF-8.
const byteOrderMark = "\uFEFF"

// checkText returns a *ParseError, without name and line, at the first
// invalid UTF-8 sequence or NUL of line.
func checkText(line []byte) *ParseError {
	if col, err := textline.Check(line); err != nil {
		return &ParseError{Column: col, Err: err}
	}
	return nil
}

// charColumn returns the 1-based column, in characters of the NFC-normalised
// line, of the character that starts at byte i of line: the convention of
// the transcript reader. Only for errors, so it may cost a normalisation;
// bytes before i are valid UTF-8 when called from checkText, and an invalid
// byte counts as one character otherwise.
func charColumn(line []byte, i int) int {
	if i > len(line) {
		i = len(line)
	}
	return utf8.RuneCount(norm.NFC.Bytes(line[:i])) + 1
}
