package gas

import (
	"math"

	"saltcast/core/unit"
)

// Table column kinds for OxygenTable.
const (
	ColumnsPressure = "pressure_kPa"
	ColumnsSalinity = "salinity"
)

// Table is a printable field table of oxygen saturation, mg/L: one row per temperature, one
// column per pressure (at a fixed salinity) or per salinity (at a fixed pressure).
type Table struct {
	TempsC   []float64
	Kind     string    // ColumnsPressure or ColumnsSalinity
	Columns  []float64 // kPa or salinity
	Fixed    float64   // the salinity (pressure columns) or the pressure in kPa (salinity columns)
	MgPerL   [][]float64
	Method   string
	Source   string
	Warnings []string // distinct warnings raised by any cell
}

// Size limits keep a table printable and the work bounded.
const (
	TableMaxRows = 101
	TableMaxCols = 12
)

// OxygenTable fills a Table by OxygenSaturation. Every cell is validated as a single call
// would be; a cell that would be refused refuses the whole table (so no blank or invented
// cells). Errors are *unit.FieldError ("temps_C", "columns", "column_kind" or the field of
// the offending cell).
func OxygenTable(tempsC []float64, kind string, columns []float64, fixed float64, method string) (Table, error) {
	if len(tempsC) == 0 || len(tempsC) > TableMaxRows {
		return Table{}, &unit.FieldError{Field: "temps_C", Value: unit.FormatCompact(float64(len(tempsC)), 4) + " rows",
			Allowed: "1 to 101 temperatures"}
	}
	if len(columns) == 0 || len(columns) > TableMaxCols {
		return Table{}, &unit.FieldError{Field: "columns", Value: unit.FormatCompact(float64(len(columns)), 4) + " columns",
			Allowed: "1 to 12 values"}
	}
	if kind != ColumnsPressure && kind != ColumnsSalinity {
		return Table{}, &unit.FieldError{Field: "column_kind", Value: kind, Allowed: `"pressure_kPa" or "salinity"`}
	}
	t := Table{TempsC: tempsC, Kind: kind, Columns: columns, Fixed: fixed, MgPerL: make([][]float64, len(tempsC))}
	seen := map[string]bool{}
	for i, tc := range tempsC {
		row := make([]float64, len(columns))
		for j, col := range columns {
			c := Conditions{TempC: tc, Salinity: fixed, PressureKPa: col}
			if kind == ColumnsSalinity {
				c = Conditions{TempC: tc, Salinity: col, PressureKPa: fixed}
			}
			o, err := OxygenSaturation(c, method)
			if err != nil {
				return Table{}, err
			}
			if math.IsNaN(o.MgPerL) || math.IsInf(o.MgPerL, 0) {
				return Table{}, unit.NumberError("temp_C", tc, "conditions where the oxygen equation gives a finite value")
			}
			row[j] = o.MgPerL
			t.Method, t.Source = o.Method, o.Source
			for _, w := range o.Warnings {
				if !seen[w] {
					seen[w] = true
					t.Warnings = append(t.Warnings, w)
				}
			}
		}
		t.MgPerL[i] = row
	}
	return t, nil
}

// Steps returns from, from+step, … up to and including to (within 1e-9·step), for table rows.
// It refuses a step that is not positive, an empty range or more than TableMaxRows values,
// with a *unit.FieldError for field.
func Steps(field string, from, to, step float64) ([]float64, error) {
	if math.IsNaN(step) || math.IsInf(step, 0) || step <= 0 {
		return nil, unit.NumberError(field, step, "a step > 0")
	}
	if math.IsNaN(from) || math.IsNaN(to) || math.IsInf(from, 0) || math.IsInf(to, 0) || to < from {
		return nil, unit.NumberError(field, to, "an end value not below the start value")
	}
	n := math.Floor((to-from)/step+1e-9) + 1
	if n > TableMaxRows {
		return nil, unit.NumberError(field, step, "a step giving at most 101 rows")
	}
	out := make([]float64, int(n))
	for i := range out {
		// Multiply instead of accumulating so 0.1-steps print as 0.1, 0.2, … without drift.
		out[i] = math.Round((from+float64(i)*step)*1e9) / 1e9
	}
	return out, nil
}
