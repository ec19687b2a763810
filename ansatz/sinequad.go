package ansatz

import (
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
	"gonum.org/v1/gonum/floats"
)

// SineQuadrature is a particular solution of Δu = g on the rectangle
// [0, L] × [0, H] for a source with no closed form. At each end x_e of the
// x-range the source's value a_e(y) and second x-derivative c_e(y) (by
// differences) are taken out with φ₀(x) = 1 − x/L and the cubic φ₁ with
// φ₁” = φ₀, φ₁(0) = φ₁(L) = 0 (mirrored, φ(L − x), at x = L), so that
// g̃ = g − Σ_e [φ₀ a_e + φ₁ c_e] and its second derivative vanish at both
// ends and its sine coefficients fall like m⁻⁵. Then
//
//	u = Σ_e [φ₀(A_e − E_e) + φ₁ D_e] + Σ_m sin(k_m x) v_m(y),   k_m = mπ/L,
//
// with A_e = I[a_e], D_e = I[c_e], E_e = I[D_e], I[f](y) = ∫_0^y (y − t) f dt
// (so I[f]” = f, and Δ(φ₁D − φ₀E) = φ₀D + φ₁c − φ₀D = φ₁c); g̃_m by FFT of
// the odd extension, and v_m” − k_m² v_m = g̃_m with v_m(0) = v_m(H) = 0 by
// the Green's function
//
//	v_m(y) = −[sinh(k(H−y)) ∫_0^y sinh(kt) g̃_m dt + sinh(ky) ∫_y^H sinh(k(H−t)) g̃_m dt]/(k sinh kH),
//
// written with decaying exponentials. The y-integrals run on Gauss–Legendre
// panels bisected until each function is resolved to Tol, whole panels by
// their separated sums and the panel that holds y split there; a mesh with
// every panel halved gives the values and, by the difference, the estimate.
type SineQuadrature struct {
	G       func(x, y float64) float64
	L, H    float64
	Tol     float64
	Samples int // points along x, fixed by Prepare
	Modes   int
	// Converged is false where the samples reached their cap first;
	// Truncation then estimates the modes beyond them.
	Converged  bool
	Truncation float64

	coarse, fine []sinePanel
	dropped      float64
	ffts         map[int]*fourier.FFT // by length
	coef         []complex128         // the transforms' output, reused
	scale        float64              // the probes' largest mode, weighted by its share of u
	modeBuf      []float64            // split's modes at a point
	den          []float64            // 2k_m(1 − e^(−2k_m H))
	lines        map[float64]*sineAt  // lines already evaluated (a grid's rows), bounded
}

// The edge functions of a panel, by index: a_0, a_1, c_0, c_1 (values and
// second x-derivatives at x = 0 and L) and D_0, D_1 = I[c_0], I[c_1], filled
// in once the mesh is built.
const (
	edgeA0 = iota
	edgeA1
	edgeC0
	edgeC1
	edgeD0
	edgeD1
	edgeFuncs
)

// sinePanel holds the source's parts at a panel's nodes — the edge
// functions and the sine coefficients g̃_m — with the separated sums.
type sinePanel struct {
	lo, hi float64
	t, w   []float64
	f      [edgeFuncs][]float64
	g      [][]float64        // g[node][m−1]
	below  []float64          // Σ w e^(−k(hi−t)) (1 − e^(−2kt)) g̃_m
	above  []float64          // Σ w e^(−k(t−lo)) (1 − e^(−2k(H−t))) g̃_m
	s0, s1 [edgeFuncs]float64 // Σ w f, Σ w t f
}

// sineAt is what a line y = const needs: I[f](y) and I[f]'(y) of every edge
// function, and v_m(y), v_m'(y) where the modes were asked for.
type sineAt struct {
	y      float64
	i2, i1 [edgeFuncs]float64
	v, dv  []float64
	err    float64
}

func (q *SineQuadrature) k(m int) float64 { return float64(m) * math.Pi / q.L }

// phi is φ₀, φ₁ and their derivatives at x (the left end's; φ(L − x) mirrors).
func (q *SineQuadrature) phi(x float64) (p0, p1, d0, d1 float64) {
	L := q.L
	return 1 - x/L, x*x/2 - x*x*x/(6*L) - L*x/3, -1 / L, x - x*x/(2*L) - L/3
}

// edges are a_e and c_e at y, the second derivatives by a one-sided
// fourth-order difference inside the rectangle.
func (q *SineQuadrature) edges(y float64) (a0, a1, c0, c1 float64) {
	h := q.L / 64 // any accuracy serves (the same function is taken out and solved for); a wide step keeps rounding out
	d2 := func(x0, dir float64) float64 {
		var f [6]float64
		for i := range f {
			f[i] = q.G(x0+dir*float64(i)*h, y)
		}
		return (45*f[0] - 154*f[1] + 214*f[2] - 156*f[3] + 61*f[4] - 10*f[5]) / (12 * h * h)
	}
	return q.G(0, y), q.G(q.L, y), d2(0, 1), d2(q.L, -1)
}

// column is the sine coefficients of g̃(·, y), m = 1..Samples−1, with the edge functions.
func (q *SineQuadrature) column(y float64) (g []float64, e [4]float64) {
	return q.columnOf(y, q.Samples)
}

// columnOf is column from n samples along x: m = 1..n−1.
func (q *SineQuadrature) columnOf(y float64, n int) (g []float64, e [4]float64) {
	if q.ffts == nil {
		q.ffts = map[int]*fourier.FFT{}
	}
	fft, ok := q.ffts[2*n]
	if !ok {
		fft = fourier.NewFFT(2 * n)
		q.ffts[2*n] = fft
	}
	e[0], e[1], e[2], e[3] = q.edges(y)
	ext := make([]float64, 2*n)
	for j := 1; j < n; j++ {
		x := q.L * float64(j) / float64(n)
		p0, p1, _, _ := q.phi(x)
		r0, r1, _, _ := q.phi(q.L - x)
		v := q.G(x, y) - p0*e[0] - r0*e[1] - p1*e[2] - r1*e[3]
		ext[j], ext[2*n-j] = v, -v
	}
	if len(q.coef) < n+1 {
		q.coef = make([]complex128, n+1)
	}
	c := fft.Coefficients(q.coef[:n+1], ext)
	g = make([]float64, n-1)
	for m := 1; m < n; m++ {
		g[m-1] = -imag(c[m]) / float64(n) // (2/L)∫ g̃ sin(k_m x) dx by the trapezoidal rule on the odd extension
	}
	return g, e
}

// newPanel samples the panel's lines with the fewest points along x that
// resolve them (the top half of each line's modes, weighted by their share
// of u, below Tol of the probes' scale), at most Samples: a line far from
// where the source lives needs fewer. Its coefficient rows are padded with
// zeros to Samples − 1.
func (q *SineQuadrature) newPanel(lo, hi float64) sinePanel {
	n := q.Samples
	for n > 32 { // the middle line first: one line per halving
		g, _ := q.columnOf((lo+hi)/2, n/2)
		if !q.lineResolved(g) {
			break
		}
		n /= 2
	}
	for {
		p := q.sampledPanel(lo, hi, n)
		done := true
		for _, g := range p.g {
			done = done && q.lineResolved(g[:n-1])
		}
		if done || n >= q.Samples {
			return p
		}
		n *= 2
	}
}

// lineResolved reports a line's modes from half its samples up below Tol of
// the scale, each weighted by its share of u.
func (q *SineQuadrature) lineResolved(g []float64) bool {
	n := len(g) + 1
	for m := n / 2; m <= len(g); m++ {
		if math.Abs(g[m-1])*q.weight(-1, m) > q.Tol*q.scale {
			return false
		}
	}
	return true
}

// sampledPanel samples the panel's lines at n points along x.
func (q *SineQuadrature) sampledPanel(lo, hi float64, n int) sinePanel {
	p := sinePanel{lo: lo, hi: hi, t: make([]float64, glN), w: make([]float64, glN), g: make([][]float64, glN)}
	for j := range p.f {
		p.f[j] = make([]float64, glN)
	}
	for i, x := range glX {
		p.t[i], p.w[i] = (lo+hi)/2+(hi-lo)/2*x, (hi-lo)/2*glW[i]
		g, e := q.columnOf(p.t[i], n)
		p.g[i] = append(g, make([]float64, q.Samples-n)...)
		for j := range e {
			p.f[j][i] = e[j]
		}
	}
	return p
}

// Prepare chooses the samples along x (doubling until the top band of the
// sine spectrum on probe lines, weighted by 1/m² as in v_m, is below Tol)
// and builds the y meshes.
func (q *SineQuadrature) Prepare() {
	q.lines = nil
	var scale, worst float64
	for n := 32; ; n *= 2 {
		q.Samples = n
		scale, worst = 0, 0
		modes := 0
		for i := 0; i < 9; i++ {
			g, e := q.column(q.H * (float64(i) + 0.5) / 9)
			for j, v := range e {
				scale = math.Max(scale, math.Abs(v)*q.weight(j, 0))
			}
			// What matters is each mode's share of u (weight).
			for m, v := range g {
				v = math.Abs(v) * q.weight(-1, m+1)
				scale = math.Max(scale, v)
				if m+1 >= n/2 {
					worst = math.Max(worst, v)
				}
				if v > 1e-15*scale {
					modes = max(modes, m+1)
				}
			}
		}
		q.Modes = modes
		if worst <= q.Tol*math.Max(scale, 1e-300) || n >= 1<<11 {
			break
		}
	}
	q.Converged = worst <= q.Tol*math.Max(scale, 1e-300)
	q.scale = math.Max(scale, 1e-300)
	q.den = make([]float64, q.Modes)
	for m := range q.den {
		k := q.k(m + 1)
		q.den[m] = 2 * k * -math.Expm1(-2*k*q.H)
	}
	var mesh []sinePanel
	for i := 0; i < 4; i++ {
		mesh = append(mesh, q.newPanel(q.H*float64(i)/4, q.H*float64(i+1)/4))
	}
	q.coarse = q.refine(mesh, scale)
	q.fine = nil
	for _, p := range q.coarse {
		mid := (p.lo + p.hi) / 2
		q.fine = append(q.fine, q.newPanel(p.lo, mid), q.newPanel(mid, p.hi))
	}
	for _, m := range [][]sinePanel{q.coarse, q.fine} {
		for i := range m {
			q.sums(&m[i])
		}
		// D_e = I[c_e] at every node, for E_e = I[D_e].
		for i := range m {
			for k, t := range m[i].t {
				l := q.integrals(m, t, false)
				m[i].f[edgeD0][k], m[i].f[edgeD1][k] = l.i2[edgeC0], l.i2[edgeC1]
			}
		}
		for i := range m {
			q.sums(&m[i])
		}
	}
	// The modes beyond the samples: |v_m| ≤ max|g̃_m|/k_m² over the top
	// band; past the cap, a tail like m⁻³ from it.
	top := 0.0
	for _, p := range q.coarse {
		for i := range p.g {
			for m := max(q.Samples/2, 1); m <= len(p.g[i]); m++ {
				top = math.Max(top, math.Abs(p.g[i][m-1])/(q.k(m)*q.k(m)))
			}
		}
	}
	q.dropped, q.Truncation = top, 0
	if !q.Converged {
		q.Truncation = top * float64(q.Samples) / 4
		q.dropped += q.Truncation
	}
}

func (q *SineQuadrature) refine(mesh []sinePanel, scale float64) []sinePanel {
	var out []sinePanel
	budget := 400 // bisections; past it the halved mesh's estimate tells what is left
	// A tail that a bisection did not shrink, and that is already at the
	// level rounding leaves in the sampled functions (the edges' second
	// differences amplify a source's rounding about 10⁵ times, and a source
	// lowered to polar form rounds where its terms cancel), is noise: more
	// panels would only resample it. A singularity's tail that does not
	// shrink is far above that level and is still bisected.
	noise := 1e-11 * scale
	var visit func(p sinePanel, depth int, parentTail float64)
	visit = func(p sinePanel, depth int, parentTail float64) {
		t := q.tail(p)
		stalled := depth > 0 && t > parentTail/1.5 && t <= noise
		if depth < 20 && budget > 0 && !stalled && t*(p.hi-p.lo) > 0.1*radialTol(q.Tol)*scale*q.H {
			budget--
			mid := (p.lo + p.hi) / 2
			visit(q.newPanel(p.lo, mid), depth+1, t)
			visit(q.newPanel(mid, p.hi), depth+1, t)
			return
		}
		out = append(out, p)
	}
	for _, p := range mesh {
		visit(p, 0, math.Inf(1))
	}
	return out
}

// weight is how a function's size carries into u: a_e through I[a] (H²),
// c_e through φ₁ I[c] (L²H²/15), g̃_m through v_m (about 1/(k_m² + 8/H²));
// j is the edge function, or −1 for mode m.
func (q *SineQuadrature) weight(j, m int) float64 {
	switch j {
	case edgeA0, edgeA1:
		return q.H * q.H
	case edgeC0, edgeC1:
		return q.L * q.L * q.H * q.H / 15
	}
	k := q.k(m)
	return 1 / (k*k + 8/(q.H*q.H))
}

// tail is the largest Legendre coefficient of degree 14 or 15 over the
// panel's functions, each by its weight in u.
func (q *SineQuadrature) tail(p sinePanel) float64 {
	out := 0.0
	column := func(weight float64, f func(i int) float64) {
		for _, rows := range tailRows {
			c := 0.0
			for i := range rows {
				c += rows[i] * f(i)
			}
			out = math.Max(out, weight*math.Abs(c))
		}
	}
	for j := edgeA0; j <= edgeC1; j++ {
		column(q.weight(j, 0), func(i int) float64 { return p.f[j][i] })
	}
	for m := 1; m <= q.Modes; m++ {
		column(q.weight(-1, m), func(i int) float64 { return p.g[i][m-1] })
	}
	return out
}

func (q *SineQuadrature) sums(p *sinePanel) {
	p.below, p.above = make([]float64, q.Modes), make([]float64, q.Modes)
	p.s0, p.s1 = [edgeFuncs]float64{}, [edgeFuncs]float64{}
	for i, t := range p.t {
		w := p.w[i]
		for j := range p.f {
			p.s0[j] += w * p.f[j][i]
			p.s1[j] += w * t * p.f[j][i]
		}
		// e^(−k_m(hi − t)), e^(−2k_m t), … as powers of their m = 1 values
		// (k_m = m·k_1): four exponentials per node, not per node and mode.
		k1 := q.k(1)
		Eb, Ab, Ea, Aa := math.Exp(-k1*(p.hi-t)), math.Exp(-2*k1*t), math.Exp(-k1*(t-p.lo)), math.Exp(-2*k1*(q.H-t))
		eb, ab, ea, aa := 1.0, 1.0, 1.0, 1.0
		for m := 1; m <= q.Modes; m++ {
			eb, ab, ea, aa = eb*Eb, ab*Ab, ea*Ea, aa*Aa
			g := w * p.g[i][m-1]
			p.below[m-1] += eb * (1 - ab) * g
			p.above[m-1] += ea * (1 - aa) * g
		}
	}
}

// integrals evaluates a line on a mesh: I[f] and I[f]' of every edge
// function and, with modes, v_m and v_m'.
func (q *SineQuadrature) integrals(mesh []sinePanel, y float64, modes bool) sineAt {
	out := sineAt{y: y}
	if modes {
		out.v, out.dv = make([]float64, q.Modes), make([]float64, q.Modes)
	}
	H := q.H
	for pi := range mesh {
		p := &mesh[pi]
		switch {
		case p.hi <= y:
			for j := range p.s0 {
				out.i2[j] += y*p.s0[j] - p.s1[j]
				out.i1[j] += p.s0[j]
			}
			if !modes {
				continue
			}
			// e^(−k_m(y−hi)) and e^(−2k_m(H−y)) are powers of their m = 1 values.
			E, F := math.Exp(-q.k(1)*(y-p.hi)), math.Exp(-2*q.k(1)*(H-y))
			e, f := 1.0, 1.0
			for m := 1; m <= q.Modes; m++ {
				e, f = e*E, f*F
				k, den := q.k(m), q.den[m-1]
				out.v[m-1] -= (1 - f) * e / den * p.below[m-1]
				out.dv[m-1] += k * e * (1 + f) / den * p.below[m-1]
			}
		case p.lo >= y:
			if !modes {
				continue
			}
			E, F := math.Exp(-q.k(1)*(p.lo-y)), math.Exp(-2*q.k(1)*y)
			e, f := 1.0, 1.0
			for m := 1; m <= q.Modes; m++ {
				e, f = e*E, f*F
				k, den := q.k(m), q.den[m-1]
				out.v[m-1] -= (1 - f) * e / den * p.above[m-1]
				out.dv[m-1] -= k * e * (1 + f) / den * p.above[m-1]
			}
		default:
			q.split(p, y, &out, modes)
		}
	}
	return out
}

// split adds the panel that holds y: Gauss–Legendre on [lo, y] and [y, hi]
// with the functions interpolated from the panel's nodes.
func (q *SineQuadrature) split(p *sinePanel, y float64, out *sineAt, modes bool) {
	H := q.H
	lw := make([]float64, glN)
	if len(q.modeBuf) < q.Modes {
		q.modeBuf = make([]float64, q.Modes)
	}
	gt := q.modeBuf[:q.Modes]
	for half := 0; half < 2; half++ {
		lo, hi := p.lo, y
		if half == 1 {
			lo, hi = y, p.hi
		}
		if half == 1 && !modes {
			break
		}
		for n, x := range glX {
			t := (lo+hi)/2 + (hi-lo)/2*x
			w := (hi - lo) / 2 * glW[n]
			lagrange((2*t-p.lo-p.hi)/(p.hi-p.lo), lw)
			interp := func(f func(j int) float64) float64 {
				v := 0.0
				for j, l := range lw {
					v += l * f(j)
				}
				return v
			}
			if half == 0 {
				for j := range p.f {
					f := interp(func(i int) float64 { return p.f[j][i] })
					out.i2[j] += w * (y - t) * f
					out.i1[j] += w * f
				}
			}
			if !modes {
				continue
			}
			// The kernel's exponentials as powers of their m = 1 values.
			k1 := q.k(1)
			var E, A, B float64 // e^(−k|y−t|), the t-factor's and the y-factor's exponentials
			if half == 0 {      // t < y: (1 − e^(−2kt)) and (1 ∓ e^(−2k(H−y)))
				E, A, B = math.Exp(-k1*(y-t)), math.Exp(-2*k1*t), math.Exp(-2*k1*(H-y))
			} else { // t > y: (1 − e^(−2k(H−t))) and (1 ∓ e^(−2ky))
				E, A, B = math.Exp(-k1*(t-y)), math.Exp(-2*k1*(H-t)), math.Exp(-2*k1*y)
			}
			// The modes at t from the nodes, node by node so the inner
			// loop runs along the modes.
			clear(gt)
			for j, l := range lw { // gonum's vector kernel
				floats.AddScaled(gt, l, p.g[j][:q.Modes])
			}
			e, a, b := 1.0, 1.0, 1.0
			for m := 1; m <= q.Modes; m++ {
				e, a, b = e*E, a*A, b*B
				k, den := q.k(m), q.den[m-1]
				g := gt[m-1] * w * e * (1 - a) / den
				out.v[m-1] -= (1 - b) * g
				if half == 0 {
					out.dv[m-1] += k * (1 + b) * g
				} else {
					out.dv[m-1] -= k * (1 + b) * g
				}
			}
		}
	}
}

// line is a line's parts from the halved mesh with the estimate; without
// modes (on y = 0, y = H, x = 0 and x = L, where sin(k_m x) v_m(y) vanishes)
// only the edge functions.
func (q *SineQuadrature) line(y float64, modes bool) *sineAt {
	if l, ok := q.lines[y]; ok && (l.v != nil || !modes) {
		return l
	}
	c, f := q.integrals(q.coarse, y, modes), q.integrals(q.fine, y, modes)
	err, big := 0.0, 0.0
	for j := range f.i2 {
		err, big = math.Max(err, math.Abs(c.i2[j]-f.i2[j])), math.Max(big, math.Abs(f.i2[j]))
	}
	for m := range f.v {
		err, big = math.Max(err, math.Abs(c.v[m]-f.v[m])), math.Max(big, math.Abs(f.v[m]))
	}
	f.err = math.Max(err, 1e-15*big) + q.dropped
	if q.lines == nil || len(q.lines) >= 4096 {
		q.lines = map[float64]*sineAt{}
	}
	q.lines[y] = &f
	return &f
}

// edgePart is Σ_e [φ₀(A_e − E_e) + φ₁ D_e] and its gradient on a line.
func (q *SineQuadrature) edgePart(l *sineAt, x float64) (u, ux, uy float64) {
	for e := 0; e < 2; e++ {
		xe, sign := x, 1.0
		if e == 1 {
			xe, sign = q.L-x, -1
		}
		p0, p1, d0, d1 := q.phi(xe)
		A, dA := l.i2[edgeA0+e], l.i1[edgeA0+e]
		D, dD := l.i2[edgeC0+e], l.i1[edgeC0+e]
		E, dE := l.i2[edgeD0+e], l.i1[edgeD0+e]
		u += p0*(A-E) + p1*D
		ux += sign * (d0*(A-E) + d1*D)
		uy += p0*(dA-dE) + p1*dD
	}
	return u, ux, uy
}

// At is u(x, y) with the error estimate.
func (q *SineQuadrature) At(x, y float64) (float64, float64) {
	onEdge := y == 0 || y == q.H || x == 0 || x == q.L
	l := q.line(y, !onEdge)
	u, _, _ := q.edgePart(l, x)
	for m := 1; !onEdge && m <= q.Modes; m++ {
		u += math.Sin(q.k(m)*x) * l.v[m-1]
	}
	return u, l.err
}

// Grad is (∂u/∂x, ∂u/∂y) at (x, y).
func (q *SineQuadrature) Grad(x, y float64) (float64, float64) {
	l := q.line(y, true)
	_, ux, uy := q.edgePart(l, x)
	for m := 1; m <= q.Modes; m++ {
		k := q.k(m)
		ux += k * math.Cos(k*x) * l.v[m-1]
		uy += math.Sin(k*x) * l.dv[m-1]
	}
	return ux, uy
}

// Panels are the finer mesh's panels in y, as (lo, hi).
func (q *SineQuadrature) Panels() [][2]float64 {
	var out [][2]float64
	for _, p := range q.fine {
		out = append(out, [2]float64{p.lo, p.hi})
	}
	return out
}
