package main

import (
	"fmt"
	"strings"

	"psol/domain"
	"psol/series"
)

// pointStages adds the point sources' field to the printed stages. psol
// splits u = u_s + w: u_s is the sources' own logarithms (part of the
// particular solution) and, where an image system exists, the images (a
// line of their own); w is what the other stages print, with each side's
// data less B[u_s].
func (v *view) pointStages(sol *domain.Solution) {
	pp := sol.Points
	for _, p := range pp.Sources {
		out := pointSourceOut{X: p.X.Text(), Y: p.Y.Text(), Strength: p.Q.Text()}
		for _, f := range []struct {
			c  series.Coef
			to **float64
		}{{p.X, &out.XValue}, {p.Y, &out.YValue}, {p.Q, &out.StrengthValue}} {
			if x, err := f.c.Float(sol.Options.Env); err == nil {
				*f.to = &x
			}
		}
		v.PointSources = append(v.PointSources, out)
	}
	own := &domain.PointPart{Logs: pp.Logs[:len(pp.Sources)]}
	v.Particular.Text = "u_p = " + joinNonzero(strings.TrimPrefix(v.Particular.Text, "u_p = "), own.Text())
	v.Particular.LaTeX = joinNonzero(v.Particular.LaTeX, own.LaTeX())
	if pp.Images != "" {
		img := &domain.PointPart{Logs: pp.Logs[len(pp.Sources):], Const: pp.Const}
		st := exactStage("images", "u_i = "+img.Text(), img.LaTeX(), "u_i")
		if len(img.Logs) == 0 && pp.Const.IsZero() { // a flux at a disk's centre needs none
			st = exactStage("images", "u_i = 0", "0", "u_i")
		}
		v.Images = &st
	}
	var tr, trTeX []string
	for _, s := range sol.Sides {
		t := pp.Traces[s.Condition.Side]
		name := domain.OperatorText(s.Condition, "u_s")
		if !pp.ExactTrace(s.Condition.Side) { // the side's operator on u_s, sampled into the correction
			tr = append(tr, s.Condition.Side+": "+name+" (numeric)")
			trTeX = append(trTeX, t.LaTeX())
			continue
		}
		tr = append(tr, s.Condition.Side+": "+name+" = "+t.Text())
		trTeX = append(trTeX, t.LaTeX())
	}
	v.Trace.Text += "; the point sources' field u_s: " + strings.Join(tr, "; ")
	v.Trace.LaTeX += `;\quad u_s:\ ` + strings.Join(trTeX, ", ")
	for _, st := range []*stage{&v.Solution, v.ClosedForm} {
		if st == nil {
			continue
		}
		for _, eq := range []string{"u = ", "u ≈ "} {
			if rest, ok := strings.CutPrefix(st.Text, eq); ok {
				st.Text = eq + joinNonzero(pp.Text(), rest)
				break
			}
		}
		st.LaTeX = joinNonzero(pp.LaTeX(), st.LaTeX)
	}
	how := "sampled on each side into the correction (numeric)"
	switch {
	case pp.Images != "" && pp.ExactTraces():
		how = "closed by the " + pp.Images + " (exact)"
	case pp.Images != "": // a row of images closes its two walls only
		how = "closed on the walls by the " + pp.Images + " (exact), and sampled on the other sides into the correction (numeric)"
	case pp.Expansion != "":
		how = "given on each circle by " + pp.Expansion + ", ln|R e^(i theta) - rho e^(i phi)| = ln R - sum(n=1..inf, (rho/R)^n cos(n (theta - phi))/n) for rho < R (R and rho exchanged for rho > R)"
	}
	count := "the source"
	if len(pp.Sources) > 1 {
		count = fmt.Sprintf("the %d sources", len(pp.Sources))
	}
	v.Steps = append(v.Steps, fmt.Sprintf("point sources: u_s = sum of (Q/(2*pi))*ln|z - z0| over %s; its traces B[u_s] are %s", count, how))
	what := "the point sources' own field"
	if pp.Images != "" {
		what = "their field with the " + pp.Images + ", $u_s = u_{p,\\delta} + u_i$"
	}
	if pp.Expansion != "" {
		what += ", its trace on each circle by " + pp.Expansion + ", $\\ln|R e^{i\\theta} - \\rho e^{i\\varphi}| = \\ln R - \\sum_{n \\ge 1} (\\rho/R)^n \\cos n(\\theta - \\varphi)/n$ for $\\rho < R$ (and $R$, $\\rho$ exchanged outside)"
	}
	v.where = append(v.where, `$u_s$ is `+what+`, and the correction is $g$ less the trace of $u_p$ and of $u_s$`)
}

// pointSourceOut is one point source Q·δ(x − X, y − Y) in JSON: exact
// forms, and numbers where the parameters have values.
type pointSourceOut struct {
	X             string   `json:"x"`
	Y             string   `json:"y"`
	Strength      string   `json:"strength"`
	XValue        *float64 `json:"x_value,omitempty"`
	YValue        *float64 `json:"y_value,omitempty"`
	StrengthValue *float64 `json:"strength_value,omitempty"`
}

// joinNonzero joins two printed sums with the right sign, dropping a "0".
func joinNonzero(a, b string) string {
	switch {
	case a == "0" || a == "":
		return b
	case b == "0" || b == "":
		return a
	case strings.HasPrefix(b, "-"):
		return a + " - " + b[1:]
	}
	return a + " + " + b
}

// sourceWithPoints is the source as given, with its point sources.
func sourceWithPoints(f series.Field, sol *domain.Solution) series.Field {
	if sol.Points != nil {
		f.Points = sol.Points.Sources
	}
	return f
}
