package prep

import (
	"math"
	"testing"
)

// Specific volumes (cm³/g) of aqueous NaCl at 100 kPa: Rogers, P. S. Z. & Pitzer, K. S.
// (1982), J. Phys. Chem. Ref. Data 11:15, as tabulated in the CRC Handbook of Chemistry and
// Physics, "Volumetric Properties of Aqueous Sodium Chloride Solutions" (open mirror:
// zanotowane.pl/1029/2356). Rows: temperature °C; columns: molality below.
var rpMolality = []float64{0.100, 0.250, 0.500, 0.750, 1.000, 2.000, 3.000, 4.000, 5.000}

var rpSpecificVolume = []struct {
	tempC float64
	v     []float64
}{
	{0, []float64{0.995732, 0.989259, 0.978889, 0.968991, 0.959525, 0.925426, 0.896292, 0.870996, 0.848646}},
	{10, []float64{0.995998, 0.989781, 0.979804, 0.970256, 0.961101, 0.927905, 0.899262, 0.874201, 0.851958}},
	{20, []float64{0.997620, 0.991564, 0.981833, 0.972505, 0.963544, 0.930909, 0.902565, 0.877643, 0.855469}},
	{25, []float64{0.998834, 0.992832, 0.983185, 0.973932, 0.965038, 0.932590, 0.904339, 0.879457, 0.857301}},
	{30, []float64{1.000279, 0.994319, 0.984735, 0.975539, 0.966694, 0.934382, 0.906194, 0.881334, 0.859185}},
	{40, []float64{1.003796, 0.997883, 0.988374, 0.979243, 0.970455, 0.938287, 0.910145, 0.885276, 0.863108}},
	{50, []float64{1.008064, 1.002161, 0.992668, 0.983551, 0.974772, 0.942603, 0.914411, 0.889473, 0.867241}},
	{60, []float64{1.0130, 1.0071, 0.9976, 0.9885, 0.9797, 0.9474, 0.9191, 0.8940, 0.8716}},
	{70, []float64{1.0186, 1.0127, 1.0031, 0.9939, 0.9851, 0.9526, 0.9240, 0.8987, 0.8762}},
	{80, []float64{1.0249, 1.0188, 1.0092, 0.9999, 0.9909, 0.9581, 0.9293, 0.9037, 0.8809}},
	{90, []float64{1.0317, 1.0256, 1.0157, 1.0063, 0.9972, 0.9640, 0.9348, 0.9089, 0.8858}},
	{100, []float64{1.0391, 1.0329, 1.0228, 1.0133, 1.0040, 0.9703, 0.9406, 0.9144, 0.8910}},
}

// The stated error bound holds for every row of Rogers & Pitzer: the library's CRC 20 °C NaCl
// densities scaled by water's density ratio stay within DensityErrorPct of the table.
func TestDensityErrorBound(t *testing.T) {
	c, _ := mustLookup(t, "NaCl")
	M := c.MolarMassGPerMol
	worst := 0.0
	for _, row := range rpSpecificVolume {
		for j, m := range rpMolality {
			w, _ := MassFraction(m, MolPerKg, M)
			rho, _, err := SolutionDensity(c, w, row.tempC)
			if err != nil {
				t.Fatalf("SolutionDensity(NaCl, %.4f, %v): %v", w, row.tempC, err)
			}
			want := 1000 / row.v[j]
			errPct := 100 * math.Abs(rho-want) / want
			worst = math.Max(worst, errPct)
			if bound := DensityErrorPct(w, row.tempC); errPct > bound {
				t.Errorf("NaCl %.2f mol/kg at %v °C: scaled density %.2f kg/m³, Rogers & Pitzer %.2f: %.3f %% off, stated bound %.3f %%",
					m, row.tempC, rho, want, errPct, bound)
			}
		}
	}
	// The bound is not vacuous: the approximation's real error reaches more than half of
	// its largest value (0.7 % + 0.05 % at 0 °C, 5 mol/kg).
	if worst < 0.4 {
		t.Errorf("largest deviation %.3f %%: the table or the scaling changed", worst)
	}
}

// At 20 °C the scaling is the identity and the bound is the table's own uncertainty.
func TestDensityAt20(t *testing.T) {
	c, _ := mustLookup(t, "NaCl")
	rho20, _, _ := c.SolutionDensityKgPerM3(0.1, 20)
	rho, warn, err := SolutionDensity(c, 0.1, 20)
	if err != nil || rho != rho20 || warn != "" {
		t.Errorf("SolutionDensity(NaCl, 0.1, 20) = %v, %q, %v; want %v, no warning", rho, warn, err, rho20)
	}
	if DensityErrorPct(0.1, 20) != densityFitErrPct {
		t.Errorf("DensityErrorPct at 20 °C = %v, want %v", DensityErrorPct(0.1, 20), densityFitErrPct)
	}
	if _, warn, _ := SolutionDensity(c, 0.1, 40); warn == "" {
		t.Errorf("no warning for the scaled density at 40 °C")
	}
}
