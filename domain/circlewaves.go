package domain

import (
	"math"

	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
)

// solveCircleWaves takes a disk's or an annulus's source waves in closed
// form (WavePart), as a section does: u = u_w + w, w the region's ordinary
// solve with the rest of the source and each circle's data less B[u_w],
// sampled (a FuncField, which the circles' numeric data path takes by FFT),
// as point sources' fields are (solvePoints). Before, Δu = sin x on a disk
// printed u_p = quadrature(sin(r*cos(theta))). Not handled (false): no
// waves, a parameter without a value, a floating circle (its net flux would
// need the waves' share), a kink beside the waves, or another region.
func solveCircleWaves(d Domain, source series.Field, conds []Condition, opt Options) (*Solution, bool, error) {
	switch d.(type) {
	case Disk, Annulus:
	default:
		return nil, false, nil
	}
	if source.Rest == nil || opt.NumericSource {
		return nil, false, nil
	}
	for _, c := range conds {
		if c.Kind == Floating {
			return nil, false, nil
		}
	}
	split := ansatz.SplitWaves(source.Rest, false)
	if len(split.Waves) == 0 {
		return nil, false, nil
	}
	if split.Rest != nil {
		// A kink beside the waves keeps the quadrature's road: there its
		// trace is exact (Kink.CircleTrace), here the circles' sampled data
		// would take it numerically, thousands of modes falling like n⁻⁴ (a
		// kink with eˣ beside it took 1.1 s, and 18 s with --report, for
		// 0.05 and 0.3 s).
		if kinks, _ := ansatz.SplitKinks(split.Rest, opt.Env); len(kinks) > 0 {
			return nil, false, nil
		}
	}
	wp := &WavePart{Waves: split.Waves, Source: split.Source, Poly: split.Poly, Posed: source.Rest}
	we, err := wp.compile(opt.Env)
	if err != nil {
		return nil, false, nil
	}
	outward := map[string]float64{}
	for _, c := range d.(circular).circles() {
		outward[c.name] = float64(c.outward)
	}
	shifted := make([]Condition, len(conds))
	for i, c := range conds {
		h, err := c.H.Float(opt.Env)
		if c.Kind == Robin && err != nil {
			return nil, true, unsupported("the Robin coefficient on %s needs a value: %w", c.Side, err)
		}
		kind, sign := c.Kind, outward[c.Side]
		at := func(r, theta float64) float64 {
			x, y := r*math.Cos(theta), r*math.Sin(theta)
			v := we.AtXY(x, y)
			if kind == Dirichlet {
				return v
			}
			gx, gy := we.grad(x, y)
			return operatorValue(kind, h, v, sign*(gx*math.Cos(theta)+gy*math.Sin(theta)))
		}
		trace := series.FuncField(OperatorText(c, "u_w"), operatorLaTeX(c, "u_w"), at)
		shifted[i] = c
		shifted[i].G = c.G.Add(trace.Neg())
	}
	rest := series.Field{Exact: source.Exact.Add(split.Poly.Polar()), Rest: split.Rest}
	sol, err := SolveWith(d, rest, shifted, opt)
	if err != nil {
		return nil, true, err
	}
	sol.Source, sol.Waves = source.Exact, wp
	byside := map[string]Condition{}
	for _, c := range conds {
		byside[c.Side] = c
	}
	sol.restoreConditions(byside)
	sol.stages = append(sol.stages, wp)
	sol.Checks = append(sol.Checks, wp.check())
	sol.Numeric = true
	sol.recheck()
	return sol, true, nil
}

// circleWaveFigures adds u_w's share to a disk's or an annulus's figures:
// ∬u_w and ∬(f_w + the polynomial the waves leave) by Gauss–Legendre
// panels in r and the trapezoidal rule in θ (spectral for the periodic,
// entire integrands), doubled until two meshes agree to 1e-14 of the
// integrand's size; each circle's outward flux of u_w by the trapezoidal
// rule likewise.
func (s *Solution) circleWaveFigures(rep *Report, shape Shape, env series.Env) error {
	we, err := s.Waves.compile(env)
	if err != nil {
		return err
	}
	f, err := s.Waves.Source.Add(cart.Waves{{Cos: s.Waves.Poly}}).Compile(env)
	if err != nil {
		return err
	}
	box := shape.Polar
	integral := func(g func(x, y float64) float64) float64 {
		prev := math.NaN()
		for n := 16; ; n *= 2 {
			total, size := 0.0, 0.0
			panels := n / 8
			for p := 0; p < panels; p++ {
				a := box.RMin + (box.RMax-box.RMin)*float64(p)/float64(panels)
				b := box.RMin + (box.RMax-box.RMin)*float64(p+1)/float64(panels)
				for k, x := range ansatz.GaussX {
					r := (a+b)/2 + (b-a)/2*x
					w := (b - a) / 2 * ansatz.GaussW[k] * r * 2 * math.Pi / float64(4*n)
					for j := 0; j < 4*n; j++ {
						th := 2 * math.Pi * float64(j) / float64(4*n)
						v := g(r*math.Cos(th), r*math.Sin(th))
						total += w * v
						size = math.Max(size, math.Abs(v))
					}
				}
			}
			if math.Abs(total-prev) <= 1e-14*size*shape.Area || n >= 1024 {
				return total
			}
			prev = total
		}
	}
	rep.Integral += integral(we.AtXY)
	rep.IntegralExact = nil
	if A, err := rep.Area.Float(env); err == nil && A > 0 {
		rep.Mean = rep.Integral / A
	}
	rep.Source += integral(f.At)
	rep.SourceExact = nil
	if len(rep.Sides) == len(shape.Sides) {
		rep.Flux, rep.FluxExact = 0, nil
		for k, side := range shape.Sides {
			prev, flux := math.NaN(), 0.0
			for n := 64; n <= 1<<16; n *= 2 {
				flux = 0
				for j := 0; j < n; j++ {
					x, y, nx, ny := side.At(float64(j) / float64(n))
					gx, gy := we.grad(x, y)
					flux += (gx*nx + gy*ny) * side.Length / float64(n)
				}
				if math.Abs(flux-prev) <= 1e-14*math.Max(math.Abs(flux), side.Length) {
					break
				}
				prev = flux
			}
			rep.Sides[k].Value += flux
			rep.Sides[k].Exact = nil
			rep.Flux += rep.Sides[k].Value
		}
	}
	return nil
}
