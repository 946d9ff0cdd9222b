package water

import (
	"math"
	"testing"
)

// densityTol covers the 4-decimal ITS-90 table against Kell's IPTS-68 equation.
const densityTol = 0.005 // kg/m³

// densityCoarseTol covers rows that the table prints to 0.1 kg/m³.
const densityCoarseTol = 0.05 // kg/m³

func TestDensityKgPerM3(t *testing.T) {
	tests := []struct {
		tempC, want, tol float64
		source           string
	}{
		{0, 999.8395, densityTol, "OpenStax Chemistry 2e, Appendix E"},
		{4, 999.9720, densityTol, "OpenStax Chemistry 2e, Appendix E (maximum)"},
		{10, 999.7026, densityTol, "OpenStax Chemistry 2e, Appendix E"},
		{20, 998.2071, densityTol, "OpenStax Chemistry 2e, Appendix E"},
		{25, 997.0479, densityTol, "OpenStax Chemistry 2e, Appendix E"},
		{30, 995.6502, densityTol, "OpenStax Chemistry 2e, Appendix E"},
		{40, 992.2, densityCoarseTol, "OpenStax Chemistry 2e, Appendix E"},
		{60, 983.2, densityCoarseTol, "OpenStax Chemistry 2e, Appendix E"},
		{80, 971.8, densityCoarseTol, "OpenStax Chemistry 2e, Appendix E"},
		{100, 958.4, densityCoarseTol, "OpenStax Chemistry 2e, Appendix E"},
	}
	for _, tt := range tests {
		got := DensityKgPerM3(tt.tempC)
		if math.Abs(got-tt.want) > tt.tol {
			t.Errorf("DensityKgPerM3(%v) = %.4f, want %.4f ± %v (%s)", tt.tempC, got, tt.want, tt.tol, tt.source)
		}
	}
}

func TestDensityMaximumNear4C(t *testing.T) {
	// Water is densest at 3.98 °C (Kell 1975; common knowledge).
	for _, tc := range []float64{0, 2, 3, 5, 6, 10} {
		if DensityKgPerM3(tc) >= DensityKgPerM3(3.98) {
			t.Errorf("DensityKgPerM3(%v) >= DensityKgPerM3(3.98)", tc)
		}
	}
}

// vaporRelTol is the relative agreement expected between the Wagner & Pruss equation and
// IAPWS-95 saturation tables printed to 5 significant figures.
const vaporRelTol = 2e-4

func TestVaporPressurePa(t *testing.T) {
	tests := []struct {
		tempC, want float64
		source      string
	}{
		{0.01, 611.657, "IAPWS triple-point pressure (IAPWS R6-95) (from memory)"},
		{20, 2339.2, "IAPWS-95 saturation table, Wagner & Pruss 2002 (from memory)"},
		{25, 3169.9, "IAPWS-95 saturation table, Wagner & Pruss 2002 (from memory)"},
		{50, 12352, "IAPWS-95 saturation table, Wagner & Pruss 2002 (from memory)"},
		{80, 47416, "IAPWS-95 saturation table, Wagner & Pruss 2002 (from memory)"},
		{100, 101418, "IAPWS-95 saturation table, Wagner & Pruss 2002 (from memory)"},
	}
	for _, tt := range tests {
		got := VaporPressurePa(tt.tempC)
		if math.Abs(got/tt.want-1) > vaporRelTol {
			t.Errorf("VaporPressurePa(%v) = %.1f, want %.1f (%s)", tt.tempC, got, tt.want, tt.source)
		}
	}
}

func TestNormalBoilingPoint(t *testing.T) {
	// Water boils at 99.974 °C at 101.325 kPa on ITS-90 (IAPWS-95; from memory).
	if p := VaporPressurePa(99.974); math.Abs(p-101325) > 5 {
		t.Errorf("VaporPressurePa(99.974) = %.1f Pa, want 101325 ± 5", p)
	}
}

// cpTol is the stated uncertainty of the remembered IAPWS-95 c_p values.
const cpTol = 0.003 // kJ/(kg·K)

func TestHeatCapacityBetweenNodes(t *testing.T) {
	// Rows between the interpolation nodes, so they test the interpolant, not the table.
	tests := []struct {
		tempC, want float64
		source      string
	}{
		{5, 4.2050, "IAPWS-95 at 101.325 kPa (from memory)"},
		{70, 4.1900, "IAPWS-95 at 101.325 kPa (from memory)"},
		{90, 4.2052, "IAPWS-95 at 101.325 kPa (from memory)"},
	}
	for _, tt := range tests {
		got := HeatCapacityKJPerKgK(tt.tempC)
		if math.Abs(got-tt.want) > cpTol {
			t.Errorf("HeatCapacityKJPerKgK(%v) = %.4f, want %.4f ± %v (%s)", tt.tempC, got, tt.want, cpTol, tt.source)
		}
	}
}

func TestHeatCapacityNearConstant(t *testing.T) {
	// "A constant 4.18 kJ/(kg·K) is within 1 % from 0 to 100 °C" (common practice).
	for tc := 0.0; tc <= 100; tc += 0.5 {
		if cp := HeatCapacityKJPerKgK(tc); math.Abs(cp/4.18-1) > 0.01 {
			t.Errorf("HeatCapacityKJPerKgK(%v) = %.4f, more than 1 %% from 4.18", tc, cp)
		}
	}
}

func TestOutsideRangeStaysFinite(t *testing.T) {
	inputs := []float64{-1e308, -300, -60, -1, 101, 150, 200, 373.946, 400, 1e308, math.Inf(1), math.Inf(-1)}
	for _, tc := range inputs {
		for name, f := range map[string]func(float64) float64{
			"DensityKgPerM3": DensityKgPerM3, "VaporPressurePa": VaporPressurePa, "HeatCapacityKJPerKgK": HeatCapacityKJPerKgK,
		} {
			if v := f(tc); math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
				t.Errorf("%s(%v) = %v, want finite and positive", name, tc, v)
			}
		}
	}
}

func TestOutsideRangeHoldsEnds(t *testing.T) {
	if DensityKgPerM3(-5) != DensityKgPerM3(0) {
		t.Errorf("DensityKgPerM3(-5) != DensityKgPerM3(0)")
	}
	if HeatCapacityKJPerKgK(120) != HeatCapacityKJPerKgK(100) {
		t.Errorf("HeatCapacityKJPerKgK(120) != HeatCapacityKJPerKgK(100)")
	}
	if VaporPressurePa(-10) != VaporPressurePa(0.01) {
		t.Errorf("VaporPressurePa(-10) != VaporPressurePa(0.01)")
	}
	// Above 100 °C the vapour-pressure equation keeps going (it is valid to the critical point).
	if p := VaporPressurePa(120); math.Abs(p/198670-1) > vaporRelTol {
		t.Errorf("VaporPressurePa(120) = %.0f Pa, want 198670 (IAPWS-95 saturation table; from memory)", p)
	}
}

func TestNaNPropagates(t *testing.T) {
	for _, f := range []func(float64) float64{DensityKgPerM3, VaporPressurePa, HeatCapacityKJPerKgK} {
		if v := f(math.NaN()); !math.IsNaN(v) {
			t.Errorf("f(NaN) = %v, want NaN (documented)", v)
		}
	}
}

var sink float64

func BenchmarkDensityKgPerM3(b *testing.B) {
	for b.Loop() {
		sink = DensityKgPerM3(23.7)
	}
}

func BenchmarkVaporPressurePa(b *testing.B) {
	for b.Loop() {
		sink = VaporPressurePa(23.7)
	}
}

func BenchmarkHeatCapacityKJPerKgK(b *testing.B) {
	for b.Loop() {
		sink = HeatCapacityKJPerKgK(73.7)
	}
}
