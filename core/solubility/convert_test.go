package solubility

import (
	"math"
	"math/rand/v2"
	"testing"
)

// roundTripTol is the relative error allowed for a value sent through a unit and back.
const roundTripTol = 1e-12

// TestConvertAgainstCRC checks the conversions against CRC Handbook 102nd ed.,
// "Concentrative Properties of Aqueous Solutions" (20 °C; open mirror: github
// amosonabike/CRC-Solution-Properties-), which prints for each mass % the density, the
// molality m and the molarity c. The table rounds m and c to 3 decimals.
func TestConvertAgainstCRC(t *testing.T) {
	tests := []struct {
		name              string
		M, w, rho, mol, c float64
	}{
		{"NaCl 10 %", 58.44, 10, 1070.7, 1.901, 1.832},
		{"NaCl 26 %", 58.44, 26, 1197.2, 6.012, 5.326},
		{"KNO3 10 %", 101.10, 10, 1062.7, 1.099, 1.051},
		{"KNO3 24 %", 101.10, 24, 1162.3, 3.123, 2.759},
	}
	const tol = 0.0015 // absolute, mol/kg and mol/L: the table's last digit plus rounding of ρ
	for _, tt := range tests {
		g := FromMassPercent(tt.w)
		if m := Molality(g, tt.M); math.Abs(m-tt.mol) > tol {
			t.Errorf("%s: Molality = %.4f, want %.3f", tt.name, m, tt.mol)
		}
		if c := MolPerL(g, tt.M, tt.rho); math.Abs(c-tt.c) > tol {
			t.Errorf("%s: MolPerL = %.4f, want %.3f", tt.name, c, tt.c)
		}
	}
	// CRC Handbook 98th ed. aqueous solubility: KNO3 at 20 °C is 24.2 mass %, which the
	// project's reference converts to 31.93 g/100 g water.
	if g := FromMassPercent(24.2); math.Abs(g-31.93) > 0.005 {
		t.Errorf("FromMassPercent(24.2) = %v, want 31.93", g)
	}
}

// TestConvertRoundTrips sends random solubilities through every unit and back.
func TestConvertRoundTrips(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for range 2000 {
		g := math.Exp(-8 + 14*r.Float64()) // 3e-4 to 400 g/100 g
		M := 20 + 400*r.Float64()
		rho := 1000 + 800*r.Float64()
		for _, u := range Units {
			v, err := Convert(g, GPer100gWater, u, M, rho)
			if err != nil {
				t.Fatalf("Convert(%v g/100g → %s) error %v", g, u, err)
			}
			back, err := Convert(v, u, GPer100gWater, M, rho)
			if err != nil || math.Abs(back-g) > roundTripTol*g {
				t.Fatalf("%v g/100g → %v %s → %v (%v)", g, v, u, back, err)
			}
		}
	}
}

func TestConvertErrors(t *testing.T) {
	tests := []struct {
		v        float64
		from, to Unit
		M, rho   float64
	}{
		{100, MassPct, GPer100gWater, 58, 1000},
		{1, MoleFrac, GPer100gWater, 58, 1000},
		{-1, GPer100gWater, MassPct, 58, 1000},
		{math.NaN(), GPer100gWater, MassPct, 58, 1000},
		{10, GPer100gWater, GramsPerL, 58, 0},
		{1200, GramsPerL, GPer100gWater, 58, 1100},
		{30, MolesPerL, GPer100gWater, 58, 1100},
		{10, "ppm", GPer100gWater, 58, 1000},
		{10, GPer100gWater, "ppm", 58, 1000},
		{10, GPer100gWater, MolPerKg, 0, 1000},
	}
	for _, tt := range tests {
		if v, err := Convert(tt.v, tt.from, tt.to, tt.M, tt.rho); err == nil {
			t.Errorf("Convert(%v %s → %s, M %v, ρ %v) = %v, want an error", tt.v, tt.from, tt.to, tt.M, tt.rho, v)
		}
	}
}
