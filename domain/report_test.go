package domain_test

import (
	"math"
	"psol/domain"
	"psol/series"
	"testing"
)

// Report figures: Hagen–Poiseuille flow rate Q = πGa⁴/(8μ) (Bird, Stewart &
// Lightfoot, Transport Phenomena, §2.3) exactly, and the divergence theorem
// ∮ ∂u/∂n ds = ∬ f dA on every kind of region.
func TestReport(t *testing.T) {
	sol := solve(t, "mu*lap(u) = -G", domain.Disk{R: coef(t, "a")}, "u = 0")
	env := series.Env{"G": series.IntCoef(3), "mu": series.FracCoef(1, 2), "a": series.FracCoef(1, 5)}
	rep, err := sol.Report(env, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	if want := math.Pi * 3 * math.Pow(0.2, 4) / (8 * 0.5); rep.IntegralExact == nil || math.Abs(rep.Integral-want) > 1e-15 {
		t.Errorf("Q = %v, want %v", rep.Integral, want)
	}
	if want := 3 * 0.04 / (4 * 0.5); math.Abs(rep.Max-want) > 1e-12 || rep.ArgMax[0] > 1e-9 {
		t.Errorf("max %v at %v, want %v at the axis", rep.Max, rep.ArgMax, want)
	}
	cases := []struct {
		eq  string
		d   domain.Domain
		bcs []string
		tol float64
	}{
		{"lap(u) = 1 + x*y", unitDisk, []string{"dn(u) + 2u = cos(theta)"}, 1e-14},
		{"lap(u) = 2 - ln(r)", annulus(t, "1/2", "2"), []string{"inner: u = 1", "outer: dn(u) = sin(theta)"}, 1e-13},
		{"lap(u) = r^(-4)", domain.Outside{R: coef(t, "1")}, []string{"u = 1 + cos(theta)"}, 1e-13},
		{"lap(u) = -2", sector(t, "1", "pi/2"), []string{"arc: u = 0", "start: u = 0", "end: u = 0"}, 1e-6},
		{"lap(u) = 1", unitDisk, []string{"u = 0 < theta < pi ? 1 : 0"}, 1e-14},
	}
	for _, c := range cases {
		rep, err := solve(t, c.eq, c.d, c.bcs...).Report(nil, 1e-12)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(rep.Flux-rep.Source) > c.tol*math.Max(1, math.Abs(rep.Source)) {
			t.Errorf("%s on %s: flux %.15g, source integral %.15g", c.eq, c.d.Describe(), rep.Flux, rep.Source)
		}
	}
}
