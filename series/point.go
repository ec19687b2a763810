package series

import "strings"

// PointSource is Q·δ(x − X, y − Y): a source of strength Q concentrated at
// the point (X, Y), a line normal to the section (a well, a line charge, a
// heating wire). Its field is the fundamental solution (Q/2π)·ln|z − z₀|.
type PointSource struct {
	Q, X, Y Coef
}

// Scale is the source c·Q·δ at the same point.
func (p PointSource) Scale(c Coef) PointSource { return PointSource{p.Q.Mul(c), p.X, p.Y} }

// Text prints the source in psol's syntax: Q*delta(x - X, y - Y).
func (p PointSource) Text() string {
	d := "delta(" + OffsetText("x", p.X) + ", " + OffsetText("y", p.Y) + ")"
	if p.Q.Equal(IntCoef(1)) {
		return d
	}
	if p.Q.Equal(IntCoef(-1)) {
		return "-" + d
	}
	return wrapSigned(p.Q.Text()) + "*" + d
}

// LaTeX prints the source as Q\,\delta(x − X, y − Y).
func (p PointSource) LaTeX() string {
	d := `\delta\left(` + OffsetLaTeX("x", p.X) + ", " + OffsetLaTeX("y", p.Y) + `\right)`
	switch {
	case p.Q.Equal(IntCoef(1)):
		return d
	case p.Q.Equal(IntCoef(-1)):
		return "-" + d
	}
	q := p.Q.LaTeX()
	if strings.ContainsAny(q[1:], "+-") {
		q = `\left(` + q + `\right)`
	}
	return q + `\,` + d
}

// OffsetText is "x - X" ("x" when X is 0, "x + 1/2" when X is −1/2).
func OffsetText(v string, c Coef) string {
	if c.IsZero() {
		return v
	}
	s := c.Neg().Text()
	if strings.HasPrefix(s, "-") && !strings.ContainsAny(s[1:], "+-") {
		return v + " - " + s[1:]
	}
	if strings.ContainsAny(s[1:], "+-") {
		return v + " + (" + s + ")"
	}
	return v + " + " + s
}

// OffsetLaTeX is OffsetText in LaTeX.
func OffsetLaTeX(v string, c Coef) string {
	if c.IsZero() {
		return v
	}
	s := c.Neg().LaTeX()
	if strings.HasPrefix(s, "-") && !strings.ContainsAny(s[1:], "+-") {
		return v + " - " + s[1:]
	}
	if strings.ContainsAny(s[1:], "+-") {
		return v + ` + \left(` + s + `\right)`
	}
	return v + " + " + s
}

func wrapSigned(s string) string {
	if strings.ContainsAny(s[1:], " +-") {
		return "(" + s + ")"
	}
	return s
}

// addPoints merges two lists of point sources, adding the strengths of
// sources at the same point and dropping those that cancel.
func addPoints(a, b []PointSource) []PointSource {
	if len(b) == 0 {
		return a
	}
	out := append([]PointSource(nil), a...)
next:
	for _, p := range b {
		for i, q := range out {
			if q.X.Equal(p.X) && q.Y.Equal(p.Y) {
				out[i].Q = q.Q.Add(p.Q)
				continue next
			}
		}
		out = append(out, p)
	}
	kept := out[:0]
	for _, p := range out {
		if !p.Q.IsZero() {
			kept = append(kept, p)
		}
	}
	if len(kept) == 0 {
		return nil
	}
	return kept
}

// PointsText prints a list of point sources joined by signs.
func PointsText(ps []PointSource) string {
	var b strings.Builder
	for i, p := range ps {
		t := p.Text()
		switch {
		case i == 0:
			b.WriteString(t)
		case strings.HasPrefix(t, "-"):
			b.WriteString(" - " + t[1:])
		default:
			b.WriteString(" + " + t)
		}
	}
	return b.String()
}

// PointsLaTeX is PointsText in LaTeX.
func PointsLaTeX(ps []PointSource) string {
	var b strings.Builder
	for i, p := range ps {
		t := p.LaTeX()
		switch {
		case i == 0:
			b.WriteString(t)
		case strings.HasPrefix(t, "-"):
			b.WriteString(" - " + t[1:])
		default:
			b.WriteString(" + " + t)
		}
	}
	return b.String()
}

func scalePoints(ps []PointSource, c Coef) []PointSource {
	if len(ps) == 0 {
		return nil
	}
	if c.IsZero() {
		return nil
	}
	out := make([]PointSource, len(ps))
	for i, p := range ps {
		out[i] = p.Scale(c)
	}
	return out
}
