package parse

import (
	"errors"
	"fmt"
	"math/big"
	"sort"
	"strconv"
	"strings"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"

	"psol/series"
	"psol/series/cart"
)

// lowerer turns the private syntax tree into series values; it is the only
// place that knows both.
type lowerer struct {
	label, input string
	env          series.Env
	clauses      bool   // a second clause ("u = const, flux = Q") is allowed: conditions only
	work         int    // term products done so far (see MaxWork)
	unknown      string // the unknown's name, "u" unless the equation names another (lap(T))
	points       bool   // delta(...) is allowed: the equation's source only
}

// unk is the unknown's name.
func (lw *lowerer) unk() string {
	if lw.unknown == "" {
		return "u"
	}
	return lw.unknown
}

func (lw *lowerer) fail(pos lexer.Position, format string, args ...any) error {
	return &Error{Label: lw.label, Input: lw.input, Offset: pos.Offset, Msg: fmt.Sprintf(format, args...)}
}

// wrapParse converts participle's errors to ours.
func (lw *lowerer) wrapParse(err error) error {
	var pe participle.Error
	if errors.As(err, &pe) {
		msg := pe.Message()
		msg = strings.ReplaceAll(msg, `unexpected token "<EOF>"`, "unexpected end of input")
		if strings.Contains(msg, "invalid input text") {
			msg = "unexpected character"
		}
		// The grammar's node names mean nothing to a user.
		msg = strings.NewReplacer(`expected Choice ")"`, `expected an expression or ")"`, "expected Choice", "expected an expression", "Choice", "an expression").Replace(msg)
		return &Error{Label: lw.label, Input: lw.input, Offset: pe.Position().Offset, Msg: msg}
	}
	return &Error{Label: lw.label, Input: lw.input, Msg: err.Error()}
}

func (lw *lowerer) choice(c *choice) (value, error) {
	if c.Then == nil {
		if len(c.Cond.Rest) > 0 {
			return value{}, lw.fail(c.Cond.Rest[0].Pos, "a comparison belongs inside cond ? a : b")
		}
		return lw.additive(c.Cond.Left)
	}
	lo, hi, err := lw.interval(c.Cond)
	numeric := errors.Is(err, errNotInterval)
	if err != nil && !numeric {
		return value{}, err
	}
	a, err := lw.choice(c.Then)
	if err != nil {
		return value{}, err
	}
	b, err := lw.choice(c.Else)
	if err != nil {
		return value{}, err
	}
	if a.hasUnknown() || b.hasUnknown() {
		return value{}, lw.fail(c.Pos, "%s may not appear inside cond ? a : b", lw.unk())
	}
	if err := lw.noPoints(a, c.Then.Pos, "inside cond ? a : b"); err != nil {
		return value{}, err
	}
	if err := lw.noPoints(b, c.Else.Pos, "inside cond ? a : b"); err != nil {
		return value{}, err
	}
	if numeric {
		return lw.numericChoice(c, a, b)
	}
	return value{f: series.Piecewise(lo, hi, a.f, b.f)}, nil
}

// errNotInterval marks a condition without θ (x < 1/2, r > 1): it is
// evaluated numerically instead of as exact pieces in θ.
var errNotInterval = errors.New("not an interval of theta")

// numericChoice is cond ? a : b with a condition without θ (x < 1/2,
// r > 1): a remainder evaluated in float64.
func (lw *lowerer) numericChoice(c *choice, a, b value) (value, error) {
	sides := []*additive{c.Cond.Left}
	var ops []string
	for _, t := range c.Cond.Rest {
		sides, ops = append(sides, t.Right), append(ops, t.Op)
	}
	var fields []series.Field
	for _, sd := range sides {
		v, err := lw.additive(sd)
		if err != nil {
			return value{}, err
		}
		if v.hasUnknown() {
			return value{}, lw.fail(sd.Pos, "%s may not appear in a condition", lw.unk())
		}
		if err := lw.noPoints(v, sd.Pos, "in a condition"); err != nil {
			return value{}, err
		}
		fields = append(fields, v.f)
	}
	if f, ok := stepSource(lw.points, ops, fields, a.f, b.f); ok {
		return value{f: f}, nil
	}
	return value{f: series.Choose(ops, fields, a.f, b.f)}, nil
}

// stepSource reads, in a source, `l < r ? a : b` with l − r linear in x
// and y and constant branches as b + (a − b)·step(r − l) (> and >= as
// step(l − r)): a conductor heated on one side of a line, whose particular
// solution is closed (ansatz.Kink, a step). As a choice psol refused it.
func stepSource(inSource bool, ops []string, sides []series.Field, a, b series.Field) (series.Field, bool) {
	if !inSource || len(ops) != 1 || !a.IsExact() || !b.IsExact() {
		return series.Field{}, false
	}
	if _, ok := a.Exact.Const(); !ok {
		return series.Field{}, false
	}
	if _, ok := b.Exact.Const(); !ok {
		return series.Field{}, false
	}
	l := sides[1].Add(sides[0].Neg()) // r − l: positive where l < r
	switch ops[0] {
	case "<", "<=":
	case ">", ">=":
		l = l.Neg()
	default:
		return series.Field{}, false
	}
	if !l.IsExact() || l.IsPiecewise() {
		return series.Field{}, false
	}
	if p, err := cart.FromPolar(l.Exact); err != nil || p.Degree() != 1 {
		return series.Field{}, false
	}
	step, jump := series.Kept("step", l), a.Add(b.Neg())
	if c, _ := jump.Exact.Const(); !c.Equal(series.IntCoef(1)) {
		step = step.Mul(jump)
	}
	return b.Add(step), true
}

// interval reads a condition on θ, such as "theta < pi" or "0 < theta < pi/2",
// as [lo·π, hi·π) within [0, 2π).
func (lw *lowerer) interval(c *compare) (lo, hi *big.Rat, err error) {
	if len(c.Rest) == 0 || len(c.Rest) > 2 {
		return nil, nil, lw.fail(c.Pos, "the condition compares theta with break points, as in 0 < theta < pi/2")
	}
	sides := []*additive{c.Left}
	for _, t := range c.Rest {
		sides = append(sides, t.Right)
	}
	at := -1 // which side is θ
	var fail error
	bounds := make([]*big.Rat, len(sides))
	for i, sd := range sides {
		v, err := lw.additive(sd)
		if err != nil {
			return nil, nil, err
		}
		if v.f.IsExact() && v.f.Exact.Equal(series.Theta) {
			if at >= 0 { // theta < theta: no break point to compare with
				fail = lw.fail(sd.Pos, "a condition compares theta with constants, and names theta once")
				continue
			}
			at = i
			continue
		}
		k, ok := constant(v)
		if !ok {
			fail = lw.fail(sd.Pos, "a condition compares theta with constants")
			continue
		}
		q, err := k.Div(series.SymCoef(series.Pi))
		r, isRat := q.Rat()
		if err != nil || !isRat {
			fail = lw.fail(sd.Pos, "break points must be rational multiples of pi")
			continue
		}
		bounds[i] = r
	}
	if at < 0 { // x < 1/2 and the like: no θ
		return nil, nil, errNotInterval
	}
	if fail != nil {
		return nil, nil, fail
	}
	less := func(op string) bool { return op == "<" || op == "<=" }
	// Each comparison is between θ and a bound.
	lo, hi = new(big.Rat), big.NewRat(2, 1)
	for i, t := range c.Rest {
		left, right := i, i+1
		switch {
		case left == at && less(t.Op): // θ < c
			hi = series.MinRat(hi, bounds[right])
		case left == at: // θ > c
			lo = series.MaxRat(lo, bounds[right])
		case right == at && less(t.Op): // c < θ
			lo = series.MaxRat(lo, bounds[left])
		case right == at: // c > θ
			hi = series.MinRat(hi, bounds[left])
		default:
			return nil, nil, lw.fail(t.Pos, "each comparison must involve theta")
		}
	}
	if lo.Cmp(hi) >= 0 {
		return nil, nil, lw.fail(c.Pos, "the condition holds nowhere in 0 <= theta < 2*pi")
	}
	return lo, hi, nil
}

func (lw *lowerer) additive(a *additive) (value, error) {
	v, err := lw.product(a.Left)
	if err != nil {
		return value{}, err
	}
	terms := []value{v}
	for _, t := range a.Rest {
		w, err := lw.product(t.Right)
		if err != nil {
			return value{}, err
		}
		if t.Op == "-" {
			w = w.scale(series.IntCoef(-1))
		}
		terms = append(terms, w)
	}
	// A sum's numbers within the bound too: 1/700^900 + 700^900 has a
	// 17012-bit numerator, and its print did not read back (the fuzzer).
	sum := total(terms)
	if sum.bits() > MaxBits {
		return value{}, lw.fail(a.Pos, "a number in the sum would exceed %d bits", MaxBits)
	}
	return sum, nil
}

func (lw *lowerer) product(p *product) (value, error) {
	v, err := lw.unary(p.Left)
	if err != nil {
		return value{}, err
	}
	vpos := p.Left.Pos
	for _, t := range p.Rest {
		w, err := lw.unary(t.Right)
		if err != nil {
			return value{}, err
		}
		if t.Op == "*" {
			v, err = lw.mul(v, vpos, w, t.Right.Pos)
		} else {
			v, err = lw.div(v, w, t.Right.Pos)
		}
		if err != nil {
			return value{}, err
		}
	}
	return v, nil
}

// mul is v·w, its numbers within MaxBits. The bound is on the result, of
// every kind of number in it (a point source's strength and an unknown's
// factor too): what psol prints must read back, and a bound on the
// factors' bits together refused the print of a result within it
// (1/700^900 + 1 prints as N/D, D·A's bits one more than D's).
func (lw *lowerer) mul(v value, vpos lexer.Position, w value, wpos lexer.Position) (value, error) {
	r, err := lw.times(v, vpos, w, wpos)
	if err == nil && r.bits() > MaxBits {
		return value{}, lw.fail(wpos, "a number in the product would exceed %d bits", MaxBits)
	}
	return r, err
}

func (lw *lowerer) times(v value, vpos lexer.Position, w value, wpos lexer.Position) (value, error) {
	switch {
	case v.hasUnknown() && w.hasUnknown():
		return value{}, lw.fail(wpos, "%s appears in a product with itself; the problem must be linear", lw.unk())
	case v.hasUnknown():
		c, ok := constant(w)
		if !ok {
			return value{}, lw.fail(wpos, "the factor of %s must be a constant", lw.unknownName(v))
		}
		return v.scale(c), nil
	case w.hasUnknown():
		c, ok := constant(v)
		if !ok {
			return value{}, lw.fail(vpos, "the factor of %s must be a constant", lw.unknownName(w))
		}
		return w.scale(c), nil
	}
	if len(v.f.Points) > 0 || len(w.f.Points) > 0 {
		return lw.scalePoints(v, vpos, w, wpos)
	}
	if v.f.Exact.Size()*w.f.Exact.Size() > MaxSize {
		return value{}, lw.fail(wpos, "the expanded expression would exceed %d terms", MaxSize)
	}
	if lw.work += v.f.Exact.Size() * w.f.Exact.Size(); lw.work > MaxWork {
		return value{}, lw.fail(wpos, "expanding the expression would take more than %d term products (the work budget): a long product, or a high power of a sum, expands into too many terms (write repeated factors as one power)", MaxWork)
	}
	return lw.printable(value{f: v.f.Mul(w.f)}, wpos)
}

// printable refuses a result with an exponent beyond the bound on those
// written in the input, so that everything printed reads back.
func (lw *lowerer) printable(v value, pos lexer.Position) (value, error) {
	if v.f.Exact.MaxExponent() > MaxExponent {
		return value{}, lw.fail(pos, "an exponent in the result would exceed the bound %d", MaxExponent)
	}
	return v, nil
}

func (lw *lowerer) unknownName(v value) string {
	switch {
	case !v.lap.IsZero():
		return "lap(" + lw.unk() + ")"
	case !v.dn.IsZero():
		return "dn(" + lw.unk() + ")"
	}
	return lw.unk()
}

// div is v/w, its numbers within MaxBits as mul's: A/70000^900/7^700 built
// a 16455-bit denominator that its own print, 1/N*A, could not read back
// (found by the fuzzer); so did delta(x,y)/70000^900/7^700.
func (lw *lowerer) div(v, w value, wpos lexer.Position) (value, error) {
	r, err := lw.quotient(v, w, wpos)
	if err == nil && r.bits() > MaxBits {
		return value{}, lw.fail(wpos, "a number in the quotient would exceed %d bits", MaxBits)
	}
	return r, err
}

func (lw *lowerer) quotient(v, w value, wpos lexer.Position) (value, error) {
	if w.hasUnknown() {
		return value{}, lw.fail(wpos, "cannot divide by %s", lw.unknownName(w))
	}
	if v.hasUnknown() {
		c, ok := constant(w)
		if !ok {
			return value{}, lw.fail(wpos, "the factor of %s must be a constant", lw.unknownName(v))
		}
		inv, err := series.IntCoef(1).Div(c)
		if err != nil {
			return value{}, lw.fail(wpos, "division by zero")
		}
		return v.scale(inv), nil
	}
	if err := lw.noPoints(w, wpos, "in a divisor"); err != nil {
		return value{}, err
	}
	if len(v.f.Points) > 0 {
		c, ok := constant(w)
		if !ok {
			return value{}, lw.fail(wpos, "a point source's strength is a constant: divide delta(...) by a number or a parameter, not by a function of x and y")
		}
		inv, err := series.IntCoef(1).Div(c)
		if err != nil {
			return value{}, lw.fail(wpos, "division by zero")
		}
		return v.scale(inv), nil
	}
	f, err := v.f.Div(w.f)
	if err != nil {
		return value{}, lw.fail(wpos, "division by zero")
	}
	return value{f: f}, nil
}

func (lw *lowerer) unary(u *unary) (value, error) {
	if u.Inner != nil {
		v, err := lw.unary(u.Inner)
		if err != nil || u.Sign == "+" {
			return v, err
		}
		return v.scale(series.IntCoef(-1)), nil
	}
	return lw.power(u.Power.Base, u.Power.Exp)
}

func (lw *lowerer) power(b *primary, exp *unary) (value, error) {
	v, err := lw.primary(b)
	if err != nil || exp == nil {
		return v, err
	}
	return lw.raise(v, b.Pos, exp)
}

func (lw *lowerer) raise(v value, vpos lexer.Position, exp *unary) (value, error) {
	e, err := lw.unary(exp)
	if err != nil {
		return value{}, err
	}
	if v.hasUnknown() || e.hasUnknown() {
		return value{}, lw.fail(vpos, "%s may not be raised to a power; the problem must be linear", lw.unk())
	}
	if err := lw.noPoints(v, vpos, "raised to a power"); err != nil {
		return value{}, err
	}
	if err := lw.noPoints(e, exp.Pos, "in an exponent"); err != nil {
		return value{}, err
	}
	c, ok := constant(e)
	q, isRat := c.Rat()
	if !ok || !isRat {
		if base, isConst := constant(v); isConst && base.Equal(series.IntCoef(-1)) && ok && c.Equal(series.IndexCoef) {
			return value{f: series.ExactField(series.Const(series.SignCoef))}, nil // (−1)^n
		}
		f, err := series.PowField(v.f, e.f)
		if err != nil {
			return value{}, lw.fail(vpos, "%v", err)
		}
		return value{f: f}, nil
	}
	if new(big.Int).Abs(q.Num()).Cmp(big.NewInt(MaxExponent)) > 0 || q.Denom().Cmp(big.NewInt(MaxExponent)) > 0 {
		return value{}, lw.fail(exp.Pos, "exponent %s is beyond the bound %d on its numerator and denominator", q.RatString(), MaxExponent)
	}
	expands := v.f.Exact.Size() > 1 || v.f.Exact.MaxMode() > 0
	if q.IsInt() && new(big.Int).Abs(q.Num()).Int64() > MaxSumPower && expands {
		return value{}, lw.fail(exp.Pos, "a whole power of an expression that expands (a sum, x or y, a cosine) takes an exponent of at most ±%d", MaxSumPower)
	}
	if q.IsInt() && int64(v.f.Exact.Bits())*new(big.Int).Abs(q.Num()).Int64() > MaxBits {
		return value{}, lw.fail(exp.Pos, "a number in this power would exceed %d bits", MaxBits)
	}
	if q.IsInt() && q.Sign() > 0 && v.f.IsExact() && expands {
		// Expand step by step so that a blow-up is caught before it happens.
		acc := v
		for i := int64(1); i < q.Num().Int64(); i++ {
			if acc, err = lw.mul(acc, vpos, v, vpos); err != nil {
				return value{}, err
			}
		}
		return acc, nil
	}
	if _, isConst := constant(v); q.IsInt() && q.Sign() < 0 && isConst && expands {
		// A sum of parameters to a negative power is 1/(its expansion):
		// expanded within the work budget as a positive power is
		// ((B+A+C+D)^(-49) took 8 s and printed a megabyte).
		acc := v
		for i := int64(1); i < -q.Num().Int64(); i++ {
			if acc, err = lw.mul(acc, vpos, v, vpos); err != nil {
				return value{}, err
			}
		}
		v, q = acc, big.NewRat(-1, 1)
	}
	f, err := v.f.Pow(q)
	if err != nil {
		return value{}, lw.fail(vpos, "%v", err)
	}
	return lw.printable(value{f: f}, exp.Pos)
}

func (lw *lowerer) primary(p *primary) (value, error) {
	if p.Atom != nil {
		return lw.atom(p.Atom)
	}
	n, err := lw.number(*p.Number, p.Pos)
	if err != nil {
		return value{}, err
	}
	v := value{f: series.ExactField(series.Const(series.RatCoef(n)))}
	if p.Times == nil {
		return v, nil
	}
	w, err := lw.atom(p.Times.Atom)
	if err == nil && p.Times.Exp != nil {
		w, err = lw.raise(w, p.Times.Pos, p.Times.Exp)
	}
	if err != nil {
		return value{}, err
	}
	return lw.mul(v, p.Pos, w, p.Times.Pos)
}

func (lw *lowerer) number(text string, pos lexer.Position) (*big.Rat, error) {
	if i := strings.IndexAny(text, "eE"); i >= 0 {
		// Decimal, as big.Rat reads it: fmt.Sscan would take 0700800 for octal.
		e, err := strconv.Atoi(text[i+1:])
		if err != nil || e > MaxDecimalExponent || e < -MaxDecimalExponent {
			return nil, lw.fail(pos, "the exponent of %s is beyond ±%d", text, MaxDecimalExponent)
		}
	}
	n, ok := new(big.Rat).SetString(text)
	if !ok {
		return nil, lw.fail(pos, "malformed number %s", text)
	}
	return n, nil
}

var (
	cosTheta = series.Trig(1, false)
	sinTheta = series.Trig(1, true)
)

// variables are the coordinates, in the polar form the algebra keeps.
var variables = map[string]series.Sum{
	"r":     series.R,
	"theta": series.Theta,
	"θ":     series.Theta,
	"x":     series.R.Mul(cosTheta),
	"y":     series.R.Mul(sinTheta),
	"pi":    series.Const(series.SymCoef(series.Pi)),
	"π":     series.Const(series.SymCoef(series.Pi)),
}

// reserved names may not be parameters.
var reserved = map[string]string{
	"lap": "lap needs its argument: lap(u)",
	"dn":  "dn needs its argument: dn(u)",
}

func (lw *lowerer) atom(a *atom) (value, error) {
	switch {
	case a.Group != nil:
		return lw.choice(a.Group)
	case a.Lap != nil:
		if a.LapOf != lw.unk() {
			return value{}, lw.fail(a.Pos, "%s applies to the unknown %s only", *a.Lap, lw.unk())
		}
		return value{lap: series.IntCoef(1)}, nil
	case a.Call != nil:
		return lw.call(a.Call)
	case a.Sum != nil:
		return lw.series(a.Sum)
	}
	name := *a.Name
	if s, ok := variables[name]; ok {
		return value{f: series.ExactField(s)}, nil
	}
	if name == lw.unk() {
		return value{u: series.IntCoef(1)}, nil
	}
	if name == "u" { // the output's name for the unknown, whatever the input calls it
		return value{}, lw.fail(a.Pos, "u cannot be a parameter: psol writes the unknown (here %s) as u", lw.unk())
	}
	if msg, ok := reserved[name]; ok {
		return value{}, lw.fail(a.Pos, "%s", msg)
	}
	if series.IsFunction(name) {
		return value{}, lw.fail(a.Pos, "%s needs an argument in brackets: %s(...)", name, name)
	}
	if c, ok := lw.env[name]; ok {
		return value{f: series.ExactField(series.Const(c))}, nil
	}
	return value{f: series.ExactField(series.Const(series.SymCoef(series.Param(name))))}, nil
}

func (lw *lowerer) call(c *call) (value, error) {
	if c.Name == "delta" || c.Name == "δ" {
		return lw.delta(c)
	}
	if c.Name == "max" || c.Name == "min" {
		return lw.extremum(c)
	}
	if len(c.Args) != 1 {
		return value{}, lw.fail(c.Pos, "%s takes one argument, not %d", c.Name, len(c.Args))
	}
	arg := c.Args[0]
	switch c.Name {
	case "lap", "dn":
		if bareName(arg) != lw.unk() {
			return value{}, lw.fail(arg.Pos, "%s applies to the unknown %s only", c.Name, lw.unk())
		}
		if c.Name == "lap" {
			return value{lap: series.IntCoef(1)}, nil
		}
		return value{dn: series.IntCoef(1)}, nil
	}
	if !series.IsFunction(c.Name) {
		return value{}, lw.fail(c.Pos, "unknown function %q (known: %s)", c.Name, strings.Join(knownFunctions(), " "))
	}
	v, err := lw.argument(c.Name, arg)
	if err != nil {
		return value{}, err
	}
	f, err := lw.apply(c.Name, v)
	if err != nil {
		return value{}, lw.fail(arg.Pos, "%v", err)
	}
	return value{f: f}, nil
}

// apply is series.Apply, except that in a source abs of a linear form in x
// and y is kept whole (series.Kept): its particular solution is the kink's
// closed form. Apply would expand abs(x) = abs(r·cos θ) into pieces in θ,
// and a source in pieces has no particular solution psol can find, while
// abs(x − 0.5), which Apply keeps, had one: max(x, 0) was refused and
// max(x, 0.1) solved.
func (lw *lowerer) apply(fn string, f series.Field) (series.Field, error) {
	if fn == "abs" && lw.points && f.IsExact() && !f.IsPiecewise() {
		if p, err := cart.FromPolar(f.Exact); err == nil && p.Degree() == 1 {
			return series.Kept(fn, f), nil
		}
	}
	return series.Apply(fn, f)
}

// argument lowers a function's argument: a function of position alone
// (no unknown, which would make the problem nonlinear, and no point source).
func (lw *lowerer) argument(name string, arg *choice) (series.Field, error) {
	v, err := lw.choice(arg)
	if err != nil {
		return series.Field{}, err
	}
	if v.hasUnknown() {
		return series.Field{}, lw.fail(arg.Pos, "%s may not appear inside %s(...); the problem must be linear", lw.unk(), name)
	}
	if err := lw.noPoints(v, arg.Pos, "inside "+name+"(...)"); err != nil {
		return series.Field{}, err
	}
	return v.f, nil
}

// extremum lowers max(a, b) and min(a, b) to (a + b ± abs(a − b))/2,
// exact for every a and b: of linear forms it is a kink, whose particular
// solution is closed (ansatz.Kink); of others, abs's pieces or quadrature.
func (lw *lowerer) extremum(c *call) (value, error) {
	if len(c.Args) != 2 {
		return value{}, lw.fail(c.Pos, "%s takes two arguments, as in %s(x, 1 - y); not %d", c.Name, c.Name, len(c.Args))
	}
	var f [2]series.Field
	for i, arg := range c.Args {
		var err error
		if f[i], err = lw.argument(c.Name, arg); err != nil {
			return value{}, err
		}
	}
	gap, err := lw.apply("abs", f[0].Add(f[1].Neg()))
	if err != nil {
		return value{}, lw.fail(c.Pos, "%v", err)
	}
	if c.Name == "min" {
		gap = gap.Neg()
	}
	return value{f: f[0].Add(f[1]).Add(gap).Scale(series.RatCoef(big.NewRat(1, 2)))}, nil
}

func knownFunctions() []string {
	var names []string
	for _, n := range []string{"sin", "cos", "tan", "exp", "log", "ln", "sqrt", "abs", "step", "sinh", "cosh", "tanh", "atan"} {
		if series.IsFunction(n) {
			names = append(names, n)
		}
	}
	names = append(names, "max", "min") // of two arguments
	sort.Strings(names)
	return names
}

func (lw *lowerer) series(s *sumNode) (value, error) {
	if s.Index != series.Index {
		return value{}, lw.fail(s.Pos, "the index of a sum is %s", series.Index)
	}
	from, err := lw.whole(s.From, s.Pos)
	if err != nil {
		return value{}, err
	}
	if s.To != "inf" {
		return value{}, lw.fail(s.Pos, "a sum runs to inf: sum(n=1..inf, ...)")
	}
	var skip []int
	for _, k := range s.Skip {
		if k.Index != series.Index {
			return value{}, lw.fail(k.Pos, "the index of a sum is %s", series.Index)
		}
		v, err := lw.whole(k.Value, k.Pos)
		if err != nil {
			return value{}, err
		}
		upto := v
		if k.Upto != "" {
			if upto, err = lw.whole(k.Upto, k.Pos); err != nil {
				return value{}, err
			}
			if upto < v {
				return value{}, lw.fail(k.Pos, "a run of skipped terms goes up: n != %d..%d is empty", v, upto)
			}
		}
		for n := v; n <= upto; n++ {
			skip = append(skip, n)
		}
	}
	body, err := lw.choice(s.Body)
	if err != nil {
		return value{}, err
	}
	if body.hasUnknown() {
		return value{}, lw.fail(s.Body.Pos, "%s may not appear inside a sum", lw.unk())
	}
	if err := lw.noPoints(body, s.Body.Pos, "inside a sum"); err != nil {
		return value{}, err
	}
	return value{f: series.SeriesField(from, skip, body.f)}, nil
}

func (lw *lowerer) whole(text string, pos lexer.Position) (int, error) {
	n, err := lw.number(text, pos)
	if err != nil || !n.IsInt() || !n.Num().IsInt64() || n.Num().Int64() > 1<<20 {
		return 0, lw.fail(pos, "expected a whole number, not %s", text)
	}
	return int(n.Num().Int64()), nil
}
