package web_test

import (
	"math"
	"os"
	"regexp"
	"strconv"
	"testing"
)

// Text colours of app.css against the backgrounds they sit on meet WCAG AA: a contrast
// ratio of at least 4.5:1 for normal text (WCAG 2.1, W3C Recommendation 2018, success
// criterion 1.4.3), with relative luminance and contrast ratio as defined in WCAG 2.1's
// glossary (sRGB channels linearised with the 0.03928 threshold; (L1 + 0.05)/(L2 + 0.05)).
func TestContrastAA(t *testing.T) {
	css, err := os.ReadFile("app.css")
	if err != nil {
		t.Fatal(err)
	}
	vars := map[string]string{}
	for _, m := range regexp.MustCompile(`--([a-z-]+):\s*(#[0-9a-fA-F]{6})`).FindAllStringSubmatch(string(css), -1) {
		vars[m[1]] = m[2]
	}
	col := func(name string) string {
		if name[0] == '#' {
			return name
		}
		c, ok := vars[name]
		if !ok {
			t.Fatalf("app.css has no colour --%s", name)
		}
		return c
	}
	// aaNormal is WCAG 2.1 SC 1.4.3's minimum for normal-size text.
	const aaNormal = 4.5
	for _, p := range []struct{ fg, bg, where string }{
		{"ink", "paper", "body text"},
		{"ink", "card", "fields and tiles"},
		{"muted", "paper", "hints on the page"},
		{"muted", "card", "labels and units in tiles"},
		{"brine", "card", "big figures, outline buttons"},
		{"brine", "paper", "legends"},
		{"brine", "brine-soft", "selected tab text"},
		{"brine-ink", "brine", "top bar, primary buttons"},
		{"ink", "brine-soft", "compound matches, table heads"},
		{"warn-ink", "warn-bg", "stale-result notice"},
		{"warn-ink", "card", "warnings list"},
		{"risk-ink", "risk-bg", "cautions"},
		{"bad", "card", "field messages"},
		{"ink", "#fff6f4", "an invalid field"},
		{"#d7dde0", "ink", "result strip labels"},
		{"#ffd27a", "ink", "result strip when stale"},
		{"#ffffff", "ink", "result strip figures"},
	} {
		r := contrast(col(p.fg), col(p.bg))
		if r < aaNormal {
			t.Errorf("%s: %s on %s has contrast %.2f:1, want ≥ %.1f:1", p.where, p.fg, p.bg, r, aaNormal)
		}
	}
}

func luminance(hex string) float64 {
	lin := func(s string) float64 {
		v, _ := strconv.ParseUint(s, 16, 8)
		c := float64(v) / 255
		if c <= 0.03928 {
			return c / 12.92
		}
		return math.Pow((c+0.055)/1.055, 2.4)
	}
	return 0.2126*lin(hex[1:3]) + 0.7152*lin(hex[3:5]) + 0.0722*lin(hex[5:7])
}

func contrast(a, b string) float64 {
	la, lb := luminance(a), luminance(b)
	if la < lb {
		la, lb = lb, la
	}
	return (la + 0.05) / (lb + 0.05)
}

// The formula itself, checked on the two values WCAG's own understanding document gives:
// black on white is 21:1 and a colour on itself is 1:1.
func TestContrastFormula(t *testing.T) {
	if r := contrast("#000000", "#ffffff"); math.Abs(r-21) > 1e-9 {
		t.Errorf("black on white = %v, want 21", r)
	}
	if r := contrast("#0c5868", "#0c5868"); r != 1 {
		t.Errorf("a colour on itself = %v, want 1", r)
	}
}
