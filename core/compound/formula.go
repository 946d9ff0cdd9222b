package compound

import (
	"strconv"
	"strings"
)

// atomicWeights are IUPAC standard atomic weights in g/mol (abridged values, CIAAW/IUPAC
// "Standard atomic weights of the elements 2021", Pure Appl. Chem. 2022; the conventional
// values for elements given as intervals: H 1.008, C 12.011, N 14.007, O 15.999, Mg 24.305,
// S 32.06, Cl 35.45, Li 6.94, Br 79.904; and for lead, whose standard atomic weight is the
// interval [206.14, 207.94] since 2020, the conventional value 207.2). Only the elements of the
// library and common custom solutes.
var atomicWeights = map[string]float64{
	"H": 1.008, "Li": 6.94, "B": 10.81, "C": 12.011, "N": 14.007, "O": 15.999, "F": 18.998403,
	"Na": 22.98977, "Mg": 24.305, "Al": 26.98154, "Si": 28.085, "P": 30.97376, "S": 32.06,
	"Cl": 35.45, "K": 39.0983, "Ca": 40.078, "Cr": 51.9961, "Mn": 54.938043, "Fe": 55.845, "Co": 58.933194,
	"Ni": 58.6934, "Cu": 63.546, "Zn": 65.38, "Br": 79.904, "Sr": 87.62, "Ag": 107.8682,
	"I": 126.90447, "Ba": 137.327, "Pb": 207.2,
}

// MolarMass returns the molar mass in g/mol of a formula such as "KAl(SO4)2·12H2O" (the
// hydrate dot may be typed as '·', '.' or '*'). The second result is false for a formula it
// cannot read or an element it does not know.
func MolarMass(formula string) (float64, bool) { return sumAtoms(formula, atomicWeights, 0) }

// koppCp are atomic heat capacities of solids in J/(mol·K) for Kopp's rule: C 7.5, H 9.6,
// B 11.3, Si 15.9, O 16.7, F 20.9, P and S 22.6, every other element 26 (Perry's Chemical
// Engineers' Handbook, "Kopp's rule" atomic heat capacities, from memory). The rule is good to
// about ±10–20 % near room temperature.
var koppCp = map[string]float64{"C": 7.5, "H": 9.6, "B": 11.3, "Si": 15.9, "O": 16.7, "F": 20.9, "P": 22.6, "S": 22.6}

// koppOther is Kopp's atomic heat capacity of every element not in koppCp, J/(mol·K).
const koppOther = 26.0

const koppSource = "Kopp's rule (sum of atomic heat capacities, Perry's Chemical Engineers' Handbook, from memory; ±10–20 %)"

// KoppHeatCapacity estimates the heat capacity of a solid in J/(mol·K) by Kopp's rule.
func KoppHeatCapacity(formula string) (float64, bool) { return sumAtoms(formula, koppCp, koppOther) }

// sumAtoms adds per-element values over a formula; an element missing from table counts
// other, or makes the formula unreadable when other is 0.
func sumAtoms(formula string, table map[string]float64, other float64) (float64, bool) {
	if len(formula) > 200 {
		return 0, false
	}
	total := 0.0
	for _, part := range strings.Split(normalizeDots(formula), "·") {
		n, rest := leadingInt(part)
		if part == "" || rest == "" {
			return 0, false
		}
		m, pos, ok := parseGroup(rest, 0, table, other)
		if !ok || pos != len(rest) {
			return 0, false
		}
		total += float64(n) * m
	}
	return total, total > 0
}

// dots maps every way of typing the hydrate dot to '·'. Built once: a Replacer is costly to
// build and Form/Lookup call normalizeDots on every plan.
var dots = strings.NewReplacer("·", "·", ".", "·", "*", "·", "•", "·", "∙", "·", "⋅", "·")

func normalizeDots(s string) string { return dots.Replace(s) }

// leadingInt splits "12H2O" into 12 and "H2O"; no number means 1.
func leadingInt(s string) (int, string) {
	i := 0
	for i < len(s) && s[i] >= '0' && s[i] <= '9' && i < 4 {
		i++
	}
	if i == 0 {
		return 1, s
	}
	n, _ := strconv.Atoi(s[:i])
	return n, s[i:]
}

// parseGroup reads elements and parenthesised groups from s[pos:] until ')' or the end.
func parseGroup(s string, pos int, table map[string]float64, other float64) (float64, int, bool) {
	total := 0.0
	for pos < len(s) {
		c := s[pos]
		var m float64
		switch {
		case c == '(':
			inner, p, ok := parseGroup(s, pos+1, table, other)
			if !ok || p >= len(s) || s[p] != ')' {
				return 0, 0, false
			}
			m, pos = inner, p+1
		case c == ')':
			return total, pos, true
		case c >= 'A' && c <= 'Z':
			end := pos + 1
			if end < len(s) && s[end] >= 'a' && s[end] <= 'z' {
				end++
			}
			w, ok := table[s[pos:end]]
			if !ok {
				if _, known := atomicWeights[s[pos:end]]; !known || other == 0 {
					return 0, 0, false
				}
				w = other
			}
			m, pos = w, end
		default:
			return 0, 0, false
		}
		n, rest := leadingInt(s[pos:])
		if n == 0 {
			return 0, 0, false
		}
		pos = len(s) - len(rest)
		total += float64(n) * m
	}
	return total, pos, true
}
