//go:build browser && bench

package web_test

import (
	"os"
	"slices"
	"testing"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/profiler"
	"github.com/chromedp/chromedp"
)

// TestRecomputeProfile takes a CPU profile of the page (DevTools) while it recomputes 300
// times and prints where the samples fall: by function (self time), wasm functions taken
// together, garbage collection and the rest. Sampled time is steadier than wall-clock
// figures on a loaded machine. SALTCAST_COMPARE_THIS names another page to profile.
func TestRecomputeProfile(t *testing.T) {
	u := appURL(t)
	if p := os.Getenv("SALTCAST_COMPARE_THIS"); p != "" {
		u = "file://" + p
	}
	ctx := tab(t)
	open(t, ctx, u)
	recomputeTimes(t, ctx, 50) // warm up
	if _, err := chromedp.Call(ctx, profiler.Enable, cdp.Empty{}); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Call(ctx, profiler.SetSamplingInterval, profiler.SetSamplingIntervalParams{Interval: 100}); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Call(ctx, profiler.Start, cdp.Empty{}); err != nil {
		t.Fatal(err)
	}
	recomputeTimes(t, ctx, 300)
	res, err := chromedp.Call(ctx, profiler.Stop, cdp.Empty{})
	if err != nil {
		t.Fatal(err)
	}
	prof := res.Profile
	self := map[int64]int{}
	for _, s := range prof.Samples {
		self[s] += 1
	}
	byName := map[string]int{}
	total, wasm := 0, 0
	for _, n := range prof.Nodes {
		c := self[n.ID]
		total += c
		name := n.CallFrame.FunctionName
		if n.CallFrame.URL == "" && len(name) > 0 && name[0] != '(' && n.CallFrame.LineNumber < 0 {
			name = "[native] " + name
		}
		if len(name) > 5 && name[:5] == "$wasm" || len(name) > 4 && name[:4] == "wasm" || n.CallFrame.URL != "" && len(n.CallFrame.URL) > 5 && n.CallFrame.URL[:5] == "wasm:" {
			wasm += c
			name = "[wasm] " + name
		}
		byName[name] += c
	}
	type kv struct {
		k string
		v int
	}
	var list []kv
	for k, v := range byName {
		list = append(list, kv{k, v})
	}
	slices.SortFunc(list, func(a, b kv) int { return b.v - a.v })
	ms := func(n int) float64 {
		return float64(n) * float64(prof.EndTime-prof.StartTime) / 1000 / float64(max(len(prof.Samples), 1)) / 300
	}
	t.Logf("%d samples; per recompute %.2f ms sampled, of which wasm %.2f ms", len(prof.Samples), ms(total), ms(wasm))
	for i, e := range list {
		if i == 25 {
			break
		}
		t.Logf("%7.3f ms  %s", ms(e.v), e.k)
	}
}
