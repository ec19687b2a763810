package series

import (
	"math"
	"math/big"
	"strconv"
	"strings"
)

// Text and LaTeX printing. Text uses psol's input syntax, so every printed
// formula parses back to an equal value.

// Text is c in psol's syntax.
func (c Coef) Text() string { return printCoef(c, textStyle) }

// LaTeX is c as LaTeX math.
func (c Coef) LaTeX() string { return printCoef(c, latexStyle) }

// Text is s in psol's syntax.
func (s Sum) Text() string { return printTerms(s.t, textStyle) }

// LaTeX is s as LaTeX math.
func (s Sum) LaTeX() string { return printTerms(s.t, latexStyle) }

// JoinText prints the sum of parts, each part's terms in its own order and
// a like term merged into its first appearance, so a solution reads as its parts.
func JoinText(parts ...Sum) string { return printTerms(joinTerms(parts), textStyle) }

// JoinLaTeX is JoinText as LaTeX.
func JoinLaTeX(parts ...Sum) string { return printTerms(joinTerms(parts), latexStyle) }

func joinTerms(parts []Sum) []Term {
	idx := map[shape]int{}
	var out []Term
	for _, p := range parts {
		for _, t := range p.t {
			if i, ok := idx[t.shape()]; ok {
				out[i].C = out[i].C.Add(t.C)
				continue
			}
			idx[t.shape()] = len(out)
			out = append(out, t)
		}
	}
	kept := out[:0]
	for _, t := range out {
		if !t.C.IsZero() {
			kept = append(kept, t)
		}
	}
	return kept
}

// style is one output syntax.
type style struct {
	latex   bool
	mul     string
	decimal bool // rationals as 12-digit decimals, for numeric coefficients
}

var (
	textStyle  = style{latex: false, mul: "*"}
	latexStyle = style{latex: true, mul: " "}
)

func printTerms(ts []Term, st style) string {
	if len(ts) == 0 {
		return "0"
	}
	var b strings.Builder
	for i, t := range ts {
		neg, body := printTerm(t, st)
		if !neg && i > 0 && strings.HasPrefix(body, "-") {
			neg, body = true, body[1:]
		}
		switch {
		case i == 0 && neg:
			b.WriteString("-")
		case i > 0 && neg:
			b.WriteString(" - ")
		case i > 0:
			b.WriteString(" + ")
		}
		b.WriteString(body)
	}
	return b.String()
}

// variables is the r, ln r, θ and trigonometric part of a term.
func (t Term) variables(st style) []string {
	var v []string
	if p := t.power(); p.Sign() != 0 {
		v = append(v, power("r", p, st))
	}
	if t.L > 0 {
		if st.latex {
			v = append(v, power(`(\ln r)`, big.NewRat(int64(t.L), 1), st))
			if t.L == 1 {
				v[len(v)-1] = `\ln r`
			}
		} else {
			v = append(v, power("ln(r)", big.NewRat(int64(t.L), 1), st))
		}
	}
	if t.K > 0 {
		name := "theta"
		if st.latex {
			name = `\theta`
		}
		v = append(v, power(name, big.NewRat(int64(t.K), 1), st))
	}
	if t.M > 0 {
		v = append(v, trigText(t.M, t.Sin, st))
	}
	return v
}

func trigText(m int, sin bool, st style) string {
	fn := "cos"
	if sin {
		fn = "sin"
	}
	switch {
	case st.latex && m == 1:
		return `\` + fn + `\theta`
	case st.latex:
		return `\` + fn + " " + strconv.Itoa(m) + `\theta`
	case m == 1:
		return fn + "(theta)"
	}
	return fn + "(" + strconv.Itoa(m) + "*theta)"
}

// power is base^e in the style's syntax; e = 1 prints the bare base.
func power(base string, e *big.Rat, st style) string {
	if e.IsInt() && e.Num().IsInt64() { // a whole exponent, nearly always: no big text
		switch n := e.Num().Int64(); {
		case n == 1:
			return base
		case st.latex:
			return base + "^{" + strconv.FormatInt(n, 10) + "}"
		case n > 0:
			return base + "^" + strconv.FormatInt(n, 10)
		default:
			return base + "^(" + strconv.FormatInt(n, 10) + ")"
		}
	}
	switch {
	case e.Cmp(one) == 0:
		return base
	case st.latex:
		return base + "^{" + latexRat(e) + "}"
	case e.IsInt() && e.Sign() > 0:
		return base + "^" + e.RatString()
	}
	return base + "^(" + e.RatString() + ")"
}

func latexRat(e *big.Rat) string {
	if e.IsInt() {
		return e.RatString()
	}
	s := ""
	if e.Sign() < 0 {
		s = "-"
	}
	return s + new(big.Int).Abs(e.Num()).String() + "/" + e.Denom().String()
}

func printTerm(t Term, st style) (neg bool, body string) {
	vars := t.variables(st)
	c := t.C
	if c.den.IsZero() && c.num.isMonomial() {
		return printMonomialTerm(c.num.t[0], vars, st)
	}
	var coef string
	if !c.den.IsZero() && c.num.t[0].c.Sign() < 0 {
		neg, c = true, c.Neg()
	}
	if c.den.IsZero() {
		if f, ok := factoredSum(c.num, st); ok { // (1 - (-1)^n)/(pi*n)
			neg = strings.HasPrefix(f, "-")
			f = strings.TrimPrefix(f, "-")
			return neg, strings.Join(append([]string{f}, vars...), st.mul)
		}
		if len(vars) == 0 { // a bare sum: its own signs stand
			return false, printPoly(c.num, st)
		}
		num := c.num
		neg = num.t[0].c.Sign() < 0
		if neg {
			num = num.Neg()
		}
		coef = paren(printPoly(num, st), st)
	} else if len(vars) == 0 {
		return neg, printCoef(c, st)
	} else if st.latex {
		coef = fracLaTeX(c, st)
		if len(c.num.t) >= longNumerator {
			coef = `\left(` + coef + `\right)`
		}
	} else {
		coef = printQuotient(c, st)
	}
	return neg, strings.Join(append([]string{coef}, vars...), st.mul)
}

func paren(s string, st style) string {
	if st.latex {
		return `\left(` + s + `\right)`
	}
	return "(" + s + ")"
}

func printPoly(p Poly, st style) string {
	return signedTerms(p, st, func(body string) string { return body })
}

// signedTerms prints p's terms with their signs between them, each term's
// body through form.
func signedTerms(p Poly, st style, form func(body string) string) string {
	var b strings.Builder
	for i, t := range p.t {
		neg, body := printMonomialTerm(t, nil, st)
		switch {
		case i == 0 && neg:
			b.WriteString("-")
		case neg:
			b.WriteString(" - ")
		case i > 0:
			b.WriteString(" + ")
		}
		b.WriteString(form(body))
	}
	return b.String()
}

// LaTeXNumber is a decimal as LaTeX: 9.7e-13 as 9.7 \cdot 10^{-13}; any
// other text as it is.
func LaTeXNumber(text string) string {
	m, e, sci := strings.Cut(text, "e")
	exp, err := strconv.Atoi(e)
	if !sci || err != nil {
		return text
	}
	return m + ` \cdot 10^{` + strconv.Itoa(exp) + `}`
}

// decimal12 is |q| to 12 significant digits, as big.Float's Text('g', 12)
// of it: by strconv when q is a float64 exactly (a numeric coefficient,
// nearly always), which is that text without big.Float's decimal
// conversion (half of printing a numeric trace of a few hundred modes).
func decimal12(q *big.Rat) string {
	if f, exact := q.Float64(); exact {
		return strconv.FormatFloat(math.Abs(f), 'g', 12, 64)
	}
	return new(big.Float).SetRat(new(big.Rat).Abs(q)).Text('g', 12)
}

// printMonomialTerm prints q·Π atoms·vars: in text as q*atoms*vars/atoms,
// in LaTeX as \frac{q_num atoms}{q_den atoms} vars.
func printMonomialTerm(t pterm, vars []string, st style) (bool, string) {
	q := t.c
	neg := q.Sign() < 0
	var num, den *big.Int
	if st.decimal && !q.IsInt() {
		text := decimal12(q)
		d, ok := new(big.Rat), false
		whole := !strings.ContainsAny(text, ".eE") // 6.8e+25 stays a decimal
		if whole {
			_, ok = d.SetString(text)
			whole = ok
		}
		if st.latex {
			text = LaTeXNumber(text)
		}
		if whole {
			num, den = d.Num(), big.NewInt(1)
		} else {
			parts := []string{text}
			for _, f := range t.m.f {
				if f.exp.Sign() > 0 {
					parts = append(parts, atomPower(f.sym, f.exp, st))
				}
			}
			parts = append(parts, vars...)
			body := strings.Join(parts, st.mul)
			for _, f := range t.m.f {
				if f.exp.Sign() < 0 {
					body += "/" + atomPower(f.sym, new(big.Rat).Neg(f.exp), st)
				}
			}
			return neg, body
		}
	}
	if num == nil {
		num, den = new(big.Int).Abs(q.Num()), q.Denom()
	}
	var up, down []string
	for _, f := range t.m.f {
		if f.exp.Sign() > 0 {
			up = append(up, atomPower(f.sym, f.exp, st))
		} else {
			down = append(down, atomPower(f.sym, new(big.Rat).Neg(f.exp), st))
		}
	}
	if st.latex {
		top := up
		if num.Cmp(one.Num()) != 0 || len(up) == 0 && (len(vars) == 0 || len(down) > 0 || den.Cmp(one.Num()) != 0) {
			top = append([]string{num.String()}, up...)
		}
		bottom := down
		if den.Cmp(one.Num()) != 0 {
			bottom = append([]string{den.String()}, down...)
		}
		head := strings.Join(top, " ")
		if len(bottom) > 0 {
			head = `\frac{` + head + "}{" + strings.Join(bottom, " ") + "}"
		}
		parts := vars
		if head != "" {
			parts = append([]string{head}, vars...)
		}
		return neg, strings.Join(parts, " ")
	}
	var parts []string
	abs := new(big.Rat).Abs(q)
	if abs.Cmp(one) != 0 || len(up)+len(vars) == 0 {
		parts = append(parts, abs.RatString())
	}
	parts = append(append(parts, up...), vars...)
	s := strings.Join(parts, "*")
	for _, d := range down {
		s += "/" + d
	}
	return neg, s
}

// greek lists the parameter names that print as LaTeX Greek letters.
var greek = map[string]bool{
	"alpha": true, "beta": true, "gamma": true, "delta": true, "epsilon": true, "zeta": true,
	"eta": true, "iota": true, "kappa": true, "lambda": true, "mu": true, "nu": true, "xi": true,
	"rho": true, "sigma": true, "tau": true, "phi": true, "chi": true, "psi": true, "omega": true,
	"Gamma": true, "Delta": true, "Lambda": true, "Sigma": true, "Phi": true, "Psi": true, "Omega": true,
}

// nameLaTeX typesets a parameter: Greek names as letters, trailing digits as a subscript.
func nameLaTeX(n string) string {
	i := len(n)
	for i > 0 && n[i-1] >= '0' && n[i-1] <= '9' {
		i--
	}
	base, sub := n[:i], n[i:]
	switch {
	case greek[base]:
		base = `\` + base
	case len([]rune(base)) > 1:
		base = `\mathrm{` + base + "}"
	}
	if sub != "" && base != "" {
		return base + "_{" + sub + "}"
	}
	return base + sub
}

func atomPower(s Symbol, e *big.Rat, st style) string {
	switch s.kind {
	case kindRoot:
		if e.Num().IsInt64() && e.Num().Int64() == 1 {
			d := e.Denom().String()
			switch {
			case d == "2" && st.latex:
				return `\sqrt{` + s.name + "}"
			case st.latex:
				return `\sqrt[` + d + "]{" + s.name + "}"
			case d == "2":
				return "sqrt(" + s.name + ")"
			}
		}
		return power(s.name, e, st)
	case kindPi:
		if st.latex {
			return power(`\pi`, e, st)
		}
		return power("pi", e, st)
	case kindSign:
		if st.latex {
			return "(-1)^{" + s.name + "}"
		}
		return "(-1)^" + s.name
	case kindPowN:
		b := "(" + s.name + ")"
		if st.latex {
			b = `\left(` + powBase(s.name).LaTeX() + `\right)`
			if e.Cmp(one) == 0 {
				return b + "^{n}"
			}
			return b + "^{" + latexRat(e) + " n}"
		}
		if e.Cmp(one) == 0 {
			return b + "^n"
		}
		return b + "^(" + e.RatString() + "*n)"
	case kindCosAtanN, kindSinAtanN:
		fn := map[symKind]string{kindCosAtanN: "cos", kindSinAtanN: "sin"}[s.kind]
		if st.latex {
			return power(`\`+fn+`\left(n \arctan `+atanLaTeX(s.name)+`\right)`, e, st)
		}
		return power(fn+"(n*atan("+s.name+"))", e, st)
	case kindAtan:
		if st.latex {
			return power(`\arctan `+atanLaTeX(s.name), e, st)
		}
		return power("atan("+s.name+")", e, st)
	case kindCosN, kindSinN:
		fn := map[symKind]string{kindCosN: "cos", kindSinN: "sin"}[s.kind]
		q, _ := new(big.Rat).SetString(s.name)
		arg := "n*pi"
		if st.latex {
			top := q.Num().String() + ` n \pi`
			if q.Num().Int64() == 1 {
				top = `n \pi`
			}
			arg = `\frac{` + top + `}{` + q.Denom().String() + "}"
			return power(`\`+fn+arg, e, st)
		}
		if q.Num().Int64() != 1 {
			arg = q.Num().String() + "*" + arg
		}
		return power(fn+"("+arg+"/"+q.Denom().String()+")", e, st)
	case kindLog:
		if st.latex {
			arg := s.name
			if !isDigits(arg) {
				arg = nameLaTeX(arg)
				if s.name == "pi" {
					arg = `\pi`
				}
			}
			if e.Cmp(one) == 0 {
				return `\ln ` + arg
			}
			return power(`(\ln `+arg+")", e, st)
		}
		return power("ln("+s.name+")", e, st)
	}
	if st.latex {
		return power(nameLaTeX(s.name), e, st)
	}
	return power(s.name, e, st)
}

func printCoef(c Coef, st style) string {
	switch {
	case c.num.IsZero():
		return "0"
	case c.den.IsZero():
		return printPoly(c.num, st)
	case st.latex:
		return fracLaTeX(c, st)
	}
	return printQuotient(c, st)
}

// longNumerator is the count of numerator terms from which a LaTeX quotient
// prints as a sum of fractions over the one denominator: a displayed line
// can break between them, not inside one \frac (a kink's general term has
// a numerator a page wide).
const longNumerator = 3

// fracLaTeX is num/den as \frac{num}{den}, or as Σ ±\frac{t}{den} for a
// long numerator.
func fracLaTeX(c Coef, st style) string {
	den := factoredPoly(c.den, st)
	if len(c.num.t) < longNumerator {
		return `\frac{` + printPoly(c.num, st) + "}{" + den + "}"
	}
	return signedTerms(c.num, st, func(body string) string { return `\frac{` + body + "}{" + den + "}" })
}

// printQuotient is num/den in text: the numerator's rational content and
// common atoms in front, brackets only where they are needed.
func printQuotient(c Coef, st style) string {
	q := c.num.content()
	if st.decimal {
		// Numeric coefficients print one by one as decimals: a common
		// rational content would turn them into long integers.
		q = new(big.Rat).Set(one)
	}
	g := commonMonomial(c.num)
	num := c.num.ScaleRat(new(big.Rat).Inv(q))
	head := ""
	if len(g.f) > 0 {
		inv, _ := Poly{[]pterm{{g, one}}}.PowRat(big.NewRat(-1, 1))
		num = num.Mul(inv)
		_, head = printMonomialTerm(pterm{g, q}, nil, st)
		head += "*"
	} else if q.Cmp(one) != 0 {
		head = q.RatString() + "*"
	}
	text := printPoly(num, st)
	sign := ""
	if len(num.t) == 1 && strings.HasPrefix(text, "-") {
		sign, text = "-", text[1:]
	}
	den := paren(factoredPoly(c.den, st), st)
	switch {
	case len(num.t) > 1:
		text = paren(text, st)
	case text == "1" && len(g.f) == 0 && !q.IsInt(): // a/b over den: a/(b*den)
		return sign + q.Num().String() + "/(" + q.Denom().String() + "*" + den + ")"
	case head != "" && text == "1":
		head, text = head[:len(head)-1], ""
	}
	return sign + head + text + "/" + den
}

// factoredPoly prints p with the monomial common to its terms in front: pi*n*(n^2 - 4).
func factoredPoly(p Poly, st style) string {
	g := commonMonomial(p)
	if len(g.f) == 0 {
		return printPoly(p, st)
	}
	inv, _ := Poly{[]pterm{{g, one}}}.PowRat(big.NewRat(-1, 1))
	_, head := printMonomialTerm(pterm{g, one}, nil, st)
	return head + st.mul + paren(printPoly(p.Mul(inv), st), st)
}

// factoredSum prints a polynomial whose terms share negative powers with
// those powers as a denominator: (1 - (-1)^n)/(pi*n). It reports false when
// there is nothing to factor.
func factoredSum(p Poly, st style) (string, bool) {
	if len(p.t) < 2 {
		return "", false
	}
	g := commonMonomial(p)
	var down []factor
	for _, f := range g.f {
		if f.exp.Sign() < 0 {
			down = append(down, factor{f.sym, f.exp})
		}
	}
	m, _ := normalizeRoots(down)
	if m.degreeOf(Param(Index)).Sign() == 0 { // only a series' general term is worth the change
		return "", false
	}
	inv, _ := Poly{[]pterm{{m, one}}}.PowRat(big.NewRat(-1, 1))
	rest := p.Mul(inv)
	q := rest.content()
	if st.decimal { // numeric coefficients one by one, as in printQuotient
		q = new(big.Rat).Set(one)
	}
	if rest.t[0].c.Sign() < 0 {
		q.Neg(q)
	}
	rest = rest.ScaleRat(new(big.Rat).Inv(q))
	_, den := printMonomialTerm(pterm{Poly{[]pterm{{m, one}}}.inverse(), one}, nil, st)
	sign := ""
	if q.Sign() < 0 {
		sign = "-"
	}
	abs := new(big.Rat).Abs(q)
	num := printPoly(rest, st)
	if st.latex {
		if abs.Cmp(one) != 0 {
			num = abs.RatString() + ` \left(` + num + `\right)`
			if !abs.IsInt() {
				num = `\frac{` + abs.Num().String() + `}{` + abs.Denom().String() + `} \left(` + printPoly(rest, st) + `\right)`
			}
		}
		return sign + `\frac{` + num + "}{" + den + "}", true
	}
	head := ""
	if abs.Cmp(one) != 0 {
		head = abs.RatString() + "*"
	}
	return sign + head + "(" + num + ")/(" + den + ")", true
}

// inverse is the monomial of a single-term polynomial, inverted.
func (p Poly) inverse() monomial {
	inv, _ := p.PowRat(big.NewRat(-1, 1))
	return inv.t[0].m
}

// atanLaTeX is an angle atom's ratio t as the argument of \arctan: a
// fraction bare, anything else in parentheses.
func atanLaTeX(name string) string {
	t := atanBase(name)
	if q, ok := t.Rat(); ok && q.Sign() > 0 {
		if q.IsInt() {
			return q.RatString()
		}
		return `\frac{` + q.Num().String() + `}{` + q.Denom().String() + `}`
	}
	return `\left(` + t.LaTeX() + `\right)`
}
