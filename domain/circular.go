package domain

import (
	"fmt"
	"math"
	"math/big"
	"sort"
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

// apply is the condition's operator on s at this circle: u, ∂u/∂n or
// ∂u/∂n + h·u. A floating side's operator is, mode by mode, ∂u/∂n on the
// mean (mode 0: its data are the flux over the circumference) and u on
// every other mode (whose data are 0: u is one constant there); being
// diagonal in the modes, the mode systems take it as they take the others.
func (c circle) apply(cond Condition, s series.Sum) (series.Sum, error) {
	switch cond.Kind {
	case Dirichlet:
		return s.Trace(c.radius)
	case Floating:
		var mean, rest []series.Term
		for _, t := range s.Terms() {
			if t.M == 0 {
				mean = append(mean, t)
			} else {
				rest = append(rest, t)
			}
		}
		dn, err := c.apply(Condition{Kind: Neumann}, series.NewSum(mean...))
		if err != nil {
			return series.Sum{}, err
		}
		v, err := series.NewSum(rest...).Trace(c.radius)
		return dn.Add(v), err
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
			return nil, unsupported("boundary data on %s: %w", c.name, err)
		}
		if cond.Kind == Floating { // the net flux, spread evenly over the circumference 2πR
			if gf, err = fluxDensity(cond, c); err != nil {
				return nil, err
			}
		}
		tr, err := c.apply(cond, up)
		if err != nil {
			return nil, unsupported("trace on %s: %w", c.name, err)
		}
		traced[c.name], traces[c.name] = gf, tr
	}
	given := map[string]series.Field{} // the data as given, for printing (the kinks' exact traces may join them)
	for k, v := range traced {
		given[k] = v
	}
	if p.rest != nil {
		if err := quadratureParticular(d, p, sol, traces, traced); err != nil {
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
			DataText: given[c.name].Text(), DataLaTeX: given[c.name].LaTeX()}
		sol.Sides = append(sol.Sides, side)
		data[c.name] = corr
	}
	if err := harmonicModes(d, p, sol, data); err != nil {
		return nil, err
	}
	freeRobinModes(d, p, sol, data)
	sol.U = up.Add(sol.Harmonic)
	for _, c := range d.circles() {
		if p.conds[c.name].Kind != Floating {
			continue
		}
		if v, err := sol.U.Trace(c.radius); err == nil {
			if sol.Floating == nil {
				sol.Floating = map[string]series.Coef{}
			}
			value := coefOf(v, mode{}).Add(quadratureMean(sol, c, p.env))
			sol.Floating[c.name] = value
			sol.Notes = append(sol.Notes, fmt.Sprintf("u on %s is the constant %s, found from its net outward flux %s (the mean of dn(u) on it is that over its length)", c.name, value.Text(), p.conds[c.name].G.Text()))
		}
	}
	if sol.Free != "" {
		c0 := d.circles()[0]
		u0, err := sol.U.Subst(series.Env{sol.Free: {}})
		if err == nil {
			tr, err := u0.Trace(c0.radius)
			if err == nil {
				sol.FreeMean = coefOf(tr, mode{}).Add(quadratureMean(sol, c0, p.env)).Neg()
			}
		}
	}
	sol.Checks = verifyCircular(d, sol, p.conds)
	if sol.Quadrature != nil {
		sol.Checks[0].Name = "lap(u_p) - f (the closed part)"
		qc, err := checkedQuadrature(d, sol, p)
		if err != nil {
			return nil, err
		}
		if !sol.Numeric { // kinks alone: closed forms, checked by differences too
			sol.Checks[0].Name = "lap(u_p) - f (the terms with a rule)"
			qc.Name = KinkCheckName(sol.Quadrature.Kinks) + " (sampled, by differences)"
		}
		sol.Checks = append(sol.Checks, qc)
		numericResiduals(d, sol, p.env)
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

// modeTable is coefOf for every mode of s at once.
func modeTable(s series.Sum) map[mode]series.Coef {
	out := map[mode]series.Coef{}
	for _, t := range s.Terms() {
		if t.P.Sign() == 0 && t.L == 0 && t.K == 0 {
			out[mode{t.M, t.Sin}] = t.C
		}
	}
	return out
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
	// Each circle's data by mode, looked up once: a numeric trace can have
	// thousands of modes, and a scan per mode is quadratic.
	byMode := map[string]map[mode]series.Coef{}
	for _, c := range circles {
		byMode[c.name] = modeTable(data[c.name])
	}
	// The operators' matrix depends on n alone: cos nθ and sin nθ share it.
	type system struct {
		basis []series.Sum
		a     [][]series.Coef
	}
	systems := map[int]system{}
	for _, m := range order {
		sys, ok := systems[m.n]
		if !ok {
			sys.basis = d.basis(m.n)
			sys.a = make([][]series.Coef, len(circles))
			for i, c := range circles {
				for _, fn := range sys.basis {
					// The operator on the mode's function, fn·T(nθ): a floating
					// side's operator differs between mode 0 and the others.
					v, err := c.apply(p.conds[c.name], fn.Mul(m.trig()))
					if err != nil {
						return err
					}
					sys.a[i] = append(sys.a[i], coefOf(v, m))
				}
			}
			systems[m.n] = sys
		}
		basis, a := sys.basis, sys.a
		b := make([]series.Coef, len(circles))
		for i, c := range circles {
			b[i] = byMode[c.name][m]
		}
		x, free, ok := series.SolveLinear(a, b)
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
				x, free, ok = series.SolveLinear(a, b)
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
	sort.Slice(ms, func(i, j int) bool {
		return ms[i].n < ms[j].n || ms[i].n == ms[j].n && !ms[i].sin && ms[j].sin
	})
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
		allNeumann = allNeumann && (c.Kind == Neumann || c.Kind == Floating)
	}
	if m.n == 0 && allNeumann {
		// ∮ ∂u/∂n ds = ∬ f dA (the divergence theorem) is what mode 0 asks.
		flux := series.Coef{}
		for _, s := range sol.Sides {
			for _, c := range d.circles() {
				if c.name == s.Condition.Side {
					mean := coefOf(s.Data, m)
					if kt, ok := sol.KinkTraces[c.name].FourierOn(c.radius); ok && sol.KinkTraces != nil {
						mean = mean.Add(kt.A0) // the data as given: the kinks' trace was taken out of them
					}
					flux = flux.Add(mean.Mul(c.radius).Mul(series.SymCoef(series.Pi)).MulRat(big.NewRat(2, 1)))
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
	u := sol.Quadrature.Value // the values alone: the check needs no estimate
	out.peak = sol.Quadrature.SourceSize()
	// The points in the quadrature's own polar coordinates (a section's
	// are about its centre).
	local := make([][2]float64, len(pts))
	rmax := 0.0
	for k, p := range pts {
		local[k] = p
		if sol.Quadrature.Centred() {
			local[k][0], local[k][1] = sol.Quadrature.Local(Cartesian(p[0], p[1]))
		}
		rmax = math.Max(rmax, local[k][0])
	}
	for k, p := range pts {
		r, th := local[k][0], local[k][1]
		if k%4 != 0 || r < 1e-2*rmax {
			// The polar stencil's angular step h/r is no small step near the
			// centre (at r = 0 it divided by zero: a Gaussian on a hexagon
			// about the origin was refused as "not a finite number").
			continue
		}
		// A polar stencil: its points share five radii, and the quadrature
		// evaluates every mode of a radius at once.
		h := 3e-3 * r
		if nearKink(sol.Quadrature.Kinks, r, th, 2*h) {
			// A stencil across a kink's line measures the difference
			// formula's O(h) error where u_p's third derivative jumps (a
			// polygon's samples on the line read 2.7e-4), not u_p's.
			continue
		}
		centre := u(r, th)
		lap := func(h float64) float64 {
			k := h / r
			out, in := u(r+h, th), u(r-h, th)
			return (out-2*centre+in)/(h*h) + (out-in)/(2*h*r) + (u(r, th+k)-2*centre+u(r, th-k))/(r*r*k*k)
		}
		fd := (4*lap(h/2) - lap(h)) / 3
		f := fc.At(p[0], p[1])
		out.Numeric = math.Max(out.Numeric, math.Abs(fd-f))
		out.scale = math.Max(out.scale, math.Abs(f))
	}
	return out
}

// nearKink reports a point (r, θ) within d of a kink's line.
func nearKink(kinks []ansatz.Kink, r, th, d float64) bool {
	x, y := r*math.Cos(th), r*math.Sin(th)
	for _, k := range kinks {
		if k.Distance(x, y) < d {
			return true
		}
	}
	return false
}

// checkedQuadrature is the quadrature's sampled check, or the refusal when
// it fails: psol prints no answer built on a numeric part it cannot check.
func checkedQuadrature(d Domain, sol *Solution, p *posed) (Check, error) {
	qc := quadratureCheck(d, sol, p.env)
	if qc.failed() {
		return qc, unsolvable("psol's own check of the quadrature fails: lap(u_q) - f_q reaches %.2g where the source is about %.2g; the source %s is too rough, or varies too fast, for the sampling (psol prints no answer it cannot check)", qc.Numeric, qc.scale, p.rest.Text())
	}
	return qc, nil
}

// failed reports a sampled check of a numeric part whose residual is not
// small against what it checks (a thousandth of the source's size at the
// check's points): the numeric part is wrong (a source rougher than its
// sampling can see, or singular), and no answer built on it may be printed.
// A residual within 1e-9 of the source's peak anywhere passes: a source
// concentrated between the check's points is tiny at all of them.
func (c Check) failed() bool {
	return !c.Exact && c.scale > 0 && c.Numeric > 1e-3*c.scale && c.Numeric > 1e-9*c.peak
}

func (s *Solution) addSeriesResidual(side string, r series.Coef) {
	if s.seriesResidual == nil {
		s.seriesResidual = map[string]series.Coef{}
	}
	s.seriesResidual[side] = s.seriesResidual[side].Add(r)
}

func paren(s string) string {
	if strings.ContainsAny(s, " +-/*") {
		return "(" + s + ")"
	}
	return s
}

// fluxDensity is a floating side's data as the mode systems take them: the
// net flux g over the circumference, g/(2πR), in mode 0.
func fluxDensity(cond Condition, c circle) (series.Field, error) {
	if !cond.G.IsExact() || cond.G.Exact.HasAngle() {
		return series.Field{}, unsupported("the net flux through %s must be one constant, not %s", c.name, cond.G.Text())
	}
	q, ok := cond.G.Exact.Const()
	if !ok {
		return series.Field{}, unsupported("the net flux through %s must be one constant, not %s", c.name, cond.G.Text())
	}
	g, err := q.Div(c.radius.Mul(series.SymCoef(series.Pi)).MulRat(big.NewRat(2, 1)))
	if err != nil {
		return series.Field{}, unsupported("the net flux through %s: %w", c.name, err)
	}
	return series.Field{Exact: series.Const(g)}, nil
}

// numericResiduals turns a side's exact residual that is only the rounding
// of decimal traces (a quadrature's, 15 digits) into a numeric check of its
// size: within 1e-9 of the data and traces it compares, it is that rounding,
// not a wrong solution; above, it stays an exact failure.
func numericResiduals(d circular, sol *Solution, env series.Env) {
	for i, c := range d.circles() {
		k := i + 1 // Checks[0] is the equation's
		if k >= len(sol.Checks) || sol.Checks[k].Residual.IsZero() {
			continue
		}
		size, ok := sumSize(sol.Checks[k].Residual, c, env)
		scale := 0.0
		for _, part := range []series.Sum{sol.Sides[i].Data, sol.Sides[i].Trace} {
			if v, ok := sumSize(part, c, env); ok {
				scale = math.Max(scale, v)
			}
		}
		if ok && size <= 1e-9*math.Max(1, scale) {
			sol.Checks[k].Exact, sol.Checks[k].Numeric, sol.Checks[k].Residual = false, size, series.Sum{}
		}
	}
}

// sumSize is the largest |s| on the circle, on 64 angles.
func sumSize(s series.Sum, c circle, env series.Env) (float64, bool) {
	comp, err := s.Compile(env)
	R, errR := c.radius.Float(env)
	if err != nil || errR != nil {
		return 0, false
	}
	worst := 0.0
	for j := 0; j < 64; j++ {
		worst = math.Max(worst, math.Abs(comp.At(R, 2*math.Pi*float64(j)/64)))
	}
	return worst, true
}

// freeRobinModes names the modes a Robin condition on a region's only circle
// annihilates (n/R·outward + h = 0 for a whole n) when the data have no
// component there: the problem then has a solution, but not one only, and
// psol says which terms are free (as it names a pure Neumann constant).
func freeRobinModes(d circular, p *posed, sol *Solution, data map[string]series.Sum) {
	circles := d.circles()
	if len(circles) != 1 {
		return
	}
	c := circles[0]
	cond := p.conds[c.name]
	if cond.Kind != Robin {
		return
	}
	hr, ok := cond.H.Mul(c.radius).Rat()
	if !ok || !hr.IsInt() || !hr.Num().IsInt64() {
		return
	}
	n := int(hr.Num().Int64())
	if n < 0 {
		n = -n
	}
	if n == 0 || n > 1<<20 {
		return
	}
	basis := d.basis(n)
	for _, m := range []mode{{n, false}, {n, true}} {
		v, err := c.apply(cond, basis[0].Mul(m.trig()))
		if err != nil || !coefOf(v, m).IsZero() || !coefOf(data[c.name], m).IsZero() {
			return
		}
	}
	fn := basis[0].Mul(series.Trig(n, false)).Text()
	gn := basis[0].Mul(series.Trig(n, true)).Text()
	sol.Notes = append(sol.Notes, fmt.Sprintf("the solution is not unique: the Robin condition on %s annihilates %s and %s (mode %d), so u + C1*%s + C2*%s solves the problem for any C1, C2; psol gives C1 = C2 = 0", c.name, fn, gn, n, fn, gn))
}

// quadratureMean is the mean of the numeric particular solution on a
// circle (its mode 0 there), a decimal; zero without one.
func quadratureMean(sol *Solution, c circle, env series.Env) series.Coef {
	if sol.Quadrature == nil {
		return series.Coef{}
	}
	R, err := c.radius.Float(env)
	if err != nil {
		return series.Coef{}
	}
	pm, _, _ := sol.Quadrature.Mode(R)
	if len(pm) == 0 {
		return series.Coef{}
	}
	return decimal(pm[0][0])
}

// KinkCheckName is the check of the kinks' and steps' closed forms.
func KinkCheckName(kinks []ansatz.Kink) string {
	var particulars, sources []string
	for _, i := range kinkKinds(kinks) {
		particulars, sources = append(particulars, kinkForms[i].particular), append(sources, kinkForms[i].source)
	}
	return "lap(" + strings.Join(particulars, " + ") + ") - " + strings.Join(sources, " - ")
}
