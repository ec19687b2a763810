package domain

import (
	"math"
	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
)

// Evaluator evaluates a solution at points in float64, summing any series to tol.
type Evaluator struct {
	closed  series.Compiled
	xy      *cart.CompiledPoly // a rectangle's closed part, evaluated in x and y
	ser     *series.CompiledSeriesSum
	tol     float64
	max     int
	rim     *compiledRim
	rect    []rectSeries
	walls   *rectWalls             // a rectangle's side data, exact on the sides themselves
	quad    *ansatz.Quadrature     // a numeric particular solution, evaluated beside the rest
	waves   *cart.CompiledWaves    // a rectangle's exponential and trigonometric particular part
	sq      *ansatz.SineQuadrature // a rectangle's numeric particular part
	dataErr float64                // what numeric traces bring to every value
	parts   []xyPart               // numeric parts evaluated in x and y (a section's harmonic part)
	pts     *pointEval             // the point sources' field u_s, where the source has any
	// after are closed parts added after the region's own sum, whose
	// shortcuts on a circle with values (the rim's Poisson integral, the
	// data on an arc) give the rest of u alone: the source's waves.
	after []xyPart
	arcs  []*compiledArc // Dirichlet data on circular sides, exact on the circles themselves
}

// onArc is u where (r, θ) lies on a circular side with Dirichlet data.
func (e *Evaluator) onArc(r, theta float64) (float64, bool) {
	for _, a := range e.arcs {
		if v, ok := a.on(r, theta); ok {
			return v, true
		}
	}
	return 0, false
}

// arcRow reports whether radius r is a circular side's with Dirichlet data.
func (e *Evaluator) arcRow(r float64) bool {
	for _, a := range e.arcs {
		if a.onRow(r) {
			return true
		}
	}
	return false
}

// xyPart is a numeric part of a solution evaluated in x and y.
type xyPart interface {
	AtXY(x, y float64) float64
}

// partsAt is the sum of the xy parts at (r, θ).
func (e *Evaluator) partsAt(r, theta float64) float64 {
	if len(e.parts) == 0 {
		return 0
	}
	x, y := r*math.Cos(theta), r*math.Sin(theta)
	v := 0.0
	for _, p := range e.parts {
		v += p.AtXY(x, y)
	}
	return v
}

// rectWalls holds a rectangle's Dirichlet data in the side coordinates.
type rectWalls struct {
	L, H                     float64
	left, right, bottom, top *sideData // nil where the side carries a flux, not a value
	env                      series.Env
}

// on is u on a side (not a corner) of the rectangle, where it is the data.
func (w *rectWalls) on(x, y float64) (float64, bool) {
	if w == nil {
		return 0, false
	}
	const eps = 1e-14
	inX, inY := x > eps*w.L && x < w.L*(1-eps), y > eps*w.H && y < w.H*(1-eps)
	var g *sideData
	var s float64
	switch {
	case math.Abs(x) <= eps*w.L && inY:
		g, s = w.left, y
	case math.Abs(x-w.L) <= eps*w.L && inY:
		g, s = w.right, y
	case math.Abs(y) <= eps*w.H && inX:
		g, s = w.bottom, x
	case math.Abs(y-w.H) <= eps*w.H && inX:
		g, s = w.top, x
	default:
		return 0, false
	}
	if g == nil {
		return 0, false
	}
	return g.at(s, w.env), true
}

// stage is a region's part of a solution that evaluation needs beyond the
// closed form and the polar series: a rectangle's side series and walls, or
// a circle's data for the Poisson integral near it. A region's solve adds
// its stages; Compile attaches each to the Evaluator.
type stage interface {
	attach(e *Evaluator, s *Solution, env series.Env) error
}

// rectSeries is a rectangle's side series as evaluated: exact or numeric.
type rectSeries interface {
	At(x, y, tol float64, maxTerms int) (sum, tail float64)
	Integral(tol float64, maxTerms int) float64
}

// Compile prepares the solution for evaluation with parameters from env.
func (s *Solution) Compile(env series.Env, tol float64, maxTerms int) (*Evaluator, error) {
	u := s.U
	if s.Series != nil {
		u = s.Particular.Add(s.Harmonic) // the closed parts: ray-adapted particular and ray shift
	}
	c, err := u.Compile(env)
	if err != nil {
		return nil, err
	}
	e := &Evaluator{closed: c, tol: tol, max: maxTerms, quad: s.Quadrature, dataErr: s.DataError}
	for _, st := range s.stages {
		if err := st.attach(e, s, env); err != nil {
			return nil, err
		}
	}
	if s.Series != nil {
		cs, err := s.Series.U.Compile(env)
		if err != nil {
			return nil, err
		}
		e.ser = &cs
	}
	return e, nil
}

// At is u(r, θ) with an estimate of the truncation error (0 for closed forms)
// and the number of series terms summed.
func (e *Evaluator) At(r, theta float64) (u, errEst float64, terms int) {
	if e.quad != nil {
		u, errEst, terms = e.atClosedAndSeries(r, theta)
		p, perr := e.quad.At(e.quadPolar(r, theta))
		return u + p, errEst + perr + e.dataErr, terms
	}
	return e.atClosedAndSeries(r, theta)
}

func (e *Evaluator) atClosedAndSeries(r, theta float64) (u, errEst float64, terms int) {
	if e.rect != nil {
		u, errEst = e.atXYTail(r*math.Cos(theta), r*math.Sin(theta))
		return u, errEst, 0
	}
	u, errEst, terms = e.atPolar(r, theta)
	if e.pts != nil {
		u += e.pts.at(r*math.Cos(theta), r*math.Sin(theta))
	}
	for _, p := range e.after {
		u += p.AtXY(r*math.Cos(theta), r*math.Sin(theta))
	}
	return u, errEst, terms
}

// atPolar is the closed parts and the polar series at (r, θ).
func (e *Evaluator) atPolar(r, theta float64) (u, errEst float64, terms int) {
	u = e.closed.At(r, theta) + e.partsAt(r, theta)
	if e.ser == nil {
		return u, 0, 0
	}
	if r == 0 {
		r = math.SmallestNonzeroFloat64
	}
	if e.rim != nil && e.rim.near(r) {
		return e.rim.at(r, theta), e.tol, 0
	}
	if v, ok := e.onArc(r, theta); ok {
		return v, 0, 0
	}
	s := e.ser.At(r, theta, e.tol, e.max)
	return u + s.Value, s.Tail, s.Terms
}

// Grid evaluates u on the tensor grid rs × thetas, returning values and an
// error estimate per point (without DataError, which At adds and a caller of
// Grid adds once); radii next to a Dirichlet circle take the Poisson
// integral point by point.
func (e *Evaluator) Grid(rs, thetas []float64) (u, errs [][]float64) {
	u = make([][]float64, len(rs))
	errs = make([][]float64, len(rs))
	for i := range rs {
		u[i] = make([]float64, len(thetas))
		errs[i] = make([]float64, len(thetas))
	}
	var far []float64
	var farRows []int
	for i, r := range rs {
		if e.ser != nil && (r == 0 || e.rim != nil && e.rim.near(r) || e.arcRow(r)) {
			for j, th := range thetas {
				u[i][j], errs[i][j], _ = e.atClosedAndSeries(r, th)
			}
			continue
		}
		far, farRows = append(far, r), append(farRows, i)
	}

	rows := make([][]float64, len(far))
	for k, i := range farRows {
		rows[k] = u[i]
	}
	e.closed.Grid(far, thetas, rows)
	if e.ser != nil {
		for k, t := range e.ser.Grid(far, thetas, rows, e.tol, e.max) {
			for j := range thetas {
				errs[farRows[k]][j] = t
			}
		}
	}
	// The parts beside the sums, on the far rows only: a near row's
	// atClosedAndSeries has them already (the point sources' field was
	// added twice there, and a CSV grid's centre row read −0.463 where u
	// is −0.271).
	for k, i := range farRows {
		r := far[k]
		for j, th := range thetas {
			x, y := r*math.Cos(th), r*math.Sin(th)
			if len(e.parts) > 0 {
				u[i][j] += e.partsAt(r, th)
			}
			for _, p := range e.after {
				u[i][j] += p.AtXY(x, y)
			}
			if e.pts != nil {
				u[i][j] += e.pts.at(x, y)
			}
		}
	}
	// The numeric particular part, a radius at a time (its modes are per
	// radius); the data's share of the error is the caller's.
	if e.quad != nil {
		for i, r := range rs {
			for j, th := range thetas {
				p, perr := e.quad.At(e.quadPolar(r, th))
				u[i][j] += p
				errs[i][j] += perr
			}
		}
	}
	return u, errs
}

// atXYTail is a rectangle's u(x, y) with the summed tail estimates.
func (e *Evaluator) atXYTail(x, y float64) (u, tail float64) {
	if e.pts != nil {
		u = e.pts.at(x, y)
	}
	if v, ok := e.walls.on(x, y); ok { // the data of w, which u_s completes
		return u + v, 0
	}
	if e.xy != nil {
		u += e.xy.At(x, y) + e.waves.At(x, y)
	} else {
		u += e.closed.At(math.Hypot(x, y), math.Atan2(y, x)) + e.waves.At(x, y)
	}
	if e.sq != nil {
		v, t := e.sq.At(x, y)
		u, tail = u+v, tail+t
	}
	for _, s := range e.rect {
		v, t := s.At(x, y, e.tol, e.max)
		u, tail = u+v, tail+t
	}
	return u, tail
}

func (e *Evaluator) atXY(x, y float64) float64 { u, _ := e.atXYTail(x, y); return u }

// attach gives the evaluator the rectangle's side series, its waves and
// numeric particular part, and its Dirichlet data to read on the sides.
func (rp *RectParts) attach(e *Evaluator, s *Solution, env series.Env) error {
	w := &rectWalls{env: env}
	var err error
	if w.L, err = rp.d.L.Float(env); err != nil {
		return err
	}
	if w.H, err = rp.d.H.Float(env); err != nil {
		return err
	}
	walls := [...]**sideData{&w.left, &w.right, &w.bottom, &w.top}
	for _, side := range rp.Sides {
		switch {
		case side.Eigen != nil:
			e.rect = append(e.rect, side.Eigen)
		case side.Series == nil: // no correction on this side
		default:
			cs, err := side.Series.Compile(env)
			if err != nil {
				return err
			}
			e.rect = append(e.rect, cs)
		}
		if k := k0(side.Name); s.Sides[k].Condition.Kind == Dirichlet {
			data := side.data
			*walls[k] = &data
		}
	}
	e.walls = w
	if len(rp.Waves) > 0 {
		if e.waves, err = rp.Waves.Compile(env); err != nil {
			return err
		}
	}
	e.sq = rp.Quadrature
	e.xy, err = rp.Particular.Compile(env)
	return err
}

// AtXY is u(x, y) with its error estimate and the series terms summed: a
// rectangle evaluates in x and y throughout (accurate at any size and
// aspect), other regions through r and θ ∈ [0, 2π).
func (e *Evaluator) AtXY(x, y float64) (u, errEst float64, terms int) {
	if e.walls != nil {
		u, tail := e.atXYTail(x, y)
		return u, tail + e.dataErr, 0
	}
	th := math.Atan2(y, x)
	if th < 0 {
		th += 2 * math.Pi
	}
	return e.At(math.Hypot(x, y), th)
}

// quadPolar is the point (r, θ) in the quadrature's own polar coordinates
// (a section's are about its centre).
func (e *Evaluator) quadPolar(r, theta float64) (float64, float64) {
	if !e.quad.Centred() {
		return r, theta
	}
	return e.quad.Local(r*math.Cos(theta), r*math.Sin(theta))
}

// Value is u at (r, θ) with no estimate: the quadrature's part from its
// halved mesh alone (Quadrature.Value, the same value as At's). The
// figures' scans and the pictures take thousands of points, each at a
// radius of its own, and need no estimate each: the first mesh's sums
// doubled their cost.
func (e *Evaluator) Value(r, theta float64) float64 {
	if e.quad == nil {
		v, _, _ := e.At(r, theta)
		return v
	}
	u, _, _ := e.atClosedAndSeries(r, theta)
	return u + e.quad.Value(e.quadPolar(r, theta))
}
