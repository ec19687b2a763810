package series

import (
	"errors"
	"math/big"
)

// ErrFlux is SectorFluxes' answer for a term whose fluxes have no closed form
// here (a logarithm at the arc, a ray flux that diverges at the apex).
var ErrFlux = errors.New("no closed form for this term's flux")

// SectorFluxes are the outward fluxes of s through the sides of the sector
// r < R, 0 < θ < α: the arc, R·∫₀^α ∂s/∂r(R, θ) dθ; the ray θ = 0, whose
// outward normal is −θ̂, −∫₀^R (1/r)∂s/∂θ(r, 0) dr; and the ray θ = α,
// +∫₀^R (1/r)∂s/∂θ(r, α) dr. Per term C·r^p·(ln r)^L·θ^k·T(mθ) each is a
// radial moment times an angular factor, exactly where cos(mα) and sin(mα)
// are.
func (s Sum) SectorFluxes(radius, alpha Coef) (arc, start, end Coef, err error) {
	tr, err := s.DR().Trace(radius)
	if err != nil {
		return Coef{}, Coef{}, Coef{}, err
	}
	if arc, err = tr.AngleIntegral(alpha); err != nil {
		return Coef{}, Coef{}, Coef{}, err
	}
	arc = arc.Mul(radius)
	for _, t := range s.DTheta().Terms() {
		if t.C.IsZero() {
			continue
		}
		p := new(big.Rat).Sub(t.power(), big.NewRat(1, 1)) // (1/r)·r^p
		if p.Cmp(big.NewRat(-1, 1)) <= 0 {
			return Coef{}, Coef{}, Coef{}, ErrFlux
		}
		rad, err := radialMoment(p, t.L, radius)
		if err != nil {
			return Coef{}, Coef{}, Coef{}, err
		}
		// θ^k T(mθ) at θ = 0 and at θ = α.
		at0 := Coef{}
		if t.K == 0 && !t.Sin {
			at0 = IntCoef(1)
		}
		c, sn, ok := unitCircle(alpha.MulRat(big.NewRat(int64(t.M), 1)))
		if !ok {
			return Coef{}, Coef{}, Coef{}, ErrAngle
		}
		atA := c
		if t.Sin {
			atA = sn
		}
		if t.K > 0 {
			ak, err := alpha.Pow(big.NewRat(int64(t.K), 1))
			if err != nil {
				return Coef{}, Coef{}, Coef{}, err
			}
			atA = atA.Mul(ak)
		}
		start = start.Sub(t.C.Mul(rad).Mul(at0))
		end = end.Add(t.C.Mul(rad).Mul(atA))
	}
	return arc, start, end, nil
}

// SectorFluxes are the series' outward fluxes through the sector's arc and
// its rays θ = 0 and θ = α (α = aOverPi·π, ν_n·α = nπ + offset·α), mode by
// mode: for Φ = sin νθ or cos νθ, ∫₀^α Φ as in SectorIntegral times
// r·∂ρ/∂r at R (ν for (r/R)^ν, p·R^p for r^p); and ∓Φ′ at the ray times
// ∫₀^R ρ/r dr (1/ν, or the moment of r^(p−1)). ErrFlux for logarithms and
// for outward series.
func (s Series) SectorFluxes(aOverPi *big.Rat) (arc, start, end IndexedSum, err error) {
	if s.Inverse {
		return arc, start, end, ErrFlux
	}
	arc = IndexedSum{From: s.Family.From, Special: map[int]Coef{}}
	start = IndexedSum{From: s.Family.From, Special: map[int]Coef{}}
	end = IndexedSum{From: s.Family.From, Special: map[int]Coef{}}
	if arc.General, start.General, end.General, err = s.modeFluxes(s.General, aOverPi, IndexCoef, SignCoef); err != nil {
		return
	}
	for n, ts := range s.Special {
		sign := IntCoef(1 - 2*int64(((n%2)+2)%2))
		if arc.Special[n], start.Special[n], end.Special[n], err = s.modeFluxes(ts, aOverPi, IntCoef(int64(n)), sign); err != nil {
			return
		}
	}
	return arc, start, end, nil
}

func (s Series) modeFluxes(ts []RadialTerm, aOverPi *big.Rat, n, sign Coef) (arc, start, end Coef, err error) {
	nu := s.Family.Nu(n)
	if q, isRat := nu.Rat(); isRat && q.Sign() == 0 { // a constant mode: no flux
		return Coef{}, Coef{}, Coef{}, nil
	}
	cd, sd, ok := unitCircle(SymCoef(Pi).Mul(RatCoef(new(big.Rat).Mul(s.Family.Offset, aOverPi))))
	if !ok {
		return Coef{}, Coef{}, Coef{}, ErrAngle
	}
	// ∫₀^α Φ, Φ′(0) and Φ′(α): cos να = sign·cd, sin να = sign·sd.
	var angular, d0, dA Coef
	if s.Family.Sin {
		if angular, err = IntCoef(1).Sub(sign.Mul(cd)).Div(nu); err != nil {
			return
		}
		d0, dA = nu, nu.Mul(sign).Mul(cd)
	} else {
		if angular, err = sign.Mul(sd).Div(nu); err != nil {
			return
		}
		d0, dA = Coef{}, nu.Mul(sign).Mul(sd).MulRat(big.NewRat(-1, 1))
	}
	var rDr, inv Coef // r·∂ρ/∂r at R, and ∫₀^R ρ/r dr
	for _, t := range ts {
		if t.L != 0 {
			return Coef{}, Coef{}, Coef{}, ErrFlux
		}
		if t.Scaled {
			v, err := IntCoef(1).Div(nu)
			if err != nil {
				return Coef{}, Coef{}, Coef{}, err
			}
			rDr, inv = rDr.Add(t.C.Mul(nu)), inv.Add(t.C.Mul(v))
			continue
		}
		if t.P.Sign() <= 0 {
			return Coef{}, Coef{}, Coef{}, ErrFlux
		}
		rp, err := s.R.Pow(t.P)
		if err != nil {
			return Coef{}, Coef{}, Coef{}, err
		}
		m, err := radialMoment(new(big.Rat).Sub(t.P, big.NewRat(1, 1)), 0, s.R)
		if err != nil {
			return Coef{}, Coef{}, Coef{}, err
		}
		rDr, inv = rDr.Add(t.C.Mul(rp).MulRat(t.P)), inv.Add(t.C.Mul(m))
	}
	return rDr.Mul(angular), d0.Mul(inv).MulRat(big.NewRat(-1, 1)), dA.Mul(inv), nil
}
