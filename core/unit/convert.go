package unit

// Conversion factors, exact by definition. Source: NIST Special Publication 811, 2008 ed.
// (A. Thompson and B. N. Taylor), appendix B.8 "Factors for units listed alphabetically" and
// B.9 "Factors for units listed by kind of quantity or field of science".
const (
	// ZeroCelsiusK is the Kelvin temperature of 0 °C (SP 811 §4.2.1.1: t/°C = T/K − 273.15).
	ZeroCelsiusK = 273.15
	// KgPerPound is the avoirdupois pound in kilograms (SP 811 B.8, "pound (avoirdupois)").
	KgPerPound = 0.45359237
	// GramsPerPound is KgPerPound in grams.
	GramsPerPound = 453.59237
	// M3PerUSGallon is the U.S. liquid gallon in cubic metres (SP 811 B.8, "gallon [U.S.]").
	M3PerUSGallon = 3.785411784e-3
	// MillilitersPerUSGallon is M3PerUSGallon in millilitres.
	MillilitersPerUSGallon = 3785.411784
)

// Temperatures on the Fahrenheit scale: t/°F = 1.8·t/°C + 32 (SP 811 B.9, "temperature").

// CelsiusFromFahrenheit converts °F to °C.
func CelsiusFromFahrenheit(f float64) float64 { return (f - 32) / 1.8 }

// FahrenheitFromCelsius converts °C to °F.
func FahrenheitFromCelsius(c float64) float64 { return c*1.8 + 32 }

// CelsiusFromKelvin converts K to °C.
func CelsiusFromKelvin(k float64) float64 { return k - ZeroCelsiusK }

// KelvinFromCelsius converts °C to K.
func KelvinFromCelsius(c float64) float64 { return c + ZeroCelsiusK }

// GramsFromKilograms converts kg to g.
func GramsFromKilograms(kg float64) float64 { return kg * 1000 }

// KilogramsFromGrams converts g to kg.
func KilogramsFromGrams(g float64) float64 { return g / 1000 }

// GramsFromPounds converts avoirdupois pounds to g.
func GramsFromPounds(lb float64) float64 { return lb * GramsPerPound }

// PoundsFromGrams converts g to avoirdupois pounds.
func PoundsFromGrams(g float64) float64 { return g / GramsPerPound }

// MillilitersFromLiters converts L to mL.
func MillilitersFromLiters(l float64) float64 { return l * 1000 }

// LitersFromMilliliters converts mL to L.
func LitersFromMilliliters(ml float64) float64 { return ml / 1000 }

// MillilitersFromUSGallons converts U.S. liquid gallons to mL.
func MillilitersFromUSGallons(gal float64) float64 { return gal * MillilitersPerUSGallon }

// USGallonsFromMilliliters converts mL to U.S. liquid gallons.
func USGallonsFromMilliliters(ml float64) float64 { return ml / MillilitersPerUSGallon }

// ToCelsius converts a temperature typed on the scale named by scale ("C", "°C", "F", "°F",
// "K") to °C. A temperature below absolute zero is refused with a *FieldError for field.
func ToCelsius(field string, v float64, scale string) (float64, error) {
	var c float64
	switch scale {
	case "C", "°C", "c":
		c = v
	case "F", "°F", "f":
		c = CelsiusFromFahrenheit(v)
	case "K", "k":
		c = CelsiusFromKelvin(v)
	default:
		return 0, &FieldError{Field: field + " unit", Value: scale, Allowed: "°C, °F or K"}
	}
	if !(c >= -ZeroCelsiusK) || c > 1e6 {
		return 0, NumberError(field, v, "a temperature above absolute zero")
	}
	return c, nil
}

// ToGrams converts a mass in the unit named by u ("g", "kg", "lb") to grams.
func ToGrams(field string, v float64, u string) (float64, error) {
	switch u {
	case "g":
		return v, nil
	case "kg":
		return GramsFromKilograms(v), nil
	case "lb":
		return GramsFromPounds(v), nil
	}
	return 0, &FieldError{Field: field + " unit", Value: u, Allowed: "g, kg or lb"}
}

// ToMilliliters converts a volume in the unit named by u ("mL", "L", "gal" for the U.S.
// gallon) to millilitres.
func ToMilliliters(field string, v float64, u string) (float64, error) {
	switch u {
	case "mL", "ml":
		return v, nil
	case "L", "l":
		return MillilitersFromLiters(v), nil
	case "gal", "US gal":
		return MillilitersFromUSGallons(v), nil
	}
	return 0, &FieldError{Field: field + " unit", Value: u, Allowed: "mL, L or gal (US)"}
}
