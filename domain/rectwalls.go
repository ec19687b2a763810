package domain

import (
	"psol/series"
	"psol/series/cart"
)

// rectEdge is one side of the rectangle [0, L] × [0, H]: which coordinate
// runs along it (s, from the lower end), where it lies across, its outward
// normal, and the sides it meets at s = 0 and s = ℓ and faces.
type rectEdge struct {
	name             string
	wall             Wall
	alongY           bool       // x is fixed and y runs along (left, right)
	far              bool       // at x = L or y = H, not at 0
	normal           [2]float64 // outward unit normal
	start, end, away string
}

// rectEdges is the rectangle's one table of sides, in Sides() order.
var rectEdges = [...]rectEdge{
	{"left", Left, true, false, [2]float64{-1, 0}, "bottom", "top", "right"},
	{"right", Right, true, true, [2]float64{1, 0}, "bottom", "top", "left"},
	{"bottom", Bottom, false, false, [2]float64{0, -1}, "left", "right", "top"},
	{"top", Top, false, true, [2]float64{0, 1}, "left", "right", "bottom"},
}

// edgeNamed is the side with that name; the names are the table's.
func edgeNamed(name string) rectEdge {
	for _, e := range rectEdges {
		if e.name == name {
			return e
		}
	}
	panic("domain: no rectangle side " + name) // names come from Sides(): a bug, not input
}

// index is the side's place in Sides().
func (e rectEdge) index() int { return int(e.wall) }

// length is ℓ, the side's length: H for left and right, L for bottom and top.
func (e rectEdge) length(d Rect) series.Coef {
	if e.alongY {
		return d.H
	}
	return d.L
}

// lengthFloat is ℓ in float64 for the numeric side lengths L and H.
func (e rectEdge) lengthFloat(L, H float64) float64 {
	if e.alongY {
		return H
	}
	return L
}

// across is the fixed coordinate's value: 0, L or H.
func (e rectEdge) across(d Rect) series.Coef {
	switch {
	case !e.far:
		return series.Coef{}
	case e.alongY:
		return d.L
	}
	return d.H
}

// point is (x, y) at the side coordinate s.
func (e rectEdge) point(s, L, H float64) (x, y float64) {
	across := 0.0
	if e.far {
		across = e.lengthFloat(H, L) // the other side's length
	}
	if e.alongY {
		return across, s
	}
	return s, across
}

// corner is the exact (x, y) of the side's end at s = 0, or s = ℓ when atEnd.
func (e rectEdge) corner(d Rect, atEnd bool) (x, y series.Coef) {
	s := series.Coef{}
	if atEnd {
		s = e.length(d)
	}
	if e.alongY {
		return e.across(d), s
	}
	return s, e.across(d)
}

// where is the side's points as text, e.g. "0, y" or "x, 2".
func (e rectEdge) where(d Rect) string {
	if e.alongY {
		return e.across(d).Text() + ", y"
	}
	return "x, " + e.across(d).Text()
}

// restrict is the polynomial q(x, y) on the side, in the side's coordinate.
func (e rectEdge) restrict(d Rect, q cart.Poly) cart.Poly {
	if e.alongY {
		return q.AtX(e.across(d))
	}
	return q.AtY(e.across(d))
}

// outward is the outward normal derivative of q, as a polynomial in x and y.
func (e rectEdge) outward(q cart.Poly) cart.Poly {
	d := q.DY()
	if e.alongY {
		d = q.DX()
	}
	if e.far {
		return d
	}
	return d.Scale(series.IntCoef(-1))
}
