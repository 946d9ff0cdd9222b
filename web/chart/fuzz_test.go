package chart

import (
	"fmt"
	"math"
	"strings"
	"testing"
	"time"
)

var noNI = strings.NewReplacer("N", "n", "I", "i")

// FuzzRender holds two properties for any labels and numbers: Render never
// panics, and it either refuses with an error or returns a well-formed SVG
// in which no label opens an element.
func FuzzRender(f *testing.F) {
	f.Add("KNO3", 0.0, 13.64, 100.0, 242.5, 35.0, 50.0, uint8(0))
	f.Add(evil, -40.0, 0.0, -40.0, 0.0, -40.0, 0.0, uint8(3))
	f.Add("\xff\x00]]>&amp;", 1e300, -1e300, 1e-300, 5e-324, 0.0, 0.0, uint8(7))
	f.Add("Na2SO4·10H2O", 32.38, 49.7, 32.38, 49.7, math.NaN(), 1.0, uint8(2))
	f.Fuzz(func(t *testing.T, label string, x0, y0, x1, y1, mx, my float64, k uint8) {
		// The label carries no capital N or I, so "NaN" or "Inf" in the SVG can only be a
		// number the chart wrote (a label "…NaNO3" once read as one). Bytes are replaced one
		// for one, so invalid UTF-8 stays as it was.
		label = noNI.Replace(label)
		c := Chart{
			Title:   label,
			X:       Axis{Label: label, Unit: "°C"},
			Y:       Axis{Label: label, Unit: label, FromZero: k&1 == 1},
			Series:  []Series{{Label: label, Points: []Point{{x0, y0}, {x1, y1}}, Kind: Kind(k % 4)}},
			Bands:   []Band{{Label: label, Edge: []Point{{x0, y0}, {x1, y1}}, Limit: []Point{{x0 - 1, y0}, {x1 - 1, y1}}}},
			Markers: []Marker{{Label: label, X: mx, Y: my, Shape: Shape(k % uint8(numShapes))}},
			Notes:   []string{label},
		}
		done := make(chan struct{})
		defer close(done)
		go func() {
			select {
			case <-done:
			case <-time.After(5 * time.Second):
				panic(fmt.Sprintf("slow input: %q %v %v %v %v %v %v %v", label, x0, y0, x1, y1, mx, my, k))
			}
		}()
		svg, err := Render(c)
		if err != nil {
			if svg != "" {
				t.Fatalf("Render returned both an SVG and %v", err)
			}
			return
		}
		if err := wellFormed(svg); err != nil {
			t.Fatalf("not well-formed: %v\n%s", err, svg)
		}
		if strings.Contains(svg, "NaN") || strings.Contains(svg, "Inf") {
			t.Fatalf("non-finite number in the SVG:\n%s", svg)
		}
	})
}
