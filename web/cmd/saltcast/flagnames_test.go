package main

import (
	"strings"
	"testing"
)

// The solubility and gas commands take flags, so their errors name the flag the user typed
// (--temp-C), not the key of the JSON query behind it (temp_C).
func TestErrorsNameFlags(t *testing.T) {
	for _, tt := range []struct {
		args []string
		flag string
	}{
		{[]string{"solubility", "--solute", "KNO3", "--temp-C", "500"}, "--temp-C"},
		{[]string{"solubility", "--solute", "KNO3"}, "--temp-C"},
		{[]string{"solubility", "--solute", "no-such-salt", "--temp-C", "20"}, "--solute"},
		{[]string{"gas", "--temp-C", "500"}, "--temp-C"},
	} {
		_, stderr, code := run(t, "", tt.args...)
		if code != 2 {
			t.Errorf("%v: exit %d, want 2", tt.args, code)
		}
		if !strings.Contains(stderr, tt.flag) || strings.Contains(stderr, "temp_C") || strings.Contains(stderr, "the key") {
			t.Errorf("%v: %q, want the flag %s named", tt.args, stderr, tt.flag)
		}
	}
}
