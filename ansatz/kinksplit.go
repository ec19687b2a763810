package ansatz

import (
	"math/big"

	"psol/series"
	"psol/series/cart"
)

// SplitKinks takes the addends c·abs(ℓ) and c·step(ℓ) of a source's
// remainder, ℓ linear in x and y, out as Kinks (their particular solutions
// are closed), and
// returns what is left for the quadrature (nil when nothing is). Constant
// factors may stand on either side of the abs and divide it; parameters
// need their values in env.
func SplitKinks(rest *series.Expr, env series.Env) ([]Kink, *series.Expr) {
	if rest == nil {
		return nil, nil
	}
	var kinks []Kink
	var left series.Field
	var any bool
	for _, e := range kinkAddends(rest) {
		if k, ok := kinkOf(e, env); ok {
			kinks = append(kinks, k)
			continue
		}
		left, any = left.Add(series.Field{Rest: e}), true
	}
	if !any {
		return kinks, nil
	}
	return kinks, left.Rest
}

// kinkAddends are e's terms through nested sums.
func kinkAddends(e *series.Expr) []*series.Expr {
	if e.Op() != "+" {
		return []*series.Expr{e}
	}
	var out []*series.Expr
	for _, a := range e.Args() {
		out = append(out, kinkAddends(a)...)
	}
	return out
}

// kinkOf reads c·abs(ℓ) or c·step(ℓ): products and quotients of constants
// with one abs or step of a linear form.
func kinkOf(e *series.Expr, env series.Env) (Kink, bool) {
	switch e.Op() {
	case "abs", "step":
		if len(e.Args()) != 1 || e.Args()[0].Op() != "sum" {
			return Kink{}, false
		}
		p, err := cart.FromPolar(e.Args()[0].Leaf())
		if err != nil {
			return Kink{}, false
		}
		k := Kink{Step: e.Op() == "step", C: 1, Abs: e, Factor: series.IntCoef(1)}
		grad2 := series.Coef{}
		for _, t := range p.Terms() {
			v, err := t.C.Float(env)
			if err != nil {
				return Kink{}, false
			}
			switch {
			case t.I == 0 && t.J == 0:
				k.D, k.LD = v, t.C
			case t.I == 1 && t.J == 0:
				k.A, k.LA, grad2 = v, t.C, grad2.Add(t.C.Mul(t.C))
			case t.I == 0 && t.J == 1:
				k.B, k.LB, grad2 = v, t.C, grad2.Add(t.C.Mul(t.C))
			default:
				return Kink{}, false // not linear
			}
		}
		if k.grad2() <= 0 {
			return Kink{}, false
		}
		n := int64(6) // |ℓ|³/6; a step's max(ℓ, 0)²/2
		if k.Step {
			n = 2
		}
		f, err := series.IntCoef(1).Div(grad2.MulRat(big.NewRat(n, 1)))
		if err != nil {
			return Kink{}, false
		}
		k.Factor = f
		return k, true
	case "*":
		c, found := 1.0, false
		exact := series.IntCoef(1)
		var k Kink
		for _, a := range e.Args() {
			if v, ok := constantOf(a, env); ok {
				c *= v
				cf, _ := a.Leaf().Const()
				exact = exact.Mul(cf)
				continue
			}
			kk, ok := kinkOf(a, env)
			if !ok || found {
				return Kink{}, false
			}
			k, found = kk, true
		}
		k.C *= c
		k.Factor = k.Factor.Mul(exact)
		return k, found
	case "/":
		if len(e.Args()) != 2 {
			return Kink{}, false
		}
		k, ok := kinkOf(e.Args()[0], env)
		d, okD := constantOf(e.Args()[1], env)
		if !ok || !okD || d == 0 {
			return Kink{}, false
		}
		k.C /= d
		cf, _ := e.Args()[1].Leaf().Const()
		f, err := k.Factor.Div(cf)
		if err != nil {
			return Kink{}, false
		}
		k.Factor = f
		return k, true
	}
	return Kink{}, false
}

// constantOf is a leaf's constant value.
func constantOf(e *series.Expr, env series.Env) (float64, bool) {
	if e.Op() != "sum" {
		return 0, false
	}
	c, ok := e.Leaf().Const()
	if !ok {
		return 0, false
	}
	v, err := c.Float(env)
	return v, err == nil
}

// KinkLines are the kinks of every abs(ℓ) in e with ℓ linear in x and y,
// wherever it stands (in a product with a sum, inside a function): the
// lines ℓ = 0 where e's derivative may jump. Their factors are those of a
// bare abs(ℓ); what they are for is where, not how much.
func KinkLines(e *series.Expr, env series.Env) []Kink {
	if e == nil {
		return nil
	}
	var out []Kink
	if e.Op() == "abs" {
		if k, ok := kinkOf(e, env); ok {
			out = append(out, k)
		}
	}
	for _, a := range e.Args() {
		out = append(out, KinkLines(a, env)...)
	}
	return out
}
