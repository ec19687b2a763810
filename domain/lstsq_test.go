package domain

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// leastSquaresInPlace against an independent path: gonum's mat.QR solve on
// a copy, for overdetermined systems with a stride wider than the matrix
// (the fit's layout: live columns in the top-left corner).
func TestLeastSquaresInPlace(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for _, size := range [][3]int{{5, 3, 4}, {40, 17, 20}, {300, 120, 130}} {
		m, n, stride := size[0], size[1], size[2]
		data := make([]float64, m*stride)
		A := mat.NewDense(m, n, nil)
		b := make([]float64, m)
		for i := 0; i < m; i++ {
			for j := 0; j < n; j++ {
				v := rng.NormFloat64()
				data[i*stride+j] = v
				A.Set(i, j, v)
			}
			b[i] = rng.NormFloat64()
		}
		var qr mat.QR
		qr.Factorize(A)
		var want mat.VecDense
		if err := qr.SolveVecTo(&want, false, mat.NewVecDense(m, append([]float64(nil), b...))); err != nil {
			t.Fatal(err)
		}
		raw := mat.NewDense(m, stride, data).RawMatrix()
		raw.Cols = n
		got, err := leastSquaresInPlace(raw, b)
		if err != nil {
			t.Fatal(err)
		}
		for j := 0; j < n; j++ {
			if math.Abs(got[j]-want.AtVec(j)) > 1e-12*(1+math.Abs(want.AtVec(j))) {
				t.Errorf("%d×%d: x[%d] = %.15g, mat.QR %.15g", m, n, j, got[j], want.AtVec(j))
			}
		}
	}
}
