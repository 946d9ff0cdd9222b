//go:build browser && shots

package web_test

import (
	"context"
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// TestRecordScreenshots writes PNGs of the gas screen (the barometer in mmHg, then the
// altitude, then N2, with the field table scrolled under its header) and of the batch sheet in
// print emulation, at a tablet's portrait and a laptop's landscape size and on a phone.
func TestRecordScreenshots(t *testing.T) {
	dir := shotsDir(t)
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	u := appURL(t)
	ctx := tab(t)
	save := func(name string, full bool) {
		t.Helper()
		var png []byte
		var err error
		if full {
			png, err = chromedp.Run(ctx, chromedp.FullScreenshot(100))
		} else {
			png, err = chromedp.Run(ctx, chromedp.CaptureScreenshot())
		}
		if err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, name), png, 0o644); err != nil {
			t.Fatal(err)
		}
	}
	for _, size := range [][2]int64{{768, 1024}, {1280, 800}, {390, 844}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		suffix := "-" + strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10) + ".png"
		open(t, ctx, u)
		click(t, ctx, `[data-demo="cuso4"]`)
		click(t, ctx, "#tab-gas")
		pick(t, ctx, "pressure_unit", "mmHg")
		setField(t, ctx, "gas", "pressure", "745")
		setField(t, ctx, "gas", "measured_mg_per_L", "8.1")
		save("gas-mmhg"+suffix, false)
		pick(t, ctx, "pressure_from", "altitude")
		setField(t, ctx, "gas", "altitude_m", "850")
		pick(t, ctx, "gas", "CO2")
		save("gas-altitude-co2"+suffix, false)
		mustEval[bool](t, ctx, `(function(){const s=document.querySelector("#gas-table").closest(".table-scroll"); s.scrollIntoView(); window.scrollBy(0, -170); s.scrollTop=400; return true})()`)
		save("gas-table-scrolled"+suffix, false)
		click(t, ctx, "#tab-sheet")
		if err := emulatePrint(ctx); err != nil {
			t.Fatal(err)
		}
		save("sheet-print"+suffix, true)
		// The same, a screen at a time: the head and the weighing record, the chart, the end.
		for _, part := range []struct{ name, sel string }{{"head", "#sheet"}, {"chart", "#s-chart"}, {"end", ".sign"}} {
			mustEval[bool](t, ctx, `(function(){const e=document.querySelector("`+part.sel+`"); window.scrollTo(0, e.getBoundingClientRect().top + window.scrollY - (`+strconv.Quote(part.name)+`==="end" ? 500 : 0)); return true})()`)
			save("sheet-print-"+part.name+suffix, false)
		}
		if err := chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: ""})
			return err
		})); err != nil {
			t.Fatal(err)
		}
		save("sheet-screen"+suffix, true)
	}
}
