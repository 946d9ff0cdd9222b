package solubility

import "math"

// VantHoff is the van 't Hoff law ln x = A + B/T (T in K, x the solute mole fraction). B is
// −ΔH/R for an ideal solution, so B < 0 for a solute more soluble when hot. The molar masses
// convert x to g per 100 g solvent; a zero SolventGPerMol means water.
type VantHoff struct {
	A, B             float64
	MolarMassGPerMol float64
	SolventGPerMol   float64
}

// Value returns g of solute per 100 g solvent at tempC.
func (v VantHoff) Value(tempC float64) float64 {
	T := tempC + 273.15
	return fromMoleFractionIn(math.Exp(v.A+v.B/T), v.MolarMassGPerMol, solvent(v.SolventGPerMol))
}

// Kind names the law.
func (VantHoff) Kind() string { return "vant-hoff" }

// Apelblat is the modified Apelblat equation ln x = A + B/T + C·ln T (T in K).
type Apelblat struct {
	A, B, C          float64
	MolarMassGPerMol float64
	SolventGPerMol   float64
}

// Value returns g of solute per 100 g solvent at tempC.
func (a Apelblat) Value(tempC float64) float64 {
	T := tempC + 273.15
	return fromMoleFractionIn(math.Exp(a.A+a.B/T+a.C*math.Log(T)), a.MolarMassGPerMol, solvent(a.SolventGPerMol))
}

// Kind names the law.
func (Apelblat) Kind() string { return "apelblat" }

// Polynomial gives g of solute per 100 g solvent directly as Σ Coef[i]·tᶦ, t in °C.
type Polynomial struct {
	Coef []float64
}

// Value evaluates the polynomial by Horner's rule.
func (p Polynomial) Value(tempC float64) float64 {
	s := 0.0
	for i := len(p.Coef) - 1; i >= 0; i-- {
		s = s*tempC + p.Coef[i]
	}
	return s
}

// Kind names the law.
func (Polynomial) Kind() string { return "polynomial" }

func solvent(m float64) float64 {
	if m == 0 {
		return WaterGPerMol
	}
	return m
}
