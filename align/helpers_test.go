package align

import (
	"fmt"
	"math/rand/v2"
	"slices"
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

// mover is what the samplers change one word at a time: Sums and
// ReverseFactor.
type mover interface {
	SplitDelta(u int, w, w1, w2 int32) float64
	JoinDelta(u int, w1, w2, w int32) float64
	Split(u int, w, w1, w2 int32)
	Join(u int, w1, w2, w int32)
}

// randomMove splits a random word of utterance u (words ws) in two, or
// joins two neighbours, through mv, with word ids below 45 (those from 40
// up are words a table built from randomCorpus has never seen). It
// returns the new words and the change mv predicted before applying it.
func randomMove(rng *rand.Rand, mv mover, u int, ws []int32) (after []int32, predicted float64) {
	if len(ws) == 1 || rng.IntN(2) == 0 {
		i := rng.IntN(len(ws))
		w1, w2 := int32(rng.IntN(45)), int32(rng.IntN(45))
		after = slices.Concat(ws[:i], []int32{w1, w2}, ws[i+1:])
		predicted = mv.SplitDelta(u, ws[i], w1, w2)
		mv.Split(u, ws[i], w1, w2)
		return after, predicted
	}
	i := rng.IntN(len(ws) - 1)
	w := int32(rng.IntN(45))
	after = slices.Concat(ws[:i], []int32{w}, ws[i+2:])
	predicted = mv.JoinDelta(u, ws[i], ws[i+1], w)
	mv.Join(u, ws[i], ws[i+1], w)
	return after, predicted
}

// testSize is a word size for Model.Size: 1 to 4 units, by word id.
func testSize(w int32) float64 { return 1 + float64(w%4) }
