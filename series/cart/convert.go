package cart

import (
	"errors"
	"math/big"

	"psol/series"
)

// ErrNotPolynomial reports a polar sum that is not a polynomial in x and y.
var ErrNotPolynomial = errors.New("not a polynomial in x and y")

// FromPolar converts a polar sum whose terms are r^p cos(mθ) or r^p sin(mθ)
// with p − m a non-negative even number (and no logarithm or power of θ)
// into x and y: r^m cos mθ = Re (x + iy)^m, r^m sin mθ = Im (x + iy)^m, and
// r² = x² + y².
func FromPolar(s series.Sum) (Poly, error) {
	var out Poly
	for _, t := range s.Terms() {
		if t.L != 0 || t.K != 0 || !t.P.IsInt() {
			return Poly{}, ErrNotPolynomial
		}
		p := int(t.P.Num().Int64())
		if p < t.M || (p-t.M)%2 != 0 {
			return Poly{}, ErrNotPolynomial
		}
		re, im := zPower(t.M)
		trig := re
		if t.Sin {
			trig = im
		}
		r2 := X.Mul(X).Add(Y.Mul(Y))
		f := trig
		for k := 0; k < (p-t.M)/2; k++ {
			f = f.Mul(r2)
		}
		out = out.Add(f.Scale(t.C))
	}
	return out, nil
}

// PolyLeaf gives series.Field.CompileXY the evaluators of the exact sums
// that are polynomials in x and y, their parameters' values from env.
func PolyLeaf(env series.Env) func(series.Sum) (func(x, y float64) float64, bool) {
	return func(s series.Sum) (func(x, y float64) float64, bool) {
		p, err := FromPolar(s)
		if err != nil {
			return nil, false
		}
		c, err := p.Compile(env)
		if err != nil {
			return nil, false
		}
		return c.At, true
	}
}

// zPower is the real and imaginary parts of (x + iy)^m by the binomial theorem.
func zPower(m int) (re, im Poly) {
	binom := big.NewInt(1)
	for k := 0; k <= m; k++ {
		// C(m, k) x^(m−k) (iy)^k
		c := series.RatCoef(new(big.Rat).SetInt(binom))
		switch k % 4 {
		case 0:
			re = re.Add(Monomial(c, m-k, k))
		case 1:
			im = im.Add(Monomial(c, m-k, k))
		case 2:
			re = re.Add(Monomial(c.Neg(), m-k, k))
		case 3:
			im = im.Add(Monomial(c.Neg(), m-k, k))
		}
		binom = new(big.Int).Div(new(big.Int).Mul(binom, big.NewInt(int64(m-k))), big.NewInt(int64(k+1)))
	}
	return re, im
}

// Harmonics are the harmonic polynomials Re and Im of (x + iy)^k for
// k = 0..degree, in that order (Im of k = 0 left out).
func Harmonics(degree int) []Poly {
	var out []Poly
	for k := 0; k <= degree; k++ {
		re, im := zPower(k)
		out = append(out, re)
		if k > 0 {
			out = append(out, im)
		}
	}
	return out
}

// Polar writes p as a polar sum (x = r cos θ, y = r sin θ).
func (p Poly) Polar() series.Sum {
	x := series.R.Mul(series.Trig(1, false))
	y := series.R.Mul(series.Trig(1, true))
	var out series.Sum
	for _, t := range p.Terms() {
		term := series.Const(t.C)
		for k := 0; k < t.I; k++ {
			term = term.Mul(x)
		}
		for k := 0; k < t.J; k++ {
			term = term.Mul(y)
		}
		out = out.Add(term)
	}
	return out
}
