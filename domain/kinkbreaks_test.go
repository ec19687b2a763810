package domain_test

import (
	"math"
	"testing"

	"psol/domain"
)

// kinkSlab is u on the rectangle 0 < x < L, 0 < y < 1 with Δu = |x − a| and
// u = 0 on the walls, by the sine series in x (common practice: separation
// of variables): u = Σ b_n(y) sin(kx), k = nπ/L, b_n” − k²b_n = f_n, b_n(0)
// = b_n(1) = 0, so b_n = −(f_n/k²)(1 − cosh(k(y − ½))/cosh(k/2)), with f_n =
// (2/L)∫₀ᴸ |x − a| sin(kx) dx = (2/L)(F(L) + F(0) − 2F(a)) for the
// antiderivative F(x) = −(x − a)cos(kx)/k + sin(kx)/k² of (x − a)sin(kx)
// (worked by hand). f_n/k² falls like n⁻⁴: 40000 terms leave under 1e-14.
func kinkSlab(L, a, x, y float64) float64 {
	u := 0.0
	for n := 1; n <= 40000; n++ {
		k := float64(n) * math.Pi / L
		F := func(x float64) float64 { return -(x-a)*math.Cos(k*x)/k + math.Sin(k*x)/(k*k) }
		fn := 2 / L * (F(L) + F(0) - 2*F(a))
		ratio := math.Exp(-k*(0.5-math.Abs(y-0.5))) * (1 + math.Exp(-2*k*math.Abs(y-0.5))) / (1 + math.Exp(-k))
		u += -fn / (k * k) * (1 - ratio) * math.Sin(k*x)
	}
	return u
}

// TestKinkLineCrossingASide: a kinked source on fitted sections, its line
// crossing the sides. u_p = |ℓ|³/6 is closed, but the correction the fit
// must supply has a jump in its third derivative at each crossing, and the
// fit, its poles at the vertices only, stopped at 2e-8 of the data after
// twelve fits and psol refused (exit 1). With a corner of angle π at each
// crossing (kinkbreaks.go) it meets the tolerance: the rectangle as a
// polygon against the sine series above, and a hexagon about the origin
// (abs(x): the line through two vertices' sides) against its mirror image
// (the kink's line x = 0 is the hexagon's mirror line, so u(x, y) = u(−x, y)).
func TestKinkLineCrossingASide(t *testing.T) {
	rect := polygon([2]float64{0, 0}, [2]float64{2, 0}, [2]float64{2, 1}, [2]float64{0, 1})
	sol := solveWith(t, "lap(u) = abs(x - 0.5)", rect, domain.Options{Tol: 1e-12}, sidesOf(rect, "s", "u = 0")...)
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{1.2, 0.5}, {0.5, 0.5}, {0.3, 0.1}, {1.9, 0.8}} {
		got, _, _ := ev.AtXY(p[0], p[1])
		if want := kinkSlab(2, 0.5, p[0], p[1]); math.Abs(got-want) > 1e-11 {
			t.Errorf("u(%g, %g) = %.14f, sine series %.14f", p[0], p[1], got, want)
		}
	}
	s3 := math.Sqrt(3) / 2
	hex := polygon([2]float64{1, 0}, [2]float64{0.5, s3}, [2]float64{-0.5, s3}, [2]float64{-1, 0}, [2]float64{-0.5, -s3}, [2]float64{0.5, -s3})
	sol = solveWith(t, "lap(u) = abs(x) - 1", hex, domain.Options{Tol: 1e-12}, sidesOf(hex, "s", "u = 0")...)
	ev = evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0.2, 0.1}, {0.6, -0.3}, {0.05, 0.8}} {
		a, _, _ := ev.AtXY(p[0], p[1])
		b, _, _ := ev.AtXY(-p[0], p[1])
		if math.Abs(a-b) > 1e-12 || a <= 0 {
			t.Errorf("u(%g, %g) = %.14f, u(%g, %g) = %.14f: want equal, and above 0 (Δu < 0: the minimum on the boundary)", p[0], p[1], a, -p[0], p[1], b)
		}
	}
}
