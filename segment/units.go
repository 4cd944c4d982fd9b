package segment

import (
	"fmt"
	"sort"
	"unicode"
	"unicode/utf8"

	"golang.org/x/text/unicode/norm"
)

// attaches reports whether r belongs to the unit before it rather than
// starting a unit of its own: combining marks (which include the tie bars
// U+0361 and U+035C) and the spacing modifier letters U+02B0..U+02FF that
// phonemic transcription writes after a segment (length, aspiration,
// labialisation, palatalisation). DESIGN section 2.
//
// The IPA stress marks U+02C8 and U+02CC lie in that block but are written
// before the stressed syllable (the IPA chart's Suprasegmentals example is
// ˌfoʊnəˈtɪʃən; recalled from memory), so they do not attach to the
// segment before them: each is a unit of its own unless ReadOptions.Ignore
// drops it.
func attaches(r rune) bool {
	if r == primaryStress || r == secondaryStress {
		return false
	}
	if r >= 0x02B0 && r <= 0x02FF {
		return true
	}
	return unicode.In(r, unicode.Mn, unicode.Me, unicode.Mc)
}

// The IPA stress marks.
const (
	primaryStress   = '\u02C8' // ˈ
	secondaryStress = '\u02CC' // ˌ
)

// joinsNext reports whether r, when it ends a unit, also pulls the following
// character into that unit: a tie bar links the characters on both sides.
func joinsNext(r rune) bool { return r == '\u0361' || r == '\u035C' }

// Inventory is a declared set of units, matched longest first.
type Inventory struct {
	units  map[string]bool
	maxLen int // longest unit in bytes
}

// NewInventory returns an Inventory of the given units. Units are
// normalised to NFC, as transcript lines are, so that a unit typed in
// decomposed form still matches. Empty strings, invalid UTF-8 and units
// containing spaces are rejected.
func NewInventory(units []string) (*Inventory, error) {
	inv := &Inventory{units: make(map[string]bool, len(units))}
	for i, u := range units {
		if u == "" {
			return nil, fmt.Errorf("unit %d: empty unit", i+1)
		}
		if !utf8.ValidString(u) {
			return nil, fmt.Errorf("unit %d %q: %w", i+1, u, ErrInvalidUTF8)
		}
		u = norm.NFC.String(u)
		for _, r := range u {
			if r == ' ' || r == '\t' {
				return nil, fmt.Errorf("unit %d %q: contains white space", i+1, u)
			}
		}
		inv.units[u] = true
		if len(u) > inv.maxLen {
			inv.maxLen = len(u)
		}
	}
	return inv, nil
}

// Units returns the inventory's units in sorted order.
func (inv *Inventory) Units() []string {
	out := make([]string, 0, len(inv.units))
	for u := range inv.units {
		out = append(out, u)
	}
	sort.Strings(out)
	return out
}

// match returns the byte length of the longest unit that s starts with, or 0.
func (inv *Inventory) match(s string) int {
	n := inv.maxLen
	if n > len(s) {
		n = len(s)
	}
	for ; n > 0; n-- {
		if inv.units[s[:n]] && utf8.ValidString(s[:n]) {
			return n
		}
	}
	return 0
}

// defaultUnitLen returns the byte length of the default unit at the start
// of s: one character with every character that attaches to it. A tie bar
// does not reach across a space or tab, which would put white space inside
// a unit.
func defaultUnitLen(s string) int {
	prev, n := utf8.DecodeRuneInString(s)
	for n < len(s) {
		r, size := utf8.DecodeRuneInString(s[n:])
		if !attaches(r) && !(joinsNext(prev) && r != ' ' && r != '\t') {
			break
		}
		prev = r
		n += size
	}
	return n
}
