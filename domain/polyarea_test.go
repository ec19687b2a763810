package domain_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/domain"
)

// A bump of width 0.1, exp(−((x − 0.2)² + (y − 0.1)²)/0.01), on the square
// (−1, 1)² as a polygon: its integral is π/100 (the Gaussian's over the plane;
// the square leaves out e⁻⁶⁴ of it), which the report's source integral must
// give to 1e-12, not to the 7e-6 of a polygon's area rule too coarse for
// it. The area integral of u against a tensor Gauss–Legendre rule (gonum's
// quad.Legendre, 32 × 32 panels of 8 × 8 points) on the evaluator. And
// with a flux condition on every side, the same bump less its mean is a
// compatible pure Neumann problem, solved (it was refused as incompatible,
// the source's integral read 9.5e-8 off 0).
func TestPolygonAreaRuleResolvesABump(t *testing.T) {
	square := polygonXY(-1, -1, 1, -1, 1, 1, -1, 1)
	bump := "exp(-((x - 0.2)^2 + (y - 0.1)^2)/0.01)"
	sol := solveWith(t, "lap(u) = "+bump, square, domain.Options{Tol: 1e-12}, everySide(square, "u = 0")...)
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rep.Source-math.Pi/100) > 1e-12*math.Pi/100 {
		t.Errorf("source integral %.15g, want π/100 = %.15g", rep.Source, math.Pi/100)
	}
	ev := evaluator(t, sol, 1e-12)
	const panels, order = 32, 8
	xs, ws := make([]float64, order), make([]float64, order)
	quad.Legendre{}.FixedLocations(xs, ws, -1, 1)
	want := 0.0
	h := 2.0 / panels
	for i := 0; i < panels; i++ {
		for j := 0; j < panels; j++ {
			for a, xa := range xs {
				for b, yb := range xs {
					x, y := -1+h*(float64(i)+(xa+1)/2), -1+h*(float64(j)+(yb+1)/2)
					u, _, _ := ev.AtXY(x, y)
					want += ws[a] * ws[b] * h * h / 4 * u
				}
			}
		}
	}
	if math.Abs(rep.Integral-want) > 1e-11*math.Abs(want) {
		t.Errorf("area integral of u %.15g, by a tensor Gauss rule %.15g", rep.Integral, want)
	}
	f, conds, err := pose("lap(u) = "+bump+" - pi/400", square, everySide(square, "dn(u) = 0"), nil)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := domain.SolveWith(square, f, conds, domain.Options{Tol: 1e-12}); err != nil {
		t.Errorf("the compatible pure Neumann problem: %v", err)
	}
}
