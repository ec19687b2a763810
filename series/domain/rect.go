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

// solve: u = u_p + Σ four one-side series, one per side with data. The particular solution is the
// polynomial that vanishes on x = 0 and x = L (cart.Particular); each side's
// correction, a polynomial in the side's coordinate, is expanded in
// sin(nπs/ℓ) with the exact general term (series.SineCoefficient) and
// continued across by sinh(nπd/ℓ)/sinh(nπw/ℓ), which vanishes on the other
// three sides.
func (d Rect) solve(p *posed) (*Solution, error) {
	allValues, anyValues := true, false
	for _, name := range d.Sides() {
		c := p.conds[name]
		if c.Kind == Robin || !c.G.IsExact() {
			return nil, unsupported("the rectangle takes u = g or dn(u) = g on each side, g a polynomial, so far; %s has %q", name, c.Text)
		}
		allValues = allValues && c.Kind == Dirichlet
		anyValues = anyValues || c.Kind == Dirichlet
	}
	if !anyValues {
		return nil, unsupported("the rectangle needs values (u = g) on at least one side so far")
	}
	f, err := cart.FromPolar(p.f)
	if err != nil {
		return nil, unsupported("on the rectangle the source must be a polynomial in x and y so far, not %s", p.f.Text())
	}
	up := cart.Particular(f, d.L)
	if allValues {
		// Add the harmonic a + bx + cy + dxy that takes the corrections' corner
		// values, so that every side's correction vanishes at its ends and its
		// sine series converges like 1/n³ rather than 1/n (common practice).
		if up, err = withCornerFit(up, d, p); err != nil {
			return nil, err
		}
	}
	parts := &RectParts{Particular: up}
	sol := &Solution{Domain: d, Source: p.f, Rect: parts}
	if sol.Particular, err = toPolar(up); err != nil {
		return nil, err
	}
	sol.U = sol.Particular // the closed part; the side series are evaluated beside it
	zero := series.Coef{}
	// Each side: where it lies, its operator (u or the outward derivative),
	// its neighbours at s = 0 and s = ℓ, and its opposite side.
	geometry := map[string]struct {
		side             cart.Side
		at               func(cart.Poly) cart.Poly
		normal           func(cart.Poly) cart.Poly
		length           series.Coef
		start, end, away string
	}{
		"left":   {cart.Left, func(q cart.Poly) cart.Poly { return q.AtX(zero) }, func(q cart.Poly) cart.Poly { return q.DX().Scale(series.IntCoef(-1)).AtX(zero) }, d.H, "bottom", "top", "right"},
		"right":  {cart.Right, func(q cart.Poly) cart.Poly { return q.AtX(d.L) }, func(q cart.Poly) cart.Poly { return q.DX().AtX(d.L) }, d.H, "bottom", "top", "left"},
		"bottom": {cart.Bottom, func(q cart.Poly) cart.Poly { return q.AtY(zero) }, func(q cart.Poly) cart.Poly { return q.DY().Scale(series.IntCoef(-1)).AtY(zero) }, d.L, "left", "right", "top"},
		"top":    {cart.Top, func(q cart.Poly) cart.Poly { return q.AtY(d.H) }, func(q cart.Poly) cart.Poly { return q.DY().AtY(d.H) }, d.L, "left", "right", "bottom"},
	}
	for _, name := range d.Sides() {
		geo := geometry[name]
		cond := p.conds[name]
		g, err := cart.FromPolar(cond.G.Exact)
		if err != nil {
			return nil, unsupported("boundary data on %s must be a polynomial so far, not %s", name, cond.G.Text())
		}
		data := geo.at(g)
		tr := geo.at(up)
		if cond.Kind == Neumann {
			tr = geo.normal(up)
		}
		corr := data.Sub(tr)
		ser, err := sideSeries(geo.side, corr, geo.length, d, p.conds[geo.start].Kind == Neumann, p.conds[geo.end].Kind == Neumann, cond.Kind == Neumann, p.conds[geo.away].Kind == Neumann)
		if err != nil {
			return nil, err
		}
		parts.Sides = append(parts.Sides, RectSide{Name: name, Data: data, Trace: tr, Correction: corr, Series: ser})
		where := map[string]string{"left": "0, y", "right": d.L.Text() + ", y", "bottom": "x, 0", "top": "x, " + d.H.Text()}[name]
		sol.Sides = append(sol.Sides, Side{Condition: cond, At: where, AtLaTeX: where, DataText: data.Text(), DataLaTeX: data.Text()})
	}
	if allValues {
		cornerWarnings(d, p, sol)
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
			if sol.Sides[k0(s.Name)].Condition.Kind == Neumann { // the outward derivative, one-sided inward
				h := 1e-4 * math.Min(L, H)
				dx, dy := map[string][2]float64{"left": {1, 0}, "right": {-1, 0}, "bottom": {0, 1}, "top": {0, -1}}[s.Name][0], map[string][2]float64{"left": {1, 0}, "right": {-1, 0}, "bottom": {0, 1}, "top": {0, -1}}[s.Name][1]
				u = -(-3*u + 4*ev.atXY(x+h*dx, y+h*dy) - ev.atXY(x+2*h*dx, y+2*h*dy)) / (2 * h)
			}
			worst = math.Max(worst, math.Abs(u-g))
		}
		out = append(out, Check{Name: OperatorText(sol.Sides[k0(s.Name)].Condition, "u") + " - g", Side: s.Name, Numeric: worst})
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

// sideSeries expands a side's correction c(s), s ∈ [0, ℓ], in the family the
// neighbours set (values: sine ends; insulated: cosine ends), through θ = πs/ℓ
// so that series.ProjectPieces gives the exact general term; the constant
// mode of a cosine family is computed apart.
func sideSeries(side cart.Side, corr cart.Poly, length series.Coef, d Rect, startN, endN, flux, insulated bool) (cart.SideSeries, error) {
	fam := series.Family{Sin: !startN, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}
	switch {
	case startN && endN:
		fam.From = 0
	case startN != endN:
		fam.Offset = big.NewRat(-1, 2)
	}
	cs, ok := corr.Coefficients()
	if !ok {
		return cart.SideSeries{}, unsupported("the data on side %v depend on both x and y", side)
	}
	scale, err := length.Div(series.SymCoef(series.Pi)) // s = (ℓ/π) θ
	if err != nil {
		return cart.SideSeries{}, err
	}
	var theta series.Sum
	for k, c := range cs {
		pw, _ := scale.Pow(big.NewRat(int64(k), 1))
		theta = theta.Add(series.NewSum(series.Term{C: c.Mul(pw), K: k}))
	}
	pieces := []series.Piece{{From: big.NewRat(0, 1), To: big.NewRat(1, 1), Value: series.ExactField(theta)}}
	b, err := series.ProjectPieces(pieces, fam, big.NewRat(1, 1), 0, false)
	if err != nil {
		return cart.SideSeries{}, err
	}
	ser := cart.SideSeries{Side: side, B: b, L: d.L, H: d.H, Fam: fam, Flux: flux, Insulated: insulated}
	if fam.From == 0 {
		b0, err := series.ProjectPieces(pieces, fam, big.NewRat(1, 1), 0, true)
		if err != nil {
			return cart.SideSeries{}, err
		}
		if flux && insulated && !b0.IsZero() {
			return cart.SideSeries{}, unsolvable("the flux data are incompatible with the source: the mean of the correction on side %v is %s, not 0", side, b0.Text())
		}
		// The constant mode's factor across is 1, d or d/w (see cart.SideSeries): scale to the operator.
		ser.B0 = &b0
	}
	return ser, nil
}

// k0 is the index of a side in Sides().
func k0(name string) int {
	return map[string]int{"left": 0, "right": 1, "bottom": 2, "top": 3}[name]
}

// cornerWarnings names the corners where the data of adjacent sides disagree:
// the series still converge, to the mean, but slowly there.
func cornerWarnings(d Rect, p *posed, sol *Solution) {
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
}
