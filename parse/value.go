package parse

import "psol/series"

// value is what lowering makes of a node: an affine form
// lap·Δu + dn·∂u/∂n + u·u + f, where only conditions and equations may have
// nonzero unknown parts.
type value struct {
	lap, dn, u series.Coef
	f          series.Field
}

func (v value) hasUnknown() bool { return !v.lap.IsZero() || !v.dn.IsZero() || !v.u.IsZero() }

func (v value) add(w value) value {
	return value{v.lap.Add(w.lap), v.dn.Add(w.dn), v.u.Add(w.u), v.f.Add(w.f)}
}

func (v value) scale(c series.Coef) value {
	return value{v.lap.Mul(c), v.dn.Mul(c), v.u.Mul(c), v.f.Scale(c)}
}

// total adds the terms pairwise, so that a long printed sum read back costs
// n log n merges rather than n².
func total(terms []value) value {
	if len(terms) == 1 {
		return terms[0]
	}
	half := len(terms) / 2
	return total(terms[:half]).add(total(terms[half:]))
}

// bits is the size of v's largest exact number, in bits: of its source,
// its point sources' strengths and its unknowns' factors.
func (v value) bits() int {
	n := v.f.Exact.Bits()
	for _, c := range []series.Coef{v.lap, v.dn, v.u} {
		n = max(n, series.Const(c).Bits())
	}
	for _, p := range v.f.Points {
		n = max(n, series.Const(p.Q).Bits())
	}
	return n
}

// constant reports v as an exact constant without unknowns.
func constant(v value) (series.Coef, bool) {
	if v.hasUnknown() || !v.f.IsExact() {
		return series.Coef{}, false
	}
	return v.f.Exact.Const()
}
