package series

import (
	"errors"
	"math/big"
)

// nTrig is (cos(qπn), sin(qπn)) for the index n, reduced: q taken mod 2 into
// [0, 1] by cos(2πn − x) = cos x and sin(2πn − x) = −sin x; q = 0 and q = 1
// give 1 and (−1)^n, other q the atoms cos(qπn) and sin(qπn).
func nTrig(q *big.Rat) (Coef, Coef) {
	q = new(big.Rat).Sub(q, new(big.Rat).SetInt(floorRat(new(big.Rat).Quo(q, ratTwo))).Mul(new(big.Rat).SetInt(floorRat(new(big.Rat).Quo(q, ratTwo))), ratTwo))
	sign := int64(1)
	if q.Cmp(one) > 0 {
		q, sign = new(big.Rat).Sub(ratTwo, q), -1
	}
	switch {
	case q.Sign() == 0:
		return IntCoef(1), Coef{}
	case q.Cmp(one) == 0:
		return SignCoef, Coef{}
	}
	name := q.RatString()
	return SymCoef(Symbol{kindCosN, name}), SymCoef(Symbol{kindSinN, name}).MulRat(big.NewRat(sign, 1))
}

// FourierCoefficients are the Fourier coefficients of boundary data on
// [0, 2π): g = A0 + Σ_{n≥1} (A_n cos nθ + B_n sin nθ), with A_n and B_n
// general in n (and (−1)^n, cos(qπn), sin(qπn)) except at the listed n.
type FourierCoefficients struct {
	A0      Coef
	A, B    Coef
	Special map[int][2]Coef // n → (A_n, B_n) where the general form fails
}

// ErrNotExactPieces reports data outside the exact class.
var ErrNotExactPieces = errors.New("boundary data outside the exact class")

// Fourier computes the coefficients of exact pieces in θ (each piece a sum of
// θ^k cos(mθ), θ^k sin(mθ)), break points at multiples of π/12:
// A_n = (1/π) Σ ∫ g cos nθ dθ, B_n = (1/π) Σ ∫ g sin nθ dθ, A0 = (1/2π) Σ ∫ g dθ.
func Fourier(ps []Piece) (FourierCoefficients, error) {
	out := FourierCoefficients{Special: map[int][2]Coef{}}
	specials := map[int]bool{}
	for _, p := range ps {
		if !p.Value.IsExact() {
			return out, ErrNotExactPieces
		}
		for _, t := range p.Value.Exact.t {
			if t.power().Sign() != 0 || t.L != 0 {
				return out, ErrNotExactPieces
			}
			if t.M > 0 {
				specials[t.M] = true
			}
		}
	}
	// On [0, 2π) with Φ_n = cos nθ, sin nθ the projection's normalisation is
	// π (2π for n = 0): the coefficients are projections on that family.
	whole := big.NewRat(2, 1)
	cosines := Family{Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 0}
	sines := Family{Sin: true, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}
	var err error
	if out.A0, err = ProjectPieces(ps, cosines, whole, 0, true); err != nil {
		return out, err
	}
	if out.A, err = ProjectPieces(ps, cosines, whole, 0, false); err != nil {
		return out, err
	}
	if out.B, err = ProjectPieces(ps, sines, whole, 0, false); err != nil {
		return out, err
	}
	for n := range specials {
		a, err := ProjectPieces(ps, cosines, whole, n, true)
		if err != nil {
			return out, err
		}
		b, err := ProjectPieces(ps, sines, whole, n, true)
		if err != nil {
			return out, err
		}
		out.Special[n] = [2]Coef{a, b}
	}
	return out, nil
}

// ProjectPieces is the coefficient of Φ_n in the expansion on (0, α) of data
// given by exact pieces (those beyond α are ignored): (1/N_n) Σ ∫ g Φ_n dθ,
// N_n = ∫_0^α Φ_n² dθ, α = aOverPi·π. It is general in n unless concrete.
func ProjectPieces(ps []Piece, fam Family, aOverPi *big.Rat, n int, concrete bool) (Coef, error) {
	nc := IndexCoef
	if concrete {
		nc = IntCoef(int64(n))
	}
	nu := fam.Nu(nc)
	total := Coef{}
	for _, p := range ps {
		lo, hi := p.From, p.To
		if lo.Cmp(aOverPi) >= 0 {
			continue
		}
		if hi.Cmp(aOverPi) > 0 {
			hi = aOverPi
		}
		if !p.Value.IsExact() {
			return Coef{}, ErrNotExactPieces
		}
		for _, t := range p.Value.Exact.t {
			if t.power().Sign() != 0 || t.L != 0 {
				return Coef{}, ErrNotExactPieces
			}
			rule := trigProduct[b2i(t.Sin)][b2i(fam.Sin)]
			x := t.Sin != fam.Sin
			for _, part := range []struct{ sigma, w int64 }{{-1, rule.dif}, {1, rule.add}} {
				if part.w == 0 {
					continue
				}
				lambda := IntCoef(int64(t.M)).Add(nu.MulRat(big.NewRat(part.sigma, 1)))
				v := Coef{}
				for i, end := range []*big.Rat{lo, hi} {
					m, err := familyEndMoment(t.K, x, t.M, part.sigma, lambda, end, fam, n, concrete)
					if err != nil {
						return Coef{}, err
					}
					if i == 0 {
						m = m.Neg()
					}
					v = v.Add(m)
				}
				total = total.Add(v.Mul(t.C).MulRat(big.NewRat(part.w, 2)))
			}
		}
	}
	norm := SymCoef(Pi).MulRat(aOverPi).MulRat(big.NewRat(1, 2))
	if q, ok := nu.Rat(); ok && q.Sign() == 0 && !fam.Sin {
		norm = SymCoef(Pi).MulRat(aOverPi)
	}
	return total.Div(norm)
}

// familyEndMoment is ∫_0^{qπ} θ^k T(λθ) dθ for λ = m + σν_n, ν_n = Slope·n + Offset:
// λqπ = φ + σ·Slope·q·nπ with the fixed phase φ = (m + σ·Offset)qπ.
func familyEndMoment(k int, sin bool, m int, sigma int64, lambda Coef, q *big.Rat, fam Family, n int, concrete bool) (Coef, error) {
	end := SymCoef(Pi).MulRat(q)
	phase := new(big.Rat).Add(big.NewRat(int64(m), 1), new(big.Rat).Mul(big.NewRat(sigma, 1), fam.Offset))
	cp, sp, ok := unitCircle(end.MulRat(phase))
	if !ok {
		return Coef{}, ErrAngle
	}
	rate := new(big.Rat).Mul(fam.Slope, q) // the angle's multiple of nπ
	var cn, sn Coef
	if concrete {
		cn, sn, ok = unitCircle(SymCoef(Pi).MulRat(new(big.Rat).Mul(rate, big.NewRat(int64(n), 1))))
		if !ok {
			return Coef{}, ErrAngle
		}
	} else {
		cn, sn = nTrig(rate)
	}
	sn = sn.MulRat(big.NewRat(sigma, 1))
	cosL := cp.Mul(cn).Sub(sp.Mul(sn))
	sinL := sp.Mul(cn).Add(cp.Mul(sn))
	return thetaMoment(k, sin, lambda, end, cosL, sinL)
}

// SineCoefficient is the general term b_n = (2/L) ∫_0^L p(s) sin(nπs/L) ds of
// the sine series on [0, L] of the polynomial p(s) = Σ_k c_k s^k (the
// rectangle's side expansions); cos(nπ) = (−1)^n and sin(nπ) = 0.
func SineCoefficient(c []Coef, L Coef) (Coef, error) {
	lambda, err := IndexCoef.Mul(SymCoef(Pi)).Div(L)
	if err != nil {
		return Coef{}, err
	}
	total := Coef{}
	for k, ck := range c {
		if ck.IsZero() {
			continue
		}
		m, err := thetaMoment(k, true, lambda, L, SignCoef, Coef{})
		if err != nil {
			return Coef{}, err
		}
		total = total.Add(m.Mul(ck))
	}
	two, _ := IntCoef(2).Div(L)
	return total.Mul(two), nil
}
