package domain

import (
	"math"
	"sort"

	"psol/ansatz"
	"psol/series"
)

// rimData is Dirichlet data on the one circle of a disk or of the region
// outside it. Close to the circle the harmonic series converges slowly, and
// the solution is evaluated as u = u_p + P[g − u_p] with the Poisson integral
//
//	P[f](r, θ) = (1/2π) ∫ (1 − ρ²)/(1 − 2ρ cos(θ − φ) + ρ²) f(φ) dφ,  ρ = r/R (R/r outside),
//
// by Gauss–Legendre panels graded towards φ = θ and broken at the data's pieces.
type rimData struct {
	data    series.Field
	trace   series.Sum // u_p on the circle
	radius  series.Coef
	inverse bool
}

type compiledRim struct {
	g, up   series.CompiledField
	tr      series.Compiled
	R       float64
	inverse bool
	breaks  []float64
}

// legendreX and legendreW are the 16-point Gauss–Legendre rule on [−1, 1] (ansatz.GaussX, GaussW).
var legendreX, legendreW = ansatz.GaussX, ansatz.GaussW

// nearRim is the ρ above which the Poisson integral replaces the series.
const nearRim = 0.9

func (d *rimData) compile(up series.Sum, env series.Env) (*compiledRim, error) {
	g, err := d.data.Compile(env)
	if err != nil {
		return nil, err
	}
	tr, err := d.trace.Compile(env)
	if err != nil {
		return nil, err
	}
	u, err := series.ExactField(up).Compile(env)
	if err != nil {
		return nil, err
	}
	R, err := d.radius.Float(env)
	if err != nil {
		return nil, err
	}
	c := &compiledRim{g: g, up: u, tr: tr, R: R, inverse: d.inverse}
	for _, p := range d.data.Pieces {
		f, _ := p.From.Float64()
		c.breaks = append(c.breaks, f*math.Pi)
	}
	return c, nil
}

func (c *compiledRim) rho(r float64) float64 {
	if c.inverse {
		return c.R / r
	}
	return r / c.R
}

func (c *compiledRim) near(r float64) bool { return c.rho(r) > nearRim && c.rho(r) < 1 }

func (c *compiledRim) at(r, theta float64) float64 {
	rho := c.rho(r)
	f := func(phi float64) float64 {
		// 1 − 2ρ cos x + ρ² = (1 − ρ)² + 4ρ sin²(x/2), without the cancellation near x = 0.
		s := math.Sin((theta - phi) / 2)
		k := (1 - rho) * (1 + rho) / ((1-rho)*(1-rho) + 4*rho*s*s)
		return k * (c.g.At(c.R, phi) - c.tr.At(1, phi))
	}
	edges := []float64{theta - math.Pi, theta + math.Pi}
	for d := (1 - rho) / 4; d < math.Pi; d *= 2.5 {
		edges = append(edges, theta-d, theta+d)
	}
	for _, b := range c.breaks {
		for _, k := range []float64{-2, 0, 2} {
			if x := b + k*math.Pi; x > theta-math.Pi && x < theta+math.Pi {
				edges = append(edges, x)
			}
		}
	}
	sort.Float64s(edges)
	total := 0.0
	for i := 0; i+1 < len(edges); i++ {
		a, b := edges[i], edges[i+1]
		if b <= a {
			continue
		}
		half, mid := (b-a)/2, (a+b)/2
		for k, x := range legendreX {
			total += half * legendreW[k] * f(mid+half*x)
		}
	}
	return c.up.At(r, theta) + total/(2*math.Pi)
}

// attach gives the evaluator the circle's data, for the Poisson integral at
// radii next to the circle, where the series converges too slowly.
func (d *rimData) attach(e *Evaluator, s *Solution, env series.Env) error {
	var err error
	e.rim, err = d.compile(s.Particular, env)
	return err
}
