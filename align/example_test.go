package align_test

import (
	"fmt"
	"strings"

	"github.com/juncture-project/juncture/align"
)

func ExampleTokenize() {
	fmt.Printf("%q\n", align.Tokenize("Don’t cross the STRAẞE—it’s 3.5 km!"))
	// Output:
	// ["don't" "cross" "the" "strasse" "it's" "3.5" "km"]
}

// The example corpus is the EM example of Koehn's Statistical Machine
// Translation (2010), section 4.2, with one more pair: German words, as a
// segmentation would give them, and English translations.
func ExampleModel() {
	translations, err := align.ReadTranslations(strings.NewReader(
		"the house\nthe book\na book\na house\n"), "en.txt", nil)
	if err != nil {
		panic(err)
	}
	types := []string{"das", "Haus", "Buch", "ein", "dasHaus"}
	words := [][]int32{{0, 1}, {0, 2}, {3, 2}, {3, 1}} // das Haus, das Buch, ein Buch, ein Haus

	m := align.NewModel(translations.Tokens, 0.1)
	m.Estimate(words, 20)
	for _, w := range []int32{1, 3} {
		for _, g := range m.Glosses(w, 2, 2) {
			fmt.Printf("%s: %s t=%.2f n=%.2f score=%.2f\n", types[w], g.Word, g.Prob, g.Count, g.Score)
		}
	}

	// A sampler asks what joining "das" and "Haus" into one unseen word
	// would do to the first utterance's translation probability.
	sums := m.NewSums(words)
	fmt.Printf("log P(the house | das Haus) = %.3f\n", sums.LogProb(0))
	fmt.Printf("joining into dasHaus changes it by %.3f\n", sums.JoinDelta(0, 0, 1, 4))
	// Output:
	// Haus: house t=0.93 n=1.54 score=2.01
	// ein: a t=0.93 n=1.54 score=2.01
	// log P(the house | das Haus) = -1.823
	// joining into dasHaus changes it by -0.950
}

// With LeaveOneOut each utterance is scored with the table learned from
// the others. "Kuh" occurs once: the full table lets it explain its own
// "cow", the cross-validated one knows nothing of it, while a pair seen
// elsewhere loses little.
func ExampleModel_leaveOneOut() {
	translations, err := align.ReadTranslations(strings.NewReader(
		"the house\nthe book\na book\na house\nthe cow\n"), "en.txt", nil)
	if err != nil {
		panic(err)
	}
	words := [][]int32{{0, 1}, {0, 2}, {3, 2}, {3, 1}, {0, 4}} // ..., das Kuh
	for _, loo := range []bool{false, true} {
		m := align.NewModel(translations.Tokens, 0.1)
		m.LeaveOneOut = loo
		m.Estimate(words, 20)
		fmt.Printf("leave-one-out %v: log P(the cow | das Kuh) = %.3f, log P(the house | das Haus) = %.3f\n",
			loo, m.LogProb(4, words[4]), m.LogProb(0, words[0]))
	}
	// Output:
	// leave-one-out false: log P(the cow | das Kuh) = -1.836, log P(the house | das Haus) = -1.674
	// leave-one-out true: log P(the cow | das Kuh) = -3.835, log P(the house | das Haus) = -1.796
}
