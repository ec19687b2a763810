package cart_test

import (
	"testing"

	"psol/parse"
	"psol/series"
	"psol/series/cart"
)

// The wave ansatz: for exponentials and trigonometric functions of linear
// forms times polynomials, Δ of the particular solution is the source,
// reduced exactly; a harmonic exponential (e^x cos y) is refused.
func TestWaveParticular(t *testing.T) {
	for _, src := range []string{"x*exp(x - y)", "sin(pi*x)*sin(2*y)", "cosh(x)*y^2", "exp(x)*cos(2*y)*x", "x^2*sin(3*x + y)/4", "exp(2*x)*sinh(y)", "(cos(x) + y)^2"} {
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
	f, _ := parse.Expression("test", "exp(x)*cos(y)", nil)
	w, err := cart.FromExpr(f.Rest)
	if err != nil {
		t.Fatal(err)
	}
	if _, _, err := w.Particular(); err != cart.ErrResonant {
		t.Errorf("exp(x)*cos(y): %v, want the resonance", err)
	}
}
