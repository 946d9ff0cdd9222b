package gas

import (
	"math"
	"testing"
)

func TestPressureKPa(t *testing.T) {
	// Each row is one standard atmosphere in the named unit (NIST SP 811, 2008, B.8).
	tests := []struct {
		v    float64
		unit string
		tol  float64
	}{
		{101.325, "kPa", 1e-12},
		{1013.25, "hPa", 1e-12},
		{1013.25, "mbar", 1e-12},
		{760, "mmHg", 1e-4}, // conventional mmHg is 1.4e-7 larger than the torr
		{760, "Torr", 1e-12},
		{29.9213, "inHg", 1e-3},
		{1, "atm", 1e-12},
	}
	for _, tt := range tests {
		got, err := PressureKPa("pressure", tt.v, tt.unit)
		if err != nil || math.Abs(got-101.325) > tt.tol {
			t.Errorf("PressureKPa(%v %s) = %v, %v; want 101.325 kPa", tt.v, tt.unit, got, err)
		}
	}
	_, err := PressureKPa("pressure", 1, "psi")
	checkField(t, err, "pressure_unit")
	_, err = PressureKPa("pressure", -1, "kPa")
	checkField(t, err, "pressure")
	_, err = PressureKPa("pressure", math.Inf(1), "kPa")
	checkField(t, err, "pressure")
}

func TestAltitudeKPa(t *testing.T) {
	// U.S. Standard Atmosphere, 1976, table I (geometric altitude; from memory).
	tests := []struct{ m, want float64 }{
		{0, 101.325},
		{1000, 89.876},
		{2000, 79.501},
		{5000, 54.048},
		{-500, 107.478},
	}
	const tol = 0.01 // kPa, table printed to 5 figures
	for _, tt := range tests {
		got, err := AltitudeKPa(tt.m)
		if err != nil || math.Abs(got-tt.want) > tol {
			t.Errorf("AltitudeKPa(%v) = %.3f, %v; want %.3f", tt.m, got, err, tt.want)
		}
	}
	for _, bad := range []float64{-501, 11001, math.NaN(), math.Inf(-1)} {
		_, err := AltitudeKPa(bad)
		checkField(t, err, "altitude_m")
	}
}
