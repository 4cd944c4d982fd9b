package textline

import "fmt"

// PositionError is an error at a place in a named file: name:line:column,
// the form every reader of the project reports (transcripts, segmented
// files, translations, stop words, TSV).
type PositionError struct {
	Name string
	Line int // 1-based
	// Column is 1-based and counts characters (runes) of the line
	// normalised to NFC; 0 when the error concerns the whole line.
	Column int
	Err    error
}

func (e *PositionError) Error() string {
	if e.Column == 0 {
		return fmt.Sprintf("%s:%d: %v", e.Name, e.Line, e.Err)
	}
	return fmt.Sprintf("%s:%d:%d: %v", e.Name, e.Line, e.Column, e.Err)
}

func (e *PositionError) Unwrap() error { return e.Err }
