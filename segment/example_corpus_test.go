package segment_test

import (
	"fmt"
	"log"
	"strings"

	"github.com/juncture-project/juncture/segment"
)

// ExampleReadCorpus reads two IPA lines. The tie bar joins t͡ʃ, the
// modifier letters ʷ and ː stay with the segment before them, the
// decomposed a + U+0303 becomes the single character ã (NFC), the stress
// mark is dropped by Ignore, and the empty line keeps its number.
func ExampleReadCorpus() {
	text := "\u02c8t\u0361\u0283a\u0303k\u02b7a\u02d0 ma\n\nd\u035c\u0292it\u02b0o\n"
	c, err := segment.ReadCorpus(strings.NewReader(text), "example.txt", segment.ReadOptions{Ignore: "\u02c8"})
	if err != nil {
		log.Fatal(err)
	}
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		var units []string
		for _, id := range c.Units[start:end] {
			units = append(units, c.Inventory[id])
		}
		fmt.Printf("line %d: %s\n", c.Lines[u], strings.Join(units, " · "))
	}
	fmt.Println(len(c.Inventory), "distinct units")
	// Output:
	// line 1: t͡ʃ · ã · kʷ · aː · m · a
	// line 3: d͜ʒ · i · tʰ · o
	// 10 distinct units
}
