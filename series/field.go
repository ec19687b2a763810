package series

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"strings"
	"sync"
)

// Field is a function of the plane: an exact sum plus, where the algebra has
// no closed form, a remainder kept as an expression tree that evaluates in
// float64. Later stages hand the remainder to numerical methods.
type Field struct {
	Exact  Sum
	Rest   *Expr   // nil when the field is exact
	Pieces []Piece // when not nil, the field is these pieces in θ (Exact and Rest unused)
	// Points are sources concentrated at points, Q·δ(x − X, y − Y): a
	// distribution beside the function the rest describes. Only a source
	// carries them; evaluation (Compile) sees the function alone.
	Points []PointSource
}

// Exact wraps a sum as a field.
func ExactField(s Sum) Field { return Field{Exact: s} }

// IsExact reports whether f is a single exact sum.
func (f Field) IsExact() bool { return f.Rest == nil && f.Pieces == nil }

// Expr is a node of a remainder: a leaf sum, or an operation on nodes.
type Expr struct {
	op     string // "sum", "+", "*", "/", "^", "series", "choose", or a function name
	sum    Sum
	args   []*Expr
	ser    *seriesNode
	pieces []Piece
	cmp    []string // "choose": the comparisons between args[2:], a chain a < b < c
	fn     *namedFunc
	four   *FourierCoefficients           // "fourier": data on a circle by their exact coefficients
	sumAt  func(r, theta float64) float64 // "fourier": the series' sum in closed form, where known
}

// namedFunc is a function of (r, θ) computed in Go, printed by its name: a
// part of data that psol derives (a point source's field on a side).
type namedFunc struct {
	text, latex string
	at          func(r, theta float64) float64
}

// FuncField is the field at(r, θ), printed as text (and latex): data psol
// computes rather than reads, such as the trace of a point source's field
// on a side. It evaluates in float64 only.
func FuncField(text, latex string, at func(r, theta float64) float64) Field {
	return opaque(&Expr{op: "func", fn: &namedFunc{text, latex, at}})
}

// Choose is "sides[0] ops[0] sides[1] ... ? then : other", evaluated in
// float64: a condition the exact pieces in θ cannot take (x < 1/2, say).
func Choose(ops []string, sides []Field, then, other Field) Field {
	args := []*Expr{then.expr(), other.expr()}
	for _, s := range sides {
		args = append(args, s.expr())
	}
	return opaque(&Expr{op: "choose", args: args, cmp: ops})
}

var compareFloat = map[string]func(a, b float64) bool{
	"<": func(a, b float64) bool { return a < b }, "<=": func(a, b float64) bool { return a <= b },
	">": func(a, b float64) bool { return a > b }, ">=": func(a, b float64) bool { return a >= b },
}

// Op is the node's operation: "sum" (a leaf: Leaf), "+", "*", "/", "^",
// "series", "pieces", or a function name; later stages read the tree by it.
func (e *Expr) Op() string { return e.op }

// Args are the node's operands.
func (e *Expr) Args() []*Expr { return e.args }

// Leaf is the exact sum of a "sum" leaf.
func (e *Expr) Leaf() Sum { return e.sum }

// seriesNode is Σ_{n=from}^{∞} body(n), skipping the listed n.
type seriesNode struct {
	from int
	skip []int
}

func (f Field) expr() *Expr {
	if f.IsPiecewise() {
		return &Expr{op: "pieces", pieces: f.Pieces}
	}
	leaf := &Expr{op: "sum", sum: f.Exact}
	if f.Rest == nil {
		return leaf
	}
	if f.Exact.IsZero() {
		return f.Rest
	}
	return &Expr{op: "+", args: []*Expr{leaf, f.Rest}}
}

func opaque(e *Expr) Field { return Field{Rest: e} }

// Kept is fn(f) kept whole: not expanded into pieces or exact terms as
// Apply would. A source's abs of a linear form stays a kink, whose
// particular solution is closed (ansatz.Kink); Apply would turn abs(x) into
// pieces in θ, which serve boundary data but no source.
func Kept(fn string, f Field) Field { return opaque(&Expr{op: fn, args: []*Expr{f.expr()}}) }

// Add is f + g.
func (f Field) Add(g Field) Field {
	if f.IsPiecewise() || g.IsPiecewise() {
		h, _ := liftPieces(f, g, func(a, b Field) (Field, error) { return a.Add(b), nil })
		h.Points = addPoints(f.Points, g.Points)
		return h
	}
	rest := f.Rest
	switch {
	case rest == nil:
		rest = g.Rest
	case g.Rest != nil:
		rest = &Expr{op: "+", args: []*Expr{f.Rest, g.Rest}}
	}
	return Field{Exact: f.Exact.Add(g.Exact), Rest: rest, Points: addPoints(f.Points, g.Points)}
}

// Neg is −f.
func (f Field) Neg() Field { return f.Scale(IntCoef(-1)) }

// Scale is c·f.
func (f Field) Scale(c Coef) Field {
	if f.IsPiecewise() {
		h, _ := mapPieces(f, func(a Field) (Field, error) { return a.Scale(c), nil })
		h.Points = scalePoints(f.Points, c)
		return h
	}
	out := Field{Exact: f.Exact.Scale(c), Points: scalePoints(f.Points, c)}
	if f.Rest == nil || c.Equal(IntCoef(1)) {
		out.Rest = f.Rest
		return out
	}
	rest := f.Rest
	if k, ok := rest.constFactor(); ok { // fold c·(k·e) into (ck)·e
		c, rest = c.Mul(k), rest.args[1]
		if c.Equal(IntCoef(1)) {
			out.Rest = rest
			return out
		}
	}
	out.Rest = &Expr{op: "*", args: []*Expr{{op: "sum", sum: Const(c)}, rest}}
	return out
}

// constFactor reports e = k·e' with k a constant leaf.
func (e *Expr) constFactor() (Coef, bool) {
	if e.op != "*" || e.args[0].op != "sum" {
		return Coef{}, false
	}
	return e.args[0].sum.Const()
}

// Mul is f·g.
func (f Field) Mul(g Field) Field {
	if f.IsPiecewise() || g.IsPiecewise() {
		h, _ := liftPieces(f, g, func(a, b Field) (Field, error) { return a.Mul(b), nil })
		return h
	}
	if f.IsExact() && g.IsExact() {
		return ExactField(f.Exact.Mul(g.Exact))
	}
	return opaque(&Expr{op: "*", args: []*Expr{f.expr(), g.expr()}})
}

// Div is f/g; exact when g is a single term free of angles and logarithms.
func (f Field) Div(g Field) (Field, error) {
	if f.IsPiecewise() || g.IsPiecewise() {
		return liftPieces(f, g, func(a, b Field) (Field, error) { return a.Div(b) })
	}
	if g.IsExact() && g.Exact.IsZero() {
		return Field{}, ErrDivideByZero
	}
	if g.IsExact() {
		if inv, err := g.Exact.Pow(big.NewRat(-1, 1)); err == nil {
			return f.Mul(ExactField(inv)), nil
		}
	}
	return opaque(&Expr{op: "/", args: []*Expr{f.expr(), g.expr()}}), nil
}

// Pow is f^g for a constant rational exponent g, exact where the algebra allows.
func (f Field) Pow(q *big.Rat) (Field, error) {
	if f.IsPiecewise() {
		return mapPieces(f, func(a Field) (Field, error) { return a.Pow(q) })
	}
	if f.IsExact() {
		s, err := f.Exact.Pow(q)
		if err == nil {
			return ExactField(s), nil
		}
		if errors.Is(err, ErrDivideByZero) {
			return Field{}, err
		}
		if c, ok := f.Exact.Const(); ok {
			return Field{}, fmt.Errorf("%s^(%s): %w", c.Text(), q.RatString(), err)
		}
	}
	return opaque(&Expr{op: "^", args: []*Expr{f.expr(), {op: "sum", sum: Const(RatCoef(q))}}}), nil
}

// unaryFloat holds the float64 form of each function a remainder may contain.
var unaryFloat = map[string]func(float64) float64{
	"sin": math.Sin, "cos": math.Cos, "tan": math.Tan, "exp": math.Exp,
	"ln": func(x float64) float64 { return math.Log(nonNegative(x)) }, "log": func(x float64) float64 { return math.Log(nonNegative(x)) },
	"sqrt": func(x float64) float64 { return math.Sqrt(nonNegative(x)) }, "abs": math.Abs,
	"sinh": math.Sinh, "cosh": math.Cosh, "tanh": math.Tanh,
	"atan": math.Atan, // for closed forms such as the Poisson integral of a step
	"step": Step,
}

// Step is the unit step of x: 1 for x > 0, 0 for x < 0, and 1/2 at 0 (the
// mean of its sides, as a Fourier series of a step converges to).
func Step(x float64) float64 {
	switch {
	case x > 0:
		return 1
	case x < 0:
		return 0
	}
	return 0.5
}

// nonNegative takes a rounding-level negative argument to 0: a piece of
// abs(f) is ±f, nonnegative exactly but not always in float64 at its end
// (sin(3θ) at θ = π/3 is −1e-16), and sqrt or log of it must not be NaN.
// A negative beyond rounding stays negative: a domain error is reported.
func nonNegative(x float64) float64 {
	if x < 0 && x > -1e-13 {
		return 0
	}
	return x
}

// IsFunction reports whether name is a function psol knows.
func IsFunction(name string) bool { _, ok := unaryFloat[name]; return ok }

// Apply is fn(f): exact where the algebra has the value, a remainder node otherwise.
func Apply(fn string, f Field) (Field, error) {
	if f.IsPiecewise() {
		return mapPieces(f, func(a Field) (Field, error) { return Apply(fn, a) })
	}
	if fn == "abs" && f.IsExact() {
		if p, ok := absPieces(f.Exact); ok {
			return p, nil
		}
	}
	if f.IsExact() {
		s, ok, err := applyExact(fn, f.Exact)
		if err != nil {
			return Field{}, err
		}
		if ok {
			return ExactField(s), nil
		}
	}
	return opaque(&Expr{op: fn, args: []*Expr{f.expr()}}), nil
}

// applyExact knows sin and cos of mθ + c (c a simple multiple of π or 0),
// ln of a single power term, sqrt through Pow, and abs and exp of plain constants.
func applyExact(fn string, s Sum) (Sum, bool, error) {
	switch fn {
	case "sin", "cos":
		m, shift, ok := angleOf(s)
		if !ok {
			return Sum{}, false, nil
		}
		if m < 0 { // cos(−x) = cos x, sin(−x) = −sin x
			r, ok, err := applyExact(fn, s.Neg())
			if fn == "sin" {
				r = r.Neg()
			}
			return r, ok, err
		}
		cs, sn, ok := unitCircle(shift)
		if !ok {
			return Sum{}, false, nil
		}
		// cos(mθ+c) = cos c cos mθ − sin c sin mθ; sin(mθ+c) = cos c sin mθ + sin c cos mθ.
		if fn == "cos" {
			return Trig(m, false).Scale(cs).Sub(Trig(m, true).Scale(sn)), true, nil
		}
		return Trig(m, true).Scale(cs).Add(Trig(m, false).Scale(sn)), true, nil
	case "sqrt":
		r, err := s.Pow(big.NewRat(1, 2))
		return r, err == nil, nil
	case "ln", "log": // log is the natural logarithm, as in most numeric libraries
		if len(s.t) != 1 || s.t[0].L != 0 || s.t[0].K != 0 || s.t[0].M != 0 {
			return Sum{}, false, nil
		}
		t := s.t[0]
		l, err := t.C.Ln()
		if err != nil {
			if t.C.IsZero() || (t.C.IsPoly() && t.C.num.isMonomial() && t.C.num.t[0].c.Sign() <= 0) {
				return Sum{}, false, fmt.Errorf("ln of a non-positive value")
			}
			return Sum{}, false, nil
		}
		return Const(l).Add(NewSum(Term{C: RatCoef(t.power()), L: 1})), true, nil
	case "abs":
		if c, ok := s.Const(); ok {
			if q, ok := c.Rat(); ok {
				return Const(RatCoef(new(big.Rat).Abs(q))), true, nil
			}
		}
	case "exp", "sinh", "tanh", "tan":
		if c, ok := s.Const(); ok && c.IsZero() {
			if fn == "exp" {
				return Const(IntCoef(1)), true, nil
			}
			return Sum{}, true, nil
		}
	case "cosh":
		if c, ok := s.Const(); ok && c.IsZero() {
			return Const(IntCoef(1)), true, nil
		}
	}
	return Sum{}, false, nil
}

// angleOf splits s = mθ + c with m a whole number and c constant.
func angleOf(s Sum) (m int, c Coef, ok bool) {
	for _, t := range s.t {
		switch {
		case t.isConst():
			c = t.C
		case t.K == 1 && t.M == 0 && t.L == 0 && t.power().Sign() == 0:
			q, isRat := t.C.Rat()
			if !isRat || !q.IsInt() || !q.Num().IsInt64() || q.Num().Int64() > 1<<40 || q.Num().Int64() < -(1<<40) {
				return 0, Coef{}, false
			}
			m = int(q.Num().Int64())
		default:
			return 0, Coef{}, false
		}
	}
	return m, c, true
}

// cos12 holds cos(kπ/12), every value a sum of rationals times 1, √2, √3 and √6.
var cos12 = sync.OnceValue(func() map[int64]Coef {
	half := big.NewRat(1, 2)
	r2, _ := IntCoef(2).Pow(half)
	r3, _ := IntCoef(3).Pow(half)
	base := map[int64]Coef{
		0: IntCoef(1),
		1: r2.Mul(r3).Add(r2).MulRat(big.NewRat(1, 4)), // (√6 + √2)/4
		2: r3.MulRat(half),
		3: r2.MulRat(half),
		4: FracCoef(1, 2),
		5: r2.Mul(r3).Sub(r2).MulRat(big.NewRat(1, 4)), // (√6 − √2)/4
		6: {},
	}
	out := map[int64]Coef{}
	for k, v := range base {
		out[k] = v               // cos(kπ/12)
		out[(24-k)%24] = v       // cos(−x) = cos x
		out[12-k] = v.Neg()      // cos(π − x) = −cos x
		out[(12+k)%24] = v.Neg() // cos(π + x) = −cos x
	}
	return out
})

// SeriesField is the series Σ_{n ≥ from, n ∉ skip} body: a remainder that
// evaluates by summing until the terms fall below 1e-15 of the sum.
func SeriesField(from int, skip []int, body Field) Field {
	return opaque(&Expr{op: "series", args: []*Expr{body.expr()}, ser: &seriesNode{from, skip}})
}

// PowField is f^g for any exponent g, exact where the algebra allows.
func PowField(f, g Field) (Field, error) {
	if f.IsPiecewise() || g.IsPiecewise() {
		return liftPieces(f, g, PowField)
	}
	if g.IsExact() {
		if c, ok := g.Exact.Const(); ok {
			if q, ok := c.Rat(); ok {
				return f.Pow(q)
			}
		}
	}
	return opaque(&Expr{op: "^", args: []*Expr{f.expr(), g.expr()}}), nil
}

// Text prints the remainder in psol's syntax.
func (e *Expr) Text() string {
	if e == nil {
		return "0"
	}
	switch e.op {
	case "func":
		return e.fn.text
	case "fourier":
		return "(" + e.four.Text() + ")"
	case "pieces":
		return "(" + piecesText(e.pieces) + ")"
	case "series":
		s := "sum(" + Index + "=" + fmt.Sprint(e.ser.from) + "..inf"
		for _, run := range runs(e.ser.skip) {
			s += ", " + Index + " != " + run
		}
		return s + ", " + TrimParens(e.args[0].Text()) + ")"
	case "choose":
		return "(" + e.condition(false) + " ? " + TrimParens(e.args[0].Text()) + " : " + TrimParens(e.args[1].Text()) + ")"
	case "sum":
		if e.sum.Len() > 1 {
			return "(" + e.sum.Text() + ")"
		}
		return e.sum.Text()
	case "+":
		if b := e.args[1].Text(); strings.HasPrefix(b, "-") {
			return e.args[0].Text() + " - " + b[1:]
		}
		return e.args[0].Text() + " + " + e.args[1].Text()
	case "*", "/":
		if k, ok := e.constFactor(); ok && k.Equal(IntCoef(-1)) {
			return "-" + operand(e.args[1], false, false)
		}
		return operand(e.args[0], true, false) + e.op + operand(e.args[1], false, e.op == "/")
	case "^":
		return operand(e.args[0], false, true) + "^(" + TrimParens(e.args[1].Text()) + ")"
	}
	return e.op + "(" + TrimParens(e.args[0].Text()) + ")"
}

// latexFunctions are the LaTeX forms of the functions of a remainder: the
// argument goes where %s is.
var latexFunctions = map[string]string{
	"sin": `\sin\left(%s\right)`, "cos": `\cos\left(%s\right)`, "tan": `\tan\left(%s\right)`,
	"exp": `e^{%s}`, "ln": `\ln\left(%s\right)`, "log": `\ln\left(%s\right)`, "sqrt": `\sqrt{%s}`,
	"abs": `\left|%s\right|`, "step": `\operatorname{step}\left(%s\right)`, "sinh": `\sinh\left(%s\right)`, "cosh": `\cosh\left(%s\right)`,
	"tanh": `\tanh\left(%s\right)`, "atan": `\arctan\left(%s\right)`,
}

// LaTeX prints the remainder as LaTeX.
func (e *Expr) LaTeX() string {
	if e == nil {
		return "0"
	}
	switch e.op {
	case "func":
		return e.fn.latex
	case "fourier":
		return `\left(` + e.four.LaTeX() + `\right)`
	case "pieces":
		return piecesLaTeX(e.pieces)
	case "series":
		lower := Index + "=" + fmt.Sprint(e.ser.from)
		if len(e.ser.skip) > 0 {
			lower += `,\ ` + Index + `\ne ` + strings.ReplaceAll(strings.Join(runs(e.ser.skip), ","), "..", `,\dots,`)
		}
		return `\sum_{` + lower + `}^{\infty} ` + e.args[0].LaTeX()
	case "sum":
		if e.sum.Len() > 1 {
			return `\left(` + e.sum.LaTeX() + `\right)`
		}
		return e.sum.LaTeX()
	case "choose":
		return `\begin{cases} ` + e.args[0].bareLaTeX() + ` & ` + e.condition(true) + ` \\ ` + e.args[1].bareLaTeX() + ` & \text{otherwise} \end{cases}`
	case "+":
		b := e.args[1].LaTeX()
		if strings.HasPrefix(b, "-") {
			return e.args[0].LaTeX() + " - " + b[1:]
		}
		return e.args[0].LaTeX() + " + " + b
	case "*":
		if k, ok := e.constFactor(); ok && k.Equal(IntCoef(-1)) {
			return "-" + wrapLaTeX(e.args[1])
		}
		return wrapLaTeX(e.args[0]) + ` \, ` + wrapLaTeX(e.args[1])
	case "/":
		return `\frac{` + e.args[0].bareLaTeX() + `}{` + e.args[1].bareLaTeX() + `}`
	case "^":
		return `{` + wrapLaTeX(e.args[0]) + `}^{` + e.args[1].bareLaTeX() + `}`
	}
	if f, ok := latexFunctions[e.op]; ok {
		return fmt.Sprintf(f, e.args[0].bareLaTeX())
	}
	return `\operatorname{` + e.op + `}\left(` + e.args[0].LaTeX() + `\right)`
}

// condition prints a "choose" node's comparisons.
func (e *Expr) condition(latex bool) string {
	tex := map[string]string{"<": "<", "<=": `\le`, ">": ">", ">=": `\ge`}
	side := func(a *Expr) string {
		if latex {
			return a.bareLaTeX()
		}
		return TrimParens(a.Text())
	}
	out := side(e.args[2])
	for i, op := range e.cmp {
		if latex {
			op = tex[op]
		}
		out += " " + op + " " + side(e.args[3+i])
	}
	return out
}

// bareLaTeX is LaTeX without the parentheses of a sum, for places that
// delimit it already: a fraction, an exponent, a function's argument.
func (e *Expr) bareLaTeX() string {
	if e.op == "sum" {
		return e.sum.LaTeX()
	}
	return e.LaTeX()
}

func wrapLaTeX(e *Expr) string {
	if sum, _ := shapeOf(e.Text()); e.op == "+" || sum {
		return `\left(` + e.LaTeX() + `\right)`
	}
	return e.LaTeX()
}

// operand prints e as an operand of *, / or ^, in parentheses where it
// would not bind as one: a sum always (a single term's compound coefficient
// too, such as n − 2), a leading sign except on the left, and a product or
// quotient where strict (the right of /, the base of ^).
func operand(e *Expr, left, strict bool) string {
	t := e.Text()
	sum, product := shapeOf(t)
	switch {
	case e.op == "+" || sum,
		strings.HasPrefix(t, "-") && !left,
		strict && (product || strings.HasPrefix(t, "-") || e.op == "*" || e.op == "/" || e.op == "^"):
		return "(" + t + ")"
	}
	return t
}

// shapeOf reports printed text with a top-level sum (+ or − between terms,
// not an exponent's sign) or a top-level product or quotient.
func shapeOf(t string) (sum, product bool) {
	depth := 0
	for i, c := range t {
		switch {
		case c == '(':
			depth++
		case c == ')':
			depth--
		case depth > 0:
		case c == '+' || c == '-' && i > 0 && t[i-1] != 'e':
			sum = true
		case c == '*' || c == '/' || c == '^':
			product = true
		}
	}
	return sum, product
}

// TrimParens drops one pair of parentheses around the whole of s (not a
// first and a last that belong to different pairs, as in (a)*f(b)).
func TrimParens(s string) string {
	if len(s) < 2 || s[0] != '(' || s[len(s)-1] != ')' {
		return s
	}
	depth := 0
	for i, c := range s {
		switch c {
		case '(':
			depth++
		case ')':
			depth--
			if depth == 0 && i != len(s)-1 {
				return s
			}
		}
	}
	return s[1 : len(s)-1]
}

// Text prints the field in psol's syntax.
func (f Field) Text() string {
	if len(f.Points) > 0 {
		pts := PointsText(f.Points)
		g := f
		g.Points = nil
		if g.IsExact() && g.Exact.IsZero() {
			return pts
		}
		if strings.HasPrefix(pts, "-") {
			return g.Text() + " - " + pts[1:]
		}
		return g.Text() + " + " + pts
	}
	if f.IsPiecewise() {
		return piecesText(f.Pieces)
	}
	if f.IsExact() {
		return f.Exact.Text()
	}
	return f.expr().Text()
}

// CompiledField evaluates a field in float64: the expression tree is turned
// into closures once, so evaluation looks nothing up.
type CompiledField struct {
	fn func(r, theta, n float64) float64
}

// indexedSum is a compiled leaf whose coefficients may depend on a series index.
type indexedSum struct {
	fixed   Compiled
	indexed []indexedTerm
}

type indexedTerm struct {
	c    coefFunc
	term cterm
}

func dependsOnIndex(c Coef) bool {
	for _, p := range []Poly{c.num, c.den} {
		for _, t := range p.t {
			for _, f := range t.m.f {
				if f.sym.indexed() {
					return true
				}
			}
		}
	}
	return false
}

func compileIndexed(s Sum, env Env) (indexedSum, error) {
	var fixed, rest []Term
	for _, t := range s.t {
		if dependsOnIndex(t.C) {
			rest = append(rest, t)
		} else {
			fixed = append(fixed, t)
		}
	}
	out := indexedSum{}
	var err error
	if out.fixed, err = NewSum(fixed...).Compile(env); err != nil {
		return out, err
	}
	for _, t := range rest {
		cf, err := compileCoef(t.C, env)
		if err != nil {
			return out, err
		}
		p, _ := t.power().Float64()
		out.indexed = append(out.indexed, indexedTerm{cf, cterm{1, p, t.L, t.K, t.M, t.Sin, false}})
	}
	return out, nil
}

func (s indexedSum) at(r, theta, n float64) float64 {
	v := s.fixed.At(r, theta)
	for _, t := range s.indexed {
		c := t.c.at(n)
		if c != 0 {
			v += c * Compiled{t: []cterm{t.term}}.At(r, theta)
		}
	}
	return v
}

// Compile fixes parameters from env for float64 evaluation.
func (f Field) Compile(env Env) (CompiledField, error) {
	fn, err := compileExpr(f.expr(), env)
	return CompiledField{fn: fn}, err
}

// At is the field's value at (r, θ).
func (cf CompiledField) At(r, theta float64) float64 { return cf.fn(r, theta, math.NaN()) }

// CompiledXY is a field compiled for Cartesian points (CompileXY).
type CompiledXY struct{ fn evalFunc }

// At is the field's value at (x, y).
func (c CompiledXY) At(x, y float64) float64 { return c.fn(x, y, math.NaN()) }

// CompileXY compiles the field for points given as (x, y): each exact sum
// that poly takes (a polynomial in x and y: series/cart's PolyLeaf, which
// this package cannot import) is evaluated in x and y, every other leaf
// through r = hypot(x, y) and θ = atan2(y, x), the operators as Compile's.
// A source sampled on a rectangle then skips the polar round trip (hypot,
// atan2, cos, sin), whose rougher rounding where a narrow bump's expanded
// terms cancel the sine quadrature's refinement read as detail: 20 panels
// where 8 resolve the bump.
func (f Field) CompileXY(env Env, poly func(Sum) (func(x, y float64) float64, bool)) (CompiledXY, error) {
	hook := func(e *Expr) (evalFunc, bool, error) {
		switch e.op {
		case "sum":
			if at, ok := poly(e.sum); ok {
				return func(x, y, _ float64) float64 { return at(x, y) }, true, nil
			}
		case "func", "fourier", "pieces":
		default:
			return nil, false, nil
		}
		polar, err := compileExpr(e, env)
		return func(x, y, n float64) float64 { return polar(math.Hypot(x, y), math.Atan2(y, x), n) }, true, err
	}
	fn, err := compileExprHook(f.expr(), env, hook)
	return CompiledXY{fn: fn}, err
}

// MaxSeriesTerms caps the summation of a series read from text.
const MaxSeriesTerms = 200000

type evalFunc = func(r, theta, n float64) float64

// binaryFloat holds the float64 form of each binary operator of a remainder.
var binaryFloat = map[string]func(a, b float64) float64{
	"+": func(a, b float64) float64 { return a + b },
	"*": func(a, b float64) float64 { return a * b },
	"/": func(a, b float64) float64 { return a / b },
	"^": func(a, b float64) float64 {
		if b != math.Trunc(b) { // a fractional power: as sqrt, of a rounding-level negative
			a = nonNegative(a)
		}
		return math.Pow(a, b)
	},
}

func compileExpr(e *Expr, env Env) (evalFunc, error) { return compileExprHook(e, env, nil) }

// leafHook, when set, compiles a node itself (ok true) before
// compileExprHook looks at it: CompileXY's leaves.
type leafHook func(e *Expr) (fn evalFunc, ok bool, err error)

// compileExprHook is compileExpr with hook consulted at every node. The
// operators pass their three arguments through unread, so with leaves that
// read (x, y) the same tree evaluates at Cartesian points.
func compileExprHook(e *Expr, env Env, hook leafHook) (evalFunc, error) {
	if hook != nil {
		if fn, ok, err := hook(e); ok {
			return fn, err
		}
	}
	switch e.op {
	case "func":
		at := e.fn.at
		return func(r, theta, _ float64) float64 { return at(r, theta) }, nil
	case "fourier":
		if at := e.sumAt; at != nil {
			return func(r, theta, _ float64) float64 { return at(r, theta) }, nil
		}
		return compileFourier(*e.four, env)
	case "pieces":
		p, err := Field{Pieces: e.pieces}.compilePieces(env)
		return func(r, theta, _ float64) float64 { return p.at(r, theta) }, err
	case "sum":
		c, err := compileIndexed(e.sum, env)
		if len(c.indexed) == 0 {
			return func(r, theta, _ float64) float64 { return c.fixed.At(r, theta) }, err
		}
		return c.at, err
	}
	args := make([]evalFunc, len(e.args))
	for i, a := range e.args {
		fn, err := compileExprHook(a, env, hook)
		if err != nil {
			return nil, err
		}
		args[i] = fn
	}
	if e.op == "series" {
		return compileSeries(e.ser, args[0]), nil
	}
	if e.op == "choose" {
		then, other, sides, ops := args[0], args[1], args[2:], e.cmp
		return func(r, theta, n float64) float64 {
			prev := sides[0](r, theta, n)
			for i, op := range ops {
				next := sides[i+1](r, theta, n)
				if !compareFloat[op](prev, next) {
					return other(r, theta, n)
				}
				prev = next
			}
			return then(r, theta, n)
		}, nil
	}
	if op, ok := binaryFloat[e.op]; ok {
		a, b := args[0], args[1]
		// The common operators inline: a call through the table per node
		// was a good part of a sampled source's cost.
		switch e.op {
		case "+":
			return func(r, theta, n float64) float64 { return a(r, theta, n) + b(r, theta, n) }, nil
		case "*":
			return func(r, theta, n float64) float64 { return a(r, theta, n) * b(r, theta, n) }, nil
		case "^":
			// A whole constant exponent on an expression the lowering left
			// unexpanded, as in 1/(1 + x)^2: by multiplication, not Pow
			// (a costly call at every sample).
			if c, ok := e.args[1].sum.Const(); ok && e.args[1].op == "sum" {
				if q, ok := c.Rat(); ok && q.IsInt() && q.Num().IsInt64() && q.Num().Int64() >= 0 && q.Num().Int64() <= 64 {
					k := q.Num().Int64()
					return func(r, theta, n float64) float64 { return powInt(a(r, theta, n), k) }, nil
				}
			}
		}
		return func(r, theta, n float64) float64 { return op(a(r, theta, n), b(r, theta, n)) }, nil
	}
	op, a := unaryFloat[e.op], args[0]
	switch e.op {
	case "exp":
		return func(r, theta, n float64) float64 { return math.Exp(a(r, theta, n)) }, nil
	case "cos":
		return func(r, theta, n float64) float64 { return math.Cos(a(r, theta, n)) }, nil
	case "sin":
		return func(r, theta, n float64) float64 { return math.Sin(a(r, theta, n)) }, nil
	}
	return func(r, theta, n float64) float64 { return op(a(r, theta, n)) }, nil
}

// compileSeries sums term over the index until four terms in a row are
// below rounding, or MaxSeriesTerms.
func compileSeries(ser *seriesNode, term evalFunc) evalFunc {
	skip := map[int]bool{}
	for _, k := range ser.skip {
		skip[k] = true
	}
	return func(r, theta, _ float64) float64 {
		sum, quiet := 0.0, 0
		for k := ser.from; k < ser.from+MaxSeriesTerms; k++ {
			if skip[k] {
				continue
			}
			t := term(r, theta, float64(k))
			sum += t
			if math.Abs(t)*float64(k) <= 1e-15*math.Max(1, math.Abs(sum)) {
				if quiet++; quiet >= 4 {
					break
				}
			} else {
				quiet = 0
			}
		}
		return sum
	}
}

// ExprOf is an exact sum as a remainder node, for numeric methods.
func ExprOf(s Sum) *Expr { return &Expr{op: "sum", sum: s} }

// HasSeries reports a remainder that contains a series (slow to evaluate).
func (e *Expr) HasSeries() bool { return e.has("series") }

// HasChoice reports a remainder that contains a numeric choice (cond ? a : b).
func (e *Expr) HasChoice() bool { return e.has("choose") }

// Entire reports a remainder built from leaves that leaf accepts by sums,
// products, powers with a non-negative integer exponent, and exp, sin, cos,
// sinh and cosh: with polynomial leaves, analytic in the whole plane, so an
// extension of it beyond a region meets no singularity.
func (e *Expr) Entire(leaf func(Sum) bool) bool {
	if e == nil {
		return true
	}
	switch e.op {
	case "sum":
		return leaf(e.sum)
	case "+", "*", "exp", "sin", "cos", "sinh", "cosh":
	case "^":
		if e.args[1].op != "sum" {
			return false
		}
		c, ok := e.args[1].sum.Const()
		if !ok {
			return false
		}
		q, ok := c.Rat()
		if !ok || !q.IsInt() || q.Sign() < 0 {
			return false
		}
		return e.args[0].Entire(leaf)
	default:
		return false
	}
	for _, a := range e.args {
		if !a.Entire(leaf) {
			return false
		}
	}
	return true
}

// HasKink reports a remainder that contains abs (max and min lower to it):
// continuous, but its derivative jumps where the argument changes sign.
func (e *Expr) HasKink() bool { return e.has("abs") }

// SingleValued says that e is written in terms single-valued around the
// origin (no power of θ itself) and in operations alone, so that its
// Cartesian form (CompileXY) takes the same values as its polar one at
// every angle. A power of θ is not (the two forms cut the plane at
// different rays, 2π and π), nor are the node kinds that evaluate in polar
// coordinates only (pieces in θ, series, conditions, derived fields).
func (e *Expr) SingleValued() bool {
	switch e.op {
	case "sum":
		for _, t := range e.sum.Terms() {
			if t.K != 0 {
				return false
			}
		}
		return true
	case "fourier", "pieces", "series", "choose", "func":
		return false
	}
	for _, a := range e.args {
		if !a.SingleValued() {
			return false
		}
	}
	return true
}

func (e *Expr) has(op string) bool {
	if e == nil {
		return false
	}
	if e.op == op {
		return true
	}
	for _, a := range e.args {
		if a.has(op) {
			return true
		}
	}
	return false
}
