package domain_test

import (
	"math"
	"strings"
	"testing"

	"psol/domain"
	"psol/series"
)

// figures solves and returns the named preset's figures by name.
func figures(t *testing.T, quantity, equation string, d domain.Domain, env series.Env, bcs ...string) map[string]domain.Figure {
	t.Helper()
	f, conds, err := pose(equation, d, bcs, env)
	if err != nil {
		t.Fatal(err)
	}
	sol, err := domain.SolveWith(d, f, conds, domain.Options{Env: env})
	if err != nil {
		t.Fatal(err)
	}
	rep, err := sol.Figures()
	if err != nil {
		t.Fatal(err)
	}
	figs, err := sol.Quantity(quantity, rep)
	if err != nil {
		t.Fatal(err)
	}
	out := map[string]domain.Figure{}
	for _, f := range figs {
		out[f.Name] = f
	}
	return out
}

var walls = []string{"left: u = 0", "right: u = 0", "bottom: u = 0", "top: u = 0"}

// TestFlowFigures checks fRe against the duct tables, however the equation
// is written and whichever sides are symmetry lines or free surfaces.
func TestFlowFigures(t *testing.T) {
	env := series.Env{"mu": coef(t, "1/1000"), "G": coef(t, "100")}
	cases := []struct {
		name, eq string
		d        domain.Domain
		env      series.Env
		bcs      []string
		fRe, tol float64
		source   string
	}{
		{"pipe, mu*lap(u) = -G", "mu*lap(u) = -G", domain.Disk{R: coef(t, "1/100")}, env, []string{"u = 0"}, 16, 1e-12,
			"Shah & London 1978: circular duct fRe = 16"},
		{"pipe, symbolic radius", "lap(u) = -5", domain.Disk{R: coef(t, "a")}, nil, []string{"u = 0"}, 16, 1e-12,
			"Shah & London 1978: circular duct fRe = 16"},
		{"square duct", "lap(u) = -3", rect(t, "1", "1"), nil, walls, 14.22708, 1e-5,
			"Shah & London 1978: square duct fRe = 14.22708"},
		{"open 2x1 channel = the 2x2 square by symmetry", "lap(u) = -1", rect(t, "2", "1"), nil,
			[]string{"left: u = 0", "right: u = 0", "bottom: u = 0", "top: dn(u) = 0"}, 14.22708, 1e-5,
			"Shah & London 1978 square duct, the free surface a symmetry line"},
		{"quarter disk, one insulated ray = the semicircular duct", "lap(u) = -1", sector(t, "1", "pi/2"), nil,
			[]string{"arc: u = 0", "start: dn(u) = 0", "end: u = 0"}, 15.767, 1e-3,
			"Shah & London 1978: semicircular duct fRe = 15.767"},
		{"concentric annulus 1/2", "lap(u) = -1", annulus(t, "1/2", "1"), nil, []string{"inner: u = 0", "outer: u = 0"}, 23.813, 1e-3,
			"Shah & London 1978: concentric annulus r*=0.5, fRe = 23.813 (from memory)"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			figs := figures(t, "flow", c.eq, c.d, c.env, c.bcs...)
			f, ok := figs["fRe"]
			if !ok {
				t.Fatalf("no fRe among %v", figs)
			}
			if math.Abs(f.Value-c.fRe) > c.tol*c.fRe {
				t.Errorf("fRe = %.8g, want %.8g (%s)", f.Value, c.fRe, c.source)
			}
			if len(f.Warnings) > 0 {
				t.Errorf("unexpected warnings %v", f.Warnings)
			}
		})
	}
	// The pipe written with symbols has the exact fRe = 16.
	figs := figures(t, "flow", "mu*lap(u) = -G", domain.Disk{R: coef(t, "a")}, nil, "u = 0")
	if f := figs["fRe"]; f.Exact == nil || !f.Exact.Equal(series.IntCoef(16)) {
		t.Errorf("symbolic pipe fRe = %v, want exactly 16", f.Exact)
	}
	if q := figs["Q"]; q.Exact == nil || !q.Exact.Equal(coef(t, "pi*G*a^4/(8*mu)")) {
		t.Errorf("symbolic Q = %v, want pi*G*a^4/(8*mu) (Hagen–Poiseuille, Bird, Stewart & Lightfoot §2.3)", q.Exact)
	}
	// A moving core: fRe is given with a warning that it assumes still walls.
	figs = figures(t, "flow", "lap(u) = -1", annulus(t, "1/2", "1"), nil, "inner: u = 1", "outer: u = 0")
	if f := figs["fRe"]; len(f.Warnings) == 0 || !strings.Contains(f.Warnings[0], "still walls") {
		t.Errorf("moving wall: warnings %v", f.Warnings)
	}
}

// TestTorsionFigures checks J and the peak shear against Timoshenko &
// Goodier: the solid and hollow shaft, and the rectangular bars' table
// (J = k₁·a·b³, τ_max = k₂·Gθ·b with b the short side).
func TestTorsionFigures(t *testing.T) {
	type want struct {
		name   string
		d      domain.Domain
		bcs    []string
		J, tau float64
		tol    float64
		source string
	}
	for _, c := range []want{
		{"solid shaft", domain.Disk{R: coef(t, "2")}, []string{"u = 0"}, math.Pi * 16 / 2, 2, 1e-9, "J = πa⁴/2, τ = Gθa"},
		{"hollow shaft, hole value found", annulus(t, "1", "2"), []string{"inner: u = const, flux = 2*pi", "outer: u = 0"},
			math.Pi * 15 / 2, 2, 1e-9, "J = π(b⁴ − a⁴)/2, τ = Gθb"},
		{"square bar", rect(t, "1", "1"), walls, 0.1406, 0.675, 2e-3, "k₁ = 0.1406, k₂ = 0.675 (a/b = 1)"},
		{"2:1 bar", rect(t, "2", "1"), walls, 0.229 * 2, 0.930, 3e-3, "k₁ = 0.229, k₂ = 0.930 (a/b = 2)"},
	} {
		t.Run(c.name, func(t *testing.T) {
			figs := figures(t, "torsion", "lap(u) = -2", c.d, nil, c.bcs...)
			if j := figs["J"].Value; math.Abs(j-c.J) > c.tol*c.J {
				t.Errorf("J = %.8g, want %.8g (Timoshenko & Goodier: %s)", j, c.J, c.source)
			}
			if tau := figs["tau_max"].Value; math.Abs(tau-c.tau) > c.tol*c.tau+1e-9 {
				t.Errorf("tau_max = %.8g, want %.8g (Timoshenko & Goodier: %s)", tau, c.tau, c.source)
			}
		})
	}
	// Symbolic: the solid shaft's J = πa⁴/2 exactly, and the hollow one's
	// π(b⁴ − a⁴)/2 with the hole's value found by psol.
	if j := figures(t, "torsion", "lap(u) = -2", domain.Disk{R: coef(t, "a")}, nil, "u = 0")["J"]; j.Exact == nil || !j.Exact.Equal(coef(t, "pi*a^4/2")) {
		t.Errorf("symbolic J = %v, want pi*a^4/2", j.Exact)
	}
	j := figures(t, "torsion", "lap(u) = -2", annulus(t, "a", "b"), nil, "inner: u = const, flux = 2*pi*a^2", "outer: u = 0")["J"]
	if j.Exact == nil || !j.Exact.Equal(coef(t, "pi*(b^4 - a^4)/2")) {
		t.Errorf("hollow J = %v, want pi*(b^4 - a^4)/2", j.Exact)
	}
	// A source written with another constant: G*theta scaled out.
	if j := figures(t, "torsion", "lap(u) = -6", domain.Disk{R: coef(t, "1")}, nil, "u = 0")["J"]; math.Abs(j.Value-math.Pi/2) > 1e-12 {
		t.Errorf("J for lap(u) = -6 = %g, want pi/2 (J does not depend on how the source is scaled)", j.Value)
	}
	// A hole given a value that breaks single-valued warping is flagged.
	j = figures(t, "torsion", "lap(u) = -2", annulus(t, "1", "2"), nil, "inner: u = 1", "outer: u = 0")["J"]
	if len(j.Warnings) == 0 || !strings.Contains(j.Warnings[0], "single-valued") {
		t.Errorf("wrong hole value: warnings %v", j.Warnings)
	}
}

// TestPipeWallShear: the largest |∇u| of Poiseuille flow μΔu = −G is at the
// wall, Ga/(2μ) (force balance; Bird, Stewart & Lightfoot §2.3).
func TestPipeWallShear(t *testing.T) {
	env := series.Env{"mu": coef(t, "2"), "G": coef(t, "8")}
	f, conds, err := pose("mu*lap(u) = -G", domain.Disk{R: coef(t, "3")}, []string{"u = 0"}, env)
	if err != nil {
		t.Fatal(err)
	}
	sol, err := domain.SolveWith(domain.Disk{R: coef(t, "3")}, f, conds, domain.Options{Env: env})
	if err != nil {
		t.Fatal(err)
	}
	rep, err := sol.Figures()
	if err != nil {
		t.Fatal(err)
	}
	if g := rep.Gradient; g == nil || math.Abs(g.Value-8*3/(2*2.0)) > 1e-8 || math.Abs(math.Hypot(g.At[0], g.At[1])-3) > 1e-9 {
		t.Errorf("largest |grad u| = %+v, want 6 on the wall r = 3", g)
	}
	// Per side and net flux: the heat balance of each face sums to the source.
	sum := 0.0
	for _, s := range rep.Sides {
		sum += s.Value
	}
	if math.Abs(sum-rep.Source) > 1e-9 {
		t.Errorf("side fluxes sum to %g, source integral %g", sum, rep.Source)
	}
}

// TestReentrantCornerShear: at a corner where the section's boundary turns
// inward (interior angle 3π/2) the stress function's gradient grows like
// ρ^(−1/3), ρ the distance from the corner, so the peak shear has no finite
// value in this model (Timoshenko & Goodier on the re-entrant corners of
// rolled and hollow sections, which need a fillet). Every corner of a hole
// is such a corner for the section round it, whichever way the hole's
// vertices are listed; a solid bar's corners are not.
func TestReentrantCornerShear(t *testing.T) {
	square := polygonXY(0, 0, 1, 0, 1, 1, 0, 1)
	flux := "u = const, flux = 2*0.25"
	for _, c := range []struct {
		name      string
		d         domain.Domain
		bcs       []string
		reentrant bool
	}{
		{"solid square", square, sidesOf(square, "s", "u = 0"), false},
		{"L shape", polygonXY(0, 0, 2, 0, 2, 1, 1, 1, 1, 2, 0, 2), nil, true},
		{"square tube, hole anticlockwise", domain.Holed{Outer: square, Holes: []domain.CircleHole{{Poly: polygonXY(0.25, 0.25, 0.75, 0.25, 0.75, 0.75, 0.25, 0.75)}}}, nil, true},
		{"square tube, hole clockwise", domain.Holed{Outer: square, Holes: []domain.CircleHole{{Poly: polygonXY(0.25, 0.25, 0.25, 0.75, 0.75, 0.75, 0.75, 0.25)}}}, nil, true},
	} {
		t.Run(c.name, func(t *testing.T) {
			bcs := c.bcs
			if bcs == nil {
				bcs = sidesOf(c.d, "s", "u = 0")
				if _, holed := c.d.(domain.Holed); holed {
					bcs = append(bcs, sidesOf(c.d, "hole1", flux)...)
				}
			}
			tau := figures(t, "torsion", "lap(u) = -2", c.d, nil, bcs...)["tau_max"]
			warned := false
			for _, w := range tau.Warnings {
				warned = warned || strings.Contains(w, "re-entrant corner")
			}
			if warned != c.reentrant {
				t.Errorf("tau_max = %g at %v, warnings %q: want the re-entrant corner's caution %v", tau.Value, *tau.At, tau.Warnings, c.reentrant)
			}
		})
	}
}
