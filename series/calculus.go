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

// Laplacian is Δs = ∂²s/∂r² + (1/r)∂s/∂r + (1/r²)∂²s/∂θ², term by term:
//
//	Δ[r^p L^j θ^k T(mθ)] = r^(p−2) [ (p²−m²) L^j θ^k T + 2pj L^(j−1) θ^k T
//	                       + j(j−1) L^(j−2) θ^k T + k(k−1) L^j θ^(k−2) T + 2k L^j θ^(k−1) T′ ]
//
// with L = ln r and T′ = dT/d(mθ)·m.
func (s Sum) Laplacian() Sum {
	out := make([]Term, 0, 3*len(s.t))
	two := big.NewRat(2, 1)
	for _, t := range s.t {
		p := t.power()
		base := t
		base.P = new(big.Rat).Sub(p, two)
		add := func(w *big.Rat, l, k int) {
			if w.Sign() == 0 || l < 0 || k < 0 {
				return
			}
			u := base
			u.C, u.L, u.K = t.C.MulRat(w), l, k
			out = append(out, u)
		}
		pp := new(big.Rat).Mul(p, p)
		add(pp.Sub(pp, big.NewRat(int64(t.M)*int64(t.M), 1)), t.L, t.K)
		add(new(big.Rat).Mul(p, big.NewRat(2*int64(t.L), 1)), t.L-1, t.K)
		add(big.NewRat(int64(t.L)*int64(t.L-1), 1), t.L-2, t.K)
		add(big.NewRat(int64(t.K)*int64(t.K-1), 1), t.L, t.K-2)
		if t.K > 0 && t.M > 0 { // 2k θ^(k−1) T′: cos′ = −m sin, sin′ = m cos
			sign := int64(-1)
			if t.Sin {
				sign = 1
			}
			u := base
			u.C, u.K, u.Sin = t.C.MulRat(big.NewRat(2*int64(t.K)*sign*int64(t.M), 1)), t.K-1, !t.Sin
			out = append(out, u)
		}
	}
	return NewSum(out...)
}

// ErrLogOfRadius reports a trace that needs ln R where R has no exact logarithm.
var ErrLogOfRadius = errors.New("the radius has no exact logarithm")

// Trace is s on the circle r = radius, a function of θ alone.
func (s Sum) Trace(radius Coef) (Sum, error) {
	var lnR *Coef
	powers := map[string]Coef{} // R^p, once per exponent
	out := make([]Term, 0, len(s.t))
	for _, t := range s.t {
		c := t.C
		if p := t.power(); p.Sign() != 0 {
			key := p.RatString()
			pw, ok := powers[key]
			if !ok {
				var err error
				if pw, err = radius.Pow(p); err != nil {
					return Sum{}, err
				}
				powers[key] = pw
			}
			if q, ok := pw.Rat(); ok {
				c = c.MulRat(q)
			} else {
				c = c.Mul(pw)
			}
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

// ErrNoExactAngle reports an angle whose sine and cosine psol cannot hold exactly.
var ErrNoExactAngle = errors.New("no exact value of the trigonometric functions at that angle (use 0 or a multiple of pi/12)")

// At is s at the point (r, θ), exactly: r^p and ln r through the atoms,
// cos(mθ) and sin(mθ) for θ = 0 or a multiple of π/12.
func (s Sum) At(r, theta Coef) (Coef, error) {
	var tr Sum
	if r.IsZero() {
		for _, t := range s.t {
			switch p := t.power().Sign(); {
			case p > 0:
			case p == 0 && t.L == 0:
				tr = tr.Add(NewSum(Term{C: t.C, K: t.K, M: t.M, Sin: t.Sin}))
			default:
				return Coef{}, errors.New("the solution is singular at r = 0")
			}
		}
	} else {
		var err error
		if tr, err = s.Trace(r); err != nil {
			return Coef{}, err
		}
	}
	total := Coef{}
	for _, t := range tr.t {
		c := t.C
		if t.K > 0 {
			pw, _ := theta.Pow(big.NewRat(int64(t.K), 1))
			c = c.Mul(pw)
		}
		if t.M > 0 {
			cs, sn, ok := unitCircle(theta.MulRat(big.NewRat(int64(t.M), 1)))
			if !ok {
				return Coef{}, ErrNoExactAngle
			}
			if t.Sin {
				c = c.Mul(sn)
			} else {
				c = c.Mul(cs)
			}
		}
		total = total.Add(c)
	}
	return total, nil
}
