//go:build browser

package web_test

import (
	"regexp"
	"testing"
)

// The batch sheet prints its date as ISO 8601 (YYYY-MM-DD, ISO 8601-1:2019), which reads the
// same in every country, not the browser's month/day order.
func TestSheetDateIsISO(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	got := mustEval[string](t, ctx, `document.getElementById("s-date").textContent`)
	if !regexp.MustCompile(`^\d{4}-\d{2}-\d{2}$`).MatchString(got) {
		t.Errorf("the sheet's date reads %q, want YYYY-MM-DD", got)
	}
	today := mustEval[string](t, ctx, `(function(){const d=new Date(); return d.getFullYear()*10000+(d.getMonth()+1)*100+d.getDate()})().toString()`)
	if len(got) == 10 && got[:4]+got[5:7]+got[8:] != today {
		t.Errorf("the sheet's date %q is not today (%s)", got, today)
	}
}
