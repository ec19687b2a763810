package series

import (
	"errors"
	"math/big"
)

// ErrAngle reports a sector angle whose trigonometric values psol cannot hold exactly.
var ErrAngle = errors.New("the sector angle must be a multiple of pi/12 for exact coefficients")

// Project is the coefficient of Φ_n in the expansion of θ^k·T(mθ) on
// (0, α), α = aOverPi·π: (1/N_n) ∫_0^α θ^k T(mθ) Φ_n(θ) dθ with
// N_n = ∫_0^α Φ_n² dθ. With n = IndexCoef (concrete false) the result is the
// general coefficient in n and (−1)^n; with concrete n it is exact for that n,
// including the n where a frequency m ∓ ν_n vanishes. The integrals use
//
//	C_k(λ) = ∫_0^α θ^k cos λθ dθ = α^k sin(λα)/λ − (k/λ) S_{k−1}(λ),   C_0 = sin(λα)/λ,
//	S_k(λ) = ∫_0^α θ^k sin λθ dθ = −α^k cos(λα)/λ + (k/λ) C_{k−1}(λ),  S_0 = (1 − cos λα)/λ,
//
// and cos(λα) = (−1)^n cos φ, sin(λα) = (−1)^n sin φ for λ = m + σν_n,
// ν_n α = nπ + δ, φ = mα + σδ.
func Project(k, m int, sin bool, fam Family, aOverPi *big.Rat, n int, concrete bool) (Coef, error) {
	alpha := SymCoef(Pi).MulRat(aOverPi)
	nc, sign := IndexCoef, SignCoef
	if concrete {
		nc = IntCoef(int64(n))
		sign = IntCoef(1 - 2*int64(((n%2)+2)%2))
	}
	nu := fam.Nu(nc)
	// δ = Offset·α/π·π must be a multiple of π/2; Slope·α must be π.
	if new(big.Rat).Mul(fam.Slope, aOverPi).Cmp(big.NewRat(1, 1)) != 0 {
		return Coef{}, errors.New("series: family does not match the angle")
	}
	deltaOverPi := new(big.Rat).Mul(fam.Offset, aOverPi)
	rule := trigProduct[b2i(sin)][b2i(fam.Sin)]
	x := sin != fam.Sin // the product's functions are sines
	total := Coef{}
	for _, part := range []struct {
		sigma int64
		w     int64
	}{{-1, rule.dif}, {1, rule.add}} {
		lambda := IntCoef(int64(m)).Add(nu.MulRat(big.NewRat(part.sigma, 1)))
		phiOverPi := new(big.Rat).Add(new(big.Rat).Mul(big.NewRat(int64(m), 1), aOverPi), new(big.Rat).Mul(big.NewRat(part.sigma, 1), deltaOverPi))
		cphi, sphi, ok := unitCircle(SymCoef(Pi).MulRat(phiOverPi))
		if !ok {
			return Coef{}, ErrAngle
		}
		j, err := thetaMoment(k, x, lambda, alpha, sign.Mul(cphi), sign.Mul(sphi))
		if err != nil {
			return Coef{}, err
		}
		total = total.Add(j.MulRat(big.NewRat(part.w, 2)))
	}
	norm := alpha.MulRat(big.NewRat(1, 2))
	if q, ok := nu.Rat(); ok && q.Sign() == 0 && !fam.Sin {
		norm = alpha
	}
	return total.Div(norm)
}

// thetaMoment is ∫_0^α θ^k cos λθ dθ (or sin), given cos λα and sin λα.
func thetaMoment(k int, sin bool, lambda, alpha, cosLA, sinLA Coef) (Coef, error) {
	if lambda.IsZero() {
		if sin {
			return Coef{}, nil
		}
		pw, _ := alpha.Pow(big.NewRat(int64(k+1), 1))
		return pw.MulRat(big.NewRat(1, int64(k+1))), nil
	}
	inv, err := IntCoef(1).Div(lambda)
	if err != nil {
		return Coef{}, err
	}
	c := sinLA.Mul(inv)                 // C_0
	s := IntCoef(1).Sub(cosLA).Mul(inv) // S_0
	for i := 1; i <= k; i++ {
		ai, _ := alpha.Pow(big.NewRat(int64(i), 1))
		ki := inv.MulRat(big.NewRat(int64(i), 1))
		c, s = ai.Mul(sinLA).Mul(inv).Sub(ki.Mul(s)), ai.Mul(cosLA).Mul(inv).Neg().Add(ki.Mul(c))
	}
	if sin {
		return s, nil
	}
	return c, nil
}
