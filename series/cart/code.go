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

// TermCode is the series' n-th term as an expression in n, x and y, with the
// across factor in its decaying-exponential form (see CompiledSide.across).
func (s SideSeries) TermCode(l series.Lang) string {
	fam := s.family()
	length, width := s.along()
	ell, w := length.Code(l, "n"), width.Code(l, "n")
	k := fmt.Sprintf("((%s*n + %s)*%s/%s)", series.RatCoef(fam.Slope).Code(l, "n"), series.RatCoef(fam.Offset).Code(l, "n"), l.Pi, ell)
	sv, d := s.Side.coords(w)
	exp := l.Fn["exp"]
	e := fmt.Sprintf("%s(-%s*(%s - %s))", exp, k, w, d)
	ed, ew := fmt.Sprintf("%s(-2.0*%s*%s)", exp, k, d), fmt.Sprintf("%s(-2.0*%s*%s)", exp, k, w)
	var across string
	switch {
	case s.Insulated && s.Flux:
		across = fmt.Sprintf("%s*(1.0 + %s)/(%s*(1.0 - %s))", e, ed, k, ew)
	case s.Insulated:
		across = fmt.Sprintf("%s*(1.0 + %s)/(1.0 + %s)", e, ed, ew)
	case s.Flux:
		across = fmt.Sprintf("%s*(1.0 - %s)/(%s*(1.0 + %s))", e, ed, k, ew)
	default:
		across = fmt.Sprintf("%s*(1.0 - %s)/(1.0 - %s)", e, ed, ew)
	}
	fn := l.Fn["cos"]
	if fam.Sin {
		fn = l.Fn["sin"]
	}
	return fmt.Sprintf("%s*%s(%s*%s)*%s", s.B.Code(l, "n"), fn, k, sv, across)
}

// ConstantCode is the constant mode's term (n = 0 of a cosine family), or "" without one.
func (s SideSeries) ConstantCode(l series.Lang) string {
	if s.B0 == nil || s.B0.IsZero() {
		return ""
	}
	_, width := s.along()
	w := width.Code(l, "n")
	_, d := s.Side.coords(w)
	across := d + "/" + w
	switch {
	case s.Insulated:
		across = "1.0"
	case s.Flux:
		across = d
	}
	return s.B0.Code(l, "n") + "*" + across
}

// From is the first n of the loop (after the constant mode).
func (s SideSeries) From() int {
	if s.family().From == 0 {
		return 1
	}
	return s.family().From
}
