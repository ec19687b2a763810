package domain

import (
	"fmt"
	"math"
	"math/big"

	"psol/series"
	"psol/series/cart"
)

// ClaimCheck is one verification of a claimed solution.
type ClaimCheck struct {
	Name     string
	Side     string // "" for the equation
	Exact    bool
	Residual series.Sum // exact residual (when Exact)
	Max      float64    // largest numeric residual; for an exact one, its largest size on samples (NaN where parameters have no values)
	Where    [2]float64 // (r, θ) of the largest numeric residual
	// Text is the exact residual in the region's own coordinates (x and y
	// on the rectangle), as Describe prints it.
	Text string
}

// Holds reports a vanishing residual: exactly zero, or numerically below tol.
func (c ClaimCheck) Holds(tol float64) bool {
	if c.Exact {
		return c.Residual.IsZero()
	}
	return c.Max <= tol
}

// CheckClaim verifies a claimed solution of Δu = f with the conditions:
// exactly when the claim and the data are closed forms, numerically (finite
// differences and boundary samples) otherwise.
func CheckClaim(d Domain, f series.Field, conds []Condition, claim series.Field, env series.Env) ([]ClaimCheck, error) {
	byName := map[string]Condition{}
	for _, c := range conds {
		byName[c.Side] = c
	}
	var out []ClaimCheck
	exact := claim.IsExact() && f.IsExact()
	if exact {
		out = append(out, ClaimCheck{Name: "lap(u) - f", Exact: true, Residual: claim.Exact.Laplacian().Sub(f.Exact)})
	} else {
		c, err := numericLaplacianResidual(d, f, claim, env)
		if err != nil {
			return nil, err
		}
		out = append(out, c)
	}
	for _, side := range d.Sides() {
		cond, ok := byName[side]
		if !ok {
			return nil, &MissingSides{[]string{side}}
		}
		c, err := d.claimSide(side, cond, claim, env)
		if err != nil {
			return nil, err
		}
		out = append(out, c)
	}
	shape, shapeErr := d.Shape(env)
	pts, ptsErr := d.samples(env)
	for i := range out {
		c := &out[i]
		if !c.Exact {
			continue
		}
		c.Text = FieldText(d, c.Residual)
		c.Max = math.NaN()
		comp, err := c.Residual.Compile(env)
		if err != nil {
			continue
		}
		var at [][2]float64 // where the residual's size is sampled: the side, or inside
		if c.Side == "" && ptsErr == nil {
			at = pts
		}
		for _, sp := range shape.Sides {
			if sp.Name == c.Side && c.Side != "" && shapeErr == nil {
				for k := 0; k <= 64; k++ {
					x, y, _, _ := sp.At(float64(k) / 64)
					at = append(at, [2]float64{math.Hypot(x, y), math.Atan2(y, x)})
				}
			}
		}
		if k, constant := c.Residual.Const(); constant {
			if v, err := k.Float(env); err == nil {
				c.Max = math.Abs(v)
			}
			continue
		}
		if len(at) == 0 {
			continue // no samples without the region's values: the size is unknown
		}
		c.Max = 0
		for _, p := range at {
			if v := math.Abs(comp.At(p[0], p[1])); v > c.Max {
				c.Max, c.Where = v, p
			}
		}
	}
	return out, nil
}

// xyRegion is a region whose fields print, and whose points are tested, in
// x and y (the rectangle).
type xyRegion interface {
	printsInXY() bool
	containsXY(x, y float64, env series.Env) (bool, error)
}

// ContainsXY reports whether the point (x, y) lies in the closed region: in
// x and y where the region is Cartesian, through r and θ ∈ [0, 2π) otherwise.
// insideXYer is a region that builds its containment test once, for loops
// over many points (its numbers from env computed up front).
type insideXYer interface {
	insideXY(env series.Env) (func(x, y float64) bool, error)
}

// InsideXY is ContainsXY as a test built once: false where the region
// cannot say.
func InsideXY(d Domain, env series.Env) func(x, y float64) bool {
	if in, ok := d.(insideXYer); ok {
		if f, err := in.insideXY(env); err == nil {
			return f
		}
	}
	return func(x, y float64) bool { ok, err := ContainsXY(d, x, y, env); return ok && err == nil }
}

func ContainsXY(d Domain, x, y float64, env series.Env) (bool, error) {
	if xy, ok := d.(xyRegion); ok {
		return xy.containsXY(x, y, env)
	}
	th := math.Atan2(y, x)
	if th < 0 {
		th += 2 * math.Pi
	}
	return d.Contains(math.Hypot(x, y), th, env)
}

// FieldText is a closed field as the region writes it: in x and y on the
// rectangle, in r and θ elsewhere.
func FieldText(d Domain, s series.Sum) string {
	if xy, ok := d.(xyRegion); ok && xy.printsInXY() {
		if p, err := cart.FromPolar(s); err == nil {
			return p.Text()
		}
	}
	return s.Text()
}

// polarSided is a region whose sides are circles about the origin (arcs)
// and rays from it; boundary finds a side's circle, or reports a ray θ = at.
type polarSided interface {
	Domain
	boundary(side string) (c circle, isCircle bool, at series.Coef)
}

// circleNamed is the circle of a region bounded by circles.
func circleNamed(d circular, side string) (circle, bool, series.Coef) {
	for _, c := range d.circles() {
		if c.name == side {
			return c, true, series.Coef{}
		}
	}
	return circle{}, false, series.Coef{}
}

// polarClaimSide is a claim's residual on a circle or a ray: exact for
// closed forms (the condition's operator on the claim, in r and θ), else
// sampled at 48 points.
func polarClaimSide(d polarSided, side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	name := OperatorText(cond, "u") + " - g"
	c, isCircle, at := d.boundary(side)
	if isCircle && claim.IsExact() && cond.G.IsExact() {
		b, err := c.apply(cond, claim.Exact)
		if err == nil {
			g, err := cond.G.Exact.Trace(c.radius)
			if err == nil {
				return ClaimCheck{Name: name, Side: side, Exact: true, Residual: b.Sub(g)}, nil
			}
		}
	}
	if !isCircle && claim.IsExact() && cond.G.IsExact() { // a ray θ = at: u, or dn(u) = ∓(1/r)∂u/∂θ
		u := claim.Exact
		if cond.Kind != Dirichlet {
			u = u.DTheta().MulR(ratOf(-1))
			if !at.IsZero() {
				u = u.Neg()
			}
		}
		var res series.Sum
		ok := true
		for _, t := range u.Terms() {
			v, err := series.NewSum(series.Term{C: t.C, K: t.K, M: t.M, Sin: t.Sin}).At(series.IntCoef(1), at)
			if err != nil {
				ok = false
				break
			}
			res = res.Add(series.NewSum(series.Term{C: v, P: t.P, L: t.L}))
		}
		if ok && cond.Kind == Robin {
			ok = false
		}
		if ok {
			return ClaimCheck{Name: name, Side: side, Exact: true, Residual: res.Sub(cond.G.Exact)}, nil
		}
	}
	return numericSideResidual(d, side, cond, claim, env)
}

func ratOf(n int64) *big.Rat { return big.NewRat(n, 1) }

// ringSamples are 72 points on six rings, radius(i) for i = 1..6, at
// angles span·(j + offset)/12 for j = 0..11: interior points of a polar
// region for numeric checks, off the rays and the axes.
func ringSamples(radius func(i int) float64, span, offset float64) [][2]float64 {
	var pts [][2]float64
	for i := 1; i <= 6; i++ {
		for j := 0; j < 12; j++ {
			pts = append(pts, [2]float64{radius(i), span * (float64(j) + offset) / 12})
		}
	}
	return pts
}

func numericLaplacianResidual(d Domain, f, claim series.Field, env series.Env) (ClaimCheck, error) {
	u, err := claim.Compile(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	fc, err := f.Compile(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	pts, err := d.samples(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	cart := func(x, y float64) float64 { return u.At(math.Hypot(x, y), math.Atan2(y, x)) }
	out := ClaimCheck{Name: "lap(u) - f"}
	for _, p := range pts {
		x, y := p[0]*math.Cos(p[1]), p[0]*math.Sin(p[1])
		h := 1e-3 * math.Max(1, p[0])
		lap := func(h float64) float64 {
			return (cart(x+h, y) + cart(x-h, y) + cart(x, y+h) + cart(x, y-h) - 4*cart(x, y)) / (h * h)
		}
		fd := (4*lap(h/2) - lap(h)) / 3
		if r := math.Abs(fd - fc.At(p[0], p[1])); r > out.Max || math.IsNaN(r) || out.Where == ([2]float64{}) {
			out.Max, out.Where = r, p
		}
	}
	return out, nil
}

// sampledSideResidual is a side's largest |B[claim] − g| at 48 points,
// B the condition's operator: point(u, k) gives the k-th point (r, θ) and
// the claim's outward normal derivative there.
func sampledSideResidual(side string, cond Condition, claim series.Field, env series.Env,
	point func(u series.CompiledField, k int) (r, th, dn float64, err error)) (ClaimCheck, error) {
	u, err := claim.Compile(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	g, err := cond.G.Compile(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	h := 0.0
	if cond.Kind == Robin {
		if h, err = cond.H.Float(env); err != nil {
			return ClaimCheck{}, err
		}
	}
	out := ClaimCheck{Name: OperatorText(cond, "u") + " - g", Side: side}
	for k := 0; k < 48; k++ {
		r, th, dn, err := point(u, k)
		if err != nil {
			return ClaimCheck{}, err
		}
		v := u.At(r, th)
		lhs := map[Kind]float64{Dirichlet: v, Neumann: dn, Robin: dn + h*v}[cond.Kind]
		if res := math.Abs(lhs - g.At(r, th)); res > out.Max || math.IsNaN(res) || k == 0 {
			out.Max, out.Where = res, [2]float64{r, th}
		}
	}
	return out, nil
}

// numericSideResidual samples a circle (or arc) at 48 angles across the
// region's span, or a ray at 48 radii.
func numericSideResidual(d polarSided, side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	c, isCircle, at := d.boundary(side)
	shape, err := d.Shape(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	box := shape.Polar
	const eps = 1e-5
	return sampledSideResidual(side, cond, claim, env, func(u series.CompiledField, k int) (r, th, dn float64, err error) {
		if isCircle {
			R, err := c.radius.Float(env)
			if err != nil {
				return 0, 0, 0, err
			}
			r, th = R, box.Span*(float64(k)+0.5)/48
			return r, th, float64(c.outward) * (u.At(r+eps, th) - u.At(r-eps, th)) / (2 * eps), nil
		}
		th, _ = at.Float(nil)
		r = box.RMax * (float64(k) + 0.5) / 48
		sign := -1.0
		if th > 0 {
			sign = 1
		}
		return r, th, sign * (u.At(r, th+eps) - u.At(r, th-eps)) / (2 * eps * r), nil
	})
}

// Describe is a check in words for output.
func (c ClaimCheck) Describe() string {
	where := ""
	if c.Side != "" {
		where = " on " + c.Side
	}
	if c.Exact {
		text := c.Text
		if text == "" {
			text = c.Residual.Text()
		}
		return fmt.Sprintf("%s = %s%s (exact)", c.Name, text, where)
	}
	x, y := Cartesian(c.Where[0], c.Where[1])
	return fmt.Sprintf("%s: largest residual %.3g%s at r = %.4g, theta = %.4g (x = %.4g, y = %.4g) (numeric)", c.Name, c.Max, where, c.Where[0], c.Where[1], x, y)
}

// Cartesian is the point (r cos θ, r sin θ) for printing: a coordinate at
// the rounding of cos(π/2), or −0, is 0.
func Cartesian(r, theta float64) (x, y float64) {
	snap := func(v float64) float64 {
		if math.Abs(v) < 1e-12*r {
			return 0
		}
		return v
	}
	return snap(r * math.Cos(theta)), snap(r * math.Sin(theta))
}

// claimSide is a rectangle side's residual for a claim: exact for
// polynomial claims and data (the side's operator on both, in the side's
// coordinate), else sampled at 48 points with central differences across.
func (d Rect) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	name := OperatorText(cond, "u") + " - g"
	if claim.IsExact() && cond.G.IsExact() {
		q, errQ := cart.FromPolar(claim.Exact)
		g, errG := cart.FromPolar(cond.G.Exact)
		if errQ == nil && errG == nil {
			res := d.trace(side, cond, q).Sub(d.trace(side, Condition{Kind: Dirichlet}, g))
			return ClaimCheck{Name: name, Side: side, Exact: true, Residual: res.Polar()}, nil
		}
	}
	L, err := d.L.Float(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	H, err := d.H.Float(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	geo := edgeNamed(side)
	normal := geo.normal
	l := geo.lengthFloat(L, H)
	eps := 1e-5 * math.Max(L, H)
	return sampledSideResidual(side, cond, claim, env, func(u series.CompiledField, k int) (r, th, dn float64, err error) {
		x, y := geo.point(l*(float64(k)+0.5)/48, L, H)
		at := func(x, y float64) float64 { return u.At(math.Hypot(x, y), math.Atan2(y, x)) }
		dn = (at(x+eps*normal[0], y+eps*normal[1]) - at(x-eps*normal[0], y-eps*normal[1])) / (2 * eps)
		return math.Hypot(x, y), math.Atan2(y, x), dn, nil
	})
}
