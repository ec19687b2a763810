package domain_test

import (
	"errors"
	"math"
	"math/big"
	"math/cmplx"
	"strings"
	"testing"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

// solvePointProblem poses and solves with parameter values, the way the CLI does.
func solvePointProblem(t *testing.T, equation string, d domain.Domain, env series.Env, bcs ...string) *domain.Solution {
	t.Helper()
	f, conds, err := pose(equation, d, bcs, env)
	if err != nil {
		t.Fatalf("%s: %v", equation, err)
	}
	sol, err := domain.SolveWith(d, f, conds, domain.Options{Env: env})
	if err != nil {
		t.Fatalf("%s on %s: %v", equation, d.Describe(), err)
	}
	if sol.Independent == nil || sol.Independent.Failed() {
		t.Fatalf("%s on %s: the independent check fails or is missing: %+v", equation, d.Describe(), sol.Independent)
	}
	for _, c := range sol.Checks {
		if c.Failed() {
			t.Fatalf("%s: check failed: %s", equation, c.Name)
		}
	}
	return sol
}

// diskGreen is the Dirichlet Green's function of the disk |z| < R for
// Δu = δ(z − a): (1/2π)·ln( R|z − a| / |R² − āz| ) (images: Jackson,
// Classical Electrodynamics, ch. 2; Griffiths ch. 3), written here in
// complex arithmetic, independently of psol's image logs.
func diskGreen(z, a complex128, R float64) float64 {
	return math.Log(R*cmplx.Abs(z-a)/cmplx.Abs(complex(R*R, 0)-cmplx.Conj(a)*z)) / (2 * math.Pi)
}

func TestPointSourcesAgainstClosedForms(t *testing.T) {
	// Groundwater in the trade's form: T·Δh = Q·δ for a well pumping Q
	// (drawdown s = H − h). Numbers are our own scenarios.
	thiem := series.Env{"Q": series.FracCoef(3, 100), "T": series.FracCoef(1, 200), "H": series.IntCoef(30)}
	cases := []struct {
		name, equation string
		d              domain.Domain
		bcs            []string
		env            series.Env
		want           func(x, y float64) float64
		tol            float64
		source         string
	}{
		{
			name: "well at the centre of a round island", equation: "T*lap(u) = Q*delta(x, y)",
			d: domain.Disk{R: series.IntCoef(400)}, bcs: []string{"u = H"}, env: thiem,
			// s(r) = (Q/2πT)·ln(R/r)
			want: func(x, y float64) float64 { return 30 - 0.03/(2*math.Pi*0.005)*math.Log(400/math.Hypot(x, y)) },
			tol:  1e-12, source: "Thiem 1906; Bear, Hydraulics of Groundwater",
		},
		{
			name: "well off centre in a round island", equation: "T*lap(u) = Q*delta(x - 150, y + 80)",
			d: domain.Disk{R: series.IntCoef(400)}, bcs: []string{"u = H"}, env: thiem,
			want: func(x, y float64) float64 {
				return 30 + 0.03/0.005*diskGreen(complex(x, y), complex(150, -80), 400)
			},
			tol: 1e-12, source: "image well (Bear; Jackson ch. 2)",
		},
		{
			name: "line charge in a grounded cylinder", equation: "-eps*lap(u) = lam*delta(x + 0.004, y - 0.003)",
			d: domain.Disk{R: series.FracCoef(1, 100)}, bcs: []string{"u = 0"},
			env: series.Env{"eps": series.FracCoef(885, 100), "lam": series.IntCoef(2)},
			// φ = (λ/2πε)·ln( ρ₀|z − a*| / (R|z − a|) ), a* = R²a/ρ₀²
			want: func(x, y float64) float64 {
				a := complex(-0.004, 0.003)
				star := a * complex(1e-4/(cmplx.Abs(a)*cmplx.Abs(a)), 0)
				z := complex(x, y)
				return 2 / (2 * math.Pi * 8.85) * math.Log(cmplx.Abs(a)*cmplx.Abs(z-star)/(0.01*cmplx.Abs(z-a)))
			},
			tol: 1e-12, source: "Jackson ch. 2; Griffiths ch. 3",
		},
		{
			name: "line charge in a grounded 90-degree corner, closed by an arc", equation: "lap(u) = -delta(x - 0.4, y - 0.3)",
			d: domain.Sector{R: series.IntCoef(1), Alpha: series.SymCoef(series.Pi).Mul(series.FracCoef(1, 2))}, bcs: []string{"arc: u = 0", "start: u = 0", "end: u = 0"},
			want: func(x, y float64) float64 {
				return -wedgeGreen(complex(x, y), complex(0.4, 0.3), 2, 1)
			},
			tol: 1e-12, source: "finite image system (Jackson ch. 2) with the disk's images",
		},
		{
			name: "line charge in a grounded 60-degree corner, closed by an arc", equation: "lap(u) = -delta(x - 0.5, y - 0.2)",
			d: domain.Sector{R: series.IntCoef(1), Alpha: series.SymCoef(series.Pi).Mul(series.FracCoef(1, 3))}, bcs: []string{"arc: u = 0", "start: u = 0", "end: u = 0"},
			want: func(x, y float64) float64 {
				return -wedgeGreen(complex(x, y), complex(0.5, 0.2), 3, 1)
			},
			tol: 1e-12, source: "finite image system (Jackson ch. 2) with the disk's images",
		},
		{
			name: "line charge outside a grounded cylinder", equation: "lap(u) = delta(x - 2, y - 0.5)",
			d: domain.Outside{R: series.IntCoef(1)}, bcs: []string{"u = 0"},
			// the same Kelvin pair, bounded far away
			want: func(x, y float64) float64 { return diskGreen(complex(x, y), complex(2, 0.5), 1) },
			tol:  1e-12, source: "images (Jackson ch. 2; Smythe)",
		},
		{
			name: "point source in a rectangle with fixed values", equation: "lap(u) = delta(x - 0.7, y - 0.35)",
			d: domain.Rect{L: series.IntCoef(2), H: series.IntCoef(1)}, bcs: []string{"left: u = 0", "right: u = 0", "bottom: u = 0", "top: u = 0"},
			want: func(x, y float64) float64 { return rectGreen(x, y, 0.7, 0.35, 2, 1) },
			tol:  1e-12, source: "the double sine series, inner sum in closed form (eigenfunction expansion, common practice)",
		},
		{
			name: "point source in a rectangle, values on three sides and no flux through the right", equation: "lap(u) = delta(x - 1.6, y - 0.3)",
			d: domain.Rect{L: series.IntCoef(2), H: series.IntCoef(1)}, bcs: []string{"left: u = 0", "right: dn(u) = 0", "bottom: u = 0", "top: u = 0"},
			want: func(x, y float64) float64 { return rectGreenModes(x, y, 1.6, 0.3, 2, 1, true) },
			tol:  1e-12, source: "the eigenfunction series in sin((m - 1/2)*pi*x/L), inner sum in closed form (common practice)",
		},
		{
			name: "point source in a tall rectangle, insulated top and bottom", equation: "lap(u) = delta(x - 0.3, y - 1.45)",
			d: domain.Rect{L: series.IntCoef(1), H: series.IntCoef(2)}, bcs: []string{"left: u = 0", "right: u = 0", "bottom: dn(u) = 0", "top: dn(u) = 0"},
			want: func(x, y float64) float64 { return rectGreenKinds(x, y, 0.3, 1.45, 1, 2, false, true) },
			tol:  1e-12, source: "the sine series in x, the insulated sides' inner sum in closed form (eigenfunction expansion, common practice)",
		},
		{
			name: "convecting disk: the Robin series", equation: "lap(u) = delta(x - 0.3, y - 0.4)",
			d: domain.Disk{R: series.IntCoef(1)}, bcs: []string{"dn(u) + 2*u = 0"},
			want: func(x, y float64) float64 { return robinDiskSeries(complex(x, y), complex(0.3, 0.4), 1, 2) },
			tol:  1e-13, source: "the Fourier series of ln|z - a| on the circle, summed directly",
		},
		{
			name: "convecting disk, the source at an angle no rational multiple of pi", equation: "lap(u) = delta(x + 0.3, y - 0.2)",
			d: domain.Disk{R: series.FracCoef(3, 2)}, bcs: []string{"dn(u) + u/2 = 0"},
			want: func(x, y float64) float64 { return robinDiskSeries(complex(x, y), complex(-0.3, 0.2), 1.5, 0.5) },
			tol:  1e-13, source: "the Fourier series of ln|z - a| on the circle, summed directly",
		},
		{
			name: "line charge between grounded coaxial cylinders", equation: "lap(u) = delta(x - 0.4, y + 0.5)",
			d: domain.Annulus{R1: series.FracCoef(1, 2), R2: series.IntCoef(1)}, bcs: []string{"inner: u = 0", "outer: u = 0"},
			want: func(x, y float64) float64 { return annulusGreen(complex(x, y), complex(0.4, -0.5), 0.5, 1) },
			tol:  1e-13, source: "the annulus' Green's function mode by mode (eigenfunction expansion, common practice), in the source's own angle",
		},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			sol := solvePointProblem(t, c.equation, c.d, c.env, c.bcs...)
			ev, err := sol.Evaluator(domain.CheckTerms)
			if err != nil {
				t.Fatal(err)
			}
			shape, err := c.d.Shape(c.env)
			if err != nil {
				t.Fatal(err)
			}
			b := shape.Box
			worst, scale := 0.0, 0.0
			for i := 1; i < 12; i++ {
				for j := 1; j < 12; j++ {
					x, y := b.X0+(b.X1-b.X0)*float64(i)/12, b.Y0+(b.Y1-b.Y0)*float64(j)/12
					if in, _ := domain.ContainsXY(c.d, x, y, c.env); !in {
						continue
					}
					got, _, _ := ev.AtXY(x, y)
					want := c.want(x, y)
					worst, scale = math.Max(worst, math.Abs(got-want)), math.Max(scale, math.Abs(want))
				}
			}
			if worst > c.tol*math.Max(1, scale) {
				t.Errorf("largest difference from %s is %.3g (scale %.3g)", c.source, worst, scale)
			}
		})
	}
}

// wedgeGreen is u with Δu = δ(z − a) in the sector of angle π/k and radius
// R with u = 0 on every side: the disk's Green's function summed over the
// 2k images of a under the reflections in the rays, alternating in sign.
func wedgeGreen(z, a complex128, k int, R float64) float64 {
	u := 0.0
	for j := 0; j < k; j++ {
		rot := cmplx.Exp(complex(0, 2*math.Pi*float64(j)/float64(k)))
		u += diskGreen(z, rot*a, R) - diskGreen(z, rot*cmplx.Conj(a), R)
	}
	return u
}

// rectGreen is u with Δu = δ at (x0, y0) in [0, L]×[0, H], u = 0 on the
// sides: Σ_m (2/L) sin(kx) sin(kx0)·g_m(y), k = mπ/L, with the inner sum
// of the double sine series in closed form,
// g_m = −sinh(k y<)·sinh(k(H − y>)) / (k sinh(kH)), summed to m = 4000.
func rectGreen(x, y, x0, y0, L, H float64) float64 {
	return rectGreenModes(x, y, x0, y0, L, H, false)
}

// rectGreenModes is rectGreen with the x modes sin(kx), k = mπ/L, or with
// k = (m − 1/2)π/L when flux (no flux through x = L).
func rectGreenModes(x, y, x0, y0, L, H float64, flux bool) float64 {
	return rectGreenKinds(x, y, x0, y0, L, H, flux, false)
}

// rectGreenKinds is rectGreenModes with, when insulated, no flux through
// y = 0 and y = H: g_m = −cosh(k y<)·cosh(k(H − y>)) / (k sinh(kH)).
func rectGreenKinds(x, y, x0, y0, L, H float64, flux, insulated bool) float64 {
	lo, hi := math.Min(y, y0), math.Max(y, y0)
	u := 0.0
	for m := 1; m <= 4000; m++ {
		k := float64(m) * math.Pi / L
		if flux {
			k = (float64(m) - 0.5) * math.Pi / L
		}
		// sinh ratio in a form that does not overflow: e^{k(lo - H + hi - H)}...
		g := -(1 - math.Exp(-2*k*lo)) * (1 - math.Exp(-2*k*(H-hi))) / (1 - math.Exp(-2*k*H)) * math.Exp(-k*(hi-lo)) / (2 * k)
		if insulated {
			g = -(1 + math.Exp(-2*k*lo)) * (1 + math.Exp(-2*k*(H-hi))) / (1 - math.Exp(-2*k*H)) * math.Exp(-k*(hi-lo)) / (2 * k)
		}
		u += 2 / L * math.Sin(k*x) * math.Sin(k*x0) * g
	}
	return u
}

// robinDiskSeries is u with Δu = δ(z − a) in |z| < R and ∂u/∂n + h·u = 0 on
// the rim: (1/2π)·ln|z − a| plus the harmonic series whose modes cancel
// the Robin operator on ln R − Σ (ρ/R)^n cos n(θ − φ)/n, summed to n = 400.
func robinDiskSeries(z, a complex128, R, h float64) float64 {
	rho, phi := cmplx.Abs(a), cmplx.Phase(a)
	r, th := cmplx.Abs(z), cmplx.Phase(z)
	u := math.Log(cmplx.Abs(z-a))/(2*math.Pi) - (1/(R*h)+math.Log(R))/(2*math.Pi)
	for n := 1; n <= 400; n++ {
		fn := float64(n)
		an := -math.Pow(rho/R, fn) * (1/R - h/fn) / (fn/R + h) / (2 * math.Pi)
		u += an * math.Pow(r/R, fn) * math.Cos(fn*(th-phi))
	}
	return u
}

// annulusGreen is u with Δu = δ(z − a) in R1 < |z| < R2, u = 0 on both
// circles: (1/2π)·ln|z − a| plus c0 + d0·ln r and, per mode, the real part
// of (α_n r^n + β_n r^(−n))·e^{in(θ − φ)}, whose values on the circles
// cancel the logarithm's series there, (ρ/R2)^n/n outside it and
// (R1/ρ)^n/n inside; summed to n = 200.
func annulusGreen(z, a complex128, R1, R2 float64) float64 {
	rho, phi := cmplx.Abs(a), cmplx.Phase(a)
	r, th := cmplx.Abs(z), cmplx.Phase(z)
	k := 1 / (2 * math.Pi)
	// c0 + d0 ln R2 = −k ln R2, c0 + d0 ln R1 = −k ln ρ.
	d0 := k * (math.Log(rho) - math.Log(R2)) / (math.Log(R2) - math.Log(R1))
	c0 := -k*math.Log(R2) - d0*math.Log(R2)
	u := k*math.Log(cmplx.Abs(z-a)) + c0 + d0*math.Log(r)
	for n := 1; n <= 200; n++ {
		fn := float64(n)
		g2, g1 := k*math.Pow(rho/R2, fn)/fn, k*math.Pow(R1/rho, fn)/fn
		// α R2^n + β R2^−n = g2, α R1^n + β R1^−n = g1.
		a11, a12, a21, a22 := math.Pow(R2, fn), math.Pow(R2, -fn), math.Pow(R1, fn), math.Pow(R1, -fn)
		det := a11*a22 - a12*a21
		alpha, beta := (g2*a22-a12*g1)/det, (a11*g1-g2*a21)/det
		u += (alpha*math.Pow(r, fn) + beta*math.Pow(r, -fn)) * math.Cos(fn*(th-phi))
	}
	return u
}

// The disk's flux condition: the closed image form against the exact
// Fourier series of ln|z − a| on the circle, the modes' coefficients
// −(ρ/R)^n/n, summed directly; up to the free constant, so differences.
func TestPointSourceNeumannDiskAgainstSeries(t *testing.T) {
	sol := solvePointProblem(t, "lap(u) = delta(x - 0.35, y + 0.2)", domain.Disk{R: series.IntCoef(1)}, nil, "dn(u) = 1/(2*pi)")
	if sol.Points == nil || sol.Points.Images == "" {
		t.Fatalf("the Neumann disk is not closed by images: %+v", sol.Points)
	}
	if err := sol.Pin(series.Coef{}); err != nil {
		t.Fatal(err)
	}
	ev, err := sol.Evaluator(domain.CheckTerms)
	if err != nil {
		t.Fatal(err)
	}
	a := complex(0.35, -0.2)
	series := func(z complex128) float64 {
		rho, phi := cmplx.Abs(a), cmplx.Phase(a)
		r, th := cmplx.Abs(z), cmplx.Phase(z)
		u := math.Log(cmplx.Abs(z-a)) / (2 * math.Pi)
		for n := 1; n <= 300; n++ {
			fn := float64(n)
			u -= math.Pow(rho, fn) / fn * math.Pow(r, fn) * math.Cos(fn*(th-phi)) / (2 * math.Pi)
		}
		return u
	}
	ref := complex(-0.5, 0.1)
	u0, _, _ := ev.AtXY(real(ref), imag(ref))
	for _, z := range []complex128{0.1 + 0.6i, -0.3 - 0.3i, 0.7, 0.2 + 0.1i} {
		u, _, _ := ev.AtXY(real(z), imag(z))
		if d := (u - u0) - (series(z) - series(ref)); math.Abs(d) > 1e-12 {
			t.Errorf("at %v: psol's difference from the series is %.3g", z, d)
		}
	}
}

// The flux through a small circle around the source is its strength, and
// the report's net outward flux equals the source integral with the points
// counted (divergence theorem), on closed and numeric paths alike.
func TestPointSourceFluxes(t *testing.T) {
	cases := []struct {
		equation string
		d        domain.Domain
		bcs      []string
		q        float64
		at       [2]float64
	}{
		{"lap(u) = 3*delta(x - 0.2, y - 0.1) - 1", domain.Disk{R: series.IntCoef(1)}, []string{"u = 0"}, 3, [2]float64{0.2, 0.1}},
		{"lap(u) = -2*delta(x - 0.9, y - 0.4)", domain.Rect{L: series.IntCoef(2), H: series.IntCoef(1)}, []string{"left: u = 0", "right: u = 0", "bottom: dn(u) = 0", "top: dn(u) + u = 0"}, -2, [2]float64{0.9, 0.4}},
		{"lap(u) = delta(x - 0.5, y - 0.3)", domain.Polygon{X: []series.Coef{series.IntCoef(0), series.IntCoef(2), series.IntCoef(1)}, Y: []series.Coef{series.IntCoef(0), series.IntCoef(0), series.FracCoef(3, 2)}}, []string{"s1: u = 0", "s2: u = 0", "s3: u = 0"}, 1, [2]float64{0.5, 0.3}},
		{"lap(u) = delta(x + 0.5, y)", domain.Annulus{R1: series.FracCoef(1, 5), R2: series.IntCoef(1)}, []string{"inner: dn(u) = 0", "outer: u = 0"}, 1, [2]float64{-0.5, 0}},
	}
	for _, c := range cases {
		sol := solvePointProblem(t, c.equation, c.d, nil, c.bcs...)
		ev, err := sol.Evaluator(domain.CheckTerms)
		if err != nil {
			t.Fatal(err)
		}
		const eps, h, n = 1e-2, 1e-5, 400
		flux := 0.0
		for k := 0; k < n; k++ {
			th := 2 * math.Pi * (float64(k) + 0.5) / n
			nx, ny := math.Cos(th), math.Sin(th)
			x, y := c.at[0]+eps*nx, c.at[1]+eps*ny
			up, _, _ := ev.AtXY(x+h*nx, y+h*ny)
			um, _, _ := ev.AtXY(x-h*nx, y-h*ny)
			flux += (up - um) / (2 * h) * eps * 2 * math.Pi / n
		}
		// The small disk's own source integral is part of the flux through its edge.
		flux -= sourceInside(c.equation, eps)
		if math.Abs(flux-c.q) > 1e-6*math.Abs(c.q) {
			t.Errorf("%s on %s: flux through a circle round the source %.10g, want %g", c.equation, c.d.Describe(), flux, c.q)
		}
		rep, err := sol.Figures()
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(rep.Flux-rep.Source) > 1e-8*(1+math.Abs(rep.Source)) {
			t.Errorf("%s on %s: net outward flux %.12g, source integral with the points %.12g", c.equation, c.d.Describe(), rep.Flux, rep.Source)
		}
		if c.q > 0 && !math.IsInf(rep.Min, -1) || c.q < 0 && !math.IsInf(rep.Max, 1) {
			t.Errorf("%s: the report's extreme at the source is not infinite: max %g, min %g", c.equation, rep.Max, rep.Min)
		}
	}
}

// sourceInside is the distributed source's integral over a disk of radius
// eps: the "- 1" of the first case.
func sourceInside(equation string, eps float64) float64 {
	if strings.HasSuffix(equation, " - 1") {
		return -math.Pi * eps * eps
	}
	return 0
}

// Between two circles: ∬G(z, a) dA = v(a), v = r²/4 + A + B·ln r with
// Δv = 1 and v = 0 on both circles (Green's reciprocity, common practice).
func TestPointSourceAnnulusAreaIntegral(t *testing.T) {
	R1, R2 := 0.5, 1.0
	sol := solvePointProblem(t, "lap(u) = delta(x - 0.3, y + 0.6)", domain.Annulus{R1: series.FracCoef(1, 2), R2: series.IntCoef(1)}, nil, "inner: u = 0", "outer: u = 0")
	rep, err := sol.Figures()
	if err != nil {
		t.Fatal(err)
	}
	B := -(R2*R2 - R1*R1) / (4 * math.Log(R2/R1))
	A := -R2*R2/4 - B*math.Log(R2)
	rho2 := 0.09 + 0.36
	want := rho2/4 + A + B*math.Log(math.Sqrt(rho2))
	if math.Abs(rep.Integral-want) > 1e-10 {
		t.Errorf("area integral of the annulus' Green's function %.15g, want %.15g (reciprocity)", rep.Integral, want)
	}
}

// The Green's function's area integral: ∬G(z, a) dA = (|a|² − R²)/4, by
// Green's reciprocity with Δv = 1, v = 0 on the rim (common practice).
func TestPointSourceAreaIntegral(t *testing.T) {
	sol := solvePointProblem(t, "lap(u) = delta(x - 0.3, y + 0.5)", domain.Disk{R: series.IntCoef(2)}, nil, "u = 0")
	rep, err := sol.Figures()
	if err != nil {
		t.Fatal(err)
	}
	want := (0.09 + 0.25 - 4) / 4
	if math.Abs(rep.Integral-want) > 1e-12 {
		t.Errorf("area integral %.15g, want %.15g", rep.Integral, want)
	}
}

// Points on or outside the boundary have no solution (exit 1); a delta in
// boundary data or times a function is bad input (exit 2, with a caret).
func TestPointSourceRefusals(t *testing.T) {
	disk := domain.Disk{R: series.IntCoef(1)}
	for _, eq := range []string{"lap(u) = delta(x - 1, y)", "lap(u) = delta(x - 2, y + 1)"} {
		f, conds, err := pose(eq, disk, []string{"u = 0"}, nil)
		if err != nil {
			t.Fatal(err)
		}
		_, err = domain.Solve(disk, f, conds)
		var un *domain.Unsolvable
		if !errors.As(err, &un) {
			t.Errorf("%s: want no solution as posed, got %v", eq, err)
		}
	}
	for _, c := range []struct{ label, text string }{
		{"equation", "lap(u) = x*delta(x, y)"},
		{"equation", "lap(u) = delta(x^2, y)"},
		{"equation", "lap(u) = sin(delta(x, y))"},
		{"equation", "lap(u) = delta(x, y)^2"},
		{"equation", "lap(u) = 1/delta(x, y)"},
		{"equation", "lap(u) = delta(x, y)*delta(x, y)"},
		{"equation", "lap(u) = delta(x)"},
		{"bc", "u = delta(x, y)"},
	} {
		var err error
		if c.label == "bc" {
			_, err = parse.Condition(c.text, disk.Sides(), nil)
		} else {
			_, err = parse.Equation(c.text, nil)
		}
		var pe *parse.Error
		if !errors.As(err, &pe) {
			t.Errorf("%s: want a parse error, got %v", c.text, err)
		}
	}
	// A strength may be a constant expression, on either side, and δ is delta.
	f, err := parse.Equation("-Q/T*δ(x - 1/2, y + 1) - N/T", nil)
	if err != nil || len(f.Points) != 1 {
		t.Fatalf("the strength form: %v, %+v", err, f.Points)
	}
	if got := series.PointsText(f.Points); got != "-Q/T*delta(x - 1/2, y + 1)" {
		t.Errorf("printed %q", got)
	}
}

// A well near a straight river at fixed head: the half-disk of a large
// radius against the half-plane's image recharge well,
// h = H + (Q/4πT)·ln(|z − a|²/|z − ā|²) (common practice; Bear). The arc's
// own images move h by O(|a||z|/R²), far below the tolerance here.
func TestPointSourceWellNearRiver(t *testing.T) {
	env := series.Env{"Q": series.FracCoef(3, 100), "T": series.FracCoef(1, 200), "H": series.IntCoef(12)}
	d := domain.Sector{R: series.IntCoef(100000), Alpha: series.SymCoef(series.Pi)}
	sol := solvePointProblem(t, "T*lap(u) = Q*delta(x, y - 80)", d, env, "arc: u = H", "start: u = H", "end: u = H")
	ev, err := sol.Evaluator(domain.CheckTerms)
	if err != nil {
		t.Fatal(err)
	}
	a := complex(0, 80)
	for _, z := range []complex128{10 + 5i, -40 + 80i, 150 + 200i, 0 + 300i, 79 + 1i} {
		got, _, _ := ev.AtXY(real(z), imag(z))
		want := 12 + 0.03/(4*math.Pi*0.005)*math.Log(math.Pow(cmplx.Abs(z-a), 2)/math.Pow(cmplx.Abs(z-cmplx.Conj(a)), 2))
		if math.Abs(got-want) > 1e-5 {
			t.Errorf("at %v: head %.12g, the image recharge well gives %.12g", z, got, want)
		}
	}
}

// A heating wire in a slab with fixed-temperature ends and convecting
// faces, on two independent numeric paths: the rectangle's eigenfunction
// series and the same rectangle as a polygon (the rational fit). They
// share only u_s.
func TestPointSourceSlabTwoPaths(t *testing.T) {
	env := series.Env{"k": series.IntCoef(15), "P": series.IntCoef(40), "hc": series.IntCoef(25)}
	eq := "-k*lap(u) = P*delta(x - 0.02, y - 0.01)"
	rect := solvePointProblem(t, eq, domain.Rect{L: series.FracCoef(1, 20), H: series.FracCoef(1, 50)}, env,
		"left: u = 20", "right: u = 20", "bottom: -k*dn(u) = hc*(u - 20)", "top: -k*dn(u) = hc*(u - 20)")
	c := func(v float64) series.Coef { return series.RatCoef(new(big.Rat).SetFloat64(v)) }
	poly := domain.Polygon{X: []series.Coef{c(0), c(0.05), c(0.05), c(0)}, Y: []series.Coef{c(0), c(0), c(0.02), c(0.02)}}
	sec := solvePointProblem(t, eq, poly, env, "s1: -k*dn(u) = hc*(u - 20)", "s3: -k*dn(u) = hc*(u - 20)", "s2: u = 20", "s4: u = 20")
	er, err := rect.Evaluator(domain.CheckTerms)
	if err != nil {
		t.Fatal(err)
	}
	es, err := sec.Evaluator(domain.CheckTerms)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range [][2]float64{{0.03, 0.01}, {0.045, 0.018}, {0.005, 0.002}, {0.021, 0.0105}} {
		a, _, _ := er.AtXY(p[0], p[1])
		b, _, _ := es.AtXY(p[0], p[1])
		if math.Abs(a-b) > 1e-8 {
			t.Errorf("at %v: the rectangle gives %.12g, the polygon %.12g", p, a, b)
		}
	}
}

// The regular part at a source, u − (Q/2π)·ln|z − z₀| there, against its
// definition as a limit: the mean of u − (Q/2π)·ln ε at the four points at
// distance ε = 1e-4 around the source (the mean cancels the linear term, so
// the difference is O(ε²)). Each way of building u_s: images, the
// logarithm's series, the row of images, the sources' own field.
func TestPointSourceRegularPart(t *testing.T) {
	cases := []struct {
		equation string
		d        domain.Domain
		bcs      []string
		at       [2]float64
		q        float64
	}{
		{"lap(u) = 2*delta(x - 0.3, y + 0.2)", domain.Disk{R: series.IntCoef(1)}, []string{"u = 0"}, [2]float64{0.3, -0.2}, 2},
		{"lap(u) = 2*delta(x - 0.3, y + 0.2)", domain.Disk{R: series.IntCoef(1)}, []string{"dn(u) + 3*u = 0"}, [2]float64{0.3, -0.2}, 2},
		{"lap(u) = delta(x + 0.6, y + 0.3)", domain.Annulus{R1: series.FracCoef(1, 2), R2: series.IntCoef(1)}, []string{"inner: dn(u) = 0", "outer: u = 0"}, [2]float64{-0.6, -0.3}, 1},
		{"lap(u) = -delta(x - 0.7, y - 0.2)", domain.Rect{L: series.IntCoef(1), H: series.FracCoef(1, 2)}, []string{"left: u = 0", "right: dn(u) = 0", "bottom: dn(u) + u = 0", "top: u = 0"}, [2]float64{0.7, 0.2}, -1},
		{"lap(u) = delta(x - 0.5, y - 0.3)", domain.Polygon{X: []series.Coef{series.IntCoef(0), series.IntCoef(2), series.IntCoef(1)}, Y: []series.Coef{series.IntCoef(0), series.IntCoef(0), series.FracCoef(3, 2)}}, []string{"s1: u = 0", "s2: u = 0", "s3: u = 0"}, [2]float64{0.5, 0.3}, 1},
	}
	for _, c := range cases {
		sol := solvePointProblem(t, c.equation, c.d, nil, c.bcs...)
		ev, err := sol.Evaluator(domain.CheckTerms)
		if err != nil {
			t.Fatal(err)
		}
		regular, _, _, ok := ev.AtSource(c.at[0], c.at[1])
		if !ok {
			t.Fatalf("%s: no source at %v", c.equation, c.at)
		}
		const eps = 1e-4
		mean := 0.0
		for _, d := range [][2]float64{{eps, 0}, {-eps, 0}, {0, eps}, {0, -eps}} {
			u, _, _ := ev.AtXY(c.at[0]+d[0], c.at[1]+d[1])
			mean += (u - c.q/(2*math.Pi)*math.Log(eps)) / 4
		}
		if math.Abs(mean-regular) > 1e-7*math.Max(1, math.Abs(regular)) {
			t.Errorf("%s on %s: the regular part %.12g, its limit from nearby %.12g", c.equation, c.d.Describe(), regular, mean)
		}
	}
}

// Evaluator.Grid against At with a point source off the image systems (a
// convective rim): the rows Grid takes point by point (the centre, the
// rows beside the rim) added the sources' field a second time, and a CSV
// grid's centre read −0.463 where u is −0.271 (At, and the series by hand:
// the field's own (1/2π)·ln 0.3 = −0.1916 was the difference).
func TestGridMatchesAtWithPointSources(t *testing.T) {
	sol := solveWith(t, "lap(u) = delta(x - 0.3, y)", unitDisk, domain.Options{}, "dn(u) + 2u = 0")
	ev := evaluator(t, sol, 1e-13)
	rs := []float64{0, 0.25, 0.6, 0.98, 0.999, 1}
	thetas := []float64{0, 1, 2.5, 4}
	u, _ := ev.Grid(rs, thetas)
	for i, r := range rs {
		for j, th := range thetas {
			want, _, _ := ev.At(r, th)
			if math.Abs(u[i][j]-want) > 1e-12 {
				t.Errorf("Grid at r = %g, theta = %g: %.15g, At %.15g", r, th, u[i][j], want)
			}
		}
	}
}
