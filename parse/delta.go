package parse

import (
	"github.com/alecthomas/participle/v2/lexer"

	"psol/series"
)

// delta lowers delta(x - X0, y - Y0) (also δ(…)): a unit source at the
// point (X0, Y0), the Dirac delta of the trade. Each argument must be the
// coordinate less a constant, so that the point is explicit; a strength
// comes from the product the call stands in.
func (lw *lowerer) delta(c *call) (value, error) {
	if !lw.points {
		return value{}, lw.fail(c.Pos, "a point source %s(...) belongs in the equation's source; boundary data are functions on the sides", c.Name)
	}
	if len(c.Args) != 2 {
		return value{}, lw.fail(c.Pos, "%s takes the point's two offsets, %s(x - X0, y - Y0), not %d arguments", c.Name, c.Name, len(c.Args))
	}
	var at [2]series.Coef
	for i, name := range []string{"x", "y"} {
		arg := c.Args[i]
		v, err := lw.choice(arg)
		if err != nil {
			return value{}, err
		}
		off, ok := coordinateOffset(v, name)
		if !ok {
			return value{}, lw.fail(arg.Pos, "the %s argument of %s is %s less a constant (%s - X0)", []string{"first", "second"}[i], c.Name, name, name)
		}
		at[i] = off
	}
	src := series.PointSource{Q: series.IntCoef(1), X: at[0], Y: at[1]}
	return value{f: series.Field{Points: []series.PointSource{src}}}, nil
}

// coordinateOffset reports v = name − X0 with X0 constant, and X0.
func coordinateOffset(v value, name string) (series.Coef, bool) {
	if v.hasUnknown() || !v.f.IsExact() || len(v.f.Points) > 0 {
		return series.Coef{}, false
	}
	rest := variables[name].Sub(v.f.Exact)
	if rest.IsZero() {
		return series.Coef{}, true
	}
	return rest.Const()
}

// noPoints refuses a point source where only functions may stand.
func (lw *lowerer) noPoints(v value, pos lexer.Position, where string) error {
	if len(v.f.Points) == 0 {
		return nil
	}
	return lw.fail(pos, "a point source delta(...) may not stand %s: it is a distribution, not a function; give it a constant strength, Q*delta(x - X0, y - Y0)", where)
}

// scalePoints is a product with a point source in it: the other factor must
// be a constant (the strength), and must not be a point source itself.
func (lw *lowerer) scalePoints(v value, vpos lexer.Position, w value, wpos lexer.Position) (value, error) {
	if len(v.f.Points) > 0 && len(w.f.Points) > 0 {
		return value{}, lw.fail(wpos, "a product of two point sources is not defined")
	}
	pts, other, pos := v, w, wpos
	if len(w.f.Points) > 0 {
		pts, other, pos = w, v, vpos
	}
	c, ok := constant(other)
	if !ok {
		return value{}, lw.fail(pos, "a point source's strength is a constant: write the value of this factor at the point, times delta(...)")
	}
	return pts.scale(c), nil
}
