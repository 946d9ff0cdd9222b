package activity

import "math"

// Salt is one strong electrolyte M(NuM)X(NuX) with its Pitzer parameters at 25 °C.
type Salt struct {
	NuM, NuX     float64 // ions per formula unit: cations, anions
	ZM, ZX       float64 // charge numbers, both positive
	Beta0, Beta1 float64 // kg/mol
	CPhi         float64 // kg²/mol²
	MaxMolal     float64 // highest molality of the fitted data, mol/kg
	Source       string
}

// Nu is the number of ions per formula unit.
func (s *Salt) Nu() float64 { return s.NuM + s.NuX }

const (
	pitzerB     = 1.2 // kg^½/mol^½, Pitzer & Mayorga (1973)
	pitzerAlpha = 2.0 // kg^½/mol^½, for salts with a univalent ion (Pitzer & Mayorga 1973)
)

// aPhi holds Aφ (kg^½/mol^½) at 0, 25, 50, 75 and 100 °C (Bradley & Pitzer 1979, J. Phys. Chem.
// 83:1599, from memory; 0.3915 at 25 °C is the value Pitzer & Mayorga used).
var aPhi = [...]float64{0.3767, 0.3915, 0.4103, 0.4328, 0.4576}

// APhi returns the Debye–Hückel slope Aφ at tempC, linear between the 25 K steps of its table
// and held at the ends outside 0–100 °C.
func APhi(tempC float64) float64 {
	u := math.Max(0, math.Min(100, tempC)) / 25
	i := int(u)
	if i >= len(aPhi)-1 {
		return aPhi[len(aPhi)-1]
	}
	f := u - float64(i)
	return aPhi[i] + f*(aPhi[i+1]-aPhi[i])
}

// LnGamma returns ln γ±, the natural logarithm of the mean ionic activity coefficient on the
// molality scale, at molality m (mol/kg) and tempC. ok is false for m ≤ 0 or beyond MaxMolal.
func (s *Salt) LnGamma(m, tempC float64) (lnGamma float64, ok bool) {
	if !(m > 0) || m > s.MaxMolal {
		return 0, false
	}
	return s.lnGamma(m, tempC), true
}

func (s *Salt) lnGamma(m, tempC float64) float64 {
	nu := s.Nu()
	I := 0.5 * m * (s.NuM*s.ZM*s.ZM + s.NuX*s.ZX*s.ZX)
	sq := math.Sqrt(I)
	f := -APhi(tempC) * (sq/(1+pitzerB*sq) + 2/pitzerB*math.Log1p(pitzerB*sq))
	a2I := pitzerAlpha * pitzerAlpha * I
	bg := 2*s.Beta0 + 2*s.Beta1/a2I*(1-(1+pitzerAlpha*sq-a2I/2)*math.Exp(-pitzerAlpha*sq))
	cg := 1.5 * s.CPhi
	return s.ZM*s.ZX*f + m*(2*s.NuM*s.NuX/nu)*bg + m*m*(2*math.Pow(s.NuM*s.NuX, 1.5)/nu)*cg
}

// Thermodynamic returns 1 + d ln γ±/d ln m at molality m and tempC: the factor by which the
// activity of the salt rises faster (or slower) than its molality. It is the correction that
// turns the slope of a solubility curve in ln m into the differential heat of solution at
// saturation (see package balance). ok is false for m ≤ 0 or beyond MaxMolal.
func (s *Salt) Thermodynamic(m, tempC float64) (factor float64, ok bool) {
	if !(m > 0) || m > s.MaxMolal {
		return 0, false
	}
	// Central difference in ln m; the step keeps both points inside the range.
	const h = 1e-4
	lo, hi := m*math.Exp(-h), m*math.Exp(h)
	if hi > s.MaxMolal {
		hi, lo = m, m*math.Exp(-2*h)
	}
	d := (s.lnGamma(hi, tempC) - s.lnGamma(lo, tempC)) / math.Log(hi/lo)
	return 1 + d, true
}
