package domain

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"psol/series"
)

// Figure is one number a practitioner quotes, with its definition: the value
// in float64, the exact form where the solution is closed (with parameters
// left as symbols in a symbolic report), and where it is attained for a peak.
type Figure struct {
	Name        string       // e.g. "J", "fRe"
	Value       float64      // NaN in a symbolic report where no exact form exists
	Exact       *series.Coef // nil where numeric
	Description string       // the definition and its reading, one line
	At          *[2]float64  // (x, y) where a peak is attained
	Warnings    []string     // what the figure assumes that the problem does not give
	// Digits are the significant digits the value carries, where fewer than
	// printing's 12 (a figure from finite differences); 0 means 12.
	Digits int
}

// Quantity is a set of figures of one trade, computed from a solution and
// its report.
type Quantity struct {
	Name, Help string
	figures    func(s *Solution, rep *Report) ([]Figure, error)
}

// Quantities are the presets, in the order help lists them.
var Quantities = []Quantity{
	{"flow", "duct flow: flow rate, mean velocity, hydraulic diameter from the wetted perimeter, fRe", flowFigures},
	{"torsion", "Saint-Venant torsion: torsion constant J (holes included) and peak shear", torsionFigures},
	{"peak", "the largest value of u and where it is", peakFigures},
}

// QuantityNames lists the presets' names.
func QuantityNames() []string {
	var out []string
	for _, q := range Quantities {
		out = append(out, q.Name)
	}
	return out
}

// Quantity computes the named preset's figures from the solution's report.
func (s *Solution) Quantity(name string, rep *Report) ([]Figure, error) {
	if s.Points != nil {
		return nil, unsupported("the figure sets (flow, torsion, ...) are for a distributed source; with point sources, --report gives the figures (the extremes, the area integral, the flux through each side)")
	}
	for _, q := range Quantities {
		if q.Name == name {
			return q.figures(s, rep)
		}
	}
	return nil, fmt.Errorf("no figure set %q; choose one of %s", name, strings.Join(QuantityNames(), ", "))
}

// constantSource is c where Δu = c with c a constant (parameters allowed).
func (s *Solution) constantSource() (series.Coef, bool) {
	if s.Quadrature != nil || s.Rect != nil && (len(s.Rect.Waves) > 0 || s.Rect.Quadrature != nil) {
		return series.Coef{}, false
	}
	return s.Source.Const()
}

// exactOrValue makes a figure from an exact coefficient where there is one
// (its value from the parameters), else from the number.
func (s *Solution) figure(name, desc string, exact *series.Coef, v float64) Figure {
	f := Figure{Name: name, Value: v, Description: desc}
	if exact != nil {
		f.Exact = exact
		if x, err := exact.Float(s.Options.Env); err == nil {
			f.Value = x
		} else {
			f.Value = math.NaN()
		}
	}
	return f
}

// combine is op on two figures' exact forms where both have them.
func combine(a, b *series.Coef, op func(x, y series.Coef) (series.Coef, error)) *series.Coef {
	if a == nil || b == nil {
		return nil
	}
	c, err := op(*a, *b)
	if err != nil {
		return nil
	}
	return &c
}

func div(x, y series.Coef) (series.Coef, error) { return x.Div(y) }
func mul(x, y series.Coef) (series.Coef, error) { return x.Mul(y), nil }

// wetted reports a side that is a wall of a duct: one where u is given
// (Dirichlet, no slip) or a slip law (Robin). A side with a flux condition
// is a symmetry line or a free surface, and not wetted.
func wetted(c Condition) bool { return c.Kind == Dirichlet || c.Kind == Robin }

// flowFigures are the duct figures for Δu = c (c = −G/μ, G the pressure drop
// per length, μ the viscosity): Q = ∬u dA, ū = Q/A, D_h = 4A/P with P the
// wetted perimeter, and the Fanning product fRe = D_h²·(−c)/(2ū), which for
// the pipe is 16 whatever G and μ (Shah & London 1978).
func flowFigures(s *Solution, rep *Report) ([]Figure, error) {
	m := s.Domain.Measures()
	if m.Unbounded {
		return nil, unsupported("flow figures need a bounded section; %s is not", s.Domain.Describe())
	}
	q := s.figure("Q", "flow rate: the area integral of u", rep.IntegralExact, rep.Integral)
	area := m.Area
	mean := s.figure("u_mean", "mean velocity Q/A", combine(q.Exact, &area, div), rep.Mean)
	out := []Figure{q, mean}
	var wet, dry, moving []string
	for _, side := range s.Sides {
		c := side.Condition
		switch {
		case !wetted(c):
			dry = append(dry, c.Side)
		default:
			wet = append(wet, c.Side)
			if !c.G.IsExact() || !c.G.Exact.IsZero() {
				moving = append(moving, c.Side)
			}
		}
	}
	if len(wet) == 0 {
		out[1].Warnings = append(out[1].Warnings, "no side is a wall (u or a slip law given), so there is no wetted perimeter and no fRe")
		return out, nil
	}
	isWet := map[string]bool{}
	for _, w := range wet {
		isWet[w] = true
	}
	p := m.Perimeter(func(side string) bool { return isWet[side] })
	four := series.IntCoef(4)
	dhExact, err := area.Mul(four).Div(p)
	var dh Figure
	if err == nil {
		dh = s.figure("D_h", "hydraulic diameter 4A/P, P the wetted perimeter: "+strings.Join(wet, ", "), &dhExact, math.NaN())
	} else {
		dh = Figure{Name: "D_h", Value: math.NaN(), Description: "hydraulic diameter 4A/P"}
	}
	if len(dry) > 0 {
		dh.Description += fmt.Sprintf(" (not %s: a flux condition marks a symmetry line or a free surface)", strings.Join(dry, ", "))
	}
	c, ok := s.constantSource()
	switch {
	case !ok:
		dh.Warnings = append(dh.Warnings, "no fRe: it needs a constant source, lap(u) = -G/mu (a uniform pressure gradient), and this source is "+series.Field{Exact: s.Source, Rest: s.NonPolarSource()}.Text())
		return append(out, dh), nil
	case c.IsZero():
		dh.Warnings = append(dh.Warnings, "no fRe: the source is zero (no pressure gradient)")
		return append(out, dh), nil
	}
	out = append(out, dh)
	// fRe = D_h²·(−c)/(2ū).
	var fre *series.Coef
	if dh.Exact != nil && mean.Exact != nil {
		num := dh.Exact.Mul(*dh.Exact).Mul(c.Neg())
		if v, err := num.Div(mean.Exact.MulRat(ratOf(2))); err == nil {
			fre = &v
		}
	}
	cv, _ := c.Float(s.Options.Env)
	f := s.figure("fRe", "Fanning friction factor times Reynolds number, D_h^2*(-c)/(2*u_mean) for lap(u) = c", fre, dh.Value*dh.Value*(-cv)/(2*mean.Value))
	if len(moving) > 0 {
		sort.Strings(moving)
		f.Warnings = append(f.Warnings, fmt.Sprintf("fRe assumes still walls (u = 0 on every wetted side), but u is not 0 on %s (a moving wall or slip data): the duct tables' fRe does not apply", strings.Join(moving, ", ")))
	}
	return append(out, f), nil
}

// torsionFigures are Saint-Venant's for Δφ = c (c = −2 in the usual
// normalisation, φ the Prandtl stress function over Gθ): φ = φ₀ on the outer
// boundary, one constant φ_k on each hole, and
//
//	J = −(4/c)·(∬(φ − φ₀) dA + Σ_k (φ_k − φ₀)·A_k)
//
// (Timoshenko & Goodier, multiply connected sections; for c = −2 it is
// 2∬φ dA + 2Σφ_k A_k). The peak shear stress is Gθ·(−2/c)·max|∇φ|.
func torsionFigures(s *Solution, rep *Report) ([]Figure, error) {
	m := s.Domain.Measures()
	if m.Unbounded {
		return nil, unsupported("torsion figures need a bounded section; %s is not", s.Domain.Describe())
	}
	c, ok := s.constantSource()
	if !ok || c.IsZero() {
		return nil, unsupported("torsion figures need a constant source, lap(u) = -2 (or any constant); this source is %s", series.Field{Exact: s.Source, Rest: s.NonPolarSource()}.Text())
	}
	var outer *series.Coef
	holeValue := map[string]series.Coef{}
	var warnings []string
	for _, side := range s.Sides {
		cond := side.Condition
		key := holeGroup(cond.Side) // a polygon hole's edges are one hole
		_, hole := m.Holes[key]
		var v series.Coef
		switch {
		case cond.Kind == Floating:
			v = s.Floating[key]
		case cond.Kind == Dirichlet && cond.G.IsExact() && !cond.G.Exact.HasAngle():
			k, isConst := cond.G.Exact.Const()
			if !isConst {
				return nil, unsupported("torsion figures need u constant on %s (the stress function is constant on each boundary curve), not %s", cond.Side, cond.G.Text())
			}
			v = k
		default:
			return nil, unsupported("torsion figures need u constant on every side (the stress function is constant on each boundary curve); %s has %s", cond.Side, cond.Text)
		}
		if !hole {
			if outer != nil && !outer.Equal(v) {
				return nil, unsupported("torsion figures need one value of u on the whole outer boundary; it takes %s and %s", outer.Text(), v.Text())
			}
			outer = &v
			continue
		}
		if prev, seen := holeValue[key]; seen && !prev.Equal(v) {
			return nil, unsupported("torsion figures need one value of u on each hole; %s takes %s and %s", key, prev.Text(), v.Text())
		}
		holeValue[key] = v
		if cond.Kind == Dirichlet && key == cond.Side { // single-valued warping asks ∮ ∂φ/∂n ds = −c·A_k (the region's outward normal)
			want := c.Neg().Mul(m.Holes[cond.Side])
			for _, f := range rep.Sides {
				if f.Side != cond.Side {
					continue
				}
				w, err := want.Float(s.Options.Env)
				off := err == nil && !math.IsNaN(f.Value) && math.Abs(f.Value-w) > 1e-6*math.Max(1, math.Abs(w))
				if f.Exact != nil {
					off = !f.Exact.Equal(want)
				}
				if off {
					warnings = append(warnings, fmt.Sprintf("the value given on %s does not keep the warping single-valued (its net flux is %.6g, not %.6g); give --bc \"%s: u = const, flux = %s\" and psol finds the value", cond.Side, f.Value, w, cond.Side, want.Text()))
				}
			}
		}
	}
	// J = −(4/c)·(∬φ dA − φ₀·A + Σ (φ_k − φ₀)·A_k).
	scale, err := series.IntCoef(-4).Div(c)
	if err != nil {
		return nil, err
	}
	base := series.Coef{}
	if outer != nil {
		base = *outer
	}
	extra := base.Neg().Mul(m.Area)
	for side, v := range holeValue {
		extra = extra.Add(v.Sub(base).Mul(m.Holes[side]))
	}
	var jExact *series.Coef
	if rep.IntegralExact != nil {
		j := rep.IntegralExact.Add(extra).Mul(scale)
		jExact = &j
	}
	jv := math.NaN()
	if e, err := extra.Float(s.Options.Env); err == nil {
		sv, _ := scale.Float(s.Options.Env)
		jv = (rep.Integral + e) * sv
	}
	desc := "torsion constant 2*(area integral of u) for lap(u) = -2, u = 0 outside"
	if len(holeValue) > 0 {
		var names []string
		for side := range holeValue {
			names = append(names, side)
		}
		sort.Strings(names)
		desc = "torsion constant 2*(area integral of u) + 2*sum(u_hole*A_hole) over the holes (" + strings.Join(names, ", ") + ") for lap(u) = -2, u = 0 outside"
	}
	j := s.figure("J", desc, jExact, jv)
	j.Warnings = warnings
	out := []Figure{j}
	if g := rep.Gradient; g != nil {
		sv, err := series.IntCoef(-2).Div(c)
		if err == nil {
			if k, err := sv.Float(s.Options.Env); err == nil {
				digits := 9 // from differences
				if g.Exact {
					digits = 0 // from the exact derivatives: printing's 12
				}
				tau := Figure{Name: "tau_max", Value: k * g.Value, At: &g.At, Digits: digits,
					Description: "peak shear stress over G*theta: the largest |grad u| for lap(u) = -2 (on the boundary, where the stress function is steepest)"}
				if g.Corner {
					tau.Warnings = append(tau.Warnings, "the largest value is at a re-entrant corner, where the stress is unbounded in this model: the figure is where sampling stopped")
				}
				out = append(out, tau)
			}
		}
	}
	return out, nil
}

// peakFigures are the largest value of u and where it is.
func peakFigures(s *Solution, rep *Report) ([]Figure, error) {
	if rep.Symbolic {
		return nil, unsupported("the peak of u needs every parameter's value: %s", strings.Join(rep.Open, ", "))
	}
	at := polarToXY(rep.ArgMax)
	return []Figure{{Name: "u_max", Value: rep.Max, At: &at, Description: "the largest value of u (a peak temperature, the centreline velocity)"}}, nil
}

func polarToXY(p [2]float64) [2]float64 {
	return [2]float64{p[0] * math.Cos(p[1]), p[0] * math.Sin(p[1])}
}
