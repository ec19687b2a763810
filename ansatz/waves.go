package ansatz

import (
	"psol/series"
	"psol/series/cart"
)

// addends are the terms of a remainder's top-level sum.
func addends(e *series.Expr) []*series.Expr {
	if e == nil {
		return nil
	}
	if e.Op() == "+" {
		return append(addends(e.Args()[0]), addends(e.Args()[1])...)
	}
	return []*series.Expr{e}
}

// WaveSplit is a source's remainder (its part with no polynomial form in x
// and y) as the Cartesian wave ansatz takes it, addend by addend.
type WaveSplit struct {
	// Waves is the particular solution of Source, exponentials and
	// trigonometric functions of x and y times polynomials.
	Waves cart.Waves
	// Source is the part of the remainder the waves solve, less Poly.
	Source cart.Waves
	// Poly is the polynomial the wave solve leaves over: it joins the
	// source's polynomial part, whose particular solution is exact.
	Poly cart.Poly
	// Rest is the sum of the addends no ansatz closes (nil when none), for
	// the quadrature; Err is why the first of them was refused.
	Rest *series.Expr
	Err  error
}

// SplitWaves takes each addend of rest through the wave ansatz
// (cart.FromExpr, then Waves.Particular); force sends every addend to Rest
// (for comparing the quadrature with the exact path).
func SplitWaves(rest *series.Expr, force bool) WaveSplit {
	var out WaveSplit
	for _, term := range addends(rest) {
		var err error
		var src, u cart.Waves
		var poly cart.Poly
		if !force {
			if src, err = cart.FromExpr(term); err == nil {
				u, poly, err = src.Particular()
			}
		}
		if force || err != nil {
			out.Rest = series.Field{Rest: out.Rest}.Add(series.Field{Rest: term}).Rest
			if out.Err == nil {
				out.Err = err
			}
			continue
		}
		out.Waves, out.Poly = out.Waves.Add(u), out.Poly.Add(poly)
		out.Source = out.Source.Add(src.Add(cart.Waves{{Cos: poly.Scale(series.IntCoef(-1))}}))
	}
	return out
}

// Residual is Δ(Waves) − Source reduced exactly: empty when the waves solve
// their part of the source.
func (w WaveSplit) Residual() cart.Waves {
	return w.Waves.Laplacian().Add(w.Source.Scale(cart.Monomial(series.IntCoef(-1), 0, 0)))
}
