package main

import (
	"errors"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// tableFlags gives every key of a recipe table a flag, in table order: the flag is the key
// with "-" for "_" and "." (dissolve_temp_C → --dissolve-temp-C, custom.points →
// --custom-points), so a key added to the table has its flag without more code. The format
// number and the kind tag are written by Saltcast itself, and an object (custom) is there
// when one of its keys is given, so these three have no flag of their own.
func tableFlags(specs recipe.Specs) []flagSpec {
	var fs []flagSpec
	for i := range specs {
		s := &specs[i]
		if s.Kind.Fixed() || s.Kind == recipe.Object {
			continue
		}
		f := flagSpec{Key: s.Key, Name: flagName(s.Key), Kind: s.Kind, Help: s.Help}
		// The table's help says the default where there is one: "...; default 100", or for
		// a choice "table (monotone PCHIP, the default), ...".
		if h, d, ok := strings.Cut(s.Help, "; default "); ok {
			f.Help, f.Default = h, d
		} else if d, h, ok := strings.Cut(strings.TrimPrefix(s.Help, "default "), "; "); ok && strings.HasPrefix(s.Help, "default ") {
			f.Help, f.Default = h, d
		} else if s.Choices != nil && strings.Contains(s.Help, "the default") {
			f.Default = strings.Fields(s.Help)[0]
		}
		switch s.Kind {
		case recipe.Temp:
			f.Arg, f.Unit = "T", "°C"
		case recipe.Mass:
			f.Arg, f.Unit = "MASS", "g"
		case recipe.Volume:
			f.Arg, f.Unit = "VOLUME", "mL"
		case recipe.Text:
			f.Arg = "TEXT"
			if s.Choices != nil {
				f.Arg = strings.Join(s.Choices, "|")
			}
		case recipe.Points:
			f.Arg, f.Unit = `"T G; T G; …"`, "°C and g anhydrous per 100 g water"
		default:
			f.Arg, f.Unit = "X", s.Unit
		}
		if h, ok := strings.CutSuffix(f.Help, " (required)"); ok {
			f.Help, f.Default = h, "required"
		}
		if s.Allowed != "" {
			f.Help += " (" + s.Allowed + ")"
		}
		if s.Need != "" || s.Required {
			f.Default = "required"
			if s.Parent() != "" {
				f.Default = "required with --" + flagName(s.Parent()) + "-…"
			}
		}
		if s.Group != "" && s.Parent() == "" {
			var others []string
			for j := range specs {
				o := &specs[j]
				if o.Group == s.Group && o.Choice != s.Choice && !o.Kind.Fixed() && o.Kind != recipe.Object {
					others = append(others, "--"+flagName(o.Key))
				}
			}
			if len(others) > 0 {
				f.Help += "; not together with " + strings.Join(others, ", ")
			}
		}
		fs = append(fs, f)
	}
	for i := range fs {
		fs[i].Help = keysToFlags(fs[i].Help, fs)
	}
	return fs
}

func contains(l []string, s string) bool {
	for _, x := range l {
		if x == s {
			return true
		}
	}
	return false
}

// tableJSON writes what the flags in p give as a file of the table's kind (the format
// number first, keys in table order); decoding it checks the recipe exactly as a file is
// checked. Numbers typed in other units arrive converted; numbers, points and their errors
// name the flag as typed.
func tableJSON(specs recipe.Specs, p *parsed) ([]byte, error) {
	var e wire.Encoder
	e.BeginObject()
	if err := tableJSONIn(&e, specs, p, ""); err != nil {
		return nil, err
	}
	e.EndObject()
	return e.Bytes()
}

func tableJSONIn(e *wire.Encoder, specs recipe.Specs, p *parsed, parent string) error {
	for i := range specs {
		s := &specs[i]
		if s.Parent() != parent {
			continue
		}
		v, given := p.vals[s.Key]
		name := s.Name()
		switch {
		case s.Kind == recipe.Version:
			e.Key(name).Int(int(s.Max))
		case s.Kind == recipe.Tag:
			e.Key(name).String(s.Choices[0])
		case s.Kind == recipe.Object:
			inside := false
			for k := range p.vals {
				inside = inside || strings.HasPrefix(k, s.Key+".")
			}
			if inside {
				e.Key(name).BeginObject()
				if err := tableJSONIn(e, specs, p, s.Key); err != nil {
					return err
				}
				e.EndObject()
			}
		case !given:
		case s.Kind == recipe.Text:
			e.Key(name).String(v)
		case s.Kind == recipe.Points:
			pts, err := parsePoints(p.typed[s.Key], v)
			if err != nil {
				return err
			}
			e.Key(name).BeginArray()
			for _, pt := range pts {
				e.BeginArray().Float(pt[0]).Float(pt[1]).EndArray()
			}
			e.EndArray()
		default:
			x, err := unit.ParseNumber(p.typed[s.Key], v)
			if err != nil {
				return err
			}
			e.Key(name).Float(x)
		}
	}
	return nil
}

// pointsAllowed says how points are typed on the command line.
const pointsAllowed = `points written "temp_C g_per_100g_water", separated by ";", e.g. "10 5.1; 30 9.4; 50 17"`

// parsePoints reads "10 5.1; 30 9.4; 50 17" (a decimal comma is fine: "10 5,1; 30 9,4").
func parsePoints(flag, text string) ([][2]float64, error) {
	var pts [][2]float64
	for _, part := range strings.Split(text, ";") {
		part = strings.TrimSpace(part)
		if part == "" {
			continue
		}
		xy := strings.Fields(part)
		if len(xy) != 2 {
			return nil, &unit.FieldError{Field: flag, Value: part, Allowed: pointsAllowed}
		}
		var pt [2]float64
		for j, s := range xy {
			v, err := unit.ParseNumber(flag, s)
			if err != nil {
				return nil, &unit.FieldError{Field: flag, Value: part, Allowed: pointsAllowed}
			}
			pt[j] = v
		}
		pts = append(pts, pt)
	}
	return pts, nil
}

// overrideJSON reads a recipe file (data, called name) and puts the flags in p over it: a
// flag replaces the file's value of its key, and a flag of another choice in a group
// replaces the file's choice (--charge-g over a file's saturation_pct, --water-mL over its
// water_g). Two flags of different choices in one group are refused. The result is written
// as a file of the table's kind, to be decoded and checked as any file is.
func overrideJSON[R any](t *recipe.Table[R], data []byte, name string, p *parsed) ([]byte, error) {
	r, err := t.Decode(data)
	if err != nil {
		var fe *unit.FieldError
		if errors.As(err, &fe) {
			err = &unit.FieldError{Field: name + ": " + fe.Field, Value: fe.Value, Allowed: fe.Allowed}
		}
		return nil, fileError{err}
	}
	specs := t.Specs()
	f := specs.NewForm()
	t.ToForm(&r, &f)
	chosen := map[string]string{} // group → the flag that chose it
	for i := range specs {
		s := &specs[i]
		v, ok := p.vals[s.Key]
		if !ok {
			continue
		}
		group, choice := s.Group, s.Choice
		if parent := s.Parent(); parent != "" {
			ps, _ := specs.Lookup(parent)
			group, choice = ps.Group, ps.Choice
		}
		if group != "" {
			if prev, ok := chosen[group]; ok && f.Pick[group] != choice {
				return nil, &unit.FieldError{Field: p.typed[s.Key], Value: p.raw[s.Key], Allowed: "not together with " + prev}
			}
			chosen[group] = p.typed[s.Key]
			f.Pick[group] = choice
		}
		switch s.Kind {
		case recipe.Text:
			f.Text[s.Key] = v
		case recipe.Points:
			pts, err := parsePoints(p.typed[s.Key], v)
			if err != nil {
				return nil, err
			}
			f.Points = f.Points[:0]
			for _, pt := range pts {
				f.Points = append(f.Points, recipe.Point{TempC: pt[0], GPer100gWater: pt[1]})
			}
		default:
			x, err := unit.ParseNumber(p.typed[s.Key], v)
			if err != nil {
				return nil, err
			}
			f.Num[s.Key] = x
		}
	}
	return specs.FormJSON(&f), nil
}

// fileError is an error in a recipe file: it names the file's keys, not flags.
type fileError struct{ error }

func (e fileError) Unwrap() error { return e.error }
