package segment

import (
	"fmt"
	"math"
	"math/rand/v2"
)

// NgramBase is a base distribution over words that is learned along with
// the words: a hierarchical Pitman-Yor language model over units (Teh 2006)
// nested under the word model, as in Mochihashi, Yamada & Ueda (2009). For a
// word u_1 .. u_L of order n,
//
//	P0(w) = prod_{i=1}^{L+1} P(u_i | u_{i-n+1} .. u_{i-1})
//
// where u_{L+1} is a word-end symbol and positions before the word hold a
// word-start symbol. The distribution in a context of k units is a
// Pitman-Yor process whose base is the distribution in the context of its
// last k-1 units, down to the empty context, whose base is uniform over the
// inventory and the end symbol: 1/(V+1). All contexts of k units share the
// parameters Levels[k]. P0 is deficient: the end symbol right after the
// word start would make an empty word, which is never drawn, so P0 sums to
// less than one over words. The posterior over segmentations, which
// normalises the joint, is still well defined, and the sampler and
// ExactLogJoint agree on it.
//
// The customers are the units of the dishes of the word model's
// unigram-level tables: when a table of w opens, w's units and its end
// symbol are seated one by one, each in the context of the n-1 units before
// it (a new table there sends a customer to the parent context, and so
// on); when the table closes they leave. The base is therefore adaptive:
// LogProb reads the current seating, and an NgramBase holds state, so each
// Words needs its own.
//
// Contexts are interned per level, keyed by their units' corpus key
// (Corpus.Key), so looking up a known context does not allocate; a key of
// fewer than k units at level k stands for a context padded with
// word-start symbols.
type NgramBase struct {
	// Levels[k] holds the discount and concentration of the contexts of k
	// units; len(Levels) is the order. Change the values in place; do not
	// replace the slice.
	Levels []PitmanYor

	units      int
	uniform    float64 // 1/(V+1)
	logUniform float64
	levels     []*restaurants
	contexts   []map[string]int32 // level -> context key -> id
	parents    [][]int32          // level -> id -> parent id at level-1 (-1 at level 0)

	seen         []PitmanYor // Levels when version last looked
	paramChanges uint64

	// Scratch for addSymbol and removeSymbol, one entry per level.
	ctxs []int32
	ps   []float64
}

// endUnit is the dish of the word-end symbol: no Unit can take its value.
const endUnit = WordType(MaxUnits)

// DefaultNgramLevels returns the starting parameters of an order-n unit
// model: discount 0.5 and concentration 1 at every level, the prior means
// of the vague priors d ~ Beta(1,1), a ~ Gamma(1,1) that Teh (2006) puts on
// every level before sampling them (recalled from memory).
func DefaultNgramLevels(order int) []PitmanYor {
	levels := make([]PitmanYor, order)
	for k := range levels {
		levels[k] = PitmanYor{Discount: 0.5, Concentration: 1}
	}
	return levels
}

// NewNgramBase returns an empty unit model of the given order over an
// inventory of units units. levels gives each level's parameters, contexts
// of k units at levels[k]; nil means DefaultNgramLevels(order). It panics if
// order < 1, units < 1, len(levels) != order or a level's parameters are
// outside d in [0,1), a > -d.
func NewNgramBase(units, order int, levels []PitmanYor) *NgramBase {
	if order < 1 || units < 1 || units > MaxUnits {
		panic(fmt.Sprintf("segment: NewNgramBase(units %d, order %d)", units, order))
	}
	if levels == nil {
		levels = DefaultNgramLevels(order)
	}
	if len(levels) != order {
		panic(fmt.Sprintf("segment: NewNgramBase: %d levels for order %d", len(levels), order))
	}
	for k, p := range levels {
		if !(p.Discount >= 0 && p.Discount < 1 && p.Concentration > -p.Discount) {
			panic(fmt.Sprintf("segment: NewNgramBase: level %d parameters %+v", k, p))
		}
	}
	b := &NgramBase{
		Levels:     append([]PitmanYor(nil), levels...),
		units:      units,
		uniform:    1 / float64(units+1),
		logUniform: -math.Log(float64(units + 1)),
		seen:       append([]PitmanYor(nil), levels...),
		ctxs:       make([]int32, order),
		ps:         make([]float64, order),
	}
	for k := range b.Levels {
		b.levels = append(b.levels, newRestaurants(&b.Levels[k]))
		b.contexts = append(b.contexts, make(map[string]int32))
		b.parents = append(b.parents, nil)
	}
	return b
}

// Order returns n, the number of units a symbol's probability depends on,
// itself included.
func (b *NgramBase) Order() int { return len(b.levels) }

// Units returns the inventory size the model was made for.
func (b *NgramBase) Units() int { return b.units }

// empty returns a model with b's parameters and no customers.
func (b *NgramBase) empty() *NgramBase { return NewNgramBase(b.units, b.Order(), b.Levels) }

// LogProb implements Base: the log probability of the span [start, end)
// of c under the current seating, each symbol's predictive probability
// taken from the same state (the word's own units are not seated in
// between).
func (b *NgramBase) LogProb(c *Corpus, start, end int) float64 {
	lp, p := 0.0, 1.0
	for i := start; i <= end; i++ {
		if p *= b.symbolProb(c, start, i, symbolAt(c, i, end)); p < 0x1p-600 {
			lp += math.Log(p) // keep the product far from underflow
			p = 1
		}
	}
	return lp + math.Log(p)
}

// symbolAt returns the dish of position i of the word [.., end): its unit,
// or the end symbol at end.
func symbolAt(c *Corpus, i, end int) WordType {
	if i == end {
		return endUnit
	}
	return WordType(c.Units[i])
}

// contextKey returns the key of the level-k context of position i of a word
// starting at start.
func contextKey(c *Corpus, start, i, k int) []byte { return c.Key(max(start, i-k), i) }

// symbolProb returns the predictive probability of dish at position i of
// a word starting at start.
func (b *NgramBase) symbolProb(c *Corpus, start, i int, dish WordType) float64 {
	// Contexts are created with their parents, so the deepest known one
	// gives all the others.
	for k := len(b.levels) - 1; k >= 0; k-- {
		if ctx, ok := b.contexts[k][string(contextKey(c, start, i, k))]; ok {
			return b.prob(k, ctx, dish)
		}
	}
	return b.uniform
}

// prob returns the predictive probability of dish in context ctx of level
// k.
func (b *NgramBase) prob(k int, ctx int32, dish WordType) float64 {
	parent := b.uniform
	if k > 0 {
		parent = b.prob(k-1, b.parents[k][ctx], dish)
	}
	return b.levels[k].predictive(ctx, dish, parent)
}

// chain fills b.ctxs with the context of every level, from ctx at level k
// down through its parents.
func (b *NgramBase) chain(k int, ctx int32) {
	for ; k >= 0; k-- {
		b.ctxs[k] = ctx
		ctx = b.parents[k][ctx]
	}
}

// context returns the id of the level-k context of position i of a word
// starting at start, interning it and its parents if new.
func (b *NgramBase) context(c *Corpus, start, i, k int) int32 {
	key := contextKey(c, start, i, k)
	if id, ok := b.contexts[k][string(key)]; ok {
		return id
	}
	parent := int32(-1)
	if k > 0 {
		parent = b.context(c, start, i, k-1)
	}
	id := int32(len(b.parents[k]))
	b.contexts[k][string(key)] = id
	b.parents[k] = append(b.parents[k], parent)
	return id
}

// addWord seats the units and the end symbol of the word [start, end) of c,
// in order, and returns the sum of their log predictive probabilities, each
// taken just before it was seated: the probability that the model generates
// the word along the seating path taken.
func (b *NgramBase) addWord(c *Corpus, start, end int, rng *rand.Rand, j *journal) float64 {
	lp := 0.0
	for i := start; i <= end; i++ {
		lp += b.addSymbol(c, start, i, symbolAt(c, i, end), rng, j)
	}
	return lp
}

// removeWord takes away the customers addWord seated, in reverse order, and
// returns the sum of their log predictive probabilities, each taken just
// after it left.
func (b *NgramBase) removeWord(c *Corpus, start, end int, rng *rand.Rand, j *journal) float64 {
	lp := 0.0
	for i := end; i >= start; i-- {
		lp += b.removeSymbol(c, start, i, symbolAt(c, i, end), rng, j)
	}
	return lp
}

// addSymbol seats one customer of dish in its deepest context; a new table
// sends a customer to the parent context, and so on down the levels. It
// returns the log predictive probability of dish before seating.
func (b *NgramBase) addSymbol(c *Corpus, start, i int, dish WordType, rng *rand.Rand, j *journal) float64 {
	top := len(b.levels) - 1
	b.chain(top, b.context(c, start, i, top))
	p := b.uniform
	for k, r := range b.levels {
		b.ps[k] = p // the parent's probability of dish
		p = r.predictive(b.ctxs[k], dish, p)
	}
	for k := len(b.levels) - 1; k >= 0 && b.levels[k].add(b.ctxs[k], dish, math.Log(b.ps[k]), rng, j); k-- {
	}
	return math.Log(p)
}

// removeSymbol takes one customer of dish from its deepest context; a
// closed table takes one from the parent context, and so on. It returns
// the log predictive probability of dish after removal.
func (b *NgramBase) removeSymbol(c *Corpus, start, i int, dish WordType, rng *rand.Rand, j *journal) float64 {
	top := len(b.levels) - 1
	ctx, ok := b.contexts[top][string(contextKey(c, start, i, top))]
	if !ok {
		panic("segment: removal from an unknown unit context")
	}
	b.chain(top, ctx)
	for k := len(b.levels) - 1; k >= 0 && b.levels[k].remove(b.ctxs[k], dish, rng, j); k-- {
	}
	return math.Log(b.prob(top, ctx, dish))
}

// version returns a number that changes whenever a predictive probability
// may have changed: after any seating change (undone ones included) or
// change of Levels.
func (b *NgramBase) version() uint64 {
	for k := range b.Levels {
		if b.Levels[k] != b.seen[k] {
			b.seen[k] = b.Levels[k]
			b.paramChanges++
		}
	}
	v := b.paramChanges
	for _, r := range b.levels {
		v += r.changes
	}
	return v
}

// Counts returns the numbers of customers and tables over all levels and
// contexts.
func (b *NgramBase) Counts() (customers, tables int) {
	for _, r := range b.levels {
		for ctx := range r.customers {
			customers += int(r.customers[ctx])
			tables += int(r.tables[ctx])
		}
	}
	return customers, tables
}

// logJoint returns the log probability of the current seating together
// with the dishes of its customers: each level's seating probability
// (Teh 2006, eq. 11) and the uniform probability of the dish of every table
// of the empty context.
func (b *NgramBase) logJoint() float64 {
	lp := 0.0
	for k, r := range b.levels {
		lp += r.logSeatingProb(b.Levels[k].Discount, b.Levels[k].Concentration)
	}
	for _, t := range b.levels[0].tables {
		lp += float64(t) * b.logUniform
	}
	return lp
}

// Check verifies the seating's invariants: every level's histograms agree
// with its totals, and the customers of each dish in a context are the
// tables of that dish in the contexts one unit longer that back off to it.
// Tests call it after mutations.
func (b *NgramBase) Check() error {
	for k, r := range b.levels {
		if err := r.check(); err != nil {
			return fmt.Errorf("unit model level %d: %w", k, err)
		}
		if len(r.customers) > len(b.parents[k]) {
			return fmt.Errorf("unit model level %d: totals for %d contexts, %d interned", k, len(r.customers), len(b.parents[k]))
		}
		if len(b.contexts[k]) != len(b.parents[k]) {
			return fmt.Errorf("unit model level %d: %d keys for %d contexts", k, len(b.contexts[k]), len(b.parents[k]))
		}
	}
	for k := 1; k < len(b.levels); k++ {
		want := map[uint64]int32{}
		b.levels[k].forEach(func(ctx int32, w WordType, ds *dishSeating) {
			want[seatKey(b.parents[k][ctx], w)] += ds.tables
		})
		if err := b.levels[k-1].checkCustomers(want); err != nil {
			return fmt.Errorf("unit model level %d against the tables of level %d: %w", k-1, k, err)
		}
	}
	return nil
}

// checkWords verifies that the customers of the deepest level are the units
// and end symbols of the given words, each counted tables times: words
// calls f with every word span and its number of unigram-level tables.
func (b *NgramBase) checkWords(c *Corpus, words func(f func(start, end int, tables int32))) error {
	want := map[uint64]int32{}
	top := len(b.levels) - 1
	var err error
	words(func(start, end int, tables int32) {
		for i := start; i <= end; i++ {
			ctx, ok := b.contexts[top][string(contextKey(c, start, i, top))]
			if !ok {
				err = fmt.Errorf("word %q: no context for position %d", c.Text(start, end), i-start)
				return
			}
			want[seatKey(ctx, symbolAt(c, i, end))] += tables
		}
	})
	if err != nil {
		return err
	}
	if err := b.levels[top].checkCustomers(want); err != nil {
		return fmt.Errorf("unit model level %d against the words' tables: %w", top, err)
	}
	return nil
}

// checkCustomers verifies that r's customers per (context, dish) are
// exactly want.
func (r *restaurants) checkCustomers(want map[uint64]int32) error {
	for key, n := range want {
		ctx, w := int32(key>>32), WordType(int32(uint32(key)))
		got := int32(0)
		if ds := r.seating(ctx, w, false); ds != nil {
			got = ds.customers
		}
		if got != n {
			return fmt.Errorf("context %d dish %d: %d customers, want %d", ctx, w, got, n)
		}
	}
	var err error
	r.forEach(func(ctx int32, w WordType, ds *dishSeating) {
		if n := want[seatKey(ctx, w)]; n != ds.customers && err == nil {
			err = fmt.Errorf("context %d dish %d: %d customers, want %d", ctx, w, ds.customers, n)
		}
	})
	return err
}
