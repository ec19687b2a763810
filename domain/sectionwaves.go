package domain

import (
	"math"
	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
)

// WavePart is a section's particular solution's part in exponentials and
// trigonometric functions of x and y: u_w with Δu_w = f_w, from the wave
// ansatz (ansatz.SplitWaves, the rectangle's rule), in closed form beside
// the polar rules' u_p. Without it a source such as sin(x)·cosh(y) went to
// the quadrature on a polygon or an ellipse, and u_p printed as
// quadrature(…) where −sin(x)·cosh(y)/… is exact (the product's spec: the
// Cartesian ansatz holds on any region).
type WavePart struct {
	Waves  cart.Waves // u_w
	Source cart.Waves // f_w, the source's part the waves solve
	// Poly is the polynomial the waves leave over (sin(x)² = 1/2 −
	// cos(2x)/2), which the polar rules solve with the source's own.
	Poly cart.Poly
	// Posed is the source's whole non-polar part as posed (the waves' and
	// the quadrature's, if any), for printing the problem and integrating
	// the source.
	Posed *series.Expr
}

// waveEval is u_w and its gradient in numbers.
type waveEval struct{ u, ux, uy *cart.CompiledWaves }

func (w *WavePart) compile(env series.Env) (*waveEval, error) {
	u, err := w.Waves.Compile(env) // refuses a parameter with no value
	if err != nil {
		return nil, err
	}
	ux, err := w.Waves.DX().Compile(env)
	if err != nil {
		return nil, err
	}
	uy, err := w.Waves.DY().Compile(env)
	if err != nil {
		return nil, err
	}
	return &waveEval{u, ux, uy}, nil
}

// AtXY is u_w at (x, y): the evaluator adds it as one of its xy parts.
func (we *waveEval) AtXY(x, y float64) float64 { return we.u.At(x, y) }

func (we *waveEval) grad(x, y float64) (float64, float64) { return we.ux.At(x, y), we.uy.At(x, y) }

// attach adds u_w to the evaluator.
func (w *WavePart) attach(e *Evaluator, _ *Solution, env series.Env) error {
	we, err := w.compile(env)
	if err != nil {
		return err
	}
	e.after = append(e.after, we)
	return nil
}

// splitSectionWaves takes the waves out of a section's source: the wave
// part and its numbers, the posed problem left for the polar rules and the quadrature (its
// rest what no rule closes, nil when the waves took it all), and the
// polynomial the waves leave over (sin(x)² = 1/2 − cos(2x)/2), which joins
// the polar rules' source. Nil where the source has no waves, or they need
// parameters without values (the quadrature then refuses them as before).
func splitSectionWaves(p *posed) (*WavePart, *waveEval, *posed, series.Sum) {
	if p.rest == nil || p.forceQuadrature {
		return nil, nil, p, p.f
	}
	split := ansatz.SplitWaves(p.rest, false)
	if len(split.Waves) == 0 {
		return nil, nil, p, p.f
	}
	wp := &WavePart{Waves: split.Waves, Source: split.Source, Poly: split.Poly, Posed: p.rest}
	we, err := wp.compile(p.env)
	if err != nil {
		return nil, nil, p, p.f
	}
	left := *p
	left.rest = split.Rest
	return wp, we, &left, p.f.Add(split.Poly.Polar())
}

// integrals are ∬ u_w dA and ∬ (f_w + Poly) dA by the section's adaptive
// area rule, each refined to its own integrand.
func (w *WavePart) integrals(d section, env series.Env) (u, f float64, err error) {
	we, err := w.compile(env)
	if err != nil {
		return 0, 0, err
	}
	cf, err := w.Source.Add(cart.Waves{{Cos: w.Poly}}).Compile(env)
	if err != nil {
		return 0, 0, err
	}
	for _, part := range []struct {
		at  func(x, y float64) float64
		out *float64
	}{{we.AtXY, &u}, {cf.At, &f}} {
		nodes, err := areaNodes(d, env, part.at)
		if err != nil {
			return 0, 0, err
		}
		for _, n := range nodes {
			*part.out += n[2] * part.at(n[0], n[1])
		}
	}
	return u, f, nil
}

// check is Δu_w − f_w reduced exactly, named as the rectangle names its
// waves' check; a residual (which the wave ansatz never leaves) fails it.
func (w *WavePart) check() Check {
	c := Check{Name: "lap(u_p) - f (exponential and trigonometric part)", Exact: true}
	if r := w.Waves.Laplacian().Add(w.Source.Scale(cart.Monomial(series.IntCoef(-1), 0, 0))); len(r) > 0 {
		c.Exact, c.Numeric = false, math.Inf(1)
	}
	return c
}

// waveSize is the largest |u_w| on a 17 × 17 grid of the box, at the points
// inside the region.
func waveSize(we *waveEval, box Box, inside func(x, y float64) bool) float64 {
	size := 0.0
	for i := 0; i <= 16; i++ {
		for j := 0; j <= 16; j++ {
			x := box.X0 + (box.X1-box.X0)*float64(i)/16
			y := box.Y0 + (box.Y1-box.Y0)*float64(j)/16
			if inside == nil || inside(x, y) {
				size = math.Max(size, math.Abs(we.AtXY(x, y)))
			}
		}
	}
	return size
}

// NonPolarSource is the source's part the polar rules do not take, as
// posed: the waves' and the quadrature's (Rest alone is the quadrature's).
func (s *Solution) NonPolarSource() *series.Expr {
	if s.Waves != nil {
		return s.Waves.Posed
	}
	return s.Rest
}

// WavesBound reports a parameter of the waves with no value in env
// (cart's Compile refuses it; before it did, a polynomial factor's
// parameter evaluated as 0 at each point, and Δu = q·sin(x) with q unset
// printed u ≈ −q·sin(x) + h with h fitted for q = 0).
func WavesBound(ws cart.Waves, env series.Env) error {
	_, err := ws.Compile(env)
	return err
}
