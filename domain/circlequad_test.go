package domain_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/domain"
	"psol/series"
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
		if trueErr > 1e-11 || !honest(est, trueErr, 1e-15) {
			t.Errorf("u(%g) = %.15f, want %.15f (error %.2g, estimate %.2g)", r, got, want, trueErr, est)
		}
	}
}

// The fallback forced on sources with a closed form agrees with the exact path.
func TestQuadratureAgainstExact(t *testing.T) {
	for _, c := range []struct {
		eq  string
		d   domain.Domain
		bcs []string
		// 0: 1e-12. Negative: |tol|, and the estimate may be 1000 times
		// the error, not 100: near the arc the bound on the modes beyond the
		// samples (ansatz.tailSum) is conservative.
		tol float64
	}{
		{"lap(u) = r^2*sin(5theta)", unitDisk, []string{"u = 0"}, 0},
		{"lap(u) = ln(r) + x^2*y", annulus(t, "1/2", "1"), []string{"inner: u = 0", "outer: dn(u) + 2u = cos(theta)"}, 0},
		{"lap(u) = x^2*y - exp(0)", domain.Disk{R: coef(t, "3/2")}, []string{"dn(u) + u = sin(theta)"}, 0},
		{"lap(u) = r^(-4) + cos(2theta)/r^5 + x*y/r^6", domain.Outside{R: coef(t, "1/2")}, []string{"dn(u) + 2u = cos(theta)"}, 0},
		{"lap(u) = (1 + x)/r^5", domain.Outside{R: coef(t, "1/2")}, []string{"u = sin(theta)"}, 0},
		{"lap(u) = x*y", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}, []string{"arc: dn(u) + 3u = cos(theta)", "start: u = 1", "end: u = 1"}, 0},
		{"lap(u) = y^2 + 1", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}, []string{"arc: u = sin(2theta)", "start: dn(u) = 0", "end: dn(u) = 0"}, 0},
		{"lap(u) = x*y^2", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi")}, []string{"arc: u = 0", "start: dn(u) = 0", "end: u = 0"}, 0},
		// Sources that do not vanish on a Dirichlet ray, where the quadrature
		// takes the ray values (and slopes on a Neumann ray) out first
		// (RayLift); beside a Neumann ray to a few 1e-12.
		{"lap(u) = 1 + x", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}, []string{"arc: dn(u) + 2u = 0", "start: u = 0", "end: u = 0"}, 0},
		{"lap(u) = x^2 + y", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "3*pi/4")}, []string{"arc: u = cos(theta)", "start: u = 0", "end: dn(u) = 0"}, -1e-11},
		{"lap(u) = 2 - y", domain.Sector{R: coef(t, "3/2"), Alpha: coef(t, "2*pi/3")}, []string{"arc: dn(u) = 1", "start: dn(u) = 0", "end: u = 1/2"}, 1e-11},
	} {
		exact := evaluator(t, solve(t, c.eq, c.d, c.bcs...), 1e-13)
		numeric := evaluator(t, solveWith(t, c.eq, c.d, domain.Options{NumericSource: true}, c.bcs...), 1e-13)
		for _, p := range [][2]float64{{0.6, 0.3}, {0.8, 1.1}, {0.95, 1.5}} {
			a, _, _ := exact.At(p[0], p[1])
			b, est, _ := numeric.At(p[0], p[1])
			tol, over := c.tol, 1.0
			switch {
			case tol == 0:
				tol = 1e-12
			case tol < 0:
				tol, over = -tol, 10
			}
			// The exact path is summed to 1e-13: that is the reference's own error.
			if math.Abs(a-b) > tol || !honest(est/over, math.Abs(a-b), 1e-13) {
				t.Errorf("%s at %v: exact %.14f, quadrature %.14f (estimate %.1g)", c.eq, p, a, b, est)
			}
		}
	}
}

// Δu = exp(−r²) outside the unit circle, u = 0 on it and bounded: the
// radial equation integrates to u(r) = [E₁(r²) − E₁(1)]/4 (E₁ as in
// Abramowitz & Stegun 5.1.1, its series 5.1.11 summed in e1).
func TestQuadratureOutside(t *testing.T) {
	sol := solve(t, "lap(u) = exp(-r^2)", domain.Outside{R: coef(t, "1")}, "u = 0")
	ev := evaluator(t, sol, 1e-13)
	for _, r := range []float64{1.2, 1.5, 2, 2.5} {
		want := (e1(r*r) - e1(1)) / 4
		got, est, _ := ev.At(r, 2)
		trueErr := math.Abs(got - want)
		if trueErr > 1e-12 || !honest(est, trueErr, 1e-15) {
			t.Errorf("u(%g) = %.15f, want %.15f (estimate %.2g)", r, got, want, est)
		}
	}
}

// A source that decays like r^−2 has no bounded particular solution outside a circle.
func TestQuadratureOutsideSlowDecay(t *testing.T) {
	_, err := trySolve("lap(u) = 1/(1 + r^2)", domain.Outside{R: coef(t, "1")}, []string{"u = 0"}, nil)
	if err == nil || !strings.Contains(err.Error(), "does not decay faster than r^-2") {
		t.Errorf("got %v, want the slow-decay refusal", err)
	}
}

// Sources with no closed form on a quarter disk, one per family of ray
// eigenfunctions, against closed forms of the single radial mode each one
// excites. For f = c(r)·Φ(θ) with Φ = sin(νθ) or cos(νθ) the mode solves
// U” + U'/r − ν²U/r² = c, and variation of parameters gives (any ODE text)
//
//	p(r) = −(1/2ν)[r^−ν ∫_0^r s^(1+ν) c ds + r^ν ∫_r^1 s^(1−ν) c ds],
//
// plus C r^ν fitted to the arc; the integrals are incomplete gamma functions
// of integer order, ∫_0^r s^(2k+1) e^(−s²) ds = (k!/2)(1 − e^(−r²) Σ_{j≤k} r^(2j)/j!)
// (Abramowitz & Stegun 6.5.13, from memory). Mode 0 (Neumann rays) is the
// disk's exp(−r²) case above.
func TestQuadratureSector(t *testing.T) {
	quarter := domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}
	em1 := math.Exp(-1)
	// f = xy e^(−r²) = (r²/2) e^(−r²) sin 2θ, u = 0 on rays and arc.
	dd := func(r float64) float64 {
		p := func(r float64) float64 {
			in := (1 - math.Exp(-r*r)*(1+r*r+r*r*r*r/2)) / 2
			out := (math.Exp(-r*r) - em1) / 4
			if r == 0 {
				return 0
			}
			return -(in/(r*r) + r*r*out) / 4
		}
		return p(r) - p(1)*r*r
	}
	// f = y e^(−r²) = r e^(−r²) sin θ, u = 0 at θ = 0, dn(u) = 0 at θ = π/2,
	// dn(u) + u = 0 on the arc: p'(1) = I(1)/2, and C r fits p'(1) + C + p(1) + C = 0.
	dn := func(r float64) float64 {
		I := func(r float64) float64 { return (1 - math.Exp(-r*r)*(1+r*r)) / 2 }
		p := func(r float64) float64 {
			if r == 0 {
				return 0
			}
			return -(I(r)/r + r*(math.Exp(-r*r)-em1)/2) / 2
		}
		C := -(I(1)/2 + p(1)) / 2
		return p(r) + C*r
	}
	for _, c := range []struct {
		eq    string
		bcs   []string
		want  func(r, theta float64) float64
		scale float64
	}{
		{"lap(u) = x*y*exp(-r^2)", []string{"arc: u = 0", "start: u = 0", "end: u = 0"},
			func(r, th float64) float64 { return dd(r) * math.Sin(2*th) }, 1},
		{"lap(u) = y*exp(-r^2)", []string{"arc: dn(u) + u = 0", "start: u = 0", "end: dn(u) = 0"},
			func(r, th float64) float64 { return dn(r) * math.Sin(th) }, 1},
		{"lap(u) = exp(-r^2)", []string{"arc: u = 0", "start: dn(u) = 0", "end: dn(u) = 0"},
			func(r, th float64) float64 { return (math.Log(r*r) + e1(r*r) - e1(1)) / 4 }, 1},
	} {
		ev := evaluator(t, solve(t, c.eq, quarter, c.bcs...), 1e-13)
		for _, p := range [][2]float64{{0.3, 0.4}, {0.7, 1.2}, {0.95, 0.1}} {
			want := c.want(p[0], p[1])
			got, est, _ := ev.At(p[0], p[1])
			trueErr := math.Abs(got - want)
			if trueErr > 1e-11 || !honest(est, trueErr, 1e-15) {
				t.Errorf("%s at %v: %.15f, want %.15f (error %.2g, estimate %.2g)", c.eq, p, got, want, trueErr, est)
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
		const phiPanels, rhoPanels = 64, 32
		for i := 0; i < phiPanels; i++ {
			for a, xa := range nodes {
				phi := 2 * math.Pi * (float64(i) + (xa+1)/2) / phiPanels
				ex, ey := math.Cos(phi), math.Sin(phi)
				b := x0*ex + y0*ey
				rmax := -b + math.Sqrt(b*b-x0*x0-y0*y0+1)
				// Uniform panels in ρ, the first graded geometrically
				// towards ρ = 0, where the kernel has its logarithm.
				edges := []float64{0}
				for j := 12; j > 0; j-- {
					edges = append(edges, rmax/rhoPanels*math.Pow(0.5, float64(j)))
				}
				for j := 1; j <= rhoPanels; j++ {
					edges = append(edges, rmax*float64(j)/rhoPanels)
				}
				for j := 0; j+1 < len(edges); j++ {
					lo, hi := edges[j], edges[j+1]
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
	// The reference's own accuracy (checked by doubling its panels): about 4e-15.
	const refErr = 1e-13
	points := [][2]float64{{-0.5, 0.2}, {0.1, 0.5}, {0.4, 0.05}}
	want := make([]float64, len(points))
	for i, p := range points {
		want[i] = green(p[0], p[1])
	}
	for _, tol := range []float64{1e-12, 1e-8, 1e-5} {
		sol := solveWith(t, "lap(u) = exp(-((x - 0.4)^2 + y^2)/0.02)", unitDisk, domain.Options{Tol: tol}, "u = 0")
		ev := evaluator(t, sol, 1e-13)
		for i, p := range points {
			got, est, _ := ev.At(math.Hypot(p[0], p[1]), math.Mod(math.Atan2(p[1], p[0])+2*math.Pi, 2*math.Pi))
			trueErr := math.Abs(got - want[i])
			if trueErr > math.Max(100*tol, 1e-12) {
				t.Errorf("tol %g: u(%v) = %.14f, images Green's function %.14f (estimate %.1g)", tol, p, got, want[i], est)
			}
			// Honest: not below the true error by more than a factor of 10
			// (where the reference can tell), nor above it by more than 100.
			if !honest(est, trueErr, refErr) {
				t.Errorf("tol %g: u(%v): error estimate %.2g, true error %.2g", tol, p, est, trueErr)
			}
		}
	}
}

// honest is the rule for an error estimate: not below the true error by
// more than a factor of 10, nor above it by more than 100, as far as the
// reference can tell (refErr: its own accuracy, rounding for closed forms).
func honest(est, trueErr, refErr float64) bool {
	return est >= (trueErr-refErr)/10 && est <= 100*math.Max(trueErr, refErr)
}

func legendre(n int) ([]float64, []float64) {
	x, w := make([]float64, n), make([]float64, n)
	quad.Legendre{}.FixedLocations(x, w, -1, 1)
	return x, w
}

// The report of a quadrature solution: ∬u dA for Δu = exp(−r²), u = 0 on the
// unit disk, against gonum's Gauss–Legendre on 2π r u(r) with u from E₁ as
// above, and the divergence theorem: the net flux equals ∬ f dA = π(1 − 1/e).
func TestQuadratureReport(t *testing.T) {
	rep, err := solve(t, "lap(u) = exp(-r^2)", unitDisk, "u = 0").Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	const gamma = 0.57721566490153286
	u := func(r float64) float64 {
		if r == 0 {
			return (-gamma - e1(1)) / 4
		}
		return (math.Log(r*r) + e1(r*r) - e1(1)) / 4
	}
	// r ln r is not smooth at 0: panels halving towards it.
	want := 0.0
	for i := 0; i < 40; i++ {
		lo, hi := math.Pow(0.5, float64(i+1)), math.Pow(0.5, float64(i))
		want += quad.Fixed(func(r float64) float64 { return 2 * math.Pi * r * u(r) }, lo, hi, 20, nil, 0)
	}
	source := math.Pi * (1 - math.Exp(-1))
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"area integral", rep.Integral, want},
		{"source integral", rep.Source, source},
		{"net flux", rep.Flux, source},
		{"min (at the centre)", rep.Min, u(0)},
	} {
		if math.Abs(c.got-c.want) > 1e-11 {
			t.Errorf("%s = %.14f, want %.14f", c.name, c.got, c.want)
		}
	}
}

// Green's second identity with w = (1 − r²)/4 (Δw = −1, w = 0 on the rim):
// for u = 0 on the unit disk, ∬u dA = −∬ w f dA. For the Gaussian
// f = exp(−|x − x0|²/s), whose mass outside the disk is below 1e-15 here,
// ∬f = πs and the mean of |x|² under it is |x0|² + s, so
// ∬u dA = −πs(1 − |x0|² − s)/4 (common practice: the identity and the
// Gaussian's moments).
func TestQuadratureGreenIdentity(t *testing.T) {
	const s = 0.01
	sol := solve(t, "lap(u) = exp(-((x - 0.4)^2 + y^2)/0.01)", unitDisk, "u = 0")
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	if want := -math.Pi * s * (1 - 0.16 - s) / 4; math.Abs(rep.Integral-want) > 1e-12 {
		t.Errorf("area integral %.15f, Green's identity %.15f", rep.Integral, want)
	}
}

// Grid carries the numeric particular part as At does (it once left it out).
func TestQuadratureGrid(t *testing.T) {
	for _, c := range []struct {
		eq  string
		d   domain.Domain
		bcs []string
	}{
		{"lap(u) = exp(-((x - 0.4)^2 + y^2)/0.02)", unitDisk, []string{"u = 0"}},
		{"lap(u) = -1/(1 + r^2)", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}, []string{"arc: dn(u) + 2u = 0", "start: u = 0", "end: u = 0"}},
	} {
		sol := solve(t, c.eq, c.d, c.bcs...)
		ev := evaluator(t, sol, 1e-12)
		rs, ths := []float64{0, 0.2, 0.45, 0.99}, []float64{0.1, 0.7, 1.3}
		u, _ := ev.Grid(rs, ths)
		for i, r := range rs {
			for j, th := range ths {
				if want, _, _ := ev.At(r, th); math.Abs(u[i][j]-want) > 1e-13 {
					t.Errorf("%s: Grid at (%g, %g) = %.15g, At = %.15g", c.eq, r, th, u[i][j], want)
				}
			}
		}
	}
}

// Piecewise arc data beside a numeric source on a sector: by linearity the
// sum of the two problems solved apart (the ray lift's arc trace once joined
// both the pieces and the plain data, and counted twice).
func TestQuadratureSectorPiecewiseArc(t *testing.T) {
	quarter := domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}
	rays := []string{"start: u = 0", "end: u = 0"}
	both := evaluator(t, solve(t, "lap(u) = -2/(1 + r^2)", quarter, append(rays, "arc: u = theta < pi/4 ? 1 : 0")...), 1e-13)
	data := evaluator(t, solve(t, "lap(u) = 0", quarter, append(rays, "arc: u = theta < pi/4 ? 1 : 0")...), 1e-13)
	source := evaluator(t, solve(t, "lap(u) = -2/(1 + r^2)", quarter, append(rays, "arc: u = 0")...), 1e-13)
	for _, p := range [][2]float64{{0.5, 0.5}, {0.8, 1.2}, {0.3, 0.1}} {
		a, _, _ := both.At(p[0], p[1])
		b, _, _ := data.At(p[0], p[1])
		c, _, _ := source.At(p[0], p[1])
		if math.Abs(a-b-c) > 1e-12 {
			t.Errorf("at %v: %.15f, the parts apart %.15f", p, a, b+c)
		}
	}
}

// Pure Neumann problems with a numeric source: data and the quadrature's
// traces (or source integral) agree only in decimals, which once made every
// such problem "incompatible". The data here are exactly compatible — the
// flux through the arc is ∬f dA (divergence theorem) — and the solutions,
// fixed up to a constant, agree with the exact path in differences.
func TestQuadraturePureNeumann(t *testing.T) {
	for _, c := range []struct {
		eq  string
		d   domain.Domain
		bcs []string
	}{
		// ∬(1 + y) over the quarter disk is π/4 + 1/3, over an arc of length π/2.
		{"lap(u) = 1 + y", domain.Sector{R: coef(t, "1"), Alpha: coef(t, "pi/2")}, []string{"arc: dn(u) = 1/2 + 2/(3*pi)", "start: dn(u) = 0", "end: dn(u) = 0"}},
		// ∬(x² + 1/3) over the unit disk is π/4 + π/3, over 2π.
		{"lap(u) = x^2 + 1/3", unitDisk, []string{"dn(u) = 7/24"}},
	} {
		exact := solve(t, c.eq, c.d, c.bcs...)
		numeric := solveWith(t, c.eq, c.d, domain.Options{NumericSource: true}, c.bcs...)
		compile := func(s *domain.Solution) *domain.Evaluator {
			ev, err := s.Compile(series.Env{s.Free: series.Coef{}}, 1e-13, 100000)
			if err != nil {
				t.Fatal(err)
			}
			return ev
		}
		e1, e2 := compile(exact), compile(numeric)
		a0, _, _ := e1.At(0.5, 0.5)
		b0, _, _ := e2.At(0.5, 0.5)
		for _, p := range [][2]float64{{0.2, 0.3}, {0.8, 1.2}, {0.95, 0.1}} {
			a, _, _ := e1.At(p[0], p[1])
			b, _, _ := e2.At(p[0], p[1])
			if math.Abs((a-a0)-(b-b0)) > 1e-11 {
				t.Errorf("%s at %v: exact %.14f, quadrature %.14f (differences from (0.5, 0.5))", c.eq, p, a-a0, b-b0)
			}
		}
	}
}

// The estimates where the errors are large: the quadrature's angular
// samples capped (a test hook, Options.QuadratureSamples). With 16 samples
// an off-centre Gaussian (which needs about 25 modes) would be wrong by
// percents: psol's own sampled check must refuse it rather than print it.
// With 32 the answer stands, and its estimate must not fall below the true
// error. The reference is the same problem uncapped at tolerance 1e-13.
// (The estimate is then far above the error, about 3000 times: the bound
// on the modes left out is conservative. Recorded, not asserted.)
func TestQuadratureEstimatesWhereErrorsAreLarge(t *testing.T) {
	const eq = "lap(u) = exp(-((x - 0.3)^2 + y^2)/0.05)"
	f, conds, err := pose(eq, unitDisk, []string{"u = 0"}, nil)
	if err != nil {
		t.Fatal(err)
	}
	var un *domain.Unsolvable
	if _, err := domain.SolveWith(unitDisk, f, conds, domain.Options{Tol: 1e-12, QuadratureSamples: 8}); !errors.As(err, &un) || !strings.Contains(err.Error(), "own check") {
		t.Errorf("8 samples: %v, want a refusal by psol's own check", err)
	}
	ref := solveWith(t, eq, unitDisk, domain.Options{Tol: 1e-13}, "u = 0")
	refEv, err := ref.Compile(nil, 1e-13, domain.PointTerms)
	if err != nil {
		t.Fatal(err)
	}
	sol := solveWith(t, eq, unitDisk, domain.Options{Tol: 1e-12, QuadratureSamples: 32}, "u = 0")
	ev, err := sol.Compile(nil, 1e-12, domain.PointTerms)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range [][2]float64{{0, 0}, {0.3, 0}, {0.5, 2}, {0.9, 0.1}} {
		got, est, _ := ev.At(p[0], p[1])
		want, _, _ := refEv.At(p[0], p[1])
		if trueErr := math.Abs(got - want); est < trueErr {
			t.Errorf("32 samples at (%g, %g): error %.2g above its estimate %.2g", p[0], p[1], trueErr, est)
		}
	}
}

// A kinked source, Δu = |y − 0.3| on the unit disk with u = 0: psol takes
// v = |y − 0.3|³/6 as the closed particular solution (ansatz.Kink) and the
// harmonic part from v's trace. Reference: v has Δv = |y − 0.3|
// (d²/ds² |s|³/6 = |s|; common practice), so u = v − P[v], with P[v] the
// Poisson integral of v's trace (the classic closed form for the disk), by
// Gauss–Legendre between the trace's kinks at sin φ = 0.3, where it is
// smooth, in the test. The trace's Fourier coefficients are exact
// (Kink.CircleTrace), so summed to rounding u meets the reference to
// 1e-13; summed to a tolerance, the estimate (the series' tail) is never
// below the error and within the tolerance.
func TestKinkedSourceClosedForm(t *testing.T) {
	v := func(x, y float64) float64 { s := math.Abs(y - 0.3); return s * s * s / 6 }
	k := math.Asin(0.3)
	cuts := []float64{k, math.Pi - k, 2*math.Pi + k}
	nodes, weights := legendre(40)
	want := func(r, theta float64) float64 {
		x, y := r*math.Cos(theta), r*math.Sin(theta)
		poisson := 0.0
		for i := 0; i+1 < len(cuts); i++ {
			for p := 0; p < 16; p++ { // 16 panels per arc between kinks
				lo := cuts[i] + (cuts[i+1]-cuts[i])*float64(p)/16
				hi := cuts[i] + (cuts[i+1]-cuts[i])*float64(p+1)/16
				for j, xj := range nodes {
					phi := (lo+hi)/2 + (hi-lo)/2*xj
					kernel := (1 - r*r) / (1 - 2*r*math.Cos(theta-phi) + r*r) / (2 * math.Pi)
					poisson += weights[j] * (hi - lo) / 2 * kernel * v(math.Cos(phi), math.Sin(phi))
				}
			}
		}
		return v(x, y) - poisson
	}
	sol := solveWith(t, "lap(u) = abs(y - 0.3)", unitDisk, domain.Options{Tol: 1e-10}, "u = 0")
	ev, exact := evaluator(t, sol, 1e-10), evaluator(t, sol, 1e-16)
	for _, p := range [][2]float64{{0.5, 0.2}, {0.8, 1.5}, {0.3, 4}} {
		got, est, _ := ev.At(p[0], p[1])
		full, _, _ := exact.At(p[0], p[1])
		ref := want(p[0], p[1])
		trueErr := math.Abs(got - ref)
		if math.Abs(full-ref) > 1e-13 || est < trueErr || est > 1e-10 {
			t.Errorf("u(r=%g, theta=%g) = %.14f (to rounding %.14f), Poisson integral %.14f: error %.2g, estimate %.2g", p[0], p[1], got, full, ref, trueErr, est)
		}
	}
	if sol.Numeric {
		t.Error("the kink's trace went by the FFT: its coefficients have a closed form")
	}
}

// The radial mesh's estimate where its error is large: a source sharp in r
// and constant in θ, Δu = exp(−(r − 0.5)²/0.0005) on the unit disk with
// u = 0, with one radial bisection allowed (Options.QuadratureBisections).
// Reference: u(r) = ∫₀¹ t f(t) ln max(r, t) dt (the radial Green's function,
// common practice: (r u')' = r f and u(1) = 0), by gonum's Gauss–Legendre on
// panels. The true error is asserted large, so the estimate is tested.
func TestQuadratureRadialEstimateWhereErrorsAreLarge(t *testing.T) {
	f := func(t float64) float64 { return math.Exp(-(t - 0.5) * (t - 0.5) / 0.0005) }
	nodes, weights := legendre(40)
	want := func(r float64) float64 {
		total := 0.0
		for _, span := range [][2]float64{{0, r}, {r, 1}} {
			for p := 0; p < 64; p++ {
				lo := span[0] + (span[1]-span[0])*float64(p)/64
				hi := span[0] + (span[1]-span[0])*float64(p+1)/64
				for j, x := range nodes {
					s := (lo+hi)/2 + (hi-lo)/2*x
					total += weights[j] * (hi - lo) / 2 * s * f(s) * math.Log(math.Max(r, s))
				}
			}
		}
		return total
	}
	sol := solveWith(t, "lap(u) = exp(-(r - 0.5)^2/0.0005)", unitDisk, domain.Options{Tol: 1e-12, QuadratureBisections: 1}, "u = 0")
	ev := evaluator(t, sol, 1e-12)
	// The estimate bounds the error at each r (not below it by more than 10×)
	// and is uniform in r, so its pessimism is measured against the largest
	// error: within 100× of it.
	largest, largestEst := 0.0, 0.0
	for _, r := range []float64{0.1, 0.3, 0.45, 0.5, 0.55, 0.7, 0.9} {
		got, est, _ := ev.At(r, 1)
		trueErr := math.Abs(got - want(r))
		largest, largestEst = math.Max(largest, trueErr), math.Max(largestEst, est)
		if est < trueErr/10 {
			t.Errorf("u(%g) = %.14f, Green's integral %.14f: error %.2g above its estimate %.2g", r, got, want(r), trueErr, est)
		}
	}
	if largest < 1e-10 {
		t.Errorf("largest true error %.2g: the hook no longer makes the radial error large", largest)
	}
	if largestEst > 100*largest {
		t.Errorf("largest estimate %.2g, over 100 times the largest true error %.2g", largestEst, largest)
	}
}

// A source concentrated between the quadrature's probe radii, a narrow
// Gaussian of width 0.01 at z₀ = 0.55: the scan for peaks finds it, and the
// sampled check measures against its peak, not against its size at the
// check's points (e^−2025 at the nearest). Reference: u(0) = ∬ f(ζ) G(0, ζ)
// dA with the disk's Green's function G(0, ζ) = ln|ζ|/2π (images; Jackson
// ch. 2), and since ln|ζ| is harmonic about z₀ and f is symmetric about it,
// the mean-value property gives u(0) = M ln|z₀|/2π with M = π·10⁻⁴ (the
// tail beyond the disk, below e^−2000, is nothing).
func TestQuadratureConcentratedSource(t *testing.T) {
	sol := solveWith(t, "lap(u) = exp(-((x - 0.55)^2 + y^2)/0.0001)", unitDisk, domain.Options{Tol: 1e-10}, "u = 0")
	ev := evaluator(t, sol, 1e-10)
	got, est, _ := ev.At(0, 0)
	want := 1e-4 / 2 * math.Log(0.55)
	if trueErr := math.Abs(got - want); trueErr > 1e-13 || !honest(est, trueErr, 1e-16) {
		t.Errorf("u(0) = %.15g, Green's function %.15g: error %.2g, estimate %.2g", got, want, trueErr, est)
	}
}

// A kink beside a smooth numeric source, Δu = −2|x − y|/3 + e^(−r²) on the
// unit disk with u = 0 on the rim: the kink's trace goes exactly, the
// Gaussian's by the quadrature (e^x, which this test had, now takes the
// waves' closed form). Reference by an independent path: v = −|x − y|³/18 +
// (1/4)Σ_{k≥1} (−1)^(k+1) r^(2k)/(k·k!) solves the equation (Δ|ℓ|³ =
// 6|ℓ||∇ℓ|² for linear ℓ, |∇ℓ|² = 2 for ℓ = x − y; the radial part from
// (1/r)(r v′)′ = e^(−r²), r v′ = (1 − e^(−r²))/2, term by term), and u = v − H
// with H harmonic, H = v
// on the rim, from the Poisson integral (Jackson §2.10) by the trapezoidal
// rule on 2^16 points (its error falls like N⁻⁴ for the kink's C² data).
func TestKinkBesideNumericSource(t *testing.T) {
	sol := solveWith(t, "lap(u) = -2*abs(x - y)/3 + exp(-x^2 - y^2)", unitDisk, domain.Options{Tol: 1e-12}, "u = 0")
	if sol.KinkTraces == nil {
		t.Fatal("the kink's trace did not go exactly")
	}
	ev := evaluator(t, sol, 1e-12)
	v := func(x, y float64) float64 {
		r2, radial, term := x*x+y*y, 0.0, 1.0
		for k := 1; k <= 40; k++ {
			term *= -r2 / float64(k) // (−r²)^k/k!
			radial -= term / float64(k) / 4
		}
		return -math.Pow(math.Abs(x-y), 3)/18 + radial
	}
	const N = 1 << 16
	for _, p := range [][2]float64{{0.2, 0.1}, {0, 0}, {-0.5, 0.6}, {0.8, -0.3}} {
		H := 0.0
		for i := 0; i < N; i++ {
			th := 2 * math.Pi * float64(i) / N
			cx, cy := math.Cos(th), math.Sin(th)
			d2 := (p[0]-cx)*(p[0]-cx) + (p[1]-cy)*(p[1]-cy)
			H += v(cx, cy) * (1 - p[0]*p[0] - p[1]*p[1]) / d2 / N
		}
		want := v(p[0], p[1]) - H
		got, est, _ := ev.AtXY(p[0], p[1])
		if err := math.Abs(got - want); err > 1e-11 || err > 10*est+1e-13 {
			t.Errorf("u(%g, %g) = %.14f, Poisson integral %.14f (estimate %.1g)", p[0], p[1], got, want, est)
		}
	}
}

// max of two linear forms is a kink: Δu = max(x, y) = (x + y)/2 + |x − y|/2
// is solved by v = (x³ + y³)/12 + |x − y|³/24 (Δ x³/12 = x/2, and
// Δ|ℓ|³ = 6|ℓ||∇ℓ|² with |∇ℓ|² = 2: worked by hand), which takes its own
// values on the rim as data; psol's answer inside is v, and exact.
func TestMaxOfLinearFormsManufactured(t *testing.T) {
	sol := solveWith(t, "lap(u) = max(x, y)", unitDisk, domain.Options{Tol: 1e-12}, "u = (x^3 + y^3)/12 + abs(x - y)^3/24")
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0, 0}, {0.5, 0.3}, {-0.2, -0.7}, {0.6, 0.6}} {
		x, y := p[0], p[1]
		want := (x*x*x+y*y*y)/12 + math.Pow(math.Abs(x-y), 3)/24
		got, est, _ := ev.AtXY(x, y)
		if err := math.Abs(got - want); err > 1e-11 || err > 10*est+1e-14 {
			t.Errorf("u(%g, %g) = %.14f, manufactured %.14f (estimate %.1g)", x, y, got, want, est)
		}
	}
}

// Kinks through the origin: abs of one term (abs(x), abs(2y)) and max or
// min with a constant (max(x, 0) = x/2 + |x|/2) are kinks as abs(x − 0.3)
// is. They were refused as sources in pieces: abs(r·cos θ) = r·|cos θ|
// expanded into pieces in θ, which serve boundary data but no source. Each
// v with Δv the source (Δ|ℓ|³/6 = |ℓ||∇ℓ|², Δx³/12 = x/2: worked by hand),
// and u = v − H with u = 0 on the rim, H harmonic with H = v there, from
// the Poisson integral (Jackson §2.10) by the trapezoidal rule on 2^16
// points (its error falls like N⁻⁴ for C² data).
func TestKinksThroughTheOrigin(t *testing.T) {
	for _, c := range []struct {
		source string
		v      func(x, y float64) float64
	}{
		{"abs(x)", func(x, y float64) float64 { return math.Pow(math.Abs(x), 3) / 6 }},
		{"abs(2*y)", func(x, y float64) float64 { return math.Pow(math.Abs(y), 3) / 3 }},
		{"max(x, 0)", func(x, y float64) float64 { return x*x*x/12 + math.Pow(math.Abs(x), 3)/12 }},
		{"min(0, -y)", func(x, y float64) float64 { return -y*y*y/12 - math.Pow(math.Abs(y), 3)/12 }},
	} {
		t.Run(c.source, func(t *testing.T) {
			sol := solveWith(t, "lap(u) = "+c.source, unitDisk, domain.Options{Tol: 1e-12}, "u = 0")
			if sol.KinkTraces == nil || sol.Numeric {
				t.Error("the kink's particular solution or its trace went numeric: both are closed")
			}
			ev := evaluator(t, sol, 1e-12)
			const N = 1 << 16
			for _, p := range [][2]float64{{0, 0}, {0.5, 0.3}, {-0.2, -0.7}, {0.6, 0.6}} {
				H := 0.0
				for i := 0; i < N; i++ {
					th := 2 * math.Pi * float64(i) / N
					cx, cy := math.Cos(th), math.Sin(th)
					d2 := (p[0]-cx)*(p[0]-cx) + (p[1]-cy)*(p[1]-cy)
					H += c.v(cx, cy) * (1 - p[0]*p[0] - p[1]*p[1]) / d2 / N
				}
				want := c.v(p[0], p[1]) - H
				got, est, _ := ev.AtXY(p[0], p[1])
				if err := math.Abs(got - want); err > 1e-11 || err > 10*est+1e-13 {
					t.Errorf("u(%g, %g) = %.14f, Poisson integral %.14f (estimate %.1g)", p[0], p[1], got, want, est)
				}
			}
		})
	}
}

// A manufactured solution with a kinked source: u = |y − 0.3|³/6 + x² − y²
// has Δu = |y − 0.3| (d²/ds² |s|³/6 = |s|; x² − y² harmonic), and takes its
// own values on the rim as data: psol's answer at points inside is u.
func TestKinkedSourceManufactured(t *testing.T) {
	sol := solveWith(t, "lap(u) = abs(y - 0.3)", unitDisk, domain.Options{Tol: 1e-12}, "u = abs(y - 0.3)^3/6 + x^2 - y^2")
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0, 0}, {0.5, 0.3}, {-0.2, -0.7}, {0.9, 0.1}} {
		want := math.Pow(math.Abs(p[1]-0.3), 3)/6 + p[0]*p[0] - p[1]*p[1]
		got, est, _ := ev.AtXY(p[0], p[1])
		if err := math.Abs(got - want); err > 1e-9 || err > 10*est+1e-14 {
			t.Errorf("u(%g, %g) = %.14f, manufactured %.14f (estimate %.1g)", p[0], p[1], got, want, est)
		}
	}
}

// A kinked source between two circles, Δu = |y − 0.3| on 1/4 < r < 1 with
// u = 0 on both: u = v − H, v = |y − 0.3|³/6, H harmonic with H = v on both
// circles. The reference builds H in the test by its own path: v sampled
// on each circle (4096 points, trapezoidal Fourier coefficients, which
// converge like the n⁻⁴ coefficients' tail), and per mode the 2×2 system
// in the scaled basis (r/R2)^n, (R1/r)^n (eigenfunction expansion, common
// practice). psol's path is the exact trace series.
func TestKinkedSourceAnnulus(t *testing.T) {
	const R1, R2, N, modes = 0.25, 1.0, 4096, 300
	v := func(x, y float64) float64 { s := math.Abs(y - 0.3); return s * s * s / 6 }
	coef := func(R float64) (a, b []float64) {
		a, b = make([]float64, modes+1), make([]float64, modes+1)
		for i := 0; i < N; i++ {
			th := 2 * math.Pi * float64(i) / N
			f := v(R*math.Cos(th), R*math.Sin(th))
			for n := 0; n <= modes; n++ {
				a[n] += f * math.Cos(float64(n)*th) * 2 / N
				b[n] += f * math.Sin(float64(n)*th) * 2 / N
			}
		}
		a[0] /= 2
		return a, b
	}
	ai, bi := coef(R1)
	ao, bo := coef(R2)
	H := func(r, th float64) float64 {
		// mode 0: c + d ln r through both circles' means.
		d := (ao[0] - ai[0]) / (math.Log(R2) - math.Log(R1))
		h := ai[0] + d*(math.Log(r)-math.Log(R1))
		for n := 1; n <= modes; n++ {
			fn := float64(n)
			rho := math.Pow(R1/R2, fn) // (r/R2)^n at R1, and (R1/r)^n at R2
			det := 1 - rho*rho
			for k, pair := range [][2]float64{{ai[n], ao[n]}, {bi[n], bo[n]}} {
				// α (r/R2)^n + β (R1/r)^n: at R1 α ρ + β = inner, at R2 α + β ρ = outer.
				alpha := (pair[1] - rho*pair[0]) / det
				beta := (pair[0] - rho*pair[1]) / det
				term := alpha*math.Pow(r/R2, fn) + beta*math.Pow(R1/r, fn)
				if k == 0 {
					h += term * math.Cos(fn*th)
				} else {
					h += term * math.Sin(fn*th)
				}
			}
		}
		return h
	}
	sol := solveWith(t, "lap(u) = abs(y - 0.3)", domain.Annulus{R1: series.FracCoef(1, 4), R2: series.IntCoef(1)}, domain.Options{Tol: 1e-12}, "inner: u = 0", "outer: u = 0")
	if sol.Numeric {
		t.Error("the kink's trace went by the FFT: its coefficients have a closed form")
	}
	ev := evaluator(t, sol, 1e-15)
	for _, p := range [][2]float64{{0.5, 0.2}, {0.8, 1.5}, {0.3, 4}, {0.95, 0.3}, {0.27, 2}} {
		x, y := p[0]*math.Cos(p[1]), p[0]*math.Sin(p[1])
		want := v(x, y) - H(p[0], p[1])
		got, _, _ := ev.At(p[0], p[1])
		if math.Abs(got-want) > 1e-11 {
			t.Errorf("u(r=%g, theta=%g) = %.14f, by the sampled trace's modes %.14f", p[0], p[1], got, want)
		}
	}
}

// A kinked source with numeric data between two circles (the trace's modes
// by FFT, as many as the two circles' powers keep representable; NaN
// before, when all of the kink's ~2000 modes went in) against two exact
// or separate paths by linearity: the kink with zero data (its exact trace)
// plus the data with no source. The estimate bounds the difference.
func TestKinkedSourceAnnulusNumericData(t *testing.T) {
	ann := domain.Annulus{R1: series.FracCoef(1, 4), R2: series.IntCoef(1)}
	opt := domain.Options{Tol: 1e-12}
	both := evaluator(t, solveWith(t, "lap(u) = abs(x + y/3 - 0.1)", ann, opt, "inner: dn(u) = 0", "outer: u = exp(x)"), 1e-14)
	kink := evaluator(t, solveWith(t, "lap(u) = abs(x + y/3 - 0.1)", ann, opt, "inner: dn(u) = 0", "outer: u = 0"), 1e-14)
	data := evaluator(t, solveWith(t, "lap(u) = 0", ann, opt, "inner: dn(u) = 0", "outer: u = exp(x)"), 1e-14)
	for _, p := range [][2]float64{{0.1, 0.5}, {0.99, 0}, {0, -0.995}, {0.26, 0}, {-0.5, 0.2}} {
		got, est, _ := both.AtXY(p[0], p[1])
		a, _, _ := kink.AtXY(p[0], p[1])
		b, _, _ := data.AtXY(p[0], p[1])
		if err := math.Abs(got - (a + b)); math.IsNaN(got) || err > est || err > 1e-9 {
			t.Errorf("u(%g, %g) = %.14f, the parts' sum %.14f (estimate %.2g)", p[0], p[1], got, a+b, est)
		}
	}
}

// A source is sampled in Cartesian coordinates on full circles only when
// its Cartesian form agrees with its polar one at every angle: its terms
// single-valued (cos 3θ, r², but not θ itself), its nodes operations.
func TestSingleValuedSources(t *testing.T) {
	mustApply := func(fn string, f series.Field) series.Field {
		g, err := series.Apply(fn, f)
		if err != nil {
			t.Fatal(err)
		}
		return g
	}
	r2 := series.ExactField(series.R.Mul(series.R))
	for _, c := range []struct {
		name string
		f    series.Field
		want bool
	}{
		{"exp(-r^2)", mustApply("exp", r2.Scale(series.IntCoef(-1))), true},
		{"exp(cos(3theta)) + r", mustApply("exp", series.ExactField(series.Trig(3, false))).Add(series.ExactField(series.R)), true},
		{"exp(theta)", mustApply("exp", series.ExactField(series.Theta)), false},
		{"sqrt(1 + theta^2)", mustApply("sqrt", series.ExactField(series.Const(series.IntCoef(1)).Add(series.Theta.Mul(series.Theta)))), false},
	} {
		if c.f.Rest == nil {
			t.Fatalf("%s: no remainder to sample", c.name)
		}
		if got := c.f.Rest.SingleValued(); got != c.want {
			t.Errorf("%s: single-valued %v, want %v", c.name, got, c.want)
		}
	}
}
