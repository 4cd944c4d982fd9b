package segment_test

import (
	"bytes"
	"context"
	"errors"
	"math/rand/v2"
	"reflect"
	"runtime"
	"strings"
	"sync"
	"testing"

	. "github.com/juncture-project/juncture/segment"
)

// syntheticCorpus makes n utterances of 1-4 words drawn from a small
// made-up vocabulary, seeded, for tests of run mechanics (not accuracy).
func syntheticCorpus(t testing.TB, n int) *Corpus {
	vocab := []string{"ba", "kitu", "mo", "lesa", "ni", "ropa", "e", "tumbi"}
	rng := rand.New(rand.NewPCG(42, 42))
	var b strings.Builder
	for i := 0; i < n; i++ {
		k := 1 + rng.IntN(4)
		for j := 0; j < k; j++ {
			b.WriteString(vocab[rng.IntN(len(vocab))])
		}
		b.WriteByte('\n')
	}
	return tinyCorpus(t, strings.Split(strings.TrimSpace(b.String()), "\n")...)
}

// runConfig returns a short run of model; "MODEL/phonotactics" adds the
// vowels as nuclei and the phonotactic base.
func runConfig(model string) Config {
	cfg := DefaultConfig()
	if m, ok := strings.CutSuffix(model, "/phonotactics"); ok {
		model = m
		cfg.Nuclei, cfg.Phonotactics = []string{"a", "e", "i", "o", "u"}, true
	}
	cfg.Model = model
	cfg.Iterations, cfg.Burnin, cfg.Block, cfg.Chains = 40, 20, 7, 2
	cfg.Seed = 5
	return cfg
}

func output(t *testing.T, res *Result) string {
	var b bytes.Buffer
	if err := res.Decoded.Write(&b); err != nil {
		t.Fatal(err)
	}
	return b.String()
}

// TestRunIndependentOfThreads: chains run in goroutines, yet the result
// depends on the seed only.
func TestRunIndependentOfThreads(t *testing.T) {
	c := syntheticCorpus(t, 60)
	for _, model := range []string{"unigram", "bigram", "collocation", "bigram/phonotactics", "collocation/phonotactics"} {
		cfg := runConfig(model)
		var outs []string
		var posts [][]float64
		var traces [][]TracePoint
		for _, procs := range []int{1, 2, 4} {
			old := runtime.GOMAXPROCS(procs)
			res, err := Run(context.Background(), c, cfg, nil, RunOptions{})
			runtime.GOMAXPROCS(old)
			if err != nil {
				t.Fatal(err)
			}
			outs = append(outs, output(t, res))
			posts = append(posts, res.Posterior)
			traces = append(traces, res.Chains[0].Trace)
		}
		for i := 1; i < len(outs); i++ {
			if outs[i] != outs[0] || !reflect.DeepEqual(posts[i], posts[0]) || !reflect.DeepEqual(traces[i], traces[0]) {
				t.Errorf("%s: output differs with GOMAXPROCS", model)
			}
		}
		cfg.Seed++
		res, err := Run(context.Background(), c, cfg, nil, RunOptions{})
		if err != nil {
			t.Fatal(err)
		}
		// On this easy corpus two seeds may well end in one segmentation;
		// the way there (the trace of log probabilities) must differ.
		if reflect.DeepEqual(res.Chains[0].Trace, traces[0]) {
			t.Errorf("%s: another seed gave the same chain", model)
		}
	}
}

// TestRunConcurrentOnOneCorpus: several runs may learn from one corpus at
// once (the evaluation scripts do), each giving what it gives alone on a
// fresh copy of the corpus. Under the race detector this also checks that
// building the corpus's span index does not race with the other runs.
func TestRunConcurrentOnOneCorpus(t *testing.T) {
	shared := syntheticCorpus(t, 60)
	configs := []Config{runConfig("unigram"), runConfig("bigram"), runConfig("bigram"), runConfig("collocation")}
	configs[1].Sampler, configs[2].Sampler = "blocked", "boundary"
	want := make([]string, len(configs))
	for i, cfg := range configs {
		res, err := Run(context.Background(), syntheticCorpus(t, 60), cfg, nil, RunOptions{})
		if err != nil {
			t.Fatal(err)
		}
		want[i] = output(t, res)
	}
	got := make([]string, len(configs))
	errs := make([]error, len(configs))
	var wg sync.WaitGroup
	for i, cfg := range configs {
		wg.Add(1)
		go func() {
			defer wg.Done()
			res, err := Run(context.Background(), shared, cfg, nil, RunOptions{})
			if errs[i] = err; err == nil {
				got[i] = output(t, res)
			}
		}()
	}
	wg.Wait()
	for i := range configs {
		if errs[i] != nil {
			t.Fatal(errs[i])
		}
		if got[i] != want[i] {
			t.Errorf("run %d (%s/%s) on the shared corpus differs from the same run alone", i, configs[i].Model, configs[i].Sampler)
		}
	}
}

// TestRunResumeIdentical stops a run after some checkpoints, resumes from
// the checkpointed states and compares with an uninterrupted run.
func TestRunResumeIdentical(t *testing.T) {
	c := syntheticCorpus(t, 60)
	for _, model := range []string{"unigram", "bigram", "collocation", "bigram/phonotactics", "collocation/phonotactics"} {
		cfg := runConfig(model)
		full, err := Run(context.Background(), c, cfg, nil, RunOptions{})
		if err != nil {
			t.Fatal(err)
		}
		for _, stopAfter := range []int{1, 3, 6} {
			ctx, cancel := context.WithCancel(context.Background())
			var mu sync.Mutex
			saved := make([]*ChainState, cfg.Chains)
			n := 0
			checkpoint := func(st *ChainState) error {
				mu.Lock()
				defer mu.Unlock()
				cp := *st
				cp.Boundary = append([]bool(nil), st.Boundary...)
				cp.BoundaryCounts = append([]uint32(nil), st.BoundaryCounts...)
				cp.Groups = append([]bool(nil), st.Groups...)
				cp.Trace = append([]TracePoint(nil), st.Trace...)
				saved[st.Index] = &cp
				if n++; n == stopAfter {
					cancel()
				}
				return nil
			}
			_, err := Run(ctx, c, cfg, nil, RunOptions{Checkpoint: checkpoint})
			if !errors.Is(err, context.Canceled) {
				t.Fatalf("stopped run: err = %v", err)
			}
			for i := range saved {
				if saved[i] == nil {
					saved[i] = InitialState(c, cfg, i)
				}
			}
			resumed, err := Run(context.Background(), c, cfg, saved, RunOptions{})
			if err != nil {
				t.Fatal(err)
			}
			if output(t, resumed) != output(t, full) || !reflect.DeepEqual(resumed.Posterior, full.Posterior) {
				t.Errorf("%s: resumed after %d checkpoints differs from uninterrupted run", model, stopAfter)
			}
			for i := range full.Chains {
				if !reflect.DeepEqual(full.Chains[i].Trace, resumed.Chains[i].Trace) {
					t.Errorf("%s: chain %d trace differs after resume", model, i)
				}
			}
		}
	}
}

// TestDecodeMinimumBayesRisk checks the decision rule: a boundary exactly
// where more than half the samples have one.
func TestDecodeMinimumBayesRisk(t *testing.T) {
	c := tinyCorpus(t, "abcd")
	st := []*ChainState{
		{Samples: 4, BoundaryCounts: []uint32{4, 3, 2, 0}},
		{Samples: 2, BoundaryCounts: []uint32{2, 1, 2, 2}},
	}
	res := Decode(c, st)
	want := []float64{1, 4.0 / 6, 4.0 / 6, 2.0 / 6}
	if !reflect.DeepEqual(res.Posterior, want) {
		t.Errorf("posterior %v, want %v", res.Posterior, want)
	}
	if got := strings.Join(res.Decoded.WordStrings(0), " "); got != "a b cd" {
		t.Errorf("decoded %q, want %q", got, "a b cd")
	}
}

// TestRunStopsWhenConverged: with a convergence threshold the run may end
// before the iteration cap, the same way every time, and a resumed run
// agrees.
func TestRunStopsWhenConverged(t *testing.T) {
	c := syntheticCorpus(t, 60)
	cfg := runConfig("unigram")
	cfg.Iterations, cfg.Burnin, cfg.Block, cfg.Chains = 400, 20, 10, 1
	cfg.Converge = 1.1
	a, err := Run(context.Background(), c, cfg, nil, RunOptions{})
	if err != nil {
		t.Fatal(err)
	}
	it := a.Chains[0].Iteration
	if it >= cfg.Iterations || !a.Chains[0].Stopped {
		t.Fatalf("did not stop early: iteration %d of %d", it, cfg.Iterations)
	}
	b, err := Run(context.Background(), c, cfg, nil, RunOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if output(t, a) != output(t, b) || b.Chains[0].Iteration != it {
		t.Error("a converging run is not reproducible")
	}
	t.Logf("stopped after %d of %d iterations", it, cfg.Iterations)

	// Two chains of this seed settle in different segmentations (172 and
	// 159 words): they disagree, so the run must not stop early.
	cfg.Chains = 2
	d, err := Run(context.Background(), c, cfg, nil, RunOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if d.Chains[0].Stopped || d.Chains[0].Iteration != cfg.Iterations {
		t.Errorf("chains in different modes stopped at iteration %d", d.Chains[0].Iteration)
	}
}

// TestCollocationStartFromOtherBoundaries: a chain state whose word
// boundaries were replaced (benchtable -start gold sets a reference
// segmentation) keeps only the collocation starts that are still word
// boundaries, instead of failing.
func TestCollocationStartFromOtherBoundaries(t *testing.T) {
	c := syntheticCorpus(t, 40)
	cfg := runConfig("collocation")
	cfg.Chains = 1
	st := InitialState(c, cfg, 0)
	st.Boundary = NewSegmentation(c).Boundary // one word per utterance
	if _, err := Run(context.Background(), c, cfg, []*ChainState{st}, RunOptions{}); err != nil {
		t.Fatal(err)
	}
}
