package series

import (
	"fmt"
	"math/big"
)

// Term is C · r^P · (ln r)^L · θ^K · cos(Mθ), or sin(Mθ) when Sin.
// A constant angular factor is cos(0θ); sin(0θ) terms do not exist.
type Term struct {
	C   Coef
	P   *big.Rat
	L   int
	K   int
	M   int
	Sin bool
}

func (t Term) power() *big.Rat {
	if t.P == nil {
		return new(big.Rat)
	}
	return t.P
}

// shape is the part of a term that like terms share.
type shape struct {
	pn, pd  int64  // r's exponent, when it fits in int64
	p       string // r's exponent otherwise
	l, k, m int
	sin     bool
}

func (t Term) shape() shape {
	p := t.power()
	if p.Num().IsInt64() && p.Denom().IsInt64() {
		return shape{pn: p.Num().Int64(), pd: p.Denom().Int64(), l: t.L, k: t.K, m: t.M, sin: t.Sin}
	}
	return shape{p: p.RatString(), l: t.L, k: t.K, m: t.M, sin: t.Sin}
}

func (t Term) sameShape(u Term) bool {
	return t.M == u.M && t.Sin == u.Sin && t.K == u.K && t.L == u.L && t.power().Cmp(u.power()) == 0
}

// termLess is the canonical order: by mode, cos before sin, then by θ power,
// r power and log power.
func termLess(a, b Term) bool {
	switch {
	case a.M != b.M:
		return a.M < b.M
	case a.Sin != b.Sin:
		return !a.Sin
	case a.K != b.K:
		return a.K < b.K
	}
	if c := a.power().Cmp(b.power()); c != 0 {
		return c < 0
	}
	return a.L < b.L
}

// Sum is a finite sum of terms in canonical order, like terms merged and
// zero terms dropped. The zero value is 0. Operations never mutate operands.
type Sum struct {
	t []Term
}

// NewSum builds the canonical sum of the given terms: sorted, like terms
// merged, zero terms dropped.
func NewSum(terms ...Term) Sum {
	out := make([]Term, 0, len(terms))
	for _, t := range terms {
		if t.C.IsZero() || (t.M == 0 && t.Sin) {
			continue
		}
		if t.M < 0 {
			t.M = -t.M
			if t.Sin {
				t.C = t.C.Neg()
			}
		}
		t.P = t.power()
		out = append(out, t)
	}
	kept := Canonical(out, termLess, Term.sameShape,
		func(a, b Term) Term { a.C = a.C.Add(b.C); return a },
		func(t Term) bool { return t.C.IsZero() })
	return Sum{kept}
}

// Const is the constant c.
func Const(c Coef) Sum { return NewSum(Term{C: c}) }

// R is the variable r; Theta is θ.
var (
	R     = NewSum(Term{C: IntCoef(1), P: big.NewRat(1, 1)})
	Theta = NewSum(Term{C: IntCoef(1), K: 1})
)

// Trig is cos(mθ) or sin(mθ).
func Trig(m int, sin bool) Sum { return NewSum(Term{C: IntCoef(1), M: m, Sin: sin}) }

// Terms lists the terms in canonical order.
func (s Sum) Terms() []Term { return append([]Term(nil), s.t...) }

func (s Sum) IsZero() bool { return len(s.t) == 0 }

// Len is the number of terms.
func (s Sum) Len() int { return len(s.t) }

// Add is s + u.
func (s Sum) Add(u Sum) Sum {
	if s.IsZero() {
		return u
	}
	if u.IsZero() {
		return s
	}
	return NewSum(append(append(make([]Term, 0, len(s.t)+len(u.t)), s.t...), u.t...)...)
}

// Scale is c·s.
func (s Sum) Scale(c Coef) Sum {
	out := make([]Term, len(s.t))
	for i, t := range s.t {
		t.C = t.C.Mul(c)
		out[i] = t
	}
	return NewSum(out...)
}

// Neg is −s.
func (s Sum) Neg() Sum { return s.Scale(IntCoef(-1)) }

// Sub is s − u.
func (s Sum) Sub(u Sum) Sum { return s.Add(u.Neg()) }

// Equal reports s = u.
func (s Sum) Equal(u Sum) bool { return s.Sub(u).IsZero() }

// trigProduct gives T1(a)·T2(b) = ½[dif·T(a−b) + add·T(a+b)], indexed by
// [T1 is sin][T2 is sin]; the product is a sine when exactly one factor is.
var trigProduct = [2][2]struct{ dif, add int64 }{
	{{1, 1}, {-1, 1}}, // cos·cos, cos·sin
	{{1, 1}, {1, -1}}, // sin·cos, sin·sin
}

func mulTerm(a, b Term) []Term {
	c := a.C.Mul(b.C)
	base := Term{
		P: new(big.Rat).Add(a.power(), b.power()),
		L: a.L + b.L,
		K: a.K + b.K,
	}
	if a.M == 0 || b.M == 0 { // a constant angular factor: no product formula
		base.C, base.M, base.Sin = c, a.M+b.M, a.Sin || b.Sin
		return []Term{base}
	}
	rule := trigProduct[b2i(a.Sin)][b2i(b.Sin)]
	half := c.MulRat(big.NewRat(1, 2))
	sin := a.Sin != b.Sin
	d, s := base, base
	d.C, d.M, d.Sin = half.MulRat(big.NewRat(rule.dif, 1)), a.M-b.M, sin
	s.C, s.M, s.Sin = half.MulRat(big.NewRat(rule.add, 1)), a.M+b.M, sin
	return []Term{d, s}
}

func b2i(b bool) int {
	if b {
		return 1
	}
	return 0
}

// Mul is s·u, trigonometric products reduced to single modes.
func (s Sum) Mul(u Sum) Sum {
	var out []Term
	for _, a := range s.t {
		for _, b := range u.t {
			out = append(out, mulTerm(a, b)...)
		}
	}
	return NewSum(out...)
}

// Const reports s as a constant, if it is one.
func (s Sum) Const() (Coef, bool) {
	switch {
	case len(s.t) == 0:
		return Coef{}, true
	case len(s.t) == 1 && s.t[0].isConst():
		return s.t[0].C, true
	}
	return Coef{}, false
}

func (t Term) isConst() bool { return t.power().Sign() == 0 && t.L == 0 && t.K == 0 && t.M == 0 }

// Pow is s^q: a whole power of any sum, or any rational power of a single
// term with no logarithm, angle or trigonometric factor.
func (s Sum) Pow(q *big.Rat) (Sum, error) {
	if q.IsInt() && q.Sign() >= 0 && len(s.t) == 1 && s.t[0].M == 0 {
		// One term without a cosine: multiply the exponents.
		t := s.t[0]
		c, err := t.C.Pow(q)
		if err != nil {
			return Sum{}, err
		}
		n := int(q.Num().Int64())
		return NewSum(Term{C: c, P: new(big.Rat).Mul(t.power(), q), L: t.L * n, K: t.K * n}), nil
	}
	if q.IsInt() && q.Sign() >= 0 {
		n := q.Num().Int64()
		out := Const(IntCoef(1))
		for i := int64(0); i < n; i++ {
			out = out.Mul(s)
		}
		return out, nil
	}
	if len(s.t) != 1 || s.t[0].L != 0 || s.t[0].K != 0 || s.t[0].M != 0 {
		return Sum{}, fmt.Errorf("no exact form for a power %s of a sum", q.RatString())
	}
	t := s.t[0]
	c, err := t.C.Pow(q)
	if err != nil {
		return Sum{}, err
	}
	return NewSum(Term{C: c, P: new(big.Rat).Mul(t.power(), q)}), nil
}

// Subst replaces parameters by the exact values env gives.
func (s Sum) Subst(env Env) (Sum, error) {
	out := make([]Term, len(s.t))
	for i, t := range s.t {
		c, err := t.C.Subst(env)
		if err != nil {
			return Sum{}, err
		}
		t.C = c
		out[i] = t
	}
	return NewSum(out...), nil
}

// Params adds the names of the parameters s depends on to into.
func (s Sum) Params(into map[string]bool) {
	for _, t := range s.t {
		t.C.Params(into)
	}
}

// HasAngle reports whether some term carries a power of θ itself.
func (s Sum) HasAngle() bool {
	for _, t := range s.t {
		if t.K != 0 {
			return true
		}
	}
	return false
}

// MaxMode is the largest angular mode in s.
func (s Sum) MaxMode() int {
	m := 0
	for _, t := range s.t {
		if t.M > m {
			m = t.M
		}
	}
	return m
}

// Bits is the bit length of the largest numerator or denominator among s's
// coefficients: a bound on the cost of its arithmetic, as Size bounds the count.
func (s Sum) Bits() int {
	n := 0
	for _, t := range s.t {
		for _, p := range []Poly{t.C.num, t.C.den} {
			for _, pt := range p.t {
				n = max(n, pt.c.Num().BitLen(), pt.c.Denom().BitLen())
			}
		}
	}
	return n
}

// MaxExponent is the largest |numerator| or denominator among the exponents
// s prints: of r, ln r and θ, and of the atoms in its coefficients.
func (s Sum) MaxExponent() int64 {
	var n int64
	grow := func(q *big.Rat) {
		for _, z := range []*big.Int{q.Num(), q.Denom()} {
			if z.BitLen() > 62 {
				n = 1 << 62
				return
			}
			n = max(n, abs64(z.Int64()))
		}
	}
	for _, t := range s.t {
		grow(t.power())
		n = max(n, int64(t.L), int64(t.K))
		for _, p := range []Poly{t.C.num, t.C.den} {
			for _, pt := range p.t {
				for _, f := range pt.m.f {
					grow(f.exp)
				}
			}
		}
	}
	return n
}

func abs64(z int64) int64 {
	if z < 0 {
		return -z
	}
	return z
}

// Size counts the monomials of s, coefficients included: a bound on the work of a product.
func (s Sum) Size() int {
	n := 0
	for _, t := range s.t {
		n += len(t.C.num.t) + len(t.C.den.t)
	}
	return n
}
