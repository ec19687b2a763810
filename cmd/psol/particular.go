package main

import (
	"io"

	"github.com/spf13/cobra"

	"psol/ansatz"
	"psol/domain"
	"psol/parse"
	"psol/series"
)

type particularOptions struct {
	lets   []string
	steps  bool
	format string
}

func newParticularCmd() *cobra.Command {
	o := &particularOptions{}
	cmd := &cobra.Command{
		Use:     "particular SOURCE",
		Short:   "Find one particular solution of lap(u) = SOURCE, with no boundary",
		Example: `  psol particular "r^2*cos(4theta)"`,
		Args:    cobra.ExactArgs(1),
		RunE:    func(cmd *cobra.Command, args []string) error { return o.run(cmd.OutOrStdout(), args[0]) },
	}
	f := cmd.Flags()
	repeatableVar(f, &o.lets, "let", `parameter values "a=0.05,q=2e5" (repeatable)`)
	f.BoolVar(&o.steps, "steps", false, "show the rule used for each source term")
	f.StringVar(&o.format, "format", "text", "output format: text, latex or json")
	return cmd
}

func (o *particularOptions) run(w io.Writer, source string) error {
	render, ok := particularRenderers[o.format]
	if !ok {
		return usagef("--format %q: choose text, latex or json", o.format)
	}
	env, err := (&problemFlags{lets: o.lets}).env()
	if err != nil {
		return err
	}
	f, err := parse.Equation(source, env)
	if err != nil {
		return err
	}
	if f.IsPiecewise() || f.Rest.HasChoice() { // as psol solve, which refuses such a source too
		return &domain.Unsupported{Reason: "psol has no closed-form rule for the source " + f.Text() + ", which is given piece by piece (cond ? a : b, or abs of what is not a linear form in x and y); psol takes pieces in a source as a step across a line only (one comparison of linear forms in x and y, constant values either side: x < 0.2 ? q : 0)"}
	}
	// Kinks c·abs(ℓ), ℓ linear: the closed form c·abs(ℓ)³/(6|∇ℓ|²).
	kinks, rest := ansatz.SplitKinks(f.Rest, env)
	// A remainder of exponentials and sines of x and y: the Cartesian wave ansatz.
	split := ansatz.SplitWaves(rest, false)
	if split.Rest != nil {
		return &domain.Unsupported{Reason: "psol has no closed-form rule for the source part " + split.Rest.Text() + " (" + split.Err.Error() + "); psol solve takes it by quadrature on a given region"}
	}
	waves := split.Waves
	exact := f.Exact.Add(split.Poly.Polar())
	up, steps, err := ansatz.Particular(exact)
	if err != nil {
		return err
	}
	v := &view{Warnings: []string{}, Points: []point{}, showSteps: o.steps}
	v.Problem = exactStage("problem", "lap(u) = "+f.Text(), `\Delta u = `+f.LaTeX(), "")
	upText, upTeX := up.Text(), up.LaTeX()
	if len(waves) > 0 {
		if up.IsZero() {
			upText, upTeX = waves.Text(), waves.LaTeX()
		} else {
			upText, upTeX = joinSigned(upText, waves.Text()), joinSigned(upTeX, waves.LaTeX())
		}
	}
	for _, k := range kinks {
		upText, upTeX = joinNonzero(upText, k.Text()), joinNonzero(upTeX, k.LaTeX())
	}
	pointStep := ""
	if len(f.Points) > 0 { // the fundamental solution of each point source
		pp := domain.SourcesField(f.Points)
		upText, upTeX = joinNonzero(upText, pp.Text()), joinNonzero(upTeX, pp.LaTeX())
		pointStep = series.PointsText(f.Points) + " -> " + pp.Text() + " (a point source Q*delta(x - X0, y - Y0) has the fundamental solution (Q/(4*pi))*ln((x - X0)^2 + (y - Y0)^2))"
	}
	v.Particular = exactStage("particular", "u_p = "+upText, upTeX, "u_p")
	res := up.Laplacian().Sub(exact)
	v.Checks = []checkOut{{Name: "lap(u_p) - f", Exact: true, Formula: res.Text(), Residual: residualSize(res, env)}}
	if len(waves) > 0 { // Δ of the waves less their source, reduced exactly
		left := split.Residual()
		c := checkOut{Name: "lap(u_p) - f (exponential and trigonometric part)", Exact: true, Formula: left.Text()}
		if len(left) > 0 {
			c.Residual = 1
		}
		v.Checks = append(v.Checks, c)
	}
	if len(kinks) > 0 { // identities: d²/dℓ² |ℓ|³/6 = |ℓ|, d²/dℓ² max(ℓ, 0)²/2 = step(ℓ), |∇ℓ|² = A² + B²
		v.Checks = append(v.Checks, checkOut{Name: domain.KinkCheckName(kinks), Exact: true, Formula: "0"})
	}
	for _, st := range steps {
		v.Steps = append(v.Steps, st.Source.Text()+" -> "+st.Result.Text()+" ("+st.Rule+")")
	}
	for _, k := range kinks {
		v.Steps = append(v.Steps, k.SourceText()+" -> "+k.Text()+" ("+k.Rule()+")")
	}
	if pointStep != "" {
		v.Steps = append(v.Steps, pointStep)
	}
	if err := v.failedCheck(); err != nil {
		return err
	}
	return render(w, v)
}

var particularRenderers = map[string]func(io.Writer, *view) error{
	"text": func(w io.Writer, v *view) error {
		line(w, "particular", v.Particular.Text)
		for _, s := range v.Steps {
			if v.showSteps {
				line(w, "step", s)
			}
		}
		line(w, "check", checkSummary(v.Checks))
		return nil
	},
	"latex": func(w io.Writer, v *view) error {
		_, err := io.WriteString(w, "% psol: "+v.Problem.Text+"\n\\begin{equation*}\n  u_p = "+v.Particular.LaTeX+"\n\\end{equation*}\n")
		return err
	},
	"json": func(w io.Writer, v *view) error {
		return renderJSON(w, &view{Problem: v.Problem, Particular: v.Particular, Checks: v.Checks, Steps: v.Steps, Warnings: v.Warnings, Points: v.Points})
	},
}
