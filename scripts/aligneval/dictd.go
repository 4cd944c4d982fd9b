package main

import (
	"bufio"
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"io"
	"os"
	"strings"
)

// IndexEntry is one row of a dictd index: a headword and where its
// article lies in the uncompressed data file.
type IndexEntry struct {
	Headword       string
	Offset, Length int
}

// Dictionary is a dictd database held in memory: the index rows in file
// order and the uncompressed data they point into.
type Dictionary struct {
	Name  string // the index file, for messages
	Index []IndexEntry
	Data  []byte
}

// maxIndexDigits bounds a dictd number to 60 bits, so it fits an int on
// every 64-bit platform.
const maxIndexDigits = 10

// dictdDigits is the alphabet of dictd's index numbers: the digits of a
// number in base 64, most significant first, with the letters of the
// base64 alphabet of RFC 4648 table 1 as digit values 0..63 (from memory of
// the dictd documentation, checked against Debian's FreeDict files in
// dictd_test.go: the offset of each headword points at its article).
const dictdDigits = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/"

// decodeIndexNumber decodes one dictd index number.
func decodeIndexNumber(s string) (int, error) {
	if s == "" {
		return 0, errors.New("empty number")
	}
	if len(s) > maxIndexDigits {
		return 0, fmt.Errorf("number %q longer than %d digits", s, maxIndexDigits)
	}
	n := 0
	for i := 0; i < len(s); i++ {
		d := strings.IndexByte(dictdDigits, s[i])
		if d < 0 {
			return 0, fmt.Errorf("number %q: %q is not a base-64 digit", s, s[i])
		}
		n = n*64 + d
	}
	return n, nil
}

// ReadIndex reads a dictd index: one row per line, headword, offset and
// length separated by tabs (later fields, which some dictd versions add,
// are ignored). name is used in messages.
func ReadIndex(r io.Reader, name string) ([]IndexEntry, error) {
	var rows []IndexEntry
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 64*1024), 1<<20)
	for line := 1; sc.Scan(); line++ {
		text := strings.TrimSuffix(sc.Text(), "\r")
		if text == "" {
			continue
		}
		f := strings.Split(text, "\t")
		if len(f) < 3 {
			return nil, fmt.Errorf("%s:%d: want headword, offset and length separated by tabs, got %d fields", name, line, len(f))
		}
		off, err := decodeIndexNumber(f[1])
		if err != nil {
			return nil, fmt.Errorf("%s:%d: offset: %w", name, line, err)
		}
		n, err := decodeIndexNumber(f[2])
		if err != nil {
			return nil, fmt.Errorf("%s:%d: length: %w", name, line, err)
		}
		rows = append(rows, IndexEntry{Headword: f[0], Offset: off, Length: n})
	}
	if err := sc.Err(); err != nil {
		return nil, fmt.Errorf("%s: %w", name, err)
	}
	return rows, nil
}

// OpenDictionary reads base.index and base.dict.dz (gzip; dictzip is gzip
// with a table of chunks in an extra header field, which compress/gzip
// skips) or, failing that, an uncompressed base.dict. Every index row must
// point inside the data.
func OpenDictionary(base string) (*Dictionary, error) {
	f, err := os.Open(base + ".index")
	if err != nil {
		return nil, err
	}
	index, err := ReadIndex(f, f.Name())
	f.Close()
	if err != nil {
		return nil, err
	}
	data, err := readDictData(base)
	if err != nil {
		return nil, err
	}
	d := &Dictionary{Name: base + ".index", Index: index, Data: data}
	return d, d.check()
}

// readDictData returns the uncompressed data file of a dictd database.
func readDictData(base string) ([]byte, error) {
	f, err := os.Open(base + ".dict.dz")
	if errors.Is(err, os.ErrNotExist) {
		return os.ReadFile(base + ".dict")
	}
	if err != nil {
		return nil, err
	}
	defer f.Close()
	zr, err := gzip.NewReader(bufio.NewReader(f))
	if err != nil {
		return nil, fmt.Errorf("%s: %w", f.Name(), err)
	}
	data, err := io.ReadAll(zr)
	if err != nil {
		return nil, fmt.Errorf("%s: %w", f.Name(), err)
	}
	return data, nil
}

// check reports the first index row that points outside the data.
func (d *Dictionary) check() error {
	for i, e := range d.Index {
		if e.Offset > len(d.Data) || e.Length > len(d.Data)-e.Offset {
			return fmt.Errorf("%s: row %d (%q) points at bytes %d..%d of %d", d.Name, i+1, e.Headword, e.Offset, e.Offset+e.Length, len(d.Data))
		}
	}
	return nil
}

// Article returns the text of index row i.
func (d *Dictionary) Article(i int) string {
	e := d.Index[i]
	return string(d.Data[e.Offset : e.Offset+e.Length])
}

// IsMetadata reports whether a headword names one of the database's own
// entries (its description, URL, alphabet...), which dictfmt writes under
// headwords starting with "00database" or "00-database-".
func IsMetadata(headword string) bool {
	return strings.HasPrefix(headword, "00database") || strings.HasPrefix(headword, "00-database-")
}

// TranslationLines returns the lines of a FreeDict article that hold
// translations, leaving out the headword line and the definitions.
//
// FreeDict's dictd articles (as Debian ships them, 2022 releases) come in
// two layouts. Both start with the headword line (headword, pronunciation,
// part of speech). In the older one the translations follow, either on one
// line or as numbered senses "1. with" or "1." with the translation on the
// next line. In the newer one, made from Wiktionary data, each sense is
// "N. translations" followed by a definition in the headword's language on
// the next line, and further definitions of the same translations appear
// as an indented " N." line followed by the definition. So:
//
//   - a line "N. text" (not indented) is a translation line "text", with a
//     trailing sense number " M." removed;
//   - a line "N." alone (not indented) makes the next non-empty line a
//     translation line;
//   - an indented "N." line makes the next line a definition;
//   - the first non-empty line of an article without a leading sense
//     number is a translation line; any other line is a definition.
func TranslationLines(article string) []string {
	lines := strings.Split(article, "\n")
	if len(lines) > 0 {
		lines = lines[1:] // the headword line
	}
	var out []string
	seen := false     // a translation line has been found
	nextIsTr := false // the previous line was a bare "N."
	for _, raw := range lines {
		line := strings.TrimSpace(raw)
		if line == "" {
			continue
		}
		indented := raw[0] == ' ' || raw[0] == '\t'
		rest, ok := senseNumber(line)
		switch {
		case ok && indented:
			nextIsTr = false
		case ok && rest == "":
			nextIsTr = true
		case ok:
			out = append(out, trimTrailingSense(rest))
			seen, nextIsTr = true, false
		case nextIsTr || !seen:
			out = append(out, trimTrailingSense(line))
			seen, nextIsTr = true, false
		}
	}
	return out
}

// senseNumber returns the text after a leading sense number ("12. text"
// gives "text"); ok is false if line does not start with one to four
// digits, a period and a space or the end.
func senseNumber(line string) (rest string, ok bool) {
	i := 0
	for i < len(line) && line[i] >= '0' && line[i] <= '9' {
		i++
	}
	if i == 0 || i > 4 || i >= len(line) || line[i] != '.' {
		return "", false
	}
	rest = line[i+1:]
	if rest != "" && rest[0] != ' ' {
		return "", false
	}
	return strings.TrimSpace(rest), true
}

// trimTrailingSense removes a trailing " N." that starts the next sense in
// the Wiktionary-derived layout ("vapaus 2.").
func trimTrailingSense(s string) string {
	i := strings.LastIndexByte(s, ' ')
	if i < 0 {
		return s
	}
	if rest, ok := senseNumber(s[i+1:]); ok && rest == "" {
		return strings.TrimSpace(s[:i])
	}
	return s
}

// TranslationItems splits a translation line into its items, each a short
// phrase: text in brackets of any kind (labels such as "(intransitive)",
// grammatical notes) is removed, anything after a colon (usage examples) is
// dropped, and the rest is split at commas and semicolons. Items are
// trimmed; empty ones are left out.
func TranslationItems(line string) []string {
	var b bytes.Buffer
	depth := 0
	for _, r := range line {
		switch r {
		case '(', '[', '{', '<':
			depth++
			continue
		case ')', ']', '}', '>':
			if depth > 0 {
				depth--
			}
			continue
		}
		if depth == 0 {
			b.WriteRune(r)
		}
	}
	s := b.String()
	if i := strings.IndexByte(s, ':'); i >= 0 {
		s = s[:i]
	}
	var items []string
	for _, it := range strings.FieldsFunc(s, func(r rune) bool { return r == ',' || r == ';' }) {
		if it = strings.TrimSpace(it); it != "" {
			items = append(items, it)
		}
	}
	return items
}
