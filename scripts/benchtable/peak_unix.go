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

// cpuSeconds returns the CPU time this process has used so far, user and
// system, summed over its threads (getrusage(2), RUSAGE_SELF); 0 if the
// call fails.
func cpuSeconds() float64 {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	tv := func(t syscall.Timeval) float64 { return float64(t.Sec) + float64(t.Usec)/1e6 }
	return tv(ru.Utime) + tv(ru.Stime)
}
