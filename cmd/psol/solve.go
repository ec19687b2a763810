package main

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"psol/parse"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/spf13/cobra"

	"psol/domain"
	"psol/series"
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
	scale    string      // --plot-scale LO,HI as given
	scaleLH  *[2]float64 // read by validate
	quantity []string
	// set records flags given explicitly (even as an empty string).
	gridSet, csvSet, plotSet bool
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
			f := cmd.Flags()
			o.gridSet, o.csvSet, o.plotSet = f.Changed("grid"), f.Changed("csv"), f.Changed("plot")
			return o.run(cmd.OutOrStdout(), args[0])
		},
	}
	f := cmd.Flags()
	o.bind(f)
	f.BoolVar(&o.steps, "steps", false, "show how each stage was found")
	f.StringVar(&o.format, "format", "text", "output format: text, latex, json or code")
	f.Float64Var(&o.tol, "tol", domain.SumTol, "numeric target for summed series")
	f.IntVar(&o.grid, "grid", 0, "with --csv: evaluate u on an N x N grid over the domain (N at most 2000: about 320 MB of CSV)")
	f.StringVar(&o.csv, "csv", "", "with --grid: the CSV file to write (replaced only when the run succeeds)")
	repeatableVar(f, &o.quantity, "quantity", quantityHelp())
	f.StringVar(&o.plot, "plot", "", "draw u over the domain to FILE.png or FILE.svg")
	f.StringVar(&o.scale, "plot-scale", "", "with --plot: the colour scale's ends LO,HI (default: the values' range)")
	f.StringVar(&o.lang, "lang", "go", "language of --format code: go, c or python")
	f.BoolVar(&o.report, "report", false, "add max, min, area integral, mean and the flux balance")
	f.IntVar(&o.terms, "terms", 100000, "cap on the series terms summed")
	repeatableVar(f, &o.at, "at", `evaluate at "r=0.5,theta=pi/4" or "x=0.1,y=0.2" (repeatable)`)
	return cmd
}

func (o *solveOptions) run(w io.Writer, equation string) error {
	render, ok := renderers[o.format]
	if !ok && o.format != "code" {
		return usagef("--format %q: choose text, latex, json or code", o.format)
	}
	if err := o.validate(); err != nil {
		return err
	}
	pr, err := o.pose(equation)
	if err != nil {
		return err
	}
	pr.tol, pr.terms = o.tol, o.terms
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
	// Every output is made before any reaches its place: the files are
	// staged, stdout is buffered, and both are committed only on success.
	files := &stagedFiles{}
	defer files.abort()
	if o.plot != "" {
		format, _ := plotFormat(o.plot)
		title := plotTitle(pr)
		if err := files.stage(o.plot, func(w io.Writer) error { return plotSolution(w, format, title, pr.unknown, sol, o.scaleLH) }); err != nil {
			return err
		}
	}
	if o.csv != "" {
		var progress io.Writer
		if terminal(o.stderr) {
			progress = o.stderr
		}
		if err := writeGrid(files, o.csv, sol, o.grid, progress); err != nil {
			return err
		}
	}
	var out bytes.Buffer
	if o.format == "code" {
		terms := codeTerms
		if o.terms != 100000 {
			terms = o.terms
		}
		if err := writeCode(&out, o.lang, pr, sol, terms); err != nil {
			return err
		}
		return o.finish(w, &out, files, nil)
	}
	// JSON always lists the steps.
	v := newView(pr, sol, pts, o.steps || o.format == "json", o.format != "text")
	var named []string // the --at texts that may name a parameter (plain numbers cannot)
	for _, a := range o.at {
		if _, plain := plainPoint(a); !plain {
			named = append(named, a)
		}
	}
	for _, name := range pr.unusedLets(named...) {
		v.Warnings = append(v.Warnings, fmt.Sprintf("--let %s: the problem never uses %s (a misspelt name?)", name, name))
	}
	if o.report || len(o.quantity) > 0 {
		rep, err := sol.Figures()
		if err != nil {
			return usagef("--report: %w", err)
		}
		if o.report {
			v.Report = newReportOut(rep)
			v.Caution = caution // figures a design may use
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
	if err := v.finite(); err != nil {
		return err
	}
	if err := render(&out, v); err != nil {
		return &outputError{err}
	}
	if err := v.failedCheck(); err != nil { // show what was computed, keep the files as they were
		files.abort()
		return o.finish(w, &out, files, err)
	}
	return o.finish(w, &out, files, nil)
}

// finish commits the staged files, then writes the buffered output; a
// write that fails (a full disk) is an output error, exit 4. failure, if
// set, is the run's own error, returned after the output is shown.
func (o *solveOptions) finish(w io.Writer, out *bytes.Buffer, files *stagedFiles, failure error) error {
	if err := files.commit(); err != nil {
		return err
	}
	for _, line := range files.Written { // stderr: stdout stays the answer alone
		fmt.Fprintln(o.stderr, "psol: "+line)
	}
	if _, err := w.Write(out.Bytes()); err != nil {
		return &outputError{fmt.Errorf("cannot write the output: %w", err)}
	}
	return failure
}

// maxGrid bounds --grid: 2000² points, about 320 MB of CSV and some
// seconds of evaluation; beyond it a file is rarely what is wanted.
const maxGrid = 2000

// validate checks every flag's value before any work: a bad one is bad
// input (exit 2) and must not cost a solve or touch a file.
func (o *solveOptions) validate() error {
	switch {
	case (o.grid != 0 || o.gridSet) != (o.csv != "" || o.csvSet):
		return usagef("--grid N and --csv FILE go together")
	case o.gridSet && (o.grid < 2 || o.grid > maxGrid):
		return usagef("--grid %d: choose 2 to %d points a side (%d² points make about %d MB of CSV)", o.grid, maxGrid, maxGrid, maxGrid*maxGrid*80/1000000)
	case o.csvSet && o.csv == "":
		return usagef("--csv needs a file name")
	case o.plotSet && o.plot == "":
		return usagef("--plot needs a file name ending in .png or .svg")
	case !(o.tol > 0 && o.tol < 1):
		return usagef("--tol %g: choose a tolerance between 0 and 1 (exclusive), e.g. 1e-12", o.tol)
	case o.terms < 1 || o.terms > domain.MaxTerms:
		return usagef("--terms %d: choose 1 to %d series terms", o.terms, domain.MaxTerms)
	}
	if o.plot != "" {
		if _, err := plotFormat(o.plot); err != nil {
			return err
		}
	}
	if o.scale != "" {
		lh, err := readScale(o.scale)
		if err != nil {
			return err
		}
		if o.plot == "" {
			return usagef("--plot-scale goes with --plot FILE")
		}
		o.scaleLH = &lh
	}
	if o.format == "code" {
		if _, ok := series.Langs[o.lang]; !ok {
			return usagef("--lang %q: choose go, c or python", o.lang)
		}
	}
	for _, q := range o.quantity {
		for _, n := range strings.Split(q, ",") {
			if !known(strings.TrimSpace(n)) {
				return usagef("--quantity %q: choose %s", strings.TrimSpace(n), strings.Join(domain.QuantityNames(), ", "))
			}
		}
	}
	return nil
}

// quantityHelp lists the presets from the library's table.
func quantityHelp() string {
	var parts []string
	for _, q := range domain.Quantities {
		parts = append(parts, q.Name+" ("+q.Help+")")
	}
	return "figures of a trade, repeatable or comma-separated: " + strings.Join(parts, "; ")
}

// plotTitle is the problem as the user wrote it: the equation, the region,
// and the conditions (each once: one given for every side shows once).
func plotTitle(pr *problem) string {
	seen := map[string]bool{}
	var conds []string
	for _, c := range pr.conds {
		if !seen[c.Text] {
			seen[c.Text] = true
			conds = append(conds, strings.TrimSpace(c.Text))
		}
	}
	region := pr.typed
	if region == "" {
		region = pr.domain.Describe()
	}
	return wrapWords(strings.TrimSpace(pr.equation)+" on "+region, titleWidth) + "\n" + wrapWords(strings.Join(conds, "; "), titleWidth)
}

// readScale reads --plot-scale LO,HI: two numbers, LO below HI.
func readScale(text string) ([2]float64, error) {
	lo, hi, ok := strings.Cut(text, ",")
	a, errA := strconv.ParseFloat(strings.TrimSpace(lo), 64)
	if !ok || errA != nil || math.IsInf(a, 0) || math.IsNaN(a) {
		return [2]float64{}, &parse.Error{Label: "--plot-scale", Input: text, Msg: "give the colour scale's ends as LO,HI, two numbers"}
	}
	b, errB := strconv.ParseFloat(strings.TrimSpace(hi), 64)
	if errB != nil || math.IsInf(b, 0) || math.IsNaN(b) {
		return [2]float64{}, &parse.Error{Label: "--plot-scale", Input: text, Offset: len(lo) + 1, Msg: "give the colour scale's ends as LO,HI, two numbers"}
	}
	if !(a < b) {
		return [2]float64{}, &parse.Error{Label: "--plot-scale", Input: text, Offset: len(lo) + 1, Msg: "the upper end must be above the lower"}
	}
	return [2]float64{a, b}, nil
}

// titleWidth is the characters of a title line that fit the plot's width
// in its font (about 100 at 12 pt on 7 inches; a margin kept).
const titleWidth = 84

// wrapWords breaks text into lines of at most width characters at spaces
// (a longer word stands on its own line).
func wrapWords(text string, width int) string {
	var lines []string
	line := ""
	for _, w := range strings.Fields(text) {
		if line != "" && utf8.RuneCountInString(line)+1+utf8.RuneCountInString(w) > width {
			lines, line = append(lines, line), w
			continue
		}
		if line != "" {
			line += " "
		}
		line += w
	}
	return strings.Join(append(lines, line), "\n")
}
