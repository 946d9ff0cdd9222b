package main

import (
	"runtime/debug"
	"strings"
)

// version is the Saltcast version this program was built as. `make cli` sets it from the
// same `git describe` the page is stamped with (web.Version), so the CLI, the page and its
// printed batch sheet name one version:
//
//	go build -ldflags "-X main.version=v1.2.0" ./web/cmd/saltcast
//
// Left empty, Version falls back to what the Go toolchain recorded in the binary.
var version string

// Version is the version text `saltcast --version` prints: the -ldflags value; else the
// module version of a `go install`ed build; else "dev" with the VCS revision the Go
// toolchain recorded (12 hex digits, "-dirty" for uncommitted changes); else "dev". Only
// the CLI imports runtime/debug for this, so the page's module does not grow.
func Version() string {
	if version != "" {
		return version
	}
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "dev"
	}
	return versionFrom(bi)
}

// versionFrom reads a version out of build information (split out for its test).
func versionFrom(bi *debug.BuildInfo) string {
	if v := bi.Main.Version; v != "" && v != "(devel)" {
		return v
	}
	rev, dirty := "", false
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			dirty = s.Value == "true"
		}
	}
	if rev == "" {
		return "dev"
	}
	if len(rev) > 12 {
		rev = rev[:12]
	}
	v := "dev-" + strings.ToLower(rev)
	if dirty {
		v += "-dirty"
	}
	return v
}
