package domain_test

import (
	"math"
	"strings"
	"testing"

	"psol/domain"
	"psol/series"
)

// Δu = −2·sin x·sin y on the square (0, π)² with u = 0: u = sin x·sin y, the
// square's first Dirichlet eigenfunction (any text on separation of
// variables, e.g. Strauss, Partial Differential Equations, ch. 10). The
// waves give it whole as u_p, its trace 0 to rounding (the fit's target
// takes the waves' size inside: the data's, 1e-16, had it refused), and
// the figures are by hand: ∬u = 2·2 = 4, each side's outward flux
// −∫₀^π sin = −2, the source's integral −8.
func TestSectionWavesEigenfunction(t *testing.T) {
	square := polygonXY(0, 0, math.Pi, 0, math.Pi, math.Pi, 0, math.Pi)
	sol := solveWith(t, "lap(u) = -2*sin(x)*sin(y)", square, domain.Options{}, everySide(square, "u = 0")...)
	if sol.Waves == nil || sol.Quadrature != nil {
		t.Fatalf("the source's waves went to the quadrature (waves %v)", sol.Waves)
	}
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{math.Pi / 2, math.Pi / 2}, {0.3, 2.9}, {2, 1}} {
		u, _, _ := ev.AtXY(p[0], p[1])
		if want := math.Sin(p[0]) * math.Sin(p[1]); math.Abs(u-want) > 1e-12 {
			t.Errorf("u(%g, %g) = %.15g, want sin x sin y = %.15g", p[0], p[1], u, want)
		}
	}
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rep.Integral-4) > 1e-11 || math.Abs(rep.Source+8) > 1e-11 || math.Abs(rep.Max-1) > 1e-9 {
		t.Errorf("area integral %.15g (want 4), source integral %.15g (want −8), max %.15g (want 1)", rep.Integral, rep.Source, rep.Max)
	}
	for _, s := range rep.Sides {
		if math.Abs(s.Value+2) > 1e-10 {
			t.Errorf("outward flux through %s %.15g, want −2", s.Side, s.Value)
		}
	}
}

// The waves in closed form against psol's other road for the same source,
// the quadrature (Options.NumericSource: an independent numeric particular
// solution, a Green's-kernel quadrature on a disk about the section): values
// and every figure agree, on a triangle with a Robin side, an ellipse with
// a flux side, a rectangle less a disk (its hole at a flux, then floating at one unknown value with a net flux), and a source whose waves leave a
// polynomial (sin(x)² = 1/2 − cos(2x)/2), and beside a bump that only the
// quadrature takes, and on a millimetre triangle with waves of 300 and
// 200 per unit length. The closed road takes no quadrature for the waves.
func TestSectionWavesAgainstQuadrature(t *testing.T) {
	triangle := polygonXY(0, 0, 1.5, 0, 0.4, 1)
	holed := domain.Holed{Outer: polygonXY(0, 0, 1, 0, 1, 0.6, 0, 0.6), Holes: []domain.CircleHole{{X: decimalCoef(0.3), Y: decimalCoef(0.3), R: decimalCoef(0.12)}}}
	ellipse := domain.Ellipse{A: decimalCoef(1.2), B: decimalCoef(0.7)}
	for _, c := range []struct {
		name, equation string
		d              domain.Domain
		bcs            []string
		rest           bool    // a part for the quadrature beside the waves
		size           float64 // the figures' scale, for the comparison (1 where 0)
	}{
		{"triangle", "lap(u) = exp(x + 2*y) - 1", triangle, []string{"s1: u = 0", "s2: dn(u) + 3u = 1", "s3: u = x"}, false, 0},
		{"ellipse", "lap(u) = sin(3*x)*cosh(y) + x*cos(y)", ellipse, []string{"rim: dn(u) + u = 0"}, false, 0},
		{"rectangle less a disk", "lap(u) = cos(2*x)*exp(-y)", holed, append(everySide(holed.Outer, "u = 0"), "hole1: dn(u) = 1"), false, 0},
		{"a floating hole", "lap(u) = sin(2*x)*exp(y)", holed, append(everySide(holed.Outer, "u = 0"), "hole1: u = const, flux = 0.1"), false, 0},
		{"a millimetre triangle", "lap(u) = exp(300*x)*cos(200*y)", polygonXY(0, 0, 0.015, 0, 0.004, 0.01), []string{"s1: u = 0", "s2: dn(u) + 50u = 0", "s3: u = 0"}, false, 1e-4},
		{"a polynomial left over", "lap(u) = sin(x)^2 + x", triangle, everySide(triangle, "u = 0"), false, 0},
		{"waves beside a bump", "lap(u) = cos(x + y) + exp(-((x - 0.5)^2 + (y - 0.3)^2)/0.05)", triangle, []string{"s1: u = 0", "s2: dn(u) + 3u = 1", "s3: u = 0"}, true, 0},
	} {
		closed, numeric, rc, rn := bothRoads(t, c.name, c.equation, c.d, c.rest, c.bcs)
		const tol = 1e-9
		size := c.size // u's scale; an integral's is it times the area
		if size == 0 {
			size = 1
		}
		area, _ := rc.Area.Float(nil)
		nearScaled := func(what string, a, b, size float64) {
			if math.Abs(a-b) > tol*math.Max(size, math.Abs(b)) {
				t.Errorf("%s: %s %.15g by the waves, %.15g by the quadrature", c.name, what, a, b)
			}
		}
		near := func(what string, a, b float64) { nearScaled(what, a, b, size) }
		nearScaled("area integral", rc.Integral, rn.Integral, size*area)
		near("source integral", rc.Source, rn.Source)
		near("max u", rc.Max, rn.Max)
		near("min u", rc.Min, rn.Min)
		for k := range rc.Sides {
			near("flux through "+rc.Sides[k].Side, rc.Sides[k].Value, rn.Sides[k].Value)
		}
		near("net flux less the source's integral", rc.Flux-rc.Source, 0)
		ec, en := evaluator(t, closed, 1e-12), evaluator(t, numeric, 1e-12)
		for _, p := range [][2]float64{{0.3, 0.2}, {0.6, 0.1}, {0.5, 0.4}, {0.004, 0.003}} {
			if !domain.InsideXY(c.d, nil)(p[0], p[1]) {
				continue
			}
			a, _, _ := ec.AtXY(p[0], p[1])
			b, _, _ := en.AtXY(p[0], p[1])
			near("u at a point", a, b)
		}
	}
}

// A wave whose polynomial factor carries a parameter with no value is
// refused, on a section and on the rectangle, with the parameter named: the
// waves' compiled form took it as 0 between points, and Δu = q·exp(x) with
// u = 0 printed u = q·exp(x) on the rectangle (its trace read 0) and
// u ≈ −q·sin(x) + h with h fitted for q = 0 on a triangle. With its value
// the answer is linear in it (common practice: linearity of Δ).
func TestWavesNeedTheirParameters(t *testing.T) {
	triangle := polygonXY(0, 0, 1, 0, 0, 1)
	rect := domain.Rect{L: decimalCoef(1), H: decimalCoef(1)}
	for _, c := range []struct {
		d      domain.Domain
		source string
	}{{triangle, "lap(u) = q*sin(x)"}, {rect, "lap(u) = q*exp(x)"}, {triangle, "lap(u) = (1 + q*y)*exp(x)"}} {
		f, conds, err := pose(c.source, c.d, everySide(c.d, "u = 0"), nil)
		if err != nil {
			t.Fatal(err)
		}
		if _, err := domain.SolveWith(c.d, f, conds, domain.Options{}); err == nil || !strings.Contains(err.Error(), "parameter q") {
			t.Errorf("%s on %s with q unset: %v, want a refusal naming q", c.source, c.d.Describe(), err)
		}
		var at [2]float64
		for i, q := range []float64{1, 3} {
			f, conds, err := pose(c.source, c.d, everySide(c.d, "u = 0"), series.Env{"q": decimalCoef(q)})
			if err != nil {
				t.Fatal(err)
			}
			sol, err := domain.SolveWith(c.d, f, conds, domain.Options{})
			if err != nil {
				t.Fatal(err)
			}
			at[i], _, _ = evaluator(t, sol, 1e-12).AtXY(0.25, 0.25)
		}
		if c.source != "lap(u) = (1 + q*y)*exp(x)" && (at[0] == 0 || math.Abs(at[1]-3*at[0]) > 1e-11) {
			t.Errorf("%s: u(1/4, 1/4) = %.15g at q = 1 and %.15g at q = 3, want three times", c.source, at[0], at[1])
		}
	}
}

// bothRoads solves a problem with the source's waves in closed form and by
// the quadrature (Options.NumericSource), checks which road each took (rest:
// the closed road keeps a quadrature for a part beside the waves), and
// reports both.
func bothRoads(t *testing.T, name, equation string, d domain.Domain, rest bool, bcs []string) (closed, numeric *domain.Solution, rc, rn *domain.Report) {
	t.Helper()
	closed = solveWith(t, equation, d, domain.Options{Tol: 1e-12}, bcs...)
	numeric = solveWith(t, equation, d, domain.Options{Tol: 1e-12, NumericSource: true}, bcs...)
	if closed.Waves == nil || (closed.Quadrature != nil) != rest || numeric.Quadrature == nil {
		t.Fatalf("%s: the closed road took waves %v and quadrature %v; the numeric road quadrature %v", name, closed.Waves != nil, closed.Quadrature != nil, numeric.Quadrature != nil)
	}
	var err error
	if rc, err = closed.Report(nil, 1e-12); err != nil {
		t.Fatal(err)
	}
	if rn, err = numeric.Report(nil, 1e-12); err != nil {
		t.Fatal(err)
	}
	return closed, numeric, rc, rn
}
