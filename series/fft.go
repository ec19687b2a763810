package series

import (
	"fmt"
	"math"
	"math/big"
	"strconv"

	"gonum.org/v1/gonum/dsp/fourier"
)

// NumericFourier is boundary data replaced by a finite Fourier sum computed by FFT.
type NumericFourier struct {
	Sum     Sum     // the kept modes, coefficients rounded to 15 digits
	Samples int     // the FFT size that met the tolerance (or the largest tried)
	Modes   int     // the highest mode kept
	Tail    float64 // an estimate of the neglected part's size: Σ |dropped coefficients|
	Met     bool    // whether the tail fell below the tolerance
	// Aliased marks data whose spectrum looked resolved on the samples but
	// whose values between them disagree with the kept modes: content above
	// the band folded onto lower modes. The coefficients are then not the data's.
	Aliased bool
	// NonFinite marks data that are NaN or infinite at the angle At: the
	// data are undefined there, or beyond float64's range.
	NonFinite bool
	At        float64
	// Peak is the largest |sample| of the data.
	Peak float64
}

// MaxSamples bounds the FFT size.
const MaxSamples = 1 << 12

// FourierFFT samples g(θ) at n equally spaced angles, n doubling from 64,
// until the coefficients in the top half of the resolved band are below
// tol·max|c|; it keeps the modes above that level.
func FourierFFT(g func(theta float64) float64, tol float64) NumericFourier {
	return FourierFFTUpTo(g, tol, MaxSamples)
}

// FourierFFTUpTo is FourierFFT with at most maxSamples samples.
func FourierFFTUpTo(g func(theta float64) float64, tol float64, maxSamples int) NumericFourier {
	var out NumericFourier
	for n := 64; n <= maxSamples; n *= 2 {
		x := make([]float64, n)
		for j := range x {
			th := 2 * math.Pi * float64(j) / float64(n)
			if x[j] = g(th); math.IsNaN(x[j]) || math.IsInf(x[j], 0) {
				out.NonFinite, out.At = true, th
				return out
			}
		}
		peak := 0.0
		for _, v := range x {
			peak = math.Max(peak, math.Abs(v))
		}
		c := fourier.NewFFT(n).Coefficients(nil, x)
		half := n / 2
		a := make([]float64, half)
		b := make([]float64, half)
		scale := 0.0
		for k := 0; k < half; k++ {
			a[k] = 2 * real(c[k]) / float64(n)
			b[k] = -2 * imag(c[k]) / float64(n)
			if k == 0 {
				a[k] /= 2
			}
			scale = math.Max(scale, math.Hypot(a[k], b[k]))
		}
		top := 0.0
		for k := half / 2; k < half; k++ {
			top = math.Max(top, math.Hypot(a[k], b[k]))
		}
		keep := half / 2
		var terms []Term
		tail := 0.0
		floor := math.Max(tol*1e-2, 1e-14) * scale
		for k := 0; k < half; k++ {
			for i, c := range []float64{a[k], b[k]} {
				if k >= keep || math.Abs(c) <= floor {
					tail += math.Abs(c)
					continue
				}
				out.Modes = k
				terms = append(terms, Term{C: decimalCoef(c), M: k, Sin: i == 1})
			}
		}
		out = NumericFourier{Sum: NewSum(terms...), Samples: n, Modes: out.Modes, Tail: tail, Met: top <= tol*math.Max(scale, 1e-300), Peak: peak}
		if out.Met {
			// A converged-looking spectrum may be aliased (cos(2^41 θ) sampled
			// at 64 points is 1): compare with the data between the samples.
			out.Aliased = offGridMismatch(g, a, b, keep) > 1e-3*scale+1e3*tol*scale
			if !out.Aliased {
				break
			}
			out.Met = false
		}
	}
	return out
}

// decimalCoef is x rounded to 15 significant digits, as an exact decimal.
func decimalCoef(x float64) Coef {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return Coef{}
	}
	q, _ := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', 15, 64))
	return RatCoef(q)
}

// Describe says how the coefficients were found.
func (nf NumericFourier) Describe() string {
	s := fmt.Sprintf("Fourier coefficients by FFT with %d samples, modes up to %d kept, neglected part about %.1e", nf.Samples, nf.Modes, nf.Tail)
	if !nf.Met {
		s += " (the tolerance was not reached: the data may be discontinuous or rough)"
	}
	return s
}

// TextApprox prints s with its coefficients as decimals, for numeric results.
func (s Sum) TextApprox() string {
	return printTerms(s.visible(), style{latex: false, mul: "*", decimal: true})
}

// LaTeXApprox is TextApprox as LaTeX.
func (s Sum) LaTeXApprox() string {
	return printTerms(s.visible(), style{latex: true, mul: " ", decimal: true})
}

// visible are the terms a decimal print shows: those above 1e-10 of the
// largest coefficient. Below, a numeric coefficient is rounding noise, which
// changes from one CPU to the next; printing it would claim digits psol
// does not have (the terms still count in every evaluation).
func (s Sum) visible() []Term {
	big := 0.0
	size := make([]float64, len(s.t))
	for i, t := range s.t {
		v, err := t.C.Float(nil)
		if err != nil {
			return s.t // parameters: no floor
		}
		size[i] = math.Abs(v)
		big = math.Max(big, size[i])
	}
	out := make([]Term, 0, len(s.t))
	for i, t := range s.t {
		if size[i] >= 1e-10*big {
			out = append(out, t)
		}
	}
	return out
}

// offGridMismatch is the largest |g(θ) − Σ_{k<keep} a_k cos kθ + b_k sin kθ|
// over 17 angles that no power-of-two grid hits (the golden-ratio sequence):
// an aliasing check that needs no more samples than the FFT's.
func offGridMismatch(g func(theta float64) float64, a, b []float64, keep int) float64 {
	worst := 0.0
	const phi = 0.6180339887498949
	for j := 1; j <= 17; j++ {
		th := 2 * math.Pi * math.Mod(float64(j)*phi, 1)
		v := 0.0
		for k := 0; k < keep && k < len(a); k++ {
			v += a[k]*math.Cos(float64(k)*th) + b[k]*math.Sin(float64(k)*th)
		}
		worst = math.Max(worst, math.Abs(g(th)-v))
	}
	return worst
}
