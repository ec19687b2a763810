package main

import (
	"math"
)

// isolines are contour lines of a sampled field by marching squares, drawn
// as segments cell by cell in the cells whose four corners lie in the
// region: a boundary or a hole (NaN) cuts them cleanly, and the cost is
// linear in the cells (the general contour tracer joins paths and excises
// loops, which took seconds on fields with holes).
type isolines struct {
	segs [][4]float64 // x0, y0, x1, y1 in data coordinates
}

func newIsolines(f *field, levels []float64) *isolines {
	out := &isolines{}
	for r := 0; r+1 < f.ny; r++ {
		for c := 0; c+1 < f.nx; c++ {
			z := [4]float64{f.Z(c, r), f.Z(c+1, r), f.Z(c+1, r+1), f.Z(c, r+1)} // counter-clockwise from the lower left
			if math.IsNaN(z[0] + z[1] + z[2] + z[3]) {
				continue
			}
			x := [4]float64{f.X(c), f.X(c + 1), f.X(c + 1), f.X(c)}
			y := [4]float64{f.Y(r), f.Y(r), f.Y(r + 1), f.Y(r + 1)}
			for _, lv := range levels {
				// The crossings on the cell's four edges, in order round it.
				var pts [][2]float64
				for e := 0; e < 4; e++ {
					a, b := z[e], z[(e+1)%4]
					if (a < lv) == (b < lv) {
						continue
					}
					t := (lv - a) / (b - a)
					nx, ny := x[(e+1)%4], y[(e+1)%4]
					pts = append(pts, [2]float64{x[e] + t*(nx-x[e]), y[e] + t*(ny-y[e])})
				}
				seg := func(i, j int) [4]float64 { return [4]float64{pts[i][0], pts[i][1], pts[j][0], pts[j][1]} }
				switch len(pts) {
				case 2:
					out.segs = append(out.segs, seg(0, 1))
				case 4: // a saddle: the centre's side decides the pairing
					if centre := (z[0] + z[1] + z[2] + z[3]) / 4; (centre < lv) == (z[0] < lv) {
						out.segs = append(out.segs, seg(0, 1), seg(2, 3))
					} else {
						out.segs = append(out.segs, seg(0, 3), seg(1, 2))
					}
				}
			}
		}
	}
	return out
}
