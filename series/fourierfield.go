package series

import (
	"math/big"
	"strings"
)

// FourierField is data on a circle given by exact Fourier coefficients with a
// general term, A0 + Σ_{n≥1} (A_n cos nθ + B_n sin nθ), such as the trace of
// a point source's logarithm. It depends on θ alone; in float64 the series is
// summed to rounding, and the circles' solvers take its coefficients as they
// are (FourierOn).
func FourierField(fc FourierCoefficients) Field {
	return opaque(&Expr{op: "fourier", four: &fc})
}

// FourierFieldSum is FourierField whose sum is known in closed form, at:
// float64 evaluation uses it (a series whose coefficients fall like n⁻⁴
// would take 10⁵ terms a point to sum to rounding).
func FourierFieldSum(fc FourierCoefficients, at func(r, theta float64) float64) Field {
	return opaque(&Expr{op: "fourier", four: &fc, sumAt: at})
}

// Add is fc + gc, term by term.
func (fc FourierCoefficients) Add(gc FourierCoefficients) (FourierCoefficients, error) {
	out := FourierCoefficients{A0: fc.A0.Add(gc.A0), A: fc.A.Add(gc.A), B: fc.B.Add(gc.B), Special: map[int][2]Coef{}}
	at := func(c FourierCoefficients, n int) ([2]Coef, error) {
		if ab, ok := c.Special[n]; ok {
			return ab, nil
		}
		a, err := Coefficient(c.A, n)
		if err != nil {
			return [2]Coef{}, err
		}
		b, err := Coefficient(c.B, n)
		return [2]Coef{a, b}, err
	}
	for _, sp := range []map[int][2]Coef{fc.Special, gc.Special} {
		for n := range sp {
			x, err := at(fc, n)
			if err != nil {
				return out, err
			}
			y, err := at(gc, n)
			if err != nil {
				return out, err
			}
			out.Special[n] = [2]Coef{x[0].Add(y[0]), x[1].Add(y[1])}
		}
	}
	return out, nil
}

// Scale is k·fc.
func (fc FourierCoefficients) Scale(k Coef) FourierCoefficients {
	out := FourierCoefficients{A0: fc.A0.Mul(k), A: fc.A.Mul(k), B: fc.B.Mul(k), Special: map[int][2]Coef{}}
	for n, ab := range fc.Special {
		out.Special[n] = [2]Coef{ab[0].Mul(k), ab[1].Mul(k)}
	}
	return out
}

// families are the cosine and the sine series of fc (n ≥ 1), as Series with
// the radial factor 1.
func (fc FourierCoefficients) families() []Series {
	var out []Series
	for i, general := range []Coef{fc.A, fc.B} {
		s := Series{
			Family:  Family{Sin: i == 1, Slope: big.NewRat(1, 1), Offset: new(big.Rat), From: 1},
			R:       IntCoef(1),
			General: []RadialTerm{{C: general, P: new(big.Rat)}},
			Special: map[int][]RadialTerm{},
		}
		for n, ab := range fc.Special {
			s.Special[n] = []RadialTerm{{C: ab[i], P: new(big.Rat)}}
		}
		out = append(out, s)
	}
	return out
}

// print joins A0 and the nonzero families.
func (fc FourierCoefficients) print(series func(Series) string, konst func(Coef) string) string {
	var parts []string
	if !fc.A0.IsZero() {
		parts = append(parts, konst(fc.A0))
	}
	for _, s := range fc.families() {
		if !s.IsZero() {
			parts = append(parts, series(s))
		}
	}
	if len(parts) == 0 {
		return "0"
	}
	return strings.Join(parts, " + ")
}

// Text prints the series in psol's syntax.
func (fc FourierCoefficients) Text() string {
	return fc.print(Series.Text, func(c Coef) string { return c.Text() })
}

// LaTeX prints the series as LaTeX.
func (fc FourierCoefficients) LaTeX() string {
	return fc.print(Series.LaTeX, func(c Coef) string { return c.LaTeX() })
}

// compileFourier sums the series at θ to rounding.
func compileFourier(fc FourierCoefficients, env Env) (evalFunc, error) {
	a0, err := fc.A0.Float(env)
	if err != nil {
		return nil, err
	}
	var parts []CompiledSeries
	for _, s := range fc.families() {
		if s.IsZero() {
			continue
		}
		c, err := s.Compile(env)
		if err != nil {
			return nil, err
		}
		parts = append(parts, c)
	}
	return func(_, theta, _ float64) float64 {
		v := a0
		for _, p := range parts {
			v += p.At(1, theta, 1e-17, MaxSeriesTerms).Value
		}
		return v
	}, nil
}

// FourierOn is f on the circle r = radius as exact Fourier coefficients, where
// f is a sum of exact terms, exact pieces in θ and FourierField data (each
// with a constant factor); ok is false for anything else.
func (f Field) FourierOn(radius Coef) (FourierCoefficients, bool) {
	if f.IsPiecewise() {
		fc, err := Fourier(f.Pieces)
		return fc, err == nil
	}
	out := FourierCoefficients{Special: map[int][2]Coef{}}
	if !f.Exact.IsZero() {
		tr, err := f.Exact.Trace(radius)
		if err != nil {
			return out, false
		}
		if out, err = Fourier([]Piece{{From: new(big.Rat), To: big.NewRat(2, 1), Value: ExactField(tr)}}); err != nil {
			return out, false
		}
	}
	if f.Rest == nil {
		return out, true
	}
	rest, ok := f.Rest.fourier()
	if !ok {
		return out, false
	}
	sum, err := out.Add(rest)
	return sum, err == nil
}

func (e *Expr) fourier() (FourierCoefficients, bool) {
	switch e.op {
	case "fourier":
		return *e.four, true
	case "sum":
		c, ok := e.sum.Const()
		return FourierCoefficients{A0: c, Special: map[int][2]Coef{}}, ok
	case "+":
		a, ok := e.args[0].fourier()
		if !ok {
			return a, false
		}
		b, ok := e.args[1].fourier()
		if !ok {
			return b, false
		}
		sum, err := a.Add(b)
		return sum, err == nil
	case "*":
		if k, ok := e.constFactor(); ok {
			fc, ok := e.args[1].fourier()
			return fc.Scale(k), ok
		}
	}
	return FourierCoefficients{}, false
}
