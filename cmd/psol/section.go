package main

import (
	"fmt"
	"strings"

	"psol/domain"
	"psol/series"
	"psol/series/cart"
)

// sectionStages prints a polygon's or an ellipse's solution: the exact
// particular solution in x and y, its operator on the sides, and the
// harmonic part described (its poles, degree and residual) rather than
// printed coefficient by coefficient.
func (v *view) sectionStages(sol *domain.Solution) {
	sp := sol.Section
	up := domain.FieldText(sol.Domain, sol.Particular)
	upTeX := sol.Particular.LaTeX()
	if p, err := cart.FromPolar(sol.Particular); err == nil {
		upTeX = p.LaTeX()
	}
	if w := sol.Waves; w != nil { // the source's exponentials and trigonometric functions, in closed form
		wText, wTeX := w.Waves.Text(), v.latex(w.Waves.LaTeX)
		if sol.Particular.IsZero() {
			up, upTeX = wText, wTeX
		} else {
			up, upTeX = joinSigned(up, wText), joinSigned(upTeX, wTeX)
		}
	}
	closedUp := up             // the closed part alone, for the corrections
	if sol.Quadrature != nil { // the source's part with no closed form, by quadrature
		q, _ := quadratureText(sol)
		if sol.Particular.IsZero() && sol.Waves == nil {
			up, upTeX = "u_q, u_q = "+q, `u_q`
		} else {
			up, upTeX = up+" + u_q, u_q = "+q, upTeX+` + u_q`
		}
	}
	v.Particular = exactStage("particular", "u_p = "+up, upTeX, "u_p")
	minusQ, minusQTeX := "", ""
	if sol.Quadrature != nil {
		up, minusQ, minusQTeX = closedUp+" + u_q", " - u_q", ` - u_q`
		if sol.Particular.IsZero() && sol.Waves == nil {
			up = "u_q"
		}
	}
	var tr, co, trTeX, coTeX []string
	xyTeX := func(s series.Sum) string {
		if p, err := cart.FromPolar(s); err == nil {
			return p.LaTeX()
		}
		return s.LaTeX()
	}
	for _, s := range sol.Sides {
		c := s.Condition
		side := `\text{` + c.Side + `}:\ `
		switch c.Kind {
		case domain.Dirichlet:
			tr, trTeX = append(tr, c.Side+": u_p = "+up), append(trTeX, side+upTeX)
			if c.G.IsExact() {
				d := c.G.Exact.Sub(sol.Particular)
				dText, dTeX := domain.FieldText(sol.Domain, d), xyTeX(d)
				if w := sol.Waves; w != nil { // g − u_p less the waves, their signs turned: y + e^(−x)/3·cos 2y, not y − (−…)
					neg := w.Waves.Scale(cart.Monomial(series.IntCoef(-1), 0, 0))
					dText, dTeX = sumText(dText, neg.Text()), sumText(dTeX, v.latex(neg.LaTeX))
				}
				co, coTeX = append(co, c.Side+": "+dText+minusQ), append(coTeX, side+dTeX+minusQTeX)
			} else {
				co, coTeX = append(co, c.Side+": "+s.DataText+" - u_p"), append(coTeX, side+s.DataLaTeX+" - u_p")
			}
		default:
			tr, trTeX = append(tr, c.Side+": "+domain.OperatorText(c, "u_p")+" with grad u_p = "+gradientText(sol)), append(trTeX, side+operatorTeX(c, "u_p"))
			co, coTeX = append(co, c.Side+": "+s.DataText+" - ("+domain.OperatorText(c, "u_p")+")"), append(coTeX, side+s.DataLaTeX+" - ("+operatorTeX(c, "u_p")+")")
		}
	}
	v.Trace = exactStage("trace", strings.Join(tr, "; "), strings.Join(trTeX, `;\quad `), `u_p\big|_{\partial\Omega}`)
	v.Correction = exactStage("correction", strings.Join(co, "; "), strings.Join(coTeX, `;\quad `), `g - u_p\big|_{\partial\Omega}`)
	form := "Re[sum_j c_j/(z - p_j) + sum_k d_k*q_k(z)], z = x + i*y"
	if sp.Corners == 0 {
		form = "Re[sum_k d_k*q_k(z)], z = x + i*y"
	}
	if sp.Holes > 0 {
		form += ", with each hole's a*log|z - c| and Laurent terms in 1/(z - c) (c inside the hole)"
		if sp.Elliptic {
			form += ", for an elliptical or elongated hole a*log|w| and terms in 1/w, w = ((z - c) + sqrt((z - c)^2 - f^2))/m (f its ellipse's focal distance and m the sum of its semi-axes; an elongated polygon's ellipse has the polygon's half-extents along its principal axes), which maps the ellipse's outside onto |w| > 1"
		}
	}
	// The poles and the degree the adaptive fit chose are in --steps: they
	// follow residuals at rounding level, which differ between CPUs.
	h := fmt.Sprintf("≈ h(x, y) = %s, fitted to the side conditions (largest residual %.1e)", form, sp.Residual)
	v.where = append(v.where, fmt.Sprintf(`$z = x + iy$, the $p_j$ are poles outside the region at its corners, the $q_k$ polynomials of Arnoldi's orthogonal basis, and $c_j$, $d_k$ coefficients fitted numerically to the side conditions (largest residual $%s$)`,
		latexNumber(sp.Residual)))
	v.Harmonic = stage{Label: "harmonic", Text: h, LaTeX: `h(x, y) = \operatorname{Re}\Big[\sum_j \frac{c_j}{z - p_j} + \sum_k d_k q_k(z)\Big]`, tex: "u_h"}
	v.Solution = stage{Label: "solution", Text: "u ≈ " + joinNonzero(up, "h(x, y)"), LaTeX: joinNonzero(upTeX, `h(x, y)`), tex: "u"}
}

// gradientText is grad u_p = (u_x, u_y) in x and y, where u_p is a polynomial.
func gradientText(sol *domain.Solution) string {
	p, err := cart.FromPolar(sol.Particular)
	if err != nil {
		return "(grad of " + series.JoinText(sol.Particular) + ")"
	}
	dx, dy := p.DX().Text(), p.DY().Text()
	if w := sol.Waves; w != nil { // the waves' derivatives beside the polynomial's
		dx, dy = sumText(dx, w.Waves.DX().Text()), sumText(dy, w.Waves.DY().Text())
	}
	return "(" + dx + ", " + dy + ")"
}

// sumText is a + b as printed, a 0 on either side left out.
func sumText(a, b string) string {
	switch {
	case b == "0":
		return a
	case a == "0":
		return b
	}
	return joinSigned(a, b)
}

// xyClosedStages reprints a closed solution on a section (the ellipse's
// polynomial one) in x and y, as the section's other output is.
func (v *view) xyClosedStages(sol *domain.Solution) {
	text := func(s series.Sum) string { return domain.FieldText(sol.Domain, s) }
	tex := func(s series.Sum) string {
		if p, err := cart.FromPolar(s); err == nil {
			return p.LaTeX()
		}
		return s.LaTeX()
	}
	v.Particular = exactStage("particular", "u_p = "+text(sol.Particular), tex(sol.Particular), "u_p")
	var tr, trTeX, co, coTeX []string
	for _, s := range sol.Sides {
		tr, trTeX = append(tr, s.Condition.Side+": u_p = "+text(s.Trace)), append(trTeX, tex(s.Trace))
		co, coTeX = append(co, s.Condition.Side+": "+text(s.Correction)), append(coTeX, tex(s.Correction))
	}
	v.Trace = exactStage("trace", strings.Join(tr, "; "), strings.Join(trTeX, `;\quad `), `u_p\big|_{\partial\Omega}`)
	v.Correction = exactStage("correction", strings.Join(co, "; "), strings.Join(coTeX, `;\quad `), `g - u_p\big|_{\partial\Omega}`)
	v.Harmonic = exactStage("harmonic", text(sol.Harmonic), tex(sol.Harmonic), "u_h")
	v.Solution = exactStage("solution", "u = "+text(sol.U), tex(sol.U), "u")
}

// latexNumber is a residual in LaTeX: 2.3 \cdot 10^{-13}.
func latexNumber(x float64) string { return series.LaTeXNumber(fmt.Sprintf("%.1e", x)) }
