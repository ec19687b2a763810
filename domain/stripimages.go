package domain

import (
	"fmt"
	"math"
	"math/big"

	"psol/series"
)

// Images in two parallel walls. A rectangle whose two opposite sides both
// carry values (u = g) or both a flux, or one each, reflects a point source
// into an infinite row of images along the walls' normal; the row sums in
// closed form (the strip's Green's function, by the conformal map
// w = sin(πz/p)): with the walls at x = 0 and x = L,
//
//	values on both:  (Q/4π)·(ln|sin(π(z − z₀)/2L)|² − ln|sin(π(z + z̄₀)/2L)|²)
//	a flux on both:  (Q/4π)·(ln|sin(π(z − z₀)/2L)|² + ln|sin(π(z + z̄₀)/2L)|²)
//
// and with values at x = 0 and a flux at x = L the same pair for the strip of
// width 2L, for z₀ and for its mirror 2L − z̄₀ (period 4L). u_s is then zero on
// the value wall and has no flux through the flux wall (the terms pair off
// under each wall's reflection, modulo the period: verifyStrip). Its trace on
// the other two sides is smooth data for w, sampled as for any source,
// with no singularity at the corners.

// stripImages fits a rectangle with a pair of opposite sides of kinds
// Dirichlet or Neumann; where both pairs are, the walls are the pair whose
// row runs along the rectangle's longer side (the sinh arguments stay small).
func stripImages(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool) {
	rect, ok := d.(Rect)
	if !ok {
		return nil, false
	}
	L, okL := rect.L.Rat()
	H, okH := rect.H.Rat()
	if !okL || !okH {
		return nil, false
	}
	wallKind := func(a, b string) (Kind, Kind, bool) {
		ka, kb := conds[a].Kind, conds[b].Kind
		ok := (ka == Dirichlet || ka == Neumann) && (kb == Dirichlet || kb == Neumann)
		return ka, kb, ok
	}
	lo, hi, okX := wallKind("left", "right")
	loY, hiY, okY := wallKind("bottom", "top")
	alongY := false // the walls are left and right, the row along x
	switch {
	case okX && okY:
		alongY = H.Cmp(L) > 0
	case okY:
		alongY = true
	case !okX:
		return nil, false
	}
	width, extent := L, H
	if alongY {
		lo, hi, width, extent = loY, hiY, H, L
	}
	period := new(big.Rat).Mul(width, big.NewRat(2, 1))
	if lo != hi {
		period.Mul(period, big.NewRat(2, 1))
	}
	e, _ := new(big.Rat).Quo(extent, period).Float64()
	if math.Pi*e > 300 { // sinh² beyond float64
		return nil, false
	}
	fourPi := series.IntCoef(4).Mul(series.SymCoef(series.Pi))
	pc := series.RatCoef(period)
	var own, images []PointLog
	for _, p := range pts {
		c, _ := p.Q.Div(fourPi)
		// In the walls' frame: a is the coordinate across the walls.
		a, b := p.X, p.Y
		if alongY {
			a, b = p.Y, p.X
		}
		mk := func(c, a series.Coef) PointLog {
			l := PointLog{C: c, X: a, Y: b, Period: pc, AlongY: alongY}
			if alongY {
				l.X, l.Y = b, a
			}
			return l
		}
		// The mirror in the wall at 0, odd for values and even for a flux.
		mirror := c
		if lo == Dirichlet {
			mirror = c.Neg()
		}
		own = append(own, mk(c, a))
		images = append(images, mk(mirror, a.Neg()))
		if lo != hi { // the far wall's mirror 2W − a, with its own mirror in 0
			far := series.RatCoef(new(big.Rat).Mul(width, big.NewRat(2, 1))).Sub(a)
			images = append(images, mk(c, far), mk(mirror, far.Neg()))
		}
	}
	pp := &PointPart{Sources: pts, Logs: append(own, images...), Traces: map[string]series.Field{}}
	walls := [2]string{"left", "right"}
	if alongY {
		walls = [2]string{"bottom", "top"}
	}
	for _, w := range walls {
		pp.Traces[w] = constField(series.Coef{})
	}
	// u_s is odd about a wall with values: zero there, and so is its
	// derivative along the wall (the adjacent sides' normal derivative).
	W, _ := width.Float64()
	var zeros []float64
	for i, k := range []Kind{lo, hi} {
		if k == Dirichlet {
			zeros = append(zeros, float64(i)*W)
		}
	}
	if len(zeros) > 0 {
		pp.zeroAt = func(x, y float64) bool {
			a := x
			if alongY {
				a = y
			}
			for _, z := range zeros {
				if math.Abs(a-z) <= 1e-13*W {
					return true
				}
			}
			return false
		}
	}
	return pp, true
}

// rowArg is |sin(π(z − z₀)/p)|² = sinh(πb/p)² + sin(πa/p)² at the offset
// (dx, dy) from the centre of the k-th row, a along the row and b across.
func (pe *pointEval) rowArg(k int, dx, dy float64) float64 {
	a, b := dx, dy
	if pe.alongY[k] {
		a, b = dy, dx
	}
	p := pe.period[k]
	s, sh := math.Sin(math.Pi*a/p), math.Sinh(math.Pi*b/p)
	return sh*sh + s*s
}

// rowGrad is ∇(C·ln rowArg) at the offset (dx, dy).
func (pe *pointEval) rowGrad(k int, dx, dy float64) (gx, gy float64) {
	a, b := dx, dy
	if pe.alongY[k] {
		a, b = dy, dx
	}
	p := pe.period[k]
	S := pe.rowArg(k, dx, dy)
	ga := pe.c[k] * math.Pi / p * math.Sin(2*math.Pi*a/p) / S
	gb := pe.c[k] * math.Pi / p * math.Sinh(2*math.Pi*b/p) / S
	if pe.alongY[k] {
		return gb, ga
	}
	return ga, gb
}

// rowNear is how many zeros of each side of a row's centre splitRows takes
// as single logarithms: the rest lie at least 2p beyond the region.
const rowNear = 2

// splitRows is pe with each row replaced by its 2·rowNear + 1 zeros nearest
// the centre, z₀ + jp, as single logarithms C·ln|z − z₀ − jp|² (S = 1); and
// the rows' indices, whose remainders the figures add.
func (pe *pointEval) splitRows() (*pointEval, []int) {
	var rows []int
	for k := range pe.c {
		if pe.period[k] != 0 {
			rows = append(rows, k)
		}
	}
	if len(rows) == 0 {
		return pe, nil
	}
	out := &pointEval{k: pe.k, sources: pe.sources}
	add := func(c, x, y, s float64) {
		out.c, out.x, out.y, out.s = append(out.c, c), append(out.x, x), append(out.y, y), append(out.s, s)
		out.period, out.alongY = append(out.period, 0), append(out.alongY, false)
	}
	for k := range pe.c {
		if pe.period[k] == 0 {
			add(pe.c[k], pe.x[k], pe.y[k], pe.s[k])
			continue
		}
		for j := -rowNear; j <= rowNear; j++ {
			x, y := pe.x[k]+float64(j)*pe.period[k], pe.y[k]
			if pe.alongY[k] {
				x, y = pe.x[k], pe.y[k]+float64(j)*pe.period[k]
			}
			add(pe.c[k], x, y, 1)
		}
	}
	return out, rows
}

// rowRest is the k-th row less its nearest zeros' logarithms, and its
// gradient: smooth on the region.
func (pe *pointEval) rowRest(k int, x, y float64) (v, gx, gy float64) {
	dx, dy := x-pe.x[k], y-pe.y[k]
	v = pe.c[k] * math.Log(pe.rowArg(k, dx, dy))
	gx, gy = pe.rowGrad(k, dx, dy)
	for j := -rowNear; j <= rowNear; j++ {
		ex, ey := dx-float64(j)*pe.period[k], dy
		if pe.alongY[k] {
			ex, ey = dx, dy-float64(j)*pe.period[k]
		}
		d2 := ex*ex + ey*ey
		v -= pe.c[k] * math.Log(d2)
		gx -= 2 * pe.c[k] * ex / d2
		gy -= 2 * pe.c[k] * ey / d2
	}
	return v, gx, gy
}

// rowRestArea is ∬ rowRest dA over the rectangle (its box), by 16-point
// Gauss–Legendre on panels no wider than a quarter period.
func (pe *pointEval) rowRestArea(k int, shape Shape) float64 {
	b := shape.Box
	panels := func(size float64) int {
		return min(256, max(2, int(math.Ceil(4*size/pe.period[k]))))
	}
	nx, ny := panels(b.X1-b.X0), panels(b.Y1-b.Y0)
	hx, hy := (b.X1-b.X0)/float64(nx), (b.Y1-b.Y0)/float64(ny)
	total := 0.0
	for i := 0; i < nx; i++ {
		for j := 0; j < ny; j++ {
			for gi, xg := range legendreX {
				x := b.X0 + hx*(float64(i)+(1+xg)/2)
				for gj, yg := range legendreX {
					y := b.Y0 + hy*(float64(j)+(1+yg)/2)
					v, _, _ := pe.rowRest(k, x, y)
					total += v * legendreW[gi] * legendreW[gj] * hx * hy / 4
				}
			}
		}
	}
	return total
}

// rowRestFlux is ∫ ∂(rowRest)/∂n ds over a side, by 16-point Gauss–Legendre
// on 64 panels.
func (pe *pointEval) rowRestFlux(k int, side SidePath) float64 {
	const panels = 64
	total := 0.0
	for i := 0; i < panels; i++ {
		a, b := float64(i)/panels, float64(i+1)/panels
		for j, xg := range legendreX {
			x, y, nx, ny := side.At((a+b)/2 + (b-a)/2*xg)
			_, gx, gy := pe.rowRest(k, x, y)
			total += (b - a) / 2 * legendreW[j] * side.Length * (gx*nx + gy*ny)
		}
	}
	return total
}

// rowText prints a row's argument: sinh(k*(y - Y))^2 + sin(k*(x - X))^2 with
// k = π/p (x and y exchanged along y).
func (l PointLog) rowText(latex bool) string {
	k := mustDiv(series.SymCoef(series.Pi), l.Period)
	a, ac, b, bc := "x", l.X, "y", l.Y
	if l.AlongY {
		a, ac, b, bc = "y", l.Y, "x", l.X
	}
	arg := func(v string, c series.Coef) string {
		if latex {
			off := series.OffsetLaTeX(v, c)
			if !c.IsZero() {
				off = `\left(` + off + `\right)`
			}
			return k.LaTeX() + ` ` + off
		}
		off := series.OffsetText(v, c)
		if !c.IsZero() {
			off = "(" + off + ")"
		}
		return k.Text() + "*" + off
	}
	if latex {
		return `\sinh^2\left(` + arg(b, bc) + `\right) + \sin^2\left(` + arg(a, ac) + `\right)`
	}
	return "sinh(" + arg(b, bc) + ")^2 + sin(" + arg(a, ac) + ")^2"
}

// verifyStrip checks the row's claims exactly: every row has the stated
// period and direction, and under each wall's reflection (a ↦ −a at the
// wall at 0, a ↦ 2W − a at the far wall) the rows pair off modulo the
// period, with the opposite strength at a wall with values and the same
// at a wall with a flux: then u_s is odd, or even, about each wall.
func verifyStrip(d Domain, conds map[string]Condition, pp *PointPart) error {
	rect := d.(Rect)
	l0 := pp.Logs[0]
	width, walls := rect.L, [2]string{"left", "right"}
	if l0.AlongY {
		width, walls = rect.H, [2]string{"bottom", "top"}
	}
	across := func(l PointLog) (series.Coef, series.Coef) {
		if l.AlongY {
			return l.Y, l.X
		}
		return l.X, l.Y
	}
	for w, name := range walls {
		sign := series.IntCoef(1)
		if conds[name].Kind == Dirichlet {
			sign = series.IntCoef(-1)
		}
		wall := width.MulRat(big.NewRat(int64(w), 1))
		for _, l := range pp.Logs {
			if !l.Period.Equal(l0.Period) || l.AlongY != l0.AlongY {
				return fmt.Errorf("the logarithms are not one row")
			}
			a, b := across(l)
			img := wall.MulRat(big.NewRat(2, 1)).Sub(a)
			found := false
			for _, m := range pp.Logs {
				ma, mb := across(m)
				q, ok := mustDiv(ma.Sub(img), l.Period).Rat()
				if ok && q.IsInt() && mb.Equal(b) && m.C.Equal(l.C.Mul(sign)) {
					found = true
					break
				}
			}
			if !found {
				return fmt.Errorf("the row at %s has no mirror image in %s", a.Text(), name)
			}
		}
	}
	return nil
}
