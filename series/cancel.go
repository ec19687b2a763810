package series

import (
	"math"
	"math/big"
	"sync"
)

// Cancellation of common linear factors n − k between the numerator and the
// denominator of a coefficient, for the index n of a series' general term:
// the denominators there are products like n(n² − 4), and the numerators
// often share a factor. Each candidate k is a small integer root of the
// denominator; the numerator must vanish at n = k identically in every
// other atom ((−1)^n counts as an atom of its own).

// indexPoly is p as a polynomial in n with polynomial coefficients: c[i] multiplies n^i.
// mentionsIndex reports a term of p with the index n in it.
func mentionsIndex(p Poly) bool {
	idx := Param(Index)
	for _, t := range p.t {
		for _, f := range t.m.f {
			if f.sym == idx {
				return true
			}
		}
	}
	return false
}

func indexPoly(p Poly) ([]Poly, bool) {
	var cs []Poly
	idx := Param(Index)
	for _, t := range p.t {
		e := t.m.degreeOf(idx)
		if !e.IsInt() || e.Sign() < 0 || !e.Num().IsInt64() || e.Num().Int64() > 64 {
			return nil, false
		}
		d := int(e.Num().Int64())
		for len(cs) <= d {
			cs = append(cs, Poly{})
		}
		var rest []factor
		for _, f := range t.m.f {
			if f.sym != idx {
				rest = append(rest, f)
			}
		}
		m, _ := normalizeRoots(rest)
		cs[d] = cs[d].Add(Poly{[]pterm{{m, t.c}}})
	}
	return cs, true
}

func fromIndexPoly(cs []Poly) Poly {
	out := Poly{}
	for i, c := range cs {
		if i == 0 {
			out = out.Add(c)
			continue
		}
		out = out.Add(c.Mul(SymPoly(Param(Index), big.NewRat(int64(i), 1))))
	}
	return out
}

// divideRoot divides Σ c_i n^i by (n − k) by Horner's rule, if k is a root.
func divideRoot(cs []Poly, kr *big.Rat) ([]Poly, bool) {
	if len(cs) < 2 {
		return nil, false
	}
	q := make([]Poly, len(cs)-1)
	carry := Poly{}
	for i := len(cs) - 1; i >= 1; i-- {
		carry = cs[i].Add(carry)
		q[i-1] = carry
		carry = carry.ScaleRat(kr)
	}
	if !cs[0].Add(carry).IsZero() {
		return nil, false
	}
	return q, true
}

// rootCandidates are the k tried: p/q with q dividing 12 (the denominators
// a sector's ν_n can have) and |k| ≤ 24. Built on first use.
var rootCandidates = sync.OnceValue(func() []*big.Rat {
	seen := map[string]bool{}
	var out []*big.Rat
	for _, q := range []int64{1, 2, 3, 4, 6, 12} {
		for p := -24 * q; p <= 24*q; p++ {
			k := big.NewRat(p, q)
			if !seen[k.String()] {
				seen[k.String()] = true
				out = append(out, k)
			}
		}
	}
	return out
})

// cancelIndexRoots removes the factors n − k that num and den share.
func cancelIndexRoots(num, den Poly) (Poly, Poly) {
	if !mentionsIndex(num) || !mentionsIndex(den) {
		// Nothing to cancel (either side of degree 0 in n), and indexPoly's
		// term-by-term sums cost the square of the terms: 1/(1 + A − B)^49,
		// 1275 terms and no n, took 1.8 s to learn that.
		return num, den
	}
	nc, ok1 := indexPoly(num)
	dc, ok2 := indexPoly(den)
	if !ok1 || !ok2 || len(dc) < 2 || len(nc) < 2 {
		return num, den
	}
	changed := false
	df, nf := probe(dc), probe(nc)
	for _, k := range rootCandidates() {
		if kf, _ := k.Float64(); !nearRoot(df, kf) || !nearRoot(nf, kf) {
			continue // the exact division below is costly; a float probe rules most k out
		}
		for {
			dq, ok := divideRoot(dc, k)
			if !ok {
				break
			}
			nq, ok := divideRoot(nc, k)
			if !ok {
				break
			}
			nc, dc, changed = nq, dq, true
			if len(dc) < 2 || len(nc) < 2 {
				break
			}
		}
	}
	if !changed {
		return num, den
	}
	return fromIndexPoly(nc), fromIndexPoly(dc)
}

// probe turns index-polynomial coefficients into floats, every atom given a
// fixed generic value, so that a root test in float64 can rule candidates out.
func probe(cs []Poly) []float64 {
	out := make([]float64, len(cs))
	for i, c := range cs {
		for _, t := range c.t {
			v, _ := t.c.Float64()
			for _, f := range t.m.f {
				e, _ := f.exp.Float64()
				v *= math.Pow(genericValue(f.sym), e)
			}
			out[i] += v
		}
	}
	return out
}

func genericValue(s Symbol) float64 {
	if s.kind == kindPi {
		return math.Pi
	}
	h := 0.0
	for i, c := range s.key() {
		h += float64(c) * float64(i+1)
	}
	return 1.25 + math.Mod(h*0.6180339887, 1) // in (1.25, 2.25), never ±1
}

func nearRoot(cs []float64, k float64) bool {
	v, scale := 0.0, 0.0
	for i := len(cs) - 1; i >= 0; i-- {
		v = v*k + cs[i]
		scale = scale*math.Abs(k) + math.Abs(cs[i])
	}
	return math.Abs(v) <= 1e-9*scale
}
