package cart

import (
	"fmt"
	"strings"

	"psol/series"
)

// Code is p as an expression in x and y in the language l.
func (p Poly) Code(l series.Lang) string { return p.CodeIn(l, "x", "y") }

// CodeIn is Code with x and y written as the expressions xs and ys (a
// polar function's r*cos(theta) and r*sin(theta)).
func (p Poly) CodeIn(l series.Lang, xs, ys string) string {
	if p.IsZero() {
		return "0.0"
	}
	var parts []string
	for _, t := range p.Terms() {
		f := []string{t.C.Code(l, "n")}
		if t.I > 0 {
			f = append(f, fmt.Sprintf("%s(%s, %d.0)", l.Fn["pow"], xs, t.I))
		}
		if t.J > 0 {
			f = append(f, fmt.Sprintf("%s(%s, %d.0)", l.Fn["pow"], ys, t.J))
		}
		parts = append(parts, strings.Join(f, "*"))
	}
	return "(" + strings.Join(parts, " + ") + ")"
}

// Code is the waves as an expression in x and y.
func (s Waves) Code(l series.Lang) string { return s.CodeIn(l, "x", "y") }

// CodeIn is Code with x and y written as the expressions xs and ys.
func (s Waves) CodeIn(l series.Lang, xs, ys string) string {
	if len(s) == 0 {
		return "0.0"
	}
	var parts []string
	for _, w := range s {
		lin := func(a, b series.Coef) string {
			return "(" + a.Code(l, "n") + "*" + xs + " + " + b.Code(l, "n") + "*" + ys + ")"
		}
		phi := lin(w.Gamma, w.Delta)
		parts = append(parts, l.Fn["exp"]+lin(w.Alpha, w.Beta)+"*("+l.Fn["cos"]+phi+"*"+w.Cos.CodeIn(l, xs, ys)+" + "+l.Fn["sin"]+phi+"*"+w.Sin.CodeIn(l, xs, ys)+")")
	}
	return "(" + strings.Join(parts, " + ") + ")"
}
