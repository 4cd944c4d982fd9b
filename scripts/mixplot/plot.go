package main

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/juncture-project/juncture/segment/atomicfile"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
)

// Size and resolution of the PNG.
const (
	plotWidth  = 8 * vg.Inch
	plotHeight = 5 * vg.Inch
	plotDPI    = 150
)

// newPlot draws one line of log joint against seconds per trace, labelled
// with names.
func newPlot(title string, names []string, traces [][]point) (*plot.Plot, error) {
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = "wall-clock seconds"
	p.Y.Label.Text = "log joint probability (nats)"
	p.Add(plotter.NewGrid())
	for i, t := range traces {
		xys := make(plotter.XYs, len(t))
		for k, pt := range t {
			xys[k] = plotter.XY{X: pt.Seconds, Y: pt.LogProb}
		}
		l, err := plotter.NewLine(xys)
		if err != nil {
			return nil, fmt.Errorf("%s trace: %w", names[i], err)
		}
		l.Color = plotutil.Color(i)
		l.Dashes = plotutil.Dashes(i)
		l.Width = vg.Points(1.5)
		p.Add(l)
		p.Legend.Add(fmt.Sprintf("%s sampler (%d sweeps)", names[i], t[len(t)-1].Sweep), l)
	}
	p.Legend.Top = false // the curves rise: the legend goes bottom right
	p.Y.Tick.Marker = shortTicks{}
	p.X.Tick.Marker = shortTicks{}
	return p, nil
}

// shortTicks places ticks as plot.DefaultTicks does but labels them with
// at most ten significant digits and no trailing zeros ("-12500", not
// "-12500.00"; "0.3", not "0.30000000000000004").
type shortTicks struct{}

func (shortTicks) Ticks(min, max float64) []plot.Tick {
	ticks := plot.DefaultTicks{}.Ticks(min, max)
	for i := range ticks {
		if ticks[i].Label != "" {
			ticks[i].Label = strconv.FormatFloat(ticks[i].Value, 'g', 10, 64)
		}
	}
	return ticks
}

// writePlot writes the plot of traces to path as PNG, atomically.
func writePlot(path, title string, names []string, traces [][]point) error {
	p, err := newPlot(title, names, traces)
	if err != nil {
		return err
	}
	c := vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(plotWidth, plotHeight), vgimg.UseDPI(plotDPI))}
	p.Draw(draw.New(c))
	return atomicfile.Write(path, func(w io.Writer) error {
		_, err := c.WriteTo(w)
		return err
	})
}

// formatTSV returns the traces as TSV: a header, then one row per point
// with the sampler's name, the sweep, the seconds and the log joint.
func formatTSV(names []string, traces [][]point) string {
	var b strings.Builder
	b.WriteString("sampler\tsweep\tseconds\tlog_joint\n")
	for i, t := range traces {
		for _, pt := range t {
			fmt.Fprintf(&b, "%s\t%d\t%s\t%s\n", names[i], pt.Sweep,
				strconv.FormatFloat(pt.Seconds, 'f', 6, 64), strconv.FormatFloat(pt.LogProb, 'f', 4, 64))
		}
	}
	return b.String()
}

// writeTSV writes the traces to path as TSV, atomically.
func writeTSV(path string, names []string, traces [][]point) error {
	return atomicfile.WriteBytes(path, []byte(formatTSV(names, traces)))
}
