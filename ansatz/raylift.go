package ansatz

import (
	"math"
	"math/big"
	"psol/series"

	"gonum.org/v1/gonum/integrate/quad"
)

// RayLift is a closed part v = r²·Σ_j G_j(r)·A_j(θ) of a sector's particular
// solution, with G_j Chebyshev interpolants in r and A_j polynomials in θ,
// whose Laplacian
//
//	Δv = Σ_j [(4G_j + 5rG_j' + r²G_j”)·A_j(θ) + G_j·A_j”(θ)]
//
// a caller takes out of the source before the quadrature. A sector chooses
// the terms so that f − Δv vanishes on its Dirichlet rays (with its second
// θ-derivative, between two of them) and its slope vanishes on a Neumann
// ray, while v meets the ray conditions: the extension of f − Δv is then
// smooth to higher order there, and its modes fall like k⁻⁵ between two
// Dirichlet rays where the source's own fall like k⁻¹ (common practice:
// subtract the singular part before a Fourier expansion).
type RayLift struct {
	R     float64
	Terms []LiftTerm

	at    float64 // the radius of the cached radial factors
	cache []radialFactors
}

// LiftTerm is one r²·G(r)·A(θ) of a RayLift.
type LiftTerm struct {
	A      []float64 // A(θ) = Σ A[i]·θ^i
	cheb   []float64 // G on [0, R], in Chebyshev polynomials of 2r/R − 1
	d1, d2 []float64 // G' and G”
	a2     []float64 // A”
}

type radialFactors struct{ g, lap float64 } // G and 4G + 5rG' + r²G”

// Fit appends the term r²·G(r)·A(θ) with G the Chebyshev interpolant of g
// on [0, R], its degree doubled (16 to 128) until the top coefficients fall
// below tol of their total, and the coefficients below that dropped from the
// top: G” multiplies a coefficient of degree k by about k⁴, so noise in g
// must not reach the high degrees. A fit short of that still helps, since what it
// misses stays in f − Δv for the quadrature. A g whose coefficients sum
// to no more than floor adds nothing; one that is not finite somewhere on
// [0, R] adds nothing and reports false.
func (l *RayLift) Fit(g func(r float64) float64, A []float64, tol, floor float64) bool {
	var c []float64
	for n := 16; n <= 128; n *= 2 {
		c = chebFit(g, l.R, n)
		for _, x := range c {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				return false
			}
		}
		if chebConverged(c, tol) {
			c = chebChop(c, tol)
			break
		}
	}
	total := 0.0
	for _, x := range c {
		total += math.Abs(x)
	}
	if total <= floor { // g is 0 there: nothing to take out
		return true
	}
	t := LiftTerm{A: A, cheb: c, a2: polyDeriv(A, 2)}
	t.d1 = chebDerivative(c, l.R)
	t.d2 = chebDerivative(t.d1, l.R)
	l.Terms = append(l.Terms, t)
	l.cache = nil
	return true
}

// RadialLap is term i's 4G + 5rG' + r²G”, the factor of A in its Laplacian.
func (l *RayLift) RadialLap(i int, r float64) float64 {
	return l.factors(r)[i].lap
}

func (l *RayLift) factors(r float64) []radialFactors {
	if l.cache != nil && l.at == r {
		return l.cache
	}
	out := make([]radialFactors, len(l.Terms))
	for i, t := range l.Terms {
		g := chebAt(t.cheb, r, l.R)
		out[i] = radialFactors{g, 4*g + 5*r*chebAt(t.d1, r, l.R) + r*r*chebAt(t.d2, r, l.R)}
	}
	l.at, l.cache = r, out
	return out
}

// Value is v(r, θ).
func (l *RayLift) Value(r, theta float64) float64 {
	v := 0.0
	for i, f := range l.factors(r) {
		v += r * r * f.g * polyAt(l.Terms[i].A, theta)
	}
	return v
}

// Lap is Δv(r, θ), from the interpolants' own derivatives, so that it is
// the Laplacian of Value to rounding.
func (l *RayLift) Lap(r, theta float64) float64 {
	out := 0.0
	for i, f := range l.factors(r) {
		t := l.Terms[i]
		out += f.lap*polyAt(t.A, theta) + f.g*polyAt(t.a2, theta)
	}
	return out
}

// LapD is ∂^mΔv/∂θ^m(r, θ).
func (l *RayLift) LapD(r, theta float64, m int) float64 {
	out := 0.0
	for i, f := range l.factors(r) {
		t := l.Terms[i]
		out += f.lap*polyAt(polyDeriv(t.A, m), theta) + f.g*polyAt(polyDeriv(t.A, m+2), theta)
	}
	return out
}

// Radial is term i's r²G(r) and its r-derivative 2rG + r²G': the factors of
// A in v and ∂v/∂r.
func (l *RayLift) Radial(i int, r float64) (v, dv float64) {
	t := l.Terms[i]
	g, g1 := chebAt(t.cheb, r, l.R), chebAt(t.d1, r, l.R)
	return r * r * g, 2*r*g + r*r*g1
}

// Integrals are ∬Δv dA and ∬v dA over r < R, 0 < θ < alpha: the radial
// factors by a Gauss–Legendre rule exact for the interpolants' degree, the
// polynomials in θ exactly.
func (l *RayLift) Integrals(alpha float64) (source, particular float64) {
	for _, t := range l.Terms {
		n := len(t.cheb) + 4
		x, w := make([]float64, n), make([]float64, n)
		quad.Legendre{}.FixedLocations(x, w, 0, l.R)
		intA, intA2 := polyIntegral(t.A, alpha), polyIntegral(t.a2, alpha)
		for i, r := range x {
			g := chebAt(t.cheb, r, l.R)
			lap := 4*g + 5*r*chebAt(t.d1, r, l.R) + r*r*chebAt(t.d2, r, l.R)
			source += w[i] * r * (lap*intA + g*intA2)
			particular += w[i] * r * r * r * g * intA
		}
	}
	return source, particular
}

func polyAt(a []float64, x float64) float64 {
	v := 0.0
	for i := len(a) - 1; i >= 0; i-- {
		v = v*x + a[i]
	}
	return v
}

// polyDeriv is the m-th derivative of Σ a_i x^i.
func polyDeriv(a []float64, m int) []float64 {
	for ; m > 0 && len(a) > 0; m-- {
		d := make([]float64, len(a)-1)
		for i := range d {
			d[i] = float64(i+1) * a[i+1]
		}
		a = d
	}
	return a
}

// polyIntegral is ∫₀^x Σ a_i t^i dt.
func polyIntegral(a []float64, x float64) float64 {
	v := 0.0
	for i := len(a) - 1; i >= 0; i-- {
		v = v*x + a[i]/float64(i+1)
	}
	return v * x
}

// chebFit is the interpolant of f at the n + 1 Chebyshev extreme points of
// [0, R], as coefficients of T_k(2r/R − 1).
func chebFit(f func(float64) float64, R float64, n int) []float64 {
	v := make([]float64, n+1)
	for i := range v {
		v[i] = f(R * (1 + math.Cos(math.Pi*float64(i)/float64(n))) / 2)
	}
	c := make([]float64, n+1)
	for k := range c {
		s := 0.0
		for i, vi := range v {
			w := 1.0
			if i == 0 || i == n {
				w = 0.5
			}
			s += w * vi * math.Cos(math.Pi*float64(k*i%(2*n))/float64(n))
		}
		c[k] = 2 * s / float64(n)
	}
	c[0] /= 2
	c[n] /= 2
	return c
}

// chebConverged reports the last three coefficients below tol of the sum of
// all magnitudes.
func chebConverged(c []float64, tol float64) bool {
	total, top := 0.0, 0.0
	for k, x := range c {
		total += math.Abs(x)
		if k >= len(c)-3 {
			top = math.Max(top, math.Abs(x))
		}
	}
	return top <= tol*total
}

// chebChop drops the trailing coefficients below tol of the total.
func chebChop(c []float64, tol float64) []float64 {
	total := 0.0
	for _, x := range c {
		total += math.Abs(x)
	}
	n := len(c)
	for n > 1 && math.Abs(c[n-1]) <= tol*total {
		n--
	}
	return c[:n]
}

// chebDerivative is d/dr of Σ c_k T_k(2r/R − 1), by the recurrence
// c'_{k−1} = c'_{k+1} + 2k·c_k, scaled by 2/R.
func chebDerivative(c []float64, R float64) []float64 {
	n := len(c) - 1
	d := make([]float64, len(c)+1)
	for k := n; k >= 1; k-- {
		d[k-1] = d[k+1] + 2*float64(k)*c[k]
	}
	d[0] /= 2
	out := d[:len(c)]
	for k := range out {
		out[k] *= 2 / R
	}
	return out
}

// chebAt is Σ c_k T_k(t) by Clenshaw's recurrence, t = 2r/R − 1.
func chebAt(c []float64, r, R float64) float64 {
	t := 2*r/R - 1
	var b1, b2 float64
	for k := len(c) - 1; k >= 1; k-- {
		b1, b2 = 2*t*b1-b2+c[k], b1
	}
	return t*b1 - b2 + c[0]
}

// LiftRays builds a sector's RayLift for the source f on 0 < θ < sectorAngle,
// r < R, which leaves f − Δv smooth across each ray in the extension; angles
// are the exact θ-polynomials A_j of its terms, in order, for the arc trace. Per Dirichlet ray j it
// has a term r²G_j(r)·a_j(θ), G_j the source along the ray, with a_j” = 1 on
// ray j and 0 on the other ray, and, when both rays are Dirichlet, a term
// r²W_j(r)·B_j(θ), W_j the second θ-derivative there of what remains, with
// B_j” = a_j. Per Neumann ray j it has a term r²S_j(r)·c_j(θ), S_j the
// θ-derivative of the source there, with c_j”' = 1 on ray j. Each polynomial
// vanishes on the Dirichlet rays and is flat on the Neumann ones, and none
// disturbs the other ray's conditions (liftAngles). Derivatives of the
// source are central differences with one Richardson step.
func LiftRays(f func(r, th float64) float64, R float64, sectorAngle series.Coef, startD, endD bool, tol float64) (lift *RayLift, angles [][]series.Coef) {
	lift = &RayLift{R: R}
	alpha, _ := sectorAngle.Float(nil)
	float := func(p []series.Coef) []float64 {
		out := make([]float64, len(p))
		for i, c := range p {
			out[i], _ = c.Float(nil)
		}
		return out
	}
	// A term below 1e-13 of the source's size, or below the rounding of its
	// differences (about 10ε/d^m), is noise: a source that vanishes on its
	// Dirichlet rays needs no lift there.
	size := 0.0
	for i := 0; i <= 16; i++ {
		for j := 0; j <= 8; j++ {
			if v := math.Abs(f(R*float64(i)/16, alpha*float64(j)/8)); !math.IsNaN(v) && !math.IsInf(v, 0) {
				size = math.Max(size, v)
			}
		}
	}
	d := 1e-2 * math.Min(1, alpha)
	floor := func(m int) float64 { return size * math.Max(1e-13, 10*2.2e-16/math.Pow(d, float64(m))) }
	derivative := func(m int, r, th float64) float64 { // ∂^m f/∂θ^m, m = 0, 1, 2
		diff := func(d float64) float64 {
			if m == 1 {
				return (f(r, th+d) - f(r, th-d)) / (2 * d)
			}
			return (f(r, th+d) - 2*f(r, th) + f(r, th-d)) / (d * d)
		}
		if m == 0 {
			return f(r, th)
		}
		return (4*diff(d/2) - diff(d)) / 3
	}
	fit := func(m int, th float64, poly []series.Coef) bool {
		g := func(r float64) float64 { return derivative(m, r, th) - lift.LapD(r, th, m) }
		fitTol := tol
		if m > 0 { // differences carry about 1e-10 of noise: fit no finer
			fitTol = math.Max(tol, 1e-8)
		}
		n := len(lift.Terms)
		if !lift.Fit(g, float(poly), fitTol, floor(m)) {
			return false
		}
		if len(lift.Terms) > n {
			angles = append(angles, poly)
		}
		return true
	}
	rays := []struct {
		dirichlet bool
		th        float64
	}{{startD, 0}, {endD, alpha}}
	first, second := liftAngles(sectorAngle, startD, endD)
	for j, ray := range rays {
		m := 0
		if !ray.dirichlet {
			m = 1
		}
		if !fit(m, ray.th, first[j]) {
			return lift, angles // the source is not finite along a ray: what is fitted stands
		}
	}
	for j, ray := range rays {
		if !startD || !endD { // beside a Neumann ray B_j is large (5α⁴/24), and so is what remains
			break
		}
		if !fit(2, ray.th, second[j]) {
			return lift, angles
		}
	}
	return lift, angles
}

// liftAngles are LiftRays' exact θ-polynomials, coefficients of θ^i, for
// the start and end rays: first[j] is a_j (Dirichlet ray) or c_j (Neumann
// ray), second[j] is B_j (Dirichlet rays only). Each is the double integral
// of a base — a_j” 1 on ray j, 0 or flat on the other; c_j” with slope 1 on
// ray j, 0 or flat on the other, of mean 0 between two Neumann rays — with
// the constants that make it vanish on Dirichlet rays and flat on Neumann ones.
// LiftRays uses second only between two Dirichlet rays.
func liftAngles(alpha series.Coef, startD, endD bool) (first, second [2][]series.Coef) {
	inv, _ := series.IntCoef(1).Div(alpha)
	one, zero := series.IntCoef(1), series.Coef{}
	third, sixth, half := big.NewRat(1, 3), big.NewRat(1, 6), big.NewRat(1, 2)
	var base [2][]series.Coef
	switch {
	case startD && endD:
		base = [2][]series.Coef{{one, inv.Neg()}, {zero, inv}}
	case startD:
		base = [2][]series.Coef{{one}, {zero, one}}
	case endD:
		base = [2][]series.Coef{{alpha.Neg(), one}, {one}}
	default:
		base = [2][]series.Coef{{alpha.MulRat(third).Neg(), one, inv.MulRat(half).Neg()}, {alpha.MulRat(sixth).Neg(), zero, inv.MulRat(half)}}
	}
	twice := func(p []series.Coef) []series.Coef {
		out := make([]series.Coef, len(p)+2)
		for i, c := range p {
			out[i+2] = c.MulRat(big.NewRat(1, int64((i+1)*(i+2))))
		}
		pw := []series.Coef{one}
		for len(pw) < len(out) {
			pw = append(pw, pw[len(pw)-1].Mul(alpha))
		}
		value, slope := series.Coef{}, series.Coef{} // at θ = α
		for i, c := range out {
			value = value.Add(c.Mul(pw[i]))
			if i > 0 {
				slope = slope.Add(c.Mul(pw[i-1]).MulRat(big.NewRat(int64(i), 1)))
			}
		}
		switch {
		case startD && endD: // q(0) = q(α) = 0
			c1, _ := value.Div(alpha)
			out[1] = c1.Neg()
		case startD: // q(0) = 0, q'(α) = 0
			out[1] = slope.Neg()
		case endD: // q'(0) = 0, q(α) = 0
			out[0] = value.Neg()
		} // two Neumann rays: q'(0) = 0, and q'(α) = 0 by the base's mean 0
		return out
	}
	for j := range base {
		first[j] = twice(base[j])
		second[j] = twice(first[j])
	}
	return first, second
}
