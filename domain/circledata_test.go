package domain_test

import (
	"math"
	"math/big"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

func solveWith(t testing.TB, equation string, d domain.Domain, opt domain.Options, bcs ...string) *domain.Solution {
	t.Helper()
	f, conds, err := pose(equation, d, bcs, nil)
	if err != nil {
		t.Fatal(err)
	}
	sol, err := domain.SolveWith(d, f, conds, opt)
	if err != nil {
		t.Fatalf("%s with %v: %v", equation, bcs, err)
	}
	return sol
}

func evaluator(t testing.TB, sol *domain.Solution, tol float64) *domain.Evaluator {
	ev, err := sol.Compile(nil, tol, 1<<22)
	if err != nil {
		t.Fatal(err)
	}
	return ev
}

var unitDisk = domain.Disk{R: series.IntCoef(1)}

// Data 1 on the upper half of the rim, 0 on the lower: the Poisson integral in
// closed form, u = 1/2 + (1/π) arctan(2r sin θ/(1 − r²)) (any text on Laplace's
// equation in a disk, e.g. Strauss, Partial Differential Equations, ch. 6).
func TestHalfRimPoisson(t *testing.T) {
	sol := solve(t, "lap(u) = 0", unitDisk, "u = 0 < theta < pi ? 1 : 0")
	ev := evaluator(t, sol, 1e-13)
	for _, p := range [][2]float64{{0, 0}, {0.3, 1}, {0.5, 1}, {0.9, 4}, {0.99, 2.5}, {0.999, 0.3}, {0.999, 3.3}, {0.9999, 2.64}} {
		r, th := p[0], p[1]
		want := 0.5 + math.Atan(2*r*math.Sin(th)/(1-r*r))/math.Pi
		got, _, _ := ev.At(r, th)
		if math.Abs(got-want) > 1e-12 {
			t.Errorf("u(%g, %g) = %.13f, Poisson closed form %.13f", r, th, got, want)
		}
	}
	if len(sol.Notes) != 2 {
		t.Errorf("want a warning per jump, got %q", sol.Notes)
	}
	// The recognised closed sum, parsed back, is the Poisson closed form too.
	closed, err := parse.Expression("closed form", "1/2 + "+sol.ClosedForm, nil)
	if err != nil {
		t.Fatalf("%s: %v", sol.ClosedForm, err)
	}
	cf, err := closed.Compile(nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range [][2]float64{{0.3, 1}, {0.9, 4}, {0.999, 0.3}} {
		r, th := p[0], p[1]
		if got, want := cf.At(r, th), 0.5+math.Atan(2*r*math.Sin(th)/(1-r*r))/math.Pi; math.Abs(got-want) > 1e-12 {
			t.Errorf("closed form %s at %v: %.14f, want %.14f", sol.ClosedForm, p, got, want)
		}
	}
}

// poisson is the Poisson integral (1/2π)∫ P(r, θ − φ) g(φ) dφ by gonum's
// Gauss–Legendre rule on panels graded towards φ = θ, with panel edges at
// the quarter angles and at breaks (where the data lose smoothness): an
// independent path.
func poisson(g func(float64) float64, r, theta float64, breaks ...float64) float64 {
	kernel := func(phi float64) float64 {
		return (1 - r*r) / (1 - 2*r*math.Cos(theta-phi) + r*r) * g(math.Mod(phi+4*math.Pi, 2*math.Pi))
	}
	var edges []float64
	w := 1 - r
	for d := w / 4; d < math.Pi; d *= 1.5 {
		edges = append(edges, theta-d, theta+d)
	}
	edges = append(edges, theta-math.Pi, theta+math.Pi)
	for _, b := range append([]float64{0, math.Pi / 2, math.Pi, 3 * math.Pi / 2}, breaks...) { // the data's break points
		for _, k := range []float64{-2 * math.Pi, 0, 2 * math.Pi} {
			if x := b + k; x > theta-math.Pi && x < theta+math.Pi {
				edges = append(edges, x)
			}
		}
	}
	sortFloats(edges)
	total := 0.0
	for i := 0; i+1 < len(edges); i++ {
		total += quad.Fixed(kernel, edges[i], edges[i+1], 40, nil, 0)
	}
	return total / (2 * math.Pi)
}

func sortFloats(xs []float64) {
	for i := 1; i < len(xs); i++ {
		for j := i; j > 0 && xs[j] < xs[j-1]; j-- {
			xs[j], xs[j-1] = xs[j-1], xs[j]
		}
	}
}

// Data θ(2π − θ): Fourier coefficients 2π²/3 and −4/n² (an elementary
// integral, common practice), and the summed values at r = 0.95 against the
// Poisson integral by quadrature.
func TestRampSquaredData(t *testing.T) {
	f, err := parse.Expression("data", "theta*(2*pi - theta)", nil)
	if err != nil {
		t.Fatal(err)
	}
	fc, err := series.Fourier([]series.Piece{{From: big.NewRat(0, 1), To: big.NewRat(2, 1), Value: f}})
	if err != nil {
		t.Fatal(err)
	}
	if fc.A.Text() != "-4/n^2" || !fc.B.IsZero() || fc.A0.Text() != "2/3*pi^2" {
		t.Errorf("coefficients A0 = %s, A = %s, B = %s; want 2/3*pi^2, -4/n^2, 0", fc.A0.Text(), fc.A.Text(), fc.B.Text())
	}
	sol := solve(t, "lap(u) = 0", unitDisk, "u = theta*(2*pi - theta)")
	ev := evaluator(t, sol, 1e-13)
	g := func(th float64) float64 { return th * (2*math.Pi - th) }
	for _, th := range []float64{0.2, 1.5, 3, 5.9} {
		got, _, _ := ev.At(0.95, th)
		if want := poisson(g, 0.95, th); math.Abs(got-want) > 1e-10 {
			t.Errorf("u(0.95, %g) = %.12f, Poisson quadrature %.12f", th, got, want)
		}
	}
}

// Data 1/(2 + cos θ), numeric: its coefficients are (2/√3)(√3 − 2)^n (the
// Poisson-kernel series; Gradshteyn & Ryzhik §1.44, from memory), so the
// harmonic extension is (1/√3)(1 − ρ²)/(1 − 2ρ cos θ + ρ²), ρ = (√3 − 2)r.
func TestRationalTrigData(t *testing.T) {
	nf := series.FourierFFT(func(th float64) float64 { return 1 / (2 + math.Cos(th)) }, 1e-13)
	q := math.Sqrt(3) - 2
	for _, tm := range nf.Sum.Terms() {
		c, _ := tm.C.Float(nil)
		want := 2 / math.Sqrt(3) * math.Pow(q, float64(tm.M))
		if tm.M == 0 {
			want = 1 / math.Sqrt(3)
		}
		if tm.Sin {
			want = 0
		}
		if math.Abs(c-want) > 1e-12 {
			t.Errorf("mode %d (sin %v): %.15f, want %.15f", tm.M, tm.Sin, c, want)
		}
	}
	sol := solve(t, "lap(u) = 0", unitDisk, "u = 1/(2 + cos(theta))")
	if !sol.Numeric {
		t.Error("1/(2 + cos θ) did not take the numeric path")
	}
	ev := evaluator(t, sol, 1e-13)
	for _, p := range [][2]float64{{0.2, 1}, {0.7, 2}, {0.999, 0.5}} {
		rho := q * p[0]
		want := (1 - rho*rho) / (1 - 2*rho*math.Cos(p[1]) + rho*rho) / math.Sqrt(3)
		got, errEst, _ := ev.At(p[0], p[1])
		if math.Abs(got-want) > 1e-11 {
			t.Errorf("u(%v) = %.14f, closed form %.14f", p, got, want)
		}
		if errEst > 1e-9 {
			t.Errorf("u(%v): error estimate %g", p, errEst)
		}
	}
}

// besselI is I_n(1) by its power series Σ_k 1/(k!(n+k)! 2^(2k+n)) (Abramowitz & Stegun 9.6.10).
func besselI(n int) float64 {
	sum, term := 0.0, math.Pow(0.5, float64(n))
	for i := 1; i <= n; i++ {
		term /= float64(i)
	}
	for k := 0; k < 30; k++ {
		sum += term
		term *= 0.25 / (float64(k+1) * float64(n+k+1))
	}
	return sum
}

// Data exp(cos θ): coefficients I_0(1) and 2 I_n(1) (Abramowitz & Stegun 9.6.34).
func TestExpCosData(t *testing.T) {
	sol := solve(t, "lap(u) = 0", unitDisk, "u = exp(cos(theta))")
	ev := evaluator(t, sol, 1e-13)
	for _, p := range [][2]float64{{0.3, 0.4}, {0.8, 2.2}, {0.999, 4}} {
		want := besselI(0)
		for n := 1; n < 40; n++ {
			want += 2 * besselI(n) * math.Pow(p[0], float64(n)) * math.Cos(float64(n)*p[1])
		}
		if got, _, _ := ev.At(p[0], p[1]); math.Abs(got-want) > 1e-11 {
			t.Errorf("u(%v) = %.14f, Bessel series %.14f", p, got, want)
		}
	}
}

// The FFT path forced on data that also has an exact path agrees with it.
func TestForcedNumericData(t *testing.T) {
	for _, c := range []struct {
		eq, bc string
		d      domain.Domain
	}{
		{"lap(u) = x^2 - 1", "u = x*y + cos(theta)^3", unitDisk},
		{"lap(u) = 0", "dn(u) + 2u = sin(3theta) - 1", domain.Outside{R: series.IntCoef(2)}},
		{"lap(u) = 1", "u = 0 < theta < pi/2 ? theta : 0", unitDisk},
	} {
		exact := evaluator(t, solveWith(t, c.eq, c.d, domain.Options{}, c.bc), 1e-13)
		nsol := solveWith(t, c.eq, c.d, domain.Options{NumericData: true}, c.bc)
		numeric := evaluator(t, nsol, 1e-13)
		limit := 1e-12
		if c.bc[4:6] == "0 " {
			// Discontinuous data: sampled coefficients are only O(1/N) accurate, and
			// psol says so; the error it reports must cover the true error.
			limit = nsol.DataError
			if !strings.Contains(strings.Join(nsol.Notes, " "), "not reached") {
				t.Errorf("discontinuous data by FFT without a warning: %q", nsol.Notes)
			}
		}
		for _, p := range [][2]float64{{0.3, 1}, {0.6, 4}} {
			r := p[0]
			if _, ok := c.d.(domain.Outside); ok {
				r = 2 + 3*p[0]
			}
			a, _, _ := exact.At(r, p[1])
			b, _, _ := numeric.At(r, p[1])
			if math.Abs(a-b) > limit {
				t.Errorf("%s, %s at (%g, %g): exact %.14f, FFT %.14f", c.eq, c.bc, r, p[1], a, b)
			}
		}
	}
}

func BenchmarkPiecewiseCoefficients(b *testing.B) {
	f, err := parse.Expression("data", "theta < pi/2 ? theta*(pi - theta) : theta < 3*pi/2 ? sin(2theta) : 1", nil)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		fc, err := series.Fourier(f.Pieces)
		if err != nil {
			b.Fatal(err)
		}
		a, _ := series.SeriesSum{Parts: []series.Series{{Family: series.Family{Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1}, R: series.IntCoef(1), General: []series.RadialTerm{{C: fc.A, Scaled: true}}}}}.Compile(nil)
		_ = a
		cf, _ := fc.A.Float(series.Env{"n": series.IntCoef(7)})
		_ = cf
	}
}

// BenchmarkDiscontinuousSummation sums the half-rim solution at 10⁴ points,
// a tenth of them at r = 0.999, to 1e-12.
func BenchmarkDiscontinuousSummation(b *testing.B) {
	sol := solve(b, "lap(u) = 0", unitDisk, "u = theta < pi ? theta : 0")
	ev := evaluator(b, sol, 1e-12)
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		for k := 0; k < 10000; k++ {
			r := 0.999
			if k%10 != 0 {
				r = 0.9 * float64(k%100) / 100
			}
			ev.At(r, 2*math.Pi*float64(k)/10000)
		}
	}
}

// Exact piecewise data on an annulus: the printed series is harmonic (finite
// differences at interior points) and takes the data on both circles.
func TestAnnulusPiecewise(t *testing.T) {
	sol := solve(t, "lap(u) = 1", annulus(t, "1", "2"), "inner: u = abs(sin(theta))", "outer: dn(u) + u = 0 < theta < pi ? 1 : 0")
	assertChecks(t, sol)
	ev := evaluator(t, sol, 1e-13)
	u := func(x, y float64) float64 {
		v, _, _ := ev.At(math.Hypot(x, y), math.Mod(math.Atan2(y, x)+2*math.Pi, 2*math.Pi))
		return v
	}
	for _, p := range [][2]float64{{1.3, 0.5}, {1.5, 2}, {1.7, 4}} {
		x, y := p[0]*math.Cos(p[1]), p[0]*math.Sin(p[1])
		lap := func(h float64) float64 { return (u(x+h, y) + u(x-h, y) + u(x, y+h) + u(x, y-h) - 4*u(x, y)) / (h * h) }
		if fd := (4*lap(5e-3) - lap(1e-2)) / 3; math.Abs(fd-1) > 1e-6 {
			t.Errorf("FD Laplacian at %v: %.9f, want 1", p, fd)
		}
	}
	for _, th := range []float64{0.7, 2.2, 4} {
		got, _, _ := ev.At(1, th)
		if want := math.Abs(math.Sin(th)); math.Abs(got-want) > 1e-5 {
			t.Errorf("inner value at θ = %g: %.8f, want %.8f", th, got, want)
		}
	}
}

// TestKinkedDataExact: data |x − 1/2| on the unit circle, kinked at
// θ = ±π/3, take exact Fourier coefficients (Kink.CircleAbs): the mean
// 1/2 + √3/π − 1/3 (∫|cos φ − 1/2| dφ/2π, worked by hand), and u inside
// against the Poisson integral by quadrature with edges at the kinks. By
// the FFT they erred 4.9e-8 at (0.2, 0.3), estimated 2.9e-4.
func TestKinkedDataExact(t *testing.T) {
	sol := solve(t, "lap(u) = 0", unitDisk, "u = abs(x - 1/2)")
	if sol.Numeric {
		t.Fatal("kinked data went to the FFT")
	}
	ev := evaluator(t, sol, 1e-13)
	g := func(phi float64) float64 { return math.Abs(math.Cos(phi) - 0.5) }
	if got, _, _ := ev.At(0, 0); math.Abs(got-(0.5+math.Sqrt(3)/math.Pi-1.0/3)) > 1e-14 {
		t.Errorf("u(0) = %.15f, want the mean 1/2 + √3/π − 1/3", got)
	}
	for _, p := range [][2]float64{{0.36, 0.98}, {0.986, 1.039}, {0.5, 4}, {0.999, 5.2}} {
		got, _, _ := ev.At(p[0], p[1])
		if want := poisson(g, p[0], p[1], math.Pi/3, 5*math.Pi/3); math.Abs(got-want) > 1e-11 {
			t.Errorf("u(%g, %g) = %.14f, Poisson integral %.14f", p[0], p[1], got, want)
		}
	}
}
