package main

import (
	"strings"
	"unicode"
	"unicode/utf8"
)

// tense is the tense of a clause: Kelaru marks the past with "ke" and the
// future with "reŋ" after the verb and leaves the present unmarked.
type tense int

const (
	present tense = iota
	past
	future
)

// verbGroup is an English verb group: a finite auxiliary or verb, then the
// rest. For "did not eat", aux is "did" and rest is "not eat"; for "ate",
// aux is "ate" and rest is empty; inverted is the form after a fronted
// auxiliary ("did she eat"), with the subject between aux and inverted.
type verbGroup struct {
	aux      string
	rest     []string
	inverted []string // what follows the subject in a question
}

// agreement says how the English verb agrees with its subject.
type agreement struct {
	person int
	plural bool
}

func (a agreement) thirdSingular() bool { return a.person == 3 && !a.plural }

// be returns the finite form of "be" in the present or past.
func be(t tense, a agreement) string {
	switch {
	case t == past && (a.plural || a.person == 2):
		return "were"
	case t == past:
		return "was"
	case a.person == 1 && !a.plural:
		return "am"
	case a.thirdSingular():
		return "is"
	default:
		return "are"
	}
}

// copula returns the verb group of "be" followed by a predicate.
func copula(t tense, a agreement, negative bool, predicate string) verbGroup {
	var g verbGroup
	switch t {
	case future:
		g.aux = "will"
		g.rest = []string{"be", predicate}
		g.inverted = []string{"be", predicate}
		if negative {
			g.rest = []string{"not", "be", predicate}
		}
	default:
		g.aux = be(t, a)
		g.rest = []string{predicate}
		g.inverted = []string{predicate}
		if negative {
			g.rest = []string{"not", predicate}
		}
	}
	return g
}

// lexical returns the verb group of v. The present is progressive when
// progressive is set and simple (habitual) otherwise.
func lexical(v *verb, t tense, progressive bool, a agreement, negative bool) verbGroup {
	not := func(rest ...string) []string {
		if negative {
			return append([]string{"not"}, rest...)
		}
		return rest
	}
	switch {
	case t == future:
		return verbGroup{aux: "will", rest: not(v.base), inverted: []string{v.base}}
	case t == past && negative:
		return verbGroup{aux: "did", rest: not(v.base), inverted: []string{v.base}}
	case t == past:
		return verbGroup{aux: v.past, inverted: []string{v.base}, rest: nil}
	case progressive:
		return verbGroup{aux: be(present, a), rest: not(v.ing), inverted: []string{v.ing}}
	default:
		do, form := "do", v.base
		if a.thirdSingular() {
			do, form = "does", v.s3
		}
		if negative {
			return verbGroup{aux: do, rest: not(v.base), inverted: []string{v.base}}
		}
		return verbGroup{aux: form, inverted: []string{v.base}}
	}
}

// questionAux returns the auxiliary that a question fronts for group g of
// a clause in tense t: the group's own auxiliary, or do-support.
func questionAux(g verbGroup, v *verb, t tense, progressive bool, a agreement) string {
	switch {
	case v == nil || t == future || t == present && progressive:
		return g.aux
	case t == past:
		return "did"
	case a.thirdSingular():
		return "does"
	default:
		return "do"
	}
}

// join joins the non-empty words with single spaces.
func join(words []string) string {
	var kept []string
	for _, w := range words {
		if w != "" {
			kept = append(kept, w)
		}
	}
	return strings.Join(kept, " ")
}

// sentence finishes an English sentence: "a" becomes "an" before a vowel,
// the first letter becomes a capital, and end is appended.
func sentence(words []string, end string) string {
	s := strings.Fields(join(words))
	for i := 0; i+1 < len(s); i++ {
		if strings.EqualFold(s[i], "a") && strings.ContainsRune("aeiou", rune(s[i+1][0])) {
			s[i] += "n"
		}
	}
	text := strings.Join(s, " ")
	r, size := utf8.DecodeRuneInString(text)
	return string(unicode.ToUpper(r)) + text[size:] + end
}

// lowerFirst lowers the first letter of an English clause so that it can
// follow "Yes," unless it is the pronoun "I" or a name.
func lowerFirst(s string, keep bool) string {
	if keep || s == "" {
		return s
	}
	r, size := utf8.DecodeRuneInString(s)
	return string(unicode.ToLower(r)) + s[size:]
}
