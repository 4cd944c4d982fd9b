// Package atomicfile writes files so that a reader sees either the old
// content or the new, never a mix: the data goes to a temporary file in the
// same directory, is synced, and is renamed over the target.
package atomicfile

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"time"
)

// Write writes the output of fill to path atomically. If fill or any step
// fails, path is left as it was and the temporary file is removed. A file
// that replaces another keeps that file's permissions; a new one gets
// those os.Create would give it (0666 less the umask), so a user who keeps
// transcripts private with a strict umask gets private results too.
func Write(path string, fill func(io.Writer) error) (err error) {
	dir := filepath.Dir(path)
	tmp, err := createTemp(dir, filepath.Base(path))
	if err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err = fill(tmp); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if fi, statErr := os.Stat(path); statErr == nil {
		if err = os.Chmod(tmp.Name(), fi.Mode().Perm()); err != nil {
			return fmt.Errorf("write %s: %w", path, err)
		}
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	return nil
}

// WriteBytes writes data to path atomically.
func WriteBytes(path string, data []byte) error {
	return Write(path, func(w io.Writer) error { _, err := w.Write(data); return err })
}

// createTemp creates a new file for writing in dir, named after base, with
// permissions 0666 less the umask (os.CreateTemp would give 0600).
func createTemp(dir, base string) (*os.File, error) {
	for i := 0; ; i++ {
		name := filepath.Join(dir, fmt.Sprintf(".%s.tmp-%d-%d", base, os.Getpid(), time.Now().UnixNano()+int64(i)))
		f, err := os.OpenFile(name, os.O_RDWR|os.O_CREATE|os.O_EXCL, 0o666)
		if os.IsExist(err) && i < 1000 {
			continue
		}
		return f, err
	}
}
