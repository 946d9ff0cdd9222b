package icons

import (
	"bytes"
	"image"
	"image/png"
	"math"
	"os"
	"strconv"
	"testing"

	"saltcast/core/wire"
)

// The icons decode, have their size, and are the same bytes on every build.
func TestIconsEncode(t *testing.T) {
	for _, ic := range Icons {
		a, err := ic.PNG()
		if err != nil {
			t.Fatal(err)
		}
		b, _ := ic.PNG()
		if !bytes.Equal(a, b) {
			t.Errorf("%s: two builds differ", ic.Name)
		}
		img, err := png.Decode(bytes.NewReader(a))
		if err != nil {
			t.Fatalf("%s: %v", ic.Name, err)
		}
		if got := img.Bounds().Size(); got != image.Pt(ic.Size, ic.Size) {
			t.Errorf("%s: size %v, want %d square", ic.Name, got, ic.Size)
		}
	}
}

// Rounded icons have transparent corners and an opaque middle; full-bleed icons are opaque
// everywhere, and everything but the background lies in the safe zone: the central circle
// of radius 40 % of the icon's width that every platform mask keeps (W3C, Web Application
// Manifest, "Icon masks" / purpose "maskable", from memory).
func TestIconShapes(t *testing.T) {
	for _, ic := range Icons {
		img := ic.Draw()
		n := ic.Size
		if ic.Rounded {
			if a := img.NRGBAAt(0, 0).A; a != 0 {
				t.Errorf("%s: corner alpha %d, want 0", ic.Name, a)
			}
		}
		for y := 0; y < n; y++ {
			for x := 0; x < n; x++ {
				c := img.NRGBAAt(x, y)
				if ic.Rounded && x > n/5 && x < 4*n/5 && c.A != 255 {
					t.Fatalf("%s: (%d,%d) alpha %d inside the square", ic.Name, x, y, c.A)
				}
				if !ic.Maskable {
					continue
				}
				if c.A != 255 {
					t.Fatalf("%s: (%d,%d) alpha %d; a full-bleed icon is opaque", ic.Name, x, y, c.A)
				}
				r := math.Hypot(float64(x)+0.5-float64(n)/2, float64(y)+0.5-float64(n)/2)
				if c != brine && r > 0.4*float64(n) {
					t.Fatalf("%s: glyph pixel %v at (%d,%d), %.1f px from the centre, outside the safe zone (%.1f)",
						ic.Name, c, x, y, r, 0.4*float64(n))
				}
			}
		}
	}
}

// The glass must stand out from the background for people with low vision: WCAG 2.1
// success criterion 1.4.11 asks 3:1 for graphical objects; contrast ratio and relative
// luminance as defined in WCAG 2.1 ("contrast ratio", "relative luminance").
func TestIconContrast(t *testing.T) {
	lum := func(c [3]uint8) float64 {
		var l [3]float64
		for i, v := range c {
			s := float64(v) / 255
			if s <= 0.03928 {
				l[i] = s / 12.92
			} else {
				l[i] = math.Pow((s+0.055)/1.055, 2.4)
			}
		}
		return 0.2126*l[0] + 0.7152*l[1] + 0.0722*l[2]
	}
	ratio := func(a, b [3]uint8) float64 {
		la, lb := lum(a), lum(b)
		return (max(la, lb) + 0.05) / (min(la, lb) + 0.05)
	}
	bg := [3]uint8{brine.R, brine.G, brine.B}
	for name, c := range map[string][3]uint8{
		"glass":  {brineInk.R, brineInk.G, brineInk.B},
		"liquor": {brineSoft.R, brineSoft.G, brineSoft.B},
	} {
		if r := ratio(bg, c); r < 3 {
			t.Errorf("%s on the background: contrast %.2f:1, want ≥ 3:1", name, r)
		}
	}
	// A check of the formula itself: black on white is 21:1 (WCAG 2.1, "contrast ratio").
	if r := ratio([3]uint8{0, 0, 0}, [3]uint8{255, 255, 255}); math.Abs(r-21) > 1e-9 {
		t.Errorf("contrast of black on white = %v, want 21", r)
	}
}

// The manifest lists exactly the icons this program draws for it, with their sizes.
func TestManifestIcons(t *testing.T) {
	b, err := os.ReadFile("../offline/manifest.webmanifest")
	if err != nil {
		t.Fatal(err)
	}
	v, err := wire.Decode(b)
	if err != nil {
		t.Fatalf("manifest is not strict JSON: %v", err)
	}
	for _, k := range []string{"name", "short_name", "start_url", "scope", "display", "icons", "theme_color", "background_color"} {
		if _, ok := v.Get(k); !ok {
			t.Errorf("manifest has no %q", k)
		}
	}
	list, _ := v.Get("icons")
	drawn := map[string]Icon{}
	for _, ic := range Icons {
		drawn["/icons/"+ic.Name] = ic
	}
	maskable := false
	for _, it := range list.Items {
		src, _ := it.Get("src")
		sizes, _ := it.Get("sizes")
		purpose, _ := it.Get("purpose")
		ic, ok := drawn[src.Text]
		if !ok {
			t.Errorf("manifest lists %s, which is not drawn", src.Text)
			continue
		}
		if want := strconv.Itoa(ic.Size) + "x" + strconv.Itoa(ic.Size); sizes.Text != want {
			t.Errorf("%s: sizes %q, want %q", src.Text, sizes.Text, want)
		}
		if (purpose.Text == "maskable") != ic.Maskable {
			t.Errorf("%s: purpose %q but drawn maskable=%v", src.Text, purpose.Text, ic.Maskable)
		}
		maskable = maskable || ic.Maskable
	}
	if !maskable {
		t.Error("manifest lists no maskable icon")
	}
}

func BenchmarkDraw512(b *testing.B) {
	var sink *image.NRGBA
	for b.Loop() {
		sink = Icons[1].Draw()
	}
	_ = sink
}
