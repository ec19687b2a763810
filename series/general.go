package series

import (
	"fmt"
	"math"
	"math/big"
	"sort"
	"strconv"
	"strings"
)

// Index is the name of a series' summation index; psol reserves it.
const Index = "n"

// IndexCoef is the index n as a coefficient, for general terms.
var IndexCoef = SymCoef(Param(Index))

// SignCoef is (−1)^n.
var SignCoef = SymCoef(SignOf(Index))

// Family is a sector's angular eigenfunctions: Φ_n(θ) = sin(ν_n θ) or
// cos(ν_n θ) with ν_n = Slope·n + Offset, for n ≥ From.
type Family struct {
	Sin           bool
	Slope, Offset *big.Rat
	From          int
}

// Nu is ν_n, symbolic when n is IndexCoef.
func (f Family) Nu(n Coef) Coef { return n.MulRat(f.Slope).Add(RatCoef(f.Offset)) }

// NuAt is ν_n for a concrete n.
func (f Family) NuAt(n int) *big.Rat {
	return new(big.Rat).Add(new(big.Rat).Mul(f.Slope, big.NewRat(int64(n), 1)), f.Offset)
}

// RadialTerm is C·r^P·(ln r)^L, or C·(r/R)^ν_n when Scaled.
type RadialTerm struct {
	C      Coef
	P      *big.Rat
	L      int
	Scaled bool
}

// Series is Σ_{n ≥ From} ρ_n(r) Φ_n(θ), ρ_n the sum of the general radial
// terms (coefficients in n and (−1)^n), except where Special gives the terms
// of an exceptional n (a vanishing denominator of the general form).
type Series struct {
	Family  Family
	Inverse bool // scaled terms are (R/r)^ν_n, outside a circle
	R       Coef // the radius in (r/R)^ν_n
	General []RadialTerm
	Special map[int][]RadialTerm
}

// IsZero reports a series whose every term vanishes.
func (s Series) IsZero() bool {
	for _, ts := range append([][]RadialTerm{s.General}, mapValues(s.Special)...) {
		for _, t := range ts {
			if !t.C.IsZero() {
				return false
			}
		}
	}
	return true
}

func mapValues(m map[int][]RadialTerm) [][]RadialTerm {
	var out [][]RadialTerm
	for _, v := range m {
		out = append(out, v)
	}
	return out
}

func (s Series) specials() []int {
	var ns []int
	for n := range s.Special {
		ns = append(ns, n)
	}
	sort.Ints(ns)
	return ns
}

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
	head := "sum(" + Index + "=" + strconv.Itoa(s.Family.From) + "..inf"
	for _, run := range runs(s.specials()) {
		head += ", " + Index + " != " + run
	}
	return s.print(head+", ", ")", st)
}

// LaTeX prints the series with \sum.
func (s Series) LaTeX() string { return s.latex(latexStyle) }

// LaTeXApprox is LaTeX with decimals.
func (s Series) LaTeXApprox() string { return s.latex(style{latex: true, mul: " ", decimal: true}) }

func (s Series) latex(st style) string {
	lower := Index + "=" + strconv.Itoa(s.Family.From)
	if len(s.Special) > 0 {
		var ex []string
		for _, run := range runs(s.specials()) {
			ex = append(ex, strings.Replace(run, "..", `,\dots,`, 1))
		}
		lower = Index + `\ge ` + strconv.Itoa(s.Family.From) + `,\ ` + Index + `\ne ` + strings.Join(ex, ",")
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
	for _, n := range s.specials() {
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

// coefFunc is a coefficient compiled to a float64 function of n.
type coefFunc struct {
	num, den []monoFunc
}

type monoFunc struct {
	c      float64 // coefficient times every atom but n, (−1)^n, cos(qπn) and sin(qπn)
	nPow   float64
	signed bool
	trig   []nTrigFactor
}

// nTrigFactor is cos(qπn)^e or sin(qπn)^e.
type nTrigFactor struct {
	q, e float64
	sin  bool
	pow  bool // ρ^(e·n) with ρ = q, instead of a trigonometric factor
}

func compilePoly(p Poly, env Env) ([]monoFunc, error) {
	out := make([]monoFunc, len(p.t))
	for i, t := range p.t {
		c, _ := t.c.Float64()
		mf := monoFunc{}
		for _, f := range t.m.f {
			switch {
			case f.sym.kind == kindParam && f.sym.name == Index:
				mf.nPow, _ = f.exp.Float64()
			case f.sym.kind == kindSign:
				mf.signed = true
			case f.sym.kind == kindPowN:
				b, err := powBase(f.sym.name).Float(env)
				if err != nil {
					return nil, err
				}
				e, _ := f.exp.Float64()
				mf.trig = append(mf.trig, nTrigFactor{q: b, e: e, pow: true})
			case f.sym.kind == kindCosN || f.sym.kind == kindSinN:
				q, _ := new(big.Rat).SetString(f.sym.name)
				e, _ := f.exp.Float64()
				mf.trig = append(mf.trig, nTrigFactor{q: ratFloat(q), e: e, sin: f.sym.kind == kindSinN})
			default:
				v, err := f.sym.float(env)
				if err != nil {
					return nil, err
				}
				e, _ := f.exp.Float64()
				c *= math.Pow(v, e)
			}
		}
		mf.c = c
		out[i] = mf
	}
	return out, nil
}

func compileCoef(c Coef, env Env) (coefFunc, error) {
	num, err := compilePoly(c.num, env)
	if err != nil {
		return coefFunc{}, err
	}
	den, err := compilePoly(c.den, env)
	return coefFunc{num, den}, err
}

func evalMonos(ms []monoFunc, n, sign float64) float64 {
	s := 0.0
	for _, m := range ms {
		v := m.c
		switch {
		case m.nPow == 0:
		case m.nPow == math.Trunc(m.nPow) && math.Abs(m.nPow) < 64:
			v *= powInt(n, int64(m.nPow))
		default:
			v *= math.Pow(n, m.nPow)
		}
		if m.signed {
			v *= sign
		}
		for _, t := range m.trig {
			if t.pow {
				v *= math.Pow(t.q, t.e*n)
				continue
			}
			x := math.Cos(t.q * math.Pi * n)
			if t.sin {
				x = math.Sin(t.q * math.Pi * n)
			}
			v *= math.Pow(x, t.e)
		}
		s += v
	}
	return s
}

func (c coefFunc) at(n float64) float64 {
	sign := 1.0
	if math.Mod(n, 2) == 1 {
		sign = -1
	}
	v := evalMonos(c.num, n, sign)
	if len(c.den) > 0 {
		v /= evalMonos(c.den, n, sign)
	}
	return v
}

type radialFunc struct {
	c      coefFunc
	p      float64
	l      int
	scaled bool
}

// CompiledSeries evaluates a series in float64.
type CompiledSeries struct {
	lastSpecial int                     // the largest exceptional n
	cache       *coefCache              // general coefficients by n, filled as sums reach them
	jump        func(n float64) float64 // a part of each scaled coefficient summed elsewhere
	inverse     bool                    // scaled terms are (R/r)^ν
	fam         Family
	slope       float64
	offset      float64
	R           float64
	general     []radialFunc
	special     map[int][]radialFunc
}

func compileRadial(ts []RadialTerm, env Env) ([]radialFunc, error) {
	out := make([]radialFunc, len(ts))
	for i, t := range ts {
		c, err := compileCoef(t.C, env)
		if err != nil {
			return nil, err
		}
		p := 0.0
		if t.P != nil {
			p, _ = t.P.Float64()
		}
		out[i] = radialFunc{c, p, t.L, t.Scaled}
	}
	return out, nil
}

// coefCache holds c_n for each general term and n − From, since the
// coefficients do not depend on the point.
type coefCache struct {
	vals [][]float64 // [term][n − From]
	jump []float64
}

func (cs CompiledSeries) coef(i, n int) float64 {
	k := n - cs.fam.From
	v := cs.cache.vals[i]
	for len(v) <= k {
		v = append(v, cs.general[i].c.at(float64(cs.fam.From+len(v))))
	}
	cs.cache.vals[i] = v
	return v[k]
}

func (cs CompiledSeries) jumpAt(n int) float64 {
	k := n - cs.fam.From
	for len(cs.cache.jump) <= k {
		cs.cache.jump = append(cs.cache.jump, cs.jump(float64(cs.fam.From+len(cs.cache.jump))))
	}
	return cs.cache.jump[k]
}

// Compile fixes the parameters from env for float64 evaluation.
func (s Series) Compile(env Env) (CompiledSeries, error) {
	R, err := s.R.Float(env)
	if err != nil {
		return CompiledSeries{}, err
	}
	cs := CompiledSeries{fam: s.Family, R: R, special: map[int][]radialFunc{}, inverse: s.Inverse}
	cs.slope, _ = s.Family.Slope.Float64()
	cs.offset, _ = s.Family.Offset.Float64()
	if cs.general, err = compileRadial(s.General, env); err != nil {
		return CompiledSeries{}, err
	}
	cs.cache = &coefCache{vals: make([][]float64, len(cs.general))}
	for n, ts := range s.Special {
		if cs.special[n], err = compileRadial(ts, env); err != nil {
			return CompiledSeries{}, err
		}
		cs.lastSpecial = max(cs.lastSpecial, n)
	}
	return cs, nil
}

func (cs CompiledSeries) radial(ts []radialFunc, n, nu, r, lnr float64) float64 {
	v := 0.0
	for _, t := range ts {
		c := t.c.at(n)
		if c == 0 {
			continue
		}
		if t.scaled {
			v += c * cs.scale(r, nu)
			continue
		}
		x := c
		if t.p != 0 {
			x *= math.Pow(r, t.p)
		}
		if t.l > 0 {
			x *= powInt(lnr, int64(t.l))
		}
		v += x
	}
	return v
}

func (cs CompiledSeries) scale(r, nu float64) float64 {
	if cs.inverse {
		return math.Pow(cs.R/r, nu)
	}
	return math.Pow(r/cs.R, nu)
}

// Summed is a series value with its truncation.
type Summed struct {
	Value float64
	Terms int     // the last index summed
	Tail  float64 // an estimate of the neglected tail
}

// At sums the series at (r, θ) until the tail estimate n·|ρ_n(r)| is below
// tol·max(1, |sum|) (the estimate is sound for terms decaying like n^(−2) or
// faster), or maxTerms terms have been summed.
func (cs CompiledSeries) At(r, theta, tol float64, maxTerms int) Summed {
	lnr := math.Log(r)
	// Per point: the fixed radial factors r^P (ln r)^L of the general terms;
	// per step, (r/R)^ν and the angle advance by constant factors.
	var buf [8]float64
	fixed := buf[:0]
	if len(cs.general) > len(buf) {
		fixed = make([]float64, 0, len(cs.general))
	}
	fixed = fixed[:len(cs.general)]
	for i, t := range cs.general {
		if !t.scaled {
			x := 1.0
			if t.p != 0 {
				x = math.Pow(r, t.p)
			}
			if t.l > 0 {
				x *= powInt(lnr, int64(t.l))
			}
			fixed[i] = x
		}
	}
	n0 := float64(cs.fam.From)
	nu0 := cs.slope*n0 + cs.offset
	scale, step := cs.scale(r, nu0), cs.scale(r, cs.slope)
	if cs.scale(r, 1) == 0 {
		scale, step = 0, 0
	}
	c, s := math.Cos(nu0*theta), math.Sin(nu0*theta)
	dc, ds := math.Cos(cs.slope*theta), math.Sin(cs.slope*theta)
	sum := 0.0
	quiet := 0
	last := cs.fam.From
	tail := math.Inf(1)
	for n := cs.fam.From; n < cs.fam.From+maxTerms; n++ {
		nf := float64(n)
		nu := cs.slope*nf + cs.offset
		if n%64 == 0 { // refresh the recurrences against drift
			scale = cs.scale(r, nu)
			c, s = math.Cos(nu*theta), math.Sin(nu*theta)
		}
		var rho float64
		var ts []radialFunc
		special := len(cs.special) > 0 && n <= cs.lastSpecial
		if special {
			ts, special = cs.special[n]
		}
		if special {
			rho = cs.radial(ts, nf, nu, r, lnr)
		} else {
			for i, t := range cs.general {
				k := cs.coef(i, n)
				if t.scaled {
					rho += k * scale
				} else {
					rho += k * fixed[i]
				}
			}
		}
		if cs.jump != nil {
			rho -= cs.jumpAt(n) * scale
		}
		phi := c
		if cs.fam.Sin {
			phi = s
		}
		sum += rho * phi
		last = n
		tail = nf * math.Abs(rho)
		if !special && tail <= tol*math.Max(1, math.Abs(sum)) {
			quiet++
			if quiet >= 4 {
				break
			}
		} else {
			quiet = 0
		}
		scale *= step
		c, s = c*dc-s*ds, s*dc+c*ds
	}
	return Summed{Value: sum, Terms: last, Tail: tail}
}

// Coefficient evaluates a general coefficient at a concrete n, exactly.
func Coefficient(c Coef, n int) (Coef, error) {
	return c.Subst(Env{Index: IntCoef(int64(n))})
}

// String is for debugging.
func (s Series) String() string { return fmt.Sprintf("Series(%s)", s.Text()) }

// IndexedSum is Σ_{n ≥ From} c_n, c_n = General at n except where Special gives it.
type IndexedSum struct {
	From    int
	General Coef
	Special map[int]Coef
}

// Float sums in float64 until the tail estimate n·|c_n| is below tol·max(1, |sum|)
// (sound for terms decaying like n^(−2) or faster), or maxTerms terms.
func (s IndexedSum) Float(env Env, tol float64, maxTerms int) (Summed, error) {
	g, err := compileCoef(s.General, env)
	if err != nil {
		return Summed{}, err
	}
	special := map[int]float64{}
	for n, c := range s.Special {
		if special[n], err = c.Float(env); err != nil {
			return Summed{}, err
		}
	}
	sum, tail, quiet, last := 0.0, math.Inf(1), 0, s.From
	for n := s.From; n < s.From+maxTerms; n++ {
		c, ok := special[n]
		if !ok {
			c = g.at(float64(n))
		}
		sum += c
		last, tail = n, float64(n)*math.Abs(c)
		if !ok && tail <= tol*math.Max(1, math.Abs(sum)) {
			if quiet++; quiet >= 4 {
				break
			}
		} else {
			quiet = 0
		}
	}
	return Summed{Value: sum, Terms: last, Tail: tail}, nil
}

// SectorIntegral is ∬ over the sector r < R, 0 < θ < α (α = aOverPi·π) of the
// series, term by term: ∫_0^α Φ_n dθ is (1 − cos ν_nα)/ν_n for sines and
// sin(ν_nα)/ν_n for cosines (α where ν_n = 0); ∫_0^R (r/R)^ν r dr = R²/(ν + 2).
func (s Series) SectorIntegral(aOverPi *big.Rat) (IndexedSum, error) {
	out := IndexedSum{From: s.Family.From, Special: map[int]Coef{}}
	var err error
	if out.General, err = s.modeIntegral(s.General, aOverPi, IndexCoef, SignCoef); err != nil {
		return IndexedSum{}, err
	}
	for n, ts := range s.Special {
		sign := IntCoef(1 - 2*int64(((n%2)+2)%2))
		if out.Special[n], err = s.modeIntegral(ts, aOverPi, IntCoef(int64(n)), sign); err != nil {
			return IndexedSum{}, err
		}
	}
	return out, nil
}

func (s Series) modeIntegral(ts []RadialTerm, aOverPi *big.Rat, n, sign Coef) (Coef, error) {
	nu := s.Family.Nu(n)
	cd, sd, ok := unitCircle(SymCoef(Pi).Mul(RatCoef(new(big.Rat).Mul(s.Family.Offset, aOverPi))))
	if !ok {
		return Coef{}, ErrAngle
	}
	var angular Coef
	switch q, isRat := nu.Rat(); {
	case isRat && q.Sign() == 0:
		if s.Family.Sin {
			return Coef{}, nil
		}
		angular = SymCoef(Pi).MulRat(aOverPi)
	case s.Family.Sin:
		angular, _ = IntCoef(1).Sub(sign.Mul(cd)).Div(nu)
	default:
		angular, _ = sign.Mul(sd).Div(nu)
	}
	radial := Coef{}
	for _, t := range ts {
		if t.Scaled {
			r2, _ := s.R.Pow(big.NewRat(2, 1))
			v, err := r2.Div(nu.Add(IntCoef(2)))
			if err != nil {
				return Coef{}, err
			}
			radial = radial.Add(t.C.Mul(v))
			continue
		}
		v, err := radialMoment(new(big.Rat).Add(t.P, one), t.L, s.R)
		if err != nil {
			return Coef{}, err
		}
		radial = radial.Add(t.C.Mul(v))
	}
	return radial.Mul(angular), nil
}

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

// Grid adds the series on the tensor grid rs × thetas to out and returns the
// tail estimate per radius: each mode is ρ_n(r)·Φ_n(θ), so a mode costs
// len(rs) + len(thetas) evaluations; a radius stops taking modes once
// n·|ρ_n(r)| has stayed below tol·max(1, |row|) for four modes.
func (cs CompiledSeries) Grid(rs, thetas []float64, out [][]float64, tol float64, maxTerms int) []float64 {
	rho := make([]float64, len(rs))
	phi := make([]float64, len(thetas))
	tail := make([]float64, len(rs))
	quiet := make([]int, len(rs))
	scale := make([]float64, len(rs))
	lnr := make([]float64, len(rs))
	for i, r := range rs {
		lnr[i] = math.Log(r)
		tail[i] = math.Inf(1)
	}
	active := len(rs)
	for n := cs.fam.From; n < cs.fam.From+maxTerms && active > 0; n++ {
		nf := float64(n)
		nu := cs.slope*nf + cs.offset
		ts, special := cs.special[n]
		for i, r := range rs {
			if quiet[i] >= 4 {
				rho[i] = 0
				continue
			}
			scale[i] = cs.scale(r, nu)
			v := 0.0
			if special {
				v = cs.radial(ts, nf, nu, r, lnr[i])
			} else {
				for k, t := range cs.general {
					c := cs.coef(k, n)
					switch {
					case t.scaled:
						v += c * scale[i]
					default:
						x := c
						if t.p != 0 {
							x *= math.Pow(r, t.p)
						}
						if t.l > 0 {
							x *= powInt(lnr[i], int64(t.l))
						}
						v += x
					}
				}
			}
			if cs.jump != nil {
				v -= cs.jumpAt(n) * scale[i]
			}
			rho[i] = v
			tail[i] = nf * math.Abs(v)
		}
		for j, th := range thetas {
			if cs.fam.Sin {
				phi[j] = math.Sin(nu * th)
			} else {
				phi[j] = math.Cos(nu * th)
			}
		}
		for i := range rs {
			if rho[i] == 0 && quiet[i] >= 4 {
				continue
			}
			row := out[i]
			big := 0.0
			for j := range thetas {
				row[j] += rho[i] * phi[j]
				big = math.Max(big, math.Abs(row[j]))
			}
			if !special && tail[i] <= tol*math.Max(1, big) {
				quiet[i]++
				if quiet[i] == 4 {
					active--
				}
			} else if quiet[i] < 4 {
				quiet[i] = 0
			}
		}
	}
	return tail
}

// IndexFunc compiles a general coefficient to a float64 function of n.
func (c Coef) IndexFunc(env Env) (func(n float64) float64, error) {
	f, err := compileCoef(c, env)
	if err != nil {
		return nil, err
	}
	return f.at, nil
}
