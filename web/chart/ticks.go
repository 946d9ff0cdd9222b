package chart

import (
	"math"
	"strconv"
	"strings"
)

// Ticks is a "loose" axis labelling: the axis runs from Lo to Hi, both
// multiples of Step, and Step is 1, 2 or 5 times a power of ten, so labels
// stay short and every data value lies inside the axis.
type Ticks struct {
	Lo, Hi, Step float64
	// Decimals is how many digits after the decimal point every label needs
	// so that all labels of the axis print alike (0 for Step ≥ 1).
	Decimals int
}

// maxTicks bounds the number of ticks Values ever returns, so a
// pathological range cannot make the SVG large.
const maxTicks = 40

// NiceTicks labels an axis for data from min to max with about n ticks
// (at least 2), by Heckbert's "loose labeling" (P. S. Heckbert, "Nice numbers
// for graph labels", in Graphics Gems, Academic Press, 1990): the range is
// rounded up to a nice number, the step is the nice number nearest to
// range/(n−1), and the axis ends are the multiples of the step just outside
// the data. If min equals max the axis is widened around the value by 10 %
// of its size (±1 at zero). ok is false only when the range cannot be
// labelled: a non-finite input or a span too large for float64.
func NiceTicks(min, max float64, n int) (t Ticks, ok bool) {
	if !finite(min) || !finite(max) {
		return Ticks{}, false
	}
	if min > max {
		min, max = max, min
	}
	if n < 2 {
		n = 2
	}
	if min == max {
		d := math.Abs(min) * 0.1
		if d == 0 {
			d = 1
		}
		min, max = min-d, max+d
	}
	span := niceNumber(max-min, false)
	step := niceNumber(span/float64(n-1), true)
	if !finite(span) || !finite(step) || step == 0 {
		return Ticks{}, false
	}
	lo := math.Floor(min/step+1e-9) * step
	hi := math.Ceil(max/step-1e-9) * step
	if !finite(lo) || !finite(hi) {
		return Ticks{}, false
	}
	dec := int(-math.Floor(math.Log10(step) + 1e-9))
	if dec < 0 {
		dec = 0
	}
	return Ticks{Lo: lo, Hi: hi, Step: step, Decimals: dec}, true
}

// niceNumber returns a number of the form 1, 2, 5 or 10 times a power of ten
// close to x: the nearest one if round is set, else the smallest one ≥ x.
// The thresholds are Heckbert's (Graphics Gems, 1990).
func niceNumber(x float64, round bool) float64 {
	if !(x > 0) || !finite(x) {
		return math.NaN()
	}
	exp := math.Floor(math.Log10(x))
	pow := math.Pow(10, exp)
	f := x / pow
	var nf float64
	switch {
	case round && f < 1.5:
		nf = 1
	case round && f < 3:
		nf = 2
	case round && f < 7:
		nf = 5
	case round:
		nf = 10
	case f <= 1+1e-9:
		nf = 1
	case f <= 2+1e-9:
		nf = 2
	case f <= 5+1e-9:
		nf = 5
	default:
		nf = 10
	}
	return nf * pow
}

// Values lists the tick positions from Lo to Hi. Each value is computed as
// an integer multiple of Step, so rounding errors do not pile up.
func (t Ticks) Values() []float64 {
	if !(t.Step > 0) {
		return nil
	}
	k0 := math.Round(t.Lo / t.Step)
	n := int(math.Round(t.Hi/t.Step-k0)) + 1
	if n < 1 || n > maxTicks {
		return nil
	}
	v := make([]float64, n)
	for i := range v {
		v[i] = (k0 + float64(i)) * t.Step
	}
	return v
}

// Label formats a tick value with the axis' decimals, a true minus sign and,
// if comma is set, a decimal comma. Zero never prints as "-0".
func (t Ticks) Label(v float64, comma bool) string {
	if math.Abs(v) < t.Step*1e-9 {
		v = 0
	}
	big := math.Max(math.Abs(t.Lo), math.Abs(t.Hi))
	if big >= 1e9 || t.Decimals > 9 {
		// Too many digits for fixed notation: exponent notation with as many
		// digits as tell neighbouring ticks apart.
		sig := int(math.Ceil(math.Log10(big/t.Step))) + 1
		sig = min(max(sig, 1), 17)
		return localize(strconv.FormatFloat(v, 'e', sig-1, 64), comma)
	}
	return formatFixed(v, t.Decimals, comma)
}

// localize puts a true minus sign (U+2212) and, if comma is set, a decimal
// comma into a number printed by strconv.
func localize(s string, comma bool) string {
	b := make([]byte, 0, len(s)+2)
	for i := 0; i < len(s); i++ {
		switch c := s[i]; {
		case c == '-':
			b = append(b, "−"...)
		case c == '.' && comma:
			b = append(b, ',')
		default:
			b = append(b, c)
		}
	}
	return string(b)
}

// formatFixed prints v with dec decimals, "−" (U+2212) for negatives and an
// optional decimal comma. Non-finite values print as "—".
func formatFixed(v float64, dec int, comma bool) string {
	if !finite(v) {
		return "—"
	}
	if math.Abs(v) >= 1e15 || dec > 15 {
		return localize(strconv.FormatFloat(v, 'g', 6, 64), comma)
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if s[0] == '-' && allZero(s[1:]) {
		s = s[1:]
	}
	return localize(s, comma)
}

// formatSig prints v with about sig significant digits, without exponent
// notation, for the text description of a chart.
func formatSig(v float64, sig int, comma bool) string {
	if !finite(v) {
		return "—"
	}
	dec := 0
	if v != 0 {
		dec = sig - 1 - int(math.Floor(math.Log10(math.Abs(v))))
	}
	if dec < 0 {
		dec = 0
	}
	if dec > 6 {
		dec = 6
	}
	return formatFixed(v, dec, comma)
}

// formatShort is formatSig without trailing zeros after the decimal point,
// for numbers inside labels ("4 °C", "32.6 °C").
func formatShort(v float64, sig int, comma bool) string {
	s := formatSig(v, sig, comma)
	if strings.ContainsAny(s, ".,") && !strings.ContainsRune(s, 'e') {
		s = strings.TrimRight(s, "0")
		s = strings.TrimRight(s, ".,")
	}
	return s
}

func allZero(s string) bool {
	for i := 0; i < len(s); i++ {
		if s[i] != '0' && s[i] != '.' {
			return false
		}
	}
	return true
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
