package main

import (
	"errors"
	"fmt"

	"github.com/juncture-project/juncture/segment/score"
	"github.com/urfave/cli/v2"
)

func scoreCommand() *cli.Command {
	return &cli.Command{
		Name:      "score",
		Usage:     "compare a segmentation with a reference segmentation",
		ArgsUsage: "PREDICTED",
		Description: "Both files hold segmented lines: one utterance per line, words separated by\n" +
			"single spaces. Line for line they must spell the same text once spaces are\n" +
			"removed. PREDICTED may be - for standard input, so\n\n" +
			"   juncture learn in.txt | juncture score --reference gold.txt -\n\n" +
			"works. Reports boundary, token and lexicon precision, recall and F, plus\n" +
			"WindowDiff and Pk, as a table or, with --json, as one JSON object.",
		Flags: []cli.Flag{
			&cli.StringFlag{Name: "reference", Aliases: []string{"r"}, Usage: "the reference (gold) segmentation `FILE` (required)"},
			&cli.BoolFlag{Name: "json", Usage: "print one JSON object instead of a table"},
		},
		Action: runScore,
	}
}

func runScore(ctx *cli.Context) error {
	predicted, err := oneArgument(ctx, "PREDICTED")
	if err != nil {
		return err
	}
	// Checked here rather than by urfave/cli, which would print the help
	// to standard output.
	reference := ctx.String("reference")
	if reference == "" {
		return errors.New("want --reference FILE, the reference segmentation")
	}
	if reference == "-" && predicted == "-" {
		return errors.New("--reference - and PREDICTED -: standard input can be read only once")
	}
	ref, refLines, refName, err := readSegmentedFile(reference)
	if err != nil {
		return err
	}
	pred, predLines, predName, err := readSegmentedFile(predicted)
	if err != nil {
		return err
	}
	if len(ref) != len(pred) {
		return fmt.Errorf("%s has %d utterances but %s has %d", refName, len(ref), predName, len(pred))
	}
	s, err := score.Compare(ref, pred)
	if err != nil {
		var le *score.LineError
		if errors.As(err, &le) && le.Line >= 1 && le.Line <= len(ref) {
			i := le.Line - 1
			return fmt.Errorf("%s:%d and %s:%d: %w", refName, refLines[i], predName, predLines[i], le.Err)
		}
		return err
	}
	if ctx.Bool("json") {
		_, err = ctx.App.Writer.Write(s.JSON())
		return err
	}
	return s.WriteTable(ctx.App.Writer)
}

func readSegmentedFile(name string) ([][]string, []int, string, error) {
	r, display, err := openInput(name)
	if err != nil {
		return nil, nil, name, err
	}
	defer r.Close()
	words, lines, err := score.ReadSegmented(r, display)
	return words, lines, display, err
}
