package score

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/juncture-project/juncture/segment/textline"
	"golang.org/x/text/unicode/norm"
)

// MaxLineBytes is the longest line ReadSegmented accepts, in bytes.
const MaxLineBytes = textline.MaxBytes

// Errors reported by ReadSegmented, wrapped in a *ParseError.
var (
	ErrInvalidUTF8 = textline.ErrInvalidUTF8
	ErrNUL         = textline.ErrNUL
	ErrLineTooLong = textline.ErrTooLong
)

// ParseError is an error at a place in a named segmented file
// (name:line:column, or name:line for the whole line).
type ParseError = textline.PositionError

// ReadSegmented reads a segmented file from r: one utterance per line, words
// separated by single ASCII spaces (DESIGN.md section 2). It returns the words
// of each non-empty line and the 1-based number of that line in the file;
// name is used in error messages.
//
// Reading is lenient where no information is lost: runs of spaces, tabs and
// carriage returns all separate words, lines holding nothing else are
// skipped (keeping their numbers), and a byte order mark at the start of the
// input is dropped. Each line is normalised to NFC. Invalid UTF-8, a NUL
// character or a line longer than MaxLineBytes is an error, a *ParseError
// giving name:line:column.
func ReadSegmented(r io.Reader, name string) ([][]string, []int, error) {
	br := bufio.NewReaderSize(r, 64*1024)
	var (
		utterances [][]string
		lines      []int
	)
	for lineNo := 1; ; lineNo++ {
		raw, err := textline.Read(br)
		if err == io.EOF && raw == nil {
			break
		}
		if err != nil && err != io.EOF {
			if errors.Is(err, ErrLineTooLong) {
				return nil, nil, &ParseError{Name: name, Line: lineNo, Err: err}
			}
			return nil, nil, fmt.Errorf("%s:%d: %w", name, lineNo, err)
		}
		if lineNo == 1 {
			raw = bytes.TrimPrefix(raw, []byte("\uFEFF"))
		}
		if col, err := textline.Check(raw); err != nil {
			return nil, nil, &ParseError{Name: name, Line: lineNo, Column: col, Err: err}
		}
		words := strings.FieldsFunc(string(norm.NFC.Bytes(raw)), isSeparator)
		if len(words) > 0 {
			utterances = append(utterances, words)
			lines = append(lines, lineNo)
		}
		if err == io.EOF {
			break
		}
	}
	return utterances, lines, nil
}

// isSeparator reports whether c separates words in a segmented line.
func isSeparator(c rune) bool { return c == ' ' || c == '\t' || c == '\r' }
