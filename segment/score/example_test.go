package score_test

import (
	"fmt"
	"log"
	"os"
	"strings"

	"github.com/juncture-project/juncture/segment/score"
)

func ExampleCompare() {
	reference := [][]string{{"ab", "c", "de"}, {"c", "ab"}}
	predicted := [][]string{{"ab", "cde"}, {"c", "ab"}}
	s, err := score.Compare(reference, predicted)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("boundary P %.3f R %.3f F %.3f\n", s.Boundary.Precision, s.Boundary.Recall, s.Boundary.F)
	fmt.Printf("token    P %.3f R %.3f F %.3f\n", s.Token.Precision, s.Token.Recall, s.Token.F)
	fmt.Printf("lexicon  P %.3f R %.3f F %.3f\n", s.Lexicon.Precision, s.Lexicon.Recall, s.Lexicon.F)
	// Output:
	// boundary P 1.000 R 0.667 F 0.800
	// token    P 0.750 R 0.600 F 0.667
	// lexicon  P 0.667 R 0.667 F 0.667
}

func ExampleCompare_mismatch() {
	_, err := score.Compare([][]string{{"ab", "c"}, {"de"}}, [][]string{{"abc"}, {"d", "f"}})
	fmt.Println(err)
	// Output:
	// line 2: reference and prediction spell different text (first difference at character 2)
}

func ExampleScores_WriteTable() {
	gold, _, err := score.ReadSegmented(strings.NewReader("ʃa tʰə ʃa\nna mi\n"), "gold.txt")
	if err != nil {
		log.Fatal(err)
	}
	pred, _, err := score.ReadSegmented(strings.NewReader("ʃa tʰəʃa\nna mi\n"), "pred.txt")
	if err != nil {
		log.Fatal(err)
	}
	s, err := score.Compare(gold, pred)
	if err != nil {
		log.Fatal(err)
	}
	if err := s.WriteTable(os.Stdout); err != nil {
		log.Fatal(err)
	}
	// Output:
	//           precision  recall  F       correct  predicted  reference
	// boundary  1.0000     0.6667  0.8000  2        2          3
	// token     0.7500     0.6000  0.6667  3        4          5
	// lexicon   0.7500     0.7500  0.7500  3        4          4
	//
	// utterances  2
	// characters  11
	// windowdiff  0.1000  (window 1)
	// pk          0.1000  (window 1)
}
