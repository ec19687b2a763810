package domain

import (
	"math"

	"psol/series"
)

// Outside is the region r > R, with u bounded as r → ∞.
type Outside struct{ R series.Coef }

func (Outside) Sides() []string { return []string{"rim"} }

func (o Outside) Describe() string {
	return "the region r > " + o.R.Text() + " (u bounded at infinity)"
}

func (o Outside) Contains(r, _ float64, env series.Env) (bool, error) {
	R, err := o.R.Float(env)
	return r >= R*(1-1e-12), err
}

func (o Outside) circles() []circle { return []circle{{"rim", o.R, -1}} }

// basis: 1 for n = 0 (ln r is unbounded), r^−n otherwise.
func (Outside) basis(n int) []series.Sum { return []series.Sum{rInt(-n)} }

func (o Outside) bounds() (*series.Coef, *series.Coef) { return &o.R, nil }

// admit refuses a particular solution that grows: r^s (ln r)^i with s > 0,
// or s = 0 and i > 0. No harmonic r^(±n) T(nθ) can cancel such a term, so no
// bounded solution exists.
func (Outside) admit(f, up series.Sum) error {
	for _, t := range up.Terms() {
		if s := t.P.Sign(); s > 0 || s == 0 && t.L > 0 {
			return unsolvable("outside a circle the solution must stay bounded, but the source %s forces a term %s that grows without bound as r -> infinity", f.Text(), series.NewSum(t).Text())
		}
	}
	return nil
}

func (o Outside) solve(p *posed) (*Solution, error) { return solveCircular(o, p) }

// Shape: the circle with its outward normal towards the centre; pictures
// show the square of three radii around it.
func (o Outside) Shape(env series.Env) (Shape, error) {
	v, err := floats(env, o.R)
	if err != nil {
		return Shape{}, err
	}
	R := v[0]
	return Shape{Sides: []SidePath{arcPath("rim", R, 0, 2*math.Pi, -1)}, Area: math.Inf(1), Box: circleBox(3 * R),
		Polar: &PolarBox{RMin: R, RMax: math.Inf(1), Span: 2 * math.Pi, FullTurn: true}}, nil
}

// samples are 72 points on six rings out to three radii.
func (o Outside) samples(env series.Env) ([][2]float64, error) {
	v, err := floats(env, o.R)
	if err != nil {
		return nil, err
	}
	return ringSamples(func(i int) float64 { return v[0] * (1 + float64(i)/3) }, 2*math.Pi, 0.3), nil
}

func (o Outside) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return circularFigures(o, s, ev, rep, env)
}

func (o Outside) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return polarClaimSide(o, side, cond, claim, env)
}

func (o Outside) boundary(side string) (circle, bool, series.Coef) { return circleNamed(o, side) }

// Outside a circle the rim encloses the disk, which is not part of the
// region: a hole of an unbounded region.
func (o Outside) Measures() Measures {
	return Measures{Unbounded: true, Lengths: map[string]series.Coef{"rim": circleLength(o.R)},
		Holes: map[string]series.Coef{"rim": discArea(o.R)}}
}

func (o Outside) integral(u series.Sum) (series.Coef, error) { return circularIntegral(o, u) }
