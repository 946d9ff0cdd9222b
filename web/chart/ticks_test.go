package chart

import (
	"math"
	"testing"
)

// tickTol covers float64 rounding in step and end values.
const tickTol = 1e-9

func TestNiceTicks(t *testing.T) {
	for _, tc := range []struct {
		min, max float64
		n        int
		lo, hi   float64
		step     float64
		dec      int
	}{
		// Heckbert's own worked example: data 105 to 543 with 5 ticks are
		// labelled 100, 200, …, 600 (P. S. Heckbert, "Nice numbers for graph
		// labels", Graphics Gems, 1990; from memory).
		{105, 543, 5, 100, 600, 100, 0},
		// The rest follow by hand from Heckbert's rules: range rounded up to
		// 1, 2, 5 or 10 × 10^k, step rounded to the nearest of them
		// (thresholds 1.5, 3 and 7).
		{0, 100, 6, 0, 100, 20, 0},      // range 100; 100/5 = 20 → 2·10
		{0, 242.5, 6, 0, 300, 100, 0},   // range 500; 500/5 = 100
		{4, 35, 8, 0, 40, 10, 0},        // range 50; 50/7 ≈ 7.1 ≥ 7 → 10
		{6.413, 14.621, 6, 6, 16, 2, 0}, // range 10; 10/5 = 2
		{0.17, 0.34, 6, 0.15, 0.35, 0.05, 2},
		{-20, 5, 6, -20, 10, 10, 0},          // range 50; 50/5 = 10
		{273.15, 373.15, 8, 270, 380, 10, 0}, // range 100; 100/7 ≈ 14.3, 1.43 < 1.5 → 10
		// A single value widens by 10 % of itself, or ±1 at zero.
		{50, 50, 6, 44, 56, 2, 0}, // 45..55: range 10, step 2
		{0, 0, 6, -1, 1, 0.5, 1},
		// Reversed ends are swapped.
		{100, 0, 6, 0, 100, 20, 0},
	} {
		got, ok := NiceTicks(tc.min, tc.max, tc.n)
		if !ok {
			t.Errorf("NiceTicks(%v, %v, %d) refused", tc.min, tc.max, tc.n)
			continue
		}
		if !near(got.Lo, tc.lo) || !near(got.Hi, tc.hi) || !near(got.Step, tc.step) || got.Decimals != tc.dec {
			t.Errorf("NiceTicks(%v, %v, %d) = %+v, want lo %v hi %v step %v decimals %d",
				tc.min, tc.max, tc.n, got, tc.lo, tc.hi, tc.step, tc.dec)
		}
	}
}

func near(a, b float64) bool { return math.Abs(a-b) <= tickTol*math.Max(1, math.Abs(b)) }

func TestNiceTicksRefuses(t *testing.T) {
	for _, tc := range []struct{ min, max float64 }{
		{math.NaN(), 1}, {0, math.Inf(1)}, {math.Inf(-1), 0},
		{-math.MaxFloat64, math.MaxFloat64}, // span overflows
	} {
		if got, ok := NiceTicks(tc.min, tc.max, 6); ok {
			t.Errorf("NiceTicks(%v, %v) = %+v, want refusal", tc.min, tc.max, got)
		}
	}
}

// Properties that hold for any range: ends enclose the data, the ends are
// multiples of the step, the count is bounded.
func TestNiceTicksProperties(t *testing.T) {
	for _, r := range [][2]float64{
		{0, 1}, {-3.7, 12.9}, {1e-6, 3e-6}, {1e9, 1.00001e9}, {-1e300, 1e300}, {12.5, 12.5000001},
		{99.99, 100.01}, {-0.001, 0}, {32, 212},
	} {
		for n := 2; n <= 12; n++ {
			tk, ok := NiceTicks(r[0], r[1], n)
			if !ok {
				t.Errorf("NiceTicks(%v, %v, %d) refused", r[0], r[1], n)
				continue
			}
			// The ends may miss the data by rounding noise, far below a pixel.
			if slack := tk.Step * 1e-9; tk.Lo > r[0]+slack || tk.Hi < r[1]-slack {
				t.Errorf("NiceTicks(%v, %v, %d) = %+v does not enclose the data", r[0], r[1], n, tk)
			}
			v := tk.Values()
			if len(v) < 2 || len(v) > maxTicks {
				t.Errorf("NiceTicks(%v, %v, %d) gives %d ticks", r[0], r[1], n, len(v))
			}
			seen := map[string]bool{}
			for _, x := range v {
				l := tk.Label(x, false)
				if seen[l] {
					t.Errorf("NiceTicks(%v, %v, %d): label %q twice", r[0], r[1], n, l)
				}
				seen[l] = true
			}
		}
	}
}

func TestLabel(t *testing.T) {
	tk := Ticks{Lo: -1, Hi: 1, Step: 0.5, Decimals: 1}
	for _, tc := range []struct {
		v     float64
		comma bool
		want  string
	}{
		{-1, false, "−1.0"}, // U+2212 minus sign
		{-0.5, true, "−0,5"},
		{1e-17, false, "0.0"}, // rounding noise is zero, not "-0"
		{-1e-17, false, "0.0"},
		{0.5, true, "0,5"},
	} {
		if got := tk.Label(tc.v, tc.comma); got != tc.want {
			t.Errorf("Label(%v, %v) = %q, want %q", tc.v, tc.comma, got, tc.want)
		}
	}
	// Tick values are multiples of the step, so 0.1 steps print exactly.
	tk, _ = NiceTicks(0, 0.7, 8)
	var got []string
	for _, v := range tk.Values() {
		got = append(got, tk.Label(v, false))
	}
	want := []string{"0.0", "0.1", "0.2", "0.3", "0.4", "0.5", "0.6", "0.7"}
	if len(got) != len(want) {
		t.Fatalf("labels for 0..0.7 = %q, want %q", got, want)
	}
	for i := range want {
		if got[i] != want[i] {
			t.Errorf("labels for 0..0.7 = %q, want %q", got, want)
			break
		}
	}
}

func TestFormatExtremes(t *testing.T) {
	for _, tc := range []struct {
		v    float64
		sig  int
		want string
	}{
		{1.5e20, 3, "1.5e+20"}, // exponent notation keeps its zeros
		{-2.5e300, 3, "−2.5e+300"},
		{4, 3, "4"},
		{32.60, 3, "32.6"},
		{0.000123, 3, "0.000123"},
	} {
		if got := formatShort(tc.v, tc.sig, false); got != tc.want {
			t.Errorf("formatShort(%v, %d) = %q, want %q", tc.v, tc.sig, got, tc.want)
		}
	}
	// A billion-scale axis prints in exponent notation, every label distinct.
	tk, _ := NiceTicks(1e9, 1.00001e9, 6)
	seen := map[string]bool{}
	for _, v := range tk.Values() {
		l := tk.Label(v, false)
		if len(l) > 12 || seen[l] {
			t.Errorf("label %q of the axis %+v is long or repeated", l, tk)
		}
		seen[l] = true
	}
}
