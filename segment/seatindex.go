package segment

// seatIndex maps (context, dish) keys to seat numbers: an open-addressing
// hash table with linear probing, each slot holding its key and value
// together. It replaced a Go map in the blocked bigram sampler's lattice,
// which looks up every pair of adjacent candidate words of an utterance
// and finds most of them absent: there the profile showed a third of a
// sweep in map probing. A slot is one cache line fetch, a miss usually
// ends at the first empty slot, and deletion shifts later entries back
// instead of leaving tombstones, so a table whose size stays put never
// grows or allocates however often pairs come and go.
type seatIndex struct {
	slots []seatSlot // len is a power of two, or 0
	n     int        // occupied slots
	shift uint       // 64 - log2(len(slots))
}

// seatSlot holds key+1 (0 marks an empty slot) and its value.
type seatSlot struct {
	key uint64
	val int32
}

// home returns the slot where a search for stored key k starts
// (Fibonacci hashing: the top bits of k times 2^64/phi).
func (s *seatIndex) home(k uint64) int { return int((k * 0x9E3779B97F4A7C15) >> s.shift) }

// get returns the value of key k and whether it is present.
func (s *seatIndex) get(k uint64) (int32, bool) {
	if s.n == 0 {
		return 0, false
	}
	k++
	mask := len(s.slots) - 1
	for i := s.home(k); ; i = (i + 1) & mask {
		switch s.slots[i].key {
		case k:
			return s.slots[i].val, true
		case 0:
			return 0, false
		}
	}
}

// put sets the value of key k, growing the table to keep it at most half
// full.
func (s *seatIndex) put(k uint64, v int32) {
	if 2*(s.n+1) > len(s.slots) {
		s.grow()
	}
	k++
	mask := len(s.slots) - 1
	for i := s.home(k); ; i = (i + 1) & mask {
		switch s.slots[i].key {
		case k:
			s.slots[i].val = v
			return
		case 0:
			s.slots[i] = seatSlot{k, v}
			s.n++
			return
		}
	}
}

// del removes key k if present. The entries after it in its probe run
// move back where their own searches would still find them (Knuth, The
// Art of Computer Programming vol. 3, section 6.4, Algorithm R; from
// memory), so no deleted-slot markers accumulate.
func (s *seatIndex) del(k uint64) {
	if s.n == 0 {
		return
	}
	k++
	mask := len(s.slots) - 1
	i := s.home(k)
	for ; s.slots[i].key != k; i = (i + 1) & mask {
		if s.slots[i].key == 0 {
			return
		}
	}
	s.n--
	for j := i; ; {
		s.slots[i] = seatSlot{}
		for {
			j = (j + 1) & mask
			if s.slots[j].key == 0 {
				return
			}
			// The entry at j may fill the hole at i unless its home lies
			// cyclically in (i, j].
			h := s.home(s.slots[j].key)
			if (j > i && (h <= i || h > j)) || (j < i && h <= i && h > j) {
				break
			}
		}
		s.slots[i] = s.slots[j]
		i = j
	}
}

// grow doubles the table (to 64 slots at first) and reinserts every entry.
func (s *seatIndex) grow() {
	old := s.slots
	size := max(64, 2*len(old))
	s.slots = make([]seatSlot, size)
	s.shift = 64
	for size > 1 {
		size >>= 1
		s.shift--
	}
	s.n = 0
	mask := len(s.slots) - 1
	for _, sl := range old {
		if sl.key == 0 {
			continue
		}
		i := s.home(sl.key)
		for s.slots[i].key != 0 {
			i = (i + 1) & mask
		}
		s.slots[i] = sl
		s.n++
	}
}

// len returns the number of keys.
func (s *seatIndex) len() int { return s.n }

// each calls f with every key and value, in slot order.
func (s *seatIndex) each(f func(k uint64, v int32)) {
	for _, sl := range s.slots {
		if sl.key != 0 {
			f(sl.key-1, sl.val)
		}
	}
}
