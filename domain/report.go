package domain

import (
	"math"
	"math/big"

	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
)

// Report holds the figures users quote: extremes with their location, the
// area integral and mean of u, and the net outward flux next to the source
// integral (equal by the divergence theorem).
type Report struct {
	Max, Min       float64
	ArgMax, ArgMin [2]float64 // (r, θ)
	Integral       float64
	IntegralExact  *series.Coef // nil where a series or a divergence forbids
	Mean           float64
	Area           series.Coef
	Flux           float64
	FluxExact      *series.Coef
	Source         float64
	SourceExact    *series.Coef
	Bounded        string // a note where the region is unbounded
}

// Report computes the figures. Extremes come from a dense sample refined by a
// local search; integrals and fluxes are exact for closed forms.
func (s *Solution) Report(env series.Env, tol float64) (*Report, error) {
	// Thousands of evaluations, some on the boundary where a series converges
	// slowly: cap the terms (extremes need no more than a few digits there).
	ev, err := s.Compile(env, tol, ReportTerms)
	if err != nil {
		return nil, err
	}
	rep := &Report{}
	if err := s.Domain.figures(s, ev, rep, env, tol); err != nil {
		return nil, err
	}
	if A, err := rep.Area.Float(env); err == nil && A > 0 {
		rep.Mean = rep.Integral / A
	}
	return rep, nil
}

// sub substitutes the parameters' values in an exact figure and evaluates it.
func sub(c series.Coef, env series.Env) (series.Coef, float64, error) {
	c, err := c.Subst(env)
	if err != nil {
		return c, 0, err
	}
	v, err := c.Float(env)
	return c, v, err
}

// circularFigures is the report of a region bounded by circles: exact area,
// integrals and flux for closed forms, the quadrature's share, and extremes
// over the polar box.
func circularFigures(d circular, s *Solution, ev *Evaluator, rep *Report, env series.Env) error {
	sub := func(c series.Coef) (series.Coef, float64, error) { return sub(c, env) }
	in, out := d.bounds()
	if area, err := areaOf(in, out); err == nil {
		rep.Area = area
	}
	if out == nil {
		rep.Bounded = "the region is unbounded: extremes are over R <= r <= 10R, and u has no finite area integral unless it decays"
		rep.Integral, rep.Mean = math.NaN(), math.NaN() // unless the integral below converges
	}
	if c, err := s.U.AreaIntegral(in, out); err == nil { // series modes n ≥ 1 integrate to zero
		c, v, err := sub(c)
		if err == nil {
			rep.IntegralExact, rep.Integral = &c, v
		}
	}
	flux := series.Coef{}
	for _, c := range d.circles() {
		dn, err := c.apply(Condition{Kind: Neumann}, s.U)
		if err != nil {
			return err
		}
		k := series.Coef{}
		for _, t := range dn.Terms() {
			if t.M == 0 && t.K == 0 {
				k = t.C
			}
		}
		flux = flux.Add(k.Mul(c.radius).Mul(series.SymCoef(series.Pi)).MulRat(ratOf(2)))
	}
	if c, v, err := sub(flux); err == nil {
		rep.FluxExact, rep.Flux = &c, v
	}
	if c, err := s.Source.AreaIntegral(in, out); err == nil {
		if c, v, err := sub(c); err == nil {
			rep.SourceExact, rep.Source = &c, v
		}
	}
	if q := s.Quadrature; q != nil { // the numeric particular solution's share
		g, p := q.Integrals(0, 2*math.Pi)
		rep.Source, rep.SourceExact = rep.Source+g, nil
		rep.Integral, rep.IntegralExact = rep.Integral+p, nil
		for _, c := range d.circles() {
			R, err := c.radius.Float(env)
			if err != nil {
				return err
			}
			rep.Flux += float64(c.outward) * q.Flux(R, 0, 2*math.Pi)
		}
		rep.FluxExact = nil
	}
	return polarExtremes(d, ev, rep, env)
}

func areaOf(in, out *series.Coef) (series.Coef, error) {
	one := series.Const(series.IntCoef(1))
	return one.AreaIntegral(in, out)
}

// sectorFlux is ∮ ∂u/∂n ds over arc and rays by Gauss–Legendre panels, with
// central differences for the normal derivative.
// inward is f′(0) by the one-sided third-order difference
// (−11f(0) + 18f(h) − 9f(2h) + 2f(3h))/(6h), error h³f⁗/4 (common practice):
// with h about ε^(1/4) of the scale, truncation and rounding both near 1e-12.
func inward(f func(float64) float64, h float64) float64 {
	return (-11*f(0) + 18*f(h) - 9*f(2*h) + 2*f(3*h)) / (6 * h)
}

func sectorFlux(d Sector, ev *Evaluator, env series.Env) (float64, error) {
	R, err := d.R.Float(env)
	if err != nil {
		return 0, err
	}
	alpha, _ := d.Alpha.Float(nil)
	u := func(r, th float64) float64 { v, _, _ := ev.At(r, th); return v }
	const h = 1e-4
	total := 0.0
	for i := 0; i < 16; i++ {
		a, b := alpha*float64(i)/16, alpha*float64(i+1)/16
		for k, x := range legendreX {
			th := (a+b)/2 + (b-a)/2*x
			dn := -inward(func(s float64) float64 { return u(R-s, th) }, h*R)
			total += (b - a) / 2 * legendreW[k] * R * dn
		}
	}
	for i := 0; i < 16; i++ {
		a, b := R*float64(i)/16, R*float64(i+1)/16
		for k, x := range legendreX {
			r := (a+b)/2 + (b-a)/2*x
			start := -inward(func(s float64) float64 { return u(r, s) }, h) / r
			end := -inward(func(s float64) float64 { return u(r, alpha-s) }, h) / r
			total += (b - a) / 2 * legendreW[k] * (start + end)
		}
	}
	return total, nil
}

// polarExtremes fills the report's extremes over a region that is a polar box.
func polarExtremes(d Domain, ev *Evaluator, rep *Report, env series.Env) (err error) {
	rep.Max, rep.ArgMax, rep.Min, rep.ArgMin, err = extremes(d, ev, env)
	return err
}

// extremes samples the closed region densely, then refines the best points
// by a shrinking pattern search that stays inside the region.
func extremes(d Domain, ev *Evaluator, env series.Env) (maxV float64, argMax [2]float64, minV float64, argMin [2]float64, err error) {
	shape, err := d.Shape(env)
	if err != nil {
		return
	}
	rlo, rhi, tlo, thi := shape.Polar.RMin, shape.Polar.Reach(), 0.0, shape.Polar.Span
	u := func(p [2]float64) float64 { v, _, _ := ev.At(p[0], p[1]); return v }
	maxV, minV = math.Inf(-1), math.Inf(1)
	nr, nt := 48, 96
	for i := 0; i <= nr; i++ {
		for j := 0; j <= nt; j++ {
			p := [2]float64{rlo + (rhi-rlo)*float64(i)/float64(nr), tlo + (thi-tlo)*float64(j)/float64(nt)}
			v := u(p)
			if v > maxV {
				maxV, argMax = v, p
			}
			if v < minV {
				minV, argMin = v, p
			}
		}
	}
	refine := func(p [2]float64, sign float64) ([2]float64, float64) {
		best := sign * u(p)
		dr, dt := (rhi-rlo)/float64(nr), (thi-tlo)/float64(nt)
		for it := 0; it < 60 && (dr > 1e-12*(rhi+1) || dt > 1e-12); it++ {
			moved := false
			for _, step := range [][2]float64{{dr, 0}, {-dr, 0}, {0, dt}, {0, -dt}} {
				q := [2]float64{p[0] + step[0], p[1] + step[1]}
				if q[0] < rlo || q[0] > rhi || q[1] < tlo || q[1] > thi {
					continue
				}
				if v := sign * u(q); v > best {
					best, p, moved = v, q, true
				}
			}
			if !moved {
				dr, dt = dr/2, dt/2
			}
		}
		return p, sign * best
	}
	argMax, maxV = refine(argMax, 1)
	argMin, minV = refine(argMin, -1)
	if argMax[0] < 1e-9 {
		argMax[1] = 0 // the centre has no angle
	}
	if argMin[0] < 1e-9 {
		argMin[1] = 0
	}
	return
}

// rectFlux is ∮ ∂u/∂n ds over the four sides, by Gauss–Legendre panels and
// one-sided differences inward.
func rectFlux(d Rect, ev *Evaluator, env series.Env) (float64, error) {
	L, err := d.L.Float(env)
	if err != nil {
		return 0, err
	}
	H, err := d.H.Float(env)
	if err != nil {
		return 0, err
	}
	u := ev.atXY
	total := 0.0
	side := func(length float64, dn func(s float64) float64) {
		for i := 0; i < 16; i++ {
			a, b := length*float64(i)/16, length*float64(i+1)/16
			for k, x := range legendreX {
				total += (b - a) / 2 * legendreW[k] * dn((a+b)/2+(b-a)/2*x)
			}
		}
	}
	h := 1e-4 * math.Min(L, H)
	side(L, func(x float64) float64 { return -inward(func(t float64) float64 { return u(x, t) }, h) })   // bottom: −∂u/∂y
	side(L, func(x float64) float64 { return -inward(func(t float64) float64 { return u(x, H-t) }, h) }) // top: ∂u/∂y
	side(H, func(y float64) float64 { return -inward(func(t float64) float64 { return u(t, y) }, h) })   // left: −∂u/∂x
	side(H, func(y float64) float64 { return -inward(func(t float64) float64 { return u(L-t, y) }, h) }) // right: ∂u/∂x
	return total, nil
}

// rectExtremes samples the rectangle densely; the location is given in polar
// form like every other region's (r, θ of the point (x, y)).
func rectExtremes(d Rect, ev *Evaluator, env series.Env) (maxV float64, argMax [2]float64, minV float64, argMin [2]float64, err error) {
	L, err := d.L.Float(env)
	if err != nil {
		return
	}
	H, err := d.H.Float(env)
	if err != nil {
		return
	}
	maxV, minV = math.Inf(-1), math.Inf(1)
	const n = 96
	for i := 0; i <= n; i++ {
		for j := 0; j <= n; j++ {
			x, y := L*float64(i)/n, H*float64(j)/n
			v := ev.atXY(x, y)
			p := [2]float64{math.Hypot(x, y), math.Atan2(y, x)}
			if v > maxV {
				maxV, argMax = v, p
			}
			if v < minV {
				minV, argMin = v, p
			}
		}
	}
	return
}

// rectIntegral is ∬ p dA over the rectangle: ∬ x^i y^j = L^(i+1) H^(j+1)/((i+1)(j+1)).
func rectIntegral(p cart.Poly, d Rect) series.Coef {
	total := series.Coef{}
	for _, t := range p.Terms() {
		lp, _ := d.L.Pow(big.NewRat(int64(t.I+1), 1))
		hp, _ := d.H.Pow(big.NewRat(int64(t.J+1), 1))
		total = total.Add(t.C.Mul(lp).Mul(hp).MulRat(big.NewRat(1, int64((t.I+1)*(t.J+1)))))
	}
	return total
}

// integrateRect is ∬ f over [0, L] × [0, H] by 16-point Gauss–Legendre on 12 × 12 panels.
func integrateRect(f func(x, y float64) float64, L, H float64) float64 {
	return ansatz.TensorIntegral(f, L, H, 12)
}

// AreaIntegral is ∬ u dA over a rectangle: the polynomial part exactly, the
// side series term by term, the waves and the quadrature by a tensor rule.
func (s *Solution) AreaIntegral(env series.Env, tol float64) (float64, error) {
	if s.Rect == nil {
		rep, err := s.Report(env, tol)
		if err != nil {
			return 0, err
		}
		return rep.Integral, nil
	}
	ev, err := s.Compile(env, tol, ReportTerms)
	if err != nil {
		return 0, err
	}
	return s.Rect.areaIntegral(ev, env, tol)
}

func (rp *RectParts) areaIntegral(ev *Evaluator, env series.Env, tol float64) (float64, error) {
	d := rp.d
	c, err := rectIntegral(rp.Particular, d).Subst(env)
	if err != nil {
		return 0, err
	}
	total, err := c.Float(env)
	if err != nil {
		return 0, err
	}
	for _, side := range ev.rect {
		total += side.Integral(tol, 1<<20)
	}
	L, _ := d.L.Float(env)
	H, _ := d.H.Float(env)
	if ev.waves != nil {
		total += integrateRect(ev.waves.At, L, H)
	}
	if q := rp.Quadrature; q != nil {
		total += integrateRect(func(x, y float64) float64 { v, _ := q.At(x, y); return v }, L, H)
	}
	return total, nil
}
