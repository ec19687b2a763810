package domain_test

import (
	"math"
	"testing"

	"psol/domain"
	"psol/series"
)

// Δu = eˣ on the unit disk with u = 0: the waves give u_p = eˣ, w takes the
// data −e^(cos θ) by FFT. Figures by hand: the outward flux is ∬eˣ =
// 2π·I₁(1) (besselI, Abramowitz & Stegun 9.6.10); by Green with w = (r² − 1)/4 (w = 0 on the rim, Δw = 1),
// ∬u = ∬w·eˣ = (π/2)∫₀¹(r² − 1)·r·I₀(r) dr, the series of I₀ term by term.
// Near the rim u is 0 (the rim's Poisson integral gives w alone, and the
// waves are added after it; before them in the sum, they were dropped).
func TestCircleWavesOnTheDisk(t *testing.T) {
	sol := solveWith(t, "lap(u) = exp(x)", unitDisk, domain.Options{}, "u = 0")
	if sol.Waves == nil || sol.Quadrature != nil {
		t.Fatalf("the disk took waves %v, quadrature %v", sol.Waves != nil, sol.Quadrature != nil)
	}
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	area := 0.0
	for k, f := 0, 1.0; k < 30; k++ {
		area += (1/float64(2*k+4) - 1/float64(2*k+2)) / (math.Pow(4, float64(k)) * f * f)
		f *= float64(k + 1)
	}
	area *= math.Pi / 2
	if want := 2 * math.Pi * besselI(1); math.Abs(rep.Flux-want) > 1e-12 || math.Abs(rep.Source-want) > 1e-12 {
		t.Errorf("flux %.15g, source integral %.15g, want 2π·I₁(1) = %.15g", rep.Flux, rep.Source, want)
	}
	if math.Abs(rep.Integral-area) > 1e-12 {
		t.Errorf("area integral %.15g, by Green %.15g", rep.Integral, area)
	}
	ev := evaluator(t, sol, 1e-13)
	for _, th := range []float64{0, 1, 3} {
		if u, _, _ := ev.At(0.99999, th); math.Abs(u) > 1e-4 {
			t.Errorf("u(0.99999, %g) = %g beside the rim where u = 0", th, u)
		}
		u, _ := ev.Grid([]float64{0, 0.5, 0.99999}, []float64{th})
		for i, r := range []float64{0, 0.5, 0.99999} {
			if want, _, _ := ev.At(r, th); math.Abs(u[i][0]-want) > 1e-13 {
				t.Errorf("Grid at r = %g: %.15g, At %.15g", r, u[i][0], want)
			}
		}
	}
}

// The waves against the quadrature road (NumericSource) on an annulus with
// an insulated and a convective circle, and on a disk with a point source
// beside them: values, extremes and every figure agree.
func TestCircleWavesAgainstQuadrature(t *testing.T) {
	annulus := domain.Annulus{R1: decimalCoef(0.5), R2: series.IntCoef(1)}
	for _, c := range []struct {
		name, equation string
		d              domain.Domain
		bcs            []string
	}{
		{"annulus", "lap(u) = sin(y)*exp(x) + 1", annulus, []string{"inner: dn(u) = 0", "outer: dn(u) + 2u = 1"}},
		{"disk with a point source", "lap(u) = cos(2*x) + delta(x - 0.3, y - 0.1)", unitDisk, []string{"dn(u) + u = 0"}},
		{"disk, a polynomial left over", "lap(u) = cos(x)^2", unitDisk, []string{"u = x"}},
	} {
		closed, numeric, rc, rn := bothRoads(t, c.name, c.equation, c.d, false, c.bcs)
		near := func(what string, a, b float64) {
			if math.Abs(a-b) > 1e-9*math.Max(1, math.Abs(b)) {
				t.Errorf("%s: %s %.15g by the waves, %.15g by the quadrature", c.name, what, a, b)
			}
		}
		near("area integral", rc.Integral, rn.Integral)
		near("source integral", rc.Source, rn.Source)
		near("net flux", rc.Flux, rn.Flux)
		for k := range rc.Sides {
			near("flux through "+rc.Sides[k].Side, rc.Sides[k].Value, rn.Sides[k].Value)
		}
		if !math.IsInf(rn.Min, 0) {
			near("min u", rc.Min, rn.Min)
		}
		if !math.IsInf(rn.Max, 0) {
			near("max u", rc.Max, rn.Max)
		}
		ec, en := evaluator(t, closed, 1e-13), evaluator(t, numeric, 1e-13)
		for _, p := range [][2]float64{{0.7, 0.3}, {0.6, 2}, {0.95, 4}} {
			a, _, _ := ec.At(p[0], p[1])
			b, _, _ := en.At(p[0], p[1])
			near("u at a point", a, b)
		}
	}
}

// A kink beside the waves keeps the quadrature's road, where its trace is
// exact: the circles' sampled data took it by thousands of FFT modes (1.1 s,
// and 18 s with --report, for 0.05 and 0.3 s). TestKinkBesideNumericSource
// checks that road against the Poisson integral.
func TestCircleWavesLeaveKinksExact(t *testing.T) {
	sol := solveWith(t, "lap(u) = -2*abs(x - y)/3 + exp(x)", unitDisk, domain.Options{}, "u = 0")
	if sol.Waves != nil || sol.KinkTraces == nil {
		t.Errorf("waves %v, the kink's trace exact %v", sol.Waves != nil, sol.KinkTraces != nil)
	}
}
