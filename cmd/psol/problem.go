package main

import (
	"errors"
	"fmt"
	"math/big"
	"sort"
	"strings"

	"github.com/spf13/pflag"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

// problemFlags are the flags that pose a problem, shared by solve and check.
type problemFlags struct {
	regions map[string]*string // domain flag name → its value
	holes   []string           // --hole, repeatable
	bcs     []string
	lets    []string
	fix     string
}

// regionKind is one domain flag: how many sizes it takes and the region they
// make, or (read) its own reading of the flag's text.
type regionKind struct {
	flag, usage string
	sizes       int
	make        func(sizes []series.Coef) (domain.Domain, string)
	read        func(label, text string, env series.Env) (domain.Domain, error)
}

// regionKinds are the domain flags, in the order help lists them.
var regionKinds = []regionKind{
	{"disk", "solve on the disk r < R (R a number or parameter)", 1,
		func(v []series.Coef) (domain.Domain, string) { return domain.Disk{R: v[0]}, "" }, nil},
	{"annulus", "solve on the annulus R1 < r < R2, given as R1,R2", 2,
		func(v []series.Coef) (domain.Domain, string) {
			if d := v[1].Sub(v[0]); !series.Positive(d) {
				return nil, "the inner radius must be smaller than the outer"
			}
			return domain.Annulus{R1: v[0], R2: v[1]}, ""
		}, nil},
	{"outside", "solve outside the circle, r > R, with u bounded at infinity", 1,
		func(v []series.Coef) (domain.Domain, string) { return domain.Outside{R: v[0]}, "" }, nil},
	{"rect", "solve on the rectangle 0 < x < L, 0 < y < H, given as L,H", 2,
		func(v []series.Coef) (domain.Domain, string) { return domain.Rect{L: v[0], H: v[1]}, "" }, nil},
	{"sector", "solve on the sector r < R, 0 < theta < ALPHA, given as R,ALPHA (ALPHA a rational multiple of pi)", 2,
		func(v []series.Coef) (domain.Domain, string) {
			if a, ok := domain.AlphaOverPi(v[1]); !ok || a.Cmp(big.NewRat(2, 1)) > 0 {
				return nil, "the angle must be a rational multiple of pi, at most 2*pi"
			}
			return domain.Sector{R: v[0], Alpha: v[1]}, ""
		}, nil},
	{"polygon", `solve inside the polygon with vertices "X1,Y1 X2,Y2 ... XN,YN" in order (either way round); side sK runs from vertex K to K+1`, 0, nil, readPolygon},
	{"ellipse", "solve on the ellipse x^2/A^2 + y^2/B^2 < 1, given as A,B; its side is rim", 2,
		func(v []series.Coef) (domain.Domain, string) { return domain.Ellipse{A: v[0], B: v[1]}, "" }, nil},
}

// readPolygon reads --polygon and refuses a faulty outline with a caret
// under the vertex at fault.
func readPolygon(label, text string, env series.Env) (domain.Domain, error) {
	xs, ys, offsets, err := parse.Vertices(label, text, env)
	if err != nil {
		return nil, err
	}
	p := domain.Polygon{X: xs, Y: ys}
	fx, errX := domain.Floats(env, xs...)
	fy, errY := domain.Floats(env, ys...)
	if errX != nil || errY != nil {
		return p, nil // parameters without values: the solve says what it needs
	}
	if k, reason := domain.PolygonFault(fx, fy); k >= 0 {
		return nil, &parse.Error{Label: label, Input: text, Offset: offsets[min(k, len(offsets)-1)], Msg: reason}
	}
	return p, nil
}

func (p *problemFlags) bind(f *pflag.FlagSet) {
	p.regions = map[string]*string{}
	for _, k := range regionKinds {
		p.regions[k.flag] = f.String(k.flag, "", k.usage)
	}
	repeatableVar(f, &p.holes, "hole", `a hole taken out of --disk, --rect, --ellipse or --polygon: "circle CX,CY,R", "ellipse CX,CY,A,B" (semi-axes along x and y) or "polygon X1,Y1 X2,Y2 ..." (repeatable); the K-th hole is side holeK (a polygon hole's edges holeK.s1, holeK.s2, ...)`)
	repeatableVar(f, &p.bcs, "bc", `boundary condition "[SIDE:] u = g", "dn(u) = g", "dn(u) + h*u = g" or "u = const, flux = Q" (one unknown value with net outward flux Q; circles); one per side, repeatable; one without SIDE applies to every side not named`)
	repeatableVar(f, &p.lets, "let", `parameter values "a=0.05,q=2e5" (repeatable)`)
	f.StringVar(&p.fix, "fix", "", `pin the free constant of a pure Neumann problem: "u(R0, THETA0) = V" (polar point)`)
}

// problem is a posed problem, lowered to series values.
type problem struct {
	equation string
	unknown  string   // the unknown's name in the input (u unless the equation says lap(T))
	inputs   []string // the texts that may name parameters: equation, region, conditions, --fix, --let
	lets     []string // the names --let gives (the solve may add a free constant to env)
	fix      string
	typed    string // the region as the flags gave it: "disk 1, hole circle 0.3,0,0.2"
	tol      float64
	terms    int // the cap on series terms at points and on grids
	env      series.Env
	domain   domain.Domain
	source   series.Field
	conds    []domain.Condition
}

func (p *problemFlags) env() (series.Env, error) {
	env := series.Env{}
	for _, l := range p.lets {
		bs, err := parse.Bindings("--let", l, env)
		if err != nil {
			return nil, err
		}
		for _, b := range bs {
			if _, ok := env[b.Name]; ok {
				return nil, usagef("--let gives %s twice", b.Name)
			}
			if reservedName(b.Name) {
				return nil, usagef("--let %s: %s is a variable, not a parameter", b.Name, b.Name)
			}
			env[b.Name] = b.Value
		}
	}
	return env, nil
}

func reservedName(n string) bool {
	switch n {
	case "r", "theta", "θ", "x", "y", "u", "pi", "π":
		return true
	}
	return series.IsFunction(n)
}

func (p *problemFlags) pose(equation string) (*problem, error) {
	env, err := p.env()
	if err != nil {
		return nil, err
	}
	pr := &problem{equation: equation, env: env, fix: p.fix, typed: p.typedRegion()}
	pr.inputs = append(append(append([]string{equation, p.fix}, p.bcs...), p.lets...), p.regionTexts()...)
	for name := range env {
		pr.lets = append(pr.lets, name)
	}
	var chosen []string
	for _, k := range regionKinds {
		text := *p.regions[k.flag]
		if text == "" {
			continue
		}
		chosen = append(chosen, "--"+k.flag)
		if k.read != nil {
			if pr.domain, err = k.read("--"+k.flag, text, env); err != nil {
				return nil, err
			}
			continue
		}
		sizes, err := parse.Lengths("--"+k.flag, text, k.sizes, env)
		if err != nil {
			return nil, err
		}
		d, msg := k.make(sizes)
		if msg != "" {
			return nil, &parse.Error{Label: "--" + k.flag, Input: text, Msg: msg}
		}
		pr.domain = d
	}
	switch len(chosen) {
	case 0:
		return nil, usagef(`give the domain: --disk R, --annulus R1,R2, --outside R, --sector R,ALPHA, --rect L,H, --polygon "X1,Y1 X2,Y2 ..." or --ellipse A,B`)
	case 1:
	default:
		return nil, usagef("give one domain, not %s", strings.Join(chosen, " and "))
	}
	if len(p.holes) > 0 {
		if pr.domain, err = withHoles(pr.domain, p.holes, env); err != nil {
			return nil, err
		}
	}
	if pr.source, pr.unknown, err = parse.EquationAndUnknown(equation, env); err != nil {
		return nil, err
	}
	if pr.conds, err = conditions(pr.unknown, p.bcs, pr.domain.Sides(), env); err != nil {
		return nil, err
	}
	return pr, nil
}

// conditions lowers the --bc flags: one per side, and at most one without a
// side name, which applies to every side no other --bc names.
func conditions(unknown string, bcs []string, sides []string, env series.Env) ([]domain.Condition, error) {
	var conds []domain.Condition
	var general *domain.Condition
	given := map[string]string{}
	// A polygon hole's edges holeK.s1, holeK.s2, … take a condition by the
	// hole's name, holeK, too.
	groups := map[string][]string{}
	named := append([]string(nil), sides...)
	for _, s := range sides {
		if g, _, ok := strings.Cut(s, "."); ok {
			if len(groups[g]) == 0 {
				named = append(named, g)
			}
			groups[g] = append(groups[g], s)
		}
	}
	for _, bc := range bcs {
		c, err := parse.ConditionIn(unknown, bc, named, env)
		if err != nil {
			return nil, err
		}
		if members, ok := groups[c.Side]; ok {
			for _, m := range members {
				if prev, dup := given[m]; dup {
					return nil, &parse.Error{Label: "--bc", Input: bc, Msg: fmt.Sprintf("side %s already has a condition (%q); give one per side", m, prev)}
				}
				mc := c
				mc.Side = m
				given[m] = bc
				conds = append(conds, mc)
			}
			continue
		}
		lead := len(bc) - len(strings.TrimLeft(bc, " "))
		switch prev, dup := given[c.Side]; {
		case c.Side == "" && general != nil:
			return nil, &parse.Error{Label: "--bc", Input: bc, Offset: lead, Msg: fmt.Sprintf("a second --bc with no side name (the first: %q); name the side, one of: %s", general.Text, strings.Join(sides, ", "))}
		case c.Side == "":
			general = &c
			continue
		case dup:
			return nil, &parse.Error{Label: "--bc", Input: bc, Offset: lead, Msg: fmt.Sprintf("side %s already has a condition (%q); give one per side", c.Side, prev)}
		}
		given[c.Side] = bc
		conds = append(conds, c)
	}
	if general != nil {
		for _, side := range sides {
			if _, ok := given[side]; !ok {
				c := *general
				c.Side = side
				conds = append(conds, c)
			}
		}
	}
	return conds, nil
}

// solve assembles the solution, pinning a free constant by --fix.
func (pr *problem) solve() (*domain.Solution, error) {
	sol, err := domain.SolveWith(pr.domain, pr.source, pr.conds, domain.Options{Env: pr.env, Tol: pr.tol, Terms: pr.terms})
	var ms *domain.MissingSides
	if errors.As(err, &ms) {
		return nil, usagef("no boundary condition for side %s; add --bc \"%s: u = ...\"", strings.Join(ms.Sides, ", "), ms.Sides[0])
	}
	if err != nil {
		return nil, err
	}
	if sol.Free == "" {
		if pr.fix != "" {
			return nil, usagef("--fix pins the free constant of a pure Neumann problem; this problem has none")
		}
		return sol, nil
	}
	if pr.fix == "" {
		mean := sol.FreeMean.Text()
		if sol.Numeric { // a decimal from numeric parts
			mean = series.Const(sol.FreeMean).TextApprox()
		}
		on := pr.domain.Sides()[0]
		if sol.Section != nil { // a section's constant is set by the whole boundary
			on = "the boundary"
		}
		sol.Notes = append(sol.Notes, fmt.Sprintf("%s = %s makes the mean of u on %s zero; numeric values use it (--fix \"u(r, theta) = v\" pins %s instead)",
			sol.Free, mean, on, sol.Free))
		pr.env[sol.Free] = sol.FreeMean
		return sol, nil
	}
	r, th, v, err := parse.FixIn(pr.unknown, pr.fix, pr.env)
	if err != nil {
		return nil, err
	}
	c, err := sol.FreeValue(r, th, v)
	if err == nil {
		if sol.IsClosed() {
			sol.Notes = append(sol.Notes, fmt.Sprintf("%s = %s from --fix %s", sol.Free, c.Text(), pr.fix))
			err = sol.Pin(c)
		} else { // the series and the quadrature keep the symbol: numeric values take it from here
			sol.Notes = append(sol.Notes, fmt.Sprintf("%s = %s from --fix %s (numeric values use it)", sol.Free, series.Const(c).TextApprox(), pr.fix))
			pr.env[sol.Free] = c
		}
	}
	if err != nil {
		return nil, &parse.Error{Label: "--fix", Input: pr.fix, Msg: err.Error()}
	}
	return sol, nil
}

// typedRegion is the region in the user's own words and numbers, for a
// plot's title: the domain flag with its value, then each hole.
func (p *problemFlags) typedRegion() string {
	var parts []string
	for _, k := range regionKinds {
		if v := strings.TrimSpace(*p.regions[k.flag]); v != "" {
			parts = append(parts, k.flag+" "+v)
		}
	}
	for _, h := range p.holes {
		parts = append(parts, "hole "+strings.TrimSpace(h))
	}
	return strings.Join(parts, ", ")
}

func (p *problemFlags) regionTexts() []string {
	var out []string
	for _, k := range regionKinds {
		out = append(out, *p.regions[k.flag])
	}
	return append(out, p.holes...)
}

// unusedLets are the --let names that no input text mentions (besides their
// own binding), e.g. a misspelt parameter: they are likely a mistake.
func (pr *problem) unusedLets(more ...string) []string {
	count := map[string]int{}
	for _, text := range append(append([]string(nil), pr.inputs...), more...) {
		for _, id := range parse.Names(text) {
			count[id]++
		}
	}
	var out []string
	for _, name := range pr.lets {
		if count[name] <= 1 { // its own "name=value" only
			out = append(out, name)
		}
	}
	sort.Strings(out)
	return out
}

// withHoles takes the --hole disks out of the region, refusing holes that
// meet the boundary or each other, with a caret under the hole at fault.
func withHoles(d domain.Domain, holes []string, env series.Env) (domain.Domain, error) {
	switch d.(type) {
	case domain.Disk, domain.Rect, domain.Ellipse, domain.Polygon:
	default:
		return nil, usagef("--hole goes with --disk, --rect, --ellipse or --polygon, not with %s (the annulus and the outside of a circle have their inner circle already)", d.Describe())
	}
	h := domain.Holed{Outer: d}
	for _, text := range holes {
		spec, err := parse.HoleOf("--hole", text, env)
		if err != nil {
			return nil, err
		}
		if spec.Polygon {
			if fx, errX := domain.Floats(env, spec.XS...); errX == nil {
				if fy, errY := domain.Floats(env, spec.YS...); errY == nil {
					if k, reason := domain.PolygonFault(fx, fy); k >= 0 {
						return nil, &parse.Error{Label: "--hole", Input: text, Offset: spec.Offsets[min(k, len(spec.Offsets)-1)], Msg: reason}
					}
				}
			}
			h.Holes = append(h.Holes, domain.CircleHole{Poly: domain.Polygon{X: spec.XS, Y: spec.YS}})
			continue
		}
		h.Holes = append(h.Holes, domain.CircleHole{X: spec.X, Y: spec.Y, R: spec.R, A: spec.A, B: spec.B})
	}
	if k, reason := h.HoleFault(env); k >= 0 {
		return nil, &parse.Error{Label: "--hole", Input: holes[k], Offset: 0, Msg: reason}
	}
	return h, nil
}
