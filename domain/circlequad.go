package domain

import (
	"fmt"
	"math"
	"math/big"
	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
	"strconv"
	"strings"
)

// quadratureParticular adds to each circle's trace that of the numeric
// particular solution of the source's remaining part (ansatz.Quadrature),
// mode by mode under the circle's operator. Where that part is kinks alone,
// c·abs(ℓ) with rational ℓ, their traces are exact (Kink.CircleTrace): they
// go into the data (traced) as series with a general term, and the solve
// stays exact.
func quadratureParticular(d circular, p *posed, sol *Solution, traces map[string]series.Sum, traced map[string]series.Field) error {
	in, out := d.bounds()
	var err error
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
	q, err := kinkedQuadrature(p, a, R, 0, 0)
	if err != nil {
		return err
	}
	sol.Quadrature, sol.Rest, sol.Numeric = q, p.rest, true
	exact, kinksExact := exactKinkTraces(d, p, q, traced)
	if kinksExact {
		sol.KinkTraces = map[string]series.Field{}
		for name, fc := range exact {
			sol.KinkTraces[name] = series.FourierField(fc)
			if at := kinksOperator(q, d, p, name); at != nil {
				sol.KinkTraces[name] = series.FourierFieldSum(fc, at)
			}
			traced[name] = traced[name].Add(sol.KinkTraces[name].Neg())
		}
		if q.Left == nil { // the kinks were the source's whole numeric part
			sol.Numeric = false
			sol.Notes = append(sol.Notes, exactKinkNote(q.Kinks))
			return nil
		}
	}
	for _, c := range d.circles() {
		r, err := c.radius.Float(p.env)
		if err != nil {
			return err
		}
		pm, dpm, _ := q.Mode(r)
		cond := p.conds[c.name]
		if len(q.Kinks) > 0 && !kinksExact { // their modes by the FFT, with the rest's
			var tail float64
			// Between two circles the modes grow like (R2/R1)^n in the exact
			// algebra's r^n, r^−n form: as many as circleData's numeric data
			// take there, the rest in the tail.
			most := 8192
			if len(d.circles()) > 1 {
				most = 256
			}
			pm, dpm, tail = addModes(pm, dpm, q, r, cond.Kind == Neumann || cond.Kind == Robin || cond.Kind == Floating, most)
			sol.DataError += tail
		}
		qerr := q.TraceError(r, cond.Kind == Neumann || cond.Kind == Robin || cond.Kind == Floating)
		h := 0.0
		if cond.Kind == Robin {
			if h, err = cond.H.Float(p.env); err != nil {
				return unsupported("the Robin coefficient needs a value for the numeric source: %w", err)
			}
		}
		var terms []series.Term
		for m := range pm {
			for k := 0; k < 2; k++ {
				v := pm[m][k]
				switch {
				case cond.Kind == Floating && m == 0, cond.Kind == Neumann:
					v = float64(c.outward) * dpm[m][k]
				case cond.Kind == Robin:
					v = float64(c.outward)*dpm[m][k] + h*pm[m][k]
				}
				if m == 0 && k == 1 {
					continue
				}
				if math.IsInf(v, 0) || math.IsNaN(v) {
					return unsolvable("the particular solution's trace on %s is beyond float64's range (mode %d is %g): the source is too large on this region for the quadrature", c.name, m, v)
				}
				terms = append(terms, series.Term{C: decimal(v), M: m, Sin: k == 1})
			}
		}
		traces[c.name] = traces[c.name].Add(series.NewSum(terms...))
		sol.DataError += qerr
	}
	sol.Notes = append(sol.Notes, quadratureNote(q, p.rest, "", fmt.Sprintf("FFT in theta with %d samples, modes up to %d; Gauss–Legendre in r", q.Samples, q.Modes), fftKinkHow, kinksExact))
	return nil
}

// exactKinkTraces are B[Σ kinks] on each circle as exact Fourier
// coefficients, where the source's remainder is kinks alone with rational
// forms and radii and the data have exact coefficients too (numeric data
// go by the FFT, and the kinks' modes with them); ok is false otherwise.
func exactKinkTraces(d circular, p *posed, q *ansatz.Quadrature, traced map[string]series.Field) (map[string]series.FourierCoefficients, bool) {
	if len(q.Kinks) == 0 || p.numeric {
		return nil, false
	}
	out := map[string]series.FourierCoefficients{}
	for _, c := range d.circles() {
		cond := p.conds[c.name]
		if _, exactData := traced[c.name].FourierOn(c.radius); cond.Kind == Floating || !exactData {
			return nil, false
		}
		total := series.FourierCoefficients{Special: map[int][2]series.Coef{}}
		for _, k := range q.Kinks {
			value, ok1 := k.CircleTrace(c.radius, false)
			slope, ok2 := k.CircleTrace(c.radius, true)
			if !ok1 || !ok2 {
				return nil, false
			}
			b := value // the side's operator: u, ∂u/∂n = ±∂u/∂r, or ∂u/∂n + h·u
			if cond.Kind != Dirichlet {
				b = slope.Scale(series.IntCoef(c.outward))
				if cond.Kind == Robin {
					sum, err := b.Add(value.Scale(cond.H))
					if err != nil {
						return nil, false
					}
					b = sum
				}
			}
			sum, err := total.Add(b)
			if err != nil {
				return nil, false
			}
			total = sum
		}
		out[c.name] = total
	}
	return out, true
}

// kinksOperator is the side's operator on the kinks' closed forms at
// (r, θ), the sum of their trace's series there; nil where the Robin
// coefficient has no value.
func kinksOperator(q *ansatz.Quadrature, d circular, p *posed, side string) func(r, theta float64) float64 {
	var c circle
	for _, cc := range d.circles() {
		if cc.name == side {
			c = cc
		}
	}
	cond := p.conds[side]
	h, err := cond.H.Float(p.env)
	if err != nil {
		return nil
	}
	return func(r, theta float64) float64 {
		v, slope := 0.0, 0.0
		for _, k := range q.Kinks {
			v += k.Value(r, theta)
			vr, _ := k.Gradient(r, theta)
			slope += vr
		}
		return operatorValue(cond.Kind, h, v, float64(c.outward)*slope)
	}
}

// kinkedQuadrature is the quadrature of the source's remainder with its
// kinks c·abs(ℓ) taken out as closed parts (ansatz.SplitKinks) where the
// region is bounded: the rest, if any, is sampled.
func kinkedQuadrature(p *posed, a, R, x0, y0 float64) (*ansatz.Quadrature, error) {
	var kinks []ansatz.Kink
	left := p.rest
	if !math.IsInf(R, 1) {
		kinks, left = ansatz.SplitKinks(p.rest, p.env)
	}
	centred := x0 != 0 || y0 != 0
	for i := range kinks {
		kinks[i] = kinks[i].Shifted(x0, y0)
	}
	g := func(r, theta float64) float64 { return 0 }
	var gxy func(x, y float64) float64
	if left != nil {
		cf, err := series.Field{Rest: left}.Compile(p.env)
		if err != nil {
			return nil, unsupported("the source %s needs every parameter's value: %w", p.rest.Text(), err)
		}
		g = cf.At
		if centred { // the source at the point of the caller's plane
			g = func(r, theta float64) float64 {
				return cf.At(polarOf(x0+r*math.Cos(theta), y0+r*math.Sin(theta)))
			}
		}
		if left.SingleValued() {
			if xy, err := (series.Field{Rest: left}).CompileXY(p.env, cart.PolyLeaf(p.env)); err == nil {
				gxy = xy.At
				if centred {
					gxy = func(x, y float64) float64 { return xy.At(x0+x, y0+y) }
				}
			}
		}
	}
	q := &ansatz.Quadrature{G: g, GXY: gxy, A: a, R: R, Tol: p.tol, MaxSamples: p.quadSamples, MaxBisections: p.quadBisections, Kinks: kinks, Left: left, X0: x0, Y0: y0}
	if err := q.Prepare(); err != nil {
		return nil, unsolvable("%s: %w", p.rest.Text(), err)
	}
	return q, nil
}

// kinkForms are the closed forms of the two kinds of kink a source can
// carry, for the notes and checks that name them: c·abs(ℓ) and c·step(ℓ).
var kinkForms = [2]struct {
	noun, source, particular, smooth string
}{
	{"kinks", "c*abs(l)", "c*abs(l)^3/(6*|grad l|^2)", "twice"},
	{"steps", "c*step(l)", "c*max(l, 0)^2/(2*|grad l|^2)", "once"},
}

// kinkKinds are the kinkForms present among kinks, kinks c·abs(ℓ) first
// (and alone where there are none, as the phrases always had it).
func kinkKinds(kinks []ansatz.Kink) (forms []int) {
	has := [2]bool{len(kinks) == 0, false}
	for _, k := range kinks {
		if k.Step {
			has[1] = true
		} else {
			has[0] = true
		}
	}
	for i, h := range has {
		if h {
			forms = append(forms, i)
		}
	}
	return forms
}

// kinkPhrase says which closed forms the source's kinks and steps took,
// up to their smoothness (the caller closes the bracket or goes on in it).
func kinkPhrase(kinks []ansatz.Kink) string {
	var nouns, sources, particulars, smooth []string
	for _, i := range kinkKinds(kinks) {
		f := kinkForms[i]
		nouns, sources = append(nouns, f.noun+" "+f.source), append(sources, f.source)
		particulars, smooth = append(particulars, f.particular), append(smooth, f.smooth)
	}
	solution := "solution"
	if len(particulars) > 1 {
		solution += "s"
	}
	return fmt.Sprintf("the source's %s, l linear in x and y, take the closed particular %s %s (%s continuously differentiable",
		strings.Join(nouns, " and "), solution, strings.Join(particulars, " and "), strings.Join(smooth, " and "))
}

// exactKinkNote says how kinks with exact traces were taken.
func exactKinkNote(kinks []ansatz.Kink) string {
	return kinkPhrase(kinks) + "); its trace on each circle is given by exact Fourier coefficients, whose general term carries the angles where the line crosses the circle"
}

// quadratureNote says how the source's remainder was taken: the kinks'
// closed parts (their traces as kinkHow says, after the bracket's opening),
// and the quadrature of what is left.
func quadratureNote(q *ansatz.Quadrature, rest *series.Expr, where, how, kinkHow string, kinksExact bool) string {
	if len(q.Kinks) == 0 {
		return fmt.Sprintf("psol has no closed-form rule for the source part %s: its particular solution is by quadrature%s (%s)", rest.Text(), where, how)
	}
	note := kinkPhrase(q.Kinks) + kinkHow
	if kinksExact {
		note = exactKinkNote(q.Kinks)
	}
	if q.Left != nil {
		note += fmt.Sprintf("; the rest, %s, is by quadrature%s (%s)", q.Left.Text(), where, how)
	}
	return note
}

// fftKinkHow is how a circle's kinks' traces are taken where not exactly.
const fftKinkHow = "; its trace's Fourier coefficients, which fall like k^-4 (a step's like k^-3), by an FFT of at least 16384 samples)"

// addModes adds the kinks' modes on the circle of radius r to the
// quadrature's, as many as the kinks need: their coefficients fall like
// k⁻⁴ (a jump in the third derivative where the line crosses), and the
// modes stop after the last one above the tolerance's share.
//
// The tail returned is what the modes left out add up to, the bound on
// their share of the solution: a value datum of mode k moves u by about
// itself, a slope datum by about r/k (the harmonic part's r^k or r^−k has
// slope k/r), so slopes are weighted by r/k. Beyond the modes computed,
// Σ_{k>n} a·(n/k)⁴ ≤ a·n/3 for values and Σ a·(n/k)⁴·r/k ≤ a·r/4 for slopes,
// a the last coefficient.
func addModes(pm, dpm [][2]float64, q *ansatz.Quadrature, r float64, slope bool, most int) (p, dp [][2]float64, tail float64) {
	kp, kdp := q.KinkModes(r, most)
	use := kp // the data the side's condition reads: values, or with a flux the slopes
	if slope {
		use = kdp
	}
	share := func(m int) float64 { // a mode's datum's share of u, per unit
		if slope {
			return r / float64(max(m, 1))
		}
		return 1
	}
	size := 0.0
	for m, v := range use {
		size = math.Max(size, math.Hypot(v[0], v[1])*share(m))
	}
	// The fewest modes whose omitted rest — those computed, summed, and
	// beyond them the k⁻⁴ tail — is within a quarter of the tolerance.
	last := len(use) - 1
	tail = math.Hypot(use[last][0], use[last][1]) * float64(len(use)) / 3
	if slope {
		tail = math.Hypot(use[last][0], use[last][1]) * r / 4
	}
	top := last
	for top > 0 {
		a := math.Hypot(use[top][0], use[top][1]) * share(top)
		if tail+a > q.Tol*size/4 {
			break
		}
		tail += a
		top--
	}
	kp, kdp = kp[:top+1], kdp[:top+1]
	n := max(len(pm), len(kp))
	p, dp = make([][2]float64, n), make([][2]float64, n)
	for m := 0; m < n; m++ {
		for j := 0; j < 2; j++ {
			if m < len(pm) {
				p[m][j], dp[m][j] = pm[m][j], dpm[m][j]
			}
			if m < len(kp) {
				p[m][j] += kp[m][j]
				dp[m][j] += kdp[m][j]
			}
		}
	}
	return p, dp, tail
}

// decimal is x rounded to 15 digits as an exact decimal.
func decimal(x float64) series.Coef { return decimalDigits(x, 15) }

// decimalDigits is x rounded to the given significant digits as an exact
// decimal.
func decimalDigits(x float64, digits int) series.Coef {
	if x == 0 || math.IsNaN(x) {
		return series.Coef{}
	}
	q, _ := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', digits, 64))
	return series.RatCoef(q)
}

// quadratureDisk names a section's quadrature disk in its note.
func quadratureDisk(q *ansatz.Quadrature) string {
	if !q.Centred() {
		return fmt.Sprintf(" on the disk r < %.6g around the section", q.R)
	}
	return fmt.Sprintf(" on the disk of radius %.6g about (%.6g, %.6g), around the section", q.R, q.X0, q.Y0)
}
