package gas

import (
	"math"

	"saltcast/core/unit"
	"saltcast/core/water"
)

// Physical constants for gas volumes. R: CODATA 2018 (exact since the 2019 SI). STP here is
// 0 °C and 101.325 kPa (the older convention still used for "mL(STP)" in gas-solubility work;
// IUPAC's present standard uses 100 kPa).
const (
	gasConstant = 8.314462618 // J mol⁻¹ K⁻¹
	stpK        = 273.15
	stpPa       = PaPerAtm
)

// OutgasInput describes water saturated with air at FromC and PressureKPa, then heated to ToC
// at HeatPressureKPa (0 means the same as PressureKPa). CO2PPM sets the CO2 in the air
// (0 is taken literally: CO2-free air; callers pass DefaultCO2PPM when the user gives none).
type OutgasInput struct {
	FromC, ToC      float64
	PressureKPa     float64
	HeatPressureKPa float64
	CO2PPM          float64
}

// Release is what one gas does on heating, per litre of water measured at FromC.
type Release struct {
	Gas               *Gas
	DissolvedUmolPerL float64 // at FromC, in equilibrium with air
	RemainingUmolPerL float64 // at ToC, in equilibrium with air at HeatPressureKPa
	ReleasedUmolPerL  float64
	ReleasedMLPerL    float64 // dry gas at ToC and HeatPressureKPa (ideal gas)
	ReleasedMLSTPPerL float64 // dry gas at 0 °C and 101.325 kPa (ideal gas)
}

// Outgassing is the result of Outgas.
type Outgassing struct {
	In              OutgasInput
	Gases           []Release
	TotalMLPerL     float64 // all gases, dry, at ToC and HeatPressureKPa
	TotalMLSTPPerL  float64
	BubbleTempC     float64 // lowest temperature at which the dissolved gases plus water vapour reach HeatPressureKPa
	BubbleFound     bool    // false when that does not happen at or below 100 °C
	Method, Source  string
	Warnings, Notes []string
	Cautions        []string
	CautionKinds    []CautionKind // CautionKinds[i] is the kind of Cautions[i]
}

// CautionKind sorts cautions so that code tests the kind, never the wording. The values
// match those of the planner's cautions (package balance).
type CautionKind string

// CautionHotWater is HotWaterCaution: hot water, pressure in closed vessels, and the pointer
// to the SDS, local rules and licensed practice.
const CautionHotWater CautionKind = "hot-liquid"

// PointsToSDS reports whether the cautions send the reader to the SDS, local rules and
// licensed practice (HotWaterCaution does).
func (o *Outgassing) PointsToSDS() bool {
	for _, k := range o.CautionKinds {
		if k == CautionHotWater {
			return true
		}
	}
	return false
}

// Outgas computes the gas released when air-saturated fresh water is heated. Each gas
// dissolves at FromC by Henry's law (IAPWS G7-04 constant, partial pressure x·(P − p_w));
// on heating the excess over air saturation at ToC can leave. The bubble temperature is where
// the sum of the dissolved gases' equilibrium pressures and the water vapour pressure first
// reaches the pressure during heating; real bubbles also need a nucleation site (a scratch, a
// crystal, a probe) and some supersaturation, so they usually appear a little later.
//
// Errors are *unit.FieldError for fields "from_C", "to_C", "pressure_kPa",
// "heat_pressure_kPa" and "co2_ppm".
func Outgas(in OutgasInput) (Outgassing, error) {
	if in.HeatPressureKPa == 0 {
		in.HeatPressureKPa = in.PressureKPa
	}
	if err := CheckHenry("from_C", in.FromC, "pressure_kPa", in.PressureKPa); err != nil {
		return Outgassing{}, err
	}
	if math.IsNaN(in.ToC) || in.ToC <= in.FromC || in.ToC > HenryMaxC {
		return Outgassing{}, unit.NumberError("to_C", in.ToC,
			"a temperature above from_C ("+unit.FormatCompact(in.FromC, 6)+" °C) and at most 100 °C")
	}
	if math.IsNaN(in.HeatPressureKPa) || in.HeatPressureKPa < 1 || in.HeatPressureKPa > 1000 {
		return Outgassing{}, unit.NumberError("heat_pressure_kPa", in.HeatPressureKPa, "a pressure from 1 to 1000 kPa")
	}
	if err := CheckCO2PPM(in.CO2PPM); err != nil {
		return Outgassing{}, err
	}

	out := Outgassing{
		In:     in,
		Method: "Henry's law (IAPWS G7-04) for each gas; release = excess over air saturation at the end temperature",
		Source: SourceIAPWS + "; " + SourceAir + "; water vapour pressure: Wagner & Pruss 1993 (IAPWS); " +
			"water density: Kell 1975",
		Notes: []string{
			"fresh water: salting-out by dissolved salts is not modelled; a salt solution holds less gas at both temperatures, " +
				"so the volumes here are upper estimates for it",
			"volumes are of dry gas (ideal gas); bubbles also carry water vapour",
			"per litre of water measured at the start temperature; STP is 0 °C and 101.325 kPa",
		},
	}

	p1 := in.PressureKPa * PaPerKPa
	p2 := in.HeatPressureKPa * PaPerKPa
	pw1 := water.VaporPressurePa(in.FromC)
	pw2 := water.VaporPressurePa(in.ToC)
	litresPerKg := 1000 / water.DensityKgPerM3(in.FromC) // L of water per kg at FromC
	if pw2 >= p2 {
		out.Warnings = append(out.Warnings, "the water boils at "+unit.FormatCompact(in.ToC, 4)+" °C and "+
			unit.FormatCompact(in.HeatPressureKPa, 5)+" kPa: all dissolved gas is counted as released")
	}

	gases := All()
	out.Gases = make([]Release, len(gases))
	n1 := make([]float64, len(gases)) // mol per kg water at FromC
	for i, g := range gases {
		x := moleFractionIn(g, in.CO2PPM)
		n1[i] = x * (p1 - pw1) * g.HenryMolPerKgPa(in.FromC)
		n2 := x * math.Max(0, p2-pw2) * g.HenryMolPerKgPa(in.ToC)
		released := math.Max(0, n1[i]-n2)
		r := Release{
			Gas:               g,
			DissolvedUmolPerL: n1[i] / litresPerKg * 1e6,
			RemainingUmolPerL: math.Min(n1[i], n2) / litresPerKg * 1e6,
			ReleasedUmolPerL:  released / litresPerKg * 1e6,
		}
		molPerL := released / litresPerKg
		r.ReleasedMLPerL = molPerL * gasConstant * (in.ToC + unit.ZeroCelsiusK) / p2 * 1e6
		r.ReleasedMLSTPPerL = molPerL * gasConstant * stpK / stpPa * 1e6
		out.TotalMLPerL += r.ReleasedMLPerL
		out.TotalMLSTPPerL += r.ReleasedMLSTPPerL
		out.Gases[i] = r
	}
	if in.HeatPressureKPa > in.PressureKPa {
		out.Notes = append(out.Notes, "the pressure during heating is above the saturation pressure: "+
			"the water can hold more gas, and less or none is released")
	}

	out.BubbleTempC, out.BubbleFound = bubbleTemp(gases, n1, in.FromC, p2)
	if !out.BubbleFound {
		out.Notes = append(out.Notes, "no bubble point at or below 100 °C at this pressure")
	}
	if in.ToC >= hotC {
		out.Cautions = append(out.Cautions, HotWaterCaution)
		out.CautionKinds = append(out.CautionKinds, CautionHotWater)
	}
	return out, nil
}

// hotC is the temperature from which hot water is treated as a scald hazard. Water at 50 °C
// can cause a full-thickness burn in about 5 minutes of contact, at 60 °C in seconds
// (common practice; figures widely quoted from A. R. Moritz and F. C. Henriques, Am. J. Pathol.
// 23 (1947) 695; from memory).
const hotC = 50.0

// HotWaterCaution is attached to results that involve heating water to hotC or above.
const HotWaterCaution = "Hot water scalds and released gas and steam raise the pressure in a closed vessel: " +
	"heat only in vented vessels, wear eye protection and heat-resistant gloves, and follow the SDS of anything " +
	"dissolved, your local rules and licensed practice. Saltcast is a planning aid, not a safety assessment."

// bubbleTemp finds the lowest temperature in [fromC, 100] at which Σ nᵢ·kHᵢ(T)·M_w + p_w(T) ≥ p
// for the gas amounts n (mol/kg). It scans in 2.5 K steps and bisects the first crossing (to well below 1e-9 K).
func bubbleTemp(gases []*Gas, n []float64, fromC, p float64) (float64, bool) {
	excess := func(tc float64) float64 {
		sum := water.VaporPressurePa(tc)
		for i, g := range gases {
			sum += n[i] / g.HenryMolPerKgPa(tc)
		}
		return sum - p
	}
	if excess(fromC) >= 0 {
		return fromC, true
	}
	const step = 2.5
	lo := fromC
	for lo < HenryMaxC {
		hi := math.Min(lo+step, HenryMaxC)
		if excess(hi) >= 0 {
			for range 48 {
				mid := (lo + hi) / 2
				if excess(mid) >= 0 {
					hi = mid
				} else {
					lo = mid
				}
			}
			return hi, true
		}
		lo = hi
	}
	return 0, false
}
