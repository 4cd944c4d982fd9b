package main

import "strings"

// utteranceKinds are the kinds of utterance and their relative weights.
var utteranceKinds = []struct {
	weight float64
	make   func(*generator) utterance
}{
	{10, (*generator).greeting},
	{24, (*generator).transitiveStatement},
	{17, (*generator).intransitiveStatement},
	{9, (*generator).adjectiveStatement},
	{4, (*generator).locationStatement},
	{3, (*generator).identification},
	{10, (*generator).polarQuestion},
	{10, (*generator).contentQuestion},
	{6, (*generator).imperative},
	{3, (*generator).answer},
	{4, (*generator).chain},
}

// utterance draws one utterance.
func (g *generator) utterance() utterance {
	g.he = g.chance(0.5)
	total := 0.0
	for _, k := range utteranceKinds {
		total += k.weight
	}
	x := g.r.Float64() * total
	for _, k := range utteranceKinds {
		if x -= k.weight; x < 0 {
			return k.make(g)
		}
	}
	return utteranceKinds[len(utteranceKinds)-1].make(g)
}

func statement(c *clause) utterance {
	return utterance{words: c.kelaru(), english: sentence(c.statement(), ".")}
}

func (g *generator) transitiveStatement() utterance {
	return statement(g.verbClause(true, nil, nil, statementOptions))
}

func (g *generator) intransitiveStatement() utterance {
	return statement(g.verbClause(false, nil, nil, statementOptions))
}

func (g *generator) adjectiveStatement() utterance {
	return statement(g.adjectiveClause(statementOptions))
}

func (g *generator) locationStatement() utterance {
	return statement(g.locationClause(statementOptions))
}

// identification returns "ki basket ne" (this is a basket) or, now and
// then, "ki kʷe ne" (what is this?).
func (g *generator) identification() utterance {
	dem, en := wThis, "this"
	if g.chance(0.4) {
		dem, en = wThat, "that"
	}
	if g.chance(0.2) {
		return utterance{
			words:   []string{dem.form, wWhat.form, wCop.form},
			english: sentence([]string{"what is", en}, "?"),
		}
	}
	ph := g.nounPhrase(func(n *noun) bool {
		return n.class&(portable|animal|built|plant|place|human) != 0 && !n.mass && !n.unique
	}, nounOptions{adjective: true, possessor: true})
	words := append([]string{dem.form}, ph.words...)
	verb := "is"
	if g.chance(0.12) {
		words = append(words, wNeg.form)
		verb = "is not"
	}
	return utterance{
		words:   append(words, wCop.form),
		english: sentence([]string{en, verb, ph.obj}, "."),
	}
}

// greeting returns a greeting, a thanks or a farewell, alone or with the
// name or kin term of the person addressed.
func (g *generator) greeting() utterance {
	type formula struct {
		w       word
		en      string
		enPlain string // when said alone
	}
	formulas := []formula{
		{wHello, "hello", "hello"},
		{wThanks, "thank you", "thank you"},
		{wBye, "goodbye", "goodbye"},
	}
	f := formulas[g.zipf(len(formulas), func(int) bool { return true })]
	words := []string{f.w.form}
	en := []string{f.enPlain}
	switch x := g.r.Float64(); {
	case x < 0.35:
		n := g.namePhrase(nil)
		words = append(words, n.words...)
		en = []string{f.en + ",", n.subj}
	case x < 0.55:
		n := g.nounPhrase(func(n *noun) bool {
			return n.class&human != 0 && n.form != "mun" && n.form != "tane" && n.form != "siri"
		}, nounOptions{})
		words = append(words, n.noun.form)
		addressee := n.noun.sg
		if g.chance(0.3) {
			words = append(words, wPl.form)
			addressee = n.noun.pl
		}
		en = []string{f.en + ",", addressee}
	case x < 0.65 && f.w == wThanks:
		words = append(words, wVery.form)
		en = []string{"thank you very much"}
	}
	text := sentence(en, ".")
	if f.w == wHello && g.chance(0.25) {
		p := g.pronounPhrase(&pronouns[2])
		if g.chance(0.3) {
			p = g.pronounPhrase(&pronouns[5])
		}
		c := &clause{subject: &p, predWords: []string{"ʔuto"}, predEN: "well"}
		words = append(words, c.kelaru()...)
		words = append(words, wQ.form)
		text += " " + sentence(c.question(""), "?")
	}
	return utterance{words: words, english: text}
}

// polarQuestion returns a yes-no question: a clause followed by "pa".
func (g *generator) polarQuestion() utterance {
	c := g.anyClause(clauseOptions{time: true, also: true})
	c.timeFront = false
	g.askYou(c)
	return utterance{
		words:   append(c.kelaru(), wQ.form),
		english: sentence(c.question(""), "?"),
	}
}

// askYou turns most questions about "I" into questions about "you":
// people ask others about themselves more than about the one asking.
func (g *generator) askYou(c *clause) {
	if p := c.subject.pron; p != nil && p.person == 1 && !p.plural && g.chance(0.8) {
		you := g.pronounPhrase(&pronouns[2])
		if !you.same(c.object) && !you.same(c.with) {
			c.subject = &you
		}
	}
}

// contentQuestion returns a question with a question word just before the
// verb ("what", "where", "when", "who" as object) or in subject position
// ("who"). Questions carry no "pa".
func (g *generator) contentQuestion() utterance {
	opt := clauseOptions{time: true}
	switch x := g.r.Float64(); {
	case x < 0.3: // what did you eat?
		c := g.verbClause(true, nil, nil, opt)
		for c.v.obj&^human == 0 {
			c = g.verbClause(true, nil, nil, opt)
		}
		g.askYou(c)
		c.object = nil
		c.focus = []string{wWhat.form}
		return utterance{words: c.kelaru(), english: sentence(c.question("what"), "?")}
	case x < 0.5: // who ate the fish?
		c := g.verbClause(g.chance(0.5), nil, nil, opt)
		for c.subject.class()&human == 0 {
			c = g.verbClause(g.chance(0.5), nil, nil, opt)
		}
		c.subject = &phrase{words: []string{wWho.form}, person: 3}
		c.dropSubject = false
		return utterance{words: c.kelaru(), english: sentence(c.whoQuestion(), "?")}
	case x < 0.58: // who did you help?
		c := g.verbClause(true, nil, nil, opt)
		for c.v.obj&human == 0 {
			c = g.verbClause(true, nil, nil, opt)
		}
		g.askYou(c)
		c.object = nil
		c.focus = []string{wWho.form, wObj.form}
		return utterance{words: c.kelaru(), english: sentence(c.question("who"), "?")}
	case x < 0.88: // where did she go? where is the dog?
		var c *clause
		if g.chance(0.35) {
			c = g.locationClause(opt)
			c.predWords, c.predEN = nil, ""
		} else {
			c = g.verbClause(false, nil, nil, opt)
			for !c.v.static && c.v.form != "ka" { // "where did she go", not "where did she come"
				c = g.verbClause(false, nil, nil, opt)
			}
			c.placeWords, c.placeEN = nil, ""
		}
		g.askYou(c)
		c.focus = []string{wWhere.form}
		return utterance{words: c.kelaru(), english: sentence(c.question("where"), "?")}
	default: // when will you come back?
		c := g.verbClause(g.chance(0.3), nil, nil, clauseOptions{})
		if g.chance(0.5) {
			c.tense, c.progressive = past, false
		} else {
			c.tense, c.progressive = future, false
		}
		g.askYou(c)
		c.focus = []string{wWhen.form}
		return utterance{words: c.kelaru(), english: sentence(c.question("when"), "?")}
	}
}

// imperative returns a request ending in "ko": to the person addressed,
// "please eat the fish"; with "naŋ" (we), "let's go to the beach".
func (g *generator) imperative() utterance {
	c := g.verbClause(g.chance(0.5), nil, nil, clauseOptions{})
	for c.subject.class()&human == 0 || c.v.stative || addressed(c.object) || addressed(c.with) {
		c = g.verbClause(g.chance(0.5), nil, nil, clauseOptions{})
	}
	c.also = false
	c.tense, c.progressive = present, false
	var words, en []string
	if g.chance(0.25) { // hortative
		we := g.pronounPhrase(&pronouns[3])
		c.subject, c.with = &we, nil
		c.negative = false
		words = append(c.kelaru(), wImp.form)
		en = append([]string{"let's", c.v.base}, c.complements()...)
		return utterance{words: words, english: sentence(en, ".")}
	}
	var vocative []string
	if g.chance(0.3) {
		n := g.namePhrase(nil)
		words = append(words, n.words...)
		vocative = []string{n.subj + ","}
	}
	you := g.pronounPhrase(&pronouns[2])
	c.subject = &you
	c.dropSubject = true
	c.negative = g.chance(0.15)
	words = append(append(words, c.kelaru()...), wImp.form)
	verb := []string{c.v.base}
	if c.negative {
		verb = []string{"do", "not", c.v.base}
	}
	if g.chance(0.5) {
		en = append(append(append(vocative, "please"), verb...), c.complements()...)
	} else {
		en = strings.Fields(join(append(append(vocative, verb...), c.complements()...)))
		en[len(en)-1] += ","
		en = append(en, "please")
	}
	return utterance{words: words, english: sentence(en, ".")}
}

// addressed reports whether p is a first or second person pronoun, which
// an imperative or a hortative cannot have as its object or companion.
func addressed(p *phrase) bool {
	return p != nil && p.pron != nil && p.pron.person != 3
}

// answer returns "ʔiwa" (yes) or "mabo" (no), alone or before a statement
// that agrees with it.
func (g *generator) answer() utterance {
	yes := g.chance(0.55)
	w, en := wYes, "yes"
	if !yes {
		w, en = wNo, "no"
	}
	if g.chance(0.3) {
		return utterance{words: []string{w.form}, english: sentence([]string{en}, ".")}
	}
	c := g.anyClause(clauseOptions{time: true})
	c.negative = !yes
	c.timeFront = false
	s := c.statement()
	keep := c.subject.pron != nil && c.subject.subj == "I" || c.subject.noun == nil && c.subject.pron == nil
	s[0] = lowerFirst(s[0], keep)
	return utterance{
		words:   append([]string{w.form}, c.kelaru()...),
		english: sentence(append([]string{en + ","}, s...), "."),
	}
}

// chain returns two clauses with one subject joined by "daŋ" (and then);
// the second clause leaves the subject out in both languages.
func (g *generator) chain() utterance {
	opt := clauseOptions{time: true}
	first := g.verbClause(g.chance(0.6), nil, nil, opt)
	for first.subject.class()&(human|animal) == 0 {
		first = g.verbClause(g.chance(0.6), nil, nil, opt)
	}
	if first.time != nil && first.time.en == "now" {
		first.time = nil
	}
	first.progressive = false
	second := g.verbClause(g.chance(0.5), first.subject, first.v, clauseOptions{})
	second.tense, second.progressive = first.tense, false
	second.dropSubject = true
	words := append(append(first.kelaru(), wThen.form), second.kelaru()...)
	en := append(append(first.statement(), "and", "then"), second.predicate()...)
	return utterance{words: words, english: sentence(en, ".")}
}
