package main

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math/rand/v2"
	"os/exec"
	"time"

	"github.com/juncture-project/juncture/scripts/internal/evalcorpus"
	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/score"
)

// childArg is the hidden argument that makes the program run one job,
// read as JSON from standard input, and print its result as JSON.
const childArg = "-benchtable-child-job"

// job is one run: a corpus, a configuration and a seed (in Config).
type job struct {
	// Mode is "learn" (score the result) or "scale" (time only).
	Mode   string            `json:"mode"`
	Source evalcorpus.Source `json:"source"`
	// Lines is how many utterances of the corpus to use (0: all).
	Lines int `json:"lines"`
	// Scale is how many shuffled copies of those utterances to learn
	// from, in scale mode.
	Scale int `json:"scale"`
	// Start is "random" or "gold": the first segmentation of each chain.
	Start  string         `json:"start,omitempty"`
	Config segment.Config `json:"config"`
}

// result is what a job measured.
type result struct {
	Job        job           `json:"-"`
	Utterances int           `json:"utterances"`
	Units      int           `json:"units"`
	Scores     *score.Scores `json:"scores,omitempty"`
	// Seconds is the wall-clock time of segment.Run.
	Seconds float64 `json:"seconds"`
	// SecondsPerSweep is the wall-clock time per iteration of the run
	// (all chains) between the end of the first sweep and the end of the
	// last, or Seconds over the iterations for a run too short for that.
	// It includes the per-sweep trace and hyperparameter sampling and the
	// model rebuilds at block starts.
	SecondsPerSweep float64 `json:"seconds_per_sweep"`
	// CPUSecondsPerSweep is the same span measured in the process's CPU
	// time (user and system, every thread), or 0 where the system does not
	// report it. On a machine shared with other work it varies less than
	// wall-clock time, which stretches whenever another process holds a
	// core.
	CPUSecondsPerSweep float64 `json:"cpu_seconds_per_sweep"`
	// LogJoint is the mean over chains of the log joint probability of
	// each chain's last sample (the model's trace value), to compare where
	// different starts or settings end up under the same model.
	LogJoint float64 `json:"log_joint"`
	// PeakKB is the child's peak resident set size in KiB.
	PeakKB int64 `json:"-"`
}

// scaleStream is the stream of the PCG source that shuffles a scaled
// corpus, apart from the learner's streams of the same seed.
const scaleStream = 0x5CA1E

// childMain runs the job read from r and writes its result to w.
func childMain(r io.Reader, w io.Writer) error {
	var j job
	if err := json.NewDecoder(r).Decode(&j); err != nil {
		return fmt.Errorf("reading the job: %w", err)
	}
	res, err := j.run()
	if err != nil {
		return err
	}
	return json.NewEncoder(w).Encode(res)
}

// run loads the corpus, learns, and scores the result in learn mode.
func (j job) run() (*result, error) {
	utts, err := evalcorpus.Load(j.Source, j.Lines)
	if err != nil {
		return nil, err
	}
	if j.Mode == "scale" {
		utts = evalcorpus.Scale(utts, j.Scale, rand.New(rand.NewPCG(j.Config.Seed, scaleStream)))
	}
	c, err := evalcorpus.Corpus(j.Source.Name, utts)
	if err != nil {
		return nil, err
	}
	// Run serialises the calls of Progress, one after every sweep of any
	// chain.
	var first, last time.Time
	var firstCPU, lastCPU float64
	ticks := 0
	progress := func() {
		last, lastCPU = time.Now(), cpuSeconds()
		if ticks == 0 {
			first, firstCPU = last, lastCPU
		}
		ticks++
	}
	start := time.Now()
	var states []*segment.ChainState
	if j.Start == "gold" {
		gold, err := evalcorpus.GoldBoundaries(j.Source.Name, utts)
		if err != nil {
			return nil, err
		}
		if len(gold) != len(c.Units) {
			return nil, fmt.Errorf("%s: the reference has %d units, the input %d", j.Source.Name, len(gold), len(c.Units))
		}
		for i := range j.Config.Chains {
			st := segment.InitialState(c, j.Config, i)
			copy(st.Boundary, gold)
			states = append(states, st)
		}
	}
	learned, err := segment.Run(context.Background(), c, j.Config, states, segment.RunOptions{Progress: progress})
	if err != nil {
		return nil, err
	}
	res := &result{Utterances: c.Len(), Units: len(c.Units), Seconds: time.Since(start).Seconds()}
	res.SecondsPerSweep = res.Seconds / float64(j.Config.Iterations)
	if ticks > j.Config.Chains {
		// From the end of the first sweep to the end of the last: the
		// first model building and the decoding are left out.
		res.SecondsPerSweep = last.Sub(first).Seconds() / float64(ticks-1) * float64(j.Config.Chains)
		res.CPUSecondsPerSweep = (lastCPU - firstCPU) / float64(ticks-1) * float64(j.Config.Chains)
	}
	for _, st := range learned.Chains {
		if n := len(st.Trace); n > 0 {
			res.LogJoint += st.Trace[n-1].LogProb / float64(len(learned.Chains))
		}
	}
	if j.Mode == "learn" {
		s, err := evalcorpus.Score(learned.Decoded, utts)
		if err != nil {
			return nil, err
		}
		res.Scores = &s
	}
	return res, nil
}

// runChild runs j in a new process of the program at self and measures
// the process's peak memory. The child's standard error goes to stderr.
func runChild(self string, j job, stderr io.Writer) (result, error) {
	in, err := json.Marshal(j)
	if err != nil {
		return result{}, err
	}
	var out bytes.Buffer
	cmd := exec.Command(self, childArg)
	cmd.Stdin = bytes.NewReader(in)
	cmd.Stdout = &out
	cmd.Stderr = stderr
	if err := cmd.Run(); err != nil {
		return result{}, err
	}
	var res result
	if err := json.Unmarshal(out.Bytes(), &res); err != nil {
		return result{}, fmt.Errorf("reading the child's result: %w", err)
	}
	res.Job = j
	res.PeakKB = peakKB(cmd.ProcessState)
	return res, nil
}

// summary is a one-line progress report of res.
func (res result) summary() string {
	j := res.Job
	cfg := j.Config
	head := fmt.Sprintf("%s %s/%s/%s seed %d", j.Source.Name, cfg.Model, cfg.Sampler, cfg.Base, cfg.Seed)
	if res.Scores != nil {
		return fmt.Sprintf("%s: %d utterances, token F %.3f, boundary F %.3f, %.1f s, %.0f MiB",
			head, res.Utterances, res.Scores.Token.F, res.Scores.Boundary.F, res.Seconds, float64(res.PeakKB)/1024)
	}
	return fmt.Sprintf("%s %dx: %d utterances, %.4f s/sweep, %.0f MiB",
		head, j.Scale, res.Utterances, res.SecondsPerSweep, float64(res.PeakKB)/1024)
}
