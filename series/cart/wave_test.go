package cart_test

import (
	"math"
	"testing"

	"psol/parse"
	"psol/series"
	"psol/series/cart"
)

// The wave ansatz: for exponentials and trigonometric functions of linear
// forms times polynomials, Δ of the particular solution is the source,
// reduced exactly; a harmonic wave (e^x cos y, x·e^y sin x) is resonant and
// takes polynomials one degree higher.
func TestWaveParticular(t *testing.T) {
	for _, src := range []string{"x*exp(x - y)", "sin(pi*x)*sin(2*y)", "cosh(x)*y^2", "exp(x)*cos(2*y)*x", "x^2*sin(3*x + y)/4", "exp(2*x)*sinh(y)", "(cos(x) + y)^2",
		"x*exp(y)*sin(x)", "exp(x)*cos(y)", "exp(3*x + 4*y)*cos(4*x - 3*y)", "y^2*exp(x)*cos(y)"} {
		f, err := parse.Expression("test", src, nil)
		if err != nil {
			t.Fatal(err)
		}
		rest := f.Rest
		if rest == nil {
			t.Fatalf("%s: no remainder", src)
		}
		w, err := cart.FromExpr(rest)
		if err != nil {
			t.Errorf("%s: %v", src, err)
			continue
		}
		if len(f.Exact.Terms()) > 0 {
			p, _ := cart.FromPolar(f.Exact)
			w = w.Add(cart.Waves{{Cos: p}})
		}
		u, poly, err := w.Particular()
		if err != nil {
			t.Errorf("%s: %v", src, err)
			continue
		}
		minus := cart.Monomial(series.IntCoef(-1), 0, 0)
		res := u.Laplacian().Add(cart.Waves{{Cos: poly}}).Add(w.Scale(minus))
		if len(res) != 0 {
			t.Errorf("%s: u_p = %s leaves %s", src, u.Text(), res.Text())
		}
	}
}

// TestResonantWaveByDifferences checks the resonant waves' particular
// solutions independently of the algebra: Δu by the five-point stencil with
// one Richardson step (common practice) against the source, at scattered points.
func TestResonantWaveByDifferences(t *testing.T) {
	for _, src := range []string{"x*exp(y)*sin(x)", "exp(x)*cos(y)", "exp(3*x + 4*y)*cos(4*x - 3*y)/50"} {
		f, err := parse.Expression("test", src, nil)
		if err != nil {
			t.Fatal(err)
		}
		w, err := cart.FromExpr(f.Rest)
		if err != nil {
			t.Fatal(err)
		}
		u, _, err := w.Particular()
		if err != nil {
			t.Fatalf("%s: %v", src, err)
		}
		cu, err := u.Compile(nil)
		if err != nil {
			t.Fatal(err)
		}
		cf, err := w.Compile(nil)
		if err != nil {
			t.Fatal(err)
		}
		for _, p := range [][2]float64{{0.3, -0.2}, {-0.7, 0.4}, {0.1, 0.9}} {
			x, y := p[0], p[1]
			lap := func(h float64) float64 {
				return (cu.At(x+h, y) + cu.At(x-h, y) + cu.At(x, y+h) + cu.At(x, y-h) - 4*cu.At(x, y)) / (h * h)
			}
			fd := (4*lap(5e-3) - lap(1e-2)) / 3
			if want := cf.At(x, y); math.Abs(fd-want) > 1e-6*math.Max(1, math.Abs(want)) {
				t.Errorf("%s at (%g, %g): Δu_p = %.10g by differences, source %.10g", src, x, y, fd, want)
			}
		}
	}
}
