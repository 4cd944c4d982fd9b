//go:build unix

package atomicfile

import (
	"os"
	"path/filepath"
	"syscall"
	"testing"
)

// TestWriteModes: a new file gets 0666 less the umask, as os.Create gives
// (POSIX open(2) semantics); a replaced file keeps its own permissions.
func TestWriteModes(t *testing.T) {
	dir := t.TempDir()
	old := syscall.Umask(0o077)
	defer syscall.Umask(old)
	fresh := filepath.Join(dir, "fresh.txt")
	if err := WriteBytes(fresh, []byte("x")); err != nil {
		t.Fatal(err)
	}
	if fi, err := os.Stat(fresh); err != nil || fi.Mode().Perm() != 0o600 {
		t.Errorf("new file under umask 077: mode %v (%v), want -rw-------", fi.Mode(), err)
	}
	kept := filepath.Join(dir, "kept.txt")
	if err := os.WriteFile(kept, []byte("old"), 0o640); err != nil {
		t.Fatal(err)
	}
	if err := os.Chmod(kept, 0o640); err != nil {
		t.Fatal(err)
	}
	if err := WriteBytes(kept, []byte("new")); err != nil {
		t.Fatal(err)
	}
	if fi, err := os.Stat(kept); err != nil || fi.Mode().Perm() != 0o640 {
		t.Errorf("replaced file: mode %v (%v), want -rw-r-----", fi.Mode(), err)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 2 {
		t.Errorf("%d files left in the directory, want 2 (no temporary files)", len(entries))
	}
}
