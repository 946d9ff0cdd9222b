package recipe

import (
	"math"
	"strings"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

// A Table lists the keys of one kind of recipe file, once. Decoding, encoding, the list of
// keys in error messages, the page's form (Form, FormJSON), the batch sheet's labels and
// units, the CSV rows and the README's key table are all derived from it, so a key cannot be
// read by one of them and dropped by another.
//
// To add a key to a recipe kind: add its Go field to the kind's struct, then one Field to
// its table in the place where it should appear in files (Fields for the batch recipe, in
// fields.go), with its range, wording, label and accessor; then an input for it in
// web/shell.html and a row in the README's key table (tests fail until both are there).
//
// To add a recipe kind: define its struct and a Table[ThatStruct] with New (the defaults of
// keys left out) and Check (rules across keys); Decode and Encode then come from
// Table.Decode and Table.Encode, and a form from Specs, ToForm and Specs.FormJSON.
type Table[R any] struct {
	Noun   string     // what an unknown key is not one of: "one of the <Noun> keys: ..."
	Fields []Field[R] // in the order keys are written; a key inside an Object follows it
	New    func() R   // a value with the defaults of keys left out
	// Check enforces the rules that involve more than one key, after every key was read;
	// prefix goes in front of field names in its errors ("recipes[2].").
	Check func(r *R, prefix string) error
}

// Field is one key of a Table: its Spec and the accessor for its Go field. Exactly the
// accessor that fits its Kind is set: Opt for an optional number, Num for a required one,
// Text, Points, Int for the Version, Has and Make for an Object.
type Field[R any] struct {
	Spec
	Opt    func(*R) *Opt
	Num    func(*R) *float64
	Text   func(*R) *string
	Points func(*R) *[]Point
	Int    func(*R) *int
	Has    func(*R) bool                   // Object: the object is there (written, shown)
	Make   func(*R)                        // Object: makes it, with its defaults, before its keys are read
	Close  func(r *R, prefix string) error // Object: rules inside it, checked once its keys are read
}

// Kind says what a key holds, and so how it is read, written and shown.
type Kind uint8

const (
	Plain   Kind = iota // a number in the Spec's own Unit (%, K, min, J/K, g/mol...)
	Temp                // a temperature: °C in the file, the user's unit on screen
	Mass                // a mass: g in the file
	Volume              // a volume: mL in the file
	Text                // a string
	Points              // solubility points, [[temp_C, g_per_100g_water], ...]
	Object              // an object of further keys, named "object.key" in the table
	Version             // the file format number ("format"); Max is the newest format read
	Tag                 // a fixed text naming the kind of file ("kind"): Choices[0], always written, optional to read
)

// IsNumber reports whether k is one of the number kinds.
func (k Kind) IsNumber() bool { return k <= Volume }

// Fixed reports whether k is written by the table itself rather than held in a form:
// the format number and the kind tag.
func (k Kind) Fixed() bool { return k == Version || k == Tag }

// Spec is what every front end needs to know about a key, without the Go type it lives in:
// how to read and check it, how to show and label it.
type Spec struct {
	Key  string // the JSON key; a key inside an Object is "object.key" (custom.name)
	Kind Kind
	Unit string // unit of a Plain number as shown ("%", "K", "J/K"); the other kinds follow the user's units

	Min, Max float64  // numbers: the accepted range (Version: Max is the newest format)
	MinOpen  bool     // Min itself is refused (v > Min)
	MaxBytes int      // Text: longest accepted, in bytes of UTF-8
	Choices  []string // Text: when given, the only values accepted
	Trim     bool     // Text: spaces around what the user types are dropped

	Allowed  string // what an error message says is allowed
	Required bool   // always written; a missing key is refused (with Need, or by Check)
	Need     string // what the error for a missing key says is allowed; "" when Check says it

	// At most one Choice of each Group is in a recipe at once (water by mass or by volume);
	// a form shows only the fields of the chosen one. The first field of a Group in the
	// table gives the Choice of a new form. A field inside an Object inherits the Object's.
	Group, Choice string

	Label string // on the batch sheet and in the CSV
	Help  string // what the key means, for documentation
}

// Parent is the Object key a key lies in ("custom" for "custom.name"), or "".
func (s *Spec) Parent() string {
	if i := strings.LastIndexByte(s.Key, '.'); i >= 0 {
		return s.Key[:i]
	}
	return ""
}

// Name is the key as written inside its object ("name" for "custom.name").
func (s *Spec) Name() string { return s.Key[strings.LastIndexByte(s.Key, '.')+1:] }

// Specs is a table's keys without their accessors, in table order.
type Specs []Spec

// Specs returns the keys of t, in order.
func (t *Table[R]) Specs() Specs {
	s := make(Specs, len(t.Fields))
	for i := range t.Fields {
		s[i] = t.Fields[i].Spec
	}
	return s
}

// Lookup returns the Spec of key (nil, false if s has none); callers must not change it.
func (s Specs) Lookup(key string) (*Spec, bool) {
	for i := range s {
		if s[i].Key == key {
			return &s[i], true
		}
	}
	return nil, false
}

// Keys lists the keys directly inside parent ("" for the top level), as written in files.
func (s Specs) Keys(parent string) []string {
	var keys []string
	for i := range s {
		if s[i].Parent() == parent {
			keys = append(keys, s[i].Name())
		}
	}
	return keys
}

// Decode reads one value of the table's kind strictly: unknown keys, wrong types,
// non-finite or out-of-range numbers and what Check refuses are errors naming the key;
// malformed JSON is a *wire.SyntaxError.
func (t *Table[R]) Decode(data []byte) (R, error) {
	v, err := wire.Decode(data)
	if err != nil {
		var zero R
		return zero, err
	}
	return t.FromValue(v, "")
}

// FromValue checks one object already read as JSON; prefix goes in front of field names
// ("recipes[2].").
func (t *Table[R]) FromValue(v wire.Value, prefix string) (R, error) {
	var zero R
	if v.Kind != wire.Object {
		return zero, &unit.FieldError{Field: strings.TrimSuffix(prefix, ".") + t.Noun, Value: v.Kind.String(),
			Allowed: "a JSON object of " + t.Noun + " keys"}
	}
	r := t.New()
	d := reader{prefix: prefix}
	t.members(&d, &r, v, "")
	if d.err != nil {
		return zero, d.err
	}
	for i := range t.Fields {
		f := &t.Fields[i].Spec
		if f.Need != "" && f.Parent() == "" {
			if _, ok := v.Get(f.Key); !ok {
				d.fail(f.Key, "", f.Need)
			}
		}
	}
	// Rules across keys speak first: they say more than a missing key does.
	if t.Check != nil {
		if err := t.Check(&r, prefix); err != nil {
			return zero, err
		}
	}
	if d.err != nil {
		return zero, d.err
	}
	return r, nil
}

// field returns the field of key, nil if the table has none.
func (t *Table[R]) field(key string) *Field[R] {
	for i := range t.Fields {
		if t.Fields[i].Key == key {
			return &t.Fields[i]
		}
	}
	return nil
}

// members reads the members of obj, the object at key parent ("" for the top level),
// stopping at the first error.
func (t *Table[R]) members(d *reader, r *R, obj wire.Value, parent string) {
	for _, m := range obj.Members {
		key := m.Key
		if parent != "" {
			key = parent + "." + m.Key
		}
		var f *Field[R]
		if !strings.Contains(m.Key, ".") {
			f = t.field(key)
		}
		if f == nil {
			d.fail(key, m.Key, unit.KeysAllowed(t.keys(parent)))
			return
		}
		t.read(d, r, f, m.Value)
		if d.err != nil {
			return
		}
	}
}

func (t *Table[R]) keys(parent string) []string {
	var keys []string
	for i := range t.Fields {
		if t.Fields[i].Parent() == parent {
			keys = append(keys, t.Fields[i].Name())
		}
	}
	return keys
}

// read checks one member against its field and stores it.
func (t *Table[R]) read(d *reader, r *R, f *Field[R], v wire.Value) {
	switch f.Kind {
	case Version:
		*f.Int(r) = d.format(v, int(f.Max))
	case Tag:
		if s := d.text(f.Key, v, f.MaxBytes); d.err == nil && s != f.Choices[0] {
			d.fail(f.Key, s, f.Allowed)
		}
	case Text:
		s := d.text(f.Key, v, f.MaxBytes)
		if f.Choices != nil && f.Trim && contains(f.Choices, strings.TrimSpace(s)) {
			s = strings.TrimSpace(s) // a choice with spaces around it means the choice
		}
		if d.err == nil && f.Choices != nil && !contains(f.Choices, s) {
			d.fail(f.Key, s, "one of "+strings.Join(f.Choices, ", "))
		}
		*f.Text(r) = s
	case Points:
		*f.Points(r) = d.points(f.Key, v)
	case Object:
		if v.Kind != wire.Object {
			d.fail(f.Key, literal(v), f.Allowed)
			return
		}
		f.Make(r)
		t.members(d, r, v, f.Key)
		if d.err == nil && f.Close != nil {
			d.err = f.Close(r, d.prefix)
		}
	default:
		o := d.num(f.Key, v, &f.Spec)
		if f.Opt != nil {
			*f.Opt(r) = o
		} else {
			*f.Num(r) = o.Value
		}
	}
}

// Encode writes r as canonical JSON: the Version first, then the keys that are set (and
// the Required ones) in table order. Decode(Encode(r)) gives r back. It panics on a
// non-finite number, which Decode never yields: a programming error in the caller.
func (t *Table[R]) Encode(r *R) []byte {
	var e wire.Encoder
	t.encode(&e, r)
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: Encode of a non-finite number: " + err.Error())
	}
	return b
}

func (t *Table[R]) encode(e *wire.Encoder, r *R) {
	e.BeginObject()
	t.encodeIn(e, r, "")
	e.EndObject()
}

func (t *Table[R]) encodeIn(e *wire.Encoder, r *R, parent string) {
	for i := range t.Fields {
		f := &t.Fields[i]
		if f.Parent() != parent {
			continue
		}
		name := f.Name()
		switch f.Kind {
		case Version:
			e.Key(name).Int(int(f.Max))
		case Tag:
			e.Key(name).String(f.Choices[0])
		case Text:
			if s := *f.Text(r); s != "" || f.Required {
				e.Key(name).String(s)
			}
		case Points:
			if p := *f.Points(r); len(p) > 0 || f.Required {
				writePoints(e.Key(name), p)
			}
		case Object:
			if f.Has(r) {
				e.Key(name).BeginObject()
				t.encodeIn(e, r, f.Key)
				e.EndObject()
			}
		default:
			if f.Opt == nil {
				e.Key(name).Float(*f.Num(r))
			} else if o := *f.Opt(r); o.Set {
				e.Key(name).Float(o.Value)
			}
		}
	}
}

func writePoints(e *wire.Encoder, pts []Point) {
	e.BeginArray()
	for _, p := range pts {
		e.BeginArray().Float(p.TempC).Float(p.GPer100gWater).EndArray()
	}
	e.EndArray()
}

// texts calls f with every text of r and the most bytes Decode reads of it.
func (t *Table[R]) texts(r *R, f func(s string, max int)) {
	for i := range t.Fields {
		fd := &t.Fields[i]
		if p := fd.Parent(); p != "" && !t.field(p).Has(r) {
			continue
		}
		if fd.Kind == Text {
			f(*fd.Text(r), fd.MaxBytes)
		}
	}
}

// Form is a recipe as a form holds it: each key's value in the file's own units (°C, g,
// mL) under its table key, and the Choice made in each Group. A key that is not there is
// simply missing from the maps.
type Form struct {
	Text   map[string]string
	Num    map[string]float64
	Points []Point           // the one Points key of a kind
	Pick   map[string]string // Group → Choice
}

// NewForm returns an empty form with the first Choice of each Group picked.
func (s Specs) NewForm() Form {
	f := Form{Text: map[string]string{}, Num: map[string]float64{}, Pick: map[string]string{}}
	for i := range s {
		if g := s[i].Group; g != "" {
			if _, ok := f.Pick[g]; !ok {
				f.Pick[g] = s[i].Choice
			}
		}
	}
	return f
}

// ToForm puts what r holds into f (made by NewForm) and picks the Choice of each Group
// that r uses.
func (t *Table[R]) ToForm(r *R, f *Form) {
	for i := range t.Fields {
		fd := &t.Fields[i]
		if p := fd.Parent(); p != "" && !t.field(p).Has(r) {
			continue
		}
		set := true
		switch fd.Kind {
		case Text:
			if s := *fd.Text(r); s != "" {
				f.Text[fd.Key] = s
			} else {
				set = false
			}
		case Points:
			f.Points = append([]Point(nil), *fd.Points(r)...)
		case Object:
			set = fd.Has(r)
		case Version, Tag:
			set = false
		default:
			if fd.Opt == nil {
				f.Num[fd.Key] = *fd.Num(r)
			} else if o := *fd.Opt(r); o.Set {
				f.Num[fd.Key] = o.Value
			} else {
				set = false
			}
		}
		if set && fd.Group != "" {
			f.Pick[fd.Group] = fd.Choice
		}
	}
}

// Active reports whether key counts in f: its Group's Choice (and its Object's) is picked.
func (s Specs) Active(f *Form, key string) bool {
	sp, ok := s.Lookup(key)
	if !ok {
		return false
	}
	if sp.Group != "" && f.Pick[sp.Group] != sp.Choice {
		return false
	}
	if p := sp.Parent(); p != "" {
		return s.Active(f, p)
	}
	return true
}

// FormJSON writes f as a file of this kind: the Version, then the keys f holds whose
// Choice is picked, in table order. Decoding it checks the form as a file would be checked.
func (s Specs) FormJSON(f *Form) []byte {
	var e wire.Encoder
	e.BeginObject()
	s.formIn(&e, f, "")
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		// A form's numbers come through unit.ParseNumber, which refuses NaN and Inf.
		panic("recipe: FormJSON: " + err.Error())
	}
	return b
}

func (s Specs) formIn(e *wire.Encoder, f *Form, parent string) {
	for i := range s {
		sp := &s[i]
		if sp.Parent() != parent || (sp.Group != "" && f.Pick[sp.Group] != sp.Choice) {
			continue
		}
		name := sp.Name()
		switch sp.Kind {
		case Version:
			e.Key(name).Int(int(sp.Max))
		case Tag:
			e.Key(name).String(sp.Choices[0])
		case Text:
			if v, ok := f.Text[sp.Key]; ok {
				e.Key(name).String(v)
			}
		case Points:
			if f.Points != nil {
				writePoints(e.Key(name), f.Points)
			}
		case Object:
			e.Key(name).BeginObject()
			s.formIn(e, f, sp.Key)
			e.EndObject()
		default:
			if v, ok := f.Num[sp.Key]; ok {
				e.Key(name).Float(v)
			}
		}
	}
}

// inRange reports whether v is a finite number s accepts.
func (s *Spec) inRange(v float64) bool {
	if math.IsNaN(v) || math.IsInf(v, 0) || v > s.Max {
		return false
	}
	if s.MinOpen {
		return v > s.Min
	}
	return v >= s.Min
}
