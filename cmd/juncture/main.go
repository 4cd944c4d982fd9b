// Command juncture finds the words in unsegmented transcriptions.
//
// Each sub-command lives in a file of its own that parses flags and calls a
// package; see DEVELOPERS.md for the architecture.
package main

import (
	"fmt"
	"os"

	"github.com/urfave/cli/v2"
)

func main() {
	if err := newApp().Run(os.Args); err != nil {
		fmt.Fprintln(os.Stderr, "juncture:", err)
		os.Exit(1)
	}
}

func newApp() *cli.App {
	return &cli.App{
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
		HideHelpCommand: false,
	}
}
