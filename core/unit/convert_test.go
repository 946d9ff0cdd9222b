package unit

import (
	"math"
	"testing"
)

// exact is the tolerance for conversions that are exact by definition: a few ulps.
const exact = 1e-12 // relative

func near(a, b, rel float64) bool { return math.Abs(a-b) <= rel*math.Max(1, math.Abs(b)) }

func TestConversions(t *testing.T) {
	tests := []struct {
		name      string
		got, want float64
	}{
		// NIST SP 811 (2008), B.8: 1 lb (avoirdupois) = 0.45359237 kg exactly.
		{"GramsFromPounds(1)", GramsFromPounds(1), 453.59237},
		{"PoundsFromGrams(453.59237)", PoundsFromGrams(453.59237), 1},
		{"GramsFromKilograms(2.5)", GramsFromKilograms(2.5), 2500},
		{"KilogramsFromGrams(250)", KilogramsFromGrams(250), 0.25},
		// NIST SP 811 (2008), B.8: 1 gal (U.S.) = 3.785411784 L exactly.
		{"MillilitersFromUSGallons(1)", MillilitersFromUSGallons(1), 3785.411784},
		{"USGallonsFromMilliliters(3785.411784)", USGallonsFromMilliliters(3785.411784), 1},
		{"MillilitersFromLiters(1.5)", MillilitersFromLiters(1.5), 1500},
		{"LitersFromMilliliters(250)", LitersFromMilliliters(250), 0.25},
		// NIST SP 811 (2008), §4.2.1.1 and B.9: t/°C = T/K − 273.15; t/°F = 1.8 t/°C + 32.
		{"KelvinFromCelsius(0)", KelvinFromCelsius(0), 273.15},
		{"CelsiusFromKelvin(373.15)", CelsiusFromKelvin(373.15), 100},
		{"FahrenheitFromCelsius(100)", FahrenheitFromCelsius(100), 212},
		{"FahrenheitFromCelsius(-40)", FahrenheitFromCelsius(-40), -40},
		{"CelsiusFromFahrenheit(98.6)", CelsiusFromFahrenheit(98.6), 37},
		{"CelsiusFromFahrenheit(32)", CelsiusFromFahrenheit(32), 0},
	}
	for _, tt := range tests {
		if !near(tt.got, tt.want, exact) {
			t.Errorf("%s = %v, want %v", tt.name, tt.got, tt.want)
		}
	}
}

func TestConversionRoundTrips(t *testing.T) {
	for _, v := range []float64{-273.15, -40, 0, 0.1, 20, 37.5, 100, 1e4} {
		if got := CelsiusFromFahrenheit(FahrenheitFromCelsius(v)); !near(got, v, exact) {
			t.Errorf("°C→°F→°C(%v) = %v", v, got)
		}
		if got := CelsiusFromKelvin(KelvinFromCelsius(v)); !near(got, v, exact) {
			t.Errorf("°C→K→°C(%v) = %v", v, got)
		}
		if got := PoundsFromGrams(GramsFromPounds(v)); !near(got, v, exact) {
			t.Errorf("lb→g→lb(%v) = %v", v, got)
		}
		if got := USGallonsFromMilliliters(MillilitersFromUSGallons(v)); !near(got, v, exact) {
			t.Errorf("gal→mL→gal(%v) = %v", v, got)
		}
	}
}

func TestToUnits(t *testing.T) {
	if c, err := ToCelsius("t", 212, "°F"); err != nil || !near(c, 100, exact) {
		t.Errorf("ToCelsius(212 °F) = %v, %v; want 100", c, err)
	}
	if c, err := ToCelsius("t", 0, "K"); err != nil || !near(c, -273.15, exact) {
		t.Errorf("ToCelsius(0 K) = %v, %v; want -273.15", c, err)
	}
	for _, tt := range []struct {
		v     float64
		scale string
	}{{-1, "K"}, {-500, "F"}, {math.NaN(), "C"}, {20, "Réaumur"}} {
		if _, err := ToCelsius("t", tt.v, tt.scale); err == nil {
			t.Errorf("ToCelsius(%v %s) gave no error", tt.v, tt.scale)
		}
	}
	if g, err := ToGrams("m", 2, "lb"); err != nil || !near(g, 907.18474, exact) {
		t.Errorf("ToGrams(2 lb) = %v, %v", g, err)
	}
	if _, err := ToGrams("m", 2, "oz"); err == nil {
		t.Error("ToGrams(oz) gave no error")
	}
	if ml, err := ToMilliliters("v", 0.5, "gal"); err != nil || !near(ml, 1892.705892, exact) {
		t.Errorf("ToMilliliters(0.5 gal) = %v, %v", ml, err)
	}
	if _, err := ToMilliliters("v", 1, "pint"); err == nil {
		t.Error("ToMilliliters(pint) gave no error")
	}
}
