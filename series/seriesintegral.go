package series

import (
	"math"
	"math/big"
)

// Coefficient evaluates a general coefficient at a concrete n, exactly.
func Coefficient(c Coef, n int) (Coef, error) {
	return c.Subst(Env{Index: IntCoef(int64(n))})
}

// IndexedSum is Σ_{n ≥ From} c_n, c_n = General at n except where Special gives it.
type IndexedSum struct {
	From    int
	General Coef
	Special map[int]Coef
}

// Float sums in float64 until the tail estimate n·|c_n| is below tol·max(1, |sum|)
// (sound for terms decaying like n^(−2) or faster), or maxTerms terms.
func (s IndexedSum) Float(env Env, tol float64, maxTerms int) (Summed, error) {
	g, special, err := s.compile(env)
	if err != nil {
		return Summed{}, err
	}
	sum, tail, quiet, last := 0.0, math.Inf(1), 0, s.From
	for n := s.From; n < s.From+maxTerms; n++ {
		c, ok := special[n]
		if !ok {
			c = g.at(float64(n))
		}
		sum += c
		last, tail = n, float64(n)*math.Abs(c)
		if !ok && tail <= tol*math.Max(1, math.Abs(sum)) {
			if quiet++; quiet >= 4 {
				break
			}
		} else {
			quiet = 0
		}
	}
	return Summed{Value: sum, Terms: last, Tail: tail}, nil
}

// SectorIntegral is ∬ over the sector r < R, 0 < θ < α (α = aOverPi·π) of the
// series, term by term: ∫_0^α Φ_n dθ is (1 − cos ν_nα)/ν_n for sines and
// sin(ν_nα)/ν_n for cosines (α where ν_n = 0); ∫_0^R (r/R)^ν r dr = R²/(ν + 2).
func (s Series) SectorIntegral(aOverPi *big.Rat) (IndexedSum, error) {
	out := IndexedSum{From: s.Family.From, Special: map[int]Coef{}}
	var err error
	if out.General, err = s.modeIntegral(s.General, aOverPi, IndexCoef, SignCoef); err != nil {
		return IndexedSum{}, err
	}
	for n, ts := range s.Special {
		sign := IntCoef(1 - 2*int64(((n%2)+2)%2))
		if out.Special[n], err = s.modeIntegral(ts, aOverPi, IntCoef(int64(n)), sign); err != nil {
			return IndexedSum{}, err
		}
	}
	return out, nil
}

func (s Series) modeIntegral(ts []RadialTerm, aOverPi *big.Rat, n, sign Coef) (Coef, error) {
	nu := s.Family.Nu(n)
	cd, sd, ok := unitCircle(SymCoef(Pi).Mul(RatCoef(new(big.Rat).Mul(s.Family.Offset, aOverPi))))
	if !ok {
		return Coef{}, ErrAngle
	}
	var angular Coef
	switch q, isRat := nu.Rat(); {
	case isRat && q.Sign() == 0:
		if s.Family.Sin {
			return Coef{}, nil
		}
		angular = SymCoef(Pi).MulRat(aOverPi)
	case s.Family.Sin:
		angular, _ = IntCoef(1).Sub(sign.Mul(cd)).Div(nu)
	default:
		angular, _ = sign.Mul(sd).Div(nu)
	}
	radial := Coef{}
	for _, t := range ts {
		if t.Scaled {
			r2, _ := s.R.Pow(big.NewRat(2, 1))
			v, err := r2.Div(nu.Add(IntCoef(2)))
			if err != nil {
				return Coef{}, err
			}
			radial = radial.Add(t.C.Mul(v))
			continue
		}
		v, err := radialMoment(new(big.Rat).Add(t.P, one), t.L, s.R)
		if err != nil {
			return Coef{}, err
		}
		radial = radial.Add(t.C.Mul(v))
	}
	return radial.Mul(angular), nil
}

// Extrapolated sums like Float, and also takes the tail of terms that fall
// like a power of n by Aitken's Δ² on the partial sums at n = 64, 128, 256,
// …: two extrapolations in a row that agree within tol·max(1, |sum|) end
// the sum (a flux's n⁻³ terms took a million to meet 1e-12 one by one).
// Tail is then their difference.
func (s IndexedSum) Extrapolated(env Env, tol float64, maxTerms int) (Summed, error) {
	g, special, err := s.compile(env)
	if err != nil {
		return Summed{}, err
	}
	var at []float64
	prev, havePrev := 0.0, false
	sum, quiet := 0.0, 0
	for n := s.From; n < s.From+maxTerms; n++ {
		c, ok := special[n]
		if !ok {
			c = g.at(float64(n))
		}
		sum += c
		tail := float64(n) * math.Abs(c)
		if !ok && tail <= tol*math.Max(1, math.Abs(sum)) {
			if quiet++; quiet >= 4 {
				return Summed{Value: sum, Terms: n, Tail: tail}, nil
			}
		} else {
			quiet = 0
		}
		if n < 64 || n&(n-1) != 0 {
			continue
		}
		at = append(at, sum)
		m := len(at)
		if m < 3 {
			continue
		}
		x := Aitken(at[m-3], at[m-2], at[m-1])
		if havePrev && math.Abs(x-prev) <= tol*math.Max(1, math.Abs(x)) {
			return Summed{Value: x, Terms: n, Tail: math.Abs(x - prev)}, nil
		}
		prev, havePrev = x, true
	}
	return Summed{Value: sum, Terms: s.From + maxTerms - 1, Tail: math.Inf(1)}, nil
}

// compile is the general coefficient as a function of n and the special
// ones as numbers.
func (s IndexedSum) compile(env Env) (coefFunc, map[int]float64, error) {
	g, err := compileCoef(s.General, env)
	if err != nil {
		return g, nil, err
	}
	special := map[int]float64{}
	for n, c := range s.Special {
		if special[n], err = c.Float(env); err != nil {
			return g, nil, err
		}
	}
	return g, special, nil
}

// Aitken is the limit Aitken's Δ² takes from three partial sums s0, s1, s2
// whose differences fall by a constant ratio: s2 − (s2 − s1)²/((s2 − s1) −
// (s1 − s0)); s2 where they do not fall.
func Aitken(s0, s1, s2 float64) float64 {
	if d := (s2 - s1) - (s1 - s0); d != 0 {
		return s2 - (s2-s1)*(s2-s1)/d
	}
	return s2
}
