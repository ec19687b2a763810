package domain

import (
	"math"
	"math/big"
	"sort"

	"psol/ansatz"

	"psol/series"
	"psol/series/cart"
)

// Ellipse is the region x²/A² + y²/B² < 1; its one side is the rim.
type Ellipse struct{ A, B series.Coef }

func (Ellipse) Sides() []string { return []string{"rim"} }

func (e Ellipse) Describe() string {
	return "the ellipse x^2/" + paren(e.A.Text()) + "^2 + y^2/" + paren(e.B.Text()) + "^2 < 1"
}

func (e Ellipse) Contains(r, theta float64, env series.Env) (bool, error) {
	v, err := floats(env, e.A, e.B)
	if err != nil {
		return false, err
	}
	x, y := r*math.Cos(theta)/v[0], r*math.Sin(theta)/v[1]
	return x*x+y*y <= 1+1e-12, nil
}

// Shape: the rim counter-clockwise from (A, 0), by arc length like every
// side (the figures' panels take t as a fraction of the length).
func (e Ellipse) Shape(env series.Env) (Shape, error) {
	v, err := floats(env, e.A, e.B)
	if err != nil {
		return Shape{}, err
	}
	A, B := v[0], v[1]
	return Shape{Sides: []SidePath{ellipseRim(A, B)}, Area: math.Pi * A * B, Box: Box{-A, A, -B, B}}, nil
}

// ellipseRim is the rim (A cos τ, B sin τ) parametrised by arc length: a
// table of s(τ) at 256 nodes (16-point Gauss–Legendre between them), inverted
// by Newton's method with s'(τ) = |z'(τ)|.
func ellipseRim(A, B float64) SidePath {
	const nodes = 256
	speed := func(tau float64) float64 { return math.Hypot(A*math.Sin(tau), B*math.Cos(tau)) }
	arc := func(lo, hi float64) float64 {
		out := 0.0
		for j, x := range ansatz.GaussX {
			out += ansatz.GaussW[j] * speed((lo+hi)/2+(hi-lo)/2*x)
		}
		return out * (hi - lo) / 2
	}
	table := make([]float64, nodes+1) // s at τ_i = 2πi/nodes
	for i := 1; i <= nodes; i++ {
		table[i] = table[i-1] + arc(2*math.Pi*float64(i-1)/nodes, 2*math.Pi*float64(i)/nodes)
	}
	length := table[nodes]
	// τ at t, by Newton's method from the table.
	tauAt := func(t float64) float64 {
		s := t * length
		i := sort.SearchFloat64s(table, s) - 1
		i = max(0, min(i, nodes-1))
		lo := 2 * math.Pi * float64(i) / nodes
		tau := lo + (s-table[i])/speed(lo+math.Pi/nodes) // a first guess
		for it := 0; it < 6; it++ {
			tau -= (table[i] + arc(lo, tau) - s) / speed(tau)
		}
		return tau
	}
	// The even sampling is uniform in τ: t = s(τ)/length at τ = 2πu.
	even := func(u float64) float64 {
		tau := 2 * math.Pi * u
		i := max(0, min(int(u*nodes), nodes-1))
		return (table[i] + arc(2*math.Pi*float64(i)/nodes, tau)) / length
	}
	rate := func(u float64) float64 { return 2 * math.Pi * speed(2*math.Pi*u) / length }
	return SidePath{Name: "rim", Length: length, Even: even, EvenRate: rate, EvenOf: func(t float64) float64 { return tauAt(t) / (2 * math.Pi) },
		At: func(t float64) (x, y, nx, ny float64) {
			tau := tauAt(t)
			c, sn := math.Cos(tau), math.Sin(tau)
			l := math.Hypot(B*c, A*sn)
			return A * c, B * sn, B * c / l, A * sn / l
		}}
}

// ellipsePerimeter by the trapezoidal rule (spectrally accurate for a
// periodic integrand).
func ellipsePerimeter(A, B float64) float64 {
	const n = 512
	sum := 0.0
	for i := 0; i < n; i++ {
		t := 2 * math.Pi * float64(i) / n
		sum += math.Hypot(A*math.Sin(t), B*math.Cos(t))
	}
	return sum * 2 * math.Pi / n
}

// geometry: no corners; the polynomial alone converges geometrically on a
// smooth boundary.
func (e Ellipse) geometry(env series.Env) (sectionGeometry, error) {
	sh, err := e.Shape(env)
	if err != nil {
		return sectionGeometry{}, err
	}
	return sectionGeometry{shape: sh, starts: []int{-1}, ends: []int{-1}, scale: math.Max(sh.Box.X1, sh.Box.Y1)}, nil
}

// solve: exactly where the mathematics allows (values on the rim, a
// polynomial particular solution and polynomial data: the harmonic part is a
// polynomial of the data's degree), numerically otherwise.
func (e Ellipse) solve(p *posed) (*Solution, error) {
	if sol, ok := e.polynomialSolve(p); ok {
		return sol, nil
	}
	return solveSection(e, p)
}

// polynomialSolve finds h = d + q·E with E = x²/A² + y²/B² − 1, d = g − u_p
// on the rim and Δh = 0: Δ(q·E) = −Δd, a square linear system for q's
// coefficients (degree deg d − 2), solved exactly. The Dirichlet problem on
// an ellipse maps polynomials to polynomials of the same degree (common
// practice; the ellipsoid's Fischer decomposition), so the system has a
// solution; ok is false where the problem is not of this kind.
func (e Ellipse) polynomialSolve(p *posed) (*Solution, bool) {
	cond := p.conds["rim"]
	if p.rest != nil || cond.Kind != Dirichlet || !cond.G.IsExact() {
		return nil, false
	}
	up, rules, err := ansatz.Particular(p.f)
	if err != nil {
		return nil, false
	}
	upXY, err1 := cart.FromPolar(up)
	g, err2 := cart.FromPolar(cond.G.Exact)
	if err1 != nil || err2 != nil {
		return nil, false
	}
	d := g.Sub(upXY)
	a2, err3 := series.IntCoef(1).Div(e.A.Mul(e.A))
	b2, err4 := series.IntCoef(1).Div(e.B.Mul(e.B))
	if err3 != nil || err4 != nil {
		return nil, false
	}
	E := cart.Monomial(a2, 2, 0).Add(cart.Monomial(b2, 0, 2)).Sub(cart.Monomial(series.IntCoef(1), 0, 0))
	h := d
	if m := d.Degree() - 2; m >= 0 {
		type mono struct{ i, j int }
		var basis []mono
		for s := 0; s <= m; s++ {
			for i := 0; i <= s; i++ {
				basis = append(basis, mono{i, s - i})
			}
		}
		index := map[mono]int{}
		for k, b := range basis {
			index[b] = k
		}
		rows := make([][]series.Coef, len(basis))
		for r := range rows {
			rows[r] = make([]series.Coef, len(basis))
		}
		for c, b := range basis {
			for _, t := range cart.Monomial(series.IntCoef(1), b.i, b.j).Mul(E).Laplacian().Terms() {
				rows[index[mono{t.I, t.J}]][c] = t.C
			}
		}
		rhs := make([]series.Coef, len(basis))
		for _, t := range d.Laplacian().Terms() {
			rhs[index[mono{t.I, t.J}]] = t.C.Neg()
		}
		x, free, ok := series.SolveLinear(rows, rhs)
		if !ok || len(free) > 0 {
			return nil, false
		}
		q := cart.Poly{}
		for k, b := range basis {
			q = q.Add(cart.Monomial(x[k], b.i, b.j))
		}
		h = d.Add(q.Mul(E))
	}
	if !h.Laplacian().IsZero() {
		return nil, false
	}
	harmonic := h.Polar()
	u := up.Add(harmonic)
	sol := &Solution{Domain: e, Source: p.f, Particular: up, Harmonic: harmonic, U: u, Rules: rules}
	eq := Check{Name: "lap(u) - f", Exact: true, Residual: u.Laplacian().Sub(p.f)}
	sol.Checks = append(sol.Checks, eq)
	// u − g vanishes on the rim exactly when it is a multiple of E; here it
	// is h − d = q·E by construction, checked as a polynomial identity.
	rim := Check{Name: "u - g (a multiple of x^2/A^2 + y^2/B^2 - 1)", Side: "rim", Exact: true}
	if diff := upXY.Add(h).Sub(g).Sub(h.Sub(d)); !diff.IsZero() {
		rim.Residual = diff.Polar()
	}
	sol.Checks = append(sol.Checks, rim)
	sol.Sides = []Side{{Condition: cond, At: "rim", AtLaTeX: "rim", Data: cond.G.Exact, Trace: up, Correction: cond.G.Exact.Sub(up),
		DataText: g.Text(), DataLaTeX: g.LaTeX()}}
	sol.Steps = append(sol.Steps, "harmonic part: the polynomial h = (g - u_p) + q*(x^2/A^2 + y^2/B^2 - 1) with lap(h) = 0, q's coefficients by exact linear algebra")
	return sol, true
}

// Measures: the area πAB exactly; the perimeter, an elliptic integral, as a
// 15-digit decimal where the semi-axes are numbers.
func (e Ellipse) Measures() Measures {
	m := Measures{Area: series.SymCoef(series.Pi).Mul(e.A).Mul(e.B), Lengths: map[string]series.Coef{}}
	if v, err := floats(nil, e.A, e.B); err == nil {
		m.Lengths["rim"] = decimal(ellipsePerimeter(v[0], v[1]))
	}
	return m
}

// integral: ∬ x^(2a) y^(2b) dA = A^(2a+1) B^(2b+1) π (2a−1)!! (2b−1)!!/(2^(a+b) (a+b+1)!)
// (the unit disk's moments Γ(a+½)Γ(b+½)/Γ(a+b+2), scaled); odd powers vanish.
func (e Ellipse) integral(u series.Sum) (series.Coef, error) {
	poly, err := cart.FromPolar(u)
	if err != nil {
		return series.Coef{}, err
	}
	total := series.Coef{}
	for _, t := range poly.Terms() {
		if t.I%2 == 1 || t.J%2 == 1 {
			continue
		}
		a, b := t.I/2, t.J/2
		num := doubleFactorial(2*a-1) * doubleFactorial(2*b-1)
		den := int64(1) << (a + b)
		for k := 2; k <= a+b+1; k++ {
			den *= int64(k)
		}
		m := pow(e.A, t.I+1).Mul(pow(e.B, t.J+1)).Mul(series.SymCoef(series.Pi)).MulRat(big.NewRat(num, den))
		total = total.Add(t.C.Mul(m))
	}
	return total, nil
}

// areaCells: x = Aρ cos φ, y = Bρ sin φ, dA = AB ρ dρ dφ, 8 panels in ρ
// and 32 in φ.
func (e Ellipse) areaCells(env series.Env) ([]areaCell, error) {
	v, err := floats(env, e.A, e.B)
	if err != nil {
		return nil, err
	}
	return polarCells(0, 0, v[0], v[1], 1), nil
}

func doubleFactorial(n int) int64 {
	out := int64(1)
	for k := n; k > 1; k -= 2 {
		out *= int64(k)
	}
	return out
}

func (e Ellipse) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return sectionFigures(e, s, ev, rep, env)
}

func (e Ellipse) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return shapeClaimSide(e, side, cond, claim, env)
}

func (e Ellipse) samples(env series.Env) ([][2]float64, error) { return shapeSamples(e, env) }

func (Ellipse) printsInXY() bool { return true }

func (e Ellipse) containsXY(x, y float64, env series.Env) (bool, error) {
	return e.Contains(math.Hypot(x, y), math.Atan2(y, x), env)
}
