package series

import (
	"errors"
	"fmt"
	"math"
	"math/big"
	"sort"
	"strings"
)

// Piece is a field on the angular interval [From·π, To·π).
type Piece struct {
	From, To *big.Rat
	Value    Field // has no pieces of its own
}

// Piecewise builds the field equal to a where θ ∈ [lo·π, hi·π) and to b elsewhere on [0, 2π).
func Piecewise(lo, hi *big.Rat, a, b Field) Field {
	cuts := []*big.Rat{lo, hi}
	pa, pb := a.piecesOn(cuts), b.piecesOn(cuts)
	out := make([]Piece, len(pb))
	for i, p := range pb {
		inside := p.From.Cmp(lo) >= 0 && p.To.Cmp(hi) <= 0
		out[i] = p
		if inside {
			out[i].Value = valueAt(pa, p.From)
		}
	}
	return Field{Pieces: merge(out)}
}

var (
	ratZero = big.NewRat(0, 1)
	ratTwo  = big.NewRat(2, 1)
)

// piecesOn lists f's pieces refined at the given cuts (f need not be piecewise).
func (f Field) piecesOn(cuts []*big.Rat) []Piece {
	ps := f.Pieces
	if ps == nil {
		ps = []Piece{{ratZero, ratTwo, f}}
	}
	points := []*big.Rat{ratZero, ratTwo}
	for _, p := range ps {
		points = append(points, p.From, p.To)
	}
	for _, c := range cuts {
		if c.Sign() > 0 && c.Cmp(ratTwo) < 0 {
			points = append(points, c)
		}
	}
	sort.Slice(points, func(i, j int) bool { return points[i].Cmp(points[j]) < 0 })
	var out []Piece
	for i := 0; i+1 < len(points); i++ {
		if points[i].Cmp(points[i+1]) == 0 {
			continue
		}
		out = append(out, Piece{points[i], points[i+1], valueAt(ps, points[i])})
	}
	return out
}

func valueAt(ps []Piece, t *big.Rat) Field {
	for _, p := range ps {
		if p.From.Cmp(t) <= 0 && t.Cmp(p.To) < 0 {
			return p.Value
		}
	}
	return ps[len(ps)-1].Value
}

// merge joins neighbours with equal exact values.
func merge(ps []Piece) []Piece {
	var out []Piece
	for _, p := range ps {
		if n := len(out); n > 0 && out[n-1].Value.IsExact() && p.Value.IsExact() && out[n-1].Value.Exact.Equal(p.Value.Exact) {
			out[n-1].To = p.To
			continue
		}
		out = append(out, p)
	}
	return out
}

// liftPieces applies a binary operation piece by piece.
func liftPieces(f, g Field, op func(a, b Field) (Field, error)) (Field, error) {
	var cuts []*big.Rat
	for _, p := range append(append([]Piece(nil), f.Pieces...), g.Pieces...) {
		cuts = append(cuts, p.From, p.To)
	}
	pf, pg := f.piecesOn(cuts), g.piecesOn(cuts)
	out := make([]Piece, len(pf))
	for i := range pf {
		v, err := op(pf[i].Value, valueAt(pg, pf[i].From))
		if err != nil {
			return Field{}, err
		}
		out[i] = Piece{pf[i].From, pf[i].To, v}
	}
	if len(out) == 1 {
		return out[0].Value, nil
	}
	return Field{Pieces: merge(out)}, nil
}

// mapPieces applies a unary operation piece by piece.
func mapPieces(f Field, op func(Field) (Field, error)) (Field, error) {
	out := make([]Piece, 0, len(f.Pieces))
	for _, p := range f.Pieces {
		v, err := op(p.Value)
		if err != nil {
			return Field{}, err
		}
		if !v.IsPiecewise() {
			out = append(out, Piece{p.From, p.To, v})
			continue
		}
		// op split the piece again (abs of a piece): keep the sub-pieces'
		// parts inside this piece, so that pieces stay one level deep and
		// their number grows with the breaks, not exponentially with nesting.
		for _, q := range v.Pieces {
			from, to := MaxRat(p.From, q.From), MinRat(p.To, q.To)
			if from.Cmp(to) < 0 {
				out = append(out, Piece{from, to, q.Value})
			}
		}
	}
	if len(out) > MaxPieces {
		return Field{}, fmt.Errorf("the expression splits into more than %d pieces in theta", MaxPieces)
	}
	return Field{Pieces: merge(out)}, nil
}

// MaxPieces bounds the pieces in θ of one field: a work budget.
const MaxPieces = 1024

// MaxRat and MinRat are the larger and the smaller of two rationals (the
// argument itself, not a copy).
func MaxRat(a, b *big.Rat) *big.Rat {
	if a.Cmp(b) >= 0 {
		return a
	}
	return b
}

func MinRat(a, b *big.Rat) *big.Rat {
	if a.Cmp(b) <= 0 {
		return a
	}
	return b
}

// IsPiecewise reports a field given by pieces in θ.
func (f Field) IsPiecewise() bool { return f.Pieces != nil }

// ExactPieces reports whether every piece is exact.
func (f Field) ExactPieces() bool {
	for _, p := range f.Pieces {
		if !p.Value.IsExact() {
			return false
		}
	}
	return true
}

func piTimes(q *big.Rat, st style) string {
	switch {
	case q.Sign() == 0:
		return "0"
	case q.Cmp(one) == 0 && st.latex:
		return `\pi`
	case q.Cmp(one) == 0:
		return "pi"
	case st.latex:
		return SymCoef(Pi).MulRat(q).LaTeX()
	}
	return SymCoef(Pi).MulRat(q).Text()
}

// piecesText prints θ-chains that parse back: theta < A ? a : theta < B ? b : c.
func piecesText(ps []Piece) string {
	var b strings.Builder
	for i, p := range ps {
		if i == len(ps)-1 {
			b.WriteString(p.Value.Text())
			break
		}
		b.WriteString("theta < " + piTimes(p.To, textStyle) + " ? " + p.Value.Text() + " : ")
	}
	return b.String()
}

func piecesLaTeX(ps []Piece) string {
	var rows []string
	for _, p := range ps {
		v := p.Value.Text()
		if p.Value.IsExact() {
			v = p.Value.Exact.LaTeX()
		}
		rows = append(rows, v+` & `+piTimes(p.From, latexStyle)+` \le \theta < `+piTimes(p.To, latexStyle))
	}
	return `\begin{cases} ` + strings.Join(rows, ` \\ `) + ` \end{cases}`
}

// ErrPiecewise reports an operation that does not take piecewise values.
var ErrPiecewise = errors.New("piecewise values are for boundary data in theta")

// TraceField is f on the circle r = radius: an exact sum in θ, pieces of
// them, or a remainder.
func (f Field) TraceField(radius Coef) (Field, error) {
	if f.IsPiecewise() {
		return mapPieces(f, func(v Field) (Field, error) { return v.TraceField(radius) })
	}
	if !f.IsExact() {
		return f, nil // evaluated numerically on the circle
	}
	s, err := f.Exact.Trace(radius)
	return ExactField(s), err
}

// Jumps lists the discontinuities of exact pieces on the circle: the angle
// (in units of π) and the jump g(θ+) − g(θ−), periodically.
func (f Field) Jumps() []Jump {
	if !f.IsPiecewise() || !f.ExactPieces() {
		return nil
	}
	var out []Jump
	n := len(f.Pieces)
	for i, p := range f.Pieces {
		prev := f.Pieces[(i+n-1)%n]
		left, err1 := prev.Value.Exact.At(IntCoef(1), SymCoef(Pi).MulRat(prev.To))
		right, err2 := p.Value.Exact.At(IntCoef(1), SymCoef(Pi).MulRat(p.From))
		if err1 != nil || err2 != nil {
			continue
		}
		if d := right.Sub(left); !d.IsZero() {
			out = append(out, Jump{At: p.From, Size: d})
		}
	}
	return out
}

// Jump is a discontinuity of boundary data.
type Jump struct {
	At   *big.Rat // angle / π
	Size Coef
}

// floatPieces evaluates a piecewise field: θ taken in [0, 2π).
type floatPieces struct {
	ends []float64
	vals []CompiledField
}

func (f Field) compilePieces(env Env) (floatPieces, error) {
	var fp floatPieces
	for _, p := range f.Pieces {
		c, err := p.Value.Compile(env)
		if err != nil {
			return fp, err
		}
		to, _ := p.To.Float64()
		fp.ends = append(fp.ends, to*math.Pi)
		fp.vals = append(fp.vals, c)
	}
	return fp, nil
}

func (fp floatPieces) at(r, theta float64) float64 {
	t := math.Mod(theta, 2*math.Pi)
	if t < 0 {
		t += 2 * math.Pi
	}
	for i, e := range fp.ends {
		if t < e || i == len(fp.ends)-1 {
			return fp.vals[i].At(r, t) // pieces are functions of θ in [0, 2π)
		}
	}
	return math.NaN()
}

// absPieces is |s| as pieces, for s = c·r^p (ln r)^j T(mθ) (sign changes at
// the zeros of T) or s = aθ + bπ (one sign change, at θ = −bπ/a).
func absPieces(s Sum) (Field, bool) {
	ts := s.Terms()
	sign := func(c Coef) int64 {
		if q, ok := c.Rat(); ok {
			return int64(q.Sign())
		}
		if c.IsPoly() && len(c.num.t) == 1 {
			return int64(c.num.t[0].c.Sign()) // parameters count as positive
		}
		return 0
	}
	if len(ts) == 1 && ts[0].K == 0 && ts[0].M > 0 {
		t := ts[0]
		sg := sign(t.C)
		if sg == 0 {
			return Field{}, false
		}
		m := int64(t.M)
		var ps []Piece
		// Zeros of sin(mθ) at kπ/m, of cos(mθ) at (k + ½)π/m.
		offset := big.NewRat(0, 1)
		if !t.Sin {
			offset = big.NewRat(1, 2*m)
		}
		cuts := []*big.Rat{ratZero}
		for k := int64(0); k <= 2*m; k++ {
			c := new(big.Rat).Add(big.NewRat(k, m), offset)
			if c.Sign() > 0 && c.Cmp(ratTwo) < 0 {
				cuts = append(cuts, c)
			}
		}
		cuts = append(cuts, ratTwo)
		for i := 0; i+1 < len(cuts); i++ {
			mid := new(big.Rat).Quo(new(big.Rat).Add(cuts[i], cuts[i+1]), ratTwo)
			v := math.Sin(float64(m) * math.Pi * ratFloat(mid))
			if !t.Sin {
				v = math.Cos(float64(m) * math.Pi * ratFloat(mid))
			}
			piece := NewSum(t)
			if (v < 0) != (sg < 0) {
				piece = piece.Neg()
			}
			ps = append(ps, Piece{cuts[i], cuts[i+1], ExactField(piece)})
		}
		return Field{Pieces: merge(ps)}, true
	}
	// aθ + bπ
	var a, b *big.Rat
	for _, t := range ts {
		switch {
		case t.K == 1 && t.isConstExceptAngle():
			a, _ = t.C.Rat()
		case t.isConst():
			q, err := t.C.Div(SymCoef(Pi))
			if err == nil {
				b, _ = q.Rat()
			}
		default:
			return Field{}, false
		}
	}
	if a == nil || a.Sign() == 0 {
		return Field{}, false
	}
	if b == nil {
		if len(ts) != 1 {
			return Field{}, false
		}
		b = new(big.Rat)
	}
	zero := new(big.Rat).Neg(new(big.Rat).Quo(b, a))
	neg := ExactField(s.Neg())
	pos := ExactField(s)
	if zero.Sign() <= 0 || zero.Cmp(ratTwo) >= 0 { // one sign on the whole circle
		if a.Sign() > 0 == (zero.Sign() <= 0) {
			return pos, true
		}
		return neg, true
	}
	if a.Sign() > 0 {
		return Piecewise(ratZero, zero, neg, pos), true
	}
	return Piecewise(ratZero, zero, pos, neg), true
}

func (t Term) isConstExceptAngle() bool { return t.power().Sign() == 0 && t.L == 0 && t.M == 0 }

// LaTeX prints the field as LaTeX where it can, pieces as a cases block.
func (f Field) LaTeX() string {
	if len(f.Points) > 0 {
		pts := PointsLaTeX(f.Points)
		g := f
		g.Points = nil
		if g.IsExact() && g.Exact.IsZero() {
			return pts
		}
		if strings.HasPrefix(pts, "-") {
			return g.LaTeX() + " - " + pts[1:]
		}
		return g.LaTeX() + " + " + pts
	}
	switch {
	case f.IsPiecewise():
		return piecesLaTeX(f.Pieces)
	case f.IsExact():
		return f.Exact.LaTeX()
	}
	return f.expr().LaTeX()
}
