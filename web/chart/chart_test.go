package chart

import (
	"bytes"
	"encoding/xml"
	"errors"
	"flag"
	"io"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden SVG files in testdata")

// kno3 is the solubility of KNO3 in g per 100 g water, from the CRC Handbook
// of Chemistry and Physics, 98th ed. (2017), "Aqueous Solubility of
// Inorganic Compounds at Various Temperatures", mass % converted with
// r = 100·w/(100−w).
var kno3 = []Point{
	{0, 13.64}, {10, 21.36}, {20, 31.93}, {25, 38.31}, {30, 45.56},
	{40, 62.87}, {50, 84.16}, {60, 109.2}, {80, 170.3}, {100, 242.5},
}

// na2so4 is the solubility of sodium sulfate (anhydrous basis, g per 100 g
// water): decahydrate below 32.38 °C, anhydrous above. 0 and 10 °C are the
// secondary compilation (Perry's/Seidell, as in the Wikipedia "Solubility
// table"), since the CRC table is blank there; 20, 25, 30 and 40–100 °C are
// the CRC Handbook, 98th ed., same table as kno3; 49.7 at the 32.38 °C
// transition is (from memory).
var (
	na2so4Deca = []Point{{0, 4.9}, {10, 9.1}, {20, 19.23}, {25, 28.11}, {30, 41.28}, {32.38, 49.7}}
	na2so4Anh  = []Point{{32.38, 49.7}, {40, 47.82}, {50, 46.09}, {60, 44.72}, {80, 42.90}, {100, 42.19}}
)

func ptr(p Point) *Point { return &p }

// kno3Batch is an invented stock-concentrate batch: 50 g KNO3 per 100 g
// water dissolved at 35 °C, a 5 K metastable zone, cooled to 4 °C. (invented)
func kno3View() SolubilityView {
	return SolubilityView{
		Title:       "Potassium nitrate, KNO3 (invented stock batch)",
		Phases:      []Phase{{Form: "KNO3", Points: kno3}},
		MetastableK: 5,
		Batch: &Batch{
			Dissolve:   Point{35, 50},
			Saturation: ptr(Point{32.6, 50}),
			Onset:      ptr(Point{27.6, 50}),
			End:        Point{4, 16.3},
			Settled:    ptr(Point{31, 48}),
		},
		Notes: []string{"Curve: CRC Handbook, 98th ed. (invented batch)"},
	}
}

func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if !bytes.Equal(want, []byte(got)) {
		t.Errorf("%s differs from the golden file; if the change is intended, run go test -update and look at the SVG", name)
	}
}

func TestGolden(t *testing.T) {
	seeded := kno3View()
	seeded.Title = "Seeded KNO3 batch in °F (invented)"
	seeded.Temp = Fahrenheit
	seeded.Batch.Seed = ptr(Point{30, 50})
	seeded.Batch.Onset = ptr(Point{30, 50})
	seeded.Batch.Settled = nil

	zoom := kno3View()
	zoom.Zoom = true

	glauber := SolubilityView{
		Title:       "Sodium sulfate: decahydrate and anhydrous",
		Phases:      []Phase{{Form: "Na2SO4·10H2O", Points: na2so4Deca}, {Form: "Na2SO4", Points: na2so4Anh}},
		MetastableK: 3,
		Temp:        Kelvin,
		Batch: &Batch{ // (invented)
			Dissolve: Point{30, 35}, Saturation: ptr(Point{27.6, 35}),
			Onset: ptr(Point{24.6, 35}), End: Point{10, 9.1},
		},
		DecimalComma: true,
	}

	// Benson & Krause (1984) oxygen saturation at 101.325 kPa, S = 0, as
	// tabulated in Standard Methods 4500-O (values from the equation, which
	// match the printed table to the 3rd decimal, from memory).
	o2 := OxygenView{
		Curve: []Point{
			{0, 14.621}, {5, 12.771}, {10, 11.288}, {15, 10.084}, {20, 9.092},
			{25, 8.263}, {30, 7.559}, {35, 6.949}, {40, 6.413},
		},
		CurveLabel: "Saturation at 101.3 kPa, fresh water",
		Day:        ptr(Point{20, 9.092}),
		Measured:   ptr(Point{20, 7.4}), // (invented)
	}

	for _, tc := range []struct {
		name string
		view any
	}{
		{"kno3-batch.svg", kno3View()},
		{"kno3-seeded-fahrenheit.svg", seeded},
		{"kno3-zoom.svg", zoom},
		{"na2so4-phases-kelvin-comma.svg", glauber},
		{"oxygen.svg", o2},
	} {
		var c Chart
		var err error
		switch v := tc.view.(type) {
		case SolubilityView:
			c, err = Solubility(v)
		case OxygenView:
			c, err = Oxygen(v)
		}
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		svg, err := Render(c)
		if err != nil {
			t.Fatalf("%s: Render: %v", tc.name, err)
		}
		golden(t, tc.name, svg)
	}
	golden(t, "placeholder.svg", Placeholder("Solubility", ErrNoData.Error()))
}

// wellFormed parses svg as XML from start to end and returns the error, so
// that a label cannot break out of its element.
func wellFormed(svg string) error {
	d := xml.NewDecoder(strings.NewReader(svg))
	for {
		_, err := d.Token()
		if err == io.EOF {
			return nil
		}
		if err != nil {
			return err
		}
	}
}

func TestGoldensAreWellFormed(t *testing.T) {
	files, _ := filepath.Glob("testdata/*.svg")
	if len(files) == 0 {
		t.Fatal("no golden files")
	}
	for _, f := range files {
		b, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		if err := wellFormed(string(b)); err != nil {
			t.Errorf("%s: %v", f, err)
		}
	}
}

const evil = `<img src=x onerror=alert(1)>`

func TestEscaping(t *testing.T) {
	c := Chart{
		Title:   evil,
		X:       Axis{Label: evil, Unit: `"&'`},
		Y:       Axis{Label: "y", Unit: evil},
		Series:  []Series{{Label: evil, Points: []Point{{0, 0}, {1, 1}}}},
		Bands:   []Band{{Label: evil, Edge: []Point{{0, 0}, {1, 1}}, Limit: []Point{{0, 0.5}, {1, 1.5}}}},
		Markers: []Marker{{Label: evil, X: 0.5, Y: 0.5}},
		Notes:   []string{evil, "bad bytes \xff\x00\x1b end"},
	}
	svg, err := Render(c)
	if err != nil {
		t.Fatal(err)
	}
	if strings.Contains(svg, "<img") || strings.Contains(svg, "onerror=alert(1)>") {
		t.Errorf("Render let markup through:\n%s", svg)
	}
	if n := strings.Count(svg, "&lt;img src=x onerror=alert(1)&gt;"); n < 7 {
		t.Errorf("escaped label appears %d times, want it in title, aria-label, desc, axes, legend and notes", n)
	}
	if !strings.Contains(svg, "bad bytes \uFFFD\uFFFD\uFFFD end") {
		t.Errorf("invalid UTF-8 and control characters not replaced by U+FFFD")
	}
	if err := wellFormed(svg); err != nil {
		t.Errorf("SVG with hostile labels is not well-formed XML: %v", err)
	}
	p := Placeholder(evil, evil)
	if strings.Contains(p, "<img") || wellFormed(p) != nil {
		t.Errorf("Placeholder let markup through or is malformed:\n%s", p)
	}
	// A custom compound named by a user goes through the builder too.
	v := kno3View()
	v.Title = evil
	v.Phases[0].Form = evil
	ch, err := Solubility(v)
	if err != nil {
		t.Fatal(err)
	}
	svg, err = Render(ch)
	if err != nil {
		t.Fatal(err)
	}
	if strings.Contains(svg, "<img") || wellFormed(svg) != nil {
		t.Errorf("Solubility chart let a compound name through as markup")
	}
}

func TestRefusesNonFinite(t *testing.T) {
	nan, inf := math.NaN(), math.Inf(1)
	line := func(p Point) []Series { return []Series{{Label: "KNO3", Points: []Point{{0, 1}, p}}} }
	for _, tc := range []struct {
		name  string
		c     Chart
		where string
	}{
		{"series y NaN", Chart{Series: line(Point{1, nan})}, `series "KNO3" point 2: y is NaN`},
		{"series x +Inf", Chart{Series: line(Point{inf, 1})}, `series "KNO3" point 2: x is +Inf`},
		{"series x -Inf", Chart{Series: line(Point{-inf, 1})}, `x is -Inf`},
		{"marker", Chart{Markers: []Marker{{Label: "End", X: 1, Y: nan}}}, `marker 1 "End": y is NaN`},
		{"band limit", Chart{Bands: []Band{{Label: "zone", Edge: []Point{{0, 0}}, Limit: []Point{{nan, 0}}}}}, `band "zone" point 1: x is NaN`},
	} {
		svg, err := Render(tc.c)
		var de *DataError
		if !errors.As(err, &de) {
			t.Errorf("%s: Render = %q, %v; want a *DataError", tc.name, svg, err)
			continue
		}
		if svg != "" || !strings.Contains(err.Error(), tc.where) || !strings.Contains(err.Error(), "allowed: finite numbers") {
			t.Errorf("%s: error %q, want it to name %q and what is allowed", tc.name, err, tc.where)
		}
	}
	// Builders refuse as well, before converting units.
	v := kno3View()
	v.Batch.End = Point{4, nan}
	if _, err := Solubility(v); err == nil {
		t.Errorf("Solubility with a NaN end point: no error")
	}
	v = kno3View()
	v.Phases[0].Points = []Point{{0, 13.64}, {inf, 20}}
	if _, err := Solubility(v); err == nil {
		t.Errorf("Solubility with an infinite curve point: no error")
	}
	v = kno3View()
	v.MetastableK = nan
	if _, err := Solubility(v); err == nil {
		t.Errorf("Solubility with a NaN metastable width: no error")
	}
	o := OxygenView{Curve: []Point{{0, 14.6}, {10, nan}}}
	c, err := Oxygen(o)
	if err == nil {
		_, err = Render(c)
	}
	if err == nil {
		t.Errorf("oxygen chart with a NaN saturation drew")
	}
}

func TestNoData(t *testing.T) {
	for _, c := range []Chart{
		{},
		{Title: "empty lines", Series: []Series{{Label: "a"}, {Label: "b"}}},
	} {
		if _, err := Render(c); !errors.Is(err, ErrNoData) {
			t.Errorf("Render(%q) error = %v, want ErrNoData", c.Title, err)
		}
	}
	c, err := Solubility(SolubilityView{})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := Render(c); !errors.Is(err, ErrNoData) {
		t.Errorf("Render(Solubility with no phases) error = %v, want ErrNoData", err)
	}
}

func TestUnknownKinds(t *testing.T) {
	for _, c := range []Chart{
		{Series: []Series{{Points: []Point{{0, 0}}, Kind: Kind(9)}}},
		{Markers: []Marker{{X: 1, Y: 1, Shape: Shape(-1)}}},
	} {
		var de *DataError
		if _, err := Render(c); !errors.As(err, &de) {
			t.Errorf("Render with an unknown kind or shape: %v, want *DataError", err)
		}
	}
	if _, err := Solubility(SolubilityView{Temp: TempUnit(7)}); err == nil {
		t.Errorf("Solubility with an unknown temperature unit: no error")
	}
}

// WCAG 2.1 (W3C Recommendation, 2018), "relative luminance" and "contrast
// ratio" definitions; success criterion 1.4.11 asks 3:1 for graphics, 1.4.3
// asks 4.5:1 for text. We hold every colour to 4.5:1 on white.
func contrastOnWhite(hex string) float64 {
	ch := func(i int) float64 {
		v, _ := strconv.ParseUint(hex[i:i+2], 16, 8)
		c := float64(v) / 255
		if c <= 0.03928 {
			return c / 12.92
		}
		return math.Pow((c+0.055)/1.055, 2.4)
	}
	l := 0.2126*ch(1) + 0.7152*ch(3) + 0.0722*ch(5)
	return 1.05 / (l + 0.05)
}

func TestContrast(t *testing.T) {
	// Check the formula on two known cases: black on white is 21:1 and
	// #767676 is the lightest grey that passes 4.5:1 (WebAIM, from memory).
	if r := contrastOnWhite("#000000"); math.Abs(r-21) > 1e-9 {
		t.Fatalf("contrast of black = %v, want 21", r)
	}
	if r := contrastOnWhite("#767676"); r < 4.5 || r > 4.6 {
		t.Fatalf("contrast of #767676 = %.3f, want just above 4.5", r)
	}
	cols := append(append([]string{ink, grey}, palette[:]...), markerColours[:]...)
	for _, c := range cols {
		if r := contrastOnWhite(c); r < 4.5 {
			t.Errorf("colour %s has contrast %.2f:1 on white, want ≥ 4.5:1", c, r)
		}
	}
}

// Tablet readability: at the natural width of 768 px every font is at least
// 14 px and every data line at least 2 px; no ids, links or external
// resources, so several charts can share a page under a strict CSP.
func TestReadableAndSelfContained(t *testing.T) {
	files, _ := filepath.Glob("testdata/*.svg")
	fontRe := regexp.MustCompile(`font-size="([0-9.]+)"`)
	strokeRe := regexp.MustCompile(`<(?:polyline|line)[^>]*stroke-width="([0-9.]+)"`)
	for _, f := range files {
		b, _ := os.ReadFile(f)
		svg := string(b)
		if !strings.HasPrefix(svg, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 768 `) ||
			!strings.Contains(svg, `width="100%"`) || !strings.Contains(svg, `role="img"`) ||
			!strings.Contains(svg, "<title>") || !strings.Contains(svg, `aria-label="`) {
			t.Errorf("%s: missing viewBox 768, width 100%%, role, title or aria-label", f)
		}
		for _, m := range fontRe.FindAllStringSubmatch(svg, -1) {
			if v, _ := strconv.ParseFloat(m[1], 64); v < 14 {
				t.Errorf("%s: font-size %v < 14", f, v)
			}
		}
		for _, m := range strokeRe.FindAllStringSubmatch(svg, -1) {
			if strings.Contains(m[0], `stroke="#CCCCCC"`) {
				continue // grid
			}
			if v, _ := strconv.ParseFloat(m[1], 64); v < 2 {
				t.Errorf("%s: data line %v px thin", f, v)
			}
		}
		for _, bad := range []string{" id=", "url(", "href", "<script", "@import", "<image", "NaN", "Inf"} {
			if strings.Contains(svg, bad) {
				t.Errorf("%s contains %q", f, bad)
			}
		}
	}
}

// The band lies on the supersaturated side: at lower temperature for a
// curve rising with temperature (KNO3), at higher temperature for a
// retrograde one (anhydrous Na2SO4 above 32.38 °C; CRC Handbook, 98th ed.).
func TestBandSide(t *testing.T) {
	v := SolubilityView{
		Phases:      []Phase{{Form: "KNO3", Points: kno3}, {Form: "Na2SO4", Points: na2so4Anh}},
		MetastableK: 5,
	}
	c, err := Solubility(v)
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Bands) != 2 {
		t.Fatalf("%d bands, want 2", len(c.Bands))
	}
	// KNO3: the limit point at 13.64 + shift is at 5 °C (clipped) ... check
	// that every limit point lies above or on the curve at its temperature.
	for i, b := range c.Bands {
		curve := v.Phases[i].Points
		for _, p := range b.Limit {
			if y := interp(curve, p.X); p.Y < y-1e-9 {
				t.Errorf("band %d: limit point %v lies below the curve (%v): undersaturated side", i, p, y)
			}
		}
		lo, hi := curve[0].X, curve[len(curve)-1].X
		for _, p := range b.Limit {
			if p.X < lo-1e-9 || p.X > hi+1e-9 {
				t.Errorf("band %d: limit point %v outside the curve's range %v..%v", i, p, lo, hi)
			}
		}
	}
}

// The path runs from the dissolve point at constant composition to the
// onset, then on the curve down to the end point, in the reader's units.
func TestPath(t *testing.T) {
	v := kno3View()
	v.Temp = Fahrenheit
	c, err := Solubility(v)
	if err != nil {
		t.Fatal(err)
	}
	var path *Series
	for i := range c.Series {
		if c.Series[i].Kind == Path {
			path = &c.Series[i]
		}
	}
	if path == nil {
		t.Fatal("no path")
	}
	p := path.Points
	// 35 °C = 95 °F and 27.6 °C = 81.68 °F (NIST SP 811, 2008: t/°F = 1.8·t/°C + 32).
	if p[0] != (Point{95, 50}) || !near(p[1].X, 81.68) || p[1].Y != 50 {
		t.Errorf("path starts %v, %v; want (95, 50), (81.68, 50)", p[0], p[1])
	}
	last := p[len(p)-1]
	if !near(last.X, 39.2) || last.Y != 16.3 {
		t.Errorf("path ends %v, want (39.2, 16.3)", last)
	}
	for i := 2; i < len(p); i++ {
		if p[i].X > p[i-1].X+1e-9 {
			t.Errorf("path warms between points %d and %d: %v → %v", i-1, i, p[i-1], p[i])
		}
	}
	// Between onset and end the path follows the tabulated curve: at 20 °C
	// (68 °F) it passes through the CRC value 31.93.
	found := false
	for _, q := range p {
		if near(q.X, 68) && near(q.Y, 31.93) {
			found = true
		}
	}
	if !found {
		t.Errorf("path does not pass through (68 °F, 31.93): %v", p)
	}
}

func TestZoom(t *testing.T) {
	v := kno3View()
	v.Zoom = true
	c, err := Solubility(v)
	if err != nil {
		t.Fatal(err)
	}
	// The batch spans 4–35 °C; a quarter of 31 K is 7.75 K on each side.
	pts := c.Series[0].Points
	if first, last := pts[0], pts[len(pts)-1]; !near(first.X, 0) || !near(last.X, 42.75) {
		t.Errorf("zoomed curve runs %v..%v, want 0..42.75 °C", first.X, last.X)
	}
	// 42.75 °C is interpolated between the CRC points at 40 and 50 °C.
	want := 62.87 + (84.16-62.87)*0.275
	if got := pts[len(pts)-1].Y; !near(got, want) {
		t.Errorf("curve at 42.75 °C = %v, want %v", got, want)
	}
}

func TestSample(t *testing.T) {
	pts, err := Sample(0, 40, 5, func(c float64) (float64, error) { return 2 * c, nil })
	if err != nil || len(pts) != 5 || pts[0] != (Point{0, 0}) || pts[4] != (Point{40, 80}) || pts[2] != (Point{20, 40}) {
		t.Errorf("Sample = %v, %v", pts, err)
	}
	boom := errors.New("beyond the data")
	if pts, err := Sample(0, 40, 60, func(c float64) (float64, error) {
		if c > 30 {
			return 0, boom
		}
		return c, nil
	}); err != boom || pts != nil {
		t.Errorf("Sample with a failing curve = %v, %v; want nil, the curve's error", pts, err)
	}
	if _, err := Sample(0, math.NaN(), 10, nil); err == nil {
		t.Errorf("Sample over a NaN range: no error")
	}
}

func TestDescription(t *testing.T) {
	c, err := Oxygen(OxygenView{
		Curve:        []Point{{0, 14.621}, {40, 6.413}},
		Day:          ptr(Point{20, 9.092}),
		Measured:     ptr(Point{20, 7.4}),
		DecimalComma: true,
	})
	if err != nil {
		t.Fatal(err)
	}
	svg, err := Render(c)
	if err != nil {
		t.Fatal(err)
	}
	i, j := strings.Index(svg, "<desc>"), strings.Index(svg, "</desc>")
	desc := svg[i+6 : j]
	for _, want := range []string{"Water temperature (°C), 0 to 40", "Measured: 7,4 mg/L at 20 °C", "Saturation today: 9,09 mg/L"} {
		if !strings.Contains(desc, want) {
			t.Errorf("desc %q lacks %q", desc, want)
		}
	}
}
