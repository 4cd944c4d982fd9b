package segment

import (
	"fmt"
	"math"
	"math/rand/v2"

	"gonum.org/v1/gonum/stat/distuv"
)

// MaxCollocationLength is the most units a collocation may span. It keeps
// the proposal's products of word probabilities far from underflow; longer
// collocations are never proposed, so the sampler is exact for the model
// truncated to shorter ones.
const MaxCollocationLength = 64

// Collocations is a two-level word model: an utterance is a sequence of
// collocations, words that recur together ("what's that", "do you"), drawn
// from a Pitman-Yor process over word sequences; a collocation's words come
// from a Pitman-Yor process over words whose base is P0. The collocation
// level's base draws k words, k with probability g(1-g)^(k-1), each from
// the word level, as the collocation adaptor grammar of Johnson (2008) and
// Johnson & Goldwater (2009) does. Words that keep company thus need not be
// fused into one word to be explained together, which is what pushes the
// unigram model to under-segment, and need not be split into pieces that
// predict each other, which is what the bigram model does instead.
//
// A collocation dish is a unit string together with its analysis into
// words: the same string with two analyses is two dishes. Utterance ends
// work as in the unigram model, per collocation: each collocation ends its
// utterance with a probability that has a Beta(Rho/2, Rho/2) prior,
// integrated out. Seating is tracked exactly (Chinese restaurant
// franchise, table sizes as histograms).
type Collocations struct {
	Word     PitmanYor // the word level's discount and concentration
	Group    PitmanYor // the collocation level's
	Base     UniformBase
	GroupEnd float64 // g: a collocation's number of words is geometric
	Rho      float64

	Corpus *Corpus
	Types  *Types // word types
	// Strings interns collocations' unit strings, so that a span's
	// analyses are found without building a key.
	Strings *Types

	words, groups *restaurants
	tokens        int // collocation tokens
	utterances    int

	lengthG, logG, log1mG float64 // see logLengthTerm

	// base[w] is exp(Types.LogBase[w]), kept so that the lattices, which
	// ask for the predictive of every span's word, take no exponential.
	base []float64

	// Collocation dishes: dishString[d] is the string type of dish d and
	// its words are dishWords[dishOff[d]:dishOff[d+1]]. The dishes of
	// string type s form a list, newest first: firstDish[s] and
	// nextDish[d] hold a dish plus one, or 0 at the end (see firstAnalysis).
	// A dish is found by comparing its word lengths with those of the few
	// other analyses of its string, with no key to build or map to search,
	// and a new dish or string allocates nothing once the arrays have
	// grown.
	dishString []WordType
	dishOff    []int32
	dishWords  []WordType
	firstDish  []int32
	nextDish   []int32

	// strCustomers[s] and strTables[s] sum the collocation level's
	// customers and tables over the dishes of string type s, so the weight
	// of joining an existing table of s, customers - discount x tables, is
	// read without visiting its dishes. add and remove keep them; after a
	// journal undo, recountStrings restores them.
	strCustomers []int32
	strTables    []int32
}

// NewCollocations returns an empty collocation model over c's words.
func NewCollocations(c *Corpus, word, group PitmanYor, base UniformBase, groupEnd float64) *Collocations {
	m := &Collocations{Word: word, Group: group, Base: base, GroupEnd: groupEnd, Rho: 2,
		Corpus: c, Types: NewTypes(), Strings: NewTypes(), utterances: c.Len(),
		dishOff: []int32{0}}
	m.words = newRestaurants(&m.Word)
	m.groups = newRestaurants(&m.Group)
	return m
}

// internWord returns the word type of span [a, b).
func (m *Collocations) internWord(a, b int) WordType {
	id, isNew := m.Types.Intern(m.Corpus, a, b)
	if isNew {
		lp := m.Base.LogProb(m.Corpus, a, b)
		m.Types.LogBase[id] = lp
		m.base = append(m.base, math.Exp(lp)) // new IDs are always the next
	}
	return id
}

// refreshBase recomputes base after Types.LogBase has changed (a new p#).
func (m *Collocations) refreshBase() {
	m.base = m.base[:0]
	for _, lp := range m.Types.LogBase {
		m.base = append(m.base, math.Exp(lp))
	}
}

// internDish returns the collocation dish of the span [a, ends[last]) whose
// words end at ends (ascending, the last one the collocation's end).
func (m *Collocations) internDish(a int, ends []int) WordType {
	s, isNew := m.Strings.Intern(m.Corpus, a, ends[len(ends)-1])
	if isNew {
		m.firstDish = append(m.firstDish, 0)
		m.strCustomers = append(m.strCustomers, 0)
		m.strTables = append(m.strTables, 0)
	} else if d, ok := m.analysisOf(s, a, ends); ok {
		return d
	}
	d := WordType(len(m.dishString))
	m.dishString = append(m.dishString, s)
	prev := a
	for _, e := range ends {
		m.dishWords = append(m.dishWords, m.internWord(prev, e))
		prev = e
	}
	m.dishOff = append(m.dishOff, int32(len(m.dishWords)))
	m.nextDish = append(m.nextDish, m.firstDish[s])
	m.firstDish[s] = int32(d) + 1
	return d
}

// findDish returns the dish internDish would return, if it exists,
// creating nothing.
func (m *Collocations) findDish(a int, ends []int) (WordType, bool) {
	s, ok := m.Strings.Lookup(m.Corpus, a, ends[len(ends)-1])
	if !ok {
		return 0, false
	}
	return m.analysisOf(s, a, ends)
}

// analysisOf returns the dish of string type s whose words end at ends
// (the string starting at a), if there is one.
func (m *Collocations) analysisOf(s WordType, a int, ends []int) (WordType, bool) {
next:
	for d := m.firstAnalysis(s); d >= 0; d = m.nextAnalysis(d) {
		ws := m.dishWordsOf(d)
		if len(ws) != len(ends) {
			continue
		}
		e := a
		for k, w := range ws {
			if e += int(m.Types.Length[w]); e != ends[k] {
				continue next
			}
		}
		return d, true
	}
	return 0, false
}

// firstAnalysis returns the newest dish of string type s, or -1.
func (m *Collocations) firstAnalysis(s WordType) WordType { return WordType(m.firstDish[s] - 1) }

// nextAnalysis returns the dish after d in its string's list, or -1.
func (m *Collocations) nextAnalysis(d WordType) WordType { return WordType(m.nextDish[d] - 1) }

// recountStrings recomputes strCustomers and strTables of the string
// types of dishes ds from the collocation level's seating, after a journal
// undo has restored it behind add's and remove's back.
func (m *Collocations) recountStrings(ds []WordType) {
	for _, d := range ds {
		s := m.dishString[d]
		m.strCustomers[s], m.strTables[s] = m.countString(s)
	}
}

// countString sums the collocation level's customers and tables over the
// dishes of string type s.
func (m *Collocations) countString(s WordType) (customers, tables int32) {
	for d := m.firstAnalysis(s); d >= 0; d = m.nextAnalysis(d) {
		if st := m.groups.seating(0, d, false); st != nil {
			customers += st.customers
			tables += st.tables
		}
	}
	return customers, tables
}

// joinWeight returns the collocation level's weight of joining an existing
// table of string type s, summed over its analyses: sum (c - d t).
func (m *Collocations) joinWeight(s WordType) float64 {
	return float64(m.strCustomers[s]) - m.Group.Discount*float64(m.strTables[s])
}

// dishWordsOf returns the words of dish d, in order.
func (m *Collocations) dishWordsOf(d WordType) []WordType {
	return m.dishWords[m.dishOff[d]:m.dishOff[d+1]]
}

// collocationMarks records the sizes of everything a rejected proposal may
// have grown, for forget.
type collocationMarks struct{ types, strings, dishes, wordSeats, groupSeats int }

func (m *Collocations) mark() collocationMarks {
	return collocationMarks{m.Types.Len(), m.Strings.Len(), len(m.dishString), m.words.markSeats(), m.groups.markSeats()}
}

// forget drops the types, dishes and seats created since mk, after a
// rejected proposal has been undone.
func (m *Collocations) forget(mk collocationMarks) {
	for d := len(m.dishString) - 1; d >= mk.dishes; d-- {
		if s := m.dishString[d]; int(s) < mk.strings {
			m.firstDish[s] = m.nextDish[d] // d, the newest, heads its list
		}
	}
	m.nextDish = m.nextDish[:mk.dishes]
	m.dishString = m.dishString[:mk.dishes]
	m.dishOff = m.dishOff[:mk.dishes+1]
	m.dishWords = m.dishWords[:m.dishOff[mk.dishes]]
	m.firstDish = m.firstDish[:mk.strings]
	m.strCustomers = m.strCustomers[:mk.strings]
	m.strTables = m.strTables[:mk.strings]
	m.base = m.base[:mk.types]
	m.Strings.Truncate(mk.strings)
	m.Types.Truncate(mk.types)
	m.words.dropSeats(mk.wordSeats)
	m.groups.dropSeats(mk.groupSeats)
}

// wordProb returns the word level's predictive probability of w.
func (m *Collocations) wordProb(w WordType) float64 {
	return m.words.predictive(0, w, m.base[w])
}

// logLengthTerm returns log g(1-g)^(k-1), the base's term for k words.
// The two logarithms are kept for the last g seen, since every seating
// asks for them.
func (m *Collocations) logLengthTerm(k int) float64 {
	if m.GroupEnd != m.lengthG {
		m.lengthG, m.logG, m.log1mG = m.GroupEnd, math.Log(m.GroupEnd), math.Log1p(-m.GroupEnd)
	}
	return m.logG + float64(k-1)*m.log1mG
}

// logGroupBase returns log of the collocation level's base probability of
// dish d given the word level's current seating: the length term times
// each word's predictive probability.
func (m *Collocations) logGroupBase(d WordType) float64 {
	ws := m.dishWordsOf(d)
	lp := m.logLengthTerm(len(ws))
	p := 1.0
	for _, w := range ws {
		p *= m.wordProb(w)
	}
	return lp + math.Log(p)
}

// add seats one collocation token of dish d and returns its log
// predictive probability just before it was added; if it opened a table,
// times the ratio of its words' sequential probabilities (each read just
// before it was seated) to the base probability the level used, which
// keeps a sampler's product of sequential terms the exact joint of
// segmentation and seating (the same correction as Words.addBase).
func (m *Collocations) add(d WordType, rng *rand.Rand, j *journal) float64 {
	m.tokens++
	lb := m.logGroupBase(d)
	p, opened := m.groups.addCustomer(0, d, math.Exp(lb), rng, j)
	s := m.dishString[d]
	m.strCustomers[s]++
	if opened {
		m.strTables[s]++
	}
	lp := math.Log(p)
	if opened {
		lp += m.addWords(d, rng, j) - lb
	}
	return lp
}

// remove takes away one collocation token of dish d and returns the value
// add would return for the same token and seating.
func (m *Collocations) remove(d WordType, rng *rand.Rand, j *journal) float64 {
	m.tokens--
	ds, closed := m.groups.removeCustomer(0, d, rng, j)
	s := m.dishString[d]
	m.strCustomers[s]--
	if closed {
		m.strTables[s]--
	}
	seq := 0.0
	if closed {
		seq = m.removeWords(d, rng, j)
	}
	lb := m.logGroupBase(d)
	lp := math.Log(m.groups.predictiveAt(0, ds, math.Exp(lb)))
	if closed {
		lp += seq - lb
	}
	return lp
}

// removeWords takes d's words out of the word level, last first, and
// returns the log of their sequential probabilities read as they leave
// (each just after it left) times the length term.
func (m *Collocations) removeWords(d WordType, rng *rand.Rand, j *journal) float64 {
	ws := m.dishWordsOf(d)
	seq := m.logLengthTerm(len(ws))
	for k := len(ws) - 1; k >= 0; k-- {
		w := ws[k]
		wds, _ := m.words.removeCustomer(0, w, rng, j)
		seq += math.Log(m.words.predictiveAt(0, wds, m.base[w]))
	}
	return seq
}

// addWords seats d's words at the word level, first first, and returns
// the log of their sequential probabilities times the length term.
func (m *Collocations) addWords(d WordType, rng *rand.Rand, j *journal) float64 {
	ws := m.dishWordsOf(d)
	seq := m.logLengthTerm(len(ws))
	for _, w := range ws {
		pw, _ := m.words.addCustomer(0, w, m.base[w], rng, j)
		seq += math.Log(pw)
	}
	return seq
}

// logEnds returns the log Beta-Bernoulli probability of the utterance-end
// decisions of n collocation tokens in the corpus's utterances.
func (m *Collocations) logEnds(n int) float64 {
	h := m.Rho / 2
	U := float64(m.utterances)
	return lbeta(U+h, float64(n)-U+h) - lbeta(h, h)
}

// logUtteranceEnds returns the log probability of one utterance's n
// end decisions given the other utterances' collocations (the model's
// current tokens), as Words.logUtteranceEnds does for words.
func (m *Collocations) logUtteranceEnds(n int) float64 {
	return logEndsGiven(n, m.tokens, m.utterances, m.Rho)
}

// groupsOf calls f with the span and word ends of every collocation of
// utterance u in s, in order. groups[i] marks a collocation starting at
// unit i; every utterance start is one, and a collocation start is always
// a word boundary.
func groupsOf(s *Segmentation, groups []bool, u int, ends []int, f func(a int, ends []int)) []int {
	start, end := s.Corpus.Utterance(u)
	a := start
	ends = ends[:0]
	for i := start + 1; i <= end; i++ {
		if i == end || s.Boundary[i] {
			ends = append(ends, i)
		}
		if i == end || groups[i] {
			f(a, ends)
			a, ends = i, ends[:0]
		}
	}
	return ends
}

// AddSegmentation seats every collocation of s grouped by groups, in
// corpus order. m must be empty.
func (m *Collocations) AddSegmentation(s *Segmentation, groups []bool, rng *rand.Rand) {
	var ends []int
	for u := 0; u < m.Corpus.Len(); u++ {
		ends = groupsOf(s, groups, u, ends, func(a int, ends []int) {
			m.add(m.internDish(a, ends), rng, nil)
		})
	}
}

// LogJoint returns the log probability of the segmentation, grouping and
// seating: both levels' seating probabilities, the length term and words'
// draws of every collocation table, the base probability of every word
// table, and the utterance-end term.
func (m *Collocations) LogJoint() float64 {
	lp := m.groups.logSeatingProb(m.Group.Discount, m.Group.Concentration)
	lp += m.words.logSeatingProb(m.Word.Discount, m.Word.Concentration)
	for i, d := range m.groups.dishes {
		if t := m.groups.seats[i].tables; t > 0 {
			lp += float64(t) * m.logLengthTerm(len(m.dishWordsOf(d)))
		}
	}
	for i, w := range m.words.dishes {
		if t := m.words.seats[i].tables; t > 0 {
			lp += float64(t) * m.Types.LogBase[w]
		}
	}
	return lp + m.logEnds(m.tokens)
}

// Tokens returns the number of word tokens.
func (m *Collocations) Tokens() int {
	n := 0
	for i, d := range m.groups.dishes {
		if c := m.groups.seats[i].customers; c > 0 { // a free slot's dish may be forgotten
			n += int(c) * len(m.dishWordsOf(d))
		}
	}
	return n
}

// SampleHyperparameters resamples every hyperparameter not marked fixed:
// both levels' discounts and concentrations (Fixed.Discount0 and Alpha0
// for the word level, Discount1 and Alpha1 for the collocation level), p#
// and g. g is conjugate like p#: every collocation table of k words
// contributes g(1-g)^(k-1), so under a Beta(1,1) prior g | seating ~
// Beta(1 + T, 1 + sum (k-1)) over the T collocation tables.
func (m *Collocations) SampleHyperparameters(fixed Fixed, rng *rand.Rand) {
	sampleLevel(m.words, &m.Word, fixed.Discount0, fixed.Alpha0, rng)
	sampleLevel(m.groups, &m.Group, fixed.Discount1, fixed.Alpha1, rng)
	if !fixed.WordEnd {
		m.Base = resampleWordEnd(m.Base, m.words, m.Types, m.Corpus, rng)
		m.refreshBase()
	}
	if !fixed.GroupEnd {
		tables, extra := 0.0, 0.0
		for i, d := range m.groups.dishes {
			if t := float64(m.groups.seats[i].tables); t > 0 {
				tables += t
				extra += t * float64(len(m.dishWordsOf(d))-1)
			}
		}
		m.GroupEnd = betaDraw(1+tables, 1+extra, rng)
	}
}

// Check verifies the seating's invariants: each level's histograms agree
// with its totals and the word level's customers are exactly the words of
// the collocation level's tables. Tests call it after mutations.
func (m *Collocations) Check() error {
	if err := m.groups.check(); err != nil {
		return fmt.Errorf("collocation level: %w", err)
	}
	if err := m.words.check(); err != nil {
		return fmt.Errorf("word level: %w", err)
	}
	want := map[uint64]int32{}
	m.groups.forEach(func(_ int32, d WordType, ds *dishSeating) {
		for _, w := range m.dishWordsOf(d) {
			want[seatKey(0, w)] += ds.tables
		}
	})
	if err := m.words.checkCustomers(want); err != nil {
		return fmt.Errorf("word level against the collocation tables: %w", err)
	}
	for s := range m.firstDish {
		c, t := m.countString(WordType(s))
		if c != m.strCustomers[s] || t != m.strTables[s] {
			return fmt.Errorf("string %d: %d customers and %d tables over its dishes, counted %d and %d",
				s, c, t, m.strCustomers[s], m.strTables[s])
		}
	}
	if got := int(m.groups.customers0()); got != m.tokens {
		return fmt.Errorf("%d collocation customers, token count %d", got, m.tokens)
	}
	return nil
}

// customers0 returns the number of customers of context 0.
func (r *restaurants) customers0() int32 {
	if len(r.customers) == 0 {
		return 0
	}
	return r.customers[0]
}

// betaDraw returns a Beta(a, b) draw from rng, kept inside (0, 1).
func betaDraw(a, b float64, rng *rand.Rand) float64 {
	x := distuv.Beta{Alpha: a, Beta: b, Src: rng}.Rand()
	return math.Min(math.Max(x, 1e-6), 1-1e-6)
}
