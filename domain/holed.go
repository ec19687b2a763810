package domain

import (
	"fmt"
	"math"
	"math/big"
	"math/cmplx"
	"strings"

	"psol/series"
	"psol/series/cart"
)

// Holed is a section with circular holes: an outer region (a disk, a
// rectangle, an ellipse or a polygon) less the disks of its holes. The K-th
// hole's circle is the side "holeK". The harmonic part is fitted as on any
// section, its basis grown by each hole's logarithm log|z − c| and Laurent
// terms (ρ/(z − c))^j: on a region with holes a harmonic function is the real
// part of an analytic one only up to those logarithms (common practice; e.g.
// Ahlfors, Complex Analysis, on harmonic functions in multiply connected
// regions).
type Holed struct {
	Outer Domain // Disk, Rect, Ellipse or Polygon
	Holes []CircleHole
}

// CircleHole is a hole: the disk (x − X)² + (y − Y)² < R²; where A is set,
// the ellipse ((x − X)/A)² + ((y − Y)/B)² < 1; where Poly has vertices, the
// inside of that polygon (its edges the sides holeK.s1, holeK.s2, …).
type CircleHole struct {
	X, Y, R series.Coef
	A, B    series.Coef // an elliptical hole's semi-axes along x and y
	Poly    Polygon
}

func (c CircleHole) isPolygon() bool { return len(c.Poly.X) > 0 }

func (c CircleHole) isEllipse() bool { return !c.isPolygon() && !c.A.IsZero() }

func holeName(k int) string { return fmt.Sprintf("hole%d", k+1) }

// holeGroup is the hole a side belongs to: holeK for holeK and holeK.sJ.
func holeGroup(side string) string {
	g, _, _ := strings.Cut(side, ".")
	return g
}

func (h Holed) Sides() []string {
	out := append([]string(nil), h.Outer.Sides()...)
	for k, c := range h.Holes {
		if !c.isPolygon() {
			out = append(out, holeName(k))
			continue
		}
		for j := range c.Poly.X {
			out = append(out, fmt.Sprintf("%s.s%d", holeName(k), j+1))
		}
	}
	return out
}

func (h Holed) Describe() string {
	var hs []string
	for _, c := range h.Holes {
		if c.isPolygon() {
			hs = append(hs, "the inside of "+c.Poly.Describe())
			continue
		}
		if c.isEllipse() {
			hs = append(hs, "the ellipse of semi-axes "+c.A.Text()+", "+c.B.Text()+" about ("+c.X.Text()+", "+c.Y.Text()+")")
			continue
		}
		hs = append(hs, "the disk of radius "+c.R.Text()+" about ("+c.X.Text()+", "+c.Y.Text()+")")
	}
	return h.Outer.Describe() + " less " + strings.Join(hs, " and ")
}

// holeNumbers is a hole in numbers: its sides (the region on their left,
// the outward normal into the hole), its corners, the centre and radius of
// its logarithm and Laurent terms, and a test for its inside.
type holeNumbers struct {
	x, y, r float64 // a circle's centre and radius; a polygon's centroid and inner radius; an ellipse's centre and smaller semi-axis
	a, b    float64 // an ellipse's semi-axes along x and y (0 otherwise)
	sides   []SidePath
	corners []corner
	area    float64
	inside  func(x, y float64) bool
	circle  bool
	// An elongated polygon's terms: its exterior-map ellipse's centre,
	// focus and A + B (slotMap); focus 0 otherwise.
	mapC, focus complex128
	span        float64
}

func (h Holed) holes(env series.Env) ([]holeNumbers, error) {
	var out []holeNumbers
	for k, c := range h.Holes {
		if c.isEllipse() {
			v, err := floats(env, c.X, c.Y, c.A, c.B)
			if err != nil {
				return nil, err
			}
			hn := holeNumbers{x: v[0], y: v[1], r: math.Min(v[2], v[3]), a: v[2], b: v[3], area: math.Pi * v[2] * v[3]}
			hn.sides = []SidePath{holeEllipse(holeName(k), hn)}
			hn.inside = func(x, y float64) bool {
				dx, dy := (x-hn.x)/hn.a, (y-hn.y)/hn.b
				return dx*dx+dy*dy < 1-1e-12
			}
			out = append(out, hn)
			continue
		}
		if !c.isPolygon() {
			v, err := floats(env, c.X, c.Y, c.R)
			if err != nil {
				return nil, err
			}
			hn := holeNumbers{x: v[0], y: v[1], r: v[2], area: math.Pi * v[2] * v[2], circle: true}
			hn.sides = []SidePath{holeCircle(holeName(k), hn)}
			hn.inside = func(x, y float64) bool { return math.Hypot(x-hn.x, y-hn.y) < hn.r*(1-1e-12) }
			out = append(out, hn)
			continue
		}
		hn, err := polygonHole(holeName(k), c.Poly, env)
		if err != nil {
			return nil, err
		}
		out = append(out, hn)
	}
	return out, nil
}

// polygonHole: the edges with the region's outward normal (into the hole),
// a corner at every vertex with its
// poles inside the hole, the Laurent centre at the vertices' centroid and
// its radius the nearest edge's distance.
func polygonHole(name string, p Polygon, env series.Env) (holeNumbers, error) {
	xs, ys, orient, err := p.vertices(env)
	if err != nil {
		return holeNumbers{}, err
	}
	n := len(xs)
	hn := holeNumbers{area: math.Abs(signedArea(xs, ys))}
	for k := 0; k < n; k++ {
		hn.x, hn.y = hn.x+xs[k]/float64(n), hn.y+ys[k]/float64(n)
	}
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		// The edge from vertex k to k+1, its normal turned into the hole
		// (the region's outward normal there).
		s := orientedSegment(fmt.Sprintf("%s.s%d", name, k+1), xs[k], ys[k], xs[j], ys[j], -orient)
		hn.sides = append(hn.sides, s)
	}
	hn.x, hn.y, hn.r = holeCentre(xs, ys, hn.x, hn.y)
	spreads := func(c, focus complex128) bool { return spreadFits(xs, ys, c, focus) }
	if c, f, m, ok := slotMap(xs, ys, spreads); ok {
		hn.mapC, hn.focus, hn.span = c, f, m
	} else if c, f, m, ok := slotMap(xs, ys, nil); ok {
		hn.mapC, hn.focus, hn.span = c, f, m
	}
	for k := 0; k < n; k++ {
		i, j := (k+n-1)%n, (k+1)%n
		w := complex(xs[k], ys[k])
		a, b := complex(xs[i], ys[i])-w, complex(xs[j], ys[j])-w
		d := a/complex(abs(a), 0) + b/complex(abs(b), 0)
		d /= complex(abs(d), 0)
		holeAngle := math.Acos(math.Max(-1, math.Min(1, real(cmplx.Conj(a)*b)/(abs(a)*abs(b))))) / math.Pi
		if turn := imag(cmplx.Conj(-a) * b); turn*orient < 0 { // a reflex vertex of the hole
			holeAngle, d = 2-holeAngle, -d
		}
		// The region's angle there is 2 − the hole's; the poles go into the hole.
		reach := 0.0
		for m := range xs {
			reach = math.Max(reach, abs(complex(xs[m], ys[m])-w))
		}
		// The powers' cut runs from the corner to the centroid: inside the
		// hole wherever the segment is (checked along it).
		cn := corner{w: w, dir: d, angle: 2 - holeAngle, reach: reach, pivot: complex(hn.x, hn.y), hasPivot: true}
		for s := 1; s < 64; s++ {
			p := w + (cn.pivot-w)*complex(float64(s)/64, 0)
			if !insidePolygon(xs, ys, real(p), imag(p)) {
				cn.hasPivot = false
			}
		}
		if spreadFits(xs, ys, hn.mapC, hn.focus) {
			spread := holeBasis{c: hn.mapC, focus: hn.focus, span: hn.span}
			if spreadCutInside(xs, ys, k, spread) {
				cn.spread, cn.centrePivot, cn.hasPivot = spread, cn.hasPivot, true
			}
		}
		hn.corners = append(hn.corners, cn)
	}
	hn.inside = func(x, y float64) bool {
		if !insidePolygon(xs, ys, x, y) {
			return false
		}
		for k := 0; k < n; k++ { // on an edge: not inside
			j := (k + 1) % n
			if pointSegment(x, y, xs[k], ys[k], xs[j], ys[j]) <= 1e-12*math.Max(1, hn.r) {
				return false
			}
		}
		return true
	}
	return hn, nil
}

// edgeDistance is the distance from (x, y) to the polygon's nearest edge.
func edgeDistance(xs, ys []float64, x, y float64) float64 {
	d := math.Inf(1)
	for k := range xs {
		j := (k + 1) % len(xs)
		d = math.Min(d, pointSegment(x, y, xs[k], ys[k], xs[j], ys[j]))
	}
	return d
}

// holeCentre is the centre of a polygonal hole's logarithm and Laurent
// terms, and the pivot of its corners' powers, with its distance to the
// nearest edge (the terms' radius): the vertices' centroid (cx, cy), unless
// it lies outside the hole or near an edge, as a non-convex hole's can (an
// L-shaped hole's is its reflex vertex, where every term is singular and
// the fit failed). Then the point of a 32 × 32 grid over the hole farthest
// from its edges.
func holeCentre(xs, ys []float64, cx, cy float64) (x, y, r float64) {
	x0, y0, x1, y1 := xs[0], ys[0], xs[0], ys[0]
	for k := range xs {
		x0, y0, x1, y1 = math.Min(x0, xs[k]), math.Min(y0, ys[k]), math.Max(x1, xs[k]), math.Max(y1, ys[k])
	}
	bx, by, br := cx, cy, 0.0
	for i := 0; i < 32; i++ {
		for j := 0; j < 32; j++ {
			px, py := x0+(x1-x0)*(float64(i)+0.5)/32, y0+(y1-y0)*(float64(j)+0.5)/32
			if d := edgeDistance(xs, ys, px, py); d > br && insidePolygon(xs, ys, px, py) {
				bx, by, br = px, py, d
			}
		}
	}
	// The centroid where it is well inside, a quarter of the grid's best
	// distance from every edge: so the holes psol solved before keep their
	// centre (every golden and test did; a triangle's centroid is two
	// thirds of its inradius from each side, a rectangle's is the best).
	if d := edgeDistance(xs, ys, cx, cy); insidePolygon(xs, ys, cx, cy) && d >= 0.25*br {
		return cx, cy, d
	}
	return bx, by, br
}

// pointSegment is the distance from (x, y) to the segment from a to b.
func pointSegment(x, y, ax, ay, bx, by float64) float64 {
	dx, dy := bx-ax, by-ay
	t := math.Max(0, math.Min(1, ((x-ax)*dx+(y-ay)*dy)/(dx*dx+dy*dy)))
	return math.Hypot(x-ax-t*dx, y-ay-t*dy)
}

// HoleFault is the first fault of the holes in numbers: a hole that meets
// the outer boundary or lies outside it, two holes that meet, a polygon
// hole's own fault; −1 and "" where they are sound.
func (h Holed) HoleFault(env series.Env) (int, string) {
	for k, c := range h.Holes {
		if !c.isPolygon() {
			continue
		}
		xs, err1 := floats(env, c.Poly.X...)
		ys, err2 := floats(env, c.Poly.Y...)
		if err1 != nil || err2 != nil {
			return -1, ""
		}
		if j, reason := PolygonFault(xs, ys); j >= 0 {
			return k, fmt.Sprintf("hole %d: %s", k+1, reason)
		}
	}
	hs, err := h.holes(env)
	if err != nil {
		return -1, ""
	}
	shape, err := h.Outer.Shape(env)
	if err != nil {
		return -1, ""
	}
	boundary := func(hn holeNumbers) [][2]float64 {
		var out [][2]float64
		for _, s := range hn.sides {
			for j := 0; j < 240; j++ {
				x, y, _, _ := s.At(float64(j) / 240)
				out = append(out, [2]float64{x, y})
			}
		}
		return out
	}
	for k, c := range hs {
		if c.circle && c.r <= 0 {
			return k, "a hole's radius must be positive"
		}
		for _, p := range boundary(c) {
			if ok, _ := ContainsXY(h.Outer, p[0], p[1], env); !ok {
				return k, fmt.Sprintf("hole %d reaches outside %s", k+1, h.Outer.Describe())
			}
		}
		for _, side := range shape.Sides {
			for j := 0; j <= 720; j++ {
				x, y, _, _ := side.At(float64(j) / 720)
				if c.inside(x, y) || c.circle && math.Hypot(x-c.x, y-c.y) <= c.r*(1+1e-9) {
					return k, fmt.Sprintf("hole %d meets or crosses the outer boundary (%s)", k+1, side.Name)
				}
			}
		}
		for j := 0; j < k; j++ {
			if c.circle && hs[j].circle {
				if math.Hypot(hs[j].x-c.x, hs[j].y-c.y) <= (hs[j].r+c.r)*(1+1e-9) {
					return k, fmt.Sprintf("holes %d and %d meet or overlap", j+1, k+1)
				}
				continue
			}
			for _, p := range boundary(c) {
				if hs[j].inside(p[0], p[1]) {
					return k, fmt.Sprintf("holes %d and %d meet or overlap", j+1, k+1)
				}
			}
			for _, p := range boundary(hs[j]) {
				if c.inside(p[0], p[1]) {
					return k, fmt.Sprintf("holes %d and %d meet or overlap", j+1, k+1)
				}
			}
		}
	}
	return -1, ""
}

func (h Holed) Contains(r, theta float64, env series.Env) (bool, error) {
	x, y := r*math.Cos(theta), r*math.Sin(theta)
	return h.containsXY(x, y, env)
}

func (h Holed) insideXY(env series.Env) (func(x, y float64) bool, error) {
	hs, err := h.holes(env)
	if err != nil {
		return nil, err
	}
	outer := InsideXY(h.Outer, env)
	return func(x, y float64) bool {
		if !outer(x, y) {
			return false
		}
		for _, c := range hs {
			if c.inside(x, y) {
				return false
			}
		}
		return true
	}, nil
}

func (h Holed) containsXY(x, y float64, env series.Env) (bool, error) {
	in, err := ContainsXY(h.Outer, x, y, env)
	if err != nil || !in {
		return false, err
	}
	hs, err := h.holes(env)
	if err != nil {
		return false, err
	}
	for _, c := range hs {
		if c.inside(x, y) {
			return false, nil
		}
	}
	return true, nil
}

func (Holed) printsInXY() bool { return true }

// Shape: the outer sides, then each hole's sides traversed with the region
// on their left, the outward normal pointing into the hole.
func (h Holed) Shape(env series.Env) (Shape, error) {
	sh, err := h.Outer.Shape(env)
	if err != nil {
		return Shape{}, err
	}
	hs, err := h.holes(env)
	if err != nil {
		return Shape{}, err
	}
	sh.Sides = append([]SidePath(nil), sh.Sides...)
	sh.Polar = nil
	for _, c := range hs {
		sh.Sides = append(sh.Sides, c.sides...)
		sh.Area -= c.area
	}
	return sh, nil
}

// holeEllipse is an elliptical hole's boundary by arc length (the outer
// ellipse's rim, moved), clockwise so that the region is on its left, with
// the normal pointing into the hole.
func holeEllipse(name string, c holeNumbers) SidePath {
	rim := ellipseRim(c.a, c.b)
	even := func(u float64) float64 { return 1 - rim.Even(1-u) }
	evenOf := func(t float64) float64 { return 1 - rim.EvenOf(1-t) }
	rate := func(u float64) float64 { return rim.EvenRate(1 - u) }
	return SidePath{Name: name, Length: rim.Length, Even: even, EvenOf: evenOf, EvenRate: rate, At: func(t float64) (x, y, nx, ny float64) {
		x, y, nx, ny = rim.At(1 - t)
		return c.x + x, c.y + y, -nx, -ny
	}}
}

func holeCircle(name string, c holeNumbers) SidePath {
	return SidePath{Name: name, Length: 2 * math.Pi * c.r, At: func(t float64) (x, y, nx, ny float64) {
		th := -2 * math.Pi * t
		cs, sn := math.Cos(th), math.Sin(th)
		return c.x + c.r*cs, c.y + c.r*sn, -cs, -sn
	}}
}

// geometry: the outer region's, with the holes' sides and corners, and
// their centres for the logarithms and Laurent terms.
func (h Holed) geometry(env series.Env) (sectionGeometry, error) {
	outer, ok := h.Outer.(section)
	var g sectionGeometry
	var err error
	if ok {
		if g, err = outer.geometry(env); err != nil {
			return g, err
		}
	} else { // a disk or a rectangle as a section
		if g, err = plainGeometry(h.Outer, env); err != nil {
			return g, err
		}
	}
	hs, err := h.holes(env)
	if err != nil {
		return g, err
	}
	mirrors := straightSides(g.shape.Sides) // the outline's, before the holes' join
	for _, c := range hs {
		first := len(g.corners)
		g.corners = append(g.corners, c.corners...)
		for j, s := range c.sides {
			g.shape.Sides = append(g.shape.Sides, s)
			if len(c.corners) == 0 { // a circle or an ellipse
				g.starts, g.ends = append(g.starts, -1), append(g.ends, -1)
				continue
			}
			// Edge j runs from vertex j+1 to j when the hole is traversed
			// backwards, from j to j+1 otherwise: its ends are those corners.
			n := len(c.corners)
			x0, y0, _, _ := s.At(0)
			a, b := first+j, first+(j+1)%n
			if abs(complex(x0, y0)-c.corners[j].w) > 1e-12*math.Max(1, c.r) {
				a, b = b, a
			}
			g.starts, g.ends = append(g.starts, a), append(g.ends, b)
		}
		hb := holeBasis{c: complex(c.x, c.y), rho: c.r}
		if c.focus != 0 { // an elongated polygon: the terms of an ellipse's exterior map
			hb.c, hb.focus, hb.span = c.mapC, c.focus, c.span
		}
		if c.a > 0 && c.a != c.b { // an ellipse: the terms of its exterior map
			hb.span = c.a + c.b
			if c.a > c.b {
				hb.focus = complex(math.Sqrt(c.a*c.a-c.b*c.b), 0)
			} else {
				hb.focus = complex(0, math.Sqrt(c.b*c.b-c.a*c.a))
			}
		}
		g.holes = append(g.holes, hb)
	}
	g.images = cornerImages(g.corners, mirrors)
	for k, c := range hs { // a smooth hole near a wall: its Laurent terms' image
		if len(c.corners) == 0 {
			g.holeImages = append(g.holeImages, smoothHoleImages(k, c.sides, g.holes[k], mirrors)...)
		}
	}
	if e, ok := h.Outer.(Ellipse); ok { // a round hole near a curved rim: its reflections there
		a, errA := e.A.Float(env)
		b, errB := e.B.Float(env)
		if errA == nil && errB == nil {
			for k, c := range hs {
				if len(c.corners) == 0 && g.holes[k].focus == 0 {
					g.rimImages = append(g.rimImages, ellipseRimImages(a, b, g.shape.Sides[0], g.holes[k])...)
				}
			}
		}
	}
	if disk, ok := h.Outer.(Disk); ok && len(hs) == 1 && hs[0].circle {
		// Two circles: the solution's singularities (images of images)
		// gather at the limiting points of the pair, the points inverse in
		// both circles; the hole's expansion converges far faster about the
		// one inside it than about its centre (an eccentric annulus).
		if R, err := disk.R.Float(env); err == nil {
			if l, ok := limitingPoint(R, hs[0]); ok {
				// ρ: the distance to the hole's circle, so that |ρ/(z − l)| ≤ 1 in the region.
				c := complex(hs[0].x, hs[0].y)
				g.holes[0].c, g.holes[0].rho = l, hs[0].r-abs(l-c)
				g.mobius = &mobiusMap{l1: l, l2: complex(R*R, 0) / cmplx.Conj(l)}
				wr, wh := g.mobius.w(l/complex(abs(l), 0)*complex(R, 0)), g.mobius.w(c+l/complex(abs(l), 0)*complex(hs[0].r, 0))
				g.mobius.lo, g.mobius.hi = math.Min(abs(wr), abs(wh)), math.Max(abs(wr), abs(wh))
				g.warp = bipolarWarps(R, l, c, hs[0].r, len(g.shape.Sides))
			}
		}
	}
	g.shape.Polar = nil
	return g, nil
}

// plainGeometry is a disk's or a rectangle's boundary as a section's: the
// rectangle's corners take poles like a polygon's.
func plainGeometry(d Domain, env series.Env) (sectionGeometry, error) {
	switch r := d.(type) {
	case Disk:
		sh, err := r.Shape(env)
		if err != nil {
			return sectionGeometry{}, err
		}
		return sectionGeometry{shape: sh, starts: []int{-1}, ends: []int{-1}, scale: sh.Box.X1}, nil
	case Rect:
		poly := Polygon{X: []series.Coef{{}, r.L, r.L, {}}, Y: []series.Coef{{}, {}, r.H, r.H}}
		g, err := poly.geometry(env)
		if err != nil {
			return g, err
		}
		// The rectangle's sides in its own names and order (left, right,
		// bottom, top), between the polygon's corners (0, 0), (L, 0),
		// (L, H), (0, H).
		if g.shape, err = r.Shape(env); err != nil {
			return g, err
		}
		g.starts, g.ends = []int{3, 1, 0, 2}, []int{0, 2, 1, 3}
		return g, nil
	}
	return sectionGeometry{}, fmt.Errorf("%s takes no holes", d.Describe())
}

func (h Holed) solve(p *posed) (*Solution, error) { return solveSection(h, p) }

// Measures: the outer region's, less the holes' areas; each hole's side
// lengths and the area it encloses.
func (h Holed) Measures() Measures {
	m := h.Outer.Measures()
	lengths := map[string]series.Coef{}
	for k, v := range m.Lengths {
		lengths[k] = v
	}
	out := Measures{Area: m.Area, Lengths: lengths, Holes: map[string]series.Coef{}}
	for k, c := range h.Holes {
		if c.isEllipse() {
			m := Ellipse{A: c.A, B: c.B}.Measures()
			out.Area = out.Area.Sub(m.Area)
			out.Lengths[holeName(k)] = m.Lengths["rim"]
			out.Holes[holeName(k)] = m.Area
			continue
		}
		if c.isPolygon() {
			pm := c.Poly.Measures()
			out.Area = out.Area.Sub(pm.Area)
			for s, l := range pm.Lengths {
				out.Lengths[holeName(k)+"."+s] = l
			}
			out.Holes[holeName(k)] = pm.Area
			continue
		}
		a := discArea(c.R)
		out.Area = out.Area.Sub(a)
		out.Lengths[holeName(k)] = circleLength(c.R)
		out.Holes[holeName(k)] = a
	}
	return out
}

// integral: the outer region's less each hole's (a polygon's exactly; a
// disk's by a polynomial's moments about its centre:
// ∬ X^(2a) Y^(2b) over a disk of radius ρ is ρ^(2a+2b+2) π (2a−1)!!(2b−1)!!/(2^(a+b) (a+b+1)!)).
func (h Holed) integral(u series.Sum) (series.Coef, error) {
	total, err := h.Outer.integral(u)
	if err != nil {
		return series.Coef{}, err
	}
	poly, err := cart.FromPolar(u)
	if err != nil {
		return series.Coef{}, err
	}
	for _, c := range h.Holes {
		var v series.Coef
		switch {
		case c.isPolygon():
			v, err = c.Poly.integral(u)
		case c.isEllipse():
			v, err = Ellipse{A: c.A, B: c.B}.integral(shiftPoly(poly, c.X, c.Y).Polar())
		default:
			v, err = Ellipse{A: c.R, B: c.R}.integral(shiftPoly(poly, c.X, c.Y).Polar())
		}
		if err != nil {
			return series.Coef{}, err
		}
		total = total.Sub(v)
	}
	return total, nil
}

// shiftPoly is p(X + a, Y + b) as a polynomial in X, Y.
func shiftPoly(p cart.Poly, a, b series.Coef) cart.Poly {
	out := cart.Poly{}
	for _, t := range p.Terms() {
		for i := 0; i <= t.I; i++ {
			for j := 0; j <= t.J; j++ {
				c := t.C.Mul(pow(a, t.I-i)).Mul(pow(b, t.J-j)).MulRat(big.NewRat(binom(t.I, i)*binom(t.J, j), 1))
				out = out.Add(cart.Monomial(c, i, j))
			}
		}
	}
	return out
}

// areaCells: the outer region's cells, less cells on each hole (negative
// weights): exact for what is smooth across the holes, as the quadrature's
// particular solution is.
func (h Holed) areaCells(env series.Env) ([]areaCell, error) {
	var cells []areaCell
	switch o := h.Outer.(type) {
	case section:
		c, err := o.areaCells(env)
		if err != nil {
			return nil, err
		}
		cells = c
	case Disk:
		R, err := o.R.Float(env)
		if err != nil {
			return nil, err
		}
		cells = polarCells(0, 0, R, R, 1)
	case Rect:
		c, err := rectCells(o, env)
		if err != nil {
			return nil, err
		}
		cells = c
	}
	for k, c := range h.Holes {
		if c.isPolygon() {
			hc, err := c.Poly.areaCells(env)
			if err != nil {
				return nil, err
			}
			for _, p := range hc {
				p.sign = -p.sign
				cells = append(cells, p)
			}
			continue
		}
		hs, err := h.holes(env)
		if err != nil {
			return nil, err
		}
		if c.isEllipse() {
			cells = append(cells, polarCells(hs[k].x, hs[k].y, hs[k].a, hs[k].b, -1)...)
			continue
		}
		cells = append(cells, polarCells(hs[k].x, hs[k].y, hs[k].r, hs[k].r, -1)...)
	}
	return cells, nil
}

func (h Holed) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return sectionFigures(h, s, ev, rep, env)
}

func (h Holed) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return shapeClaimSide(h, side, cond, claim, env)
}

func (h Holed) samples(env series.Env) ([][2]float64, error) { return shapeSamples(h, env) }

// limitingPoint is the limiting point inside the hole of the circles |z| = R
// and |z − c| = ρ: on the line of centres, inverse in both circles
// (x·x' = R² and (x − c)(x' − c) = ρ² along the line).
func limitingPoint(R float64, h holeNumbers) (complex128, bool) {
	c := math.Hypot(h.x, h.y)
	if c < 1e-12*R {
		return complex(h.x, h.y), false // concentric: the centre itself
	}
	s := (R*R - h.r*h.r + c*c) / c // x + x'
	disc := s*s - 4*R*R
	if disc <= 0 {
		return 0, false
	}
	x := (s - math.Sqrt(disc)) / 2 // the root nearer the hole's centre
	if math.Abs((s+math.Sqrt(disc))/2-c) < math.Abs(x-c) {
		x = (s + math.Sqrt(disc)) / 2
	}
	dir := complex(h.x/c, h.y/c)
	return dir * complex(x, 0), true
}

// mobiusMap is w = (z − l₁)/(z − l₂) for the limiting points of two
// circles: it maps them onto the circles |w| = lo and |w| = hi about the
// origin, where a harmonic function is a Laurent series in w plus a multiple
// of log|w| (an eccentric annulus made concentric; the bipolar coordinates
// of the classical solutions).
type mobiusMap struct {
	l1, l2 complex128
	lo, hi float64
}

func (m *mobiusMap) w(z complex128) complex128 { return (z - m.l1) / (z - m.l2) }

// terms are the basis's terms at z, (w/hi)^k for k > 0 and (lo/w)^−k for
// k < 0, one for each k of ks, into f, and their derivatives in z into df.
// The powers come by multiplication: one cmplx.Pow a term was two thirds of
// an eccentric annulus's evaluation at degree 86.
func (m *mobiusMap) terms(z complex128, ks []int, f, df []complex128) {
	w := m.w(z)
	dw := (m.l1 - m.l2) / ((z - m.l2) * (z - m.l2))
	up, down := w/complex(m.hi, 0), complex(m.lo, 0)/w
	pu, pd, n := complex128(1), complex128(1), 0 // (w/hi)^n, (lo/w)^n
	slope := dw / w
	for i, k := range ks {
		a := max(k, -k)
		if a < n {
			pu, pd, n = 1, 1, 0 // out of order: start again
		}
		for ; n < a; n++ {
			pu, pd = pu*up, pd*down
		}
		if k > 0 {
			f[i] = pu
		} else {
			f[i] = pd
		}
		df[i] = complex(float64(k), 0) * f[i] * slope
	}
}

// ellipseRimImages are a round hole's reflections in the rim of the ellipse
// x²/a² + y²/b² = 1 about the origin, where its terms decay slowly along
// the rim (|ρ/(z − c)| > holeImageDecay somewhere on it): the points
// conj(S(c)), S(z) = ((a² + b²)z ∓ 2ab·√(z² − f²))/f² the ellipse's Schwarz
// function (S(z) = z̄ on the rim; f² = a² − b²), both branches, each a
// Laurent basis of the hole's radius. Across a curved side the solution's
// continuation is singular near these points, as across a wall at the
// hole's mirror image, and the polynomial alone resolved them slowly: a
// 1 × 0.05 ellipse with a hole of radius 0.02 at x = 0.5 took degree 291
// and stopped at 1.2e-10.
func ellipseRimImages(a, b float64, rim SidePath, hb holeBasis) []holeBasis {
	slow := false
	for j := 0; j < 256 && !slow; j++ {
		x, y, _, _ := rim.At(float64(j) / 256)
		v, _ := hb.variable(complex(x, y))
		slow = abs(v) > holeImageDecay
	}
	if !slow || a == b {
		return nil
	}
	rot := complex128(1) // the major axis onto the real one
	if b > a {
		a, b, rot = b, a, complex(0, -1)
	}
	f2 := a*a - b*b
	z := hb.c * rot
	root := cmplx.Sqrt(z*z - complex(f2, 0))
	var out []holeBasis
	for _, sign := range []float64{1, -1} {
		s := (complex(a*a+b*b, 0)*z - complex(2*a*b*sign, 0)*root) / complex(f2, 0)
		p := cmplx.Conj(s) / rot
		out = append(out, holeBasis{c: p, rho: hb.rho})
	}
	return out
}

// bipolarWarps sample the rim (side 0) and the hole (side n−1) of an
// eccentric annulus uniformly in the angle of w = (z − l₁)/(z − l₂), l₁ and
// l₂ = R²/l̄₁ the limiting points, which maps both circles onto circles about
// the origin: the samples crowd into the narrow gap, where the solution
// varies fastest, as the basis in w does.
func bipolarWarps(R float64, l1, c complex128, r float64, n int) []func(float64) float64 {
	l2 := complex(R*R, 0) / cmplx.Conj(l1)
	circle := func(z0 complex128) func(float64) complex128 { // z on the w-circle through z0, by its w-angle
		w0 := (z0 - l1) / (z0 - l2)
		return func(s float64) complex128 {
			w := w0 * cmplx.Rect(1, 2*math.Pi*s)
			return (l1 - l2*w) / (1 - w)
		}
	}
	dir := l1 / complex(abs(l1), 0)
	rim := circle(dir * complex(R, 0))
	hole := circle(c + dir*complex(r, 0))
	warps := make([]func(float64) float64, n)
	warps[0] = func(s float64) float64 {
		a := cmplx.Phase(rim(s)) / (2 * math.Pi)
		return a - math.Floor(a)
	}
	warps[n-1] = func(s float64) float64 {
		a := -cmplx.Phase(hole(s)-c) / (2 * math.Pi) // the hole's circle runs clockwise
		return a - math.Floor(a)
	}
	return warps
}
