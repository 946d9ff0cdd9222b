package unit

import (
	"math"
	"strconv"
	"strings"
)

// System is the set of units a reader chose to see: temperature "C", "F" or "K"; mass "g",
// "kg" or "lb"; volume "mL", "L" or "gal" (US). Saltcast computes in °C, g and mL (and K for
// temperature differences); a System is the one place that shows those quantities in the
// reader's units, in figures and inside sentences (Words).
type System struct{ Temp, Mass, Volume string }

// Metric is the system Saltcast computes in.
var Metric = System{Temp: "C", Mass: "g", Volume: "mL"}

// TempSymbol is the symbol shown beside a temperature.
func (s System) TempSymbol() string {
	switch s.Temp {
	case "F":
		return "°F"
	case "K":
		return "K"
	}
	return "°C"
}

// DeltaSymbol is the symbol of a temperature difference: K, or °F when °F is shown (a
// difference of 1 K is 1.8 °F, with no offset; NIST SP 811, 2008, B.9).
func (s System) DeltaSymbol() string {
	if s.Temp == "F" {
		return "°F"
	}
	return "K"
}

// VolumeSymbol is the symbol shown beside a volume.
func (s System) VolumeSymbol() string {
	if s.Volume == "gal" {
		return "US gal"
	}
	return s.Volume
}

// TempFromC converts °C to the system's temperature unit.
func (s System) TempFromC(c float64) float64 {
	switch s.Temp {
	case "F":
		return FahrenheitFromCelsius(c)
	case "K":
		return KelvinFromCelsius(c)
	}
	return c
}

// DeltaFromK converts a temperature difference in K to the system's (°F-degrees: ×1.8).
func (s System) DeltaFromK(k float64) float64 {
	if s.Temp == "F" {
		return k * 1.8
	}
	return k
}

// DeltaToK converts a temperature difference typed in the system's unit to K.
func (s System) DeltaToK(d float64) float64 {
	if s.Temp == "F" {
		return d / 1.8
	}
	return d
}

// MassFromG converts grams to the system's mass unit.
func (s System) MassFromG(g float64) float64 {
	switch s.Mass {
	case "kg":
		return KilogramsFromGrams(g)
	case "lb":
		return PoundsFromGrams(g)
	}
	return g
}

// VolumeFromML converts millilitres to the system's volume unit.
func (s System) VolumeFromML(ml float64) float64 {
	switch s.Volume {
	case "L":
		return LitersFromMilliliters(ml)
	case "gal":
		return USGallonsFromMilliliters(ml)
	}
	return ml
}

// TempDecimals is how many decimals a temperature shown with dec decimals in °C or °F takes
// in the system: one more in kelvin, so that 0 °C reads 273.15 K, not 273.1.
func (s System) TempDecimals(dec int) int {
	if s.Temp == "K" {
		return dec + 1
	}
	return dec
}

// Words rewrites the quantities in a sentence Saltcast wrote in °C, K (differences), g and
// mL into the system: "cools the batch by up to 11.4 K" reads "… 20.5 °F" in °F, "a
// temperature from −40 to 150 °C" reads "from −40 to 302 °F", "6.35 g" reads "0.014 lb".
// A range "A to B unit" or "A–B unit" converts both ends. Concentrations (g per 100 g water,
// g/mol, g/L) and the other units are left as written; °C named alone ("in °C") becomes the
// system's symbol. With Metric, text is returned as is.
func (s System) Words(text string) string {
	if s.Temp == "C" && s.Mass == "g" && s.Volume == "mL" || text == "" {
		return text
	}
	var b strings.Builder
	i := 0
	for i < len(text) {
		v, end, ok := numberAt(text, i)
		if !ok && s.Temp != "C" && strings.HasPrefix(text[i:], "°C") {
			b.WriteString(s.TempSymbol()) // the unit named alone: "a temperature in °C"
			i += len("°C")
			continue
		}
		if !ok {
			b.WriteByte(text[i])
			i++
			continue
		}
		// "A to B °C", "A–B °C": the unit after B belongs to A as well.
		var second float64
		var secondStart, secondEnd int
		hasRange := false
		for _, sep := range []string{" to ", "–", " and "} {
			if strings.HasPrefix(text[end:], sep) {
				if w, e2, ok := numberAt(text, end+len(sep)); ok {
					second, secondStart, secondEnd, hasRange = w, end+len(sep), e2, true
				}
				break
			}
		}
		uEnd := end
		if hasRange {
			uEnd = secondEnd
		}
		kind, unitLen := s.unitAfter(text, i, uEnd)
		if kind == "" {
			b.WriteString(text[i:end])
			i = end
			continue
		}
		b.WriteString(s.shown(kind, v))
		if hasRange {
			b.WriteString(text[end:secondStart])
			b.WriteString(s.shown(kind, second))
		}
		b.WriteString(" " + s.symbol(kind))
		i = uEnd + unitLen
	}
	return b.String()
}

// unitAfter reads the unit written after the number ending at end (start is where the
// quantity starts): its kind ("T" temperature, "D" difference, "M" mass, "V" volume) and the
// length of " unit" in text; "" when the unit is not one the system changes.
func (s System) unitAfter(text string, start, end int) (kind string, n int) {
	rest := text[end:]
	word := func(u string) bool {
		if !strings.HasPrefix(rest, u) {
			return false
		}
		after := rest[len(u):]
		return after == "" || !(isLetter(after[0]) || after[0] == '/' || after[0] == '(' || after[0] == '\xc2' && strings.HasPrefix(after, "·"))
	}
	switch {
	case word(" °C"):
		if s.Temp != "C" {
			return "T", len(" °C")
		}
	case word(" K"):
		if s.Temp == "F" {
			return "D", len(" K")
		}
	case word(" g"):
		// Not a concentration: "31.6 g per 100 g water", "per 100 g".
		if s.Mass != "g" && !strings.HasPrefix(rest[len(" g"):], " per") && !strings.HasSuffix(text[:start], "per ") &&
			!strings.HasSuffix(text[:start], "/") {
			return "M", len(" g")
		}
	case word(" mL"):
		if s.Volume != "mL" && !strings.HasPrefix(rest[len(" mL"):], " per") && !strings.HasSuffix(text[:start], "per ") {
			return "V", len(" mL")
		}
	}
	return "", 0
}

func (s System) symbol(kind string) string {
	switch kind {
	case "T":
		return s.TempSymbol()
	case "D":
		return s.DeltaSymbol()
	case "M":
		return s.Mass
	}
	return s.VolumeSymbol()
}

// shown prints a quantity of kind in the system, rounded for reading: temperatures to
// 0.1 degree (0.01 K), masses and volumes to 4 significant figures.
func (s System) shown(kind string, v float64) string {
	var out string
	switch kind {
	case "T":
		out = trimZeros(strconv.FormatFloat(s.TempFromC(v), 'f', s.TempDecimals(1), 64))
	case "D":
		out = trimZeros(strconv.FormatFloat(s.DeltaFromK(v), 'f', 1, 64))
	case "M":
		out = FormatCompact(s.MassFromG(v), 4)
	default:
		out = FormatCompact(s.VolumeFromML(v), 4)
	}
	if strings.HasPrefix(out, "-") {
		out = "−" + out[1:] // the minus sign the sentences use
	}
	if out == "−0" {
		out = "0"
	}
	return out
}

func trimZeros(s string) string {
	if strings.Contains(s, ".") {
		s = strings.TrimSuffix(strings.TrimRight(s, "0"), ".")
	}
	return s
}

// numberAt reads a number written at text[i:] (a sign '-' or '−', digits, a decimal point,
// an exponent) that does not continue a word or another number; ok is false otherwise.
func numberAt(text string, i int) (v float64, end int, ok bool) {
	if i >= len(text) {
		return 0, i, false
	}
	if i > 0 {
		p := text[i-1]
		if isDigit(p) || isLetter(p) || p == '.' || p == '_' {
			return 0, i, false
		}
	}
	j := i
	neg := false
	switch {
	case strings.HasPrefix(text[j:], "−"):
		neg, j = true, j+len("−")
	case text[j] == '-' && (i == 0 || text[i-1] == ' ' || text[i-1] == '('):
		neg, j = true, j+1
	}
	k := j
	for k < len(text) && isDigit(text[k]) {
		k++
	}
	if k == j {
		return 0, i, false
	}
	if k+1 < len(text) && text[k] == '.' && isDigit(text[k+1]) {
		k++
		for k < len(text) && isDigit(text[k]) {
			k++
		}
	}
	if k+1 < len(text) && (text[k] == 'e' || text[k] == 'E') && (isDigit(text[k+1]) || text[k+1] == '-' && k+2 < len(text) && isDigit(text[k+2])) {
		k += 2
		for k < len(text) && isDigit(text[k]) {
			k++
		}
	}
	f, err := strconv.ParseFloat(text[j:k], 64)
	if err != nil || math.IsInf(f, 0) {
		return 0, i, false
	}
	if neg {
		f = -f
	}
	return f, k, true
}

func isLetter(c byte) bool { return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' }
