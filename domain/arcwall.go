package domain

import (
	"math"

	"psol/series"
)

// arcWall is Dirichlet data on a circular side of a region whose harmonic
// part is a polar series: on the circle itself u is the data, which the
// series reaches only slowly (its terms decay like a power of 1/n there, not
// geometrically). A point or a grid row on the arc takes the data, exactly.
type arcWall struct {
	data       series.Field
	radius     series.Coef
	from, to   series.Coef // the arc's angular range
	fullCircle bool
}

type compiledArc struct {
	g        series.CompiledField
	R        float64
	from, to float64
	full     bool
}

func (a *arcWall) attach(e *Evaluator, s *Solution, env series.Env) error {
	if s.Quadrature != nil {
		return nil // the quadrature's part is added beside: the data is not the rest's alone
	}
	g, err := a.data.Compile(env)
	if err != nil {
		return err
	}
	R, err := a.radius.Float(env)
	if err != nil {
		return err
	}
	c := &compiledArc{g: g, R: R, full: a.fullCircle}
	if !a.fullCircle {
		if c.from, err = a.from.Float(env); err != nil {
			return err
		}
		if c.to, err = a.to.Float(env); err != nil {
			return err
		}
	}
	e.arcs = append(e.arcs, c)
	return nil
}

// onRow reports whether the radius r is the arc's (to rounding).
func (c *compiledArc) onRow(r float64) bool { return math.Abs(r-c.R) <= 1e-14*c.R }

// on is u at (r, θ) where that point is on the arc, away from its ends.
func (c *compiledArc) on(r, theta float64) (float64, bool) {
	if !c.onRow(r) {
		return 0, false
	}
	if !c.full {
		span := c.to - c.from
		if theta <= c.from+1e-14*span || theta >= c.to-1e-14*span {
			return 0, false // a corner: the rays' data may differ
		}
	}
	return c.g.At(c.R, theta), true
}
