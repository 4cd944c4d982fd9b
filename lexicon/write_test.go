package lexicon_test

import (
	"os"

	"github.com/juncture-project/juncture/align"
	"github.com/juncture-project/juncture/lexicon"
)

func ExampleWriteTSV() {
	entries := []lexicon.Entry{
		{Form: "ʃara", Count: 12, Confidence: 0.9731, Lines: []int{3, 8, 11},
			Glosses: []align.Gloss{{Word: "fish", Prob: 0.61}, {Word: "river", Prob: 0.12}}},
		{Form: "ke", Count: 2, Confidence: 1, Lines: []int{5, 9}},
	}
	if err := lexicon.WriteTSV(os.Stdout, entries); err != nil {
		panic(err)
	}
	// Output:
	// form	count	confidence	glosses	lines
	// ʃara	12	0.973	fish (0.61); river (0.12)	3,8,11
	// ke	2	1.000		5,9
}
