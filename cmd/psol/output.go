package main

import (
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"psol/domain"
	"psol/series"
)

// stage is one printed formula.
type stage struct {
	Label string `json:"-"`
	Text  string `json:"text"`
	LaTeX string `json:"latex"`
	Exact bool   `json:"exact"`
	tex   string // the LaTeX left-hand side
}

type checkOut struct {
	Name     string  `json:"name"`
	Side     string  `json:"side,omitempty"`
	Exact    bool    `json:"exact"`
	Residual float64 `json:"residual"`
	Formula  string  `json:"formula"`
}

// view is everything a renderer prints, computed once.
type view struct {
	Problem    stage  `json:"problem"`
	Particular stage  `json:"particular"`
	Images     *stage `json:"images,omitempty"`
	// PointSources are the source's points, with their strengths.
	PointSources []pointSourceOut `json:"point_sources,omitempty"`
	Trace        stage            `json:"trace"`
	Correction   stage            `json:"correction"`
	Harmonic     stage            `json:"harmonic"`
	Solution     stage            `json:"solution"`
	Checks       []checkOut       `json:"checks"`
	Points       []point          `json:"points"`
	Steps        []string         `json:"steps,omitempty"`
	Report       *reportOut       `json:"report,omitempty"`
	ClosedForm   *stage           `json:"closed_form,omitempty"`
	Quantities   []figureOut      `json:"quantities,omitempty"`
	Caution      string           `json:"caution,omitempty"`
	Warnings     []string         `json:"warnings"`
	showSteps    bool
	// tex says whether the output shows LaTeX (the latex and json formats);
	// text output never reads it, and the stages leave it empty there.
	tex        bool
	checkScope string // how far an exact check reaches, for series
	// where defines, for LaTeX, the symbols the formulas use but do not
	// spell out (u_q, a fitted h's poles and basis), one clause each.
	where []string
	// Independent is the check of every side's condition from the evaluated
	// solution, by code the solve does not use; nil without parameter values.
	Independent       *checkOut `json:"independent_check,omitempty"`
	independentFailed bool
}

// latex is f(), a stage's LaTeX, when the output shows LaTeX, and "" when
// it does not: the LaTeX of a long numeric series took as long as its
// text, a tenth of a short command's own work, for output that is text.
func (v *view) latex(f func() string) string {
	if !v.tex {
		return ""
	}
	return f()
}

// joiner is join (domain.JoinSeries and its approximation) with its LaTeX
// left out, as by latex, when the output shows none.
func (v *view) joiner(join func(series.Sum, series.SeriesSum, bool) string) func(series.Sum, series.SeriesSum, bool) string {
	return func(closed series.Sum, ser series.SeriesSum, latex bool) string {
		if latex && !v.tex {
			return ""
		}
		return join(closed, ser, latex)
	}
}

func exactStage(label, text, latex, tex string) stage {
	return stage{Label: label, Text: text, LaTeX: latex, Exact: true, tex: tex}
}

func newView(pr *problem, sol *domain.Solution, pts []point, showSteps, tex bool) *view {
	v := &view{Points: pts, Warnings: []string{}, showSteps: showSteps, tex: tex}
	if v.Points == nil {
		v.Points = []point{}
	}
	if pr.unknown != "" && pr.unknown != "u" {
		v.Warnings = append(v.Warnings, "the output writes the unknown "+pr.unknown+" as u (and its particular part as u_p)")
	}
	f := series.ExactField(sol.Source)
	if rest := sol.NonPolarSource(); rest != nil { // the part the waves and the quadrature took
		f = f.Add(series.Field{Rest: rest})
	}
	f = sourceWithPoints(f, sol)
	var conds, condsTeX []string
	for _, s := range sol.Sides {
		if s.Condition.Kind == domain.Floating { // as the user gave it: one unknown value, a net flux
			conds = append(conds, s.Condition.Side+": u = const, flux = "+s.Condition.G.Text())
			condsTeX = append(condsTeX, `u = \text{const},\ \oint \partial_n u\,ds = `+v.latex(s.Condition.G.LaTeX)+`\ \text{on `+s.Condition.Side+"}")
			continue
		}
		conds = append(conds, s.Condition.Side+": "+domain.OperatorText(s.Condition, "u")+" = "+s.DataText)
		condsTeX = append(condsTeX, operatorTeX(s.Condition, "u")+" = "+s.DataLaTeX+`\ \text{on `+s.Condition.Side+"}")
	}
	v.Problem = exactStage("problem",
		"lap(u) = "+f.Text()+" on "+pr.domain.Describe()+"; "+strings.Join(conds, "; "),
		`\Delta u = `+v.latex(f.LaTeX)+`,\quad `+strings.Join(condsTeX, `,\quad `), "")
	v.Particular = exactStage("particular", "u_p = "+sol.Particular.Text(), v.latex(sol.Particular.LaTeX), "u_p")
	var tr, trTeX, co, coTeX []string
	for _, s := range sol.Sides {
		prefix := sidePrefix(sol, s)
		trace, traceTeX := s.Trace.Text(), v.latex(s.Trace.LaTeX)
		if kink, kinkTeX := kinkTrace(sol, s); kink != "" {
			trace, traceTeX = joinNonzero(trace, kink), joinNonzero(traceTeX, kinkTeX)
		}
		tr = append(tr, prefix+traceText(s)+" = "+trace)
		trTeX = append(trTeX, traceTeX)
		co = append(co, prefix+series.JoinText(s.Data, s.Trace.Neg()))
		coTeX = append(coTeX, v.latex(func() string { return series.JoinLaTeX(s.Data, s.Trace.Neg()) }))
	}
	side := sol.Sides[0]
	if sol.RaysByShift { // rays carry no trace: their data is met by the eigenfunctions and the shift
		tr, trTeX, co, coTeX = tr[:1], trTeX[:1], co[:1], coTeX[:1]
	}
	v.Trace = exactStage("trace", strings.Join(tr, "; "), strings.Join(trTeX, ", "), traceTeX(side))
	v.Correction = exactStage("correction", strings.Join(co, "; "), strings.Join(coTeX, ", "), `g - `+traceTeX(side))
	v.Harmonic = exactStage("harmonic", sol.Harmonic.Text(), v.latex(sol.Harmonic.LaTeX), "u_h")
	v.Solution = exactStage("solution", "u = "+series.JoinText(sol.Particular, sol.Harmonic), v.latex(func() string { return series.JoinLaTeX(sol.Particular, sol.Harmonic) }), "u")
	if ps := sol.Series; ps != nil {
		v.seriesStages(sol, ps)
	}
	if sol.ClosedForm != "" {
		closed := sol.Particular.Add(sol.Harmonic)
		text, tex := sol.ClosedForm, sol.ClosedFormLaTeX
		if !closed.IsZero() {
			join := " + "
			if strings.HasPrefix(text, " - ") {
				join = ""
			}
			text, tex = closed.Text()+join+text, v.latex(closed.LaTeX)+join+tex
		}
		st := exactStage("closed form", "u = "+text, tex, "u")
		v.ClosedForm = &st
	}
	if rest := quadratureSource(sol); rest != nil {
		v.where = append(v.where, `$u_q$ is the particular solution of the source part $`+v.latex(rest.LaTeX)+`$, by quadrature (numeric)`)
	}
	if sol.Numeric {
		v.approximate(sol)
		v.checkScope = fmt.Sprintf(" for the numeric parts as computed (see the notes), which carry an error of about %.1e", sol.DataError)
	}
	for _, c := range sol.Checks {
		if !c.Exact {
			v.Checks = append(v.Checks, checkOut{Name: c.Name, Side: c.Side, Residual: c.Numeric})
			continue
		}
		v.Checks = append(v.Checks, checkOut{Name: c.Name, Side: c.Side, Exact: c.Exact, Formula: c.Residual.Text(), Residual: residualSize(c.Residual, pr.env)})
	}
	if sol.Rect != nil {
		v.rectStages(sol)
	}
	if sol.Section != nil {
		v.sectionStages(sol)
	} else if _, ok := sol.Domain.(domain.Ellipse); ok {
		v.xyClosedStages(sol)
	}
	if sol.Waves != nil && sol.Section == nil && sol.Rect == nil {
		v.circleWaveStages(sol)
	}
	if sol.Points != nil {
		v.pointStages(sol)
	}
	if c := sol.Independent; c != nil {
		v.Independent = &checkOut{Name: c.Name}
		if v.independentFailed = c.Failed(); v.independentFailed {
			// Where it fails, where and by how much; where it holds, only that
			// (a residual at rounding level differs between CPUs).
			v.Independent.Side, v.Independent.Residual = c.Side, c.Numeric
		}
	}
	for _, st := range sol.Rules {
		v.Steps = append(v.Steps, fmt.Sprintf("ansatz %s -> %s (%s)", st.Source.Text(), st.Result.Text(), st.Rule))
	}
	if w := sol.Waves; w != nil {
		v.Steps = append(v.Steps, fmt.Sprintf("ansatz %s -> %s (exponential-trigonometric in x and y)", w.Source.Text(), w.Waves.Text()))
	}
	if showSteps { // a line per mode: thousands with numeric data
		v.Steps = append(v.Steps, sol.StepLines()...)
	}
	v.Warnings = append(v.Warnings, sol.Notes...)
	return v
}

// stages are the printed formulas in order.
func (v *view) stages() []stage {
	out := []stage{v.Particular}
	if v.Images != nil {
		out = append(out, *v.Images)
	}
	return append(out, v.Trace, v.Correction, v.Harmonic, v.Solution)
}

// residualSize is 0 for an exactly vanishing residual, and 1 as a flag otherwise
// (the formula field carries the exact residual).
func residualSize(r series.Sum, _ series.Env) float64 {
	if r.IsZero() {
		return 0
	}
	return 1
}

func traceText(s domain.Side) string {
	if s.Condition.Kind == domain.Dirichlet {
		return "u_p(" + s.At + ")"
	}
	return domain.OperatorText(s.Condition, "u_p") + " at (" + s.At + ")"
}

func operatorTeX(c domain.Condition, fn string) string {
	switch c.Kind {
	case domain.Neumann:
		return `\partial_n ` + fn
	case domain.Robin:
		return `\partial_n ` + fn + " + " + c.H.LaTeX() + " " + fn
	case domain.Floating:
		return `\overline{\partial_n ` + fn + `}`
	}
	return fn
}

func traceTeX(s domain.Side) string {
	return operatorTeX(s.Condition, "u_p") + `\big|_{` + s.AtLaTeX + "}"
}

// finite refuses a view with a number that is not finite (a check
// residual, a figure of the report): psol prints no NaN or Inf as an answer.
func (v *view) finite() error {
	bad := func(x float64) bool { return math.IsNaN(x) || math.IsInf(x, 0) }
	for _, c := range v.Checks {
		if bad(c.Residual) {
			return &domain.Unsolvable{Reason: fmt.Sprintf("the check %s on %s is not a finite number: the solution exceeds float64's range there, or the data or source are undefined; psol gives no answer it cannot check", c.Name, orEquation(c.Side))}
		}
	}
	if r := v.Report; r != nil {
		if g := r.Gradient; g != nil && bad(g.Value) {
			return &domain.Unsolvable{Reason: "the largest |grad u| is not a finite number: the solution exceeds float64's range in the region"}
		}
		for _, p := range []*float64{r.Max, r.Min, r.Flux, r.SourceIntegral} {
			if p != nil && bad(*p) {
				return &domain.Unsolvable{Reason: "a figure of the report is not a finite number: the solution exceeds float64's range in the region"}
			}
		}
	}
	return nil
}

func orEquation(side string) string {
	if side == "" {
		return "the region"
	}
	return side
}

// independentText is the check line's note of the independent check: its
// verdict only (a residual at rounding level differs between CPUs).
func (v *view) independentText() string {
	switch {
	case v.Independent == nil:
		return ""
	case v.independentFailed:
		return "; " + v.Independent.Name
	}
	return "; every side's condition verified independently"
}

func (v *view) failedCheck() error {
	if v.independentFailed {
		return &internalError{v.Independent.Name + " (a defect of psol's: please report it with the command line)"}
	}
	for _, c := range v.Checks {
		if c.Exact && c.Formula != "0" {
			return &internalError{fmt.Sprintf("internal check failed: %s = %s (please report it with the command line)", c.Name, c.Formula)}
		}
	}
	return nil
}

var renderers = map[string]func(io.Writer, *view) error{
	"text":  renderText,
	"latex": renderLaTeX,
	"json":  renderJSON,
}

const labelWidth = 13 // "closed form" and the longest stage names fit

func line(w io.Writer, label, text string) {
	fmt.Fprintf(w, "%-*s%s\n", labelWidth, label, text)
}

func renderText(w io.Writer, v *view) error {
	if v.showSteps {
		line(w, "problem", v.Problem.Text)
		for _, s := range v.Steps {
			line(w, "step", s)
		}
	}
	for _, s := range v.stages() {
		line(w, s.Label, shortenNumeric(s.Text))
	}
	if v.ClosedForm != nil {
		line(w, "closed form", v.ClosedForm.Text)
	}
	line(w, "check", checkSummary(v.Checks)+v.checkScope+v.independentText())
	for _, p := range v.Points {
		at := fmt.Sprintf("r = %.10g, theta = %.10g (x = %.10g, y = %.10g): u = %.12g", p.R, p.Theta, p.X, p.Y, p.U)
		if p.Regular {
			at = fmt.Sprintf("r = %.10g, theta = %.10g (x = %.10g, y = %.10g), a point source: u is infinite; its regular part u - (Q/(2*pi))*ln|z - z0| = %.12g, Q = %s", p.R, p.Theta, p.X, p.Y, p.U, p.strength)
		}
		switch {
		case p.Terms > 0:
			tail := p.Error
			if tail < 1e-300 { // an underflow's denormal, not a measure
				tail = 0
			}
			at += fmt.Sprintf(" (series summed to n = %d, tail estimate %.1e)", p.Terms, tail)
		case p.Error > 1e-10*math.Max(1, math.Abs(p.U)): // numeric parts: the estimate matters
			at += fmt.Sprintf(" (error estimate %.1e)", p.Error)
		}
		line(w, "point", at)
	}
	if r := v.Report; r != nil {
		uScale := 0.0 // u's size (the extremes', the mean's), against which rounding is judged
		for _, m := range []*float64{r.Max, r.Min, r.Mean} {
			if m != nil {
				uScale = math.Max(uScale, math.Abs(*m))
			}
		}
		for _, e := range []struct {
			name string
			v    *float64
			at   [2]float64
			inf  string
		}{{"max", r.Max, r.ArgMax, r.MaxInf}, {"min", r.Min, r.ArgMin, r.MinInf}} {
			switch {
			case e.v != nil:
				line(w, "report", fmt.Sprintf("%s u = %s at %s", e.name, noiseFloor(*e.v, uScale), where(e.at)))
			case e.inf != "":
				line(w, "report", fmt.Sprintf("%s u = %s at the point source, %s", e.name, e.inf, where(e.at)))
			}
		}
		switch {
		case r.Integral != nil && r.Mean != nil:
			line(w, "report", "area integral of u = "+figure(r.IntegralText, *r.Integral)+fmt.Sprintf(", mean u = %.12g", *r.Mean))
		case r.Integral != nil:
			line(w, "report", "area integral of u = "+figure(r.IntegralText, *r.Integral))
		case r.IntegralText != "":
			line(w, "report", "area integral of u = "+r.IntegralText+", area = "+r.AreaText)
		default:
			line(w, "report", "area integral of u: not finite over the unbounded region")
		}
		fluxScale := 0.0
		for _, f := range append([]*float64{r.SourceIntegral, r.Flux}, sideFluxes(r.Sides)...) {
			if f != nil {
				fluxScale = math.Max(fluxScale, math.Abs(*f))
			}
		}
		var sides []string
		for _, f := range r.Sides {
			if f.Infinite != "" {
				sides = append(sides, f.Side+" infinite ("+f.Infinite+")")
				continue
			}
			if f.Text == "" && f.Flux != nil {
				sides = append(sides, f.Side+" "+noiseFloor(*f.Flux, fluxScale))
				continue
			}
			sides = append(sides, f.Side+" "+figureOrExact(f.Text, f.Flux))
		}
		if len(sides) > 1 {
			line(w, "report", "outward flux through each side: "+strings.Join(sides, "; "))
		}
		if r.FluxInfinite != "" && r.SourceIntegral != nil {
			line(w, "report", "net outward flux: infinite side by side ("+r.FluxInfinite+"); in the limit about the corners it is the source integral = "+figure(r.SourceText, *r.SourceIntegral)+" (divergence theorem)")
		} else if r.Flux != nil {
			line(w, "report", "net outward flux = "+figure(r.FluxText, *r.Flux)+", source integral = "+figure(r.SourceText, *r.SourceIntegral)+
				fmt.Sprintf(" (divergence theorem: difference %.2g)", *r.Flux-*r.SourceIntegral))
		} else if r.FluxText != "" {
			line(w, "report", "net outward flux = source integral = "+r.FluxText+" (divergence theorem)")
		}
		if g := r.Gradient; g != nil && g.Unbounded && g.Why != "" {
			line(w, "report", "largest |grad u|: unbounded where "+g.Why+" (|grad u| grows like 1/distance there)")
		} else if g != nil && g.Unbounded {
			line(w, "report", fmt.Sprintf("largest |grad u|: unbounded at the point source x = %.6g, y = %.6g (|grad u| grows like |Q|/(2*pi*distance) there)", g.At[0], g.At[1]))
		} else if g != nil {
			digits := 9 // by differences
			if g.exact {
				digits = 12 // from the exact derivatives
			}
			line(w, "report", fmt.Sprintf("largest |grad u| = %.*g at x = %.6g, y = %.6g", digits, g.Value, g.At[0], g.At[1])+g.note)
		}
		if r.Note != "" {
			line(w, "report", r.Note)
		}
	}
	for _, q := range v.Quantities {
		line(w, "figure", q.text())
		for _, warn := range q.Warnings {
			line(w, "figure", "  caution: "+warn)
		}
	}
	if v.Caution != "" {
		label := "figure"
		if len(v.Quantities) == 0 {
			label = "report"
		}
		line(w, label, v.Caution)
	}
	for _, s := range v.Warnings {
		line(w, "note", s)
	}
	return nil
}

// reportOut is the JSON form of a report: the SPEC keys, with exact forms
// beside; a number that needs parameter values is null.
type reportOut struct {
	Max            *float64     `json:"max"`
	Min            *float64     `json:"min"`
	MaxInf         string       `json:"max_infinite,omitempty"` // "+inf" at a point source (max is null)
	MinInf         string       `json:"min_infinite,omitempty"`
	ArgMax         [2]float64   `json:"argmax"`
	ArgMin         [2]float64   `json:"argmin"`
	Integral       *float64     `json:"integral"` // null where it is not finite (outside a circle)
	IntegralText   string       `json:"integral_exact,omitempty"`
	AreaText       string       `json:"area_exact,omitempty"`
	Mean           *float64     `json:"mean"`
	Flux           *float64     `json:"flux"`
	FluxText       string       `json:"flux_exact,omitempty"`
	SourceIntegral *float64     `json:"source_integral"`
	SourceText     string       `json:"source_integral_exact,omitempty"`
	Sides          []sideOut    `json:"side_flux"`
	FluxInfinite   string       `json:"flux_infinite,omitempty"` // why the sides' fluxes are not finite (flux is null)
	Gradient       *gradientOut `json:"max_gradient,omitempty"`
	Note           string       `json:"note,omitempty"`
}

// sideOut is the outward flux through one side.
type sideOut struct {
	Side     string   `json:"side"`
	Flux     *float64 `json:"flux"`
	Text     string   `json:"exact,omitempty"`
	Infinite string   `json:"infinite,omitempty"` // why the flux is infinite (flux is null)
}

// gradientOut is the largest |∇u| and where (x, y).
type gradientOut struct {
	Value  float64    `json:"value"`
	At     [2]float64 `json:"at"`
	Corner bool       `json:"at_reentrant_corner,omitempty"`
	// Unbounded marks |grad u| growing without bound at a point source (value 0).
	Unbounded bool `json:"unbounded,omitempty"`
	// Why, where set, is the place it is unbounded other than a point source.
	Why   string `json:"unbounded_where,omitempty"`
	note  string
	exact bool
}

func finite(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return &v
}

func exactText(c *series.Coef) string {
	if c == nil {
		return ""
	}
	return c.Text()
}

func newReportOut(r *domain.Report) *reportOut {
	out := &reportOut{Max: finite(r.Max), Min: finite(r.Min), ArgMax: r.ArgMax, ArgMin: r.ArgMin, Integral: finite(r.Integral), IntegralText: exactText(r.IntegralExact),
		Mean: finite(r.Mean), Flux: finite(r.Flux), FluxText: exactText(r.FluxExact), SourceIntegral: finite(r.Source), SourceText: exactText(r.SourceExact), Note: r.Bounded, FluxInfinite: r.FluxInfinite,
		Sides: []sideOut{}}
	if r.Symbolic {
		out.AreaText = r.Area.Text()
	}
	if math.IsInf(r.Max, 1) {
		out.MaxInf = "+inf"
	}
	if math.IsInf(r.Min, -1) {
		out.MinInf = "-inf"
	}
	for _, f := range r.Sides {
		out.Sides = append(out.Sides, sideOut{Side: f.Side, Flux: finite(f.Value), Text: exactText(f.Exact), Infinite: f.Infinite})
	}
	if g := r.Gradient; g != nil && math.IsInf(g.Value, 1) {
		out.Gradient = &gradientOut{At: g.At, Unbounded: true, Why: g.Unbounded}
	} else if g != nil && !math.IsNaN(g.Value) {
		out.Gradient = &gradientOut{Value: g.Value, At: g.At, Corner: g.Corner, exact: g.Exact}
		if g.Corner {
			out.Gradient.note = " (at a re-entrant corner, where |grad u| is unbounded in general: the value is where sampling stopped)"
		}
	}
	return out
}

// figureOrExact is a figure, or its exact form alone where it needs values.
func figureOrExact(exact string, v *float64) string {
	if v == nil {
		return exact
	}
	return figure(exact, *v)
}

// noiseFloor prints a computed figure, or 0 with what was computed where it
// is below 1e-9 of the size of its kind of figure (the extremes', the
// fluxes'): there the digits are the rounding of the numeric parts, and a
// zero (an insulated side's flux, the value on a side at u = 0) is what the
// user should read.
func noiseFloor(v, scale float64) string {
	if v != 0 && math.Abs(v) <= 1e-9*scale {
		return fmt.Sprintf("0 (computed %.1e, within rounding)", v)
	}
	return fmt.Sprintf("%.12g", v)
}

func sideFluxes(ss []sideOut) []*float64 {
	out := make([]*float64, len(ss))
	for i, s := range ss {
		out[i] = s.Flux
	}
	return out
}

// figure prints an exact value with its decimal, or the decimal alone.
func figure(exact string, v float64) string {
	if exact == "" {
		return fmt.Sprintf("%.12g", v)
	}
	if q, err := strconv.ParseFloat(exact, 64); err == nil && q == v {
		return exact
	}
	return fmt.Sprintf("%s = %.12g", exact, v)
}

func checkSummary(cs []checkOut) string {
	var parts []string
	exact := true
	var numeric []string
	for _, c := range cs {
		on := ""
		if c.Side != "" {
			on = " on " + c.Side
		}
		if !c.Exact {
			numeric = append(numeric, fmt.Sprintf("%s%s %.1e", c.Name, on, c.Residual))
			continue
		}
		parts = append(parts, c.Name+" = "+c.Formula+on)
		exact = exact && c.Exact
	}
	out := strings.Join(parts, ", ") + " (exact)"
	if len(numeric) > 0 {
		out += "; largest sampled residuals: " + strings.Join(numeric, ", ")
	}
	return out
}

func renderLaTeX(w io.Writer, v *view) error {
	fmt.Fprintf(w, "%% psol: %s\n", v.Problem.Text)
	fmt.Fprintln(w, `\begin{align*}`)
	var lines []string
	for i, l := range breakLaTeX(v.Problem.LaTeX) {
		if i > 0 {
			l = `\quad ` + l
		}
		lines = append(lines, "  & "+l)
	}
	where := v.where
	for _, s := range v.stages() {
		tex, note := shortenNumericLaTeX(s.Text, s.LaTeX, s.tex)
		if note != "" {
			where = append(where, note)
		}
		for i, l := range breakLaTeX(tex) {
			if i == 0 {
				lines = append(lines, "  "+s.tex+" &= "+l)
			} else {
				lines = append(lines, `  &\quad `+l)
			}
		}
	}
	sep := " \\\\\n"
	if len(lines) > 12 { // taller than a page's share: let the page break between lines
		sep = ` \displaybreak[0]` + sep
	}
	fmt.Fprintln(w, strings.Join(lines, sep))
	fmt.Fprintln(w, `\end{align*}`)
	if len(where) > 0 {
		// sloppy: a long inline formula moves to a line of its own rather than past the margin
		fmt.Fprintf(w, "{\\sloppy\\noindent where %s.\\par}\n", strings.Join(where, "; "))
	}
	fmt.Fprintf(w, "%% check: %s\n", checkSummary(v.Checks))
	return nil
}

func renderJSON(w io.Writer, v *view) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(v)
}

// seriesStages prints a sector's stages: the mode-by-mode particular
// solution, its arc trace, the correction, and the harmonic part as the
// ray shift plus a series.
func (v *view) seriesStages(sol *domain.Solution, ps *domain.SeriesParts) {
	side := sol.Sides[0]
	join := v.joiner(domain.JoinSeries)
	up, upSer := sol.Particular, ps.Particular
	h, hSer := sol.Harmonic, ps.Harmonic
	v.Particular = exactStage("particular", "u_p = "+join(up, upSer, false), join(up, upSer, true), "u_p")
	if sol.RaysByShift {
		v.Trace = exactStage("trace", traceText(side)+" = "+join(side.Trace, ps.Trace, false), join(side.Trace, ps.Trace, true), traceTeX(side))
	}
	if sol.RaysByShift {
		v.Steps = append(v.Steps, "the rays' values are carried by the harmonic shift w = "+h.Text()+"; the modes vanish on the rays")
		v.Correction = exactStage("correction", ps.Correction.Text(), v.latex(ps.Correction.LaTeX), `g - w - `+traceTeX(side))
		v.where = append(v.where, `$w = `+v.latex(h.LaTeX)+`$ is the harmonic shift that carries the rays' values, so that the modes vanish on the rays`)
	} else {
		var co, coTeX []string
		for _, s := range sol.Sides {
			corr := s.Data.Sub(s.Trace)
			co = append(co, sidePrefix(sol, s)+join(corr, ps.BySide[s.Condition.Side], false))
			coTeX = append(coTeX, join(corr, ps.BySide[s.Condition.Side], true))
		}
		v.Correction = exactStage("correction", strings.Join(co, "; "), strings.Join(coTeX, ", "), `g - `+traceTeX(side))
	}
	v.Harmonic = exactStage("harmonic", join(h, hSer, false), join(h, hSer, true), "u_h")
	// u without the point sources' field, which pointStages adds.
	w := sol.Particular.Add(sol.Harmonic)
	v.Solution = exactStage("solution", "u = "+join(w, ps.U, false), join(w, ps.U, true), "u")
	if sol.Quadrature != nil && !sol.Numeric { // kinks alone: their closed forms, exact traces
		q, qTeX := quadratureText(sol)
		v.Particular.Text, v.Particular.LaTeX = "u_p = "+joinNonzero(join(up, upSer, false), q), joinNonzero(join(up, upSer, true), qTeX)
		v.Solution.Text, v.Solution.LaTeX = "u = "+joinNonzero(join(w, ps.U, false), q), joinNonzero(join(w, ps.U, true), qTeX)
	}
	v.checkScope = "; the series term by term, for every n"
}

// approximate reprints the stages that carry numeric coefficients as decimals, marked ≈.
func (v *view) approximate(sol *domain.Solution) {
	mark := func(st *stage, text, latex string) {
		st.Text, st.LaTeX, st.Exact = text, latex, false
	}
	if sol.Rect != nil { // rectStages marks its own numeric stages
		return
	}
	if ps := sol.Series; ps != nil && sol.Quadrature != nil && sol.KinkTraces != nil {
		// A circle's exact kinks beside a numeric rest: the kinks' traces
		// are exact series, the rest's modes decimals in the side's sums.
		join := v.joiner(domain.JoinSeriesApprox)
		q, qTeX := quadratureText(sol)
		mark(&v.Particular, "u_p = "+joinNonzero(sol.Particular.TextApprox(), q), joinNonzero(v.latex(sol.Particular.LaTeXApprox), qTeX))
		var tr, trTeX, co, coTeX []string
		for _, s := range sol.Sides {
			kt, ktTeX := kinkTrace(sol, s)
			tr = append(tr, sidePrefix(sol, s)+traceText(s)+" ≈ "+joinNonzero(s.Trace.TextApprox(), kt))
			trTeX = append(trTeX, joinNonzero(v.latex(s.Trace.LaTeXApprox), ktTeX))
			co = append(co, sidePrefix(sol, s)+"≈ "+join(s.Data.Sub(s.Trace), ps.BySide[s.Condition.Side], false))
			coTeX = append(coTeX, join(s.Data.Sub(s.Trace), ps.BySide[s.Condition.Side], true))
		}
		mark(&v.Trace, strings.Join(tr, "; "), strings.Join(trTeX, ", "))
		mark(&v.Correction, strings.Join(co, "; "), strings.Join(coTeX, ", "))
		mark(&v.Harmonic, "≈ "+join(sol.Harmonic, ps.Harmonic, false), join(sol.Harmonic, ps.Harmonic, true))
		w := sol.Particular.Add(sol.Harmonic)
		mark(&v.Solution, "u ≈ "+joinNonzero(join(w, ps.U, false), q), joinNonzero(join(w, ps.U, true), qTeX))
		return
	}
	if ps := sol.Series; ps != nil && sol.Quadrature != nil { // a sector: the numeric traces are in the modes
		join := v.joiner(domain.JoinSeriesApprox)
		q := "quadrature(" + sol.Rest.Text() + ")"
		plus := func(s string) string {
			if s == "0" {
				return q
			}
			return s + " + " + q
		}
		plusTeX := func(s string) string {
			if s == "0" {
				return `u_q`
			}
			return s + ` + u_q`
		}
		side := sol.Sides[0]
		mark(&v.Particular, "u_p = "+plus(join(sol.Particular, ps.Particular, false)), plusTeX(join(sol.Particular, ps.Particular, true)))
		mark(&v.Trace, traceText(side)+" ≈ "+join(side.Trace, ps.Trace, false), join(side.Trace, ps.Trace, true))
		mark(&v.Correction, "≈ "+ps.Correction.TextApprox(), v.latex(ps.Correction.LaTeXApprox))
		mark(&v.Harmonic, "≈ "+join(sol.Harmonic, ps.Harmonic, false), join(sol.Harmonic, ps.Harmonic, true))
		mark(&v.Solution, "u ≈ "+plus(join(sol.Particular.Add(sol.Harmonic), ps.U, false)), plusTeX(join(sol.Particular.Add(sol.Harmonic), ps.U, true)))
		return
	}
	var co, coTeX []string
	for _, s := range sol.Sides {
		c := s.Data.Sub(s.Trace)
		co, coTeX = append(co, sidePrefix(sol, s)+"≈ "+c.TextApprox()), append(coTeX, v.latex(c.LaTeXApprox))
	}
	mark(&v.Correction, strings.Join(co, "; "), strings.Join(coTeX, ", "))
	var tr, trTeX []string
	for _, s := range sol.Sides {
		tr, trTeX = append(tr, sidePrefix(sol, s)+traceText(s)+" ≈ "+s.Trace.TextApprox()), append(trTeX, v.latex(s.Trace.LaTeXApprox))
	}
	mark(&v.Trace, strings.Join(tr, "; "), strings.Join(trTeX, ", "))
	if sol.Quadrature != nil {
		q, qTeX := quadratureText(sol)
		text := "u_p = " + sol.Particular.Text() + " + " + q
		if sol.Particular.IsZero() {
			text = "u_p = " + q
		}
		tex := v.latex(sol.Particular.LaTeX) + ` + ` + qTeX
		if sol.Particular.IsZero() {
			tex = qTeX
		}
		mark(&v.Particular, text, tex)
		if sol.Quadrature.Left == nil && len(sol.Quadrature.Kinks) > 0 {
			v.Particular.Exact = true // closed: the kinks' forms alone
		}
	}
	mark(&v.Harmonic, "≈ "+sol.Harmonic.TextApprox(), v.latex(sol.Harmonic.LaTeXApprox))
	solText, solTeX := sol.U.TextApprox(), v.latex(sol.U.LaTeXApprox)
	if sol.Quadrature != nil {
		q, qTeX := quadratureText(sol)
		solText, solTeX = solText+" + "+q, solTeX+` + `+qTeX
	}
	mark(&v.Solution, "u ≈ "+solText, solTeX)
}

// kinkTrace is the kinks' exact trace on a side, as a bare sum of series
// (no outer parentheses, so that LaTeX lines break inside it); "" if none.
func kinkTrace(sol *domain.Solution, s domain.Side) (text, latex string) {
	f, ok := sol.KinkTraces[s.Condition.Side]
	if !ok {
		return "", ""
	}
	fc, _ := f.FourierOn(series.IntCoef(1)) // the kinks' traces depend on theta alone
	return fc.Text(), fc.LaTeX()
}

// quadratureText is the particular solution of the source's part with no
// polynomial rule: the kinks' closed forms, c*abs(l)^3/(6|grad l|^2), and
// quadrature(rest) for what is left (u_q in LaTeX).
func quadratureText(sol *domain.Solution) (text, tex string) {
	q := sol.Quadrature
	if len(q.Kinks) == 0 {
		return "quadrature(" + sol.Rest.Text() + ")", `u_q`
	}
	var ts, xs []string
	for _, k := range q.Kinks {
		ts, xs = append(ts, k.Text()), append(xs, k.LaTeX())
	}
	if q.Left != nil {
		ts, xs = append(ts, "quadrature("+q.Left.Text()+")"), append(xs, `u_q`)
	}
	return strings.Join(ts, " + "), strings.Join(xs, " + ")
}

// quadratureSource is the source part the quadrature samples (nil: none,
// the kinks took it all).
func quadratureSource(sol *domain.Solution) *series.Expr {
	if sol.Quadrature == nil {
		return nil
	}
	if len(sol.Quadrature.Kinks) > 0 {
		return sol.Quadrature.Left
	}
	return sol.Rest
}

// where is a polar point, with its Cartesian coordinates beside.
func where(p [2]float64) string {
	x, y := domain.Cartesian(p[0], p[1])
	return fmt.Sprintf("r = %.6g, theta = %.6g (x = %.6g, y = %.6g)", p[0], p[1], x, y)
}

// sidePrefix names the side in a stage line where the region has several.
func sidePrefix(sol *domain.Solution, s domain.Side) string {
	if len(sol.Sides) > 1 {
		return s.Condition.Side + ": "
	}
	return ""
}

// rectStages prints a rectangle's stages in x and y: the particular
// solution, each side's trace and correction, and a series per side.
func (v *view) rectStages(sol *domain.Solution) {
	rp := sol.Rect
	var tr, co, h, hTeX, trTeX, coTeX []string
	for _, s := range rp.Sides {
		coord := "x"
		if s.Name == "left" || s.Name == "right" {
			coord = "y"
		}
		trText, trLaTeX := s.Trace.Text(), v.latex(s.Trace.LaTeX)
		if sol.Numeric {
			trText, trLaTeX = s.Trace.TextApprox(), v.latex(s.Trace.LaTeXApprox)
		}
		switch {
		case s.NumericTrace != "" && s.Trace.IsZero():
			trText, trLaTeX = "("+s.NumericTrace+")", s.NumericTraceLaTeX
		case s.NumericTrace != "":
			trText, trLaTeX = trText+" + ("+s.NumericTrace+")", trLaTeX+` + `+s.NumericTraceLaTeX
		}
		tr = append(tr, s.Name+": "+trText)
		trTeX = append(trTeX, `\text{`+s.Name+`: } `+trLaTeX)
		co = append(co, s.Name+": "+s.CorrectionText()+" (in "+coord+")")
		coTeX = append(coTeX, `\text{`+s.Name+`: } `+v.latex(s.CorrectionLaTeX))
		if t := s.HarmonicText(false); t != "0" {
			h = append(h, t)
			hTeX = append(hTeX, v.latex(func() string { return s.HarmonicText(true) }))
		}
	}
	harm, harmTeX := strings.Join(h, " + "), strings.Join(hTeX, " + ")
	if harm == "" {
		harm, harmTeX = "0", "0"
	}
	upText, upTeX := rp.Particular.Text(), v.latex(rp.Particular.LaTeX)
	if sol.Numeric {
		upText, upTeX = rp.Particular.TextApprox(), v.latex(rp.Particular.LaTeXApprox)
	}
	if rp.Quadrature != nil {
		q := "quadrature(" + rp.QuadratureSource.Text() + ")"
		if upText == "0" {
			upText, upTeX = q, "u_q"
		} else {
			upText, upTeX = upText+" + "+q, upTeX+" + u_q"
		}
	}
	if len(rp.Waves) > 0 {
		w, wTeX := rp.Waves.Text(), v.latex(rp.Waves.LaTeX)
		if rp.Particular.IsZero() {
			upText, upTeX = w, wTeX
		} else {
			upText, upTeX = joinSigned(upText, w), joinSigned(upTeX, wTeX)
		}
	}
	v.Particular = exactStage("particular", "u_p = "+upText, upTeX, "u_p")
	v.Trace = exactStage("trace", strings.Join(tr, "; "), strings.Join(trTeX, `,\ `), "u_p|_{\\partial}")
	v.Correction = exactStage("correction", strings.Join(co, "; "), strings.Join(coTeX, `,\ `), "g - u_p")
	v.Harmonic = exactStage("harmonic", harm, harmTeX, "u_h")
	sol0, sol0TeX := upText, upTeX+" + "+harmTeX
	switch {
	case upText == "0":
		sol0, sol0TeX = harm, harmTeX
	case harm != "0":
		sol0 += " + " + harm
	}
	v.Solution = exactStage("solution", "u = "+sol0, sol0TeX, "u")
	v.checkScope = ""
	if sol.Numeric { // some side series have numeric coefficients (cart.EigenSide)
		for _, st := range []*stage{&v.Correction, &v.Harmonic, &v.Solution} {
			st.Exact = false
		}
		if rp.ParticularNumeric {
			v.Particular.Exact, v.Trace.Exact = false, false
		}
		v.checkScope = "; the numeric side series as summed"
	}
	for _, side := range rp.Sides {
		if side.Eigen != nil {
			v.where = append(v.where, `$\mu_n$ and $\delta_n$ are the $n$-th mode's wavenumber and phase along a side with a convective neighbour, fixed by its two neighbours' conditions; $Y_n(d)$ is the mode's profile across, $d$ the distance from the opposite side, meeting that side's condition and scaled to 1 under this side's operator; $b_n$ its coefficient, fitted to the side's data (numeric)`)
			break
		}
	}
}

// joinSigned is a + b, written a - b' where b prints with a leading minus.
func joinSigned(a, b string) string {
	if strings.HasPrefix(b, "-") {
		return a + " - " + b[1:]
	}
	return a + " + " + b
}
