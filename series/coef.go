package series

import (
	"errors"
	"fmt"
	"math"
	"math/big"
)

// Coef is an exact coefficient: a quotient num/den of Laurent polynomials in
// the atoms (parameters, π, ln of primes and parameters, roots of primes).
// A monomial denominator is always folded into num, so most coefficients are
// polynomials. The zero value is 0. Operations never mutate their operands.
type Coef struct {
	num, den Poly // den zero means 1
}

// RatCoef is the rational x.
func RatCoef(x *big.Rat) Coef { return Coef{num: RatPoly(x)} }

// IntCoef is the integer n.
func IntCoef(n int64) Coef { return RatCoef(big.NewRat(n, 1)) }

// FracCoef is a/b.
func FracCoef(a, b int64) Coef { return RatCoef(big.NewRat(a, b)) }

// SymCoef is the atom s.
func SymCoef(s Symbol) Coef { return Coef{num: SymPoly(s, one)} }

func (c Coef) denPoly() Poly {
	if c.den.IsZero() {
		return RatPoly(one)
	}
	return c.den
}

// makeCoef reduces num/den to the canonical form.
func makeCoef(num, den Poly) (Coef, error) {
	if den.IsZero() {
		return Coef{}, ErrDivideByZero
	}
	if num.IsZero() {
		return Coef{}, nil
	}
	if den.isMonomial() {
		inv, err := den.PowRat(big.NewRat(-1, 1))
		if err != nil {
			return Coef{}, err
		}
		return Coef{num: num.Mul(inv)}, nil
	}
	// Clear negative powers of parameters from both sides, then divide out
	// the monomial common to every term of both.
	if clear := negativePowers(num, den); len(clear.f) > 0 {
		m := Poly{[]pterm{{clear, one}}}
		num, den = num.Mul(m), den.Mul(m)
	}
	num, den = cancelIndexRoots(num, den)
	if den.isMonomial() {
		return makeCoef(num, den)
	}
	g := commonMonomial(Poly{append(append([]pterm(nil), num.t...), den.t...)})
	if len(g.f) > 0 {
		inv, _ := Poly{[]pterm{{g, one}}}.PowRat(big.NewRat(-1, 1))
		num, den = num.Mul(inv), den.Mul(inv)
	}
	// Scale so that the denominator has coprime whole coefficients, the first positive.
	k := new(big.Rat).Inv(den.content())
	if den.t[0].c.Sign() < 0 {
		k.Neg(k)
	}
	num, den = num.ScaleRat(k), den.ScaleRat(k)
	if k, ok := proportional(num, den); ok {
		return RatCoef(k), nil
	}
	if q, ok := monomialQuotient(num, den); ok {
		return Coef{num: q}, nil
	}
	return Coef{num: num, den: den}, nil
}

// monomialQuotient reports num = q·den for a single term q, tried as the
// quotient of the leading terms.
func monomialQuotient(num, den Poly) (Poly, bool) {
	if len(num.t) != len(den.t) {
		return Poly{}, false
	}
	inv, err := Poly{[]pterm{den.t[0]}}.PowRat(big.NewRat(-1, 1))
	if err != nil {
		return Poly{}, false
	}
	q := Poly{[]pterm{num.t[0]}}.Mul(inv)
	if !q.Mul(den).Equal(num) {
		return Poly{}, false
	}
	return q, true
}

// negativePowers is the monomial that clears every negative power of a
// parameter or π from the terms of num and den.
func negativePowers(num, den Poly) monomial {
	worst := map[Symbol]*big.Rat{}
	for _, p := range []Poly{num, den} {
		for _, t := range p.t {
			for _, f := range t.m.f {
				if (f.sym.kind == kindParam || f.sym.kind == kindPi) && f.exp.Sign() < 0 {
					if w, ok := worst[f.sym]; !ok || f.exp.Cmp(w) < 0 {
						worst[f.sym] = f.exp
					}
				}
			}
		}
	}
	var fs []factor
	for s, e := range worst {
		fs = append(fs, factor{s, new(big.Rat).Neg(e)})
	}
	m, _ := normalizeRoots(fs)
	return m
}

// commonMonomial is the largest monomial dividing every term of p.
func commonMonomial(p Poly) monomial {
	if len(p.t) == 0 {
		return monomial{}
	}
	var fs []factor
	for _, f := range p.t[0].m.f {
		if f.sym.kind == kindRoot {
			continue
		}
		e := f.exp
		present := true
		for _, t := range p.t[1:] {
			d := t.m.degreeOf(f.sym)
			if d.Sign() == 0 {
				present = false
				break
			}
			if d.Cmp(e) < 0 {
				e = d
			}
		}
		if present {
			fs = append(fs, factor{f.sym, e})
		}
	}
	m, _ := normalizeRoots(fs)
	return m
}

// proportional reports num = k·den.
func proportional(num, den Poly) (*big.Rat, bool) {
	if len(num.t) != len(den.t) {
		return nil, false
	}
	k := new(big.Rat).Quo(num.t[0].c, den.t[0].c)
	for i := range num.t {
		if num.t[i].m.key != den.t[i].m.key || new(big.Rat).Mul(den.t[i].c, k).Cmp(num.t[i].c) != 0 {
			return nil, false
		}
	}
	return k, true
}

func mustCoef(num, den Poly) Coef {
	c, err := makeCoef(num, den)
	if err != nil {
		panic("series: " + err.Error()) // callers guarantee den ≠ 0
	}
	return c
}

func (c Coef) IsZero() bool { return c.num.IsZero() }

// Rat reports c as a rational, if it is one.
func (c Coef) Rat() (*big.Rat, bool) {
	if !c.den.IsZero() {
		return nil, false
	}
	return c.num.Rat()
}

// IsPoly reports whether c has no denominator.
func (c Coef) IsPoly() bool { return c.den.IsZero() }

// Add is c + d.
func (c Coef) Add(d Coef) Coef {
	if c.den.IsZero() && d.den.IsZero() {
		return Coef{num: c.num.Add(d.num)}
	}
	if c.den.Equal(d.den) {
		return mustCoef(c.num.Add(d.num), c.den)
	}
	return mustCoef(c.num.Mul(d.denPoly()).Add(d.num.Mul(c.denPoly())), c.denPoly().Mul(d.denPoly()))
}

// Neg is −c.
func (c Coef) Neg() Coef { return Coef{num: c.num.Neg(), den: c.den} }

// Sub is c − d.
func (c Coef) Sub(d Coef) Coef { return c.Add(d.Neg()) }

// Mul is c·d.
func (c Coef) Mul(d Coef) Coef {
	if c.den.IsZero() && d.den.IsZero() {
		return Coef{num: c.num.Mul(d.num)}
	}
	return mustCoef(c.num.Mul(d.num), c.denPoly().Mul(d.denPoly()))
}

// MulRat is x·c.
func (c Coef) MulRat(x *big.Rat) Coef {
	if x.Sign() == 0 {
		return Coef{}
	}
	return Coef{num: c.num.ScaleRat(x), den: c.den}
}

// Div is c/d; d must not be zero.
func (c Coef) Div(d Coef) (Coef, error) {
	if d.IsZero() {
		return Coef{}, ErrDivideByZero
	}
	return makeCoef(c.num.Mul(d.denPoly()), d.num.Mul(c.denPoly()))
}

// Equal reports c = d.
func (c Coef) Equal(d Coef) bool { return c.Sub(d).IsZero() }

// Pow is c^q: any integer q, or a rational q when c is a single term.
func (c Coef) Pow(q *big.Rat) (Coef, error) {
	if x, ok := c.Rat(); ok && q.IsInt() && (x.Sign() != 0 || q.Sign() > 0) {
		return RatCoef(ratPowInt(x, q.Num().Int64())), nil // the common case: a numeric radius
	}
	if c.den.IsZero() && c.num.isMonomial() {
		p, err := c.num.PowRat(q)
		if err != nil {
			return Coef{}, err
		}
		return Coef{num: p}, nil
	}
	if q.IsInt() {
		n := q.Num().Int64()
		if n < 0 {
			inv, err := IntCoef(1).Div(c)
			if err != nil {
				return Coef{}, err
			}
			c, n = inv, -n
		}
		out := IntCoef(1)
		for i := int64(0); i < n; i++ {
			out = out.Mul(c)
		}
		return out, nil
	}
	if !c.den.IsZero() || !c.num.isMonomial() {
		return Coef{}, fmt.Errorf("a fractional power of %s", c.Text())
	}
	p, err := c.num.PowRat(q)
	if err != nil {
		return Coef{}, err
	}
	return Coef{num: p}, nil
}

// Ln is ln c for a positive single-term c, as a sum of ln atoms.
func (c Coef) Ln() (Coef, error) {
	if !c.den.IsZero() || !c.num.isMonomial() {
		return Coef{}, fmt.Errorf("ln(%s) has no exact form", c.Text())
	}
	t := c.num.t[0]
	if t.c.Sign() <= 0 {
		return Coef{}, fmt.Errorf("ln(%s) of a non-positive value", c.Text())
	}
	var out Poly
	for _, side := range []struct {
		n    *big.Int
		sign int64
	}{{t.c.Num(), 1}, {t.c.Denom(), -1}} {
		ps, err := factorize(side.n)
		if err != nil {
			return Coef{}, err
		}
		for _, pe := range ps {
			out = out.Add(SymPoly(Symbol{kindLog, pe.p.String()}, one).ScaleRat(big.NewRat(side.sign*pe.e, 1)))
		}
	}
	for _, f := range t.m.f {
		if f.sym.kind == kindLog {
			return Coef{}, fmt.Errorf("ln of a logarithm has no exact form")
		}
		name := f.sym.name
		if f.sym.kind == kindPi {
			name = "pi"
		}
		out = out.Add(SymPoly(Symbol{kindLog, name}, one).ScaleRat(f.exp))
	}
	return Coef{num: out}, nil
}

// Params lists the parameter names c depends on.
func (c Coef) Params(into map[string]bool) {
	for _, p := range []Poly{c.num, c.den} {
		for _, t := range p.t {
			for _, f := range t.m.f {
				if f.sym.kind == kindParam || (f.sym.kind == kindLog && !isDigits(f.sym.name) && f.sym.name != "pi") {
					into[f.sym.name] = true
				}
			}
		}
	}
}

// ErrUnbound reports a parameter with no value in a numeric evaluation. Its
// message names no way to give one: that is the caller's (the CLI adds its flag).
type ErrUnbound struct{ Name string }

func (e ErrUnbound) Error() string { return fmt.Sprintf("parameter %s has no value", e.Name) }

// Env gives parameters values.
type Env map[string]Coef

func (e Env) float(name string) (float64, error) {
	v, ok := e[name]
	if !ok {
		return 0, ErrUnbound{name}
	}
	return v.Float(nil)
}

func (s Symbol) float(env Env) (float64, error) {
	switch s.kind {
	case kindRoot:
		p, _ := new(big.Float).SetString(s.name)
		f, _ := p.Float64()
		return f, nil
	case kindPi:
		return math.Pi, nil
	case kindPowN:
		v, err := env.float(Index)
		if err != nil {
			return 0, err
		}
		b, err := powBase(s.name).Float(env)
		return math.Pow(b, v), err
	case kindCosN, kindSinN:
		v, err := env.float(Index)
		q, _ := new(big.Rat).SetString(s.name)
		x := ratFloat(q) * math.Pi * v
		if s.kind == kindCosN {
			return math.Cos(x), err
		}
		return math.Sin(x), err
	case kindAtan:
		t, err := atanBase(s.name).Float(nil)
		return math.Atan(t), err
	case kindCosAtanN, kindSinAtanN:
		v, err := env.float(Index)
		x := atanQ(s.name) * math.Pi * v
		if s.kind == kindCosAtanN {
			return math.Cos(x), err
		}
		return math.Sin(x), err
	case kindSign:
		v, err := env.float(s.name)
		if math.Mod(math.Abs(v), 2) == 1 {
			return -1, err
		}
		return 1, err
	case kindLog:
		if isDigits(s.name) {
			p, _ := new(big.Float).SetString(s.name)
			f, _ := p.Float64()
			return math.Log(f), nil
		}
		if s.name == "pi" {
			return math.Log(math.Pi), nil
		}
		v, err := env.float(s.name)
		return math.Log(v), err
	}
	return env.float(s.name)
}

func (p Poly) float(env Env) (float64, error) {
	sum := 0.0
	for _, t := range p.t {
		v, _ := t.c.Float64()
		for _, f := range t.m.f {
			x, err := f.sym.float(env)
			if err != nil {
				return 0, err
			}
			e, _ := f.exp.Float64()
			if f.exp.IsInt() {
				v *= powInt(x, f.exp.Num().Int64())
			} else {
				v *= math.Pow(x, e)
			}
		}
		sum += v
	}
	return sum, nil
}

func powInt(x float64, n int64) float64 {
	if n < 0 {
		return 1 / powInt(x, -n)
	}
	r := 1.0
	for ; n > 0; n >>= 1 {
		if n&1 == 1 {
			r *= x
		}
		x *= x
	}
	return r
}

// Float is the value of c with parameters from env.
func (c Coef) Float(env Env) (float64, error) {
	n, err := c.num.float(env)
	if err != nil || c.den.IsZero() {
		return n, err
	}
	d, err := c.den.float(env)
	return n / d, err
}

// Subst replaces the parameters that env names by their exact values.
func (c Coef) Subst(env Env) (Coef, error) {
	if len(env) == 0 {
		return c, nil
	}
	n, err := c.num.subst(env)
	if err != nil {
		return Coef{}, err
	}
	if c.den.IsZero() {
		return n, nil
	}
	d, err := c.den.subst(env)
	if err != nil {
		return Coef{}, err
	}
	return n.Div(d)
}

var errZeroDenominator = errors.New("the values given make a denominator zero")

func (p Poly) subst(env Env) (Coef, error) {
	out := Coef{}
	for _, t := range p.t {
		term := RatCoef(t.c)
		for _, f := range t.m.f {
			base := Coef{num: SymPoly(f.sym, one)}
			switch {
			case f.sym.kind == kindParam:
				if v, ok := env[f.sym.name]; ok {
					base = v
				}
			case f.sym.kind == kindPowN:
				if v, ok := env[Index]; ok {
					q, isRat := v.Rat()
					if !isRat || !q.IsInt() {
						return Coef{}, fmt.Errorf("(%s)^n needs a whole number", f.sym.name)
					}
					b, err := powBase(f.sym.name).Subst(env)
					if err != nil {
						return Coef{}, err
					}
					if base, err = b.Pow(q); err != nil {
						return Coef{}, err
					}
				}
			case f.sym.kind == kindCosN || f.sym.kind == kindSinN:
				if v, ok := env[Index]; ok {
					q, _ := new(big.Rat).SetString(f.sym.name)
					cs, sn, ok := unitCircle(SymCoef(Pi).Mul(v).MulRat(q))
					if !ok {
						return Coef{}, ErrNoExactAngle
					}
					base = cs
					if f.sym.kind == kindSinN {
						base = sn
					}
				}
			case f.sym.kind == kindCosAtanN || f.sym.kind == kindSinAtanN:
				if v, ok := env[Index]; ok {
					k, isRat := v.Rat()
					if !isRat || !k.IsInt() || !k.Num().IsInt64() {
						return Coef{}, fmt.Errorf("%s needs a whole number", f.sym.key())
					}
					cs, sn, err := atanTrigAt(atanBase(f.sym.name), k.Num().Int64())
					if err != nil {
						return Coef{}, err
					}
					base = cs
					if f.sym.kind == kindSinAtanN {
						base = sn
					}
				}
			case f.sym.kind == kindSign:
				if v, ok := env[f.sym.name]; ok {
					q, isRat := v.Rat()
					if !isRat || !q.IsInt() {
						return Coef{}, fmt.Errorf("(-1)^%s needs a whole number", f.sym.name)
					}
					base = IntCoef(1 - 2*new(big.Int).Mod(q.Num(), big.NewInt(2)).Int64())
				}
			case f.sym.kind == kindLog && !isDigits(f.sym.name) && f.sym.name != "pi":
				if v, ok := env[f.sym.name]; ok {
					l, err := v.Ln()
					if err != nil {
						return Coef{}, err
					}
					base = l
				}
			}
			pw, err := base.Pow(f.exp)
			if err != nil {
				return Coef{}, err
			}
			term = term.Mul(pw)
		}
		out = out.Add(term)
	}
	return out, nil
}

// Positive reports that c may be taken as positive: parameters count as
// positive, so only a coefficient that is provably zero or negative is refused.
func Positive(c Coef) bool {
	if c.IsZero() {
		return false
	}
	if !c.den.IsZero() {
		return true
	}
	for _, t := range c.num.t {
		if t.c.Sign() > 0 {
			return true
		}
		for _, f := range t.m.f {
			if f.sym.kind == kindLog && !isDigits(f.sym.name) {
				return true // ln of a parameter has either sign
			}
		}
	}
	return false
}

// Index is the name of a series' summation index; psol reserves it.
const Index = "n"

// IndexCoef is the index n as a coefficient, for general terms.
var IndexCoef = SymCoef(Param(Index))

// SignCoef is (−1)^n.
var SignCoef = SymCoef(SignOf(Index))

// unitCircle is (cos c, sin c) for c = 0 or c = qπ with 12q whole.
func unitCircle(c Coef) (Coef, Coef, bool) {
	if c.IsZero() {
		return IntCoef(1), Coef{}, true
	}
	piInv, _ := IntCoef(1).Div(SymCoef(Pi))
	q, ok := c.Mul(piInv).Rat()
	if !ok {
		return Coef{}, Coef{}, false
	}
	twelfths := new(big.Rat).Mul(q, big.NewRat(12, 1))
	if !twelfths.IsInt() {
		return Coef{}, Coef{}, false
	}
	k := new(big.Int).Mod(twelfths.Num(), big.NewInt(24)).Int64()
	v, ok := cos12()[k%24]
	if !ok {
		return Coef{}, Coef{}, false
	}
	s, ok := cos12()[(k+18)%24] // sin x = cos(x − π/2)
	if !ok {
		return Coef{}, Coef{}, false
	}
	return v, s, true
}

func ratFloat(q *big.Rat) float64 { f, _ := q.Float64(); return f }
