package main

import (
	"strings"

	"psol/domain"
)

// circleWaveStages adds a disk's or an annulus's source waves to the
// printed stages. psol splits u = u_w + w (domain.solveCircleWaves): u_w is
// part of the particular solution, in closed form; w is what the other
// stages print, with each circle's data less B[u_w], sampled.
func (v *view) circleWaveStages(sol *domain.Solution) {
	w := sol.Waves
	text, tex := w.Waves.Text(), v.latex(w.Waves.LaTeX)
	v.Particular.Text = "u_p = " + joinNonzero(strings.TrimPrefix(v.Particular.Text, "u_p = "), text)
	v.Particular.LaTeX = joinNonzero(v.Particular.LaTeX, tex)
	var tr []string
	for _, s := range sol.Sides {
		tr = append(tr, s.Condition.Side+": "+domain.OperatorText(s.Condition, "u_w")+" (numeric)")
	}
	v.Trace.Text += "; the waves u_w = " + text + ": " + strings.Join(tr, "; ")
	v.Trace.LaTeX += `;\quad u_w = ` + tex
	for _, st := range []*stage{&v.Solution, v.ClosedForm} {
		if st == nil {
			continue
		}
		for _, eq := range []string{"u = ", "u ≈ "} {
			if rest, ok := strings.CutPrefix(st.Text, eq); ok {
				st.Text = eq + joinNonzero(text, rest)
				break
			}
		}
		st.LaTeX = joinNonzero(tex, st.LaTeX)
	}
	v.where = append(v.where, `$u_w$ is the particular solution of the source's exponential and trigonometric part, in closed form, and the correction is $g$ less the trace of $u_p$ and of $u_w$ (sampled)`)
}
