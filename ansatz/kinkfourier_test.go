package ansatz

import (
	"math"
	"math/big"
	"testing"

	"psol/series"
)

// The kink's exact trace coefficients against an independent path: the
// FFT of v and of ∂v/∂r sampled on the circle (Kink.Modes, 16384 samples),
// for lines crossing the circle in each quadrant's angles, through the
// centre, and missing it.
func TestKinkCircleTraceAgainstFFT(t *testing.T) {
	cases := []struct {
		c       int64
		a, b, d *big.Rat
		R       *big.Rat
	}{
		{1, big.NewRat(0, 1), big.NewRat(1, 1), big.NewRat(-3, 10), big.NewRat(1, 1)}, // abs(y − 0.3)
		{-2, big.NewRat(1, 1), big.NewRat(-1, 1), big.NewRat(0, 1), big.NewRat(1, 1)}, // through the centre, 45°
		{3, big.NewRat(2, 1), big.NewRat(1, 1), big.NewRat(1, 2), big.NewRat(3, 2)},   // an angle no rational multiple of π
		{1, big.NewRat(-1, 3), big.NewRat(2, 5), big.NewRat(1, 7), big.NewRat(1, 2)},
		{1, big.NewRat(1, 1), big.NewRat(2, 1), big.NewRat(5, 1), big.NewRat(1, 1)}, // misses the circle
	}
	for _, c := range cases {
		A, B, D := series.RatCoef(c.a), series.RatCoef(c.b), series.RatCoef(c.d)
		g2 := A.Mul(A).Add(B.Mul(B))
		factor, _ := series.IntCoef(c.c).Div(g2.MulRat(big.NewRat(6, 1)))
		af, _ := c.a.Float64()
		bf, _ := c.b.Float64()
		df, _ := c.d.Float64()
		k := Kink{C: float64(c.c), A: af, B: bf, D: df, Factor: factor, LA: A, LB: B, LD: D}
		r, _ := c.R.Float64()
		p, dp := k.Modes(r, 40)
		for i, deriv := range []bool{false, true} {
			fc, ok := k.CircleTrace(series.RatCoef(c.R), deriv)
			if !ok {
				t.Fatalf("%+v: no exact trace", c)
			}
			want := p
			if i == 1 {
				want = dp
			}
			// The FFT aliases: ∂v/∂r jumps in its second derivative, so its
			// coefficients fall like n⁻³ and those folded back from beyond
			// 16384 samples add ~1e-12; v's fall like n⁻⁴.
			tol := 1e-13
			if deriv {
				tol = 1e-11
			}
			scale := 0.0
			for _, m := range want {
				scale = math.Max(scale, math.Hypot(m[0], m[1]))
			}
			for n := 0; n <= 40; n++ {
				var ab [2]float64
				if n == 0 {
					ab[0], _ = fc.A0.Float(nil)
				} else if sp, ok := fc.Special[n]; ok {
					ab[0], _ = sp[0].Float(nil)
					ab[1], _ = sp[1].Float(nil)
				} else {
					for j, g := range []series.Coef{fc.A, fc.B} {
						v, err := series.Coefficient(g, n)
						if err != nil {
							t.Fatalf("%+v n = %d: %v", c, n, err)
						}
						ab[j], _ = v.Float(nil)
					}
				}
				for j := 0; j < 2; j++ {
					if math.Abs(ab[j]-want[n][j]) > tol*scale {
						t.Errorf("%+v deriv %v mode %d[%d]: exact %.16g, FFT %.16g", c, deriv, n, j, ab[j], want[n][j])
					}
				}
			}
		}
	}
}
