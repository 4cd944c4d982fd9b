// Package textline reads lines of text for juncture's parsers (transcripts,
// segmented files, translations): one place for line endings and the
// line-length limit, so every reader treats a file the same way.
package textline

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
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
