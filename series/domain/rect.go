package domain

import (
	"fmt"
	"math"
	"math/big"

	"psol/series"
	"psol/series/cart"
)

// Rect is the rectangle 0 < x < L, 0 < y < H.
type Rect struct{ L, H series.Coef }

func (Rect) Sides() []string { return []string{"left", "right", "bottom", "top"} }

func (d Rect) Describe() string {
	return "the rectangle 0 < x < " + d.L.Text() + ", 0 < y < " + d.H.Text()
}

func (d Rect) Contains(r, theta float64, env series.Env) (bool, error) {
	L, err := d.L.Float(env)
	if err != nil {
		return false, err
	}
	H, err := d.H.Float(env)
	x, y := r*math.Cos(theta), r*math.Sin(theta)
	const eps = 1e-12
	return x >= -eps*L && x <= L*(1+eps) && y >= -eps*H && y <= H*(1+eps), err
}

// RectParts are a rectangle's stages in x and y.
type RectParts struct {
	Particular cart.Poly
	Sides      []RectSide
}

// RectSide is one side's trace, correction and harmonic series.
type RectSide struct {
	Name       string
	Data       cart.Poly // in the side's coordinate
	Trace      cart.Poly
	Correction cart.Poly
	Series     cart.SideSeries
}

// solve: u = u_p + Σ four one-side series. The particular solution is the
// polynomial that vanishes on x = 0 and x = L (cart.Particular); each side's
// correction, a polynomial in the side's coordinate, is expanded in
// sin(nπs/ℓ) with the exact general term (series.SineCoefficient) and
// continued across by sinh(nπd/ℓ)/sinh(nπw/ℓ), which vanishes on the other
// three sides.
func (d Rect) solve(p *posed) (*Solution, error) {
	for _, name := range d.Sides() {
		if c := p.conds[name]; c.Kind != Dirichlet || !c.G.IsExact() {
			return nil, unsupported("the rectangle takes values on every side (u = g, g a polynomial) so far; %s has %q", name, c.Text)
		}
	}
	f, err := cart.FromPolar(p.f)
	if err != nil {
		return nil, unsupported("on the rectangle the source must be a polynomial in x and y so far, not %s", p.f.Text())
	}
	up := cart.Particular(f, d.L)
	// Add the harmonic a + bx + cy + dxy that takes the corrections' corner
	// values, so that every side's correction vanishes at its ends and its
	// sine series converges like 1/n³ rather than 1/n (common practice).
	up, err = withCornerFit(up, d, p)
	if err != nil {
		return nil, err
	}
	parts := &RectParts{Particular: up}
	sol := &Solution{Domain: d, Source: p.f, Rect: parts}
	if sol.Particular, err = toPolar(up); err != nil {
		return nil, err
	}
	sol.U = sol.Particular // the closed part; the side series are evaluated beside it
	zero := series.Coef{}
	at := map[string]func(cart.Poly) cart.Poly{
		"left":   func(q cart.Poly) cart.Poly { return q.AtX(zero) },
		"right":  func(q cart.Poly) cart.Poly { return q.AtX(d.L) },
		"bottom": func(q cart.Poly) cart.Poly { return q.AtY(zero) },
		"top":    func(q cart.Poly) cart.Poly { return q.AtY(d.H) },
	}
	sides := map[string]cart.Side{"left": cart.Left, "right": cart.Right, "bottom": cart.Bottom, "top": cart.Top}
	corner := map[string]series.Coef{}
	for _, name := range d.Sides() {
		g, err := cart.FromPolar(p.conds[name].G.Exact)
		if err != nil {
			return nil, unsupported("boundary data on %s must be a polynomial so far, not %s", name, p.conds[name].G.Text())
		}
		data := at[name](g)
		tr := at[name](up)
		corr := data.Sub(tr)
		cs, ok := corr.Coefficients()
		if !ok {
			return nil, unsupported("the data on %s depend on both x and y", name)
		}
		length := d.L
		if name == "left" || name == "right" {
			length = d.H
		}
		b, err := series.SineCoefficient(cs, length)
		if err != nil {
			return nil, err
		}
		parts.Sides = append(parts.Sides, RectSide{Name: name, Data: data, Trace: tr, Correction: corr, Series: cart.SideSeries{Side: sides[name], B: b, L: d.L, H: d.H}})
		where := map[string]string{"left": "0, y", "right": d.L.Text() + ", y", "bottom": "x, 0", "top": "x, " + d.H.Text()}[name]
		sol.Sides = append(sol.Sides, Side{Condition: p.conds[name], At: where, AtLaTeX: where, DataText: data.Text(), DataLaTeX: data.Text()})
		// Values at the two ends of the side, for the corner compatibility check.
		v0, _ := corr.AtX(zero).AtY(zero).Coefficients()
		vl, _ := corr.AtX(length).AtY(length).Coefficients()
		corner[name+"0"], corner[name+"1"] = first(v0), first(vl)
	}
	// Corners where the data of adjacent sides disagree: the series still
	// converge, to the mean, but slowly there.
	for _, c := range []struct{ a, b, where string }{
		{"left0", "bottom0", "(0, 0)"}, {"bottom1", "right0", "(L, 0)"}, {"right1", "top1", "(L, H)"}, {"top0", "left1", "(0, H)"},
	} {
		sideA, sideB := c.a[:len(c.a)-1], c.b[:len(c.b)-1]
		ga, _ := cart.FromPolar(p.conds[sideA].G.Exact)
		gb, _ := cart.FromPolar(p.conds[sideB].G.Exact)
		va, vb := cornerValue(ga, c.where, d), cornerValue(gb, c.where, d)
		if !va.Equal(vb) {
			sol.Notes = append(sol.Notes, fmt.Sprintf("the data disagree at the corner %s: %s gives %s, %s gives %s (a jump of %s)", c.where, sideA, va.Text(), sideB, vb.Text(), vb.Sub(va).Text()))
		}
	}
	res := up.Laplacian().Sub(f)
	resPolar, _ := toPolar(res)
	sol.Checks = []Check{{Name: "lap(u) - f", Exact: true, Residual: resPolar}}
	sol.rectEnv = p.env
	if ev, err := sol.Compile(p.env, p.tol, 1<<14); err == nil { // numeric parameters: sample the sides
		ev.walls = nil // sum the series on the sides themselves: the check must not read the data back
		sol.Checks = append(sol.Checks, rectChecks(d, sol, ev, p.env)...)
	}
	return sol, nil
}

func first(cs []series.Coef) series.Coef {
	if len(cs) == 0 {
		return series.Coef{}
	}
	return cs[0]
}

func cornerValue(g cart.Poly, where string, d Rect) series.Coef {
	zero := series.Coef{}
	x, y := zero, zero
	switch where {
	case "(L, 0)":
		x = d.L
	case "(L, H)":
		x, y = d.L, d.H
	case "(0, H)":
		y = d.H
	}
	cs, _ := g.AtX(x).AtY(y).Coefficients()
	return first(cs)
}

// toPolar writes a polynomial in x and y as a polar sum (x = r cos θ, y = r sin θ).
func toPolar(p cart.Poly) (series.Sum, error) {
	x := series.R.Mul(series.Trig(1, false))
	y := series.R.Mul(series.Trig(1, true))
	var out series.Sum
	for _, t := range p.Terms() {
		term := series.Const(t.C)
		for k := 0; k < t.I; k++ {
			term = term.Mul(x)
		}
		for k := 0; k < t.J; k++ {
			term = term.Mul(y)
		}
		out = out.Add(term)
	}
	return out, nil
}

// rectCheck samples the boundary: u − g on each side, away from the corners,
// with the series summed to tol (the sine series converge there pointwise).
func rectChecks(d Rect, sol *Solution, ev *Evaluator, env series.Env) []Check {
	L, _ := d.L.Float(env)
	H, _ := d.H.Float(env)
	var out []Check
	for _, s := range sol.Rect.Sides {
		worst := 0.0
		for k := 1; k < 20; k++ {
			t := float64(k) / 20
			var x, y, g float64
			switch s.Name {
			case "left":
				x, y = 0, t*H
			case "right":
				x, y = L, t*H
			case "bottom":
				x, y = t*L, 0
			case "top":
				x, y = t*L, H
			}
			along := x
			if s.Name == "left" || s.Name == "right" {
				along = y
			}
			g, _ = s.Data.Eval(along, along, env)
			u := ev.atXY(x, y)
			worst = math.Max(worst, math.Abs(u-g))
		}
		out = append(out, Check{Name: "u - g", Side: s.Name, Numeric: worst})
	}
	return out
}

// withCornerFit adds to up the bilinear harmonic w with w = g − up at the
// four corners (the mean of the two sides' values where they disagree).
func withCornerFit(up cart.Poly, d Rect, p *posed) (cart.Poly, error) {
	zero := series.Coef{}
	value := func(side string, x, y series.Coef) (series.Coef, error) {
		g, err := cart.FromPolar(p.conds[side].G.Exact)
		if err != nil {
			return series.Coef{}, unsupported("boundary data on %s must be a polynomial so far, not %s", side, p.conds[side].G.Text())
		}
		cs, _ := g.Sub(up).AtX(x).AtY(y).Coefficients()
		return first(cs), nil
	}
	corner := func(a, b string, x, y series.Coef) (series.Coef, error) {
		va, err := value(a, x, y)
		if err != nil {
			return series.Coef{}, err
		}
		vb, err := value(b, x, y)
		return va.Add(vb).MulRat(big.NewRat(1, 2)), err
	}
	c00, err := corner("left", "bottom", zero, zero)
	if err != nil {
		return cart.Poly{}, err
	}
	cL0, err := corner("bottom", "right", d.L, zero)
	if err != nil {
		return cart.Poly{}, err
	}
	cLH, err := corner("right", "top", d.L, d.H)
	if err != nil {
		return cart.Poly{}, err
	}
	c0H, err := corner("top", "left", zero, d.H)
	if err != nil {
		return cart.Poly{}, err
	}
	invL, _ := series.IntCoef(1).Div(d.L)
	invH, _ := series.IntCoef(1).Div(d.H)
	w := cart.Monomial(c00, 0, 0).
		Add(cart.X.Scale(cL0.Sub(c00).Mul(invL))).
		Add(cart.Y.Scale(c0H.Sub(c00).Mul(invH))).
		Add(cart.X.Mul(cart.Y).Scale(cLH.Sub(cL0).Sub(c0H).Add(c00).Mul(invL).Mul(invH)))
	return up.Add(w), nil
}
