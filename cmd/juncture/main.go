// Command juncture finds the words in unsegmented transcriptions.
//
// Each sub-command lives in a file of its own that parses flags and calls a
// package; see DEVELOPERS.md for the architecture.
package main

import (
	"context"
	"errors"
	"fmt"
	"os"
	"os/signal"
	"runtime/pprof"
	"syscall"

	"github.com/urfave/cli/v2"
)

func main() {
	// An interrupt cancels the context: a learning run stops at once and
	// keeps its last checkpoint, which --resume continues from.
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
	defer stop()
	if err := newApp().RunContext(ctx, os.Args); err != nil {
		if errors.Is(err, context.Canceled) {
			fmt.Fprintln(os.Stderr, "juncture: interrupted; with --state DIR, 'juncture learn --state DIR --resume' continues")
			os.Exit(130)
		}
		fmt.Fprintln(os.Stderr, "juncture:", err)
		os.Exit(1)
	}
}

func newApp() *cli.App {
	app := &cli.App{
		Name:  "juncture",
		Usage: "find the words in unsegmented transcriptions",
		Description: "juncture proposes word boundaries for phonemic transcripts written without\n" +
			"spaces, one utterance per line, with Bayesian nonparametric word models\n" +
			"sampled by Gibbs sampling. It runs offline; nothing leaves this machine.",
		Commands: []*cli.Command{
			learnCommand(),
			scoreCommand(),
			demoCommand(),
		},
		Flags: []cli.Flag{
			&cli.StringFlag{Name: "cpuprofile", Usage: "write a CPU profile to `FILE` (for go tool pprof)", Hidden: true},
		},
		Before:       startProfile,
		After:        stopProfile,
		OnUsageError: usageError("juncture "),
	}
	for _, c := range app.Commands {
		c.OnUsageError = usageError("juncture " + c.Name + " ")
	}
	return app
}

// usageError returns the handler of a flag that cannot be parsed. It makes
// the mistake an ordinary error, printed on standard error; by default
// urfave/cli prints it with the whole help to standard output, which may be
// redirected into a data file.
func usageError(command string) cli.OnUsageErrorFunc {
	return func(_ *cli.Context, err error, _ bool) error {
		return fmt.Errorf("%w (see '%s--help')", err, command)
	}
}

var profileFile *os.File

// startProfile starts CPU profiling when --cpuprofile is given; profiles
// guide optimisation (see DEVELOPERS.md).
func startProfile(ctx *cli.Context) error {
	name := ctx.String("cpuprofile")
	if name == "" {
		return nil
	}
	f, err := os.Create(name)
	if err != nil {
		return err
	}
	profileFile = f
	return pprof.StartCPUProfile(f)
}

func stopProfile(*cli.Context) error {
	if profileFile == nil {
		return nil
	}
	pprof.StopCPUProfile()
	return profileFile.Close()
}
