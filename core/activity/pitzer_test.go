package activity

import (
	"math"
	"testing"
)

// gammaTol covers the fit itself (Pitzer & Mayorga report standard deviations of about
// 0.001–0.003 in φ) and three-digit printed values (relative).
const gammaTol = 0.015

// Parameters from Pitzer & Mayorga (1973), J. Phys. Chem. 77:2300, Table I (as reproduced
// in the open pytzer package, tables.py PM73_TableI); ranges from memory.
var (
	nacl = Salt{NuM: 1, NuX: 1, ZM: 1, ZX: 1, Beta0: 0.0765, Beta1: 0.2664, CPhi: 0.00127, MaxMolal: 6}
	kcl  = Salt{NuM: 1, NuX: 1, ZM: 1, ZX: 1, Beta0: 0.04835, Beta1: 0.2122, CPhi: -0.00084, MaxMolal: 4.8}
	kno3 = Salt{NuM: 1, NuX: 1, ZM: 1, ZX: 1, Beta0: -0.0816, Beta1: 0.0494, CPhi: 0.0066, MaxMolal: 3.8}
)

func TestGamma(t *testing.T) {
	// Mean activity coefficients at 25 °C from Robinson & Stokes, Electrolyte Solutions, 2nd
	// ed. (1959), Appendix 8.10 (from memory): measured values the Pitzer fit must reproduce.
	for _, c := range []struct {
		name string
		s    Salt
		m    float64
		want float64
	}{
		{"NaCl", nacl, 0.1, 0.778},
		{"NaCl", nacl, 1, 0.657},
		{"NaCl", nacl, 6, 0.986},
		{"KCl", kcl, 1, 0.604},
		{"KCl", kcl, 4, 0.577},
		{"KNO3", kno3, 1, 0.443},
	} {
		lg, ok := c.s.LnGamma(c.m, 25)
		if got := math.Exp(lg); !ok || math.Abs(got-c.want) > gammaTol*c.want {
			t.Errorf("%s LnGamma(%v) → γ± = %.4f (ok %v), want %.3f", c.name, c.m, got, ok, c.want)
		}
	}
}

func TestThermodynamicFactor(t *testing.T) {
	// The factor agrees with a wide secant of ln γ± in ln m, and KNO3's γ± falls steeply with
	// m (Robinson & Stokes: 0.443 at 1 m, near 0.3 at 3 m, from memory), so its factor lies
	// between 0 and 1.
	for _, m := range []float64{0.5, 1, 2, 3, 3.7} {
		f, ok := kno3.Thermodynamic(m, 25)
		if !ok {
			t.Fatalf("Thermodynamic(%v) not ok", m)
		}
		a, b := m*0.99, m*1.01
		wide := 1 + (kno3.lnGamma(b, 25)-kno3.lnGamma(a, 25))/math.Log(b/a)
		if math.Abs(f-wide) > 1e-3 {
			t.Errorf("Thermodynamic(%v) = %v, wide secant %v", m, f, wide)
		}
		if !(f > 0 && f < 1) {
			t.Errorf("KNO3 factor at %v m = %v, want between 0 and 1", m, f)
		}
	}
	if _, ok := kno3.Thermodynamic(4, 25); ok {
		t.Error("Thermodynamic beyond MaxMolal is ok, want refused")
	}
	if _, ok := nacl.LnGamma(0, 25); ok {
		t.Error("LnGamma(0) is ok, want refused")
	}
}

func TestAPhi(t *testing.T) {
	if got := APhi(25); got != 0.3915 {
		t.Errorf("APhi(25) = %v, want 0.3915 (Pitzer & Mayorga 1973)", got)
	}
	if !(APhi(-5) == APhi(0) && APhi(120) == APhi(100) && APhi(40) > APhi(30)) {
		t.Error("APhi not held at the ends or not rising")
	}
}
