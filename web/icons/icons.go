// Package icons draws Saltcast's home-screen icons as PNG files (web/offline writes them for
// the worker to serve).
//
// The glyph is our own: a conical flask drawn in white on the app's brine colour, a light
// liquor in its lower half and three diamond crystals (the diamond of the page's brand
// mark) settled in it. It is drawn from a few polygons by supersampling (4×4 samples a
// pixel), so the files depend on nothing but this code and the Go standard library.
//
// The icons (web/offline/manifest.webmanifest lists the first three):
//
//	icon-192.png, icon-512.png   purpose "any": rounded square, transparent corners
//	icon-maskable-512.png        purpose "maskable": full bleed, glyph inside the central
//	                             circle of 40 % radius that every mask keeps
//	apple-touch-icon.png         180 px, full bleed (iOS rounds the corners itself)
package icons

import (
	"bytes"
	"image"
	"image/color"
	"image/png"
)

// The app's colours, as in web/app.css (--brine, --brine-ink, --brine-soft).
var (
	brine     = color.NRGBA{0x0c, 0x58, 0x68, 0xff}
	brineInk  = color.NRGBA{0xff, 0xff, 0xff, 0xff}
	brineSoft = color.NRGBA{0xdc, 0xec, 0xef, 0xff}
)

// Icon is one file to write.
type Icon struct {
	Name     string
	Size     int
	Maskable bool // full bleed, glyph shrunk into the safe zone
	Rounded  bool // transparent rounded corners
}

// Icons are the files the manifest and the served page refer to.
var Icons = []Icon{
	{Name: "icon-192.png", Size: 192, Rounded: true},
	{Name: "icon-512.png", Size: 512, Rounded: true},
	{Name: "icon-maskable-512.png", Size: 512, Maskable: true},
	{Name: "apple-touch-icon.png", Size: 180, Maskable: true},
}

// PNG encodes the icon at best compression.
func (ic Icon) PNG() ([]byte, error) {
	var b bytes.Buffer
	enc := png.Encoder{CompressionLevel: png.BestCompression}
	if err := enc.Encode(&b, ic.Draw()); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// pt is a point of the 100 × 100 design grid; y grows downwards as on screen.
type pt struct{ x, y float64 }

// The glyph on the design grid. The outer outline is the white glass; the inner one is
// the inside of the flask (open at the top of the neck); the liquor fills the inside below
// liquorTop; crystals are diamonds |x−cx|/a + |y−cy|/b ≤ 1.
var (
	glass = []pt{{37, 13}, {63, 13}, {63, 21}, {58.5, 21}, {58.5, 39}, {84, 78}, {81, 86},
		{19, 86}, {16, 78}, {41.5, 39}, {41.5, 21}, {37, 21}}
	inside = []pt{{46.5, 8}, {53.5, 8}, {53.5, 41}, {77.5, 77.5}, {76, 80.5},
		{24, 80.5}, {22.5, 77.5}, {46.5, 41}}
	crystals = []struct{ cx, cy, a, b float64 }{
		{36, 72.5, 5, 7.5}, {50.5, 69, 6.5, 10.5}, {64, 73.5, 5, 6.5},
	}
)

const (
	liquorTop   = 57.0 // the liquor's surface on the design grid
	cornerR     = 18.0 // corner radius of the rounded square, design units
	maskScale   = 0.8  // glyph scale on full-bleed icons: its farthest corner stays 37 units from the centre (< 40)
	samplesEdge = 4    // supersampling: 4 × 4 samples a pixel
)

// Draw renders the icon.
func (ic Icon) Draw() *image.NRGBA {
	n := ic.Size
	img := image.NewNRGBA(image.Rect(0, 0, n, n))
	scale := 1.0
	if ic.Maskable {
		scale = maskScale
	}
	step := 100 / float64(n)
	for py := 0; py < n; py++ {
		for px := 0; px < n; px++ {
			// Inside a shape (all four corners alike) one sample is enough; features are
			// several pixels wide even at 180 px, so nothing falls between the corners.
			c0, ok0 := ic.sample(float64(px)*step, float64(py)*step, scale)
			same := true
			for _, d := range [3][2]float64{{1, 0}, {0, 1}, {1, 1}} {
				c, ok := ic.sample((float64(px)+d[0])*step, (float64(py)+d[1])*step, scale)
				same = same && c == c0 && ok == ok0
			}
			if same {
				if ok0 {
					img.SetNRGBA(px, py, c0)
				}
				continue
			}
			var r, g, b, a float64 // premultiplied sums
			for sy := 0; sy < samplesEdge; sy++ {
				for sx := 0; sx < samplesEdge; sx++ {
					x := (float64(px) + (float64(sx)+0.5)/samplesEdge) * step
					y := (float64(py) + (float64(sy)+0.5)/samplesEdge) * step
					c, ok := ic.sample(x, y, scale)
					if !ok {
						continue
					}
					r += float64(c.R)
					g += float64(c.G)
					b += float64(c.B)
					a++
				}
			}
			if a == 0 {
				continue // transparent
			}
			img.SetNRGBA(px, py, color.NRGBA{
				R: uint8(r/a + 0.5), G: uint8(g/a + 0.5), B: uint8(b/a + 0.5),
				A: uint8(a/(samplesEdge*samplesEdge)*255 + 0.5),
			})
		}
	}
	return img
}

// sample gives the colour at (x, y) of the design grid, and false where the icon is
// transparent.
func (ic Icon) sample(x, y, scale float64) (color.NRGBA, bool) {
	if ic.Rounded && !inRoundedSquare(x, y) {
		return color.NRGBA{}, false
	}
	// Undo the glyph's scale about the centre.
	gx, gy := 50+(x-50)/scale, 50+(y-50)/scale
	for _, c := range crystals {
		if abs(gx-c.cx)/c.a+abs(gy-c.cy)/c.b <= 1 {
			return brine, true
		}
	}
	switch {
	case inPolygon(inside, gx, gy):
		if gy >= liquorTop {
			return brineSoft, true
		}
		return brine, true
	case inPolygon(glass, gx, gy):
		return brineInk, true
	}
	return brine, true
}

func inRoundedSquare(x, y float64) bool {
	cx := clamp(x, cornerR, 100-cornerR)
	cy := clamp(y, cornerR, 100-cornerR)
	dx, dy := x-cx, y-cy
	return dx*dx+dy*dy <= cornerR*cornerR
}

// inPolygon is the even–odd rule: a ray to the right crosses the outline an odd number of
// times from inside.
func inPolygon(p []pt, x, y float64) bool {
	in := false
	for i, j := 0, len(p)-1; i < len(p); j, i = i, i+1 {
		a, b := p[i], p[j]
		if (a.y > y) != (b.y > y) && x < (b.x-a.x)*(y-a.y)/(b.y-a.y)+a.x {
			in = !in
		}
	}
	return in
}

func abs(v float64) float64 {
	if v < 0 {
		return -v
	}
	return v
}

func clamp(v, lo, hi float64) float64 {
	return max(lo, min(hi, v))
}
