package ansatz

import (
	"math"
	"testing"
)

// A kinked source needs every angular sample and more radial panels than
// any budget: the mesh stops at MaxQuadratureBytes (the coarse mesh and its
// halving), and the error it leaves is estimated, not hidden.
func TestQuadratureMeshWithinBudget(t *testing.T) {
	q := &Quadrature{G: func(r, theta float64) float64 { return math.Abs(r*math.Sin(theta) - 0.3) }, R: 1, Tol: 1e-12}
	if err := q.Prepare(); err != nil {
		t.Fatal(err)
	}
	if q.Samples != q.maxSamples() {
		t.Errorf("%d angular samples, want the cap %d for a kinked source", q.Samples, q.maxSamples())
	}
	if used := (len(q.coarse) + len(q.fine)) * q.panelBytes(); used > MaxQuadratureBytes {
		t.Errorf("the meshes keep %d MB of coefficients, over the budget of %d MB", used>>20, MaxQuadratureBytes>>20)
	}
	if _, _, est := q.Mode(0.5); est <= 0 {
		t.Errorf("estimate %g for a mesh stopped by its budget, want > 0", est)
	}
}
