package domain

import (
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"

	"psol/ansatz"
	"psol/series"
)

// circle is a boundary circle r = radius, with the outward normal along
// +r (outward = 1) or −r (outward = −1).
type circle struct {
	name    string
	radius  series.Coef
	outward int64
}

// apply is the condition's operator on s at this circle: u, ∂u/∂n or ∂u/∂n + h·u.
func (c circle) apply(cond Condition, s series.Sum) (series.Sum, error) {
	if cond.Kind == Dirichlet {
		return s.Trace(c.radius)
	}
	dn, err := s.DR().Trace(c.radius)
	if err != nil {
		return series.Sum{}, err
	}
	dn = dn.Scale(series.IntCoef(c.outward))
	if cond.Kind == Neumann {
		return dn, nil
	}
	v, err := s.Trace(c.radius)
	if err != nil {
		return series.Sum{}, err
	}
	return dn.Add(v.Scale(cond.H)), nil
}

// circular is a region bounded by circles about the origin. Its harmonic
// functions separate into modes ρ(r)·T(nθ); basis lists the admissible ρ.
type circular interface {
	Domain
	circles() []circle
	basis(n int) []series.Sum
	// admit refuses a source, or a particular solution, the region cannot take.
	admit(f, up series.Sum) error
	// inner and outer bound the region for area integrals (nil: centre, infinity).
	bounds() (inner, outer *series.Coef)
}

func rPow(q *big.Rat) series.Sum {
	return series.NewSum(series.Term{C: series.IntCoef(1), P: q})
}

func rInt(n int) series.Sum { return rPow(big.NewRat(int64(n), 1)) }

var lnR = series.NewSum(series.Term{C: series.IntCoef(1), L: 1})

// solveCircular is the pipeline for regions bounded by circles: the
// particular solution, each circle's trace and correction, and per angular
// mode an exact square system for the coefficients of the radial basis.
func solveCircular(d circular, p *posed) (*Solution, error) {
	up, rules, err := ansatz.Particular(p.f)
	if err != nil {
		return nil, err
	}
	if err := d.admit(p.f, up); err != nil {
		return nil, err
	}
	sol := &Solution{Domain: d, Source: p.f, Particular: up, Rules: rules}
	data := map[string]series.Sum{}
	traced := map[string]series.Field{}
	traces := map[string]series.Sum{}
	for _, c := range d.circles() {
		cond := p.conds[c.name]
		gf, err := cond.G.TraceField(c.radius)
		if err != nil {
			return nil, unsupported("boundary data on %s: %v", c.name, err)
		}
		tr, err := c.apply(cond, up)
		if err != nil {
			return nil, unsupported("trace on %s: %v", c.name, err)
		}
		traced[c.name], traces[c.name] = gf, tr
	}
	if p.rest != nil {
		if err := quadratureParticular(d, p, sol, traces); err != nil {
			return nil, err
		}
	}
	closedData, err := twoCircleSeries(d, p, traced, traces, sol)
	if err != nil {
		return nil, err
	}
	for _, c := range d.circles() {
		cond := p.conds[c.name]
		gf, tr := traced[c.name], traces[c.name]
		g, ok := closedData[c.name]
		if !ok {
			if g, err = circleData(d, c, cond, gf, tr, p, sol); err != nil {
				return nil, err
			}
		}
		corr := g.Sub(tr)
		side := Side{Condition: cond, At: c.radius.Text() + ", theta", AtLaTeX: "r=" + c.radius.LaTeX(), Data: g, Trace: tr, Correction: corr,
			DataText: gf.Text(), DataLaTeX: gf.LaTeX()}
		sol.Sides = append(sol.Sides, side)
		data[c.name] = corr
	}
	if err := harmonicModes(d, p, sol, data); err != nil {
		return nil, err
	}
	sol.U = up.Add(sol.Harmonic)
	if sol.Free != "" {
		c0 := d.circles()[0]
		u0, err := sol.U.Subst(series.Env{sol.Free: {}})
		if err == nil {
			tr, err := u0.Trace(c0.radius)
			if err == nil {
				sol.FreeMean = coefOf(tr, mode{}).Neg()
			}
		}
	}
	sol.Checks = verifyCircular(d, sol, p.conds)
	if sol.Quadrature != nil {
		sol.Checks[0].Name = "lap(u_p) - f (the closed part)"
		sol.Checks = append(sol.Checks, quadratureCheck(d, sol, p.env))
	}
	for i := range sol.Checks {
		if r, ok := sol.seriesResidual[sol.Checks[i].Side]; ok {
			sol.Checks[i].Residual = sol.Checks[i].Residual.Add(series.Const(r))
		}
	}
	return sol, nil
}

// mode is one angular mode: cos(nθ) or sin(nθ).
type mode struct {
	n   int
	sin bool
}

func (m mode) trig() series.Sum { return series.Trig(m.n, m.sin) }

func (m mode) name() string {
	if m.n == 0 {
		return "constant"
	}
	return m.trig().Text()
}

// coefOf is the coefficient of T(nθ) in a θ-only sum.
func coefOf(s series.Sum, m mode) series.Coef {
	for _, t := range s.Terms() {
		if t.M == m.n && t.Sin == m.sin && t.P.Sign() == 0 && t.L == 0 && t.K == 0 {
			return t.C
		}
	}
	return series.Coef{}
}

func harmonicModes(d circular, p *posed, sol *Solution, data map[string]series.Sum) error {
	circles := d.circles()
	modes := map[mode]bool{{0, false}: true} // mode 0 always: it may carry a free constant
	for _, c := range circles {
		for _, t := range data[c.name].Terms() {
			modes[mode{t.M, t.Sin}] = true
		}
	}
	var order []mode
	for m := range modes {
		order = append(order, m)
	}
	sortModes(order)
	harmonic := sol.Harmonic.Terms() // built once, at the end
	defer func() { sol.Harmonic = series.NewSum(harmonic...) }()
	for _, m := range order {
		basis := d.basis(m.n)
		a := make([][]series.Coef, len(circles))
		b := make([]series.Coef, len(circles))
		for i, c := range circles {
			for _, fn := range basis {
				v, err := c.apply(p.conds[c.name], fn)
				if err != nil {
					return err
				}
				k, _ := v.Const()
				a[i] = append(a[i], k)
			}
			b[i] = coefOf(data[c.name], m)
		}
		x, free, ok := solveLinear(a, b)
		if !ok && sol.Quadrature != nil {
			// Data and a source integral by quadrature can agree only in
			// decimals: a mismatch at that level is the quadrature's, not
			// the problem's, and goes into the error estimate.
			scale := 0.0
			for _, side := range sol.Sides {
				for _, part := range []series.Sum{side.Data, side.Trace} {
					if v, err := coefOf(part, m).Float(p.env); err == nil {
						scale = math.Max(scale, math.Abs(v))
					}
				}
			}
			if gap, small := numericGap(b, scale, p.env); small {
				b = make([]series.Coef, len(b))
				x, free, ok = solveLinear(a, b)
				sol.DataError += gap
			}
		}
		if !ok {
			return singular(d, p, sol, m)
		}
		for j, fn := range basis {
			harmonic = append(harmonic, fn.Mul(m.trig()).Scale(x[j]).Terms()...)
		}
		for _, j := range free {
			if m.n == 0 && j == 0 { // the constant: pure Neumann data leave it free
				used := map[string]bool{}
				p.f.Params(used)
				for _, c := range p.conds {
					c.G.Exact.Params(used)
				}
				sol.Free = freeName(used)
				harmonic = append(harmonic, series.Const(series.SymCoef(series.Param(sol.Free))).Terms()...)
				sol.Notes = append(sol.Notes, fmt.Sprintf("pure Neumann data fix u only up to an additive constant %s", sol.Free))
				continue
			}
			sol.Notes = append(sol.Notes, fmt.Sprintf("mode %s is not determined by the conditions; its free coefficient is taken as 0", m.name()))
		}
		if !allZero(b) {
			sol.modes = append(sol.modes, modeRecord{m, basis, x})
		}
	}
	return nil
}

func allZero(cs []series.Coef) bool {
	for _, c := range cs {
		if !c.IsZero() {
			return false
		}
	}
	return true
}

// modeRecord is how one mode's coefficients were found, printed only on request.
type modeRecord struct {
	m     mode
	basis []series.Sum
	x     []series.Coef
}

func modeStep(m mode, basis []series.Sum, x []series.Coef) string {
	s := "harmonic mode " + m.name() + ":"
	for j, fn := range basis {
		if j > 0 {
			s += ","
		}
		s += fmt.Sprintf(" coefficient of %s = %s", fn.Text(), x[j].Text())
	}
	return s
}

func sortModes(ms []mode) {
	for i := 1; i < len(ms); i++ {
		for j := i; j > 0 && (ms[j].n < ms[j-1].n || ms[j].n == ms[j-1].n && !ms[j].sin && ms[j-1].sin); j-- {
			ms[j], ms[j-1] = ms[j-1], ms[j]
		}
	}
}

// numericGap is the largest |b_i|, and whether it is within 1e-9 of scale,
// the size of the data and traces it is the difference of: then it is the
// rounding of decimal traces of a numeric particular solution (or of a
// source integral by quadrature) rather than incompatible data.
func numericGap(b []series.Coef, scale float64, env series.Env) (float64, bool) {
	gap := 0.0
	for _, c := range b {
		v, err := c.Float(env)
		if err != nil {
			return 0, false
		}
		gap = math.Max(gap, math.Abs(v))
	}
	return gap, gap <= 1e-9*scale
}

// singular explains a mode whose system has no solution.
func singular(d circular, p *posed, sol *Solution, m mode) error {
	allNeumann := true
	for _, c := range p.conds {
		allNeumann = allNeumann && c.Kind == Neumann
	}
	if m.n == 0 && allNeumann {
		// ∮ ∂u/∂n ds = ∬ f dA (the divergence theorem) is what mode 0 asks.
		flux := series.Coef{}
		for _, s := range sol.Sides {
			for _, c := range d.circles() {
				if c.name == s.Condition.Side {
					flux = flux.Add(coefOf(s.Data, m).Mul(c.radius).Mul(series.SymCoef(series.Pi)).MulRat(big.NewRat(2, 1)))
				}
			}
		}
		in, out := d.bounds()
		src, err := p.f.AreaIntegral(in, out)
		if err != nil {
			return unsolvable("the Neumann data is incompatible with the source (mode 0 of the correction does not vanish)")
		}
		extra := ""
		if out == nil {
			extra = " (outside a circle the ln r term that could carry the difference is unbounded)"
		}
		srcText := src.Text()
		if sol.Quadrature != nil {
			if v, err := src.Float(p.env); err == nil {
				g, _ := sol.Quadrature.Integrals(0, 2*math.Pi)
				srcText = fmt.Sprintf("%.12g (by quadrature for %s)", v+g, p.rest.Text())
			}
		}
		return unsolvable("the Neumann data is incompatible with the source: the net outward flux of the data is %s but the source integral is %s; they must be equal%s", flux.Text(), srcText, extra)
	}
	for _, c := range d.circles() {
		cond := p.conds[c.name]
		if cond.Kind != Robin {
			continue
		}
		// On r = R the operator takes r^(±n) to R^(±n)·(±n/R·outward + h).
		for _, fn := range d.basis(m.n) {
			v, err := c.apply(cond, fn)
			if k, _ := v.Const(); err == nil && k.IsZero() {
				return unsolvable("the Robin condition on %s (h = %s, radius %s) is singular for mode %s: the operator annihilates %s there, and the correction has a component in that mode", c.name, cond.H.Text(), c.radius.Text(), m.name(), fn.Text())
			}
		}
	}
	return unsolvable("the boundary conditions are singular for mode %s, and the correction has a component there", m.name())
}

// solveLinear solves the square system a·x = b exactly by Gaussian
// elimination. A column with no pivot is a free unknown, set to 0 and
// listed; ok is false when the system is inconsistent.
func solveLinear(a [][]series.Coef, b []series.Coef) (x []series.Coef, free []int, ok bool) {
	n := len(a[0])
	rows := len(a)
	m := make([][]series.Coef, rows)
	for i := range a {
		m[i] = append(append([]series.Coef(nil), a[i]...), b[i])
	}
	pivotCol := make([]int, 0, n)
	r := 0
	for c := 0; c < n && r < rows; c++ {
		p := -1
		for i := r; i < rows; i++ {
			if !m[i][c].IsZero() {
				p = i
				break
			}
		}
		if p < 0 {
			free = append(free, c)
			continue
		}
		m[r], m[p] = m[p], m[r]
		for i := 0; i < rows; i++ {
			if i == r || m[i][c].IsZero() {
				continue
			}
			k, _ := m[i][c].Div(m[r][c])
			for j := c; j <= n; j++ {
				m[i][j] = m[i][j].Sub(k.Mul(m[r][j]))
			}
		}
		pivotCol = append(pivotCol, c)
		r++
	}
	for c := len(pivotCol) + len(free); c < n; c++ {
		free = append(free, c)
	}
	for i := r; i < rows; i++ {
		if !m[i][n].IsZero() {
			return nil, nil, false
		}
	}
	x = make([]series.Coef, n)
	for i, c := range pivotCol {
		x[c], _ = m[i][n].Div(m[i][c])
	}
	return x, free, true
}

// verifyCircular reduces Δu − f and each boundary residual exactly.
func verifyCircular(d circular, sol *Solution, conds map[string]Condition) []Check {
	checks := []Check{{Name: "lap(u) - f", Exact: true, Residual: sol.U.Laplacian().Sub(sol.Source)}}
	for i, c := range d.circles() {
		cond := conds[c.name]
		b, err := c.apply(cond, sol.U)
		res := b.Sub(sol.Sides[i].Data)
		if sol.Quadrature != nil {
			// The numeric particular's trace is in the correction: check the
			// harmonic part against it exactly, and the whole solution below.
			b, err = c.apply(cond, sol.Harmonic)
			res = b.Sub(sol.Sides[i].Correction)
		}
		if err != nil {
			res = series.Sum{}
		}
		checks = append(checks, Check{Name: OperatorText(cond, "u") + " - g", Side: c.name, Exact: err == nil, Residual: res})
	}
	return checks
}

// quadratureCheck is the largest |Δu_q − f_q| of the numeric particular
// solution u_q of the source's part f_q with no closed form, on a sample of
// interior points, by finite differences with one Richardson step: an
// independent look at the quadrature (the rest is verified exactly).
func quadratureCheck(d Domain, sol *Solution, env series.Env) Check {
	out := Check{Name: "lap(u_q) - f_q (sampled, the numeric part)"}
	fc, err := series.Field{Rest: sol.Rest}.Compile(env)
	if err != nil {
		return out
	}
	pts, err := d.samples(env)
	if err != nil {
		return out
	}
	u := func(r, theta float64) float64 { v, _ := sol.Quadrature.At(r, theta); return v }
	for k, p := range pts {
		if k%4 != 0 {
			continue
		}
		// A polar stencil: its points share five radii, and the quadrature
		// evaluates every mode of a radius at once.
		r, th := p[0], p[1]
		h := 3e-3 * r
		centre := u(r, th)
		lap := func(h float64) float64 {
			k := h / r
			out, in := u(r+h, th), u(r-h, th)
			return (out-2*centre+in)/(h*h) + (out-in)/(2*h*r) + (u(r, th+k)-2*centre+u(r, th-k))/(r*r*k*k)
		}
		fd := (4*lap(h/2) - lap(h)) / 3
		out.Numeric = math.Max(out.Numeric, math.Abs(fd-fc.At(p[0], p[1])))
	}
	return out
}

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
	// The numeric fallback: sample the data on the circle.
	cf, err := gf.Compile(p.env)
	if err != nil {
		return series.Sum{}, unsupported("boundary data on %s: %v (numeric data needs every parameter's value: --let)", c.name, err)
	}
	R, err := c.radius.Float(p.env)
	if err != nil {
		return series.Sum{}, unsupported("boundary data on %s: %v", c.name, err)
	}
	// Between two circles the modes grow like (R2/R1)^n in the exact algebra's
	// r^n, r^−n form; fewer samples keep them representable.
	samples := series.MaxSamples
	if len(d.circles()) > 1 {
		samples = 512
	}
	nf := series.FourierFFTUpTo(func(th float64) float64 { return cf.At(R, th) }, p.tol, samples)
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
				return series.Sum{}, unsupported("%v", err)
			}
			b, err := series.Coefficient(fc.B, n)
			if err != nil {
				return series.Sum{}, unsupported("%v", err)
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
	}
	ss := series.SeriesSum{Parts: harm, Inverse: inverse}
	if cond.Kind == Dirichlet && len(skip) == 0 && constantPieces(data) {
		// Piecewise-constant values: the series sums to arctangents, one per jump.
		sol.ClosedForm, sol.ClosedFormLaTeX = jumpClosedForm(jumps, c.radius, inverse)
	}
	if cond.Kind == Dirichlet {
		ss.Jumps = jumps
		sol.rim = &rimData{data: data, trace: tr, radius: c.radius, inverse: inverse}
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
		pieces, ok := exactAngular(traced[c.name])
		if !ok {
			return nil, nil // numeric data: the FFT path
		}
		fc, err := series.Fourier(pieces)
		if err != nil {
			return nil, nil
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
		}
	}
	ss := series.SeriesSum{Parts: harm}
	sol.Series = &SeriesParts{Harmonic: ss, U: ss, BySide: map[string]series.SeriesSum{}}
	for name, parts := range corr {
		sol.Series.BySide[name] = series.SeriesSum{Parts: parts}
	}
	return closed, nil
}

func (s *Solution) addSeriesResidual(side string, r series.Coef) {
	if s.seriesResidual == nil {
		s.seriesResidual = map[string]series.Coef{}
	}
	s.seriesResidual[side] = s.seriesResidual[side].Add(r)
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

func paren(s string) string {
	if strings.ContainsAny(s, " +-/*") {
		return "(" + s + ")"
	}
	return s
}

// quadratureParticular adds to each circle's trace that of the numeric
// particular solution of the source's remaining part (ansatz.Quadrature),
// mode by mode under the circle's operator.
func quadratureParticular(d circular, p *posed, sol *Solution, traces map[string]series.Sum) error {
	cf, err := series.Field{Rest: p.rest}.Compile(p.env)
	if err != nil {
		return unsupported("the source %s needs every parameter's value (--let): %v", p.rest.Text(), err)
	}
	in, out := d.bounds()
	a := 0.0
	if in != nil {
		if a, err = in.Float(p.env); err != nil {
			return err
		}
	}
	R := math.Inf(1)
	if out != nil {
		if R, err = out.Float(p.env); err != nil {
			return err
		}
	}
	q := &ansatz.Quadrature{G: cf.At, A: a, R: R, Tol: p.tol}
	if err := q.Prepare(); err != nil {
		return unsolvable("%s: %v", p.rest.Text(), err)
	}
	sol.Quadrature, sol.Rest, sol.Numeric = q, p.rest, true
	for _, c := range d.circles() {
		r, err := c.radius.Float(p.env)
		if err != nil {
			return err
		}
		pm, dpm, _ := q.Mode(r)
		cond := p.conds[c.name]
		qerr := q.TraceError(r, cond.Kind != Dirichlet)
		h := 0.0
		if cond.Kind == Robin {
			if h, err = cond.H.Float(p.env); err != nil {
				return unsupported("the Robin coefficient needs a value for the numeric source: %v", err)
			}
		}
		var terms []series.Term
		for m := range pm {
			for k := 0; k < 2; k++ {
				v := pm[m][k]
				switch cond.Kind {
				case Neumann:
					v = float64(c.outward) * dpm[m][k]
				case Robin:
					v = float64(c.outward)*dpm[m][k] + h*pm[m][k]
				}
				if m == 0 && k == 1 {
					continue
				}
				terms = append(terms, series.Term{C: decimal(v), M: m, Sin: k == 1})
			}
		}
		traces[c.name] = traces[c.name].Add(series.NewSum(terms...))
		sol.DataError += qerr
	}
	sol.Notes = append(sol.Notes, fmt.Sprintf("the source part %s has no closed form: its particular solution is by quadrature (FFT in theta with %d samples, modes up to %d; Gauss–Legendre in r)", p.rest.Text(), q.Samples, q.Modes))
	return nil
}

// decimal is x rounded to 15 digits as an exact decimal.
func decimal(x float64) series.Coef {
	if x == 0 || math.IsNaN(x) {
		return series.Coef{}
	}
	q, _ := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', 15, 64))
	return series.RatCoef(q)
}
