package main

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"psol/parse"
)

// TestParticularKinks: psol particular gives the kinks' closed form
// c·abs(ℓ)³/(6|∇ℓ|²) (it said no rule, and named quadrature, for a source
// psol solve takes in closed form). Independent check: the printed u_p read
// back, its Laplacian by the five-point difference with one Richardson step
// (h and h/2, error O(h⁴); common practice) against the source, at points
// on both sides of each kink line and off it.
func TestParticularKinks(t *testing.T) {
	for _, source := range []string{"abs(x - 0.5)", "x^2 + 3*abs(y)", "max(x, 2y - 1)", "min(x, 0)", "abs(x)*2/5 + exp(x)"} {
		var out, errb bytes.Buffer
		if code := run([]string{"particular", source}, &out, &errb); code != 0 {
			t.Errorf("%s: exit %d: %s", source, code, errb.String())
			continue
		}
		line := strings.SplitN(out.String(), "\n", 2)[0]
		up := strings.TrimSpace(strings.TrimPrefix(strings.TrimPrefix(line, "particular"), "   "))
		up = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(up), "u_p ="))
		uf, err := parse.Expression("u_p", up, nil)
		if err != nil {
			t.Fatalf("%s: u_p %q does not read back: %v", source, up, err)
		}
		ff, err := parse.Expression("f", source, nil)
		if err != nil {
			t.Fatal(err)
		}
		u, err := uf.Compile(nil)
		if err != nil {
			t.Fatal(err)
		}
		f, err := ff.Compile(nil)
		if err != nil {
			t.Fatal(err)
		}
		at := func(c interface{ At(r, th float64) float64 }, x, y float64) float64 {
			return c.At(math.Hypot(x, y), math.Atan2(y, x))
		}
		lap := func(x, y, h float64) float64 {
			return (at(u, x+h, y) + at(u, x-h, y) + at(u, x, y+h) + at(u, x, y-h) - 4*at(u, x, y)) / (h * h)
		}
		for _, p := range [][2]float64{{0.3, 0.2}, {0.7, -0.4}, {-0.6, 0.55}, {1.3, 0.9}} {
			const h = 1e-2
			got := (4*lap(p[0], p[1], h/2) - lap(p[0], p[1], h)) / 3
			if want := at(f, p[0], p[1]); math.Abs(got-want) > 1e-6*(1+math.Abs(want)) {
				t.Errorf("%s: lap(u_p) at (%g, %g) = %.10f by differences, source %.10f (u_p = %s)", source, p[0], p[1], got, want, up)
			}
		}
	}
}
