package solubility

import (
	"math"

	"saltcast/core/unit"
)

// WaterGPerMol is the molar mass of water from IUPAC standard atomic weights (2·1.008 + 15.999).
const WaterGPerMol = 18.015

// WarnMarginK is how far outside a curve's data range At still answers, with a warning.
// Beyond it At refuses. Five kelvin keeps a short extrapolation of a smooth curve within a
// few per cent for the salts in the library (common practice).
const WarnMarginK = 5

// Point is one measured solubility: grams of anhydrous solute per 100 g of solvent at TempC.
// The field name says water because water is the solvent everywhere in Saltcast except in
// Fit with a solvent molar mass.
type Point struct {
	TempC         float64
	GPer100gWater float64
}

// Model is a solubility law without its range. Value returns g of anhydrous solute per 100 g
// of solvent at tempC with no range check; it may return NaN or a negative number far outside
// the data, which Curve.At catches.
type Model interface {
	Value(tempC float64) float64
	Kind() string
}

// Curve is a Model together with the temperature range of the data behind it.
type Curve struct {
	Model      Model
	MinC, MaxC float64
	Source     string
}

// At returns the solubility at tempC under the field name "temp_C". See AtField.
func (c Curve) At(tempC float64) (gPer100gWater float64, warning string, err error) {
	return c.AtField("temp_C", tempC)
}

// AtField returns the solubility at tempC. Inside [MinC, MaxC] the warning is empty; within
// WarnMarginK outside, the extrapolated value comes with a warning; beyond that, or for a
// non-finite temperature, the error is a *unit.FieldError for field naming the range.
func (c Curve) AtField(field string, tempC float64) (gPer100gWater float64, warning string, err error) {
	warning, err = c.Check(field, tempC)
	if err != nil {
		return 0, "", err
	}
	v := c.Model.Value(tempC)
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return 0, "", &unit.FieldError{Field: field, Value: unit.FormatCompact(tempC, 6),
			Allowed: "a temperature where the " + c.Model.Kind() + " curve gives a finite, non-negative solubility"}
	}
	return v, warning, nil
}

// Check says whether tempC is inside the curve's range (no warning), within the margin (a
// warning) or outside (a *unit.FieldError for field).
func (c Curve) Check(field string, tempC float64) (warning string, err error) {
	if math.IsNaN(tempC) || math.IsInf(tempC, 0) || tempC < c.MinC-WarnMarginK || tempC > c.MaxC+WarnMarginK {
		return "", &unit.FieldError{Field: field, Value: unit.FormatCompact(tempC, 6),
			Allowed: "a temperature from " + unit.FormatCompact(c.MinC-WarnMarginK, 6) + " to " +
				unit.FormatCompact(c.MaxC+WarnMarginK, 6) + " °C (data " + c.rangeText() +
				", extrapolated with a warning up to " + unit.FormatCompact(WarnMarginK, 2) + " K beyond)"}
	}
	switch {
	case tempC < c.MinC:
		return unit.FormatCompact(tempC, 6) + " °C is " + unit.FormatCompact(c.MinC-tempC, 3) +
			" K below the data (" + c.rangeText() + "); the solubility is extrapolated", nil
	case tempC > c.MaxC:
		return unit.FormatCompact(tempC, 6) + " °C is " + unit.FormatCompact(tempC-c.MaxC, 3) +
			" K above the data (" + c.rangeText() + "); the solubility is extrapolated", nil
	}
	return "", nil
}

func (c Curve) rangeText() string {
	return unit.FormatCompact(c.MinC, 6) + "–" + unit.FormatCompact(c.MaxC, 6) + " °C"
}
