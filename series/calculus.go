package series

import (
	"errors"
	"math/big"
)

// DR is ∂s/∂r: d/dr[r^p (ln r)^j] = r^(p−1)[p (ln r)^j + j (ln r)^(j−1)].
func (s Sum) DR() Sum {
	var out []Term
	for _, t := range s.t {
		p := t.power()
		down := new(big.Rat).Sub(p, one)
		if p.Sign() != 0 {
			u := t
			u.C, u.P = t.C.MulRat(p), down
			out = append(out, u)
		}
		if t.L > 0 {
			u := t
			u.C, u.P, u.L = t.C.MulRat(big.NewRat(int64(t.L), 1)), down, t.L-1
			out = append(out, u)
		}
	}
	return NewSum(out...)
}

// DTheta is ∂s/∂θ: d/dθ[θ^k cos mθ] = kθ^(k−1) cos mθ − mθ^k sin mθ, and likewise for sin.
func (s Sum) DTheta() Sum {
	var out []Term
	for _, t := range s.t {
		if t.K > 0 {
			u := t
			u.C, u.K = t.C.MulRat(big.NewRat(int64(t.K), 1)), t.K-1
			out = append(out, u)
		}
		if t.M > 0 {
			u := t
			sign := int64(-1)
			if t.Sin {
				sign = 1
			}
			u.C, u.Sin = t.C.MulRat(big.NewRat(sign*int64(t.M), 1)), !t.Sin
			out = append(out, u)
		}
	}
	return NewSum(out...)
}

// MulR is r^q·s.
func (s Sum) MulR(q *big.Rat) Sum {
	out := make([]Term, len(s.t))
	for i, t := range s.t {
		t.P = new(big.Rat).Add(t.power(), q)
		out[i] = t
	}
	return NewSum(out...)
}

// Laplacian is Δs = ∂²s/∂r² + (1/r)∂s/∂r + (1/r²)∂²s/∂θ².
func (s Sum) Laplacian() Sum {
	d := s.DR()
	return d.DR().Add(d.MulR(big.NewRat(-1, 1))).Add(s.DTheta().DTheta().MulR(big.NewRat(-2, 1)))
}

// ErrLogOfRadius reports a trace that needs ln R where R has no exact logarithm.
var ErrLogOfRadius = errors.New("the radius has no exact logarithm")

// Trace is s on the circle r = radius, a function of θ alone.
func (s Sum) Trace(radius Coef) (Sum, error) {
	var lnR *Coef
	out := make([]Term, 0, len(s.t))
	for _, t := range s.t {
		c := t.C
		if t.power().Sign() != 0 {
			pw, err := radius.Pow(t.power())
			if err != nil {
				return Sum{}, err
			}
			c = c.Mul(pw)
		}
		if t.L > 0 {
			if lnR == nil {
				l, err := radius.Ln()
				if err != nil {
					return Sum{}, err
				}
				lnR = &l
			}
			pw, _ := lnR.Pow(big.NewRat(int64(t.L), 1))
			c = c.Mul(pw)
		}
		out = append(out, Term{C: c, K: t.K, M: t.M, Sin: t.Sin})
	}
	return NewSum(out...), nil
}
