package main

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"psol/domain"
	"psol/series"
)

// codeTerms is the series truncation in generated code unless --terms says otherwise.
const codeTerms = 2000

// writeCode emits a function u(r, theta, parameters...) in the chosen language.
func writeCode(w io.Writer, lang string, pr *problem, sol *domain.Solution, terms int) error {
	l, ok := series.Langs[lang]
	if !ok {
		return usagef("--lang %q: choose go, c or python", lang)
	}
	if sol.Points != nil && !sol.Points.ExactTraces() {
		return &domain.Unsupported{Reason: "generated code for point sources is written where their field's traces are exact (images on a disk or a sector of angle pi/k, the logarithm's series on a disk or an annulus); here their field's correction is numeric"}
	}
	if sol.Rect != nil {
		return writeRectCode(w, l, pr, sol, terms)
	}
	if sol.Section != nil { // the fitted harmonic part, from its tables
		return writeSectionCode(w, l, pr, sol)
	}
	var waves []string
	if w := sol.Waves; w != nil { // a disk's or an annulus's, in x = r*cos(theta), y = r*sin(theta)
		if err := wavesWritable(w); err != nil {
			return err
		}
		waves = append(waves, w.Waves.CodeIn(l, "(r*"+l.Fn["cos"]+"(theta))", "(r*"+l.Fn["sin"]+"(theta))"))
	}
	var kinks []string
	if sol.Quadrature != nil { // the numeric particular part has no formula to write
		if sol.Numeric || len(sol.Quadrature.Kinks) == 0 {
			return &domain.Unsupported{Reason: "generated code for a source part by quadrature is not written yet"}
		}
		var err error
		if kinks, err = kinkCode(l, sol); err != nil {
			return err
		}
	}
	closed := sol.U
	var parts []series.Series
	if sol.Series != nil {
		closed = sol.Particular.Add(sol.Harmonic)
		parts = sol.Series.U.Parts
	}
	closed, err := closed.Subst(pr.env)
	if err != nil {
		return err
	}
	used := map[string]bool{}
	closed.Params(used)
	var kept []series.Series
	for _, p := range parts {
		if !p.IsZero() {
			kept = append(kept, p)
		}
	}
	parts = kept
	for i := range parts {
		if parts[i], err = substSeries(parts[i], pr.env); err != nil {
			return err
		}
		for _, t := range parts[i].General {
			t.C.Params(used)
		}
		parts[i].R.Params(used)
	}
	delete(used, series.Index)
	var params []string
	for p := range used {
		params = append(params, p)
	}
	sort.Strings(params)
	var logs []string
	if sol.Points != nil {
		if logs, err = pointCode(l, sol.Points, pr.env, used); err != nil {
			return err
		}
	}
	delete(used, series.Index)
	params = params[:0]
	for p := range used {
		params = append(params, p)
	}
	sort.Strings(params)
	g := codeGen{l: l, vars: []string{"r", "theta"}, params: params, closed: closed.Code(l), parts: parts, terms: terms, extra: append(append(logs, kinks...), waves...)}
	fmt.Fprintf(w, "%s psol %s: %s\n", g.comment(), version, sol.Formula(false))
	if len(parts) > 0 {
		fmt.Fprintf(w, "%s The series are summed to n = %d.\n", g.comment(), terms)
	}
	return g.write(w)
}

// wavesWritable refuses generated code for waves whose factors still carry
// a parameter (the code takes none for them): sections and circles alike.
func wavesWritable(w *domain.WavePart) error {
	if domain.WavesBound(w.Waves, nil) != nil {
		return &domain.Unsupported{Reason: "generated code for waves (exponentials or trigonometric functions of x and y) that carry parameters is not written yet; give the numbers in the equation"}
	}
	return nil
}

// kinkCode is each kink's closed form, Factor*|A*x + B*y + D|^3, as a term
// in r and theta (kinks alone are closed: their forms are rational).
func kinkCode(l series.Lang, sol *domain.Solution) ([]string, error) {
	var out []string
	for _, k := range sol.Quadrature.Kinks {
		if k.LA.IsZero() && k.LB.IsZero() {
			return nil, &domain.Unsupported{Reason: "a kink with no linear form has no code"}
		}
		if k.Step {
			return nil, &domain.Unsupported{Reason: "generated code for a step source (cond ? a : b) is not written yet"}
		}
		code := func(c series.Coef) string { return c.Code(l, series.Index) }
		form := "(" + code(k.LA) + "*r*" + l.Fn["cos"] + "(theta) + " + code(k.LB) + "*r*" + l.Fn["sin"] + "(theta) + " + code(k.LD) + ")"
		a := l.Fn["abs"] + form
		out = append(out, code(k.Factor)+"*"+a+"*"+a+"*"+a)
	}
	return out, nil
}

// pointCode is each logarithm of u_s, C*log(S*((x - X)^2 + (y - Y)^2)),
// as a term in r and theta; it adds the parameters it uses to used.
func pointCode(l series.Lang, pp *domain.PointPart, env series.Env, used map[string]bool) ([]string, error) {
	var out []string
	for _, lg := range pp.Logs {
		cs := []series.Coef{lg.C, lg.X, lg.Y, lg.S}
		if lg.S.IsZero() {
			cs[3] = series.IntCoef(1)
		}
		for i := range cs {
			c, err := cs[i].Subst(env)
			if err != nil {
				return nil, err
			}
			c.Params(used)
			cs[i] = c
		}
		code := func(c series.Coef) string { return c.Code(l, series.Index) }
		x := "r*" + l.Fn["cos"] + "(theta)"
		y := "r*" + l.Fn["sin"] + "(theta)"
		dx := "(" + x + " - " + code(cs[1]) + ")"
		dy := "(" + y + " - " + code(cs[2]) + ")"
		out = append(out, code(cs[0])+"*"+l.Fn["log"]+"("+code(cs[3])+"*("+dx+"*"+dx+" + "+dy+"*"+dy+"))")
	}
	if !pp.Const.IsZero() {
		k, err := pp.Const.Subst(env)
		if err != nil {
			return nil, err
		}
		k.Params(used)
		out = append(out, k.Code(l, series.Index))
	}
	return out, nil
}

func substSeries(s series.Series, env series.Env) (series.Series, error) {
	out := s
	out.General = nil
	for _, t := range s.General {
		c, err := t.C.Subst(env)
		if err != nil {
			return s, err
		}
		t.C = c
		out.General = append(out.General, t)
	}
	r, err := s.R.Subst(env)
	out.R = r
	return out, err
}

type codeGen struct {
	l      series.Lang
	vars   []string // the function's coordinates: r, theta or x, y
	params []string
	closed string
	parts  []series.Series
	// loops are further series as (first n, term code), and extra plain terms.
	loops []codeLoop
	extra []string
	terms int
}

type codeLoop struct {
	from int
	term string
}

// codeShape is how one language spells the function psol writes: a closed
// part, then a loop per series with its exceptional terms.
type codeShape struct {
	comment string
	header  func(vars, params []string, closed string) string
	add     string // format: a term added outside any loop
	loop    func(from, to int) string
	skip    string // format: index, exceptional term
	term    string // format: general term
	end     string
}

var codeShapes = map[string]codeShape{
	"go": {
		comment: "//",
		header: func(vars, params []string, closed string) string {
			args := strings.Join(append(vars, params...), ", ") + " float64"
			return fmt.Sprintf("// It needs: import \"math\"\nfunc U(%s) float64 {\n\tu := %s\n", args, closed)
		},
		add:  "\tu += %s\n",
		loop: func(from, to int) string { return fmt.Sprintf("\tfor n := %d.0; n <= %d; n++ {\n", from, to) },
		skip: "\t\tif n == %d {\n\t\t\tu += %s\n\t\t\tcontinue\n\t\t}\n",
		term: "\t\tu += %s\n\t}\n",
		end:  "\treturn u\n}\n",
	},
	"c": {
		comment: "//",
		header: func(vars, params []string, closed string) string {
			var args []string
			for _, p := range append(vars, params...) {
				args = append(args, "double "+p)
			}
			return fmt.Sprintf("#include <math.h>\n\ndouble u(%s) {\n\tdouble u = %s;\n", strings.Join(args, ", "), closed)
		},
		add:  "\tu += %s;\n",
		loop: func(from, to int) string { return fmt.Sprintf("\tfor (double n = %d; n <= %d; n++) {\n", from, to) },
		skip: "\t\tif (n == %d) { u += %s; continue; }\n",
		term: "\t\tu += %s;\n\t}\n",
		end:  "\treturn u;\n}\n",
	},
	"python": {
		comment: "#",
		header: func(vars, params []string, closed string) string {
			args := append(vars, params...)
			return fmt.Sprintf("import math\n\n\ndef u(%s):\n    u = %s\n", strings.Join(args, ", "), closed)
		},
		add: "    u += %s\n",
		loop: func(from, to int) string {
			return fmt.Sprintf("    for k in range(%d, %d):\n        n = float(k)\n", from, to+1)
		},
		skip: "        if k == %d:\n            u += %s\n            continue\n",
		term: "        u += %s\n",
		end:  "    return u\n",
	},
}

func (g codeGen) comment() string { return codeShapes[g.l.Name].comment }

func (g codeGen) write(w io.Writer) error {
	shape := codeShapes[g.l.Name]
	var b strings.Builder
	b.WriteString(shape.header(append([]string(nil), g.vars...), g.params, g.closed))
	for _, e := range g.extra {
		fmt.Fprintf(&b, shape.add, e)
	}
	for _, p := range g.parts {
		b.WriteString(shape.loop(p.Family.From, g.terms))
		for _, k := range p.Skips() {
			fmt.Fprintf(&b, shape.skip, k, p.SpecialCode(g.l, k))
		}
		fmt.Fprintf(&b, shape.term, p.TermCode(g.l))
	}
	for _, lp := range g.loops {
		b.WriteString(shape.loop(lp.from, g.terms))
		fmt.Fprintf(&b, shape.term, lp.term)
	}
	b.WriteString(shape.end)
	_, err := io.WriteString(w, b.String())
	return err
}

// writeRectCode emits u(x, y, parameters...) for a rectangle: the
// polynomial and wave parts, then a loop per side series.
func writeRectCode(w io.Writer, l series.Lang, pr *problem, sol *domain.Solution, terms int) error {
	rp := sol.Rect
	if rp.Quadrature != nil {
		return &domain.Unsupported{Reason: "generated code for a source part by quadrature is not written yet"}
	}
	g := codeGen{l: l, vars: []string{"x", "y"}, terms: terms}
	used := map[string]bool{}
	closed := rp.Particular.Code(l)
	if len(rp.Waves) > 0 {
		closed += " + " + rp.Waves.Code(l)
	}
	g.closed = closed
	for _, s := range rp.Sides {
		switch {
		case s.Eigen != nil:
			return &domain.Unsupported{Reason: "generated code for numeric side series (Robin sides, data that are no polynomial) is not written yet"}
		case s.Series == nil || s.Correction.IsZero():
			continue
		}
		if c := s.Series.ConstantCode(l); c != "" {
			g.extra = append(g.extra, c)
		}
		g.loops = append(g.loops, codeLoop{from: s.Series.From(), term: s.Series.TermCode(l)})
		s.Series.B.Params(used)
		s.Series.L.Params(used)
		s.Series.H.Params(used)
	}
	for _, t := range rp.Particular.Terms() {
		t.C.Params(used)
	}
	delete(used, series.Index)
	if len(used) > 0 {
		var names []string
		for p := range used {
			names = append(names, p)
		}
		sort.Strings(names)
		return &domain.Unsupported{Reason: "generated code for the rectangle needs every parameter's value (--let " + strings.Join(names, "=..., ") + "=...)"}
	}
	fmt.Fprintf(w, "%s psol %s: u(x, y) on %s; the side series are summed to n = %d.\n", g.comment(), version, pr.domain.Describe(), terms)
	return g.write(w)
}
