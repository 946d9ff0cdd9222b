package main

import (
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// CSV quotes as RFC 4180 says: fields with commas, quotes or line breaks in double quotes,
// quotes doubled; lines end in CRLF.
func TestCSVQuoting(t *testing.T) {
	var r recipe.Result
	r.Recipe.Name = `tank "B", night`
	r.SoluteID = "KNO3"
	r.ChargeG = 1234.6
	r.Warnings = []string{"line one\nline two"}
	got := CSV(&r, DefaultUnits)
	for _, want := range []string{
		"key,value,unit,label\r\n",
		`name,"tank ""B"", night",,Batch name` + "\r\n",
		"charge_g,1235,g,Charge to weigh\r\n", // four significant figures
		"warning,\"line one\nline two\",,\r\n",
	} {
		if !strings.Contains(got, want) {
			t.Errorf("CSV lacks %q:\n%s", want, got)
		}
	}
}

// Figures never show NaN or Inf: a non-finite number shows as a dash.
func TestFigureNonFinite(t *testing.T) {
	var r recipe.Result
	r.HasOnset = true
	for _, v := range []float64{nan(), inf()} {
		r.SaturationTempC = v
		r.ChargeG = v
		for _, key := range []string{"saturation_temp_C", "charge_g"} {
			f, _ := FigureByKey(key)
			text, _, ok := f.Show(&r, Units{Temp: "F", Mass: "lb", Volume: "gal"})
			if !ok || text != "—" {
				t.Errorf("%s of %v shows %q, want —", key, v, text)
			}
		}
	}
}

func nan() float64 { z := 0.0; return z / z }
func inf() float64 { z := 0.0; return 1 / z }
