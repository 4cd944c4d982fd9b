package main

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
)

// stat is the mean and sample standard deviation (n-1 in the denominator;
// 0 for a single value) of one measure over seeds.
type stat struct {
	Mean float64 `json:"mean"`
	SD   float64 `json:"sd"`
}

// summarize returns the mean and sample standard deviation of xs.
func summarize(xs []float64) stat {
	if len(xs) == 0 {
		return stat{}
	}
	var sum float64
	for _, x := range xs {
		sum += x
	}
	mean := sum / float64(len(xs))
	if len(xs) == 1 {
		return stat{Mean: mean}
	}
	var ss float64
	for _, x := range xs {
		d := x - mean
		ss += float64(d * d) // the conversion forbids a fused multiply-add, for the same bits everywhere
	}
	return stat{Mean: mean, SD: math.Sqrt(ss / float64(len(xs)-1))}
}

// row is one line of the table: a configuration on a corpus at one scale,
// summarised over seeds.
type row struct {
	Corpus     string   `json:"corpus"`
	Model      string   `json:"model"`
	Base       string   `json:"base"`
	Sampler    string   `json:"sampler"`
	Scale      int      `json:"scale"`
	Utterances int      `json:"utterances"`
	Units      int      `json:"units"`
	Iterations int      `json:"iterations"`
	Chains     int      `json:"chains"`
	Seeds      []uint64 `json:"seeds"`
	// The F scores are absent in scale mode.
	TokenF    *stat `json:"token_f,omitempty"`
	BoundaryF *stat `json:"boundary_f,omitempty"`
	LexiconF  *stat `json:"lexicon_f,omitempty"`
	// Words is the number of words of the decoded segmentation (learn
	// mode) and LogJoint the log joint probability of the chains' last
	// samples: where a configuration ends up, beside how well.
	Words    *stat `json:"words,omitempty"`
	LogJoint stat  `json:"log_joint"`
	// Seconds is the wall-clock time of learning, SecondsPerSweep that of
	// one sweep (see result.SecondsPerSweep) and NsPerUnitSweep the latter
	// over the units.
	Seconds         stat `json:"seconds"`
	SecondsPerSweep stat `json:"seconds_per_sweep"`
	NsPerUnitSweep  stat `json:"ns_per_unit_sweep"`
	// Ratio is NsPerUnitSweep's mean over that of the same configuration
	// at the smallest scale; scale mode only.
	Ratio float64 `json:"ratio,omitempty"`
	// CPUNsPerUnitSweep and CPURatio are NsPerUnitSweep and Ratio from
	// the process's CPU time instead of wall-clock time (0 where it is not
	// measured): the figures to trust on a machine other work shares.
	CPUNsPerUnitSweep stat    `json:"cpu_ns_per_unit_sweep"`
	CPURatio          float64 `json:"cpu_ratio,omitempty"`
	PeakMiB           stat    `json:"peak_mib"`
}

// rowKey identifies the results a row summarises.
type rowKey struct {
	corpus, model, base, sampler string
	scale                        int
}

// aggregate groups results by corpus, configuration and scale, in the
// order of their first result, and summarises each group over its seeds.
// In scale mode (results without scores) it fills in Ratio.
func aggregate(results []result) []row {
	var (
		keys   []rowKey
		groups = map[rowKey][]result{}
	)
	for _, r := range results {
		cfg := r.Job.Config
		k := rowKey{r.Job.Source.Name, cfg.Model, cfg.Base, cfg.Sampler, r.Job.Scale}
		if _, ok := groups[k]; !ok {
			keys = append(keys, k)
		}
		groups[k] = append(groups[k], r)
	}
	rows := make([]row, len(keys))
	for i, k := range keys {
		g := groups[k]
		first := g[0]
		rw := row{Corpus: k.corpus, Model: k.model, Base: k.base, Sampler: k.sampler, Scale: k.scale,
			Utterances: first.Utterances, Units: first.Units,
			Iterations: first.Job.Config.Iterations, Chains: first.Job.Config.Chains}
		var tok, bnd, lex, words, joint, secs, perSweep, perUnit, cpuPerUnit, peak []float64
		for _, r := range g {
			rw.Seeds = append(rw.Seeds, r.Job.Config.Seed)
			if r.Scores != nil {
				tok = append(tok, r.Scores.Token.F)
				bnd = append(bnd, r.Scores.Boundary.F)
				lex = append(lex, r.Scores.Lexicon.F)
				words = append(words, float64(r.Scores.Counts.Token.Predicted))
			}
			joint = append(joint, r.LogJoint)
			sweep := r.SecondsPerSweep
			secs = append(secs, r.Seconds)
			perSweep = append(perSweep, sweep)
			perUnit = append(perUnit, sweep*1e9/float64(max(1, r.Units)))
			cpuPerUnit = append(cpuPerUnit, r.CPUSecondsPerSweep*1e9/float64(max(1, r.Units)))
			peak = append(peak, float64(r.PeakKB)/1024)
		}
		if len(tok) > 0 {
			t, b, l := summarize(tok), summarize(bnd), summarize(lex)
			w := summarize(words)
			rw.TokenF, rw.BoundaryF, rw.LexiconF, rw.Words = &t, &b, &l, &w
		}
		rw.LogJoint = summarize(joint)
		rw.Seconds, rw.SecondsPerSweep, rw.NsPerUnitSweep = summarize(secs), summarize(perSweep), summarize(perUnit)
		rw.CPUNsPerUnitSweep = summarize(cpuPerUnit)
		rw.PeakMiB = summarize(peak)
		rows[i] = rw
	}
	for i := range rows {
		if rows[i].TokenF != nil {
			continue
		}
		var smallest *row
		for j := range rows {
			if sameConfig(rows[i], rows[j]) && (smallest == nil || rows[j].Scale < smallest.Scale) {
				smallest = &rows[j]
			}
		}
		if smallest.NsPerUnitSweep.Mean > 0 {
			rows[i].Ratio = rows[i].NsPerUnitSweep.Mean / smallest.NsPerUnitSweep.Mean
		}
		if smallest.CPUNsPerUnitSweep.Mean > 0 {
			rows[i].CPURatio = rows[i].CPUNsPerUnitSweep.Mean / smallest.CPUNsPerUnitSweep.Mean
		}
	}
	return rows
}

// sameConfig says whether a and b are the same configuration on the same
// corpus (at any scale).
func sameConfig(a, b row) bool {
	return a.Corpus == b.Corpus && a.Model == b.Model && a.Base == b.Base && a.Sampler == b.Sampler
}

// writeRows writes rows as format "text" (aligned columns), "tsv" or
// "json". mode "learn" shows the F scores, "scale" the cost per sweep.
func writeRows(w io.Writer, rows []row, mode, format string) error {
	switch format {
	case "json":
		b, err := json.MarshalIndent(rows, "", "  ")
		if err != nil {
			return err
		}
		_, err = w.Write(append(b, '\n'))
		return err
	case "tsv":
		return writeTSV(w, rows)
	case "text":
		return writeText(w, rows, mode)
	}
	return fmt.Errorf("unknown format %q", format)
}

// tsvHeader names the TSV columns; every row has all of them, the F
// columns empty in scale mode and the ratio empty in learn mode.
var tsvHeader = []string{"corpus", "model", "base", "sampler", "scale", "utterances", "units",
	"iterations", "chains", "seeds",
	"token_f", "token_f_sd", "boundary_f", "boundary_f_sd", "lexicon_f", "lexicon_f_sd",
	"words", "words_sd", "log_joint", "log_joint_sd",
	"seconds", "seconds_sd", "seconds_per_sweep", "seconds_per_sweep_sd",
	"ns_per_unit_sweep", "ns_per_unit_sweep_sd", "ratio",
	"cpu_ns_per_unit_sweep", "cpu_ns_per_unit_sweep_sd", "cpu_ratio", "peak_mib", "peak_mib_sd"}

func writeTSV(w io.Writer, rows []row) error {
	var b strings.Builder
	b.WriteString(strings.Join(tsvHeader, "\t"))
	b.WriteByte('\n')
	num := func(x float64) string { return strconv.FormatFloat(x, 'g', 6, 64) }
	pair := func(s *stat) []string {
		if s == nil {
			return []string{"", ""}
		}
		return []string{num(s.Mean), num(s.SD)}
	}
	for _, r := range rows {
		seeds := make([]string, len(r.Seeds))
		for i, s := range r.Seeds {
			seeds[i] = strconv.FormatUint(s, 10)
		}
		ratio, cpuRatio := "", ""
		if r.Ratio != 0 {
			ratio = num(r.Ratio)
		}
		if r.CPURatio != 0 {
			cpuRatio = num(r.CPURatio)
		}
		cells := []string{r.Corpus, r.Model, r.Base, r.Sampler, strconv.Itoa(r.Scale),
			strconv.Itoa(r.Utterances), strconv.Itoa(r.Units), strconv.Itoa(r.Iterations),
			strconv.Itoa(r.Chains), strings.Join(seeds, ",")}
		cells = append(cells, pair(r.TokenF)...)
		cells = append(cells, pair(r.BoundaryF)...)
		cells = append(cells, pair(r.LexiconF)...)
		cells = append(cells, pair(r.Words)...)
		cells = append(cells, pair(&r.LogJoint)...)
		cells = append(cells, pair(&r.Seconds)...)
		cells = append(cells, pair(&r.SecondsPerSweep)...)
		cells = append(cells, pair(&r.NsPerUnitSweep)...)
		cells = append(cells, ratio)
		cells = append(cells, pair(&r.CPUNsPerUnitSweep)...)
		cells = append(cells, cpuRatio)
		cells = append(cells, pair(&r.PeakMiB)...)
		b.WriteString(strings.Join(cells, "\t"))
		b.WriteByte('\n')
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// cell formats s with prec decimals, as mean±sd when there are several
// seeds.
func cell(s stat, seeds, prec int) string {
	if seeds > 1 {
		return fmt.Sprintf("%.*f±%.*f", prec, s.Mean, prec, s.SD)
	}
	return fmt.Sprintf("%.*f", prec, s.Mean)
}

func writeText(w io.Writer, rows []row, mode string) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	if mode == "scale" {
		fmt.Fprintln(tw, "corpus\tmodel\tbase\tsampler\tscale\tutterances\tunits\titerations\tseeds\ts/sweep\tns/unit/sweep\tratio\tcpu ns/unit/sweep\tcpu ratio\tpeak MiB")
		for _, r := range rows {
			n := len(r.Seeds)
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%dx\t%d\t%d\t%d\t%d\t%s\t%s\t%.2f\t%s\t%.2f\t%s\n",
				r.Corpus, r.Model, r.Base, r.Sampler, r.Scale, r.Utterances, r.Units, r.Iterations, n,
				cell(r.SecondsPerSweep, n, 4), cell(r.NsPerUnitSweep, n, 0), r.Ratio,
				cell(r.CPUNsPerUnitSweep, n, 0), r.CPURatio, cell(r.PeakMiB, n, 0))
		}
		return tw.Flush()
	}
	fmt.Fprintln(tw, "corpus\tmodel\tbase\tsampler\tutterances\titerations\tchains\tseeds\ttoken F\tboundary F\tlexicon F\twords\tlog joint\tseconds\tpeak MiB")
	for _, r := range rows {
		n := len(r.Seeds)
		f := func(s *stat) string {
			if s == nil {
				return "-"
			}
			return cell(*s, n, 3)
		}
		words := "-"
		if r.Words != nil {
			words = cell(*r.Words, n, 0)
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%d\t%d\t%d\t%d\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n",
			r.Corpus, r.Model, r.Base, r.Sampler, r.Utterances, r.Iterations, r.Chains, n,
			f(r.TokenF), f(r.BoundaryF), f(r.LexiconF), words, cell(r.LogJoint, n, 0), cell(r.Seconds, n, 1), cell(r.PeakMiB, n, 0))
	}
	return tw.Flush()
}
