package main

import (
	"testing"

	"saltcast/web/help"
)

// Every result the batch screen, sheet and CSV can show is explained on the Help screen, and
// the Help screen explains no result the page no longer has.
func TestHelpExplainsEveryFigure(t *testing.T) {
	explained := map[string]bool{}
	for _, o := range help.Outputs {
		explained[o.Key] = true
	}
	shown := map[string]bool{}
	for _, f := range Figures {
		shown[f.Key] = true
		if !explained[f.Key] {
			t.Errorf("result %s (%q) has no entry in web/help Outputs", f.Key, f.Label)
		}
	}
	for _, o := range help.Outputs {
		if !shown[o.Key] {
			t.Errorf("web/help explains %s, which the page does not show", o.Key)
		}
	}
}
