package lexicon

import (
	"reflect"
	"strings"
	"testing"

	"github.com/juncture-project/juncture/segment"
)

func TestBuild(t *testing.T) {
	c, err := segment.ReadCorpus(strings.NewReader("abab\n\nbab"), "t", segment.ReadOptions{})
	if err != nil {
		t.Fatal(err)
	}
	seg := segment.NewSegmentation(c)
	// "ab ab" and "b ab"
	seg.Boundary[2] = true
	seg.Boundary[5] = true
	post := []float64{1, 0.1, 0.8, 0, 1, 0.6, 0.2}
	got := Build(seg, post)
	want := []Entry{
		{Form: "ab", Count: 3, Confidence: (0.8 + 0.8 + 0.6) / 3, Lines: []int{1, 1, 3}},
		{Form: "b", Count: 1, Confidence: 0.6, Lines: []int{3}},
	}
	if len(got) != len(want) {
		t.Fatalf("got %+v", got)
	}
	for i := range want {
		if got[i].Form != want[i].Form || got[i].Count != want[i].Count || !reflect.DeepEqual(got[i].Lines, want[i].Lines) ||
			abs(got[i].Confidence-want[i].Confidence) > 1e-12 {
			t.Errorf("entry %d: got %+v, want %+v", i, got[i], want[i])
		}
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
