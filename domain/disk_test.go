package domain_test

import (
	"math"
	"math/big"
	"math/rand"
	"strings"
	"testing"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

// solveDisk poses and solves a disk problem the way the CLI does.
func solveDisk(t testing.TB, equation, radius string, bcs []string, env series.Env) *domain.Solution {
	t.Helper()
	sol, err := trySolveDisk(equation, radius, bcs, env)
	if err != nil {
		t.Fatalf("%s: %v", equation, err)
	}
	return sol
}

func trySolveDisk(equation, radius string, bcs []string, env series.Env) (*domain.Solution, error) {
	rs, err := parse.Lengths("--disk", radius, 1, env)
	if err != nil {
		return nil, err
	}
	return trySolve(equation, domain.Disk{R: rs[0]}, bcs, env)
}

// pose lowers an equation and conditions the way the CLI does.
func pose(equation string, d domain.Domain, bcs []string, env series.Env) (series.Field, []domain.Condition, error) {
	f, err := parse.Equation(equation, env)
	if err != nil {
		return series.Field{}, nil, err
	}
	var conds []domain.Condition
	for _, b := range bcs {
		c, err := parse.Condition(b, d.Sides(), env)
		if err != nil {
			return series.Field{}, nil, err
		}
		conds = append(conds, c)
	}
	return f, conds, nil
}

func trySolve(equation string, d domain.Domain, bcs []string, env series.Env) (*domain.Solution, error) {
	f, conds, err := pose(equation, d, bcs, env)
	if err != nil {
		return nil, err
	}
	return domain.Solve(d, f, conds)
}

func solve(t testing.TB, equation string, d domain.Domain, bcs ...string) *domain.Solution {
	t.Helper()
	sol, err := trySolve(equation, d, bcs, nil)
	if err != nil {
		t.Fatalf("%s on %s: %v", equation, d.Describe(), err)
	}
	// Every solve in the tests passes the independent check of its
	// conditions (evaluated solution, geometric normals, differences).
	if c := sol.Independent; c != nil && c.Failed() {
		t.Fatalf("%s on %s: %s", equation, d.Describe(), c.Name)
	}
	return sol
}

func coef(t testing.TB, s string) series.Coef {
	t.Helper()
	c, ok := expr(t, s).Const()
	if !ok {
		t.Fatalf("%s is not a constant", s)
	}
	return c
}

func expr(t testing.TB, s string) series.Sum {
	t.Helper()
	f, err := parse.Expression("test", s, nil)
	if err != nil || !f.IsExact() {
		t.Fatalf("%s: %v", s, err)
	}
	return f.Exact
}

// Published closed forms, with symbolic parameters, compared exactly.
func TestDiskPublishedForms(t *testing.T) {
	cases := []struct {
		name, source, equation, radius, bc, want string
	}{
		// Hagen–Poiseuille flow: u = G(a² − r²)/(4μ).
		{"Poiseuille", "Bird, Stewart & Lightfoot, Transport Phenomena, §2.3",
			"lap(u) = -G/mu", "a", "u = 0", "G*(a^2 - r^2)/(4*mu)"},
		// Solid cylinder with uniform generation: T = Ts + q(a² − r²)/(4k).
		{"heated cylinder", "Incropera, Fundamentals of Heat and Mass Transfer, conduction with thermal energy generation (radial systems)",
			"-k*lap(u) = q", "a", "u = Ts", "Ts + q*(a^2 - r^2)/(4*k)"},
		// Pressurised circular membrane: w = p(a² − r²)/(4T).
		{"membrane", "classical membrane theory, e.g. Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, membrane analogy",
			"T*lap(u) = -p", "a", "u = 0", "p*(a^2 - r^2)/(4*T)"},
		// Saint-Venant torsion of a round shaft: φ = (a² − r²)/2.
		{"torsion", "Timoshenko & Goodier, Theory of Elasticity, torsion of circular shafts",
			"lap(u) = -2", "a", "u = 0", "(a^2 - r^2)/2"},
	}
	for _, c := range cases {
		sol := solveDisk(t, c.equation, c.radius, []string{c.bc}, nil)
		if want := expr(t, c.want); !sol.U.Equal(want) {
			t.Errorf("%s (%s): u = %s, want %s", c.name, c.source, sol.U.Text(), want.Text())
		}
		assertChecks(t, sol)
	}
	// Torsion constant J = 2∬φ dA = πa⁴/2 (Timoshenko & Goodier, torsion of circular shafts).
	sol := solveDisk(t, "lap(u) = -2", "a", []string{"u = 0"}, nil)
	area, err := sol.U.DiskIntegral(series.SymCoef(series.Param("a")))
	if err != nil {
		t.Fatal(err)
	}
	if got := area.MulRat(big.NewRat(2, 1)); !got.Equal(expr(t, "pi*a^4/2").Terms()[0].C) {
		t.Errorf("J = %s, want pi*a^4/2", got.Text())
	}
}

// The SPEC §5 example, stage by stage.
func TestDiskStages(t *testing.T) {
	sol := solveDisk(t, "lap(u) = 6r*sin(theta)", "2", []string{"u = 4sin(3theta)"}, nil)
	for _, c := range []struct{ name, got, want string }{
		{"particular", sol.Particular.Text(), "3/4*r^3*sin(theta)"},
		{"trace", sol.Sides[0].Trace.Text(), "6*sin(theta)"},
		{"correction", sol.Sides[0].Correction.Text(), "-6*sin(theta) + 4*sin(3*theta)"},
		{"harmonic", sol.Harmonic.Text(), "-3*r*sin(theta) + 1/2*r^3*sin(3*theta)"},
	} {
		if c.got != c.want {
			t.Errorf("%s: %s, want %s", c.name, c.got, c.want)
		}
	}
	assertChecks(t, sol)
}

// An independent numeric path: the solution's printed text, parsed back and
// evaluated in float64, satisfies Δu = f by a 5-point finite-difference
// Laplacian (with one Richardson step) at scattered interior points, and
// takes the data on the rim. This shares no code with the exact check.
func TestDiskFiniteDifference(t *testing.T) {
	cases := []struct {
		equation, radius, bc string
	}{
		{"lap(u) = 6r*sin(theta)", "2", "u = 4sin(3theta)"},
		{"lap(u) = x^2*y - 3", "1.5", "u = x*y + cos(theta)^3"},
		{"lap(u) = ln(r)*cos(2theta) + r^(1/2)", "1", "u = 1 + sin(5theta)"},
		{"lap(u) = r^2*cos(4theta)", "3/2", "u = 0"},
		{"lap(u) = cos(theta)/r", "2", "u = y"},
	}
	rng := rand.New(rand.NewSource(5))
	for _, c := range cases {
		sol := solveDisk(t, c.equation, c.radius, []string{c.bc}, nil)
		u := mustCompile(t, expr(t, sol.U.Text()))
		f := mustCompile(t, expr(t, mustSource(t, c.equation)))
		g := mustCompile(t, expr(t, strings.TrimPrefix(c.bc, "u = ")))
		R := mustFloat(t, c.radius)
		cart := func(x, y float64) float64 { return u.At(math.Hypot(x, y), math.Atan2(y, x)) }
		for i := 0; i < 20; i++ {
			r, th := R*(0.15+0.75*rng.Float64()), 2*math.Pi*rng.Float64()
			x, y := r*math.Cos(th), r*math.Sin(th)
			lap := func(h float64) float64 {
				return (cart(x+h, y) + cart(x-h, y) + cart(x, y+h) + cart(x, y-h) - 4*cart(x, y)) / (h * h)
			}
			h := 1e-2 * R
			fd := (4*lap(h/2) - lap(h)) / 3 // Richardson: removes the O(h²) term
			want := f.At(r, th)
			if math.Abs(fd-want) > 1e-6*math.Max(1, math.Abs(want)) {
				t.Errorf("%s at (%.3f, %.3f): FD Laplacian %.9g, f = %.9g", c.equation, r, th, fd, want)
			}
			if d := math.Abs(u.At(R, th) - g.At(R, th)); d > 1e-12*math.Max(1, math.Abs(g.At(R, th))) {
				t.Errorf("%s: rim value at θ = %.3f off by %g", c.equation, th, d)
			}
		}
	}
}

func mustSource(t testing.TB, equation string) string {
	f, err := parse.Equation(equation, nil)
	if err != nil {
		t.Fatal(err)
	}
	return f.Text()
}

func mustCompile(t testing.TB, s series.Sum) series.Compiled {
	c, err := s.Compile(nil)
	if err != nil {
		t.Fatal(err)
	}
	return c
}

func mustFloat(t testing.TB, s string) float64 {
	v, err := expr(t, s).Eval(1, 0, nil)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

func TestDiskRefusals(t *testing.T) {
	cases := []struct {
		equation, bc, want string
	}{
		{"lap(u) = 1/r^2", "u = 0", "not integrable"},
		{"lap(u) = r^(-5/2)*cos(theta)", "u = 0", "not integrable"},
		{"lap(u) = theta", "u = 0", "no closed-form particular solution"},
	}
	for _, c := range cases {
		_, err := trySolveDisk(c.equation, "1", []string{c.bc}, nil)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s with %s: %v, want %q", c.equation, c.bc, err, c.want)
		}
	}
}

// BenchmarkSolveDisk is a five-term closed-form disk problem, from lowered
// values to the verified solution (parsing has its own benchmark).
func BenchmarkSolveDisk(b *testing.B) {
	f, err := parse.Equation("lap(u) = 6r*sin(theta) - 2 + ln(r) + r^2*cos(4theta) + r^(1/2)*cos(2theta)", nil)
	if err != nil {
		b.Fatal(err)
	}
	d := domain.Disk{R: series.IntCoef(2)}
	c, err := parse.Condition("u = 4sin(3theta) + x*y", d.Sides(), nil)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := domain.Solve(d, f, []domain.Condition{c}); err != nil {
			b.Fatal(err)
		}
	}
}
