// Package cart is the Cartesian cousin of the term algebra: exact polynomials
// in x and y (Poly) and waves e^(αx+βy)[cos(γx+δy)C + sin(γx+δy)S] with
// polynomial C and S (Wave), with their derivatives, Laplacian, conversion
// from and to the polar sums of package series, exact particular solutions
// (Particular, Wave.Particular) and generated code.
//
// It holds algebra only: solving on the rectangle (side series, eigenfunction
// sides, corner fits) is in package domain, which imports this one.
package cart
