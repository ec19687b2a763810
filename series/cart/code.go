package cart

import (
	"fmt"
	"strings"

	"psol/series"
)

// Code is p as an expression in x and y in the language l.
func (p Poly) Code(l series.Lang) string {
	if p.IsZero() {
		return "0.0"
	}
	var parts []string
	for _, t := range p.Terms() {
		f := []string{t.C.Code(l, "n")}
		if t.I > 0 {
			f = append(f, fmt.Sprintf("%s(x, %d.0)", l.Fn["pow"], t.I))
		}
		if t.J > 0 {
			f = append(f, fmt.Sprintf("%s(y, %d.0)", l.Fn["pow"], t.J))
		}
		parts = append(parts, strings.Join(f, "*"))
	}
	return "(" + strings.Join(parts, " + ") + ")"
}

// Code is the waves as an expression in x and y.
func (s Waves) Code(l series.Lang) string {
	if len(s) == 0 {
		return "0.0"
	}
	var parts []string
	for _, w := range s {
		lin := func(a, b series.Coef) string { return "(" + a.Code(l, "n") + "*x + " + b.Code(l, "n") + "*y)" }
		phi := lin(w.Gamma, w.Delta)
		parts = append(parts, l.Fn["exp"]+lin(w.Alpha, w.Beta)+"*("+l.Fn["cos"]+phi+"*"+w.Cos.Code(l)+" + "+l.Fn["sin"]+phi+"*"+w.Sin.Code(l)+")")
	}
	return "(" + strings.Join(parts, " + ") + ")"
}
