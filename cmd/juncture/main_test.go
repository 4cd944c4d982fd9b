package main

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"testing"
)

// binary is the juncture command built once for tests that need a real
// process (killing it, reading its exit status).
var binary string

func TestMain(m *testing.M) {
	dir, err := os.MkdirTemp("", "juncture-test-")
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
		os.Exit(1)
	}
	binary = filepath.Join(dir, "juncture")
	if out, err := exec.Command("go", "build", "-o", binary, ".").CombinedOutput(); err != nil {
		fmt.Fprintf(os.Stderr, "building juncture: %v\n%s", err, out)
		os.Exit(1)
	}
	code := m.Run()
	os.RemoveAll(dir)
	os.Exit(code)
}

// run runs the juncture binary and returns its standard output; it fails
// the test on a non-zero exit.
func run(t *testing.T, stdin []byte, args ...string) []byte {
	t.Helper()
	cmd := exec.Command(binary, args...)
	cmd.Stdin = bytes.NewReader(stdin)
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	if err := cmd.Run(); err != nil {
		t.Fatalf("juncture %v: %v\n%s", args, err, stderr.Bytes())
	}
	return stdout.Bytes()
}
