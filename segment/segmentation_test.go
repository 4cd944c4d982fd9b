package segment_test

import (
	"bytes"
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// segmentationCorpus reads text with spaces as locked boundaries.
func segmentationCorpus(t *testing.T, text string) *Corpus {
	t.Helper()
	c, err := ReadCorpus(strings.NewReader(text), "seg.txt", ReadOptions{SpacesAreBoundaries: true})
	if err != nil {
		t.Fatal(err)
	}
	return c
}

// TestNewSegmentation checks that a new segmentation has boundaries at
// utterance starts and at Boundary locks only.
func TestNewSegmentation(t *testing.T) {
	c := segmentationCorpus(t, "t\u0361\u0283a ma\n\nkam\n a  b c")
	s := NewSegmentation(c)
	want := []bool{
		true, false, true, false, // t͡ʃa ma
		true, false, false, // kam
		true, true, true, // a b c
	}
	if !slices.Equal(s.Boundary, want) {
		t.Errorf("Boundary = %v, want %v", s.Boundary, want)
	}
	if s.Corpus != c {
		t.Errorf("Corpus not kept")
	}
	tests := []struct {
		u    int
		want []string
	}{
		{0, []string{"t\u0361\u0283a", "ma"}},
		{1, []string{"kam"}},
		{2, []string{"a", "b", "c"}},
	}
	for _, tt := range tests {
		if got := s.WordStrings(tt.u); !slices.Equal(got, tt.want) {
			t.Errorf("WordStrings(%d) = %q, want %q", tt.u, got, tt.want)
		}
	}

	// Without locks, each utterance is one word.
	d, err := ReadCorpus(strings.NewReader("ab cd\nef"), "seg.txt", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if got := NewSegmentation(d).Boundary; !slices.Equal(got, []bool{true, false, false, false, true, false}) {
		t.Errorf("Boundary without locks = %v", got)
	}
}

// TestSegmentationWords checks the spans Words reports for hand-set
// boundaries, including one-unit words at both ends.
func TestSegmentationWords(t *testing.T) {
	c := segmentationCorpus(t, "abcdef\ngh")
	s := NewSegmentation(c)
	for _, i := range []int{1, 3, 5} {
		s.Boundary[i] = true
	}
	var spans [][2]int
	s.Words(0, func(a, b int) { spans = append(spans, [2]int{a, b}) })
	if want := [][2]int{{0, 1}, {1, 3}, {3, 5}, {5, 6}}; !slices.Equal(spans, want) {
		t.Errorf("Words(0) spans = %v, want %v", spans, want)
	}
	if got, want := s.WordStrings(0), []string{"a", "bc", "de", "f"}; !slices.Equal(got, want) {
		t.Errorf("WordStrings(0) = %q, want %q", got, want)
	}
	// A boundary in utterance 0 does not leak into utterance 1.
	spans = nil
	s.Words(1, func(a, b int) { spans = append(spans, [2]int{a, b}) })
	if want := [][2]int{{6, 8}}; !slices.Equal(spans, want) {
		t.Errorf("Words(1) spans = %v, want %v", spans, want)
	}
}

// TestSegmentationWrite checks the output contract of DESIGN section 2:
// one line per utterance, words separated by single ASCII spaces.
func TestSegmentationWrite(t *testing.T) {
	c := segmentationCorpus(t, "\t\u02c8t\u0361\u0283a\u0303  ma\r\n\n  ka\u02d0m \nb")
	s := NewSegmentation(c)
	s.Boundary[c.Starts[1]+1] = true // k | aːm
	var out bytes.Buffer
	if err := s.Write(&out); err != nil {
		t.Fatal(err)
	}
	want := "\u02c8t\u0361\u0283\u00e3 ma\nk a\u02d0m\nb\n"
	if out.String() != want {
		t.Errorf("Write = %q, want %q", out.String(), want)
	}

	// Empty corpus: no output.
	out.Reset()
	if err := NewSegmentation(NewCorpus("empty")).Write(&out); err != nil || out.Len() != 0 {
		t.Errorf("Write of an empty corpus = %q, %v", out.String(), err)
	}
}

// TestSegmentationWriteRoundTrip checks that Write's output, read back with
// spaces as boundaries, gives the same units with the written boundaries
// as locks.
func TestSegmentationWriteRoundTrip(t *testing.T) {
	c, err := ReadCorpus(strings.NewReader("t\u0361\u0283a\u0303mak\u02b7a\u02d0\nn\u02b2eb\u02c8ata\n@^#$%&*+|!-369DZ"), "rt.txt", ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	s := RandomSegmentation(c, 0.5, rand.New(rand.NewPCG(7, 11)))
	var out bytes.Buffer
	if err := s.Write(&out); err != nil {
		t.Fatal(err)
	}
	if strings.Contains(out.String(), "  ") || strings.Contains(out.String(), " \n") || strings.HasPrefix(out.String(), " ") {
		t.Errorf("Write output has stray spaces: %q", out.String())
	}
	d := segmentationCorpus(t, out.String())
	if !slices.Equal(d.Inventory, c.Inventory) || !slices.Equal(d.Units, c.Units) || !slices.Equal(d.Starts, c.Starts) {
		t.Fatalf("read back %q: units differ", out.String())
	}
	if got := NewSegmentation(d).Boundary; !slices.Equal(got, s.Boundary) {
		t.Errorf("read back boundaries %v, wrote %v", got, s.Boundary)
	}
}

// TestRandomSegmentation checks that RandomSegmentation is reproducible
// from its seed, keeps every lock and utterance start, and puts a boundary
// at a free gap with probability p.
func TestRandomSegmentation(t *testing.T) {
	var b strings.Builder
	for i := range 200 {
		b.WriteString(strings.Repeat("ab", 10+i%7))
		if i%3 == 0 {
			b.WriteString(" ba")
		}
		b.WriteString("\n")
	}
	c := segmentationCorpus(t, b.String())
	// Lock some gaps as Joined by hand (DESIGN section 2: confirmed
	// word-internal gaps).
	for i := range c.Locks {
		if i%11 == 5 && c.Locks[i] == Free {
			c.Locks[i] = Joined
		}
	}
	isStart := make([]bool, len(c.Units))
	for u := 0; u < c.Len(); u++ {
		isStart[c.Starts[u]] = true
	}

	for _, p := range []float64{0, 0.3, 1} {
		s1 := RandomSegmentation(c, p, rand.New(rand.NewPCG(1, 2)))
		s2 := RandomSegmentation(c, p, rand.New(rand.NewPCG(1, 2)))
		if !slices.Equal(s1.Boundary, s2.Boundary) {
			t.Errorf("p=%v: same seed, different segmentations", p)
		}
		free, set := 0, 0
		for i, bd := range s1.Boundary {
			switch {
			case isStart[i]:
				if !bd {
					t.Fatalf("p=%v: no boundary at utterance start %d", p, i)
				}
			case c.LockAt(i) == Boundary:
				if !bd {
					t.Fatalf("p=%v: Boundary lock at %d broken", p, i)
				}
			case c.LockAt(i) == Joined:
				if bd {
					t.Fatalf("p=%v: Joined lock at %d broken", p, i)
				}
			default:
				free++
				if bd {
					set++
				}
			}
		}
		switch p {
		case 0:
			if set != 0 {
				t.Errorf("p=0: %d boundaries at free gaps", set)
			}
		case 1:
			if set != free {
				t.Errorf("p=1: %d of %d free gaps are boundaries", set, free)
			}
		default:
			// Binomial(free, p): mean free*p, sd sqrt(free*p*(1-p)).
			mean, sd := float64(free)*p, math.Sqrt(float64(free)*p*(1-p))
			if math.Abs(float64(set)-mean) > 5*sd {
				t.Errorf("p=%v: %d of %d free gaps are boundaries, want %.0f ± %.0f", p, set, free, mean, 5*sd)
			}
		}
	}
	a := RandomSegmentation(c, 0.5, rand.New(rand.NewPCG(1, 2)))
	z := RandomSegmentation(c, 0.5, rand.New(rand.NewPCG(3, 4)))
	if slices.Equal(a.Boundary, z.Boundary) {
		t.Errorf("different seeds gave the same segmentation of %d gaps", len(a.Boundary))
	}
}

// TestSegmentationClone checks that a clone shares the corpus but not the
// boundaries.
func TestSegmentationClone(t *testing.T) {
	c := segmentationCorpus(t, "abc d")
	s := NewSegmentation(c)
	k := s.Clone()
	if k.Corpus != c || !slices.Equal(k.Boundary, s.Boundary) {
		t.Fatalf("clone differs: %v vs %v", k.Boundary, s.Boundary)
	}
	k.Boundary[1] = true
	if s.Boundary[1] {
		t.Errorf("changing the clone changed the original")
	}
}
