package score

import (
	"errors"
	"fmt"
	"strings"
	"unicode/utf8"
)

// Utterance is one segmented line: its words in order. Words are non-empty
// and contain no space.
type Utterance = []string

// Errors reported by Compare, wrapped with the line they concern.
var (
	// ErrLineCount means the reference and the prediction have different
	// numbers of lines.
	ErrLineCount = errors.New("reference and prediction have different numbers of lines")
	// ErrTextMismatch means a predicted line does not spell the same text as
	// its reference line once spaces are removed.
	ErrTextMismatch = errors.New("reference and prediction spell different text")
	// ErrBadWord means a word is empty or contains a space.
	ErrBadWord = errors.New("word is empty or contains a space")
)

// LineError is an error about one line of the segmentations given to
// Compare. Line counts from 1 among the lines given; a caller that read them
// with ReadSegmented can map it to a file line through the line numbers
// ReadSegmented returned.
type LineError struct {
	Line int
	Err  error
}

func (e *LineError) Error() string { return fmt.Sprintf("line %d: %v", e.Line, e.Err) }

func (e *LineError) Unwrap() error { return e.Err }

// PRF is a precision, recall and F triple, each in [0,1].
type PRF struct {
	Precision float64 `json:"precision"`
	Recall    float64 `json:"recall"`
	F         float64 `json:"f"`
}

// Tally holds the counts behind one PRF: items found in both segmentations,
// items predicted and items in the reference.
type Tally struct {
	Correct   int `json:"correct"`
	Predicted int `json:"predicted"`
	Reference int `json:"reference"`
}

// PRF returns precision Correct/Predicted, recall Correct/Reference and their
// harmonic mean, with 0 wherever a denominator is 0 (see the package
// documentation).
func (t Tally) PRF() PRF {
	p := ratio(t.Correct, t.Predicted)
	r := ratio(t.Correct, t.Reference)
	f := 0.0
	if p+r > 0 {
		f = 2 * p * r / (p + r)
	}
	return PRF{Precision: p, Recall: r, F: f}
}

func ratio(num, den int) float64 {
	if den == 0 {
		return 0
	}
	return float64(num) / float64(den)
}

// Counts are the raw counts behind the boundary, token and lexicon scores.
type Counts struct {
	Boundary Tally `json:"boundary"`
	Token    Tally `json:"token"`
	Lexicon  Tally `json:"lexicon"`
}

// Scores is the result of comparing a predicted segmentation with a reference.
// Its JSON form starts with the keys DESIGN.md section 6 fixes; the keys
// after lexicon are additions.
type Scores struct {
	// Utterances is the number of lines compared.
	Utterances int `json:"utterances"`
	Boundary   PRF `json:"boundary"`
	Token      PRF `json:"token"`
	Lexicon    PRF `json:"lexicon"`
	// WindowDiff and Pk are error rates: 0 is a perfect match.
	WindowDiff float64 `json:"windowdiff"`
	Pk         float64 `json:"pk"`
	// Window is the window k used for WindowDiff and Pk.
	Window int `json:"window"`
	// Characters is the number of characters (runes) in the corpus.
	Characters int    `json:"characters"`
	Counts     Counts `json:"counts"`
}

// Compare scores the predicted segmentation pred against the reference ref,
// line by line. Line i of each must spell the same text once its words are
// concatenated; otherwise the error is a *LineError for line i+1 wrapping
// ErrTextMismatch. An empty word or one containing a space gives a
// *LineError wrapping ErrBadWord, and different line counts give
// ErrLineCount. A line with no words is allowed and contributes nothing but
// its count.
func Compare(ref, pred [][]string) (Scores, error) {
	if len(ref) != len(pred) {
		return Scores{}, fmt.Errorf("%w: %d in the reference, %d in the prediction", ErrLineCount, len(ref), len(pred))
	}
	var (
		s                 Scores
		refEnds, predEnds []int  // word end offsets of the current line, reused
		refGaps, predGaps []bool // boundary indicators of the corpus's gaps
		refTypes          = make(map[string]struct{})
		predTypes         = make(map[string]struct{})
	)
	for i := range ref {
		var err error
		if refEnds, err = wordEnds(refEnds[:0], ref[i]); err != nil {
			return Scores{}, &LineError{Line: i + 1, Err: fmt.Errorf("reference: %w", err)}
		}
		if predEnds, err = wordEnds(predEnds[:0], pred[i]); err != nil {
			return Scores{}, &LineError{Line: i + 1, Err: fmt.Errorf("prediction: %w", err)}
		}
		if !sameText(ref[i], pred[i]) {
			pos := firstDifference(strings.Join(ref[i], ""), strings.Join(pred[i], ""))
			return Scores{}, &LineError{Line: i + 1, Err: fmt.Errorf("%w (first difference at character %d)", ErrTextMismatch, pos+1)}
		}
		if len(refEnds) == 0 {
			continue // an empty line
		}
		n := refEnds[len(refEnds)-1] // characters in the line
		matchLine(&s.Counts, refEnds, predEnds)
		for _, w := range ref[i] {
			refTypes[w] = struct{}{}
		}
		for _, w := range pred[i] {
			predTypes[w] = struct{}{}
		}

		// The gap before the line is an utterance edge, a boundary in both.
		if s.Characters > 0 {
			refGaps = append(refGaps, true)
			predGaps = append(predGaps, true)
		}
		refGaps = appendGaps(refGaps, refEnds, n)
		predGaps = appendGaps(predGaps, predEnds, n)
		s.Characters += n
	}
	s.Utterances = len(ref)

	s.Counts.Lexicon = Tally{Reference: len(refTypes), Predicted: len(predTypes)}
	for w := range predTypes {
		if _, ok := refTypes[w]; ok {
			s.Counts.Lexicon.Correct++
		}
	}
	s.Boundary = s.Counts.Boundary.PRF()
	s.Token = s.Counts.Token.PRF()
	s.Lexicon = s.Counts.Lexicon.PRF()

	if len(refGaps) > 0 {
		// k <= N-1 always holds: N >= W gives k <= (N+1)/2 <= N-1 for N >= 2.
		s.Window = windowSize(s.Characters, s.Counts.Token.Reference)
		s.WindowDiff = WindowDiff(refGaps, predGaps, s.Window)
		s.Pk = Pk(refGaps, predGaps, s.Window)
	}
	return s, nil
}

// wordEnds appends to ends the end offset, in characters, of each word of u
// and returns the extended slice.
func wordEnds(ends []int, u Utterance) ([]int, error) {
	end := 0
	for j, w := range u {
		if w == "" || strings.IndexByte(w, ' ') >= 0 {
			return ends, fmt.Errorf("word %d %q: %w", j+1, w, ErrBadWord)
		}
		end += utf8.RuneCountInString(w)
		ends = append(ends, end)
	}
	return ends, nil
}

// sameText reports whether the words of a and b concatenate to the same
// string, without building either string.
func sameText(a, b Utterance) bool {
	var i, j int      // current words of a and b
	var ai, bj string // unconsumed rest of them
	for {
		for ai == "" && i < len(a) {
			ai, i = a[i], i+1
		}
		for bj == "" && j < len(b) {
			bj, j = b[j], j+1
		}
		if ai == "" || bj == "" {
			return ai == "" && bj == ""
		}
		n := min(len(ai), len(bj))
		if ai[:n] != bj[:n] {
			return false
		}
		ai, bj = ai[n:], bj[n:]
	}
}

// firstDifference returns the 0-based character offset where a and b first
// differ, or the length of the shorter one if it is a prefix of the other.
func firstDifference(a, b string) int {
	pos := 0
	for a != "" && b != "" {
		_, na := utf8.DecodeRuneInString(a)
		_, nb := utf8.DecodeRuneInString(b)
		if a[:na] != b[:nb] {
			break
		}
		a, b, pos = a[na:], b[nb:], pos+1
	}
	return pos
}

// matchLine adds one line's boundary and token counts to c. refEnds and
// predEnds are the word end offsets of the line; both end at the line's
// length n. Walking them together finds the shared word ends: a shared end
// before n is a correct boundary, and a shared end whose word also starts
// at a shared offset is a correct token.
func matchLine(c *Counts, refEnds, predEnds []int) {
	n := refEnds[len(refEnds)-1]
	c.Boundary.Reference += len(refEnds) - 1
	c.Boundary.Predicted += len(predEnds) - 1
	c.Token.Reference += len(refEnds)
	c.Token.Predicted += len(predEnds)
	refStart, predStart := 0, 0
	for i, j := 0, 0; i < len(refEnds) && j < len(predEnds); {
		r, p := refEnds[i], predEnds[j]
		switch {
		case r < p:
			refStart = r
			i++
		case p < r:
			predStart = p
			j++
		default:
			if r < n {
				c.Boundary.Correct++
			}
			if refStart == predStart {
				c.Token.Correct++
			}
			refStart, predStart = r, p
			i++
			j++
		}
	}
}

// appendGaps appends the n-1 gaps of a line of n characters to gaps, true
// where the line has a word end.
func appendGaps(gaps []bool, ends []int, n int) []bool {
	base := len(gaps)
	gaps = append(gaps, make([]bool, n-1)...)
	for _, e := range ends[:len(ends)-1] {
		gaps[base+e-1] = true // the gap after character e-1 (0-based)
	}
	return gaps
}

// windowSize returns half the mean reference word length, N/W/2 for N
// characters and W words, rounded half up, and at least 1.
func windowSize(chars, words int) int {
	return max(1, (chars+words)/(2*words))
}
