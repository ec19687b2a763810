package domain

import (
	"container/heap"
	"math"
	"sync"

	"gonum.org/v1/gonum/integrate/quad"

	"psol/ansatz"
	"psol/series"
)

// An areaCell is a piece of a section's area rule: the 16 × 16
// Gauss–Legendre product rule on a triangle (Duffy's collapsed square), on
// a panel of a disk or ellipse in polar coordinates, or on a box, with its
// weights times sign (−1 for a hole's pieces, which the rule subtracts).
// Each splits into four of its own kind, for the refinement (areaNodes).
type areaCell struct {
	shape cellShape
	// A triangle's vertices a, b, c; a box's corners a and b.
	a, b, c [2]float64
	// A polar panel: centre a, semi-axes (sa, sb), ρ ∈ [r0, r1] of the unit
	// disk and φ ∈ [p0, p1]; x = a + (sa·ρ cos φ, sb·ρ sin φ).
	sa, sb, r0, r1, p0, p1 float64
	sign                   float64
}

type cellShape int

const (
	triangleCell cellShape = iota
	polarCell
	boxCell
)

// nodes calls visit with each node and weight of the cell's rule.
func (c areaCell) nodes(visit func(x, y, w float64)) {
	c.rule(ansatz.GaussX, ansatz.GaussW, visit)
}

// gauss8 is the 8-point Gauss–Legendre rule on [−1, 1], the refinement's
// check on the 16-point rule.
var gauss8 = sync.OnceValues(func() ([]float64, []float64) {
	xs, ws := make([]float64, 8), make([]float64, 8)
	quad.Legendre{}.FixedLocations(xs, ws, -1, 1)
	return xs, ws
})

// rule is the cell's product rule on the one-dimensional nodes xs, ws.
func (c areaCell) rule(xs, ws []float64, visit func(x, y, w float64)) {
	switch c.shape {
	case triangleCell:
		a, b, v := c.a, c.b, c.c
		area := math.Abs((b[0]-a[0])*(v[1]-a[1])-(v[0]-a[0])*(b[1]-a[1])) / 2
		for i, u := range xs {
			s := (u + 1) / 2
			for j, t0 := range xs {
				t := (t0 + 1) / 2 * (1 - s)
				w := ws[i] / 2 * ws[j] / 2 * (1 - s) * 2 * area
				visit(a[0]+s*(b[0]-a[0])+t*(v[0]-a[0]), a[1]+s*(b[1]-a[1])+t*(v[1]-a[1]), c.sign*w)
			}
		}
	case polarCell:
		for i, u := range xs {
			rho := c.r0 + (c.r1-c.r0)*(u+1)/2
			for j, v := range xs {
				phi := c.p0 + (c.p1-c.p0)*(v+1)/2
				w := ws[i] * (c.r1 - c.r0) / 2 * ws[j] * (c.p1 - c.p0) / 2 * c.sa * c.sb * rho
				visit(c.a[0]+c.sa*rho*math.Cos(phi), c.a[1]+c.sb*rho*math.Sin(phi), c.sign*w)
			}
		}
	case boxCell:
		dx, dy := c.b[0]-c.a[0], c.b[1]-c.a[1]
		for i, u := range xs {
			for j, v := range xs {
				visit(c.a[0]+dx*(u+1)/2, c.a[1]+dy*(v+1)/2, c.sign*ws[i]*ws[j]/4*dx*dy)
			}
		}
	}
}

// split is the cell in four: a triangle by its midpoints, a panel or a box
// by halving both its ranges.
func (c areaCell) split() [4]areaCell {
	var out [4]areaCell
	switch c.shape {
	case triangleCell:
		mid := func(p, q [2]float64) [2]float64 { return [2]float64{(p[0] + q[0]) / 2, (p[1] + q[1]) / 2} }
		ab, bc, ca := mid(c.a, c.b), mid(c.b, c.c), mid(c.c, c.a)
		for k, t := range [4][3][2]float64{{c.a, ab, ca}, {ab, c.b, bc}, {ca, bc, c.c}, {ab, bc, ca}} {
			out[k] = c
			out[k].a, out[k].b, out[k].c = t[0], t[1], t[2]
		}
	case polarCell:
		rm, pm := (c.r0+c.r1)/2, (c.p0+c.p1)/2
		for k, r := range [4][4]float64{{c.r0, rm, c.p0, pm}, {rm, c.r1, c.p0, pm}, {c.r0, rm, pm, c.p1}, {rm, c.r1, pm, c.p1}} {
			out[k] = c
			out[k].r0, out[k].r1, out[k].p0, out[k].p1 = r[0], r[1], r[2], r[3]
		}
	case boxCell:
		xm, ym := (c.a[0]+c.b[0])/2, (c.a[1]+c.b[1])/2
		for k, r := range [4][4]float64{{c.a[0], xm, c.a[1], ym}, {xm, c.b[0], c.a[1], ym}, {c.a[0], xm, ym, c.b[1]}, {xm, c.b[0], ym, c.b[1]}} {
			out[k] = c
			out[k].a, out[k].b = [2]float64{r[0], r[2]}, [2]float64{r[1], r[3]}
		}
	}
	return out
}

// polarCells are a disk's or an ellipse's panels about centre (cx, cy),
// semi-axes (sa, sb): 8 in ρ by 32 in φ.
func polarCells(cx, cy, sa, sb, sign float64) []areaCell {
	var out []areaCell
	for i := 0; i < 8; i++ {
		for j := 0; j < 32; j++ {
			out = append(out, areaCell{shape: polarCell, a: [2]float64{cx, cy}, sa: sa, sb: sb,
				r0: float64(i) / 8, r1: float64(i+1) / 8, p0: 2 * math.Pi * float64(j) / 32, p1: 2 * math.Pi * float64(j+1) / 32, sign: sign})
		}
	}
	return out
}

// areaRuleTol is the refinement's target: the cells' 16- and 8-point rules
// agree to this share of ∬|f| over the region, summed over the cells.
const areaRuleTol = 1e-14

// areaRuleBudget caps the refinement's evaluations of f beyond the base
// cells': a source with a kink along a curve (abs(x² + y² − 1/4)) asks for
// cells ever smaller along it (the error falls only as the cells' size
// squared), and the budget, spent where the estimates are largest, takes a
// square's integral of it from 4·10⁻⁵ to 2·10⁻⁸ of itself wrong for
// 0.07 s more. A smooth source, however narrow, converges geometrically
// once its cells resolve it.
const areaRuleBudget = 1 << 18

// areaNodes are points and weights of a rule for ∬ g dA over the section
// that resolves f, the source's numeric part, which the integrals read
// (the source's integral, and g = w·f or u_q of the area integral). Each
// cell's error is estimated by its 16-point rule less its 8-point rule
// (the 16-point rule's own is far smaller), and the cell with the largest
// estimate is split in four until the estimates sum to areaRuleTol of
// ∬|f| or areaRuleBudget evaluations are spent. A fixed rule missed a
// narrow source: a polygon's cut into 4 triangles an ear took a bump of
// width 0.1 on a square 7·10⁻⁶ of its integral wrong, and a compatible
// pure Neumann problem with it was refused as incompatible; a disk's, one
// of width 0.01 7·10⁻⁴.
func areaNodes(d section, env series.Env, f func(x, y float64) float64) ([][3]float64, error) {
	cells, err := d.areaCells(env)
	if err != nil {
		return nil, err
	}
	var out [][3]float64
	emit := func(c areaCell) {
		c.nodes(func(x, y, w float64) { out = append(out, [3]float64{x, y, w}) })
	}
	x8, w8 := gauss8()
	evals := 0
	estimate := func(c areaCell) (cellEstimate, float64) {
		var fine, coarse, abs float64
		c.nodes(func(x, y, w float64) {
			v := w * f(x, y)
			fine, abs = fine+v, abs+math.Abs(v)
		})
		c.rule(x8, w8, func(x, y, w float64) { coarse += w * f(x, y) })
		evals += len(ansatz.GaussX)*len(ansatz.GaussX) + len(x8)*len(x8)
		e := math.Abs(fine - coarse)
		if math.IsNaN(e) {
			e = 0 // a singular source: no refinement mends it
		}
		return cellEstimate{c, e}, abs
	}
	h := &estimateHeap{}
	scale, total := 0.0, 0.0
	for _, c := range cells {
		e, a := estimate(c)
		heap.Push(h, e)
		scale, total = scale+a, total+e.err
	}
	evals = 0
	for total > areaRuleTol*scale && evals < areaRuleBudget && h.Len() > 0 {
		worst := heap.Pop(h).(cellEstimate)
		total -= worst.err
		for _, p := range worst.cell.split() {
			e, _ := estimate(p)
			heap.Push(h, e)
			total += e.err
		}
	}
	for _, e := range *h {
		emit(e.cell)
	}
	return out, nil
}

// cellEstimate is a cell and its error estimate.
type cellEstimate struct {
	cell areaCell
	err  float64
}

// estimateHeap is a max-heap of cells by their estimates (container/heap).
type estimateHeap []cellEstimate

func (h estimateHeap) Len() int           { return len(h) }
func (h estimateHeap) Less(i, j int) bool { return h[i].err > h[j].err }
func (h estimateHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *estimateHeap) Push(x any)        { *h = append(*h, x.(cellEstimate)) }
func (h *estimateHeap) Pop() any {
	old := *h
	x := old[len(old)-1]
	*h = old[:len(old)-1]
	return x
}
