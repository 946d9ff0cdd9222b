//go:build !(js && wasm)

package main

import (
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"slices"
	"strings"
	"testing"
)

// The worker's js/wasm build links none of these: net/http (with crypto/tls, x509…) made
// app.wasm 588 kB larger gzipped, net/url (with fmt, reflect, net/netip) 123 kB more, and
// encoding/json is what core/wire replaces (measured 2026-12-02, wasm/worker/README.md).
var keptOutOfWorker = []string{"net/http", "net/url", "fmt", "reflect", "encoding/json"}

func TestWorkerBuildLeavesOutHeavyPackages(t *testing.T) {
	gobin := filepath.Join(runtime.GOROOT(), "bin", "go")
	cmd := exec.Command(gobin, "list", "-deps", ".")
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("go list -deps (js/wasm): %v", err)
	}
	deps := strings.Fields(string(out))
	if !slices.Contains(deps, "saltcast/web/api") {
		t.Fatalf("go list -deps (js/wasm) does not list saltcast/web/api; got %d packages", len(deps))
	}
	for _, p := range keptOutOfWorker {
		if slices.Contains(deps, p) {
			t.Errorf("the worker's js/wasm build imports %s", p)
		}
	}
}
