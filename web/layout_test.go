//go:build browser

package web_test

import (
	"context"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// layoutSizes are the viewports the screens are designed for (CSS px): tablets in both
// orientations (768×1024 and 800×1280 portrait, 1024×768 and 1280×800 landscape) and a
// 390 px wide phone.
var layoutSizes = [][2]int64{{768, 1024}, {800, 1280}, {1024, 768}, {1280, 800}, {390, 844}}

// maxHeaderPx bounds the header on a tablet: one row of 48 px touch targets and its padding.
// On a phone it takes three rows of 44 px targets (name and units, the screens on two rows)
// and scrolls away with the page.
const maxHeaderPx, maxPhoneHeaderPx = 64, 160

// While a technician types in a field deep in the batch form, the charge to weigh and the
// onset temperature stay on screen, uncovered, showing numbers; the field itself is not
// hidden under anything pinned to the top; the header stays one row on a tablet; and the
// amount switch stays one row. At every size above.
func TestResultsInViewWhileTyping(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	for _, size := range layoutSizes {
		name := strconv.FormatInt(size[0], 10) + "x" + strconv.FormatInt(size[1], 10)
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		open(t, ctx, u)
		click(t, ctx, `[data-demo="cuso4"]`)
		head := mustEval[float64](t, ctx, `document.querySelector("header.top").getBoundingClientRect().height`)
		if limit := float64(maxHeaderPx); size[0] < 561 && head > maxPhoneHeaderPx || size[0] >= 561 && head > limit {
			t.Errorf("%s: the header is %.0f px high", name, head)
		}
		// every screen's tab is in view, none scrolled away out of reach
		if hidden := mustEval[[]string](t, ctx, `[...document.querySelectorAll(".screens [data-screen]")].filter(b => {
				const r = b.getBoundingClientRect(), n = b.parentElement.getBoundingClientRect();
				return r.left < n.left - 1 || r.right > n.right + 1 || r.right > innerWidth }).map(b => b.id)`); len(hidden) > 0 {
			t.Errorf("%s: tabs out of view: %v", name, hidden)
		}
		rows := mustEval[int](t, ctx, `new Set([...document.querySelectorAll('#recipe .seg[aria-label="Amount given as"] span')].map(s => Math.round(s.getBoundingClientRect().top))).size`)
		if rows != 1 {
			t.Errorf("%s: the amount switch wraps onto %d rows", name, rows)
		}
		for _, field := range []string{"f-liquor_heat_capacity_kJ_per_kgK", "f-notes", "f-cool_to_C"} {
			for _, block := range []string{"start", "end"} {
				if msg := answerInView(t, ctx, field, block, map[string]string{
					"charge_g":          `[data-strip="charge_g"], #outcome output[data-key="charge_g"]`,
					"saturation_temp_C": `[data-strip="saturation_temp_C"], #outcome output[data-key="saturation_temp_C"]`,
				}); msg != "" {
					t.Errorf("%s, batch, typing in %s scrolled to the %s: %s", name, field, block, msg)
				}
			}
		}
		// The Make up screen: the mass to weigh stays in view while typing its last fields.
		click(t, ctx, "#tab-prep")
		for _, field := range []string{"p-concentration", "p-notes", "p-store_at_C"} {
			for _, block := range []string{"start", "end"} {
				if msg := answerInView(t, ctx, field, block, map[string]string{
					"form_g": `[data-mirror="form_g"] b, #prep-outcome output[data-key="form_g"]`,
				}); msg != "" {
					t.Errorf("%s, make up, typing in %s scrolled to the %s: %s", name, field, block, msg)
				}
			}
		}
		// The Gases screen: the saturation stays in view while typing its last fields.
		click(t, ctx, "#tab-gas")
		for _, field := range []string{"g-salinity", "g-measured_mg_per_L", "g-to_C"} {
			for _, block := range []string{"start", "end"} {
				if msg := answerInView(t, ctx, field, block, map[string]string{
					"saturation_mg_per_L": `[data-mirror="saturation_mg_per_L"] b, #gas-outcome output[data-key="saturation_mg_per_L"]`,
				}); msg != "" {
					t.Errorf("%s, gases, typing in %s scrolled to the %s: %s", name, field, block, msg)
				}
			}
		}
	}
}

// answerInView focuses the field with the given id as a tap does, scrolls it to the start or
// the end of the view (the two places a browser scrolls a field it focuses to), and returns
// why it or one of the answers is not readable: outside the view, covered by something,
// or showing no number. Each answer is found by a selector; any one element of it in view
// and uncovered will do. "" when all is in view.
func answerInView(t *testing.T, ctx context.Context, field, block string, answers map[string]string) string {
	t.Helper()
	var keys, sels []string
	for k, sel := range answers {
		keys = append(keys, strconv.Quote(k))
		sels = append(sels, strconv.Quote(sel))
	}
	return mustEval[string](t, ctx, `(function(){
		const keys = [`+strings.Join(keys, ",")+`], sels = [`+strings.Join(sels, ",")+`];
		const input = document.getElementById("`+field+`");
		if (!input) return "no field";
		input.focus(); input.scrollIntoView({block: "`+block+`"});
		const vw = innerWidth, vh = innerHeight;
		function seen(el) {
			const r = el.getBoundingClientRect();
			if (r.width === 0 || r.height === 0) return "not shown";
			const x = r.left + r.width/2, y = r.top + r.height/2;
			if (x < 0 || x > vw || y < 0 || y > vh) return "outside the view (centre at " + Math.round(x) + "," + Math.round(y) + ")";
			const hit = document.elementFromPoint(x, y);
			if (!hit || !(hit === el || el.contains(hit) || hit.contains(el) && hit.tagName !== "HEADER")) return "covered by " + (hit ? hit.tagName + "." + hit.className : "nothing");
			return "";
		}
		const why = seen(input);
		if (why) return "the field itself is " + why;
		for (let i = 0; i < keys.length; i++) {
			const shown = [...document.querySelectorAll(sels[i])].filter(el => seen(el) === "");
			if (shown.length === 0) return keys[i] + " is not in view";
			if (!/^-?[0-9]/.test(shown[0].textContent.trim())) return keys[i] + " shows " + JSON.stringify(shown[0].textContent);
		}
		return "";
	})()`)
}
