package segment

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"strings"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

// Unit is an interned phoneme: an index into Corpus.Inventory.
type Unit uint16

// MaxUnits is the largest number of distinct units a corpus may have.
const MaxUnits = 1 << 16

// MaxLineBytes is the longest transcript line accepted, in bytes.
const MaxLineBytes = 1 << 20

// Lock is a decision about one gap that sampling must not change.
type Lock int8

const (
	// Free gaps are sampled.
	Free Lock = iota
	// Boundary gaps always separate two words (a pause, a confirmed boundary).
	Boundary
	// Joined gaps never separate two words (a confirmed word-internal gap).
	Joined
)

// ReadOptions says how to read transcripts.
type ReadOptions struct {
	// Inventory, when set, lists the units; the longest match is taken and
	// any character outside it is an error. When nil, a unit is one
	// character with everything that attaches to it.
	Inventory *Inventory
	// Ignore lists characters dropped before splitting into units (stress
	// marks, punctuation).
	Ignore string
	// SpacesAreBoundaries makes spaces in the input certain boundaries.
	// Otherwise spaces are ignored.
	SpacesAreBoundaries bool
}

// Corpus is a set of utterances split into interned units, end to end.
type Corpus struct {
	// Name is the file the corpus was read from, for messages.
	Name string
	// Inventory gives each Unit's text.
	Inventory []string
	// Units holds all utterances one after another.
	Units []Unit
	// Starts[u] is the offset of utterance u in Units; Starts[len] == len(Units).
	Starts []int
	// Lines[u] is the 1-based line of utterance u in the source file.
	Lines []int
	// Locks, when not nil, has one entry per position of Units: the gap
	// before that unit. Utterance-initial entries are ignored.
	Locks []Lock

	keys    []byte // units as little-endian uint16, for map lookups without allocation
	unitIDs map[string]Unit
}

// PositionError is an error at a place in a named file.
type PositionError struct {
	Name         string
	Line, Column int // 1-based; Column counts characters
	Err          error
}

func (e *PositionError) Error() string {
	return fmt.Sprintf("%s:%d:%d: %v", e.Name, e.Line, e.Column, e.Err)
}

func (e *PositionError) Unwrap() error { return e.Err }

// Errors reported by ReadCorpus, wrapped in a *PositionError.
var (
	ErrInvalidUTF8 = errors.New("invalid UTF-8")
	ErrNUL         = errors.New("NUL character")
	ErrLineTooLong = fmt.Errorf("line longer than %d bytes", MaxLineBytes)
	ErrUnknownUnit = errors.New("character outside the unit inventory")
	ErrTooManyUnit = fmt.Errorf("more than %d distinct units", MaxUnits)
)

// ReadCorpus reads one utterance per line from r. name is used in error
// messages. Lines are normalised to NFC; empty lines are skipped but keep
// their numbers. Column numbers in errors count characters of the
// normalised line.
func ReadCorpus(r io.Reader, name string, opts ReadOptions) (*Corpus, error) {
	c := NewCorpus(name)
	br := bufio.NewReaderSize(r, 64*1024)
	lineNo := 0
	var locks []Lock
	anyLock := false
	for {
		line, err := readLine(br)
		if err == io.EOF && line == nil {
			break
		}
		lineNo++
		if err != nil && err != io.EOF {
			if errors.Is(err, ErrLineTooLong) {
				return nil, &PositionError{name, lineNo, 1, err}
			}
			return nil, fmt.Errorf("%s:%d: %w", name, lineNo, err)
		}
		units, ulocks, perr := c.splitLine(line, opts)
		if perr != nil {
			perr.Name, perr.Line = name, lineNo
			return nil, perr
		}
		if len(units) > 0 {
			c.appendUtterance(units, lineNo)
			locks = append(locks, ulocks...)
			for _, l := range ulocks {
				anyLock = anyLock || l != Free
			}
		}
		if err == io.EOF {
			break
		}
	}
	if anyLock {
		c.Locks = locks
	}
	return c, nil
}

// NewCorpus returns an empty corpus to which utterances can be added with
// AddUtterance.
func NewCorpus(name string) *Corpus {
	return &Corpus{Name: name, Starts: []int{0}, unitIDs: map[string]Unit{}}
}

// readLine returns the next line without its line ending.
func readLine(br *bufio.Reader) ([]byte, error) {
	var buf []byte
	for {
		frag, err := br.ReadSlice('\n')
		buf = append(buf, frag...)
		if len(buf) > MaxLineBytes+2 {
			// Drain the rest of the line so the count stays right.
			for err == bufio.ErrBufferFull {
				_, err = br.ReadSlice('\n')
			}
			return buf, ErrLineTooLong
		}
		if err == bufio.ErrBufferFull {
			continue
		}
		if err == io.EOF && len(buf) == 0 {
			return nil, io.EOF
		}
		buf = bytes.TrimSuffix(buf, []byte("\n"))
		buf = bytes.TrimSuffix(buf, []byte("\r"))
		return buf, err
	}
}

// splitLine validates and splits one line into unit texts. Returned locks
// hold one entry per unit.
func (c *Corpus) splitLine(raw []byte, opts ReadOptions) ([]string, []Lock, *PositionError) {
	for i := 0; i < len(raw); {
		r, size := utf8.DecodeRune(raw[i:])
		col := utf8.RuneCount(raw[:i]) + 1
		if r == utf8.RuneError && size == 1 {
			return nil, nil, &PositionError{Column: col, Err: ErrInvalidUTF8}
		}
		if r == 0 {
			return nil, nil, &PositionError{Column: col, Err: ErrNUL}
		}
		i += size
	}
	line := norm.NFC.String(string(raw))
	var units []string
	var locks []Lock
	pendingPause := false
	col := 1
	for i := 0; i < len(line); {
		r, size := utf8.DecodeRuneInString(line[i:])
		if r == ' ' || r == '\t' {
			pendingPause = pendingPause || (opts.SpacesAreBoundaries && len(units) > 0)
			i += size
			col++
			continue
		}
		if strings.ContainsRune(opts.Ignore, r) {
			i += size
			col++
			continue
		}
		var n int
		if opts.Inventory != nil {
			n = opts.Inventory.match(line[i:])
			if n == 0 {
				return nil, nil, &PositionError{Column: col, Err: fmt.Errorf("%w: %q", ErrUnknownUnit, r)}
			}
		} else {
			n = defaultUnitLen(line[i:])
		}
		u := line[i : i+n]
		if opts.Ignore != "" && opts.Inventory == nil {
			// Drop ignored characters that attached to the unit.
			u = strings.Map(func(r rune) rune {
				if strings.ContainsRune(opts.Ignore, r) {
					return -1
				}
				return r
			}, u)
		}
		units = append(units, u)
		if pendingPause {
			locks = append(locks, Boundary)
		} else {
			locks = append(locks, Free)
		}
		pendingPause = false
		col += utf8.RuneCountInString(line[i : i+n])
		i += n
	}
	if len(units) > 0 {
		locks[0] = Free
	}
	return units, locks, nil
}

// AddUtterance appends an utterance given as unit texts, interning new
// units. line is its 1-based source line.
func (c *Corpus) AddUtterance(units []string, line int) error {
	for _, u := range units {
		if _, ok := c.unitIDs[u]; !ok && len(c.Inventory) >= MaxUnits {
			return fmt.Errorf("%s:%d: %w", c.Name, line, ErrTooManyUnit)
		}
	}
	c.appendUtterance(units, line)
	if c.Locks != nil {
		for range units {
			c.Locks = append(c.Locks, Free)
		}
	}
	return nil
}

func (c *Corpus) appendUtterance(units []string, line int) {
	for _, u := range units {
		id, ok := c.unitIDs[u]
		if !ok {
			if len(c.Inventory) >= MaxUnits {
				panic("segment: too many units") // checked by callers
			}
			id = Unit(len(c.Inventory))
			c.unitIDs[u] = id
			c.Inventory = append(c.Inventory, u)
		}
		c.Units = append(c.Units, id)
		c.keys = append(c.keys, byte(id), byte(id>>8))
	}
	c.Starts = append(c.Starts, len(c.Units))
	c.Lines = append(c.Lines, line)
}

// Len returns the number of utterances.
func (c *Corpus) Len() int { return len(c.Starts) - 1 }

// Utterance returns the start and end offsets of utterance u.
func (c *Corpus) Utterance(u int) (start, end int) { return c.Starts[u], c.Starts[u+1] }

// Key returns the bytes identifying the unit span [start, end). The result
// aliases the corpus; string(Key(...)) used as a map index does not allocate.
func (c *Corpus) Key(start, end int) []byte { return c.keys[2*start : 2*end] }

// Text returns the text of the unit span [start, end).
func (c *Corpus) Text(start, end int) string {
	var b strings.Builder
	for _, u := range c.Units[start:end] {
		b.WriteString(c.Inventory[u])
	}
	return b.String()
}

// UnitID returns the Unit for a unit text, if the corpus has it.
func (c *Corpus) UnitID(text string) (Unit, bool) {
	u, ok := c.unitIDs[text]
	return u, ok
}

// LockAt returns the lock on the gap before unit position i.
func (c *Corpus) LockAt(i int) Lock {
	if c.Locks == nil {
		return Free
	}
	return c.Locks[i]
}
