package domain

import (
	"fmt"
	"math"
	"psol/series"
	"psol/series/cart"
)

// rectSection is a rectangle solved as a section: its harmonic part fitted
// (poles at the four corners and a polynomial) instead of summed from side
// series. The rectangle takes that road where its own series would be
// numeric and miss the target — a side whose correction is no polynomial
// or meets a Robin side — because there the side series, with a fixed
// count of modes of data that do not vanish to high order at the corners,
// stop near 1e-8 of the data whatever the tolerance (Δu = eˣ on a 2 × 1
// rectangle: 3.3e-8 on its long sides against a target of 1e-12), while
// the fit meets the target and says how well (the maximum principle, or the
// change between fits). Data given in pieces stay with the side series,
// whose panels break at the jumps, and which say how far they fall short
// (rectShortfall); the fit takes no breaks at jumps.
type rectSection struct{ Rect }

func (r rectSection) geometry(env series.Env) (sectionGeometry, error) {
	return plainGeometry(r.Rect, env)
}

func (r rectSection) areaCells(env series.Env) ([]areaCell, error) {
	return rectCells(r.Rect, env)
}

func (r rectSection) solve(p *posed) (*Solution, error) { return solveSection(r, p) }

func (r rectSection) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return sectionFigures(r, s, ev, rep, env)
}

// asSection reports whether the rectangle's problem may go to the fit: its
// sides are numbers and no side's data come in pieces (the fit places no
// breaks at jumps; it does at kinks, addDataKinkBreaks). The
// rectangle's solve sends it there where its own series would be numeric.
func (d Rect) asSection(p *posed) (rectSection, bool) {
	if _, err := floats(p.env, d.L, d.H); err != nil {
		return rectSection{}, false
	}
	for _, c := range p.conds {
		if c.G.IsPiecewise() || c.G.Rest.HasChoice() {
			return rectSection{}, false
		}
	}
	return rectSection{d}, true
}

// polynomialInXY reports a polar sum that is a polynomial in x and y.
func polynomialInXY(s series.Sum) bool {
	_, err := cart.FromPolar(s)
	return err == nil
}

// rectCells: 8 × 8 equal boxes.
func rectCells(d Rect, env series.Env) ([]areaCell, error) {
	v, err := floats(env, d.L, d.H)
	if err != nil {
		return nil, err
	}
	var out []areaCell
	for i := 0; i < 8; i++ {
		for j := 0; j < 8; j++ {
			out = append(out, areaCell{shape: boxCell, a: [2]float64{v[0] * float64(i) / 8, v[1] * float64(j) / 8}, b: [2]float64{v[0] * float64(i+1) / 8, v[1] * float64(j+1) / 8}, sign: 1})
		}
	}
	return out, nil
}

// rectShortfall is the note for numeric side series that miss the target:
// their sampled side residuals against tol times scale, the largest size
// of the data and of u_p's trace (its numeric part too) on those sides. Data given in pieces or with kinks keep such series
// (asSection), which converge like the data's jumps allow, about 1/n for a
// jump and 1/n² for a kink: 512 modes leave 1e-3 to 1e-4; so does a source
// part for quadrature (the sine transform's u_q is smooth, but its traces
// do not vanish to high order at the corners: 7.5e-7 for a Gaussian bump
// beside 1/(1 + x + y)).
// Without the note the residuals stood in the check line unexplained, and
// a user asking for 1e-12 took 15 digits on trust.
func rectShortfall(d Rect, sol *Solution, p *posed, scale float64) (string, bool) {
	if sol.Rect == nil {
		return "", false
	}
	modes := 0
	for _, side := range sol.Rect.Sides {
		if side.Eigen != nil {
			modes = max(modes, side.Eigen.Modes)
		}
	}
	if modes == 0 {
		return "", false
	}
	target := p.tol * math.Max(scale, 1e-300)
	// A flux side's check is a one-sided difference with a step of 1e-4 of
	// the short side (rectChecks): its rounding alone is about 1e-12 of u,
	// so it is read against 1e-10 of the data (an exact Robin problem's
	// checks read 5.6e-13 and 1.2e-12).
	worst, where, values := 0.0, "", true
	for _, c := range sol.Checks {
		if c.Side == "" || c.Exact {
			continue
		}
		floor := target
		if p.conds[c.Side].Kind != Dirichlet {
			floor = math.Max(target, 1e-10*scale)
		}
		if c.Numeric > floor && c.Numeric > worst {
			worst, where = c.Numeric, c.Side
		}
	}
	if worst == 0 {
		return "", false
	}
	for _, side := range sol.Sides {
		values = values && side.Condition.Kind == Dirichlet
	}
	note := fmt.Sprintf("the side series (%d modes a side) meet the side conditions only to %.1e (largest on %s, sampled away from the data's jumps), short of the target %.1e: such series converge slowly for data with jumps or kinks, or corrections that do not vanish to high order at the corners", modes, worst, where, target)
	if values {
		note += "; by the maximum principle the error inside is no larger than the error on the sides, which is larger still near a jump"
	}
	return note, true
}
