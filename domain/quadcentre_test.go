package domain_test

import (
	"math"
	"strconv"
	"testing"

	"psol/domain"
)

// TestSectionQuadratureAboutItsCentre: a section's quadrature disk is
// about the section, not the origin. A manufactured solution (common
// practice) u* = ln(1 + x + y), Δu* = −2/(1 + x + y)², on the rectangle
// 1 × 1/2 as a polygon: the source's singular line x + y = −1 lies 0.71
// from the origin, inside the old disk r < 1.118 about it (the fit failed
// after 6.5 s) and 1.24 from the section's centre, outside the new disk of
// radius 0.56. And a Gaussian on the unit square moved to (100, 100) gives
// the values it gives at the origin (translation invariance; the disk
// about the origin had radius 143 there, and psol refused).
func TestSectionQuadratureAboutItsCentre(t *testing.T) {
	rect := polygon([2]float64{0, 0}, [2]float64{1, 0}, [2]float64{1, 0.5}, [2]float64{0, 0.5})
	sol := solveWith(t, "lap(u) = -2/(1 + x + y)^2", rect, domain.Options{Tol: 1e-12}, sidesOf(rect, "s", "u = ln(1 + x + y)")...)
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0.6, 0.3}, {0.05, 0.05}, {0.95, 0.45}} {
		got, _, _ := ev.AtXY(p[0], p[1])
		if want := math.Log(1 + p[0] + p[1]); math.Abs(got-want) > 1e-11 {
			t.Errorf("u(%g, %g) = %.14f, ln(1 + x + y) = %.14f", p[0], p[1], got, want)
		}
	}
	at := func(x0, y0 float64) func(x, y float64) float64 {
		sq := polygon([2]float64{x0, y0}, [2]float64{x0 + 1, y0}, [2]float64{x0 + 1, y0 + 1}, [2]float64{x0, y0 + 1})
		src := "lap(u) = exp(-((x - " + ftoa(x0+0.3) + ")^2 + (y - " + ftoa(y0+0.6) + ")^2)/0.05)"
		ev := evaluator(t, solveWith(t, src, sq, domain.Options{Tol: 1e-12}, sidesOf(sq, "s", "u = 0")...), 1e-12)
		return func(x, y float64) float64 { v, _, _ := ev.AtXY(x0+x, y0+y); return v }
	}
	home, away := at(0, 0), at(100, 100)
	for _, p := range [][2]float64{{0.3, 0.6}, {0.5, 0.5}, {0.9, 0.1}} {
		if a, b := home(p[0], p[1]), away(p[0], p[1]); math.Abs(a-b) > 1e-12 {
			t.Errorf("u at (%g, %g) from the corner: %.14f at the origin, %.14f at (100, 100)", p[0], p[1], a, b)
		}
	}
}

func ftoa(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
