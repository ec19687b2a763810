package domain

import (
	"fmt"
	"math"
	"strings"

	"psol/series"
	"psol/series/cart"
)

// Point sources. A source Q·δ(z − z₀) has the fundamental solution
// (Q/2π)·ln|z − z₀| = (Q/4π)·ln|z − z₀|² as its particular solution; its
// trace on each side is an ordinary smooth function there. psol splits
//
//	u = u_s + w,
//
// where u_s is the sources' field — their own logarithms, plus image
// logarithms outside the region where an image rule (images.go) makes u_s
// meet the homogeneous form of every side's condition exactly — and w solves
// the distributed problem Δw = f with the data less u_s's trace, B[w] =
// g − B[u_s]. With images the traces are exact constants and w keeps every
// exactness the region has; without, the traces are numeric data.

// PointLog is C·ln P with P = S·((x − X)² + (y − Y)²), S = 1 where zero: a
// point source's logarithm or an image's. With a Period p it is instead a
// row of them, period p along x (along y when AlongY), summed in closed form:
//
//	P = sinh(π(y − Y)/p)² + sin(π(x − X)/p)² = |sin(π(z − z₀)/p)|²
//
// (x and y exchanged when AlongY), whose zeros are z₀ + kp; near z₀ it is
// (π/p)²·|z − z₀|².
type PointLog struct {
	C, X, Y, S series.Coef
	Period     series.Coef
	AlongY     bool
}

// rowed reports a row of logarithms (a Period).
func (l PointLog) rowed() bool { return !l.Period.IsZero() }

func (l PointLog) scale() series.Coef {
	if l.S.IsZero() {
		return series.IntCoef(1)
	}
	return l.S
}

// Poly is P as a polynomial in x and y.
func (l PointLog) Poly() cart.Poly {
	one := series.IntCoef(1)
	dx := cart.Monomial(one, 1, 0).Sub(cart.Monomial(l.X, 0, 0))
	dy := cart.Monomial(one, 0, 1).Sub(cart.Monomial(l.Y, 0, 0))
	return dx.Mul(dx).Add(dy.Mul(dy)).Scale(l.scale())
}

// argText is P as psol prints it: (x - X)^2 + (y - Y)^2 where S = 1, the
// expanded polynomial otherwise.
func (l PointLog) argText(latex bool) string {
	if l.rowed() {
		return l.rowText(latex)
	}
	if !l.scale().Equal(series.IntCoef(1)) {
		if latex {
			return l.Poly().LaTeX()
		}
		return l.Poly().Text()
	}
	sq := func(v string, c series.Coef) string {
		if c.IsZero() {
			return v + "^2"
		}
		if latex {
			return `\left(` + series.OffsetLaTeX(v, c) + `\right)^2`
		}
		return "(" + series.OffsetText(v, c) + ")^2"
	}
	return sq("x", l.X) + " + " + sq("y", l.Y)
}

// PointPart is the point sources' field u_s = Σ C_k·ln P_k and how it meets
// the conditions.
type PointPart struct {
	Sources []series.PointSource
	// Logs are the sources' own logarithms (one per source, in order), then
	// the images'.
	Logs []PointLog
	// Const is an additive constant of the images' (−(Q/4π)·ln R² for a
	// source at a disk's centre, whose image is at infinity).
	Const series.Coef
	// Images names the image system that makes u_s meet every side's
	// homogeneous condition exactly; "" where u_s is the sources' own field
	// and its traces are numeric data for w.
	Images string
	// Expansion names how the traces are exact without images (the
	// logarithm's Fourier series on circles); "" with images or numeric traces.
	Expansion string
	// Traces are B[u_s] on each side, by side: exact constants with images
	// (a row of images: its two walls', the other sides numeric), exact
	// Fourier series with an Expansion, numeric functions otherwise.
	Traces map[string]series.Field
	verify func() error // the image rule's exact check of its claims
	// zeroAt reports a point of a wall where u_s vanishes and with it every
	// side's operator on u_s (a corner on a wall with values): the numeric
	// traces take 0 there, not its rounding, so the corners' data agree.
	zeroAt func(x, y float64) bool
}

// ExactTraces reports traces B[u_s] all in closed form (images) or as exact
// series (Expansion), none numeric data.
func (pp *PointPart) ExactTraces() bool {
	for _, t := range pp.Traces {
		if !pp.exactTrace(t) {
			return false
		}
	}
	return true
}

func (pp *PointPart) exactTrace(t series.Field) bool {
	if t.IsExact() {
		return true
	}
	_, ok := t.FourierOn(series.IntCoef(1))
	return ok
}

// ExactTrace reports the trace on a side given exactly.
func (pp *PointPart) ExactTrace(side string) bool { return pp.exactTrace(pp.Traces[side]) }

// Text is u_s in psol's syntax.
func (pp *PointPart) Text() string { return pp.print(false) }

// LaTeX is u_s in LaTeX.
func (pp *PointPart) LaTeX() string { return pp.print(true) }

func (pp *PointPart) print(latex bool) string {
	var b strings.Builder
	for i, l := range pp.Logs {
		c := l.C
		neg := false
		if s := c.Text(); strings.HasPrefix(s, "-") && !strings.ContainsAny(s[1:], "+-") {
			c, neg = c.Neg(), true
		}
		var coef, ln string
		if latex {
			coef = c.LaTeX()
			if strings.ContainsAny(coef[1:], "+-") {
				coef = `\left(` + coef + `\right)`
			}
			ln = coef + ` \ln\left(` + l.argText(true) + `\right)`
			if c.Equal(series.IntCoef(1)) {
				ln = `\ln\left(` + l.argText(true) + `\right)`
			}
		} else {
			coef = c.Text()
			if strings.ContainsAny(coef[1:], " +-") {
				coef = "(" + coef + ")"
			}
			ln = coef + "*ln(" + l.argText(false) + ")"
			if c.Equal(series.IntCoef(1)) {
				ln = "ln(" + l.argText(false) + ")"
			}
		}
		switch {
		case i == 0 && neg:
			b.WriteString("-" + ln)
		case i == 0:
			b.WriteString(ln)
		case neg:
			b.WriteString(" - " + ln)
		default:
			b.WriteString(" + " + ln)
		}
	}
	if !pp.Const.IsZero() {
		k := pp.Const.Text()
		if latex {
			k = pp.Const.LaTeX()
		}
		switch {
		case b.Len() == 0:
			b.WriteString(k)
		case strings.HasPrefix(k, "-"):
			b.WriteString(" - " + k[1:])
		default:
			b.WriteString(" + " + k)
		}
	}
	return b.String()
}

// pointEval is u_s in float64.
type pointEval struct {
	c, x, y, s []float64
	period     []float64 // 0 for a single logarithm, else the row's period
	alongY     []bool
	k          float64 // the additive constant
	sources    int     // the first logs are the sources' own
}

func (pp *PointPart) compile(env series.Env) (*pointEval, error) {
	pe := &pointEval{sources: len(pp.Sources)}
	var err error
	if pe.k, err = pp.Const.Float(env); err != nil {
		return nil, err
	}
	for _, l := range pp.Logs {
		v, err := floats(env, l.C, l.X, l.Y, l.scale())
		if err != nil {
			return nil, err
		}
		pe.c, pe.x, pe.y, pe.s = append(pe.c, v[0]), append(pe.x, v[1]), append(pe.y, v[2]), append(pe.s, v[3])
		p, err := l.Period.Float(env)
		if err != nil {
			return nil, err
		}
		pe.period, pe.alongY = append(pe.period, p), append(pe.alongY, l.AlongY)
	}
	return pe, nil
}

// at is u_s(x, y): ±Inf at a source.
func (pe *pointEval) at(x, y float64) float64 {
	if pe == nil {
		return 0
	}
	v := pe.k
	for k := range pe.c {
		v += pe.logAt(k, x-pe.x[k], y-pe.y[k])
	}
	return v
}

// logAt is the k-th logarithm (or row of them) at the offset (dx, dy) from
// its centre.
func (pe *pointEval) logAt(k int, dx, dy float64) float64 {
	if pe.period[k] != 0 {
		return pe.c[k] * math.Log(pe.rowArg(k, dx, dy))
	}
	return pe.c[k] * math.Log(pe.s[k]*(dx*dx+dy*dy))
}

// grad is ∇u_s at (x, y).
func (pe *pointEval) grad(x, y float64) (gx, gy float64) {
	for k := range pe.c {
		dx, dy := x-pe.x[k], y-pe.y[k]
		if pe.period[k] != 0 {
			rx, ry := pe.rowGrad(k, dx, dy)
			gx, gy = gx+rx, gy+ry
			continue
		}
		d2 := dx*dx + dy*dy
		gx += 2 * pe.c[k] * dx / d2
		gy += 2 * pe.c[k] * dy / d2
	}
	return gx, gy
}

// source reports the source at (x, y), if any, by its index.
func (pe *pointEval) source(x, y float64) (int, bool) {
	if pe == nil {
		return 0, false
	}
	for k := 0; k < pe.sources; k++ {
		if x == pe.x[k] && y == pe.y[k] {
			return k, true
		}
	}
	return 0, false
}

// regular is u_s less the k-th source's singular part (Q_k/2π)·ln|z − z_k|,
// at (x, y): finite at the source itself.
func (pe *pointEval) regular(x, y float64, k int) float64 {
	v := pe.k + pe.c[k]*math.Log(pe.s[k])
	if p := pe.period[k]; p != 0 { // |sin(π(z − z₀)/p)|² ~ (π/p)²·|z − z₀|²
		v = pe.k + pe.c[k]*2*math.Log(math.Pi/p)
	}
	for j := range pe.c {
		if j != k {
			v += pe.logAt(j, x-pe.x[j], y-pe.y[j])
		}
	}
	return v
}

// attach gives the evaluator u_s.
func (pp *PointPart) attach(e *Evaluator, _ *Solution, env series.Env) error {
	pe, err := pp.compile(env)
	e.pts = pe
	return err
}

// SourcesField is the point sources' own field, Σ (Q/4π)·ln|z − z₀|²: a
// particular solution of Δu = Σ Q·δ(z − z₀) in the whole plane.
func SourcesField(pts []series.PointSource) *PointPart {
	return &PointPart{Sources: pts, Logs: ownLogs(pts)}
}

// ownLogs are the sources' own logarithms, (Q/4π)·ln|z − z₀|².
func ownLogs(pts []series.PointSource) []PointLog {
	var out []PointLog
	for _, p := range pts {
		c, _ := p.Q.Div(series.IntCoef(4).Mul(series.SymCoef(series.Pi)))
		out = append(out, PointLog{C: c, X: p.X, Y: p.Y})
	}
	return out
}

// solvePoints solves a problem whose source has point sources: u_s by an
// image rule where one fits, else the sources' own field with numeric
// traces; then w by the region's solve with the data less u_s's trace.
func solvePoints(d Domain, source series.Field, conds []Condition, opt Options) (*Solution, error) {
	pts := source.Points
	source.Points = nil
	byside := map[string]Condition{}
	for _, c := range conds {
		byside[c.Side] = c
		if c.Kind == Floating {
			return nil, unsupported("a side at one unknown constant value (u = const, flux = ...) with a point source in the region is not supported yet: give the side's value or flux")
		}
	}
	if err := pointsInside(d, pts, opt.Env); err != nil {
		return nil, err
	}
	if err := pointsBalance(d, source, conds, pts, opt.Env); err != nil {
		return nil, err
	}
	pp, err := imagesFor(d, byside, pts)
	if err != nil {
		return nil, err
	}
	if pp != nil && len(pp.Traces) < len(d.Sides()) { // a rule that closes some sides only
		if err := numericTraces(d, byside, pp, opt.Env); err != nil {
			return nil, err
		}
	}
	if pp == nil {
		pp, _ = circleLogSeries(d, byside, pts)
	}
	if pp == nil {
		if pp, err = ownField(d, byside, pts, opt.Env); err != nil {
			return nil, err
		}
	}
	shifted := make([]Condition, len(conds))
	for i, c := range conds {
		shifted[i] = c
		if tr, ok := pp.Traces[c.Side]; ok {
			shifted[i].G = c.G.Add(tr.Neg())
		}
	}
	sol, err := SolveWith(d, source, shifted, opt)
	if err != nil {
		return nil, err
	}
	sol.Points = pp
	sol.restoreConditions(byside)
	sol.stages = append(sol.stages, pp)
	if pp.Images != "" {
		sol.Checks = append(sol.Checks, exactImageCheck(pp, pp.verify))
	}
	if pp.Images != "" || pp.Expansion != "" {
		if c, ok := imageCheck(d, sol, pp, opt.Env); ok {
			sol.Checks = append(sol.Checks, c)
		}
	}
	sol.recheck()
	return sol, nil
}

// restoreConditions gives the sides back their conditions as posed, after a
// solve with data less a part's trace (a point sources' field, the waves).
func (s *Solution) restoreConditions(byside map[string]Condition) {
	for k := range s.Sides {
		if orig, ok := byside[s.Sides[k].Condition.Side]; ok {
			s.Sides[k].Condition = orig
			s.Sides[k].DataText, s.Sides[k].DataLaTeX = orig.G.Text(), orig.G.LaTeX()
		}
	}
}

// recheck runs the independent check again, on u whole and the conditions
// as posed.
func (s *Solution) recheck() {
	s.Independent = nil
	if c, ok := s.independentCheck(); ok {
		s.Independent = &c
	}
}

// pointsInside refuses a point source outside the region or on its
// boundary (its field is infinite there). A point given with parameters
// is taken as given.
func pointsInside(d Domain, pts []series.PointSource, env series.Env) error {
	shape, shapeErr := d.Shape(env)
	for _, p := range pts {
		v, err := floats(env, p.X, p.Y)
		if err != nil || shapeErr != nil {
			continue
		}
		x, y := v[0], v[1]
		r, th := polarOf(x, y)
		in, err := d.Contains(r, th, env)
		if err != nil {
			continue
		}
		where := fmt.Sprintf("the point source at (x, y) = (%.6g, %.6g)", x, y)
		if !in {
			return unsolvable("%s lies outside %s: a point source must lie inside the region", where, d.Describe())
		}
		size := math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
		if side, dist := nearestSide(shape, x, y); dist <= 1e-9*size {
			return unsolvable("%s lies on the boundary (%s): its field is infinite there, so no condition can hold; move it inside, or give its flux as data on the side", where, side)
		}
	}
	return nil
}

// nearestSide is the side nearest to (x, y) and the distance to it.
func nearestSide(shape Shape, x, y float64) (string, float64) {
	best, name := math.Inf(1), ""
	for _, side := range shape.Sides {
		t := nearestT(side, x, y)
		px, py, _, _ := side.At(t)
		if d := math.Hypot(px-x, py-y); d < best {
			best, name = d, side.Name
		}
	}
	return name, best
}

// straightNormal is a straight side's one outward normal, ok false for a
// curved side: the normals at its ends and middle agree, and the middle
// lies on the chord. (The Robin and flux traces of point sources took
// each point's normal by nearestT, some 300 evaluations of the side a
// point, a quarter of a rectangle's solve.)
func straightNormal(side SidePath) (nx, ny float64, ok bool) {
	x0, y0, nx, ny := side.At(0)
	xm, ym, mx, my := side.At(0.5)
	x1, y1, ex, ey := side.At(1)
	const eps = 1e-14
	ok = math.Abs(mx-nx) < eps && math.Abs(my-ny) < eps && math.Abs(ex-nx) < eps && math.Abs(ey-ny) < eps &&
		math.Abs((xm-(x0+x1)/2)*nx+(ym-(y0+y1)/2)*ny) <= eps*math.Max(side.Length, 1)
	return nx, ny, ok
}

// nearestT is the parameter of the side's point nearest to (x, y): the
// nearest of 257 samples, refined by golden-section search between its
// neighbours.
func nearestT(side SidePath, x, y float64) float64 {
	dist := func(t float64) float64 {
		px, py, _, _ := side.At(t)
		return (px-x)*(px-x) + (py-y)*(py-y)
	}
	const n = 256
	k, best := 0, math.Inf(1)
	for i := 0; i <= n; i++ {
		if d := dist(float64(i) / n); d < best {
			k, best = i, d
		}
	}
	a, b := math.Max(0, float64(k-1)/n), math.Min(1, float64(k+1)/n)
	g := (math.Sqrt(5) - 1) / 2
	c, e := b-g*(b-a), a+g*(b-a)
	fc, fe := dist(c), dist(e)
	for i := 0; i < 60 && b-a > 1e-15; i++ {
		if fc < fe {
			b, e, fe = e, c, fc
			c = b - g*(b-a)
			fc = dist(c)
		} else {
			a, c, fc = c, e, fe
			e = a + g*(b-a)
			fe = dist(e)
		}
	}
	return (a + b) / 2
}

// ownField is u_s without images: the sources' own logarithms, whose traces
// on the sides are numeric data for w (each side's operator on u_s, with
// the outward normal of the side's point nearest to where it is asked).
func ownField(d Domain, conds map[string]Condition, pts []series.PointSource, env series.Env) (*PointPart, error) {
	if _, ok := d.(Outside); ok {
		return nil, unsupported("a point source outside a circle is solved by its image in the circle, which needs values on the circle (u = g); with a flux there the source's strength has to leave through infinity, and psol's exterior solutions stay bounded")
	}
	if _, ok := d.(Sector); ok {
		return nil, unsupported("a point source in a sector is solved by images, which need the angle pi/k (k = 1, 2, 3, 4 or 6) and the same kind of condition on both rays (u = 0 or dn(u) = 0 once the constant is taken out), and the arc at a value or a flux; %s does not meet that", d.Describe())
	}
	pp := &PointPart{Sources: pts, Logs: ownLogs(pts), Traces: map[string]series.Field{}}
	return pp, numericTraces(d, conds, pp, env)
}

// numericTraces gives each side that has no trace yet B[u_s] as numeric data.
func numericTraces(d Domain, conds map[string]Condition, pp *PointPart, env series.Env) error {
	pe, err := pp.compile(env)
	if err != nil {
		return unsupported("a point source off the exact image systems is solved numerically, which needs every parameter's value: %w", err)
	}
	shape, err := d.Shape(env)
	if err != nil {
		return unsupported("%w", err)
	}
	for _, side := range shape.Sides {
		cond, ok := conds[side.Name]
		if _, done := pp.Traces[side.Name]; !ok || done {
			continue
		}
		h, err := cond.H.Float(env)
		if err != nil {
			return unsupported("%w", err)
		}
		side, kind := side, cond.Kind
		nx0, ny0, straight := straightNormal(side)
		zero := pp.zeroAt
		at := func(r, theta float64) float64 {
			x, y := r*math.Cos(theta), r*math.Sin(theta)
			if zero != nil && zero(x, y) {
				return 0
			}
			v := pe.at(x, y)
			if kind == Dirichlet {
				return v
			}
			nx, ny := nx0, ny0
			if !straight { // a curved side's normal at the point's place on it
				_, _, nx, ny = side.At(nearestT(side, x, y))
			}
			gx, gy := pe.grad(x, y)
			return operatorValue(kind, h, v, gx*nx+gy*ny)
		}
		text := OperatorText(cond, "u_s")
		pp.Traces[side.Name] = series.FuncField(text, operatorLaTeX(cond, "u_s"), at)
	}
	return nil
}

// operatorLaTeX is OperatorText in LaTeX.
func operatorLaTeX(cond Condition, fn string) string {
	switch cond.Kind {
	case Neumann:
		return `\partial_n ` + fn
	case Robin:
		return `\partial_n ` + fn + " + " + cond.H.LaTeX() + `\,` + fn
	}
	return fn
}

// imageCheck verifies an image rule's claims on the evaluated u_s: every
// image lies outside the region, and on each side B[u_s] equals the stated
// trace (values and one-sided differences along the normal, 24 points a
// side), relative to u_s's size there.
func imageCheck(d Domain, sol *Solution, pp *PointPart, env series.Env) (Check, bool) {
	pe, err := pp.compile(env)
	if err != nil {
		return Check{}, false
	}
	shape, err := d.Shape(env)
	if err != nil {
		return Check{}, false
	}
	c := Check{Name: "B[u_s] less its stated trace, images outside"}
	if pp.Images == "" {
		c.Name = "B[u_s] less its stated series trace"
	}
	for k := len(pp.Sources); k < len(pe.c); k++ {
		r, th := polarOf(pe.x[k], pe.y[k])
		if in, err := d.Contains(r, th, env); err == nil && in && r > 1e-12 {
			c.Name = fmt.Sprintf("IMAGE CHECK FAILED: the image at (%.6g, %.6g) lies inside the region", pe.x[k], pe.y[k])
			c.Numeric, c.independentFailed = math.Inf(1), true
			return c, true
		}
	}
	h := 1e-5 * math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
	worst, raw := 0.0, 0.0
	for _, side := range shape.Sides {
		cond := sol.sideCondition(side.Name)
		tr, err := pp.Traces[side.Name].Compile(env)
		if err != nil {
			return Check{}, false
		}
		hr, _ := cond.H.Float(env)
		for j := 0; j < 24; j++ {
			x, y, nx, ny := side.At(0.02 + 0.96*(float64(j)+0.5)/24)
			v := pe.at(x, y)
			// ∂u/∂n by a second-order one-sided difference along the inward normal.
			dn := -(-3*v + 4*pe.at(x-h*nx, y-h*ny) - pe.at(x-2*h*nx, y-2*h*ny)) / (2 * h)
			var lhs, tol float64
			switch cond.Kind {
			case Dirichlet:
				lhs, tol = v, 1e-12
			case Neumann:
				lhs, tol = dn, 1e-6
			case Robin:
				lhs, tol = dn+hr*v, 1e-6
			}
			r, th := polarOf(x, y)
			scale := 1 + math.Abs(v) + math.Abs(tr.At(r, th))
			rel := math.Abs(lhs-tr.At(r, th)) / scale
			if rel/tol > worst {
				worst, raw = rel/tol, rel
			}
		}
	}
	c.Numeric = raw
	if worst > 1 {
		c.Name = fmt.Sprintf("IMAGE CHECK FAILED: u_s misses its stated trace by %.2g times the tolerance", worst)
		c.independentFailed = true
	}
	return c, true
}

// sideCondition is the condition on the named side.
func (s *Solution) sideCondition(name string) Condition {
	for _, sd := range s.Sides {
		if sd.Condition.Side == name {
			return sd.Condition
		}
	}
	return Condition{}
}

// AtSource reports whether (x, y) is a point source's position and, if it
// is, the regular part there: u − (Q/2π)·ln|z − z₀| (u itself is infinite),
// with its error estimate. It is the figure a well's drawdown at its radius
// and a wire's self-capacitance come from.
// k is the source's index in PointPart.Sources.
func (e *Evaluator) AtSource(x, y float64) (regular, errEst float64, k int, ok bool) {
	k, ok = e.pts.source(x, y)
	if !ok {
		return 0, 0, 0, false
	}
	pts := e.pts
	e.pts = nil
	w, est, _ := e.AtXY(x, y)
	e.pts = pts
	return w + pts.regular(x, y, k), est, k, true
}

// pointFigures adds u_s's share to a report whose region figures covered
// w (and whose extremes were sampled on u): its area integral by the
// divergence theorem, the sources' strengths to the source integral, its
// outward flux through each side (the angle each side subtends at each
// logarithm's centre), and the infinite extreme and gradient at each source.
func (s *Solution) pointFigures(rep *Report, shape Shape, env series.Env) error {
	pp := s.Points
	pe, err := pp.compile(env)
	if err != nil {
		return err
	}
	if math.IsInf(shape.Area, 1) { // u_s tends to a constant, or grows: no finite integral
		rep.Integral, rep.IntegralExact, rep.Mean = math.NaN(), nil, math.NaN()
	} else if !math.IsNaN(rep.Integral) {
		rep.Integral += pe.areaIntegral(shape)
		rep.IntegralExact = nil
		if A, err := rep.Area.Float(env); err == nil && A > 0 {
			rep.Mean = rep.Integral / A
		}
	}
	for _, p := range pp.Sources {
		q, err := p.Q.Float(env)
		if err != nil {
			return err
		}
		rep.Source += q
		if rep.SourceExact != nil {
			c := rep.SourceExact.Add(p.Q)
			rep.SourceExact = &c
		}
	}
	if len(rep.Sides) == len(shape.Sides) {
		rep.Flux, rep.FluxExact = 0, nil
		for k, side := range shape.Sides {
			rep.Sides[k].Value += pe.sideFlux(side)
			rep.Sides[k].Exact = nil
			rep.Flux += rep.Sides[k].Value
		}
	}
	for k, p := range pp.Sources {
		q, _ := p.Q.Float(env)
		at := [2]float64{pe.x[k], pe.y[k]}
		r, th := polarOf(at[0], at[1])
		if q > 0 { // Δu = Qδ with Q > 0: u → −∞ like (Q/2π)·ln|z − z₀|
			rep.Min, rep.ArgMin = math.Inf(-1), [2]float64{r, th}
		} else {
			rep.Max, rep.ArgMax = math.Inf(1), [2]float64{r, th}
		}
		rep.Gradient = &GradientPeak{Value: math.Inf(1), At: at}
	}
	return nil
}

// areaIntegral is ∬u_s dA over the region: for each C·ln(S·ρ²), ρ = |z − a|,
// C·ln S·A plus C·∮ ∂v/∂n ds with v = ρ²(ln ρ − 1)/2, Δv = ln ρ² (v is C¹
// at a, so the divergence theorem holds with no term there), by
// Gauss–Legendre on 64 panels a side.
//
// A row of logarithms enters as its five terms nearest the centre, each a
// single logarithm as above, and the rest, smooth on the region, by
// Gauss–Legendre over it (rowRestArea).
func (pe *pointEval) areaIntegral(shape Shape) float64 {
	return pe.overRows(func(p *pointEval) float64 { return p.logsArea(shape) },
		func(k int) float64 { return pe.rowRestArea(k, shape) })
}

// overRows is a figure of u_s: plain's on its single logarithms (the rows
// split into their nearest zeros, splitRows) plus rest's for each row.
func (pe *pointEval) overRows(plain func(*pointEval) float64, rest func(k int) float64) float64 {
	p, rows := pe.splitRows()
	total := plain(p)
	for _, k := range rows {
		total += rest(k)
	}
	return total
}

func (pe *pointEval) logsArea(shape Shape) float64 {
	total := pe.k * shape.Area
	for k := range pe.c {
		total += pe.c[k] * math.Log(pe.s[k]) * shape.Area
	}
	for _, side := range shape.Sides {
		side.panelNodes(uniformEdges(64), legendreX, legendreW, func(t, w float64) {
			x, y, nx, ny := side.At(t)
			for k := range pe.c {
				dx, dy := x-pe.x[k], y-pe.y[k]
				rho := math.Hypot(dx, dy)
				if rho == 0 {
					continue
				}
				total += w * pe.c[k] * (math.Log(rho) - 0.5) * (dx*nx + dy*ny)
			}
		})
	}
	return total
}

// sideFlux is ∫ ∂u_s/∂n ds over a side: for each C·ln ρ², 2C times the
// angle the side subtends at the centre, signed by the outward normal
// (∂ ln ρ/∂n ds = dφ), summed over 2048 steps whose angles are exact.
//
// A row of logarithms enters as its five nearest terms so, and the rest by
// Gauss–Legendre of its normal derivative (rowRestFlux).
func (pe *pointEval) sideFlux(side SidePath) float64 {
	return pe.overRows(func(p *pointEval) float64 { return p.logsFlux(side) },
		func(k int) float64 { return pe.rowRestFlux(k, side) })
}

func (pe *pointEval) logsFlux(side SidePath) float64 {
	const steps = 2048
	total := 0.0
	px, py, _, _ := side.At(0)
	for i := 1; i <= steps; i++ {
		x, y, _, _ := side.At(float64(i) / steps)
		mx, my, nx, ny := side.At((float64(i) - 0.5) / steps)
		for k := range pe.c {
			ax, ay, bx, by := px-pe.x[k], py-pe.y[k], x-pe.x[k], y-pe.y[k]
			dphi := math.Abs(math.Atan2(ax*by-ay*bx, ax*bx+ay*by))
			if (mx-pe.x[k])*nx+(my-pe.y[k])*ny < 0 {
				dphi = -dphi
			}
			total += 2 * pe.c[k] * dphi
		}
		px, py = x, y
	}
	return total
}

// pointsBalance refuses a problem with a flux on every side whose data's
// net outward flux differs from the source's integral plus the point
// sources' strengths (the divergence theorem: ∮g ds = ∬f dA + ΣQ), in the
// user's terms, before the solve of w would say it in terms of the data
// less u_s's flux. It needs the parameters' values and an exact source.
func pointsBalance(d Domain, source series.Field, conds []Condition, pts []series.PointSource, env series.Env) error {
	for _, c := range conds {
		if c.Kind != Neumann {
			return nil
		}
	}
	if source.Rest != nil || source.IsPiecewise() {
		return nil
	}
	fc, err := d.integral(source.Exact)
	if err != nil {
		return nil
	}
	f, err := fc.Float(env)
	if err != nil {
		return nil
	}
	q := 0.0
	for _, p := range pts {
		v, err := p.Q.Float(env)
		if err != nil {
			return nil
		}
		q += v
	}
	shape, err := d.Shape(env)
	if err != nil || math.IsInf(shape.Area, 1) {
		return nil
	}
	flux := 0.0
	for _, side := range shape.Sides {
		var cond Condition
		for _, c := range conds {
			if c.Side == side.Name {
				cond = c
			}
		}
		g, err := cond.G.Compile(env)
		if err != nil {
			return nil
		}
		side.panelNodes(uniformEdges(64), legendreX, legendreW, func(t, ds float64) {
			x, y, _, _ := side.At(t)
			r, th := polarOf(x, y)
			flux += ds * g.At(r, th)
		})
	}
	if math.Abs(flux-f-q) > 1e-9*(1+math.Abs(flux)+math.Abs(f)+math.Abs(q)) {
		return unsolvable("with a flux condition on every side the net outward flux of the data, %.12g, must equal the source's integral over the region plus the point sources' strengths, %.12g + %.12g = %.12g (divergence theorem); they differ by %.3g, so the problem has no solution", flux, f, q, f+q, flux-f-q)
	}
	return nil
}
