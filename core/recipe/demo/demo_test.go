package demo

import (
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// Every demo decodes, plans, says it is invented, and encodes back to the same recipe; the
// folder holds no other recipe file.
func TestDemos(t *testing.T) {
	for _, d := range All {
		r, err := Recipe(d.Key)
		if err != nil {
			t.Errorf("%s: %v", d.File, err)
			continue
		}
		if !strings.Contains(r.Name+r.Notes, "(invented)") {
			t.Errorf("%s: neither name nor notes say the batch is invented", d.File)
		}
		if _, err := recipe.Plan(r); err != nil {
			t.Errorf("%s: Plan: %v", d.File, err)
		}
		if again, err := recipe.Decode(r.Encode()); err != nil || string(again.Encode()) != string(r.Encode()) {
			t.Errorf("%s: does not encode back to itself (%v)", d.File, err)
		}
		if byFile, err := Recipe(d.File); err != nil || byFile.Name != r.Name {
			t.Errorf("Recipe(%q) = %q, %v; want the demo %q", d.File, byFile.Name, err, d.Key)
		}
	}
	files, err := filepath.Glob("*.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range files {
		if _, ok := Lookup(f); !ok {
			t.Errorf("%s is in the demo folder but not in All", f)
		}
	}
	for _, d := range All {
		b, err := os.ReadFile(d.File)
		if err != nil || string(b) != string(d.JSON) {
			t.Errorf("%s: the embedded bytes differ from the file (%v)", d.File, err)
		}
	}
	if _, err := Recipe("no-such-demo"); err == nil {
		t.Error(`Recipe("no-such-demo") gave no error`)
	}
	keys := []string{}
	for _, d := range All {
		if slices.Contains(keys, d.Key) {
			t.Errorf("two demos called %q", d.Key)
		}
		keys = append(keys, d.Key)
	}
}

// Each demo preparation decodes and plans, and says it is invented.
func TestPrepsDecodeAndPlan(t *testing.T) {
	for _, d := range Preps {
		p, err := recipe.DecodePrep(d.JSON)
		if err != nil {
			t.Errorf("%s: %v", d.File, err)
			continue
		}
		if _, err := recipe.PlanPrep(p); err != nil {
			t.Errorf("%s: plan: %v", d.File, err)
		}
		if !strings.Contains(p.Name+p.Notes, "(invented)") {
			t.Errorf("%s does not say it is invented", d.File)
		}
		if got, ok := Lookup(d.Key); !ok || got.File != d.File {
			t.Errorf("Lookup(%q) does not find %s", d.Key, d.File)
		}
	}
}
