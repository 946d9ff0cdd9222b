// Package activity gives the mean ionic activity coefficient of a single strong electrolyte in
// water, and its slope d ln γ±/d ln m, from the Pitzer equations.
//
// # Model
//
// For a salt M(ν+)X(ν−) with charges z+, z− at molality m (mol per kg of water), ionic
// strength I = ½·m·(ν+·z+² + ν−·z−²) and ν = ν+ + ν−:
//
//	ln γ± = |z+·z−|·f^γ + m·(2ν+ν−/ν)·B^γ + m²·(2(ν+ν−)^{3/2}/ν)·C^γ
//	f^γ = −Aφ·[√I/(1 + b√I) + (2/b)·ln(1 + b√I)],  b = 1.2
//	B^γ = 2β0 + (2β1/(α²I))·[1 − (1 + α√I − α²I/2)·e^{−α√I}],  α = 2.0
//	C^γ = (3/2)·Cφ
//
// (Pitzer, K. S. & Mayorga, G. (1973), J. Phys. Chem. 77:2300, eqs. for single salts).
// Aφ, the Debye–Hückel slope for the osmotic coefficient, is interpolated in temperature
// from the values of Bradley & Pitzer (1979), J. Phys. Chem. 83:1599 (from memory; 0.3915 at
// 25 °C). The salt parameters β0, β1, Cφ are 25 °C values; used at other temperatures they
// are an approximation (their temperature derivatives are of order 1e-3 per K, Silvester &
// Pitzer 1979). Salts of two divalent ions (β2 terms) are not covered.
//
// # Range
//
// Each parameter set is valid up to the highest molality of the data it was fitted to
// (Salt.MaxMolal). In reports beyond it, ok is false: the caller must not use the value.
package activity
