package align

// own holds one utterance's share of the expected counts of the last
// E-step, for scoring that utterance with a table estimated from the other
// utterances alone (Model.LeaveOneOut). words are the distinct words of
// the utterance's segmentation at that E-step; for the i-th of them,
// total[i] is its share of n(w) and count[i*m+j] its share of n(e_j,w),
// summed over the utterance's tokens with the id of token j (m tokens).
// null[j] and nullTotal are the same for NULL.
type own struct {
	words     []int32
	total     []float64
	count     []float64
	null      []float64
	nullTotal float64
}

// recordOwn starts collecting utterance u's counts of the E-step under
// way for its words ws and returns the cleared record, which the E-step
// fills token by token (Model.step) and finishes with spread.
func (m *Model) recordOwn(u int, ws []int32) *own {
	for len(m.own) <= u {
		m.own = append(m.own, own{})
	}
	o := &m.own[u]
	o.words = o.words[:0]
	for _, w := range ws {
		if o.index(w) < 0 {
			o.words = append(o.words, w)
		}
	}
	n := len(m.Tokens(u))
	o.total = resize(o.total, len(o.words))
	clear(o.total)
	o.count = resize(o.count, len(o.words)*n)
	clear(o.count)
	o.null = resize(o.null, n)
	clear(o.null)
	o.nullTotal = 0
	return o
}

// index returns the position of w in o.words, or -1.
func (o *own) index(w int32) int {
	for i, v := range o.words {
		if v == w {
			return i
		}
	}
	return -1
}

// spread makes every token's share cover all tokens of the same id, so
// count[i*m+j] is the utterance's share of n(e_j, w_i) whatever the number
// of times e_j occurs.
func (o *own) spread(tokens []int32) {
	n := len(tokens)
	spreadRow := func(row []float64) {
		for j := range tokens {
			for j2 := j + 1; j2 < n; j2++ {
				if tokens[j2] == tokens[j] {
					row[j] += row[j2]
				}
			}
		}
		for j := n - 1; j >= 0; j-- {
			for j2 := 0; j2 < j; j2++ {
				if tokens[j2] == tokens[j] {
					row[j] = row[j2]
					break
				}
			}
		}
	}
	spreadRow(o.null)
	for i := range o.words {
		spreadRow(o.count[i*n : (i+1)*n])
	}
}

// columnIn returns word w's column (Null included) as utterance u sees
// it: with LeaveOneOut, the table without u's own counts.
func (m *Model) columnIn(u int, w int32) column {
	c := m.column(w)
	if !m.LeaveOneOut || u >= len(m.own) || !c.seen {
		return c
	}
	o := &m.own[u]
	var ownTotal float64
	if w == Null {
		c.own, ownTotal = o.null, o.nullTotal
	} else {
		i := o.index(w)
		if i < 0 {
			return c
		}
		n := len(o.null)
		c.own, ownTotal = o.count[i*n:(i+1)*n], o.total[i]
	}
	rest := m.total[int(w)+1] - ownTotal
	if rest <= 1e-9*m.total[int(w)+1] {
		// Only u saw w: the rest of the corpus says nothing about it.
		return column{w: w, size: c.size}
	}
	c.denom = rest + m.Beta
	return c
}
