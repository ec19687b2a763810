package domain

import (
	"errors"
	"math"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack/lapack64"
)

// leastSquaresInPlace solves min ‖A·x − b‖₂ for the m×n matrix a (m ≥ n,
// row-major with its stride) by Householder QR, overwriting a with the
// factors and b with Qᵀb; x is b's first n entries. It is mat.QR's solve
// without its copy of A (the fit's matrix is the largest thing psol holds,
// and copying it was a fifth of a thin tube's fit). A rank-deficient R (a
// zero or non-finite pivot) is an error; an ill-conditioned one is not:
// the fit's residual, measured afterwards, judges it.
func leastSquaresInPlace(a blas64.General, b []float64) ([]float64, error) {
	m, n := a.Rows, a.Cols
	tau := make([]float64, n)
	work := []float64{0}
	lapack64.Geqrf(a, tau, work, -1)
	c := blas64.General{Rows: m, Cols: 1, Stride: 1, Data: b}
	lapack64.Ormqr(blas.Left, blas.Trans, a, tau, c, work[:1], -1)
	size := int(work[0])
	lapack64.Geqrf(a, tau, work, -1)
	size = max(size, int(work[0]))
	work = make([]float64, size)
	lapack64.Geqrf(a, tau, work, len(work))
	lapack64.Ormqr(blas.Left, blas.Trans, a, tau, c, work, len(work))
	for i := 0; i < n; i++ {
		if d := a.Data[i*a.Stride+i]; d == 0 || math.IsNaN(d) || math.IsInf(d, 0) {
			return nil, errors.New("the basis is rank-deficient")
		}
	}
	x := b[:n]
	blas64.Trsv(blas.NoTrans, blas64.Triangular{Uplo: blas.Upper, Diag: blas.NonUnit, N: n, Stride: a.Stride, Data: a.Data}, blas64.Vector{N: n, Inc: 1, Data: x})
	return x, nil
}
