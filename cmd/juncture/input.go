package main

import (
	"bufio"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"unicode/utf8"

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
		for line := 1; sc.Scan(); line++ {
			u := sc.Text()
			if line == 1 {
				u = strings.TrimPrefix(u, "\uFEFF") // a byte order mark, as ReadCorpus drops
			}
			if !utf8.ValidString(u) {
				return opts, fmt.Errorf("%s:%d: %w", name, line, segment.ErrInvalidUTF8)
			}
			if u = strings.TrimSpace(u); u != "" {
				units = append(units, u)
			}
		}
		if err := sc.Err(); err != nil {
			return opts, fmt.Errorf("%s: %w", name, err)
		}
		if len(units) == 0 {
			return opts, fmt.Errorf("%s: no units", name)
		}
		inv, err := segment.NewInventory(units)
		if err != nil {
			return opts, fmt.Errorf("%s: %w", name, err)
		}
		opts.Inventory = inv
	}
	return opts, nil
}

// oneArgument returns the command's one positional argument, called what
// in messages. urfave/cli reads flags only up to the first argument, so a
// flag after it arrives here as an argument: say so rather than count it.
func oneArgument(ctx *cli.Context, what string) (string, error) {
	args := ctx.Args().Slice()
	for _, a := range args[min(1, len(args)):] {
		if strings.HasPrefix(a, "-") && a != "-" {
			return "", fmt.Errorf("flags go before %s: %q comes after it", what, a)
		}
	}
	if len(args) != 1 {
		return "", fmt.Errorf("want one %s file (or - for standard input), got %d arguments", what, len(args))
	}
	return args[0], nil
}

// A namedPath is a file named on the command line, with the flag (or
// argument) that named it.
type namedPath struct{ flag, path string }

// checkOutputs checks, before any sampling, that each output file of learn
// can be created and overwrites none of the inputs or another output, so
// that a mistyped path does not cost a whole run.
func checkOutputs(ctx *cli.Context, inputs []namedPath) error {
	seen := inputs
	for _, flag := range []string{"out", "posteriors", "lexicon"} {
		out := namedPath{"--" + flag, ctx.String(flag)}
		if out.path == "" {
			continue
		}
		dir := filepath.Dir(out.path)
		fi, err := os.Stat(dir)
		if err != nil {
			return fmt.Errorf("%s %s: %w", out.flag, out.path, err)
		}
		if !fi.IsDir() {
			return fmt.Errorf("%s %s: %s is not a directory", out.flag, out.path, dir)
		}
		if fi, err := os.Stat(out.path); err == nil && fi.IsDir() {
			return fmt.Errorf("%s %s: is a directory", out.flag, out.path)
		}
		for _, p := range seen {
			if p.path != "" && p.path != "-" && sameFile(out.path, p.path) {
				return fmt.Errorf("%s %s would overwrite %s", out.flag, out.path, p.flag)
			}
		}
		seen = append(seen, out)
	}
	return nil
}

// sameFile reports whether two paths name the same file, existing or not.
func sameFile(a, b string) bool {
	absA, errA := filepath.Abs(a)
	absB, errB := filepath.Abs(b)
	if errA == nil && errB == nil && absA == absB {
		return true
	}
	fa, errA := os.Stat(a)
	fb, errB := os.Stat(b)
	return errA == nil && errB == nil && os.SameFile(fa, fb)
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
