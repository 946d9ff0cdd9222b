package chart

// TempUnit is the temperature unit the reader chose. Builders take °C and
// convert for display only.
type TempUnit int

const (
	Celsius TempUnit = iota
	Fahrenheit
	Kelvin
)

// Symbol is the unit as printed on an axis.
func (u TempUnit) Symbol() string {
	switch u {
	case Fahrenheit:
		return "°F"
	case Kelvin:
		return "K"
	}
	return "°C"
}

// FromCelsius converts a temperature in °C to u. The factors are exact by
// definition (NIST SP 811, 2008, sections 4.2.1.1 and B.8): T/K = t/°C +
// 273.15 and t/°F = 1.8·t/°C + 32.
func (u TempUnit) FromCelsius(c float64) float64 {
	switch u {
	case Fahrenheit:
		return c*1.8 + 32
	case Kelvin:
		return c + 273.15
	}
	return c
}

// FromCelsiusDelta converts a temperature difference in K (or °C) to u.
func (u TempUnit) FromCelsiusDelta(d float64) float64 {
	if u == Fahrenheit {
		return d * 1.8
	}
	return d
}

func (u TempUnit) valid() bool { return u >= Celsius && u <= Kelvin }

// ConcUnit is the concentration unit of a solubility chart's vertical axis.
// Convert turns g of anhydrous solute per 100 g water into the unit; the
// zero ConcUnit is g/100 g water itself.
type ConcUnit struct {
	Symbol  string // e.g. "mass %"; "" means g/100 g water
	Convert func(gPer100gWater float64) (float64, error)
}

// PerHundredWater is the symbol of the core's own concentration unit.
const PerHundredWater = "g/100 g water"

func (u ConcUnit) symbol() string {
	if u.Symbol == "" {
		return PerHundredWater
	}
	return u.Symbol
}

func (u ConcUnit) conv(g float64) (float64, error) {
	if u.Convert == nil {
		return g, nil
	}
	return u.Convert(g)
}
