// Command saltcast is the command-line face of Saltcast: the same answers as the app and the
// lab service, as readable text for people at a terminal and as JSON for scripts, QC records
// and tests.
//
//	saltcast plan recipe.json          (or - for standard input)
//	saltcast plan --solute KNO3 --water-g 500 --dissolve-temp-C 60 --cool-to-C 10
//	saltcast prep preparation.json     (or -, or its keys as flags: a solution made up to the mark)
//	saltcast solubility --solute KNO3 --temp-C 20
//	saltcast compounds
//	saltcast gas --temp-C 20           (and gas outgas, gas table)
//	saltcast demo [recipe.json ...]    (plans printed as readable batch sheets)
//	saltcast help [command]            (or command --help; saltcast --version)
//
// Every recipe key has a flag of the same name (water_g is --water-g), taken from the recipe
// table (core/recipe), so the flags cannot fall behind the format. Errors go to standard
// error naming the flag as typed; the exit status is 2 for a usage or input error and 1 when
// Saltcast itself fails.
package main

import (
	"io"
	"os"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/web/api"
)

func main() {
	os.Exit(Run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

// maxRecipeBytes bounds what plan and demo read from a file or standard input; the recipe
// decoder refuses anything past its own 64 KiB limit with a clear message.
const maxRecipeBytes = 1 << 20

// Run runs one saltcast command with args (without the program name) and returns the exit
// status. Tests call it directly.
func Run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		io.WriteString(stderr, topHelp())
		return 2
	}
	switch args[0] {
	case "help", "-h", "--help":
		if len(args) > 1 && (args[1] == "-h" || args[1] == "--help") {
			args = []string{"help", "help"}
		}
		if len(args) == 1 {
			io.WriteString(stdout, topHelp())
			return 0
		}
		c := findCommand(args[1:]...)
		if c == nil {
			io.WriteString(stderr, "saltcast help: "+(&unit.FieldError{Field: "command", Value: strings.Join(args[1:], " "),
				Allowed: commandNames() + ", gas outgas or gas table"}).Error()+"\n")
			return 2
		}
		io.WriteString(stdout, c.help())
		return 0
	case "--version", "version":
		if len(args) == 2 && (args[1] == "-h" || args[1] == "--help") {
			io.WriteString(stdout, findCommand("version").help())
			return 0
		}
		if len(args) > 1 {
			io.WriteString(stderr, "saltcast version: "+(&unit.FieldError{Field: "arguments", Value: strings.Join(args[1:], " "), Allowed: "none"}).Error()+"\n")
			return 2
		}
		io.WriteString(stdout, "saltcast "+Version()+"\n")
		return 0
	}
	words := args[:1]
	if args[0] == "gas" && len(args) > 1 && !strings.HasPrefix(args[1], "-") && args[1] != "help" {
		words = args[:2]
	}
	c := findCommand(words...)
	if c == nil {
		prefix, allowed := "saltcast", commandNames()+" (see saltcast help)"
		if len(words) == 2 {
			prefix, allowed = "saltcast gas", "gas, gas outgas or gas table (see saltcast help gas)"
		}
		io.WriteString(stderr, prefix+": "+(&unit.FieldError{Field: "command", Value: strings.Join(words, " "), Allowed: allowed}).Error()+"\n")
		return 2
	}
	return c.run(args[len(words):], stdin, stdout, stderr)
}

// run parses the command's flags and answers.
func (c *command) run(args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	positional := c.Name == "plan" || c.Name == "prep" || c.Name == "demo"
	flags := c.allFlags()
	fail := func(err error) int {
		io.WriteString(stderr, "saltcast "+c.Name+": "+err.Error()+"\n")
		if api.IsInputError(err) {
			return 2
		}
		return 1
	}
	p, err := parseFlags(flags, args, positional)
	if err != nil {
		return fail(err)
	}
	if p.help {
		io.WriteString(stdout, c.help())
		return 0
	}
	u, err := unitsOf(p)
	if err != nil {
		return fail(err)
	}
	var out []byte
	switch c.Name {
	case "plan", "prep":
		out, err = c.planOrPrep(p, u, stdin, stdout)
	case "solubility":
		out, err = api.Solubility(p.vals)
	case "compounds":
		out = api.Compounds()
	case "gas":
		out, err = api.Gas(p.vals)
	case "gas outgas":
		out, err = api.Outgas(p.vals)
	case "gas table":
		out, err = api.GasTable(p.vals)
		if err == nil && format(p, stdout, "text") == "text" {
			out, err = gasTableText(out)
		}
	case "demo":
		return demo(p.args, u, stdin, stdout, stderr)
	}
	if err != nil {
		if len(p.typed) > 0 {
			err = flagError(err, flags, p)
		}
		return fail(err)
	}
	stdout.Write(out)
	if len(out) == 0 || out[len(out)-1] != '\n' {
		io.WriteString(stdout, "\n")
	}
	return 0
}

// planOrPrep reads the recipe (a file, standard input, or the flags) and answers in the
// format asked.
func (c *command) planOrPrep(p *parsed, u units, stdin io.Reader, stdout io.Writer) ([]byte, error) {
	kind, specs := "recipe", recipe.FieldSpecs
	if c.Name == "prep" {
		kind, specs = "preparation", recipe.PrepFields.Specs()
	}
	var data []byte
	var err error
	switch {
	case len(p.args) > 1:
		return nil, &unit.FieldError{Field: "arguments", Value: strings.Join(p.args, " "), Allowed: "one " + kind + " file, or - for standard input"}
	case len(p.args) == 1:
		if data, err = readRecipe(p.args[0], stdin); err != nil {
			return nil, err
		}
		if len(p.typed) > 0 { // flags change the file's recipe: a what-if
			if c.Name == "prep" {
				data, err = overrideJSON(&recipe.PrepFields, data, p.args[0], p)
			} else {
				data, err = overrideJSON(&recipe.Fields, data, p.args[0], p)
			}
			if err != nil {
				return nil, err
			}
		}
	case len(p.typed) > 0:
		if data, err = tableJSON(specs, p); err != nil {
			return nil, err
		}
	default:
		return nil, &unit.FieldError{Field: "arguments", Value: "", Allowed: "a " + kind + " file, - for standard input, or the " + kind + " as flags (see saltcast " + c.Name + " --help)"}
	}
	def := "text"
	if c.Name == "prep" {
		def = "json"
	}
	switch format(p, stdout, def) {
	case "recipe":
		if c.Name == "prep" {
			pr, err := recipe.DecodePrep(data)
			if err != nil {
				return nil, err
			}
			return recipe.PrepFields.Encode(&pr), nil
		}
		r, err := recipe.Decode(data)
		if err != nil {
			return nil, err
		}
		return recipe.Fields.Encode(&r), nil
	case "text":
		r, err := recipe.Decode(data)
		if err != nil {
			return nil, err
		}
		res, err := recipe.Plan(r)
		if err != nil {
			return nil, err
		}
		return []byte(SheetIn(res, u)), nil
	}
	if c.Name == "prep" {
		return api.Prep(data)
	}
	return api.Plan(data)
}

// format is the --format asked for; without one, def on a terminal and json otherwise (a
// pipe or a file: a script reads it).
func format(p *parsed, stdout io.Writer, def string) string {
	if f, ok := p.opts["format"]; ok {
		return f
	}
	if isTerminal(stdout) {
		return def
	}
	return "json"
}

// isTerminal reports whether w is a terminal (a character device), where people read.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
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
