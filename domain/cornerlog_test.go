package domain_test

import (
	"math"
	"testing"

	"psol/domain"
)

// At a right-angled corner with u = 0 on both sides, Δu = −2 meets a
// resonance: the particular solution's trace −r²/2 on the two sides is no
// harmonic polynomial's of degree 2 with those values, and the expansion
// there takes (2/π)·Re(i·z²·log z) (common practice: the corner's
// eigenfunctions r^(2k) meet the data's degree-2 term; Grisvard, Elliptic
// Problems in Nonsmooth Domains). Poles alone resolve that log only
// root-exponentially (21 poles a corner for a tolerance of 1e-12, on this
// rectangle and on others from 1 × 1 to 1 × 0.2); with the corner's ζ²·log ζ
// in the basis, 8 to 12. The stress function is
// checked against Timoshenko & Goodier's series for the rectangular bar,
// −a < x < a, −b < y < b: φ = b² − y² − (32b²/π³) Σ_{n odd} (−1)^((n−1)/2)
// n^−3 cosh(nπx/2b)/cosh(nπa/2b) cos(nπy/2b), summed here to rounding.
func TestCornerLogarithms(t *testing.T) {
	a, b := 1.0, 0.5
	rect := polygon([2]float64{-a, -b}, [2]float64{a, -b}, [2]float64{a, b}, [2]float64{-a, b})
	sol := solveWith(t, "lap(u) = -2", rect, domain.Options{Tol: 1e-12}, everySide(rect, "u = 0")...)
	series := func(x, y float64) float64 {
		sum := 0.0
		for n := 1; n < 400; n += 2 {
			k := float64(n) * math.Pi / (2 * b)
			sign := 1.0
			if (n-1)/2%2 == 1 {
				sign = -1
			}
			// cosh(kx)/cosh(ka) without overflow: e^(k(|x|−a))(1 + e^(−2k|x|))/(1 + e^(−2ka)).
			ratio := math.Exp(k*(math.Abs(x)-a)) * (1 + math.Exp(-2*k*math.Abs(x))) / (1 + math.Exp(-2*k*a))
			sum += sign / math.Pow(float64(n), 3) * ratio * math.Cos(k*y)
		}
		return b*b - y*y - 32*b*b/math.Pow(math.Pi, 3)*sum
	}
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0, 0}, {0.5, 0.2}, {-0.9, 0.45}, {0.99, -0.49}, {0.3, -0.1}} {
		got, _, _ := ev.AtXY(p[0], p[1])
		if want := series(p[0], p[1]); math.Abs(got-want) > 1e-13 {
			t.Errorf("φ%v = %.16f, series %.16f", p, got, want)
		}
	}
	for k, n := range sol.Section.Poles {
		if n > 12 {
			t.Errorf("corner %d took %d poles: with its ζ²·log ζ, 12 serve", k, n)
		}
	}
}
