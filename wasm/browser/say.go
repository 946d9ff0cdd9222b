package main

import (
	"errors"
	"sort"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// sayUnits are the units the page shows now; the app sets them with the unit switch, so every
// message, caution and warning is worded in them (say).
var sayUnits = DefaultUnits

// say words a sentence of the core for the person at the screen: quantities in their units
// (unit.System.Words) and the recipe file's keys as the labels of the form ("seed_at_C lies
// below…" reads "“Seed at” lies below…").
func say(s string) string { return labelKeys(sayUnits.Words(s)) }

// keyLabels are the recipe keys with their labels, longest key first (so water_temp_C is
// replaced before a shorter key could match inside it), plus phrases of the file format.
var keyLabels = func() [][2]string {
	var out [][2]string
	for i := range recipe.FieldSpecs {
		s := &recipe.FieldSpecs[i]
		if s.Label != "" && strings.Contains(s.Key, "_") || strings.Contains(s.Key, ".") {
			out = append(out, [2]string{s.Key, "“" + s.Label + "”"})
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return len(out[i][0]) > len(out[j][0]) })
	return out
}()

// labelKeys replaces recipe keys standing as words in s with their labels.
func labelKeys(s string) string {
	s = strings.ReplaceAll(s, " (the key is required)", " (required)")
	s = strings.ReplaceAll(s, "[temp_C, g_per_100g_water]", "(temperature and solubility)")
	if !strings.ContainsAny(s, "_.") {
		return s
	}
	for _, kl := range keyLabels {
		for from := 0; ; {
			i := strings.Index(s[from:], kl[0])
			if i < 0 {
				break
			}
			i += from
			j := i + len(kl[0])
			if (i > 0 && wordByte(s[i-1])) || (j < len(s) && wordByte(s[j])) {
				from = j
				continue
			}
			s = s[:i] + kl[1] + s[j:]
			from = i + len(kl[1])
		}
	}
	return s
}

func wordByte(c byte) bool {
	return c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9' || c == '_'
}

// fieldMessage says what is wrong with what the user typed, in words for beside the field
// (typed is the text in the field) or, with typed "", for a message that names the field.
func fieldMessage(err error, typed string) string {
	var fe *unit.FieldError
	if !errors.As(err, &fe) {
		return say(err.Error())
	}
	allowed := say(fe.Allowed)
	var s string
	switch {
	case strings.TrimSpace(typed) != "":
		s = "“" + typed + "” is not allowed"
		if allowed != "" {
			s += "; allowed: " + allowed
		}
	case fe.Value == "" && allowed != "":
		s = fieldLabel(fe.Field) + " is needed: " + allowed
	case fe.Value != "":
		s = fieldLabel(fe.Field) + ": " + valueText(fe.Field, fe.Value) + " is not allowed"
		if allowed != "" {
			s += "; allowed: " + allowed
		}
	default:
		s = fieldLabel(fe.Field) + " is not allowed"
	}
	return s + "."
}

// fieldLabel names a recipe field by its label ("recipes[2].seed_at_C" is “Seed at”).
func fieldLabel(field string) string {
	if i := strings.LastIndexByte(field, ']'); i >= 0 && i+2 <= len(field) {
		field = strings.TrimPrefix(field[i+1:], ".")
	}
	if i := strings.IndexByte(field, '['); i > 0 {
		field = field[:i]
	}
	if s, ok := recipe.FieldSpecs.Lookup(field); ok && s.Label != "" {
		return "“" + s.Label + "”"
	}
	return say(field)
}

// valueText shows a value of field (in the recipe's units) in the user's units.
func valueText(field, v string) string {
	s, ok := recipe.FieldSpecs.Lookup(field)
	if !ok {
		return "“" + v + "”"
	}
	switch {
	case s.Kind == kTemp:
		return sayUnits.Words(v + " °C")
	case s.Kind == kMass:
		return sayUnits.Words(v + " g")
	case s.Kind == kVolume:
		return sayUnits.Words(v + " mL")
	case isDelta(s):
		return sayUnits.Words(v + " K")
	}
	return "“" + v + "”"
}
