package ansatz

import (
	"math/big"

	"psol/series"
)

// The kink's trace on a circle in closed form. On r = R write ψ = θ − φ,
// φ = atan2(B, A), ρ = R·|∇ℓ|: then ℓ = ρ cos ψ + D, and where the line
// crosses the circle (|D| < ρ), ℓ > 0 exactly for |ψ| < β, β = arccos(−D/ρ).
// So
//
//	|ℓ|³ = ℓ³·(2·1{|ψ| < β} − 1),   ℓ³ = Σ_{j=0..3} e_j cos jψ,
//
// and each mode is an integral of cos jψ·cos nψ over (−β, β): for n > 3
//
//	a_n = (2/π) Σ_j e_j [sin((n − j)β)/(n − j) + sin((n + j)β)/(n + j)],
//
// with sin((n ± j)β) = sin nβ cos jβ ± cos nβ sin jβ: cos nβ and sin nβ are
// the angle atoms (series.IndexTrig) of the crossing, cos jβ and sin jβ
// polynomials in cos β = −D/ρ and sin β. The modes n ≤ 3 carry β itself
// (series.Angle). The radial derivative is 3K|∇ℓ|·ℓ|ℓ| cos ψ, the same
// with ℓ² cos ψ = Σ e'_j cos jψ. In θ, cos nψ = cos nφ cos nθ + sin nφ sin nθ.
// (Elementary integrals; the expansion of a kinked trace is common practice.)

// CircleTrace is v (or ∂v/∂r, deriv) on the circle r = radius as exact
// Fourier coefficients with a general term; ok is false where the kink's
// form or the radius is not rational.
func (k Kink) CircleTrace(radius series.Coef, deriv bool) (series.FourierCoefficients, bool) {
	return k.circleSeries(radius, deriv, false)
}

// CircleAbs is the kink itself, c·|ℓ|, on the circle r = radius as exact
// Fourier coefficients with a general term: boundary data with a kink. The
// same integrals as CircleTrace's with ℓ in place of ℓ³ (e_0 = D, e_1 = ρ),
// so its coefficients fall like n⁻², and in float64 an FFT would leave
// about 1/N of them (3e-4 with 4096 samples).
func (k Kink) CircleAbs(radius series.Coef) (series.FourierCoefficients, bool) {
	return k.circleSeries(radius, false, true)
}

func (k Kink) circleSeries(radius series.Coef, deriv, bare bool) (series.FourierCoefficients, bool) {
	out := series.FourierCoefficients{Special: map[int][2]series.Coef{}}
	R, okR := radius.Rat()
	A, okA := k.LA.Rat()
	B, okB := k.LB.Rat()
	D, okD := k.LD.Rat()
	if !okR || !okA || !okB || !okD || k.Factor.IsZero() {
		return out, false
	}
	sq := func(q *big.Rat) *big.Rat { return new(big.Rat).Mul(q, q) }
	g2 := new(big.Rat).Add(sq(A), sq(B))
	rho2 := new(big.Rat).Mul(sq(R), g2)
	rho, err := series.RatCoef(rho2).Pow(big.NewRat(1, 2))
	if err != nil || g2.Sign() == 0 {
		return out, false
	}
	d := series.RatCoef(D)
	// e_j of ℓ³ (value) or of ℓ² cos ψ (slope), and the factor before them.
	var e [4]series.Coef
	factor := k.Factor
	half, quarter := big.NewRat(1, 2), big.NewRat(1, 4)
	rhoSq := series.RatCoef(rho2)
	// A step's v = Factor·ℓ²·1{|ψ| < β}: the indicator alone, where a
	// kink's |ℓ|³ = ℓ³·(2·1{|ψ| < β} − 1).
	step := k.Step && !bare
	switch {
	case step && !deriv: // ℓ² = D² + ρ²/2 + 2ρD cos ψ + (ρ²/2) cos 2ψ
		e[0] = d.Mul(d).Add(rhoSq.MulRat(half))
		e[1] = rho.Mul(d).MulRat(big.NewRat(2, 1))
		e[2] = rhoSq.MulRat(half)
	case step: // ∂v/∂r = 2·Factor·|∇ℓ|·ℓ cos ψ·1{}, ℓ cos ψ = ρ/2 + D cos ψ + (ρ/2) cos 2ψ
		g, err := series.RatCoef(g2).Pow(half)
		if err != nil {
			return out, false
		}
		factor = factor.Mul(g).MulRat(big.NewRat(2, 1))
		e[0], e[1], e[2] = rho.MulRat(half), d, rho.MulRat(half)
	case bare: // c·|ℓ|: the factor 1/(6|∇ℓ|²) of the closed form undone
		factor = factor.Mul(series.RatCoef(g2)).MulRat(big.NewRat(6, 1))
		e[0], e[1] = d, rho
	case !deriv:
		e[0] = d.Mul(d).Mul(d).Add(rhoSq.Mul(d).MulRat(big.NewRat(3, 2)))
		e[1] = rho.Mul(d).Mul(d).MulRat(big.NewRat(3, 1)).Add(rhoSq.Mul(rho).MulRat(big.NewRat(3, 4)))
		e[2] = rhoSq.Mul(d).MulRat(big.NewRat(3, 2))
		e[3] = rhoSq.Mul(rho).MulRat(quarter)
	default:
		g, err := series.RatCoef(g2).Pow(half)
		if err != nil {
			return out, false
		}
		factor = factor.Mul(g).MulRat(big.NewRat(3, 1))
		e[0] = rho.Mul(d)
		e[1] = rhoSq.MulRat(big.NewRat(3, 4)).Add(d.Mul(d))
		e[2] = rho.Mul(d)
		e[3] = rhoSq.MulRat(quarter)
	}
	cosPhi, sinPhi, ok := series.IndexTrig(k.LA, k.LB)
	if !ok {
		return out, false
	}
	inTheta := func(n int, a series.Coef) ([2]series.Coef, bool) { // a·(cos nφ, sin nφ)
		c, err1 := series.Coefficient(cosPhi, n)
		s, err2 := series.Coefficient(sinPhi, n)
		return [2]series.Coef{a.Mul(factor).Mul(c), a.Mul(factor).Mul(s)}, err1 == nil && err2 == nil
	}
	if sq(D).Cmp(rho2) >= 0 { // the line misses (or touches) the circle: one sign throughout
		sign := series.IntCoef(int64(D.Sign()))
		if step { // the indicator: 1 where ℓ > 0 throughout, else 0
			sign = series.IntCoef(int64(max(D.Sign(), 0)))
		}
		out.A0 = e[0].Mul(sign).Mul(factor)
		for n := 1; n <= 3; n++ {
			ab, ok := inTheta(n, e[n].Mul(sign))
			if !ok {
				return out, false
			}
			out.Special[n] = ab
		}
		return out, true
	}
	// cos β = −D/ρ, sin β = √(1 − D²/ρ²).
	c := d.Neg().Mul(rho).Mul(series.RatCoef(new(big.Rat).Inv(rho2)))
	s, err := series.RatCoef(new(big.Rat).Sub(big.NewRat(1, 1), new(big.Rat).Quo(sq(D), rho2))).Pow(half)
	if err != nil {
		return out, false
	}
	beta, ok := series.Angle(c, s)
	if !ok {
		return out, false
	}
	cosN, sinN, ok := series.IndexTrig(c, s)
	if !ok {
		return out, false
	}
	// cos jβ and sin jβ, j = 0..3.
	c2 := c.Mul(c)
	cj := [4]series.Coef{series.IntCoef(1), c, c2.MulRat(big.NewRat(2, 1)).Sub(series.IntCoef(1)), c2.Mul(c).MulRat(big.NewRat(4, 1)).Sub(c.MulRat(big.NewRat(3, 1)))}
	sj := [4]series.Coef{{}, s, s.Mul(c).MulRat(big.NewRat(2, 1)), s.Mul(c2.MulRat(big.NewRat(4, 1)).Sub(series.IntCoef(1)))}
	pi := series.SymCoef(series.Pi)
	// The general term, n > 3.
	n := series.IndexCoef
	var general series.Coef
	for j := 0; j < 4; j++ {
		jc := series.IntCoef(int64(j))
		minus, err1 := sinN.Mul(cj[j]).Sub(cosN.Mul(sj[j])).Div(n.Sub(jc))
		plus, err2 := sinN.Mul(cj[j]).Add(cosN.Mul(sj[j])).Div(n.Add(jc))
		if err1 != nil || err2 != nil {
			return out, false
		}
		general = general.Add(e[j].Mul(minus.Add(plus)))
	}
	twice := big.NewRat(2, 1) // 2·1{} − 1; a step's indicator once
	if step {
		twice = big.NewRat(1, 1)
	}
	general, err = general.MulRat(twice).Div(pi)
	if err != nil {
		return out, false
	}
	out.A, out.B = general.Mul(factor).Mul(cosPhi), general.Mul(factor).Mul(sinPhi)
	// The modes n ≤ 3, with sin mβ at whole m from the atoms.
	sinAt := func(m int) (series.Coef, bool) {
		v, err := series.Coefficient(sinN, m)
		return v, err == nil
	}
	integral := func(j, n int) (series.Coef, bool) { // ∫_{−β}^{β} cos jψ cos nψ dψ
		if j == n {
			if n == 0 {
				return beta.MulRat(big.NewRat(2, 1)), true
			}
			s2n, ok := sinAt(2 * n)
			return beta.Add(s2n.MulRat(big.NewRat(1, int64(2*n)))), ok
		}
		diff, sum := n-j, n+j
		if diff < 0 {
			diff = -diff
		}
		a, ok1 := sinAt(diff)
		b, ok2 := sinAt(sum)
		return a.MulRat(big.NewRat(1, int64(diff))).Add(b.MulRat(big.NewRat(1, int64(sum)))), ok1 && ok2
	}
	for m := 0; m <= 3; m++ {
		var a series.Coef // π·a_m (2π·a_0)
		for j := 0; j < 4; j++ {
			I, ok := integral(j, m)
			if !ok {
				return out, false
			}
			a = a.Add(e[j].Mul(I.MulRat(twice)))
		}
		whole := pi // ∫_{−π}^{π} cos² mψ
		if m == 0 {
			whole = pi.MulRat(big.NewRat(2, 1))
		}
		if !step {
			a = a.Sub(e[m].Mul(whole))
		}
		if m == 0 {
			a0, err := a.Div(pi.MulRat(big.NewRat(2, 1)))
			if err != nil {
				return out, false
			}
			out.A0 = a0.Mul(factor)
			continue
		}
		am, err := a.Div(pi)
		if err != nil {
			return out, false
		}
		ab, ok := inTheta(m, am)
		if !ok {
			return out, false
		}
		out.Special[m] = ab
	}
	return out, true
}
