package ansatz

import "gonum.org/v1/gonum/integrate/quad"

// GaussX and GaussW are psol's one 16-point Gauss–Legendre rule on [−1, 1]
// (nodes and weights from gonum): every panel integral in the quadratures,
// the Poisson integral, the report's fluxes and the tensor integrals uses it.
// It is exact for polynomials of degree 31 on a panel.
var GaussX, GaussW = func() ([]float64, []float64) {
	x, w := make([]float64, glN), make([]float64, glN)
	quad.Legendre{}.FixedLocations(x, w, -1, 1)
	return x, w
}()

// glN is the rule's number of nodes.
const glN = 16

// TensorIntegral is ∬ f over [0, a] × [0, b] by the tensor product of the
// 16-point rule on panels × panels equal cells.
func TensorIntegral(f func(x, y float64) float64, a, b float64, panels int) float64 {
	total := 0.0
	for i := 0; i < panels; i++ {
		for j := 0; j < panels; j++ {
			for p, xp := range GaussX {
				for q, xq := range GaussX {
					x := a * (float64(i) + (xp+1)/2) / float64(panels)
					y := b * (float64(j) + (xq+1)/2) / float64(panels)
					total += GaussW[p] * GaussW[q] * f(x, y)
				}
			}
		}
	}
	return total * a * b / float64(4*panels*panels)
}
