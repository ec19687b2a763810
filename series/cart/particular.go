package cart

import "psol/series"

// Particular is a polynomial u_p with Δu_p = f, built by the terminating
// inverse series
//
//	u_p = F − G + ...,  F = (∂x^−2 f − its chord in x), G = ∂x^−2 ∂y² F, ...
//
// where each ∂x^−2 is followed by subtracting the chord through x = 0 and
// x = L, so that every stage, and u_p, vanishes on x = 0 and x = L. The
// y-degree falls by two at each stage, so the series ends. For f = −1 this
// gives the parabola x(L − x)/2 that already meets the walls x = 0, L.
func Particular(f Poly, L series.Coef) Poly {
	var u Poly
	stage := f
	sign := series.IntCoef(1)
	for k := 0; !stage.IsZero() && k < 64; k++ {
		F := vanishAtEnds(stage.AntiXX(), L)
		u = u.Add(F.Scale(sign))
		stage = F.DY().DY()
		sign = sign.Neg()
	}
	return u
}

// vanishAtEnds subtracts the chord that matches F at x = 0 and x = L:
// F − F(0, y) − x (F(L, y) − F(0, y))/L, still with ∂²/∂x² unchanged.
func vanishAtEnds(F Poly, L series.Coef) Poly {
	zero := series.Coef{}
	f0 := F.AtX(zero)
	fL := F.AtX(L)
	inv, _ := series.IntCoef(1).Div(L)
	return F.Sub(f0).Sub(X.Mul(fL.Sub(f0)).Scale(inv))
}

// ParticularAlongY is Particular with the roles of x and y exchanged: u_p
// vanishes on y = 0 and y = H. A long rectangle takes its particular
// solution across its short side, so that the side series left to correct
// it live on the short sides and decay fast along the long one.
func ParticularAlongY(f Poly, H series.Coef) Poly {
	return Particular(f.SwapXY(), H).SwapXY()
}
