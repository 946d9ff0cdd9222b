package gas

import (
	"math"
	"testing"

	"saltcast/core/water"
)

func mustOutgas(t *testing.T, in OutgasInput) Outgassing {
	t.Helper()
	o, err := Outgas(in)
	if err != nil {
		t.Fatalf("Outgas(%+v): %v", in, err)
	}
	return o
}

// balanceTol is the relative closure of dissolved = remaining + released.
const balanceTol = 1e-9

func TestOutgasBalanceAndSigns(t *testing.T) {
	for from := 0.0; from < 100; from += 10 {
		for to := from + 5; to <= 100; to += 15 {
			o := mustOutgas(t, OutgasInput{FromC: from, ToC: to, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM})
			var sum, sumSTP float64
			for _, r := range o.Gases {
				if r.ReleasedUmolPerL < 0 || r.ReleasedMLPerL < 0 {
					t.Errorf("%v→%v °C %s: negative release %+v", from, to, r.Gas.ID, r)
				}
				if d := r.DissolvedUmolPerL - r.RemainingUmolPerL - r.ReleasedUmolPerL; math.Abs(d) > balanceTol*r.DissolvedUmolPerL {
					t.Errorf("%v→%v °C %s: dissolved %v ≠ remaining %v + released %v", from, to, r.Gas.ID,
						r.DissolvedUmolPerL, r.RemainingUmolPerL, r.ReleasedUmolPerL)
				}
				sum += r.ReleasedMLPerL
				sumSTP += r.ReleasedMLSTPPerL
			}
			if math.Abs(sum-o.TotalMLPerL) > 1e-12 || math.Abs(sumSTP-o.TotalMLSTPPerL) > 1e-12 {
				t.Errorf("%v→%v °C: totals do not add up", from, to)
			}
			// Ideal gas: V(T2, P)/V(STP) = (T2/273.15)·(101.325/P).
			if o.TotalMLSTPPerL > 0 {
				ratio := o.TotalMLPerL / o.TotalMLSTPPerL
				want := (to + 273.15) / 273.15
				if math.Abs(ratio/want-1) > 1e-12 {
					t.Errorf("%v→%v °C: volume ratio %v, want %v", from, to, ratio, want)
				}
			}
		}
	}
}

func TestOutgasRisesWithEndTemperature(t *testing.T) {
	prev := -1.0
	for to := 21.0; to <= 99; to++ {
		o := mustOutgas(t, OutgasInput{FromC: 20, ToC: to, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM})
		if !(o.TotalMLSTPPerL > prev) {
			t.Fatalf("release does not rise with end temperature at %v °C", to)
		}
		prev = o.TotalMLSTPPerL
	}
}

func TestOutgasMagnitude(t *testing.T) {
	// Air dissolved at 20 °C, 1 atm: about 0.01869 × (1 − 0.0231) ≈ 0.01826 mL(STP)/mL from the
	// Bunsen coefficient of air (Lange's Handbook; from memory). Heating to 100 °C at 1 atm boils
	// the water, so all of it leaves: 18.3 mL(STP)/L ± 5 %.
	o := mustOutgas(t, OutgasInput{FromC: 20, ToC: 100, PressureKPa: StdKPa, CO2PPM: 0})
	if math.Abs(o.TotalMLSTPPerL/18.26-1) > 0.05 {
		t.Errorf("air released 20→100 °C = %.2f mL(STP)/L, want 18.3 ± 5 %%", o.TotalMLSTPPerL)
	}
	if len(o.Warnings) == 0 {
		t.Errorf("no boiling warning at 100 °C and 101.325 kPa")
	}
	for _, r := range o.Gases {
		if r.RemainingUmolPerL != 0 {
			t.Errorf("%s remains %v µmol/L in boiling water", r.Gas.ID, r.RemainingUmolPerL)
		}
	}
	// O2/N2 ratio of dissolved air is enriched in O2 against air (about 1:1.9 instead of 1:3.7)
	// because O2 is about twice as soluble (common knowledge; Sander 2015 constants).
	var o2, n2 float64
	for _, r := range o.Gases {
		switch r.Gas.ID {
		case "O2":
			o2 = r.DissolvedUmolPerL
		case "N2":
			n2 = r.DissolvedUmolPerL
		}
	}
	if ratio := n2 / o2; ratio < 1.7 || ratio > 2.1 {
		t.Errorf("dissolved N2/O2 = %.2f, want about 1.9", ratio)
	}
}

func TestBubbleTemperature(t *testing.T) {
	// Saturated at the same pressure: any warming makes the gases' pressure exceed it.
	o := mustOutgas(t, OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM})
	if !o.BubbleFound || math.Abs(o.BubbleTempC-20) > 1e-6 {
		t.Errorf("bubble temperature at the saturation pressure = %v (%v), want 20 °C", o.BubbleTempC, o.BubbleFound)
	}
	// Heated under a higher pressure the bubble point rises, and at the bubble point the
	// dissolved gases plus water vapour equal the pressure.
	prev := 20.0
	for _, p := range []float64{110, 130, 150, 180} {
		o := mustOutgas(t, OutgasInput{FromC: 20, ToC: 90, PressureKPa: StdKPa, HeatPressureKPa: p, CO2PPM: DefaultCO2PPM})
		if !o.BubbleFound || o.BubbleTempC <= prev {
			t.Errorf("bubble temperature at %v kPa = %v (%v), want above %v", p, o.BubbleTempC, o.BubbleFound, prev)
			continue
		}
		prev = o.BubbleTempC
		sum := water.VaporPressurePa(o.BubbleTempC)
		for _, r := range o.Gases {
			molPerKg := r.DissolvedUmolPerL * 1e-6 * 1000 / water.DensityKgPerM3(20)
			sum += molPerKg / r.Gas.HenryMolPerKgPa(o.BubbleTempC)
		}
		if math.Abs(sum/(p*1000)-1) > 1e-6 {
			t.Errorf("at the bubble point %v °C the pressures sum to %.1f Pa, want %v", o.BubbleTempC, sum, p*1000)
		}
	}
	// Far above the dissolved gases' pressure: no bubbles below 100 °C.
	o = mustOutgas(t, OutgasInput{FromC: 20, ToC: 90, PressureKPa: StdKPa, HeatPressureKPa: 500, CO2PPM: DefaultCO2PPM})
	if o.BubbleFound {
		t.Errorf("bubble point found at 500 kPa: %v °C", o.BubbleTempC)
	}
	if o.TotalMLPerL != 0 {
		t.Errorf("release at 500 kPa = %v, want 0 (the water can hold more gas)", o.TotalMLPerL)
	}
}

func TestOutgasCaution(t *testing.T) {
	if o := mustOutgas(t, OutgasInput{FromC: 10, ToC: 30, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM}); len(o.Cautions) != 0 {
		t.Errorf("caution at 30 °C: %v", o.Cautions)
	}
	if o := mustOutgas(t, OutgasInput{FromC: 10, ToC: 60, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM}); len(o.Cautions) == 0 {
		t.Errorf("no hot-water caution at 60 °C")
	}
}

func TestOutgasRefuses(t *testing.T) {
	tests := []struct {
		in    OutgasInput
		field string
	}{
		{OutgasInput{FromC: -1, ToC: 80, PressureKPa: StdKPa}, "from_C"},
		{OutgasInput{FromC: math.NaN(), ToC: 80, PressureKPa: StdKPa}, "from_C"},
		{OutgasInput{FromC: 20, ToC: 20, PressureKPa: StdKPa}, "to_C"},
		{OutgasInput{FromC: 20, ToC: 10, PressureKPa: StdKPa}, "to_C"},
		{OutgasInput{FromC: 20, ToC: 101, PressureKPa: StdKPa}, "to_C"},
		{OutgasInput{FromC: 20, ToC: math.Inf(1), PressureKPa: StdKPa}, "to_C"},
		{OutgasInput{FromC: 20, ToC: 80, PressureKPa: -5}, "pressure_kPa"},
		{OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, HeatPressureKPa: -5}, "heat_pressure_kPa"},
		{OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, HeatPressureKPa: 1e-300}, "heat_pressure_kPa"},
		{OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, HeatPressureKPa: 5000}, "heat_pressure_kPa"},
		{OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, CO2PPM: -3}, "co2_ppm"},
	}
	for _, tt := range tests {
		_, err := Outgas(tt.in)
		checkField(t, err, tt.field)
	}
}

var sinkOut Outgassing

func BenchmarkOutgas(b *testing.B) {
	in := OutgasInput{FromC: 20, ToC: 80, PressureKPa: StdKPa, HeatPressureKPa: 150, CO2PPM: DefaultCO2PPM}
	for b.Loop() {
		sinkOut, _ = Outgas(in)
	}
}

// Heating to a scalding temperature brings the hot-water caution, by kind, and it points to
// the SDS; below 50 °C (common practice, see hotC) there is none.
func TestOutgasCautionKinds(t *testing.T) {
	for _, tt := range []struct {
		toC  float64
		want bool
	}{{40, false}, {80, true}} {
		o, err := Outgas(OutgasInput{FromC: 20, ToC: tt.toC, PressureKPa: StdKPa, CO2PPM: DefaultCO2PPM})
		if err != nil {
			t.Fatal(err)
		}
		if o.PointsToSDS() != tt.want || len(o.CautionKinds) != len(o.Cautions) {
			t.Errorf("Outgas(20 → %v °C): kinds %q for %d cautions, points to the SDS %v; want %v",
				tt.toC, o.CautionKinds, len(o.Cautions), o.PointsToSDS(), tt.want)
		}
	}
}
