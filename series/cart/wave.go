package cart

import (
	"errors"
	"math"
	"math/big"
	"strings"

	"psol/series"
)

// Wave is e^(αx+βy)·[cos(γx+δy)·C(x, y) + sin(γx+δy)·S(x, y)] with exact
// α, β, γ, δ and polynomials C and S: the Cartesian sources and particular
// solutions of exponentials and trigonometric functions of linear forms
// times polynomials. A Wave with α = β = γ = δ = 0 is the polynomial C.
type Wave struct {
	Alpha, Beta, Gamma, Delta series.Coef
	Cos, Sin                  Poly
}

// Waves is a sum of waves with distinct exponents and frequencies.
type Waves []Wave

func (w Wave) key() string {
	return w.Alpha.Text() + "|" + w.Beta.Text() + "|" + w.Gamma.Text() + "|" + w.Delta.Text()
}

func (w Wave) isPoly() bool {
	return w.Alpha.IsZero() && w.Beta.IsZero() && w.Gamma.IsZero() && w.Delta.IsZero()
}

// canonical makes the frequency's first nonzero component positive (cos is
// even, sin odd) and drops the sine part of a wave with no frequency.
func (w Wave) canonical() Wave {
	if w.Gamma.IsZero() && w.Delta.IsZero() {
		w.Sin = Poly{}
		return w
	}
	neg := sign(w.Gamma) < 0 || w.Gamma.IsZero() && sign(w.Delta) < 0
	if neg {
		w.Gamma, w.Delta, w.Sin = w.Gamma.Neg(), w.Delta.Neg(), w.Sin.Scale(series.IntCoef(-1))
	}
	return w
}

// sign is the sign of an exact number (0 where parameters leave it open).
func sign(c series.Coef) int {
	if q, ok := c.Rat(); ok {
		return q.Sign()
	}
	v, err := c.Float(nil)
	switch {
	case err != nil || v == 0:
		return 0
	case v < 0:
		return -1
	}
	return 1
}

// Add merges the waves of s and t.
func (s Waves) Add(t Waves) Waves {
	all := make(Waves, 0, len(s)+len(t))
	for _, w := range s {
		all = append(all, w.canonical())
	}
	for _, w := range t {
		all = append(all, w.canonical())
	}
	return series.Canonical(all, nil,
		func(a, b Wave) bool { return a.key() == b.key() },
		func(a, b Wave) Wave { a.Cos, a.Sin = a.Cos.Add(b.Cos), a.Sin.Add(b.Sin); return a },
		func(w Wave) bool { return w.Cos.IsZero() && w.Sin.IsZero() })
}

// Scale multiplies every wave by the polynomial q.
func (s Waves) Scale(q Poly) Waves {
	var out Waves
	for _, w := range s {
		w.Cos, w.Sin = w.Cos.Mul(q), w.Sin.Mul(q)
		out = append(out, w)
	}
	return Waves{}.Add(out)
}

// Mul is the product, by cos a cos b = [cos(a−b) + cos(a+b)]/2 and its kin.
func (s Waves) Mul(t Waves) Waves {
	half := series.FracCoef(1, 2)
	var out Waves
	for _, a := range s {
		for _, b := range t {
			al, be := a.Alpha.Add(b.Alpha), a.Beta.Add(b.Beta)
			plus := Wave{Alpha: al, Beta: be, Gamma: a.Gamma.Add(b.Gamma), Delta: a.Delta.Add(b.Delta)}
			minus := Wave{Alpha: al, Beta: be, Gamma: a.Gamma.Sub(b.Gamma), Delta: a.Delta.Sub(b.Delta)}
			cc, ss := a.Cos.Mul(b.Cos), a.Sin.Mul(b.Sin)
			cs, sc := a.Cos.Mul(b.Sin), a.Sin.Mul(b.Cos)
			plus.Cos = cc.Sub(ss).Scale(half)
			minus.Cos = cc.Add(ss).Scale(half)
			plus.Sin = cs.Add(sc).Scale(half)
			minus.Sin = sc.Sub(cs).Scale(half)
			out = append(out, plus, minus)
		}
	}
	return Waves{}.Add(out)
}

// DX is ∂/∂x: e^E[cos φ (αC + C_x + γS) + sin φ (αS + S_x − γC)].
func (w Wave) DX() Wave {
	return w.derivative(w.Alpha, w.Gamma, Poly.DX)
}

// DY is ∂/∂y.
func (w Wave) DY() Wave {
	return w.derivative(w.Beta, w.Delta, Poly.DY)
}

func (w Wave) derivative(a, g series.Coef, d func(Poly) Poly) Wave {
	out := w
	out.Cos = w.Cos.Scale(a).Add(d(w.Cos)).Add(w.Sin.Scale(g))
	out.Sin = w.Sin.Scale(a).Add(d(w.Sin)).Sub(w.Cos.Scale(g))
	return out
}

// Laplacian is Δ of the sum.
func (s Waves) Laplacian() Waves {
	var out Waves
	for _, w := range s {
		out = append(out, w.DX().DX(), w.DY().DY())
	}
	return Waves{}.Add(out)
}

// ErrResonant is Particular's answer for a wave that is itself harmonic
// times a polynomial (α² + β² = γ² + δ² and αγ + βδ = 0, as e^x cos y).
var ErrResonant = errors.New("the source is a harmonic exponential times a polynomial (as exp(x)*cos(y)), and the raised-degree ansatz found no solution")

// Particular solves Δu = w for a wave with a frequency or an exponent: u is
// e^E[cos φ A + sin φ B] with
//
//	k A + m B + (D₁A + ΔA + D₂B) = C,   k B − m A + (D₁B + ΔB − D₂A) = S,
//
// k = α²+β²−γ²−δ², m = 2(αγ+βδ), D₁ = 2(α∂x + β∂y), D₂ = 2(γ∂x + δ∂y); the
// bracketed terms lower the degree, so iterating [A; B] = M⁻¹(rhs − lower)
// from zero terminates, M = [k m; −m k] with det k² + m² ≠ 0.
func (w Wave) Particular() (Wave, error) {
	k := w.Alpha.Mul(w.Alpha).Add(w.Beta.Mul(w.Beta)).Sub(w.Gamma.Mul(w.Gamma)).Sub(w.Delta.Mul(w.Delta))
	m := w.Alpha.Mul(w.Gamma).Add(w.Beta.Mul(w.Delta)).MulRat(big.NewRat(2, 1))
	det := k.Mul(k).Add(m.Mul(m))
	if det.IsZero() { // a harmonic wave: the polynomials go one degree up
		return resonantParticular(w)
	}
	inv, err := series.IntCoef(1).Div(det)
	if err != nil {
		return Wave{}, err
	}
	two := series.IntCoef(2)
	d1 := func(p Poly) Poly { return p.DX().Scale(w.Alpha.Mul(two)).Add(p.DY().Scale(w.Beta.Mul(two))) }
	d2 := func(p Poly) Poly { return p.DX().Scale(w.Gamma.Mul(two)).Add(p.DY().Scale(w.Delta.Mul(two))) }
	solve := func(rc, rs Poly) (Poly, Poly) { // M⁻¹ = [k −m; m k]/det, or 1/k where m = 0
		if m.IsZero() {
			invK, _ := series.IntCoef(1).Div(k)
			return rc.Scale(invK), rs.Scale(invK)
		}
		return rc.Scale(k).Sub(rs.Scale(m)).Scale(inv), rc.Scale(m).Add(rs.Scale(k)).Scale(inv)
	}
	var A, B Poly
	for it := 0; it < 200; it++ {
		rc := w.Cos.Sub(d1(A).Add(A.Laplacian()).Add(d2(B)))
		rs := w.Sin.Sub(d1(B).Add(B.Laplacian()).Sub(d2(A)))
		nA, nB := solve(rc, rs)
		if nA.Equal(A) && nB.Equal(B) {
			out := w
			out.Cos, out.Sin = A, B
			return out.canonical(), nil
		}
		A, B = nA, nB
	}
	return Wave{}, errors.New("the wave ansatz did not terminate")
}

// Particular solves Δu = s wave by wave; polynomial waves are left to the
// caller (they are returned as rest).
func (s Waves) Particular() (u Waves, rest Poly, err error) {
	for _, w := range s {
		if w.isPoly() {
			rest = rest.Add(w.Cos)
			continue
		}
		p, err := w.Particular()
		if err != nil {
			return nil, Poly{}, err
		}
		u = u.Add(Waves{p})
	}
	return u, rest, nil
}

// FromExpr reads a remainder of the algebra as waves: sums and products of
// polynomials, exp, sin and cos of linear forms in x and y (no constant
// term), cosh and sinh likewise, quotients by constants and whole powers.
func FromExpr(e *series.Expr) (Waves, error) {
	fail := errors.New("not a sum of exponentials and trigonometric functions of x and y times polynomials")
	switch op := e.Op(); op {
	case "sum":
		p, err := FromPolar(e.Leaf())
		if err != nil {
			return nil, fail
		}
		return Waves{{Cos: p}}.Add(nil), nil
	case "+", "*":
		a, err := FromExpr(e.Args()[0])
		if err != nil {
			return nil, err
		}
		b, err := FromExpr(e.Args()[1])
		if err != nil {
			return nil, err
		}
		if op == "+" {
			return a.Add(b), nil
		}
		return a.Mul(b), nil
	case "/":
		a, err := FromExpr(e.Args()[0])
		if err != nil {
			return nil, err
		}
		b := e.Args()[1]
		if b.Op() != "sum" {
			return nil, fail
		}
		c, ok := b.Leaf().Const()
		if !ok || c.IsZero() {
			return nil, fail
		}
		inv, err := series.IntCoef(1).Div(c)
		if err != nil {
			return nil, fail
		}
		return a.Scale(Monomial(inv, 0, 0)), nil
	case "^":
		a, err := FromExpr(e.Args()[0])
		if err != nil {
			return nil, err
		}
		pw := e.Args()[1]
		if pw.Op() != "sum" {
			return nil, fail
		}
		c, ok := pw.Leaf().Const()
		q, isRat := c.Rat()
		if !ok || !isRat || !q.IsInt() || q.Sign() < 0 || q.Num().Int64() > 12 {
			return nil, fail
		}
		out := Waves{{Cos: Monomial(series.IntCoef(1), 0, 0)}}
		for i := int64(0); i < q.Num().Int64(); i++ {
			out = out.Mul(a)
		}
		return out, nil
	case "exp", "sin", "cos", "sinh", "cosh":
		arg := e.Args()[0]
		if arg.Op() != "sum" {
			return nil, fail
		}
		lin, err := FromPolar(arg.Leaf())
		if err != nil {
			return nil, fail
		}
		a, b, ok := linear(lin)
		if !ok {
			return nil, fail
		}
		one := Monomial(series.IntCoef(1), 0, 0)
		half := Monomial(series.FracCoef(1, 2), 0, 0)
		switch op {
		case "exp":
			return Waves{{Alpha: a, Beta: b, Cos: one}}, nil
		case "cos":
			return Waves{{Gamma: a, Delta: b, Cos: one}}, nil
		case "sin":
			return Waves{{Gamma: a, Delta: b, Sin: one}}, nil
		case "cosh":
			return Waves{{Alpha: a, Beta: b, Cos: half}, {Alpha: a.Neg(), Beta: b.Neg(), Cos: half}}.Add(nil), nil
		}
		return Waves{{Alpha: a, Beta: b, Cos: half}, {Alpha: a.Neg(), Beta: b.Neg(), Cos: half.Scale(series.IntCoef(-1))}}.Add(nil), nil
	}
	return nil, fail
}

// linear is p = a·x + b·y, with no other term.
func linear(p Poly) (a, b series.Coef, ok bool) {
	for _, t := range p.Terms() {
		switch {
		case t.I == 1 && t.J == 0:
			a = t.C
		case t.I == 0 && t.J == 1:
			b = t.C
		default:
			return a, b, false
		}
	}
	return a, b, true
}

// Text prints the waves in psol's syntax.
func (s Waves) Text() string { return s.print(false) }

// LaTeX prints the waves as LaTeX.
func (s Waves) LaTeX() string { return s.print(true) }

func (s Waves) print(latex bool) string {
	if len(s) == 0 {
		return "0"
	}
	var parts []string
	for _, w := range s {
		parts = append(parts, w.print(latex))
	}
	out := parts[0]
	for _, p := range parts[1:] {
		if strings.HasPrefix(p, "-") {
			out += " - " + p[1:]
		} else {
			out += " + " + p
		}
	}
	return out
}

func linearText(a, b series.Coef, latex bool) string {
	x, y := Monomial(a, 1, 0), Monomial(b, 0, 1)
	if latex {
		return x.Add(y).LaTeX()
	}
	return x.Add(y).Text()
}

func (w Wave) print(latex bool) string {
	poly := func(p Poly) string {
		t := p.Text()
		if latex {
			t = p.LaTeX()
		}
		if len(p.Terms()) > 1 {
			if latex {
				return `\left(` + t + `\right)`
			}
			return "(" + t + ")"
		}
		return t
	}
	factor := func(fn string, p Poly, arg string) string {
		if p.IsZero() {
			return ""
		}
		f := fn + "(" + arg + ")"
		if latex {
			f = `\` + fn + `\left(` + arg + `\right)`
		}
		if p.Equal(Monomial(series.IntCoef(1), 0, 0)) {
			return f
		}
		if p.Equal(Monomial(series.IntCoef(-1), 0, 0)) { // -sin(x), not -1*sin(x)
			return "-" + f
		}
		if latex {
			return poly(p) + ` \, ` + f
		}
		return poly(p) + "*" + f
	}
	hasExp := !w.Alpha.IsZero() || !w.Beta.IsZero()
	var body string
	if w.Gamma.IsZero() && w.Delta.IsZero() {
		body = poly(w.Cos)
	} else {
		arg := linearText(w.Gamma, w.Delta, latex)
		c, s := factor("cos", w.Cos, arg), factor("sin", w.Sin, arg)
		switch {
		case c == "":
			body = s
		case s == "":
			body = c
		case strings.HasPrefix(s, "-"):
			body = c + " - " + s[1:]
		default:
			body = c + " + " + s
		}
		if c != "" && s != "" && hasExp {
			if latex {
				body = `\left(` + body + `\right)`
			} else {
				body = "(" + body + ")"
			}
		}
	}
	if !hasExp {
		return body
	}
	e := "exp(" + linearText(w.Alpha, w.Beta, false) + ")"
	mul := "*"
	if latex {
		e, mul = "e^{"+linearText(w.Alpha, w.Beta, true)+"}", ` \, `
	}
	_, constant := w.Cos.Coefficients()
	if constant && len(w.Cos.Terms()) == 1 && w.Cos.Terms()[0].I == 0 && w.Cos.Terms()[0].J == 0 && w.Gamma.IsZero() && w.Delta.IsZero() {
		switch body {
		case "1":
			return e
		case "-1":
			return "-" + e
		}
		return body + mul + e
	}
	if strings.HasPrefix(body, "-") {
		return "-" + e + mul + body[1:]
	}
	return e + mul + body
}

// CompiledWaves evaluates waves in float64.
type CompiledWaves struct {
	waves []compiledWave
}

type compiledWave struct {
	a, b, g, d float64
	cos, sin   Poly
	env        series.Env
}

// Compile fixes parameters for evaluation.
func (s Waves) Compile(env series.Env) (*CompiledWaves, error) {
	out := &CompiledWaves{}
	for _, w := range s {
		var cw compiledWave
		var err error
		for _, p := range []struct {
			c   series.Coef
			dst *float64
		}{{w.Alpha, &cw.a}, {w.Beta, &cw.b}, {w.Gamma, &cw.g}, {w.Delta, &cw.d}} {
			if *p.dst, err = p.c.Float(env); err != nil {
				return nil, err
			}
		}
		// The polynomial factors are evaluated at each point, where an
		// error has nowhere to go: a parameter with no value is refused
		// here (At took it as 0, and a wave's trace read 0).
		for _, p := range []Poly{w.Cos, w.Sin} {
			if _, err := p.Eval(0, 0, env); err != nil {
				return nil, err
			}
		}
		cw.cos, cw.sin, cw.env = w.Cos, w.Sin, env
		out.waves = append(out.waves, cw)
	}
	return out, nil
}

// At is the sum at (x, y).
func (c *CompiledWaves) At(x, y float64) float64 {
	if c == nil {
		return 0
	}
	total := 0.0
	for _, w := range c.waves {
		phi := w.g*x + w.d*y
		pc, _ := w.cos.Eval(x, y, w.env)
		ps, _ := w.sin.Eval(x, y, w.env)
		total += math.Exp(w.a*x+w.b*y) * (math.Cos(phi)*pc + math.Sin(phi)*ps)
	}
	return total
}

// DX and DY are the sums of the waves' derivatives.
func (s Waves) DX() Waves {
	var out Waves
	for _, w := range s {
		out = append(out, w.DX())
	}
	return Waves{}.Add(out)
}

// DY is ∂/∂y of the sum.
func (s Waves) DY() Waves {
	var out Waves
	for _, w := range s {
		out = append(out, w.DY())
	}
	return Waves{}.Add(out)
}
