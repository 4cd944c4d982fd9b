package main

import (
	"bufio"
	"fmt"
	"io"
	"os"
	"strings"

	"github.com/juncture-project/juncture/segment"
	"github.com/juncture-project/juncture/segment/atomicfile"
	"github.com/urfave/cli/v2"
)

// unitFlags are the flags that say how transcripts split into units.
func unitFlags() []cli.Flag {
	return []cli.Flag{
		&cli.StringFlag{Name: "units", Usage: "read the unit inventory from `FILE`, one unit per line, matched longest first; any other character is an error"},
		&cli.StringFlag{Name: "ignore", Usage: "drop these `CHARS` before splitting into units (stress marks, punctuation)"},
		&cli.BoolFlag{Name: "spaces-are-boundaries", Usage: "treat spaces in the input as certain word boundaries (pauses) instead of ignoring them"},
	}
}

// readOptions builds segment.ReadOptions from the unit flags.
func readOptions(ctx *cli.Context) (segment.ReadOptions, error) {
	opts := segment.ReadOptions{Ignore: ctx.String("ignore"), SpacesAreBoundaries: ctx.Bool("spaces-are-boundaries")}
	if name := ctx.String("units"); name != "" {
		f, err := os.Open(name)
		if err != nil {
			return opts, err
		}
		defer f.Close()
		var units []string
		sc := bufio.NewScanner(f)
		for sc.Scan() {
			if u := strings.TrimSpace(sc.Text()); u != "" {
				units = append(units, u)
			}
		}
		if err := sc.Err(); err != nil {
			return opts, fmt.Errorf("%s: %w", name, err)
		}
		inv, err := segment.NewInventory(units)
		if err != nil {
			return opts, fmt.Errorf("%s: %w", name, err)
		}
		opts.Inventory = inv
	}
	return opts, nil
}

// openInput opens a named file, or standard input for "-".
func openInput(name string) (io.ReadCloser, string, error) {
	if name == "-" {
		return io.NopCloser(os.Stdin), "<stdin>", nil
	}
	f, err := os.Open(name)
	if err != nil {
		return nil, name, err
	}
	return f, name, nil
}

// writeOutput writes through fill to the file named by --out, atomically,
// or to standard output when --out is empty.
func writeOutput(ctx *cli.Context, fill func(io.Writer) error) error {
	if out := ctx.String("out"); out != "" {
		return atomicfile.Write(out, fill)
	}
	w := bufio.NewWriter(ctx.App.Writer)
	if err := fill(w); err != nil {
		return err
	}
	return w.Flush()
}
