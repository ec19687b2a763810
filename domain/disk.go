package domain

import (
	"math"
	"math/big"

	"psol/series"
)

// Disk is the region r < R.
type Disk struct{ R series.Coef }

func (Disk) Sides() []string { return []string{"rim"} }

func (d Disk) Describe() string { return "the disk r < " + d.R.Text() }

func (d Disk) Contains(r, _ float64, env series.Env) (bool, error) {
	R, err := d.R.Float(env)
	return r <= R*(1+1e-12), err
}

func (d Disk) circles() []circle { return []circle{{"rim", d.R, 1}} }

// basis: r^n, bounded at the centre.
func (Disk) basis(n int) []series.Sum { return []series.Sum{rInt(n)} }

func (d Disk) bounds() (*series.Coef, *series.Coef) { return nil, &d.R }

// admit refuses sources whose area integral diverges at the origin:
// ∬ r^k dA = 2π∫ r^(k+1) dr diverges for k ≤ −2.
func (Disk) admit(f, _ series.Sum) error {
	for _, t := range f.Terms() {
		if t.P.Cmp(big.NewRat(-2, 1)) <= 0 {
			return unsolvable("the source term %s is not integrable near r = 0 (r^k with k <= -2), so the disk problem has no solution", series.NewSum(t).Text())
		}
	}
	return nil
}

func (d Disk) solve(p *posed) (*Solution, error) { return solveCircular(d, p) }

// Shape: one circle, the rim, traversed counter-clockwise.
func (d Disk) Shape(env series.Env) (Shape, error) {
	v, err := floats(env, d.R)
	if err != nil {
		return Shape{}, err
	}
	R := v[0]
	return Shape{Sides: []SidePath{arcPath("rim", R, 0, 2*math.Pi, 1)}, Area: math.Pi * R * R, Box: circleBox(R),
		Polar: &PolarBox{RMax: R, Span: 2 * math.Pi, FullTurn: true}}, nil
}

// samples are 72 interior points on six rings, for numeric checks.
func (d Disk) samples(env series.Env) ([][2]float64, error) {
	v, err := floats(env, d.R)
	if err != nil {
		return nil, err
	}
	return ringSamples(func(i int) float64 { return v[0] * float64(i) / 7.5 }, 2*math.Pi, 0.3), nil
}

func (d Disk) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return circularFigures(d, s, ev, rep, env)
}

func (d Disk) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return polarClaimSide(d, side, cond, claim, env)
}

func (d Disk) boundary(side string) (circle, bool, series.Coef) { return circleNamed(d, side) }

func (d Disk) Measures() Measures {
	return Measures{Area: discArea(d.R), Lengths: map[string]series.Coef{"rim": circleLength(d.R)}}
}

func (d Disk) integral(u series.Sum) (series.Coef, error) { return circularIntegral(d, u) }
