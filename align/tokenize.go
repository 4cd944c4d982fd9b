package align

import (
	"unicode"
	"unicode/utf8"

	"golang.org/x/text/cases"
	"golang.org/x/text/unicode/norm"
)

// fold is Unicode full case folding; a folding Caser is stateless and safe
// for concurrent use (golang.org/x/text/cases documentation).
var fold = cases.Fold()

// Tokenize splits a free translation into the words the translation model
// sees. It case-folds and normalises s, so that "Straße", "STRASSE" and
// "strasse" give the same token, and keeps only words:
//
//   - s is normalised to NFD, case-folded (full folding, Unicode
//     CaseFolding.txt statuses C and F), and normalised to NFC. The NFD first
//     follows the Unicode Standard's canonical caseless match, D145 in
//     section 3.13 (definition number from memory): folding is only closed
//     under canonical equivalence on decomposed text.
//   - A token is a maximal run of letters, numbers and private-use
//     characters, with the combining marks that follow them. A mark that
//     follows no such character is dropped.
//   - White space, punctuation, symbols, controls and U+200B ZERO WIDTH
//     SPACE separate tokens and are dropped.
//   - Inside a token, a single apostrophe (U+0027 or U+2019, the latter
//     written as U+0027) between two word characters is kept, so "don't"
//     and "don’t" both give "don't" and "l'eau" gives "l'eau": splitting
//     them would make "t" and "l" frequent tokens with no meaning of their
//     own. Possessives stay attached too ("dog's" is not "dog"); list them
//     as stop words or preprocess if that matters. Apostrophes at a token's
//     edge are quotation marks and are dropped. U+02BC MODIFIER LETTER
//     APOSTROPHE is a letter and is always kept.
//   - ZERO WIDTH NON-JOINER and ZERO WIDTH JOINER between word characters
//     are kept (they are part of the spelling in Persian and Indic
//     scripts); other format characters (soft hyphen, direction marks) are
//     dropped without splitting.
//   - A period or comma between two decimal digits is kept, so "3.5" and
//     "1,000" stay one token. A hyphen always splits: "well-known" gives
//     "well" and "known".
//
// Tokenize of the tokens joined by spaces gives the same tokens.
func Tokenize(s string) []string {
	return appendTokens(nil, s)
}

// appendTokens appends the tokens of s to dst.
func appendTokens(dst []string, s string) []string {
	s = norm.NFC.String(fold.String(norm.NFD.String(s)))
	var tok []byte
	var pending rune // a joiner after a word character, kept if a word character follows
	var last rune    // the last word character of tok
	flush := func() {
		if len(tok) > 0 {
			// Dropped format characters may leave a mark next to a
			// base it now composes with.
			if !norm.NFC.IsNormal(tok) {
				tok = norm.NFC.Bytes(tok)
			}
			dst = append(dst, string(tok))
			tok = tok[:0]
		}
		pending = 0
	}
	for _, r := range s {
		r = foldCherokee(r)
		switch {
		case isWordChar(r):
			if pending != 0 {
				if joins(pending, last, r) {
					tok = utf8.AppendRune(tok, pending)
					pending = 0
				} else {
					flush()
				}
			}
			tok = utf8.AppendRune(tok, r)
			last = r
		case unicode.IsMark(r):
			if len(tok) > 0 && pending == 0 {
				tok = utf8.AppendRune(tok, r)
			} else {
				flush()
			}
		case isJoiner(r):
			if len(tok) > 0 && pending == 0 {
				pending = r
				if r == '\u2019' {
					pending = '\''
				}
			} else {
				flush()
			}
		case r != '\u200B' && unicode.Is(unicode.Cf, r):
			// Format characters are invisible: drop them, keep the token.
		default:
			flush()
		}
	}
	flush()
	return dst
}

// foldCherokee corrects the case folding of a Cherokee letter in text
// folded by fold. Unicode folds Cherokee small letters to the
// capitals, which were encoded first (CaseFolding.txt: "13F8; C; 13F0",
// "AB70; C; 13A0"), but golang.org/x/text/cases v0.44.0 folds capitals to
// small letters and small letters to capitals (Go issue 46101), so folding
// is not idempotent. Mapping every small letter to its capital after fold
// gives the CaseFolding.txt result for both.
func foldCherokee(r rune) rune {
	switch {
	case r >= 0xAB70 && r <= 0xABBF:
		return r - 0xAB70 + 0x13A0
	case r >= 0x13F8 && r <= 0x13FD:
		return r - 0x13F8 + 0x13F0
	}
	return r
}

// isWordChar reports whether r can start or continue a token.
func isWordChar(r rune) bool {
	return unicode.IsLetter(r) || unicode.IsNumber(r) || unicode.Is(unicode.Co, r)
}

// isJoiner reports whether r is kept inside a token when it stands between
// two suitable word characters (see joins).
func isJoiner(r rune) bool {
	switch r {
	case '\'', '\u2019', '\u200C', '\u200D', '.', ',':
		return true
	}
	return false
}

// joins reports whether joiner j between word characters before and after
// stays in the token.
func joins(j, before, after rune) bool {
	if j == '.' || j == ',' {
		return unicode.IsDigit(before) && unicode.IsDigit(after)
	}
	return true
}
