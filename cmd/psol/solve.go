package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"psol/domain"
)

type solveOptions struct {
	problemFlags
	steps    bool
	format   string
	at       []string
	tol      float64
	terms    int
	report   bool
	lang     string
	grid     int
	csv      string
	stderr   io.Writer
	plot     string
	quantity []string
}

func newSolveCmd() *cobra.Command {
	o := &solveOptions{}
	cmd := &cobra.Command{
		Use:   "solve EQUATION --disk R --bc CONDITION",
		Short: "Solve lap(u) = f with boundary conditions, stage by stage",
		Example: `  psol solve "lap(u) = 6r*sin(theta)" --disk 2 --bc "u = 4sin(3theta)"
  psol solve "-k*lap(u) = q" --disk a --bc "u = Ts"`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			o.stderr = cmd.ErrOrStderr()
			return o.run(cmd.OutOrStdout(), args[0])
		},
	}
	f := cmd.Flags()
	o.bind(f)
	f.BoolVar(&o.steps, "steps", false, "show how each stage was found")
	f.StringVar(&o.format, "format", "text", "output format: text, latex, json or code")
	f.Float64Var(&o.tol, "tol", domain.SumTol, "numeric target for summed series")
	f.IntVar(&o.grid, "grid", 0, "with --csv: evaluate u on an N x N grid over the domain")
	f.StringVar(&o.csv, "csv", "", "with --grid: the CSV file to write (replaced only when the run succeeds)")
	f.StringArrayVar(&o.quantity, "quantity", nil, quantityHelp())
	f.StringVar(&o.plot, "plot", "", "draw u over the domain to FILE.png or FILE.svg")
	f.StringVar(&o.lang, "lang", "go", "language of --format code: go, c or python")
	f.BoolVar(&o.report, "report", false, "add max, min, area integral, mean and the flux balance")
	f.IntVar(&o.terms, "terms", 100000, "cap on the series terms summed")
	f.StringArrayVar(&o.at, "at", nil, `evaluate at "r=0.5,theta=pi/4" or "x=0.1,y=0.2" (repeatable)`)
	return cmd
}

func (o *solveOptions) run(w io.Writer, equation string) error {
	render, ok := renderers[o.format]
	if !ok && o.format != "code" {
		return usagef("--format %q: choose text, latex, json or code", o.format)
	}
	pr, err := o.pose(equation)
	if err != nil {
		return err
	}
	pr.tol, pr.terms = o.tol, o.terms
	if (o.grid > 0) != (o.csv != "") {
		return usagef("--grid N and --csv FILE go together")
	}
	if o.grid == 1 || o.grid > 4000 {
		return usagef("--grid %d: choose 2 to 4000 points a side", o.grid)
	}
	var pts []point
	for _, a := range o.at {
		p, err := readPoint(a, pr.env)
		if err != nil {
			return err
		}
		pts = append(pts, p)
	}
	sol, err := pr.solve()
	if err != nil {
		return err
	}
	if err := evaluate(sol, pts); err != nil {
		return err
	}
	if o.plot != "" {
		format, err := plotFormat(o.plot)
		if err != nil {
			return err
		}
		title := "lap(u) = " + pr.source.Text() + " on " + pr.domain.Describe()
		if err := writeAtomically(o.plot, func(w io.Writer) error { return plotSolution(w, format, title, sol) }); err != nil {
			return err
		}
	}
	if o.csv != "" {
		var progress io.Writer
		if terminal(o.stderr) {
			progress = o.stderr
		}
		if err := writeGrid(o.csv, sol, o.grid, progress); err != nil {
			return err
		}
	}
	if o.format == "code" {
		terms := codeTerms
		if o.terms != 100000 {
			terms = o.terms
		}
		return writeCode(w, o.lang, pr, sol, terms)
	}
	v := newView(pr, sol, pts, o.steps)
	for _, name := range pr.unusedLets(o.at...) {
		v.Warnings = append(v.Warnings, fmt.Sprintf("--let %s: the problem never uses %s (a misspelt name?)", name, name))
	}
	if o.report || len(o.quantity) > 0 {
		rep, err := sol.Figures()
		if err != nil {
			return usagef("--report: %w", err)
		}
		if o.report {
			v.Report = newReportOut(rep)
		}
		if len(o.quantity) > 0 {
			if v.Quantities, err = quantities(o.quantity, sol, rep); err != nil {
				return err
			}
			v.Caution = caution
		}
		if rep.Symbolic {
			v.Warnings = append(v.Warnings, fmt.Sprintf("the figures are exact, with %s as symbols; numbers and peaks need values (--let %s=...)", strings.Join(rep.Open, ", "), strings.Join(rep.Open, "=...,")))
		}
	}
	if err := v.failedCheck(); err != nil {
		render(w, v)
		return err
	}
	return render(w, v)
}

// quantityHelp lists the presets from the library's table.
func quantityHelp() string {
	var parts []string
	for _, q := range domain.Quantities {
		parts = append(parts, q.Name+" ("+q.Help+")")
	}
	return "figures of a trade, repeatable or comma-separated: " + strings.Join(parts, "; ")
}
