package main

import (
	"errors"
	"slices"
	"strconv"
	"strings"
	"unicode"

	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// A flagSpec is one flag of a command: how it is read and how --help shows it.
type flagSpec struct {
	Key     string      // the request or recipe key it sets ("temp_C"); "" for an option of the output
	Name    string      // without the dashes: "temp-C"
	Kind    recipe.Kind // a Temp, Mass or Volume flag also takes its value in the other units
	Arg     string      // its value in the usage line: "T", "NAME"
	Unit    string      // the unit of its value, as help shows it
	Default string      // what applies without it; "required" when it must be given
	Help    string      // what it means, in the trade's words
	Choices []string    // an option: the only values accepted
}

// flagName is the flag of a request or recipe key: "--" + the key with "_" and "." as "-",
// its case kept (temp_C → --temp-C, custom.molar_mass_g_per_mol → --custom-molar-mass-g-per-mol).
func flagName(key string) string {
	return strings.NewReplacer("_", "-", ".", "-").Replace(key)
}

// A unitVariant is another unit a Temp, Mass or Volume flag takes: the flag's name with
// Suffix in place of the last part ("--cool-to-F" for "--cool-to-C").
type unitVariant struct{ Suffix, Unit string }

// variants lists the other units a flag of kind k whose name ends in the key's own unit
// takes; the first entry is that own unit.
func variants(k recipe.Kind, name string) []unitVariant {
	var vs []unitVariant
	switch k {
	case recipe.Temp:
		vs = []unitVariant{{"C", "C"}, {"F", "F"}, {"K", "K"}}
	case recipe.Mass:
		vs = []unitVariant{{"g", "g"}, {"kg", "kg"}, {"lb", "lb"}}
	case recipe.Volume:
		vs = []unitVariant{{"mL", "mL"}, {"L", "L"}, {"gal", "gal"}}
	default:
		return nil
	}
	if !strings.HasSuffix(name, "-"+vs[0].Suffix) {
		return nil
	}
	return vs
}

// unitNote is what help says about a flag's unit, with the other units it takes.
func unitNote(f *flagSpec) string {
	vs := variants(f.Kind, f.Name)
	if vs == nil {
		return f.Unit
	}
	base := strings.TrimSuffix(f.Name, vs[0].Suffix)
	s := f.Unit + "; or --" + base + vs[1].Suffix
	if len(vs) > 2 {
		s += ", --" + base + vs[2].Suffix
	}
	return s + " in " + unitSymbol(vs[1].Unit) + ", " + unitSymbol(vs[2].Unit)
}

func unitSymbol(u string) string {
	switch u {
	case "C":
		return "°C"
	case "F":
		return "°F"
	case "gal":
		return "US gal"
	}
	return u
}

// parsed is a command line read against a command's flags.
type parsed struct {
	vals  map[string]string // key → value, converted to the key's own unit (°C, g, mL)
	typed map[string]string // key → the flag as typed ("--water-lb")
	raw   map[string]string // key → the value as typed
	unit  map[string]string // key → the unit it was typed in, when not the key's own (F, lb...)
	opts  map[string]string // output option name → value
	args  []string          // words that are not flags (files, "-")
	help  bool
}

// lookup finds the flag called name (without dashes) and the unit its value is in ("" for
// the flag's own unit).
func lookupFlag(flags []flagSpec, name string) (*flagSpec, string) {
	for i := range flags {
		f := &flags[i]
		if f.Name == name {
			return f, ""
		}
		if vs := variants(f.Kind, f.Name); vs != nil {
			base := strings.TrimSuffix(f.Name, vs[0].Suffix)
			for _, v := range vs[1:] {
				if name == base+v.Suffix {
					return f, v.Unit
				}
			}
		}
	}
	// Flags are spelled with their units' case (--water-mL); a different case is taken
	// when it names one flag only.
	var found *flagSpec
	var unitFound string
	for i := range flags {
		f := &flags[i]
		names := []struct{ n, u string }{{f.Name, ""}}
		if vs := variants(f.Kind, f.Name); vs != nil {
			base := strings.TrimSuffix(f.Name, vs[0].Suffix)
			for _, v := range vs[1:] {
				names = append(names, struct{ n, u string }{base + v.Suffix, v.Unit})
			}
		}
		for _, c := range names {
			if strings.EqualFold(c.n, name) {
				if found != nil && found != f {
					return nil, ""
				}
				found, unitFound = f, c.u
			}
		}
	}
	return found, unitFound
}

// parseFlags reads args ("--name value" or "--name=value") against flags. positional says
// whether words that are not flags are taken (files); help asks for --help, -h and a word
// "help" before any flag.
func parseFlags(flags []flagSpec, args []string, positional bool) (*parsed, error) {
	p := &parsed{vals: map[string]string{}, typed: map[string]string{}, raw: map[string]string{}, unit: map[string]string{}, opts: map[string]string{}}
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "-h" || a == "--help" || (a == "help" && i == 0) {
			p.help = true
			return p, nil
		}
		if a == "-" || !strings.HasPrefix(a, "-") {
			if !positional {
				return nil, &unit.FieldError{Field: "arguments", Value: a, Allowed: "flags written --name value (see --help)"}
			}
			p.args = append(p.args, a)
			continue
		}
		if !strings.HasPrefix(a, "--") || len(a) == 2 {
			return nil, &unit.FieldError{Field: "arguments", Value: a, Allowed: "flags written --name value, with two dashes (see --help)"}
		}
		name, value, hasValue := strings.Cut(a[2:], "=")
		f, u := lookupFlag(flags, name)
		if f == nil {
			if !hasValue && i+1 < len(args) && !strings.HasPrefix(args[i+1], "--") {
				value = args[i+1]
			}
			return nil, &unit.FieldError{Field: shownFlag(name), Value: value, Allowed: flagsAllowed(flags)}
		}
		if !hasValue {
			if i+1 >= len(args) {
				return nil, &unit.FieldError{Field: "--" + name, Value: "", Allowed: "a value after --" + name}
			}
			i++
			value = args[i]
		}
		typed := "--" + name
		if f.Key == "" {
			if _, dup := p.opts[f.Name]; dup {
				return nil, &unit.FieldError{Field: typed, Value: value, Allowed: "each flag once"}
			}
			if f.Choices != nil && !slices.Contains(f.Choices, value) {
				return nil, &unit.FieldError{Field: typed, Value: value, Allowed: "one of " + strings.Join(f.Choices, ", ")}
			}
			p.opts[f.Name] = value
			continue
		}
		if prev, dup := p.typed[f.Key]; dup {
			allowed := "each flag once"
			if prev != typed {
				allowed = "one of " + prev + " and " + typed + ", not both (the same quantity in two units)"
			}
			return nil, &unit.FieldError{Field: typed, Value: value, Allowed: allowed}
		}
		p.typed[f.Key], p.raw[f.Key], p.vals[f.Key] = typed, value, value
		if u != "" {
			v, err := convertIn(typed, value, u)
			if err != nil {
				return nil, err
			}
			p.vals[f.Key] = strconv.FormatFloat(v, 'g', -1, 64)
			p.unit[f.Key] = u
		}
	}
	return p, nil
}

// convertIn reads a number typed in unit u (F, K, kg, lb, L, gal) and converts it to the
// file's unit (°C, g, mL). Errors name the flag as typed.
func convertIn(flag, text, u string) (float64, error) {
	v, err := unit.ParseNumber(flag, text)
	if err != nil {
		return 0, err
	}
	switch u {
	case "F", "K":
		return unit.ToCelsius(flag, v, u)
	case "kg", "lb":
		return unit.ToGrams(flag, v, u)
	}
	return unit.ToMilliliters(flag, v, u)
}

// flagsAllowed is the Allowed text of an unknown flag: the command's flags, once each.
func flagsAllowed(flags []flagSpec) string {
	names := make([]string, 0, len(flags))
	kinds := map[recipe.Kind]bool{}
	for i := range flags {
		names = append(names, "--"+flags[i].Name)
		if variants(flags[i].Kind, flags[i].Name) != nil {
			kinds[flags[i].Kind] = true
		}
	}
	s := "one of the flags: " + strings.Join(names, ", ")
	var also []string
	for _, k := range []struct {
		kind recipe.Kind
		text string
	}{{recipe.Temp, "-C also -F or -K"}, {recipe.Mass, "-g also -kg or -lb"}, {recipe.Volume, "-mL also -L or -gal"}} {
		if kinds[k.kind] {
			also = append(also, k.text)
		}
	}
	if len(also) > 0 {
		s += " (a flag ending in " + strings.Join(also, "; ") + ")"
	}
	return s
}

// flagError rewrites an input error about request or recipe keys into the flags the user
// typed: the field becomes the flag as typed (or the key's flag when it was not typed), the
// value what was typed, and keys named in the explanation become flags. Errors that are not
// about a field come back unchanged.
func flagError(err error, flags []flagSpec, p *parsed) error {
	var inFile fileError
	if errors.As(err, &inFile) {
		return err
	}
	var fe *unit.FieldError
	if !errors.As(err, &fe) {
		return err
	}
	out := &unit.FieldError{Field: fe.Field, Value: fe.Value, Allowed: fe.Allowed}
	key, index := fe.Field, "" // custom.points[2]: the third point of --custom-points
	if i := strings.IndexByte(key, '['); i > 0 {
		key, index = key[:i], key[i:]
	}
	if f := flagForKey(flags, key); f != nil {
		out.Field = "--" + f.Name + index
		if t, ok := p.typed[f.Key]; ok {
			out.Field = t + index
			if u, ok := p.unit[f.Key]; ok {
				// Typed in °F, lb...: show what was typed, and what it is in the unit the
				// explanation uses.
				out.Value = p.raw[f.Key]
				own := variants(f.Kind, f.Name)[0].Unit
				// The typed number as read (the quoted value above is the text itself, which
				// may hold spaces or line breaks that must not enter the sentence).
				typedV, err1 := unit.ParseNumber(out.Field, p.raw[f.Key])
				if v, err := strconv.ParseFloat(p.vals[f.Key], 64); err == nil && err1 == nil {
					out.Allowed += " (" + unit.FormatCompact(typedV, 6) + " " + unitSymbol(u) + " is " + unit.FormatCompact(v, 6) + " " + unitSymbol(own) + ")"
				}
			}
		}
	}
	if strings.HasPrefix(out.Allowed, "one of the keys: ") {
		out.Allowed = flagsAllowed(flags)
	}
	out.Allowed = strings.ReplaceAll(out.Allowed, "(the key is required)", "(the flag is required)")
	out.Allowed = keysToFlags(out.Allowed, flags)
	return out
}

func flagForKey(flags []flagSpec, key string) *flagSpec {
	for i := range flags {
		if flags[i].Key != "" && flags[i].Key == key {
			return &flags[i]
		}
	}
	return nil
}

// keysToFlags replaces the keys with "_" or "." in them (temp_C, water_mL, custom.points)
// that stand as words in s by their flags; a key in quotes is a value ("pressure_kPa") and
// stays. Plain-word keys (solute, salinity) are left alone: they are also ordinary words.
func keysToFlags(s string, flags []flagSpec) string {
	keys := []*flagSpec{}
	for i := range flags {
		if strings.ContainsAny(flags[i].Key, "_.") {
			keys = append(keys, &flags[i])
		}
	}
	// Longest first, so that temp_from_C is not taken for a shorter key inside it.
	slices.SortFunc(keys, func(a, b *flagSpec) int { return len(b.Key) - len(a.Key) })
	isWord := func(c byte) bool {
		return c == '_' || c == '.' || c == '-' || c >= '0' && c <= '9' || c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z'
	}
	var b strings.Builder
	for i := 0; i < len(s); {
		matched := false
		if i == 0 || !isWord(s[i-1]) && s[i-1] != '"' {
			for _, f := range keys {
				end := i + len(f.Key)
				if strings.HasPrefix(s[i:], f.Key) && (end == len(s) || !isWord(s[end]) || s[end] == '.' && (end+1 == len(s) || s[end+1] == ' ')) &&
					(end == len(s) || s[end] != '"') {
					b.WriteString("--" + f.Name)
					i = end
					matched = true
					break
				}
			}
		}
		if !matched {
			b.WriteByte(s[i])
			i++
		}
	}
	return b.String()
}

// shownFlag is an unknown flag as a message shows it: quoted when it holds characters that
// do not print (a line break would split the one-line message).
func shownFlag(name string) string {
	if strings.IndexFunc(name, func(r rune) bool { return !unicode.IsPrint(r) }) >= 0 {
		return strconv.Quote("--" + name)
	}
	return "--" + name
}
