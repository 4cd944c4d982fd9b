package segment

import "fmt"

// check verifies that every dish's table-size histogram agrees with its
// customer and table totals, and that each context's totals are the sums
// over its dishes. Tests call it after mutations.
func (r *restaurants) check() error {
	if len(r.customers) != len(r.tables) {
		return fmt.Errorf("%d customer totals but %d table totals", len(r.customers), len(r.tables))
	}
	if len(r.dishes) != len(r.seats) || r.index.len() != len(r.seats)-len(r.freeSeats) {
		return fmt.Errorf("%d seatings (%d free), %d dishes, %d index entries", len(r.seats), len(r.freeSeats), len(r.dishes), r.index.len())
	}
	customers := make([]int32, len(r.customers))
	tables := make([]int32, len(r.tables))
	var err error
	r.index.each(func(k uint64, i int32) {
		if err != nil {
			return
		}
		err = r.checkSeat(k, i, customers, tables)
	})
	if err != nil {
		return err
	}
	for ctx := range customers {
		if customers[ctx] != r.customers[ctx] || tables[ctx] != r.tables[ctx] {
			return fmt.Errorf("context %d: dishes sum to %d customers at %d tables, totals say %d at %d",
				ctx, customers[ctx], tables[ctx], r.customers[ctx], r.tables[ctx])
		}
	}
	return nil
}

// checkSeat checks the seating i of index key k and adds its customers
// and tables to its context's sums.
func (r *restaurants) checkSeat(k uint64, i int32, customers, tables []int32) error {
	ctx, w := int32(k>>32), WordType(int32(uint32(k)))
	if r.dishes[i] != w {
		return fmt.Errorf("context %d dish %d: seating %d records dish %d", ctx, w, i, r.dishes[i])
	}
	ds := &r.seats[i]
	var c, t int32
	for _, sc := range ds.hist {
		if sc.Size < 1 || sc.Tables < 1 {
			return fmt.Errorf("context %d dish %d: histogram entry %+v", ctx, w, sc)
		}
		c += sc.Size * sc.Tables
		t += sc.Tables
	}
	if c != ds.customers || t != ds.tables {
		return fmt.Errorf("context %d dish %d: histogram has %d customers at %d tables, totals say %d at %d",
			ctx, w, c, t, ds.customers, ds.tables)
	}
	if int(ctx) >= len(customers) {
		return fmt.Errorf("context %d dish %d: context has no totals", ctx, w)
	}
	customers[ctx] += c
	tables[ctx] += t
	return nil
}

// forEach calls f with every dish seating of r that has customers, in no
// particular order.
func (r *restaurants) forEach(f func(ctx int32, w WordType, ds *dishSeating)) {
	r.index.each(func(k uint64, i int32) {
		if ds := &r.seats[i]; ds.customers > 0 {
			f(int32(k>>32), WordType(int32(uint32(k))), ds)
		}
	})
}
