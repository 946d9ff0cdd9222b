package solubility

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/unit"
)

func TestCurveAtEdges(t *testing.T) {
	// KCl, CRC Handbook 98th ed. (mass % → g/100 g water), 0–100 °C.
	m, err := NewTable([]Point{{0, 27.78}, {20, 34.03}, {40, 40.04}, {60, 45.77}, {80, 51.19}, {100, 56.37}}, 74.55)
	if err != nil {
		t.Fatal(err)
	}
	c := Curve{Model: m, MinC: 0, MaxC: 100, Source: "CRC 98th ed."}
	tests := []struct {
		tempC   float64
		warn    bool
		refused bool
	}{
		{50, false, false},
		{0, false, false},
		{100, false, false},
		{-0.5, true, false},
		{-WarnMarginK, true, false},
		{100 + WarnMarginK, true, false},
		{-WarnMarginK - 0.01, false, true},
		{100 + WarnMarginK + 0.01, false, true},
		{150, false, true},
		{math.NaN(), false, true},
		{math.Inf(1), false, true},
		{math.Inf(-1), false, true},
	}
	for _, tt := range tests {
		v, warn, err := c.At(tt.tempC)
		if tt.refused {
			var fe *unit.FieldError
			if !errors.As(err, &fe) || fe.Field != "temp_C" || !strings.Contains(fe.Allowed, "°C") {
				t.Errorf("At(%v) = %v, %q, %v; want a *unit.FieldError for temp_C naming the range", tt.tempC, v, warn, err)
			}
			continue
		}
		if err != nil || (warn != "") != tt.warn || math.IsNaN(v) || v <= 0 {
			t.Errorf("At(%v) = %v, %q, %v; want a value, warning %v", tt.tempC, v, warn, err, tt.warn)
		}
	}
	// The margin continues the end slope: just past 100 °C the value keeps rising.
	v100, _, _ := c.At(100)
	v103, _, _ := c.At(103)
	if !(v103 > v100) {
		t.Errorf("At(103) = %v not above At(100) = %v", v103, v100)
	}
}

// A model that goes negative inside its range is caught by At, not passed on.
func TestCurveAtCatchesBadModel(t *testing.T) {
	c := Curve{Model: Polynomial{Coef: []float64{10, -1}}, MinC: 0, MaxC: 20}
	if _, _, err := c.At(15); err == nil {
		t.Error("At(15) of 10 − t gave no error")
	}
	if v, _, err := c.At(5); err != nil || v != 5 {
		t.Errorf("At(5) of 10 − t = %v, %v; want 5", v, err)
	}
}
