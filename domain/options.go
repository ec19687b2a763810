package domain

import "psol/series"

// Options are a solve's numeric contract: the parameters' values and the
// tolerance every numeric step is held to. A Solution keeps the Options it
// was solved with, so evaluation, grids, pictures and reports take them from
// there (Solution.Evaluator, Solution.Figures).
//
// Tol is the one target the user sets (default SumTol). The numeric steps
// derive theirs from it, each for a stated reason:
//
//   - series sums stop when the tail bound falls below Tol relative to the
//     sum (series.CompiledSeries.At);
//   - the quadrature's radial meshes are refined to min(Tol, 1e-10)
//     (ansatz.radialTol): its error estimate is the difference of two meshes,
//     and that should not be much larger than the error of the values returned;
//   - the ray lift fits source derivatives, taken by differences with about
//     1e-10 of noise, to max(Tol, 1e-8) and no finer (ansatz.LiftRays);
//   - outside a circle the quadrature's mesh doubles outward until two
//     panels in a row carry below 1e-3·Tol of the source's largest share,
//     so that the tail beyond stays well below Tol (ansatz.Quadrature);
//   - boundary data by FFT double their samples until the top half of the
//     resolved band is below Tol·max|c| (series.FourierFFT).
type Options struct {
	Env series.Env // parameter values
	Tol float64    // numeric target (default SumTol)
	// Terms caps the series terms summed at a point or on a grid (default PointTerms).
	Terms int
	// NumericData forces the FFT path for boundary data, even where exact
	// coefficients exist (for comparing the two).
	NumericData bool
	// NumericSource sends the whole source to the quadrature fallback (for comparing the two).
	NumericSource bool
	// QuadratureSamples caps the quadrature's angular samples (0: its own
	// default). Below it, the quadrature is coarse on purpose: a test hook
	// for the honesty of its error estimate where the errors are large.
	QuadratureSamples int
	// QuadratureBisections caps the quadrature's radial bisections (0: its
	// own default), the same kind of hook for the radial mesh's estimate.
	QuadratureBisections int
	// WholeBoundary fits a section on its whole boundary even where the
	// problem has a symmetry (for comparing the two).
	WholeBoundary bool
}

// SumTol is the series truncation used where no tolerance is given.
const SumTol = 1e-12

// Term caps by use: a series summed near a boundary with jumps in its data
// converges like 1/n, so each use caps the terms at what it can show.
const (
	PointTerms   = 100000  // a value the user asked for: as many terms as Tol needs, within reason
	PictureTerms = 1 << 12 // a picture resolves about three digits
	ReportTerms  = 1 << 13 // extremes and integrals sample thousands of points: a few digits at the boundary
	CheckTerms   = 1 << 14 // sampled side checks of numeric parameters
	// MaxTerms bounds what a user may ask for (--terms): a series that needs
	// more at a point is reported with its tail, not summed for minutes.
	MaxTerms = 1 << 22
)

// Evaluator compiles the solution with its own parameters and tolerance,
// summing at most terms terms of each series (one of the caps above, or
// Options.Terms for points and grids).
func (s *Solution) Evaluator(terms int) (*Evaluator, error) {
	return s.Compile(s.Options.Env, s.Options.Tol, terms)
}

// Figures is the Report with the solution's own parameters and tolerance.
func (s *Solution) Figures() (*Report, error) { return s.Report(s.Options.Env, s.Options.Tol) }
