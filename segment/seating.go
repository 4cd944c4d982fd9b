package segment

import "math/rand/v2"

// sizeCount is one entry of a table-size histogram: Tables tables that
// each seat Size customers.
type sizeCount struct{ Size, Tables int32 }

// dishSeating is the seating of one dish in one restaurant, kept as a
// histogram of table sizes (Blunsom, Cohn, Goldwater & Johnson 2009): tables
// of equal size are interchangeable, so their identities are never stored.
type dishSeating struct {
	customers, tables int32
	hist              []sizeCount // unordered; no entry has Tables == 0
}

// addToSize moves one table of the given size (0 for a new table) up by one
// customer.
func (ds *dishSeating) addToSize(size int32) {
	if size == 0 {
		ds.tables++
	} else {
		ds.bump(size, -1)
	}
	ds.bump(size+1, +1)
	ds.customers++
}

// removeFromSize moves one table of the given size down by one customer;
// a table of size 1 disappears.
func (ds *dishSeating) removeFromSize(size int32) {
	ds.bump(size, -1)
	if size == 1 {
		ds.tables--
	} else {
		ds.bump(size-1, +1)
	}
	ds.customers--
}

func (ds *dishSeating) bump(size, delta int32) {
	for k := range ds.hist {
		if ds.hist[k].Size == size {
			ds.hist[k].Tables += delta
			if ds.hist[k].Tables == 0 {
				last := len(ds.hist) - 1
				ds.hist[k] = ds.hist[last]
				ds.hist = ds.hist[:last]
			} else if ds.hist[k].Tables < 0 {
				panic("segment: negative table count")
			}
			return
		}
	}
	if delta < 0 {
		panic("segment: no table of that size")
	}
	ds.hist = append(ds.hist, sizeCount{size, delta})
}

// pickJoin chooses an existing table for a new customer with probability
// proportional to size - d, given u uniform in [0, customers - d*tables).
func (ds *dishSeating) pickJoin(d, u float64) int32 {
	for _, sc := range ds.hist {
		u -= float64(sc.Tables) * (float64(sc.Size) - d)
		if u < 0 {
			return sc.Size
		}
	}
	return ds.hist[len(ds.hist)-1].Size // rounding
}

// pickLeave chooses the table of a departing customer, a customer chosen
// uniformly, so a table with probability proportional to its size.
func (ds *dishSeating) pickLeave(rng *rand.Rand) int32 {
	u := rng.Float64() * float64(ds.customers)
	for _, sc := range ds.hist {
		u -= float64(sc.Tables) * float64(sc.Size)
		if u < 0 {
			return sc.Size
		}
	}
	return ds.hist[len(ds.hist)-1].Size
}
