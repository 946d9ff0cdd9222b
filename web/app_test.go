package web_test

import (
	"strings"
	"testing"
)

// The page computes on load: the demo batch's charge is on screen without any input.
func TestComputesOnLoad(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	if got := outputNumber(t, ctx, "charge_g"); !(got > 0) {
		t.Errorf("charge_g on load = %v, want a positive mass", got)
	}
}

// Nothing is fetched: opening the page and using it makes no request beyond the file itself.
func TestNoNetworkRequests(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	rc := countRequests(t, ctx)
	open(t, ctx, u)
	var extra []string
	sawPage := false
	for _, r := range rc.list() {
		if r == u {
			sawPage = true
		} else {
			extra = append(extra, r)
		}
	}
	if !sawPage {
		t.Fatal("the request counter did not see the page itself, so it cannot see others")
	}
	if len(extra) > 0 {
		t.Errorf("the page made %d network requests: %s", len(extra), strings.Join(extra, ", "))
	}
}
