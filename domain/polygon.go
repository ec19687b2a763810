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

// Polygon is the region inside the closed outline through its vertices, in
// order, either way round; side sK runs from vertex K to vertex K+1 (the
// last back to the first). Coordinates are exact (numbers or parameters).
type Polygon struct{ X, Y []series.Coef }

func (p Polygon) Sides() []string {
	out := make([]string, len(p.X))
	for k := range out {
		out[k] = fmt.Sprintf("s%d", k+1)
	}
	return out
}

func (p Polygon) Describe() string {
	var vs []string
	for k := range p.X {
		vs = append(vs, "("+p.X[k].Text()+", "+p.Y[k].Text()+")")
	}
	return "the polygon " + strings.Join(vs, ", ")
}

// vertices are the corners in numbers, and the orientation: +1 where they
// run counter-clockwise, −1 clockwise.
func (p Polygon) vertices(env series.Env) (xs, ys []float64, orient float64, err error) {
	if xs, err = floats(env, p.X...); err != nil {
		return
	}
	if ys, err = floats(env, p.Y...); err != nil {
		return
	}
	orient = 1
	if signedArea(xs, ys) < 0 {
		orient = -1
	}
	return
}

func signedArea(xs, ys []float64) float64 {
	a := 0.0
	for k := range xs {
		j := (k + 1) % len(xs)
		a += xs[k]*ys[j] - xs[j]*ys[k]
	}
	return a / 2
}

// PolygonFault is the first fault of an outline in numbers, with the vertex
// (from 0) to point at, or −1 and "" for a sound polygon: fewer than three
// vertices, a side of zero length, a vertex on the line through its
// neighbours (a straight angle or a spike), or two sides that cross or touch.
func PolygonFault(xs, ys []float64) (vertex int, reason string) {
	n := len(xs)
	if n < 3 {
		return n - 1, "a polygon needs at least 3 vertices"
	}
	size := 0.0
	for k := range xs {
		size = math.Max(size, math.Max(math.Abs(xs[k]), math.Abs(ys[k])))
	}
	eps := 1e-12 * math.Max(size, 1e-300)
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		if math.Hypot(xs[j]-xs[k], ys[j]-ys[k]) <= eps {
			return j, fmt.Sprintf("vertex %d repeats vertex %d: the side between them has no length", j+1, k+1)
		}
	}
	for k := 0; k < n; k++ {
		i, j := (k+n-1)%n, (k+1)%n
		ax, ay := xs[k]-xs[i], ys[k]-ys[i]
		bx, by := xs[j]-xs[k], ys[j]-ys[k]
		if math.Abs(ax*by-ay*bx) <= 1e-12*math.Hypot(ax, ay)*math.Hypot(bx, by) {
			return k, fmt.Sprintf("vertex %d lies on the line through its neighbours (a straight angle or a spike): leave it out", k+1)
		}
	}
	for a := 0; a < n; a++ {
		for b := a + 1; b < n; b++ {
			if b == a+1 || a == 0 && b == n-1 {
				continue // neighbours share a vertex
			}
			if segmentsMeet(xs[a], ys[a], xs[(a+1)%n], ys[(a+1)%n], xs[b], ys[b], xs[(b+1)%n], ys[(b+1)%n], eps) {
				return b, fmt.Sprintf("side s%d (from vertex %d) crosses or touches side s%d: the outline must not meet itself", b+1, b+1, a+1)
			}
		}
	}
	if math.Abs(signedArea(xs, ys)) <= eps*eps {
		return 0, "the polygon has no area"
	}
	return -1, ""
}

// segmentsMeet reports whether segments PQ and RS share a point.
func segmentsMeet(px, py, qx, qy, rx, ry, sx, sy, eps float64) bool {
	cross := func(ax, ay, bx, by, cx, cy float64) float64 { return (bx-ax)*(cy-ay) - (by-ay)*(cx-ax) }
	d1, d2 := cross(rx, ry, sx, sy, px, py), cross(rx, ry, sx, sy, qx, qy)
	d3, d4 := cross(px, py, qx, qy, rx, ry), cross(px, py, qx, qy, sx, sy)
	if (d1 > eps && d2 < -eps || d1 < -eps && d2 > eps) && (d3 > eps && d4 < -eps || d3 < -eps && d4 > eps) {
		return true
	}
	on := func(ax, ay, bx, by, cx, cy, d float64) bool {
		return math.Abs(d) <= eps*math.Hypot(bx-ax, by-ay) && math.Min(ax, bx)-eps <= cx && cx <= math.Max(ax, bx)+eps &&
			math.Min(ay, by)-eps <= cy && cy <= math.Max(ay, by)+eps
	}
	return on(rx, ry, sx, sy, px, py, d1) || on(rx, ry, sx, sy, qx, qy, d2) || on(px, py, qx, qy, rx, ry, d3) || on(px, py, qx, qy, sx, sy, d4)
}

// Contains: the crossing rule, with the outline itself inside.
func (p Polygon) Contains(r, theta float64, env series.Env) (bool, error) {
	xs, ys, _, err := p.vertices(env)
	if err != nil {
		return false, err
	}
	x, y := r*math.Cos(theta), r*math.Sin(theta)
	return insidePolygon(xs, ys, x, y), nil
}

func insidePolygon(xs, ys []float64, x, y float64) bool {
	n := len(xs)
	size := 0.0
	for k := range xs {
		size = math.Max(size, math.Hypot(xs[k], ys[k]))
	}
	in := false
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		ax, ay, bx, by := xs[k], ys[k], xs[j], ys[j]
		// On the side (to rounding): inside.
		l := math.Hypot(bx-ax, by-ay)
		if t := ((x-ax)*(bx-ax) + (y-ay)*(by-ay)) / (l * l); t >= 0 && t <= 1 {
			if math.Abs((bx-ax)*(y-ay)-(by-ay)*(x-ax))/l <= 1e-12*math.Max(size, 1) {
				return true
			}
		}
		if (ay > y) != (by > y) && x < ax+(y-ay)*(bx-ax)/(by-ay) {
			in = !in
		}
	}
	return in
}

// Shape: the sides as segments with the outward normal (on the right for a
// counter-clockwise outline, on the left for a clockwise one).
func (p Polygon) Shape(env series.Env) (Shape, error) {
	xs, ys, orient, err := p.vertices(env)
	if err != nil {
		return Shape{}, err
	}
	n := len(xs)
	sh := Shape{Area: math.Abs(signedArea(xs, ys)), Box: Box{math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)}}
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		sh.Sides = append(sh.Sides, orientedSegment(fmt.Sprintf("s%d", k+1), xs[k], ys[k], xs[j], ys[j], orient))
		sh.Box = Box{math.Min(sh.Box.X0, xs[k]), math.Max(sh.Box.X1, xs[k]), math.Min(sh.Box.Y0, ys[k]), math.Max(sh.Box.Y1, ys[k])}
	}
	return sh, nil
}

// orientedSegment is segmentPath with the normal on the side orient says:
// the right for +1 (region on the left), the left for −1.
func orientedSegment(name string, x0, y0, x1, y1, orient float64) SidePath {
	s := segmentPath(name, x0, y0, x1, y1)
	if orient > 0 {
		return s
	}
	return SidePath{Name: name, Length: s.Length, At: func(t float64) (float64, float64, float64, float64) {
		x, y, nx, ny := s.At(t)
		return x, y, -nx, -ny
	}}
}

// geometry: a corner at every vertex, its poles on the exterior bisector.
func (p Polygon) geometry(env series.Env) (sectionGeometry, error) {
	sh, err := p.Shape(env)
	if err != nil {
		return sectionGeometry{}, err
	}
	xs, ys, orient, _ := p.vertices(env)
	n := len(xs)
	g := sectionGeometry{shape: sh, starts: make([]int, n), ends: make([]int, n)}
	for k := 0; k < n; k++ {
		g.centre += complex(xs[k]/float64(n), ys[k]/float64(n))
	}
	for k := 0; k < n; k++ {
		g.scale = math.Max(g.scale, math.Hypot(xs[k]-real(g.centre), ys[k]-imag(g.centre)))
		i, j := (k+n-1)%n, (k+1)%n
		w := complex(xs[k], ys[k])
		a, b := complex(xs[i], ys[i])-w, complex(xs[j], ys[j])-w
		d := a/complex(abs(a), 0) + b/complex(abs(b), 0)
		d /= complex(abs(d), 0)
		// Turning left at a vertex of a counter-clockwise outline: convex,
		// the bisector d points inside and the poles go the other way.
		// The interior angle, from a (back) to b (on) turning through the inside.
		angle := math.Acos(math.Max(-1, math.Min(1, real(cmplx.Conj(a)*b)/(abs(a)*abs(b))))) / math.Pi
		if turn := imag(cmplx.Conj(-a) * b); turn*orient > 0 { // cross(v_k − v_{k−1}, v_{k+1} − v_k)
			d = -d
		} else {
			angle = 2 - angle // re-entrant
		}
		reach := 0.0
		for j := range xs {
			reach = math.Max(reach, abs(complex(xs[j], ys[j])-w))
		}
		g.corners = append(g.corners, corner{w: w, dir: d, angle: angle, reach: reach})
		g.starts[k], g.ends[k] = k, j
	}
	return g, nil
}

// areaCells: the polygon cut into triangles by ear clipping, each triangle
// into 4 by its midpoints (areaNodes refines them further where the
// integrand needs it).
func (p Polygon) areaCells(env series.Env) ([]areaCell, error) {
	xs, ys, orient, err := p.vertices(env)
	if err != nil {
		return nil, err
	}
	var out []areaCell
	for _, tri := range earClip(xs, ys, orient) {
		c := areaCell{shape: triangleCell, a: [2]float64{xs[tri[0]], ys[tri[0]]}, b: [2]float64{xs[tri[1]], ys[tri[1]]}, c: [2]float64{xs[tri[2]], ys[tri[2]]}, sign: 1}
		for _, piece := range c.split() {
			out = append(out, piece)
		}
	}
	return out, nil
}

// earClip cuts a simple polygon into triangles: repeatedly the first
// convex vertex whose triangle holds no other vertex.
func earClip(xs, ys []float64, orient float64) [][3]int {
	idx := make([]int, len(xs))
	for i := range idx {
		idx[i] = i
	}
	cross := func(a, b, c int) float64 {
		return orient * ((xs[b]-xs[a])*(ys[c]-ys[a]) - (ys[b]-ys[a])*(xs[c]-xs[a]))
	}
	var out [][3]int
	for len(idx) > 3 {
		cut := false
		for k := range idx {
			a, b, c := idx[(k+len(idx)-1)%len(idx)], idx[k], idx[(k+1)%len(idx)]
			if cross(a, b, c) <= 0 {
				continue // reflex: not an ear
			}
			ear := true
			for _, o := range idx {
				if o != a && o != b && o != c && cross(a, b, o) >= 0 && cross(b, c, o) >= 0 && cross(c, a, o) >= 0 {
					ear = false
					break
				}
			}
			if ear {
				out = append(out, [3]int{a, b, c})
				idx = append(idx[:k], idx[k+1:]...)
				cut = true
				break
			}
		}
		if !cut { // rounding on a degenerate outline: close with a fan
			break
		}
	}
	for k := 1; k+1 < len(idx); k++ {
		out = append(out, [3]int{idx[0], idx[k], idx[k+1]})
	}
	return out
}

func abs(z complex128) float64 { return math.Hypot(real(z), imag(z)) }

func (p Polygon) solve(ps *posed) (*Solution, error) { return solveSection(p, ps) }

// Measures: the area by the shoelace formula and each side's length, exact.
func (p Polygon) Measures() Measures {
	n := len(p.X)
	area := series.Coef{}
	lengths := map[string]series.Coef{}
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		area = area.Add(p.X[k].Mul(p.Y[j]).Sub(p.X[j].Mul(p.Y[k])))
		dx, dy := p.X[j].Sub(p.X[k]), p.Y[j].Sub(p.Y[k])
		sq := dx.Mul(dx).Add(dy.Mul(dy))
		l, err := sq.Pow(big.NewRat(1, 2))
		if err != nil { // not a perfect square: a 15-digit decimal, where it is a number
			if v, errF := sq.Float(nil); errF == nil {
				l, err = decimal(math.Sqrt(v)), nil
			}
		}
		if err == nil {
			lengths[fmt.Sprintf("s%d", k+1)] = l
		}
	}
	area = area.MulRat(big.NewRat(1, 2))
	if !series.Positive(area) {
		area = area.Neg()
	}
	return Measures{Area: area, Lengths: lengths}
}

// integral: a closed field on a polygon as a polynomial in x and y, by
// Green's theorem side by side: ∬ x^i y^j dA = ∮ x^(i+1) y^j/(i+1) dy, each
// side x = x0 + t·dx, y = y0 + t·dy expanded binomially; exact.
func (p Polygon) integral(u series.Sum) (series.Coef, error) {
	poly, err := cart.FromPolar(u)
	if err != nil {
		return series.Coef{}, err
	}
	n := len(p.X)
	total := series.Coef{}
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		x0, y0 := p.X[k], p.Y[k]
		dx, dy := p.X[j].Sub(x0), p.Y[j].Sub(y0)
		for _, t := range poly.Terms() {
			total = total.Add(t.C.Mul(sideMoment(x0, dx, y0, dy, t.I+1, t.J)).MulRat(big.NewRat(1, int64(t.I+1))))
		}
	}
	if !series.Positive(p.Measures().Area) || len(p.X) == 0 {
		return total, nil
	}
	// The formula gives the signed integral: negative for a clockwise outline.
	signed := series.Coef{}
	for k := 0; k < n; k++ {
		j := (k + 1) % n
		signed = signed.Add(p.X[k].Mul(p.Y[j]).Sub(p.X[j].Mul(p.Y[k])))
	}
	if !series.Positive(signed) {
		total = total.Neg()
	}
	return total, nil
}

// sideMoment is ∫₀¹ (x0 + t dx)^a (y0 + t dy)^b dy dt.
func sideMoment(x0, dx, y0, dy series.Coef, a, b int) series.Coef {
	out := series.Coef{}
	for i := 0; i <= a; i++ {
		for j := 0; j <= b; j++ {
			c := binom(a, i) * binom(b, j)
			term := pow(x0, a-i).Mul(pow(dx, i)).Mul(pow(y0, b-j)).Mul(pow(dy, j)).Mul(dy)
			out = out.Add(term.MulRat(big.NewRat(c, int64(i+j+1))))
		}
	}
	return out
}

func binom(n, k int) int64 {
	out := int64(1)
	for i := 1; i <= k; i++ {
		out = out * int64(n-k+i) / int64(i)
	}
	return out
}

func pow(c series.Coef, n int) series.Coef {
	out := series.IntCoef(1)
	for i := 0; i < n; i++ {
		out = out.Mul(c)
	}
	return out
}

func (p Polygon) figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error {
	return sectionFigures(p, s, ev, rep, env)
}

func (p Polygon) claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	return shapeClaimSide(p, side, cond, claim, env)
}

func (p Polygon) samples(env series.Env) ([][2]float64, error) { return shapeSamples(p, env) }

func (Polygon) printsInXY() bool { return true }

func (p Polygon) insideXY(env series.Env) (func(x, y float64) bool, error) {
	xs, ys, _, err := p.vertices(env)
	if err != nil {
		return nil, err
	}
	return func(x, y float64) bool { return insidePolygon(xs, ys, x, y) }, nil
}

func (p Polygon) containsXY(x, y float64, env series.Env) (bool, error) {
	in, err := p.insideXY(env)
	return err == nil && in(x, y), err
}
