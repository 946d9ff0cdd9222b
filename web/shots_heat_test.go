//go:build browser && shots

package web_test

import (
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"github.com/chromedp/chromedp"
)

// TestHeatScreenshots writes the batch screen and the sheet of the three batches above at
// the two tablet sizes, for a person to look at (SALTCAST_SHOTS=/tmp/shots, as
// TestScreenshots). It checks nothing beyond the page starting.
func TestHeatScreenshots(t *testing.T) {
	dir := os.Getenv("SALTCAST_SHOTS")
	if dir == "" {
		t.Skip("set SALTCAST_SHOTS to a directory to write screenshots")
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	u := appURL(t)
	ctx := tab(t)
	for _, size := range [][2]int64{{768, 1024}, {1280, 800}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		for _, b := range []struct{ name, recipe string }{
			{"acetate", `{"format":1,"solute":"CH3COONa","water_g":100,"dissolve_temp_C":70,"seed_at_C":20,"cool_to_C":20}`},
			{"kno3-ice", `{"format":1,"solute":"KNO3","water_g":100,"charge_g":5,"dissolve_temp_C":20,"cool_to_C":-2}`},
			{"dichromate", `{"format":1,"solute":"K2Cr2O7","water_g":100,"dissolve_temp_C":60,"saturation_pct":90,"cool_to_C":20}`},
		} {
			openRecipe(t, ctx, u, b.recipe)
			for _, screen := range []string{"batch", "sheet"} {
				click(t, ctx, "#tab-"+screen)
				var png []byte
				var err error
				if screen == "batch" {
					// The cautions at the top of the results, then the new tiles below them.
					mustEval[bool](t, ctx, `document.getElementById("cautions").scrollIntoView({block: "start"}), true`)
					top, err := chromedp.Run(ctx, chromedp.CaptureScreenshot())
					if err != nil {
						t.Fatal(err)
					}
					name := "heat-" + b.name + "-cautions-" + strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10) + ".png"
					if err := os.WriteFile(filepath.Join(dir, name), top, 0o644); err != nil {
						t.Fatal(err)
					}
					mustEval[bool](t, ctx, `document.getElementById("extra-figures").scrollIntoView({block: "end"}), true`)
					png, err = chromedp.Run(ctx, chromedp.CaptureScreenshot())
				} else {
					png, err = chromedp.Run(ctx, chromedp.FullScreenshot(100))
				}
				if err != nil {
					t.Fatal(err)
				}
				name := "heat-" + b.name + "-" + screen + "-" + strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10) + ".png"
				if err := os.WriteFile(filepath.Join(dir, name), png, 0o644); err != nil {
					t.Fatal(err)
				}
			}
		}
	}
}
