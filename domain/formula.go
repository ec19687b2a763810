package domain

import (
	"psol/series"
	"strings"
)

// Formula is u in psol's syntax (or LaTeX): the point sources' field, the
// closed parts, then any series.
func (s *Solution) Formula(latex bool) string {
	rest := s.formulaOfW(latex)
	if w := s.Waves; w != nil && s.Section == nil { // a circle's waves, beside w (a section's formula is its own)
		wt := w.Waves.Text()
		if latex {
			wt = w.Waves.LaTeX()
		}
		rest = joinPrinted(wt, rest, rest == "0", false)
	}
	if s.Points == nil {
		return rest
	}
	pts := s.Points.Text()
	if latex {
		pts = s.Points.LaTeX()
	}
	return joinPrinted(pts, rest, rest == "0", pts == "")
}

func (s *Solution) formulaOfW(latex bool) string {
	if s.Series == nil {
		if latex {
			return series.JoinLaTeX(s.Particular, s.Harmonic)
		}
		return series.JoinText(s.Particular, s.Harmonic)
	}
	return JoinSeries(s.Particular.Add(s.Harmonic), s.Series.U, latex)
}

// JoinSeries prints closed + ser, leaving out a part that is zero.
func JoinSeries(closed series.Sum, ser series.SeriesSum, latex bool) string {
	c, t := closed.Text(), ser.Text()
	if latex {
		c, t = closed.LaTeX(), ser.LaTeX()
	}
	return joinPrinted(c, t, ser.IsZero(), closed.IsZero())
}

// JoinSeriesApprox is JoinSeries with decimal coefficients, for numeric results.
func JoinSeriesApprox(closed series.Sum, ser series.SeriesSum, latex bool) string {
	c, t := closed.TextApprox(), ser.TextApprox()
	if latex {
		c, t = closed.LaTeXApprox(), ser.LaTeXApprox()
	}
	return joinPrinted(c, t, ser.IsZero(), closed.IsZero())
}

func joinPrinted(c, t string, serZero, closedZero bool) string {
	switch {
	case serZero:
		return c
	case closedZero:
		return t
	case strings.HasPrefix(t, "-"):
		return c + " - " + t[1:]
	}
	return c + " + " + t
}
