package domain

import (
	"fmt"

	"psol/series"
)

// TermCode is the series' n-th term as an expression in n, x and y, with the
// across factor in its decaying-exponential form (see CompiledSide.across).
func (s SideSeries) TermCode(l series.Lang) string {
	fam := s.family()
	length, width := s.along()
	ell, w := length.Code(l, "n"), width.Code(l, "n")
	k := fmt.Sprintf("((%s*n + %s)*%s/%s)", series.RatCoef(fam.Slope).Code(l, "n"), series.RatCoef(fam.Offset).Code(l, "n"), l.Pi, ell)
	sv, d := s.Wall.coords(w)
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
	_, d := s.Wall.coords(w)
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
