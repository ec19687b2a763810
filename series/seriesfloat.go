package series

import (
	"math"
	"math/big"
)

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
			case f.sym.kind == kindCosAtanN || f.sym.kind == kindSinAtanN:
				e, _ := f.exp.Float64()
				mf.trig = append(mf.trig, nTrigFactor{q: atanQ(f.sym.name), e: e, sin: f.sym.kind == kindSinAtanN})
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
	var recent [4]float64
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
		// The estimate is the largest n·|ρ_n| of the last four terms: a
		// series whose every other term vanishes would otherwise read 0
		// wherever the cap stops it on a zero term.
		recent[n%4] = nf * math.Abs(rho)
		tail = max(recent[0], recent[1], recent[2], recent[3])
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

// Grid adds the series on the tensor grid rs × thetas to out and returns the
// tail estimate per radius: each mode is ρ_n(r)·Φ_n(θ), so a mode costs
// len(rs) + len(thetas) evaluations; a radius stops taking modes once
// n·|ρ_n(r)| has stayed below tol·max(1, |row|) for four modes.
func (cs CompiledSeries) Grid(rs, thetas []float64, out [][]float64, tol float64, maxTerms int) []float64 {
	rho := make([]float64, len(rs))
	tail := make([]float64, len(rs))
	quiet := make([]int, len(rs))
	scale := make([]float64, len(rs))
	lnr := make([]float64, len(rs))
	for i, r := range rs {
		lnr[i] = math.Log(r)
		tail[i] = math.Inf(1)
	}
	recent := make([][4]float64, len(rs))
	// The angular factors by rotation, cos and sin of ν_n·θ advanced by
	// ν's step each mode (refreshed every 64 modes against drift).
	cosT, sinT := make([]float64, len(thetas)), make([]float64, len(thetas))
	cosD, sinD := make([]float64, len(thetas)), make([]float64, len(thetas))
	for j, th := range thetas {
		sinD[j], cosD[j] = math.Sincos(cs.slope * th)
	}
	active := len(rs)
	for n := cs.fam.From; n < cs.fam.From+maxTerms && active > 0; n++ {
		nf := float64(n)
		nu := cs.slope*nf + cs.offset
		if n == cs.fam.From || (n-cs.fam.From)%64 == 0 {
			for j, th := range thetas {
				sinT[j], cosT[j] = math.Sincos(nu * th)
			}
		} else {
			for j := range thetas {
				cosT[j], sinT[j] = cosT[j]*cosD[j]-sinT[j]*sinD[j], sinT[j]*cosD[j]+cosT[j]*sinD[j]
			}
		}
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
			recent[i][n%4] = nf * math.Abs(v)
			tail[i] = max(recent[i][0], recent[i][1], recent[i][2], recent[i][3])
		}
		phi := cosT
		if cs.fam.Sin {
			phi = sinT
		}
		for i := range rs {
			if rho[i] == 0 && quiet[i] >= 4 {
				continue
			}
			row := out[i]
			big := 0.0
			ri := rho[i]
			for j, p := range phi {
				v := row[j] + ri*p
				row[j] = v
				if a := math.Abs(v); a > big {
					big = a
				}
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
