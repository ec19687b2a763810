package domain

import (
	"fmt"
	"math"

	"psol/series"
)

// verifyIndependently checks the assembled solution against its boundary
// conditions by a path that shares no operator code with the solve: u from
// the evaluator (the closed parts and the series as printed and summed; the
// Dirichlet data and the Poisson integral near a circle, which would read
// the data back, switched off), the outward normal from the region's
// geometry (Shape), ∂u/∂n by one-sided differences along it, and the data
// g and the Robin coefficient h compiled from the conditions as given. A
// wrong operator in the solve (a sign, a doubled coefficient, a shifted
// eigenfunction) is solved consistently and then verified consistently by
// the exact checks; this check is not fooled.
//
// It samples 24 points a side away from the ends and from jumps in the
// data, and returns the largest residual beyond ten times the evaluator's
// own error estimate there (a series converging slowly towards a corner
// whose data disagree is not a defect), relative to the data's size and
// in units of the side's tolerance (1e-6; 1e-3 beside jumps in the data),
// and the side where it is: the check holds below 1. ok is false where
// parameters have no values.
func (s *Solution) verifyIndependently() (worst float64, side string, ok bool) {
	env := s.Options.Env
	if s.Free != "" {
		env = withFree(env, s.Free, s.FreeMean)
	}
	ev, err := s.Compile(env, math.Min(s.Options.Tol, 1e-10), CheckTerms)
	if err != nil {
		return 0, "", false
	}
	ev.walls, ev.rim, ev.arcs = nil, nil, nil // no reading the data back
	shape, err := s.Domain.Shape(env)
	if err != nil {
		return 0, "", false
	}
	u := pointValue(ev)
	h := shape.step()
	for k, path := range shape.Sides {
		if k >= len(s.Sides) {
			break
		}
		cond := s.Sides[k].Condition
		if cond.Kind == Floating {
			continue // its data are a net flux: checked by the figures' side fluxes
		}
		g, err := cond.G.Compile(env)
		if err != nil {
			return 0, "", false
		}
		hr, _ := cond.H.Float(env)
		gAt := func(t float64) float64 {
			x, y, _, _ := path.At(t)
			th := math.Atan2(y, x)
			if th < 0 {
				th += 2 * math.Pi
			}
			if shape.Polar != nil && !shape.Polar.FullTurn && th > shape.Polar.Span+1e-9 {
				th -= 2 * math.Pi
			}
			return g.At(math.Hypot(x, y), th)
		}
		scale := 1.0
		for j := 0; j <= 48; j++ {
			scale = math.Max(scale, math.Abs(gAt(float64(j)/48)))
		}
		// Jumps in the data: the series converges like 1/n near them, more
		// slowly than its own tail estimate says; points near them are
		// skipped and the side's tolerance is a thousandth, still far below
		// what a wrong operator leaves (of the order of the data).
		var jumps []float64
		for j := 1; j < 400; j++ {
			t := float64(j) / 400
			if math.Abs(gAt(t+0.002)-gAt(t-0.002)) > 0.1*scale {
				jumps = append(jumps, t)
			}
		}
		tol := 1e-6
		if len(jumps) > 0 {
			tol = 1e-3
		}
	points:
		for j := 0; j < 24; j++ {
			t := 0.05 + 0.9*(float64(j)+0.5)/24
			for _, jt := range jumps {
				if math.Abs(t-jt) < 0.05 || math.Abs(t-jt) > 0.95 {
					continue points
				}
			}
			gt := gAt(t)
			px, py, nx, ny := path.At(t)
			// The difference's step, at most a hundredth of the way to the
			// side's nearer end: by a re-entrant corner ∂u/∂n varies on the
			// scale of that distance, and the third-order difference's error
			// grows as (h/distance)³. A 10:1 slot's end, 0.06 long, with
			// dn(u) = 0 on it, failed this check by twice its tolerance at
			// 0.003 from a corner, with the fit's residual at 2e-13.
			h := math.Min(h, 0.01*math.Min(t, 1-t)*path.Length)
			stepIn, curved := inwardPath(shape, ev, u, px, py, nx, ny)
			line := func(s float64) float64 { v, _ := stepIn(s); return v }
			// The series' own tail one step in: not a defect. Taken on the
			// inward path where it curves, whose points keep the side's
			// radius on a ray (a radius the quadrature has evaluated).
			var est float64
			if curved {
				_, est = stepIn(h)
			} else {
				_, est, _ = ev.AtXY(px-h*nx, py-h*ny)
			}
			if cond.Kind != Dirichlet {
				est /= h // it enters the difference quotient
			}
			var lhs float64
			switch cond.Kind {
			case Dirichlet:
				lhs = line(0)
			case Neumann:
				lhs = -inward(line, h)
			case Robin:
				lhs = -inward(line, h) + hr*line(0)
			}
			if r := (math.Abs(lhs-gt) - 10*est) / scale / tol; r > worst || math.IsNaN(r) {
				worst, side = r, cond.Side
			}
		}
	}
	return worst, side, true
}

func withFree(env series.Env, name string, v series.Coef) series.Env {
	out := series.Env{name: v}
	for k, c := range env {
		out[k] = c
	}
	return out
}

// independentCheck is the check line of verifyIndependently: it holds when
// the largest relative residual is below tol (the differences' error, the
// series' and numeric parts' estimates, and a margin).
func (s *Solution) independentCheck() (Check, bool) {
	worst, side, ok := s.verifyIndependently()
	if !ok {
		return Check{}, false
	}
	if math.IsNaN(worst) || math.IsInf(worst, 0) {
		s.Notes = append(s.Notes, "the independent check of the conditions could not be done: the solution's values exceed float64's range")
		return Check{}, false
	}
	limit := 1 + 1e7*s.DataError // numeric data's own error, in units of 1e-6
	c := Check{Name: "u and dn(u) from the evaluated solution against the data (independent)", Side: side, Numeric: worst}
	if worst > limit {
		c.Name = fmt.Sprintf("INDEPENDENT CHECK FAILED on %s: the evaluated solution misses its condition there by %.2g times the tolerance", side, worst)
		c.independentFailed = true
	}
	return c, true
}
