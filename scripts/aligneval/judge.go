package main

import (
	"fmt"
	"path/filepath"
	"strings"
	"unicode/utf8"

	"github.com/juncture-project/juncture/align"
)

// DictSpec names a FreeDict database (the Debian package is
// "dict-freedict-" + Name) and whether its headwords are English, so that
// it is read in reverse: English headword -> target-language translations.
type DictSpec struct {
	Name    string
	Reverse bool
}

// Package returns the Debian package that installs d.
func (d DictSpec) Package() string { return "dict-freedict-" + d.Name }

// dictionaries lists, for each corpus language, the FreeDict databases
// that judge its glosses. "one" is the set the evaluation was first
// specified with (a target->English database where Debian has one, else an
// English->target one read in reverse); "all" adds the database of the
// other direction wherever Debian 12 packages it, which matters most for
// Turkish (tur-eng has about 1,000 headwords, eng-tur about 36,000).
var dictionaries = map[string]map[string][]DictSpec{
	"one": {
		"spa": {{"spa-eng", false}},
		"tur": {{"tur-eng", false}},
		"swh": {{"swh-eng", false}},
		"fin": {{"eng-fin", true}},
		"ind": {{"eng-ind", true}},
	},
	"all": {
		"spa": {{"spa-eng", false}, {"eng-spa", true}},
		"tur": {{"tur-eng", false}, {"eng-tur", true}},
		"swh": {{"swh-eng", false}, {"eng-swh", true}},
		"fin": {{"fin-eng", false}, {"eng-fin", true}},
		"ind": {{"eng-ind", true}},
	},
}

// maxReverseItemTokens is the longest translation item, in tokens, whose
// words count as translations of an English headword when a database is
// read in reverse.
const maxReverseItemTokens = 2

// Judge decides whether an English gloss translates a target-language
// spelling, from bilingual dictionaries.
//
// Matching rules (our choices, documented in the report):
//
//   - Both sides are tokenised with align.Tokenize (case folding, NFC,
//     punctuation dropped), as the translations the glosses come from are.
//   - The translations of a headword are its translation lines (see
//     TranslationLines), split into items (see TranslationItems). On the
//     English side a leading "to " (infinitive) or article is dropped from
//     a multi-word item, and every remaining token of every item counts:
//     "claim, presumption, pretence" gives three, "out of" gives "out" and
//     "of".
//   - Read in reverse, a database makes each token of an item of at most
//     maxReverseItemTokens tokens ("di dalam" under "in") a translation of
//     an English headword that is a single token (after dropping a leading
//     "to" or article). Longer items are mostly explanations ("adalete
//     uygun şekilde" under "right") and longer headwords phrases ("the
//     thing is": "asia on"), whose function words would otherwise
//     translate every word they appear with.
//   - English inflection: a gloss matches a dictionary word if the two
//     share a form after removing a plural, past or -ing ending (see
//     englishForms), so "rights" matches "right".
//   - Target-language inflection: if MinStem > 0, a spelling also takes
//     the entry of its longest proper prefix of at least MinStem
//     characters that is a headword (or, in reverse, a translation
//     token): "derechos" takes "derecho", "hakkını" "hakkı". A prefix is
//     no morphological analysis: "kaikkien" (of all) reaches "kaikki" but
//     "oikeuksia" (rights) never reaches "oikeus"; and a short stem may be
//     another word ("hak" is also a prefix of "hakem", referee).
type Judge struct {
	// MinStem is the shortest prefix of a spelling that may stand for it;
	// 0 allows exact entries only.
	MinStem int
	english map[string]map[string]bool // target form -> English forms
}

// NewJudge returns a judge with no dictionary.
func NewJudge(minStem int) *Judge {
	return &Judge{MinStem: minStem, english: map[string]map[string]bool{}}
}

// Len returns the number of target-language forms with a translation.
func (j *Judge) Len() int { return len(j.english) }

// add records English words as translations of target form t.
func (j *Judge) add(t string, english []string) {
	if len(english) == 0 {
		return
	}
	set := j.english[t]
	if set == nil {
		set = map[string]bool{}
		j.english[t] = set
	}
	for _, e := range english {
		for _, f := range englishForms(e) {
			set[f] = true
		}
	}
}

// AddDictionary adds the translations of d, read forward (headword in the
// target language) or in reverse.
func (j *Judge) AddDictionary(d *Dictionary, reverse bool) {
	for i, e := range d.Index {
		if IsMetadata(e.Headword) {
			continue
		}
		lines := TranslationLines(d.Article(i))
		if reverse {
			english := englishTokens(e.Headword)
			if len(english) != 1 {
				continue
			}
			for _, line := range lines {
				for _, item := range TranslationItems(line) {
					if toks := align.Tokenize(item); len(toks) <= maxReverseItemTokens {
						for _, t := range toks {
							j.add(t, english)
						}
					}
				}
			}
			continue
		}
		key := strings.Join(align.Tokenize(e.Headword), " ")
		if key == "" {
			continue
		}
		for _, line := range lines {
			for _, item := range TranslationItems(line) {
				j.add(key, englishTokens(item))
			}
		}
	}
}

// englishTokens tokenises an English item, dropping a leading infinitive
// "to" or article when more words follow.
func englishTokens(item string) []string {
	toks := align.Tokenize(item)
	if len(toks) > 1 {
		switch toks[0] {
		case "to", "the", "a", "an":
			toks = toks[1:]
		}
	}
	return toks
}

// entries returns the English forms that translate spelling: those of its
// own entry and, if MinStem > 0, those of its longest proper prefix of at
// least MinStem characters that has an entry (so an inflected form with an
// unrelated homograph entry still reaches its stem). It returns nil if
// neither exists.
func (j *Judge) entries(spelling string) []map[string]bool {
	key := strings.Join(align.Tokenize(spelling), " ")
	var out []map[string]bool
	if set, ok := j.english[key]; ok {
		out = append(out, set)
	}
	if j.MinStem <= 0 || strings.Contains(key, " ") {
		return out
	}
	for end := len(key); end > 0; {
		_, size := utf8.DecodeLastRuneInString(key[:end])
		end -= size
		if utf8.RuneCountInString(key[:end]) < j.MinStem {
			break
		}
		if set, ok := j.english[key[:end]]; ok {
			return append(out, set)
		}
	}
	return out
}

// Known reports whether any of the spellings has a dictionary entry.
func (j *Judge) Known(spellings []string) bool {
	for _, s := range spellings {
		if len(j.entries(s)) > 0 {
			return true
		}
	}
	return false
}

// Correct reports whether gloss, one English word, translates any of the
// spellings.
func (j *Judge) Correct(spellings []string, gloss string) bool {
	toks := align.Tokenize(gloss)
	if len(toks) != 1 {
		return false
	}
	forms := englishForms(toks[0])
	for _, s := range spellings {
		for _, set := range j.entries(s) {
			for _, f := range forms {
				if set[f] {
					return true
				}
			}
		}
	}
	return false
}

// englishForms returns w and the stems a regular English ending may hide:
// -ies -> -y, -es and -s removed (not -ss, -us, -is), -ed and -d removed,
// -ing removed with or without an -e restored. A stem must keep at least
// three characters before the ending, so "this", "has", "thing" and "need"
// give no stems that collide with short function words. This is a crude
// suffix stripper (common practice), meant for matching one gloss against
// dictionary words, not a lemmatiser.
func englishForms(w string) []string {
	forms := []string{w}
	base := func(suffix string) (string, bool) {
		if !strings.HasSuffix(w, suffix) {
			return "", false
		}
		b := w[:len(w)-len(suffix)]
		return b, utf8.RuneCountInString(b) >= 3
	}
	if b, ok := base("ies"); ok {
		forms = append(forms, b+"y")
	} else if b, ok := base("es"); ok {
		forms = append(forms, b, b+"e")
	} else if b, ok := base("s"); ok && !strings.HasSuffix(w, "ss") && !strings.HasSuffix(w, "us") && !strings.HasSuffix(w, "is") {
		forms = append(forms, b)
	}
	if b, ok := base("ed"); ok {
		forms = append(forms, b, b+"e")
	}
	if b, ok := base("ing"); ok {
		forms = append(forms, b, b+"e")
	}
	return forms
}

// LoadJudge builds the judge for lang from the databases of set in dir.
// It returns, for the report, the databases used and their entry counts.
func LoadJudge(dir, set, lang string, minStem int) (*Judge, []string, error) {
	specs, ok := dictionaries[set][lang]
	if !ok {
		return nil, nil, fmt.Errorf("no dictionaries for language %q in set %q", lang, set)
	}
	j := NewJudge(minStem)
	var used []string
	for _, s := range specs {
		d, err := OpenDictionary(filepath.Join(dir, "freedict-"+s.Name))
		if err != nil {
			return nil, nil, fmt.Errorf("%w (install Debian package %s, or run scripts/align-eval.sh)", err, s.Package())
		}
		j.AddDictionary(d, s.Reverse)
		way := "forward"
		if s.Reverse {
			way = "reverse"
		}
		desc := fmt.Sprintf("%s (%s, %d index rows", s.Name, way, len(d.Index))
		if v := debianVersion(s.Package()); v != "" && filepath.Clean(dir) == debianDictDir {
			desc += ", Debian " + s.Package() + " " + v
		}
		used = append(used, desc+")")
	}
	return j, used, nil
}
