package domain

import "psol/series"

// Kind is the type of a boundary condition.
type Kind int

const (
	Dirichlet Kind = iota // u = g
	Neumann               // ∂u/∂n = g
	Robin                 // ∂u/∂n + h·u = g
	// Floating: u takes one unknown constant value on the side, and the net
	// outward flux ∮ ∂u/∂n ds through it is g (a constant). A hole's boundary
	// in torsion (the value follows from single-valued warping), a floating
	// conductor carrying a given charge, a well screen at one unknown head
	// with a given discharge.
	Floating
)

var kindNames = [...]string{"Dirichlet", "Neumann", "Robin", "floating"}

func (k Kind) String() string { return kindNames[k] }

// Condition is one side's boundary condition, normalised to
// u = G, ∂u/∂n = G or ∂u/∂n + H·u = G with the outward normal.
type Condition struct {
	Side string // "" where the domain has a single side
	Kind Kind
	H    series.Coef
	G    series.Field
	Text string // as the user wrote it
}

// operatorValue is a condition's operator in numbers: u, ∂u/∂n or
// ∂u/∂n + h·u from the value v and the outward normal derivative dn.
func operatorValue(kind Kind, h, v, dn float64) float64 {
	switch kind {
	case Neumann:
		return dn
	case Robin:
		return dn + h*v
	}
	return v
}
