package ansatz

import (
	"math"
	"testing"
)

// The Chebyshev interpolant and its derivatives against exp (common
// practice: an entire function's interpolant converges geometrically).
func TestChebyshevFit(t *testing.T) {
	const R = 2
	c := chebFit(math.Exp, R, 32)
	d1 := chebDerivative(c, R)
	d2 := chebDerivative(d1, R)
	for _, tc := range []struct {
		name string
		got  func(r float64) float64
		tol  float64
	}{
		{"G", func(r float64) float64 { return chebAt(c, r, R) }, 1e-14},
		{"G'", func(r float64) float64 { return chebAt(d1, r, R) }, 1e-12},
		{"G''", func(r float64) float64 { return chebAt(d2, r, R) }, 1e-10},
	} {
		for _, r := range []float64{0, 0.3, 1, 1.7, 2} {
			if got, want := tc.got(r), math.Exp(r); math.Abs(got-want) > tc.tol*want {
				t.Errorf("%s(%g) = %.16g, want %.16g", tc.name, r, got, want)
			}
		}
	}
}

// Lap is the Laplacian of Value: against central differences in polar
// coordinates with one Richardson step (an independent path).
func TestRayLiftLaplacian(t *testing.T) {
	alpha := math.Pi / 3
	l := &RayLift{R: 1.5}
	if !l.Fit(func(r float64) float64 { return 1 / (1 + r*r) }, []float64{0, -alpha / 3, 0.5, -1 / (6 * alpha)}, 1e-13, 0) ||
		!l.Fit(func(r float64) float64 { return math.Cos(r) }, []float64{0, 0, 0, 1, -1 / alpha}, 1e-13, 0) {
		t.Fatal("fits refused")
	}
	for _, p := range [][2]float64{{0.4, 0.2}, {0.9, 0.5}, {1.3, 1}} {
		r, th := p[0], p[1]
		fd := func(h float64) float64 {
			k := h / r
			u := l.Value
			return (u(r+h, th)-2*u(r, th)+u(r-h, th))/(h*h) + (u(r+h, th)-u(r-h, th))/(2*h*r) + (u(r, th+k)-2*u(r, th)+u(r, th-k))/(r*r*k*k)
		}
		want := (4*fd(1e-3) - fd(2e-3)) / 3
		if got := l.Lap(r, th); math.Abs(got-want) > 1e-7 {
			t.Errorf("Lap(%g, %g) = %.12g, differences give %.12g", r, th, got, want)
		}
	}
}

// A source that is not finite on the ray adds no term; one below the floor
// adds none either, and both leave the lift usable.
func TestRayLiftRefusals(t *testing.T) {
	l := &RayLift{R: 1}
	if l.Fit(func(r float64) float64 { return 1 / r }, []float64{0, 1}, 1e-12, 0) {
		t.Error("1/r on [0, 1] was fitted")
	}
	if !l.Fit(func(r float64) float64 { return 1e-20 * r }, []float64{0, 1}, 1e-12, 1e-15) || len(l.Terms) != 0 {
		t.Errorf("a negligible term was kept: %d terms", len(l.Terms))
	}
	if v := l.Value(0.5, 0.5); v != 0 {
		t.Errorf("an empty lift is %g", v)
	}
}

// TensorIntegral against elementary integrals (common practice): a
// polynomial of degree below 32 per variable is exact to rounding, and
// ∬ e^x cos y = (e^a − 1) sin b converges spectrally.
func TestTensorIntegral(t *testing.T) {
	for _, c := range []struct {
		name string
		f    func(x, y float64) float64
		a, b float64
		want float64
	}{
		{"x^3 y^5", func(x, y float64) float64 { return x * x * x * y * y * y * y * y }, 2, 3, 16.0 / 4 * 729.0 / 6},
		{"e^x cos y", func(x, y float64) float64 { return math.Exp(x) * math.Cos(y) }, 1.5, 2, (math.Exp(1.5) - 1) * math.Sin(2)},
	} {
		if got := TensorIntegral(c.f, c.a, c.b, 3); math.Abs(got-c.want) > 1e-13*math.Abs(c.want) {
			t.Errorf("%s: %.16g, want %.16g", c.name, got, c.want)
		}
	}
}
