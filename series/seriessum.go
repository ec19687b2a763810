package series

import (
	"math"
	"strings"
)

// SeriesSum is a sum of series — a cosine and a sine family, say — and the
// jumps of Dirichlet data on a circle, whose slowly decaying part of the
// series is summed in closed form when evaluated.
type SeriesSum struct {
	Parts []Series
	Jumps []Jump // on the circle r = Parts[0].R; their series parts are ~1/n
	// Inverse marks a harmonic extension outside the circle ((R/r)^n).
	Inverse bool
}

// IsZero reports a sum of series whose every term vanishes.
func (s SeriesSum) IsZero() bool {
	for _, p := range s.Parts {
		if !p.IsZero() {
			return false
		}
	}
	return true
}

func (s SeriesSum) join(print func(Series) string) string {
	var out []string
	for _, p := range s.Parts {
		if !p.IsZero() {
			out = append(out, print(p))
		}
	}
	if len(out) == 0 {
		return "0"
	}
	return strings.Join(out, " + ")
}

// Text prints the sum in psol's syntax.
func (s SeriesSum) Text() string { return s.join(Series.Text) }

// TextApprox prints the sum with decimal coefficients, for numeric results.
func (s SeriesSum) TextApprox() string { return s.join(Series.TextApprox) }

// LaTeXApprox is TextApprox as LaTeX.
func (s SeriesSum) LaTeXApprox() string { return s.join(Series.LaTeXApprox) }

// LaTeX prints the sum as LaTeX.
func (s SeriesSum) LaTeX() string { return s.join(Series.LaTeX) }

// CompiledSeriesSum evaluates a sum of series.
type CompiledSeriesSum struct {
	parts   []CompiledSeries
	jumps   []floatJump
	inverse bool
	R       float64
}

type floatJump struct{ at, size float64 }

// Compile fixes parameters for evaluation.
func (s SeriesSum) Compile(env Env) (CompiledSeriesSum, error) {
	out := CompiledSeriesSum{inverse: s.Inverse}
	for _, p := range s.Parts {
		c, err := p.Compile(env)
		if err != nil {
			return out, err
		}
		out.parts = append(out.parts, c)
		out.R = c.R
	}
	for _, j := range s.Jumps {
		size, err := j.Size.Float(env)
		if err != nil {
			return out, err
		}
		out.jumps = append(out.jumps, floatJump{ratFloat(j.At) * math.Pi, size})
	}
	if len(out.jumps) > 0 {
		for i := range out.parts {
			fam := out.parts[i].fam
			jumps := out.jumps
			// The n-th coefficient of Σ J_j (1/π) Σ sin(n(θ − θ_j))/n:
			// cos nθ: −Σ J_j sin(nθ_j)/(πn); sin nθ: Σ J_j cos(nθ_j)/(πn).
			out.parts[i].jump = func(n float64) float64 {
				v := 0.0
				for _, j := range jumps {
					if fam.Sin {
						v += j.size * math.Cos(n*j.at)
					} else {
						v -= j.size * math.Sin(n*j.at)
					}
				}
				return v / (math.Pi * n)
			}
			out.parts[i].inverse = s.Inverse
		}
	}
	return out, nil
}

// At sums every series at (r, θ) to tol, adding the jumps' closed forms
// Σ_j (J_j/π) atan2(ρ sin φ_j, 1 − ρ cos φ_j), ρ = r/R (R/r outside), φ_j = θ − θ_j.
func (c CompiledSeriesSum) At(r, theta, tol float64, maxTerms int) Summed {
	out := Summed{}
	for _, p := range c.parts {
		s := p.At(r, theta, tol, maxTerms)
		out.Value += s.Value
		out.Tail += s.Tail
		out.Terms = max(out.Terms, s.Terms)
	}
	if len(c.jumps) > 0 {
		rho := r / c.R
		if c.inverse {
			rho = c.R / r
		}
		for _, j := range c.jumps {
			phi := theta - j.at
			out.Value += j.size / math.Pi * math.Atan2(rho*math.Sin(phi), 1-rho*math.Cos(phi))
		}
	}
	return out
}

// Grid adds every series on the tensor grid and the jumps' closed forms; it
// returns the summed tail estimates per radius.
func (c CompiledSeriesSum) Grid(rs, thetas []float64, out [][]float64, tol float64, maxTerms int) []float64 {
	total := make([]float64, len(rs))
	for _, p := range c.parts {
		for i, t := range p.Grid(rs, thetas, out, tol, maxTerms) {
			total[i] += t
		}
	}
	for _, j := range c.jumps {
		for i, r := range rs {
			rho := r / c.R
			if c.inverse {
				rho = c.R / r
			}
			for k, th := range thetas {
				phi := th - j.at
				out[i][k] += j.size / math.Pi * math.Atan2(rho*math.Sin(phi), 1-rho*math.Cos(phi))
			}
		}
	}
	return total
}
