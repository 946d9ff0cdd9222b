//go:build browser

package web_test

import (
	"context"
	"math"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/gas"
)

// pick sets a menu or switch of the gas form as a user would (select value or radio button,
// then an input event).
func pick(t *testing.T, ctx context.Context, name, value string) {
	t.Helper()
	js := `(function(){const f=document.getElementById("gas");` +
		`let el=f.querySelector('select[name="` + name + `"]');` +
		`if(el){el.value=` + strconv.Quote(value) + `}else{el=f.querySelector('input[name="` + name + `"][value=` + strconv.Quote(value) + `]'); if(!el) return false; el.checked=true}` +
		`el.dispatchEvent(new Event("input",{bubbles:true})); el.dispatchEvent(new Event("change",{bubbles:true})); return true})()`
	if !mustEval[bool](t, ctx, js) {
		t.Fatalf("no %s = %s in the gas form", name, value)
	}
}

// gasTile is the label of the tile showing the output key.
func gasTile(t *testing.T, ctx context.Context, key string) string {
	t.Helper()
	return mustEval[string](t, ctx, `document.querySelector('#gas-figures [data-key="`+key+`"]').closest(".fig").querySelector(".lbl").textContent`)
}

func gasStale(t *testing.T, ctx context.Context) string {
	t.Helper()
	return mustEval[string](t, ctx, `(function(){const s=document.getElementById("gas-stale"); return s.hidden ? "" : s.textContent})()`)
}

// openGas opens the gas screen in °C with fresh water at 20 °C.
func openGas(t *testing.T) context.Context {
	t.Helper()
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, "#tab-gas")
	mustEval[bool](t, ctx, `document.querySelector('#units [name="unit_temp"]').value="C", document.querySelector('#units [name="unit_temp"]').dispatchEvent(new Event("change",{bubbles:true})), true`)
	setField(t, ctx, "gas", "temp_C", "20")
	setField(t, ctx, "gas", "salinity", "0")
	return ctx
}

// The barometer reading is taken in kPa, hPa, mmHg, inHg or atm, and the page's saturation is
// the core's for that pressure (NIST SP 811 factors, in core/gas). Check value: fresh water at
// 20 °C under 760 mmHg holds 9.09 mg/L of O2 (USGS Office of Water Quality Technical Memorandum
// 2011.03 table and Standard Methods 4500-O table, both after Benson & Krause 1984; from memory).
func TestGasPressureUnits(t *testing.T) {
	ctx := openGas(t)
	for _, tt := range []struct {
		unit, text string
		v          float64
	}{{"mmHg", "760", 760}, {"hPa", "1013,25", 1013.25}, {"inHg", "29.92", 29.92}, {"atm", "0.9", 0.9}, {"kPa", "95", 95}} {
		pick(t, ctx, "pressure_unit", tt.unit)
		setField(t, ctx, "gas", "pressure", tt.text)
		if s := gasStale(t, ctx); s != "" {
			t.Fatalf("%s %s: %s", tt.text, tt.unit, s)
		}
		kPa, err := gas.PressureKPa("pressure", tt.v, tt.unit)
		if err != nil {
			t.Fatal(err)
		}
		want, err := gas.OxygenSaturation(gas.Conditions{TempC: 20, PressureKPa: kPa}, gas.BensonKrause)
		if err != nil {
			t.Fatal(err)
		}
		got := outputNumber(t, ctx, "saturation_mg_per_L")
		if math.Abs(got-want.MgPerL) > shownTol*want.MgPerL {
			t.Errorf("%s %s: saturation %v mg/L, core says %v", tt.text, tt.unit, got, want.MgPerL)
		}
		if tt.unit == "mmHg" && math.Abs(got-9.09) > 0.02 { // the table's last digit and rounding
			t.Errorf("20 °C, 760 mmHg: %v mg/L, the USGS table says 9.09", got)
		}
		// The field table's columns are in the unit typed, around the day's pressure.
		corner := mustEval[string](t, ctx, `document.querySelector("#gas-table thead th").textContent`)
		if !strings.HasSuffix(corner, tt.unit) {
			t.Errorf("field table corner %q, want the unit %s", corner, tt.unit)
		}
		cols := mustEval[string](t, ctx, `Array.from(document.querySelectorAll("#gas-table thead th")).slice(1).map(th=>th.textContent).join(";")`)
		if !strings.Contains(";"+cols+";", ";"+strings.ReplaceAll(tt.text, ",", ".")+";") {
			t.Errorf("field table columns %q (%s) lack the day's %s", cols, tt.unit, tt.text)
		}
	}
}

// The pressure can come from the altitude by the standard atmosphere (U.S. Standard
// Atmosphere, 1976, table I: 89.876 kPa at 1000 m, 79.501 kPa at 2000 m; from memory), and the
// saturation is then the core's at that pressure.
func TestGasAltitude(t *testing.T) {
	ctx := openGas(t)
	pick(t, ctx, "pressure_from", "altitude")
	if mustEval[bool](t, ctx, `document.getElementById("g-altitude-box").hidden || !document.getElementById("g-pressure-box").hidden`) {
		t.Fatal("the altitude switch does not show the altitude instead of the pressure")
	}
	for _, tt := range []struct {
		m, tableKPa float64
	}{{1000, 89.876}, {2000, 79.501}} {
		setField(t, ctx, "gas", "altitude_m", strconv.FormatFloat(tt.m, 'f', -1, 64))
		if s := gasStale(t, ctx); s != "" {
			t.Fatalf("%v m: %s", tt.m, s)
		}
		kPa, err := gas.AltitudeKPa(tt.m)
		if err != nil {
			t.Fatal(err)
		}
		want, _ := gas.OxygenSaturation(gas.Conditions{TempC: 20, PressureKPa: kPa}, gas.BensonKrause)
		if got := outputNumber(t, ctx, "saturation_mg_per_L"); math.Abs(got-want.MgPerL) > shownTol*want.MgPerL {
			t.Errorf("%v m: %v mg/L, core says %v", tt.m, got, want.MgPerL)
		}
		note := mustEval[string](t, ctx, `document.getElementById("g-altitude-kPa").textContent`)
		i := strings.Index(note, ": ")
		j := strings.Index(note, " kPa")
		if i < 0 || j < i {
			t.Fatalf("altitude note %q shows no pressure in kPa", note)
		}
		shown, err := strconv.ParseFloat(note[i+2:j], 64)
		if err != nil || math.Abs(shown-tt.tableKPa) > 0.01 {
			t.Errorf("%v m: the note shows %q, the standard atmosphere table %v kPa", tt.m, note[i+2:j], tt.tableKPa)
		}
	}
	setField(t, ctx, "gas", "altitude_m", "12000")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-g-altitude_m").textContent`); msg == "" {
		t.Error("12 000 m is taken without a word (the model stops at 11 000 m)")
	}
	// Back to the barometer: the bad altitude no longer holds the screen back.
	pick(t, ctx, "pressure_from", "barometer")
	if s := gasStale(t, ctx); s != "" {
		t.Errorf("back on the barometer the screen still says %q", s)
	}
	station := mustEval[string](t, ctx, `document.getElementById("g-station").textContent`)
	for _, w := range []string{"station pressure", "sea level"} {
		if !strings.Contains(station, w) {
			t.Errorf("the pressure note %q does not mention %q", station, w)
		}
	}
}

// Every gas of the core is offered, and each shows what the core computes: N2, Ar and CH4 by
// Henry's law, CO2 by Weiss. Check value for CO2: K0 = 10^-1.47 mol/(L·atm) at 25 °C (pK_H
// 1.47; W. Stumm and J. J. Morgan, Aquatic Chemistry, 3rd ed., 1996, table 4.2; from memory),
// with 420 ppm in air and the water-vapour pressure at 25 °C, 3.169 kPa (CRC Handbook; from
// memory): c = K0·x·(P − p_w).
func TestGasEveryGas(t *testing.T) {
	ctx := openGas(t)
	setField(t, ctx, "gas", "temp_C", "25")
	setField(t, ctx, "gas", "pressure", "101.325")
	for _, g := range gas.All() {
		pick(t, ctx, "gas", g.ID)
		if s := gasStale(t, ctx); s != "" {
			t.Fatalf("%s: %s", g.ID, s)
		}
		c := gas.Conditions{TempC: 25, PressureKPa: gas.StdKPa}
		var want float64
		switch g.ID {
		case "O2":
			o, _ := gas.OxygenSaturation(c, gas.BensonKrause)
			want = o.MgPerL
		case "CO2":
			d, _ := gas.CO2Saturation(c, gas.DefaultCO2PPM)
			want = d.MgPerL
		default:
			d, _ := gas.AirSaturated(g, 25, gas.StdKPa, gas.DefaultCO2PPM)
			want = d.MgPerL
		}
		got := outputNumber(t, ctx, "saturation_mg_per_L")
		if math.Abs(got-want) > shownTol*want {
			t.Errorf("%s: %v mg/L, core says %v", g.ID, got, want)
		}
		if lbl := gasTile(t, ctx, "saturation_mg_per_L"); !strings.HasPrefix(lbl, strings.Map(sub, g.ID)) {
			t.Errorf("%s: the tile reads %q", g.ID, lbl)
		}
		if g.ID == "CO2" {
			const pK, pwAtm = 1.47, 3.169 / 101.325
			table := math.Pow(10, -pK) * 420e-6 * (1 - pwAtm) * 44.0095 * 1000
			if math.Abs(got/table-1) > 0.03 { // pK to two decimals: ±2.3 %
				t.Errorf("CO2 at 25 °C: %v mg/L, from pK_H 1.47 %v", got, table)
			}
		}
	}
	// N2, Ar and CH4 have no salinity correction here: refused, naming the salinity.
	pick(t, ctx, "gas", "N2")
	setField(t, ctx, "gas", "salinity", "35")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-g-salinity").textContent`); !strings.Contains(msg, "0 for N₂") {
		t.Errorf("N2 in sea water: the salinity field says %q", msg)
	}
	pick(t, ctx, "gas", "O2")
	if s := gasStale(t, ctx); s != "" {
		t.Errorf("O2 in sea water refused: %s", s)
	}
}

func sub(r rune) rune {
	if r >= '0' && r <= '9' {
		return '₀' + r - '0'
	}
	return r
}

// Salinity is practical salinity (PSS-78, no unit) wherever the screen names it, and the
// field table keeps its header row in view while its rows scroll.
func TestGasSalinityAndStickyHeader(t *testing.T) {
	ctx := openGas(t)
	label := mustEval[string](t, ctx, `document.querySelector('label[for="g-salinity"]').textContent`)
	caption := mustEval[string](t, ctx, `document.querySelector("#gas-table caption").textContent`)
	for what, s := range map[string]string{"label": label, "field table caption": caption} {
		if !strings.Contains(s, "Practical salinity") {
			t.Errorf("the %s reads %q, not practical salinity", what, s)
		}
	}
	if screen := mustEval[string](t, ctx, `document.getElementById("screen-gas").innerText`); strings.Contains(screen, "g/kg") {
		t.Error("the gas screen still calls salinity g/kg")
	}
	top := mustEval[float64](t, ctx, `(function(){const s=document.querySelector("#gas-table").closest(".table-scroll");`+
		`s.scrollIntoView(); s.scrollTop=600; const h=document.querySelector("#gas-table thead th").getBoundingClientRect();`+
		`return h.top - s.getBoundingClientRect().top})()`)
	if scrolled := mustEval[float64](t, ctx, `document.querySelector("#gas-table").closest(".table-scroll").scrollTop`); scrolled < 100 {
		t.Fatalf("the field table does not scroll within its box (scrollTop %v)", scrolled)
	}
	if math.Abs(top) > 2 {
		t.Errorf("with the rows scrolled, the header row sits %v px from the top of the table's box", top)
	}
}
