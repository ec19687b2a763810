package domain

import (
	"math"

	"psol/ansatz"
	"psol/series"
)

// sideBreak is a point inside side at parameter t where the side's data
// (the boundary condition less u_p's share) lose smoothness, and the index
// of the corner of angle π placed there.
type sideBreak struct {
	side, corner int
	t            float64
	closed       bool // the side is a closed curve: t wraps round
}

// addKinkBreaks places a corner of angle π (its poles along the outward
// normal) wherever the line of one of the source's kinks crosses a side.
// u_p = c·|ℓ|³/(6|∇ℓ|²) is C² but its third derivative jumps on ℓ = 0, so
// the correction the harmonic part must supply on the boundary has a
// singularity of that order at each crossing: the rational fit converges
// root-exponentially with poles gathered towards a boundary singularity, as
// at a corner (Gopal & Trefethen 2019, who treat corners and boundary
// singularities alike), and only algebraically without (a rectangle with
// Δu = |x − 0.5| stopped at 2e-8 of its data after twelve fits).
func addKinkBreaks(g *sectionGeometry, q *ansatz.Quadrature) {
	if q == nil || len(q.Kinks) == 0 {
		return
	}
	kinks := q.GlobalKinks()
	for k := range g.shape.Sides {
		addBreaksOn(g, k, kinks)
	}
}

// addDataKinkBreaks does the same where a side's own data have kinks
// c·|ℓ| (max and min lower to them): there the data's first derivative
// jumps, and the harmonic part has a singularity like (z − z₀)log(z − z₀)
// at the crossing (Gopal & Trefethen's boundary singularities again). The
// fit had no poles there and stalled at 2.8e-3 (u = |x − 0.5| on a 2 × 1
// rectangle, after twelve fits and 2.7 s).
func addDataKinkBreaks(g *sectionGeometry, conds map[string]Condition, env series.Env) {
	for k, side := range g.shape.Sides {
		c, ok := conds[side.Name]
		if !ok || c.G.Rest == nil {
			continue
		}
		if kinks := ansatz.KinkLines(c.G.Rest, env); len(kinks) > 0 {
			addBreaksOn(g, k, kinks)
		}
	}
}

// addBreaksOn places a break where a kink's line crosses side k, unless a
// vertex or a break already stands there.
func addBreaksOn(g *sectionGeometry, k int, kinks []ansatz.Kink) {
	side := g.shape.Sides[k]
	path := func(t float64) (float64, float64) { x, y, _, _ := side.At(t); return x, y }
	x0, y0 := path(0)
	x1, y1 := path(1)
	closed := math.Hypot(x1-x0, y1-y0) <= 1e-12*g.scale
	for _, kink := range kinks {
	crossings:
		for _, t := range kink.Crossings(path, 1024) {
			// At a vertex the corner's own poles serve.
			if !closed && math.Min(t, 1-t)*side.Length < 1e-9*g.scale {
				continue
			}
			for _, b := range g.breaks {
				if b.side == k && math.Abs(b.t-t)*side.Length < 1e-9*g.scale {
					continue crossings
				}
			}
			x, y, nx, ny := side.At(t)
			g.breaks = append(g.breaks, sideBreak{side: k, corner: len(g.corners), t: t, closed: closed})
			g.corners = append(g.corners, corner{w: complex(x, y), dir: complex(nx, ny), angle: 1, reach: 2 * g.scale})
		}
	}
}
