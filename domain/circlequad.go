package domain

import (
	"fmt"
	"math"
	"math/big"
	"psol/ansatz"
	"psol/series"
	"strconv"
)

// quadratureParticular adds to each circle's trace that of the numeric
// particular solution of the source's remaining part (ansatz.Quadrature),
// mode by mode under the circle's operator.
func quadratureParticular(d circular, p *posed, sol *Solution, traces map[string]series.Sum) error {
	cf, err := series.Field{Rest: p.rest}.Compile(p.env)
	if err != nil {
		return unsupported("the source %s needs every parameter's value: %w", p.rest.Text(), err)
	}
	in, out := d.bounds()
	a := 0.0
	if in != nil {
		if a, err = in.Float(p.env); err != nil {
			return err
		}
	}
	R := math.Inf(1)
	if out != nil {
		if R, err = out.Float(p.env); err != nil {
			return err
		}
	}
	q := &ansatz.Quadrature{G: cf.At, A: a, R: R, Tol: p.tol, MaxSamples: p.quadSamples, MaxBisections: p.quadBisections}
	if err := q.Prepare(); err != nil {
		return unsolvable("%s: %w", p.rest.Text(), err)
	}
	sol.Quadrature, sol.Rest, sol.Numeric = q, p.rest, true
	for _, c := range d.circles() {
		r, err := c.radius.Float(p.env)
		if err != nil {
			return err
		}
		pm, dpm, _ := q.Mode(r)
		cond := p.conds[c.name]
		qerr := q.TraceError(r, cond.Kind == Neumann || cond.Kind == Robin || cond.Kind == Floating)
		h := 0.0
		if cond.Kind == Robin {
			if h, err = cond.H.Float(p.env); err != nil {
				return unsupported("the Robin coefficient needs a value for the numeric source: %w", err)
			}
		}
		var terms []series.Term
		for m := range pm {
			for k := 0; k < 2; k++ {
				v := pm[m][k]
				switch {
				case cond.Kind == Floating && m == 0, cond.Kind == Neumann:
					v = float64(c.outward) * dpm[m][k]
				case cond.Kind == Robin:
					v = float64(c.outward)*dpm[m][k] + h*pm[m][k]
				}
				if m == 0 && k == 1 {
					continue
				}
				terms = append(terms, series.Term{C: decimal(v), M: m, Sin: k == 1})
			}
		}
		traces[c.name] = traces[c.name].Add(series.NewSum(terms...))
		sol.DataError += qerr
	}
	sol.Notes = append(sol.Notes, fmt.Sprintf("psol has no closed-form rule for the source part %s: its particular solution is by quadrature (FFT in theta with %d samples, modes up to %d; Gauss–Legendre in r)", p.rest.Text(), q.Samples, q.Modes))
	return nil
}

// decimal is x rounded to 15 digits as an exact decimal.
func decimal(x float64) series.Coef { return decimalDigits(x, 15) }

// decimalDigits is x rounded to the given significant digits as an exact
// decimal.
func decimalDigits(x float64, digits int) series.Coef {
	if x == 0 || math.IsNaN(x) {
		return series.Coef{}
	}
	q, _ := new(big.Rat).SetString(strconv.FormatFloat(x, 'g', digits, 64))
	return series.RatCoef(q)
}
