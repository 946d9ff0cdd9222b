// Package unit turns what a technician types into numbers and converts the quantities Saltcast uses.
//
// Numbers: ParseNumber accepts one decimal separator, either '.' or ',' ("12,5" is 12.5), an
// optional leading sign and an exponent ("1e3", "2,5E-2"). It refuses thousands separators of
// every kind ("1.234,5", "1,234.5", "1 234", "1'234", "1_234"), because in a lab notebook
// "1.234" and "1,234" mean different numbers in different countries; a number with a single
// separator is therefore always read as a decimal fraction ("1,234" is 1.234, not 1234). Empty
// text, NaN and infinities are refused too. Every refusal is a *FieldError naming the field and
// what is allowed.
//
// Conversions: temperature (°C, °F, K), mass (g, kg, lb) and volume (mL, L, US gallon) are plain
// float64 helpers; the conversion factors are exact by definition and cited from NIST Special
// Publication 811 (2008 ed., Thompson and Taylor), "Guide for the Use of the International
// System of Units", appendix B. Degrees Celsius and Fahrenheit are offset scales, so they are
// converted by functions, never by multiplying with a factor.
//
// System is the reader's choice of units. It converts figures (TempFromC, DeltaFromK for
// temperature differences, MassFromG, VolumeFromML) and rewrites the sentences Saltcast writes
// in °C, K, g and mL into those units (Words), so messages, cautions and warnings follow the
// unit switch the same way the figures do.
//
// FormatNumber prints a value for a person, rounded to significant figures; FormatCompact does
// the same without trailing zeros, for numbers inside sentences. Neither ever prints NaN or Inf
// (they print "—" instead).
package unit
