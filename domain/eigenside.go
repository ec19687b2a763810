package domain

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/dsp/fourier"

	"psol/series"
)

// End is a homogeneous condition at one end of a side's coordinate, or on a
// side itself: v = 0, ∂v/∂n = 0, or ∂v/∂n + h·v = 0 (n the outward normal).
type End struct {
	Kind Kind    // Dirichlet: v = 0; Neumann: ∂v/∂n = 0; Robin: ∂v/∂n + h·v = 0
	H    float64 // the Robin coefficient, h ≥ 0
}

// phase is δ(μ) = atan(h/μ): π/2 for a value, 0 for a flux.
func (e End) phase(mu float64) float64 {
	switch e.Kind {
	case Dirichlet:
		return math.Pi / 2
	case Neumann:
		return 0
	}
	return math.Atan2(e.H, mu)
}

// EigenSide is the harmonic function on the rectangle that meets a side's
// operator with data c(s) there and homogeneous conditions on the other
// three sides, for any mix of values, fluxes and Robin conditions, with
// numeric coefficients:
//
//	v(s, d) = Σ_n b_n X_n(s) Y_n(d),  X_n(s) = cos(μ_n s − δ_0(μ_n)),
//
// s along the side in [0, ℓ], d the distance from the opposite side in
// [0, w]. The X_n are the Sturm–Liouville eigenfunctions of the neighbours'
// conditions: X'(0) = h_0 X(0) gives δ_0 = atan(h_0/μ), and the condition at
// s = ℓ the eigenvalue equation μℓ = δ_0(μ) + δ_1(μ) + (n − 1)π, solved by
// bisection (its left side minus its right increases with μ). b_n =
// ∫ c X_n ds / ∫ X_n² ds by composite Gauss–Legendre; across, Y_n solves
// Y” = μ²Y with the opposite side's condition at d = 0 and the side's own
// operator equal to 1 at d = w, written with decaying exponentials.
type EigenSide struct {
	Wall       Wall
	L, H       float64
	Start, End End // the neighbours at s = 0 and s = ℓ
	Opposite   End
	Own        End // the side's own operator (its H for a Robin side)
	Data       func(s float64) float64
	Breaks     []float64 // where the data jump (panel edges go there; see Jumps)
	Label      string    // how the data are written, for printing
	Modes      int       // the modes computed (default 512)

	mu, delta, b []float64
	constant     bool    // a mode μ = 0 (flux at both ends)
	b0           float64 // its coefficient
}

// ErrSingular is Prepare's answer for an operator that annihilates the
// constant mode its data need (flux conditions all round).
var ErrSingular = fmt.Errorf("the flux data are incompatible with the source: the correction's mean on a side with flux conditions all round must be 0")

func (e *EigenSide) along() (l, w float64) {
	if e.Wall == Left || e.Wall == Right {
		return e.H, e.L
	}
	return e.L, e.H
}

// Prepare computes the eigenvalues and the coefficients.
func (e *EigenSide) Prepare() error {
	if e.Modes == 0 {
		e.Modes = 512
	}
	l, _ := e.along()
	e.constant = e.Start.Kind == Neumann && e.End.Kind == Neumann
	// Gauss–Legendre nodes enough for the highest mode's oscillation, with
	// panel edges at the data's jumps (data given piece by piece).
	x, w := legendreX, legendreW
	panels := e.Modes/4 + 16
	edges := []float64{0}
	jumps := append([]float64(nil), e.Breaks...)
	for i := 1; i <= panels; i++ {
		next := l * float64(i) / float64(panels)
		for len(jumps) > 0 && jumps[0] < next {
			if jumps[0] > edges[len(edges)-1] {
				edges = append(edges, jumps[0])
			}
			jumps = jumps[1:]
		}
		if next > edges[len(edges)-1] {
			edges = append(edges, next)
		}
	}
	var ns, ws, cs []float64
	for i := 0; i+1 < len(edges); i++ {
		lo, hi := edges[i], edges[i+1]
		for k, xk := range x {
			s := (lo+hi)/2 + (hi-lo)/2*xk
			ns, ws, cs = append(ns, s), append(ws, (hi-lo)/2*w[k]), append(cs, e.Data(s))
		}
	}
	if e.constant {
		mean := 0.0
		for i := range ns {
			mean += ws[i] * cs[i]
		}
		e.b0 = mean / l
		if e.across0(1) == 0 {
			if math.Abs(e.b0) > 1e-12*maxAbsSlice(cs) {
				return ErrSingular
			}
			e.b0 = 0
		}
	}
	e.mu, e.delta, e.b = make([]float64, e.Modes), make([]float64, e.Modes), make([]float64, e.Modes)
	for n := 1; n <= e.Modes; n++ {
		e.mu[n-1] = e.eigenvalue(n, l)
		e.delta[n-1] = e.Start.phase(e.mu[n-1])
	}
	var proj []float64
	if uniform := len(edges) == panels+1; uniform {
		proj = e.uniformProjections(cs, panels)
	}
	if proj == nil {
		proj = e.projections(ns, ws, cs)
	}
	for n, mu := range e.mu {
		d0 := e.delta[n]
		norm := l/2 + (math.Sin(2*(mu*l-d0))+math.Sin(2*d0))/(4*mu)
		e.b[n] = proj[n] / norm
	}
	// Below the quadrature's rounding a coefficient is noise (a correction
	// with no such mode): drop it.
	floor := 1e-14 * maxAbsSlice(cs)
	for n := range e.b {
		if math.Abs(e.b[n]) < floor {
			e.b[n] = 0
		}
	}
	return nil
}

// Jumps locates the discontinuities of f on [0, l]: on 2048 cells, a
// step far larger than its neighbours' is bisected to rounding.
func Jumps(f func(float64) float64, l float64) []float64 {
	const n = 2048
	v := make([]float64, n+1)
	for i := range v {
		v[i] = f(l * float64(i) / n)
	}
	scale := maxAbsSlice(v)
	var out []float64
	for i := 0; i < n; i++ {
		d := math.Abs(v[i+1] - v[i])
		left, right := 0.0, 0.0
		if i > 0 {
			left = math.Abs(v[i] - v[i-1])
		}
		if i+1 < n {
			right = math.Abs(v[i+2] - v[i+1])
		}
		if d <= 1e-9*scale || d <= 20*math.Max(left, right) {
			continue
		}
		lo, hi := l*float64(i)/n, l*float64(i+1)/n
		flo, fhi := v[i], v[i+1]
		for it := 0; it < 60 && hi-lo > 1e-15*l; it++ {
			mid := (lo + hi) / 2
			fm := f(mid)
			if math.Abs(fm-flo) < math.Abs(fm-fhi) {
				lo, flo = mid, fm
			} else {
				hi, fhi = mid, fm
			}
		}
		out = append(out, (lo+hi)/2)
	}
	return out
}

func maxAbsSlice(v []float64) float64 {
	m := 0.0
	for _, x := range v {
		m = math.Max(m, math.Abs(x))
	}
	return m
}

// eigenvalue is the n-th root of μℓ − δ_0(μ) − δ_1(μ) = (n − 1)π, with n
// counted from the first positive root (a flux at both ends has μ = 0 apart).
// projections are ∫ c X_n ds for every mode on the nodes ns, weights ws and
// data cs. With values or fluxes at both ends the μ_n are evenly spaced by
// π/ℓ and δ_0 is fixed, so X_n(s) comes by rotating X_{n−1}(s) through the
// angle πs/ℓ, restarted from the cosine every 4 modes (a cosine per node
// and mode was a third of a rectangle's numeric solve). The rotations add
// rounding of the size the phases μs already carry (about 1e-14 of the
// data in b_n, the noise floor below); longer runs between restarts
// raise it. A Robin end spaces the μ_n unevenly, and each takes its cosine.
func (e *EigenSide) projections(ns, ws, cs []float64) []float64 {
	proj := make([]float64, len(e.mu))
	fixed := func(k Kind) bool { return k == Dirichlet || k == Neumann }
	if !fixed(e.Start.Kind) || !fixed(e.End.Kind) {
		for n, mu := range e.mu {
			for i, s := range ns {
				proj[n] += ws[i] * cs[i] * math.Cos(mu*s-e.delta[n])
			}
		}
		return proj
	}
	l, _ := e.along()
	step := math.Pi / l
	for i, s := range ns {
		wc := ws[i] * cs[i]
		s1, c1 := math.Sincos(step * s)
		var c, sn float64
		for n, mu := range e.mu {
			if n%4 == 0 {
				sn, c = math.Sincos(mu*s - e.delta[n])
			}
			proj[n] += wc * c
			c, sn = c*c1-sn*s1, sn*c1+c*s1
		}
	}
	return proj
}

// uniformProjections are projections' sums by FFT, for data on P equal
// panels of 16 nodes (no breaks) and evenly spaced μ_n = (n₀ + n)π/ℓ (a
// value or a flux at each end, so a constant δ): node k of panel p sits at
// s = (p + t_k)Δ, Δ = ℓ/P, t_k = (1 + x_k)/2, so
//
//	Σ_{p,k} W_k c_pk cos(μ_n s − δ) = Re[e^(−iδ) Σ_k W_k e^(iμ_n t_k Δ) X_k(n)],
//	X_k(n) = Σ_p c_pk e^(iπ n₀ p/P) e^(2πi n p/(2P)),
//
// a DFT of length 2P for each k, periodic in n. 16 transforms of 2P points
// and 16·N products replace the 16·N·P of the direct sums (a third of a
// rectangle's numeric solve), with the DFT's rounding, about ε·log P of the
// data, against the direct sum's. nil when the μ_n are not so spaced.
func (e *EigenSide) uniformProjections(cs []float64, P int) []float64 {
	fixed := func(k Kind) bool { return k == Dirichlet || k == Neumann }
	if !fixed(e.Start.Kind) || !fixed(e.End.Kind) || len(cs) != P*len(legendreX) || len(e.mu) == 0 {
		return nil
	}
	l, _ := e.along()
	n0 := e.mu[0] * l / math.Pi
	if math.Abs(2*n0-math.Round(2*n0)) > 1e-9 {
		return nil
	}
	n0 = math.Round(2*n0) / 2
	for n, mu := range e.mu {
		if math.Abs(mu*l/math.Pi-(n0+float64(n))) > 1e-9*(n0+float64(n)+1) {
			return nil
		}
	}
	delta := e.delta[0]
	fft := fourier.NewCmplxFFT(2 * P)
	y := make([]complex128, 2*P)
	X := make([]complex128, 2*P)
	acc := make([]complex128, len(e.mu))
	for k, xk := range legendreX {
		tk := (1 + xk) / 2
		// Coefficients gives Σ y_p e^(−2πi n p/2P): conjugate in and out.
		for p := 0; p < P; p++ {
			sn, c := math.Sincos(math.Pi * n0 * float64(p) / float64(P))
			y[p] = complex(cs[p*len(legendreX)+k], 0) * complex(c, -sn)
		}
		for p := P; p < 2*P; p++ {
			y[p] = 0
		}
		fft.Coefficients(X, y)
		W := legendreW[k] * l / float64(P) / 2
		for n := range e.mu {
			sn, c := math.Sincos(math.Pi*(n0+float64(n))*tk/float64(P) - delta)
			x := X[n%(2*P)]
			acc[n] += complex(W*c, W*sn) * complex(real(x), -imag(x))
		}
	}
	proj := make([]float64, len(e.mu))
	for n, a := range acc {
		proj[n] = real(a)
	}
	return proj
}

func (e *EigenSide) eigenvalue(n int, l float64) float64 {
	k := float64(n - 1)
	if e.constant {
		k = float64(n)
	}
	f := func(mu float64) float64 { return mu*l - e.Start.phase(mu) - e.End.phase(mu) - k*math.Pi }
	lo, hi := math.Max(k*math.Pi/l, 1e-300), (k+1)*math.Pi/l
	for i := 0; i < 200 && hi-lo > 1e-15*hi; i++ {
		mid := (lo + hi) / 2
		if f(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}

// across is Y_n(d) for μ > 0: with Z(d) = P e^(μd) + M e^(−μd) meeting the
// opposite side's condition, Y = Z/B[Z](w), B = a + b ∂_d the own operator.
func (e *EigenSide) across(mu, d float64) float64 {
	_, w := e.along()
	var P, M float64
	switch e.Opposite.Kind {
	case Dirichlet: // sinh
		P, M = 0.5, -0.5
	case Neumann: // cosh
		P, M = 0.5, 0.5
	default: // −Z'(0) + h Z(0) = 0: μ cosh + h sinh
		P, M = (mu+e.Opposite.H)/2, (mu-e.Opposite.H)/2
	}
	a, b := e.own()
	num := P + M*math.Exp(-2*mu*d)
	den := (a+b*mu)*P + (a-b*mu)*M*math.Exp(-2*mu*w)
	return math.Exp(mu*(d-w)) * num / den
}

// own is the own operator as a·v + b·∂v/∂n.
func (e *EigenSide) own() (a, b float64) {
	switch e.Own.Kind {
	case Dirichlet:
		return 1, 0
	case Neumann:
		return 0, 1
	}
	return e.Own.H, 1
}

// across0 is the constant mode's factor: Z = 1 + h_o d (d for a value
// opposite), over a·Z(w) + b·Z'(w); 0 when that vanishes.
func (e *EigenSide) across0(d float64) float64 {
	_, w := e.along()
	z, dz := 1.0, 0.0
	switch e.Opposite.Kind {
	case Dirichlet:
		z, dz = 0, 1
	case Robin:
		dz = e.Opposite.H
	}
	a, b := e.own()
	den := a*(z+dz*w) + b*dz
	if den == 0 {
		return 0
	}
	return (z + dz*d) / den
}

// At sums the series at (x, y) until the terms, bounded by |b_n Y_n|, stay
// below tol·max(1, |sum|) for four in a row; tail is the last bound times n.
func (e *EigenSide) At(x, y, tol float64, maxTerms int) (sum, tail float64) {
	s, d := e.local(x, y)
	if e.constant {
		sum = e.b0 * e.across0(d)
	}
	stop := stopRule{runs: 4}
	tail = math.Inf(1)
	for n := 0; n < len(e.b) && n < maxTerms; n++ {
		term := e.b[n] * e.across(e.mu[n], d)
		sum += term * math.Cos(e.mu[n]*s-e.delta[n])
		tail = float64(n+1) * math.Abs(term)
		if stop.small(tail, sum, tol) {
			break
		}
	}
	// The modes beyond the computed ones: about the last ones' size, times
	// n — the largest of the last four, since symmetric data leave every
	// other coefficient 0 and the very last one may be among them.
	for n := max(0, len(e.b)-4); n < len(e.b); n++ {
		tail = math.Max(tail, math.Abs(e.b[n]*e.across(e.mu[n], d))*float64(len(e.b)))
	}
	return sum, tail
}

// Integral is ∬ v over the rectangle: Σ b_n ∫X_n ds ∫Y_n dd, each factor by
// a 16-point Gauss–Legendre rule on enough panels, plus the constant mode.
func (e *EigenSide) Integral(tol float64, maxTerms int) float64 {
	l, w := e.along()
	x, wts := legendreX, legendreW
	integrate := func(f func(float64) float64, length float64, panels int) float64 {
		total := 0.0
		for i := 0; i < panels; i++ {
			lo, hi := length*float64(i)/float64(panels), length*float64(i+1)/float64(panels)
			for k, xk := range x {
				total += (hi - lo) / 2 * wts[k] * f((lo+hi)/2+(hi-lo)/2*xk)
			}
		}
		return total
	}
	total := 0.0
	if e.constant {
		total = e.b0 * l * integrate(e.across0, w, 4)
	}
	for n := 0; n < len(e.b) && n < maxTerms; n++ {
		mu, d0 := e.mu[n], e.delta[n]
		ix := (math.Sin(mu*l-d0) + math.Sin(d0)) / mu
		iy := integrate(func(d float64) float64 { return e.across(mu, d) }, w, 8)
		total += e.b[n] * ix * iy
	}
	return total
}

// local is the point (x, y) as (s along the side, d from the opposite side).
func (e *EigenSide) local(x, y float64) (s, d float64) {
	_, w := e.along()
	switch e.Wall {
	case Bottom:
		return x, w - y
	case Top:
		return x, y
	case Left:
		return y, w - x
	}
	return y, x
}

// IsZero reports a series with no nonzero coefficient.
func (e *EigenSide) IsZero() bool {
	if e.constant && e.b0 != 0 {
		return false
	}
	for _, b := range e.b {
		if b != 0 {
			return false
		}
	}
	return true
}

// Text prints the series with its leading coefficients and eigenvalues as
// decimals: sum(n=1..N, b_n*cos(mu_n*s - delta_n)*Y_n(d)), then the values.
func (e *EigenSide) Text() string { return e.describe(false) }

// LaTeX is Text as LaTeX.
func (e *EigenSide) LaTeX() string { return e.describe(true) }

func (e *EigenSide) describe(latex bool) string {
	if e.IsZero() {
		return "0"
	}
	_, w := e.along()
	sv, d := e.Wall.coords(fmt.Sprintf("%.12g", w))
	var bs, mus []string
	for n := 0; n < len(e.b) && n < 4; n++ {
		bs, mus = append(bs, fmt.Sprintf("%.6g", e.b[n])), append(mus, fmt.Sprintf("%.9g", e.mu[n]))
	}
	// The constant mode is linear across: b_0 (1 + h_o d)/(a Z(w) + b Z'(w)).
	head := ""
	if e.constant && e.b0 != 0 {
		switch e.Opposite.Kind {
		case Dirichlet:
			head = fmt.Sprintf("%.12g*%s", e.b0*e.across0(1), d)
		case Neumann:
			head = fmt.Sprintf("%.12g", e.b0*e.across0(0))
		default:
			c0 := e.b0 * e.across0(0)
			head = fmt.Sprintf("%.12g*(1 + %.12g*%s)", c0, e.Opposite.H, d)
		}
		if latex {
			head = strings.ReplaceAll(head, "*", " ")
		}
		if allZeroFloats(e.b) {
			return head
		}
		head += " + "
	}
	if latex {
		for i := range bs {
			bs[i] = series.LaTeXNumber(bs[i])
		}
		for i := range mus {
			mus[i] = series.LaTeXNumber(mus[i])
		}
		return head + fmt.Sprintf(`\sum_{n=1}^{%d} b_n \cos\left(\mu_n %s - \delta_n\right) Y_n(%s),\ b_n \approx %s, \dots;\ \mu_n \approx %s, \dots`,
			len(e.b), sv, d, strings.Join(bs, ", "), strings.Join(mus, ", "))
	}
	// Y_n is Z_n over the side's operator on it there; Z_n meets the opposite side.
	z := map[Kind]string{Dirichlet: "sinh(mu_n*d)", Neumann: "cosh(mu_n*d)", Robin: fmt.Sprintf("mu_n*cosh(mu_n*d) + %.12g*sinh(mu_n*d)", e.Opposite.H)}[e.Opposite.Kind]
	return head + fmt.Sprintf("sum(n=1..%d, b_n*cos(mu_n*%s - delta_n)*Y_n(%s)) with b_n ≈ %s, ...; mu_n ≈ %s, ...; Y_n(d) = Z_n(d)/(the side's operator on Z_n at d = %.12g), Z_n(d) = %s",
		len(e.b), sv, d, strings.Join(bs, ", "), strings.Join(mus, ", "), w, z)
}

func allZeroFloats(v []float64) bool {
	for _, x := range v {
		if x != 0 {
			return false
		}
	}
	return true
}
