package balance_test

import (
	"fmt"

	"saltcast/core/balance"
	"saltcast/core/compound"
)

// A hydrate crash-out: copper sulfate saturated at 80 °C in 100 g of water, cooled to
// 20 °C. The solid is the pentahydrate, so the crystals weigh far more than the CuSO4 in
// them.
func ExampleCrashAt() {
	c, _, _ := compound.Lookup("CuSO4")
	penta, _ := c.Form("CuSO4·5H2O")
	s20, _, _, _ := c.Solubility(20)
	k, _ := balance.CrashAt(penta, s20, 56.99, 100, 20)
	fmt.Printf("%.1f g of %s holding %.1f g CuSO4; liquor %.1f g\n",
		k.CrystalsG, k.Phase.Formula, k.CrystalsG*penta.AnhydrousFraction, k.LiquorG())
	// Output: 65.2 g of CuSO4·5H2O holding 41.7 g CuSO4; liquor 91.8 g
}

// How much Glauber's salt to weigh so that 500 g of water is 90 % saturated at 25 °C.
// By hand: s(25 °C) = 28.11 g/100 g (CRC 98th ed.), k = 0.9·0.2811 = 0.2530,
// f = 142.04/322.19 = 0.4409: m = 0.2530·500/(0.4409 − 0.2530·0.5591) = 422.5 g.
func ExampleChargeFor() {
	c, deca, _ := compound.Lookup("Glauber's salt")
	s, _, _, _ := c.Solubility(25)
	m, _ := balance.ChargeFor(deca, 1, 500, 0.9*s, "saturation_pct")
	fmt.Printf("%.0f g of %s\n", m, deca.Formula)
	// Output: 422 g of Na2SO4·10H2O
}

// A whole batch: potassium alum crystals for a school open day (invented). 2 kg of water
// at 70 °C with alum at 90 % of saturation, cooled to 15 °C over six hours.
//
// Checked by hand: alum at 70 °C dissolves 40.0 g KAl(SO4)2 per 100 g water (Perry's-type
// table, from memory, as in the library), so k = 0.36; f = 258.19/474.37 = 0.5443 and
// m = 0.36·2000/(0.99·(0.5443 − 0.36·0.4557)) = 1913 g. That brings S = 1031 g and
// Wt = 2863 g of water; at 15 °C (≈4.9 g/100 g, between the 10 and 20 °C rows)
// x = (1031 − 2863·0.049)/(0.5443 − 0.4557·0.049) ≈ 1706 g, yield ≈ 90 %, liquor ≈ 2186 g.
// Duty ≈ 2.863 kg·4.18 kJ/(kg·K)·55 K + 3.60 mol·14.41 kJ/mol (llnl.dat) ≈ 710 kJ; over
// 6 h that is 33 W. Cubic programme half-way: 67.0 − (67.0 − 15)/8 = 60.5 °C.
func ExamplePlan() {
	c, alum, _ := compound.Lookup("alum")
	r, err := balance.Plan(balance.Batch{
		Compound: c, Form: alum, PurityPct: 99, WaterG: 2000,
		DissolveTempC: 70, SaturationPct: 90,
		HasTarget: true, TargetC: 15,
		MetastableWidthK: 4, CoolingTimeMin: 360,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("weigh %.0f g of %s\n", r.ChargeG, r.ChargedForm)
	fmt.Printf("saturated at %.1f °C; seed at %.1f °C with %.0f–%.0f g\n", r.SaturationTempC, r.SeedHintC, r.SeedLowG, r.SeedHighG)
	fmt.Printf("at %.0f °C: %.0f g of %s, yield %.0f %%, liquor %.0f g\n", r.TargetC, r.CrystalsG, r.CrystalPhase, r.YieldPct, r.LiquorG)
	fmt.Printf("cooling duty %.0f kJ, %.0f W on average\n", r.CoolingDutyKJ, r.CoolingPowerW)
	fmt.Printf("half-way through the cubic programme: %.1f °C\n", r.Programme[5].CubicC)
	// Output:
	// weigh 1913 g of KAl(SO4)2·12H2O
	// saturated at 68.0 °C; seed at 67.0 °C with 17–34 g
	// at 15 °C: 1708 g of KAl(SO4)2·12H2O, yield 90 %, liquor 2185 g
	// cooling duty 816 kJ, 38 W on average
	// half-way through the cubic programme: 60.5 °C
}
