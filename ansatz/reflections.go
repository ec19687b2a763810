package ansatz

import (
	"gonum.org/v1/gonum/dsp/fourier"
)

// quarterRing takes a ring's modes from its first quarter when the source
// over the period is that quarter reflected about θ = 0 and θ = P/4 (a
// sector's extension, Quadrature.Reflect). With q = n/4 and θ_j = P·j/n,
// the reflections leave one family of the n-point FFT's modes, which the
// quarter's own transform gives (gonum's, unnormalised, so divided by q):
//
//	odd, odd    b_2m      DST-I of x_1..x_{q−1}      (period P/2, sines)
//	even, even  a_2m      DCT-I of x_0..x_q          (period P/2, cosines; a_0 = out_0/2q)
//	odd, even   b_{2m+1}  quarter-wave sine of x_1..x_q
//	even, odd   a_{2m+1}  quarter-wave cosine of x_0..x_{q−1}
//
// The samples on a ray the extension is odd about are 0 and are not taken.
// TestQuarterRingAgainstFFT checks each against the full transform.
type quarterRing struct {
	odd   [2]bool
	first int // the first sample taken
	x     []float64
	dst   *fourier.DST
	dct   *fourier.DCT
	wave  *fourier.QuarterWaveFFT
}

func newQuarterRing(n int, odd [2]bool) *quarterRing {
	q := n / 4
	r := &quarterRing{odd: odd}
	switch {
	case odd[0] && odd[1]:
		r.first, r.x, r.dst = 1, make([]float64, q-1), fourier.NewDST(q-1)
	case !odd[0] && !odd[1]:
		r.first, r.x, r.dct = 0, make([]float64, q+1), fourier.NewDCT(q+1)
	case odd[0]:
		r.first, r.x, r.wave = 1, make([]float64, q), fourier.NewQuarterWaveFFT(q)
	default:
		r.first, r.x, r.wave = 0, make([]float64, q), fourier.NewQuarterWaveFFT(q)
	}
	return r
}

// modes are the ring's a_k, b_k, k < top ≤ n/2, at radius s.
func (r *quarterRing) modes(quad *Quadrature, s float64, n, top int) (a, b []float64) {
	P, q := quad.period(), n/4
	for i := range r.x {
		r.x[i] = quad.G(s, P*float64(r.first+i)/float64(n))
	}
	quad.noteSize(r.x)
	// One family only is nonzero (sines when the start ray is odd): the
	// other is the quadrature's shared zeros.
	if r.odd[0] {
		a, b = quad.zeros(top), make([]float64, top)
	} else {
		a, b = make([]float64, top), quad.zeros(top)
	}
	scale := 1 / float64(q)
	switch {
	case r.dst != nil:
		out := r.dst.Transform(r.x, r.x)
		for m := 0; m < len(out) && 2*(m+1) < top; m++ {
			b[2*(m+1)] = out[m] * scale
		}
	case r.dct != nil:
		out := r.dct.Transform(r.x, r.x)
		a[0] = out[0] * scale / 2
		for m := 1; m < len(out) && 2*m < top; m++ {
			a[2*m] = out[m] * scale
		}
	case r.odd[0]:
		out := r.wave.SinCoefficients(r.x, r.x)
		for m := 0; m < len(out) && 2*m+1 < top; m++ {
			b[2*m+1] = out[m] * scale
		}
	default:
		out := r.wave.CosCoefficients(r.x, r.x)
		for m := 0; m < len(out) && 2*m+1 < top; m++ {
			a[2*m+1] = out[m] * scale
		}
	}
	return a, b
}
