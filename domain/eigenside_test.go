package domain

import (
	"math"
	"testing"
)

// The first root of ζ tan ζ = Bi, the eigenvalue of a plane wall with a
// symmetry plane and a convecting face (X'(0) = 0, X'(1) + Bi·X(1) = 0):
// Incropera, Fundamentals of Heat and Mass Transfer, Table 5.1 (values from
// memory, to the table's four decimals).
func TestEigenvaluesBiot(t *testing.T) {
	for _, c := range []struct{ bi, zeta float64 }{{0.1, 0.3111}, {1, 0.8603}, {10, 1.4289}} {
		e := &EigenSide{Wall: Bottom, L: 1, H: 1, Start: End{Kind: Neumann}, End: End{Kind: Robin, H: c.bi}}
		e.constant = false
		if got := e.eigenvalue(1, 1); math.Abs(got-c.zeta) > 5e-5 {
			t.Errorf("Bi = %g: ζ1 = %.6f, table %.4f", c.bi, got, c.zeta)
		}
	}
	// Values at both ends: nπ/ℓ exactly; the eigenfunctions meet their ends.
	e := &EigenSide{Wall: Top, L: 2, H: 1, Start: End{Kind: Dirichlet}, End: End{Kind: Robin, H: 0.7}}
	for n := 1; n <= 5; n++ {
		mu := e.eigenvalue(n, 2)
		d0 := e.Start.phase(mu)
		x := func(s float64) float64 { return math.Cos(mu*s - d0) }
		dx := func(s float64) float64 { return -mu * math.Sin(mu*s-d0) }
		if math.Abs(x(0)) > 1e-14 || math.Abs(dx(2)+0.7*x(2)) > 1e-12 {
			t.Errorf("n = %d, mu = %g: X(0) = %g, X'(2) + 0.7 X(2) = %g", n, mu, x(0), dx(2)+0.7*x(2))
		}
	}
}
