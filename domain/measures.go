package domain

import (
	"math/big"

	"psol/series"
)

// Measures are a region's exact sizes, as the figures need them with
// parameters left symbolic: the area, each side's length, and the area each
// inner side encloses (a hole of the section: the torsion constant and the
// single-valued-warping flux need it).
type Measures struct {
	Area      series.Coef // meaningless where Unbounded
	Unbounded bool
	Lengths   map[string]series.Coef
	Holes     map[string]series.Coef // an inner side → the area it encloses
}

// Perimeter is the summed length of the sides that keep says are counted
// (the wetted ones, for a duct).
func (m Measures) Perimeter(keep func(side string) bool) series.Coef {
	p := series.Coef{}
	for side, l := range m.Lengths {
		if keep(side) {
			p = p.Add(l)
		}
	}
	return p
}

var twoPi = series.SymCoef(series.Pi).MulRat(big.NewRat(2, 1))

// circleLength is 2πR; discArea is πR².
func circleLength(R series.Coef) series.Coef { return twoPi.Mul(R) }
func discArea(R series.Coef) series.Coef {
	return series.SymCoef(series.Pi).Mul(R).Mul(R)
}
