package segment

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
)

// Hyper is the set of hyperparameters a chain carries between iterations.
type Hyper struct {
	Alpha0    float64 `json:"alpha0"`
	Alpha1    float64 `json:"alpha1"`
	Discount0 float64 `json:"discount0"`
	Discount1 float64 `json:"discount1"`
	WordEnd   float64 `json:"word_end"`
	// GroupEnd is the collocation model's g.
	GroupEnd float64 `json:"group_end,omitempty"`
	// Ngram holds the character model's levels when the base is "ngram".
	Ngram []PitmanYor `json:"ngram,omitempty"`
}

// TracePoint records one iteration of a chain.
type TracePoint struct {
	Iteration   int     `json:"iteration"`
	Temperature float64 `json:"temperature"`
	LogProb     float64 `json:"log_prob"`
	Hyper       Hyper   `json:"hyper"`
	Acceptance  float64 `json:"acceptance"`
	Words       int     `json:"words"`
}

// ChainState is everything a chain needs to continue: its segmentation,
// hyperparameters, boundary counts since burn-in, and traces. A chain is
// rebuilt from its ChainState at the start of every block of
// Config.Block iterations, in an uninterrupted run as after a resume, so
// resuming gives the same result as not stopping.
type ChainState struct {
	Index     int    `json:"index"`
	Iteration int    `json:"iteration"` // sweeps completed
	Hyper     Hyper  `json:"hyper"`
	Boundary  []bool `json:"-"`
	// Groups marks the units that start a collocation (collocation model
	// only; nil otherwise).
	Groups []bool `json:"-"`
	// BoundaryCounts[i] counts the samples after burn-in with a boundary
	// before unit i; Samples is their number.
	BoundaryCounts []uint32 `json:"-"`
	Samples        int      `json:"samples"`
	// Stopped is set when the run ended early because its chains agreed.
	Stopped bool         `json:"stopped,omitempty"`
	Trace   []TracePoint `json:"trace"`
}

// blockRand returns the random source for one block of one chain.
func blockRand(seed uint64, chain, block int) *rand.Rand {
	return rand.New(rand.NewPCG(seed^0x6A09E667F3BCC909, uint64(chain)<<32|uint64(uint32(block))))
}

// InitialState returns chain index's state before its first sweep.
func InitialState(c *Corpus, cfg Config, index int) *ChainState {
	rng := blockRand(cfg.Seed, index, -1)
	seg := RandomSegmentation(c, cfg.InitialBoundary, rng)
	if nuc := nucleiFor(c, cfg); nuc != nil {
		nuc.Repair(seg)
	}
	st := &ChainState{
		Index: index,
		Hyper: Hyper{Alpha0: cfg.Alpha0, Alpha1: cfg.Alpha1, Discount0: cfg.Discount0,
			Discount1: cfg.Discount1, WordEnd: cfg.WordEnd},
		Boundary:       seg.Boundary,
		BoundaryCounts: make([]uint32, len(c.Units)),
	}
	if cfg.Model == "collocation" {
		st.Hyper.GroupEnd = 0.5
		st.Groups = randomGroups(c, seg.Boundary, rng)
	}
	return st
}

// randomGroups starts a collocation at every utterance start and at each
// other word boundary with probability 1/2.
func randomGroups(c *Corpus, boundary []bool, rng *rand.Rand) []bool {
	groups := make([]bool, len(boundary))
	for u := 0; u < c.Len(); u++ {
		start, end := c.Utterance(u)
		groups[start] = true
		for i := start + 1; i < end; i++ {
			groups[i] = boundary[i] && rng.IntN(2) == 0
		}
	}
	return groups
}

// nucleiFor returns the nucleus index cfg asks for, nil if none (or if a
// nucleus is not a unit of c, which Run reports before any chain starts).
func nucleiFor(c *Corpus, cfg Config) *Nuclei {
	if len(cfg.Nuclei) == 0 {
		return nil
	}
	nuc, err := NewNuclei(c, cfg.Nuclei)
	if err != nil {
		return nil
	}
	return nuc
}

// uniformBaseFor returns the uniform base cfg asks for, with p# wordEnd.
// Its phonotactics are estimated once per corpus and shared.
func uniformBaseFor(c *Corpus, cfg Config, wordEnd float64) UniformBase {
	b := UniformBase{WordEnd: wordEnd, Units: max(1, len(c.Inventory)), Nuclei: nucleiFor(c, cfg)}
	if cfg.Phonotactics && b.Nuclei != nil {
		b.Shapes = c.phonotactics(b.Nuclei, cfg.PhonotacticsBeta, cfg.MaxWordLength)
	}
	return b
}

// newModel builds the model cfg asks for with hyperparameters h.
func newModel(c *Corpus, cfg Config, h Hyper) *Words {
	order := 1
	if cfg.Model == "bigram" {
		order = 2
	}
	var base Base = uniformBaseFor(c, cfg, h.WordEnd)
	if cfg.Base == "ngram" {
		levels := h.Ngram
		if len(levels) != cfg.NgramOrder {
			levels = DefaultNgramLevels(cfg.NgramOrder)
		}
		base = NewNgramBase(max(1, len(c.Inventory)), cfg.NgramOrder, append([]PitmanYor(nil), levels...))
	}
	m := NewWords(c, order, PitmanYor{h.Discount0, h.Alpha0}, PitmanYor{h.Discount1, h.Alpha1}, base)
	m.Rho = cfg.Rho
	return m
}

func (m *Words) hyper() Hyper {
	h := Hyper{Alpha0: m.Unigram.Concentration, Alpha1: m.Bigram.Concentration,
		Discount0: m.Unigram.Discount, Discount1: m.Bigram.Discount}
	switch b := m.Base.(type) {
	case UniformBase:
		h.WordEnd = b.WordEnd
	case *NgramBase:
		h.Ngram = append([]PitmanYor(nil), b.Levels...)
	}
	return h
}

// runBlock advances st by up to cfg.Block iterations, ending at a block
// boundary or at cfg.Iterations.
func runBlock(ctx context.Context, c *Corpus, cfg Config, st *ChainState, progress func(), factor FactorBuilder) error {
	block := st.Iteration / cfg.Block
	rng := blockRand(cfg.Seed, st.Index, block)
	seg := &Segmentation{Corpus: c, Boundary: st.Boundary}
	var m chainModel
	var g sampler
	if cfg.Model == "collocation" {
		if factor != nil {
			return fmt.Errorf("the collocation model takes no translation factor")
		}
		if st.Groups == nil {
			st.Groups = append([]bool(nil), st.Boundary...)
		}
		for i, g := range st.Groups {
			// A collocation starts at a word boundary; a state whose
			// boundaries were set from elsewhere (a reference
			// segmentation) keeps only the group starts that still are.
			st.Groups[i] = g && st.Boundary[i]
		}
		cm := NewCollocations(c, PitmanYor{st.Hyper.Discount0, st.Hyper.Alpha0}, PitmanYor{st.Hyper.Discount1, st.Hyper.Alpha1},
			uniformBaseFor(c, cfg, st.Hyper.WordEnd), st.Hyper.GroupEnd)
		cm.Rho = cfg.Rho
		m, g = cm, NewCollocationSampler(seg, st.Groups, cm, cfg.MaxWordLength, rng)
	} else {
		wm := newModel(c, cfg, st.Hyper)
		m = wm
		if cfg.SamplerFor(c) == "blocked" {
			bs := NewBlockedSampler(seg, wm, cfg.MaxWordLength, rng)
			bs.UnigramProposal = cfg.Proposal == "unigram"
			if factor != nil {
				bs.Factor, bs.Weight = factor(utteranceWords(seg, wm), wm.wordLength), cfg.TranslationWeight
			}
			g = bs
		} else {
			gs := NewWordsGibbs(seg, wm, rng)
			if factor != nil {
				gs.Factor, gs.Weight = factor(utteranceWords(seg, wm), wm.wordLength), cfg.TranslationWeight
			}
			g = gs
		}
	}
	stop := min(cfg.Iterations, (block+1)*cfg.Block)
	for st.Iteration < stop {
		if err := ctx.Err(); err != nil {
			return err
		}
		temp := cfg.temperature(st.Iteration)
		g.resetRate()
		g.Sweep(temp, rng)
		if temp == 1 {
			m.SampleHyperparameters(cfg.Fixed, rng)
		}
		st.Iteration++
		if st.Iteration > cfg.Burnin {
			for i, b := range seg.Boundary {
				if b {
					st.BoundaryCounts[i]++
				}
			}
			st.Samples++
		}
		st.Trace = append(st.Trace, TracePoint{Iteration: st.Iteration, Temperature: temp,
			LogProb: finiteForJSON(m.LogJoint()), Hyper: m.hyper(), Acceptance: g.AcceptanceRate(), Words: m.wordTokens()})
		if progress != nil {
			progress()
		}
	}
	st.Hyper = m.hyper()
	return nil
}

// finiteForJSON returns x, or the largest finite float64 of its sign if x
// is infinite: a state the model gives probability 0 (a start that breaks
// a constraint the sampler then repairs) has log probability -Inf, which
// JSON cannot hold, and a checkpoint must not fail on it.
func finiteForJSON(x float64) float64 {
	switch {
	case math.IsInf(x, -1):
		return -math.MaxFloat64
	case math.IsInf(x, 1):
		return math.MaxFloat64
	}
	return x
}

// chainModel is what a chain needs of a model.
type chainModel interface {
	SampleHyperparameters(Fixed, *rand.Rand)
	LogJoint() float64
	hyper() Hyper
	wordTokens() int
}

func (m *Words) wordTokens() int { return m.tokens }

func (m *Collocations) wordTokens() int { return m.Tokens() }

func (m *Collocations) hyper() Hyper {
	return Hyper{Alpha0: m.Word.Concentration, Alpha1: m.Group.Concentration,
		Discount0: m.Word.Discount, Discount1: m.Group.Discount,
		WordEnd: m.Base.WordEnd, GroupEnd: m.GroupEnd}
}

// sampler is what a chain needs of a sampler.
type sampler interface {
	Sweep(temperature float64, rng *rand.Rand)
	AcceptanceRate() float64
	resetRate()
}

// acceptance counts a Metropolis-Hastings sampler's proposals.
type acceptance struct{ accepts, steps int }

// AcceptanceRate returns the fraction of accepted proposals since the
// counts were last reset.
func (a *acceptance) AcceptanceRate() float64 {
	if a.steps == 0 {
		return 0
	}
	return float64(a.accepts) / float64(a.steps)
}

func (a *acceptance) resetRate() { a.accepts, a.steps = 0, 0 }

// temperature returns the temperature of iteration k: the schedule runs
// over the burn-in and sampling after it is at temperature 1.
func (cfg Config) temperature(k int) float64 {
	if k >= cfg.Burnin {
		return 1
	}
	s := cfg.Schedule
	if s == nil {
		s = Annealed
	}
	return s(k, cfg.Burnin)
}

// runOneBlock advances st by one block and checkpoints it. On error st
// is left at its last completed block.
func runOneBlock(ctx context.Context, c *Corpus, cfg Config, st *ChainState, progress func(), opts RunOptions) error {
	if len(st.Boundary) != len(c.Units) || len(st.BoundaryCounts) != len(c.Units) {
		return fmt.Errorf("chain %d: state does not fit the corpus", st.Index)
	}
	work := st.clone()
	if err := runBlock(ctx, c, cfg, work, progress, opts.Factor); err != nil {
		return err
	}
	*st = *work
	if opts.Checkpoint != nil {
		return opts.Checkpoint(st)
	}
	return nil
}

func (st *ChainState) clone() *ChainState {
	cp := *st
	cp.Boundary = append([]bool(nil), st.Boundary...)
	cp.BoundaryCounts = append([]uint32(nil), st.BoundaryCounts...)
	if st.Groups != nil {
		cp.Groups = append([]bool(nil), st.Groups...)
	}
	cp.Trace = append([]TracePoint(nil), st.Trace...)
	return &cp
}
