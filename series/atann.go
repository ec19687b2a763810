package series

import (
	"math"
	"math/big"
)

// Angles that are no rational multiple of π. A point source at (X, Y) sits at
// the polar angle φ = atan2(Y, X), and the Fourier series of its logarithm on
// a circle carries cos(nφ) and sin(nφ) in its general term. For rational
// Y/X other than 0 and ±1, φ is no rational multiple of π (the only rational
// values of tan at rational multiples of π are 0 and ±1, a corollary of
// Niven's theorem), so psol keeps cos(n·atan t) and sin(n·atan t) for the
// rational t = |Y/X| as atoms, independent of the others, and reaches φ's
// quadrant by the signs of X and Y:
//
//	φ = atan t:      cos nφ = C,        sin nφ = S
//	φ = −atan t:     cos nφ = C,        sin nφ = −S
//	φ = π − atan t:  cos nφ = (−1)^n C, sin nφ = −(−1)^n S
//	φ = atan t − π:  cos nφ = (−1)^n C, sin nφ = (−1)^n S
//
// with C = cos(n·atan t), S = sin(n·atan t).

// IndexTrig is (cos nφ, sin nφ) for the index n and φ = atan2(y, x), exact
// for rational x and y, not both zero; ok is false otherwise.
func IndexTrig(x, y Coef) (cos, sin Coef, ok bool) {
	qx, okx := x.Rat()
	qy, oky := y.Rat()
	if !okx || !oky || qx.Sign() == 0 && qy.Sign() == 0 {
		return Coef{}, Coef{}, false
	}
	if qx.Sign() == 0 || qy.Sign() == 0 || new(big.Rat).Abs(qx).Cmp(new(big.Rat).Abs(qy)) == 0 {
		// A multiple of π/4: the atoms cos(qπn), sin(qπn).
		q := map[[2]int]*big.Rat{
			{1, 0}: big.NewRat(0, 1), {1, 1}: big.NewRat(1, 4), {0, 1}: big.NewRat(1, 2), {-1, 1}: big.NewRat(3, 4),
			{-1, 0}: big.NewRat(1, 1), {-1, -1}: big.NewRat(5, 4), {0, -1}: big.NewRat(3, 2), {1, -1}: big.NewRat(7, 4),
		}[[2]int{qx.Sign(), qy.Sign()}]
		c, s := nTrig(q)
		return c, s, true
	}
	t := new(big.Rat).Abs(new(big.Rat).Quo(qy, qx))
	C, S := SymCoef(Symbol{kindCosAtanN, t.RatString()}), SymCoef(Symbol{kindSinAtanN, t.RatString()})
	if qx.Sign() < 0 {
		C, S = C.Mul(SignCoef), S.Mul(SignCoef).Neg()
	}
	if qy.Sign() < 0 {
		S = S.Neg()
	}
	return C, S, true
}

// atanTrigAt is (cos kφ, sin kφ) for φ = atan t and a whole k, exactly:
// (1 + it)^k = (1 + t²)^(k/2)·(cos kφ + i sin kφ).
func atanTrigAt(t *big.Rat, k int64) (Coef, Coef, error) {
	neg := k < 0
	if neg {
		k = -k
	}
	re, im := big.NewRat(1, 1), new(big.Rat)
	for i := int64(0); i < k; i++ { // (re + i·im)(1 + it)
		re, im = new(big.Rat).Sub(re, new(big.Rat).Mul(im, t)), new(big.Rat).Add(im, new(big.Rat).Mul(re, t))
	}
	norm := new(big.Rat).Add(big.NewRat(1, 1), new(big.Rat).Mul(t, t))
	scale, err := RatCoef(norm).Pow(big.NewRat(k, 2))
	if err != nil {
		return Coef{}, Coef{}, err
	}
	c, err := RatCoef(re).Div(scale)
	if err != nil {
		return Coef{}, Coef{}, err
	}
	s, err := RatCoef(im).Div(scale)
	if neg {
		s = s.Neg()
	}
	return c, s, err
}

// atanQ is atan t / π, the form cos(qπn) takes it in float64.
func atanQ(name string) float64 {
	t, _ := new(big.Rat).SetString(name)
	return math.Atan(ratFloat(t)) / math.Pi
}
