package series

import (
	"fmt"
	"math/big"
)

// DiskIntegral is ∬_{r<R} s dA = Σ over the θ-free terms of
// 2π ∫_0^R r^(p+1) (ln r)^j dr, using
//
//	∫_0^R r^a (ln r)^j dr = R^(a+1) Σ_{i=0}^{j} (−1)^i j!/(j−i)! (ln R)^(j−i) / (a+1)^(i+1),  a > −1.
//
// Terms with cos(mθ) or sin(mθ), m ≥ 1, integrate to zero over a full turn.
func (s Sum) DiskIntegral(radius Coef) (Coef, error) {
	total := Coef{}
	twoPi := SymCoef(Pi).MulRat(big.NewRat(2, 1))
	for _, t := range s.t {
		if t.M != 0 {
			continue
		}
		if t.K != 0 {
			return Coef{}, fmt.Errorf("no exact integral for a power of theta")
		}
		a := new(big.Rat).Add(t.power(), one)
		v, err := radialMoment(a, t.L, radius)
		if err != nil {
			return Coef{}, err
		}
		total = total.Add(v.Mul(t.C).Mul(twoPi))
	}
	return total, nil
}

// radialMoment is ∫_0^R r^a (ln r)^j dr for a > −1.
func radialMoment(a *big.Rat, j int, radius Coef) (Coef, error) {
	a1 := new(big.Rat).Add(a, one)
	if a1.Sign() <= 0 {
		return Coef{}, fmt.Errorf("∫ r^%s dr diverges at r = 0", a.RatString())
	}
	head, err := radius.Pow(a1)
	if err != nil {
		return Coef{}, err
	}
	var lnR Coef
	if j > 0 {
		if lnR, err = radius.Ln(); err != nil {
			return Coef{}, err
		}
	}
	sum := Coef{}
	fall := big.NewRat(1, 1) // j!/(j−i)!
	for i := 0; i <= j; i++ {
		w := new(big.Rat).Quo(fall, ratPowInt(a1, int64(i+1)))
		if i%2 == 1 {
			w.Neg(w)
		}
		lp, _ := lnR.Pow(big.NewRat(int64(j-i), 1))
		sum = sum.Add(lp.MulRat(w))
		fall = new(big.Rat).Mul(fall, big.NewRat(int64(j-i), 1))
	}
	return sum.Mul(head), nil
}
