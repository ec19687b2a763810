package domain

import (
	"math"

	"psol/ansatz"
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
	for k, side := range g.shape.Sides {
		path := func(t float64) (float64, float64) { x, y, _, _ := side.At(t); return x, y }
		x0, y0 := path(0)
		x1, y1 := path(1)
		closed := math.Hypot(x1-x0, y1-y0) <= 1e-12*g.scale
		for _, kink := range q.Kinks {
			for _, t := range kink.Crossings(path, 1024) {
				// At a vertex the corner's own poles serve.
				if !closed && math.Min(t, 1-t)*side.Length < 1e-9*g.scale {
					continue
				}
				x, y, nx, ny := side.At(t)
				g.breaks = append(g.breaks, sideBreak{side: k, corner: len(g.corners), t: t, closed: closed})
				g.corners = append(g.corners, corner{w: complex(x, y), dir: complex(nx, ny), angle: 1, reach: 2 * g.scale})
			}
		}
	}
}
