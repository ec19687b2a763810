package ansatz

import (
	"math"
	"math/big"
	"sort"
	"strings"

	"gonum.org/v1/gonum/dsp/fourier"

	"psol/series"
)

// Kink is the source term C·|ℓ|, ℓ = A·x + B·y + D a linear form with a
// nonzero gradient: the source of a heated slab whose sides are at
// different temperatures, a load that changes sign along a line. Its
// particular solution is closed:
//
//	v = C·|ℓ|³/(6(A² + B²)),  since d²/dℓ² |ℓ|³/6 = |ℓ| and |∇ℓ|² = A² + B²
//
// (common practice). v is twice continuously differentiable, so the
// harmonic part sees a smooth enough trace; no quadrature of the kinked
// source is needed (it took 10⁸ samples and a gigabyte for 1e-9).
//
// A step, Step set, is the source term C·step(ℓ), step(ℓ) = 1 where ℓ > 0
// and 0 where ℓ < 0 (a conductor heated on one side of a line; `cond ? a
// : b` with a linear comparison and constant branches lowers to it), with
//
//	v = C·max(ℓ, 0)²/(2(A² + B²)),  since d²/dℓ² max(ℓ, 0)²/2 = step(ℓ)
//
// (common practice): once continuously differentiable, its second
// derivative jumping on ℓ = 0, where a section's fit gathers poles.
type Kink struct {
	Step       bool
	C, A, B, D float64
	// Factor is C/(6(A² + B²)) exactly (a step's C/(2(A² + B²))), where
	// the source's numbers are, and Abs the abs(ℓ) node (a step's step(ℓ)):
	// the closed form prints as Factor·Abs³ (Factor·max(ℓ, 0)²).
	Factor series.Coef
	Abs    *series.Expr
	// LA, LB, LD are ℓ's coefficients exactly (the float ones above carry
	// the parameters' values), for the trace's exact coefficients.
	LA, LB, LD series.Coef
}

// Shifted is the kink in coordinates whose origin is the point (dx, dy):
// ℓ(x) = ℓ'(x − (dx, dy)), so D' = D + A·dx + B·dy (exactly, dx and dy
// taken as the rationals they are). Its text keeps the caller's ℓ.
func (k Kink) Shifted(dx, dy float64) Kink {
	k.D += k.A*dx + k.B*dy
	k.LD = k.LD.Add(k.LA.Mul(series.RatCoef(new(big.Rat).SetFloat64(dx)))).Add(k.LB.Mul(series.RatCoef(new(big.Rat).SetFloat64(dy))))
	return k
}

// Text is the closed form, Factor*abs(ℓ)^3 (a step's Factor*max(ℓ, 0)^2).
func (k Kink) Text() string {
	if k.Step {
		return k.timesText() + "max(" + series.TrimParens(k.Abs.Args()[0].Text()) + ", 0)^2"
	}
	return k.factorText() + "*" + k.Abs.Text() + "^3"
}

// LaTeX is the closed form in LaTeX.
func (k Kink) LaTeX() string {
	if k.Step {
		f := series.Const(k.Factor).LaTeX() + ` `
		if k.Factor.Equal(series.IntCoef(1)) {
			f = ""
		}
		arg := k.Abs.Args()[0].LaTeX()
		if in, ok := strings.CutPrefix(arg, `\left(`); ok && strings.HasSuffix(in, `\right)`) && !strings.Contains(in, `\left(`) {
			arg = strings.TrimSuffix(in, `\right)`)
		}
		return f + `\max\left(` + arg + `, 0\right)^{2}`
	}
	return series.Const(k.Factor).LaTeX() + ` ` + k.Abs.LaTeX() + `^{3}`
}

// Rule names the closed form for a step of the working.
func (k Kink) Rule() string {
	if k.Step {
		return "a step c*step(l), l linear in x and y: c*max(l, 0)^2/(2*|grad l|^2), once continuously differentiable"
	}
	return "a kink c*abs(l), l linear in x and y: c*abs(l)^3/(6*|grad l|^2), twice continuously differentiable"
}

// SourceText is the source term the kink solves, c*abs(ℓ), with c =
// Factor·6(A² + B²) exactly (a step's c*step(ℓ), c = Factor·2(A² + B²)).
func (k Kink) SourceText() string {
	n := int64(6)
	if k.Step {
		n = 2
	}
	c := k.Factor.Mul(k.LA.Mul(k.LA).Add(k.LB.Mul(k.LB))).MulRat(big.NewRat(n, 1))
	if c.Equal(series.IntCoef(1)) {
		return k.Abs.Text()
	}
	return "(" + series.Const(c).Text() + ")*" + k.Abs.Text()
}

func (k Kink) factorText() string { return "(" + series.Const(k.Factor).Text() + ")" }

// timesText is the factor and "*", or nothing for a factor of 1.
func (k Kink) timesText() string {
	if k.Factor.Equal(series.IntCoef(1)) {
		return ""
	}
	return k.factorText() + "*"
}

func (k Kink) form(x, y float64) float64 { return k.A*x + k.B*y + k.D }

func (k Kink) grad2() float64 { return k.A*k.A + k.B*k.B }

// ValueXY is v(x, y).
func (k Kink) ValueXY(x, y float64) float64 {
	if k.Step {
		l := math.Max(k.form(x, y), 0)
		return k.C * l * l / (2 * k.grad2())
	}
	l := math.Abs(k.form(x, y))
	return k.C * l * l * l / (6 * k.grad2())
}

// slope is dv/dℓ·/|∇ℓ|²: ∇v = slope·(A, B).
func (k Kink) slope(l float64) float64 {
	if k.Step {
		return k.C * math.Max(l, 0) / k.grad2()
	}
	return k.C * l * math.Abs(l) / (2 * k.grad2())
}

// AreaFlux is F·(nx, ny) at (x, y) for the field F = C·ℓ|ℓ|³/(24(A² +
// B²)²)·(A, B), whose divergence is v: ∫∫ v dA over a region is the
// integral of AreaFlux over its boundary (divergence theorem). An area rule
// across the line met v's jump in third derivative and left 1e-9; the
// boundary integrand is smooth but at the line's crossings.
func (k Kink) AreaFlux(x, y, nx, ny float64) float64 {
	l := k.form(x, y)
	g2 := k.grad2()
	if k.Step { // F = C·max(ℓ, 0)³/(6(A² + B²)²)·(A, B)
		p := math.Max(l, 0)
		return k.C * p * p * p / (6 * g2 * g2) * (k.A*nx + k.B*ny)
	}
	return k.C * l * l * l * math.Abs(l) / (24 * g2 * g2) * (k.A*nx + k.B*ny)
}

// Distance is the distance from (x, y) to the kink's line ℓ = 0.
func (k Kink) Distance(x, y float64) float64 { return math.Abs(k.form(x, y)) / math.Sqrt(k.grad2()) }

// GradientXY is ∇v at (x, y): C·ℓ|ℓ|/(2(A² + B²))·(A, B).
func (k Kink) GradientXY(x, y float64) (vx, vy float64) {
	g := k.slope(k.form(x, y))
	return g * k.A, g * k.B
}

// Crossings are the t in (0, 1) where the kink's line ℓ = 0 crosses the
// path at(t): sign changes of ℓ on n even steps, each narrowed by
// bisection to rounding, and the start itself where ℓ is 0 there. A
// crossing is where the trace of v, smooth elsewhere, has a jump in its
// third derivative (a step's: second): a fit to that trace needs its terms
// gathered there as at a corner.
func (k Kink) Crossings(at func(t float64) (x, y float64), n int) []float64 {
	l := func(t float64) float64 { x, y := at(t); return k.form(x, y) }
	var out []float64
	prev := l(0)
	if prev == 0 {
		// At the path's start: a closed curve's crossing there (x + y = 1
		// through the unit circle's (1, 0)) went unseen, and the fit, with
		// no poles at it, took 7.8 s for a kink and failed for a step.
		out = append(out, 0)
	}
	for j := 1; j <= n; j++ {
		t := float64(j) / float64(n)
		v := l(t)
		if v == 0 && j < n {
			out = append(out, t)
		} else if prev != 0 && (v < 0) != (prev < 0) && v != 0 {
			lo, hi := float64(j-1)/float64(n), t
			for it := 0; it < 60 && hi-lo > 1e-15; it++ {
				mid := (lo + hi) / 2
				if (l(mid) < 0) == (prev < 0) {
					lo = mid
				} else {
					hi = mid
				}
			}
			out = append(out, (lo+hi)/2)
		}
		prev = v
	}
	return out
}

// Value is v(r, θ).
func (k Kink) Value(r, theta float64) float64 {
	return k.ValueXY(r*math.Cos(theta), r*math.Sin(theta))
}

// Source is C·|ℓ| (a step's C·step(ℓ)) at (r, θ): Δv.
func (k Kink) Source(r, theta float64) float64 {
	l := k.form(r*math.Cos(theta), r*math.Sin(theta))
	if k.Step {
		return k.C * series.Step(l)
	}
	return k.C * math.Abs(l)
}

// Gradient is (∂v/∂r, ∂v/∂θ) at (r, θ): ∇v = C·ℓ|ℓ|/(2(A² + B²))·(A, B).
func (k Kink) Gradient(r, theta float64) (vr, vt float64) {
	c, s := math.Cos(theta), math.Sin(theta)
	g := k.slope(k.form(r*c, r*s))
	gx, gy := g*k.A, g*k.B
	return gx*c + gy*s, r * (gy*c - gx*s)
}

// breaks are the angles in [0, 2π) where the line ℓ = 0 meets the circle
// of radius r (none, one where it touches, or two), sorted.
func (k Kink) breaks(r float64) []float64 {
	// A r cos θ + B r sin θ = −D: ρ cos(θ − φ) = −D/r with ρ = |∇ℓ|.
	rho, phi := math.Sqrt(k.grad2()), math.Atan2(k.B, k.A)
	c := -k.D / (r * rho)
	if math.Abs(c) > 1 {
		return nil
	}
	d := math.Acos(c)
	var out []float64
	for _, t := range []float64{phi + d, phi - d} {
		t = math.Mod(t, 2*math.Pi)
		if t < 0 {
			t += 2 * math.Pi
		}
		out = append(out, t)
	}
	sort.Float64s(out)
	return out
}

// arcNodes are Gauss–Legendre nodes and weights on [0, 2π) split at the
// breaks, each arc in panels of at most 2π/64: v is a polynomial in cos θ
// and sin θ between the breaks, integrated to rounding.
func arcNodes(breaks []float64) (th, w []float64) { return arcNodesFor(breaks, 64) }

// arcNodesFor is arcNodes with panels of at most 2π/panels: a rule for
// the modes up to about 4·panels (16 nodes to a panel resolve its ~4
// periods of the highest mode).
func arcNodesFor(breaks []float64, panels int) (th, w []float64) {
	edges := append([]float64{0}, breaks...)
	edges = append(edges, 2*math.Pi)
	for i := 0; i+1 < len(edges); i++ {
		lo, hi := edges[i], edges[i+1]
		if hi <= lo {
			continue
		}
		n := int(math.Ceil((hi - lo) / (2 * math.Pi / float64(panels))))
		for p := 0; p < n; p++ {
			a, b := lo+(hi-lo)*float64(p)/float64(n), lo+(hi-lo)*float64(p+1)/float64(n)
			for j, x := range GaussX {
				th = append(th, (a+b)/2+(b-a)/2*x)
				w = append(w, GaussW[j]*(b-a)/2)
			}
		}
	}
	return th, w
}

// Modes are the Fourier coefficients of v and of ∂v/∂r on the circle of
// radius r, [k][0] of cos kθ and [k][1] of sin kθ, k = 0..top, by an FFT of
// 8·top samples (at least 2¹⁴): v has a jump only in its third derivative,
// so its coefficients fall like k⁻⁴ and the aliased ones, from k ≥ 7·top,
// are below 10⁻¹⁶ of the largest.
func (k Kink) Modes(r float64, top int) (p, dp [][2]float64) {
	n := max(1<<14, 8*top)
	vals, slopes := make([]float64, n), make([]float64, n)
	for i := range vals {
		t := 2 * math.Pi * float64(i) / float64(n)
		vals[i] = k.Value(r, t)
		slopes[i], _ = k.Gradient(r, t)
	}
	fft := fourier.NewFFT(n)
	cv, cs := fft.Coefficients(nil, vals), fft.Coefficients(nil, slopes)
	p, dp = make([][2]float64, top+1), make([][2]float64, top+1)
	for m := 0; m <= top; m++ {
		f := 2 / float64(n)
		if m == 0 {
			f = 1 / float64(n)
		}
		// The FFT's coefficient is Σ x_j e^(−2πijm/n): a_m = f·Re, b_m = −f·Im.
		p[m] = [2]float64{f * real(cv[m]), -f * imag(cv[m])}
		dp[m] = [2]float64{f * real(cs[m]), -f * imag(cs[m])}
	}
	return p, dp
}

// Integrals are ∬ C|ℓ| dA and ∬ v dA over a < r < R, θ0 < θ < θ1, by
// Gauss–Legendre in r on panels graded towards where the line touches a
// circle and in θ between each ring's crossings (and θ0, θ1).
func (k Kink) Integrals(a, R, theta0, theta1 float64) (source, particular float64) {
	// Radial panels: 30 on each side of where the line touches a circle,
	// halving towards that radius, where the crossings move like a square
	// root of the distance; 16 equal ones where it touches none.
	edges := []float64{a, R}
	if t := math.Abs(k.D) / math.Sqrt(k.grad2()); t > a && t < R {
		edges = []float64{a}
		for j := 30; j >= 1; j-- {
			edges = append(edges, t-(t-a)*math.Pow(0.5, float64(j)))
		}
		edges = append(edges, t)
		for j := 1; j <= 30; j++ {
			edges = append(edges, t+(R-t)*math.Pow(0.5, float64(31-j)))
		}
		edges = append(edges, R)
		sort.Float64s(edges)
	}
	for i := 0; i+1 < len(edges); i++ {
		lo, hi := edges[i], edges[i+1]
		panels := 1
		if len(edges) == 2 {
			panels = 16
		}
		for pn := 0; pn < panels; pn++ {
			pa, pb := lo+(hi-lo)*float64(pn)/float64(panels), lo+(hi-lo)*float64(pn+1)/float64(panels)
			for j, x := range GaussX {
				r := (pa+pb)/2 + (pb-pa)/2*x
				wr := GaussW[j] * (pb - pa) / 2 * r
				th, w := arcNodes(withEnds(k.breaks(r), theta0, theta1))
				for m, t := range th {
					if t < theta0 || t > theta1 {
						continue
					}
					source += wr * w[m] * k.Source(r, t)
					particular += wr * w[m] * k.Value(r, t)
				}
			}
		}
	}
	return source, particular
}

// withEnds adds the ends of a range in [0, 2π] to the breaks, so that no
// panel straddles them.
func withEnds(breaks []float64, theta0, theta1 float64) []float64 {
	out := append([]float64(nil), breaks...)
	for _, t := range []float64{theta0, theta1} {
		if t > 0 && t < 2*math.Pi {
			out = append(out, t)
		}
	}
	sort.Float64s(out)
	return out
}

// Flux is ∫ ∂v/∂r r dθ over θ0 < θ < θ1 on the circle of radius r.
func (k Kink) Flux(r, theta0, theta1 float64) float64 {
	th, w := arcNodes(withEnds(k.breaks(r), theta0, theta1))
	total := 0.0
	for i, t := range th {
		if t < theta0 || t > theta1 {
			continue
		}
		vr, _ := k.Gradient(r, t)
		total += w[i] * vr * r
	}
	return total
}
