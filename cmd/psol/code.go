package main

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"psol/series"
	"psol/series/domain"
)

// codeTerms is the series truncation in generated code unless --terms says otherwise.
const codeTerms = 2000

// writeCode emits a function u(r, theta, parameters...) in the chosen language.
func writeCode(w io.Writer, lang string, pr *problem, sol *domain.Solution, terms int) error {
	l, ok := series.Langs[lang]
	if !ok {
		return usagef("--lang %q: choose go, c or python", lang)
	}
	if sol.Rect != nil {
		return &domain.Unsupported{Reason: "generated code for the rectangle's series is not written yet"}
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
	g := codeGen{l: l, params: params, closed: closed.Code(l), parts: parts, terms: terms}
	fmt.Fprintf(w, "%s psol %s: %s\n", g.comment(), version, sol.Formula(false))
	if len(parts) > 0 {
		fmt.Fprintf(w, "%s The series are summed to n = %d.\n", g.comment(), terms)
	}
	return g.write(w)
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
	params []string
	closed string
	parts  []series.Series
	terms  int
}

// codeShape is how one language spells the function psol writes: a closed
// part, then a loop per series with its exceptional terms.
type codeShape struct {
	comment string
	header  func(params []string, closed string) string
	loop    func(from, to int) string
	skip    string // format: index, exceptional term
	term    string // format: general term
	end     string
}

var codeShapes = map[string]codeShape{
	"go": {
		comment: "//",
		header: func(params []string, closed string) string {
			args := "r, theta float64"
			if len(params) > 0 {
				args += ", " + strings.Join(params, ", ") + " float64"
			}
			return fmt.Sprintf("// It needs: import \"math\"\nfunc U(%s) float64 {\n\tu := %s\n", args, closed)
		},
		loop: func(from, to int) string { return fmt.Sprintf("\tfor n := %d.0; n <= %d; n++ {\n", from, to) },
		skip: "\t\tif n == %d {\n\t\t\tu += %s\n\t\t\tcontinue\n\t\t}\n",
		term: "\t\tu += %s\n\t}\n",
		end:  "\treturn u\n}\n",
	},
	"c": {
		comment: "//",
		header: func(params []string, closed string) string {
			args := []string{"double r", "double theta"}
			for _, p := range params {
				args = append(args, "double "+p)
			}
			return fmt.Sprintf("#include <math.h>\n\ndouble u(%s) {\n\tdouble u = %s;\n", strings.Join(args, ", "), closed)
		},
		loop: func(from, to int) string { return fmt.Sprintf("\tfor (double n = %d; n <= %d; n++) {\n", from, to) },
		skip: "\t\tif (n == %d) { u += %s; continue; }\n",
		term: "\t\tu += %s;\n\t}\n",
		end:  "\treturn u;\n}\n",
	},
	"python": {
		comment: "#",
		header: func(params []string, closed string) string {
			args := append([]string{"r", "theta"}, params...)
			return fmt.Sprintf("import math\n\n\ndef u(%s):\n    u = %s\n", strings.Join(args, ", "), closed)
		},
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
	b.WriteString(shape.header(g.params, g.closed))
	for _, p := range g.parts {
		b.WriteString(shape.loop(p.Family.From, g.terms))
		for _, k := range p.Skips() {
			fmt.Fprintf(&b, shape.skip, k, p.SpecialCode(g.l, k))
		}
		fmt.Fprintf(&b, shape.term, p.TermCode(g.l))
	}
	b.WriteString(shape.end)
	_, err := io.WriteString(w, b.String())
	return err
}
