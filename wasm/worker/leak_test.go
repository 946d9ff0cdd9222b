//go:build workerd

package main

import (
	"bytes"
	"encoding/json"
	"io"
	"net/http"
	"os"
	"strings"
	"sync"
	"testing"

	"saltcast/web/api"
)

// One Go program serves every request of an isolate (glue/worker.mjs), so whatever a request
// leaves behind piles up. This test reads the Go program's memory and its table of live JS
// references through a probe module (test-only, in front of the worker) before and after a
// few thousand requests of every kind. The process's RSS is not used: workerd's grows by
// hundreds of MiB under load even for a plain JS worker, and settles.
//
// Live references are released by Go's garbage collector, so their count swings by up to
// about 2 500 with its timing; a leak of callbacks per request (what syumai/workers' streamed
// bodies did: about five references and 1.2 KiB per request) adds 30 000 and 7 MiB here.
const (
	leakWarmup    = 600
	leakRequests  = 6000
	leakMaxValues = 3000    // half a reference per request
	leakMaxMemory = 4 << 20 // Go grows its heap in steps of a few MiB
)

// probeModule sits in front of the worker in the tests' config: /__test/go-stats answers the
// Go program's figures, /__test/stop makes the worker drop its Go program.
const probeModule = `import worker from "./worker.mjs";
export default {
  async fetch(request, env, ctx) {
    const hooks = globalThis.saltcastTestHooks;
    switch (new URL(request.url).pathname) {
      case "/__test/go-stats":
        return new Response(JSON.stringify(hooks ? hooks.stats() : null));
      case "/__test/stop":
        hooks.stop();
        return new Response("stopped");
    }
    return worker.fetch(request, env, ctx);
  },
};
`

// startProbed starts workerd with the probe module in front of the worker.
func startProbed(t *testing.T) *workerdServer {
	t.Helper()
	bin := needBuild(t)
	probe := repoPath("build", "worker", "probe.mjs")
	if err := os.WriteFile(probe, []byte(probeModule), 0o644); err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { os.Remove(probe) })
	s := startWorkerdWith(t, bin, "", func(cfg string) string {
		const first = `    (name = "worker.mjs", esModule = embed "worker.mjs"),`
		if !strings.Contains(cfg, first) {
			t.Fatalf("workerd.capnp: no line %q to put the probe before", first)
		}
		return strings.Replace(cfg, first, `    (name = "probe.mjs", esModule = embed "probe.mjs"),`+"\n"+first, 1)
	})
	t.Cleanup(s.stop)
	s.waitReady(t)
	return s
}

func getStats(t *testing.T, s *workerdServer) goStats {
	t.Helper()
	res, err := http.Get(s.base + "/__test/go-stats")
	if err != nil {
		t.Fatal(err)
	}
	defer res.Body.Close()
	var st goStats
	if err := json.NewDecoder(res.Body).Decode(&st); err != nil || st.MemoryBytes == 0 {
		t.Fatalf("probe: %v %+v", err, st)
	}
	return st
}

// When the Go program is gone, the next request starts a new one and is answered in full.
func TestWorkerdRestartsAGoneProgram(t *testing.T) {
	s := startProbed(t)
	want, err := api.Solubility(api.Params{"solute": "KNO3", "temp_C": "20"})
	if err != nil {
		t.Fatal(err)
	}
	for round := range 3 {
		res, err := http.Get(s.base + "/__test/stop")
		if err != nil {
			t.Fatal(err)
		}
		res.Body.Close()
		if res.StatusCode != 200 {
			t.Fatalf("round %d: the probe could not stop the program: %s", round, res.Status)
		}
		res, err = http.Get(s.base + "/api/v1/solubility?solute=KNO3&temp_C=20")
		if err != nil {
			t.Fatal(err)
		}
		got, _ := io.ReadAll(res.Body)
		res.Body.Close()
		if res.StatusCode != 200 || !bytes.Equal(got, want) {
			t.Errorf("round %d, after the program stopped: %d %.200s", round, res.StatusCode, got)
		}
	}
}

type goStats struct {
	MemoryBytes int `json:"memoryBytes"`
	JSValues    int `json:"jsValues"`
}

func TestWorkerdDoesNotLeak(t *testing.T) {
	s := startProbed(t)

	kno3 := testdataFile(t, "demo-kno3-stock.json")
	oversize := bytes.Repeat([]byte(" "), MaxBodyBytes+10)
	type call struct {
		method, path, ct string
		body             []byte
	}
	calls := []call{
		{"POST", "/api/v1/plan", "application/json", kno3},
		{"POST", "/api/v1/plan", "application/json", []byte(`{"solute":"KNO3","dissolve_temp_C":NaN}`)},
		{"POST", "/api/v1/gas", "application/json", []byte(`{"temp_C":[20]}`)},
		{"POST", "/api/v1/plan", "application/json", oversize},
		{"GET", "/api/v1/solubility?solute=KNO3&temp_C=20", "", nil},
		{"GET", "/api/v1/solubility?solute=nope&temp_C=20", "", nil},
		{"POST", "/api/v1/gas", "application/json", []byte(`{"temp_C":20}`)},
		{"GET", "/api/v1/gas/outgas?from_C=15&to_C=80", "", nil},
		{"GET", "/api/v1/compounds", "", nil},
		{"OPTIONS", "/api/v1/plan", "", nil},
		{"DELETE", "/api/v1/plan", "", nil},
		{"GET", "/", "", nil},
	}
	send := func(n int) {
		var wg sync.WaitGroup
		next := make(chan int)
		for range 4 {
			wg.Go(func() {
				for i := range next {
					c := calls[i%len(calls)]
					var body io.Reader
					if c.body != nil {
						body = bytes.NewReader(c.body)
					}
					req, _ := http.NewRequest(c.method, s.base+c.path, body)
					if c.ct != "" {
						req.Header.Set("Content-Type", c.ct)
					}
					res, err := s.do(req)
					if err != nil {
						t.Error(err)
						continue
					}
					io.Copy(io.Discard, res.Body)
					res.Body.Close()
					if res.StatusCode >= 500 {
						t.Errorf("%s %s: %s", c.method, c.path, res.Status)
					}
				}
			})
		}
		for i := range n {
			next <- i
		}
		close(next)
		wg.Wait()
	}

	send(leakWarmup)
	before := getStats(t, s)
	send(leakRequests)
	after := getStats(t, s)
	t.Logf("%d requests: Go memory %d → %d bytes, live JS references %d → %d",
		leakRequests, before.MemoryBytes, after.MemoryBytes, before.JSValues, after.JSValues)
	if d := after.JSValues - before.JSValues; d > leakMaxValues {
		t.Errorf("live JS references grew by %d over %d requests (allowed %d)", d, leakRequests, leakMaxValues)
	}
	if d := after.MemoryBytes - before.MemoryBytes; d > leakMaxMemory {
		t.Errorf("Go memory grew by %d bytes over %d requests (allowed %d)", d, leakRequests, leakMaxMemory)
	}
}
