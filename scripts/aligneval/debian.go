package main

import (
	"bufio"
	"os"
	"strings"
	"sync"
)

// dpkgStatus is Debian's database of installed packages.
const dpkgStatus = "/var/lib/dpkg/status"

// debianDictDir is where Debian's dictd packages put their databases.
const debianDictDir = "/usr/share/dictd"

var (
	debianOnce     sync.Once
	debianVersions map[string]string
)

// debianVersion returns the installed version of a Debian package, or ""
// if it is not installed or the system is not Debian. It reads the
// package stanzas of dpkg's status file (deb-control(5) syntax: fields
// "Name: value", stanzas separated by blank lines) and keeps the packages
// whose Status ends in "installed".
func debianVersion(pkg string) string {
	debianOnce.Do(func() {
		debianVersions = map[string]string{}
		f, err := os.Open(dpkgStatus)
		if err != nil {
			return
		}
		defer f.Close()
		var name, version, status string
		flush := func() {
			if name != "" && strings.HasSuffix(status, " installed") {
				debianVersions[name] = version
			}
			name, version, status = "", "", ""
		}
		sc := bufio.NewScanner(f)
		sc.Buffer(make([]byte, 64*1024), 1<<20)
		for sc.Scan() {
			line := sc.Text()
			if line == "" {
				flush()
				continue
			}
			if k, v, ok := strings.Cut(line, ":"); ok && !strings.HasPrefix(line, " ") {
				switch k {
				case "Package":
					name = strings.TrimSpace(v)
				case "Version":
					version = strings.TrimSpace(v)
				case "Status":
					status = strings.TrimSpace(v)
				}
			}
		}
		flush()
	})
	return debianVersions[pkg]
}
