package series

import (
	"math/big"
	"sort"
)

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
