package main

import "math/rand/v2"

// generator draws utterances from the Kelaru grammar. All randomness comes
// from r, so one seed gives one corpus.
type generator struct {
	r  *rand.Rand
	he bool // English renders the third person singular pronoun as "he"
}

// utterance is one Kelaru utterance with its free English translation.
type utterance struct {
	words   []string
	english string
}

func (g *generator) chance(p float64) bool { return g.r.Float64() < p }

// zipf draws an index i < n for which ok(i) holds with weight 1/(i+1), so
// that the lists in lexicon.go, ordered by frequency, give Zipfian word
// frequencies. It panics when no index qualifies: the grammar asked for a
// word the lexicon does not have.
func (g *generator) zipf(n int, ok func(int) bool) int {
	i, found := g.tryZipf(n, ok)
	if !found {
		panic("demogen: the lexicon has no word the grammar asked for")
	}
	return i
}

// tryZipf is zipf for requests that may have no answer.
func (g *generator) tryZipf(n int, ok func(int) bool) (int, bool) {
	total := 0.0
	for i := range n {
		if ok(i) {
			total += 1 / float64(i+1)
		}
	}
	if total == 0 {
		return 0, false
	}
	x := g.r.Float64() * total
	last := -1
	for i := range n {
		if ok(i) {
			last = i
			if x -= 1 / float64(i+1); x < 0 {
				return i, true
			}
		}
	}
	return last, true
}

// pickTense draws a tense that agrees with time word t, if any.
func (g *generator) pickTense(t *timeWord) tense {
	for {
		var tn tense
		switch x := g.r.Float64(); {
		case x < 0.45:
			tn = past
		case x < 0.75:
			tn = present
		default:
			tn = future
		}
		if t == nil || tn == past && t.past || tn == present && t.present || tn == future && t.future {
			return tn
		}
	}
}

// clauseOptions says what a clause may contain.
type clauseOptions struct {
	negative bool // may be negated
	time     bool // may have a time adverb
	also     bool // may have "bi" (also)
	drop     bool // may leave out a subject pronoun
}

// statementOptions are the options of a plain statement.
var statementOptions = clauseOptions{negative: true, time: true, also: true, drop: true}

// decorate adds time, tense, negation and "also" to c.
func (g *generator) decorate(c *clause, opt clauseOptions) {
	if opt.time && g.chance(0.28) {
		c.time = &timeWords[g.zipf(len(timeWords), func(int) bool { return true })]
		c.timeFront = g.chance(0.3)
	}
	c.tense = g.pickTense(c.time)
	if c.v != nil && c.tense == present && !c.v.stative {
		switch {
		case c.time == nil:
			c.progressive = g.chance(0.6)
		default:
			c.progressive = c.time.en == "now" || c.time.en == "today"
		}
	}
	c.negative = opt.negative && g.chance(0.12)
	c.also = opt.also && !c.negative && g.chance(0.05)
	c.dropSubject = opt.drop && c.subject.pron != nil && g.chance(0.08)
}

// verbClause returns a clause with a transitive or an intransitive verb,
// about subject if given and with a verb other than avoid.
func (g *generator) verbClause(transitive bool, subject *phrase, avoid *verb, opt clauseOptions) *clause {
	v := &verbs[g.zipf(len(verbs), func(i int) bool {
		v := &verbs[i]
		cls := v.isubj
		if transitive {
			cls = v.subj
			if v.obj == 0 {
				return false
			}
		}
		if cls == 0 || v == avoid {
			return false
		}
		return subject == nil || subject.class()&cls != 0
	})]
	c := &clause{v: v, subject: subject}
	subjClass := v.isubj
	if transitive {
		subjClass = v.subj
	}
	if c.subject == nil {
		s := g.argument(subjClass, nil, allModifiers)
		c.subject = &s
	}
	if transitive {
		o := g.argument(v.obj, c.subject, allModifiers)
		c.object = &o
	}
	switch {
	case v.motion:
		switch x := g.r.Float64(); {
		case x < 0.55:
			adverbs := placeAdverbs
			if v.form == "ka" { // "go there", not "go here"
				adverbs = placeAdverbs[1:]
			}
			c.placeWords, c.placeEN = g.place(0, wAll, v.goalPrep, adverbs)
		case x < 0.75 && v.form != "ka": // "come from", not "go from"
			c.placeWords, c.placeEN = g.place(0, wAbl, "from", nil)
		}
	case v.static:
		p := 0.3
		if !transitive {
			p = 0.5
		}
		if g.chance(p) {
			c.placeWords, c.placeEN = g.place(v.locClass, wLoc, "", placeAdverbs)
		}
	}
	if c.subject.class()&human != 0 && !v.stative && g.chance(0.08) { // not "knew a child with Kwalong"
		w := g.argument(human, c.subject, nounOptions{possessor: true})
		if !w.same(c.object) {
			c.with = &w
		}
	}
	if g.chance(0.08) {
		c.adverb = &mannerAdverbs[g.zipf(len(mannerAdverbs), func(i int) bool {
			return !v.stative || mannerAdverbs[i].en == "again" // not "know quickly"
		})]
	}
	g.decorate(c, opt)
	return c
}

// adjectiveClause returns a copular clause "the house is big".
func (g *generator) adjectiveClause(opt clauseOptions) *clause {
	a := &adjectives[g.zipf(len(adjectives), func(int) bool { return true })]
	var s phrase
	switch {
	case a.person && g.chance(0.4):
		s = g.pronounPhrase(g.pickPronoun(nil))
	case a.person && g.chance(0.25):
		s = g.namePhrase(nil)
	default:
		s = g.nounPhrase(a.describes, nounOptions{number: true, possessor: true, demonstr: true, definite: true})
	}
	c := &clause{subject: &s, predWords: []string{a.form}, predEN: a.en}
	if g.chance(0.15) {
		c.predWords = append(c.predWords, wVery.form)
		c.predEN = "very " + a.en
	}
	g.decorate(c, clauseOptions{negative: opt.negative, time: opt.time && a.state && g.chance(0.6), also: opt.also})
	if !a.state && c.tense != present && (c.tense == future || g.chance(0.7)) {
		c.tense = present
	}
	return c
}

// locationClause returns a copular clause "the dog is in the house".
func (g *generator) locationClause(opt clauseOptions) *clause {
	s := g.argument(human|animal|portable, nil, nounOptions{number: true, possessor: true, demonstr: true, definite: true})
	c := &clause{subject: &s}
	c.predWords, c.predEN = g.place(0, wLoc, "", placeAdverbs)
	g.decorate(c, clauseOptions{negative: opt.negative, time: opt.time && g.chance(0.5), also: opt.also})
	return c
}

// anyClause returns a clause of a kind drawn with fixed weights.
func (g *generator) anyClause(opt clauseOptions) *clause {
	switch x := g.r.Float64(); {
	case x < 0.42:
		return g.verbClause(true, nil, nil, opt)
	case x < 0.74:
		return g.verbClause(false, nil, nil, opt)
	case x < 0.9:
		return g.adjectiveClause(opt)
	default:
		return g.locationClause(opt)
	}
}
