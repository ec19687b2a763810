package domain

import (
	"math"
	"math/cmplx"
)

// slotAspect is the elongation from which a polygonal hole's terms are
// powers of an ellipse's exterior map rather than of 1/(z − c).
const slotAspect = 1.5

// slotMap is the exterior map an elongated polygonal hole takes its terms
// from: the ellipse with the hole's half-extents A ≥ B along its principal
// axes (those of its area's second moments), centred in those extents,
// whose foci c ± f, f = √(A² − B²), lie on the major axis. The Laurent
// series in ρ/(z − c) about one point cannot serve a slot: its terms at the
// flanks, a half-width from c, are (A/B)^j times those at the ends, so a
// 5:1 slot's fit diverged (a residual of 1e5 for data of size 10). The
// ellipse's terms w^(−j), w = (ζ + √(ζ − f)·√(ζ + f))/(A + B), are level on
// confocal ellipses, and a rectangle's sides and corners lie between two of
// them (1.3 apart for 5:1). Where the segment between the foci (the
// terms' branch cut) leaves the hole, as a parallelogram's does by its
// acute corners, the foci move in, by twentieths down to 0.6 of f, until
// it stays inside; m is then A + √(A² − f²), so that |w| = 1 on the
// confocal ellipse through the slot's ends (a 10:1 parallelogram was
// refused, its series about the centre diverging, residual 1.7e3). ok is
// false for a hole less elongated than slotAspect, or where the centre or
// that segment at 0.6 of f leaves the hole.
//
// With fits (the spread pivot's test, spreadFits), a focus is taken only
// where fits holds, and a shortened one only where its segment keeps half
// of B from every edge. A slot with pointed tips on its axis has them
// beside the full foci, where the spread pivot fails (spreadFits); with the
// foci moved in until they are clear, the spread serves it: a 10:1 hexagon
// took 12 s about its centre, 1.6 s so. A blunt narrow end is another
// matter: a 6:1 trapezium's foci moved in by a tenth ran 0.012 (a quarter
// of B) from its flanks, and the fit was refused at 1.4e-6.
func slotMap(xs, ys []float64, fits func(c, focus complex128) bool) (c, focus complex128, span float64, ok bool) {
	n := len(xs)
	var area, cx, cy float64
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		cross := xs[k]*ys[j] - xs[j]*ys[k]
		area += cross / 2
		cx += (xs[k] + xs[j]) * cross / 6
		cy += (ys[k] + ys[j]) * cross / 6
	}
	if area == 0 {
		return 0, 0, 0, false
	}
	cx, cy = cx/area, cy/area
	// ∫x², ∫y², ∫xy over the polygon about its centroid (signed with the
	// orientation, which the ratio below does not see).
	var sxx, syy, sxy float64
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		x0, y0, x1, y1 := xs[k]-cx, ys[k]-cy, xs[j]-cx, ys[j]-cy
		cross := x0*y1 - x1*y0
		sxx += cross * (x0*x0 + x0*x1 + x1*x1) / 12
		syy += cross * (y0*y0 + y0*y1 + y1*y1) / 12
		sxy += cross * (x0*y1 + 2*x0*y0 + 2*x1*y1 + x1*y0) / 24
	}
	dir := complex(math.Cos(math.Atan2(2*sxy, sxx-syy)/2), math.Sin(math.Atan2(2*sxy, sxx-syy)/2))
	lo, hi, loN, hiN := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	for k := 0; k < n; k++ {
		v := complex(xs[k]-cx, ys[k]-cy) / dir // in the principal frame
		lo, hi = math.Min(lo, real(v)), math.Max(hi, real(v))
		loN, hiN = math.Min(loN, imag(v)), math.Max(hiN, imag(v))
	}
	A, B := (hi-lo)/2, (hiN-loN)/2
	if B <= 0 || A < slotAspect*B {
		return 0, 0, 0, false
	}
	c = complex(cx, cy) + dir*complex((hi+lo)/2, (hiN+loN)/2)
	inside := func(focus complex128, clearance float64) bool {
		if fits != nil && !fits(c, focus) {
			return false
		}
		for s := -32; s <= 32; s++ {
			p := c + focus*complex(float64(s)/32, 0)
			if !insidePolygon(xs, ys, real(p), imag(p)) || edgeDistance(xs, ys, real(p), imag(p)) < clearance {
				return false
			}
		}
		return true
	}
	if focus = dir * complex(math.Sqrt(A*A-B*B), 0); inside(focus, 1e-3*B) {
		return c, focus, A + B, true
	}
	clearance := 1e-3 * B
	if fits != nil {
		clearance = B / 2
	}
	for t := 0.95; t > 0.55; t -= 0.05 {
		f := t * math.Sqrt(A*A-B*B)
		if focus = dir * complex(f, 0); inside(focus, clearance) {
			return c, focus, A + math.Sqrt(A*A-f*f), true
		}
	}
	return 0, 0, 0, false
}

// spreadZeta is a slot corner's power variable ζ and dζ/dz: the pivot of
// (z − w)/(z − p) spread over the slot's focal segment. A point pivot at
// the slot's centre lies a half-width from its flanks and ten half-widths
// from a 10:1 slot's corners: |ζ| reached 10 at the flanks' middles, the
// powers ζ^β were spikes there, and the fit stalled near 1e-11 at a flank
// (2.5 s). Spread, log ζ = log(z − w) − Φ(z), Φ the logarithmic potential
// ∫ log(z − t) dμ(t) of the semicircle density μ(t) = 2√(f² − t²)/(πf²) on
// the segment [c − f·e, c + f·e] (e the major axis). With s = √(ζ₁² − f²),
// ζ₁ = (z − c)/e, on the branch of variable, and T = e·(ζ₁ + s) (≈ 2(z − c)
// far out):
//
//	Φ(z) = log T + (z − c)/T + const,  Φ'(z) = 2/T,
//	ζ = ((z − w)/T)·exp(−(z − c)/T),   dζ/dz = (exp(−(z − c)/T)/T)·(1 − 2(z − w)/T).
//
// (∫ √(f² − t²)/(z − t) dt = π(z − √(z² − f²)) on [−f, f], and
// z − s = f²/(z + s), without the cancellation far out.) As f → 0 it is the
// centre's pivot, times e^(−1/2)/2. The semicircle rather than the
// segment's equilibrium density (1/T alone): that one's 1/√ ends made the
// foci, a slot's half-width from its ends, a square-root singularity of
// every power, and its fits stalled near there. ζ vanishes only at w and
// is analytic outside the segment; the principal branch's cut runs from w
// to the segment, inside the hole where spreadCutInside says so.
func (hb holeBasis) spreadZeta(z, w complex128) (complex128, complex128) {
	v, _ := hb.variable(z) // v = 1/w_map, T = e·span/v
	t := hb.axis() * complex(hb.span, 0) / v
	rt := recip(t)
	e := cmplx.Exp(-(z - hb.c) * rt)
	return (z - w) * rt * e, e * rt * (1 - 2*(z-w)*rt)
}

// spreadFits reports whether a slot's corners take the spread pivot
// (spreadZeta): every vertex at least half the slot's half-width B from
// both ends of the focal segment, as a rectangle's corners are (at
// √((A − f)² + B²) ≥ B; a 10:1 quadrilateral with no two sides parallel,
// at 0.65 B, took 1.2 s spread and 11 s about its centre). The semicircle's ends are singular points of every
// spread power; a vertex beside one, as a pointed tip on the axis is,
// meets that singularity within its own expansion's reach. A hexagonal
// slot with such tips stopped at 3.9e-11 where the centre's pivot reached
// 1.5e-12; a 6:1 trapezium whose narrow end (its half-height a fifth of
// B) lies 0.01 from a focus was refused at 1.7e-9 (2.9e-12 about the
// centre); a rhombus and a wedge were worse too. Such holes keep the
// centre's pivot.
func spreadFits(xs, ys []float64, c, focus complex128) bool {
	if focus == 0 {
		return false
	}
	dir := focus / complex(abs(focus), 0)
	lo, hi := math.Inf(1), math.Inf(-1)
	for k := range xs { // the half-width across the major axis
		v := imag((complex(xs[k], ys[k]) - c) / dir)
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	half := (hi - lo) / 2
	for k := range xs {
		w := complex(xs[k], ys[k])
		if abs(w-(c+focus)) < half/2 || abs(w-(c-focus)) < half/2 {
			return false
		}
	}
	return true
}

// spreadCutInside reports whether the principal cut of vertex k's spread
// variable (spreadZeta) stays inside the polygonal hole: it leaves the
// vertex into the hole, and ζ's argument runs without a jump along the
// hole's sides (the cut, a curve from the vertex to the focal segment,
// would cross a side to leave). A hole that fails keeps its centre's pivot.
func spreadCutInside(xs, ys []float64, k int, hb holeBasis) bool {
	n := len(xs)
	w := complex(xs[k], ys[k])
	size := hb.span
	_, dz := hb.spreadZeta(w, w)
	start := w - complex(1e-6*size, 0)*cmplx.Conj(dz)/complex(abs(dz), 0) // ζ ≈ ζ'(w)·(z − w): negative along −1/ζ'(w)
	if !insidePolygon(xs, ys, real(start), imag(start)) {
		return false
	}
	const per = 256
	prev := math.NaN()
	for j := 0; j < n; j++ {
		a, b := complex(xs[(k+j)%n], ys[(k+j)%n]), complex(xs[(k+j+1)%n], ys[(k+j+1)%n])
		for s := 0; s < per; s++ {
			if j == 0 && s == 0 {
				continue // the vertex itself, where ζ = 0
			}
			z := a + (b-a)*complex(float64(s)/per, 0)
			zeta, _ := hb.spreadZeta(z, w)
			arg := cmplx.Phase(zeta)
			if !math.IsNaN(prev) && math.Abs(arg-prev) > math.Pi {
				return false
			}
			prev = arg
		}
	}
	return true
}
