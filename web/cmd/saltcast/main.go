// Command saltcast is the command-line face of Saltcast: the same answers as the app and the
// lab service, as JSON on standard output, for scripts, QC records and tests.
//
//	saltcast solubility --solute KNO3 --temp-C 20
//	saltcast plan recipe.json          (or - for standard input)
//	saltcast prep preparation.json     (or -: a solution made up to the mark)
//	saltcast compounds
//	saltcast gas --temp-C 20           (see saltcast gas --help)
//	saltcast demo [recipe.json ...]    (plans printed as a readable batch sheet; the
//	                                    built-in invented demos without files)
//
// Errors go to standard error; the exit status is 2 for a usage or input error and 1 when
// Saltcast itself fails.
package main

import (
	"errors"
	"io"
	"os"
	"regexp"
	"strings"

	"saltcast/core/unit"
	"saltcast/web/api"
)

func main() {
	os.Exit(Run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

const usage = `saltcast: crystallization and solubility planning

  saltcast solubility --solute KNO3 --temp-C 20
      solubility of a library compound (g anhydrous per 100 g water) and its stable solid, as JSON
  saltcast plan recipe.json        (or "-" to read the recipe from standard input)
      the plan of one batch recipe, as JSON
  saltcast prep preparation.json   (or "-" to read it from standard input)
      a solution made up to the mark (or diluted from a stock): what to weigh, the water,
      the concentration in every unit and the lowest storage temperature, as JSON
  saltcast compounds
      the compound library, as JSON
  saltcast gas ...
      dissolved gases (saltcast gas --help)
  saltcast demo [recipe.json ...]
      plans of one or more recipes printed as readable batch sheets (without files: the
      invented demo recipes built in)

Numbers accept a decimal comma (12,5). Errors go to standard error with exit status 2.
Saltcast is a planning aid, not a safety assessment: read the SDS and follow local rules.
`

// maxRecipeBytes bounds what plan and demo read from a file or standard input; the recipe
// decoder refuses anything past its own 64 KiB limit with a clear message.
const maxRecipeBytes = 1 << 20

// Run runs one saltcast command with args (without the program name) and returns the exit
// status. Tests call it directly.
func Run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		io.WriteString(stderr, usage)
		return 2
	}
	cmd, rest := args[0], args[1:]
	fail := func(err error) int {
		io.WriteString(stderr, "saltcast "+cmd+": "+err.Error()+"\n")
		if api.IsInputError(err) {
			return 2
		}
		return 1
	}
	var out []byte
	var err error
	switch cmd {
	case "help", "-h", "--help":
		io.WriteString(stdout, usage)
		return 0
	case "solubility":
		p, help, ferr := flags(rest, "e.g. --temp-C 20")
		if help {
			io.WriteString(stdout, usage)
			return 0
		}
		if ferr != nil {
			return fail(ferr)
		}
		out, err = api.Solubility(p)
		err = asFlags(err)
	case "plan":
		if len(rest) != 1 {
			return fail(&unit.FieldError{Field: "arguments", Value: strings.Join(rest, " "), Allowed: "one recipe file, or - for standard input"})
		}
		data, rerr := readRecipe(rest[0], stdin)
		if rerr != nil {
			return fail(rerr)
		}
		out, err = api.Plan(data)
	case "prep":
		if len(rest) != 1 {
			return fail(&unit.FieldError{Field: "arguments", Value: strings.Join(rest, " "), Allowed: "one preparation file, or - for standard input"})
		}
		data, rerr := readRecipe(rest[0], stdin)
		if rerr != nil {
			return fail(rerr)
		}
		out, err = api.Prep(data)
	case "compounds":
		if len(rest) != 0 {
			return fail(&unit.FieldError{Field: "arguments", Value: strings.Join(rest, " "), Allowed: "none"})
		}
		out = api.Compounds()
	case "gas":
		return runGas(rest, stdout, stderr)
	case "demo":
		return demo(rest, stdin, stdout, stderr)
	default:
		return fail(&unit.FieldError{Field: "command", Value: cmd, Allowed: "solubility, plan, prep, compounds, gas, demo or help"})
	}
	if err != nil {
		return fail(err)
	}
	stdout.Write(out)
	io.WriteString(stdout, "\n")
	return 0
}

// asFlags words an error about a query key as the flag the user typed: temp_C is --temp-C,
// in the field and in what is allowed ("one of the flags: --solute, --temp-C"; "above
// --from-C"), and a required key is a required flag. Other errors pass unchanged.
func asFlags(err error) error {
	var fe *unit.FieldError
	if !errors.As(err, &fe) || fe.Field == "" || strings.ContainsAny(fe.Field, " .[") ||
		fe.Field == "command" || fe.Field == "arguments" || fe.Field == "file" {
		return err
	}
	allowed := strings.ReplaceAll(fe.Allowed, "(the key is required)", "(the flag is required)")
	allowed = strings.ReplaceAll(allowed, "one of the keys: ", "one of the flags: ")
	if strings.Contains(allowed, "one of the flags: ") {
		head, list, _ := strings.Cut(allowed, "one of the flags: ")
		keys := strings.Split(list, ", ")
		for i, k := range keys {
			keys[i] = flagName(k)
		}
		allowed = head + "one of the flags: " + strings.Join(keys, ", ")
	}
	allowed = keyWord.ReplaceAllStringFunc(allowed, flagName)
	return &unit.FieldError{Field: flagName(fe.Field), Value: fe.Value, Allowed: allowed}
}

// keyWord matches a query key inside a sentence (from_C, pressure_kPa).
var keyWord = regexp.MustCompile(`\b[a-z][a-z0-9]*(_[A-Za-z0-9]+)+\b`)

// flagName is the flag of query key k: temp_C is --temp-C.
func flagName(k string) string {
	if strings.HasPrefix(k, "--") {
		return k
	}
	return "--" + strings.ReplaceAll(k, "_", "-")
}

// readRecipe reads a recipe file, or standard input for "-".
func readRecipe(name string, stdin io.Reader) ([]byte, error) {
	var r io.Reader = stdin
	if name != "-" {
		f, err := os.Open(name)
		if err != nil {
			return nil, &unit.FieldError{Field: "file", Value: name, Allowed: "a readable recipe file (" + errText(err) + ")"}
		}
		defer f.Close()
		r = f
	}
	data, err := io.ReadAll(io.LimitReader(r, maxRecipeBytes+1))
	if err != nil {
		return nil, &unit.FieldError{Field: "file", Value: name, Allowed: "a readable recipe file (" + errText(err) + ")"}
	}
	if len(data) > maxRecipeBytes {
		return nil, &unit.FieldError{Field: "file", Value: name, Allowed: "a recipe file of at most 1 MiB"}
	}
	return data, nil
}

// errText is the part of an *os.PathError worth showing ("no such file or directory").
func errText(err error) string {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err.Error()
	}
	return err.Error()
}

// flags turns "--temp-C 20" and "--temp-C=20" into Params{"temp_C": "20"}. A flag given
// twice, a flag without a value and a word that is not a flag are usage errors; example is
// shown in the message for the last.
func flags(args []string, example string) (p api.Params, help bool, err error) {
	p = api.Params{}
	for i := 0; i < len(args); i++ {
		a := args[i]
		if a == "-h" || a == "--help" || a == "help" {
			return nil, true, nil
		}
		if !strings.HasPrefix(a, "--") || len(a) == 2 {
			return nil, false, &unit.FieldError{Field: "arguments", Value: a, Allowed: "flags written --name value, " + example}
		}
		name, value, hasValue := strings.Cut(a[2:], "=")
		if !hasValue {
			if i+1 >= len(args) {
				return nil, false, &unit.FieldError{Field: name, Value: "", Allowed: "a value after --" + name}
			}
			i++
			value = args[i]
		}
		key := strings.ReplaceAll(name, "-", "_")
		if _, dup := p[key]; dup {
			return nil, false, &unit.FieldError{Field: key, Value: value, Allowed: "each flag once"}
		}
		p[key] = value
	}
	return p, false, nil
}
