package domain

import (
	"math"

	"psol/series"
)

// Annulus is the region R1 < r < R2.
type Annulus struct{ R1, R2 series.Coef }

func (Annulus) Sides() []string { return []string{"inner", "outer"} }

func (a Annulus) Describe() string {
	return "the annulus " + a.R1.Text() + " < r < " + a.R2.Text()
}

func (a Annulus) Contains(r, _ float64, env series.Env) (bool, error) {
	r1, err := a.R1.Float(env)
	if err != nil {
		return false, err
	}
	r2, err := a.R2.Float(env)
	return r >= r1*(1-1e-12) && r <= r2*(1+1e-12), err
}

func (a Annulus) circles() []circle {
	return []circle{{"inner", a.R1, -1}, {"outer", a.R2, 1}}
}

// basis: 1 and ln r for n = 0; r^n and r^−n otherwise.
func (Annulus) basis(n int) []series.Sum {
	if n == 0 {
		return []series.Sum{rInt(0), lnR}
	}
	return []series.Sum{rInt(n), rInt(-n)}
}

func (a Annulus) bounds() (*series.Coef, *series.Coef) { return &a.R1, &a.R2 }

func (Annulus) admit(_, _ series.Sum) error { return nil }

func (a Annulus) solve(p *posed) (*Solution, error) { return solveCircular(a, p) }

// Shape: the inner circle (outward normal towards the centre), then the outer.
func (a Annulus) Shape(env series.Env) (Shape, error) {
	v, err := floats(env, a.R1, a.R2)
	if err != nil {
		return Shape{}, err
	}
	r1, r2 := v[0], v[1]
	return Shape{Sides: []SidePath{arcPath("inner", r1, 0, 2*math.Pi, -1), arcPath("outer", r2, 0, 2*math.Pi, 1)},
		Area: math.Pi * (r2*r2 - r1*r1), Box: circleBox(r2), Polar: &PolarBox{RMin: r1, RMax: r2, Span: 2 * math.Pi, FullTurn: true}}, nil
}

// samples are 72 interior points on six rings between the circles.
func (a Annulus) samples(env series.Env) ([][2]float64, error) {
	v, err := floats(env, a.R1, a.R2)
	if err != nil {
		return nil, err
	}
	return ringSamples(func(i int) float64 { return v[0] + (v[1]-v[0])*float64(i)/7 }, 2*math.Pi, 0.3), nil
}

func (a Annulus) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return circularFigures(a, s, ev, rep, env)
}

func (a Annulus) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return polarClaimSide(a, side, cond, claim, env)
}

func (a Annulus) boundary(side string) (circle, bool, series.Coef) { return circleNamed(a, side) }

func (a Annulus) Measures() Measures {
	return Measures{Area: discArea(a.R2).Sub(discArea(a.R1)),
		Lengths: map[string]series.Coef{"inner": circleLength(a.R1), "outer": circleLength(a.R2)},
		Holes:   map[string]series.Coef{"inner": discArea(a.R1)}}
}

func (a Annulus) integral(u series.Sum) (series.Coef, error) { return circularIntegral(a, u) }
