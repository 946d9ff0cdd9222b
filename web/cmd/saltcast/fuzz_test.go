package main

import (
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// FuzzPlanFlags reads command lines (words separated by NUL) as plan flags: it never panics,
// refuses bad input with exit status 2 and a message naming a flag or the arguments (never
// 1, Saltcast's own failure), and a recipe it accepts reads back the same as a file.
func FuzzPlanFlags(f *testing.F) {
	for _, seed := range []string{
		"--solute\x00KNO3\x00--water-g\x00500\x00--dissolve-temp-C\x0060",
		"--solute=alum\x00--water-lb\x001,5\x00--dissolve-temp-F\x00140\x00--cool-to-K\x00283.15",
		"--custom-name\x00x\x00--custom-molar-mass-g-per-mol\x00100\x00--custom-points\x0010 1; 20 2; 30 4\x00--water-L\x001\x00--dissolve-temp-C\x0025",
		"--water-g\x005\x00--water-lb\x001",
		"--notes\x00--\x00--solute\x00-",
		"--custom-points\x00;;;\x00--charge-g\x00e5",
		"--bogus",
		"-",
	} {
		f.Add(seed)
	}
	f.Fuzz(func(t *testing.T, line string) {
		args := append([]string{"plan", "--format", "recipe"}, strings.Split(line, "\x00")...)
		out, errs, code := run(t, "", args...)
		switch code {
		case 0:
			if out == findCommand("plan").help() { // --help or -h among the words
				return
			}
			r, err := recipe.Decode([]byte(strings.TrimSuffix(out, "\n")))
			if err != nil {
				t.Fatalf("%q: printed a recipe that does not read back: %v\n%s", args, err, out)
			}
			if again := string(recipe.Fields.Encode(&r)) + "\n"; again != out {
				t.Fatalf("%q: %s reads back as %s", args, out, again)
			}
		case 2:
			if !strings.HasPrefix(errs, "saltcast plan: ") || strings.Count(errs, "\n") != 1 {
				t.Fatalf("%q: message %q", args, errs)
			}
		default:
			t.Fatalf("%q: exit %d, %s", args, code, errs)
		}
	})
}
