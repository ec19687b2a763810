package domain

import "psol/series"

// Kind is the type of a boundary condition.
type Kind int

const (
	Dirichlet Kind = iota // u = g
	Neumann               // ∂u/∂n = g
	Robin                 // ∂u/∂n + h·u = g
)

var kindNames = [...]string{"Dirichlet", "Neumann", "Robin"}

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
