package segment

import (
	"math"
	"math/rand/v2"
)

// WordsGibbs samples the gaps of a Segmentation one at a time under a Words
// model, as in Goldwater, Griffiths & Johnson (2009), but with exact
// treatment of the seating: each step proposes the opposite decision at one
// gap, seats the proposed words' customers one by one (each from its
// conditional), and accepts with the Metropolis-Hastings probability
//
//	min(1, prod_new P(w | earlier) / prod_old P(w | earlier))
//
// where each product runs over the customers that differ between the two
// decisions, each predictive taken with the customers before it seated.
// The current decision's product is read off while its customers are
// removed in reverse order. The ratio is the joint probability ratio
// divided by the seating proposal ratio, so the chain leaves the joint
// distribution of segmentation and seating invariant; for a binary choice
// this Metropolised Gibbs step mixes at least as well as Gibbs sampling
// (Liu 1996, "Peskun's theorem and a modified discrete-state Gibbs sampler").
// With an adaptive base (NgramBase) the units of a word whose unigram-level
// table opens or closes are customers too, and their sequential
// probabilities enter the products (see Words.addBase).
type WordsGibbs struct {
	Seg   *Segmentation
	Model *Words

	// Factor, when not nil, multiplies the target by Factor^Weight.
	Factor UtteranceFactor
	Weight float64

	journal journal
	marks   []int
	acceptance
}

// NewWordsGibbs seats s in m and returns a sampler over both. m must be
// empty.
func NewWordsGibbs(s *Segmentation, m *Words, rng *rand.Rand) *WordsGibbs {
	if m.tokens != 0 {
		panic("segment: NewWordsGibbs needs an empty model")
	}
	m.AddSegmentation(s, rng)
	return &WordsGibbs{Seg: s, Model: m}
}

// Sweep visits every free gap once, in corpus order, with the acceptance
// ratio raised to the power 1/temperature.
func (g *WordsGibbs) Sweep(temperature float64, rng *rand.Rand) {
	c := g.Seg.Corpus
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		for i := start + 1; i < end; i++ {
			if c.LockAt(i) == Free {
				g.step(u, i, start, end, temperature, rng)
			}
		}
	}
}

// customer is one word token with the word before it.
type customer struct{ prev, w WordType }

// step proposes flipping the gap before unit i of utterance [us, ue).
func (g *WordsGibbs) step(u, i, us, ue int, temperature float64, rng *rand.Rand) {
	b := g.Seg.Boundary
	m := g.Model
	l := i - 1
	for l > us && !b[l] {
		l--
	}
	r := i + 1
	for r < ue && !b[r] {
		r++
	}
	prev, next := End, End
	if m.Order == 2 {
		if l > us {
			p := l - 1
			for p > us && !b[p] {
				p--
			}
			prev = m.Intern(p, l)
		}
		if r < ue {
			n := r + 1
			for n < ue && !b[n] {
				n++
			}
			next = m.Intern(r, n)
		}
	}
	g.marks = m.mark(g.marks)
	whole := m.Intern(l, r)
	first := m.Intern(l, i)
	second := m.Intern(i, r)

	var joined, split [3]customer
	joined[0], joined[1] = customer{prev, whole}, customer{whole, next}
	split[0], split[1], split[2] = customer{prev, first}, customer{first, second}, customer{second, next}
	nJoined, nSplit := 1, 2
	if m.Order == 2 {
		nJoined, nSplit = 2, 3
	}
	old, proposed := joined[:nJoined], split[:nSplit]
	if b[i] {
		old, proposed = proposed, old
	}

	g.journal.reset()
	tokensBefore := m.tokens
	logOld := 0.0
	for k := len(old) - 1; k >= 0; k-- {
		logOld += m.remove(old[k].prev, old[k].w, rng, &g.journal)
	}
	logNew := 0.0
	for _, cu := range proposed {
		logNew += m.add(cu.prev, cu.w, rng, &g.journal)
	}
	logRatio := logNew - logOld + m.logEnds(m.tokens) - m.logEnds(tokensBefore)
	factor := 0.0
	if g.Factor != nil {
		if b[i] {
			factor = g.Factor.JoinDelta(u, int32(first), int32(second), int32(whole))
		} else {
			factor = g.Factor.SplitDelta(u, int32(whole), int32(first), int32(second))
		}
		logRatio += g.Weight * factor
	}
	g.steps++
	if logRatio >= 0 || math.Log(rng.Float64()) < logRatio/temperature {
		if g.Factor != nil {
			if b[i] {
				g.Factor.Join(u, int32(first), int32(second), int32(whole))
			} else {
				g.Factor.Split(u, int32(whole), int32(first), int32(second))
			}
		}
		b[i] = !b[i]
		g.accepts++
		g.journal.releaseEmpty()
		return
	}
	g.journal.undo()
	m.tokens = tokensBefore
	m.forget(g.marks)
}
