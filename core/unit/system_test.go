package unit

import (
	"testing"
	"unicode/utf8"
)

// Sentences written in °C, K, g and mL, read in other units. Factors: NIST SP 811 (2008),
// B.8 (pound 453.59237 g, US gallon 3.785411784 L) and B.9 (t/°F = 1.8·t/°C + 32; a
// difference of 1 K is 1.8 °F); §4.2.1.1 (T/K = t/°C + 273.15).
func TestWords(t *testing.T) {
	us := System{Temp: "F", Mass: "lb", Volume: "gal"}
	kel := System{Temp: "K", Mass: "kg", Volume: "L"}
	for _, tt := range []struct {
		s        System
		in, want string
	}{
		{us, "a temperature from −40 to 150 °C", "a temperature from −40 to 302 °F"},
		{us, "the batch reaches 60 °C.", "the batch reaches 140 °F."},
		{us, "cools the batch by up to 11.4 K; heat it", "cools the batch by up to 20.5 °F; heat it"},
		{us, "a margin from 0 to 50 K", "a margin from 0 to 90 °F"},
		{us, "(data -2.9–100 °C, extrapolated up to 5 K beyond)", "(data 26.8–212 °F, extrapolated up to 9 °F beyond)"},
		{us, "weighs 453.59237 g", "weighs 1 lb"},
		{us, "3785.411784 mL of water", "1 US gal of water"},
		{us, "31.6 g per 100 g water", "31.6 g per 100 g water"},
		{us, "14.3 g/100 g water; 101 g/mol; 3 kJ/(kg·K)", "14.3 g/100 g water; 101 g/mol; 3 kJ/(kg·K)"},
		{us, "CuSO4·5H2O at 25 °C", "CuSO4·5H2O at 77 °F"},
		{kel, "stable from 0 to 100 °C", "stable from 273.15 to 373.15 K"},
		{kel, "cools by 2 K", "cools by 2 K"},
		{kel, "a mass > 0, from 0.001 g to 1e7 g", "a mass > 0, from 0.000001 kg to 10000 kg"},
		{Metric, "from −40 to 150 °C", "from −40 to 150 °C"},
		{us, "a dissolve temperature in °C (required)", "a dissolve temperature in °F (required)"},
	} {
		if got := tt.s.Words(tt.in); got != tt.want {
			t.Errorf("%v.Words(%q) = %q, want %q", tt.s, tt.in, got, tt.want)
		}
	}
}

// Words never panics, leaves text alone in the metric system, and keeps valid UTF-8 valid
// (it must not cut a multi-byte character such as "−" or "°").
func FuzzWords(f *testing.F) {
	for _, s := range []string{"from −40 to 150 °C", "by 11.4 K", "6.35 g per 100 g water", "1e7 g", "-2.9–100 °C", "−", "°C", "5 mL", "1.2.3 °C", "-e5 g"} {
		f.Add(s)
	}
	us := System{Temp: "F", Mass: "lb", Volume: "gal"}
	f.Fuzz(func(t *testing.T, s string) {
		if got := Metric.Words(s); got != s {
			t.Fatalf("Metric.Words(%q) = %q", s, got)
		}
		for _, sys := range []System{us, {Temp: "K", Mass: "kg", Volume: "L"}} {
			got := sys.Words(s)
			if utf8.ValidString(s) && !utf8.ValidString(got) {
				t.Fatalf("%v.Words(%q) = %q, not valid UTF-8", sys, s, got)
			}
		}
	})
}
