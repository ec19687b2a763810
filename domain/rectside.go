package domain

import (
	"fmt"
	"math"
	"math/big"
	"strings"

	"psol/ansatz"
	"psol/series"
)

// Wall is one side of the rectangle [0, L] × [0, H], by position.
type Wall int

const (
	Left   Wall = iota // x = 0
	Right              // x = L
	Bottom             // y = 0
	Top                // y = H
)

var sideNames = [...]string{"left", "right", "bottom", "top"}

func (s Wall) String() string { return sideNames[s] }

// SideSeries is the harmonic function that equals Σ b_n sin(nπs/ℓ) on one
// side and vanishes on the other three (Dirichlet): along the side the
// coordinate s runs over [0, ℓ]; across, the factor
//
//	sinh(nπ d/ℓ)/sinh(nπ w/ℓ),  d the distance from the opposite side, w the width,
//
// is evaluated as e^(−nπ(w−d)/ℓ)(1 − e^(−2nπd/ℓ))/(1 − e^(−2nπw/ℓ)), which
// neither overflows nor loses digits for large n.
type SideSeries struct {
	Wall Wall
	B    series.Coef // b_n, general in n
	L, H series.Coef
	// Fam is the along-side family Φ_n(s) = sin/cos(ν_n π s/ℓ), set by the
	// two neighbouring sides (values: sine ends, insulated: cosine ends); the
	// zero value is the sine family for values on both neighbours.
	Fam series.Family
	// Flux marks a side whose condition is dn(u) = g; Insulated, an opposite
	// side with dn(u) = 0. Across, the factor is then
	//	values here, values opposite:      sinh(kd)/sinh(kw)
	//	values here, insulated opposite:   cosh(kd)/cosh(kw)
	//	flux here, values opposite:        sinh(kd)/(k cosh(kw))
	//	flux here, insulated opposite:     cosh(kd)/(k sinh(kw))
	Flux, Insulated bool
	// B0 is the coefficient of the constant mode (n = 0 of a cosine family), apart.
	B0 *series.Coef
}

// family is Fam, or the sine family when unset.
func (s SideSeries) family() series.Family {
	if s.Fam.Slope == nil {
		return series.Family{Sin: true, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}
	}
	return s.Fam
}

// along is the side's length ℓ and the width w across.
func (s SideSeries) along() (l, w series.Coef) {
	if s.Wall == Left || s.Wall == Right {
		return s.H, s.L
	}
	return s.L, s.H
}

// Text prints the series in psol's syntax.
func (s SideSeries) Text() string {
	l, w := s.along()
	lt, wt := paren(l.Text()), paren(w.Text())
	sv, d := s.coords(false)
	b := series.Const(s.B).Text()
	if len(b) > 1 && (strings.ContainsAny(b[1:], " ") || strings.ContainsAny(b, "/")) {
		b = "(" + b + ")"
	}
	over := "/" + lt
	if lt == "1" {
		over = ""
	}
	fam := s.family()
	nu := fam.Nu(series.IndexCoef).Text()
	if strings.ContainsAny(nu, " ") {
		nu = "(" + nu + ")"
	}
	k := nu + "*pi"
	phi := "sin"
	if !fam.Sin {
		phi = "cos"
	}
	num, den := s.acrossFunctions("")
	denom := den + "(" + k + "*" + wt + over + ")"
	if s.Flux {
		denom = "((" + k + over + ")*" + denom + ")"
	}
	from := fam.From
	head := ""
	if s.B0 != nil { // the constant mode, apart
		from = 1
		if !s.B0.IsZero() {
			head = "(" + s.B0.Text() + ")*" + s.constantAcross(false) + " + "
		}
	}
	if s.B.IsZero() && head != "" { // the constant mode alone
		return strings.TrimSuffix(head, " + ")
	}
	return head + "sum(n=" + fmt.Sprint(from) + "..inf, " + b + "*" + phi + "(" + k + "*" + sv + over + ")*" + num + "(" + k + "*" + d + over + ")/" + denom + ")"
}

// constantAcross is the constant mode's factor across: 1, d, or d/w.
func (s SideSeries) constantAcross(latex bool) string {
	_, w := s.along()
	_, d := s.coords(latex)
	switch {
	case s.Insulated:
		return "1"
	case s.Flux:
		return d
	}
	if w.Equal(series.IntCoef(1)) {
		return d
	}
	if latex {
		return `\frac{` + d + `}{` + w.LaTeX() + `}`
	}
	return d + "/" + paren(w.Text())
}

// coords names the along and the across coordinate (distance from the opposite side).
func (s SideSeries) coords(latex bool) (along, across string) {
	_, w := s.along()
	if latex {
		return s.Wall.coords(w.LaTeX())
	}
	return s.Wall.coords(w.Text())
}

// coords are the side's along and across coordinates, the width written w.
func (s Wall) coords(w string) (along, across string) {
	switch s {
	case Bottom:
		return "x", "(" + w + " - y)"
	case Top:
		return "x", "y"
	case Left:
		return "y", "(" + w + " - x)"
	}
	return "y", "x"
}

// LaTeX prints the series with \sum.
func (s SideSeries) LaTeX() string {
	l, w := s.along()
	sv, d := s.coords(true)
	fam := s.family()
	k := `\frac{` + fam.Nu(series.IndexCoef).LaTeX() + ` \pi}{` + l.LaTeX() + `}`
	if l.Equal(series.IntCoef(1)) { // no \frac{…}{1}
		k = fam.Nu(series.IndexCoef).LaTeX() + ` \pi`
	}
	// w = 1 multiplies nothing: kπ·1 prints as kπ.
	wTeX := " " + w.LaTeX()
	if w.Equal(series.IntCoef(1)) {
		wTeX = ""
	}
	phi := `\sin`
	if !fam.Sin {
		phi = `\cos`
	}
	num, den := s.acrossFunctions(`\`)
	denom := den + `\left(` + k + wTeX + `\right)`
	if s.Flux {
		denom = k + " " + denom
	}
	from, head := fam.From, ""
	if s.B0 != nil {
		from = 1
		if !s.B0.IsZero() {
			head = `\left(` + s.B0.LaTeX() + `\right) ` + s.constantAcross(true) + " + "
		}
	}
	if s.B.IsZero() && head != "" {
		return strings.TrimSuffix(head, " + ")
	}
	return head + `\sum_{n=` + fmt.Sprint(from) + `}^{\infty} \left(` + series.Const(s.B).LaTeX() + `\right) ` + phi + `\left(` + k + " " + sv + `\right) \frac{` + num + `\left(` + k + " " + d + `\right)}{` + denom + `}`
}

// CompiledSide evaluates a side series.
type CompiledSide struct {
	side            Wall
	b               func(n float64) float64
	l, w            float64
	bs              []float64 // cached b_n
	sin             bool
	slope, offset   float64
	from            int
	flux, insulated bool
	b0              float64
	zero            bool // no term: the side's correction vanishes
	constantOnly    bool // the constant mode alone: the general term is 0
}

// Compile fixes parameters for evaluation.
func (s SideSeries) Compile(env series.Env) (*CompiledSide, error) {
	b, err := s.B.IndexFunc(env)
	if err != nil {
		return nil, err
	}
	l, w := s.along()
	lf, err := l.Float(env)
	if err != nil {
		return nil, err
	}
	wf, err := w.Float(env)
	fam := s.family()
	slope, _ := fam.Slope.Float64()
	offset, _ := fam.Offset.Float64()
	cs := &CompiledSide{side: s.Wall, b: b, l: lf, w: wf, sin: fam.Sin, slope: slope, offset: offset, from: fam.From, flux: s.Flux, insulated: s.Insulated,
		zero: s.B.IsZero() && (s.B0 == nil || s.B0.IsZero()), constantOnly: s.B.IsZero()}
	if s.B0 != nil {
		if cs.b0, err = s.B0.Float(env); err != nil {
			return nil, err
		}
	}
	return cs, err
}

// across is the factor Y(d) with k = ν π/ℓ, in a form that neither overflows
// nor loses digits for large k; k = 0 (the constant mode) takes its limit.
func (c *CompiledSide) across(k, d float64) float64 {
	if k == 0 {
		switch {
		case c.insulated && c.flux:
			return math.NaN() // no such mode: excluded by the solver
		case c.insulated:
			return 1
		case c.flux:
			return d
		}
		return d / c.w
	}
	e := math.Exp(-k * (c.w - d))
	sh, ch := -math.Expm1(-2*k*d), 1+math.Exp(-2*k*d)
	shw, chw := -math.Expm1(-2*k*c.w), 1+math.Exp(-2*k*c.w)
	switch {
	case c.insulated && c.flux:
		return e * ch / (k * shw)
	case c.insulated:
		return e * ch / chw
	case c.flux:
		return e * sh / (k * chw)
	}
	return e * sh / shw
}

func (c *CompiledSide) coef(n int) float64 {
	if n == 0 {
		return c.b0
	}
	k := n - c.from
	for len(c.bs) <= k {
		c.bs = append(c.bs, c.b(float64(c.from+len(c.bs))))
	}
	return c.bs[k]
}

// At sums the series at (x, y) until n·|term bound| < tol·max(1, |sum|), at most maxTerms.
// The wave numbers k_n = (slope·n + offset)π/ℓ step evenly, so the across
// factor's exponentials are running products and the sines and cosines
// follow T_(n+1) = 2cos(Δk s)T_n − T_(n−1): a few multiplications a term.
func (c *CompiledSide) At(x, y, tol float64, maxTerms int) (sum, tail float64) {
	if c.zero {
		return 0, 0
	}
	s, d := c.local(x, y)
	n0 := c.from
	if n0 == 0 { // the constant mode, apart
		sum += c.b0 * c.across(0, d)
		n0 = 1
	}
	dk := c.slope * math.Pi / c.l
	k0 := (c.slope*float64(n0) + c.offset) * math.Pi / c.l
	// e^(−k(w−d)), e^(−2kd), e^(−2kw) at k0 and their ratios per step.
	e, eStep := math.Exp(-k0*(c.w-d)), math.Exp(-dk*(c.w-d))
	ed, edStep := math.Exp(-2*k0*d), math.Exp(-2*dk*d)
	ew, ewStep := math.Exp(-2*k0*c.w), math.Exp(-2*dk*c.w)
	trig := math.Cos
	if c.sin {
		trig = math.Sin
	}
	cur, prev, twoCos := trig(k0*s), trig((k0-dk)*s), 2*math.Cos(dk*s)
	stop := stopRule{runs: 4}
	tail = math.Inf(1)
	if c.constantOnly { // no general term: the constant mode is the whole series
		return sum, 0
	}
	k := k0
	for n := n0; n < c.from+maxTerms; n++ {
		b := c.coef(n)
		if b != 0 {
			var across float64
			switch sh, ch, shw, chw := 1-ed, 1+ed, 1-ew, 1+ew; {
			case c.insulated && c.flux:
				across = e * ch / (k * shw)
			case c.insulated:
				across = e * ch / chw
			case c.flux:
				across = e * sh / (k * chw)
			default:
				across = e * sh / shw
			}
			term := b * across
			sum += term * cur
			tail = float64(n+1) * math.Abs(term)
			if stop.small(tail, sum, tol) {
				break
			}
		} else {
			stop.quiet++
		}
		e, ed, ew, k = e*eStep, ed*edStep, ew*ewStep, k+dk
		cur, prev = twoCos*cur-prev, cur
	}
	return sum, tail
}

// Integral is ∬ over the rectangle: Σ b_n · ℓ(1 − (−1)^n)/(nπ) · (ℓ/(nπ)) tanh(nπw/(2ℓ)),
// since ∫_0^w sinh(kd)/sinh(kw) dd = (cosh(kw) − 1)/(k sinh(kw)) = tanh(kw/2)/k.
func (c *CompiledSide) Integral(tol float64, maxTerms int) float64 {
	if c.zero {
		return 0
	}
	if !c.sin || c.offset != 0 || c.flux || c.insulated {
		return c.integralByQuadrature()
	}
	sum, stop := 0.0, stopRule{runs: 8} // even n give 0: ask for a longer run of small terms
	for n := 1; n <= maxTerms; n++ {
		k := float64(n) * math.Pi / c.l
		odd := 1 - math.Pow(-1, float64(n))
		term := c.coef(n) * odd / k * math.Tanh(k*c.w/2) / k
		sum += term
		if stop.small(math.Abs(term)*float64(n), sum, tol) {
			break
		}
	}
	return sum
}

// integralByQuadrature is the series' area integral by a tensor Gauss–Legendre
// rule on 16×16 panels, for the families without a closed form here.
func (c *CompiledSide) integralByQuadrature() float64 {
	return ansatz.TensorIntegral(func(s, d float64) float64 {
		px, py := c.point(s, d)
		v, _ := c.At(px, py, 1e-13, CheckTerms)
		return v
	}, c.l, c.w, 16)
}

// local is the point (x, y) as (s along the side, d from the opposite side),
// from the rectangle's table of sides.
func (c *CompiledSide) local(x, y float64) (s, d float64) {
	e := rectEdges[c.side]
	s, across := x, y
	if e.alongY {
		s, across = y, x
	}
	if e.far {
		return s, across
	}
	return s, c.w - across
}

// point is local's inverse.
func (c *CompiledSide) point(s, d float64) (x, y float64) {
	e := rectEdges[c.side]
	across := c.w - d
	if e.far {
		across = d
	}
	if e.alongY {
		return across, s
	}
	return s, across
}

// acrossFunctions names the across factor's numerator and denominator
// functions, with a prefix (a backslash for LaTeX).
func (s SideSeries) acrossFunctions(prefix string) (num, den string) {
	num, den = "sinh", "sinh"
	switch {
	case s.Insulated && s.Flux:
		num, den = "cosh", "sinh"
	case s.Insulated:
		num, den = "cosh", "cosh"
	case s.Flux:
		num, den = "sinh", "cosh"
	}
	return prefix + num, prefix + den
}

// stopRule ends a series sum once runs terms in a row have a bound below
// tol·max(1, |sum|): one term can be small by accident (a zero of sin nπ/2).
type stopRule struct{ runs, quiet int }

func (r *stopRule) small(bound, sum, tol float64) bool {
	if sum < 0 { // |sum|, kept simple enough to inline in the hot loops
		sum = -sum
	}
	if sum < 1 {
		sum = 1
	}
	if !(bound <= tol*sum) { // NaN is never small
		r.quiet = 0
		return false
	}
	r.quiet++
	return r.quiet >= r.runs
}
