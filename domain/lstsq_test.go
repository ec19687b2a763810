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

// columnNorms reads the matrix row by row, and each norm must be bit for bit
// gonum's own (mat.Norm of the column, BLAS's dnrm2): the adaptive fits'
// paths turn on the last bit of a column's scale. Entries span 1e-200 to
// 1e200, with zeros (leading, inside, a whole column), an infinity and a NaN.
func TestColumnNormsMatchGonum(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	const m, nc = 257, 40
	A := mat.NewDense(m+nc, nc+3, nil) // ridge rows below, spare columns right: both ignored
	for i := 0; i < m; i++ {
		for j := 0; j < nc; j++ {
			if j == 7 || rng.IntN(5) == 0 || (j == 11 && i < 100) {
				continue
			}
			v := rng.NormFloat64() * math.Pow(10, float64(rng.IntN(41)-20))
			if j == 30 {
				v *= 1e180
			}
			if j == 31 {
				v *= 1e-180
			}
			A.Set(i, j, v)
		}
	}
	A.Set(50, 20, math.Inf(-1))
	A.Set(60, 21, math.NaN())
	got := columnNorms(A, m, nc)
	for j := 0; j < nc; j++ {
		want := mat.Norm(A.ColView(j), 2) // the fit's old call, the zero ridge rows included
		if math.Float64bits(got[j]) != math.Float64bits(want) && !(math.IsNaN(got[j]) && math.IsNaN(want)) {
			t.Errorf("column %d: %v, gonum's norm %v", j, got[j], want)
		}
	}
	if got[7] != 0 || !math.IsInf(got[20], 1) || !math.IsNaN(got[21]) {
		t.Errorf("zero, infinite and NaN columns: %v %v %v", got[7], got[20], got[21])
	}
}
