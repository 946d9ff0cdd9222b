//go:build browser && shots

package web_test

import (
	"context"
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"github.com/chromedp/chromedp"

	"saltcast/web/carry"
)

// Screenshots for a person to look at, built only with the shots tag:
// SALTCAST_SHOTS=/tmp/shots go test -tags browser,shots -run Screenshots ./web.
// They check nothing beyond the page starting.

// shotsDir is where the screenshots go ($SALTCAST_SHOTS, required with the shots tag).
func shotsDir(t *testing.T) string {
	t.Helper()
	dir := os.Getenv("SALTCAST_SHOTS")
	if dir == "" {
		t.Fatal("set SALTCAST_SHOTS to a directory to write screenshots")
	}
	return dir
}

// TestScreenshots writes PNGs of every screen at the tablet sizes the app is designed for.
func TestScreenshots(t *testing.T) {
	dir := shotsDir(t)
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	u := appURL(t)
	ctx := tab(t)
	for _, size := range shotSizes {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		open(t, ctx, u)
		click(t, ctx, `[data-demo="cuso4"]`)
		for _, screen := range []string{"batch", "prep", "gas", "box", "sheet", "help"} {
			click(t, ctx, "#tab-"+screen)
			screenMedia(t, ctx)
			png, err := chromedp.Run(ctx, chromedp.CaptureScreenshot())
			if err != nil {
				t.Fatal(err)
			}
			name := screen + "-" + strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10) + ".png"
			if err := os.WriteFile(filepath.Join(dir, name), png, 0o644); err != nil {
				t.Fatal(err)
			}
		}
		if size[0] == 1280 {
			click(t, ctx, "#tab-batch")
			if png, err := chromedp.Run(ctx, chromedp.FullScreenshot(100)); err == nil {
				os.WriteFile(filepath.Join(dir, "batch-full-1280.png"), png, 0o644)
			}
			if err := emulatePrint(ctx); err != nil {
				t.Fatal(err)
			}
			if png, err := chromedp.Run(ctx, chromedp.FullScreenshot(100)); err == nil {
				os.WriteFile(filepath.Join(dir, "print-1280.png"), png, 0o644)
			}
			// Back to the screen: the sizes after this one are pictures of the screen, not of
			// the print view.
			if err := emulateScreen(ctx); err != nil {
				t.Fatal(err)
			}
		}
	}
}

// shotSizes are the viewports the screens are designed for: the two tablet orientations at
// 768×1024 and 800×1280, landscape 1024×768 and 1280×800, and a 390 px wide phone.
var shotSizes = [][2]int64{{768, 1024}, {1024, 768}, {1280, 800}, {800, 1280}, {390, 844}}

// screenMedia fails when the page is rendered for print rather than for the screen: a
// screenshot taken then would show the print view under the name of a screen.
func screenMedia(t *testing.T, ctx context.Context) {
	t.Helper()
	if mustEval[bool](t, ctx, `matchMedia("print").matches || !matchMedia("screen").matches`) {
		t.Fatal("the page is emulating print media: the screenshot would show the print view, not the screen")
	}
}

// TestCarryScreenshots writes PNGs of the screens of a received copy.
func TestCarryScreenshots(t *testing.T) {
	dir := shotsDir(t)
	page, err := os.ReadFile(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		need(t, "dist/saltcast.html is not built")
	}
	ctx := tab(t)
	open(t, ctx, appURL(t))
	resetStorage(t, ctx, appURL(t))
	rs := saveRecipes(t, ctx)
	copyPage, err := carry.WithCarried(page, carry.Carried{AppVersion: "v-shot", SavedAt: "2026-12-01T09:30:00Z",
		SentBy: "Ana (bench 3)", Recipes: rs})
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "copy.html")
	os.WriteFile(path, copyPage, 0o644)
	os.MkdirAll(dir, 0o755)
	for _, size := range [][2]int64{{768, 1024}, {1280, 800}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		open(t, ctx, fileURL(t, path))
		suffix := "-" + strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10) + ".png"
		for _, shot := range []struct{ name, click string }{{"carry-note", ""}, {"carry-box", "#tab-box"}} {
			if shot.click != "" {
				click(t, ctx, shot.click)
				click(t, ctx, "#carry-all")
			}
			png, err := chromedp.Run(ctx, chromedp.FullScreenshot(100))
			if err != nil {
				t.Fatal(err)
			}
			os.WriteFile(filepath.Join(dir, shot.name+suffix), png, 0o644)
		}
	}
}
