package parse

import (
	"errors"
	"fmt"
	"psol/domain"
	"psol/series"
	"strings"

	"github.com/alecthomas/participle/v2/lexer"
)

// Equation reads "c*lap(u) = f", or a bare source f, as the source of Δu = f.
func Equation(text string, env series.Env) (series.Field, error) {
	f, _, err := EquationAndUnknown(text, env)
	return f, err
}

// EquationAndUnknown is Equation and the name of its unknown (Unknown)
// from one parse: a command needs both, and the grammar's parse is most of
// a short command's own work.
func EquationAndUnknown(text string, env series.Env) (series.Field, string, error) {
	lw := &lowerer{label: "equation", input: text, env: env, points: true}
	f, err := lw.equation()
	return f, lw.unknown, err
}

func (lw *lowerer) equation() (series.Field, error) {
	st, err := lw.statement()
	if err != nil {
		return series.Field{}, err
	}
	if lw.unknown, err = lw.unknownOf(st); err != nil {
		return series.Field{}, err
	}
	if st.Side != nil {
		return series.Field{}, lw.fail(st.Side.Pos, "a side name belongs in --bc, not in the equation")
	}
	v, err := lw.choice(st.Left)
	if err != nil {
		return series.Field{}, err
	}
	if st.Eq == nil {
		if v.hasUnknown() {
			return series.Field{}, lw.fail(st.Pos, "write the equation with an = sign: lap(u) = f")
		}
		return v.f, nil
	}
	w, err := lw.choice(st.Eq.Right)
	if err != nil {
		return series.Field{}, err
	}
	v = v.add(w.scale(series.IntCoef(-1)))
	if !v.dn.IsZero() {
		return series.Field{}, lw.fail(st.Pos, "dn(u) belongs in boundary conditions, not in the equation")
	}
	if !v.u.IsZero() {
		return series.Field{}, lw.fail(st.Pos, "%s appears outside lap(%s); psol solves Poisson's equation lap(u) = f only", lw.unk(), lw.unk())
	}
	if v.lap.IsZero() {
		return series.Field{}, lw.fail(st.Pos, "missing lap(u): write the equation as c*lap(u) = f")
	}
	// lap·Δu + f = 0  ⇒  Δu = −f/lap.
	inv, err := series.IntCoef(-1).Div(v.lap)
	if err != nil {
		return series.Field{}, lw.fail(st.Pos, "%v", err)
	}
	return lw.readsBack(st.Pos, value{f: v.f.Scale(inv)})
}

// readsBack is v's field, within the numbers' bound: moving a side across
// the = sign or dividing by the Laplacian's factor makes new numbers, and
// what psol prints must read back (lap(u) + 1/700^900 = -700^900).
func (lw *lowerer) readsBack(pos lexer.Position, v value) (series.Field, error) {
	if v.bits() > MaxBits {
		return series.Field{}, lw.fail(pos, "a number in the result would exceed %d bits", MaxBits)
	}
	return v.f, nil
}

func (lw *lowerer) statement() (*statement, error) {
	if strings.TrimSpace(lw.input) == "" {
		return nil, &Error{Label: lw.label, Input: lw.input, Msg: "empty input"}
	}
	if len(lw.input) > MaxInput {
		return nil, &Error{Label: lw.label, Input: lw.input[:64] + "…", Offset: 64, Msg: fmt.Sprintf("the input is %d characters long; psol reads at most %d", len(lw.input), MaxInput)}
	}
	st, err := statementParser().ParseString("", lw.input)
	if err != nil {
		return nil, lw.wrapParse(err)
	}
	if st.Also != nil && !lw.clauses {
		return nil, lw.fail(st.Also.Pos, "a second clause after a comma belongs only in a boundary condition at one unknown value: u = const, flux = Q")
	}
	return st, nil
}

// floating reads the condition "u = const, flux = Q": u takes one unknown
// constant value on the side, and Q is the net outward flux ∮ ∂u/∂n ds
// through it. ok is false when the statement is not of that form.
func (lw *lowerer) floating(st *statement, cond domain.Condition) (domain.Condition, bool, error) {
	constant := st.Eq != nil && bareName(st.Eq.Right) == "const"
	if st.Also == nil && !constant {
		return cond, false, nil
	}
	switch {
	case bareName(st.Left) != lw.unk():
		return cond, true, lw.fail(st.Left.Pos, "a side at one unknown value is written u = const, flux = Q")
	case !constant:
		return cond, true, lw.fail(st.Also.Pos, "a second clause belongs only in u = const, flux = Q")
	case st.Also == nil:
		return cond, true, lw.fail(st.Eq.Right.Pos, "u = const needs the net flux through the side: u = const, flux = Q")
	case st.Also.Name != "flux":
		return cond, true, lw.fail(st.Also.Pos, "expected flux = Q, the net outward flux through the side, not %s", st.Also.Name)
	}
	q, err := lw.choice(st.Also.Value)
	if err != nil {
		return cond, true, err
	}
	if q.hasUnknown() || !q.f.IsExact() || q.f.Exact.HasAngle() {
		return cond, true, lw.fail(st.Also.Value.Pos, "the net flux is one number or constant expression, not a function on the side")
	}
	if _, ok := q.f.Exact.Const(); !ok {
		return cond, true, lw.fail(st.Also.Value.Pos, "the net flux is one number or constant expression, not a function of r, x or y")
	}
	cond.Kind, cond.G = domain.Floating, q.f
	return cond, true, nil
}

// bareName is the identifier a formula consists of, or "".
func bareName(c *choice) string {
	if c == nil || c.Then != nil || len(c.Cond.Rest) > 0 {
		return ""
	}
	a := c.Cond.Left
	if len(a.Rest) > 0 || len(a.Left.Rest) > 0 {
		return ""
	}
	u := a.Left.Left
	if u.Power == nil || u.Power.Exp != nil || u.Power.Base.Atom == nil || u.Power.Base.Atom.Name == nil {
		return ""
	}
	return *u.Power.Base.Atom.Name
}

// Unknown is the name of the equation's unknown: the argument of its lap
// (lap(T), ΔT), or u. Conditions, claims and --fix take it from here.
func Unknown(equation string) string {
	lw := &lowerer{label: "equation", input: equation}
	st, err := lw.statement()
	if err != nil {
		return "u"
	}
	name, err := lw.unknownOf(st)
	if err != nil {
		return "u"
	}
	return name
}

// unknownOf finds the first lap(NAME) or ΔNAME; a name that is a variable,
// a function or a reserved word cannot be the unknown.
func (lw *lowerer) unknownOf(st *statement) (string, error) {
	var found *atom
	var walk func(c *choice)
	walkAtom := func(a *atom) {
		switch {
		case a == nil || found != nil:
		case a.Lap != nil:
			found = a
		case a.Call != nil && a.Call.Name == "lap" && len(a.Call.Args) == 1 && bareName(a.Call.Args[0]) != "":
			found = a
		case a.Call != nil:
			for _, arg := range a.Call.Args {
				walk(arg)
			}
		case a.Group != nil:
			walk(a.Group)
		}
	}
	var walkUnary func(u *unary)
	walkUnary = func(u *unary) {
		for ; u != nil && u.Inner != nil; u = u.Inner {
		}
		if u == nil || u.Power == nil {
			return
		}
		if pr := u.Power.Base; pr.Atom != nil {
			walkAtom(pr.Atom)
		} else if pr.Times != nil {
			walkAtom(pr.Times.Atom)
		}
	}
	walk = func(c *choice) {
		if c == nil || found != nil {
			return
		}
		for _, a := range append([]*additive{c.Cond.Left}, restAdditives(c.Cond)...) {
			for _, p := range append([]*product{a.Left}, restProducts(a)...) {
				walkUnary(p.Left)
				for _, m := range p.Rest {
					walkUnary(m.Right)
				}
			}
		}
		walk(c.Then)
		walk(c.Else)
	}
	walk(st.Left)
	if st.Eq != nil {
		walk(st.Eq.Right)
	}
	if found == nil {
		return "u", nil
	}
	name := found.LapOf
	if found.Call != nil {
		name = bareName(found.Call.Args[0])
	}
	_, variable := variables[name]
	_, word := reserved[name]
	if variable || word || series.IsFunction(name) || name == "const" || name == "flux" {
		return "", lw.fail(found.Pos, "%s cannot be the unknown: it is a coordinate, a function or a reserved word", name)
	}
	if _, given := lw.env[name]; given {
		return "", lw.fail(found.Pos, "%s is the unknown here, and --let gives it a value", name)
	}
	return name, nil
}

func restAdditives(c *compare) []*additive {
	var out []*additive
	for _, t := range c.Rest {
		out = append(out, t.Right)
	}
	return out
}

func restProducts(a *additive) []*product {
	var out []*product
	for _, t := range a.Rest {
		out = append(out, t.Right)
	}
	return out
}

// Condition reads "[SIDE:] CONDITION" for a domain with the given sides.
// Without SIDE, the condition's Side is the domain's only side, or "" on a
// domain with several: the caller applies it to every side not named.
func Condition(text string, sides []string, env series.Env) (domain.Condition, error) {
	return ConditionIn("u", text, sides, env)
}

// ConditionIn is Condition for an unknown with another name (see Unknown).
func ConditionIn(unknown, text string, sides []string, env series.Env) (domain.Condition, error) {
	// A dotted side name (a polygon hole's edge, hole1.s2) is read as a
	// name with an underscore, of the same length, so that columns stay.
	input, dotted := text, map[string]string{}
	for _, s := range sides {
		if !strings.Contains(s, ".") {
			continue
		}
		alias := strings.ReplaceAll(s, ".", "_")
		dotted[alias] = s
		trimmed := strings.TrimLeft(input, " \t")
		lead := len(input) - len(trimmed)
		if rest, ok := strings.CutPrefix(trimmed, s); ok && strings.HasPrefix(strings.TrimLeft(rest, " \t"), ":") {
			input = input[:lead] + alias + rest
		}
	}
	lw := &lowerer{label: "--bc", input: input, env: env, clauses: true, unknown: unknown}
	st, err := lw.statement()
	if err != nil {
		var pe *Error
		if errors.As(err, &pe) {
			pe.Input = text
		}
		return domain.Condition{}, err
	}
	if st.Side != nil {
		if name, ok := dotted[st.Side.Name]; ok {
			st.Side.Name = name
		}
	}
	lw.input = text
	cond := domain.Condition{Text: text}
	switch {
	case st.Side != nil:
		if !contains(sides, st.Side.Name) {
			return domain.Condition{}, lw.fail(st.Side.Pos, "this domain has no side %q (its sides: %s)", st.Side.Name, strings.Join(sides, ", "))
		}
		cond.Side = st.Side.Name
	case len(sides) == 1:
		cond.Side = sides[0]
	default:
		// No side named on a region with several: the caller applies it to
		// every side that has no condition of its own (Side stays "").
	}
	if c, ok, err := lw.floating(st, cond); ok || err != nil {
		return c, err
	}
	if st.Eq == nil {
		return domain.Condition{}, lw.fail(st.Left.Pos, "a condition needs an = sign, as in %s = g or dn(%s) = g", lw.unk(), lw.unk())
	}
	v, err := lw.choice(st.Left)
	if err != nil {
		return domain.Condition{}, err
	}
	w, err := lw.choice(st.Eq.Right)
	if err != nil {
		return domain.Condition{}, err
	}
	v = v.add(w.scale(series.IntCoef(-1)))
	if !v.lap.IsZero() {
		return domain.Condition{}, lw.fail(st.Pos, "lap(%s) belongs in the equation, not in a boundary condition", lw.unk())
	}
	// dn·∂u/∂n + u·u + f = 0.
	lead := v.dn
	switch {
	case !v.dn.IsZero() && v.u.IsZero():
		cond.Kind = domain.Neumann
	case !v.dn.IsZero():
		cond.Kind = domain.Robin
		cond.H, _ = v.u.Div(v.dn)
	case !v.u.IsZero():
		cond.Kind = domain.Dirichlet
		lead = v.u
	default:
		return domain.Condition{}, lw.fail(st.Pos, "a condition must involve %s or dn(%s)", lw.unk(), lw.unk())
	}
	inv, _ := series.IntCoef(-1).Div(lead)
	if cond.G, err = lw.readsBack(st.Pos, value{u: cond.H, f: v.f.Scale(inv)}); err != nil {
		return domain.Condition{}, err
	}
	return cond, nil
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// Expression reads a formula in r, θ, x, y and parameters, with no unknown;
// "u = formula" is taken as the formula.
func Expression(label, text string, env series.Env) (series.Field, error) {
	return ExpressionIn("u", label, text, env)
}

// ExpressionIn is Expression for an unknown with another name (see Unknown).
func ExpressionIn(unknown, label, text string, env series.Env) (series.Field, error) {
	lw := &lowerer{label: label, input: text, env: env, unknown: unknown}
	st, err := lw.statement()
	if err != nil {
		return series.Field{}, err
	}
	body := st.Left
	if st.Side == nil && st.Eq != nil {
		left, err := lw.choice(st.Left)
		if err != nil {
			return series.Field{}, err
		}
		if !left.lap.IsZero() || !left.dn.IsZero() || !left.u.Equal(series.IntCoef(1)) || !left.f.IsExact() || !left.f.Exact.IsZero() {
			return series.Field{}, lw.fail(st.Pos, "expected a formula, or u = formula")
		}
		body = st.Eq.Right
	}
	if st.Side != nil {
		return series.Field{}, lw.fail(st.Pos, "expected a formula, not a boundary condition")
	}
	v, err := lw.choice(body)
	if err != nil {
		return series.Field{}, err
	}
	if v.hasUnknown() {
		return series.Field{}, lw.fail(st.Pos, "expected a formula without u")
	}
	return v.f, nil
}

// Binding is one name = value pair of --let or --at.
type Binding struct {
	Name  string
	Value series.Coef
}

// Bindings reads "a=0.05,q=2e5": names bound to exact constants.
func Bindings(label, text string, env series.Env) ([]Binding, error) {
	lw := &lowerer{label: label, input: text, env: env}
	if strings.TrimSpace(text) == "" {
		return nil, &Error{Label: label, Input: text, Msg: "empty input"}
	}
	bs, err := bindingsParser().ParseString("", text)
	if err != nil {
		return nil, lw.wrapParse(err)
	}
	var out []Binding
	seen := map[string]bool{}
	for _, b := range bs.List {
		if seen[b.Name] {
			return nil, lw.fail(b.Pos, "%s is given twice", b.Name)
		}
		seen[b.Name] = true
		v, err := lw.choice(b.Value)
		if err != nil {
			return nil, err
		}
		c, ok := constant(v)
		if !ok {
			return nil, lw.fail(b.Value.Pos, "the value of %s must be a constant", b.Name)
		}
		out = append(out, Binding{b.Name, c})
	}
	return out, nil
}

// Lengths reads n comma-separated positive sizes such as "2", "a" or "pi/3".
func Lengths(label, text string, n int, env series.Env) ([]series.Coef, error) {
	lw := &lowerer{label: label, input: text, env: env}
	parts := strings.Split(text, ",")
	if len(parts) != n {
		return nil, &Error{Label: label, Input: text, Offset: len(text), Msg: fmt.Sprintf("expected %d comma-separated values, found %d", n, len(parts))}
	}
	var out []series.Coef
	off := 0
	for _, p := range parts {
		f, err := Expression(label, p, env)
		if err != nil {
			var pe *Error
			if errors.As(err, &pe) {
				pe.Input, pe.Offset = text, pe.Offset+off
			}
			return nil, err
		}
		c, ok := constant(value{f: f})
		if !ok {
			return nil, lw.fail(lexer.Position{Offset: off}, "a size must be a constant")
		}
		if !series.Positive(c) {
			lead := off + len(p) - len(strings.TrimLeft(p, " "))
			return nil, lw.fail(lexer.Position{Offset: lead}, "a size must be positive, not %s", c.Text())
		}
		out = append(out, c)
		off += len(p) + 1
	}
	return out, nil
}

// Fix reads "u(R0, THETA0) = V": a value of u at a point given in polar
// coordinates, used to pin a free additive constant.
func Fix(text string, env series.Env) (r, theta, v series.Coef, err error) {
	return FixIn("u", text, env)
}

// FixIn is Fix for an unknown with another name (see Unknown).
func FixIn(unknown, text string, env series.Env) (r, theta, v series.Coef, err error) {
	lw := &lowerer{label: "--fix", input: text, env: env, unknown: unknown}
	st, err := lw.statement()
	if err != nil {
		return
	}
	at := st.Left.Cond.Left.Left.Left
	var c *call
	if st.Left.Then == nil && len(st.Left.Cond.Rest) == 0 && len(st.Left.Cond.Left.Rest) == 0 && len(st.Left.Cond.Left.Left.Rest) == 0 &&
		at.Power != nil && at.Power.Exp == nil && at.Power.Base.Atom != nil {
		c = at.Power.Base.Atom.Call
	}
	if st.Side != nil || st.Eq == nil || c == nil || c.Name != lw.unk() || len(c.Args) != 2 {
		err = lw.fail(st.Pos, `write the pinned value as u(r, theta) = v, e.g. "u(0, 0) = 0"`)
		return
	}
	var vals [3]series.Coef
	for i, node := range []*choice{c.Args[0], c.Args[1], st.Eq.Right} {
		val, e := lw.choice(node)
		if e != nil {
			err = e
			return
		}
		k, ok := constant(val)
		if !ok {
			err = lw.fail(node.Pos, "expected a constant")
			return
		}
		vals[i] = k
	}
	return vals[0], vals[1], vals[2], nil
}

// Vertices reads a polygon's corners, "X1,Y1 X2,Y2 …": pairs separated by
// spaces, each coordinate a constant (a number, pi/3, a parameter). Offsets
// are where each vertex starts in text, for a caret under a faulty one.
func Vertices(label, text string, env series.Env) (xs, ys []series.Coef, offsets []int, err error) {
	lw := &lowerer{label: label, input: text, env: env}
	for off := 0; off < len(text); {
		if text[off] == ' ' || text[off] == '\t' {
			off++
			continue
		}
		end := off
		for end < len(text) && text[end] != ' ' && text[end] != '\t' {
			end++
		}
		pair := text[off:end]
		x, y, ok := strings.Cut(pair, ",")
		if !ok || strings.Contains(y, ",") {
			return nil, nil, nil, lw.fail(lexer.Position{Offset: off}, "a vertex is X,Y (two coordinates, a comma between them, no spaces), not %q", pair)
		}
		var cs [2]series.Coef
		for i, part := range []struct {
			text string
			at   int
		}{{x, off}, {y, off + len(x) + 1}} {
			f, err := Expression(label, part.text, env)
			if err != nil {
				var pe *Error
				if errors.As(err, &pe) {
					pe.Input, pe.Offset = text, pe.Offset+part.at
				}
				return nil, nil, nil, err
			}
			c, ok := constant(value{f: f})
			if !ok {
				return nil, nil, nil, lw.fail(lexer.Position{Offset: part.at}, "a coordinate must be a constant")
			}
			cs[i] = c
		}
		xs, ys, offsets = append(xs, cs[0]), append(ys, cs[1]), append(offsets, off)
		off = end
	}
	if len(xs) < 3 {
		return nil, nil, nil, lw.fail(lexer.Position{Offset: len(text)}, "a polygon needs at least 3 vertices, found %d", len(xs))
	}
	return xs, ys, offsets, nil
}

// HoleSpec is a hole as given: a circle (X, Y, R) or a polygon's vertices.
type HoleSpec struct {
	Polygon     bool
	Ellipse     bool        // "ellipse CX,CY,A,B": semi-axes A along x, B along y
	X, Y, R     series.Coef // the centre; a circle's radius
	A, B        series.Coef // an ellipse's semi-axes
	XS, YS      []series.Coef
	Offsets     []int // where each polygon vertex starts in the text
	VertexStart int   // where the vertices start
}

// holeShapes are the words a hole starts with and the sizes that follow
// (polygon aside: its vertices).
var holeShapes = map[string][]string{
	"circle":  {"CX", "CY", "R"},
	"ellipse": {"CX", "CY", "A", "B"},
}

// HoleOf reads a hole: "circle CX,CY,R", "ellipse CX,CY,A,B" (semi-axes
// along x and y) or "polygon X1,Y1 X2,Y2 …".
func HoleOf(label, text string, env series.Env) (HoleSpec, error) {
	lw := &lowerer{label: label, input: text, env: env}
	trimmed := strings.TrimLeft(text, " \t")
	lead := len(text) - len(trimmed)
	word, rest, _ := strings.Cut(trimmed, " ")
	if word == "polygon" {
		start := lead + len(word) + 1
		xs, ys, offs, err := Vertices(label, rest, env)
		if err != nil {
			var pe *Error
			if errors.As(err, &pe) {
				pe.Input, pe.Offset = text, pe.Offset+start
			}
			return HoleSpec{}, err
		}
		for i := range offs {
			offs[i] += start
		}
		return HoleSpec{Polygon: true, XS: xs, YS: ys, Offsets: offs, VertexStart: start}, nil
	}
	names, ok := holeShapes[word]
	if !ok {
		return HoleSpec{}, lw.fail(lexer.Position{Offset: lead}, "a hole is \"circle CX,CY,R\", \"ellipse CX,CY,A,B\" or \"polygon X1,Y1 X2,Y2 ...\", not %q", word)
	}
	off := lead + len(word) + 1
	parts := strings.Split(rest, ",")
	if len(parts) != len(names) {
		return HoleSpec{}, lw.fail(lexer.Position{Offset: len(text)}, "%q takes %s: expected %d comma-separated values, found %d", word, strings.Join(names, ","), len(names), len(parts))
	}
	cs := make([]series.Coef, len(parts))
	for i, p := range parts {
		f, err := Expression(label, p, env)
		if err != nil {
			var pe *Error
			if errors.As(err, &pe) {
				pe.Input, pe.Offset = text, pe.Offset+off
			}
			return HoleSpec{}, err
		}
		c, ok := constant(value{f: f})
		if !ok {
			return HoleSpec{}, lw.fail(lexer.Position{Offset: off}, "a hole's centre and sizes must be constants")
		}
		if i >= 2 && !series.Positive(c) {
			return HoleSpec{}, lw.fail(lexer.Position{Offset: off + len(p) - len(strings.TrimLeft(p, " "))}, "a hole's %s must be positive, not %s", map[bool]string{true: "radius", false: "semi-axis"}[word == "circle"], c.Text())
		}
		cs[i] = c
		off += len(p) + 1
	}
	if word == "ellipse" {
		return HoleSpec{Ellipse: true, X: cs[0], Y: cs[1], A: cs[2], B: cs[3]}, nil
	}
	return HoleSpec{X: cs[0], Y: cs[1], R: cs[2]}, nil
}
