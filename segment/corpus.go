package segment

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"strings"
	"sync"
	"sync/atomic"
	"unicode/utf8"

	"github.com/juncture-project/juncture/segment/textline"
	"golang.org/x/text/unicode/norm"
)

// Unit is an interned phoneme: an index into Corpus.Inventory.
type Unit uint16

// MaxUnits is the largest number of distinct units a corpus may have.
const MaxUnits = 1 << 16

// MaxLineBytes is the longest transcript line accepted, in bytes.
const MaxLineBytes = textline.MaxBytes

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
	// Ignore lists characters dropped from the input (stress marks,
	// punctuation): they never start a unit and are removed from a unit
	// they attach to. Columns in errors still count them.
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
	forms   atomic.Pointer[spanForms] // see IndexSpans
	indexMu sync.Mutex                // serialises IndexSpans

	shapesMu sync.Mutex
	shapes   map[string]*Phonotactics // by nucleus list and beta; see phonotactics
}

// PositionError is an error at a place in a named file: name:line:column.
type PositionError = textline.PositionError

// Errors reported by ReadCorpus, wrapped in a *PositionError.
var (
	ErrInvalidUTF8 = textline.ErrInvalidUTF8
	ErrNUL         = textline.ErrNUL
	ErrLineTooLong = textline.ErrTooLong
	ErrUnknownUnit = errors.New("character outside the unit inventory")
	ErrTooManyUnit = fmt.Errorf("more than %d distinct units", MaxUnits)
)

// ReadCorpus reads one utterance per line from r. name is used in error
// messages. Lines are normalised to NFC; empty lines are skipped but keep
// their numbers. A byte order mark (U+FEFF) at the start of r is dropped:
// the Unicode Standard treats it in UTF-8 as an encoding signature, not as
// text (section 23.8, "Specials"; section number recalled from memory).
// Column numbers in errors count characters of the normalised line.
func ReadCorpus(r io.Reader, name string, opts ReadOptions) (*Corpus, error) {
	c := NewCorpus(name)
	br := bufio.NewReaderSize(r, 64*1024)
	if bom, err := br.Peek(len(byteOrderMark)); err == nil && string(bom) == byteOrderMark {
		br.Discard(len(byteOrderMark))
	}
	lineNo := 0
	var locks []Lock
	anyLock := false
	for {
		line, err := textline.Read(br)
		if err == io.EOF && line == nil {
			break
		}
		lineNo++
		if err != nil && err != io.EOF {
			if errors.Is(err, ErrLineTooLong) {
				// Point at the character of the normalised line that
				// crosses the limit: back up to where NFC may start a
				// new character.
				i := MaxLineBytes
				for i > 0 && !(utf8.RuneStart(line[i]) && norm.NFC.Properties(line[i:]).BoundaryBefore()) {
					i--
				}
				return nil, &PositionError{Name: name, Line: lineNo, Column: column(line, i), Err: err}
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

// byteOrderMark is U+FEFF encoded in UTF-8.
const byteOrderMark = "\uFEFF"

// NewCorpus returns an empty corpus to which utterances can be added with
// AddUtterance.
func NewCorpus(name string) *Corpus {
	return &Corpus{Name: name, Starts: []int{0}, unitIDs: map[string]Unit{}}
}

// column returns the 1-based column, in characters of the NFC-normalised
// line, of the character that starts at byte i of the raw line. Used only
// for errors, so it may cost a normalisation.
func column(raw []byte, i int) int {
	return utf8.RuneCount(norm.NFC.Bytes(raw[:i])) + 1
}

// splitLine validates one line, splits it into units and interns them.
// Returned locks hold one entry per unit.
func (c *Corpus) splitLine(raw []byte, opts ReadOptions) ([]Unit, []Lock, *PositionError) {
	if col, err := textline.Check(raw); err != nil {
		return nil, nil, &PositionError{Column: col, Err: err}
	}
	line := norm.NFC.String(string(raw))
	var units []Unit
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
		id, ok := c.intern(u)
		if !ok {
			return nil, nil, &PositionError{Column: col, Err: ErrTooManyUnit}
		}
		units = append(units, id)
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
// units. line is its 1-based source line. An empty utterance, an empty
// unit or a unit containing white space is an error, as is going past
// MaxUnits distinct units; on error c is unchanged.
func (c *Corpus) AddUtterance(units []string, line int) error {
	if len(units) == 0 {
		return fmt.Errorf("%s:%d: empty utterance", c.Name, line)
	}
	var fresh map[string]bool
	for _, u := range units {
		if u == "" || strings.ContainsAny(u, " \t\r\n") {
			return fmt.Errorf("%s:%d: unit %q is empty or contains white space", c.Name, line, u)
		}
		if _, ok := c.unitIDs[u]; !ok {
			if fresh == nil {
				fresh = map[string]bool{}
			}
			fresh[u] = true
		}
	}
	if len(c.Inventory)+len(fresh) > MaxUnits {
		return fmt.Errorf("%s:%d: %w", c.Name, line, ErrTooManyUnit)
	}
	ids := make([]Unit, len(units))
	for i, u := range units {
		ids[i], _ = c.intern(u)
	}
	c.appendUtterance(ids, line)
	if c.Locks != nil {
		for range units {
			c.Locks = append(c.Locks, Free)
		}
	}
	return nil
}

// intern returns the Unit for text u, adding it if new. It reports false
// when u is new and the corpus already has MaxUnits units.
func (c *Corpus) intern(u string) (Unit, bool) {
	if id, ok := c.unitIDs[u]; ok {
		return id, true
	}
	if len(c.Inventory) >= MaxUnits {
		return 0, false
	}
	// Clone: u may be a slice of a long line that would otherwise stay
	// in memory for as long as the corpus.
	u = strings.Clone(u)
	id := Unit(len(c.Inventory))
	c.unitIDs[u] = id
	c.Inventory = append(c.Inventory, u)
	return id, true
}

// appendUtterance appends an utterance of interned units.
func (c *Corpus) appendUtterance(units []Unit, line int) {
	for _, id := range units {
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

// phonotactics returns the word-shape model of c for nuclei n and
// smoothing beta (see NewPhonotactics), built on first use and shared by
// every later caller (chains, blocks).
func (c *Corpus) phonotactics(n *Nuclei, beta float64, maxWord int) *Phonotactics {
	key := fmt.Sprintf("%s|%v", strings.Join(n.Units, " "), beta)
	c.shapesMu.Lock()
	defer c.shapesMu.Unlock()
	if p := c.shapes[key]; p != nil {
		return p
	}
	if maxWord < 1 || maxWord > 32 {
		maxWord = 32
	}
	p := NewPhonotactics(c, n, beta, maxWord)
	if c.shapes == nil {
		c.shapes = map[string]*Phonotactics{}
	}
	c.shapes[key] = p
	return p
}
