package web_test

import (
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"github.com/chromedp/chromedp"
)

// TestScreenshots writes PNGs of every screen at the tablet sizes the app is designed for,
// for a person to look at: SALTCAST_SHOTS=/tmp/shots go test -run TestScreenshots ./web.
// It checks nothing beyond the page starting.
func TestScreenshots(t *testing.T) {
	dir := os.Getenv("SALTCAST_SHOTS")
	if dir == "" {
		t.Skip("set SALTCAST_SHOTS to a directory to write screenshots")
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	u := appURL(t)
	ctx := tab(t)
	for _, size := range [][2]int64{{768, 1024}, {1024, 768}, {1280, 800}, {800, 1280}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		open(t, ctx, u)
		click(t, ctx, `[data-demo="cuso4"]`)
		for _, screen := range []string{"batch", "prep", "gas", "box", "sheet"} {
			click(t, ctx, "#tab-"+screen)
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
		}
	}
}
