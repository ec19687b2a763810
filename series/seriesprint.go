package series

import (
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"
)

func (s Series) radialText(ts []RadialTerm, nu Coef, st style) string {
	var plain []Term
	var scaled []string
	for _, t := range ts {
		if t.Scaled {
			if t.C.IsZero() {
				continue
			}
			scaled = append(scaled, s.scaledText(t.C, nu, st))
			continue
		}
		plain = append(plain, Term{C: t.C, P: t.P, L: t.L})
	}
	text := ""
	if p := NewSum(plain...); !p.IsZero() || len(scaled) == 0 {
		text = p.print(st)
	}
	for _, sc := range scaled {
		switch {
		case text == "" || text == "0":
			text = sc
		case strings.HasPrefix(sc, "-"):
			text += " - " + sc[1:]
		default:
			text += " + " + sc
		}
	}
	return text
}

func (s Sum) print(st style) string { return printTerms(s.t, st) }

func (s Series) scaledText(c Coef, nu Coef, st style) string {
	neg, body := printTerm(Term{C: c, P: new(big.Rat)}, st)
	if nu.IsZero() { // (r/R)^0 = 1
		if neg {
			return "-" + body
		}
		return body
	}
	base, exp := "(r/"+wrapText(s.R.Text())+")", nu.Text()
	if st.latex {
		base, exp = `\left(\frac{r}{`+s.R.LaTeX()+`}\right)`, nu.LaTeX()
	}
	switch {
	case s.Inverse && st.latex:
		base = `\left(\frac{` + s.R.LaTeX() + `}{r}\right)`
	case s.Inverse:
		base = "(" + wrapText(s.R.Text()) + "/r)"
	case s.R.Equal(IntCoef(1)):
		base = "r"
	}
	pw := base + "^{" + exp + "}"
	if !st.latex {
		pw = base + "^(" + exp + ")"
		if isName(exp) {
			pw = base + "^" + exp
		}
	}
	switch {
	case body == "1":
		body = pw
	case topLevelSum(body):
		if st.latex {
			body = `\left(` + body + `\right)` + st.mul + pw
		} else {
			body = "(" + body + ")" + st.mul + pw
		}
	default:
		body = body + st.mul + pw
	}
	if neg {
		return "-" + body
	}
	return body
}

func isName(s string) bool {
	for _, c := range s {
		if !(c >= 'a' && c <= 'z' || c >= 'A' && c <= 'Z' || c >= '0' && c <= '9') {
			return false
		}
	}
	return s != ""
}

func wrapText(s string) string {
	if strings.ContainsAny(s, " /*") {
		return "(" + s + ")"
	}
	return s
}

func (s Series) phiText(nu Coef, st style) string {
	fn := "cos"
	if s.Family.Sin {
		fn = "sin"
	}
	if q, ok := nu.Rat(); ok && q.Cmp(big.NewRat(1, 1)) == 0 { // cos(theta), not cos(1*theta)
		if st.latex {
			return `\` + fn + `\theta`
		}
		return fn + "(theta)"
	}
	if st.latex {
		arg := nu.LaTeX()
		if _, ok := nu.Rat(); !ok && strings.ContainsAny(arg, "+-") {
			arg = `\left(` + arg + `\right)`
		}
		return `\` + fn + `\left(` + arg + ` \theta\right)`
	}
	arg := nu.Text()
	if strings.ContainsAny(arg, " ") {
		arg = "(" + arg + ")"
	}
	return fn + "(" + arg + "*theta)"
}

func (s Series) termText(ts []RadialTerm, nu Coef, st style) string {
	if q, ok := nu.Rat(); ok && q.Sign() == 0 && !s.Family.Sin { // Φ = cos 0 = 1
		return s.radialText(ts, nu, st)
	}
	radial := s.radialText(ts, nu, st)
	if radial == "0" {
		return "0"
	}
	if strings.ContainsAny(radial[1:], "+-") || strings.Contains(radial, " ") {
		if st.latex {
			radial = `\left(` + radial + `\right)`
		} else {
			radial = "(" + radial + ")"
		}
	}
	return radial + st.mul + s.phiText(nu, st)
}

// Text prints the series in psol's syntax: sum(n=FROM..inf[, n != K ...], TERM)
// followed by the exceptional terms.
func (s Series) Text() string { return s.text(textStyle) }

// TextApprox is Text with rational coefficients as decimals, for numeric results.
func (s Series) TextApprox() string { return s.text(style{mul: "*", decimal: true}) }

func (s Series) text(st style) string {
	from, skip := s.lower()
	head := "sum(" + Index + "=" + strconv.Itoa(from) + "..inf"
	for _, run := range runs(skip) {
		head += ", " + Index + " != " + run
	}
	return s.print(head+", ", ")", st)
}

// lower is the sum's first index and the exceptional indices past it:
// exceptions that run on from the family's first index move the first
// index on (sum(n=4..inf, ...), not sum(n=1..inf, n != 1..3, ...)).
func (s Series) lower() (int, []int) {
	from, skip := s.Family.From, s.specials()
	for len(skip) > 0 && skip[0] == from {
		from, skip = from+1, skip[1:]
	}
	return from, skip
}

// LaTeX prints the series with \sum.
func (s Series) LaTeX() string { return s.latex(latexStyle) }

// LaTeXApprox is LaTeX with decimals.
func (s Series) LaTeXApprox() string { return s.latex(style{latex: true, mul: " ", decimal: true}) }

func (s Series) latex(st style) string {
	from, skip := s.lower()
	lower := Index + "=" + strconv.Itoa(from)
	if len(skip) > 0 {
		var ex []string
		for _, run := range runs(skip) {
			ex = append(ex, strings.Replace(run, "..", `,\dots,`, 1))
		}
		lower = Index + `\ge ` + strconv.Itoa(from) + `,\ ` + Index + `\ne ` + strings.Join(ex, ",")
	}
	return s.print(`\sum_{`+lower+`}^{\infty} `, "", st)
}

// runs writes sorted whole numbers with runs of three or more as "a..b".
func runs(ns []int) []string {
	var out []string
	for i := 0; i < len(ns); {
		j := i
		for j+1 < len(ns) && ns[j+1] == ns[j]+1 {
			j++
		}
		if j-i >= 2 {
			out = append(out, strconv.Itoa(ns[i])+".."+strconv.Itoa(ns[j]))
		} else {
			for k := i; k <= j; k++ {
				out = append(out, strconv.Itoa(ns[k]))
			}
		}
		i = j + 1
	}
	return out
}

// print is open + general term + close, then the exceptional terms.
func (s Series) print(open, close string, st style) string {
	var b strings.Builder
	// A zero general term (every mode exceptional or numeric) prints no sum.
	if g := s.termText(s.General, s.Family.Nu(IndexCoef), st); g != "0" {
		b.WriteString(open + g + close)
	}
	floor := s.specialFloor(st)
	for _, n := range s.specials() {
		if floor > 0 && specialSize(s.Special[n]) < floor {
			continue // rounding noise of a numeric mode: see Sum.visible
		}
		t := s.termText(s.Special[n], RatCoef(s.Family.NuAt(n)), st)
		switch {
		case t == "0":
		case b.Len() == 0:
			b.WriteString(t)
		case strings.HasPrefix(t, "-"):
			b.WriteString(" - " + t[1:])
		default:
			b.WriteString(" + " + t)
		}
	}
	if b.Len() == 0 {
		return "0"
	}
	return b.String()
}

// String is for debugging.
func (s Series) String() string { return fmt.Sprintf("Series(%s)", s.Text()) }

// topLevelSum reports a printed expression with a + or − outside brackets.
func topLevelSum(s string) bool {
	depth := 0
	for i := 0; i < len(s); i++ {
		switch s[i] {
		case '(', '{':
			depth++
		case ')', '}':
			depth--
		case '+', '-':
			if depth == 0 && i > 0 && s[i-1] == ' ' {
				return true
			}
		}
	}
	return false
}

// specialFloor is, for a decimal print, 1e-10 of the largest exceptional
// term's coefficient: smaller ones are rounding noise of numeric modes and
// are not printed (they still count in every evaluation). 0 prints all.
func (s Series) specialFloor(st style) float64 {
	if !st.decimal {
		return 0
	}
	big := 0.0
	for _, ts := range s.Special {
		v := specialSize(ts)
		if math.IsNaN(v) {
			return 0 // parameters: no floor
		}
		big = math.Max(big, v)
	}
	return 1e-10 * big
}

// specialSize is the largest |coefficient| of a mode's radial terms (NaN
// where one has parameters).
func specialSize(ts []RadialTerm) float64 {
	size := 0.0
	for _, t := range ts {
		v, err := t.C.Float(nil)
		if err != nil {
			return math.NaN()
		}
		size = math.Max(size, math.Abs(v))
	}
	return size
}
