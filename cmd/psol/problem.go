package main

import (
	"errors"
	"strings"

	"github.com/spf13/pflag"

	"psol/parse"
	"psol/series"
	"psol/series/domain"
)

// problemFlags are the flags that pose a problem, shared by solve and check.
type problemFlags struct {
	disk string
	bcs  []string
	lets []string
}

func (p *problemFlags) bind(f *pflag.FlagSet) {
	f.StringVar(&p.disk, "disk", "", "solve on the disk r < R (R a number or parameter)")
	f.StringArrayVar(&p.bcs, "bc", nil, `boundary condition "[SIDE:] u = g", "dn(u) = g" or "dn(u) + h*u = g" (repeatable)`)
	f.StringArrayVar(&p.lets, "let", nil, `parameter values "a=0.05,q=2e5" (repeatable)`)
}

// problem is a posed problem, lowered to series values.
type problem struct {
	equation string
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
	pr := &problem{equation: equation, env: env}
	switch {
	case p.disk == "":
		return nil, usagef("give the domain, e.g. --disk 1")
	default:
		rs, err := parse.Lengths("--disk", p.disk, 1, env)
		if err != nil {
			return nil, err
		}
		pr.domain = domain.Disk{R: rs[0]}
	}
	if pr.source, err = parse.Equation(equation, env); err != nil {
		return nil, err
	}
	for _, bc := range p.bcs {
		c, err := parse.Condition(bc, pr.domain.Sides(), env)
		if err != nil {
			return nil, err
		}
		pr.conds = append(pr.conds, c)
	}
	return pr, nil
}

// solve assembles the solution.
func (pr *problem) solve() (*domain.Solution, error) {
	sol, err := domain.Solve(pr.domain, pr.source, pr.conds)
	var ms *domain.MissingSides
	if errors.As(err, &ms) {
		return nil, usagef("no boundary condition for side %s; add --bc \"%s: u = ...\"", strings.Join(ms.Sides, ", "), ms.Sides[0])
	}
	return sol, err
}
