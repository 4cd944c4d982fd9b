package align

import (
	"fmt"
	"math/rand/v2"
)

// randomCorpus returns n utterances of 1..maxWords word ids below nWords,
// drawn with Zipf-like weights, and translations generated from a hidden
// one-token dictionary with noise: each word emits its token with
// probability 0.6, and up to two random tokens are added. About one
// utterance in 20 has an empty translation, and tokens may repeat.
func randomCorpus(rng *rand.Rand, n, nWords, nTokens, maxWords int) (words [][]int32, translations [][]string) {
	dict := make([]int, nWords)
	for w := range dict {
		dict[w] = rng.IntN(nTokens)
	}
	zipf := rand.NewZipf(rng, 1.2, 1, uint64(nWords-1))
	for range n {
		k := 1 + rng.IntN(maxWords)
		ws := make([]int32, k)
		for i := range ws {
			ws[i] = int32(zipf.Uint64())
		}
		var tr []string
		if rng.IntN(20) > 0 {
			for _, w := range ws {
				if rng.Float64() < 0.6 {
					tr = append(tr, fmt.Sprintf("t%d", dict[w]))
				}
			}
			for range rng.IntN(3) {
				tr = append(tr, fmt.Sprintf("t%d", rng.IntN(nTokens)))
			}
		}
		words = append(words, ws)
		translations = append(translations, tr)
	}
	return words, translations
}

// seenWords returns the words of utterances with a translation, and Null.
func seenWords(m *Model, words [][]int32) []int32 {
	seen := map[int32]bool{Null: true}
	out := []int32{Null}
	for u, ws := range words {
		if len(m.Tokens(u)) == 0 {
			continue
		}
		for _, w := range ws {
			if !seen[w] {
				seen[w] = true
				out = append(out, w)
			}
		}
	}
	return out
}
