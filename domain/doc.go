// Package domain holds the regions psol solves on and the solve pipeline.
//
// # The model
//
// psol solves Δu = f on a region with one condition per side: a value
// (Dirichlet, u = g), a flux (Neumann, ∂u/∂n = g) or convection (Robin,
// ∂u/∂n + h·u = g), n the outward normal. It splits the solution as
//
//	u = u_p + h,  Δu_p = f,  Δh = 0,
//
// where the particular solution u_p depends on the source alone (package
// ansatz: exact rules where the source has a closed form, quadrature where
// not) and the harmonic part h on the region. On each side the condition's
// operator B applied to u_p is the trace; data minus trace is the correction
// that h must supply: B[h] = g − B[u_p]. Solve runs that pipeline and then
// verifies the result exactly where the algebra allows (the Laplacian and
// every side's residual as exact sums), numerically where it does not.
//
// # Regions
//
// A region is a Domain: it names its sides, describes itself, owns its
// geometry (Shape: the sides with their points, outward normals and lengths,
// the area, the bounding box and, for regions that are one, the (r, θ) box),
// solves for its harmonic part, computes its share of a report (figures),
// checks a claim on its sides (claimSide) and gives interior sample points.
// Each region is one file: disk.go, annulus.go and outside.go are bounded by
// circles and share the mode solve of circular.go (per angular mode an exact
// square system for the radial basis); sector.go uses the rays'
// eigenfunctions with a closed general term in n; rect.go uses one
// series per side (rectside.go exact, eigenside.go numeric for Robin sides).
//
// # Numbers
//
// Coefficients are exact (series.Coef, math/big) wherever the data allow;
// numeric steps (FFT of boundary data, quadrature of a source with no closed
// form, eigenvalues of Robin sides) print as decimals and carry an error
// estimate. Options states the one tolerance the user sets and what each
// numeric step derives from it; a Solution keeps its Options, so its
// Evaluator, grids, pictures and Figures need no further arguments.
package domain
