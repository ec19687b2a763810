package domain_test

import (
	"math"
	"strconv"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/domain"
	"psol/series"
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
func TestAreaRuleResolvesTheSource(t *testing.T) {
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
	// Narrower bumps, π·s of them, on other rules: the area rule refines
	// its cells where the source needs it (areaNodes).
	holed := domain.Holed{Outer: domain.Disk{R: series.IntCoef(1)}, Holes: []domain.CircleHole{{X: decimalCoef(-0.5), Y: decimalCoef(0), R: decimalCoef(0.2)}}}
	for _, c := range []struct {
		name string
		d    domain.Domain
		s    string
	}{{"square", square, "0.001"}, {"disk less a circle", holed, "0.0001"}, {"ellipse", domain.Ellipse{A: decimalCoef(1.2), B: decimalCoef(1)}, "0.0001"}} {
		sol := solveWith(t, "lap(u) = exp(-((x - 0.3)^2 + (y - 0.1)^2)/"+c.s+")", c.d, domain.Options{Tol: 1e-12}, everySide(c.d, "u = 0")...)
		rep, err := sol.Report(nil, 1e-12)
		if err != nil {
			t.Fatal(err)
		}
		want := math.Pi * decimal(c.s)
		if math.Abs(rep.Source-want) > 1e-12*want {
			t.Errorf("%s, width %s: source integral %.15g, want %.15g", c.name, c.s, rep.Source, want)
		}
	}
	// A kink along a circle, abs(r² − 1/4): ∬ over the square by hand,
	// 8/3 − 1 + 2·2π(1/4·1/8 − 1/64) (the area rule's budget takes it to
	// about 2e-8; the fixed rule left 4e-5).
	kinked := solveWith(t, "lap(u) = abs(x^2 + y^2 - 0.25)", square, domain.Options{Tol: 1e-12}, everySide(square, "u = 0")...)
	if rep, err := kinked.Report(nil, 1e-12); err != nil {
		t.Fatal(err)
	} else if want := 8.0/3 - 1 + 4*math.Pi*(0.25/8-1.0/64); math.Abs(rep.Source-want) > 1e-7*want {
		t.Errorf("abs(r^2 - 1/4) on the square: source integral %.15g, by hand %.15g", rep.Source, want)
	}
	f, conds, err := pose("lap(u) = "+bump+" - pi/400", square, everySide(square, "dn(u) = 0"), nil)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := domain.SolveWith(square, f, conds, domain.Options{Tol: 1e-12}); err != nil {
		t.Errorf("the compatible pure Neumann problem: %v", err)
	}
}

func decimal(s string) float64 {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		panic(err)
	}
	return v
}
