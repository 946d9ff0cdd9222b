// Package recipe reads and writes the recipe format (a batch as a technician describes it,
// versioned by "format") and the plan result format, and turns a recipe into a plan.
//
// Format rule: the current format is 1. A recipe without "format" is read as format 1,
// because format 1 is the only one so far and recipes are often written by hand; a newer
// format is refused with a message to update Saltcast. A future format 2 will keep reading
// format 1 files.
//
// Decoding is strict: unknown keys, wrong JSON types, NaN or absurd magnitudes and
// contradictory keys (water_g with water_mL; more than one of saturation_pct, charge_g and
// clear_down_to_C) are refused with a *unit.FieldError naming the key. A collection file
// ({"format":1,"kind":"saltcast-recipes","recipes":[...]}) is read all or nothing.
package recipe
