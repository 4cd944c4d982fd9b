package segment

import (
	"fmt"
	"math"
	"math/rand/v2"
)

// CollocationSampler samples segmentations and their grouping into
// collocations under a Collocations model, with two moves per sweep:
//
//   - blocked resampling of one utterance at a time, as BlockedSampler
//     does for words: the utterance's collocations are removed, a grouping
//     and the analysis of every collocation are drawn by forward filtering
//     over collocation ends and backward sampling, a new collocation's
//     analysis from an inner lattice over its words, all under the
//     predictive probabilities of the rest of the corpus; a
//     Metropolis-Hastings test corrects for repeats within the utterance;
//   - relabelling of collocation tables, as many as there are, each chosen
//     uniformly: the table's words are removed, a new analysis of its
//     string is drawn from the word level and accepted by a
//     Metropolis-Hastings test, and the table's tokens all take it.
//     Without this move a table keeps the analysis it opened with for as
//     long as it has customers, and the sampler hardly mixes (Johnson &
//     Goldwater 2009, table label resampling).
//
// Relabelling is skipped on corpora with locks, whose tokens of one string
// may allow different analyses.
type CollocationSampler struct {
	Seg           *Segmentation
	Groups        []bool // Groups[i]: a collocation starts at unit i
	Model         *Collocations
	MaxWordLength int
	// SkipRelabel turns the relabelling move off, to measure what it buys.
	SkipRelabel bool

	logSpace bool // always use groupingLog (tests)
	general  bool // never use the indexed lattices (tests)

	journal journal
	acceptance

	// tokDish[a] is the dish of the collocation starting at unit a, for
	// every collocation of the current state (other entries are stale):
	// reading it is cheaper than finding a collocation's dish from its
	// string and word ends, which every utterance move and the
	// relabelling index would otherwise do for every collocation.
	tokDish []WordType

	// Scratch, reused across utterances.
	old, dishes []WordType
	starts      []int // starts[k]: the first unit of dishes[k]
	ends        []int
	newB, newG  []bool
	wp          []float64 // [m][k]: (1-g) G_w of word [m, m+k)
	inner       []float64 // [i][l]: sum over analyses of [i, i+l) of prod wp
	lx          []float64 // [i][l]: untempered proposal weight of collocation [i, i+l)
	lxInv       []float64 // lx to the power 1/T
	lg          []float64 // [i][l]: its tempered logarithm (log-space lattice only)
	fwd         []float64 // forward log probabilities, or 1/c_j (linear lattice)
	alive       []bool
	// The relabelling index: the collocation tokens (first units) of dish
	// d are those of lists[slot[d]-1], slot[d] = 0 for a dish with none.
	// Every list is a window of one arena, rebuilt each sweep by counting
	// sort; a list that outgrows its window moves to the arena's end with
	// twice the room. The arena keeps its buffer, so once it has grown to
	// what a sweep needs the index allocates nothing, though dish IDs keep
	// growing.
	slot   []int32
	lists  []tokenList
	arena  []int32
	tables []dishTable
}

// tokenList is one dish's collocation tokens in the relabelling index:
// arena[off : off+n], with room for size.
type tokenList struct{ off, n, size int32 }

// tokens returns the index in g.lists of dish d's list, giving it an
// empty one if it has none.
func (g *CollocationSampler) tokens(d WordType) int {
	if int(d) >= len(g.slot) {
		g.slot = append(g.slot, make([]int32, int(d)+1-len(g.slot))...)
	}
	if g.slot[d] == 0 {
		g.lists = append(g.lists, tokenList{off: int32(len(g.arena))})
		g.slot[d] = int32(len(g.lists))
	}
	return int(g.slot[d] - 1)
}

// reserve makes room in list k for extra more tokens, moving it to the
// end of the arena if it must.
func (g *CollocationSampler) reserve(k, extra int) {
	l := &g.lists[k]
	if int(l.n)+extra <= int(l.size) {
		return
	}
	size := max(2*(int(l.n)+extra), 4)
	off := len(g.arena)
	g.arena = append(g.arena, g.arena[l.off:l.off+l.n]...)
	g.arena = append(g.arena, make([]int32, size-int(l.n))...) // no allocation once the arena has room
	l.off, l.size = int32(off), int32(size)
}

type dishTable struct {
	d    WordType
	size int32
}

// NewCollocationSampler seats s, grouped by groups, in m and returns a
// sampler over all three. m must be empty; groups may be nil (every word
// its own collocation).
func NewCollocationSampler(s *Segmentation, groups []bool, m *Collocations, maxWordLength int, rng *rand.Rand) *CollocationSampler {
	if m.tokens != 0 {
		panic("segment: NewCollocationSampler needs an empty model")
	}
	if groups == nil {
		groups = append([]bool(nil), s.Boundary...)
	}
	m.AddSegmentation(s, groups, rng)
	g := &CollocationSampler{Seg: s, Groups: groups, Model: m, MaxWordLength: maxWordLength,
		tokDish: make([]WordType, len(s.Corpus.Units))}
	for u := 0; u < s.Corpus.Len(); u++ {
		g.ends = groupsOf(s, groups, u, g.ends, func(a int, ends []int) {
			g.tokDish[a], _ = m.findDish(a, ends)
		})
	}
	return g
}

// Check verifies the model's invariants (Collocations.Check) and that the
// sampler's record of each collocation's dish matches the state. Tests
// call it after sweeps.
func (g *CollocationSampler) Check() error {
	if err := g.Model.Check(); err != nil {
		return err
	}
	var err error
	for u := 0; u < g.Seg.Corpus.Len() && err == nil; u++ {
		g.ends = groupsOf(g.Seg, g.Groups, u, g.ends, func(a int, ends []int) {
			if d, ok := g.Model.findDish(a, ends); err == nil && (!ok || d != g.tokDish[a]) {
				err = fmt.Errorf("collocation at unit %d: recorded dish %d, state's %d (found %v)", a, g.tokDish[a], d, ok)
			}
		})
	}
	return err
}

// Sweep resamples every utterance once, in corpus order, then relabels
// every collocation table. At temperature T the target is raised to the
// power 1/T, and so are the proposal's collocation terms.
func (g *CollocationSampler) Sweep(temperature float64, rng *rand.Rand) {
	c := g.Seg.Corpus
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		if end-start > 1 {
			g.resample(u, start, end, temperature, rng)
		}
	}
	if c.Locks == nil && !g.SkipRelabel {
		g.relabel(temperature, rng)
	}
}

func growFloats(s []float64, n int) []float64 {
	if cap(s) < n {
		return make([]float64, n, 2*n)
	}
	return s[:n]
}

// wordLattice fills g.wp for the units [us, ue) with words of up to Kw
// units: (1-g) times the word level's predictive probability, 0 where
// locks forbid the word.
func (g *CollocationSampler) wordLattice(us, ue, Kw int) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	g.wp = growFloats(g.wp, (L+1)*(Kw+1))
	cw, tw := m.words.totals(0)
	pw := m.words.params
	newW := (pw.Concentration + pw.Discount*tw) / (cw + pw.Concentration)
	if cw == 0 {
		newW = 1
	}
	stay := 1 - m.GroupEnd
	if g.wordLatticeIndexed(us, ue, Kw, newW, stay) {
		return
	}
	for i := 0; i < L; i++ {
		for k := 1; k <= Kw; k++ {
			p := 0.0
			if i+k <= L && spanOK(c, us, ue, us+i, us+i+k) {
				if w, ok := m.Types.Lookup(c, us+i, us+i+k); ok {
					p = m.wordProb(w)
				} else {
					p = newW * m.Base.prob(c, us+i, us+i+k)
				}
				p *= stay
			}
			g.wp[i*(Kw+1)+k] = p
		}
	}
}

// wordLatticeIndexed is wordLattice for the common case, a corpus without
// locks whose span index covers every word proposed and a base with
// phonotactics: it walks each start's span-index entries in order and
// reads the word type, syllable count and shape from them, where the
// general loop finds each span's entry twice through function calls. It
// reports false, doing nothing, when the case does not hold.
func (g *CollocationSampler) wordLatticeIndexed(us, ue, Kw int, newW, stay float64) bool {
	m := g.Model
	c := m.Corpus
	t, ph := m.Types, m.Base.Shapes
	f := t.forms
	if g.general || c.Locks != nil || ph == nil || f == nil || ph.forms != f || f.max < Kw {
		return false
	}
	wordEnd := m.Base.WordEnd
	L := ue - us
	W := Kw + 1
	for i := 0; i < L; i++ {
		row := g.wp[i*W : (i+1)*W]
		n := min(Kw, L-i)
		o := int(f.off[us+i])
		ids := f.ids[o : o+n]
		counts := ph.count[o : o+n]
		shapes := ph.shape[o : o+n]
		for k := 1; k <= n; k++ {
			form := ids[k-1]
			var p float64
			if t.formHas[form>>6]&(1<<(form&63)) != 0 {
				p = m.wordProb(WordType(t.formType[form]-1)) * stay
			} else if syl := counts[k-1]; syl > 0 {
				// UniformBase.prob's products, in its order, so that both
				// paths give the same bits.
				b := shapes[k-1] * wordEnd
				for range syl - 1 {
					b *= 1 - wordEnd
				}
				p = newW * b * stay
			}
			row[k] = p
		}
		clear(row[n+1:])
	}
	return true
}

// collocationLattice fills g.lx for the utterance [us, ue): the
// untempered proposal weight of collocation [i, i+l), a new table's
// (newW times the inner sum) plus the join weight of its string's tables,
// over norm, times the utterance-continuation term cont.
func (g *CollocationSampler) collocationLattice(us, ue, Kg int, newW, norm, cont float64) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	for i := 0; i < L; i++ {
		for l := 1; l <= Kg; l++ {
			x := 0.0
			if i+l <= L && groupEdgeOK(c, us, ue, us+i) && groupEdgeOK(c, us, ue, us+i+l) {
				p := newW * g.inner[i*(Kg+1)+l]
				if s, ok := m.Strings.Lookup(c, us+i, us+i+l); ok {
					p += g.Model.joinWeight(s)
				}
				x = p / norm * cont
			}
			g.lx[i*(Kg+1)+l] = x
		}
	}
}

// collocationLatticeIndexed is collocationLattice for a corpus without
// locks whose span index covers every collocation, walking each start's
// index entries in order (as wordLatticeIndexed does), with the same
// products in the same order. It reports false, doing nothing, when the
// case does not hold.
func (g *CollocationSampler) collocationLatticeIndexed(us, ue, Kg int, newW, norm, cont float64) bool {
	m := g.Model
	t := m.Strings
	f := t.forms
	if g.general || m.Corpus.Locks != nil || f == nil || f.max < Kg {
		return false
	}
	L := ue - us
	W := Kg + 1
	for i := 0; i < L; i++ {
		row := g.lx[i*W : (i+1)*W]
		inner := g.inner[i*W : (i+1)*W]
		n := min(Kg, L-i)
		o := int(f.off[us+i])
		ids := f.ids[o : o+n]
		for l := 1; l <= n; l++ {
			p := newW * inner[l]
			if form := ids[l-1]; t.formHas[form>>6]&(1<<(form&63)) != 0 {
				p += m.joinWeight(WordType(t.formType[form] - 1))
			}
			row[l] = p / norm * cont
		}
		clear(row[n+1:])
	}
	return true
}

// innerFrom fills g.inner's row for start i (relative) up to Kg units:
// inner[i][l] sums, over the analyses of [i, i+l) into words, the product
// of their wp terms.
func (g *CollocationSampler) innerFrom(i, L, Kw, Kg int) {
	row := g.inner[i*(Kg+1) : (i+1)*(Kg+1)]
	row[0] = 1
	n := min(Kg, L-i)
	for l := 1; l <= n; l++ {
		s := 0.0
		for k := 1; k <= min(l, Kw); k++ {
			s += row[l-k] * g.wp[(i+l-k)*(Kw+1)+k]
		}
		row[l] = s
	}
	clear(row[n+1:])
}

// groupEdgeOK reports whether a collocation may start or end at unit a of
// the utterance [us, ue): not inside a run of units locked together.
func groupEdgeOK(c *Corpus, us, ue, a int) bool {
	return c.Locks == nil || a == us || a == ue || c.Locks[a] != Joined
}

// resample proposes a new segmentation and grouping of the utterance
// [us, ue).
func (g *CollocationSampler) resample(u, us, ue int, temperature float64, rng *rand.Rand) {
	m := g.Model
	c := m.Corpus
	L := ue - us
	Kw := longestProposed(c, g.MaxWordLength, us, ue)
	Kg := max(min(MaxCollocationLength, L), Kw)
	inv := 1 / temperature

	// Remove the current collocations, reading off their predictives. The
	// lattices must hold the current state, which may have longer words or
	// collocations than proposals make (a random start).
	g.old = g.old[:0]
	g.ends = groupsOf(g.Seg, g.Groups, u, g.ends, func(a int, ends []int) {
		g.old = append(g.old, g.tokDish[a])
		Kg = max(Kg, ends[len(ends)-1]-a)
		prev := a
		for _, e := range ends {
			Kw = max(Kw, e-prev)
			prev = e
		}
	})
	Kg = max(Kg, Kw)
	g.journal.reset()
	tokensBefore := m.tokens
	logOld := 0.0
	for k := len(g.old) - 1; k >= 0; k-- {
		logOld += m.remove(g.old[k], rng, &g.journal)
	}
	logOld += m.logUtteranceEnds(tokensBefore - m.tokens)

	// Lattices: words, analyses, collocations.
	g.wordLattice(us, ue, Kw)
	g.inner = growFloats(g.inner, (L+1)*(Kg+1))
	for i := 0; i < L; i++ {
		g.innerFrom(i, L, Kw, Kg)
	}
	cg, tg := m.groups.totals(0)
	pg := m.groups.params
	newG := pg.Concentration + pg.Discount*tg
	norm := cg + pg.Concentration
	if cg == 0 {
		newG, norm = 1, 1
	}
	h := m.Rho / 2
	cont := (float64(m.tokens) - float64(m.utterances-1) + h) / (float64(m.tokens) + m.Rho)
	baseScale := m.GroupEnd / (1 - m.GroupEnd)
	g.lx = growFloats(g.lx, (L+1)*(Kg+1))
	if !g.collocationLatticeIndexed(us, ue, Kg, newG*baseScale, norm, cont) {
		g.collocationLattice(us, ue, Kg, newG*baseScale, norm, cont)
	}
	g.newB = growBools(g.newB, L+1)
	g.newG = growBools(g.newG, L+1)
	clear(g.newB)
	clear(g.newG)
	var logQOld, logQNew float64
	ok := false
	if !g.logSpace {
		logQOld, logQNew, ok = g.groupingLinear(u, us, L, Kw, Kg, inv, newG*baseScale, rng)
	}
	if !ok {
		clear(g.newB)
		clear(g.newG)
		logQOld, logQNew = g.groupingLog(u, us, L, Kw, Kg, inv, newG*baseScale, rng)
	}

	// Seat the proposal, multiplying its predictives.
	mk := m.mark()
	tokensMid := m.tokens
	logNew := 0.0
	a := us
	g.ends = g.ends[:0]
	g.dishes = g.dishes[:0]
	g.starts = g.starts[:0]
	for i := us + 1; i <= ue; i++ {
		if i == ue || g.newB[i-us] || g.newG[i-us] {
			g.ends = append(g.ends, i)
		}
		if i == ue || g.newG[i-us] {
			d := m.internDish(a, g.ends)
			g.dishes = append(g.dishes, d)
			g.starts = append(g.starts, a)
			logNew += m.add(d, rng, &g.journal)
			a, g.ends = i, g.ends[:0]
		}
	}
	m.tokens, tokensMid = tokensMid, m.tokens // the end term sees the other utterances only
	logNew += m.logUtteranceEnds(tokensMid - m.tokens)
	m.tokens = tokensMid

	g.steps++
	logRatio := (logNew*inv - logQNew) - (logOld*inv - logQOld)
	if acceptMH(logRatio, rng) {
		for i := us + 1; i < ue; i++ {
			g.Seg.Boundary[i] = g.newB[i-us] || g.newG[i-us]
			g.Groups[i] = g.newG[i-us]
		}
		for k, a := range g.starts {
			g.tokDish[a] = g.dishes[k]
		}
		g.accepts++
		g.journal.releaseEmpty()
		return
	}
	g.journal.undo()
	m.recountStrings(g.old)
	m.recountStrings(g.dishes)
	m.tokens = tokensBefore
	m.forget(mk)
}

// acceptMH reports whether a Metropolis-Hastings test with log ratio
// logRatio accepts. It always takes one uniform from rng, so that how much
// of the stream a move uses does not depend on which side of 0 a ratio of
// 1 rounds to (a proposal drawn from the exact conditional).
func acceptMH(logRatio float64, rng *rand.Rand) bool {
	u := rng.Float64()
	return logRatio >= 0 || math.Log(u) < logRatio
}

func growBools(s []bool, n int) []bool {
	if cap(s) < n {
		return make([]bool, n, 2*n)
	}
	return s[:n]
}

// analysisWeights returns, for the collocation [a, ends[last]) analysed
// into words ending at ends, the join weight of dish d (0 if d < 0, no
// dish) and its new-table weight newW * prod wp.
func (g *CollocationSampler) analysisWeights(a int, ends []int, d WordType, Kw, us int, newW float64) (join, fresh float64) {
	m := g.Model
	fresh = newW
	prev := a
	for _, e := range ends {
		fresh *= g.wp[(prev-us)*(Kw+1)+e-prev]
		prev = e
	}
	if d >= 0 {
		if ds := m.groups.seating(0, d, false); ds != nil {
			join = float64(ds.customers) - m.Group.Discount*float64(ds.tables)
		}
	}
	return join, fresh
}

// logAnalysis returns the log probability that the backward pass picks
// the given analysis, of dish d, for the collocation [a, ends[last]).
func (g *CollocationSampler) logAnalysis(a int, ends []int, d WordType, Kw, Kg, us int, newW float64) float64 {
	m := g.Model
	b := ends[len(ends)-1]
	total := newW * g.inner[(a-us)*(Kg+1)+b-a]
	if s, ok := m.Strings.Lookup(m.Corpus, a, b); ok {
		total += g.Model.joinWeight(s)
	}
	join, fresh := g.analysisWeights(a, ends, d, Kw, us, newW)
	return math.Log((join + fresh) / total)
}

// sampleAnalysis draws an analysis of the collocation [a, b): an existing
// dish's with weight c - d t, or a fresh one from the inner lattice with
// total weight newW * inner. It marks the words' boundaries in newB and
// returns the log probability of the analysis drawn, which may be an
// existing dish's drawn afresh (logAnalysis counts both ways).
func (g *CollocationSampler) sampleAnalysis(a, b, Kw, Kg, us int, newW float64, rng *rand.Rand) float64 {
	m := g.Model
	row := g.inner[(a-us)*(Kg+1):]
	fresh := newW * row[b-a]
	join := 0.0
	s, known := m.Strings.Lookup(m.Corpus, a, b)
	if known {
		join = g.Model.joinWeight(s)
	}
	g.ends = g.ends[:0]
	var pick WordType = -1 // the dish joined, if one is
	if r := rng.Float64() * (join + fresh); r < join {
		d := m.Group.Discount
		for dish := m.firstAnalysis(s); dish >= 0; dish = m.nextAnalysis(dish) {
			if ds := m.groups.seating(0, dish, false); ds != nil {
				r -= float64(ds.customers) - d*float64(ds.tables)
				pick = dish
				if r < 0 {
					break
				}
			}
		}
		e := a
		for _, w := range m.dishWordsOf(pick) {
			e += int(m.Types.Length[w])
			g.ends = append(g.ends, e)
		}
	} else {
		for e := b - a; e > 0; {
			r := rng.Float64() * row[e]
			k := 1
			for ; k < min(e, Kw); k++ {
				r -= row[e-k] * g.wp[(a-us+e-k)*(Kw+1)+k]
				if r < 0 {
					break
				}
			}
			for g.wp[(a-us+e-k)*(Kw+1)+k] == 0 || row[e-k] == 0 {
				k-- // rounding past the last possible word
			}
			g.ends = append(g.ends, a+e)
			e -= k
		}
		for x, y := 0, len(g.ends)-1; x < y; x, y = x+1, y-1 {
			g.ends[x], g.ends[y] = g.ends[y], g.ends[x]
		}
	}
	for _, e := range g.ends[:len(g.ends)-1] {
		g.newB[e-us] = true
	}
	d := pick // a fresh analysis may still be an existing dish's
	if d < 0 && known {
		if x, ok := m.analysisOf(s, a, g.ends); ok {
			d = x
		}
	}
	jw, fw := g.analysisWeights(a, g.ends, d, Kw, us, newW)
	return math.Log((jw + fw) / (join + fresh))
}

// relabel proposes new analyses for collocation tables, as many times as
// there are tables, each time for a table chosen uniformly, each proposal
// accepted by a Metropolis-Hastings test.
func (g *CollocationSampler) relabel(temperature float64, rng *rand.Rand) {
	m := g.Model
	// Index the collocation tokens by dish, by their first unit: count
	// each dish's tokens, lay the lists out in the arena, fill them.
	clear(g.slot)
	g.lists = g.lists[:0]
	g.arena = g.arena[:0]
	c := m.Corpus
	forTokens := func(f func(a int, k int)) {
		for u := 0; u < c.Len(); u++ {
			start, end := c.Utterance(u)
			for a := start; a < end; a++ {
				if a == start || g.Groups[a] {
					f(a, g.tokens(g.tokDish[a]))
				}
			}
		}
	}
	forTokens(func(_ int, k int) { g.lists[k].size++ })
	total := int32(0)
	for k := range g.lists {
		g.lists[k].off = total
		total += g.lists[k].size
	}
	g.arena = append(g.arena, make([]int32, total)...)
	forTokens(func(a int, k int) {
		l := &g.lists[k]
		g.arena[l.off+l.n] = int32(a)
		l.n++
	})
	g.tables = g.tables[:0]
	for i, d := range m.groups.dishes {
		for _, sc := range m.groups.seats[i].hist {
			for range sc.Tables {
				g.tables = append(g.tables, dishTable{d, sc.Size})
			}
		}
	}
	// As many draws as there are tables, each of a table chosen uniformly:
	// the tables and their sizes are what relabelling never changes, so
	// the choice does not depend on the labels it samples (a scan in dish
	// order would).
	for range g.tables {
		k := rng.IntN(len(g.tables))
		t := g.tables[k]
		if d2, moved := g.relabelTable(t.d, t.size, 1/temperature, rng); moved {
			g.tables[k].d = d2
		}
	}
}

// relabelTable proposes a new analysis for one table of dish d seating
// size customers.
func (g *CollocationSampler) relabelTable(d WordType, size int32, inv float64, rng *rand.Rand) (WordType, bool) {
	m := g.Model
	s := m.dishString[d]
	if m.Strings.Length[s] == 1 {
		return d, false // one unit: one analysis
	}
	ds := m.groups.seating(0, d, false)
	if ds == nil || !hasSize(ds, size) {
		panic("segment: relabelling a table that is not there")
	}
	a := int(m.Strings.First[s])
	b := a + int(m.Strings.Length[s])
	L := b - a
	Kw := min(L, g.MaxWordLength)
	if Kw <= 0 {
		Kw = L
	}
	for _, w := range m.dishWordsOf(d) {
		Kw = max(Kw, int(m.Types.Length[w]))
	}
	g.journal.reset()
	mk := m.mark()
	logOld := m.removeWords(d, rng, &g.journal)
	g.wordLattice(a, b, Kw)
	g.inner = growFloats(g.inner, (L+1)*(L+1))
	g.innerFrom(0, L, Kw, L)
	z := g.inner[L]
	// Old analysis's proposal probability.
	logQOld := -math.Log(z)
	prev := a
	for _, w := range m.dishWordsOf(d) {
		k := int(m.Types.Length[w])
		logQOld += math.Log(g.wp[(prev-a)*(Kw+1)+k])
		prev += k
	}
	// Draw a new one backward.
	g.ends = g.ends[:0]
	logQNew := -math.Log(z)
	for e := L; e > 0; {
		r := rng.Float64() * g.inner[e]
		k := 1
		for ; k < min(e, Kw); k++ {
			r -= g.inner[e-k] * g.wp[(e-k)*(Kw+1)+k]
			if r < 0 {
				break
			}
		}
		for g.wp[(e-k)*(Kw+1)+k] == 0 || g.inner[e-k] == 0 {
			k--
		}
		logQNew += math.Log(g.wp[(e-k)*(Kw+1)+k])
		g.ends = append(g.ends, a+e)
		e -= k
	}
	for x, y := 0, len(g.ends)-1; x < y; x, y = x+1, y-1 {
		g.ends[x], g.ends[y] = g.ends[y], g.ends[x]
	}
	d2 := m.internDish(a, g.ends)
	logNew := m.addWords(d2, rng, &g.journal)
	logRatio := (logNew*inv - logQNew) - (logOld*inv - logQOld)
	if !acceptMH(logRatio, rng) {
		g.journal.undo()
		m.forget(mk)
		return d, false
	}
	g.journal.releaseEmpty()
	if d2 == d {
		return d, false
	}
	m.groups.moveTable(0, d, d2, size)
	// The table's customers are size of d's tokens, uniformly: tokens
	// are exchangeable given the histogram.
	to := g.tokens(d2)
	g.reserve(to, int(size)) // before from's tokens are read: it may move the arena
	from := g.lists[g.tokens(d)]
	toks := g.arena[from.off : from.off+from.n]
	for x := 0; x < int(size); x++ {
		y := x + rng.IntN(len(toks)-x)
		toks[x], toks[y] = toks[y], toks[x]
		p := int(toks[x])
		for i := p + 1; i < p+L; i++ {
			g.Seg.Boundary[i] = false
		}
		for _, e := range g.ends[:len(g.ends)-1] {
			g.Seg.Boundary[p+e-a] = true
		}
		t := &g.lists[to]
		g.arena[t.off+t.n] = toks[x]
		t.n++
		g.tokDish[p] = d2
	}
	// d keeps its other tokens: the moved ones were swapped to the front.
	f := &g.lists[g.tokens(d)]
	f.off += size
	f.n -= size
	f.size -= size
	return d2, true
}

func hasSize(ds *dishSeating, size int32) bool {
	for _, sc := range ds.hist {
		if sc.Size == size {
			return true
		}
	}
	return false
}

// moveTable moves one table of the given size from dish from to dish to,
// keeping its customers: a change of the table's label.
func (r *restaurants) moveTable(ctx int32, from, to WordType, size int32) {
	dt := r.seating(ctx, to, true) // may grow r.seats: look up from after
	r.roomFor(dt)
	dt.bump(size, +1)
	dt.tables++
	dt.customers += size
	df := r.seating(ctx, from, false)
	df.bump(size, -1)
	df.tables--
	df.customers -= size
	r.changes++
	if df.customers == 0 {
		i, _ := r.index.get(seatKey(ctx, from))
		r.release(i)
	}
}

// groupingLinear draws the utterance's collocation ends from the proposal
// whose collocation [i, i+l) has weight x = g.lx[i][l]^inv, and for each
// one its analysis, recording them in g.newG and g.newB. It returns the
// proposal's log probability of the current grouping and analysis (which
// may be -Inf) and of the drawn one. The forward variables are scaled as in
// BlockedSampler.unigramProposalLinear: with c_j their sum at j, every
// scaled variable is 1 where a collocation can end and 0 where none can, a
// collocation [j-l, j) enters position j's sum with weight x times
// prod_{j-l<t<j} 1/c_t, and log Z = sum_j log c_j. ok is false, with
// nothing drawn, if a sum leaves the floating-point range; groupingLog then
// does the same in log space.
func (g *CollocationSampler) groupingLinear(u, us, L, Kw, Kg int, inv, newW float64, rng *rand.Rand) (logQOld, logQNew float64, ok bool) {
	W := Kg + 1
	x := g.lx
	if inv != 1 {
		g.lxInv = growFloats(g.lxInv, len(x))
		for i, v := range x[:L*W] {
			g.lxInv[i] = 0
			if v > 0 {
				g.lxInv[i] = temperWeight(v, inv)
			}
		}
		x = g.lxInv
	}
	g.fwd = growFloats(g.fwd, L+1)
	g.alive = growBools(g.alive, L+1)
	invc, alive := g.fwd, g.alive
	invc[0], alive[0] = 1, true
	logZ := 0.0
	for j := 1; j <= L; j++ {
		raw, ratio := 0.0, 1.0
		for l := 1; l <= min(j, Kg); l++ {
			if l > 1 {
				ratio *= invc[j-l+1]
			}
			if alive[j-l] {
				raw += x[(j-l)*W+l] * ratio
			}
		}
		if math.IsInf(ratio, 1) || math.IsInf(raw, 1) || math.IsNaN(raw) {
			return 0, 0, false
		}
		alive[j] = raw > 0
		invc[j] = 1
		if alive[j] {
			invc[j] = 1 / raw
			logZ += math.Log(raw)
		}
	}
	if !alive[L] {
		return 0, 0, false
	}

	// The current grouping's proposal probability.
	logQOld = -logZ
	g.ends = groupsOf(g.Seg, g.Groups, u, g.ends, func(a int, ends []int) {
		i, l := a-us, ends[len(ends)-1]-a
		logQOld += math.Log(x[i*W+l]) + g.logAnalysis(a, ends, g.tokDish[a], Kw, Kg, us, newW)
	})

	// Backward sampling: at j, l has probability x[j-l][l] times
	// prod_{j-l<t<=j} 1/c_t over the live starts, and these sum to 1.
	logQNew = -logZ
	for j := L; j > 0; {
		r := rng.Float64()
		ratio := invc[j]
		l, last := 0, 0
		for k := 1; k <= min(j, Kg); k++ {
			if k > 1 {
				ratio *= invc[j-k+1]
			}
			if !alive[j-k] || x[(j-k)*W+k] == 0 {
				continue
			}
			last = k
			if r -= x[(j-k)*W+k] * ratio; r < 0 {
				l = k
				break
			}
		}
		if l == 0 {
			l = last // rounding
		}
		i := j - l
		logQNew += math.Log(x[i*W+l])
		g.newG[i] = true
		logQNew += g.sampleAnalysis(us+i, us+j, Kw, Kg, us, newW, rng)
		j = i
	}
	return logQOld, logQNew, true
}

// groupingLog is groupingLinear in log space, for utterances whose sums
// leave the floating-point range.
func (g *CollocationSampler) groupingLog(u, us, L, Kw, Kg int, inv, newW float64, rng *rand.Rand) (logQOld, logQNew float64) {
	W := Kg + 1
	g.lg = growFloats(g.lg, (L+1)*W)
	for i := range g.lg[:L*W] {
		g.lg[i] = math.Inf(-1)
		if v := g.lx[i]; v > 0 {
			// The same tempered weights as groupingLinear's: v^inv lies
			// between v and 1, so it is never out of range.
			if inv != 1 {
				v = temperWeight(v, inv)
			}
			g.lg[i] = math.Log(v)
		}
	}
	g.fwd = growFloats(g.fwd, L+1)
	g.fwd[0] = 0
	for j := 1; j <= L; j++ {
		acc := math.Inf(-1)
		for l := 1; l <= min(j, Kg); l++ {
			acc = logAddExp(acc, g.fwd[j-l]+g.lg[(j-l)*W+l])
		}
		g.fwd[j] = acc
	}

	logQOld = -g.fwd[L]
	g.ends = groupsOf(g.Seg, g.Groups, u, g.ends, func(a int, ends []int) {
		i, l := a-us, ends[len(ends)-1]-a
		logQOld += g.lg[i*W+l] + g.logAnalysis(a, ends, g.tokDish[a], Kw, Kg, us, newW)
	})

	logQNew = -g.fwd[L]
	for j := L; j > 0; {
		r := math.Log(rng.Float64()) + g.fwd[j]
		acc := math.Inf(-1)
		l := 1
		for ; l < min(j, Kg); l++ {
			acc = logAddExp(acc, g.fwd[j-l]+g.lg[(j-l)*W+l])
			if acc > r && g.lg[(j-l)*W+l] > math.Inf(-1) {
				break
			}
		}
		for g.lg[(j-l)*W+l] == math.Inf(-1) { // rounding past the last possible one
			l--
		}
		i := j - l
		logQNew += g.lg[i*W+l]
		g.newG[i] = true
		logQNew += g.sampleAnalysis(us+i, us+j, Kw, Kg, us, newW, rng)
		j = i
	}
	return logQOld, logQNew
}
