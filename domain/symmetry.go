package domain

import (
	"math"
	"math/cmplx"

	"psol/ansatz"
)

// A section whose outline, holes and side data are all unchanged by some
// reflections has a harmonic part with the same symmetry: h(g(z)) = h(z) for
// every g of the group G the reflections generate (the problem's solution is
// unique, and h∘g solves it too). The fit then needs only the functions
// h = Σ_{g∈G} φ∘g, φ from the basis at the corners of one chamber (a
// fundamental domain: the wedge between two adjacent mirror lines), and
// rows only on the chamber's part of the boundary: |G| times fewer rows and
// about |G| times fewer columns, so the least-squares solve, which costs
// rows × columns², is about |G|³ times cheaper (64 times for a rectangle's
// two mirror lines). A thin-walled tube is the case that needs it: its fit
// is thousands of columns wide (common practice: a symmetry-adapted basis,
// as in group-theoretic methods for boundary-value problems).

// isometry is z ↦ rot·z + shift, or z ↦ rot·z̄ + shift where flip (|rot| = 1).
type isometry struct {
	rot, shift complex128
	flip       bool
}

// apply is g(z).
func (g isometry) apply(z complex128) complex128 {
	if g.flip {
		z = cmplx.Conj(z)
	}
	return g.rot*z + g.shift
}

// direction is g's linear part applied to a direction (a normal).
func (g isometry) direction(v complex128) complex128 {
	if g.flip {
		v = cmplx.Conj(v)
	}
	return g.rot * v
}

// after is g∘f.
func (g isometry) after(f isometry) isometry {
	out := isometry{flip: g.flip != f.flip, shift: g.apply(f.shift)}
	if g.flip {
		out.rot = g.rot * cmplx.Conj(f.rot)
	} else {
		out.rot = g.rot * f.rot
	}
	return out
}

// near reports whether g and f are the same map to rounding.
func (g isometry) near(f isometry, eps float64) bool {
	return g.flip == f.flip && abs(g.rot-f.rot) < 1e-9 && abs(g.shift-f.shift) < eps
}

// Matrix is g as real numbers: (x, y) ↦ (A·x + B·y + E, C·x + D·y + F).
func (g isometry) Matrix() [6]float64 {
	r, i := real(g.rot), imag(g.rot)
	if g.flip {
		return [6]float64{r, i, i, -r, real(g.shift), imag(g.shift)}
	}
	return [6]float64{r, -i, i, r, real(g.shift), imag(g.shift)}
}

// mirror is the reflection in the line through c along the unit direction d.
func mirror(c, d complex128) isometry {
	rot := d * d
	return isometry{rot: rot, shift: c - rot*cmplx.Conj(c), flip: true}
}

// symmetry is the group a section's problem is invariant under, with its
// chamber and each corner's representative there.
type symmetry struct {
	group  []isometry // the identity first
	centre complex128
	walls  []complex128 // the chamber's one or two walls' directions, counter-clockwise
	eps    float64
	rep    []int // rep[k]: the corner of corner k's orbit that lies in the chamber
}

// inChamber reports whether z lies in the closed chamber: left of the first
// wall's direction and, with two walls, right of the second's.
func (s *symmetry) inChamber(z complex128) bool {
	d := z - s.centre
	if imag(cmplx.Conj(s.walls[0])*d) < -s.eps {
		return false
	}
	return len(s.walls) < 2 || imag(cmplx.Conj(d)*s.walls[1]) >= -s.eps
}

// order is |G|, 1 without symmetry.
func (s *symmetry) order() int {
	if s == nil {
		return 1
	}
	return len(s.group)
}

// findSymmetry is the largest group of reflections, in mirror lines through
// the region's centroid at multiples of 15°, that maps the outline, every
// side's condition and given data (to within tolData), the source f (at the
// interior nodes) and every hole's centre onto themselves; nil if there is
// none. The sides must map onto sides, t ↦ 1 − t (t is proportional to arc
// length, and a reflection reverses it), or a closed side onto a closed side
// with a shift of t. The particular solution need not be symmetric
// (particularShift).
func findSymmetry(g *sectionGeometry, conds []sideCondition, tolData float64, interior [][3]float64, f func(x, y float64) float64) *symmetry {
	if g.mobius != nil || len(g.shape.Sides) == 0 {
		return nil // two circles: the bipolar series is fast already
	}
	c, ok := boundaryCentroid(g.shape)
	if !ok {
		return nil
	}
	eps := 1e-9 * g.scale
	var axes []float64
	for k := 0; k < 12; k++ {
		alpha := float64(k) * math.Pi / 12
		if invariantUnder(mirror(c, cmplx.Rect(1, alpha)), g, conds, eps, tolData, interior, f) {
			axes = append(axes, alpha)
		}
	}
	if len(axes) == 0 {
		return nil
	}
	// The chamber's walls: the two adjacent mirror lines closest in angle
	// (the group they generate is dihedral of order 2π/angle and contains
	// every mirror found).
	s := &symmetry{centre: c, eps: eps}
	walls := []float64{axes[0]}
	if len(axes) > 1 {
		best := math.Inf(1)
		for i := range axes {
			next := axes[(i+1)%len(axes)]
			if i+1 == len(axes) {
				next += math.Pi
			}
			if d := next - axes[i]; d < best-1e-12 {
				best, walls = d, []float64{axes[i], next}
			}
		}
	}
	for _, a := range walls {
		s.walls = append(s.walls, cmplx.Rect(1, a))
	}
	s.group = []isometry{{rot: 1}}
	var gens []isometry
	for _, d := range s.walls {
		gens = append(gens, mirror(c, d))
	}
	for i := 0; i < len(s.group) && len(s.group) <= 24; i++ { // closure
		for _, m := range gens {
			h := m.after(s.group[i])
			known := false
			for _, f := range s.group {
				known = known || f.near(h, eps)
			}
			if !known {
				s.group = append(s.group, h)
			}
		}
	}
	// Each corner's representative: its orbit's member in the chamber.
	s.rep = make([]int, len(g.corners))
	for k, ck := range g.corners {
		s.rep[k] = -1
		for _, h := range s.group {
			j := cornerAt(g.corners, h.apply(ck.w), eps)
			if j >= 0 && s.inChamber(g.corners[j].w) && (s.rep[k] < 0 || j < s.rep[k]) {
				s.rep[k] = j
			}
		}
		if s.rep[k] < 0 {
			return nil
		}
	}
	return s
}

// cornerAt is the corner at w, or −1.
func cornerAt(corners []corner, w complex128, eps float64) int {
	for j, c := range corners {
		if abs(c.w-w) < 100*eps {
			return j
		}
	}
	return -1
}

// invariantUnder reports whether the reflection m maps the problem onto
// itself: sides onto sides with the same condition and data, corners onto
// corners, each hole's centre onto itself (the holes' logarithms stay out of
// the symmetrised basis).
func invariantUnder(m isometry, g *sectionGeometry, conds []sideCondition, eps, tolData float64, interior [][3]float64, f func(x, y float64) float64) bool {
	step := max(1, len(interior)/97)
	size := 0.0 // the source's size, for a tolerance that a zero of f does not defeat
	for i := 0; i < len(interior); i += step {
		size = math.Max(size, math.Abs(f(interior[i][0], interior[i][1])))
	}
	for i := 0; i < len(interior); i += step {
		z := complex(interior[i][0], interior[i][1])
		w := m.apply(z)
		a, b := f(real(z), imag(z)), f(real(w), imag(w))
		if math.Abs(a-b) > 1e-12*size || math.IsNaN(a-b) {
			return false
		}
	}
	for _, hb := range g.holes {
		if abs(m.apply(hb.c)-hb.c) > 100*eps {
			return false
		}
	}
	for _, c := range g.corners {
		// A corner on the mirror line is refused too: its poles, within
		// rounding of the line (10⁻¹⁶ absolute at 10⁻⁹ from the corner),
		// would make the symmetrised terms asymmetric by 10⁻⁷ of their
		// size there, which the fit on one side cannot see (the L shape's
		// re-entrant corner then stalled at 4·10⁻¹² instead of 1.6·10⁻¹²).
		j := cornerAt(g.corners, m.apply(c.w), eps)
		if j < 0 || abs(g.corners[j].w-c.w) < 100*eps {
			return false
		}
	}
	sides := g.shape.Sides
	for k, side := range sides {
		image, ok := sideImage(m, k, sides, eps)
		if !ok {
			return false
		}
		for _, t := range []float64{0.013, 0.07, 0.29, 0.5, 0.73, 0.94, 0.991} {
			x, y, nx, ny := side.At(t)
			j, tj := image(t)
			xj, yj, nxj, nyj := sides[j].At(tj)
			if abs(m.apply(complex(x, y))-complex(xj, yj)) > 100*eps || abs(m.direction(complex(nx, ny))-complex(nxj, nyj)) > 1e-7 {
				return false
			}
			p, q := conds[k], conds[j]
			gp, _ := p.parts(-1, x, y, nx, ny)
			gq, _ := q.parts(-1, xj, yj, nxj, nyj)
			if p.a != q.a || p.b != q.b || p.floating != q.floating || p.floating && p.group != q.group || math.Abs(gp-gq) > tolData || math.IsNaN(gp-gq) {
				return false
			}
		}
	}
	return true
}

// sideImage finds the side that m maps side k onto, and the map of t.
func sideImage(m isometry, k int, sides []SidePath, eps float64) (func(t float64) (int, float64), bool) {
	point := func(s SidePath, t float64) complex128 {
		x, y, _, _ := s.At(t)
		return complex(x, y)
	}
	a, b := m.apply(point(sides[k], 0)), m.apply(point(sides[k], 1))
	closed := abs(point(sides[k], 0)-point(sides[k], 1)) < 100*eps
	for j, s := range sides {
		if math.Abs(s.Length-sides[k].Length) > 100*eps*math.Max(1, s.Length) {
			continue
		}
		if !closed {
			if abs(point(s, 0)-b) < 100*eps && abs(point(s, 1)-a) < 100*eps {
				return func(t float64) (int, float64) { return j, 1 - t }, true
			}
			continue
		}
		if abs(point(s, 0)-point(s, 1)) > 100*eps {
			continue
		}
		// A closed side: t ↦ shift − t; the shift puts m's image of t = 0.
		const n = 2048
		shift, best := 0.0, math.Inf(1)
		for i := 0; i < n; i++ {
			if d := abs(point(s, float64(i)/n) - a); d < best {
				shift, best = float64(i)/n, d
			}
		}
		lo, hi := shift-1.0/n, shift+1.0/n
		wrap := func(t float64) float64 { return t - math.Floor(t) }
		for it := 0; it < 60; it++ { // ternary search on the distance, unimodal this close
			m1, m2 := lo+(hi-lo)/3, hi-(hi-lo)/3
			if abs(point(s, wrap(m1))-a) < abs(point(s, wrap(m2))-a) {
				hi = m2
			} else {
				lo = m1
			}
		}
		shift = (lo + hi) / 2
		if abs(point(s, wrap(shift))-a) > 100*eps {
			continue
		}
		return func(t float64) (int, float64) { return j, wrap(shift - t) }, true
	}
	return nil, false
}

// boundaryCentroid is the region's centroid from boundary integrals
// (divergence theorem: A = ∮ x·n_x ds, A·x̄ = ∮ x²/2·n_x ds, A·ȳ = ∮ y²/2·n_y ds).
func boundaryCentroid(shape Shape) (complex128, bool) {
	var area, mx, my float64
	for _, side := range shape.Sides {
		side.panelNodes(uniformEdges(16), ansatz.GaussX, ansatz.GaussW, func(t, w float64) {
			px, py, nx, ny := side.At(t)
			area += w * px * nx
			mx += w * px * px / 2 * nx
			my += w * py * py / 2 * ny
		})
	}
	if !(area > 0) || math.IsInf(area, 0) {
		return 0, false
	}
	return complex(mx/area, my/area), true
}

// particularShift is c = ū_p − u_p, ū_p = (1/|G|)·Σ_g u_p∘g, and the F' with
// ∇c = (Re F', −Im F'). ū_p solves Δū_p = f too (f is symmetric), and is
// symmetric: u = ū_p + h̄ with h̄ symmetric, so h = u − u_p = h̄ + c, c
// harmonic and known. Over the symmetric region ∬ c dA = 0. The chain rule
// for u_p∘g takes the linear part's transpose to the gradient: conj(rot)·∇
// for a rotation, rot·conj(∇) for a reflection (its matrix is symmetric).
func particularShift(s *symmetry, sc sideCondition) func(z complex128) (float64, complex128) {
	at := func(z complex128) (float64, complex128) {
		r, th := polarOf(real(z), imag(z))
		return sc.up.At(r, th), sc.particularGradient(r, th)
	}
	n := float64(len(s.group))
	return func(z complex128) (float64, complex128) {
		v0, g0 := at(z)
		var v, grad complex128
		for _, g := range s.group {
			vg, gg := at(g.apply(z))
			if g.flip {
				gg = g.rot * cmplx.Conj(gg)
			} else {
				gg = cmplx.Conj(g.rot) * gg
			}
			v, grad = v+complex(vg, 0), grad+gg
		}
		c := real(v)/n - v0
		gc := grad/complex(n, 0) - g0
		return c, cmplx.Conj(gc)
	}
}

// sectionSymmetry is findSymmetry for a posed section problem: the source
// tested at the section's area nodes.
func sectionSymmetry(d section, g *sectionGeometry, conds []sideCondition, p *posed, tolData float64) (*symmetry, error) {
	nodes, err := d.areaNodes(p.env)
	if err != nil {
		return nil, err
	}
	f, err := p.f.Compile(p.env)
	if err != nil {
		return nil, nil // a source that needs parameters: no symmetry test, the full fit
	}
	at := func(x, y float64) float64 { return f.At(polarOf(x, y)) }
	return findSymmetry(g, conds, tolData, nodes, at), nil
}

// inverse is g⁻¹: a reflection is its own; a rotation's turns back.
func (g isometry) inverse() isometry {
	if g.flip {
		return g
	}
	r := cmplx.Conj(g.rot)
	return isometry{rot: r, shift: -r * g.shift}
}

// imageTerm says how a term of the expanded basis takes its coefficient
// from its representative's: c_image = factor·c, or factor·conj(c) where
// conj. The fit's columns add each image's share alike (fitHarmonic).
type imageTerm struct {
	rep    int
	conj   bool
	factor complex128
}

// coef is the image's coefficient from the representative's c.
func (m imageTerm) coef(c complex128) complex128 {
	if m.conj {
		c = cmplx.Conj(c)
	}
	return m.factor * c
}

// The images of the basis's terms under g, each again a term of the same
// kind evaluated at z itself (never at g(z): rounding in g(z) near a corner
// is noise that no fit can follow, where a pole moved by rounding is just
// another pole). With q = g⁻¹(·) of a point, L the linear part of g:
//
//	1/(g(z) − p)        = rot/(z − q) conjugated (a reflection), or rot̄/(z − q)
//	((g(z) − w)·ρ)^β    = ((z − q)·conj(ρ·rot))^β conjugated, or ((z − q)·ρ·rot)^β
//	(r/(g(z) − c))^j    = rot^j·(r/(z − q))^j conjugated, or rot̄^j·(r/(z − q))^j
//
// and an ellipse's terms with its focus turned by L⁻¹ (the exterior map
// commutes with conjugation), with factor 1.

// poleImage is the pole p's image under g.
func poleImage(g isometry, p complex128) (complex128, imageTerm) {
	q := g.inverse().apply(p)
	if g.flip {
		return q, imageTerm{conj: true, factor: g.rot}
	}
	return q, imageTerm{factor: cmplx.Conj(g.rot)}
}

// powerImage is a corner power's image under g.
func powerImage(g isometry, c cornerPower) (cornerPower, imageTerm) {
	inv := g.inverse()
	out := c
	out.w, out.pivot = inv.apply(c.w), inv.apply(c.pivot)
	if c.spread.focus != 0 {
		out.spread, _ = holeImage(g, c.spread, 0)
	}
	if g.flip {
		out.rot = cmplx.Conj(c.rot * g.rot)
		return out, imageTerm{conj: true, factor: 1}
	}
	out.rot = c.rot * g.rot
	return out, imageTerm{factor: 1}
}

// holeImage is a hole's basis under g, and the factor of its term j.
func holeImage(g isometry, hb holeBasis, j int) (holeBasis, imageTerm) {
	out := hb
	out.c = g.inverse().apply(hb.c)
	factor := complex128(1)
	if hb.focus != 0 {
		if g.flip {
			out.focus = g.rot * cmplx.Conj(hb.focus)
		} else {
			out.focus = cmplx.Conj(g.rot) * hb.focus
		}
	} else if g.flip {
		factor = cmplx.Pow(g.rot, complex(float64(j), 0))
	} else {
		factor = cmplx.Pow(cmplx.Conj(g.rot), complex(float64(j), 0))
	}
	return out, imageTerm{conj: g.flip, factor: factor}
}
