package series

import (
	"errors"
	"math/big"
)

// Poly is a Laurent polynomial with rational coefficients in the atoms:
// Σ c_i·m_i, terms sorted by monomial, no zero coefficient. The zero value is 0.
// Operations never mutate their operands.
type Poly struct {
	t []pterm
}

type pterm struct {
	m monomial
	c *big.Rat
}

// RatPoly is the constant polynomial x.
func RatPoly(x *big.Rat) Poly {
	if x.Sign() == 0 {
		return Poly{}
	}
	return Poly{[]pterm{{c: new(big.Rat).Set(x)}}}
}

// SymPoly is the polynomial s^e.
func SymPoly(s Symbol, e *big.Rat) Poly {
	if e.Sign() == 0 {
		return RatPoly(one)
	}
	m, k := normalizeRoots([]factor{{s, new(big.Rat).Set(e)}})
	return Poly{[]pterm{{m: m, c: k}}}
}

func (p Poly) IsZero() bool { return len(p.t) == 0 }

// Rat reports p as a rational constant, if it is one.
func (p Poly) Rat() (*big.Rat, bool) {
	switch {
	case len(p.t) == 0:
		return new(big.Rat), true
	case len(p.t) == 1 && len(p.t[0].m.f) == 0:
		return p.t[0].c, true
	}
	return nil, false
}

// canonical sorts accumulated terms, merges equal monomials and drops zeros.
func canonical(ts []pterm) Poly {
	kept := Canonical(ts, func(a, b pterm) bool { return monoLess(a.m, b.m) },
		func(a, b pterm) bool { return a.m.key == b.m.key },
		func(a, b pterm) pterm { return pterm{a.m, new(big.Rat).Add(a.c, b.c)} },
		func(t pterm) bool { return t.c.Sign() == 0 })
	if len(kept) == 0 {
		return Poly{}
	}
	return Poly{kept}
}

// monoLess orders monomials by their atoms in print order, then by exponent.
func monoLess(a, b monomial) bool {
	for i := 0; i < len(a.f) && i < len(b.f); i++ {
		x, y := a.f[i], b.f[i]
		if x.sym != y.sym {
			return x.sym.less(y.sym)
		}
		if c := x.exp.Cmp(y.exp); c != 0 {
			return c > 0
		}
	}
	return len(a.f) < len(b.f)
}

// Add is p + q, by merging the two sorted term lists.
func (p Poly) Add(q Poly) Poly {
	if p.IsZero() {
		return q
	}
	if q.IsZero() {
		return p
	}
	out := make([]pterm, 0, len(p.t)+len(q.t))
	i, j := 0, 0
	for i < len(p.t) || j < len(q.t) {
		switch {
		case j == len(q.t) || (i < len(p.t) && monoLess(p.t[i].m, q.t[j].m)):
			out = append(out, p.t[i])
			i++
		case i == len(p.t) || monoLess(q.t[j].m, p.t[i].m):
			out = append(out, q.t[j])
			j++
		default:
			if c := new(big.Rat).Add(p.t[i].c, q.t[j].c); c.Sign() != 0 {
				out = append(out, pterm{p.t[i].m, c})
			}
			i++
			j++
		}
	}
	if len(out) == 0 {
		return Poly{}
	}
	return Poly{out}
}

// Neg is −p.
func (p Poly) Neg() Poly { return p.ScaleRat(big.NewRat(-1, 1)) }

// Sub is p − q.
func (p Poly) Sub(q Poly) Poly { return p.Add(q.Neg()) }

// ScaleRat is x·p.
func (p Poly) ScaleRat(x *big.Rat) Poly {
	if x.Sign() == 0 {
		return Poly{}
	}
	out := make([]pterm, len(p.t))
	for i, t := range p.t {
		out[i] = pterm{t.m, new(big.Rat).Mul(t.c, x)}
	}
	return Poly{out}
}

// Mul is p·q.
func (p Poly) Mul(q Poly) Poly {
	if p.IsZero() || q.IsZero() {
		return Poly{}
	}
	acc := make([]pterm, 0, len(p.t)*len(q.t))
	for _, a := range p.t {
		for _, b := range q.t {
			m, k := monoMul(a.m, b.m)
			c := new(big.Rat).Mul(a.c, b.c)
			if k != one {
				c.Mul(c, k)
			}
			acc = append(acc, pterm{m, c})
		}
	}
	return canonical(acc)
}

// Equal reports p = q.
func (p Poly) Equal(q Poly) bool { return p.Sub(q).IsZero() }

// isMonomial reports whether p is a single term.
func (p Poly) isMonomial() bool { return len(p.t) == 1 }

// ErrRootOfNegative and its kin report a power that has no real exact value.
var (
	ErrRootOfNegative = errors.New("a fractional power of a negative number has no real value")
	ErrTooLarge       = errors.New("a number too large to factor exactly")
	ErrDivideByZero   = errors.New("division by zero")
)

// PowRat is p^q for a single-term p; q fractional needs a positive coefficient.
func (p Poly) PowRat(q *big.Rat) (Poly, error) {
	if q.IsInt() && q.Sign() >= 0 && !p.isMonomial() {
		n := q.Num().Int64()
		out := RatPoly(one)
		for i := int64(0); i < n; i++ {
			out = out.Mul(p)
		}
		return out, nil
	}
	if !p.isMonomial() {
		if p.IsZero() {
			return Poly{}, ErrDivideByZero
		}
		return Poly{}, errNotMonomial
	}
	t := p.t[0]
	c, roots, err := ratPowRat(t.c, q)
	if err != nil {
		return Poly{}, err
	}
	m, k := monoPow(t.m, q)
	m, k2 := monoMul(m, roots)
	c = new(big.Rat).Mul(c, k)
	c.Mul(c, k2)
	return Poly{[]pterm{{m, c}}}, nil
}

var errNotMonomial = errors.New("power of a sum")

// ratPowRat is x^q as a rational times a monomial of prime roots.
func ratPowRat(x *big.Rat, q *big.Rat) (*big.Rat, monomial, error) {
	if x.Sign() == 0 {
		if q.Sign() <= 0 {
			return nil, monomial{}, ErrDivideByZero
		}
		return new(big.Rat), monomial{}, nil
	}
	if q.IsInt() {
		return ratPowInt(x, q.Num().Int64()), monomial{}, nil
	}
	if x.Sign() < 0 {
		return nil, monomial{}, ErrRootOfNegative
	}
	var fs []factor
	add := func(n *big.Int, sign int64) error {
		ps, err := factorize(n)
		if err != nil {
			return err
		}
		for _, pe := range ps {
			e := new(big.Rat).Mul(q, big.NewRat(sign*pe.e, 1))
			fs = append(fs, factor{Symbol{kindRoot, pe.p.String()}, e})
		}
		return nil
	}
	if err := add(x.Num(), 1); err != nil {
		return nil, monomial{}, err
	}
	if err := add(x.Denom(), -1); err != nil {
		return nil, monomial{}, err
	}
	m, k := normalizeRoots(fs)
	return k, m, nil
}

type primePower struct {
	p *big.Int
	e int64
}

// factorize splits n > 0 into primes by trial division; a cofactor that
// is not prime after that is refused rather than guessed.
func factorize(n *big.Int) ([]primePower, error) {
	n = new(big.Int).Set(n)
	var out []primePower
	if n.BitLen() > 62 && !n.ProbablyPrime(20) {
		return nil, ErrTooLarge
	}
	if n.BitLen() > 62 {
		return []primePower{{n, 1}}, nil
	}
	v := n.Uint64()
	for p := uint64(2); p*p <= v; p++ {
		if p > 1<<20 {
			if !new(big.Int).SetUint64(v).ProbablyPrime(20) {
				return nil, ErrTooLarge
			}
			break
		}
		var e int64
		for v%p == 0 {
			v /= p
			e++
		}
		if e > 0 {
			out = append(out, primePower{new(big.Int).SetUint64(p), e})
		}
	}
	if v > 1 {
		out = append(out, primePower{new(big.Int).SetUint64(v), 1})
	}
	return out, nil
}

// content is the positive rational q with p/q having coprime integer coefficients.
func (p Poly) content() *big.Rat {
	if len(p.t) == 0 {
		return big.NewRat(1, 1)
	}
	g := new(big.Int)
	l := big.NewInt(1)
	for _, t := range p.t {
		g.GCD(nil, nil, g, new(big.Int).Abs(t.c.Num()))
		d := t.c.Denom()
		l.Div(new(big.Int).Mul(l, d), new(big.Int).GCD(nil, nil, l, d))
	}
	return new(big.Rat).SetFrac(g, l)
}
