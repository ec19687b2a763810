package domain

import (
	"fmt"
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

func (d Disk) side(string) circle { return circle{"rim", d.R, 1} }

// admit refuses sources whose area integral diverges at the origin:
// ∬ r^k dA = ∫ r^(k+1) dr diverges for k ≤ −2.
func (Disk) admit(f series.Sum) error {
	for _, t := range f.Terms() {
		if t.P.Cmp(big.NewRat(-2, 1)) <= 0 {
			return unsolvable("the source term %s is not integrable near r = 0 (r^k with k <= -2), so the disk problem has no solution", series.NewSum(t).Text())
		}
	}
	return nil
}

// harmonic is Σ A_n r^n T(nθ) with A_n = c_n / B[r^n](R): each mode of the
// correction fixes one coefficient; a mode whose operator vanishes (n = 0
// for Neumann, n/R + h = 0 for Robin) needs its correction to vanish.
func (d Disk) harmonic(data map[string]series.Sum, conds map[string]Condition) (series.Sum, []string, error) {
	rim := d.side("rim")
	cond := conds["rim"]
	var h series.Sum
	var steps []string
	for _, t := range data["rim"].Terms() {
		mode := series.NewSum(series.Term{C: series.IntCoef(1), M: t.M, Sin: t.Sin})
		if cond.Kind == Neumann && t.M == 0 {
			continue
		}
		b, err := rim.apply(cond, rPow(t.M))
		if err != nil {
			return series.Sum{}, nil, err
		}
		bc, _ := b.Const()
		if bc.IsZero() {
			return series.Sum{}, nil, singularMode(cond, t, d.R)
		}
		a, err := t.C.Div(bc)
		if err != nil {
			return series.Sum{}, nil, err
		}
		h = h.Add(rPow(t.M).Mul(mode).Scale(a))
		steps = append(steps, fmt.Sprintf("harmonic mode %s: A*%s = %s, so A = %s", modeName(t), grouped(bc), grouped(t.C), a.Text()))
	}
	return h, steps, nil
}

func singularMode(cond Condition, t series.Term, radius series.Coef) error {
	if cond.Kind == Neumann && t.M == 0 {
		return unsolvable("the Neumann data is incompatible with the source: the mean of the correction is %s, not 0 (the flux through the rim must equal the source integral)", t.C.Text())
	}
	return unsolvable("the Robin condition is singular for mode n = %d (n/R + h = 0 with R = %s), and the correction has a nonzero component %s there", t.M, radius.Text(), series.NewSum(t).Text())
}

// modeName names an angular mode: "constant", "cos(2*theta)".
func modeName(t series.Term) string {
	if t.M == 0 {
		return "constant"
	}
	return series.Trig(t.M, t.Sin).Text()
}

// grouped brackets a coefficient that prints as a sum.
func grouped(c series.Coef) string {
	s := c.Text()
	for _, r := range s[1:] {
		if r == ' ' {
			return "(" + s + ")"
		}
	}
	return s
}
