package main

import (
	"fmt"
	"io"

	"github.com/schollz/progressbar/v3"
)

// newProgress returns a progress bar on w for n iterations, or nil when
// quiet. It shows the rate and the time left.
func newProgress(w io.Writer, n int, what string, quiet bool) *progressbar.ProgressBar {
	if quiet {
		return nil
	}
	return progressbar.NewOptions(n,
		progressbar.OptionSetWriter(w),
		progressbar.OptionSetDescription(what),
		progressbar.OptionShowCount(),
		progressbar.OptionShowIts(),
		progressbar.OptionSetItsString("sweeps"),
		progressbar.OptionSetPredictTime(true),
		progressbar.OptionThrottle(100_000_000),
		progressbar.OptionSetWidth(30),
		progressbar.OptionOnCompletion(func() { fmt.Fprintln(w) }),
	)
}
