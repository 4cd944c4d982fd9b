package main

// phrase is a noun phrase: its Kelaru words and its English renderings.
type phrase struct {
	words    []string
	subj     string // English as a subject
	obj      string // English as an object or after a preposition
	person   int
	plural   bool
	definite bool     // takes the object marker when it is an object
	pron     *pronoun // set for a pronoun
	noun     *noun    // set for a common noun
}

// class returns the semantic features of the phrase: people for pronouns
// and names, the head noun's features otherwise.
func (p *phrase) class() class {
	if p.noun != nil {
		return p.noun.class
	}
	return human
}

// same reports whether p and q are the same pronoun or the same name, so
// that a clause does not say "I saw me".
func (p *phrase) same(q *phrase) bool {
	if p == nil || q == nil || p.noun != nil || q.noun != nil {
		return false
	}
	return p.words[0] == q.words[0]
}

// pronounPhrase returns the phrase of pronoun p.
func (g *generator) pronounPhrase(p *pronoun) phrase {
	ph := phrase{words: []string{p.form}, subj: p.subj, obj: p.obj, person: p.person,
		plural: p.plural, definite: true, pron: p}
	if p.person == 3 && !p.plural {
		ph.subj, ph.obj = "she", "her"
		if g.he {
			ph.subj, ph.obj = "he", "him"
		}
	}
	return ph
}

// possessive returns the English possessive determiner of pronoun p.
func (g *generator) possessive(p *pronoun) string {
	if p.person == 3 && !p.plural {
		if g.he {
			return "his"
		}
		return "her"
	}
	return p.poss
}

// pickPronoun returns a pronoun other than the one in avoid.
func (g *generator) pickPronoun(avoid *phrase) *pronoun {
	i := g.zipf(len(pronouns), func(i int) bool {
		return avoid == nil || avoid.pron == nil || avoid.pron.form != pronouns[i].form
	})
	return &pronouns[i]
}

// namePhrase returns the phrase of a personal name other than the one in avoid.
func (g *generator) namePhrase(avoid *phrase) phrase {
	i := g.zipf(len(names), func(i int) bool {
		return avoid == nil || avoid.pron != nil || avoid.noun != nil || avoid.words[0] != names[i].form
	})
	n := names[i]
	return phrase{words: []string{n.form}, subj: n.en, obj: n.en, person: 3, definite: true}
}

// nounOptions says which modifiers a noun phrase may have.
type nounOptions struct {
	adjective bool // an attributive adjective
	number    bool // plural, numeral, quantifier
	possessor bool
	demonstr  bool
	definite  bool // never "a" or a bare noun: "the egg is big"
}

// allModifiers lets a noun phrase have every kind of modifier.
var allModifiers = nounOptions{adjective: true, number: true, possessor: true, demonstr: true}

// nounPhrase returns a phrase headed by a noun for which ok holds. Kelaru
// order is possessor, noun, adjective, "very", plural particle or numeral,
// demonstrative; English puts all but the noun in front of it.
func (g *generator) nounPhrase(ok func(*noun) bool, opt nounOptions) phrase {
	n := &nouns[g.zipf(len(nouns), func(i int) bool { return ok(&nouns[i]) })]
	ph := phrase{person: 3, noun: n}
	var det string // English determiner; "" for none yet
	var pre, post []string

	if opt.possessor && n.class&own != 0 && g.chance(possessorChance(n)) {
		if g.chance(0.85) {
			p := g.pickPronoun(nil)
			pre = append(pre, p.form)
			det = g.possessive(p)
		} else {
			nm := g.namePhrase(nil)
			pre = append(pre, nm.words...)
			det = nm.subj + "'s"
		}
		ph.definite = true
	}

	var adj *adjective
	very := false
	if opt.adjective && g.chance(0.22) {
		if i, found := g.tryZipf(len(adjectives), func(i int) bool {
			a := &adjectives[i]
			return !a.predicateOnly && a.describes(n)
		}); found {
			adj = &adjectives[i]
			post = append(post, adj.form)
			if g.chance(0.15) {
				very = true
				post = append(post, wVery.form)
			}
		}
	}

	countable := !n.mass && !n.unique
	var num *numeral
	if opt.number && countable && !(n.class&kin != 0 && det != "") && g.chance(0.24) {
		if g.chance(0.3) {
			num = &numerals[g.zipf(len(numerals), func(i int) bool {
				// "all" and "one" do not go with a possessor in English here.
				return det == "" || numerals[i].plural && numerals[i].form != "keʃa"
			})]
			post = append(post, num.form)
			ph.plural = num.plural
		} else {
			post = append(post, wPl.form)
			ph.plural = true
		}
	}

	if opt.demonstr && det == "" && num == nil && !n.unique && g.chance(0.12) {
		if g.chance(0.6) {
			post = append(post, wThis.form)
			det = "this"
			if ph.plural {
				det = "these"
			}
		} else {
			post = append(post, wThat.form)
			det = "that"
			if ph.plural {
				det = "those"
			}
		}
		ph.definite = true
	}

	head := n.sg
	if ph.plural {
		head = n.pl
	}
	switch {
	case num != nil && num.form == "keʃa":
		if det == "" {
			det = "all the"
		} else {
			det = "all " + det
		}
		ph.definite = true
	case num != nil:
		if det == "" {
			det = num.en
		} else {
			det += " " + num.en
		}
	case det != "":
	case n.unique:
		det = "the"
		ph.definite = true
	case n.mass || ph.plural:
		if opt.definite || g.chance(0.6) {
			det = "the"
			ph.definite = true
		}
	default:
		det = "a"
		if opt.definite || g.chance(0.65) {
			det = "the"
			ph.definite = true
		}
	}

	var en []string
	if det != "" {
		en = append(en, det)
	}
	if very {
		en = append(en, "very")
	}
	if adj != nil {
		en = append(en, adj.en)
	}
	en = append(en, head)
	ph.subj = join(en)
	ph.obj = ph.subj
	ph.words = append(append(append(ph.words, pre...), n.form), post...)
	return ph
}

// possessorChance is how often a noun that can be possessed has a possessor:
// relatives almost always do.
func possessorChance(n *noun) float64 {
	if n.class&kin != 0 {
		return 0.85
	}
	return 0.22
}

// argument returns a subject or object phrase whose head has a feature in
// cls: a pronoun, a name or a noun phrase, avoiding the referent of avoid.
func (g *generator) argument(cls class, avoid *phrase, opt nounOptions) phrase {
	if cls&human != 0 {
		switch x := g.r.Float64(); {
		case x < 0.42:
			return g.pronounPhrase(g.pickPronoun(avoid))
		case x < 0.56:
			return g.namePhrase(avoid)
		case x < 0.60 && avoid == nil:
			return g.coordination()
		}
	}
	return g.nounPhrase(func(n *noun) bool {
		return n.class&cls != 0 && (avoid == nil || avoid.noun != n)
	}, opt)
}

// coordination returns two people joined by "ja" (and).
func (g *generator) coordination() phrase {
	a := g.namePhrase(nil)
	var b phrase
	if g.chance(0.5) {
		b = g.namePhrase(&a)
	} else {
		b = g.nounPhrase(func(n *noun) bool { return n.class&human != 0 }, nounOptions{possessor: true})
	}
	return phrase{
		words:    append(append(append([]string{}, a.words...), wAnd.form), b.words...),
		subj:     a.subj + " and " + b.subj,
		obj:      a.obj + " and " + b.obj,
		person:   3,
		plural:   true,
		definite: true,
	}
}

// place returns a phrase naming a place, followed by postposition post; en
// is its English with a preposition: prep if not empty, else the noun's own.
// The place has a feature in within, or is any place but water when within
// is zero. When adverbs is not empty, the place may be one of them ("kir"
// here, "wur" there), which take no postposition.
func (g *generator) place(within class, post word, prep string, adverbs []adverb) (words []string, en string) {
	if len(adverbs) > 0 && within == 0 && g.chance(0.12) {
		a := adverbs[g.zipf(len(adverbs), func(int) bool { return true })]
		return []string{a.form}, a.en
	}
	ph := g.nounPhrase(func(n *noun) bool {
		if post != wLoc && n.mass {
			return false // "to the house", not "to sand"
		}
		if within == 0 {
			return n.class&place != 0 && n.class&liquid == 0
		}
		return n.class&place != 0 && n.class&within != 0
	}, nounOptions{adjective: true, possessor: true, demonstr: true})
	if prep == "" {
		prep = ph.noun.prep
	}
	return append(ph.words, post.form), prep + " " + ph.obj
}
