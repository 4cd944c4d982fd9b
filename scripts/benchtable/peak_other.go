//go:build !unix

package main

import "os"

// peakKB returns 0: this system reports no peak resident set size.
func peakKB(*os.ProcessState) int64 { return 0 }

// cpuSeconds returns 0: CPU time is not measured on this system.
func cpuSeconds() float64 { return 0 }
