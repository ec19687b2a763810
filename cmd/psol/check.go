package main

import (
	"encoding/json"
	"io"
	"math"
	"strings"

	"github.com/spf13/cobra"

	"psol/domain"
	"psol/parse"
)

type checkOptions struct {
	problemFlags
	claim  string
	format string
}

// numericCheckTol is the largest numeric residual that still counts as zero.
const numericCheckTol = 1e-6

func newCheckCmd() *cobra.Command {
	o := &checkOptions{}
	cmd := &cobra.Command{
		Use:     "check EQUATION --disk R --bc CONDITION --claim EXPR",
		Short:   "Verify a hand-derived solution: the equation and every boundary condition",
		Example: `  psol check "lap(u) = -2" --disk a --bc "u = 0" --claim "(a^2 - r^2)/2"`,
		Args:    cobra.ExactArgs(1),
		RunE:    func(cmd *cobra.Command, args []string) error { return o.run(cmd.OutOrStdout(), args[0]) },
	}
	f := cmd.Flags()
	o.bind(f)
	f.StringVar(&o.claim, "claim", "", "the claimed solution u, a formula in r, theta, x, y and parameters (or u = formula)")
	f.StringVar(&o.format, "format", "text", "output format: text or json")
	return cmd
}

type claimReport struct {
	Claim   string        `json:"claim"`
	Holds   bool          `json:"holds"`
	Checks  []claimResult `json:"checks"`
	OffBy   string        `json:"off_by,omitempty"`
	Exact   bool          `json:"exact"`
	Verdict string        `json:"verdict"`
}

type claimResult struct {
	Name     string   `json:"name"`
	Side     string   `json:"side,omitempty"`
	Exact    bool     `json:"exact"`
	Holds    bool     `json:"holds"`
	Formula  string   `json:"formula,omitempty"`
	Residual *float64 `json:"residual"` // null where parameters have no values
	Text     string   `json:"text"`
}

func (o *checkOptions) run(w io.Writer, equation string) error {
	if o.format != "text" && o.format != "json" {
		return usagef("--format %q: choose text or json", o.format)
	}
	if o.claim == "" {
		return usagef("give the claimed solution with --claim")
	}
	pr, err := o.pose(equation)
	if err != nil {
		return err
	}
	claim, err := parse.ExpressionIn(pr.unknown, "--claim", o.claim, pr.env)
	if err != nil {
		return err
	}
	checks, err := domain.CheckClaim(pr.domain, pr.source, pr.conds, claim, pr.env)
	if err != nil {
		if ms, ok := err.(*domain.MissingSides); ok {
			return usagef("no boundary condition for side %s", strings.Join(ms.Sides, ", "))
		}
		return err
	}
	rep := claimReport{Claim: claim.Text(), Holds: true, Exact: true}
	if claim.IsExact() {
		rep.Claim = domain.FieldText(pr.domain, claim.Exact)
	}
	var failed []string
	for _, c := range checks {
		res := claimResult{Name: c.Name, Side: c.Side, Exact: c.Exact, Holds: c.Holds(numericCheckTol), Text: c.Describe()}
		if !math.IsNaN(c.Max) {
			res.Residual = &c.Max // the residual's largest size (sampled where it is exact)
		}
		if c.Exact {
			res.Formula = c.Text
		} else {
			rep.Exact = false
		}
		if !res.Holds {
			rep.Holds = false
			failed = append(failed, res.Text)
		}
		rep.Checks = append(rep.Checks, res)
	}
	// Where psol solves the problem in closed form, say how far off the claim is.
	if sol, err := pr.solve(); err == nil && sol.IsClosed() && claim.IsExact() && sol.Free == "" {
		if d := claim.Exact.Sub(sol.U); !d.IsZero() {
			rep.OffBy = domain.FieldText(pr.domain, d)
		}
	}
	rep.Verdict = "the claim holds"
	if !rep.Holds {
		rep.Verdict = "the claim fails: " + strings.Join(failed, "; ")
	}
	if o.format == "json" {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		enc.SetEscapeHTML(false)
		if err := enc.Encode(rep); err != nil {
			return err
		}
	} else {
		line(w, "claim", "u = "+rep.Claim)
		for _, c := range rep.Checks {
			mark := ""
			if !c.Holds {
				mark = "   <- fails"
			}
			line(w, "check", c.Text+mark)
		}
		if rep.OffBy != "" {
			line(w, "off by", "claim - solution = "+rep.OffBy)
		}
		line(w, "verdict", rep.Verdict)
	}
	if !rep.Holds {
		return &claimError{"the claim does not solve the problem"}
	}
	return nil
}
