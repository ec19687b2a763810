package domain

import (
	"fmt"
	"math"
	"math/big"

	"psol/ansatz"
	"psol/series"
)

// Sector is the region r < R, 0 < θ < Alpha, with Alpha a rational multiple of π.
type Sector struct{ R, Alpha series.Coef }

func (Sector) Sides() []string { return []string{"arc", "start", "end"} }

func (s Sector) Describe() string {
	return "the sector r < " + s.R.Text() + ", 0 < theta < " + s.Alpha.Text()
}

func (s Sector) Contains(r, theta float64, env series.Env) (bool, error) {
	R, err := s.R.Float(env)
	if err != nil {
		return false, err
	}
	a, _ := s.Alpha.Float(nil)
	return r <= R*(1+1e-12) && theta >= -1e-12 && theta <= a+1e-12, nil
}

// AlphaOverPi is α/π, when α is a rational multiple of π.
func AlphaOverPi(alpha series.Coef) (*big.Rat, bool) {
	q, err := alpha.Div(series.SymCoef(series.Pi))
	if err != nil {
		return nil, false
	}
	return q.Rat()
}

// SeriesParts are the infinite-series stages of a sector solution; the
// shift w (a harmonic that carries constant ray values) is in Solution.Harmonic.
type SeriesParts struct {
	Particular series.SeriesSum // mode by mode (a sector's terms the closed form cannot take)
	Trace      series.SeriesSum // the boundary operator applied to it
	Correction series.SeriesSum // data minus trace (and shift), mode by mode
	Harmonic   series.SeriesSum // Σ A_n (r/R)^ν_n Φ_n
	U          series.SeriesSum // particular + harmonic, term by term
	// BySide is each circle's data series (the correction's series part), on regions bounded by circles.
	BySide map[string]series.SeriesSum
}

// rayKind is a ray's condition, reduced to what the eigenfunctions allow.
type rayKind struct {
	dirichlet bool
	value     series.Coef
}

func (s Sector) rays(p *posed) (start, end rayKind, err error) {
	var out [2]rayKind
	for i, name := range []string{"start", "end"} {
		c := p.conds[name]
		g, ok := c.G.Exact.Const()
		ok = ok && c.G.IsExact()
		switch {
		case c.Kind == Dirichlet && ok:
			out[i] = rayKind{true, g}
		case c.Kind == Neumann && ok && g.IsZero():
			out[i] = rayKind{false, series.Coef{}}
		default:
			return rayKind{}, rayKind{}, unsupported("on the sector's %s ray psol takes u = constant or dn(u) = 0, not %q", name, c.Text)
		}
	}
	return out[0], out[1], nil
}

func (s Sector) solve(p *posed) (*Solution, error) {
	a, ok := AlphaOverPi(s.Alpha)
	if !ok || a.Sign() <= 0 || a.Cmp(big.NewRat(2, 1)) > 0 {
		return nil, unsolvable("the sector angle must be a rational multiple of pi in (0, 2*pi], not %s", s.Alpha.Text())
	}
	if !new(big.Rat).Mul(a, big.NewRat(12, 1)).IsInt() {
		return nil, unsupported("sector angles with exact coefficients are multiples of pi/12; %s is not", s.Alpha.Text())
	}
	if kinks, _ := ansatz.SplitKinks(p.rest, p.env); len(kinks) > 0 {
		for _, k := range kinks {
			if k.Step { // the sector's quadrature would sample the jump (it was refused as aliased)
				return nil, unsupported("a step source (cond ? a : b) on a sector is not taken yet: a sector's quadrature has no closed part for it; on a disk, an annulus, a rectangle or a section it is closed")
			}
		}
	}
	used := map[string]bool{}
	p.f.Params(used)
	for _, c := range p.conds {
		c.G.Exact.Params(used)
		c.H.Params(used)
	}
	s.R.Params(used)
	if used[series.Index] {
		return nil, unsupported("the name %s is the series index in sector solutions; rename that parameter", series.Index)
	}
	for _, t := range p.f.Terms() {
		if t.P.Cmp(big.NewRat(-2, 1)) <= 0 {
			return nil, unsolvable("the source term %s is not integrable near r = 0 (r^k with k <= -2), so the sector problem has no solution", series.NewSum(t).Text())
		}
	}
	start, end, err := s.rays(p)
	if err != nil {
		return nil, err
	}
	inv := new(big.Rat).Inv(a)
	fam := series.Family{Slope: inv, Offset: new(big.Rat), From: 1}
	theta := series.Theta
	var shift series.Sum
	switch {
	case start.dirichlet && end.dirichlet: // sin(nπθ/α); w = c1 + (c2 − c1)θ/α
		fam.Sin = true
		slope, _ := end.value.Sub(start.value).Div(s.Alpha)
		shift = series.Const(start.value).Add(theta.Scale(slope))
	case !start.dirichlet && !end.dirichlet: // cos(nπθ/α), n ≥ 0
		fam.From = 0
	case start.dirichlet: // sin((n − ½)πθ/α); w = c1
		fam.Sin, fam.Offset = true, new(big.Rat).Neg(new(big.Rat).Mul(inv, big.NewRat(1, 2)))
		shift = series.Const(start.value)
	default: // cos((n − ½)πθ/α); w = c2
		fam.Offset = new(big.Rat).Neg(new(big.Rat).Mul(inv, big.NewRat(1, 2)))
		shift = series.Const(end.value)
	}
	arc := circle{"arc", s.R, 1}
	arcCond := p.conds["arc"]
	gf, err := arcCond.G.TraceField(s.R)
	if err != nil {
		return nil, unsupported("boundary data on arc: %w", err)
	}
	if !gf.IsExact() && !(gf.IsPiecewise() && gf.ExactPieces()) {
		return nil, unsupported("boundary data on a sector's arc must be exact (sums of powers of theta times cos(m*theta) and sin(m*theta), or pieces of them), not %s", gf.Text())
	}
	g := gf.Exact
	bw, err := arc.apply(arcCond, shift)
	if err != nil {
		return nil, err
	}
	// Source terms whose ray-adapted particular solution r^s F(θ) has a closed
	// form go there; the rest are expanded mode by mode.
	var closed, expanded series.Sum
	var rest []series.Term
	for _, t := range p.f.Terms() {
		if u, ok := rayAdapted(t, start.dirichlet, end.dirichlet, s.Alpha, fam, a); ok {
			closed = closed.Add(u)
			continue
		}
		rest = append(rest, t)
	}
	expanded = series.NewSum(rest...)
	bu, err := arc.apply(arcCond, closed)
	if err != nil {
		return nil, err
	}
	data := g.Sub(bw).Sub(bu) // what the modes must carry on the arc
	b := &sectorBuilder{s: s, a: a, fam: fam, f: expanded, data: data, arc: arc, cond: arcCond, env: p.env}
	if gf.IsPiecewise() { // data pieces, less the shift's and the closed part's traces
		b.pieces = gf.Add(series.ExactField(bw.Add(bu).Neg())).Pieces
		b.data = series.Sum{}
	}
	sol := &Solution{Domain: s, Source: p.f, Particular: closed, Harmonic: shift, RaysByShift: true}
	parts := &SeriesParts{}
	for _, part := range []*series.SeriesSum{&parts.Particular, &parts.Trace, &parts.Correction, &parts.Harmonic, &parts.U} {
		*part = series.SeriesSum{Parts: []series.Series{{Family: fam, R: s.R, Special: map[int][]series.RadialTerm{}}}}
	}
	if p.rest != nil {
		if err := b.quadrature(p, sol, start.dirichlet, end.dirichlet); err != nil {
			return nil, err
		}
	}
	general, err := b.mode(series.IndexCoef, 0, false)
	if err != nil {
		return nil, err
	}
	general.store(parts, -1)
	for _, n := range b.concrete() {
		m, err := b.mode(series.IntCoef(int64(n)), n, true)
		if err != nil {
			return nil, err
		}
		if m.free {
			sol.Free = freeName(used)
			m.harmonic = []series.RadialTerm{{C: series.SymCoef(series.Param(sol.Free)), Scaled: true}}
			m.u = append(m.u, m.harmonic...)
			sol.Notes = append(sol.Notes, fmt.Sprintf("pure Neumann data fix u only up to an additive constant %s", sol.Free))
		}
		m.store(parts, n)
	}
	sol.Series = parts
	if arcCond.Kind == Dirichlet {
		sol.stages = append(sol.stages, &arcWall{data: gf, radius: s.R, from: series.Coef{}, to: s.Alpha})
	}
	if sol.Free != "" {
		sol.FreeMean = sectorFreeMean(s, sol, p)
	}
	sol.DataError += b.gap
	sol.Sides = []Side{{Condition: arcCond, At: s.R.Text() + ", theta", AtLaTeX: "r=" + s.R.LaTeX(), Data: g, Trace: bu.Add(b.liftArc), DataText: gf.Text(), DataLaTeX: gf.LaTeX()}}
	for _, name := range []string{"start", "end"} {
		ray := p.conds[name].G
		sol.Sides = append(sol.Sides, Side{Condition: p.conds[name], At: "r, " + map[string]string{"start": "0", "end": s.Alpha.Text()}[name], Data: ray.Exact, DataText: ray.Text(), DataLaTeX: ray.LaTeX()})
	}
	sol.Checks = mergeChecks(append(b.checks(general, shift, start, end, p), closedChecks(closed, p.f.Sub(expanded), start.dirichlet, end.dirichlet, s.Alpha, p)...))
	if sol.Quadrature != nil {
		sol.Checks[0].Name = "lap(u_p) - f (the closed part)"
		qc, err := checkedQuadrature(s, sol, p)
		if err != nil {
			return nil, err
		}
		sol.Checks = append(sol.Checks, qc)
	}
	sol.CornerJumps = s.cornerJumps(start, end, arcCond, g, p.env)
	if nu1 := fam.NuAt(max(fam.From, 1)); nu1.Cmp(big.NewRat(1, 1)) < 0 {
		sol.Notes = append(sol.Notes, fmt.Sprintf("the corner exponent is %s < 1: the gradient of u is unbounded at the corner r = 0", nu1.RatString()))
	}
	return sol, nil
}

// sectorBuilder computes the modes of a sector solution.
type sectorBuilder struct {
	s      Sector
	a      *big.Rat // α/π
	fam    series.Family
	f      series.Sum
	data   series.Sum
	pieces []series.Piece // piecewise arc data, when given so
	arc    circle
	cond   Condition
	// numeric is, per mode n, the arc operator on the quadrature particular
	// solution of the source's part with no closed form; liftArc is that on
	// the quadrature's closed part (its RayLift), which joins the arc data.
	numeric   map[int]series.Coef
	gap       float64 // what numericGap let pass, for the error estimate
	env       series.Env
	liftArc   series.Sum
	liftPolys [][]series.Coef // the θ-polynomial of each RayLift term (ansatz.LiftRays)
}

// concrete lists the modes built one by one: the exceptional n and those
// that carry a numeric trace.
func (b *sectorBuilder) concrete() []int {
	out := b.exceptional()
	seen := map[int]bool{}
	for _, n := range out {
		seen[n] = true
	}
	for n := range b.numeric {
		if !seen[n] {
			out = append(out, n)
		}
	}
	sortInts(out)
	return out
}

// raySigns are the extension's signs across the rays: odd (−1) about a
// Dirichlet ray, even about a Neumann one.
func raySigns(startD, endD bool) (s0, s1 float64) {
	s0, s1 = 1, 1
	if startD {
		s0 = -1
	}
	if endD {
		s1 = -1
	}
	return s0, s1
}

// sectorExtension is src on 0 ≤ θ ≤ α extended to the period 4α by a
// reflection about each ray, odd about a Dirichlet ray and even about a
// Neumann one, so that the extension's modes are the rays' eigenfunctions.
func sectorExtension(src func(r, th float64) float64, alpha float64, startD, endD bool) func(r, th float64) float64 {
	s0, s1 := raySigns(startD, endD)
	return func(r, th float64) float64 {
		sign := 1.0
		if th >= 2*alpha { // a reflection about each ray: a shift by 2α
			th, sign = th-2*alpha, s0*s1
		}
		if th > alpha {
			th, sign = 2*alpha-th, sign*s1
		}
		// On a Dirichlet ray the odd extension jumps: its mean, 0, is the value.
		if th == 0 && startD || th == alpha && endD {
			return 0
		}
		return sign * src(r, th)
	}
}

// quadrature takes the source's part with no closed form: extended to the
// period 4α, odd about a Dirichlet ray and even about a Neumann one, its
// Fourier modes are the rays' eigenfunctions Φ_n, and the particular solution
// of each (ansatz.Quadrature) meets the ray conditions. Its arc traces join
// the mode systems as decimals.
func (b *sectorBuilder) quadrature(p *posed, sol *Solution, startD, endD bool) error {
	cf, err := series.Field{Rest: p.rest}.Compile(p.env)
	if err != nil {
		return unsupported("the source %s needs every parameter's value: %w", p.rest.Text(), err)
	}
	R, err := b.s.R.Float(p.env)
	if err != nil {
		return err
	}
	alpha, _ := b.s.Alpha.Float(nil)
	// Take the source's values on Dirichlet rays and slopes on Neumann rays
	// out first (RayLift): otherwise its extension jumps or kinks there and
	// its modes fall like 1/k or 1/k².
	lift, angles := ansatz.LiftRays(cf.At, R, b.s.Alpha, startD, endD, p.tol)
	b.liftPolys = angles
	src := func(r, th float64) float64 { return cf.At(r, th) - lift.Lap(r, th) }
	ext := sectorExtension(src, alpha, startD, endD)
	// ν_k = kπ/(2α) = ν_n for k = 2n + 2(α/π)·offset, of the family's kind.
	twoOff := new(big.Rat).Mul(new(big.Rat).Mul(b.a, b.fam.Offset), big.NewRat(2, 1))
	off := int(twoOff.Num().Int64()) // 0 or −1
	index := func(k int) (int, bool) {
		if (k-off)%2 != 0 {
			return 0, false
		}
		n := (k - off) / 2
		return n, n >= b.fam.From
	}
	q := &ansatz.Quadrature{G: ext, A: 0, R: R, Period: 4 * alpha, Tol: p.tol, Lift: lift, MaxSamples: p.quadSamples, MaxBisections: p.quadBisections,
		Keep: func(k int, sin bool) bool { _, ok := index(k); return ok && sin == b.fam.Sin }, Reflect: &[2]bool{startD, endD}}
	if err := q.Prepare(); err != nil {
		return unsolvable("%s: %w", p.rest.Text(), err)
	}
	h := 0.0
	if b.cond.Kind == Robin {
		if h, err = b.cond.H.Float(p.env); err != nil {
			return unsupported("the Robin coefficient needs a value for the numeric source: %w", err)
		}
	}
	if lift != nil {
		b.liftArc = b.liftTrace(lift, R, h)
		if b.pieces != nil { // the arc data are in the pieces then, and b.data is 0
			b.pieces = series.Field{Pieces: b.pieces}.Add(series.ExactField(b.liftArc.Neg())).Pieces
		} else {
			b.data = b.data.Sub(b.liftArc)
		}
	}
	pm, dpm, _ := q.Mode(R)
	qerr := q.TraceError(R, b.cond.Kind != Dirichlet)
	b.numeric = map[int]series.Coef{}
	noise := 0.0
	part := 0
	if b.fam.Sin {
		part = 1
	}
	traceOf := func(k int) float64 {
		switch b.cond.Kind {
		case Neumann:
			return dpm[k][part]
		case Robin:
			return dpm[k][part] + h*pm[k][part]
		}
		return pm[k][part]
	}
	// The trace's size: of its modes and of the lift's polynomial in θ
	// (Σ|c_k|α^k bounds it on the arc), which can be most of it.
	scale := 0.0
	for k := range pm {
		scale = math.Max(scale, math.Abs(traceOf(k)))
	}
	liftSize := 0.0
	for _, t := range b.liftArc.Terms() {
		if c, err := t.C.Float(nil); err == nil {
			liftSize += math.Abs(c) * math.Pow(alpha, float64(t.K))
		}
	}
	scale = math.Max(scale, liftSize)
	for k := range pm {
		n, ok := index(k)
		if !ok {
			continue
		}
		v := traceOf(k)
		// A trace far below its own error estimate is noise of a mode the
		// symmetry empties, and one at rounding's level of the largest is
		// noise too (below 1e-11 of it, it comes and goes between CPUs): leave it out (and
		// count it) rather than build the mode for it.
		if math.Abs(v) < 1e-11*scale {
			continue // rounding: already within the estimate
		}
		if math.Abs(v) < 1e-3*qerr {
			noise += math.Abs(v)
			continue
		}
		if c := decimal(v); !c.IsZero() {
			b.numeric[n] = c
		}
	}
	sol.Quadrature, sol.Rest, sol.Numeric = q, p.rest, true
	sol.DataError += qerr + noise
	note := fmt.Sprintf("psol has no closed-form rule for the source part %s: its particular solution is by quadrature (FFT of its extension over 4*alpha with %d samples, modes up to n = %d; Gauss–Legendre in r)", p.rest.Text(), q.Samples, (q.Modes-off)/2)
	if !q.Converged {
		note += fmt.Sprintf("; the ray expansion converges slowly (the source does not vanish on a Dirichlet ray, or its slope on a Neumann ray): about %.1e is neglected", q.Truncation)
	}
	sol.Notes = append(sol.Notes, note)
	return nil
}

// liftTrace is the arc operator on the quadrature's RayLift, Σ_t c_t·A_t(θ),
// in decimals: the modes take its projection by their general term like any
// arc data.
func (b *sectorBuilder) liftTrace(lift *ansatz.RayLift, R, h float64) series.Sum {
	var out series.Sum
	for i, poly := range b.liftPolys {
		v, dv := lift.Radial(i, R)
		c := v
		switch b.cond.Kind {
		case Neumann:
			c = dv
		case Robin:
			c = dv + h*v
		}
		for k, a := range poly {
			if af, _ := a.Float(nil); af != 0 {
				// 13 digits: the lift's coefficients cancel in the modes'
				// general term, and past 13 digits the cancellation's
				// remainder is rounding that differs between CPUs (fused
				// multiply-add); the quadrature's own error is far larger.
				out = out.Add(series.NewSum(series.Term{C: decimalDigits(c*af, 13), K: k}))
			}
		}
	}
	return out
}

// modeResult is one mode's radial parts: particular (r^s (ln r)^i terms),
// the arc trace of the particular, the correction, the harmonic (scaled) and u.
type modeResult struct {
	particular, trace, correction, harmonic, u []series.RadialTerm
	source                                     series.Sum // f_n(r), for the check
	rho                                        series.Sum // the particular as a sum in r
	a, gamma, bScaled, bPart                   series.Coef
	free                                       bool
}

func (m modeResult) store(p *SeriesParts, n int) {
	set := func(ss *series.SeriesSum, ts []series.RadialTerm) {
		s := &ss.Parts[0]
		if n < 0 {
			s.General = ts
		} else {
			s.Special[n] = ts
		}
	}
	set(&p.Particular, m.particular)
	set(&p.Trace, m.trace)
	set(&p.Correction, m.correction)
	set(&p.Harmonic, m.harmonic)
	set(&p.U, m.u)
}

func plainTerms(s series.Sum) []series.RadialTerm {
	var out []series.RadialTerm
	for _, t := range s.Terms() {
		out = append(out, series.RadialTerm{C: t.C, P: t.P, L: t.L})
	}
	return out
}

// mode builds mode n (symbolic when n is the index).
func (b *sectorBuilder) mode(nc series.Coef, n int, concrete bool) (modeResult, error) {
	nu := b.fam.Nu(nc)
	nu2 := nu.Mul(nu)
	var res modeResult
	var rho, src series.Sum
	for _, t := range b.f.Terms() {
		beta, err := series.Project(t.K, t.M, t.Sin, b.fam, b.a, n, concrete)
		if err != nil {
			return res, unsupported("%w", err)
		}
		c := t.C.Mul(beta)
		if c.IsZero() {
			continue
		}
		src = src.Add(series.NewSum(series.Term{C: c, P: t.P, L: t.L}))
		s := new(big.Rat).Add(t.P, big.NewRat(2, 1))
		cs, _ := ansatz.Radial(c, s, t.L, nu2)
		for i, ci := range cs {
			rho = rho.Add(series.NewSum(series.Term{C: ci, P: s, L: i}))
		}
	}
	gamma := series.Coef{}
	if b.pieces != nil {
		gp, err := series.ProjectPieces(b.pieces, b.fam, b.a, n, concrete)
		if err != nil {
			return res, unsupported("%w", err)
		}
		gamma = gp
	}
	for _, t := range b.data.Terms() {
		beta, err := series.Project(t.K, t.M, t.Sin, b.fam, b.a, n, concrete)
		if err != nil {
			return res, unsupported("%w", err)
		}
		gamma = gamma.Add(t.C.Mul(beta))
	}
	tr, err := b.arc.apply(b.cond, rho)
	if err != nil {
		return res, err
	}
	bPart, _ := tr.Const()
	if concrete {
		bPart = bPart.Add(b.numeric[n])
	}
	// The arc operator on (r/R)^ν at r = R: 1, ν/R, or ν/R + h.
	bScaled := series.IntCoef(1)
	if b.cond.Kind != Dirichlet {
		bScaled, _ = nu.Div(b.s.R)
		if b.cond.Kind == Robin {
			bScaled = bScaled.Add(b.cond.H)
		}
	}
	corr := gamma.Sub(bPart)
	res = modeResult{source: src, rho: rho, gamma: gamma, bScaled: bScaled, bPart: bPart}
	if bScaled.IsZero() && concrete && b.numeric != nil && !corr.IsZero() {
		// Data and a quadrature trace agree only in decimals (see numericGap).
		scale := 0.0
		for _, c := range []series.Coef{gamma, bPart} {
			if v, err := c.Float(b.env); err == nil {
				scale = math.Max(scale, math.Abs(v))
			}
		}
		if gap, small := numericGap([]series.Coef{corr}, scale, b.env); small {
			corr, b.gap = series.Coef{}, b.gap+gap
		}
	}
	if bScaled.IsZero() {
		if !corr.IsZero() {
			if b.cond.Kind == Neumann {
				text := corr.Text()
				if b.numeric != nil { // decimals from the quadrature: as a decimal
					if v, err := corr.Float(b.env); err == nil {
						text = fmt.Sprintf("%.12g", v)
					}
				}
				return res, unsolvable("the Neumann data is incompatible with the source: mode %d of the arc correction is %s, not 0 (the net flux must equal the source integral)", n, text)
			}
			return res, unsolvable("the Robin condition on the arc is singular for mode n = %d (nu/R + h = 0), and the correction has a component there", n)
		}
		res.free = b.cond.Kind == Neumann
	} else {
		res.a, _ = corr.Div(bScaled)
	}
	res.particular = plainTerms(rho)
	res.trace = []series.RadialTerm{{C: bPart}}
	res.correction = []series.RadialTerm{{C: corr}}
	if !res.a.IsZero() {
		res.harmonic = []series.RadialTerm{{C: res.a, Scaled: true}}
	}
	res.u = append(append([]series.RadialTerm(nil), res.particular...), res.harmonic...)
	return res, nil
}

// exceptional lists the n where the general term's denominators vanish:
// a projection frequency m − ν_n = 0, a radial resonance ν_n = |k + 2|, a
// singular arc operator, and n = 0 of a cosine family.
func (b *sectorBuilder) exceptional() []int {
	set := map[int]bool{}
	if b.fam.From == 0 {
		set[0] = true
	}
	hit := func(nu *big.Rat) { // n with ν_n = nu
		n := new(big.Rat).Quo(new(big.Rat).Sub(nu, b.fam.Offset), b.fam.Slope)
		if n.IsInt() && n.Num().IsInt64() && int(n.Num().Int64()) >= b.fam.From {
			set[int(n.Num().Int64())] = true
		}
	}
	for _, t := range append(b.f.Terms(), b.data.Terms()...) {
		hit(big.NewRat(int64(t.M), 1))
	}
	for _, p := range b.pieces {
		for _, t := range p.Value.Exact.Terms() {
			hit(big.NewRat(int64(t.M), 1))
		}
	}
	for _, t := range b.f.Terms() {
		hit(new(big.Rat).Abs(new(big.Rat).Add(t.P, big.NewRat(2, 1))))
	}
	if b.cond.Kind == Robin {
		if hr, ok := b.cond.H.Mul(b.s.R).Rat(); ok {
			hit(new(big.Rat).Neg(hr))
		}
	}
	var out []int
	for n := range set {
		out = append(out, n)
	}
	sortInts(out)
	return out
}

func sortInts(xs []int) {
	for i := 1; i < len(xs); i++ {
		for j := i; j > 0 && xs[j] < xs[j-1]; j-- {
			xs[j], xs[j-1] = xs[j-1], xs[j]
		}
	}
}

// radialOperator is ρ” + ρ'/r − ν²ρ/r².
func radialOperator(rho series.Sum, nu2 series.Coef) series.Sum {
	d := rho.DR()
	return d.DR().Add(d.MulR(big.NewRat(-1, 1))).Sub(rho.MulR(big.NewRat(-2, 1)).Scale(nu2))
}

// checks verifies the general term exactly: the radial equation of every
// mode and the arc condition; the rays hold by the eigenfunctions and the shift.
func (b *sectorBuilder) checks(general modeResult, shift series.Sum, start, end rayKind, p *posed) []Check {
	nu := b.fam.Nu(series.IndexCoef)
	ode := radialOperator(general.rho, nu.Mul(nu)).Sub(general.source)
	arcRes := general.bPart.Add(general.a.Mul(general.bScaled)).Sub(general.gamma)
	checks := []Check{
		{Name: "lap(u) - f", Exact: true, Residual: ode},
		{Name: OperatorText(b.cond, "u") + " - g", Side: "arc", Exact: true, Residual: series.Const(arcRes)},
	}
	alpha := b.s.Alpha
	for i, ray := range []rayKind{start, end} {
		name := []string{"start", "end"}[i]
		var res series.Sum
		if ray.dirichlet {
			at := series.Coef{}
			if i == 1 {
				at = alpha
			}
			v, err := shift.At(series.IntCoef(1), at)
			if err == nil {
				res = series.Const(v.Sub(ray.value))
			}
		} else {
			res = shift.DTheta() // dn(w) on a ray is ∓(1/r)∂w/∂θ
		}
		checks = append(checks, Check{Name: OperatorText(p.conds[name], "u") + " - g", Side: name, Exact: true, Residual: res})
	}
	return checks
}

// rayAdapted is a closed-form particular solution of Δu = c r^k T(mθ),
// s = k + 2 a whole number, that satisfies the homogeneous ray conditions
// (F = 0 on a Dirichlet ray, F′ = 0 on a Neumann ray):
//
//	u = r^s F(θ) + C r^s ln r Φ_N(θ),  F″ + s²F = c T(mθ) − 2sC Φ_N(θ),
//
// where C = 0 unless s is an eigenvalue ν_N of the rays; then the forcing
// excites Φ_N and C = c β_N/(2s), β_N its coefficient, makes the ray problem
// for F solvable (Δ[r^s ln r Φ_N] = 2s r^(s−2) Φ_N). It reports false for
// logarithms or powers of θ in the term, a fractional s, or an angle without
// exact values; such terms go to the mode-by-mode expansion.
func rayAdapted(t series.Term, startD, endD bool, alpha series.Coef, fam series.Family, a *big.Rat) (series.Sum, bool) {
	s := new(big.Rat).Add(t.P, big.NewRat(2, 1))
	if t.L != 0 || t.K != 0 || !s.IsInt() || s.Sign() <= 0 || !s.Num().IsInt64() || s.Num().Int64() > 1<<20 {
		return series.Sum{}, false
	}
	si := int(s.Num().Int64())
	fp := thetaParticular(t.C, t.M, t.Sin, si)
	var logPart series.Sum
	n := new(big.Rat).Quo(new(big.Rat).Sub(s, fam.Offset), fam.Slope)
	if n.IsInt() && n.Num().IsInt64() && int(n.Num().Int64()) >= fam.From { // s = ν_N: resonance with the rays
		N := int(n.Num().Int64())
		beta, err := series.Project(0, t.M, t.Sin, fam, a, N, true)
		if err != nil {
			return series.Sum{}, false
		}
		c := t.C.Mul(beta).MulRat(big.NewRat(1, int64(2*si)))
		if !c.IsZero() {
			phi := series.Trig(si, fam.Sin)
			logPart = phi.Scale(c).Mul(series.NewSum(series.Term{C: series.IntCoef(1), L: 1}))
			fp = fp.Add(thetaParticular(c.MulRat(big.NewRat(int64(-2*si), 1)), si, fam.Sin, si))
		}
	}
	basis := []series.Sum{series.Trig(si, false), series.Trig(si, true)}
	row := func(f series.Sum, dirichlet bool, at series.Coef) (series.Coef, bool) {
		if !dirichlet {
			f = f.DTheta()
		}
		v, err := f.At(series.IntCoef(1), at)
		return v, err == nil
	}
	var m [][]series.Coef
	var rhs []series.Coef
	for _, ray := range []struct {
		d  bool
		at series.Coef
	}{{startD, series.Coef{}}, {endD, alpha}} {
		var r []series.Coef
		for _, h := range basis {
			v, ok := row(h, ray.d, ray.at)
			if !ok {
				return series.Sum{}, false
			}
			r = append(r, v)
		}
		v, ok := row(fp, ray.d, ray.at)
		if !ok {
			return series.Sum{}, false
		}
		m, rhs = append(m, r), append(rhs, v.Neg())
	}
	x, _, ok := series.SolveLinear(m, rhs)
	if !ok {
		return series.Sum{}, false
	}
	F := fp.Add(basis[0].Scale(x[0])).Add(basis[1].Scale(x[1]))
	return F.Add(logPart).MulR(s), true
}

// thetaParticular solves F″ + s²F = c T(mθ): c T(mθ)/(s² − m²) for m ≠ s, and
// for m = s, by (θ sin sθ)″ + s²θ sin sθ = 2s cos sθ and
// (θ cos sθ)″ + s²θ cos sθ = −2s sin sθ, ±c θ T̃(sθ)/(2s).
func thetaParticular(c series.Coef, m int, sin bool, s int) series.Sum {
	if m != s {
		k, _ := c.Div(series.IntCoef(int64(s*s - m*m)))
		return series.Trig(m, sin).Scale(k)
	}
	k := c.MulRat(big.NewRat(1, int64(2*s)))
	if sin {
		k = k.Neg()
	}
	return series.Theta.Mul(series.Trig(s, !sin)).Scale(k)
}

// closedChecks verifies the ray-adapted part exactly: its Laplacian is the
// source it took, and it meets the homogeneous ray conditions.
func closedChecks(u, f series.Sum, startD, endD bool, alpha series.Coef, p *posed) []Check {
	if u.IsZero() && f.IsZero() {
		return nil
	}
	checks := []Check{{Name: "lap(u) - f", Exact: true, Residual: u.Laplacian().Sub(f)}}
	for _, ray := range []struct {
		name string
		d    bool
		at   series.Coef
	}{{"start", startD, series.Coef{}}, {"end", endD, alpha}} {
		g := u
		if !ray.d {
			g = u.DTheta()
		}
		var res series.Sum
		for _, t := range g.Terms() { // the ray value, a function of r
			v, err := series.NewSum(series.Term{C: t.C, K: t.K, M: t.M, Sin: t.Sin}).At(series.IntCoef(1), ray.at)
			if err != nil {
				return checks
			}
			res = res.Add(series.NewSum(series.Term{C: v, P: t.P, L: t.L}))
		}
		checks = append(checks, Check{Name: OperatorText(p.conds[ray.name], "u") + " - g", Side: ray.name, Exact: true, Residual: res})
	}
	return checks
}

// mergeChecks adds up the residuals of checks with the same name and side:
// a sector's closed part and its series are verified separately.
func mergeChecks(cs []Check) []Check {
	var out []Check
	for _, c := range cs {
		merged := false
		for i := range out {
			if out[i].Name == c.Name && out[i].Side == c.Side {
				out[i].Residual = out[i].Residual.Add(c.Residual)
				out[i].Exact = out[i].Exact && c.Exact
				merged = true
			}
		}
		if !merged {
			out = append(out, c)
		}
	}
	return out
}

// figures: the closed parts' integrals exactly over the sector, the
// series' term by term, the quadrature's share, the flux through arc and rays
// by panels, and extremes over the polar box.
func (d Sector) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	sub := func(c series.Coef) (series.Coef, float64, error) { return sub(c, env) }
	rep.Area = d.R.Mul(d.R).Mul(d.Alpha).MulRat(big.NewRat(1, 2))
	a, _ := AlphaOverPi(d.Alpha)
	closed, err := s.Particular.Add(s.Harmonic).SectorIntegral(d.R, d.Alpha)
	if err == nil {
		c, v, err := sub(closed)
		if err == nil {
			rep.Integral = v
			if s.Series != nil && !s.Series.U.IsZero() {
				for _, p := range s.Series.U.Parts {
					is, err := p.SectorIntegral(a)
					if err == nil {
						sum, err := is.Float(env, tol, 1<<22)
						if err == nil {
							rep.Integral += sum.Value
						}
					}
				}
			} else {
				rep.IntegralExact = &c
			}
		}
	}
	if c, err := s.Source.SectorIntegral(d.R, d.Alpha); err == nil {
		if c, v, err := sub(c); err == nil {
			rep.SourceExact, rep.Source = &c, v
		}
	}
	if q := s.Quadrature; q != nil { // the numeric particular solution's share
		to, _ := d.Alpha.Float(nil)
		g, p := q.Integrals(0, to)
		rep.Source, rep.SourceExact = rep.Source+g, nil
		rep.Integral, rep.IntegralExact = rep.Integral+p, nil
	}
	if sides, ok := d.sectorSideFluxes(s, env, tol); ok {
		rep.setSideFluxes(sides)
	}
	return polarExtremes(d, ev, rep, env)
}

// Shape: the arc, then the ray θ = 0 (outward normal −y), then the ray θ = α.
func (d Sector) Shape(env series.Env) (Shape, error) {
	v, err := floats(env, d.R)
	if err != nil {
		return Shape{}, err
	}
	R := v[0]
	a, _ := d.Alpha.Float(nil)
	box := Box{}
	for i := 0; i <= 200; i++ { // the arc's extent, with the centre
		t := a * float64(i) / 200
		x, y := R*math.Cos(t), R*math.Sin(t)
		box = Box{math.Min(box.X0, x), math.Max(box.X1, x), math.Min(box.Y0, y), math.Max(box.Y1, y)}
	}
	ca, sa := math.Cos(a), math.Sin(a)
	return Shape{
		Sides: []SidePath{arcPath("arc", R, 0, a, 1), segmentPath("start", 0, 0, R, 0), segmentPath("end", R*ca, R*sa, 0, 0)},
		Area:  a * R * R / 2, Box: box, Polar: &PolarBox{RMax: R, Span: a},
	}, nil
}

// samples are 72 interior points on six arcs, off the rays.
func (d Sector) samples(env series.Env) ([][2]float64, error) {
	v, err := floats(env, d.R)
	if err != nil {
		return nil, err
	}
	a, _ := d.Alpha.Float(nil)
	return ringSamples(func(i int) float64 { return v[0] * float64(i) / 7.5 }, a, 0.5), nil
}

func (d Sector) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return polarClaimSide(d, side, cond, claim, env)
}

// boundary: the arc is a circle; "start" and "end" are the rays θ = 0 and θ = α.
func (d Sector) boundary(side string) (circle, bool, series.Coef) {
	switch side {
	case "arc":
		return circle{"arc", d.R, 1}, true, series.Coef{}
	case "end":
		return circle{}, false, d.Alpha
	}
	return circle{}, false, series.Coef{}
}

func (d Sector) Measures() Measures {
	return Measures{Area: d.R.Mul(d.R).Mul(d.Alpha).MulRat(big.NewRat(1, 2)),
		Lengths: map[string]series.Coef{"arc": d.R.Mul(d.Alpha), "start": d.R, "end": d.R}}
}

func (d Sector) integral(u series.Sum) (series.Coef, error) { return u.SectorIntegral(d.R, d.Alpha) }

// sectorFreeMean is the value of the free constant that makes u's mean on
// the arc zero: the closed parts' mean exactly (∫₀^α of their trace), the
// series' and the quadrature's by Gauss–Legendre panels where parameters
// have values (the eigenfunctions of mode n ≥ 1 have mean zero, but the
// exceptional modes and a numeric part need not).
func sectorFreeMean(d Sector, sol *Solution, p *posed) series.Coef {
	closed := sol.Particular.Add(sol.Harmonic)
	zero := series.Env{sol.Free: {}}
	mean := series.Coef{}
	if tr, err := closed.Trace(d.R); err == nil {
		if tr, err = tr.Subst(zero); err == nil {
			if in, err := tr.AngleIntegral(d.Alpha); err == nil {
				if m, err := in.Div(d.Alpha); err == nil {
					mean = m
				}
			}
		}
	}
	env := series.Env{sol.Free: {}}
	for k, v := range p.env {
		env[k] = v
	}
	cs, err := sol.Series.U.Compile(env)
	R, errR := d.R.Float(env)
	alpha, errA := d.Alpha.Float(env)
	if err != nil || errR != nil || errA != nil {
		return mean.Neg()
	}
	rest := 0.0
	for i := 0; i < 16; i++ {
		a, b := alpha*float64(i)/16, alpha*float64(i+1)/16
		for k, x := range legendreX {
			th := (a+b)/2 + (b-a)/2*x
			v := cs.At(R, th, 1e-14, CheckTerms).Value
			if sol.Quadrature != nil {
				q, _ := sol.Quadrature.At(R, th)
				v += q
			}
			rest += (b - a) / 2 * legendreW[k] * v
		}
	}
	if rest /= alpha; math.Abs(rest) > 1e-14 {
		mean = mean.Add(decimal(rest))
	}
	return mean.Neg()
}

// cornerJumps are the corners where two sides with values disagree: the
// apex, where the rays' constants meet, and the arc's ends, where its data
// meet a ray's (compared as numbers, to 1e-12 of their size).
func (s Sector) cornerJumps(start, end rayKind, arcCond Condition, g series.Sum, env series.Env) []CornerJump {
	var out []CornerJump
	if start.dirichlet && end.dirichlet && !start.value.Equal(end.value) {
		out = append(out, CornerJump{Sides: [2]string{"start", "end"}})
	}
	R, err1 := s.R.Float(env)
	alpha, err2 := s.Alpha.Float(env)
	cg, err3 := g.Compile(env)
	if arcCond.Kind != Dirichlet || err1 != nil || err2 != nil || err3 != nil {
		return out
	}
	for _, e := range []struct {
		ray   rayKind
		name  string
		theta float64
	}{{start, "start", 0}, {end, "end", alpha}} {
		v, err := e.ray.value.Float(env)
		if !e.ray.dirichlet || err != nil {
			continue
		}
		if a := cg.At(R, e.theta); math.Abs(a-v) > 1e-12*math.Max(1, math.Max(math.Abs(a), math.Abs(v))) {
			out = append(out, CornerJump{At: [2]float64{R * math.Cos(e.theta), R * math.Sin(e.theta)}, Sides: [2]string{"arc", e.name}})
		}
	}
	return out
}
