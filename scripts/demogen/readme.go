package main

import (
	"bytes"
	"fmt"
	"strings"
)

// stats are the counts the README reports.
type stats struct {
	utterances, distinct    int
	tokens, types           int
	units, unitTypes        int
	lexicon, attested       int
	prefixTypes             int // attested types that begin another attested type
	maxWords                int
	minSyllables            int // over the lexicon
	maxSyllables            int
	wordsPerUtt, unitsPerWd float64
}

// measure counts the corpus.
func measure(utts []utterance, lex map[string]word) (stats, error) {
	st := stats{utterances: len(utts), lexicon: len(lex), minSyllables: -1}
	for form := range lex {
		syl, err := syllables(form)
		if err != nil {
			return stats{}, err
		}
		if st.minSyllables < 0 || len(syl) < st.minSyllables {
			st.minSyllables = len(syl)
		}
		st.maxSyllables = max(st.maxSyllables, len(syl))
	}
	lines := make(map[string]bool)
	types := make(map[string]bool)
	unitSet := make(map[string]bool)
	for _, u := range utts {
		lines[strings.Join(u.words, " ")] = true
		st.tokens += len(u.words)
		st.maxWords = max(st.maxWords, len(u.words))
		for _, w := range u.words {
			types[w] = true
			us, err := units(w)
			if err != nil {
				return stats{}, err
			}
			st.units += len(us)
			for _, x := range us {
				unitSet[x] = true
			}
		}
	}
	st.distinct, st.types, st.attested, st.unitTypes = len(lines), len(types), len(types), len(unitSet)
	for w := range types {
		for v := range types {
			if v != w && strings.HasPrefix(v, w) {
				st.prefixTypes++
				break
			}
		}
	}
	st.wordsPerUtt = float64(st.tokens) / float64(st.utterances)
	st.unitsPerWd = float64(st.units) / float64(st.tokens)
	return st, nil
}

// readme returns the README of the demo corpus.
func readme(seed uint64, n int, st stats) []byte {
	var b bytes.Buffer
	p := func(format string, args ...any) { fmt.Fprintf(&b, format, args...) }
	p(`# Kelaru: the invented demo corpus

**Everything in this directory is invented for the juncture demo.** Kelaru is
not a real language, Hamoli is not a real place, and the people, names,
sentences and translations were made up by a program
(`+"`scripts/demogen`"+`). Any likeness to words of a real language is an
accident. Use these files to try juncture and to test it, never as evidence
about any language.

## The scenario

Kelaru is imagined as the language of about 350 people on Hamoli, a small
island of fishing and garden villages. A linguist has recorded everyday talk:
greetings and thanks, fishing, cooking, the gardens, the weather, questions
and requests. Each utterance was transcribed phonemically, at first without
deciding where words begin and end, and a bilingual helper gave a free
English translation. That is the situation juncture is built for: find the
word boundaries in the unbroken transcription, with the translation as an
optional hint.

## Files

| file | contents |
|---|---|
| `+"`input.txt`"+` | the transcriptions, one utterance a line, no spaces: what a user starts with |
| `+"`gold.txt`"+` | the same lines with single spaces between words: the reference segmentation |
| `+"`translations.txt`"+` | a free English translation of each line, line-aligned |
| `+"`lexicon.tsv`"+` | every word of the language: form, gloss and part of speech separated by tabs, sorted by form |
| `+"`demo.go`"+` | package `+"`demo`"+`, which embeds the files above in Go programs |

Lines are UTF-8 in Unicode normalisation form C.

## Sounds

Syllables are CV or CVC: every syllable has one consonant before its
vowel, and only %s may close a syllable.
Words have %d to %d syllables.

Consonants (%d): %s

Vowels (%d): %s

Several phonemes are written with more than one character: aspiration `+"`ʰ`"+`
(U+02B0) and labialisation `+"`ʷ`"+` (U+02B7) are modifier letters, length
`+"`ː`"+` (U+02D0) is a modifier letter, and the affricate `+"`t͡ʃ`"+` has a tie bar
(U+0361). Each counts as one unit under juncture's default rule (a base
character with the marks and modifier letters that follow it; a tie bar
joins the characters on both sides). The voiced
velar stop is written with ASCII `+"`g`"+`.

## Grammar sketch

- Word order is subject, object, verb. A time word (`+"`ʃolo`"+` yesterday,
  `+"`ʃolomi`"+` tomorrow, ...) comes first.
- Postpositions follow the noun phrase: `+"`ni`"+` marks a definite object (an
  indefinite object has none: "the fish" is `+"`ʃara ni`"+`, "a fish" is
  `+"`ʃara`"+`), `+"`lo`"+` location, `+"`tu`"+` goal, `+"`maʃ`"+` source, `+"`sen`"+` "with".
- A noun phrase is: possessor, noun, adjective, `+"`hu`"+` "very", the plural
  particle `+"`ta`"+` or a numeral, the demonstrative `+"`ki`"+` "this" or `+"`wu`"+` "that".
- The verb ends the clause: `+"`mo`"+` (not) before it, `+"`ke`"+` (past) or `+"`reŋ`"+`
  (future) after it; the present is unmarked. Adjectives and places are
  predicated with the copula `+"`ne`"+`.
- Yes-no questions end in `+"`pa`"+`. Question words (`+"`kʷe`"+` what, `+"`kʷen`"+` who,
  `+"`kʷelo`"+` where, `+"`hamaː`"+` when) stand just before the verb; "who" as subject
  stays in the subject's place. Requests end in `+"`ko`"+`; with `+"`naŋ`"+` (we) they
  mean "let's".
- A subject pronoun may be left out; after `+"`daŋ`"+` "and then" the subject of
  the second clause is always left out.

Example (gold.txt has the first line, input.txt the second):

    ʃolo na ʃara ni kumo ke
    ʃolonaʃaranikumoke
    yesterday I fish OBJ cook PST
    'I cooked the fish yesterday.'

Many short words begin longer ones (`+"`na`"+` I, `+"`naŋ`"+` we, `+"`nawin`"+` a name;
`+"`ka`"+` go, `+"`kaka`"+` laugh; `+"`tu`"+` goal, `+"`tulu`"+` come back; `+"`kʷe`"+` what,
`+"`kʷelo`"+` where): a segmenter has to decide between them from context.

Gloss abbreviations follow the Leipzig Glossing Rules: ABL ablative, ALL
allative, COM comitative, COP copula, FUT future, IMP imperative, LOC
locative, NEG negation, OBJ object, PL plural, PST past, Q question.

## Counts

| | |
|---|---|
| utterances | %d (%d distinct) |
| word tokens | %d (%.2f per utterance, at most %d) |
| word types | %d of %d in the lexicon |
| word types that begin a longer type | %d |
| phoneme units | %d (%.2f per word), %d distinct |

Word frequencies are roughly Zipfian: each word class draws its words with
weights 1/rank.

## Regenerating

From the repository root:

    go run ./scripts/demogen -out data/demo -seed %d -n %d

The same seed and count give the same bytes (one explicit PCG source from
math/rand/v2; every file is written to a temporary file and renamed into
place). `+"`go test ./scripts/demogen`"+` fails when these files differ from
what the generator makes, and `+"`go test ./data/demo`"+` checks that the files
agree with each other.
`,
		orList(codas), st.minSyllables, st.maxSyllables, len(consonants), code(consonants), len(vowels), code(vowels),
		st.utterances, st.distinct, st.tokens, st.wordsPerUtt, st.maxWords,
		st.attested, st.lexicon, st.prefixTypes, st.units, st.unitsPerWd, st.unitTypes,
		seed, n)
	return b.Bytes()
}

// code formats a list of phonemes as Markdown code spans.
func code(list []string) string {
	out := make([]string, len(list))
	for i, s := range list {
		out[i] = "`" + s + "`"
	}
	return strings.Join(out, " ")
}

// orList formats a list of phonemes as "a, b or c".
func orList(list []string) string {
	c := strings.Fields(code(list))
	return strings.Join(c[:len(c)-1], ", ") + " or " + c[len(c)-1]
}
