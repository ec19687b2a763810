package domain

import (
	"errors"
	"math"
	"math/big"
	"sort"

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
	// Sides is the outward flux through each side, in the order of Sides().
	Sides []SideFlux
	// FluxInfinite, where set, says why the net flux is not finite.
	FluxInfinite string
	// Gradient is the largest |∇u| and where; nil in a symbolic report.
	Gradient *GradientPeak
	// Symbolic marks a report with parameters left without values: only
	// the exact figures are filled (the numbers are NaN), and Open names
	// what the numbers would need.
	Symbolic bool
	Open     []string
}

// Report computes the figures. Extremes come from a dense sample refined by a
// local search; integrals and fluxes are exact for closed forms.
func (s *Solution) Report(env series.Env, tol float64) (*Report, error) {
	// Thousands of evaluations, some on the boundary where a series converges
	// slowly: cap the terms (extremes need no more than a few digits there).
	ev, err := s.Compile(env, tol, ReportTerms)
	var unbound series.ErrUnbound
	if errors.As(err, &unbound) && s.IsClosed() {
		return s.symbolicReport(unbound.Name)
	}
	if err != nil {
		return nil, err
	}
	rep := &Report{}
	if err := s.Domain.figures(s, ev, rep, env, tol); err != nil {
		return nil, err
	}
	// The region's figures cover w; u_s's share is added below (pointFigures).
	pts := ev.pts
	ev.pts = nil
	if A, err := rep.Area.Float(env); err == nil && A > 0 {
		rep.Mean = rep.Integral / A
	}
	shape, err := s.Domain.Shape(env)
	if err != nil {
		return nil, err
	}
	if rep.Sides == nil { // regions with no exact side fluxes: by panels
		rep.Sides = sideFluxes(shape, ev)
		rep.Flux, rep.FluxExact = 0, nil
		for _, f := range rep.Sides {
			rep.Flux += f.Value
		}
	}
	ev.pts = pts
	if s.Waves != nil && s.Section == nil { // a disk's or an annulus's waves (sections count theirs)
		if err := s.circleWaveFigures(rep, shape, env); err != nil {
			return nil, err
		}
	}
	if s.Points != nil {
		if err := s.pointFigures(rep, shape, env); err != nil {
			return nil, err
		}
		s.markCornerJumps(rep)
		return rep, nil
	}
	// The containment test built once: a holed section's Contains builds
	// its holes' numbers afresh (a polygonal hole's centre by a 32 × 32
	// search), and the interior scan asks it 16,000 times: 1.2 s of an L
	// shape's report with a square hole and a non-constant source.
	inside := InsideXY(s.Domain, env)
	if _, constant := s.constantSource(); constant {
		inside = nil // the peak of |∇u| is on the boundary
	}
	g := gradientPeak(shape, ev, inside)
	if s.IsClosed() && !g.Corner {
		// A closed solution's gradient at the peak found, from the exact
		// derivatives: the value to rounding, not to the differences' 1e-9.
		if v, ok := exactGradient(s.U, env, g.At); ok {
			g.Value, g.Exact = v, true
		}
	}
	rep.Gradient = &g
	s.markCornerJumps(rep)
	return rep, nil
}

// markCornerJumps makes the figures a jump in the data at a corner spoils
// say so: the two sides' fluxes are infinite (∂u/∂n grows like 1/distance
// from the corner, whose integral diverges), so is the balance, and |∇u| has
// no maximum. Differences and sums had printed finite numbers there (11.76
// through a side, |∇u| = 1611).
func (s *Solution) markCornerJumps(rep *Report) {
	for _, j := range s.CornerJumps {
		if j.Sides[0] == j.Sides[1] { // within a side: its flux stays finite
			if rep.Gradient == nil || !math.IsInf(rep.Gradient.Value, 1) {
				rep.Gradient = &GradientPeak{Value: math.Inf(1), At: j.At, Unbounded: j.Where()}
			}
			continue
		}
		for i := range rep.Sides {
			if rep.Sides[i].Side == j.Sides[0] || rep.Sides[i].Side == j.Sides[1] {
				rep.Sides[i].Value, rep.Sides[i].Exact, rep.Sides[i].Infinite = math.NaN(), nil, j.Where()
			}
		}
		rep.Flux, rep.FluxExact, rep.FluxInfinite = math.NaN(), nil, "the data jump at a corner"
		if rep.Gradient == nil || !math.IsInf(rep.Gradient.Value, 1) {
			rep.Gradient = &GradientPeak{Value: math.Inf(1), At: j.At, Unbounded: j.Where()}
		}
	}
}

// exactGradient is |∇u| = √(u_r² + (u_θ/r)²) at (x, y) from the exact
// derivatives of a closed u.
func exactGradient(u series.Sum, env series.Env, at [2]float64) (float64, bool) {
	ur, err1 := u.DR().Compile(env)
	ut, err2 := u.DTheta().Compile(env)
	if err1 != nil || err2 != nil {
		return 0, false
	}
	r := math.Hypot(at[0], at[1])
	if r == 0 {
		return 0, false
	}
	th := math.Atan2(at[1], at[0])
	v := math.Hypot(ur.At(r, th), ut.At(r, th)/r)
	return v, !math.IsNaN(v) && !math.IsInf(v, 0)
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
		k, err := circleFlux(c, s.U)
		if err != nil {
			return err
		}
		flux = flux.Add(k)
		side := SideFlux{Side: c.name}
		if k, v, err := sub(k); err == nil {
			side.Exact, side.Value = &k, v
		}
		rep.Sides = append(rep.Sides, side)
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
			qf := float64(c.outward) * q.Flux(R, 0, 2*math.Pi)
			rep.Flux += qf
			for i := range rep.Sides {
				if rep.Sides[i].Side == c.name {
					rep.Sides[i].Value += qf
					rep.Sides[i].Exact = nil
				}
			}
		}
		rep.FluxExact = nil
	}
	return polarExtremes(d, ev, rep, env)
}

func areaOf(in, out *series.Coef) (series.Coef, error) {
	one := series.Const(series.IntCoef(1))
	return one.AreaIntegral(in, out)
}

// inward is f′(0) by the one-sided third-order difference
// (−11f(0) + 18f(h) − 9f(2h) + 2f(3h))/(6h), error h³f⁗/4 (common practice):
// with h about ε^(1/4) of the scale, truncation and rounding both near 1e-12.
func inward(f func(float64) float64, h float64) float64 {
	return (-11*f(0) + 18*f(h) - 9*f(2*h) + 2*f(3*h)) / (6 * h)
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

// circleFlux is the exact outward flux of u through a circle: 2πR times the
// mean of ∂u/∂n there (modes n ≥ 1 integrate to zero).
func circleFlux(c circle, u series.Sum) (series.Coef, error) {
	dn, err := c.apply(Condition{Kind: Neumann}, u)
	if err != nil {
		return series.Coef{}, err
	}
	k := series.Coef{}
	for _, t := range dn.Terms() {
		if t.M == 0 && t.K == 0 {
			k = t.C
		}
	}
	return k.Mul(circleLength(c.radius)), nil
}

// symbolicReport is the report of a closed solution whose parameters have no
// values: the exact area, integrals and side fluxes, with the parameters as
// symbols (J = πa⁴/2), and NaN where a figure needs numbers (the extremes).
func (s *Solution) symbolicReport(open string) (*Report, error) {
	m := s.Domain.Measures()
	nan := math.NaN()
	rep := &Report{Symbolic: true, Open: s.openParams(open), Area: m.Area, Max: nan, Min: nan, Integral: nan, Mean: nan, Flux: nan, Source: nan}
	if m.Unbounded {
		rep.Bounded = "the region is unbounded"
		return rep, nil
	}
	if c, err := s.Domain.integral(s.U); err == nil {
		rep.IntegralExact = &c
	}
	if c, err := s.Domain.integral(s.Source); err == nil {
		rep.SourceExact = &c
		// The divergence theorem: the net outward flux is the source integral.
		rep.FluxExact = &c
	}
	if d, ok := s.Domain.(circular); ok {
		for _, c := range d.circles() {
			side := SideFlux{Side: c.name, Value: nan}
			if k, err := circleFlux(c, s.U); err == nil {
				side.Exact = &k
			}
			rep.Sides = append(rep.Sides, side)
		}
	}
	return rep, nil
}

// circularIntegral is ∬u dA between a circular region's bounds.
func circularIntegral(d circular, u series.Sum) (series.Coef, error) {
	in, out := d.bounds()
	return u.AreaIntegral(in, out)
}

// openParams are the parameters of the solution and its region that have no
// value, sorted (first, the one an evaluation stopped at, if it is not there).
func (s *Solution) openParams(first string) []string {
	used := map[string]bool{}
	s.U.Params(used)
	s.Source.Params(used)
	m := s.Domain.Measures()
	m.Area.Params(used)
	for _, l := range m.Lengths {
		l.Params(used)
	}
	var out []string
	for name := range used {
		if _, ok := s.Options.Env[name]; !ok {
			out = append(out, name)
		}
	}
	sort.Strings(out)
	if len(out) == 0 {
		out = []string{first}
	}
	return out
}

// setSideFluxes takes a region's side fluxes and their balance: exact where
// every side's is.
func (rep *Report) setSideFluxes(sides []SideFlux) {
	rep.Sides, rep.Flux, rep.FluxExact = sides, 0, nil
	exact, closed := series.Coef{}, true
	for _, f := range sides {
		rep.Flux += f.Value
		if f.Exact == nil {
			closed = false
			continue
		}
		exact = exact.Add(*f.Exact)
	}
	if closed {
		rep.FluxExact = &exact
	}
}
