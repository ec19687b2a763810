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
		v, _, _ := ev.At(math.Hypot(x, y), th)
		return v
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
	for _, side := range shape.Sides {
		total := 0.0
		for i := 0; i < 16; i++ {
			a, b := float64(i)/16, float64(i+1)/16
			for k, x := range legendreX {
				px, py, nx, ny := side.At((a+b)/2 + (b-a)/2*x)
				dn := -inward(func(s float64) float64 { return u(px-s*nx, py-s*ny) }, h)
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
		dn := -inward(func(s float64) float64 { return u(px-s*nx, py-s*ny) }, h)
		// Along the side, one step inward keeps both points in the region.
		qx, qy := px-h*nx, py-h*ny
		tx, ty := -ny, nx
		dt := (u(qx+h*tx, qy+h*ty) - u(qx-h*tx, qy-h*ty)) / (2 * h)
		return math.Hypot(dn, dt), [2]float64{px, py}
	}
	best := GradientPeak{Value: -1}
	// better asks for a real gain: values equal to rounding (a circle's rim
	// in a symmetric problem) keep the first point, on every CPU.
	better := func(g float64) bool { return g > best.Value+1e-11*math.Abs(best.Value) }
	var bestSide, bestT = -1, 0.0
	const n = 128
	for k, side := range shape.Sides {
		margin := 4 * h / math.Max(side.Length, h)
		for j := 0; j < n; j++ {
			t := margin + (1-2*margin)*(float64(j)+0.5)/n
			if g, p := onSide(side, t); better(g) {
				best, bestSide, bestT = GradientPeak{Value: g, At: p}, k, t
			}
		}
	}
	// Inside, on a 64 × 64 grid over the box, points whose stencil is inside.
	box := shape.Box
	for i := 1; i < 64 && inside != nil; i++ {
		for j := 1; j < 64; j++ {
			x, y := box.X0+(box.X1-box.X0)*float64(i)/64, box.Y0+(box.Y1-box.Y0)*float64(j)/64
			if !inside(x+h, y) || !inside(x-h, y) || !inside(x, y+h) || !inside(x, y-h) {
				continue
			}
			gx, gy := (u(x+h, y)-u(x-h, y))/(2*h), (u(x, y+h)-u(x, y-h))/(2*h)
			if g := math.Hypot(gx, gy); better(g) {
				best, bestSide = GradientPeak{Value: g, At: [2]float64{x, y}}, -1
			}
		}
	}
	if bestSide >= 0 { // refine along the side
		side := shape.Sides[bestSide]
		margin := 4 * h / math.Max(side.Length, h)
		dt := 1.0 / n
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
	best.Corner = nearReentrantCorner(shape, best.At, 4/float64(n))
	return best
}

// nearReentrantCorner reports a point within frac of the region's size of a
// corner where two sides meet turning right (an interior angle above π).
func nearReentrantCorner(shape Shape, p [2]float64, frac float64) bool {
	size := math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
	for _, a := range shape.Sides {
		ax, ay, anx, any := a.At(1)
		for _, b := range shape.Sides {
			bx, by, bnx, bny := b.At(0)
			if math.Hypot(ax-bx, ay-by) > 1e-9*size {
				continue
			}
			// Tangents (−n_y, n_x) along the travel; a right turn is re-entrant.
			if cross := (-any)*bnx - anx*(-bny); cross < -1e-9 && math.Hypot(p[0]-ax, p[1]-ay) <= frac*size {
				return true
			}
		}
	}
	return false
}
