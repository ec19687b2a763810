package domain

import (
	"math"

	"psol/ansatz"
	"psol/series"
)

// Shape is a region's geometry in numbers, for given parameter values: what
// plots, grids, checks and figures need, so that none of them asks which
// region it has. Each region builds its own (Domain.Shape).
type Shape struct {
	// Sides are the boundary parts in the order of Domain.Sides.
	Sides []SidePath
	// Area is the region's area; +Inf for an unbounded region.
	Area float64
	// Box is the closed region's bounding box; for an unbounded region, the
	// window around the boundary that pictures show.
	Box Box
	// Polar is the region as a box in (r, θ), where it is one; nil otherwise
	// (a rectangle is sampled in x and y).
	Polar *PolarBox
}

// Box is x0 ≤ x ≤ x1, y0 ≤ y ≤ y1.
type Box struct{ X0, X1, Y0, Y1 float64 }

// SidePath is one boundary part: its length and a parametrisation by t in [0, 1].
type SidePath struct {
	Name   string
	Length float64
	// At is the point at t ∈ [0, 1] and the outward unit normal there; t
	// is proportional to arc length (t·Length along the side), which the
	// integrals along the side rely on (panelNodes weighs by it).
	At func(t float64) (x, y, nx, ny float64)
	// Even, where set, maps u uniform in [0, 1] to the t of an even
	// sampling of the side: one uniform in the variable its fitted terms
	// oscillate in, where that runs unevenly against arc length. An
	// ellipse's polynomial and exterior-map terms are trigonometric
	// polynomials in its eccentric angle, which arc length samples ten
	// times more thinly at the ends than at the flanks of a 10:1 ellipse.
	Even func(u float64) float64
	// EvenOf is Even's inverse, u at t (set with Even).
	EvenOf func(t float64) float64
	// EvenRate is dt/du of Even (set with Even): integrals along the side
	// take their nodes in u (panelNodes). A thin ellipse's fluxes gather
	// at its tips within a length b²/a, which panels in arc length missed:
	// the flux out of a 14.5:1 confocal hole read 0.8% short.
	EvenRate func(u float64) float64
}

// panelNodes calls node with each node of the Gauss–Legendre rule (xs,
// ws on [−1, 1]) on the panels between consecutive edges of [0, 1], taken
// in the side's even variable u: t = even(u), and its weight in arc length,
// Length·dt/du·(panel width)/2·w.
func (p SidePath) panelNodes(edges, xs, ws []float64, node func(t, ds float64)) {
	for i := 0; i+1 < len(edges); i++ {
		lo, hi := edges[i], edges[i+1]
		for j, x := range xs {
			u := (lo+hi)/2 + (hi-lo)/2*x
			node(p.even(u), p.Length*p.evenRate(u)*(hi-lo)/2*ws[j])
		}
	}
}

// closedTrapezoid is the node count of the trapezoidal rule on a closed
// side for the report's side integrals (closedNodes).
const closedTrapezoid = 2048

// closedNodes are a side integral's nodes: on a closed side (a circle, an
// ellipse) the trapezoidal rule in the even variable with n nodes, spectral
// for a periodic integrand; on an open one panelNodes on the edges given. A round hole 0.023 from a 1 × 0.05 ellipse's rim,
// 0.004 of the turn in the eccentric angle, made the rim's flux by the
// graded panels (1/32 of the turn in the middle) 2.6e-9 short of 0.30; the
// rule's error falls like e^(−2π·n·0.004), under 1e-20 at 2048 nodes.
func (p SidePath) closedNodes(edges []float64, n int, node func(t, ds float64)) {
	x0, y0, _, _ := p.At(0)
	x1, y1, _, _ := p.At(1)
	if math.Hypot(x1-x0, y1-y0) > 1e-12*math.Max(1, p.Length) {
		p.panelNodes(edges, ansatz.GaussX, ansatz.GaussW, node)
		return
	}
	for j := 0; j < n; j++ {
		u := float64(j) / float64(n)
		node(p.even(u), p.Length*p.evenRate(u)/float64(n))
	}
}

// uniformEdges are n equal panels' edges on [0, 1].
func uniformEdges(n int) []float64 {
	edges := make([]float64, n+1)
	for i := range edges {
		edges[i] = float64(i) / float64(n)
	}
	return edges
}

// evenRate is dt/du of even: EvenRate, or 1 where even is arc length.
func (p SidePath) evenRate(u float64) float64 {
	if p.Even == nil || p.EvenOf == nil || p.EvenRate == nil {
		return 1
	}
	return p.EvenRate(u)
}

// even is the side's even sampling at u: Even, or arc length (where Even
// or its inverse is missing, so that even and evenOf stay inverses: the
// quadrature's trace interpolant places its nodes by one and reads by the
// other).
func (p SidePath) even(u float64) float64 {
	if p.Even == nil || p.EvenOf == nil || p.EvenRate == nil {
		return u
	}
	return p.Even(u)
}

// evenOf is even's inverse: u at t.
func (p SidePath) evenOf(t float64) float64 {
	if p.Even == nil || p.EvenOf == nil || p.EvenRate == nil {
		return t
	}
	return p.EvenOf(t)
}

// PolarBox is RMin ≤ r ≤ RMax, 0 ≤ θ ≤ Span. RMax is +Inf outside a circle;
// FullTurn marks Span = 2π with θ periodic (no ray sides).
type PolarBox struct {
	RMin, RMax, Span float64
	FullTurn         bool
}

// Reach is the largest radius that samples of the region go to: RMax, or
// ten times RMin outside a circle (far enough to show the decay, near
// enough to resolve the boundary).
func (p PolarBox) Reach() float64 {
	if math.IsInf(p.RMax, 1) {
		return 10 * p.RMin
	}
	return p.RMax
}

// Perimeter is the sum of the sides' lengths: the wetted perimeter of a duct
// whose every side is a wall.
func (s Shape) Perimeter() float64 {
	p := 0.0
	for _, side := range s.Sides {
		p += side.Length
	}
	return p
}

// HydraulicDiameter is 4A/P (common practice for ducts of any section).
func (s Shape) HydraulicDiameter() float64 { return 4 * s.Area / s.Perimeter() }

// Outline is the boundary as polylines for pictures: each side sampled at
// n + 1 points, sides that meet end to start chained into one line (so a
// rectangle or a sector is one closed loop, with proper corners).
func (s Shape) Outline(n int) [][][2]float64 {
	var out [][][2]float64
	used := make([]bool, len(s.Sides))
	sample := func(side SidePath) [][2]float64 {
		line := make([][2]float64, n+1)
		for i := range line {
			x, y, _, _ := side.At(float64(i) / float64(n))
			line[i] = [2]float64{x, y}
		}
		return line
	}
	near := func(p, q [2]float64) bool {
		scale := math.Max(s.Box.X1-s.Box.X0, s.Box.Y1-s.Box.Y0)
		return math.Hypot(p[0]-q[0], p[1]-q[1]) <= 1e-9*scale
	}
	for first := range s.Sides {
		if used[first] {
			continue
		}
		used[first] = true
		line := sample(s.Sides[first])
		for joined := true; joined; {
			joined = false
			for k, side := range s.Sides {
				if used[k] {
					continue
				}
				x, y, _, _ := side.At(0)
				if near(line[len(line)-1], [2]float64{x, y}) {
					used[k], joined = true, true
					line = append(line, sample(side)[1:]...)
				}
			}
		}
		out = append(out, line)
	}
	return out
}

// arcPath is the arc of radius R from angle a to b; outward is +1 where the
// region lies inside the circle, −1 where it lies outside.
func arcPath(name string, R, a, b float64, outward int) SidePath {
	o := float64(outward)
	return SidePath{Name: name, Length: R * math.Abs(b-a), At: func(t float64) (x, y, nx, ny float64) {
		th := a + (b-a)*t
		c, s := math.Cos(th), math.Sin(th)
		return R * c, R * s, o * c, o * s
	}}
}

// segmentPath is the straight side from (x0, y0) to (x1, y1) with the
// region on its left, so that the outward normal points to the right.
func segmentPath(name string, x0, y0, x1, y1 float64) SidePath {
	l := math.Hypot(x1-x0, y1-y0)
	nx, ny := (y1-y0)/l, -(x1-x0)/l
	return SidePath{Name: name, Length: l, At: func(t float64) (float64, float64, float64, float64) {
		return x0 + (x1-x0)*t, y0 + (y1-y0)*t, nx, ny
	}}
}

// Floats evaluates coefficients with the parameters' values, stopping at
// the first error.
func Floats(env series.Env, cs ...series.Coef) ([]float64, error) { return floats(env, cs...) }

// floats evaluates coefficients with the parameters' values, stopping at the first error.
func floats(env series.Env, cs ...series.Coef) ([]float64, error) {
	out := make([]float64, len(cs))
	for i, c := range cs {
		v, err := c.Float(env)
		if err != nil {
			return nil, err
		}
		out[i] = v
	}
	return out, nil
}

// circleBox is the box around a circle of radius R.
func circleBox(R float64) Box { return Box{-R, R, -R, R} }
