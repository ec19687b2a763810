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
// Niven's theorem), so psol keeps cos(n·atan t) and sin(n·atan t) for
// t = |Y/X| as atoms, independent of the others, and reaches φ's quadrant by
// the signs of X and Y (t may carry roots: a line's crossing with a circle
// sits at such an angle, and atan t itself is then an atom too, Angle):
//
//	φ = atan t:      cos nφ = C,        sin nφ = S
//	φ = −atan t:     cos nφ = C,        sin nφ = −S
//	φ = π − atan t:  cos nφ = (−1)^n C, sin nφ = −(−1)^n S
//	φ = atan t − π:  cos nφ = (−1)^n C, sin nφ = (−1)^n S
//
// with C = cos(n·atan t), S = sin(n·atan t).

// atanBases remembers the ratio t behind each angle atom.
var atanBases registry

func atanAtom(kind symKind, t Coef) Coef { return SymCoef(Symbol{kind, atanBases.name(t)}) }

func atanBase(name string) Coef { return atanBases.coef(name) }

// quadrant reads the signs of x and y and the ratio t = |y/x| for an angle
// atan2(y, x) of constants (roots allowed); ok is false for parameters or
// the origin.
func quadrant(x, y Coef) (sx, sy int, t Coef, ok bool) {
	fx, errx := x.Float(nil)
	fy, erry := y.Float(nil)
	if errx != nil || erry != nil || fx == 0 && fy == 0 {
		return 0, 0, Coef{}, false
	}
	sign := func(f float64, c Coef) int {
		if c.IsZero() {
			return 0
		}
		if f < 0 {
			return -1
		}
		return 1
	}
	sx, sy = sign(fx, x), sign(fy, y)
	if sx == 0 || sy == 0 {
		return sx, sy, Coef{}, true
	}
	t, err := y.Div(x)
	if err != nil {
		return 0, 0, Coef{}, false
	}
	if sx*sy < 0 {
		t = t.Neg()
	}
	return sx, sy, t, true
}

// quarterTurns is q with atan2(y, x) = qπ where that is a multiple of π/4
// or of π/6 (t = |y/x| of 1, √3 or √3/3): a kinked line through a circle
// meets it at such angles often (|x − 1/2| on the unit circle at ±π/3), and
// π/3 reads better than atan(√3), and its cos(nπ/3) are the index atoms.
func quarterTurns(sx, sy int, t Coef) (*big.Rat, bool) {
	if sx == 0 || sy == 0 {
		q, ok := map[[2]int]*big.Rat{
			{1, 0}: big.NewRat(0, 1), {0, 1}: big.NewRat(1, 2), {-1, 0}: big.NewRat(1, 1), {0, -1}: big.NewRat(3, 2),
		}[[2]int{sx, sy}]
		return q, ok
	}
	root3, err := IntCoef(3).Pow(big.NewRat(1, 2))
	if err != nil {
		return nil, false
	}
	var a *big.Rat // the angle in the first quadrant, over π
	switch {
	case t.Equal(IntCoef(1)):
		a = big.NewRat(1, 4)
	case t.Equal(root3):
		a = big.NewRat(1, 3)
	case t.Equal(root3.MulRat(big.NewRat(1, 3))):
		a = big.NewRat(1, 6)
	default:
		return nil, false
	}
	one := big.NewRat(1, 1)
	switch {
	case sx > 0 && sy > 0:
		return a, true
	case sx < 0 && sy > 0:
		return new(big.Rat).Sub(one, a), true
	case sx < 0:
		return new(big.Rat).Add(one, a), true
	}
	return new(big.Rat).Sub(big.NewRat(2, 1), a), true
}

// IndexTrig is (cos nφ, sin nφ) for the index n and φ = atan2(y, x), exact
// for constant x and y (rationals, or with roots), not both zero; ok is
// false otherwise.
func IndexTrig(x, y Coef) (cos, sin Coef, ok bool) {
	sx, sy, t, ok := quadrant(x, y)
	if !ok {
		return Coef{}, Coef{}, false
	}
	if q, ok := quarterTurns(sx, sy, t); ok { // the atoms cos(qπn), sin(qπn)
		c, s := nTrig(q)
		return c, s, true
	}
	C, S := atanAtom(kindCosAtanN, t), atanAtom(kindSinAtanN, t)
	if sx < 0 {
		C, S = C.Mul(SignCoef), S.Mul(SignCoef).Neg()
	}
	if sy < 0 {
		S = S.Neg()
	}
	return C, S, true
}

// Angle is atan2(y, x) exactly for constant x and y: a multiple of π/4, or
// atan t (t = |y/x|) placed in its quadrant by π and signs, atan t an atom.
func Angle(x, y Coef) (Coef, bool) {
	sx, sy, t, ok := quadrant(x, y)
	if !ok {
		return Coef{}, false
	}
	if q, ok := quarterTurns(sx, sy, t); ok {
		if q.Cmp(big.NewRat(1, 1)) > 0 { // in (−π, π]
			q.Sub(q, big.NewRat(2, 1))
		}
		return SymCoef(Pi).MulRat(q), true
	}
	a := atanAtom(kindAtan, t)
	switch {
	case sx > 0 && sy > 0:
		return a, true
	case sx > 0:
		return a.Neg(), true
	case sy > 0:
		return SymCoef(Pi).Sub(a), true
	}
	return a.Sub(SymCoef(Pi)), true
}

// atanTrigAt is (cos kφ, sin kφ) for φ = atan t and a whole k, exactly:
// (1 + it)^k = (1 + t²)^(k/2)·(cos kφ + i sin kφ).
func atanTrigAt(t Coef, k int64) (Coef, Coef, error) {
	neg := k < 0
	if neg {
		k = -k
	}
	re, im := IntCoef(1), Coef{}
	for i := int64(0); i < k; i++ { // (re + i·im)(1 + it)
		re, im = re.Sub(im.Mul(t)), im.Add(re.Mul(t))
	}
	scale, err := IntCoef(1).Add(t.Mul(t)).Pow(big.NewRat(k, 2))
	if err != nil {
		return Coef{}, Coef{}, err
	}
	c, err := re.Div(scale)
	if err != nil {
		return Coef{}, Coef{}, err
	}
	s, err := im.Div(scale)
	if neg {
		s = s.Neg()
	}
	return c, s, err
}

// atanQ is atan t / π, the form cos(qπn) takes it in float64.
func atanQ(name string) float64 {
	t, _ := atanBase(name).Float(nil)
	return math.Atan(t) / math.Pi
}
