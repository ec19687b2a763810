package series

import (
	"errors"
	"math/big"
)

// ErrDiverges reports an area integral that does not converge.
var ErrDiverges = errors.New("the area integral diverges")

// radialAntiderivative is F with dF/dr = r·s₀(r), s₀ the θ-free part of s,
// term by term: for a = p + 1,
//
//	∫ r^a (ln r)^j dr = r^(a+1) Σ_{i=0}^{j} (−1)^i j!/(j−i)! (ln r)^(j−i) / (a+1)^(i+1)   (a ≠ −1)
//	∫ r^(−1) (ln r)^j dr = (ln r)^(j+1) / (j+1).
//
// The terms with cos(mθ) or sin(mθ), m ≥ 1, integrate to zero over a full turn.
func (s Sum) radialAntiderivative() (Sum, error) {
	var out []Term
	for _, t := range s.t {
		if t.M != 0 {
			continue
		}
		if t.K != 0 {
			return Sum{}, errors.New("no exact integral for a power of theta")
		}
		a1 := new(big.Rat).Add(t.power(), big.NewRat(2, 1)) // a + 1
		if a1.Sign() == 0 {
			out = append(out, Term{C: t.C.MulRat(big.NewRat(1, int64(t.L+1))), L: t.L + 1})
			continue
		}
		fall := big.NewRat(1, 1) // j!/(j−i)!
		for i := 0; i <= t.L; i++ {
			w := new(big.Rat).Quo(fall, ratPowInt(a1, int64(i+1)))
			if i%2 == 1 {
				w.Neg(w)
			}
			out = append(out, Term{C: t.C.MulRat(w), P: a1, L: t.L - i})
			fall = new(big.Rat).Mul(fall, big.NewRat(int64(t.L-i), 1))
		}
	}
	return NewSum(out...), nil
}

// AreaIntegral is ∬ s dA over inner < r < outer, a full turn; a nil inner
// means the disk's centre and a nil outer means infinity.
func (s Sum) AreaIntegral(inner, outer *Coef) (Coef, error) {
	F, err := s.radialAntiderivative()
	if err != nil {
		return Coef{}, err
	}
	at := func(r *Coef, atZero bool) (Coef, error) {
		if r != nil {
			v, err := F.Trace(*r)
			if err != nil {
				return Coef{}, err
			}
			c, _ := v.Const()
			return c, nil
		}
		for _, t := range F.t { // F must vanish in the limit
			p := t.power().Sign()
			if atZero && (p < 0 || p == 0 && t.L > 0) || !atZero && (p > 0 || p == 0 && t.L > 0) {
				return Coef{}, ErrDiverges
			}
		}
		return Coef{}, nil
	}
	hi, err := at(outer, false)
	if err != nil {
		return Coef{}, err
	}
	lo, err := at(inner, true)
	if err != nil {
		return Coef{}, err
	}
	return hi.Sub(lo).Mul(SymCoef(Pi).MulRat(big.NewRat(2, 1))), nil
}

// DiskIntegral is ∬_{r<R} s dA.
func (s Sum) DiskIntegral(radius Coef) (Coef, error) { return s.AreaIntegral(nil, &radius) }

// radialMoment is ∫_0^R r^a (ln r)^j dr for a > −1.
func radialMoment(a *big.Rat, j int, radius Coef) (Coef, error) {
	F, err := NewSum(Term{C: IntCoef(1), P: new(big.Rat).Sub(a, big.NewRat(1, 1)), L: j}).radialAntiderivative()
	if err != nil {
		return Coef{}, err
	}
	if new(big.Rat).Add(a, big.NewRat(1, 1)).Sign() <= 0 {
		return Coef{}, ErrDiverges
	}
	v, err := F.Trace(radius)
	if err != nil {
		return Coef{}, err
	}
	c, _ := v.Const()
	return c, nil
}

// SectorIntegral is ∬ s dA over r < R, 0 < θ < α: per term
// ∫_0^R r^(p+1) (ln r)^j dr · ∫_0^α θ^k T(mθ) dθ.
func (s Sum) SectorIntegral(radius, alpha Coef) (Coef, error) {
	total := Coef{}
	for _, t := range s.t {
		rad, err := radialMoment(new(big.Rat).Add(t.power(), big.NewRat(1, 1)), t.L, radius)
		if err != nil {
			return Coef{}, err
		}
		ang, err := t.angleMoment(alpha)
		if err != nil {
			return Coef{}, err
		}
		total = total.Add(t.C.Mul(rad).Mul(ang))
	}
	return total, nil
}

// AngleIntegral is ∫₀^α s dθ for a function of θ alone (a Trace): per term
// ∫₀^α θ^k T(mθ) dθ, exactly where cos(mα) and sin(mα) are exact.
func (s Sum) AngleIntegral(alpha Coef) (Coef, error) {
	total := Coef{}
	for _, t := range s.t {
		if t.power().Sign() != 0 || t.L != 0 {
			return Coef{}, errors.New("AngleIntegral takes a function of theta alone")
		}
		ang, err := t.angleMoment(alpha)
		if err != nil {
			return Coef{}, err
		}
		total = total.Add(t.C.Mul(ang))
	}
	return total, nil
}

// angleMoment is ∫₀^α θ^k T(mθ) dθ for the term's angular factor.
func (t Term) angleMoment(alpha Coef) (Coef, error) {
	cs, sn, ok := unitCircle(alpha.MulRat(big.NewRat(int64(t.M), 1)))
	if !ok {
		return Coef{}, ErrAngle
	}
	return thetaMoment(t.K, t.Sin, IntCoef(int64(t.M)), alpha, cs, sn)
}
