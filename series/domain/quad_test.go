package domain_test

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/series/domain"
)

// e1 is the exponential integral E₁(x) = −γ − ln x − Σ_{k≥1} (−x)^k/(k·k!)
// (Abramowitz & Stegun 5.1.11), summed to rounding: an independent path.
func e1(x float64) float64 {
	const gamma = 0.57721566490153286
	sum, term := 0.0, 1.0
	for k := 1; k < 60; k++ {
		term *= -x / float64(k)
		sum += term / float64(k)
	}
	return -gamma - math.Log(x) - sum
}

// Δu = exp(−r²) on the unit disk, u = 0 on the rim: u(r) = [ln r² + E₁(r²) − E₁(1)]/4
// (integrating the radial equation; E₁ as in Abramowitz & Stegun 5.1.1), with
// u(0) = [−γ − E₁(1)]/4. The reported error estimate must be honest: not
// below the true error by more than a factor of 10.
func TestQuadratureGaussianSource(t *testing.T) {
	sol := solve(t, "lap(u) = exp(-r^2)", unitDisk, "u = 0")
	ev := evaluator(t, sol, 1e-13)
	const gamma = 0.57721566490153286
	for _, r := range []float64{0, 0.5, 0.9} {
		want := (-gamma - e1(1)) / 4
		if r > 0 {
			want = (math.Log(r*r) + e1(r*r) - e1(1)) / 4
		}
		got, est, _ := ev.At(r, 0.7)
		trueErr := math.Abs(got - want)
		if trueErr > 1e-11 {
			t.Errorf("u(%g) = %.15f, want %.15f", r, got, want)
		}
		if est < trueErr/10 {
			t.Errorf("u(%g): error estimate %.2g below the true error %.2g", r, est, trueErr)
		}
		// Not above it by more than a factor of 100 either (with rounding, 1e-15, as the floor).
		if est > 100*math.Max(trueErr, 1e-15) {
			t.Errorf("u(%g): error estimate %.2g, true error %.2g", r, est, trueErr)
		}
	}
}

// The fallback forced on sources with a closed form agrees with the exact path.
func TestQuadratureAgainstExact(t *testing.T) {
	for _, c := range []struct {
		eq  string
		d   domain.Domain
		bcs []string
	}{
		{"lap(u) = r^2*sin(5theta)", unitDisk, []string{"u = 0"}},
		{"lap(u) = ln(r) + x^2*y", annulus(t, "1/2", "1"), []string{"inner: u = 0", "outer: dn(u) + 2u = cos(theta)"}},
		{"lap(u) = x^2*y - exp(0)", domain.Disk{R: coef(t, "3/2")}, []string{"dn(u) + u = sin(theta)"}},
	} {
		exact := evaluator(t, solve(t, c.eq, c.d, c.bcs...), 1e-13)
		numeric := evaluator(t, solveWith(t, c.eq, c.d, domain.Options{NumericSource: true}, c.bcs...), 1e-13)
		for _, p := range [][2]float64{{0.6, 0.3}, {0.8, 2.9}, {0.95, 5}} {
			a, _, _ := exact.At(p[0], p[1])
			b, est, _ := numeric.At(p[0], p[1])
			if math.Abs(a-b) > 1e-10 {
				t.Errorf("%s at %v: exact %.14f, quadrature %.14f (estimate %.1g)", c.eq, p, a, b, est)
			}
		}
	}
}

// An off-centre Gaussian source on the unit disk, u = 0 on the rim, against
// the Dirichlet Green's function of the disk by the method of images,
// G(x, ξ) = (1/2π)[ln|x − ξ| − ln(|ξ|·|x − ξ/|ξ|²|)] (any text on Green's
// functions, e.g. Strauss, Partial Differential Equations, ch. 7), integrated
// here by Gauss–Legendre in polar coordinates about x (an independent path).
func TestQuadratureOffCentreGaussian(t *testing.T) {
	f := func(x, y float64) float64 { return math.Exp(-((x-0.4)*(x-0.4) + y*y) / 0.02) }
	green := func(x0, y0 float64) float64 {
		nodes, weights := legendre(24)
		total := 0.0
		const phiPanels, rhoPanels = 48, 24
		for i := 0; i < phiPanels; i++ {
			for a, xa := range nodes {
				phi := 2 * math.Pi * (float64(i) + (xa+1)/2) / phiPanels
				ex, ey := math.Cos(phi), math.Sin(phi)
				b := x0*ex + y0*ey
				rmax := -b + math.Sqrt(b*b-x0*x0-y0*y0+1)
				for j := 0; j < rhoPanels; j++ {
					lo, hi := rmax*float64(j)/rhoPanels, rmax*float64(j+1)/rhoPanels
					for c, xc := range nodes {
						rho := (lo+hi)/2 + (hi-lo)/2*xc
						xi, eta := x0+rho*ex, y0+rho*ey
						n2 := xi*xi + eta*eta
						img := math.Hypot(math.Sqrt(n2)*x0-xi/math.Sqrt(n2), math.Sqrt(n2)*y0-eta/math.Sqrt(n2))
						g := (math.Log(rho) - math.Log(img)) / (2 * math.Pi)
						total += weights[a] * math.Pi / phiPanels * weights[c] * (hi - lo) / 2 * g * f(xi, eta) * rho
					}
				}
			}
		}
		return total
	}
	sol := solve(t, "lap(u) = exp(-((x - 0.4)^2 + y^2)/0.02)", unitDisk, "u = 0")
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{-0.5, 0.2}, {0.1, 0.5}, {0.4, 0.05}} {
		want := green(p[0], p[1])
		got, est, _ := ev.At(math.Hypot(p[0], p[1]), math.Mod(math.Atan2(p[1], p[0])+2*math.Pi, 2*math.Pi))
		if math.Abs(got-want) > 1e-7 {
			t.Errorf("u(%v) = %.12f, images Green's function %.12f (estimate %.1g)", p, got, want, est)
		}
	}
}

func legendre(n int) ([]float64, []float64) {
	x, w := make([]float64, n), make([]float64, n)
	quad.Legendre{}.FixedLocations(x, w, -1, 1)
	return x, w
}
