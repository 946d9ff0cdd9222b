//go:build workerd && bench

package main

// Performance figures of the worker under workerd, printed by `make bench` (built
// only with the workerd and bench tags).
// They are measurements, not pass/fail timings: the aims (cold start ≤ 400 ms, p50 ≤ 3 ms)
// are printed beside them. The only limit that fails is the paid plan's size limit, since
// over it the worker cannot be deployed at all.

import (
	"bytes"
	"compress/gzip"
	"errors"
	"io"
	"os"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"
)

const (
	coldStarts   = 5    // workerd processes started for the cold-start figure
	warmRequests = 50   // requests before timing, so V8 has tiered up
	timedPlans   = 1000 // sequential POST /api/v1/plan timed for p50 and p95

	aimColdStart = 400 * time.Millisecond
	aimP50       = 3 * time.Millisecond
	aimBundle    = 2_300_000 // bytes of gzip, room under the free plan's 3 MB to grow

	// paidPlanLimit is the compressed size limit of a Worker on Cloudflare's paid plan,
	// 10 MB (Workers "Limits" page; from memory). freePlanLimit is in workerd_test.go.
	paidPlanLimit = 10 << 20
)

func TestFigures(t *testing.T) {
	bin := needBuild(t)
	recipe := testdataFile(t, "demo-kno3-stock.json")
	post := func(base string) (int, error) {
		res, err := workerdClient.Post(base+"/api/v1/plan", "application/json", bytes.NewReader(recipe))
		if err != nil {
			return 0, err
		}
		io.Copy(io.Discard, res.Body)
		res.Body.Close()
		return res.StatusCode, nil
	}

	// Sizes.
	for _, f := range bundleFiles {
		b, err := os.ReadFile(repoPath("build", "worker", f))
		if err != nil {
			t.Fatal(err)
		}
		t.Logf("module %-14s %9d bytes, gzip %9d", f, len(b), gzipLen(b))
	}
	size, err := bundleGzipSize()
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("bundle gzip %d bytes (%.2f MiB; aim ≤ %d): %.0f %% of the free plan's 3 MB, %.0f %% of the paid plan's 10 MB (limits from memory)",
		size, float64(size)/(1<<20), aimBundle, 100*float64(size)/freePlanLimit, 100*float64(size)/paidPlanLimit)
	if size > paidPlanLimit {
		t.Errorf("bundle gzip %d bytes is over the paid plan's limit %d", size, paidPlanLimit)
	}

	// Cold start: process start → first 200 for a plan, on a fresh workerd each time.
	// Beside the wall time, workerd's CPU time (user + system) up to that answer: steadier
	// than the wall time when other work shares the machine.
	var cold, coldCPU []time.Duration
	for range coldStarts {
		s := startWorkerd(t, bin, "")
		status, err := post(s.base)
		d := time.Since(s.started)
		c, cpuErr := processCPU(s.cmd.Process.Pid)
		s.stop()
		if err != nil || status != 200 {
			t.Fatalf("cold start: %d %v\n%s", status, err, s.log.String())
		}
		if cpuErr != nil {
			t.Fatalf("cold start: workerd's CPU time: %v", cpuErr)
		}
		cold, coldCPU = append(cold, d), append(coldCPU, c)
	}
	slices.Sort(cold)
	slices.Sort(coldCPU)
	t.Logf("cold start (workerd process start → first 200 of POST /api/v1/plan), %d runs: median %v, min %v, max %v (aim ≤ %v); workerd CPU time to that answer: median %v, min %v, max %v; load average %s",
		coldStarts, cold[len(cold)/2].Round(time.Millisecond), cold[0].Round(time.Millisecond),
		cold[len(cold)-1].Round(time.Millisecond), aimColdStart,
		coldCPU[len(coldCPU)/2], coldCPU[0], coldCPU[len(coldCPU)-1], loadAverage())

	// Latency of sequential plans on one warm isolate, over one kept-alive connection.
	s := startWorkerd(t, bin, "")
	defer s.stop()
	s.waitReady(t)
	for range warmRequests {
		if _, err := post(s.base); err != nil {
			t.Fatal(err)
		}
	}
	lat := make([]time.Duration, 0, timedPlans)
	for range timedPlans {
		t0 := time.Now()
		status, err := post(s.base)
		if err != nil || status != 200 {
			t.Fatalf("plan: %d %v", status, err)
		}
		lat = append(lat, time.Since(t0))
	}
	slices.Sort(lat)
	q := func(p float64) time.Duration { return lat[int(p*float64(len(lat)-1))].Round(10 * time.Microsecond) }
	t.Logf("POST /api/v1/plan (demo-kno3-stock.json), %d sequential on loopback: p50 %v, p95 %v, p99 %v, max %v (aim p50 ≤ %v)",
		timedPlans, q(0.50), q(0.95), q(0.99), lat[len(lat)-1].Round(10*time.Microsecond), aimP50)
}

// processCPU is the user + system CPU time of a running process, from /proc/PID/stat
// (fields 14 and 15, in clock ticks of 1/100 s: Linux's USER_HZ on every architecture it
// reports to user space; proc(5)).
func processCPU(pid int) (time.Duration, error) {
	b, err := os.ReadFile("/proc/" + strconv.Itoa(pid) + "/stat")
	if err != nil {
		return 0, err
	}
	s := string(b)
	i := strings.LastIndexByte(s, ')') // the command name may hold spaces and parentheses
	if i < 0 {
		return 0, errors.New("/proc/" + strconv.Itoa(pid) + "/stat: no command name")
	}
	f := strings.Fields(s[i+1:]) // f[0] is field 3 (state)
	if len(f) < 13 {
		return 0, errors.New("/proc/" + strconv.Itoa(pid) + "/stat: too few fields")
	}
	utime, err1 := strconv.ParseInt(f[11], 10, 64)
	stime, err2 := strconv.ParseInt(f[12], 10, 64)
	if err1 != nil || err2 != nil {
		return 0, errors.New("/proc/" + strconv.Itoa(pid) + "/stat: unreadable CPU times")
	}
	return time.Duration(utime+stime) * 10 * time.Millisecond, nil
}

// loadAverage is the machine's 1, 5 and 15 minute load averages, from /proc/loadavg.
func loadAverage() string {
	b, err := os.ReadFile("/proc/loadavg")
	if err != nil {
		return "unknown"
	}
	f := strings.Fields(string(b))
	if len(f) < 3 {
		return "unknown"
	}
	return strings.Join(f[:3], " ")
}

func gzipLen(b []byte) int {
	var buf bytes.Buffer
	zw, _ := gzip.NewWriterLevel(&buf, gzip.BestCompression)
	zw.Write(b)
	zw.Close()
	return buf.Len()
}
