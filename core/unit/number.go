package unit

import (
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

const (
	noThousands = "a number without thousands separators, with one decimal point or comma (e.g. 1234,5 or 1234.5)"
	noUnit      = "a number without its unit (the unit is given by the field)"
)

// ParseNumber reads a number as a person types it. See the package documentation for what is
// accepted. The error, if any, is a *FieldError for field.
func ParseNumber(field, text string) (float64, error) {
	s := strings.TrimSpace(text)
	bad := func(allowed string) (float64, error) {
		return 0, &FieldError{Field: field, Value: text, Allowed: allowed}
	}
	if s == "" {
		return bad("a number")
	}
	// A typographic minus (U+2212) is what word processors put in front of negative numbers.
	if r := strings.TrimPrefix(s, "−"); r != s {
		s = "-" + r
	}
	var b strings.Builder
	b.Grow(len(s))
	i := 0
	if s[0] == '+' || s[0] == '-' {
		b.WriteByte(s[0])
		i++
	}
	digits, seps, expDigits, inExp := 0, 0, 0, false
	for i < len(s) {
		c := s[i]
		switch {
		case c >= '0' && c <= '9':
			if inExp {
				expDigits++
			} else {
				digits++
			}
			b.WriteByte(c)
			i++
			continue
		case (c == '.' || c == ',') && !inExp:
			if seps > 0 {
				return bad(noThousands)
			}
			seps++
			b.WriteByte('.')
			i++
			continue
		case (c == 'e' || c == 'E') && !inExp && digits > 0 && i+1 < len(s) && (isDigit(s[i+1]) ||
			(s[i+1] == '+' || s[i+1] == '-') && i+2 < len(s) && isDigit(s[i+2])):
			inExp = true
			b.WriteByte('e')
			i++
			if s[i] == '+' || s[i] == '-' {
				b.WriteByte(s[i])
				i++
			}
			continue
		}
		// Not part of a number: say why in the most useful way.
		r, size := utf8.DecodeRuneInString(s[i:])
		rest := strings.TrimLeftFunc(s[i+size:], unicode.IsSpace)
		switch {
		case digits > 0 && isGroupSep(r) && rest != "" && isDigit(rest[0]):
			return bad(noThousands)
		case digits > 0 && (unicode.IsSpace(r) || unicode.IsLetter(r) || strings.ContainsRune("°%‰µ", r)):
			return bad(noUnit)
		}
		return bad("a number")
	}
	if digits == 0 || (inExp && expDigits == 0) {
		return bad("a number")
	}
	v, err := strconv.ParseFloat(b.String(), 64)
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return bad("a finite number (this one is too large)")
	}
	if err != nil {
		// ParseFloat reports underflow as ErrRange with the result rounded to 0 or a
		// subnormal; that is a legitimate reading of what was typed.
		if ne, ok := err.(*strconv.NumError); !ok || ne.Err != strconv.ErrRange {
			return bad("a number")
		}
	}
	return v, nil
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

// isGroupSep reports characters used to group digits: spaces of every kind (including the
// no-break U+00A0, figure U+2007, thin U+2009 and narrow no-break U+202F spaces), apostrophes
// and underscores.
func isGroupSep(r rune) bool {
	switch r {
	case '\'', '’', '_', '\u00a0', '\u2007', '\u2009', '\u202f':
		return true
	}
	return unicode.IsSpace(r)
}

// FormatNumber prints v rounded to sig significant figures (1 to 15) in plain decimal
// notation, switching to an exponent only for magnitudes at or above 1e15 or below 1e-6.
// It never prints NaN or Inf: a non-finite v prints as "—".
func FormatNumber(v float64, sig int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	sig = max(1, min(sig, 15))
	if v == 0 {
		return "0"
	}
	a := math.Abs(v)
	if a >= 1e15 || a < 1e-6 {
		return strconv.FormatFloat(v, 'g', sig, 64)
	}
	exp := int(math.Floor(math.Log10(a)))
	dec := sig - 1 - exp
	// Rounding can carry into a new leading digit (99.96 → 100.0); keep sig digits then.
	if dec > 0 && dec < 16 {
		p := math.Pow(10, float64(dec))
		if math.Abs(math.Round(a*p)/p) >= math.Pow(10, float64(exp+1)) {
			dec--
		}
	}
	if dec < 0 {
		p := math.Pow(10, float64(-dec))
		v = math.Round(v/p) * p
		dec = 0
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.Trim(s, "-0.") == "" {
		return strings.TrimPrefix(s, "-")
	}
	return s
}

// FormatCompact is FormatNumber without trailing zeros after the decimal point ("95", "0.25"),
// for numbers inside sentences.
func FormatCompact(v float64, sig int) string {
	s := FormatNumber(v, sig)
	if strings.ContainsAny(s, "e—") || !strings.Contains(s, ".") {
		return s
	}
	s = strings.TrimRight(s, "0")
	return strings.TrimSuffix(s, ".")
}
