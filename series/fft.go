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
			x[j] = g(2 * math.Pi * float64(j) / float64(n))
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
		out = NumericFourier{Sum: NewSum(terms...), Samples: n, Modes: out.Modes, Tail: tail, Met: top <= tol*math.Max(scale, 1e-300)}
		if out.Met {
			break
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
	return printTerms(s.t, style{latex: false, mul: "*", decimal: true})
}

// LaTeXApprox is TextApprox as LaTeX.
func (s Sum) LaTeXApprox() string {
	return printTerms(s.t, style{latex: true, mul: " ", decimal: true})
}
