package series

import (
	"math/big"
	"sort"
	"strings"
)

// symKind orders the atoms of a coefficient; the order is the print order.
type symKind uint8

const (
	kindRoot     symKind = iota // a prime p to a power in (0, 1): the irrational part of R^p
	kindPi                      // π
	kindParam                   // a parameter such as a, mu, G
	kindLog                     // ln of a prime or of a parameter
	kindSign                    // (−1)^n for a whole-number parameter n
	kindCosN                    // cos(qπn) for the index n, q in (0, 1) (name: q)
	kindSinN                    // sin(qπn)
	kindPowN                    // ρ^n for a fixed ratio ρ (name: ρ's text; value in powBases)
	kindCosAtanN                // cos(n·atan t) for the index n, t > 0, t ≠ 1 (name: t's text; value in atanBases)
	kindSinAtanN                // sin(n·atan t)
	kindAtan                    // atan t, a constant angle (name: t's text; value in atanBases)
)

// Symbol is one atom of a coefficient. Atoms are treated as independent
// transcendentals, so a coefficient is zero exactly when its polynomial is.
type Symbol struct {
	kind symKind
	name string // the prime's digits or the parameter's name; "" for π
}

// indexed reports an atom that depends on a series' index n.
func (s Symbol) indexed() bool {
	switch s.kind {
	case kindSign, kindCosN, kindSinN, kindPowN, kindCosAtanN, kindSinAtanN:
		return true
	}
	return s.kind == kindParam && s.name == Index
}

// Param is the atom of the named parameter.
func Param(name string) Symbol { return Symbol{kindParam, name} }

// Pi is the atom π.
var Pi = Symbol{kind: kindPi}

// SignOf is the atom (−1)^n of the whole-number parameter n.
func SignOf(n string) Symbol { return Symbol{kindSign, n} }

func (s Symbol) key() string {
	switch s.kind {
	case kindRoot:
		return "#" + s.name
	case kindPi:
		return "pi"
	case kindLog:
		return "ln(" + s.name + ")"
	case kindSign:
		return "(-1)^" + s.name
	case kindCosN:
		return "cos(" + s.name + "*pi*n)"
	case kindSinN:
		return "sin(" + s.name + "*pi*n)"
	case kindPowN:
		return "(" + s.name + ")^n"
	case kindCosAtanN:
		return "cos(n*atan(" + s.name + "))"
	case kindSinAtanN:
		return "sin(n*atan(" + s.name + "))"
	case kindAtan:
		return "atan(" + s.name + ")"
	}
	return s.name
}

func (s Symbol) less(t Symbol) bool {
	if s.kind != t.kind {
		return s.kind < t.kind
	}
	if s.kind == kindRoot || (s.kind == kindLog && isDigits(s.name) && isDigits(t.name)) {
		if len(s.name) != len(t.name) {
			return len(s.name) < len(t.name)
		}
	}
	return s.name < t.name
}

func isDigits(s string) bool {
	for _, c := range s {
		if c < '0' || c > '9' {
			return false
		}
	}
	return s != ""
}

// factor is one atom raised to a nonzero rational power.
type factor struct {
	sym Symbol
	exp *big.Rat
}

// monomial is a product of atom powers, sorted by atom, with no repeated atom.
// The empty monomial is 1. Roots keep exponents in (0, 1).
type monomial struct {
	f   []factor
	key string
}

func newMonomial(fs []factor) monomial {
	sort.Slice(fs, func(i, j int) bool { return fs[i].sym.less(fs[j].sym) })
	var b strings.Builder
	for i, f := range fs {
		if i > 0 {
			b.WriteByte('*')
		}
		b.WriteString(f.sym.key())
		b.WriteByte('^')
		b.WriteString(f.exp.RatString())
	}
	return monomial{f: fs, key: b.String()}
}

var one = big.NewRat(1, 1)

// monoMul multiplies two monomials; root atoms that reach whole powers
// leave the monomial as a rational factor, which is returned.
func monoMul(a, b monomial) (monomial, *big.Rat) {
	if len(a.f) == 0 {
		return b, one
	}
	if len(b.f) == 0 {
		return a, one
	}
	out := make([]factor, 0, len(a.f)+len(b.f))
	i, j := 0, 0
	for i < len(a.f) || j < len(b.f) {
		switch {
		case j == len(b.f) || (i < len(a.f) && a.f[i].sym.less(b.f[j].sym)):
			out = append(out, a.f[i])
			i++
		case i == len(a.f) || b.f[j].sym.less(a.f[i].sym):
			out = append(out, b.f[j])
			j++
		default:
			e := new(big.Rat).Add(a.f[i].exp, b.f[j].exp)
			if e.Sign() != 0 {
				out = append(out, factor{a.f[i].sym, e})
			}
			i++
			j++
		}
	}
	return normalizeRoots(out)
}

// normalizeRoots moves whole powers of primes out of root atoms.
func normalizeRoots(fs []factor) (monomial, *big.Rat) {
	scale := one
	kept := fs[:0:0]
	for _, f := range fs {
		if f.sym.kind == kindSign { // (−1)^(2n) = 1
			if new(big.Int).Mod(f.exp.Num(), big.NewInt(2)).Sign() != 0 {
				kept = append(kept, factor{f.sym, big.NewRat(1, 1)})
			}
			continue
		}
		if f.sym.kind != kindRoot {
			kept = append(kept, f)
			continue
		}
		whole := floorRat(f.exp)
		frac := new(big.Rat).Sub(f.exp, new(big.Rat).SetInt(whole))
		if whole.Sign() != 0 {
			p, _ := new(big.Int).SetString(f.sym.name, 10)
			scale = new(big.Rat).Mul(scale, ratPowInt(new(big.Rat).SetInt(p), whole.Int64()))
		}
		if frac.Sign() != 0 {
			kept = append(kept, factor{f.sym, frac})
		}
	}
	return newMonomial(kept), scale
}

func floorRat(x *big.Rat) *big.Int {
	q, m := new(big.Int).DivMod(x.Num(), x.Denom(), new(big.Int))
	_ = m
	return q // DivMod rounds towards -inf for positive divisors
}

// ratPowInt is x^n for an integer n (x ≠ 0 when n < 0).
func ratPowInt(x *big.Rat, n int64) *big.Rat {
	neg := n < 0
	if neg {
		n = -n
	}
	e := big.NewInt(n)
	num := new(big.Int).Exp(x.Num(), e, nil)
	den := new(big.Int).Exp(x.Denom(), e, nil)
	if neg {
		num, den = den, num
	}
	return new(big.Rat).SetFrac(num, den)
}

// monoPow raises a monomial to a rational power.
func monoPow(a monomial, q *big.Rat) (monomial, *big.Rat) {
	if q.Sign() == 0 {
		return monomial{}, one
	}
	fs := make([]factor, len(a.f))
	for i, f := range a.f {
		fs[i] = factor{f.sym, new(big.Rat).Mul(f.exp, q)}
	}
	return normalizeRoots(fs)
}

// degreeOf is the exponent of s in a, or 0.
func (a monomial) degreeOf(s Symbol) *big.Rat {
	for _, f := range a.f {
		if f.sym == s {
			return f.exp
		}
	}
	return new(big.Rat)
}
