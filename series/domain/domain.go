package domain

import (
	"fmt"
	"math/big"

	"psol/ansatz"
	"psol/series"
)

// Unsolvable reports a well-formed problem that has no solution as posed.
type Unsolvable struct{ Reason string }

func (e *Unsolvable) Error() string { return e.Reason }

func unsolvable(format string, args ...any) error {
	return &Unsolvable{fmt.Sprintf(format, args...)}
}

// Unsupported reports a problem psol cannot yet put in closed form.
type Unsupported struct{ Reason string }

func (e *Unsupported) Error() string { return e.Reason }

// Domain is a region psol solves on.
type Domain interface {
	// Sides names the boundary parts, in the order output lists them.
	Sides() []string
	// Describe is a phrase such as "the disk r < 2".
	Describe() string
	// Contains reports whether the point (r, θ) lies in the closed region.
	Contains(r, theta float64, env series.Env) (bool, error)
	// admit refuses a source the region cannot take (e.g. not integrable).
	admit(f series.Sum) error
	// side is the boundary part of that name.
	side(name string) circle
	// harmonic solves Δh = 0 with B_side h = data_side on every side.
	harmonic(data map[string]series.Sum, conds map[string]Condition) (series.Sum, []string, error)
}

// circle is a boundary circle r = radius, with the outward normal along
// +r (outward = 1) or −r (outward = −1).
type circle struct {
	name    string
	radius  series.Coef
	outward int64
}

// apply is the condition's operator on s at this circle: u, ∂u/∂n or ∂u/∂n + h·u.
func (c circle) apply(cond Condition, s series.Sum) (series.Sum, error) {
	if cond.Kind == Dirichlet {
		return s.Trace(c.radius)
	}
	dn, err := s.DR().Trace(c.radius)
	if err != nil {
		return series.Sum{}, err
	}
	dn = dn.Scale(series.IntCoef(c.outward))
	if cond.Kind == Neumann {
		return dn, nil
	}
	v, err := s.Trace(c.radius)
	if err != nil {
		return series.Sum{}, err
	}
	return dn.Add(v.Scale(cond.H)), nil
}

// OperatorText names the condition's operator applied to a function, e.g. "dn(u_p) + h*u_p".
func OperatorText(cond Condition, fn string) string {
	switch cond.Kind {
	case Neumann:
		return "dn(" + fn + ")"
	case Robin:
		return "dn(" + fn + ") + " + coefFactor(cond.H) + fn
	}
	return fn
}

func coefFactor(h series.Coef) string {
	if h.Equal(series.IntCoef(1)) {
		return ""
	}
	if q, ok := h.Rat(); ok && q.Sign() > 0 || len(h.Text()) > 0 && isSimple(h.Text()) {
		return h.Text() + "*"
	}
	return "(" + h.Text() + ")*"
}

func isSimple(s string) bool {
	for _, c := range s {
		if c == ' ' || c == '+' || c == '-' {
			return false
		}
	}
	return true
}

// Side is what one boundary part contributes: the condition, the particular
// solution's trace under the condition's operator, and the correction
// (data minus trace) the harmonic part must supply.
type Side struct {
	Condition  Condition
	Radius     series.Coef
	Data       series.Sum
	Trace      series.Sum
	Correction series.Sum
}

// Check is one verification of the assembled solution.
type Check struct {
	Name     string
	Side     string // "" for the equation
	Exact    bool
	Residual series.Sum
}

// Solution is the assembled answer with its stages.
type Solution struct {
	Domain     Domain
	Source     series.Sum
	Particular series.Sum
	Sides      []Side
	Harmonic   series.Sum
	U          series.Sum
	Checks     []Check
	Rules      []ansatz.Step // how each source term was solved
	Steps      []string      // how the harmonic part was found
	Notes      []string
}

// Solve assembles u = u_p + h on d for Δu = f with the given conditions:
// u_p from the ansatz rules, h from the domain's harmonic series.
func Solve(d Domain, source series.Field, conds []Condition) (*Solution, error) {
	if !source.IsExact() {
		return nil, &Unsupported{"the source has a part with no closed form yet: " + source.Rest.Text()}
	}
	f := source.Exact
	if err := d.admit(f); err != nil {
		return nil, err
	}
	byName := map[string]Condition{}
	for _, c := range conds {
		if _, dup := byName[c.Side]; dup {
			return nil, &Unsupported{fmt.Sprintf("side %s has two conditions; give one", c.Side)}
		}
		byName[c.Side] = c
	}
	var missing []string
	for _, s := range d.Sides() {
		if _, ok := byName[s]; !ok {
			missing = append(missing, s)
		}
	}
	if len(missing) > 0 {
		return nil, &MissingSides{missing}
	}
	up, rules, err := ansatz.Particular(f)
	if err != nil {
		return nil, err
	}
	sol := &Solution{Domain: d, Source: f, Particular: up, Rules: rules}
	data := map[string]series.Sum{}
	for _, name := range d.Sides() {
		cond := byName[name]
		side := d.side(name)
		if !cond.G.IsExact() {
			return nil, &Unsupported{fmt.Sprintf("boundary data %s on %s has no closed form yet", cond.G.Text(), name)}
		}
		g, err := cond.G.Exact.Trace(side.radius)
		if err != nil {
			return nil, &Unsupported{fmt.Sprintf("boundary data on %s: %v", name, err)}
		}
		if g.HasAngle() {
			return nil, &Unsupported{fmt.Sprintf("boundary data on %s is not a trigonometric polynomial in theta; only sums of cos(n*theta) and sin(n*theta) are supported so far", name)}
		}
		tr, err := side.apply(cond, up)
		if err != nil {
			return nil, &Unsupported{fmt.Sprintf("trace on %s: %v", name, err)}
		}
		corr := g.Sub(tr)
		sol.Sides = append(sol.Sides, Side{cond, side.radius, g, tr, corr})
		data[name] = corr
	}
	h, steps, err := d.harmonic(data, byName)
	if err != nil {
		return nil, err
	}
	sol.Harmonic, sol.Steps = h, steps
	sol.U = up.Add(h)
	sol.Checks = verify(d, sol.U, f, sol.Sides)
	return sol, nil
}

// MissingSides reports sides that have no condition.
type MissingSides struct{ Sides []string }

func (e *MissingSides) Error() string {
	return fmt.Sprintf("no boundary condition for %v; give one --bc per side", e.Sides)
}

// verify reduces Δu − f and each boundary residual exactly.
func verify(d Domain, u, f series.Sum, sides []Side) []Check {
	checks := []Check{{Name: "lap(u) - f", Exact: true, Residual: u.Laplacian().Sub(f)}}
	for _, s := range sides {
		b, err := d.side(s.Condition.Side).apply(s.Condition, u)
		res := b.Sub(s.Data)
		if err != nil {
			res = series.Sum{}
		}
		checks = append(checks, Check{Name: OperatorText(s.Condition, "u") + " - g", Side: s.Condition.Side, Exact: err == nil, Residual: res})
	}
	return checks
}

// rPow is r^n.
func rPow(n int) series.Sum {
	return series.NewSum(series.Term{C: series.IntCoef(1), P: big.NewRat(int64(n), 1)})
}
