package domain

import (
	"math"
	"math/big"

	"psol/series"
	"psol/series/cart"
)

// rectSideFluxes are the outward fluxes ∫ ∂u/∂n ds through the rectangle's
// sides: the polynomial part exactly, each side series term by term in
// closed form (fluxes). The panels of differences that serve other regions
// (sideFluxes) erred by 1e-8 here, next to corners where the series
// converge slowly, and printed those digits. ok is false where some part
// has no such form (waves, a quadrature) or a sum does not settle: the
// caller falls back on panels. A Robin side's numeric eigenfunctions take
// the same closed forms (EigenSide.fluxes): by panels they erred by 1e-5.
func (rp *RectParts) rectSideFluxes(ev *Evaluator, env series.Env, tol float64) ([]SideFlux, bool) {
	if ev.waves != nil || rp.Quadrature != nil {
		return nil, false
	}
	var series4 [4]float64
	for _, s := range ev.rect {
		fl, ok := s.(interface {
			fluxes(tol float64, maxTerms int) ([4]float64, bool)
		})
		if !ok {
			return nil, false
		}
		f, ok := fl.fluxes(tol, 1<<20)
		if !ok {
			return nil, false
		}
		for w := range series4 {
			series4[w] += f[w]
		}
	}
	var out []SideFlux
	for _, e := range rectEdges {
		c, err := rp.d.polyFlux(rp.Particular, e).Subst(env)
		if err != nil {
			return nil, false
		}
		v, err := c.Float(env)
		if err != nil {
			return nil, false
		}
		f := SideFlux{Side: e.name, Value: v + series4[e.wall]}
		if len(ev.rect) == 0 {
			f.Exact = &c
		}
		out = append(out, f)
	}
	return out, true
}

// polyFlux is the exact outward flux of the polynomial p through side e:
// ∫ (∇p·n) along it.
func (d Rect) polyFlux(p cart.Poly, e rectEdge) series.Coef {
	var dn cart.Poly // ∂p/∂n on the side, a polynomial in the coordinate along it
	length := d.L
	if e.alongY {
		length = d.H
		at := series.Coef{}
		if e.far {
			at = d.L
		}
		dn = p.DX().AtX(at).Scale(series.IntCoef(int64(e.normal[0])))
	} else {
		at := series.Coef{}
		if e.far {
			at = d.H
		}
		dn = p.DY().AtY(at).Scale(series.IntCoef(int64(e.normal[1])))
	}
	total := series.Coef{}
	for _, t := range dn.Terms() { // one of t.I, t.J is 0 after the restriction
		k := t.I + t.J
		lp, _ := length.Pow(big.NewRat(int64(k+1), 1))
		total = total.Add(t.C.Mul(lp).MulRat(big.NewRat(1, int64(k+1))))
	}
	return total
}

// fluxes are the series' outward fluxes through the four walls (indexed by
// Wall). A term b·T(ks)·A(d) — T sin or cos along the side (s from 0 to ℓ),
// A the across factor (d from the opposite wall, 0, to the side's own, w) —
// sends b·A′(w)·∫T through its own wall, −b·A′(0)·∫T through the opposite
// one, and ∓b·T′·∫A through the walls at s = 0 and s = ℓ, each in closed
// form. ok is false where a sum has not settled in maxTerms terms (data
// that jump at a corner, whose fluxes the report marks infinite).
func (c *CompiledSide) fluxes(tol float64, maxTerms int) (out [4]float64, ok bool) {
	if c.zero {
		return out, true
	}
	e := rectEdges[c.side]
	own, opposite := c.side, edgeNamed(e.away).wall
	start, end := edgeNamed(e.start).wall, edgeNamed(e.end).wall
	if c.b0 != 0 { // the constant mode: A = 1 (no flux), d, or d/w, with T = 1
		slope := 0.0
		switch {
		case c.insulated:
		case c.flux:
			slope = 1
		default:
			slope = 1 / c.w
		}
		out[own] += c.b0 * slope * c.l
		out[opposite] -= c.b0 * slope * c.l
	}
	if c.constantOnly {
		return out, true
	}
	n0 := max(c.from, 1)
	var stops [4]stopRule
	for i := range stops {
		stops[i].runs = 8
	}
	// The terms fall like a power of n (n⁻³ for data that meet at the
	// corners), so a sum to 1e-12 takes a million of them. Aitken's Δ² on
	// the partial sums at n = 64, 128, 256, … takes the power's tail exactly
	// (S_N = S − C·N^(−q)); two extrapolations in a row that agree within
	// tol settle the sum.
	var sums [4]float64
	var at [4][]float64 // the partial sums at the checkpoints
	var prevX [4]float64
	havePrev := false
	next := 64
	for n := n0; n < c.from+maxTerms; n++ {
		b := c.b(float64(n)) // not coef: a million cached terms a side
		k := (c.slope*float64(n) + c.offset) * math.Pi / c.l
		kw := k * c.w
		// ∫T over the side, T′ at its two ends.
		var intT, dT0, dTl float64
		if c.sin {
			intT, dT0, dTl = (1-math.Cos(k*c.l))/k, k, k*math.Cos(k*c.l)
		} else {
			intT, dT0, dTl = math.Sin(k*c.l)/k, 0, -k*math.Sin(k*c.l)
		}
		// A′(w), A′(0) and ∫A over [0, w] (the forms of across, kept finite
		// for large k).
		var dAw, dA0, intA float64
		q := math.Exp(-2 * kw) // e^(−2kw)
		sech := 2 * math.Exp(-kw) / (1 + q)
		csch := 2 * math.Exp(-kw) / (1 - q)
		switch {
		case c.insulated && c.flux:
			dAw, dA0, intA = 1, 0, 1/(k*k)
		case c.insulated:
			dAw, dA0, intA = k*(1-q)/(1+q), 0, (1-q)/(1+q)/k
		case c.flux:
			dAw, dA0, intA = 1, sech, (1-sech)/(k*k)
		default:
			dAw, dA0, intA = k*(1+q)/(1-q), k*csch, math.Tanh(kw/2)/k
		}
		terms := [4]float64{}
		terms[own] = b * dAw * intT
		terms[opposite] = -b * dA0 * intT
		terms[start] = -b * dT0 * intA
		terms[end] = b * dTl * intA
		direct := true
		for w, t := range terms {
			sums[w] += t
			if !stops[w].small(float64(n)*math.Abs(t), sums[w], tol) {
				direct = false
			}
		}
		if direct {
			for w := range out {
				out[w] += sums[w]
			}
			return out, true
		}
		if n != next {
			continue
		}
		next *= 2
		settled, x := havePrev, [4]float64{}
		for w := range at {
			at[w] = append(at[w], sums[w])
			m := len(at[w])
			if m < 3 {
				settled = false
				continue
			}
			x[w] = series.Aitken(at[w][m-3], at[w][m-2], at[w][m-1])
			if !(math.Abs(x[w]-prevX[w]) <= tol*math.Max(1, math.Abs(x[w]))) {
				settled = false
			}
		}
		if settled {
			for w := range out {
				out[w] += x[w]
			}
			return out, true
		}
		prevX, havePrev = x, len(at[0]) >= 3
	}
	return out, false
}

// fluxes are the numeric series' outward fluxes through the four walls,
// term by term as for the exact family: X_n = cos(μs − δ) along the side
// (∫X = (sin(μℓ − δ) + sin δ)/μ, X′ = −μ sin(μs − δ)) and the across factor
// (P·e^(μ(d − w)) + M·e^(−μ(d + w)))/den of across, whose derivative and
// integral are as plain; the constant mode's factor is linear. Its modes
// are the ones computed (Modes), as everywhere it is summed.
func (e *EigenSide) fluxes(tol float64, maxTerms int) (out [4]float64, ok bool) {
	l, w := e.along()
	edge := rectEdges[e.Wall]
	own, opposite := e.Wall, edgeNamed(edge.away).wall
	start, end := edgeNamed(edge.start).wall, edgeNamed(edge.end).wall
	a, b := e.own()
	if e.constant && e.b0 != 0 { // X = 1 and across0 linear in d: its slope is its rise over w
		slope := (e.across0(w) - e.across0(0)) / w
		out[own] += e.b0 * slope * l
		out[opposite] -= e.b0 * slope * l
	}
	// The partial sums at 64, 128, … modes, for Aitken's Δ² on their tail
	// (as in CompiledSide.fluxes; here the modes end at those computed).
	var at [4][]float64
	sums := out
	checkpoint := func(n int) {
		if n&(n-1) != 0 || n < 64 {
			return
		}
		for w := range at {
			at[w] = append(at[w], sums[w])
		}
	}
	for n := 0; n < len(e.b) && n < maxTerms; n++ {
		checkpoint(n)
		mu, delta, c := e.mu[n], e.delta[n], e.b[n]
		if c == 0 {
			continue
		}
		var P, M float64
		switch e.Opposite.Kind {
		case Dirichlet:
			P, M = 0.5, -0.5
		case Neumann:
			P, M = 0.5, 0.5
		default:
			P, M = (mu+e.Opposite.H)/2, (mu-e.Opposite.H)/2
		}
		ew := math.Exp(-mu * w)
		den := (a+b*mu)*P + (a-b*mu)*M*ew*ew
		dAw := mu * (P - M*ew*ew) / den
		dA0 := mu * (P - M) * ew / den
		intA := (P*(1-ew) + M*(ew-ew*ew)) / (mu * den)
		intX := (math.Sin(mu*l-delta) + math.Sin(delta)) / mu
		sums[own] += c * dAw * intX
		sums[opposite] -= c * dA0 * intX
		sums[start] -= c * mu * math.Sin(delta) * intA // outward at s = 0 is −∂s: −X′(0) = −μ sin δ
		sums[end] += c * (-mu * math.Sin(mu*l-delta)) * intA
	}
	checkpoint(len(e.b))
	for w := range at {
		out[w] = sums[w]
		if m := len(at[w]); m >= 3 && math.Abs(at[w][m-1]-at[w][m-2]) < math.Abs(at[w][m-2]-at[w][m-3]) {
			out[w] = series.Aitken(at[w][m-3], at[w][m-2], at[w][m-1])
		}
	}
	return out, true
}
