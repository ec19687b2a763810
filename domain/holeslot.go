package domain

import "math"

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
// them (1.3 apart for 5:1). ok is false for a hole less elongated than
// slotAspect, or where the centre or the segment between the foci (the
// terms' branch cut) leaves the hole.
func slotMap(xs, ys []float64) (c, focus complex128, span float64, ok bool) {
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
	focus = dir * complex(math.Sqrt(A*A-B*B), 0)
	for s := -32; s <= 32; s++ {
		p := c + focus*complex(float64(s)/32, 0)
		if !insidePolygon(xs, ys, real(p), imag(p)) || edgeDistance(xs, ys, real(p), imag(p)) < 1e-3*B {
			return 0, 0, 0, false
		}
	}
	return c, focus, A + B, true
}
