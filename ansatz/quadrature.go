package ansatz

import (
	"math"

	"gonum.org/v1/gonum/dsp/fourier"
	"gonum.org/v1/gonum/integrate/quad"
)

// Quadrature is a particular solution of Δu = g for a source with no closed
// form, on a region bounded by circles about the origin with inner radius A
// (0 for a disk). Mode by mode, with g = Σ_m g_m(r) T_m(θ) from an FFT on
// each ring,
//
//	p_0(r) = ∫_A^r s ln(r/s) g_0(s) ds,
//	p_m(r) = ∫_A^r s [(r/s)^m − (s/r)^m]/(2m) g_m(s) ds   (m ≥ 1),
//
// which solve p” + p'/r − m²p/r² = g_m and vanish with their derivative at
// r = A; the integrals use composite Gauss–Legendre rules, and the angular
// samples double until the top band of every ring's spectrum is below Tol.
type Quadrature struct {
	G       func(r, theta float64) float64
	A, R    float64
	Tol     float64
	Samples int // angular samples, fixed by Prepare
	Modes   int // highest mode kept
	ffts    map[int]*fourier.FFT
	buf     []float64
	rings   map[float64][2][]float64 // rings of the current Mode call: its levels share most nodes
	last    *modeAt                  // the latest Mode, for several angles on one radius
}

type modeAt struct {
	r, err float64
	p, dp  [][2]float64
}

var gl16x, gl16w = func() ([]float64, []float64) {
	x, w := make([]float64, 16), make([]float64, 16)
	quad.Legendre{}.FixedLocations(x, w, -1, 1)
	return x, w
}()

// ring is the Fourier coefficients of g on the circle of radius s: a[m] cos, b[m] sin.
func (q *Quadrature) ring(s float64, n int) (a, b []float64) {
	if c, ok := q.rings[s]; ok && len(c[0]) == n/2 {
		return c[0], c[1]
	}
	defer func() {
		if q.rings != nil {
			q.rings[s] = [2][]float64{a, b}
		}
	}()
	if q.ffts == nil {
		q.ffts = map[int]*fourier.FFT{}
	}
	fft, ok := q.ffts[n]
	if !ok {
		fft = fourier.NewFFT(n)
		q.ffts[n] = fft
	}
	if len(q.buf) < n {
		q.buf = make([]float64, n)
	}
	x := q.buf[:n]
	for j := range x {
		x[j] = q.G(s, 2*math.Pi*float64(j)/float64(n))
	}
	c := fft.Coefficients(nil, x)
	a, b = make([]float64, n/2), make([]float64, n/2)
	for k := 0; k < n/2; k++ {
		a[k] = 2 * real(c[k]) / float64(n)
		b[k] = -2 * imag(c[k]) / float64(n)
	}
	a[0] /= 2
	// Below the FFT's rounding level a coefficient is noise, and the kernel's
	// (r/s)^m would magnify it near the centre: drop it.
	big := 0.0
	for k := range a {
		big = math.Max(big, math.Max(math.Abs(a[k]), math.Abs(b[k])))
	}
	for k := range a {
		if math.Abs(a[k]) < 1e-14*big {
			a[k] = 0
		}
		if math.Abs(b[k]) < 1e-14*big {
			b[k] = 0
		}
	}
	return a, b
}

// Prepare chooses the angular samples on rings out to R.
func (q *Quadrature) Prepare(R float64) {
	q.last = nil
	for n := 32; n <= 1<<12; n *= 2 {
		q.Samples = n
		worst, scale, modes := 0.0, 0.0, 0
		for _, frac := range []float64{0.1, 0.35, 0.6, 0.85, 1} {
			a, b := q.ring(q.A+(R-q.A)*frac, n)
			for k := range a {
				v := math.Hypot(a[k], b[k])
				scale = math.Max(scale, v)
				if k >= n/4 {
					worst = math.Max(worst, v)
				} else if v > 1e-3*q.Tol*scale {
					modes = max(modes, k)
				}
			}
		}
		q.Modes = modes
		if worst <= q.Tol*math.Max(scale, 1e-300) {
			return
		}
	}
}

// Mode is (p_m(r), p_m'(r)), slices the caller must not modify, for the cosine and sine parts of every kept
// mode, by 16-point Gauss–Legendre panels on [A, r], graded geometrically
// towards A where a disk's kernel has its logarithm. err estimates the error
// of the returned (finest) values from three equally spaced levels, where
// the error falls geometrically: with e1 = |P12 − P8|, e2 = |P16 − P12| and
// rate ρ = e2/e1, err = e2·ρ/(1 − ρ).
func (q *Quadrature) Mode(r float64) (p, dp [][2]float64, err float64) {
	if q.last != nil && q.last.r == r {
		return q.last.p, q.last.dp, q.last.err
	}
	defer func() { q.last = &modeAt{r, err, p, dp} }()
	q.rings = map[float64][2][]float64{}
	defer func() { q.rings = nil }()
	p4, d4 := q.integrate(r, 8)
	p8, d8 := q.integrate(r, 12)
	p16, d16 := q.integrate(r, 16)
	e1, e2 := 0.0, 0.0
	for m := range p16 {
		for k := 0; k < 2; k++ {
			e1 = math.Max(e1, math.Max(math.Abs(p8[m][k]-p4[m][k]), math.Abs(d8[m][k]-d4[m][k])*r))
			e2 = math.Max(e2, math.Max(math.Abs(p16[m][k]-p8[m][k]), math.Abs(d16[m][k]-d8[m][k])*r))
		}
	}
	switch rho := e2 / e1; {
	case e1 == 0 || e2 == 0:
		err = e2
	case rho < 0.9:
		err = e2 * rho / (1 - rho)
	default: // not converging geometrically: say so by the last change itself
		err = e2
	}
	// Rounding: the integrals add terms of size ∫|K g| s ds, known to ~1e-16 each.
	err = math.Max(err, 1e-15*math.Abs(maxAbs(p16)))
	return p16, d16, err
}

func maxAbs(p [][2]float64) float64 {
	m := 0.0
	for _, v := range p {
		m = math.Max(m, math.Max(math.Abs(v[0]), math.Abs(v[1])))
	}
	return m
}

func (q *Quadrature) integrate(r float64, panels int) (p, dp [][2]float64) {
	p = make([][2]float64, q.Modes+1)
	dp = make([][2]float64, q.Modes+1)
	if r <= q.A {
		r = q.A
	}
	// [A, r]: panels halving towards A, where a disk's kernel has its logarithm.
	edges := []float64{r}
	for i := 1; i < panels; i++ {
		edges = append(edges, q.A+(r-q.A)*math.Pow(0.5, float64(i)))
	}
	edges = append(edges, q.A)
	inner := func(s, w float64, a, b []float64) {
		for m := 0; m <= q.Modes && m < len(a); m++ {
			var K, dK float64
			if m == 0 { // p_0 = ∫_A^r s ln(r/s) g_0 ds
				K, dK = math.Log(r/s), 1/r
			} else { // p_m ⊃ −(1/2m) r^(−m) ∫_A^r s^(1+m) g_m ds
				f := math.Pow(s/r, float64(m)) / (2 * float64(m))
				K, dK = -f, f*float64(m)/r
			}
			p[m][0] += w * K * a[m]
			p[m][1] += w * K * b[m]
			dp[m][0] += w * dK * a[m]
			dp[m][1] += w * dK * b[m]
		}
	}
	outer := func(s, w float64, a, b []float64) {
		for m := 1; m <= q.Modes && m < len(a); m++ { // p_m ⊃ −(1/2m) r^m ∫_r^R s^(1−m) g_m ds
			f := math.Pow(r/s, float64(m)) / (2 * float64(m))
			K, dK := -f, -f*float64(m)/r
			p[m][0] += w * K * a[m]
			p[m][1] += w * K * b[m]
			dp[m][0] += w * dK * a[m]
			dp[m][1] += w * dK * b[m]
		}
	}
	rule := func(lo, hi float64, add func(s, w float64, a, b []float64)) {
		for k, x := range gl16x {
			s := (lo+hi)/2 + (hi-lo)/2*x
			a, b := q.ring(s, q.Samples)
			add(s, (hi-lo)/2*gl16w[k]*s, a, b)
		}
	}
	for i := 0; i+1 < len(edges); i++ {
		if edges[i] > edges[i+1] {
			rule(edges[i+1], edges[i], inner)
		}
	}
	if q.Modes > 0 && q.R > r {
		for i := 0; i < panels; i++ {
			rule(r+(q.R-r)*float64(i)/float64(panels), r+(q.R-r)*float64(i+1)/float64(panels), outer)
		}
	}
	return p, dp
}

// At is the particular solution at (r, θ), with the quadrature error estimate.
func (q *Quadrature) At(r, theta float64) (float64, float64) {
	p, _, err := q.Mode(r)
	v := 0.0
	for m := range p {
		c, s := math.Cos(float64(m)*theta), math.Sin(float64(m)*theta)
		v += p[m][0]*c + p[m][1]*s
	}
	return v, err
}
