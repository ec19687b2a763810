package domain

import (
	"fmt"
	"math"
	"math/big"
	"psol/ansatz"
	"psol/series"
	"strings"
)

// circleData reduces a circle's data to what the mode systems take: a
// trigonometric polynomial as it is; exact pieces (or powers of θ) on a
// region with one circle as the modes 0 and the exceptional n, the rest
// going to a series with exact general term; anything else by FFT.
func circleData(d circular, c circle, cond Condition, gf series.Field, tr series.Sum, p *posed, sol *Solution) (series.Sum, error) {
	if gf.IsExact() && !gf.Exact.HasAngle() && !p.numeric {
		return gf.Exact, nil
	}
	pieces := gf.Pieces
	if gf.IsExact() { // a polynomial in θ on [0, 2π)
		pieces = []series.Piece{{From: big.NewRat(0, 1), To: big.NewRat(2, 1), Value: gf}}
	}
	if len(d.circles()) == 1 && pieces != nil && !p.numeric {
		if fc, err := series.Fourier(pieces); err == nil {
			return seriesData(d, c, cond, series.Field{Pieces: pieces}, fc, tr, sol)
		}
	}
	if len(d.circles()) == 1 && !p.numeric && cond.Kind != Floating {
		// Kinked data c·|ℓ|: exact coefficients with a general term.
		if fc, ok := kinkedDataFourier(c, cond, p.env); ok {
			return seriesData(d, c, cond, gf, fc, tr, sol)
		}
	}
	if len(d.circles()) == 1 && !p.numeric {
		// Data with an exact general term (a point source's trace).
		if fc, ok := gf.FourierOn(c.radius); ok {
			return seriesData(d, c, cond, gf, fc, tr, sol)
		}
	}
	// The numeric fallback: sample the data on the circle.
	cf, err := gf.Compile(p.env)
	if err != nil {
		return series.Sum{}, unsupported("boundary data on %s need every parameter's value: %w", c.name, err)
	}
	R, err := c.radius.Float(p.env)
	if err != nil {
		return series.Sum{}, unsupported("boundary data on %s: %w", c.name, err)
	}
	// Between two circles the modes grow like (R2/R1)^n in the exact algebra's
	// r^n, r^−n form; fewer samples keep them representable.
	samples := series.MaxSamples
	if len(d.circles()) > 1 {
		samples = 512
	}
	nf := series.FourierFFTUpTo(func(th float64) float64 { return cf.At(R, th) }, p.tol, samples)
	if nf.NonFinite {
		return series.Sum{}, unsolvable("boundary data on %s are not a finite number at theta = %.6g (undefined there, or beyond float64's range)", c.name, nf.At)
	}
	if !nf.Met && nf.Tail > 0.5*nf.Peak {
		return series.Sum{}, unsolvable("boundary data on %s are too rough for %d samples: the neglected part of their Fourier series (about %.1e) is comparable with the data themselves (up to %.1e), so no answer would be worth printing (give the data as exact modes or pieces, or smoother)", c.name, nf.Samples, nf.Tail, nf.Peak)
	}
	if nf.Aliased {
		return series.Sum{}, unsolvable("boundary data on %s vary faster in theta than %d samples resolve: between the samples the data differ from every band-limited fit, so any answer would be aliased (give the data as exact modes, or smoother)", c.name, nf.Samples)
	}
	sol.Numeric = true
	sol.DataError += nf.Tail
	sol.Notes = append(sol.Notes, fmt.Sprintf("boundary data on %s: %s", c.name, nf.Describe()))
	return nf.Sum, nil
}

// seriesData splits exact Fourier coefficients: mode 0 and the exceptional n
// (those of the general form, of the trace, and of a singular Robin mode) go
// back as a trigonometric polynomial; every other n to the harmonic series,
// A_n/B_n with B_n the operator on (r/R)^n (or (R/r)^n outside): 1, n/R, n/R + h.
func seriesData(d circular, c circle, cond Condition, data series.Field, fc series.FourierCoefficients, tr series.Sum, sol *Solution) (series.Sum, error) {
	skip := map[int]bool{}
	for n := range fc.Special {
		skip[n] = true
	}
	for _, t := range tr.Terms() {
		if t.M > 0 {
			skip[t.M] = true
		}
	}
	if cond.Kind == Robin {
		if hr, ok := cond.H.Mul(c.radius).Rat(); ok && hr.Sign() < 0 && hr.IsInt() {
			skip[int(new(big.Int).Neg(hr.Num()).Int64())] = true
		}
	}
	closed := series.Const(fc.A0)
	for n := range skip {
		ab, ok := fc.Special[n]
		if !ok {
			a, err := series.Coefficient(fc.A, n)
			if err != nil {
				return series.Sum{}, unsupported("%w", err)
			}
			b, err := series.Coefficient(fc.B, n)
			if err != nil {
				return series.Sum{}, unsupported("%w", err)
			}
			ab = [2]series.Coef{a, b}
		}
		closed = closed.Add(series.Trig(n, false).Scale(ab[0])).Add(series.Trig(n, true).Scale(ab[1]))
	}
	inverse := c.outward < 0
	bn := series.IntCoef(1)
	if cond.Kind != Dirichlet {
		bn, _ = series.IndexCoef.Div(c.radius)
		if cond.Kind == Robin {
			bn = bn.Add(cond.H)
		}
	}
	var corr, harm []series.Series
	for i, general := range []series.Coef{fc.A, fc.B} {
		fam := series.Family{Sin: i == 1, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}
		special := map[int][]series.RadialTerm{}
		for n := range skip {
			special[n] = nil
		}
		coef, err := general.Div(bn)
		if err != nil {
			return series.Sum{}, err
		}
		sol.addSeriesResidual(c.name, coef.Mul(bn).Sub(general)) // the general term checked exactly
		corr = append(corr, series.Series{Family: fam, R: c.radius, Inverse: inverse, General: []series.RadialTerm{{C: general, P: new(big.Rat)}}, Special: special})
		harm = append(harm, series.Series{Family: fam, R: c.radius, Inverse: inverse, General: []series.RadialTerm{{C: coef, Scaled: true}}, Special: special})
	}
	jumps := data.Jumps()
	for _, j := range jumps {
		sol.Notes = append(sol.Notes, fmt.Sprintf("the data on %s jumps by %s at theta = %s; the series converges to the mean of the two sides there", c.name, j.Size.Text(), series.SymCoef(series.Pi).MulRat(j.At).Text()))
		sol.addCircleJump(c, j, nil)
	}
	ss := series.SeriesSum{Parts: harm, Inverse: inverse}
	if cond.Kind == Dirichlet && len(skip) == 0 && constantPieces(data) {
		// Piecewise-constant values: the series sums to arctangents, one per jump.
		sol.ClosedForm, sol.ClosedFormLaTeX = jumpClosedForm(jumps, c.radius, inverse)
	}
	if cond.Kind == Dirichlet && data.IsPiecewise() {
		// Near the rim, pieces' slowly converging series go by the Poisson
		// integral of the data; data given by their coefficients (a
		// kink's trace, falling like n⁻⁴) sum well as they are.
		ss.Jumps = jumps
		sol.stages = append(sol.stages, &rimData{data: data, trace: tr, radius: c.radius, inverse: inverse})
	}
	sol.Series = &SeriesParts{
		Correction: series.SeriesSum{Parts: corr},
		Harmonic:   ss,
		U:          ss,
		BySide:     map[string]series.SeriesSum{c.name: {Parts: corr}},
	}
	return closed, nil
}

// exactAngular reports data that have exact Fourier coefficients: a
// trigonometric polynomial, a polynomial in θ, or exact pieces.
func exactAngular(f series.Field) ([]series.Piece, bool) {
	switch {
	case f.IsExact():
		return []series.Piece{{From: big.NewRat(0, 1), To: big.NewRat(2, 1), Value: f}}, true
	case f.IsPiecewise() && f.ExactPieces():
		return f.Pieces, true
	}
	return nil, false
}

// twoCircleSeries handles an annulus whose data are exact but not both
// trigonometric polynomials. Per mode n the harmonic part is
// A_n (r/R2)^n + B_n (R1/r)^n, and the conditions give, with ρ = R1/R2,
//
//	inner: B_in[(r/R2)^n] = ρ^n·(1, −n/R1, −n/R1 + h),  B_in[(R1/r)^n] = (1, n/R1, n/R1 + h)
//	outer: B_out[(r/R2)^n] = (1, n/R2, n/R2 + h),        B_out[(R1/r)^n] = ρ^n·(1, −n/R2, −n/R2 + h)
//
// for Dirichlet, Neumann and Robin, solved by Cramer's rule with ρ^n an atom.
// Mode 0 and the exceptional n return as trigonometric polynomials for the
// mode systems. It returns nil where the data do not call for it.
func twoCircleSeries(d circular, p *posed, traced map[string]series.Field, traces map[string]series.Sum, sol *Solution) (map[string]series.Sum, error) {
	circles := d.circles()
	if len(circles) != 2 || p.numeric {
		return nil, nil
	}
	needed := false
	for _, c := range circles {
		if gf := traced[c.name]; !gf.IsExact() || gf.Exact.HasAngle() {
			needed = true
		}
	}
	if !needed {
		return nil, nil // trigonometric data on both circles: the mode systems take them as they are
	}
	fcs := map[string]series.FourierCoefficients{}
	for _, c := range circles {
		fc, ok := traced[c.name].FourierOn(c.radius)
		if !ok {
			return nil, nil // numeric data: the FFT path
		}
		fcs[c.name] = fc
	}
	inner, outer := circles[0], circles[1]
	rho, err := inner.radius.Div(outer.radius)
	if err != nil {
		return nil, err
	}
	P := series.PowIndex(rho)
	n := series.IndexCoef
	entry := func(c circle, scaledOuter bool) series.Coef {
		cond := p.conds[c.name]
		// The radial derivative of (r/R2)^n is (n/r)(r/R2)^n, of (R1/r)^n it is −(n/r)(R1/r)^n.
		deriv, _ := n.Div(c.radius)
		if !scaledOuter {
			deriv = deriv.Neg()
		}
		value := series.IntCoef(1)
		if (c.name == inner.name) == scaledOuter { // the far circle of this basis function
			value, deriv = P, deriv.Mul(P)
		}
		dn := deriv.MulRat(big.NewRat(c.outward, 1))
		switch cond.Kind {
		case Neumann:
			return dn
		case Robin:
			return dn.Add(cond.H.Mul(value))
		}
		return value
	}
	m00, m01 := entry(inner, true), entry(inner, false)
	m10, m11 := entry(outer, true), entry(outer, false)
	det := m00.Mul(m11).Sub(m01.Mul(m10))
	skip := map[int]bool{}
	for _, c := range circles {
		for k := range fcs[c.name].Special {
			skip[k] = true
		}
		for _, t := range traces[c.name].Terms() {
			if t.M > 0 {
				skip[t.M] = true
			}
		}
	}
	for k := 1; k <= 64; k++ { // a mode where the system is singular is solved apart
		if v, err := series.Coefficient(det, k); err != nil || v.IsZero() {
			skip[k] = true
		}
	}
	closed := map[string]series.Sum{}
	for _, c := range circles {
		fc := fcs[c.name]
		g := series.Const(fc.A0)
		for k := range skip {
			ab, ok := fc.Special[k]
			if !ok {
				a, err1 := series.Coefficient(fc.A, k)
				b, err2 := series.Coefficient(fc.B, k)
				if err1 != nil || err2 != nil {
					return nil, unsupported("mode %d of the data on %s has no exact value", k, c.name)
				}
				ab = [2]series.Coef{a, b}
			}
			g = g.Add(series.Trig(k, false).Scale(ab[0])).Add(series.Trig(k, true).Scale(ab[1]))
		}
		closed[c.name] = g
	}
	special := map[int][]series.RadialTerm{}
	for k := range skip {
		special[k] = nil
	}
	var harm []series.Series
	corr := map[string][]series.Series{}
	for i, pick := range []func(series.FourierCoefficients) series.Coef{
		func(f series.FourierCoefficients) series.Coef { return f.A },
		func(f series.FourierCoefficients) series.Coef { return f.B },
	} {
		fam := series.Family{Sin: i == 1, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}
		gi, go_ := pick(fcs[inner.name]), pick(fcs[outer.name])
		a, err := gi.Mul(m11).Sub(m01.Mul(go_)).Div(det)
		if err != nil {
			return nil, err
		}
		b, err := m00.Mul(go_).Sub(gi.Mul(m10)).Div(det)
		if err != nil {
			return nil, err
		}
		// The general term checked exactly: both conditions hold for every n.
		sol.addSeriesResidual(inner.name, m00.Mul(a).Add(m01.Mul(b)).Sub(gi))
		sol.addSeriesResidual(outer.name, m10.Mul(a).Add(m11.Mul(b)).Sub(go_))
		harm = append(harm,
			series.Series{Family: fam, R: outer.radius, General: []series.RadialTerm{{C: a, Scaled: true}}, Special: special},
			series.Series{Family: fam, R: inner.radius, Inverse: true, General: []series.RadialTerm{{C: b, Scaled: true}}, Special: special})
		for _, c := range circles {
			corr[c.name] = append(corr[c.name], series.Series{Family: fam, R: c.radius, General: []series.RadialTerm{{C: pick(fcs[c.name]), P: new(big.Rat)}}, Special: special})
		}
	}
	for _, c := range circles {
		for _, j := range traced[c.name].Jumps() {
			sol.Notes = append(sol.Notes, fmt.Sprintf("the data on %s jumps by %s at theta = %s; the series converges to the mean of the two sides there", c.name, j.Size.Text(), series.SymCoef(series.Pi).MulRat(j.At).Text()))
			sol.addCircleJump(c, j, p.env)
		}
	}
	ss := series.SeriesSum{Parts: harm}
	sol.Series = &SeriesParts{Harmonic: ss, U: ss, BySide: map[string]series.SeriesSum{}}
	for _, c := range circles {
		if p.conds[c.name].Kind == Dirichlet {
			sol.stages = append(sol.stages, &arcWall{data: traced[c.name], radius: c.radius, fullCircle: true})
		}
	}
	for name, parts := range corr {
		sol.Series.BySide[name] = series.SeriesSum{Parts: parts}
	}
	return closed, nil
}

func constantPieces(f series.Field) bool {
	for _, p := range f.Pieces {
		if _, ok := p.Value.Exact.Const(); !ok || !p.Value.IsExact() {
			return false
		}
	}
	return len(f.Pieces) > 0
}

// jumpClosedForm is Σ_j (J_j/π) arctan(ρ sin(θ − θ_j)/(1 − ρ cos(θ − θ_j))),
// ρ = r/R (R/r outside): the sum of Σ_n ρ^n J_j sin(n(θ − θ_j))/(πn), valid
// for ρ < 1 where 1 − ρ cos(·) > 0.
func jumpClosedForm(jumps []series.Jump, radius series.Coef, inverse bool) (string, string) {
	rho, rhoTeX := "r/"+paren(radius.Text()), `\frac{r}{`+radius.LaTeX()+"}"
	if inverse {
		rho, rhoTeX = paren(radius.Text())+"/r", `\frac{`+radius.LaTeX()+"}{r}"
	}
	if radius.Equal(series.IntCoef(1)) && !inverse {
		rho, rhoTeX = "r", "r"
	}
	var text, tex []string
	for _, j := range jumps {
		at := series.SymCoef(series.Pi).MulRat(j.At)
		phi, phiTeX := "theta", `\theta`
		if !at.IsZero() {
			phi, phiTeX = "theta - "+at.Text(), `\theta - `+at.LaTeX()
		}
		k, _ := j.Size.Div(series.SymCoef(series.Pi))
		sign := " + "
		if q, ok := k.Rat(); ok && q.Sign() < 0 || strings.HasPrefix(k.Text(), "-") {
			sign, k = " - ", k.Neg()
		}
		text = append(text, sign+fmt.Sprintf("%s*atan(%s*sin(%s)/(1 - %s*cos(%s)))", paren(k.Text()), rho, phi, rho, phi))
		tex = append(tex, sign+fmt.Sprintf(`%s \arctan\frac{%s \sin(%s)}{1 - %s \cos(%s)}`, k.LaTeX(), rhoTeX, phiTeX, rhoTeX, phiTeX))
	}
	t, x := strings.Join(text, ""), strings.Join(tex, "")
	return strings.TrimPrefix(t, " + "), strings.TrimPrefix(x, " + ")
}

// addCircleJump records a jump of Dirichlet data on a circle: |∇u| grows
// like 1/distance there (the circle's flux stays finite, its two sides'
// 1/distance cancelling).
func (s *Solution) addCircleJump(c circle, j series.Jump, env series.Env) {
	R, err := c.radius.Float(env)
	if err != nil {
		return
	}
	at, _ := j.At.Float64()
	th := at * math.Pi
	s.CornerJumps = append(s.CornerJumps, CornerJump{At: [2]float64{R * math.Cos(th), R * math.Sin(th)}, Sides: [2]string{c.name, c.name}})
}

// kinkedDataFourier is data that are a closed part plus kinks c·|ℓ| (ℓ
// linear in x and y, rational) as exact Fourier coefficients on the
// circle: the closed part's and each kink's (Kink.CircleAbs). The FFT
// took them to about 3e-4 (their coefficients fall like n⁻²).
func kinkedDataFourier(c circle, cond Condition, env series.Env) (series.FourierCoefficients, bool) {
	if cond.G.IsPiecewise() || cond.G.Rest == nil {
		return series.FourierCoefficients{}, false
	}
	kinks, left := ansatz.SplitKinks(cond.G.Rest, env)
	if len(kinks) == 0 || left != nil {
		return series.FourierCoefficients{}, false
	}
	total, ok := series.ExactField(cond.G.Exact).FourierOn(c.radius)
	if !ok {
		return total, false
	}
	for _, k := range kinks {
		if k.Step { // a step in the data is a jump: not a kink's coefficients
			return total, false
		}
		fc, ok := k.CircleAbs(c.radius)
		if !ok {
			return total, false
		}
		sum, err := total.Add(fc)
		if err != nil {
			return total, false
		}
		total = sum
	}
	return total, true
}
