// Package textline reads lines of text for juncture's parsers (transcripts,
// segmented files, translations): one place for line endings and the
// line-length limit, so every reader treats a file the same way.
package textline

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

// MaxBytes is the longest line accepted, in bytes, without its line ending.
const MaxBytes = 1 << 20

// ErrTooLong is returned for a line longer than MaxBytes.
var ErrTooLong = fmt.Errorf("line longer than %d bytes", MaxBytes)

// Read returns the next line of br without its line ending ("\n" or
// "\r\n"). A line longer than MaxBytes is returned, cut to at least
// MaxBytes+1 bytes, with ErrTooLong. At the end of br it returns nil,
// io.EOF; a last line without a line ending comes with io.EOF.
func Read(br *bufio.Reader) ([]byte, error) {
	var buf []byte
	for {
		frag, err := br.ReadSlice('\n')
		buf = append(buf, frag...)
		if err == bufio.ErrBufferFull {
			if len(buf) > MaxBytes+len("\r\n") {
				return buf, ErrTooLong
			}
			continue
		}
		if err == io.EOF && len(buf) == 0 {
			return nil, io.EOF
		}
		buf = bytes.TrimSuffix(buf, []byte("\n"))
		buf = bytes.TrimSuffix(buf, []byte("\r"))
		if len(buf) > MaxBytes {
			return buf, ErrTooLong
		}
		return buf, err
	}
}

// Errors in the text of a line.
var (
	ErrInvalidUTF8 = errors.New("invalid UTF-8")
	ErrNUL         = errors.New("NUL character")
)

// Check returns the column and error of the first invalid UTF-8 sequence or
// NUL character of line, or 0 and nil. The column is 1-based and counts
// characters of the line normalised to NFC, the convention of every
// juncture reader's messages (an invalid byte counts as one character).
func Check(line []byte) (column int, err error) {
	if utf8.Valid(line) && bytes.IndexByte(line, 0) < 0 {
		return 0, nil
	}
	for i := 0; i < len(line); {
		r, size := utf8.DecodeRune(line[i:])
		switch {
		case r == utf8.RuneError && size == 1:
			return utf8.RuneCount(norm.NFC.Bytes(line[:i])) + 1, ErrInvalidUTF8
		case r == 0:
			return utf8.RuneCount(norm.NFC.Bytes(line[:i])) + 1, ErrNUL
		}
		i += size
	}
	panic("textline: line is invalid but no bad character was found")
}
