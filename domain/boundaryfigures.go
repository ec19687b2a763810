package domain

import (
	"math"

	"psol/series"
)

// SideFlux is the outward flux ∫ ∂u/∂n ds through one side: a heat rate per
// unit length through a face, a wall's share of the drag, a charge on a
// conductor (over ε).
type SideFlux struct {
	Side  string
	Value float64
	Exact *series.Coef // where the solution is closed
	// Infinite, where set, says why the flux is infinite (Value is NaN).
	Infinite string
}

// pointValue is u at (x, y): regions evaluate in (r, θ) with θ in [0, 2π),
// the rectangle in x and y.
func pointValue(ev *Evaluator) func(x, y float64) float64 {
	if ev.rect != nil || ev.walls != nil {
		return ev.atXY
	}
	return func(x, y float64) float64 {
		th := math.Atan2(y, x)
		if th < 0 {
			th += 2 * math.Pi
		}
		return ev.Value(math.Hypot(x, y), th)
	}
}

// step is the finite-difference step for a shape: 1e-4 of its smaller
// extent (the one-sided third-order difference then errs by about
// h³·u⁗/4 ≈ 1e-12 of the scale, near rounding; common practice).
func (s Shape) step() float64 {
	return 1e-4 * math.Min(s.Box.X1-s.Box.X0, s.Box.Y1-s.Box.Y0)
}

// sideFluxes are the outward fluxes through each side, by 16 Gauss–Legendre
// panels of 16 points along the side, the normal derivative by the
// one-sided difference inward (Shape's step).
func sideFluxes(shape Shape, ev *Evaluator) []SideFlux {
	u := pointValue(ev)
	h := shape.step()
	var out []SideFlux
	panels := 16
	for _, side := range shape.Sides {
		total := 0.0
		for i := 0; i < panels; i++ {
			a, b := float64(i)/float64(panels), float64(i+1)/float64(panels)
			for k, x := range legendreX {
				px, py, nx, ny := side.At((a+b)/2 + (b-a)/2*x)
				dn := -inward(inwardLine(shape, ev, u, px, py, nx, ny), h)
				total += (b - a) / 2 * legendreW[k] * side.Length * dn
			}
		}
		out = append(out, SideFlux{Side: side.Name, Value: total})
	}
	return out
}

// GradientPeak is the largest |∇u| over the closed region and where it is:
// a twisted bar's peak shear stress (over Gθ), a duct's peak wall shear
// (over μ), the hottest spot of a heat flux.
type GradientPeak struct {
	Value float64
	At    [2]float64 // (x, y)
	// Corner is set where the largest value sits at a re-entrant corner,
	// where |∇u| is unbounded in general: Value is then where sampling stopped.
	Corner bool
	// Exact marks a value from the exact derivatives of a closed solution
	// (at the location found by sampling), not from differences.
	Exact bool
	// Unbounded, where set, says why |∇u| has no maximum (Value is +Inf).
	Unbounded string
}

// gradientPeak samples |∇u| on the sides (the normal derivative one-sided
// inward, the tangential one along the side) and inside (central
// differences), then refines the best sample by a shrinking search. For a
// constant source |∇u|² is subharmonic (Δ|∇u|² = 2|∇∇u|²), so the peak is on
// the boundary and the caller passes inside = nil; the interior samples
// serve other sources.
func gradientPeak(shape Shape, ev *Evaluator, inside func(x, y float64) bool) GradientPeak {
	u := pointValue(ev)
	h := shape.step()
	onSide := func(side SidePath, t float64) (float64, [2]float64) {
		px, py, nx, ny := side.At(t)
		dn := -inward(inwardLine(shape, ev, u, px, py, nx, ny), h)
		// Along the side, one step inward keeps both points in the region.
		qx, qy := px-h*nx, py-h*ny
		tx, ty := -ny, nx
		dt := (u(qx+h*tx, qy+h*ty) - u(qx-h*tx, qy-h*ty)) / (2 * h)
		return math.Hypot(dn, dt), [2]float64{px, py}
	}
	best := GradientPeak{Value: -1}
	// better asks for a real gain: values equal to rounding (a circle's rim
	// in a symmetric problem) keep the first point, on every CPU. The
	// samples ask for more than the differences resolve (9 digits), the
	// refinement between them for less.
	gain := 1e-9
	better := func(g float64) bool { return g > best.Value+gain*math.Abs(best.Value) }
	var bestSide, bestT = -1, 0.0
	n := 128
	if ev.costly() {
		n = 16 // a radius costs a mode sum; the refinement finds the peak between samples
	}
	for k, side := range shape.Sides {
		margin := 4 * h / math.Max(side.Length, h)
		for j := 0; j < n; j++ {
			t := margin + (1-2*margin)*(float64(j)+0.5)/float64(n)
			if g, p := onSide(side, t); better(g) {
				best, bestSide, bestT = GradientPeak{Value: g, At: p}, k, t
			}
		}
	}
	// Inside: a polar region on rings (their points share radii, which a
	// numeric particular solution evaluates once a radius), a rectangle on
	// a 32 × 32 grid (the compass search below takes the best of them to
	// the peak: 64 × 64 took four times the evaluations, a quarter of a
	// second on a numeric source); points whose stencil is inside.
	if p := shape.Polar; p != nil && inside != nil && ev.walls == nil {
		at := func(r, th float64) float64 { v, _, _ := ev.At(r, th); return v }
		rmax := p.Reach()
		for i := 0; i < 24; i++ {
			r := p.RMin + (rmax-p.RMin)*(float64(i)+0.5)/24
			k := h / r
			for j := 0; j < 48; j++ {
				th := p.Span * (float64(j) + 0.5) / 48
				if !p.FullTurn && (th-k < 0 || th+k > p.Span) || r-h < p.RMin || r+h > rmax {
					continue
				}
				gr := (at(r+h, th) - at(r-h, th)) / (2 * h)
				gt := (at(r, th+k) - at(r, th-k)) / (2 * h)
				if g := math.Hypot(gr, gt); better(g) {
					best, bestSide = GradientPeak{Value: g, At: [2]float64{r * math.Cos(th), r * math.Sin(th)}}, -1
				}
			}
		}
	} else if inside != nil {
		box := shape.Box
		for i := 1; i < 32; i++ {
			for j := 1; j < 32; j++ {
				x, y := box.X0+(box.X1-box.X0)*float64(i)/32, box.Y0+(box.Y1-box.Y0)*float64(j)/32
				if !inside(x+h, y) || !inside(x-h, y) || !inside(x, y+h) || !inside(x, y-h) {
					continue
				}
				gx, gy := (u(x+h, y)-u(x-h, y))/(2*h), (u(x, y+h)-u(x, y-h))/(2*h)
				if g := math.Hypot(gx, gy); better(g) {
					best, bestSide = GradientPeak{Value: g, At: [2]float64{x, y}}, -1
				}
			}
		}
	}
	if bestSide < 0 && inside != nil && best.Value >= 0 { // refine inside
		// From the best sample, on fourth-order central differences: each
		// step takes the best of the 3 × 3 stencil of spacing δ about the
		// point and the Newton step of the quadratic through it (clipped
		// to δ), and halves δ where neither gains. The samples alone left
		// the value a few 10⁻⁷ of itself short, and the second order's
		// error, h²·u‴/6, was 6·10⁻⁷ of a bump's peak (width 0.1), both
		// printed to ten digits; the fourth order's, h⁴·u⁽⁵⁾/30, is about
		// 10⁻¹³ there. A search along the axes alone stalled on the
		// curved ridge round a narrower bump (width 0.03), 10⁻⁴ short.
		gain = 1e-11
		grad := func(x, y float64) (float64, bool) {
			for _, s := range []float64{-2 * h, -h, h, 2 * h} {
				if !inside(x+s, y) || !inside(x, y+s) {
					return 0, false
				}
			}
			d := func(f func(s float64) float64) float64 { return (f(-2*h) - 8*f(-h) + 8*f(h) - f(2*h)) / (12 * h) }
			gx := d(func(s float64) float64 { return u(x+s, y) })
			gy := d(func(s float64) float64 { return u(x, y+s) })
			return math.Hypot(gx, gy), true
		}
		if g, ok := grad(best.At[0], best.At[1]); ok {
			best.Value = g // the sample's value on the same differences as its neighbours'
		}
		box := shape.Box
		size := math.Max(box.X1-box.X0, box.Y1-box.Y0)
		for it, delta := 0, size/32; it < 100 && delta > 1e-7*size; it++ {
			x0, y0 := best.At[0], best.At[1]
			var g [3][3]float64
			full := true
			moved := false
			for i := -1; i <= 1; i++ {
				for j := -1; j <= 1; j++ {
					if i == 0 && j == 0 {
						g[1][1] = best.Value
						continue
					}
					x, y := x0+float64(i)*delta, y0+float64(j)*delta
					v, ok := grad(x, y)
					full = full && ok
					g[i+1][j+1] = v
					if ok && better(v) {
						best.Value, best.At, moved = v, [2]float64{x, y}, true
					}
				}
			}
			if full { // the Newton step of the stencil's quadratic
				gx, gy := (g[2][1]-g[0][1])/(2*delta), (g[1][2]-g[1][0])/(2*delta)
				hxx, hyy := (g[2][1]-2*g[1][1]+g[0][1])/(delta*delta), (g[1][2]-2*g[1][1]+g[1][0])/(delta*delta)
				hxy := (g[2][2] - g[2][0] - g[0][2] + g[0][0]) / (4 * delta * delta)
				// Along the Hessian's eigenvectors, only those of a
				// curvature well below 0: on a flat ridge (a radial
				// problem's ring of peaks) the other's step is rounding's,
				// and builds with and without fused multiply-add walked
				// the ring to different points.
				tr, det := hxx+hyy, hxx*hyy-hxy*hxy
				disc := math.Sqrt(math.Max(0, tr*tr/4-det))
				l1, l2 := tr/2-disc, tr/2+disc // l1 ≤ l2
				var sx, sy float64
				for _, l := range []float64{l1, l2} {
					if l >= 1e-3*l1 { // not well below 0 (l1 < 0 here, or no step)
						continue
					}
					vx, vy := hxy, l-hxx // an eigenvector of l
					if math.Abs(vx)+math.Abs(vy) < 1e-12*(math.Abs(hxx)+math.Abs(hyy)) {
						vx, vy = l-hyy, hxy
					}
					if n := math.Hypot(vx, vy); n > 0 {
						vx, vy = vx/n, vy/n
						t := -(gx*vx + gy*vy) / l
						sx, sy = sx+t*vx, sy+t*vy
					}
				}
				if sx != 0 || sy != 0 {
					if l := math.Hypot(sx, sy); l > delta {
						sx, sy = sx*delta/l, sy*delta/l
					}
					if v, ok := grad(x0+sx, y0+sy); ok && better(v) {
						best.Value, best.At, moved = v, [2]float64{x0 + sx, y0 + sy}, true
					}
				}
			}
			if !moved {
				delta /= 2
			}
		}
	}
	if bestSide >= 0 { // refine along the side
		gain = 1e-11
		side := shape.Sides[bestSide]
		margin := 4 * h / math.Max(side.Length, h)
		dt := 1.0 / float64(n)
		for it := 0; it < 40 && dt > 1e-10; it++ {
			moved := false
			for _, t := range []float64{bestT - dt, bestT + dt} {
				if t < margin || t > 1-margin {
					continue
				}
				if g, p := onSide(side, t); better(g) {
					best.Value, best.At, bestT, moved = g, p, t, true
				}
			}
			if !moved {
				dt /= 2
			}
		}
	}
	best.Corner = nearReentrantCorner(shape, best.At, 4/128.0)
	return best
}

// nearReentrantCorner reports a point within frac of the region's size of a
// corner where two sides meet turning right (an interior angle above π),
// travelling with the region on the left. A hole's sides may run either way
// in their parameter (a hole given anticlockwise runs against that travel),
// so each side's ends are taken in the order of travel, not of t: a convex
// hole's every corner is re-entrant for the region round it.
func nearReentrantCorner(shape Shape, p [2]float64, frac float64) bool {
	size := math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
	for _, a := range shape.Sides {
		ax, ay, atx, aty := travelEnd(a, true)
		for _, b := range shape.Sides {
			bx, by, btx, bty := travelEnd(b, false)
			if math.Hypot(ax-bx, ay-by) > 1e-9*size {
				continue
			}
			if cross := atx*bty - aty*btx; cross < -1e-9 && math.Hypot(p[0]-ax, p[1]-ay) <= frac*size {
				return true
			}
		}
	}
	return false
}

// travelEnd is the side's last point (or first, with last false) in the
// order of travel with the region on the left, and the unit tangent of that
// travel there, (−n_y, n_x) for the outward normal n.
func travelEnd(side SidePath, last bool) (x, y, tx, ty float64) {
	x0, y0, nx0, ny0 := side.At(0)
	x1, y1, nx1, ny1 := side.At(1)
	// Does t run with the travel? The step from t = 0 to t = 1/4 against
	// the travel's tangent at t = 1/8 (a side turns far less than π in an eighth).
	xq, yq, _, _ := side.At(0.25)
	_, _, nxe, nye := side.At(0.125)
	forward := (xq-x0)*(-nye)+(yq-y0)*nxe >= 0
	if last == forward {
		return x1, y1, -ny1, nx1
	}
	return x0, y0, -ny0, nx0
}

// costly reports an evaluator with a numeric particular solution, whose
// every new radius (or ordinate) costs a sum over its modes and panels.
func (e *Evaluator) costly() bool { return e.quad != nil || e.sq != nil }

// inwardLine is u at distance s inward from the boundary point p along the
// normal. In a polar region it steps in r and θ (s·n_r, s·n_θ/r), so that
// the points off a ray share its radius, and those off an arc share theirs:
// a numeric particular solution then computes one radius, not one a point.
// The path differs from the straight normal by O(s²), which the one-sided
// difference (exact for quadratics) does not see.
func inwardLine(shape Shape, ev *Evaluator, u func(x, y float64) float64, px, py, nx, ny float64) func(s float64) float64 {
	line, _ := inwardPath(shape, ev, u, px, py, nx, ny)
	return func(s float64) float64 { v, _ := line(s); return v }
}

// inwardPath is inwardLine with the evaluator's own error estimate at each
// point where the path curves; curved is false, and the estimate 0, where it
// is straight and u gives none.
func inwardPath(shape Shape, ev *Evaluator, u func(x, y float64) float64, px, py, nx, ny float64) (line func(s float64) (v, est float64), curved bool) {
	straight := func(s float64) (float64, float64) { return u(px-s*nx, py-s*ny), 0 }
	if shape.Polar == nil || ev.walls != nil {
		return straight, false
	}
	r := math.Hypot(px, py)
	if r < 100*shape.step() { // near the centre the angular step s/r is not small: go straight
		return straight, false
	}
	th := math.Atan2(py, px)
	if th < 0 {
		th += 2 * math.Pi
	}
	if shape.Polar.Span < 2*math.Pi && th > shape.Polar.Span+1e-12 {
		th -= 2 * math.Pi // a ray at θ = 0 reached from below
	}
	nr := nx*math.Cos(th) + ny*math.Sin(th)
	nt := -nx*math.Sin(th) + ny*math.Cos(th)
	return func(s float64) (float64, float64) {
		v, est, _ := ev.At(r-s*nr, th-s*nt/r)
		return v, est
	}, true
}
