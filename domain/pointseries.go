package domain

import (
	"math/big"

	"psol/series"
)

// Point sources on circles with no finite image system — a Robin rim, the
// two circles of an annulus — keep u_s as the sources' own logarithms, and
// give its trace on each circle exactly, as the Fourier series of the
// logarithm there (the real part of ln(1 − w) = −Σ w^n/n, |w| < 1):
//
//	ln|R e^{iθ} − ρ e^{iφ}| = ln R − Σ_{n≥1} (ρ/R)^n cos n(θ − φ)/n   (ρ < R)
//	                        = ln ρ − Σ_{n≥1} (R/ρ)^n cos n(θ − φ)/n   (ρ > R)
//
// with cos n(θ − φ) = cos nφ·cos nθ + sin nφ·sin nθ, and cos nφ, sin nφ exact
// atoms of the index (series.IndexTrig). The circles' solvers take these
// coefficients as they take any exact data, so the harmonic part keeps an
// exact general term and its check for every n.

// logSeriesName names the method in the printed stages.
const logSeriesName = "the logarithm's exact Fourier series"

// circleLogSeries is u_s with exact series traces on a disk or an annulus,
// for sources at rational points with rational strengths' positions and
// circles of rational radius; ok is false elsewhere (the numeric traces).
func circleLogSeries(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool) {
	var circles []circle
	switch r := d.(type) {
	case Disk:
		circles = r.circles()
	case Annulus:
		circles = r.circles()
	default:
		return nil, false
	}
	pp := &PointPart{Sources: pts, Logs: ownLogs(pts), Traces: map[string]series.Field{}, Expansion: logSeriesName}
	for _, c := range circles {
		cond, ok := conds[c.name]
		if !ok || cond.Kind == Floating {
			return nil, false
		}
		total := series.FourierCoefficients{Special: map[int][2]series.Coef{}}
		for _, p := range pts {
			fc, ok := logTrace(c, cond, p)
			if !ok {
				return nil, false
			}
			sum, err := total.Add(fc)
			if err != nil {
				return nil, false
			}
			total = sum
		}
		pp.Traces[c.name] = series.FourierField(total)
	}
	return pp, true
}

// logTrace is B[(Q/2π)·ln|z − z₀|] on the circle c as exact Fourier
// coefficients: the value's series above, and its radial derivative
//
//	(Q/2π)·(1/R + Σ (ρ/R)^n cos n(θ − φ)/R)   (ρ < R)
//	(Q/2π)·(−Σ (R/ρ)^n cos n(θ − φ)/R)        (ρ > R)
//
// times the circle's outward sign.
//
// A source lies inside the region, so inside the circle that bounds it from
// outside (outward normal +r) and outside a hole's circle: the radius may
// be a parameter.
func logTrace(c circle, cond Condition, p series.PointSource) (series.FourierCoefficients, bool) {
	x, okx := p.X.Rat()
	y, oky := p.Y.Rat()
	if !okx || !oky {
		return series.FourierCoefficients{}, false
	}
	rho2 := new(big.Rat).Add(new(big.Rat).Mul(x, x), new(big.Rat).Mul(y, y))
	inside := c.outward > 0 // the source inside the circle
	twoPi := series.IntCoef(2).Mul(series.SymCoef(series.Pi))
	k, err := p.Q.Div(twoPi)
	if err != nil {
		return series.FourierCoefficients{}, false
	}
	radius := c.radius
	invR, err := series.IntCoef(1).Div(radius)
	if err != nil {
		return series.FourierCoefficients{}, false
	}
	// The value: k·(ln max(R, ρ) − Σ m^n cos n(θ − φ)/n), m = min(R, ρ)/max(R, ρ).
	var value, deriv series.FourierCoefficients
	lnBig, err := radius.Ln()
	if !inside {
		var l series.Coef
		l, err = series.RatCoef(rho2).Ln()
		lnBig = l.MulRat(big.NewRat(1, 2))
	}
	if err != nil {
		return series.FourierCoefficients{}, false
	}
	value.A0 = k.Mul(lnBig)
	if inside {
		deriv.A0 = k.Mul(invR)
	}
	if rho2.Sign() != 0 {
		rho, err := series.RatCoef(rho2).Pow(big.NewRat(1, 2))
		if err != nil {
			return series.FourierCoefficients{}, false
		}
		m, err := rho.Div(radius) // ρ/R, or R/ρ outside the circle
		if !inside {
			m, err = radius.Div(rho)
		}
		if err != nil {
			return series.FourierCoefficients{}, false
		}
		cos, sin, ok := series.IndexTrig(p.X, p.Y)
		if !ok {
			return series.FourierCoefficients{}, false
		}
		mn := series.PowIndex(m)
		perN, _ := k.Mul(mn).Div(series.IndexCoef)
		value.A, value.B = perN.Mul(cos).Neg(), perN.Mul(sin).Neg()
		d := k.Mul(mn).Mul(invR)
		if !inside {
			d = d.Neg()
		}
		deriv.A, deriv.B = d.Mul(cos), d.Mul(sin)
	}
	deriv = deriv.Scale(series.IntCoef(c.outward))
	switch cond.Kind {
	case Dirichlet:
		return value, true
	case Neumann:
		return deriv, true
	case Robin:
		sum, err := deriv.Add(value.Scale(cond.H))
		return sum, err == nil
	}
	return series.FourierCoefficients{}, false
}
