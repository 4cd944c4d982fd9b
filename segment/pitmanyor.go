package segment

import (
	"math"
	"math/rand/v2"
)

// PitmanYor holds the parameters of one level of a hierarchical
// Pitman-Yor process: discount d in [0,1) and concentration a > -d.
// With d = 0 the level is a Dirichlet process.
type PitmanYor struct {
	Discount, Concentration float64
}

// restaurants is one level of a hierarchy: a Chinese restaurant for every
// context, all with the same parameters, seating customers of word types
// (dishes). The predictive probability of dish w in context u is
// (Teh 2006, eq. 4 in the Chinese-restaurant form):
//
//	P(w | u) = (c_uw - d t_uw + (a + d t_u) P_parent(w)) / (c_u + a)
//
// where c counts customers and t tables.
type restaurants struct {
	params *PitmanYor
	index  seatIndex // (context, dish) -> seats
	// first has the seats of context 0, indexed by dish+1, so the most
	// used restaurant (the unigram level's only one) needs no hashing;
	// -1 where absent.
	first     []int32
	seats     []dishSeating
	dishes    []WordType    // dishes[i] is the dish of seats[i]
	customers []int32       // by context
	tables    []int32       // by context
	slab      []sizeCount   // spare histogram room for new dishes
	free      [][]sizeCount // histogram room of dropped seats, for reuse
	seatCtx   []int32       // seatCtx[i] is the context of seats[i]
	freeSeats []int32       // released slots of seats, for reuse
	created   []int32       // slots created since markSeats, for dropSeats
	// changes counts seating changes, undone ones included, so that a
	// cache of predictive probabilities can tell when it is stale.
	changes uint64
}

func newRestaurants(p *PitmanYor) *restaurants {
	return &restaurants{params: p}
}

func seatKey(ctx int32, w WordType) uint64 { return uint64(uint32(ctx))<<32 | uint64(uint32(w)) }

// seating returns the seating of dish w in context ctx, creating it if
// create is set; nil if absent and not created.
func (r *restaurants) seating(ctx int32, w WordType, create bool) *dishSeating {
	if ctx == 0 {
		if d := int(w) + 1; d < len(r.first) && r.first[d] >= 0 {
			return &r.seats[r.first[d]]
		}
	} else if i, ok := r.index.get(seatKey(ctx, w)); ok {
		return &r.seats[i]
	}
	if !create {
		return nil
	}
	k := seatKey(ctx, w)
	for int(ctx) >= len(r.customers) {
		r.customers = append(r.customers, 0)
		r.tables = append(r.tables, 0)
	}
	// Reuse a released slot if there is one, so that a long run's seat
	// slices stop growing once they hold the most seats ever live at once.
	i := int32(len(r.seats))
	if n := len(r.freeSeats); n > 0 {
		i, r.freeSeats = r.freeSeats[n-1], r.freeSeats[:n-1]
	} else {
		r.seats = append(r.seats, dishSeating{})
		r.dishes = append(r.dishes, 0)
		r.seatCtx = append(r.seatCtx, 0)
	}
	r.created = append(r.created, i)
	r.index.put(k, i)
	if ctx == 0 {
		for int(w)+1 >= len(r.first) {
			r.first = append(r.first, -1)
		}
		r.first[w+1] = i
	}
	// Most dishes never have more than two table sizes: give each room
	// for two from a shared slab (or a released seat's), so creating a
	// dish seldom allocates.
	var hist []sizeCount
	if n := len(r.free); n > 0 {
		hist, r.free = r.free[n-1][:0], r.free[:n-1]
	} else {
		if len(r.slab) < 2 {
			r.slab = make([]sizeCount, 4096)
		}
		hist, r.slab = r.slab[:0:2], r.slab[2:]
	}
	r.seats[i] = dishSeating{hist: hist}
	r.dishes[i] = w
	r.seatCtx[i] = ctx
	return &r.seats[i]
}

// markSeats starts a new record of created seats and returns its mark:
// everything created before is kept by dropSeats.
func (r *restaurants) markSeats() int {
	r.created = r.created[:0]
	return 0
}

// dropSeats releases the seats created since mark n, which must all be
// empty: after a rejected proposal, so that (context, dish) pairs that were
// only proposed do not pile up in the index.
func (r *restaurants) dropSeats(n int) {
	for k := len(r.created) - 1; k >= n; k-- {
		i := r.created[k]
		if r.seats[i].customers != 0 {
			panic("segment: dropping a seat with customers")
		}
		r.release(i)
	}
	r.created = r.created[:n]
}

// release frees seat slot i, which has no customers, for reuse.
func (r *restaurants) release(i int32) {
	ds := &r.seats[i]
	ctx, w := r.seatCtx[i], r.dishes[i]
	r.index.del(seatKey(ctx, w))
	if ctx == 0 {
		r.first[w+1] = -1
	}
	if cap(ds.hist) > 0 {
		r.free = append(r.free, ds.hist[:0])
	}
	*ds = dishSeating{}
	r.freeSeats = append(r.freeSeats, i)
}

// releaseEmpty frees the seats that changes in j left without customers,
// once those changes are kept (an accepted proposal): a seat exists only
// while its (context, dish) pair has customers or is being proposed.
func (j *journal) releaseEmpty() {
	for _, e := range j.entries {
		if e.add {
			continue
		}
		if i, ok := e.r.index.get(seatKey(e.ctx, e.w)); ok && e.r.seats[i].customers == 0 {
			e.r.release(i)
		}
	}
}

func (r *restaurants) totals(ctx int32) (customers, tables float64) {
	if int(ctx) >= len(r.customers) {
		return 0, 0
	}
	return float64(r.customers[ctx]), float64(r.tables[ctx])
}

// logPredictive returns log P(w | ctx) given log P_parent(w). An empty
// restaurant passes the parent's probability through (the formula's limit,
// also when a = 0).
func (r *restaurants) logPredictive(ctx int32, w WordType, logParent float64) float64 {
	d, a := r.params.Discount, r.params.Concentration
	c, t := r.totals(ctx)
	if c == 0 {
		return logParent
	}
	lNew := math.Log(a+d*t) + logParent
	if ds := r.seating(ctx, w, false); ds != nil && ds.customers > 0 {
		lNew = logAddExp(math.Log(float64(ds.customers)-d*float64(ds.tables)), lNew)
	}
	return lNew - math.Log(c+a)
}

// predictive returns P(w | ctx) given P_parent(w): logPredictive without
// logarithms, for the unit model, whose probabilities are never small
// enough to underflow, and for the blocked sampler's scaled lattices. w
// may be -2, a word never interned.
func (r *restaurants) predictive(ctx int32, w WordType, parent float64) float64 {
	c, t := r.totals(ctx)
	if c == 0 {
		return parent
	}
	d, a := r.params.Discount, r.params.Concentration
	p := (a + d*t) * parent
	if w >= End {
		if ds := r.seating(ctx, w, false); ds != nil {
			p += float64(ds.customers) - d*float64(ds.tables)
		}
	}
	return p / (c + a)
}

// add seats a customer of dish w in context ctx. It returns whether the
// customer opened a new table (so the parent gets a customer too). The
// choice is recorded in j.
func (r *restaurants) add(ctx int32, w WordType, logParent float64, rng *rand.Rand, j *journal) bool {
	d, a := r.params.Discount, r.params.Concentration
	ds := r.seating(ctx, w, true)
	_, t := r.totals(ctx)
	join := float64(ds.customers) - d*float64(ds.tables)
	var size int32
	if join > 0 {
		pNew := (a + d*t) * math.Exp(logParent)
		u := rng.Float64() * (join + pNew)
		if u < join {
			size = ds.pickJoin(d, u)
		}
	}
	r.seatAt(ctx, ds, size)
	j.push(r, ctx, w, size, true)
	return size == 0
}

// remove takes away one customer of dish w in context ctx, chosen
// uniformly. It returns whether a table closed (so the parent loses a
// customer too).
func (r *restaurants) remove(ctx int32, w WordType, rng *rand.Rand, j *journal) bool {
	ds := r.seating(ctx, w, false)
	if ds == nil || ds.customers == 0 {
		panic("segment: remove of an absent customer")
	}
	size := ds.pickLeave(rng)
	r.unseatAt(ctx, ds, size)
	j.push(r, ctx, w, size, false)
	return size == 1
}

// addCustomer seats a customer of dish w in context ctx, like add, and
// also returns the predictive probability P(w | ctx) just before, given
// the parent's probability: one lookup for both.
func (r *restaurants) addCustomer(ctx int32, w WordType, parent float64, rng *rand.Rand, j *journal) (p float64, newTable bool) {
	d, a := r.params.Discount, r.params.Concentration
	ds := r.seating(ctx, w, true)
	c, t := r.totals(ctx)
	join := float64(ds.customers) - d*float64(ds.tables)
	pNew := (a + d*t) * parent
	p = parent
	if c > 0 {
		p = (join + pNew) / (c + a)
	}
	var size int32
	if join > 0 && rng.Float64()*(join+pNew) < join {
		size = ds.pickJoin(d, rng.Float64()*join)
	}
	r.seatAt(ctx, ds, size)
	j.push(r, ctx, w, size, true)
	return p, size == 0
}

// removeCustomer takes away a customer of dish w in context ctx, like
// remove, and returns the seating it left for predictiveAt.
func (r *restaurants) removeCustomer(ctx int32, w WordType, rng *rand.Rand, j *journal) (ds *dishSeating, closed bool) {
	ds = r.seating(ctx, w, false)
	if ds == nil || ds.customers == 0 {
		panic("segment: remove of an absent customer")
	}
	size := ds.pickLeave(rng)
	r.unseatAt(ctx, ds, size)
	j.push(r, ctx, w, size, false)
	return ds, size == 1
}

// predictiveAt returns P(w | ctx) for the dish whose seating is ds.
func (r *restaurants) predictiveAt(ctx int32, ds *dishSeating, parent float64) float64 {
	c, t := r.totals(ctx)
	if c == 0 {
		return parent
	}
	d, a := r.params.Discount, r.params.Concentration
	return (float64(ds.customers) - d*float64(ds.tables) + (a+d*t)*parent) / (c + a)
}

// seatAt adds a customer to a table of the given size (0: a new table).
func (r *restaurants) seatAt(ctx int32, ds *dishSeating, size int32) {
	r.roomFor(ds)
	ds.addToSize(size)
	r.changes++
	r.customers[ctx]++
	if size == 0 {
		r.tables[ctx]++
	}
}

// roomFor makes sure ds's histogram can take one more table size without
// append reallocating it: a full one moves to twice the room, carved from
// the slab. Moving a customer between sizes adds at most one entry, so
// sweeps allocate only when a slab runs out (every few thousand moves of
// a histogram to more room), not every time a dish meets a new size.
func (r *restaurants) roomFor(ds *dishSeating) {
	if len(ds.hist) < cap(ds.hist) {
		return
	}
	n := max(2, 2*cap(ds.hist))
	if len(r.slab) < n {
		r.slab = make([]sizeCount, max(4096, n))
	}
	h := r.slab[:len(ds.hist):n]
	r.slab = r.slab[n:]
	copy(h, ds.hist)
	ds.hist = h
}

// unseatAt removes a customer from a table of the given size.
func (r *restaurants) unseatAt(ctx int32, ds *dishSeating, size int32) {
	r.roomFor(ds)
	ds.removeFromSize(size)
	r.changes++
	r.customers[ctx]--
	if size == 1 {
		r.tables[ctx]--
	}
}

// journalEntry records one seating change so that it can be undone.
type journalEntry struct {
	r    *restaurants
	ctx  int32
	w    WordType
	size int32 // table size before the change (0: new table)
	add  bool
}

// journal is a log of seating changes, undone in reverse order to restore
// a seating exactly after a rejected proposal.
type journal struct{ entries []journalEntry }

func (j *journal) push(r *restaurants, ctx int32, w WordType, size int32, add bool) {
	if j != nil {
		j.entries = append(j.entries, journalEntry{r, ctx, w, size, add})
	}
}

func (j *journal) reset() { j.entries = j.entries[:0] }

// undo reverts every change in j, newest first, and empties it.
func (j *journal) undo() {
	for k := len(j.entries) - 1; k >= 0; k-- {
		e := j.entries[k]
		ds := e.r.seating(e.ctx, e.w, false)
		if e.add {
			e.r.unseatAt(e.ctx, ds, e.size+1)
		} else {
			e.r.seatAt(e.ctx, ds, e.size-1)
		}
	}
	j.reset()
}

// logSeatingProb returns the log probability of the level's seating
// arrangement given its dishes' parent draws, summed over contexts
// (Teh 2006, eq. 11 without the parent term):
//
//	prod_u [(a+d)_{t_u-1, d} / (a+1)_{c_u-1}] * prod_{uw} prod_tables (1-d)_{size-1}
//
// with (x)_{n,d} = x(x+d)...(x+(n-1)d). Used for hyperparameter inference.
func (r *restaurants) logSeatingProb(d, a float64) float64 {
	lp := 0.0
	for ctx := range r.customers {
		c, t := float64(r.customers[ctx]), float64(r.tables[ctx])
		if c == 0 {
			continue
		}
		for k := 1.0; k < t; k++ {
			lp += math.Log(a + d*k)
		}
		lp -= lgamma(a+c) - lgamma(a+1)
	}
	if d > 0 {
		lg1d := lgamma(1 - d)
		for i := range r.seats {
			for _, sc := range r.seats[i].hist {
				lp += float64(sc.Tables) * (lgamma(float64(sc.Size)-d) - lg1d)
			}
		}
	}
	return lp
}
