package unit

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"testing"
)

func TestParseNumber(t *testing.T) {
	tests := []struct {
		in   string
		want float64
	}{
		// decimal point and decimal comma
		{"12.5", 12.5},
		{"12,5", 12.5},
		{" 12,5 ", 12.5},
		{"0,25", 0.25},
		{",5", 0.5},
		{"5.", 5},
		{"1,234", 1.234}, // one separator is always decimal (package doc)
		// signs and exponents
		{"-3", -3},
		{"+3", 3},
		{"−3,5", -3.5}, // typographic minus U+2212
		{"1e3", 1000},
		{"2,5E-2", 0.025},
		{"1E+2", 100},
		{"0", 0},
		{"1e-400", 0}, // underflow reads as zero
	}
	for _, tt := range tests {
		got, err := ParseNumber("x", tt.in)
		if err != nil || got != tt.want {
			t.Errorf("ParseNumber(%q) = %v, %v; want %v", tt.in, got, err, tt.want)
		}
	}
}

func TestParseNumberRefuses(t *testing.T) {
	tests := []struct {
		in, allowed string // allowed: a word the message must contain
	}{
		{"", "a number"},
		{"   ", "a number"},
		{"1.234,5", "thousands"},
		{"1,234.5", "thousands"},
		{"1 234", "thousands"},
		{"1\u00a0234", "thousands"}, // no-break space
		{"1\u202f234", "thousands"}, // narrow no-break space
		{"1'234", "thousands"},
		{"1_234", "thousands"},
		{"1.2.3", "thousands"},
		{"1,2,3", "thousands"},
		{"NaN", "a number"},
		{"nan", "a number"},
		{"Inf", "a number"},
		{"-Infinity", "a number"},
		{"1e400", "finite"},
		{"1e", "a number"},
		{"1e+", "a number"},
		{"e5", "a number"},
		{"20°C", "unit"},
		{"12 g", "unit"},
		{"12g", "unit"},
		{"50 %", "unit"},
		{"1,5 kg", "unit"},
		{"1e3 mL", "unit"},
		{"0x10", "a number"},
		{"abc", "a number"},
		{"--1", "a number"},
		{".", "a number"},
		{"-", "a number"},
	}
	for _, tt := range tests {
		got, err := ParseNumber("water_g", tt.in)
		var fe *FieldError
		if !errors.As(err, &fe) {
			t.Errorf("ParseNumber(%q) = %v, %v; want a *FieldError", tt.in, got, err)
			continue
		}
		if fe.Field != "water_g" || fe.Value != tt.in || !strings.Contains(fe.Allowed, tt.allowed) {
			t.Errorf("ParseNumber(%q) error = %+v; want field water_g, value %q, allowed mentioning %q", tt.in, fe, tt.in, tt.allowed)
		}
	}
}

func TestFieldErrorMessage(t *testing.T) {
	err := &FieldError{Field: "water_g", Value: "-5", Allowed: "a mass > 0 g"}
	const want = `water_g: "-5" is not allowed; allowed: a mass > 0 g`
	if err.Error() != want {
		t.Errorf("Error() = %q, want %q", err.Error(), want)
	}
}

// A key or value as long as a whole request is shown clipped at a character boundary, with
// its length, so the message stays short whatever was sent.
func TestFieldErrorClipsLongText(t *testing.T) {
	long := strings.Repeat("é", 30000) // 2 bytes each
	err := &FieldError{Field: long, Value: long, Allowed: "one of the keys: a, b"}
	msg := err.Error()
	if len(msg) > 4*ClipBytes+100 {
		t.Fatalf("message is %d bytes, want it clipped", len(msg))
	}
	if !strings.Contains(msg, "… (60000 bytes)") || !strings.HasSuffix(msg, "allowed: one of the keys: a, b") {
		t.Errorf("message %q lacks the clip mark or the allowed text", msg)
	}
	for _, tc := range []struct {
		in   string
		want string
	}{
		{"water_g", "water_g"},
		{strings.Repeat("a", ClipBytes), strings.Repeat("a", ClipBytes)},
		{strings.Repeat("a", ClipBytes+1), strings.Repeat("a", ClipBytes) + "… (81 bytes)"},
		{"a" + strings.Repeat("é", ClipBytes), "a" + strings.Repeat("é", ClipBytes/2-1) + "… (161 bytes)"},
	} {
		if got := Clip(tc.in); got != tc.want {
			t.Errorf("Clip(%d bytes) = %q, want %q", len(tc.in), got, tc.want)
		}
	}
}

func TestFormatNumber(t *testing.T) {
	tests := []struct {
		v    float64
		sig  int
		want string
	}{
		{31.93, 3, "31.9"},
		{31.96, 3, "32.0"}, // carries into the next digit, keeping the zero
		{0.0025, 2, "0.0025"},
		{1234.5, 3, "1230"},
		{-2.5, 2, "-2.5"},
		{-0.0001, 1, "-0.0001"},
		{-0.00001, 1, "-0.00001"},
		{1e20, 3, "1e+20"},
		{0, 4, "0"},
		{math.NaN(), 3, "—"},
		{math.Inf(1), 3, "—"},
		{math.Inf(-1), 3, "—"},
		{2, 0, "2"},
		{99.96, 3, "100"},
		{0.09996, 3, "0.100"},
	}
	for _, tt := range tests {
		if got := FormatNumber(tt.v, tt.sig); got != tt.want {
			t.Errorf("FormatNumber(%v, %d) = %q, want %q", tt.v, tt.sig, got, tt.want)
		}
	}
	if got := FormatCompact(95, 6); got != "95" {
		t.Errorf("FormatCompact(95, 6) = %q, want 95", got)
	}
	if got := FormatCompact(0.250, 6); got != "0.25" {
		t.Errorf("FormatCompact(0.25, 6) = %q, want 0.25", got)
	}
}

// FuzzParseNumber checks properties, not outputs: no panic; an accepted number is finite;
// the decimal comma reads like the decimal point; and a value printed back is read back
// exactly.
func FuzzParseNumber(f *testing.F) {
	for _, s := range []string{"12,5", "1.234,5", "-1e3", " 7 ", "1 234", "−0,5", "1e400", ""} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, err := ParseNumber("x", s)
		if err != nil {
			var fe *FieldError
			if !errors.As(err, &fe) || fe.Field != "x" {
				t.Fatalf("ParseNumber(%q) error %v is not a *FieldError for x", s, err)
			}
			return
		}
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("ParseNumber(%q) = %v", s, v)
		}
		if strings.Count(s, ".") == 1 && !strings.Contains(s, ",") {
			w, err := ParseNumber("x", strings.Replace(s, ".", ",", 1))
			if err != nil || w != v {
				t.Fatalf("comma form of %q = %v, %v; want %v", s, w, err, v)
			}
		}
		back, err := ParseNumber("x", strconv.FormatFloat(v, 'g', -1, 64))
		if err != nil || back != v {
			t.Fatalf("round trip of %v = %v, %v", v, back, err)
		}
	})
}
