package main

import (
	"fmt"
	"math"
	"strings"

	"psol/domain"
)

// figureOut is one figure as JSON gives it: a number a script can read, the
// exact form where there is one, and what it means (no prose to parse).
type figureOut struct {
	Name        string      `json:"name"`
	Value       *float64    `json:"value"` // null where it needs parameter values
	Exact       string      `json:"exact,omitempty"`
	Description string      `json:"description"`
	At          *[2]float64 `json:"at,omitempty"` // (x, y) for a peak
	Warnings    []string    `json:"warnings,omitempty"`
	digits      int
}

// quantities computes each named preset's figures (domain.Quantities holds
// the definitions), in the order asked.
func quantities(names []string, sol *domain.Solution, rep *domain.Report) ([]figureOut, error) {
	var out []figureOut
	seen := map[string]bool{}
	for _, name := range names {
		for _, n := range strings.Split(name, ",") {
			n = strings.TrimSpace(n)
			if seen[n] {
				continue
			}
			seen[n] = true
			if !known(n) {
				return nil, usagef("--quantity %q: choose %s", n, strings.Join(domain.QuantityNames(), ", "))
			}
			figs, err := sol.Quantity(n, rep)
			if err != nil {
				return nil, err
			}
			for _, f := range figs {
				out = append(out, newFigureOut(f))
			}
		}
	}
	return out, nil
}

func known(name string) bool {
	for _, n := range domain.QuantityNames() {
		if n == name {
			return true
		}
	}
	return false
}

func newFigureOut(f domain.Figure) figureOut {
	out := figureOut{Name: f.Name, Description: f.Description, At: f.At, Warnings: f.Warnings, digits: f.Digits}
	if !math.IsNaN(f.Value) && !math.IsInf(f.Value, 0) {
		v := f.Value
		out.Value = &v
	}
	if f.Exact != nil {
		out.Exact = f.Exact.Text()
	}
	return out
}

// text is the figure's line: name = exact = decimal, then its meaning.
func (f figureOut) text() string {
	var value string
	switch {
	case f.Value == nil && f.Exact != "":
		value = f.Exact
	case f.Value == nil:
		value = "(needs parameter values)"
	case f.digits > 0 && f.Exact == "":
		value = fmt.Sprintf("%.*g", f.digits, *f.Value)
	default:
		value = figure(f.Exact, *f.Value)
	}
	s := f.Name + " = " + value
	if f.At != nil {
		s += fmt.Sprintf(" at x = %.6g, y = %.6g", f.At[0], f.At[1])
	}
	return s + " (" + f.Description + ")"
}
