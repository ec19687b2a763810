package cart

import (
	"fmt"
	"math/big"
	"strings"

	"psol/series"
)

// Poly is Σ c_ij x^i y^j with exact coefficients, in canonical order
// (by total degree, then by the power of x, highest first), no zero terms.
// Operations never mutate their operands.
type Poly struct {
	t []term
}

type term struct {
	i, j int
	c    series.Coef
}

// Monomial is c·x^i·y^j.
func Monomial(c series.Coef, i, j int) Poly { return newPoly([]term{{i, j, c}}) }

// X and Y are the coordinates.
var (
	X = Monomial(series.IntCoef(1), 1, 0)
	Y = Monomial(series.IntCoef(1), 0, 1)
)

func newPoly(ts []term) Poly {
	return Poly{series.Canonical(ts, termLess,
		func(a, b term) bool { return a.i == b.i && a.j == b.j },
		func(a, b term) term { a.c = a.c.Add(b.c); return a },
		func(t term) bool { return t.c.IsZero() })}
}

// termLess orders by total degree, then by falling power of x.
func termLess(a, b term) bool {
	if da, db := a.i+a.j, b.i+b.j; da != db {
		return da < db
	}
	return a.i > b.i
}

func (p Poly) IsZero() bool { return len(p.t) == 0 }

// Add is p + q.
func (p Poly) Add(q Poly) Poly { return newPoly(append(append([]term(nil), p.t...), q.t...)) }

// Scale is c·p.
func (p Poly) Scale(c series.Coef) Poly {
	out := make([]term, len(p.t))
	for k, t := range p.t {
		out[k] = term{t.i, t.j, t.c.Mul(c)}
	}
	return newPoly(out)
}

// Sub is p − q.
func (p Poly) Sub(q Poly) Poly { return p.Add(q.Scale(series.IntCoef(-1))) }

// Mul is p·q.
func (p Poly) Mul(q Poly) Poly {
	var out []term
	for _, a := range p.t {
		for _, b := range q.t {
			out = append(out, term{a.i + b.i, a.j + b.j, a.c.Mul(b.c)})
		}
	}
	return newPoly(out)
}

// Equal reports p = q.
func (p Poly) Equal(q Poly) bool { return p.Sub(q).IsZero() }

// SwapXY is p with x and y exchanged.
func (p Poly) SwapXY() Poly {
	ts := make([]term, len(p.t))
	for k, t := range p.t {
		ts[k] = term{t.j, t.i, t.c}
	}
	return newPoly(ts)
}

// Degree is the largest i + j of a term; −1 for the zero polynomial.
func (p Poly) Degree() int {
	d := -1
	for _, t := range p.t {
		d = max(d, t.i+t.j)
	}
	return d
}

// DX and DY are the partial derivatives.
func (p Poly) DX() Poly {
	var out []term
	for _, t := range p.t {
		if t.i > 0 {
			out = append(out, term{t.i - 1, t.j, t.c.MulRat(big.NewRat(int64(t.i), 1))})
		}
	}
	return newPoly(out)
}

func (p Poly) DY() Poly {
	var out []term
	for _, t := range p.t {
		if t.j > 0 {
			out = append(out, term{t.i, t.j - 1, t.c.MulRat(big.NewRat(int64(t.j), 1))})
		}
	}
	return newPoly(out)
}

// Laplacian is ∂²p/∂x² + ∂²p/∂y².
func (p Poly) Laplacian() Poly { return p.DX().DX().Add(p.DY().DY()) }

// AntiXX is the x-antiderivative taken twice, x^i → x^(i+2)/((i+1)(i+2)),
// with no integration constants.
func (p Poly) AntiXX() Poly {
	out := make([]term, len(p.t))
	for k, t := range p.t {
		out[k] = term{t.i + 2, t.j, t.c.MulRat(big.NewRat(1, int64((t.i+1)*(t.i+2))))}
	}
	return newPoly(out)
}

// AtX is p on the line x = a, a polynomial in y alone; AtY likewise.
func (p Poly) AtX(a series.Coef) Poly {
	var out []term
	for _, t := range p.t {
		pw, _ := a.Pow(big.NewRat(int64(t.i), 1))
		out = append(out, term{0, t.j, t.c.Mul(pw)})
	}
	return newPoly(out)
}

func (p Poly) AtY(b series.Coef) Poly {
	var out []term
	for _, t := range p.t {
		pw, _ := b.Pow(big.NewRat(int64(t.j), 1))
		out = append(out, term{t.i, 0, t.c.Mul(pw)})
	}
	return newPoly(out)
}

// Text prints p in psol's syntax.
func (p Poly) Text() string { return p.print(textPoly(series.Coef.Text)) }

// TextApprox is Text with the coefficients as decimals, for numeric results.
func (p Poly) TextApprox() string {
	return p.print(textPoly(func(c series.Coef) string { return series.Const(c).TextApprox() }))
}

// LaTeX prints p as LaTeX.
func (p Poly) LaTeX() string {
	return p.print(latexPoly(func(c series.Coef) string { return series.Const(c).LaTeX() }))
}

// LaTeXApprox is LaTeX with decimal coefficients, for numeric results.
func (p Poly) LaTeXApprox() string {
	return p.print(latexPoly(func(c series.Coef) string { return series.Const(c).LaTeXApprox() }))
}

// polyStyle is how a polynomial prints: coefficients, powers, the product
// sign and the brackets around a coefficient that is a sum.
type polyStyle struct {
	coef        func(series.Coef) string
	power       string // format: variable, exponent
	mul         string
	open, close string
}

func textPoly(coef func(series.Coef) string) polyStyle {
	return polyStyle{coef: coef, power: "%s^%d", mul: "*", open: "(", close: ")*"}
}

func latexPoly(coef func(series.Coef) string) polyStyle {
	return polyStyle{coef: coef, power: "%s^{%d}", mul: " ", open: `\left(`, close: `\right) `}
}

func (p Poly) print(st polyStyle) string {
	if p.IsZero() {
		return "0"
	}
	pow := func(v string, n int) string {
		if n == 1 {
			return v
		}
		return fmt.Sprintf(st.power, v, n)
	}
	var b strings.Builder
	for k, t := range p.t {
		c := st.coef(t.c)
		var vars []string
		if t.i > 0 {
			vars = append(vars, pow("x", t.i))
		}
		if t.j > 0 {
			vars = append(vars, pow("y", t.j))
		}
		v := strings.Join(vars, st.mul)
		body := c
		switch {
		case v == "":
		case c == "1":
			body = v
		case c == "-1":
			body = "-" + v
		case strings.ContainsAny(strings.TrimPrefix(c, "-"), "+-"):
			body = st.open + c + st.close + v
		default:
			body = c + st.mul + v
		}
		switch {
		case k == 0:
			b.WriteString(body)
		case strings.HasPrefix(body, "-"):
			b.WriteString(" - " + body[1:])
		default:
			b.WriteString(" + " + body)
		}
	}
	return b.String()
}

// CompiledPoly evaluates a polynomial in float64, in x and y (never through
// r and θ, which lose every digit far from the origin).
type CompiledPoly struct {
	c    []float64
	i, j []int
}

// Compile fixes the parameters' values.
func (p Poly) Compile(env series.Env) (*CompiledPoly, error) {
	out := &CompiledPoly{}
	for _, t := range p.t {
		c, err := t.c.Float(env)
		if err != nil {
			return nil, err
		}
		out.c, out.i, out.j = append(out.c, c), append(out.i, t.i), append(out.j, t.j)
	}
	return out, nil
}

// At is the polynomial at (x, y).
func (c *CompiledPoly) At(x, y float64) float64 {
	sum := 0.0
	for k, v := range c.c {
		for n := 0; n < c.i[k]; n++ {
			v *= x
		}
		for n := 0; n < c.j[k]; n++ {
			v *= y
		}
		sum += v
	}
	return sum
}

// Eval is p at (x, y) with parameters from env.
func (p Poly) Eval(x, y float64, env series.Env) (float64, error) {
	sum := 0.0
	for _, t := range p.t {
		c, err := t.c.Float(env)
		if err != nil {
			return 0, err
		}
		v := c
		for k := 0; k < t.i; k++ {
			v *= x
		}
		for k := 0; k < t.j; k++ {
			v *= y
		}
		sum += v
	}
	return sum, nil
}

// Coefficients lists a polynomial in one variable (x or y alone) as c_0, c_1, ...
func (p Poly) Coefficients() ([]series.Coef, bool) {
	var out []series.Coef
	for _, t := range p.t {
		if t.i > 0 && t.j > 0 {
			return nil, false
		}
		d := t.i + t.j
		for len(out) <= d {
			out = append(out, series.Coef{})
		}
		out[d] = out[d].Add(t.c)
	}
	return out, true
}

// PolyTerm is one term c·x^I·y^J.
type PolyTerm struct {
	C    series.Coef
	I, J int
}

// Terms lists the terms in canonical order.
func (p Poly) Terms() []PolyTerm {
	out := make([]PolyTerm, len(p.t))
	for k, t := range p.t {
		out[k] = PolyTerm{t.c, t.i, t.j}
	}
	return out
}

// ModCircle is p reduced modulo x² + y² − R2: every y² replaced by
// R2 − x² until y's degree is at most 1. p vanishes on the circle
// x² + y² = R2 exactly when the result is zero (a polynomial in x plus y
// times one vanishes at infinitely many points of the circle only if both do).
func (p Poly) ModCircle(R2 series.Coef) Poly {
	out := Poly{}
	for _, t := range p.t {
		out = out.Add(reduceCircle(t, R2))
	}
	return out
}

// reduceCircle is c·x^i·y^j with y^j = y^(j mod 2)·(R2 − x²)^(j div 2).
func reduceCircle(t term, R2 series.Coef) Poly {
	acc := Monomial(t.c, t.i, t.j%2)
	step := Monomial(R2, 0, 0).Sub(Monomial(series.IntCoef(1), 2, 0))
	for k := 0; k < t.j/2; k++ {
		acc = acc.Mul(step)
	}
	return acc
}

// RadialDerivative is x·∂p/∂x + y·∂p/∂y, which is r·∂p/∂r.
func (p Poly) RadialDerivative() Poly { return X.Mul(p.DX()).Add(Y.Mul(p.DY())) }

// Const reports p as a constant.
func (p Poly) Const() (series.Coef, bool) {
	switch {
	case len(p.t) == 0:
		return series.Coef{}, true
	case len(p.t) == 1 && p.t[0].i == 0 && p.t[0].j == 0:
		return p.t[0].c, true
	}
	return series.Coef{}, false
}
