package cart

import (
	"errors"

	"psol/series"
)

// resonantParticular solves Δu = w for a harmonic wave e^(αx+βy)·trig(γx+δy)
// (α² + β² = γ² + δ², αγ + βδ = 0), where the ansatz with polynomials of
// the source's degree cannot close: on such a wave Δ acts on the
// polynomials (A, B) of u = e^(αx+βy)[A cos(γx+δy) + B sin(γx+δy)] only
// through the first-order operators d₁ = 2(α∂x + β∂y), d₂ = 2(γ∂x + δ∂y) and
// Δ itself, each lowering the degree. So A and B are sought one degree
// higher than the source's, as the polar rule raises the log degree on a
// resonant mode: their coefficients solve an exact linear system
//
//	(d₁ + Δ)A + d₂B = C,  (d₁ + Δ)B − d₂A = S,
//
// one equation per monomial; its free unknowns (harmonic waves of lower
// degree) are set to 0.
func resonantParticular(w Wave) (Wave, error) {
	deg := max(w.Cos.Degree(), w.Sin.Degree()) + 1
	var monos [][2]int // x^i y^j with i + j ≤ deg
	for d := 0; d <= deg; d++ {
		for i := d; i >= 0; i-- {
			monos = append(monos, [2]int{i, d - i})
		}
	}
	index := map[[2]int]int{}
	for k, m := range monos {
		index[m] = k
	}
	n := len(monos)
	two := series.IntCoef(2)
	d1 := func(p Poly) Poly { return p.DX().Scale(w.Alpha.Mul(two)).Add(p.DY().Scale(w.Beta.Mul(two))) }
	d2 := func(p Poly) Poly { return p.DX().Scale(w.Gamma.Mul(two)).Add(p.DY().Scale(w.Delta.Mul(two))) }
	// Column k of the system is the operator on the k-th unknown: A's
	// monomials first, then B's; rows are the two equations' monomials.
	rows := make([][]series.Coef, 2*n)
	for i := range rows {
		rows[i] = make([]series.Coef, 2*n)
	}
	put := func(col int, eqC, eqS Poly) {
		for _, t := range eqC.Terms() {
			rows[index[[2]int{t.I, t.J}]][col] = t.C
		}
		for _, t := range eqS.Terms() {
			rows[n+index[[2]int{t.I, t.J}]][col] = t.C
		}
	}
	for k, m := range monos {
		p := Monomial(series.IntCoef(1), m[0], m[1])
		lp := d1(p).Add(p.Laplacian())
		put(k, lp, d2(p).Scale(series.IntCoef(-1))) // A's monomial: (d₁ + Δ)p in the cos row, −d₂p in the sin row
		put(n+k, d2(p), lp)                         // B's monomial: d₂p in the cos row, (d₁ + Δ)p in the sin row
	}
	rhs := make([]series.Coef, 2*n)
	for _, t := range w.Cos.Terms() {
		rhs[index[[2]int{t.I, t.J}]] = t.C
	}
	for _, t := range w.Sin.Terms() {
		rhs[n+index[[2]int{t.I, t.J}]] = t.C
	}
	x, _, ok := series.SolveLinear(rows, rhs)
	if !ok {
		return Wave{}, ErrResonant
	}
	var A, B Poly
	for k, m := range monos {
		A = A.Add(Monomial(x[k], m[0], m[1]))
		B = B.Add(Monomial(x[n+k], m[0], m[1]))
	}
	out := w
	out.Cos, out.Sin = A, B
	// The system is exact; check the result anyway, as the rest of the rule does.
	if !A.Laplacian().Add(d1(A)).Add(d2(B)).Equal(w.Cos) || !B.Laplacian().Add(d1(B)).Sub(d2(A)).Equal(w.Sin) {
		return Wave{}, errors.New("the resonant wave ansatz did not reduce exactly")
	}
	return out.canonical(), nil
}
