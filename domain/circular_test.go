package domain_test

import (
	"math"
	"math/rand"
	"psol/domain"
	"strings"
	"testing"
)

// Pure Neumann problems: ∮ g ds = ∬ f dA decides solvability (the divergence theorem).
func TestNeumannSolvability(t *testing.T) {
	sol := solve(t, "lap(u) = 1", domain.Disk{R: coef(t, "1")}, "dn(u) = 1/2 + cos(theta)")
	assertChecks(t, sol)
	if sol.Free == "" || !sol.FreeMean.Equal(coef(t, "-1/4")) {
		t.Errorf("free constant %q with mean-zero value %s, want C and -1/4", sol.Free, sol.FreeMean.Text())
	}
	_, err := trySolve("lap(u) = 1", domain.Disk{R: coef(t, "1")}, []string{"dn(u) = 1"}, nil)
	if err == nil || !strings.Contains(err.Error(), "2*pi") || !strings.Contains(err.Error(), "source integral is pi") {
		t.Errorf("incompatible data: %v", err)
	}
	sol = solve(t, "lap(u) = 1", annulus(t, "1", "2"), "inner: dn(u) = -1/2", "outer: dn(u) = 1")
	assertChecks(t, sol)
	if sol.Free == "" {
		t.Error("annulus with Neumann data on both circles: no free constant")
	}
	_, err = trySolve("lap(u) = 1", annulus(t, "1", "2"), []string{"inner: dn(u) = 0", "outer: dn(u) = 0"}, nil)
	if err == nil || !strings.Contains(err.Error(), "incompatible") {
		t.Errorf("incompatible annulus data: %v", err)
	}
}

func TestRobinSingularMode(t *testing.T) {
	_, err := trySolve("lap(u) = 0", domain.Disk{R: coef(t, "1")}, []string{"dn(u) - 2*u = sin(2theta)"}, nil)
	if err == nil || !strings.Contains(err.Error(), "singular for mode sin(2*theta)") {
		t.Errorf("singular Robin mode: %v", err)
	}
	// The same condition is fine where the data has no component in that mode.
	solve(t, "lap(u) = 0", domain.Disk{R: coef(t, "1")}, "dn(u) - 2*u = cos(theta)")
}

// An independent numeric path: finite differences with one Richardson step
// on the parsed-back printed solution, for an annulus, an outside and a Robin case.
func TestPolarFiniteDifference(t *testing.T) {
	cases := []struct {
		equation string
		d        domain.Domain
		bcs      []string
		rmin     float64
		rmax     float64
	}{
		{"lap(u) = x*y - ln(r)", annulus(t, "1/2", "2"), []string{"inner: dn(u) + 3u = cos(theta)", "outer: u = x"}, 0.5, 2},
		{"lap(u) = r^(-4)*cos(2theta) + r^(-3)", domain.Outside{R: coef(t, "1")}, []string{"u = sin(theta)"}, 1, 4},
		{"lap(u) = 2 - x^2", domain.Disk{R: coef(t, "3/2")}, []string{"dn(u) + 2u = y"}, 0, 1.5},
	}
	rng := rand.New(rand.NewSource(7))
	for _, c := range cases {
		sol := solve(t, c.equation, c.d, c.bcs...)
		assertChecks(t, sol)
		u := mustCompile(t, expr(t, sol.U.Text()))
		f := mustCompile(t, expr(t, mustSource(t, c.equation)))
		cart := func(x, y float64) float64 { return u.At(math.Hypot(x, y), math.Atan2(y, x)) }
		for i := 0; i < 20; i++ {
			r := c.rmin + (c.rmax-c.rmin)*(0.1+0.8*rng.Float64())
			th := 2 * math.Pi * rng.Float64()
			x, y := r*math.Cos(th), r*math.Sin(th)
			lap := func(h float64) float64 {
				return (cart(x+h, y) + cart(x-h, y) + cart(x, y+h) + cart(x, y-h) - 4*cart(x, y)) / (h * h)
			}
			h := 5e-3
			fd := (4*lap(h/2) - lap(h)) / 3
			if want := f.At(r, th); math.Abs(fd-want) > 1e-6*math.Max(1, math.Abs(want)) {
				t.Errorf("%s at (%.3f, %.3f): FD Laplacian %.10g, f = %.10g", c.equation, r, th, fd, want)
			}
		}
	}
	// The Robin condition dn(u) + 2u = y on r = 3/2, by a central difference in r.
	sol := solve(t, "lap(u) = 2 - x^2", domain.Disk{R: coef(t, "3/2")}, "dn(u) + 2u = y")
	u := mustCompile(t, expr(t, sol.U.Text()))
	for _, th := range []float64{0.3, 1.9, 4.4} {
		const R, h = 1.5, 1e-4
		dn := (u.At(R+h, th) - u.At(R-h, th)) / (2 * h)
		if got, want := dn+2*u.At(R, th), R*math.Sin(th); math.Abs(got-want) > 1e-7 {
			t.Errorf("Robin residual at θ = %.1f: %g vs %g", th, got, want)
		}
	}
}
