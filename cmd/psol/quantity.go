package main

import (
	"fmt"
	"math"

	"psol/domain"
)

// quantity computes a named figure from the report. Each preset states its
// physical reading and the usual caution:
//
//	flow:    Δu = −G/μ with u = 0 on the walls: u is the axial velocity,
//	         Q = ∬u dA the flow rate, ū = Q/A, and for Δu = −1 the Fanning
//	         product fRe = D_h²/(2ū) with D_h = 4A/P.
//	torsion: Δφ = −2 with φ = 0 on the outer boundary: J = 2∬φ dA
//	         (Saint-Venant; a hole needs its own constant φ on its boundary).
//	peak:    the largest value of u and where it is (a peak temperature, say).
func quantity(name string, pr *problem, rep *domain.Report) ([]string, error) {
	var out []string
	switch name {
	case "flow":
		out = append(out, fmt.Sprintf("flow rate Q = area integral of u = %.12g", rep.Integral), fmt.Sprintf("mean velocity = Q/A = %.12g", rep.Mean))
		if a, p, ok := areaPerimeter(pr); ok && rep.Mean != 0 {
			dh := 4 * a / p
			out = append(out, fmt.Sprintf("hydraulic diameter D_h = 4A/P = %.12g; for lap(u) = -1, fRe = D_h^2/(2*mean) = %.12g", dh, dh*dh/(2*rep.Mean)))
		}
	case "torsion":
		out = append(out, fmt.Sprintf("torsion constant J = 2 * area integral of u = %.12g (u the stress function of lap(u) = -2, zero on the outer boundary)", 2*rep.Integral))
	case "peak":
		out = append(out, fmt.Sprintf("peak u = %.12g at %s", rep.Max, where(rep.ArgMax)))
	default:
		return nil, usagef("--quantity %q: choose flow, torsion or peak", name)
	}
	return append(out, caution), nil
}

// areaPerimeter is the region's area and wetted perimeter, numerically.
func areaPerimeter(pr *problem) (float64, float64, bool) {
	shape, err := pr.domain.Shape(pr.env)
	if err != nil {
		return 0, 0, false
	}
	return shape.Area, shape.Perimeter(), !math.IsInf(shape.Area, 1) // an unbounded region is no duct
}
