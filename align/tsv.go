package align

import (
	"errors"
	"fmt"
	"io"
	"strings"
)

// TSVColumns names, by their header, the two columns ReadTSV reads.
type TSVColumns struct {
	Transcript  string
	Translation string
}

// Bitext is a transcript together with its free translations, read from
// one file. Row i (0-based) is Transcripts[i] with Translations.Tokens[i],
// on line Lines[i] of the file.
//
// Feeding the transcripts to a transcript reader one row per line (joined
// by "\n") makes its line numbers row numbers, so
// Translations.Select(corpus.Lines) pairs them; Lines turns a row number
// back into a file line for messages.
type Bitext struct {
	Transcripts  []string
	Translations Translations
	Lines        []int
}

// ReadTSV reads tab-separated values with a header row and returns the two
// columns named by cols; other columns are ignored. The format is IANA's
// text/tab-separated-values: fields are split at tabs, with no quoting or
// escapes, so every printable character, quotation marks included, can be
// part of a transcript (some phonemic alphabets write '"' as a phoneme).
// Header names are compared after trimming white space. Every row must have
// as many fields as the header; blank lines are skipped but keep their
// numbers. Transcripts are returned as written (the transcript reader
// validates and normalises them); translations are tokenised as by
// ReadTranslations, dropping tokens in stop. Errors name file:line:column.
func ReadTSV(r io.Reader, name string, cols TSVColumns, stop map[string]bool) (*Bitext, error) {
	if cols.Transcript == cols.Translation {
		return nil, fmt.Errorf("%s: transcript and translation are both column %q", name, cols.Transcript)
	}
	b := &Bitext{Translations: Translations{Name: fmt.Sprintf("%s, column %q,", name, cols.Translation)}}
	var header []string
	ti, ei := -1, -1
	err := eachLine(r, name, func(line string, lineNo int) error {
		if header == nil {
			header = strings.Split(line, "\t")
			var err error
			if ti, err = findColumn(header, cols.Transcript); err == nil {
				ei, err = findColumn(header, cols.Translation)
			}
			if err != nil {
				return fmt.Errorf("%s:%d: %w", name, lineNo, err)
			}
			return nil
		}
		if line == "" {
			return nil
		}
		fields := strings.Split(line, "\t")
		if len(fields) != len(header) {
			// Point at the tab before the first extra field, or at the
			// end of a short row.
			end := len(line)
			if len(fields) > len(header) {
				end = len(line) - len(strings.Join(fields[len(header):], "\t")) - 1
			}
			return &ParseError{Name: name, Line: lineNo, Column: charColumn([]byte(line), end),
				Err: fmt.Errorf("row has %d fields, the header %d", len(fields), len(header))}
		}
		b.Transcripts = append(b.Transcripts, fields[ti])
		b.Translations.Tokens = append(b.Translations.Tokens, dropStopWords(Tokenize(fields[ei]), stop))
		b.Lines = append(b.Lines, lineNo)
		return nil
	})
	if err != nil {
		return nil, err
	}
	if header == nil {
		return nil, fmt.Errorf("%s: %w", name, errNoHeader)
	}
	return b, nil
}

var errNoHeader = errors.New("empty file, want a header row")

// findColumn returns the index of the header field named col.
func findColumn(header []string, col string) (int, error) {
	found := -1
	for i, h := range header {
		if strings.TrimSpace(h) != col {
			continue
		}
		if found >= 0 {
			return 0, fmt.Errorf("column %q appears twice in the header", col)
		}
		found = i
	}
	if found < 0 {
		names := make([]string, len(header))
		for i, h := range header {
			names[i] = fmt.Sprintf("%q", strings.TrimSpace(h))
		}
		return 0, fmt.Errorf("no column %q in the header (it has %s)", col, strings.Join(names, ", "))
	}
	return found, nil
}
