package gas

import (
	"math"
	"testing"
)

func TestOxygenTableMatchesSingleCalls(t *testing.T) {
	temps, err := Steps("temps_C", 0, 40, 5)
	if err != nil || len(temps) != 9 {
		t.Fatalf("Steps(0, 40, 5) = %v, %v", temps, err)
	}
	cols := []float64{70, 80, 90, StdKPa}
	tab, err := OxygenTable(temps, ColumnsPressure, cols, 0, BensonKrause)
	if err != nil {
		t.Fatal(err)
	}
	if len(tab.MgPerL) != len(temps) || len(tab.MgPerL[0]) != len(cols) {
		t.Fatalf("table is %d×%d, want %d×%d", len(tab.MgPerL), len(tab.MgPerL[0]), len(temps), len(cols))
	}
	// Row 20 °C, column 80 kPa: 7.135 mg/L (derived: Benson & Krause 1984 with the Standard
	// Methods 4500-O pressure correction).
	if v := tab.MgPerL[4][1]; math.Abs(v-7.135) > pressureTol {
		t.Errorf("table[20 °C][80 kPa] = %.4f, want 7.135", v)
	}
	// Row 10 °C, column 1 atm: 11.288 (B&K equation / SM 4500-O).
	if v := tab.MgPerL[2][3]; math.Abs(v-11.288) > eqTol {
		t.Errorf("table[10 °C][1 atm] = %.4f, want 11.288", v)
	}
	sal, err := OxygenTable([]float64{0, 10, 20, 25, 30}, ColumnsSalinity, []float64{0, 35}, StdKPa, BensonKrause)
	if err != nil {
		t.Fatal(err)
	}
	// S 35 column: 11.446, 9.024, 7.396, 6.772, 6.237 (derived: Benson & Krause 1984 equation
	// with its salinity term).
	for i, want := range []float64{11.446, 9.024, 7.396, 6.772, 6.237} {
		if v := sal.MgPerL[i][1]; math.Abs(v-want) > seaTol {
			t.Errorf("salinity table row %d S 35 = %.4f, want %.3f", i, v, want)
		}
	}
}

func TestOxygenTableRefuses(t *testing.T) {
	_, err := OxygenTable(nil, ColumnsPressure, []float64{StdKPa}, 0, BensonKrause)
	checkField(t, err, "temps_C")
	_, err = OxygenTable([]float64{20}, ColumnsPressure, nil, 0, BensonKrause)
	checkField(t, err, "columns")
	_, err = OxygenTable([]float64{20}, "altitude", []float64{1}, 0, BensonKrause)
	checkField(t, err, "column_kind")
	_, err = OxygenTable([]float64{20, 60}, ColumnsPressure, []float64{StdKPa}, 0, BensonKrause)
	checkField(t, err, "temp_C")
	_, err = OxygenTable([]float64{20}, ColumnsSalinity, []float64{0, 50}, StdKPa, BensonKrause)
	checkField(t, err, "salinity")
	tab, err := OxygenTable([]float64{20, 45}, ColumnsPressure, []float64{StdKPa, 100}, 0, BensonKrause)
	if err != nil || len(tab.Warnings) != 1 {
		t.Errorf("a 45 °C row should give one distinct warning: %v, %v", tab.Warnings, err)
	}
}

func TestSteps(t *testing.T) {
	s, err := Steps("temps_C", 0, 1, 0.1)
	if err != nil || len(s) != 11 || s[3] != 0.3 || s[10] != 1 {
		t.Errorf("Steps(0, 1, 0.1) = %v, %v", s, err)
	}
	for _, tt := range []struct{ from, to, step float64 }{
		{0, 10, 0}, {0, 10, -1}, {10, 0, 1}, {0, 1000, 1}, {0, math.NaN(), 1}, {0, 10, math.Inf(1)},
	} {
		_, err := Steps("temps_C", tt.from, tt.to, tt.step)
		checkField(t, err, "temps_C")
	}
}

var sinkTab Table

func BenchmarkOxygenTable41x5(b *testing.B) {
	temps, _ := Steps("temps_C", 0, 40, 1)
	cols := []float64{70, 80, 90, 100, StdKPa}
	for b.Loop() {
		sinkTab, _ = OxygenTable(temps, ColumnsPressure, cols, 0, BensonKrause)
	}
}
