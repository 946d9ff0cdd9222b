package gas

import (
	"math"
	"testing"
)

// weissTol covers rounding of the check values, which are the Weiss (1974) equation evaluated
// at 4 significant figures, and the last digit of the coefficients (±0.2 %).
const weissTol = 2e-3

func TestWeissK0(t *testing.T) {
	tests := []struct {
		tempC, s, want float64
		perKg          bool
		source         string
	}{
		{25, 35, 0.02839, true, "Weiss (1974) table of K0, 2.839e-2 mol kg⁻¹ atm⁻¹ (from memory)"},
		{0, 35, 0.06287, true, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
		{0, 0, 0.07758, false, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
		{10, 0, 0.05366, false, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
		{20, 0, 0.03910, false, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
		{25, 0, 0.03397, false, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
		{30, 0, 0.02983, false, "Weiss (1974), Marine Chemistry 2:203, equation with its printed coefficients (derived)"},
	}
	for _, tt := range tests {
		got := WeissK0MolPerLAtm(tt.tempC, tt.s)
		if tt.perKg {
			got = WeissK0MolPerKgAtm(tt.tempC, tt.s)
		}
		if math.Abs(got/tt.want-1) > weissTol {
			t.Errorf("Weiss K0(%v °C, S %v, perKg %v) = %.5f, want %.5f (%s)", tt.tempC, tt.s, tt.perKg, got, tt.want, tt.source)
		}
	}
}

func TestWeissAgainstSander(t *testing.T) {
	// Sander (2015) CO2 3.3e-4 mol m⁻³ Pa⁻¹ = 0.0334 mol L⁻¹ atm⁻¹ at 25 °C; within 2 %.
	sander := 3.3e-4 * PaPerAtm / 1000
	if got := WeissK0MolPerLAtm(25, 0); math.Abs(got/sander-1) > 0.02 {
		t.Errorf("Weiss K0(25 °C) = %.5f, Sander %.5f", got, sander)
	}
}

func TestCO2Saturation(t *testing.T) {
	// 420 ppm, 25 °C, fresh water, 1 atm: K0·x·(1 − Pwv) = 0.03397 × 420e-6 × 0.96874 mol/L
	// (derived: from Weiss 1974, Marine Chemistry 2:203) = 13.82 µmol/L = 0.608 mg/L.
	d, err := CO2Saturation(Conditions{TempC: 25, PressureKPa: StdKPa}, 420)
	if err != nil {
		t.Fatal(err)
	}
	want := 0.03397 * 420e-6 * (1 - 0.031262) * 44.0095 * 1000
	if math.Abs(d.MgPerL/want-1) > weissTol {
		t.Errorf("CO2Saturation(25 °C, 420 ppm) = %.4f mg/L, want %.4f", d.MgPerL, want)
	}
	// Salting out lowers it.
	sea, _ := CO2Saturation(Conditions{TempC: 25, Salinity: 35, PressureKPa: StdKPa}, 420)
	if !(sea.MgPerL < d.MgPerL) {
		t.Errorf("CO2 at S 35 (%.4f) not below fresh water (%.4f)", sea.MgPerL, d.MgPerL)
	}
	for _, tt := range []struct {
		c     Conditions
		ppm   float64
		field string
	}{
		{Conditions{TempC: -2, PressureKPa: StdKPa}, 420, "temp_C"},
		{Conditions{TempC: 55, PressureKPa: StdKPa}, 420, "temp_C"},
		{Conditions{TempC: 20, Salinity: 45, PressureKPa: StdKPa}, 420, "salinity"},
		{Conditions{TempC: 20, PressureKPa: 10}, 420, "pressure_kPa"},
		{Conditions{TempC: 20, PressureKPa: StdKPa}, math.NaN(), "co2_ppm"},
	} {
		_, err := CO2Saturation(tt.c, tt.ppm)
		checkField(t, err, tt.field)
	}
}
