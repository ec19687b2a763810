package domain

import (
	"math"
	"testing"

	"psol/series"
)

// Every region's Shape against closed forms and against itself: the area by
// the divergence theorem, A = ½∮(x n_x + y n_y) ds over the sides (an
// independent path through the sides' points and normals; common practice),
// the perimeter against the elementary formula, and the outward normal
// checked by stepping off each side: inward lands in the region, outward not.
func TestShapes(t *testing.T) {
	pi := math.Pi
	cases := []struct {
		name      string
		d         Domain
		area, per float64 // from the elementary formulas
	}{
		{"disk", Disk{R: series.IntCoef(2)}, 4 * pi, 4 * pi},
		{"annulus", Annulus{R1: series.IntCoef(1), R2: series.IntCoef(3)}, 8 * pi, 8 * pi},
		{"sector", Sector{R: series.IntCoef(2), Alpha: series.SymCoef(series.Pi).MulRat(ratOf(1)).Mul(series.FracCoef(2, 3))}, 4 * pi / 3, 4 + 4*pi/3},
		{"rect", Rect{L: series.IntCoef(3), H: series.FracCoef(1, 2)}, 1.5, 7},
		{"outside", Outside{R: series.IntCoef(1)}, math.Inf(1), 2 * pi},
	}
	for _, c := range cases {
		sh, err := c.d.Shape(nil)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if got := sh.Area; math.Abs(got-c.area) > 1e-13*c.area && got != c.area {
			t.Errorf("%s: area %g, want %g", c.name, got, c.area)
		}
		if got := sh.Perimeter(); math.Abs(got-c.per) > 1e-13*c.per {
			t.Errorf("%s: perimeter %g, want %g", c.name, got, c.per)
		}
		if len(sh.Sides) != len(c.d.Sides()) {
			t.Fatalf("%s: %d side paths for %d sides", c.name, len(sh.Sides), len(c.d.Sides()))
		}
		flux := 0.0
		for k, side := range sh.Sides {
			if side.Name != c.d.Sides()[k] {
				t.Errorf("%s: side %d is %s, want %s", c.name, k, side.Name, c.d.Sides()[k])
			}
			for i, x := range legendreX { // one 16-point panel: exact for these boundaries' polynomial-times-trig integrands to rounding
				tt := (1 + x) / 2
				px, py, nx, ny := side.At(tt)
				flux += legendreW[i] / 2 * side.Length * (px*nx + py*ny) / 2
				if math.Abs(math.Hypot(nx, ny)-1) > 1e-14 {
					t.Errorf("%s %s: normal of length %g", c.name, side.Name, math.Hypot(nx, ny))
				}
				h := 1e-6 * side.Length
				in, _ := c.d.Contains(polar(px-h*nx, py-h*ny))
				out, _ := c.d.Contains(polar(px+h*nx, py+h*ny))
				if !in || out {
					t.Errorf("%s %s at t = %g: inward point inside %v, outward point inside %v", c.name, side.Name, tt, in, out)
				}
			}
		}
		if !math.IsInf(c.area, 1) && math.Abs(flux-c.area) > 1e-12*c.area {
			t.Errorf("%s: divergence-theorem area %.15g, want %.15g", c.name, flux, c.area)
		}
	}
}

func polar(x, y float64) (float64, float64, series.Env) {
	th := math.Atan2(y, x)
	if th < 0 {
		th += 2 * math.Pi
	}
	return math.Hypot(x, y), th, nil
}
