package parse

import (
	"math"
	"testing"

	"psol/series/cart"
)

// A source compiled for Cartesian points gives the formula's values (the
// reference: the formula as typed, in Go) to rounding, relative to each
// value. For a narrow bump, whose expanded terms cancel, that is about half
// the polar form's error; on a rectangle the sine quadrature's refinement
// took 20 panels for the polar samples of such a bump and 8 for these.
func TestCompileXY(t *testing.T) {
	for _, c := range []struct {
		text   string
		direct func(x, y float64) float64
		tol    float64
	}{
		{"exp(-((x-0.6)^2 + (y-0.3)^2)/0.02)", func(x, y float64) float64 {
			return math.Exp(-((x-0.6)*(x-0.6) + (y-0.3)*(y-0.3)) / 0.02)
		}, 1e-14},
		{"x^3*y - 2*x*y^2 + 7", func(x, y float64) float64 { return x*x*x*y - 2*x*y*y + 7 }, 1e-15},
		// Leaves that are not polynomials go through r and θ.
		{"sqrt(x^2 + y^2)*cos(theta) + 1/(1 + x + y)", func(x, y float64) float64 {
			return math.Sqrt(x*x+y*y)*math.Cos(math.Atan2(y, x)) + 1/(1+x+y)
		}, 1e-14},
		{"theta^2*x + y", func(x, y float64) float64 { th := math.Atan2(y, x); return th*th*x + y }, 1e-15},
	} {
		f, err := Expression("source", c.text, nil)
		if err != nil {
			t.Fatal(err)
		}
		xy, err := f.CompileXY(nil, cart.PolyLeaf(nil))
		if err != nil {
			t.Fatal(err)
		}
		polar, err := f.Compile(nil)
		if err != nil {
			t.Fatal(err)
		}
		worstXY, worstPolar := 0.0, 0.0
		for i := 0; i <= 40; i++ {
			for j := 0; j <= 20; j++ {
				x, y := 0.2+0.02*float64(i), 0.1+0.02*float64(j)
				want := c.direct(x, y)
				scale := math.Abs(want) // relative: the bump's tails are small values
				worstXY = math.Max(worstXY, math.Abs(xy.At(x, y)-want)/scale)
				worstPolar = math.Max(worstPolar, math.Abs(polar.At(math.Hypot(x, y), math.Atan2(y, x))-want)/scale)
			}
		}
		if worstXY > c.tol {
			t.Errorf("%s: CompileXY is off by %.2g (polar: %.2g)", c.text, worstXY, worstPolar)
		}
		t.Logf("%s: largest difference from the formula %.2g in x and y, %.2g through r and θ", c.text, worstXY, worstPolar)
	}
}
