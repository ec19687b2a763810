package domain

import (
	"fmt"
	"math/big"

	"psol/series"
)

// Exact checks of an image system's claims, in the polynomial algebra: each
// logarithm C·ln P is harmonic away from its centre (P·ΔP = |∇P|², as
// polynomials), the field is odd or even under the reflection in each ray
// (each log has a partner at the mirrored centre with the same scale and
// the opposite or the same strength), and on a circle the logs pair off so
// that the trace is the stated constant (P₁ ≡ P₂ modulo x² + y² − R²; with
// a flux, r∂_r(P₁P₂) ≡ 2P₁P₂ too). Nothing is sampled.

// harmonicLogs checks Δ(C·ln P) = 0 away from the centre for every log. A
// row, ln|sin(π(z − z₀)/p)|², is the log of an analytic function's modulus
// squared, harmonic away from its zeros by construction (no polynomial).
func harmonicLogs(pp *PointPart) error {
	for _, l := range pp.Logs {
		if l.rowed() {
			continue
		}
		p := l.Poly()
		grad := p.DX().Mul(p.DX()).Add(p.DY().Mul(p.DY()))
		if !p.Mul(p.Laplacian()).Sub(grad).IsZero() {
			return fmt.Errorf("the log of %s is not harmonic", p.Text())
		}
	}
	return nil
}

// mirroredLogs checks that the logs are symmetric (mirror = 1) or
// antisymmetric (mirror = −1) under the reflection (x, y) → (c·x + s·y,
// s·x − c·y) in the ray at angle β, c = cos 2β, s = sin 2β.
func mirroredLogs(pp *PointPart, c, s, mirror series.Coef) error {
	for _, l := range pp.Logs {
		mx, my := c.Mul(l.X).Add(s.Mul(l.Y)), s.Mul(l.X).Sub(c.Mul(l.Y))
		found := false
		for _, m := range pp.Logs {
			if m.X.Equal(mx) && m.Y.Equal(my) && m.scale().Equal(l.scale()) && m.C.Equal(l.C.Mul(mirror)) {
				found = true
				break
			}
		}
		if !found {
			return fmt.Errorf("the log centred at (%s, %s) has no mirror image in the ray", l.X.Text(), l.Y.Text())
		}
	}
	if !mirror.Equal(series.IntCoef(1)) && !pp.Const.IsZero() {
		return fmt.Errorf("a constant in a field odd about a ray")
	}
	return nil
}

// circleTrace checks that on the circle of radius R the field's value
// (Dirichlet) or its derivative along the outward normal (Neumann; the
// normal is r̂ times outward) is the constant want.
func circleTrace(pp *PointPart, R series.Coef, kind Kind, outward int, want series.Coef) error {
	R2 := R.Mul(R)
	used := make([]bool, len(pp.Logs))
	total := series.Coef{}
	if kind == Dirichlet {
		total = pp.Const
	}
	for k, l := range pp.Logs {
		if used[k] {
			continue
		}
		used[k] = true
		p := l.Poly()
		if k0, ok := p.ModCircle(R2).Const(); ok { // centred at the origin: constant on the circle
			switch kind {
			case Dirichlet:
				ln, err := k0.Ln()
				if err != nil {
					return err
				}
				total = total.Add(l.C.Mul(ln))
			case Neumann: // r∂_r P = 2P: ∂_r(C ln P) = 2C/R
				total = total.Add(mustDiv(l.C.MulRat(big.NewRat(2, 1)), R))
			}
			continue
		}
		partner := -1
		for j, m := range pp.Logs {
			if used[j] {
				continue
			}
			same := m.C.Equal(l.C)
			if kind == Dirichlet {
				same = m.C.Equal(l.C.Neg())
			}
			if same && p.Sub(m.Poly()).ModCircle(R2).IsZero() {
				partner = j
				break
			}
		}
		if partner < 0 {
			return fmt.Errorf("the log of %s has no partner on the circle", p.Text())
		}
		used[partner] = true
		if kind == Neumann { // ∂_r(C ln P₁ + C ln P₂) = C(r∂_rP₁ + r∂_rP₂)/(R·P₁) with P₁ ≡ P₂
			q := pp.Logs[partner].Poly()
			if !p.RadialDerivative().Add(q.RadialDerivative()).Sub(p.Scale(series.IntCoef(2))).ModCircle(R2).IsZero() {
				return fmt.Errorf("the pair's flux is not uniform on the circle")
			}
			total = total.Add(mustDiv(l.C.MulRat(big.NewRat(2, 1)), R))
		}
	}
	if kind == Neumann && outward < 0 {
		total = total.Neg()
	}
	if !total.Equal(want) {
		return fmt.Errorf("the trace on the circle is %s, not the stated %s", total.Text(), want.Text())
	}
	return nil
}

// exactImageCheck is the check line of an image rule's exact verification.
func exactImageCheck(pp *PointPart, verify func() error) Check {
	c := Check{Name: "lap(u_s) away from the sources, and B[u_s] less its stated trace on every side", Exact: true}
	if !pp.ExactTraces() { // a row of images closes the walls only
		c.Name = "lap(u_s) away from the sources, and B[u_s] on the walls"
	}
	err := harmonicLogs(pp)
	if err == nil {
		err = verify()
	}
	if err != nil {
		c.Name = "IMAGE CHECK FAILED: " + err.Error()
		c.Residual = series.Const(series.IntCoef(1))
		c.independentFailed = true
	}
	return c
}

// The three rules' claims.

func verifyDisk(d Domain, conds map[string]Condition, pp *PointPart) error {
	return circleTrace(pp, d.(Disk).R, conds["rim"].Kind, 1, traceConst(pp, "rim"))
}

func verifyOutside(d Domain, conds map[string]Condition, pp *PointPart) error {
	return circleTrace(pp, d.(Outside).R, Dirichlet, -1, traceConst(pp, "rim"))
}

func verifySector(d Domain, conds map[string]Condition, pp *PointPart) error {
	s := d.(Sector)
	mirror := series.IntCoef(-1)
	if conds["start"].Kind == Neumann {
		mirror = series.IntCoef(1)
	}
	if err := mirroredLogs(pp, series.IntCoef(1), series.Coef{}, mirror); err != nil { // the start ray, θ = 0
		return err
	}
	q, _ := s.Alpha.Div(series.SymCoef(series.Pi))
	frac, _ := q.Rat()
	c, sn, ok := cosSinPi(new(big.Rat).Mul(frac, big.NewRat(2, 1)))
	if !ok {
		return fmt.Errorf("no exact reflection in the end ray")
	}
	if err := mirroredLogs(pp, c, sn, mirror); err != nil {
		return err
	}
	return circleTrace(pp, s.R, conds["arc"].Kind, 1, traceConst(pp, "arc"))
}

// traceConst is the stated exact trace on a side.
func traceConst(pp *PointPart, side string) series.Coef {
	c, _ := pp.Traces[side].Exact.Const()
	return c
}
