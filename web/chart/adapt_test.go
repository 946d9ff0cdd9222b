package chart

import (
	"flag"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/gas"
)

func lookup(t *testing.T, name string) *compound.Compound {
	t.Helper()
	c, _, err := compound.Lookup(name)
	if err != nil {
		t.Fatalf("compound.Lookup(%q): %v", name, err)
	}
	return c
}

// crcTol covers the library's table interpolation and the spread between
// sources at the tabulated temperatures: CRC 98th ed. and the Perry's/Seidell
// values of Wikipedia's "Solubility table" differ by up to 3 % for KNO3 and
// Na2SO4 away from the transition (derived: from the two tables).
const crcTol = 0.03

func TestPhasesFromCompound(t *testing.T) {
	for _, tc := range []struct {
		name  string
		forms []string
		// A tabulated point of the stable phase: CRC Handbook, 98th ed.,
		// "Aqueous Solubility of Inorganic Compounds at Various
		// Temperatures", mass % converted to g/100 g water.
		tempC, g float64
	}{
		{"KNO3", []string{"KNO3"}, 20, 31.93},
		{"Na2SO4", []string{"Na2SO4·10H2O", "Na2SO4"}, 50, 46.09},
		{"MgSO4", []string{"MgSO4·11H2O", "MgSO4·7H2O", "MgSO4·6H2O", "MgSO4·H2O"}, 40, 44.72},
	} {
		c := lookup(t, tc.name)
		ph, err := Phases(c, 101)
		if err != nil {
			t.Fatalf("Phases(%s): %v", tc.name, err)
		}
		if len(ph) != len(tc.forms) {
			t.Fatalf("Phases(%s) gives %d phases, want %v", tc.name, len(ph), tc.forms)
		}
		for i, p := range ph {
			if p.Form != tc.forms[i] {
				t.Errorf("Phases(%s)[%d].Form = %q, want %q", tc.name, i, p.Form, tc.forms[i])
			}
			seg := c.Segments[i]
			if p.Points[0].X != seg.MinC || p.Points[len(p.Points)-1].X != seg.MaxC {
				t.Errorf("Phases(%s)[%d] runs %v..%v, want the segment's %v..%v", tc.name, i,
					p.Points[0].X, p.Points[len(p.Points)-1].X, seg.MinC, seg.MaxC)
			}
		}
		var all []Point
		for _, p := range ph {
			all = append(all, p.Points...)
		}
		if got := interp(all, tc.tempC); math.Abs(got-tc.g) > crcTol*tc.g {
			t.Errorf("%s at %v °C on the chart = %.2f, want %.2f ± %.0f %% (CRC 98th ed.)", tc.name, tc.tempC, got, tc.g, 100*crcTol)
		}
	}
	if _, err := Phases(nil, 60); err != ErrNoData {
		t.Errorf("Phases(nil) error = %v, want ErrNoData", err)
	}
}

// plan is an invented KNO3 batch as the planner reports it: 50 g per 100 g
// water dissolved at 35 °C, saturated near 32.6 °C, a 5 K metastable zone,
// cooled to 4 °C. (invented)
func plan(t *testing.T) *balance.Result {
	return &balance.Result{
		Compound: lookup(t, "KNO3"), SoluteID: "KNO3", SoluteName: "potassium nitrate",
		DissolveTempC: 35, ConcentrationG100: 50,
		HasOnset: true, SaturationTempC: 32.6,
		HasTarget: true, TargetC: 4, LiquorG100: 16.3,
		CrystalsG:     33.7, // (derived: 50 − 16.3 g per 100 g water, anhydrous solid)
		HasMetastable: true, MetastableWidthK: 5, NucleationC: 27.6,
	}
}

func TestBatchFromPlan(t *testing.T) {
	// From the result's fields (no path points).
	r := plan(t)
	b := BatchFromPlan(r)
	if b.Dissolve != (Point{35, 50}) || *b.Saturation != (Point{32.6, 50}) || *b.Onset != (Point{27.6, 50}) ||
		b.End != (Point{4, 16.3}) || b.Seed != nil || b.Settled != nil {
		t.Errorf("BatchFromPlan(fields) = %+v", b)
	}
	// From path points, seeded: crystals start at the seed. Points are matched by kind;
	// the labels are for readers and may say anything.
	r.Path = []balance.PathPoint{
		{Kind: balance.PathDissolve, Label: "end", TempC: 35, G100: 50},
		{Kind: balance.PathOnset, Label: "seed", TempC: 32.6, G100: 50},
		{Kind: balance.PathSeed, Label: "onset", TempC: 31, G100: 50},
		{Kind: balance.PathAdiabaticEnd, Label: "insulated, reworded", TempC: 31.8, G100: 48.6},
		{Kind: balance.PathNucleation, Label: "nucleation", TempC: 27.6, G100: 50},
		{Kind: balance.PathEnd, Label: "dissolve", TempC: 4, G100: 16.3},
		{Kind: "something new", Label: "end", TempC: 99, G100: 99}, // ignored
	}
	b = BatchFromPlan(r)
	if b.Dissolve != (Point{35, 50}) || b.End != (Point{4, 16.3}) || *b.Saturation != (Point{32.6, 50}) ||
		*b.Onset != (Point{31, 50}) || *b.Seed != (Point{31, 50}) || *b.Settled != (Point{31.8, 48.6}) {
		t.Errorf("BatchFromPlan(seeded path) = %+v", b)
	}
	// No onset: the batch stays clear, the path runs straight.
	r = plan(t)
	r.HasOnset, r.TargetC, r.LiquorG100 = false, 33, 50
	b = BatchFromPlan(r)
	if b.Onset != nil || b.Saturation != nil || b.End != (Point{33, 50}) {
		t.Errorf("BatchFromPlan(no onset) = %+v", b)
	}
	// Stored at 33 °C, above its saturation at 32.6 °C: no crystals, so none start, though
	// the saturation point is still marked.
	r = plan(t)
	r.TargetC, r.LiquorG100, r.CrystalsG = 33, 50, 0
	r.Path = []balance.PathPoint{
		{Kind: balance.PathDissolve, Label: "dissolve", TempC: 35, G100: 50},
		{Kind: balance.PathOnset, Label: "onset", TempC: 32.6, G100: 50},
		{Kind: balance.PathEnd, Label: "end", TempC: 33, G100: 50},
	}
	if b = BatchFromPlan(r); b.Onset != nil || b.Saturation == nil || b.End != (Point{33, 50}) {
		t.Errorf("BatchFromPlan(target above saturation) = %+v, want no onset", b)
	}
	// Unseeded, with a metastable zone the path does not reach (target 30 °C, nucleation
	// expected at 27.6 °C): at equilibrium the crystals start at saturation.
	r.TargetC, r.LiquorG100, r.CrystalsG = 30, 45.6, 4.4 // (invented)
	r.Path[2] = balance.PathPoint{Kind: balance.PathEnd, Label: "end", TempC: 30, G100: 45.6}
	if b = BatchFromPlan(r); b.Onset == nil || *b.Onset != (Point{32.6, 50}) {
		t.Errorf("BatchFromPlan(short of nucleation) onset = %v, want saturation at 32.6 °C", b.Onset)
	}
	// No target: dissolved only, nothing crystallizes.
	r = plan(t)
	r.HasTarget, r.CrystalsG = false, 0
	if b = BatchFromPlan(r); b.Onset != nil || b.End != b.Dissolve {
		t.Errorf("BatchFromPlan(no target) = %+v, want no onset and the end at the dissolve point", b)
	}
	r = plan(t)
	r.HasOnset, r.TargetC, r.LiquorG100 = false, 33, 50
	v, err := PlanView(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	c, _ := Solubility(v)
	for _, s := range c.Series {
		if s.Kind == Path && len(s.Points) != 2 {
			t.Errorf("clear batch path = %v, want two points", s.Points)
		}
	}
}

func TestPlanSVG(t *testing.T) {
	r := plan(t)
	svg := SolubilitySVG(nil, r, Options{Zoom: true})
	for _, want := range []string{"Solubility of potassium nitrate, KNO3", "Metastable zone, 5 K wide", "Batch path", "Crystals from 27.6 °C"} {
		if !strings.Contains(svg, want) {
			t.Errorf("plan chart lacks %q", want)
		}
	}
	if err := wellFormed(svg); err != nil {
		t.Error(err)
	}
	// Cooling to −3 °C goes below the data (0 °C): the chart says so.
	r.TargetC = -3
	v, err := PlanView(r, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(v.Notes) != 1 || !strings.Contains(v.Notes[0], "extrapolated") {
		t.Errorf("notes = %q, want a note on extrapolation", v.Notes)
	}
	// A batch with cautions says so on the chart, which may be printed or
	// passed on without the results beside it.
	r.Cautions = []string{"hot liquid (invented)"}
	v, _ = PlanView(r, Options{})
	if !strings.Contains(strings.Join(v.Notes, " "), "SDS") {
		t.Errorf("notes = %q, want a pointer to the cautions and the SDS", v.Notes)
	}
	// The compound alone, before planning, and nothing at all.
	if svg := SolubilitySVG(lookup(t, "Na2SO4"), nil, Options{Temp: Kelvin}); !strings.Contains(svg, "Na2SO4·10H2O") {
		t.Errorf("compound chart lacks the decahydrate")
	}
	if svg := SolubilitySVG(nil, nil, Options{}); !strings.Contains(svg, "nothing to draw") {
		t.Errorf("SolubilitySVG(nil, nil) = %q, want a placeholder", svg)
	}
}

// Oxygen saturation of fresh water at 101.325 kPa by Benson & Krause (1984),
// checked against the values of Standard Methods 4500-O (0 °C 14.621,
// 20 °C 9.092 mg/L; the equation reproduces the printed table to the 3rd
// decimal, from memory).
const doTol = 0.005 // mg/L, against the equation

func TestOxygenView(t *testing.T) {
	day := gas.Conditions{TempC: 20, Salinity: 0, PressureKPa: 101.325}
	measured := 7.4 // (invented)
	v, err := OxygenChartView(day, gas.BensonKrause, &measured, Options{})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(v.Day.Y-9.092) > doTol || v.Day.X != 20 {
		t.Errorf("day's point = %v, want (20, 9.092)", *v.Day)
	}
	if first := v.Curve[0]; first.X != 0 || math.Abs(first.Y-14.621) > doTol {
		t.Errorf("curve starts at %v, want (0, 14.621)", first)
	}
	if last := v.Curve[len(v.Curve)-1]; last.X != 40 {
		t.Errorf("curve ends at %v °C, want 40", last.X)
	}
	// The label names every unit and the method (the one label the app and sheet draw).
	if want := "Saturation at 101.3 kPa, practical salinity 0 (" + gas.BensonKrause + ")"; v.CurveLabel != want {
		t.Errorf("curve label = %q, want %q", v.CurveLabel, want)
	}
	// The chart the gas screen shows for this day, drawn through the adapter.
	golden(t, "oxygen-day.svg", OxygenSVG(day, gas.BensonKrause, &measured, Options{}))
	// 7.4 / 9.092 = 81.4 % of saturation.
	if len(v.Notes) != 1 || !strings.Contains(v.Notes[0], "81.4 % of saturation") {
		t.Errorf("notes = %q, want the measured reading as 81.4 %% of saturation", v.Notes)
	}
	// A warm day beyond the measured range: the curve is widened and says so.
	day.TempC = 45
	v, err = OxygenChartView(day, gas.BensonKrause, nil, Options{Temp: Fahrenheit})
	if err != nil {
		t.Fatal(err)
	}
	if len(v.Notes) != 1 || !strings.Contains(v.Notes[0], "32 to 104 °F the curve is extrapolated") {
		t.Errorf("notes = %q, want the extrapolation note in °F", v.Notes)
	}
	// Refused input becomes a placeholder naming the field.
	day.TempC = 80
	if svg := OxygenSVG(day, gas.BensonKrause, nil, Options{}); !strings.Contains(svg, "temp_C") {
		t.Errorf("OxygenSVG at 80 °C = %q, want a placeholder naming temp_C", svg)
	}
}

// Every library compound, planned by the real planner at invented batches
// (95 % saturated at 80 % of its range, cooled to 20 % of it; then seeded
// 1 K below the saturation temperature), draws a well-formed chart whose
// path never warms on the way down; only the jump may. Batches the planner
// refuses are skipped.
func TestLibraryPlansDraw(t *testing.T) {
	drawn := 0
	for _, c := range compound.All() {
		lo, hi := c.Range()
		b := balance.Batch{
			Compound: c, WaterG: 100,
			DissolveTempC: lo + 0.8*(hi-lo), SaturationPct: 95,
			HasTarget: true, TargetC: lo + 0.2*(hi-lo),
			MetastableWidthK: 4,
		}
		for _, seeded := range []bool{false, true} {
			r, err := balance.Plan(b)
			if err != nil {
				t.Logf("%s (seeded %v): planner refused: %v", c.ID, seeded, err)
				break
			}
			if !seeded && r.HasOnset {
				b.HasSeedAt, b.SeedAtC = true, r.SaturationTempC-1
			}
			v, err := PlanView(&r, Options{Zoom: seeded})
			if err != nil {
				t.Errorf("%s: PlanView: %v", c.ID, err)
				continue
			}
			ch, err := Solubility(v)
			if err != nil {
				t.Errorf("%s: Solubility: %v", c.ID, err)
				continue
			}
			svg, err := Render(ch)
			if err != nil {
				t.Errorf("%s: Render: %v", c.ID, err)
				continue
			}
			if err := wellFormed(svg); err != nil {
				t.Errorf("%s: %v", c.ID, err)
			}
			if *dump != "" {
				name := c.ID
				if seeded {
					name += "-seeded"
				}
				os.WriteFile(filepath.Join(*dump, strings.NewReplacer("(", "", ")", "").Replace(name)+".svg"), []byte(svg), 0o644)
			}
			for _, s := range ch.Series {
				if s.Kind != Path {
					continue
				}
				for i := 1; i < len(s.Points); i++ {
					if s.Points[i].X > s.Points[i-1].X+1e-9 {
						t.Errorf("%s (seeded %v): path warms from %v to %v", c.ID, seeded, s.Points[i-1], s.Points[i])
					}
				}
			}
			drawn++
			if !b.HasSeedAt {
				break
			}
		}
	}
	if drawn == 0 {
		t.Fatal("no library batch was drawn")
	}
}

var dump = flag.String("dump", "", "write the library charts of TestLibraryPlansDraw into this directory, to look at")
