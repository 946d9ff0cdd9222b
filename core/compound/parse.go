package compound

import (
	"math"
	"slices"
	"strconv"
	"strings"

	"saltcast/core/activity"
	"saltcast/core/solubility"
)

// ParseError reports a line of a library file that Parse cannot use.
type ParseError struct {
	Line int
	Text string // the line as written
	Msg  string
}

func (e *ParseError) Error() string {
	return "library line " + strconv.Itoa(e.Line) + ": " + e.Msg + " (" + strconv.Quote(e.Text) + ")"
}

// transitionTol is how closely two phases' curves must agree at their shared transition
// temperature (relative).
const transitionTol = 0.005

// Parse reads a library in the format documented at the top of library.txt. It checks what a
// reader of the file would trust: formulas that give a molar mass, forms and phases of the
// compound, phases in order and touching, rows covering each phase, and curves that meet at
// each transition.
func Parse(data []byte) ([]*Compound, error) {
	p := parser{sources: map[string]string{}}
	for i, raw := range strings.Split(string(data), "\n") {
		p.line, p.text = i+1, strings.TrimRight(raw, "\r")
		if err := p.statement(); err != nil {
			return nil, err
		}
	}
	if p.c != nil {
		return nil, &ParseError{Line: p.line, Text: "", Msg: "compound " + p.c.ID + " has no end line"}
	}
	if len(p.out) == 0 {
		return nil, &ParseError{Line: p.line, Msg: "no compounds"}
	}
	return p.out, nil
}

type rowSet struct {
	line         int
	pts          []solubility.Point
	rowSources   []string
	unit, source string
}

type phaseDef struct {
	form       *Form
	minC, maxC float64
	rows       rowSet
}

type parser struct {
	line    int
	text    string
	sources map[string]string
	out     []*Compound
	seen    map[string]bool

	c        *Compound
	phases   []*phaseDef
	rows     *rowSet // rows being filled: a phase's, the density's or the freezing curve's
	density  *rowSet
	freezing *rowSet
	eutectic *eutecticDef
}

type eutecticDef struct {
	line         int
	text         string
	tempC, massP float64
	form         *Form
	source       string
}

func (p *parser) fail(msg string) error { return &ParseError{Line: p.line, Text: p.text, Msg: msg} }

func (p *parser) statement() error {
	s := p.text
	if i := strings.IndexByte(s, '#'); i >= 0 {
		s = s[:i]
	}
	s = strings.TrimSpace(s)
	if s == "" {
		return nil
	}
	if c := s[0]; c >= '0' && c <= '9' || c == '-' || c == '.' {
		return p.row(s)
	}
	kw, rest, _ := strings.Cut(s, " ")
	fields := splitFields(rest)
	if kw != "source" && kw != "compound" && p.c == nil {
		return p.fail("\"" + kw + "\" outside a compound block")
	}
	switch kw {
	case "source":
		if len(fields) != 2 || fields[0] == "" || fields[1] == "" {
			return p.fail("want: source KEY | citation")
		}
		if _, dup := p.sources[fields[0]]; dup {
			return p.fail("source " + fields[0] + " defined twice")
		}
		p.sources[fields[0]] = fields[1]
	case "compound":
		return p.compound(fields)
	case "name":
		p.c.Name = strings.TrimSpace(rest)
	case "names":
		p.c.Names = append(p.c.Names, splitNames(rest)...)
	case "flags":
		for _, f := range fields {
			switch f {
			case "oxidizer":
				p.c.Oxidizer = true
			case "organic":
				p.c.Organic = true
			case "toxic":
				p.c.Toxic = true
			default:
				return p.fail("unknown flag " + strconv.Quote(f) + " (known: oxidizer, organic, toxic)")
			}
		}
	case "hazard":
		p.c.Hazard = strings.TrimSpace(rest)
	case "note":
		p.c.Notes = append(p.c.Notes, strings.TrimSpace(rest))
	case "form":
		return p.form(fields)
	case "enthalpy":
		return p.enthalpy(fields)
	case "fusion", "solidcp", "meltcp":
		return p.formHeat(kw, fields)
	case "pitzer":
		return p.pitzer(fields)
	case "phase":
		return p.phase(fields)
	case "unit":
		return p.unit(fields)
	case "density":
		if p.density != nil {
			return p.fail("second density block")
		}
		if len(fields) != 1 || fields[0] == "" {
			return p.fail("want: density source")
		}
		src, err := p.source(fields[0])
		if err != nil {
			return err
		}
		p.density = &rowSet{line: p.line, unit: "density", source: src}
		p.rows = p.density
	case "freezing":
		return p.freezingBlock(fields)
	case "eutectic":
		return p.eutecticLine(fields)
	case "caution":
		if len(fields) != 3 {
			return p.fail("want: caution from °C | to °C | text")
		}
		lo, err1 := strconv.ParseFloat(fields[0], 64)
		hi, err2 := strconv.ParseFloat(fields[1], 64)
		if err1 != nil || err2 != nil || !(lo < hi) || fields[2] == "" {
			return p.fail("want: caution from °C | to °C | text, with from < to")
		}
		p.c.Cautions = append(p.c.Cautions, Caution{MinC: lo, MaxC: hi, Text: fields[2]})
	case "end":
		return p.end()
	default:
		return p.fail("unknown statement " + strconv.Quote(kw))
	}
	return nil
}

func splitFields(s string) []string {
	if strings.TrimSpace(s) == "" {
		return nil
	}
	f := strings.Split(s, "|")
	for i := range f {
		f[i] = strings.TrimSpace(f[i])
	}
	return f
}

func splitNames(s string) []string {
	var out []string
	for _, n := range strings.Split(s, ";") {
		if n = strings.TrimSpace(n); n != "" {
			out = append(out, n)
		}
	}
	return out
}

// expand replaces each @KEY with the named source's citation, keeping any text after the
// key. Inserted citations are not expanded again, so a citation that mentions @KEY cannot
// loop. An unknown key is left in place for source to report.
func (p *parser) expand(s string) string {
	var b strings.Builder
	for {
		i := strings.IndexByte(s, '@')
		if i < 0 {
			b.WriteString(s)
			return b.String()
		}
		j := i + 1
		for j < len(s) && (s[j] >= 'A' && s[j] <= 'Z' || s[j] >= '0' && s[j] <= '9') {
			j++
		}
		b.WriteString(s[:i])
		if full, ok := p.sources[s[i+1:j]]; ok {
			b.WriteString(full)
		} else {
			b.WriteString(s[i:j])
		}
		s = s[j:]
	}
}

func (p *parser) source(s string) (string, error) {
	for rest := s; ; {
		i := strings.IndexByte(rest, '@')
		if i < 0 {
			break
		}
		j := i + 1
		for j < len(rest) && (rest[j] >= 'A' && rest[j] <= 'Z' || rest[j] >= '0' && rest[j] <= '9') {
			j++
		}
		if _, ok := p.sources[rest[i+1:j]]; !ok {
			return "", p.fail("unknown source key in " + strconv.Quote(s))
		}
		rest = rest[j:]
	}
	e := p.expand(s)
	if strings.TrimSpace(e) == "" {
		return "", p.fail("empty source")
	}
	return e, nil
}

func (p *parser) compound(fields []string) error {
	if p.c != nil {
		return p.fail("compound " + p.c.ID + " has no end line before this one")
	}
	if len(fields) != 1 || fields[0] == "" || strings.ContainsAny(fields[0], " ·.*") {
		return p.fail("want: compound ID (the anhydrous formula)")
	}
	id := fields[0]
	m, ok := MolarMass(id)
	if !ok {
		return p.fail("cannot compute the molar mass of " + strconv.Quote(id))
	}
	if p.seen == nil {
		p.seen = map[string]bool{}
	}
	if p.seen[id] {
		return p.fail("compound " + id + " defined twice")
	}
	p.seen[id] = true
	p.c = &Compound{ID: id, MolarMassGPerMol: m}
	p.phases, p.rows, p.density, p.freezing, p.eutectic = nil, nil, nil, nil, nil
	return nil
}

func (p *parser) form(fields []string) error {
	if len(fields) < 1 || len(fields) > 3 {
		return p.fail("want: form FORMULA | name ; name [| not on the shelf]")
	}
	formula := fields[0]
	f := &Form{Formula: formula}
	if len(p.c.Forms) == 0 {
		if formula != p.c.ID {
			return p.fail("the first form must be the anhydrous " + p.c.ID)
		}
		f.MolarMassGPerMol = p.c.MolarMassGPerMol
	} else {
		base, water, ok := strings.Cut(formula, "·")
		n, rest := leadingInt(water)
		if !ok || base != p.c.ID || rest != "H2O" || n < 1 {
			return p.fail("a hydrate is written " + p.c.ID + "·nH2O with the middle dot")
		}
		f.WaterPerFormula = float64(n)
		m, _ := MolarMass(formula)
		f.MolarMassGPerMol = m
	}
	if len(fields) >= 2 {
		f.Names = splitNames(fields[1])
	}
	if len(fields) == 3 {
		if fields[2] != "not on the shelf" || len(p.c.Forms) == 0 {
			return p.fail("the third field of a hydrate's form line can only be: not on the shelf")
		}
		f.NotOnShelf = true
	}
	for _, g := range p.c.Forms {
		if g.Formula == formula {
			return p.fail("form " + formula + " listed twice")
		}
	}
	f.AnhydrousFraction = p.c.MolarMassGPerMol / f.MolarMassGPerMol
	p.c.Forms = append(p.c.Forms, f)
	return nil
}

func (p *parser) findForm(formula string) (*Form, error) {
	for _, f := range p.c.Forms {
		if f.Formula == formula {
			return f, nil
		}
	}
	return nil, p.fail("no form " + strconv.Quote(formula) + " declared before this line")
}

func (p *parser) enthalpy(fields []string) error {
	if len(fields) != 3 {
		return p.fail("want: enthalpy FORMULA | kJ/mol | source")
	}
	f, err := p.findForm(fields[0])
	if err != nil {
		return err
	}
	v, err := strconv.ParseFloat(fields[1], 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1000 {
		return p.fail("enthalpy must be a number of kJ/mol")
	}
	if f.HasEnthalpy {
		return p.fail("second enthalpy for " + f.Formula)
	}
	src, err := p.source(fields[2])
	if err != nil {
		return err
	}
	f.SolutionEnthalpyKJPerMol, f.HasEnthalpy, f.EnthalpySource = v, true, src
	p.addSource(src)
	return nil
}

// formHeat reads the heat data of one form: fusion FORMULA | kJ/kg low | kJ/kg high | source,
// solidcp FORMULA | J/(mol·K) | source, meltcp FORMULA | kJ/(kg·K) | source.
func (p *parser) formHeat(kw string, fields []string) error {
	want := map[string]string{
		"fusion":  "fusion FORMULA | kJ/kg low | kJ/kg high | source",
		"solidcp": "solidcp FORMULA | J/(mol·K) | source",
		"meltcp":  "meltcp FORMULA | kJ/(kg·K) | source",
	}[kw]
	n := 3
	if kw == "fusion" {
		n = 4
	}
	if len(fields) != n {
		return p.fail("want: " + want)
	}
	f, err := p.findForm(fields[0])
	if err != nil {
		return err
	}
	v := make([]float64, n-2)
	for i := range v {
		x, err := strconv.ParseFloat(fields[1+i], 64)
		if err != nil || !(x > 0 && x < 5000) {
			return p.fail("want: " + want + ", with positive numbers")
		}
		v[i] = x
	}
	src, err := p.source(fields[n-1])
	if err != nil {
		return err
	}
	switch kw {
	case "fusion":
		if f.HasFusion || f.WaterPerFormula == 0 || v[0] > v[1] {
			return p.fail("one fusion line per hydrate, low value first")
		}
		f.FusionKJPerKgLow, f.FusionKJPerKgHigh, f.HasFusion, f.FusionSource = v[0], v[1], true, src
	case "solidcp":
		if f.HasSolidCp {
			return p.fail("second solidcp for " + f.Formula)
		}
		f.SolidCpJPerMolK, f.HasSolidCp, f.SolidCpSource = v[0], true, src
	case "meltcp":
		if f.HasMeltCp || f.WaterPerFormula == 0 || v[0] > 10 {
			return p.fail("one meltcp line per hydrate, in kJ/(kg·K)")
		}
		f.MeltCpKJPerKgK, f.HasMeltCp, f.MeltCpSource = v[0], true, src
	}
	p.addSource(src)
	return nil
}

// pitzer reads pitzer ν+ | z+ | ν− | z− | β0 | β1 | Cφ | max mol/kg | source.
func (p *parser) pitzer(fields []string) error {
	const want = "want: pitzer ν+ | z+ | ν− | z− | β0 | β1 | Cφ | max mol/kg | source"
	if len(fields) != 9 || p.c.Activity != nil {
		return p.fail(want + " (once per compound)")
	}
	var v [8]float64
	for i := range v {
		x, err := strconv.ParseFloat(fields[i], 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) || math.Abs(x) > 100 {
			return p.fail(want)
		}
		v[i] = x
	}
	for _, i := range [...]int{0, 1, 2, 3, 7} {
		if !(v[i] > 0) {
			return p.fail(want + ", with positive ion counts, charges and range")
		}
	}
	if v[0]*v[1] != v[2]*v[3] {
		return p.fail("the charges do not balance: ν+·z+ must equal ν−·z−")
	}
	if v[1] > 1 && v[3] > 1 {
		return p.fail("salts of two multivalent ions need β2, which this model leaves out")
	}
	src, err := p.source(fields[8])
	if err != nil {
		return err
	}
	p.c.Activity = &activity.Salt{NuM: v[0], ZM: v[1], NuX: v[2], ZX: v[3], Beta0: v[4], Beta1: v[5], CPhi: v[6],
		MaxMolal: v[7], Source: src}
	p.addSource(src)
	return nil
}

func (p *parser) phase(fields []string) error {
	if len(fields) != 3 {
		return p.fail("want: phase FORMULA | from °C | to °C")
	}
	f, err := p.findForm(fields[0])
	if err != nil {
		return err
	}
	lo, err1 := strconv.ParseFloat(fields[1], 64)
	hi, err2 := strconv.ParseFloat(fields[2], 64)
	if err1 != nil || err2 != nil || !(lo < hi) || lo < -100 || hi > 500 {
		return p.fail("phase range must be two temperatures from −100 to 500 °C, low first")
	}
	if n := len(p.phases); n > 0 && p.phases[n-1].maxC != lo {
		return p.fail("phase must start where the previous one ends (" + strconv.FormatFloat(p.phases[n-1].maxC, 'g', -1, 64) + " °C)")
	}
	if p.density != nil {
		return p.fail("phases come before the density block")
	}
	if p.freezing != nil {
		return p.fail("phases come before the freezing block")
	}
	ph := &phaseDef{form: f, minC: lo, maxC: hi, rows: rowSet{line: p.line}}
	p.phases = append(p.phases, ph)
	p.rows = &ph.rows
	return nil
}

func (p *parser) unit(fields []string) error {
	if p.rows == nil || p.rows == p.density || p.rows == p.freezing {
		return p.fail("unit belongs under a phase line")
	}
	if len(fields) != 2 || (fields[0] != "mass%" && fields[0] != "g/100g") {
		return p.fail("want: unit mass% | source  or  unit g/100g | source")
	}
	src, err := p.source(fields[1])
	if err != nil {
		return err
	}
	p.rows.unit, p.rows.source = fields[0], src
	return nil
}

func (p *parser) row(s string) error {
	if p.c == nil || p.rows == nil {
		return p.fail("a data row must follow a phase, density or freezing line")
	}
	nums, src, _ := strings.Cut(s, "|")
	f := strings.Fields(nums)
	if len(f) != 2 {
		return p.fail("want a row: temperature value [| source]")
	}
	a, err1 := strconv.ParseFloat(f[0], 64)
	b, err2 := strconv.ParseFloat(f[1], 64)
	if err1 != nil || err2 != nil || math.IsNaN(a) || math.IsNaN(b) || math.IsInf(a, 0) || math.IsInf(b, 0) {
		return p.fail("row values must be plain numbers")
	}
	if p.rows.unit == "" {
		return p.fail("a unit line must come before the rows of a phase")
	}
	source := p.rows.source
	if strings.TrimSpace(src) != "" {
		var err error
		if source, err = p.source(strings.TrimSpace(src)); err != nil {
			return err
		}
	}
	switch p.rows.unit {
	case "mass%":
		if !(b > 0 && b < 100) {
			return p.fail("a mass per cent must be above 0 and below 100")
		}
		b = solubility.FromMassPercent(b)
	case "g/100g":
		if !(b > 0 && b < 1e6) {
			return p.fail("a solubility must be above 0 g/100 g")
		}
	case "density":
		if !(a > 0 && a < 100 && b > 0.5 && b < 5) {
			return p.fail("a density row is mass % (0–100) and g/cm³ (0.5–5)")
		}
	case "freezing":
		if !(a > 0 && a < 100 && b > 0 && b < 100) {
			return p.fail("a freezing row is mass % (0–100) and a depression in K (0–100)")
		}
	}
	p.rows.pts = append(p.rows.pts, solubility.Point{TempC: a, GPer100gWater: b})
	p.rows.rowSources = append(p.rows.rowSources, source)
	p.addSource(source)
	return nil
}

func (p *parser) addSource(s string) {
	for _, t := range p.c.Sources {
		if t == s {
			return
		}
	}
	p.c.Sources = append(p.c.Sources, s)
}

func (p *parser) end() error {
	c := p.c
	switch {
	case c.Name == "":
		return p.fail("compound " + c.ID + " has no name")
	case c.Hazard == "":
		return p.fail("compound " + c.ID + " has no hazard note")
	case !strings.Contains(c.Hazard, "SDS"):
		return p.fail("the hazard note of " + c.ID + " must point to the SDS")
	case c.Toxic && !strings.HasPrefix(c.Hazard, "DANGER") && !strings.HasPrefix(c.Hazard, "Toxic"):
		return p.fail("the hazard note of toxic " + c.ID + " must open with \"DANGER\" or \"Toxic\"")
	case len(c.Forms) == 0:
		return p.fail("compound " + c.ID + " has no forms")
	case len(p.phases) == 0:
		return p.fail("compound " + c.ID + " has no phases")
	}
	extended, err := p.extendToEutectic()
	if err != nil {
		return err
	}
	for i, ph := range p.phases {
		pts := ph.rows.pts
		if len(pts) < 2 {
			return &ParseError{Line: ph.rows.line, Text: "phase " + ph.form.Formula, Msg: "a phase needs at least 2 data rows"}
		}
		lo, hi := pts[0].TempC, pts[0].TempC
		for _, q := range pts {
			lo, hi = math.Min(lo, q.TempC), math.Max(hi, q.TempC)
		}
		if lo > ph.minC || hi < ph.maxC {
			return &ParseError{Line: ph.rows.line, Text: "phase " + ph.form.Formula, Msg: "the data rows do not cover the phase range"}
		}
		m, err := solubility.NewTable(pts, c.MolarMassGPerMol)
		if err != nil {
			return &ParseError{Line: ph.rows.line, Text: "phase " + ph.form.Formula, Msg: err.Error()}
		}
		var srcs []string
		for _, s := range ph.rows.rowSources {
			if !slices.Contains(srcs, s) {
				srcs = append(srcs, s)
			}
		}
		src := strings.Join(srcs, "; ")
		c.Segments = append(c.Segments, Segment{Form: ph.form, MinC: ph.minC, MaxC: ph.maxC,
			Curve: solubility.Curve{Model: m, MinC: ph.minC, MaxC: ph.maxC, Source: src}})
		if i > 0 {
			t := ph.minC
			a := c.Segments[i-1].Curve.Model.Value(t)
			b := m.Value(t)
			if math.Abs(a-b) > transitionTol*math.Max(a, b) {
				return &ParseError{Line: ph.rows.line, Text: "phase " + ph.form.Formula, Msg: "the solubility curves of this phase and the previous one do not meet at " + strconv.FormatFloat(t, 'g', -1, 64) + " °C"}
			}
		}
	}
	if err := p.buildFreezing(extended); err != nil {
		return err
	}
	if p.density != nil {
		d, err := fitDensity(p.density.pts, p.density.source)
		if err != nil {
			return &ParseError{Line: p.density.line, Text: "density", Msg: err.Error()}
		}
		c.density = d
	}
	p.out = append(p.out, c)
	p.c, p.phases, p.rows, p.density, p.freezing, p.eutectic = nil, nil, nil, nil, nil, nil
	return nil
}
