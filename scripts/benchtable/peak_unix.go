//go:build unix

package main

import (
	"os"
	"runtime"
	"syscall"
)

// peakKB returns the peak resident set size of the finished process ps in
// KiB, from the rusage wait4 returned for it: ru_maxrss is in KiB on Linux
// (getrusage(2)) and in bytes on Darwin (getrusage(2) of macOS).
func peakKB(ps *os.ProcessState) int64 {
	ru, ok := ps.SysUsage().(*syscall.Rusage)
	if !ok || ru == nil {
		return 0
	}
	if runtime.GOOS == "darwin" {
		return int64(ru.Maxrss) / 1024
	}
	return int64(ru.Maxrss)
}
