package chart

import (
	"strconv"
	"unicode/utf8"
)

// svgWriter appends SVG text to a byte slice; coordinates are printed with
// one decimal, which is a tenth of a pixel at the chart's natural size.
type svgWriter struct{ b []byte }

func (w *svgWriter) s(s string) { w.b = append(w.b, s...) }

// s3 appends a, b and c, without joining them into a new string first.
func (w *svgWriter) s3(a, b, c string) {
	w.b = append(append(append(w.b, a...), b...), c...)
}

// num appends v with at most one decimal and no trailing ".0".
func (w *svgWriter) num(v float64) {
	if v > -0.05 && v < 0.05 {
		v = 0
	}
	n := len(w.b)
	w.b = strconv.AppendFloat(w.b, v, 'f', 1, 64)
	if l := len(w.b); l-n >= 2 && w.b[l-1] == '0' && w.b[l-2] == '.' {
		w.b = w.b[:l-2]
	}
}

// attr appends ` name="v"` with v a coordinate.
func (w *svgWriter) attr(name string, v float64) {
	w.b = append(w.b, ' ')
	w.b = append(w.b, name...)
	w.b = append(w.b, '=', '"')
	w.num(v)
	w.b = append(w.b, '"')
}

// text appends s escaped for XML character data and attribute values.
func (w *svgWriter) text(s string) { w.b = appendEscaped(w.b, s) }

// appendEscaped escapes the five XML special characters and replaces what
// XML 1.0 cannot carry at all (invalid UTF-8, control characters other than
// tab, newline and carriage return, U+FFFE and U+FFFF) with U+FFFD, so that
// whatever a user typed stays text and the SVG stays well-formed.
func appendEscaped(b []byte, s string) []byte {
	for i := 0; i < len(s); {
		c := s[i]
		if c < utf8.RuneSelf {
			switch {
			case c == '&':
				b = append(b, "&amp;"...)
			case c == '<':
				b = append(b, "&lt;"...)
			case c == '>':
				b = append(b, "&gt;"...)
			case c == '"':
				b = append(b, "&quot;"...)
			case c == '\'':
				b = append(b, "&#39;"...)
			case c < 0x20 && c != '\t' && c != '\n' && c != '\r', c == 0x7f:
				b = append(b, "\uFFFD"...)
			default:
				b = append(b, c)
			}
			i++
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 || r == 0xFFFE || r == 0xFFFF || (r >= 0x80 && r < 0xA0) {
			b = append(b, "\uFFFD"...)
		} else {
			b = append(b, s[i:i+size]...)
		}
		i += size
	}
	return b
}

// textWidth estimates the width of s in a sans-serif font of the given
// size. It errs on the wide side so that layouts do not overlap.
func textWidth(s string, size float64) float64 {
	w := 0.0
	for _, r := range s {
		switch {
		case r == ' ' || r == '.' || r == ',' || r == ':' || r == ';' || r == '\'' || r == '|' || r == 'i' || r == 'l' || r == 'j' || r == '!' || r == '(' || r == ')' || r == '·':
			w += 0.32
		case r == 'm' || r == 'w' || r == 'M' || r == 'W' || r == '%' || r == '—':
			w += 0.9
		case r >= 'A' && r <= 'Z':
			w += 0.68
		case r >= 0x2E80:
			w += 1.0 // CJK and other wide scripts
		default:
			w += 0.58
		}
	}
	return w * size
}
