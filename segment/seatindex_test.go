package segment

import (
	"math/rand/v2"
	"testing"
)

// TestSeatIndex drives a seatIndex and a Go map through the same random
// puts, gets and deletes, with keys drawn from a small range so that
// probe runs collide, wrap around the table's end and get holes shifted
// into; after every step the two must agree on every key.
func TestSeatIndex(t *testing.T) {
	tests := []struct {
		name  string
		keys  uint64
		steps int
	}{
		{"dense", 50, 3000},
		{"sparse", 1 << 40, 3000},
		{"context keys", 2000, 20000},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			rng := rand.New(rand.NewPCG(1, 2))
			var s seatIndex
			want := map[uint64]int32{}
			key := func() uint64 {
				k := rng.Uint64N(tt.keys)
				if tt.name == "context keys" {
					k = seatKey(int32(k%7), WordType(int32(k/7))-1) // dish End included
				}
				return k
			}
			for step := range tt.steps {
				k := key()
				switch rng.IntN(3) {
				case 0, 1:
					v := int32(rng.IntN(1000))
					s.put(k, v)
					want[k] = v
				case 2:
					s.del(k)
					delete(want, k)
				}
				if s.len() != len(want) {
					t.Fatalf("step %d: %d keys, want %d", step, s.len(), len(want))
				}
				if 2*s.len() > len(s.slots) {
					t.Fatalf("step %d: %d keys in %d slots", step, s.len(), len(s.slots))
				}
				probe := key()
				v, ok := s.get(probe)
				if wv, wok := want[probe]; ok != wok || v != wv {
					t.Fatalf("step %d: get(%d) = %d, %v; want %d, %v", step, probe, v, ok, wv, wok)
				}
			}
			seen := 0
			s.each(func(k uint64, v int32) {
				seen++
				if wv, ok := want[k]; !ok || wv != v {
					t.Errorf("each: %d -> %d, want %d (present %v)", k, v, wv, ok)
				}
			})
			if seen != len(want) {
				t.Errorf("each visited %d keys, want %d", seen, len(want))
			}
			for k, wv := range want {
				if v, ok := s.get(k); !ok || v != wv {
					t.Errorf("get(%d) = %d, %v; want %d", k, v, ok, wv)
				}
			}
		})
	}
}

// TestSeatIndexSteadyState checks that deleting and re-adding keys at a
// constant count never grows the table: no tombstones pile up.
func TestSeatIndexSteadyState(t *testing.T) {
	var s seatIndex
	for k := range uint64(1000) {
		s.put(k, int32(k))
	}
	size := len(s.slots)
	rng := rand.New(rand.NewPCG(3, 4))
	next := uint64(1000)
	for range 100000 {
		victim := rng.Uint64N(next)
		if _, ok := s.get(victim); !ok {
			continue
		}
		s.del(victim)
		s.put(next, 1)
		next++
	}
	if len(s.slots) != size || s.len() != 1000 {
		t.Errorf("after churn: %d keys in %d slots, want 1000 in %d", s.len(), len(s.slots), size)
	}
}

func BenchmarkSeatIndexMiss(b *testing.B) {
	var s seatIndex
	m := map[uint64]int32{}
	rng := rand.New(rand.NewPCG(5, 6))
	for range 500000 {
		k := seatKey(int32(rng.IntN(20000)+1), WordType(rng.IntN(20000)))
		s.put(k, 1)
		m[k] = 1
	}
	keys := make([]uint64, 4096)
	for i := range keys {
		keys[i] = seatKey(int32(rng.IntN(20000)+1), WordType(rng.IntN(20000)))
	}
	b.Run("seatIndex", func(b *testing.B) {
		n := 0
		for i := 0; b.Loop(); i++ {
			if _, ok := s.get(keys[i&4095]); ok {
				n++
			}
		}
	})
	b.Run("map", func(b *testing.B) {
		n := 0
		for i := 0; b.Loop(); i++ {
			if _, ok := m[keys[i&4095]]; ok {
				n++
			}
		}
	})
}
