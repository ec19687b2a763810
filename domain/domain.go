package domain

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"psol/ansatz"
	"psol/series"
)

// Unsolvable reports a well-formed problem that has no solution as posed.
type Unsolvable struct {
	Reason string
	cause  error // the error the reason wraps (%w), if any
}

func (e *Unsolvable) Error() string { return e.Reason }

// Unwrap is the cause, so that callers can test its kind with errors.As.
func (e *Unsolvable) Unwrap() error { return e.cause }

func unsolvable(format string, args ...any) error {
	err := fmt.Errorf(format, args...)
	return &Unsolvable{err.Error(), errors.Unwrap(err)}
}

// Unsupported reports a problem psol cannot yet put in closed form.
type Unsupported struct {
	Reason string
	cause  error // the error the reason wraps (%w), if any
}

func (e *Unsupported) Error() string { return e.Reason }

// Unwrap is the cause, so that callers can test its kind with errors.As.
func (e *Unsupported) Unwrap() error { return e.cause }

func unsupported(format string, args ...any) error {
	err := fmt.Errorf(format, args...)
	return &Unsupported{err.Error(), errors.Unwrap(err)}
}

// MissingSides reports sides that have no condition.
type MissingSides struct{ Sides []string }

func (e *MissingSides) Error() string {
	return fmt.Sprintf("no boundary condition for %s; every side needs one", strings.Join(e.Sides, ", "))
}

// Domain is a region psol solves on.
type Domain interface {
	// Sides names the boundary parts, in the order output lists them.
	Sides() []string
	// Describe is a phrase such as "the disk r < 2".
	Describe() string
	// Contains reports whether the point (r, θ) lies in the closed region.
	Contains(r, theta float64, env series.Env) (bool, error)
	// Measures are the region's exact area, side lengths and holes.
	Measures() Measures
	// integral is the exact area integral of a closed field over the region.
	integral(u series.Sum) (series.Coef, error)
	// Shape is the region's geometry with the parameters' values: sides,
	// area, bounding box, and its (r, θ) box where it is one.
	Shape(env series.Env) (Shape, error)
	// solve assembles the solution; each region family has its own method.
	solve(p *posed) (*Solution, error)
	// figures fills the region's share of a report: the area, the integrals
	// of u and of the source, the net outward flux, and the extremes.
	figures(s *Solution, ev *Evaluator, rep *Report, env series.Env, tol float64) error
	// claimSide is a claimed solution's residual under one side's condition.
	claimSide(side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error)
	// samples are interior points (r, θ) for numeric checks.
	samples(env series.Env) ([][2]float64, error)
}

// posed is a problem after the checks every region shares.
type posed struct {
	f       series.Sum
	conds   map[string]Condition
	env     series.Env // parameter values, for numeric data
	tol     float64
	numeric bool
	rest    *series.Expr // the source's part with no closed form, for quadrature
	// forceQuadrature keeps rest from any ansatz (Options.NumericSource).
	forceQuadrature bool
	quadSamples     int  // Options.QuadratureSamples
	quadBisections  int  // Options.QuadratureBisections
	wholeBoundary   bool // Options.WholeBoundary
}

// Side is what one boundary part contributes: the condition, the particular
// solution's trace under the condition's operator, and the correction
// (data minus trace) the harmonic part must supply.
type Side struct {
	Condition  Condition
	At         string     // where the trace is taken, e.g. "2, theta"
	AtLaTeX    string     // e.g. "r=2"
	Data       series.Sum // the data as the mode systems take it
	Trace      series.Sum
	Correction series.Sum
	DataText   string // the data as given, traced on the side
	DataLaTeX  string
}

// Check is one verification of the assembled solution.
type Check struct {
	Name     string
	Side     string // "" for the equation
	Exact    bool
	Residual series.Sum
	Numeric  float64 // the largest residual on a check grid, when not exact
	scale    float64 // the size of what a sampled check compares, at its points (for failed)
	peak     float64 // the largest size anywhere, where known (a concentrated source's peak)
	// independentFailed marks the independent check failing: psol's own
	// solution does not meet its conditions (a defect of psol's).
	independentFailed bool
}

// Failed reports a check that shows psol's solution wrong: the independent
// check of the conditions.
func (c Check) Failed() bool { return c.independentFailed }

// Solution is the assembled answer with its stages.
type Solution struct {
	// CornerJumps are the corners where two sides' values disagree: there
	// |∇u| grows like 1/distance, and the two sides' fluxes are infinite.
	CornerJumps []CornerJump
	Domain      Domain
	Source      series.Sum
	Particular  series.Sum
	Sides       []Side
	Harmonic    series.Sum
	U           series.Sum
	Free        string // the name of a free additive constant in U, if any
	// Floating are the constant values u takes on its floating sides, by side.
	Floating map[string]series.Coef
	FreeMean series.Coef // the value of Free that makes u's mean on the first boundary circle zero
	Checks   []Check
	// Independent is the check of the conditions by a path that shares no
	// code with the solve (see verifyIndependently); nil where parameters
	// have no values.
	Independent *Check
	Series      *SeriesParts // the infinite-series stages, where the region needs them
	// Options are those the solution was solved with; evaluation, grids,
	// pictures and reports take the parameters and the tolerance from here.
	Options Options
	// RaysByShift marks a solution whose sides after the first are rays met
	// by the eigenfunctions and the harmonic shift w (Harmonic): they carry
	// no trace or correction of their own, and the correction is g − w − trace.
	RaysByShift bool
	// Rect is a rectangle's stages in x and y, for printing; its evaluation
	// is one of the stages.
	Rect *RectParts
	// Section is a polygon's or an ellipse's numeric harmonic part.
	Section *SectionParts
	// Points is the point sources' field u_s and how it meets the
	// conditions, where the source has point sources; U is then w, and u = u_s + U.
	Points *PointPart
	// Waves is a section's particular part in exponentials and
	// trigonometric functions of x and y, where the source has any.
	Waves  *WavePart
	stages []stage       // region parts that evaluation attaches (see Compile)
	Rules  []ansatz.Step // how each source term was solved
	Steps  []string      // how the harmonic part was found, beyond the per-mode records
	modes  []modeRecord
	Notes  []string
	// Quadrature is the particular solution of the source's part with no
	// closed form, and Rest that part.
	Quadrature *ansatz.Quadrature
	// KinkTraces are, by side, the kinks' share of B[u_p] given exactly
	// (their particular solution is the quadrature's closed part): in the
	// data, and printed with the trace.
	KinkTraces map[string]series.Field
	Rest       *series.Expr
	// seriesResidual is, per side, the exact residual of the general term's condition.
	seriesResidual map[string]series.Coef
	// ClosedForm is the harmonic series summed in closed form, where psol
	// recognises it (piecewise-constant values on a circle), to add to the closed parts.
	ClosedForm, ClosedFormLaTeX string
	Numeric                     bool    // some coefficients are numeric (FFT of boundary data)
	DataError                   float64 // an estimate of the error the numeric data bring
}

// Solve assembles u = u_p + h on d for Δu = f with the given conditions:
// u_p from the ansatz rules, h from the region's harmonic series.
func Solve(d Domain, source series.Field, conds []Condition) (*Solution, error) {
	return SolveWith(d, source, conds, Options{})
}

// SolveWith is Solve with options for the numeric fallbacks.
func SolveWith(d Domain, source series.Field, conds []Condition, opt Options) (*Solution, error) {
	if opt.Tol == 0 {
		opt.Tol = SumTol
	}
	if opt.Terms == 0 {
		opt.Terms = PointTerms
	}
	if len(source.Points) > 0 {
		return solvePoints(d, source, conds, opt)
	}
	switch {
	case source.IsPiecewise() || source.Rest.HasChoice():
		return nil, unsupported("a source given piece by piece (cond ? a : b) is taken as a step across a line only: one comparison of linear forms in x and y, and constant values either side (x < 0.2 ? q : 0); this one is not")
	case !source.IsExact():
		// The rectangle's wave ansatz or the quadrature fallback takes the part with no closed form.
		if source.Rest.HasSeries() {
			return nil, unsupported("a source given as an infinite series is not taken by the quadrature fallback: %s", source.Rest.Text())
		}
	}
	if opt.NumericSource && source.IsExact() {
		source = series.Field{Rest: series.ExprOf(source.Exact)}
	}
	p := &posed{f: source.Exact, rest: source.Rest, conds: map[string]Condition{}, env: opt.Env, tol: opt.Tol, numeric: opt.NumericData, forceQuadrature: opt.NumericSource, quadSamples: opt.QuadratureSamples, quadBisections: opt.QuadratureBisections, wholeBoundary: opt.WholeBoundary}
	for _, c := range conds {
		if _, dup := p.conds[c.Side]; dup {
			return nil, unsupported("side %s has two conditions; give one", c.Side)
		}
		p.conds[c.Side] = c
	}
	for _, c := range conds {
		if fieldHasSeries(c.G) {
			return nil, unsupported("boundary data on %s given as an infinite series are not sampled (each of thousands of samples would sum the series, and the sum's tail would go unmeasured): give the data in closed form, or as a finite sum of modes", c.Side)
		}
	}
	_, holed := d.(Holed)
	if _, circles := d.(circular); !circles {
		for _, c := range conds {
			if c.Kind == Floating && !(holed && strings.HasPrefix(c.Side, "hole")) {
				return nil, unsupported("a side at one unknown constant value (u = const, flux = ...) is supported on circles for now (the annulus, the disk, outside a circle), not on %s", d.Describe())
			}
		}
	}
	var missing []string
	for _, s := range d.Sides() {
		if _, ok := p.conds[s]; !ok {
			missing = append(missing, s)
		}
	}
	if len(missing) > 0 {
		return nil, &MissingSides{missing}
	}
	if err := finiteSource(d, source, opt.Env); err != nil {
		return nil, err
	}
	if sol, handled, err := solveCircleWaves(d, source, conds, opt); handled {
		return sol, err
	}
	sol, err := d.solve(p)
	if sol != nil {
		sol.Options = opt
		if c, ok := sol.independentCheck(); ok {
			sol.Independent = &c
		}
	}
	return sol, err
}

// finiteSource refuses a source that is not a finite number somewhere in
// the region (sqrt(x) on a disk, exp(1000*x)), sampled at the check points
// and along the sides before any quadrature is spent on it.
func finiteSource(d Domain, source series.Field, env series.Env) error {
	if source.Rest == nil {
		return nil
	}
	f, err := source.Compile(env)
	if err != nil {
		return nil // parameters without values: the solve says so
	}
	pts, err := d.samples(env)
	if err != nil {
		return nil
	}
	if shape, err := d.Shape(env); err == nil {
		for _, side := range shape.Sides {
			for k := 0; k <= 32; k++ {
				x, y, nx, ny := side.At(float64(k) / 32)
				x, y = x-1e-9*nx, y-1e-9*ny // just inside
				th := math.Atan2(y, x)
				if th < 0 {
					th += 2 * math.Pi
				}
				pts = append(pts, [2]float64{math.Hypot(x, y), th})
			}
		}
	}
	for _, p := range pts {
		if v := f.At(p[0], p[1]); math.IsNaN(v) || math.IsInf(v, 0) {
			x, y := Cartesian(p[0], p[1])
			return unsolvable("the source %s is not a finite number at (x, y) = (%.4g, %.4g), inside the region: it is undefined there, or beyond float64's range", source.Text(), x, y)
		}
	}
	return nil
}

// OperatorText names the condition's operator applied to a function, e.g. "dn(u_p) + h*u_p".
func OperatorText(cond Condition, fn string) string {
	switch cond.Kind {
	case Neumann:
		return "dn(" + fn + ")"
	case Robin:
		return "dn(" + fn + ") + " + factorText(cond.H) + fn
	case Floating: // its data are the net flux over the circumference, in mode 0
		return "mean dn(" + fn + ")"
	}
	return fn
}

func factorText(h series.Coef) string {
	if h.Equal(series.IntCoef(1)) {
		return ""
	}
	s := h.Text()
	if strings.ContainsAny(s[1:], " ") || strings.HasPrefix(s, "-") {
		return "(" + s + ")*"
	}
	return s + "*"
}

// freeName picks a name for a free constant that the problem does not use.
func freeName(used map[string]bool) string {
	for _, n := range []string{"C", "C0", "C1", "C_free"} {
		if !used[n] {
			return n
		}
	}
	return "C_free"
}

// IsClosed reports a solution whose U is the whole answer: no series, no
// numeric part, and on a rectangle no side series or waves.
func (s *Solution) IsClosed() bool {
	if s.Series != nil || s.Numeric || s.Quadrature != nil || s.Points != nil {
		return false
	}
	if s.Rect != nil {
		if len(s.Rect.Waves) > 0 || s.Rect.Quadrature != nil {
			return false
		}
		for _, side := range s.Rect.Sides {
			if side.Eigen != nil || side.Series != nil && !side.Correction.IsZero() {
				return false
			}
		}
	}
	return true
}

// FreeValue is the value of the free additive constant that makes u(r, θ) = v:
// exact where the solution is closed, else from the evaluated solution
// (series, quadrature and all) as a 15-digit decimal.
func (s *Solution) FreeValue(r, theta, v series.Coef) (series.Coef, error) {
	if s.Free == "" {
		return series.Coef{}, fmt.Errorf("the solution has no free constant")
	}
	zero := series.Env{s.Free: {}}
	if s.IsClosed() {
		at, err := s.U.Subst(zero)
		if err != nil {
			return series.Coef{}, err
		}
		u0, err := at.At(r, theta)
		if err != nil {
			return series.Coef{}, err
		}
		return v.Sub(u0), nil
	}
	env := series.Env{}
	for k, c := range s.Options.Env {
		env[k] = c
	}
	env[s.Free] = series.Coef{}
	ev, err := s.Compile(env, s.Options.Tol, CheckTerms)
	if err != nil {
		return series.Coef{}, err
	}
	rf, err := r.Float(env)
	if err != nil {
		return series.Coef{}, err
	}
	tf, err := theta.Float(env)
	if err != nil {
		return series.Coef{}, err
	}
	vf, err := v.Float(env)
	if err != nil {
		return series.Coef{}, err
	}
	u0, _, _ := ev.At(rf, tf)
	return decimal(vf - u0), nil
}

// Pin gives the free additive constant its value.
func (s *Solution) Pin(v series.Coef) error {
	env := series.Env{s.Free: v}
	var err error
	if s.U, err = s.U.Subst(env); err != nil {
		return err
	}
	s.Harmonic, err = s.Harmonic.Subst(env)
	s.Free = ""
	return err
}

// StepLines is how the harmonic part was found, one line a step.
func (s *Solution) StepLines() []string {
	lines := append([]string(nil), s.Steps...)
	for _, r := range s.modes {
		lines = append(lines, modeStep(r.m, r.basis, r.x))
	}
	return lines
}

// fieldHasSeries reports an infinite series anywhere in a field's
// remainder or pieces.
func fieldHasSeries(f series.Field) bool {
	if f.Rest != nil && f.Rest.HasSeries() {
		return true
	}
	for _, p := range f.Pieces {
		if fieldHasSeries(p.Value) {
			return true
		}
	}
	return false
}

// CornerJump is a corner where the data of two sides with values disagree,
// or a jump of one side's values (both Sides the same).
type CornerJump struct {
	At    [2]float64 // (x, y)
	Sides [2]string
}

// Where is the jump's place in words.
func (j CornerJump) Where() string {
	if j.Sides[0] == j.Sides[1] {
		return fmt.Sprintf("the data on %s jump at x = %.6g, y = %.6g", j.Sides[0], j.At[0], j.At[1])
	}
	return fmt.Sprintf("the data jump at the corner x = %.6g, y = %.6g", j.At[0], j.At[1])
}
