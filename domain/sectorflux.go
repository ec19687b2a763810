package domain

import (
	"math"

	"psol/series"
)

// sectorSideFluxes are the outward fluxes through the arc and the two rays
// in closed form: the closed part's per term (Sum.SectorFluxes), each series
// part's mode by mode (Series.SectorFluxes), summed like the area integral.
// Panels of differences (sideFluxes) erred by 4e-8 on a 60° sector. ok is
// false where a part has no such form (a quadrature, point sources, jumps in
// the data, logarithms): the caller falls back on panels.
func (d Sector) sectorSideFluxes(s *Solution, env series.Env, tol float64) ([]SideFlux, bool) {
	if s.Quadrature != nil || s.Points != nil {
		return nil, false
	}
	a, ok := AlphaOverPi(d.Alpha)
	if !ok {
		return nil, false
	}
	arc, start, end, err := s.Particular.Add(s.Harmonic).SectorFluxes(d.R, d.Alpha)
	if err != nil {
		return nil, false
	}
	exact := [3]series.Coef{arc, start, end}
	var extra [3]float64
	closed := true
	if s.Series != nil && !s.Series.U.IsZero() {
		if len(s.Series.U.Jumps) > 0 {
			return nil, false
		}
		closed = false
		for _, p := range s.Series.U.Parts {
			ia, is, ie, err := p.SectorFluxes(a)
			if err != nil {
				return nil, false
			}
			for k, sum := range []series.IndexedSum{ia, is, ie} {
				v, err := sum.Extrapolated(env, tol, 1<<22)
				if err != nil || math.IsNaN(v.Value) {
					return nil, false
				}
				extra[k] += v.Value
			}
		}
	}
	var out []SideFlux
	for k, name := range []string{"arc", "start", "end"} {
		c, v, err := sub(exact[k], env)
		if err != nil {
			return nil, false
		}
		f := SideFlux{Side: name, Value: v + extra[k]}
		if closed {
			f.Exact = &c
		}
		out = append(out, f)
	}
	return out, true
}
