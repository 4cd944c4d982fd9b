package main

// clause is one Kelaru clause, held as constituents so that it can be put
// into Kelaru and English word order.
type clause struct {
	time        *timeWord
	timeFront   bool // English puts the time adverb first
	subject     *phrase
	dropSubject bool // Kelaru leaves the pronoun out; English keeps it
	also        bool
	with        *phrase
	object      *phrase
	placeWords  []string
	placeEN     string
	adverb      *adverb
	focus       []string // question words, just before the verb
	negative    bool
	v           *verb    // nil for a copular clause
	predWords   []string // copular predicate
	predEN      string
	tense       tense
	progressive bool
}

// kelaru returns the words of c in Kelaru order: time, subject, "bi",
// comitative, object, place, manner adverb, question words, negation,
// verb or predicate with copula, tense particle.
func (c *clause) kelaru() []string {
	var w []string
	if c.time != nil {
		w = append(w, c.time.form)
	}
	if c.subject != nil && !c.dropSubject {
		w = append(w, c.subject.words...)
	}
	if c.also {
		w = append(w, wAlso.form)
	}
	if c.with != nil {
		w = append(append(w, c.with.words...), wCom.form)
	}
	if c.object != nil {
		w = append(w, c.object.words...)
		if c.object.definite {
			w = append(w, wObj.form)
		}
	}
	w = append(w, c.placeWords...)
	if c.adverb != nil {
		w = append(w, c.adverb.form)
	}
	if c.v == nil {
		w = append(w, c.predWords...)
	}
	w = append(w, c.focus...)
	if c.negative {
		w = append(w, wNeg.form)
	}
	if c.v != nil {
		w = append(w, c.v.form)
	} else {
		w = append(w, wCop.form)
	}
	switch c.tense {
	case past:
		w = append(w, wPast.form)
	case future:
		w = append(w, wFut.form)
	}
	return w
}

func (c *clause) agreement() agreement {
	return agreement{person: c.subject.person, plural: c.subject.plural}
}

// group returns the English verb group of c with agreement a.
func (c *clause) group(a agreement) verbGroup {
	if c.v == nil {
		return copula(c.tense, a, c.negative, c.predEN)
	}
	return lexical(c.v, c.tense, c.progressive, a, c.negative)
}

// complements returns the English words after the verb.
func (c *clause) complements() []string {
	var w []string
	if c.object != nil {
		w = append(w, c.object.obj)
	}
	w = append(w, c.placeEN)
	if c.with != nil {
		w = append(w, "with", c.with.obj)
	}
	if c.adverb != nil {
		w = append(w, c.adverb.en)
	}
	return w
}

// tail returns the English time adverb and "too" at the end of a clause.
func (c *clause) tail(question bool) []string {
	var w []string
	if c.time != nil && (question || !c.timeFront) {
		w = append(w, c.time.en)
	}
	if c.also {
		w = append(w, "too")
	}
	return w
}

// statement returns c as an English statement, without final punctuation.
func (c *clause) statement() []string {
	var w []string
	if c.time != nil && c.timeFront {
		w = append(w, c.time.en+",")
	}
	g := c.group(c.agreement())
	w = append(w, c.subject.subj, g.aux)
	w = append(w, g.rest...)
	w = append(w, c.complements()...)
	return append(w, c.tail(false)...)
}

// predicate returns c as an English predicate without its subject, as the
// second half of "she cooked the fish and then ate it": a future loses its
// "will", which the first half already has.
func (c *clause) predicate() []string {
	g := c.group(c.agreement())
	var w []string
	if !(c.tense == future && g.aux == "will") {
		w = append(w, g.aux)
	}
	w = append(w, g.rest...)
	w = append(w, c.complements()...)
	return append(w, c.tail(false)...)
}

// question returns c as an English question with the auxiliary before the
// subject, after wh if given ("what did you eat").
func (c *clause) question(wh string) []string {
	a := c.agreement()
	g := c.group(a)
	w := []string{wh, questionAux(g, c.v, c.tense, c.progressive, a), c.subject.subj}
	w = append(w, g.inverted...)
	w = append(w, c.complements()...)
	return append(w, c.tail(true)...)
}

// whoQuestion returns c as an English question about its subject.
func (c *clause) whoQuestion() []string {
	g := c.group(agreement{person: 3})
	w := []string{"who", g.aux}
	w = append(w, g.rest...)
	w = append(w, c.complements()...)
	return append(w, c.tail(true)...)
}
