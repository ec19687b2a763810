package ansatz

import (
	"errors"
	"math"
	"psol/series"
	"sort"
	"sync"

	"gonum.org/v1/gonum/dsp/fourier"
	"gonum.org/v1/gonum/floats"
)

// Quadrature is a particular solution of Δu = g for a source with no closed
// form, on a region bounded by circles about the origin: A < r < R, with
// A = 0 for a disk or sector and R = +Inf outside a circle. With g sampled on
// rings and transformed by FFT, g = Σ_k g_k(r) T(ν_k θ), ν_k = 2πk/Period,
// each mode's part is the regular radial Green's formula
//
//	p_0(r) = ∫_A^r s ln(r/s) g_0(s) ds               (R finite),
//	p_0(r) = ∫_r^∞ s ln(s/r) g_0(s) ds               (R = ∞: bounded),
//	p_k(r) = −(1/2ν)[∫_A^r s (s/r)^ν g_k ds + ∫_r^R s (r/s)^ν g_k ds],
//
// which solves p” + p'/r − ν²p/r² = g_k. The integrals run on one mesh of
// 16-point Gauss–Legendre panels shared by every point: halvings towards
// the centre of a disk (centreLevels; mode 0's kernel s ln s takes a
// product rule there, centreLogWeights), geometric out to infinity, and bisected
// until each panel's Legendre tail of every g_k is below Tol. Each panel
// takes the fewest angular samples that resolve all its rings, starting
// from the probes' count scaled by its outer radius: a smooth source's
// rings near the centre need few. The kernels separate on
// whole panels, so a point costs its own panel only, where g_k comes from the
// panel's nodes by barycentric interpolation. A second mesh with every panel
// halved gives the values; their difference from the first is the estimate.
type Quadrature struct {
	G func(r, theta float64) float64
	// GXY, when set, is G in Cartesian coordinates: a ring then samples it
	// at (s·cos θ_j, s·sin θ_j) from a table of its angles, shared by every
	// ring of its size, instead of taking trigonometric functions of each
	// sample's angle (which were a fifth of a smooth source's quadrature).
	GXY    func(x, y float64) float64
	A, R   float64
	Period float64 // the angular period of G; 0 means 2π (a sector passes its symmetric extension)
	// Keep selects the modes a region admits (nil keeps all): a sector keeps
	// the eigenfunctions of its rays, which the extension makes the only ones.
	Keep    func(k int, sin bool) bool
	Tol     float64
	Samples int // angular samples, fixed by Prepare
	// MaxSamples caps the angular samples (0: 4096). Below the default it
	// coarsens the quadrature on purpose: the tests use it to make the
	// errors large enough for the estimate's honesty to be tested.
	MaxSamples int
	// MaxBisections caps the radial mesh's bisections (0: 400), a test hook
	// like MaxSamples for the estimate of the radial error.
	MaxBisections int
	Modes         int // highest mode kept
	// Converged is false where the samples reached their cap before the top
	// band fell below Tol; Truncation then estimates the modes beyond them.
	Converged  bool
	Truncation float64
	// Lift, when set, is a closed part of the particular solution whose
	// Laplacian the caller has taken out of G (a sector's RayLift): At and
	// Integrals add it; Mode is the quadrature's own part without it.
	Lift *RayLift
	// Kinks are closed parts C·|ℓ|³/(6|∇ℓ|²) of the particular solution
	// whose sources C·|ℓ| the caller has taken out of G (SplitKinks): At,
	// Gradient, Integrals and Flux add them; Mode leaves them to KinkModes.
	Kinks []Kink
	// Left is the source part G samples when Kinks are set (nil: none).
	Left *series.Expr
	// X0, Y0 are the centre of the quadrature's polar coordinates in the
	// caller's plane: G, GXY, Kinks and every (r, θ) the methods take are
	// about it (Local maps a point there). The circles' quadratures sit at
	// the origin; a section's at its own centre, since a disk about the
	// origin reached far outside a section away from it (a unit square at
	// (100, 100) took a disk of radius 143, and was refused) and met a
	// source's singularities there (1/(1 + x + y) beside the unit square).
	X0, Y0 float64
	// Reflect, when set, says that G over the period is its first quarter
	// reflected about θ = 0 and about θ = Period/4, odd about each where
	// its flag is true and even where false: a sector's extension about
	// its rays. A ring then samples that quarter only and takes its modes
	// by the quarter's own transform (reflections.go): a quarter of the
	// samples and of the transform's length.
	Reflect *[2]bool

	coarse, fine []panel
	dropped      float64               // a bound on the particular solution of the modes not kept
	plans        map[int]*ringSampling // by the number of samples
	sourceSize   float64               // the largest |g| sampled (SourceSize)
	peakRadii    []float64             // where |g| peaks (peaks), found once by Prepare
	buf          []float64
	zero         []float64 // read-only zeros shared by quarter rings (zeros)
	scale        float64   // the probes' largest mode, weighted by its share of p
	used         int       // the most angular samples a panel took
	capped       bool      // a panel reached the cap with its top band above Tol
	recent       []*modeAt // the latest Modes, newest last: a stencil or a ring revisits a few radii
	recentFine   []*modeAt // the latest values from the halved mesh alone (Value)
}

// panel is one Gauss–Legendre panel of the radial mesh with the source's
// modes at its nodes and the separated kernels' sums over it.
type panel struct {
	lo, hi   float64
	infinite bool      // [lo, ∞) by s = lo/t, t in (0, 1]
	s, w     []float64 // nodes and weights, the Jacobian included
	a, b     [][]float64
	// below[k] = Σ w s (s/hi)^ν g_k and above[k] = Σ w s (lo/s)^ν g_k;
	// for k = 0 both are Σ w s g_0, and log0 = Σ w s ln s g_0.
	below, above [][2]float64
	log0         float64
	// hasCos and hasSin: whether any node has a cosine (sine) coefficient;
	// a sector's family keeps one kind only, and the other is skipped.
	hasCos, hasSin bool
}

type modeAt struct {
	r, err, slopeErr float64 // the meshes' estimates, with the modes not kept
	tail             float64 // a sector's modes beyond the samples, here
	p, dp            [][2]float64
}

// glX and glW are the shared rule (gauss.go) under the names this file's formulas use.
var glX, glW = GaussX, GaussW

// bary are the barycentric weights of the Legendre nodes, 1/Π_{i≠j}(x_j − x_i).
var bary = func() []float64 {
	out := make([]float64, glN)
	for j := range glX {
		p := 1.0
		for i := range glX {
			if i != j {
				p *= glX[j] - glX[i]
			}
		}
		out[j] = 1 / p
	}
	return out
}()

// lagrange fills ell with the weights that interpolate, from the values at
// the Legendre nodes, the value at x in [−1, 1] (barycentric form).
func lagrange(x float64, ell []float64) {
	sum := 0.0
	for j, xj := range glX {
		if x == xj {
			for i := range ell {
				ell[i] = 0
			}
			ell[j] = 1
			return
		}
		ell[j] = bary[j] / (x - xj)
		sum += ell[j]
	}
	for j := range ell {
		ell[j] /= sum
	}
}

// tailRows are the rows of the map from node values to the Legendre
// coefficients of degrees 14 and 15: c_j = (2j+1)/2 Σ_i w_i P_j(x_i) f(x_i).
var tailRows = func() [2][]float64 {
	var rows [2][]float64
	for d := 0; d < 2; d++ {
		j := glN - 2 + d
		rows[d] = make([]float64, glN)
		for i, x := range glX {
			p0, p1 := 1.0, x
			for n := 1; n < j; n++ {
				p0, p1 = p1, (float64(2*n+1)*x*p1-float64(n)*p0)/float64(n+1)
			}
			rows[d][i] = float64(2*j+1) / 2 * glW[i] * p1
		}
	}
	return rows
}()

func (q *Quadrature) period() float64 {
	if q.Period == 0 {
		return 2 * math.Pi
	}
	return q.Period
}

// omega is ν_1: ν_k = kω.
func (q *Quadrature) omega() float64 { return 2 * math.Pi / q.period() }

func (q *Quadrature) nu(k int) float64 { return float64(k) * q.omega() }

// ring is the Fourier coefficients of g on the circle of radius s from n
// samples: a[k] cos, b[k] sin, k < n/2.
func (q *Quadrature) ring(s float64, n int) (a, b []float64) { return q.ringTop(s, n, n/2) }

// ringTop is ring's modes k < top only (top ≤ n/2): the halved mesh sums
// only the modes the first kept (Modes), and a sector's kinked source
// would otherwise hold several times the coefficients it uses.
func (q *Quadrature) ringTop(s float64, n, top int) (a, b []float64) {
	plan := q.ringPlan(n)
	if plan.quarter != nil {
		a, b = plan.quarter.modes(q, s, n, top)
		q.dropNoise(plan, a, b)
		return a, b
	}
	if len(q.buf) < n {
		q.buf = make([]float64, n)
	}
	x := q.buf[:n]
	P := q.period()
	if q.GXY != nil { // the ring's points from the plan's table of angles
		for j := range x {
			x[j] = q.GXY(s*plan.cos[j], s*plan.sin[j])
		}
	} else {
		for j := range x {
			x[j] = q.G(s, P*float64(j)/float64(n))
		}
	}
	q.noteSize(x)
	c := plan.fft.Coefficients(plan.coef, x)
	a, b = make([]float64, top), make([]float64, top)
	for k := 0; k < top; k++ {
		a[k] = 2 * real(c[k]) / float64(n)
		b[k] = -2 * imag(c[k]) / float64(n)
	}
	a[0] /= 2
	q.dropNoise(plan, a, b)
	return a, b
}

// noteSize raises SourceSize to the largest |g| among the samples x, by
// plain comparisons (math.Max's NaN rules cost a third of a sector ring's
// bookkeeping), a NaN kept as math.Max would.
func (q *Quadrature) noteSize(x []float64) {
	size := q.sourceSize
	for _, v := range x {
		if v := math.Abs(v); v > size || v != v {
			size = v
		}
	}
	q.sourceSize = size
}

// dropNoise zeroes the modes below the transform's rounding, which the
// kernel's (r/s)^ν would magnify near the centre, and those Keep leaves out.
func (q *Quadrature) dropNoise(plan *ringSampling, a, b []float64) {
	big := 0.0 // plain comparisons: math.Max's NaN rules cost a third of a sector ring here
	for k := range a {
		if v := math.Abs(a[k]); v > big {
			big = v
		}
		if v := math.Abs(b[k]); v > big {
			big = v
		}
	}
	floor := 1e-14 * big
	for k := range a { // zeros are not written: a quarter ring's empty family is shared (zeros)
		if a[k] != 0 && (!plan.keepCos[k] || math.Abs(a[k]) < floor) {
			a[k] = 0
		}
		if b[k] != 0 && (!plan.keepSin[k] || math.Abs(b[k]) < floor) {
			b[k] = 0
		}
	}
}

// zeros is a slice of n zeros shared by every ring of this quadrature that
// has no modes of one family (a quarter ring's cosines or sines): read
// only, never written (dropNoise leaves zeros alone).
func (q *Quadrature) zeros(n int) []float64 {
	if len(q.zero) < n {
		q.zero = make([]float64, n)
	}
	return q.zero[:n:n]
}

// ringSampling is what every ring of n samples shares: the FFT, or the
// quarter's transform under Reflect, and the modes kept (Keep).
type ringSampling struct {
	cos, sin         []float64 // of the sample angles P·j/n, with GXY
	fft              *fourier.FFT
	coef             []complex128 // the transform's output, reused
	quarter          *quarterRing
	keepCos, keepSin []bool
}

// ringPlan is the ringSampling for n samples, built on first use.
func (q *Quadrature) ringPlan(n int) *ringSampling {
	if plan, ok := q.plans[n]; ok {
		return plan
	}
	plan := &ringSampling{keepCos: make([]bool, n/2), keepSin: make([]bool, n/2)}
	if q.Reflect != nil && n >= 16 && n%4 == 0 {
		plan.quarter = newQuarterRing(n, *q.Reflect)
	} else {
		plan.fft, plan.coef = fourier.NewFFT(n), make([]complex128, n/2+1)
		if q.GXY != nil {
			plan.cos, plan.sin = make([]float64, n), make([]float64, n)
			for j := range plan.cos {
				plan.sin[j], plan.cos[j] = math.Sincos(q.period() * float64(j) / float64(n))
			}
		}
	}
	for k := range plan.keepCos {
		plan.keepCos[k] = q.Keep == nil || q.Keep(k, false)
		plan.keepSin[k] = q.Keep == nil || q.Keep(k, true)
	}
	if q.plans == nil {
		q.plans = map[int]*ringSampling{}
	}
	q.plans[n] = plan
	return plan
}

// newPanel samples g at the panel's nodes with the fewest angular samples
// that resolve every node's ring (sampledPanel).
func (q *Quadrature) newPanel(lo, hi float64, infinite bool) panel {
	n := q.Samples
	if !infinite && !math.IsInf(q.R, 1) {
		// A ring's bandwidth grows with its radius (a smooth source's mode k
		// falls like (s/ρ)^k): start from the probes' count scaled to hi.
		for n > 16 && float64(n/2) >= float64(q.Samples)*hi/q.R {
			n /= 2
		}
	}
	if !infinite { // the outermost node's ring first: one ring per doubling
		s := (lo+hi)/2 + (hi-lo)/2*glX[glN-1]
		for n < q.maxSamples() {
			a, b := q.ring(s, n)
			if q.ringResolved(a, b) {
				break
			}
			n *= 2
		}
	}
	for {
		p := q.sampledPanel(lo, hi, infinite, n)
		done := q.resolved(p)
		if done || n >= q.maxSamples() {
			q.used, q.capped = max(q.used, n), q.capped || !done
			for i := range p.a { // every mode above rounding's reach
				for k := q.Modes + 1; k < len(p.a[i]); k++ {
					if math.Hypot(p.a[i][k], p.b[i][k])*q.weight(k) > 1e-16*q.scale {
						q.Modes = k
					}
				}
			}
			return p
		}
		n *= 2
	}
}

// resolved reports every ring of the panel with its top band (modes from a
// quarter of the samples up), weighted by its share of p, below Tol of the
// probes' scale.
func (q *Quadrature) resolved(p panel) bool {
	for i := range p.a {
		if !q.ringResolved(p.a[i], p.b[i]) {
			return false
		}
	}
	return true
}

// ringResolved is one ring's test in resolved.
func (q *Quadrature) ringResolved(a, b []float64) bool {
	for k := len(a) / 2; k < len(a); k++ {
		if math.Hypot(a[k], b[k])*q.weight(k) > q.Tol*q.scale {
			return false
		}
	}
	return true
}

// sampledPanel samples g at the panel's nodes on rings of n samples.
func (q *Quadrature) sampledPanel(lo, hi float64, infinite bool, n int) panel {
	return q.sampledPanelTop(lo, hi, infinite, n, n/2)
}

// sampledPanelTop is sampledPanel keeping the modes k < top (ringTop).
func (q *Quadrature) sampledPanelTop(lo, hi float64, infinite bool, n, top int) panel {
	p := panel{lo: lo, hi: hi, infinite: infinite, s: make([]float64, glN), w: make([]float64, glN)}
	p.a, p.b = make([][]float64, glN), make([][]float64, glN)
	for i, x := range glX {
		if infinite { // s = lo/t on t in (0, 1]: ds = lo/t² dt
			t := (x + 1) / 2
			p.s[i], p.w[i] = lo/t, glW[i]/2*lo/(t*t)
		} else {
			p.s[i], p.w[i] = (lo+hi)/2+(hi-lo)/2*x, (hi-lo)/2*glW[i]
		}
		p.a[i], p.b[i] = q.ringTop(p.s[i], n, top)
	}
	return p
}

// sums fills the panel's separated kernel sums for modes 0..Modes.
func (q *Quadrature) sums(p *panel) {
	// Modes beyond the panel's samples are 0 here: a panel near a disk's
	// centre takes few, and its sums stop there.
	top := min(q.Modes+1, len(p.a[0]))
	p.below, p.above, p.log0 = make([][2]float64, top), make([][2]float64, top), 0
	for i, s := range p.s {
		ws := p.w[i] * s
		a, b := p.a[i], p.b[i]
		p.below[0][0] += ws * a[0]
		p.log0 += ws * math.Log(s) * a[0]
		// (s/hi)^ν_k and (lo/s)^ν_k as powers of their k = 1 values.
		xb, xa := 1.0, math.Pow(p.lo/s, q.omega())
		if !p.infinite {
			xb = math.Pow(s/p.hi, q.omega())
		}
		fb, fa := ws, ws
		for k := 1; k < top; k++ {
			fb, fa = fb*xb, fa*xa
			p.below[k][0] += fb * a[k]
			p.below[k][1] += fb * b[k]
			p.above[k][0] += fa * a[k]
			p.above[k][1] += fa * b[k]
		}
	}
	p.above[0] = p.below[0]
	for i := range p.a {
		for k := range p.a[i] {
			p.hasCos = p.hasCos || p.a[i][k] != 0
			p.hasSin = p.hasSin || p.b[i][k] != 0
		}
	}
	if p.lo == 0 { // s ln s is not smooth at the centre: its product rule
		p.log0 = 0
		w := centreLogWeights()
		lnh := math.Log(p.hi)
		for i := range p.s {
			p.log0 += p.hi * p.hi * (lnh*(glW[i]/2)*(glX[i]+1)/2 + w[i]) * p.a[i][0]
		}
	}
}

// centreLogWeights are the product-integration weights W_j of
// ∫_0^1 t ln t φ(t) dt ≈ Σ W_j φ(t_j) at the Legendre nodes t_j = (x_j + 1)/2
// (exact for φ of degree 15): W_j = ∫_0^1 t ln t ℓ_j(t) dt, ℓ_j the Lagrange
// basis, by the 16-point rule on the dyadic intervals [2^−m−1, 2^−m], where
// the integrand is smooth, down to 2^−60. The log kernel of mode 0 meets the
// centre of a disk this way on one panel, not on dozens graded towards it.
var centreLogWeights = sync.OnceValue(func() []float64 {
	w := make([]float64, glN)
	ell := make([]float64, glN)
	for m := 0; m < 60; m++ {
		lo, hi := math.Ldexp(1, -m-1), math.Ldexp(1, -m)
		for i, x := range glX {
			t := (lo+hi)/2 + (hi-lo)/2*x
			lagrange(2*t-1, ell)
			f := (hi - lo) / 2 * glW[i] * t * math.Log(t)
			for j := range w {
				w[j] += f * ell[j]
			}
		}
	}
	return w
})

// tail is the largest Legendre coefficient of degree 14 or 15 of any mode on the panel.
func (q *Quadrature) tail(p panel) float64 {
	out := 0.0
	for k := 0; k <= q.Modes && k < len(p.a[0]); k++ {
		for _, rows := range tailRows {
			var ca, cb float64
			for i := range rows {
				ca += rows[i] * p.a[i][k]
				cb += rows[i] * p.b[i][k]
			}
			out = math.Max(out, math.Max(math.Abs(ca), math.Abs(cb))*q.weight(k))
		}
	}
	return out
}

// radialTol is the target of the radial meshes: Tol, but never looser than
// 1e-10, since Gauss–Legendre panels cost little more there, and a mesh
// much coarser than its halving would make the estimate (their difference)
// far larger than the error of the values returned (the halved mesh's).
func radialTol(tol float64) float64 { return math.Min(tol, 1e-10) }

// weight is how mode k's source carries into p, relative to mode 0's:
// about 4/(ν_k² + 4) (p_k ≈ −r² g_k/ν² for large ν, r² g_0/4 for mode 0).
func (q *Quadrature) weight(k int) float64 {
	nu := q.nu(k)
	return 4 / (nu*nu + 4)
}

func (p panel) peak() float64 {
	out := 0.0
	for i := range p.a {
		for k := range p.a[i] {
			out = math.Max(out, math.Max(math.Abs(p.a[i][k]), math.Abs(p.b[i][k])))
		}
	}
	return out
}

// ErrSlowDecay is Prepare's answer outside a circle for a source that does
// not decay faster than r^−2: no bounded particular solution exists.
// ErrAliased reports a source that varies faster in θ than the largest
// sampling resolves: its coefficients would be another function's.
var ErrAliased = errors.New("the source varies faster in theta than 4096 samples resolve: between the samples it differs from every band-limited fit, so the quadrature would be aliased")

var ErrSlowDecay = errors.New("the source does not decay faster than r^-2, so its particular solution outside the circle is unbounded (its area integral diverges)")

// Prepare chooses the angular samples and builds the radial mesh: the
// samples double until the top band of the spectrum on probe rings (one in
// each starting panel) is below Tol relative to the source's size; then each
// panel is bisected until its Legendre tail is too.
func (q *Quadrature) Prepare() error {
	q.recent, q.recentFine, q.peakRadii = nil, nil, q.peaks()
	for n := min(32, q.maxSamples()); ; n *= 2 {
		q.Samples = n
		worst, scale, modes := 0.0, 0.0, 0
		// What matters is each mode's share of p (weight): its source over ν².
		var sizes []float64
		aliased := false
		for _, r := range q.probes() {
			a, b := q.ring(r, n)
			if !aliased && q.offGrid(r, a, b) {
				aliased = true
			}
			for k := range a {
				v := math.Hypot(a[k], b[k]) * q.weight(k)
				scale = math.Max(scale, v)
				if k >= n/4 {
					worst = math.Max(worst, v)
				}
				for len(sizes) <= k {
					sizes = append(sizes, 0)
				}
				sizes[k] = math.Max(sizes[k], v)
			}
		}
		// Aliasing matters where the spectrum looks resolved: between the
		// samples the source then differs from what the modes say. (A source
		// whose spectrum has not converged, such as an extension with a jump,
		// is refined and estimated as before.)
		resolved := worst <= q.Tol*math.Max(scale, 1e-300)
		if (!resolved || aliased) && n < q.maxSamples() {
			continue
		}
		if resolved && aliased {
			return ErrAliased
		}
		for k, v := range sizes { // every mode above rounding's reach
			if v > 1e-16*scale {
				modes = k
			}
		}
		q.Modes, q.scale, q.used, q.capped = modes, scale, 0, false
		mesh, err := q.mesh()
		if err != nil {
			return err
		}
		q.coarse = q.refine(mesh, scale)
		q.fine = q.halve(q.coarse)
		q.Samples = max(q.Samples, q.used)
		// The modes left out: those not kept, and beyond the samples about
		// the size of the last ones computed (bounds on their particular
		// solutions); when the samples reached their cap, a tail like 1/k²
		// from the last.
		size := q.modeSizes(q.coarse)
		// Two: a sector keeps every other mode.
		q.dropped, q.Truncation = math.Max(size[len(size)-1], size[len(size)-2]), 0
		for k := q.Modes + 1; k < len(size); k++ {
			q.dropped = math.Max(q.dropped, size[k])
		}
		if q.Converged = resolved && !q.capped; !q.Converged {
			for k := len(size) - 1; k > 0; k-- {
				if size[k] > 0 {
					q.Truncation = size[k] * float64(k)
					break
				}
			}
			q.dropped += q.Truncation
		}
		return nil
	}
}

// tailSum bounds Σ_{k>K} s_k for the modes beyond the samples (and what
// they alias onto those kept), from the decay of the computed sizes s_k,
// k ≤ K: an algebraic decay k^−p, measured between the top two octaves,
// sums to about K·s_K/(p − 1), twice for aliasing; a decay slower than k^−1.5
// is taken as k^−1.5. Band maxima, since a sector keeps every other mode.
// Below 64 modes the samples stopped early because the spectrum ended.
func tailSum(size []float64) float64 {
	K := len(size) - 1
	if K < 64 { // too few modes to see a decay: the samples resolved them all
		return 0
	}
	band := func(lo, hi int) float64 {
		m := 0.0
		for k := lo; k <= hi && k <= K; k++ {
			m = math.Max(m, size[k])
		}
		return m
	}
	top, below := band(K/2, K), band(K/4, K/2-1)
	if top == 0 {
		return 0
	}
	p := 1.5
	if below > 0 {
		p = math.Max(p, math.Log2(below/top))
	}
	return 2 * top * math.Pow(2, -p) * float64(K) / (p - 1)
}

// probes are the radii whose rings choose the angular samples: the middle of
// each starting panel, and where the source peaks. A source concentrated
// about one radius (a sharp ring, an off-centre spike) can fall between the
// panels' middles; a scan of the largest |g| (peaks) finds it, and the
// radii of its largest local maxima join the probes.
func (q *Quadrature) probes() []float64 {
	var out []float64
	switch {
	case math.IsInf(q.R, 1):
		for i := 0; i < 48; i++ {
			out = append(out, q.A*math.Pow(2, float64(i)+0.5))
		}
	case q.A == 0:
		for i := q.centreLevels(); i >= 0; i-- {
			out = append(out, 0.75*q.R*math.Pow(0.5, float64(i)))
		}
	default:
		for i := 0; i < 8; i++ {
			out = append(out, q.A+(q.R-q.A)*(float64(i)+0.5)/8)
		}
	}
	return append(out, q.peakRadii...)
}

// peaks are the radii of the largest local maxima of max_θ |g| on a scan of
// the region (out to 64 A when it is unbounded), at most eight of them. The
// scan's points are about 2π·hi/128 apart along each of its 64 rings (at
// least 16 to a ring), and hi/64 across them: 128 rings were a quarter of a
// smooth source's samples (a Gaussian hot spot's 8,300 of 29,000), and the
// sharp rings and spikes tried (widths down to 0.007 of the radius) found
// the same peaks, samples and values with 64.
func (q *Quadrature) peaks() []float64 {
	const rings = 64
	lo, hi := q.A, q.R
	if math.IsInf(hi, 1) {
		hi = 64 * q.A
	}
	radius := func(i int) float64 { return lo + (hi-lo)*(float64(i)+0.5)/rings }
	size := make([]float64, rings)
	P := q.period()
	for i := range size {
		r := radius(i)
		angles := max(16, int(128*r/hi)+1)
		if q.GXY != nil { // the scan's points by rotation: a scan needs no more than rounding's accuracy
			s1, c1 := math.Sincos(P / float64(angles))
			sn, c := math.Sincos(P / float64(2*angles))
			for j := 0; j < angles; j++ {
				if v := math.Abs(q.GXY(r*c, r*sn)); v > size[i] {
					size[i] = v
				}
				c, sn = c*c1-sn*s1, sn*c1+c*s1
			}
			continue
		}
		for j := 0; j < angles; j++ {
			if v := math.Abs(q.G(r, P*(float64(j)+0.5)/float64(angles))); v > size[i] {
				size[i] = v
			}
		}
	}
	var at []int
	for i, v := range size {
		if (i == 0 || v > size[i-1]) && (i == rings-1 || v >= size[i+1]) && v > 0 && !math.IsInf(v, 0) {
			at = append(at, i)
		}
	}
	sort.Slice(at, func(a, b int) bool { return size[at[a]] > size[at[b]] })
	out := make([]float64, 0, 8)
	for _, i := range at[:min(8, len(at))] {
		out = append(out, radius(i))
	}
	return out
}

// centreLevels is how many halvings the starting mesh takes towards a
// disk's centre. On a full turn the kernels s·(s/r)^k are polynomials and
// mode 0's log has its product rule, so two serve (refine adds more where
// the source needs them); a sector's ν = kπ/(2α) are fractional, and
// s^(1+ν) is not smooth at the centre: six, down to R/64.
func (q *Quadrature) centreLevels() int {
	if q.Period == 0 && q.Keep == nil {
		return 2
	}
	return 6
}

// mesh is the starting mesh: halving towards a disk's centre (the log kernel
// and r^ν), four panels across an annulus, doublings out to infinity.
func (q *Quadrature) mesh() ([]panel, error) {
	var mesh []panel
	switch {
	case math.IsInf(q.R, 1):
		scale := 0.0
		var sizes []float64
		lo := q.A
		for i := 0; i < 48; i++ {
			p := q.newPanel(lo, 2*lo, false)
			size := p.peak() * p.hi * p.hi // the panel's share of p is about hi² g
			scale = math.Max(scale, size)
			mesh, sizes = append(mesh, p), append(sizes, size)
			lo *= 2
			if i >= 3 && size <= 1e-3*q.Tol*scale && sizes[i-1] <= 1e-3*q.Tol*scale {
				break
			}
		}
		if n := len(sizes); n == 48 && sizes[n-1] > 0.9*sizes[n-2] {
			return nil, ErrSlowDecay
		}
		mesh = append(mesh, q.newPanel(lo, math.Inf(1), true))
	case q.A == 0:
		edges := []float64{0}
		for i := q.centreLevels(); i >= 0; i-- {
			edges = append(edges, q.R*math.Pow(0.5, float64(i)))
		}
		for i := 0; i+1 < len(edges); i++ {
			mesh = append(mesh, q.newPanel(edges[i], edges[i+1], false))
		}
	default:
		for i := 0; i < 4; i++ {
			mesh = append(mesh, q.newPanel(q.A+(q.R-q.A)*float64(i)/4, q.A+(q.R-q.A)*float64(i+1)/4, false))
		}
	}
	return mesh, nil
}

// refine bisects finite panels while their Legendre tail, weighted by their
// share of the integrals (width × outer radius), exceeds Tol relative to the
// source's size (scale, over the reference radius squared). The worst panel
// is bisected first, so that when the budget (400 bisections, and the memory
// of MaxQuadratureBytes) runs out the bisections went where they help most;
// past it the halved mesh's estimate tells what is left.
func (q *Quadrature) refine(mesh []panel, scale float64) []panel {
	ref := q.R
	if math.IsInf(ref, 1) {
		ref = q.A
	}
	limit := 0.1 * radialTol(q.Tol) * scale * ref * ref
	type leaf struct {
		p      panel
		depth  int
		excess float64 // the weighted tail; 0 for a panel that stays
	}
	weigh := func(p panel, depth int) leaf {
		l := leaf{p: p, depth: depth}
		if !p.infinite && depth < 30 {
			if e := q.tail(p) * (p.hi - p.lo) * p.hi; e > limit {
				l.excess = e
			}
		}
		return l
	}
	leaves := make([]leaf, len(mesh))
	for i, p := range mesh {
		leaves[i] = weigh(p, 0)
	}
	// Each bisection adds one coarse panel and two halved ones.
	for budget := min(q.maxBisections(), MaxQuadratureBytes/(3*q.panelBytes())-len(mesh)); budget > 0; budget-- {
		worst := -1
		for i, l := range leaves {
			if l.excess > 0 && (worst < 0 || l.excess > leaves[worst].excess) {
				worst = i
			}
		}
		if worst < 0 {
			break
		}
		l := leaves[worst]
		mid := (l.p.lo + l.p.hi) / 2
		left, right := weigh(q.newPanel(l.p.lo, mid, false), l.depth+1), weigh(q.newPanel(mid, l.p.hi, false), l.depth+1)
		leaves = append(leaves[:worst+1], leaves[worst:]...)
		leaves[worst], leaves[worst+1] = left, right
	}
	out := make([]panel, len(leaves))
	for i, l := range leaves {
		q.sums(&l.p)
		out[i] = l.p
	}
	return out
}

// halve is the mesh with every panel split in two (an infinite one at t = ½).
func (q *Quadrature) halve(mesh []panel) []panel {
	var out []panel
	// The halved rings need only the modes kept (Modes, the last above
	// rounding's reach on any ring of the first mesh): fewer samples than
	// the first mesh's, which doubled until its top band fell below Tol,
	// serve them, the modes beyond aliasing onto them at rounding's level.
	// A quarter more than Modes is the margin for the rings between.
	need := q.Modes + 1 + q.Modes/4
	for _, p := range mesh {
		n := 2 * len(p.a[0]) // the first mesh's samples
		for n > 16 && n/4 >= need {
			n /= 2
		}
		top := min(n/2, q.Modes+1) // the modes sums and eval read
		if p.infinite {
			out = append(out, q.sampledPanelTop(p.lo, 2*p.lo, false, n, top), q.sampledPanelTop(2*p.lo, math.Inf(1), true, n, top))
		} else {
			mid := (p.lo + p.hi) / 2
			out = append(out, q.sampledPanelTop(p.lo, mid, false, n, top), q.sampledPanelTop(mid, p.hi, false, n, top))
		}
	}
	for i := range out {
		q.sums(&out[i])
	}
	return out
}

// modeSizes bounds each mode's particular solution: |p_k| ≤ (1/2ν_k) ∫ s |g_k| ds,
// or the sharper bound below.
func (q *Quadrature) modeSizes(mesh []panel) []float64 {
	size := make([]float64, q.Samples/2)
	peak := make([]float64, q.Samples/2)
	for _, p := range mesh {
		for i, s := range p.s {
			for k := 1; k < len(p.a[i]); k++ {
				g := math.Hypot(p.a[i][k], p.b[i][k])
				size[k] += p.w[i] * s * g / (2 * q.nu(k))
				peak[k] = math.Max(peak[k], g)
			}
		}
	}
	// Inside a circle of radius R and for ν > 2 the kernel's integrals are
	// at most r²/(ν + 2) and r²/(ν − 2): |p_k| ≤ max|g_k| R²/(ν² − 4), sharper.
	for k := range size {
		if nu := q.nu(k); nu > 2 && !math.IsInf(q.R, 1) {
			size[k] = math.Min(size[k], peak[k]*q.R*q.R/(nu*nu-4))
		}
	}
	return size
}

// Mode is (p_k(r), p_k'(r)), slices the caller must not modify, for the
// cosine and sine parts of every kept mode, from the halved mesh; err is the
// largest change of a value from the first mesh, with rounding, 1e-15 of the
// largest value, as the floor, plus the bound on the modes not kept.
func (q *Quadrature) Mode(r float64) (p, dp [][2]float64, err float64) {
	m := q.mode(r)
	return m.p, m.dp, m.err + m.tail
}

// TraceError is the estimate of the modes on a boundary circle of radius r
// as data for the harmonic part: of p_k(r), or with slope of
// r·p_k'(r)/max(ν_k, 1) (an error δ in the slope of mode k moves the
// harmonic part by about δ·r/ν_k). A sector's tail is left out, since its
// modes are missing from the harmonic part too.
func (q *Quadrature) TraceError(r float64, slope bool) float64 {
	m := q.mode(r)
	if slope {
		return math.Max(m.err, m.slopeErr)
	}
	return m.err
}

// recentRadii is how many radii's modes a quadrature keeps: a check
// walks each side's points and a step inward from each, and a sector's two
// rays visit the same radii (about 50 in all).
const recentRadii = 32

// sameRadius says whether a radius's cached modes serve r: equal to a few
// units in the last place (two rays' points reach one radius by different
// arithmetic), where the modes differ by rounding only.
func sameRadius(a, r float64) bool { return math.Abs(a-r) <= 2e-15*r }

func (q *Quadrature) mode(r float64) *modeAt {
	for _, m := range q.recent {
		if sameRadius(m.r, r) {
			return m
		}
	}
	p1, d1 := q.eval(q.coarse, r)
	p, dp := q.eval(q.fine, r)
	var errV, errD float64
	for k := range p {
		for j := 0; j < 2; j++ {
			errV = math.Max(errV, math.Abs(p[k][j]-p1[k][j]))
			errD = math.Max(errD, math.Abs(dp[k][j]-d1[k][j])*r/math.Max(q.nu(k), 1))
		}
	}
	floor := 1e-15 * maxAbs(p)
	tail := 0.0
	if q.Keep != nil {
		// A sector's extension decays algebraically (what its lift leaves at
		// the rays): the modes beyond are summed as a tail, at this radius.
		// Modes at rounding's reach are no tail.
		size := make([]float64, len(p))
		for k := range p {
			if v := math.Hypot(p[k][0], p[k][1]); v > floor/10 {
				size[k] = v
			}
		}
		tail = tailSum(size)
	}
	m := &modeAt{r, math.Max(errV, floor) + q.dropped, math.Max(errD, floor) + q.dropped, tail, p, dp}
	if len(q.recent) == recentRadii {
		q.recent = q.recent[1:]
	}
	q.recent = append(q.recent, m)
	return m
}

func maxAbs(p [][2]float64) float64 {
	m := 0.0
	for _, v := range p {
		m = math.Max(m, math.Max(math.Abs(v[0]), math.Abs(v[1])))
	}
	return m
}

// eval sums the Green's formula on a mesh: whole panels below and above r by
// their separated sums, the panel that holds r split there.
func (q *Quadrature) eval(mesh []panel, r float64) (p, dp [][2]float64) {
	p, dp = make([][2]float64, q.Modes+1), make([][2]float64, q.Modes+1)
	outside := math.IsInf(q.R, 1)
	if r < q.A {
		r = q.A
	}

	lnr := math.Log(r)
	for i := range mesh {
		pn := &mesh[i]
		switch {
		case !pn.infinite && pn.hi <= r: // wholly below r
			if !outside {
				p[0][0] += lnr*pn.below[0][0] - pn.log0
				dp[0][0] += pn.below[0][0] / r
			}
			x, f := math.Pow(pn.hi/r, q.omega()), 1.0
			// (hi/r)^ν_k falls with k: once below 1e-18 the rest of the
			// modes add nothing a float64 holds (a far panel's sums stop
			// after a few dozen modes, not a sector's thousand).
			for k := 1; k < len(pn.below) && f > 1e-18; k++ {
				nu := q.nu(k)
				f *= x
				for j := 0; j < 2; j++ {
					p[k][j] -= f / (2 * nu) * pn.below[k][j]
					dp[k][j] += f / (2 * r) * pn.below[k][j]
				}
			}
		case pn.lo >= r || pn.infinite: // wholly above r
			if outside {
				p[0][0] += pn.log0 - lnr*pn.above[0][0]
				dp[0][0] -= pn.above[0][0] / r
			}
			x, f := 0.0, 1.0
			if pn.lo > 0 {
				x = math.Pow(r/pn.lo, q.omega())
			}
			for k := 1; k < len(pn.above) && f > 1e-18; k++ { // as below
				nu := q.nu(k)
				f *= x
				for j := 0; j < 2; j++ {
					p[k][j] -= f / (2 * nu) * pn.above[k][j]
					if r > 0 { // at the centre p_k' is a limit the values do not need
						dp[k][j] -= f / (2 * r) * pn.above[k][j]
					}
				}
			}
		default:
			q.split(pn, r, p, dp)
		}
	}
	return p, dp
}

// split adds the part of the panel that holds r: Gauss–Legendre on [lo, r]
// and [r, hi] with the modes interpolated from the panel's nodes.
func (q *Quadrature) split(pn *panel, r float64, p, dp [][2]float64) {
	outside := math.IsInf(q.R, 1)
	ell := make([]float64, glN)
	// The modes at a point from the panel's nodes: ga[k] = Σ_j ℓ_j a_j[k],
	// node by node so the inner loop runs along the modes.
	top := min(q.Modes+1, len(pn.a[0]))
	ga, gb := make([]float64, q.Modes+1), make([]float64, q.Modes+1)
	for half := 0; half < 2; half++ {
		lo, hi := pn.lo, r
		if half == 1 {
			lo, hi = r, pn.hi
		}
		for n, x := range glX {
			s := (lo+hi)/2 + (hi-lo)/2*x
			ws := (hi - lo) / 2 * glW[n] * s
			lagrange((2*s-pn.lo-pn.hi)/(pn.hi-pn.lo), ell)
			clear(ga)
			clear(gb)
			for j, l := range ell { // ga += ℓ_j·a_j by gonum's vector kernel
				if pn.hasCos {
					floats.AddScaled(ga[:top], l, pn.a[j][:top])
				}
				if pn.hasSin {
					floats.AddScaled(gb[:top], l, pn.b[j][:top])
				}
			}
			g0 := ga[0]
			switch {
			case half == 0 && !outside && pn.lo == 0: // s = r·t_n: the centre's product rule
				p[0][0] -= r * r * centreLogWeights()[n] * g0
				dp[0][0] += ws / r * g0
			case half == 0 && !outside:
				p[0][0] += ws * math.Log(r/s) * g0
				dp[0][0] += ws / r * g0
			case half == 1 && outside:
				p[0][0] += ws * math.Log(s/r) * g0
				dp[0][0] -= ws / r * g0
			}
			x, xk := math.Pow(s/r, q.omega()), 1.0 // (s/r)^ν_k below r, (r/s)^ν_k above
			if half == 1 {
				x = math.Pow(r/s, q.omega())
			}
			for k := 1; k <= q.Modes; k++ {
				nu := q.nu(k)
				xk *= x
				f := xk / (2 * nu)
				K, dK := -f, f*nu/r
				if half == 1 {
					dK = -dK
				}
				p[k][0] += ws * K * ga[k]
				p[k][1] += ws * K * gb[k]
				dp[k][0] += ws * dK * ga[k]
				dp[k][1] += ws * dK * gb[k]
			}
		}
	}
}

// Integrals are ∬ g dA and ∬ p dA over the region with θ0 < θ < θ1, by the
// first mesh's rule in r and each mode's exact integral in θ; the second is
// NaN outside a circle, where p need not be integrable. A Lift adds its
// share over its sector.
func (q *Quadrature) Integrals(theta0, theta1 float64) (source, particular float64) {
	ic, is := make([]float64, q.Modes+1), make([]float64, q.Modes+1)
	ic[0] = theta1 - theta0
	for k := 1; k <= q.Modes; k++ {
		nu := q.nu(k)
		ic[k] = (math.Sin(nu*theta1) - math.Sin(nu*theta0)) / nu
		is[k] = (math.Cos(nu*theta0) - math.Cos(nu*theta1)) / nu
	}
	if math.IsInf(q.R, 1) {
		particular = math.NaN()
	}
	for _, pn := range q.coarse {
		for i, s := range pn.s {
			ws := pn.w[i] * s
			for k := 0; k <= q.Modes && k < len(pn.a[i]); k++ {
				source += ws * (pn.a[i][k]*ic[k] + pn.b[i][k]*is[k])
			}
			if !math.IsInf(q.R, 1) {
				p, _, _ := q.Mode(s)
				for k := range p {
					particular += ws * (p[k][0]*ic[k] + p[k][1]*is[k])
				}
			}
		}
	}
	if q.Lift != nil { // a sector's, with θ0 = 0
		g, p := q.Lift.Integrals(theta1)
		source, particular = source+g, particular+p
	}
	for _, k := range q.Kinks {
		g, p := k.Integrals(q.A, q.R, theta0, theta1)
		source, particular = source+g, particular+p
	}
	return source, particular
}

// Flux is ∫ ∂p/∂r r dθ over θ0 < θ < θ1 on the circle of radius r.
func (q *Quadrature) Flux(r, theta0, theta1 float64) float64 {
	_, dp, _ := q.Mode(r)
	total := dp[0][0] * (theta1 - theta0)
	for k := 1; k < len(dp); k++ {
		nu := q.nu(k)
		total += dp[k][0]*(math.Sin(nu*theta1)-math.Sin(nu*theta0))/nu + dp[k][1]*(math.Cos(nu*theta0)-math.Cos(nu*theta1))/nu
	}
	flux := r * total
	for _, k := range q.Kinks {
		flux += k.Flux(r, theta0, theta1)
	}
	return flux
}

// At is the particular solution at (r, θ), with the quadrature error estimate.
func (q *Quadrature) At(r, theta float64) (float64, float64) {
	p, _, err := q.Mode(r)
	return q.sum(p, r, theta), err
}

// Centred reports a centre away from the caller's origin.
func (q *Quadrature) Centred() bool { return q.X0 != 0 || q.Y0 != 0 }

// Local is the point (x, y) of the caller's plane in the quadrature's polar
// coordinates, θ in [0, 2π).
func (q *Quadrature) Local(x, y float64) (r, theta float64) {
	x, y = x-q.X0, y-q.Y0
	theta = math.Atan2(y, x)
	if theta < 0 {
		theta += 2 * math.Pi
	}
	return math.Hypot(x, y), theta
}

// GlobalKinks are the kinks in the caller's plane.
func (q *Quadrature) GlobalKinks() []Kink {
	if !q.Centred() {
		return q.Kinks
	}
	out := make([]Kink, len(q.Kinks))
	for i, k := range q.Kinks {
		out[i] = k.Shifted(-q.X0, -q.Y0)
	}
	return out
}

// Value is the particular solution at (r, θ) from the halved mesh alone,
// with no estimate (which needs the first mesh too): for checks, which
// sample it at many radii. It equals At's value.
func (q *Quadrature) Value(r, theta float64) float64 {
	return q.sum(q.fineMode(r).p, r, theta)
}

// ValueGradient is Value with Gradient, from the halved mesh alone: for a
// section's side samples, each at a radius of its own, where the first
// mesh's sums (half the work) would serve no estimate.
func (q *Quadrature) ValueGradient(r, theta float64) (v, pr, pt float64) {
	m := q.fineMode(r)
	pr, pt = q.gradient(m.p, m.dp, r, theta)
	return q.sum(m.p, r, theta), pr, pt
}

// fineMode is the halved mesh's modes at r, from either cache.
func (q *Quadrature) fineMode(r float64) *modeAt {
	for _, m := range q.recent {
		if sameRadius(m.r, r) {
			return m
		}
	}
	for _, m := range q.recentFine {
		if sameRadius(m.r, r) {
			return m
		}
	}
	p, dp := q.eval(q.fine, r)
	if len(q.recentFine) == recentRadii {
		q.recentFine = q.recentFine[1:]
	}
	m := &modeAt{r: r, p: p, dp: dp}
	q.recentFine = append(q.recentFine, m)
	return m
}

// sum is Σ_k p_k(r)·T(ν_k θ) with the closed parts (lift, kinks) at (r, θ).
func (q *Quadrature) sum(p [][2]float64, r, theta float64) float64 {
	// cos kωθ and sin kωθ by the rotation (c, s) ← (c·c₁ − s·s₁, s·c₁ + c·s₁),
	// exact to rounding; restarted from the functions every 64 modes.
	c1, s1 := math.Cos(q.omega()*theta), math.Sin(q.omega()*theta)
	v, c, sn := 0.0, 1.0, 0.0
	for k := range p {
		if k%64 == 0 {
			c, sn = math.Cos(q.nu(k)*theta), math.Sin(q.nu(k)*theta)
		}
		v += p[k][0]*c + p[k][1]*sn
		c, sn = c*c1-sn*s1, sn*c1+c*s1
	}
	if q.Lift != nil {
		v += q.Lift.Value(r, theta)
	}
	for _, k := range q.Kinks {
		v += k.Value(r, theta)
	}
	return v
}

// KinkModes are the Fourier coefficients of the kinks' closed parts and of
// their radial derivatives on the circle of radius r, modes 0..top.
func (q *Quadrature) KinkModes(r float64, top int) (p, dp [][2]float64) {
	p, dp = make([][2]float64, top+1), make([][2]float64, top+1)
	for _, k := range q.Kinks {
		kp, kdp := k.Modes(r, top)
		for m := range p {
			for j := 0; j < 2; j++ {
				p[m][j] += kp[m][j]
				dp[m][j] += kdp[m][j]
			}
		}
	}
	return p, dp
}

// Gradient is (∂p/∂r, ∂p/∂θ) at (r, θ), from the modes and their radial
// derivatives (no lift: regions with a lift do not ask).
func (q *Quadrature) Gradient(r, theta float64) (pr, pt float64) {
	p, dp, _ := q.Mode(r)
	return q.gradient(p, dp, r, theta)
}

func (q *Quadrature) gradient(p, dp [][2]float64, r, theta float64) (pr, pt float64) {
	for k := range p {
		c, s := math.Cos(q.nu(k)*theta), math.Sin(q.nu(k)*theta)
		pr += dp[k][0]*c + dp[k][1]*s
		pt += q.nu(k) * (p[k][1]*c - p[k][0]*s)
	}
	for _, k := range q.Kinks {
		vr, vt := k.Gradient(r, theta)
		pr, pt = pr+vr, pt+vt
	}
	return pr, pt
}

// offGrid reports a ring whose coefficients a, b (of the period P) disagree
// with the source between the samples, at 13 angles no power-of-two grid
// hits: content above the band folded onto lower modes (aliasing).
func (q *Quadrature) offGrid(r float64, a, b []float64) bool {
	const phi = 0.6180339887498949
	P := q.period()
	w := 2 * math.Pi / P
	// The ring's size is at least Σ|a_k| + |b_k|: a source concentrated
	// between the 13 test angles is tiny at all of them, and the FFT's
	// rounding must be measured against its peak.
	size, worst := 0.0, 0.0
	for k := range a {
		size += math.Abs(a[k]) + math.Abs(b[k])
	}
	for j := 1; j <= 13; j++ {
		th := P * math.Mod(float64(j)*phi, 1)
		v := 0.0
		for k := range a {
			v += a[k]*math.Cos(float64(k)*w*th) + b[k]*math.Sin(float64(k)*w*th)
		}
		g := q.G(r, th)
		size = math.Max(size, math.Abs(g))
		worst = math.Max(worst, math.Abs(g-v))
	}
	return worst > 1e-6*math.Max(size, 1e-300) && worst > 1e3*q.Tol*size
}

// MaxQuadratureBytes is the work budget of a quadrature's radial mesh: the
// bytes its panels' node coefficients may take (the coarse mesh and its
// halving together). It bounds memory, and with it the source evaluations.
const MaxQuadratureBytes = 64 << 20

// panelBytes is one panel's node coefficients: glN rings of Samples/2
// cosine and sine coefficients.
func (q *Quadrature) panelBytes() int { return glN * q.Samples * 8 }

// SourceSize is the largest |g| the quadrature sampled: the scale a check of
// its residual is measured against (a concentrated source can be tiny at
// every point a check samples).
func (q *Quadrature) SourceSize() float64 { return q.sourceSize }

func (q *Quadrature) maxBisections() int {
	if q.MaxBisections > 0 {
		return q.MaxBisections
	}
	return 400
}

func (q *Quadrature) maxSamples() int {
	if q.MaxSamples > 0 {
		return q.MaxSamples
	}
	return 1 << 12
}
