package segment

import (
	"fmt"
	"math"
	"math/rand/v2"
	"reflect"
	"slices"
	"strings"
	"testing"
)

// seatingSnapshot returns r's occupied seatings and totals in a form that
// compares equal exactly when the seatings are the same.
func seatingSnapshot(r *restaurants) map[string]string {
	snap := map[string]string{}
	r.forEach(func(ctx int32, w WordType, ds *dishSeating) {
		hist := slices.Clone(ds.hist)
		slices.SortFunc(hist, func(a, b sizeCount) int { return int(a.Size - b.Size) })
		snap[fmt.Sprintf("seat %d %d", ctx, w)] = fmt.Sprint(ds.customers, ds.tables, hist)
	})
	for ctx := range r.customers {
		if r.customers[ctx] != 0 || r.tables[ctx] != 0 {
			snap[fmt.Sprintf("ctx %d", ctx)] = fmt.Sprint(r.customers[ctx], r.tables[ctx])
		}
	}
	return snap
}

func modelSnapshot(m *Words) []map[string]string {
	snaps := []map[string]string{seatingSnapshot(m.uni), seatingSnapshot(m.bi)}
	for _, r := range m.ngram().levels {
		snaps = append(snaps, seatingSnapshot(r))
	}
	return snaps
}

// checkBaseCache compares every type's cached base probability with one
// computed afresh from the unit model.
func checkBaseCache(t *testing.T, m *Words) {
	t.Helper()
	for w := range WordType(m.Types.Len()) {
		s, e := m.span(w)
		got, want := m.logP0(w), m.ngram().LogProb(m.Corpus, s, e)
		if math.Abs(got-want) > 1e-12 {
			t.Fatalf("cached log P0(%q) = %v, the unit model says %v", m.Types.Text(m.Corpus, w), got, want)
		}
	}
}

// TestNgramBaseJournalUndo resegments random utterances through a journal,
// as WordsGibbs does, and checks that undoing restores every level's
// seating, the unit model's included, exactly, and that cached base
// probabilities follow every change.
func TestNgramBaseJournalUndo(t *testing.T) {
	c, err := ReadCorpus(strings.NewReader("tanamiku\nkutana\nmikutanami\nnamikuta\ntatata"), "undo", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for _, order := range []int{1, 2} {
		for _, unitOrder := range []int{2, 3} {
			t.Run(fmt.Sprintf("words%d/units%d", order, unitOrder), func(t *testing.T) {
				m := NewWords(c, order, PitmanYor{0.5, 1}, PitmanYor{0.3, 2}, NewNgramBase(len(c.Inventory), unitOrder, nil))
				rng := rand.New(rand.NewPCG(uint64(order), uint64(unitOrder)))
				s := RandomSegmentation(c, 0.5, rng)
				m.AddSegmentation(s, rng)
				var j journal
				for trial := 0; trial < 200; trial++ {
					before, tokens := modelSnapshot(m), m.tokens
					u := rng.IntN(c.Len())
					words := func(s *Segmentation) []WordType {
						ws := []WordType{End}
						s.Words(u, func(a, b int) { ws = append(ws, m.Intern(a, b)) })
						if order == 2 {
							ws = append(ws, End)
						}
						return ws
					}
					j.reset()
					old := words(s)
					for k := len(old) - 1; k > 0; k-- {
						m.remove(old[k-1], old[k], rng, &j)
					}
					next := words(RandomSegmentation(c, 0.5, rng))
					for k := 1; k < len(next); k++ {
						m.add(next[k-1], next[k], rng, &j)
					}
					if err := m.Check(); err != nil {
						t.Fatalf("trial %d, after resegmenting: %v", trial, err)
					}
					checkBaseCache(t, m)
					j.undo()
					m.tokens = tokens
					if err := m.Check(); err != nil {
						t.Fatalf("trial %d, after undo: %v", trial, err)
					}
					if after := modelSnapshot(m); !reflect.DeepEqual(before, after) {
						t.Fatalf("trial %d: undo did not restore the seating:\nbefore %v\nafter  %v", trial, before, after)
					}
					checkBaseCache(t, m)
				}
			})
		}
	}
}
