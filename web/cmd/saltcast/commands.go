package main

import (
	"strings"
	"unicode/utf8"

	"saltcast/core/gas"
	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// A command is one subcommand: what --help prints about it and the flags it reads.
type command struct {
	Name     string   // "plan", "gas outgas"
	Summary  string   // one line for the list of commands
	Usage    []string // usage lines, without "saltcast "
	About    string   // what it does, in a technician's words
	Flags    []flagSpec
	Options  []flagSpec // options of the output (--format, units): no request key
	Examples []string   // command lines, without "saltcast "
}

// Options shared by the commands that print a plan.
var (
	formatOpt = func(help string, choices ...string) flagSpec {
		return flagSpec{Name: "format", Arg: strings.Join(choices, "|"), Choices: choices,
			Default: "text on a terminal, json when the output goes to a file or a pipe", Help: help}
	}
	unitOpts = []flagSpec{
		{Name: "temp-unit", Arg: "C|F|K", Choices: []string{"C", "F", "K"}, Default: "C",
			Help: "temperatures in the text sheet (temperature differences follow: K, or °F degrees)"},
		{Name: "mass-unit", Arg: "g|kg|lb", Choices: []string{"g", "kg", "lb"}, Default: "g",
			Help: "masses in the text sheet (lb: avoirdupois pound)"},
		{Name: "volume-unit", Arg: "mL|L|gal", Choices: []string{"mL", "L", "gal"}, Default: "mL",
			Help: "volumes in the text sheet (gal: US liquid gallon)"},
	}
	pressureFlags = []flagSpec{
		{Key: "pressure_kPa", Name: "pressure-kPa", Arg: "P", Unit: "kPa", Default: "101.325 (one standard atmosphere)",
			Help: "air pressure at the water, as a barometer on site reads it (station pressure, not the sea-level value of a weather report)"},
		{Key: "pressure", Name: "pressure", Arg: "P", Unit: "the unit of --pressure-unit",
			Help: "the same pressure in another unit, with --pressure-unit"},
		{Key: "pressure_unit", Name: "pressure-unit", Arg: "U", Default: "kPa",
			Help: "kPa, hPa, mbar, mmHg, Torr, inHg or atm"},
		{Key: "altitude_m", Name: "altitude-m", Arg: "H", Unit: "m above sea level",
			Help: "instead of a pressure: the standard atmosphere at this altitude (a rough figure; a barometer reading is better)"},
	}
)

var recipeFlags = withDefaults(tableFlags(recipe.FieldSpecs), map[string]string{
	// What the recipe's cross-key check requires (recipe.checkCombination), per flag.
	"solute":   "required, or your own compound (--custom-name, --custom-molar-mass-g-per-mol, --custom-points)",
	"water_g":  "required, or --water-mL",
	"water_mL": "required, or --water-g",
})

// withDefaults sets the Default shown for the flags of the keys in d.
func withDefaults(fs []flagSpec, d map[string]string) []flagSpec {
	for i := range fs {
		if text, ok := d[fs[i].Key]; ok {
			fs[i].Default = text
		}
	}
	return fs
}

var prepFlags = tableFlags(recipe.PrepFields.Specs())

var commands = []*command{
	{
		Name:    "plan",
		Summary: "plan one batch: what to weigh, where crystals start, what you collect, the heat",
		Usage: []string{
			"plan RECIPE.json [--format text|json] [--temp-unit C|F|K] [--mass-unit g|kg|lb]",
			"plan - < RECIPE.json",
			"plan RECIPE.json --cool-to-C 5 [other recipe flags]     (the file's recipe, changed by the flags)",
			"plan --solute NAME --water-g MASS --dissolve-temp-C T [more recipe flags] [--format text|json|recipe]",
		},
		About: `Plans one batch: how much of the solid on the shelf to weigh into the water, below which
temperature crystals start to form, how much solid (and which hydrate) you collect at the
filtration temperature, the mother liquor left, the heat on dissolving and the cooling
needed, with the cautions first. Give a recipe file (the app's export or one you wrote), or
give the recipe as flags: every recipe key has a flag of the same name (water_g is
--water-g). A temperature flag ending in -C also takes -F or -K, a mass ending in -g also
-kg or -lb, a volume ending in -mL also -L or -gal: the flag's name always says the unit.
A file and flags together: the flags change the file's recipe (a flag of another choice, such
as --charge-g over a file's saturation_pct, replaces that choice). --format recipe prints the
recipe the flags make, to keep as a file. Required: --solute (or
your own compound, --custom-…), the water (--water-g or --water-mL) and --dissolve-temp-C;
without --saturation-pct, --charge-g or --clear-down-to-C the charge saturates the water.`,
		Flags: recipeFlags,
		Options: append([]flagSpec{formatOpt("text: a readable batch sheet, cautions first; json: the plan for scripts (every key always there); "+
			"recipe: the recipe the flags make, as a file to keep", "text", "json", "recipe")}, unitOpts...),
		Examples: []string{
			"plan --solute KNO3 --water-g 500 --dissolve-temp-C 60 --saturation-pct 90 --cool-to-C 10",
			"plan --solute CuSO4 --charged-form CuSO4·5H2O --water-lb 2 --dissolve-temp-F 140 --cool-to-F 68 --temp-unit F --mass-unit lb",
			"plan recipe.json --cool-to-C 5 --cooling-time-min 120",
			"plan recipe.json --format json > plan.json",
		},
	},
	{
		Name:    "prep",
		Summary: "make up a solution to the mark (or dilute a stock): what to weigh, the water, storage",
		Usage: []string{
			"prep PREPARATION.json [preparation flags that change it]",
			"prep - < PREPARATION.json",
			"prep --solute NAME --concentration X --concentration-unit U --final-volume-mL VOLUME [more flags] [--format json|recipe]",
		},
		About: `Works out a solution made up to the mark, or diluted from a stock of the same solute: what
to weigh (or measure from the stock), the water, the concentration in every unit, and the
lowest temperature it can be stored at without crystals or ice. As JSON. Give a
preparation file, or its keys as flags of the same name (final_volume_mL is
--final-volume-mL; a volume also takes -L or -gal, a mass -kg or -lb, a temperature -F or -K).`,
		Flags: prepFlags,
		Options: []flagSpec{{Name: "format", Arg: "json|recipe", Choices: []string{"json", "recipe"}, Default: "json",
			Help: "json: the worked preparation; recipe: the preparation the flags make, to keep as a file"}},
		Examples: []string{
			`prep --solute NaCl --concentration 0.5 --concentration-unit mol/L --final-volume-L 1 --stock-concentration 5 --stock-unit mol/L --store-at-C 4`,
		},
	},
	{
		Name:    "solubility",
		Summary: "how much of a compound dissolves at one temperature, and the solid it is in balance with",
		Usage:   []string{"solubility --solute NAME --temp-C T"},
		About: `Looks up the saturation of a library compound at one temperature: grams of anhydrous solute
per 100 g of water, the same in other units, the solid in equilibrium there (which hydrate),
the range of the data and its source. As JSON. Up to 5 K outside the data it answers with a
warning; further out it refuses.`,
		Flags: []flagSpec{
			{Key: "solute", Name: "solute", Arg: "NAME", Default: "required",
				Help: `compound id (KNO3), hydrate formula (Na2SO4·10H2O, also with . or *) or common name ("Glauber's salt")`},
			{Key: "temp_C", Name: "temp-C", Kind: recipe.Temp, Arg: "T", Unit: "°C", Default: "required",
				Help: "the temperature of the solution"},
		},
		Examples: []string{"solubility --solute KNO3 --temp-C 20", `solubility --solute "potassium alum" --temp-F 68`},
	},
	{
		Name:    "compounds",
		Summary: "the compound library, as JSON",
		Usage:   []string{"compounds"},
		About: `Lists every compound Saltcast knows: names, molar masses, the forms (anhydrous and hydrates)
with their enthalpies of solution, the stable solid in each temperature range, the range of
the data, and the hazard note. As JSON.`,
		Examples: []string{"compounds > library.json"},
	},
	{
		Name:    "gas",
		Summary: "saturation of a dissolved gas (O2, N2, Ar, CO2, CH4) from the air",
		Usage:   []string{"gas [--gas O2] --temp-C T [--salinity S] [--pressure-kPa P | --pressure P --pressure-unit U | --altitude-m H]"},
		About: `How much of a gas water holds when it is in balance with the air at this temperature,
salinity and pressure (water-saturated air). O2 by Benson & Krause 1984 (or Garcia & Gordon
1992), CO2 by Weiss 1974, the others by Henry's law. With a meter reading
(--measured-mg-per-L) it adds the percent saturation. As JSON. See also "gas outgas" and
"gas table".`,
		Flags: append([]flagSpec{
			{Key: "gas", Name: "gas", Arg: "O2|N2|Ar|CO2|CH4", Default: "O2", Help: "the gas"},
			{Key: "temp_C", Name: "temp-C", Kind: recipe.Temp, Arg: "T", Unit: "°C", Default: "required", Help: "water temperature"},
			{Key: "salinity", Name: "salinity", Arg: "S", Unit: "practical salinity (about g/kg)", Default: "0 (fresh water)",
				Help: "practical salinity, 0 to 40; sea water is about 35"},
		}, append(pressureFlags[:len(pressureFlags):len(pressureFlags)],
			flagSpec{Key: "method", Name: "method", Arg: "benson-krause|garcia-gordon", Default: "benson-krause", Help: "the O2 equation (O2 only)"},
			flagSpec{Key: "measured_mg_per_L", Name: "measured-mg-per-L", Arg: "X", Unit: "mg/L", Help: "a meter reading: adds percent_saturation"},
			flagSpec{Key: "co2_ppm", Name: "co2-ppm", Arg: "C", Unit: "µmol/mol in dry air", Default: unit.FormatCompact(gas.DefaultCO2PPM, 6), Help: "CO2 in the air (CO2 only)"},
		)...),
		Examples: []string{
			"gas --temp-C 20 --measured-mg-per-L 8.1",
			"gas --temp-C 20 --pressure 29.5 --pressure-unit inHg",
			"gas --gas CO2 --temp-C 15 --salinity 35 --co2-ppm 425",
		},
	},
	{
		Name:    "gas outgas",
		Summary: "gas released when air-saturated water is heated, and where bubbles can form",
		Usage:   []string{"gas outgas --from-C T1 --to-C T2 [--pressure-kPa P] [--heat-pressure-kPa P2] [--co2-ppm C]"},
		About: `Air-saturated water heated from one temperature to another holds less gas: this gives the
O2, N2, Ar and CO2 driven out per litre (as gas at the heating temperature and at STP) and
the temperature at which bubbles can first form. Fresh water only. As JSON.`,
		Flags: append([]flagSpec{
			{Key: "from_C", Name: "from-C", Kind: recipe.Temp, Arg: "T1", Unit: "°C", Default: "required", Help: "temperature the water was saturated at"},
			{Key: "to_C", Name: "to-C", Kind: recipe.Temp, Arg: "T2", Unit: "°C", Default: "required", Help: "temperature it is heated to"},
		}, append(pressureFlags[:len(pressureFlags):len(pressureFlags)],
			flagSpec{Key: "heat_pressure_kPa", Name: "heat-pressure-kPa", Arg: "P2", Unit: "kPa", Default: "the air pressure", Help: "pressure in the heated vessel"},
			flagSpec{Key: "co2_ppm", Name: "co2-ppm", Arg: "C", Unit: "µmol/mol in dry air", Default: unit.FormatCompact(gas.DefaultCO2PPM, 6), Help: "CO2 in the air"},
		)...),
		Examples: []string{"gas outgas --from-C 20 --to-C 80", "gas outgas --from-F 68 --to-F 176 --heat-pressure-kPa 150"},
	},
	{
		Name:    "gas table",
		Summary: "a field table of oxygen saturation, mg/L, by temperature and pressure (or salinity)",
		Usage:   []string{"gas table [--temp-from-C 0] [--temp-to-C 40] [--temp-step-C 1] [--columns pressure_kPa|salinity] [--values LIST] [--format text|json]"},
		About: `A table of oxygen saturation (mg/L, water-saturated air) to take into the field: one row per
temperature, one column per pressure (or per salinity). Text to print, or JSON.`,
		Flags: []flagSpec{
			{Key: "temp_from_C", Name: "temp-from-C", Kind: recipe.Temp, Arg: "T", Unit: "°C", Default: "0", Help: "first row"},
			{Key: "temp_to_C", Name: "temp-to-C", Kind: recipe.Temp, Arg: "T", Unit: "°C", Default: "40", Help: "last row"},
			{Key: "temp_step_C", Name: "temp-step-C", Arg: "K", Unit: "K (a difference)", Default: "1", Help: "step between rows"},
			{Key: "columns", Name: "columns", Arg: "pressure_kPa|salinity", Default: "pressure_kPa", Help: "what the columns are"},
			{Key: "values", Name: "values", Arg: "LIST", Unit: "kPa, or practical salinity",
				Default: "101.325;95;90;85;80;75;70 (pressures) or 0;10;20;30;35;40 (salinities)", Help: "the columns, separated by ; or spaces"},
			{Key: "salinity", Name: "salinity", Arg: "S", Unit: "practical salinity", Default: "0", Help: "with pressure columns: the salinity of every column"},
			{Key: "pressure_kPa", Name: "pressure-kPa", Arg: "P", Unit: "kPa", Default: "101.325", Help: "with salinity columns: the pressure of every column"},
			{Key: "method", Name: "method", Arg: "benson-krause|garcia-gordon", Default: "benson-krause", Help: "the O2 equation"},
		},
		Options:  []flagSpec{formatOpt("text: an aligned table to print; json: for scripts", "text", "json")},
		Examples: []string{`gas table --temp-to-C 30 --temp-step-C 5 --values "101.325;95;90;85;80"`},
	},
	{
		Name:    "demo",
		Summary: "plans printed as readable batch sheets (without files: the invented demo batches)",
		Usage:   []string{"demo [RECIPE.json ...] [--temp-unit C|F|K] [--mass-unit g|kg|lb]"},
		About: `Prints the batch sheet of each recipe file, one after the other, as "plan --format text"
does; without files, the two invented demo batches built into Saltcast.`,
		Options:  unitOpts,
		Examples: []string{"demo", "demo a.json b.json --temp-unit F"},
	},
	{
		Name:     "version",
		Summary:  "the Saltcast version (also saltcast --version)",
		Usage:    []string{"version", "--version"},
		About:    `Prints the version of Saltcast this program is, the same version the app shows and its batch sheet prints.`,
		Examples: []string{"--version"},
	},
	{
		Name:     "help",
		Summary:  "this list, or the help of one command",
		Usage:    []string{"help [COMMAND]"},
		About:    `Prints the list of commands, or what one command does, its flags and an example (as COMMAND --help does).`,
		Examples: []string{"help plan", "help gas table"},
	},
}

// findCommand finds a command by its words ("gas", "table").
func findCommand(words ...string) *command {
	name := strings.Join(words, " ")
	for _, c := range commands {
		if c.Name == name {
			return c
		}
	}
	return nil
}

func commandNames() string {
	var names []string
	for _, c := range commands {
		if !strings.Contains(c.Name, " ") {
			names = append(names, c.Name)
		}
	}
	return strings.Join(names, ", ")
}

// topHelp is what saltcast, saltcast help and saltcast --help print.
func topHelp() string {
	var b strings.Builder
	b.WriteString("saltcast: plan solutions near saturation and crystallization by cooling (version " + Version() + ")\n\n")
	b.WriteString("Usage: saltcast COMMAND [flags]   (saltcast help COMMAND, or COMMAND --help, for its flags)\n\nCommands:\n")
	for _, c := range commands {
		b.WriteString("  " + padRight(c.Name, 13) + c.Summary + "\n")
	}
	b.WriteString(`
Numbers take a decimal point or a decimal comma (12,5). A flag's name says its unit
(--cool-to-C, --cool-to-F). Errors go to standard error naming the flag, with exit status 2
(1 when Saltcast itself fails).

Saltcast is a planning aid, not a safety assessment: read the SDS of every chemical and
follow your local rules and licensed practice.
`)
	return b.String()
}

// help is what saltcast COMMAND --help prints.
func (c *command) help() string {
	var b strings.Builder
	b.WriteString("saltcast " + c.Name + ": " + c.Summary + "\n\nUsage:\n")
	for _, u := range c.Usage {
		b.WriteString("  saltcast " + u + "\n")
	}
	b.WriteString("\n" + c.About + "\n")
	writeFlags := func(title string, fs []flagSpec) {
		if len(fs) == 0 {
			return
		}
		b.WriteString("\n" + title + ":\n")
		for i := range fs {
			f := &fs[i]
			head := "  --" + f.Name
			if f.Arg != "" {
				head += " " + f.Arg
			}
			b.WriteString(head + "\n")
			line := f.Help
			if u := unitNote(f); u != "" {
				line += "\n[unit: " + u + "]"
			}
			if f.Default != "" {
				line += "\n[default: " + f.Default + "]"
			} else {
				line += "\n[optional]"
			}
			b.WriteString(wrap(line, "      ", 92))
		}
	}
	writeFlags("Flags", c.Flags)
	writeFlags("Output", c.Options)
	b.WriteString("  -h, --help\n      this help\n")
	b.WriteString("\nExample")
	if len(c.Examples) > 1 {
		b.WriteString("s")
	}
	b.WriteString(":\n")
	for _, e := range c.Examples {
		b.WriteString("  saltcast " + e + "\n")
	}
	return b.String()
}

// wrap indents text and breaks its lines at spaces before width (counted in characters).
func wrap(text, indent string, width int) string {
	var b strings.Builder
	for _, para := range strings.Split(text, "\n") {
		line := indent
		for _, w := range strings.Fields(para) {
			if utf8.RuneCountInString(line)+1+utf8.RuneCountInString(w) > width && line != indent {
				b.WriteString(line + "\n")
				line = indent
			}
			if line != indent {
				line += " "
			}
			line += w
		}
		b.WriteString(line + "\n")
	}
	return b.String()
}

func padRight(s string, w int) string {
	if k := utf8.RuneCountInString(s); k < w {
		return s + strings.Repeat(" ", w-k)
	}
	return s + " "
}

// allFlags is a command's flags and options, for parsing.
func (c *command) allFlags() []flagSpec {
	return append(c.Flags[:len(c.Flags):len(c.Flags)], c.Options...)
}
