// Package help writes the Help screen of the page: what every input and result means in the
// words of the bench, what the planner assumes and where it stops, where its data come from,
// and the usual cautions. It is plain HTML, written into the page when it is built
// (web.Page puts it where the shell says {{HELP}}), so it works offline and costs the module
// nothing.
//
// The inputs are read from the recipe tables (recipe.Fields for a batch, recipe.PrepFields
// for a preparation): each key's label, unit, accepted range and short meaning come from its
// Spec, so a key added to a table appears here without anyone touching this package. Words
// gives a key a longer explanation at the bench; Outputs explains the batch screen's
// results, keyed by the result keys the page and the command line share (a test in
// wasm/browser checks every result the page shows is explained here).
package help

import (
	"html"
	"strings"

	"saltcast/core/recipe"
)

// HTML is the inside of the Help screen's section.
func HTML() string {
	var b strings.Builder
	b.WriteString(intro)
	b.WriteString(`<section class="panel help-part" id="help-batch"><h2>Batch: what you type</h2>` +
		`<p>Temperatures, masses and volumes are shown in the units picked at the top (°C, °F or K; g, kg or lb; mL, L or US gal); recipe files always keep °C, g and mL. A number takes a point or a comma as decimal separator, never a thousands separator.</p>`)
	writeFields(&b, "f", recipe.Fields.Specs(), BatchWords)
	b.WriteString(`</section>`)
	b.WriteString(`<section class="panel help-part" id="help-results"><h2>Batch: what you get</h2><dl class="help-list">`)
	for _, o := range Outputs {
		b.WriteString(`<dt id="help-out-` + o.Key + `">` + html.EscapeString(o.Label) + `</dt><dd>` + o.Text + `</dd>`)
	}
	b.WriteString(`</dl></section>`)
	b.WriteString(`<section class="panel help-part" id="help-prep"><h2>Make up: what you type</h2>` + prepIntro)
	writeFields(&b, "p", recipe.PrepSpecs, PrepWords)
	b.WriteString(prepResults + `</section>`)
	b.WriteString(gas + limits + data + safety)
	return b.String()
}

// writeFields writes one definition per key of specs, in table order: label and unit, the
// longer words when there are any, else the key's own short meaning, then what is accepted.
func writeFields(b *strings.Builder, prefix string, specs recipe.Specs, words map[string]string) {
	b.WriteString(`<dl class="help-list">`)
	for i := range specs {
		s := &specs[i]
		if s.Kind.Fixed() {
			continue
		}
		b.WriteString(`<dt id="help-` + prefix + `-` + s.Key + `">` + html.EscapeString(s.Label))
		if u := unitOf(s); u != "" {
			b.WriteString(` <span class="u">` + html.EscapeString(u) + `</span>`)
		}
		if s.Parent() != "" {
			b.WriteString(` <span class="opt">own compound</span>`)
		}
		b.WriteString(`</dt><dd>`)
		if w := words[s.Key]; w != "" {
			b.WriteString(w)
		} else {
			b.WriteString(html.EscapeString(upperFirst(readable(strings.ReplaceAll(s.Help, " (required)", ""), specs))) + ".")
		}
		var more []string
		if s.Allowed != "" && s.Kind != recipe.Object {
			more = append(more, "Accepted: "+html.EscapeString(readable(s.Allowed, specs))+".")
		}
		if len(s.Choices) > 0 && s.Allowed == "" {
			more = append(more, "One of: "+html.EscapeString(strings.Join(s.Choices, ", "))+".")
		}
		if s.Required {
			more = append(more, "Needed.")
		}
		more = append(more, `In a recipe file: <code>`+html.EscapeString(s.Key)+`</code>.`)
		b.WriteString(` <small>` + strings.Join(more, " ") + `</small></dd>`)
	}
	b.WriteString(`</dl>`)
}

// unitOf is the unit a key is typed in: its own for a plain number, the user's for the rest.
func unitOf(s *recipe.Spec) string {
	switch s.Kind {
	case recipe.Temp:
		return "°C (or °F, K)"
	case recipe.Mass:
		return "g (or kg, lb)"
	case recipe.Volume:
		return "mL (or L, US gal)"
	case recipe.Plain:
		return s.Unit
	}
	return ""
}

// readable puts a key's label, in quotes, where a table's text names another key
// ("below clear_down_to_C" → "below “Stays clear down to”"): the Help screen speaks of the
// fields as the form shows them. Only keys with an underscore are names no one would write
// as a word.
func readable(text string, specs recipe.Specs) string {
	for i := range specs {
		s := &specs[i]
		if strings.Contains(s.Key, "_") && s.Label != "" {
			text = strings.ReplaceAll(text, s.Key, "“"+s.Label+"”")
		}
	}
	return text
}

func upperFirst(s string) string {
	if s == "" || s[0] < 'a' || s[0] > 'z' {
		return s
	}
	return string(s[0]-'a'+'A') + s[1:]
}
