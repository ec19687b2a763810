// Package ansatz finds particular solutions of Δu = f: the u_p of psol's
// split u = u_p + h, which depends on the source alone.
//
// Rules match a source term's form and return its particular solution
// exactly: the polar rules (polar.go, one table row each) solve
// Δ[r^s Σ c_i (ln r)^i T(mθ)] = c r^k (ln r)^j T(mθ) with the resonant
// logarithms where s = ±m; the Cartesian wave rule (waves.go, through
// series/cart) solves exponentials and trigonometric functions of x and y
// times polynomials, addend by addend (SplitWaves). A term no rule closes
// is a *NoRule with the reason.
//
// A kink along a line, c·abs(ℓ) with ℓ linear in x and y, has the closed
// particular solution c·|ℓ|³/(6|∇ℓ|²) (Kink, kink.go): SplitKinks takes such
// addends out of a remainder, and the quadrature carries them as closed
// parts beside what it samples.
//
// What no rule closes goes to a quadrature: Quadrature (polar regions: an FFT
// in θ, Green's kernels on Gauss–Legendre panels in r) and SineQuadrature (the
// rectangle: a sine transform in x, panels in y). Both refine two meshes and
// report their difference as the error estimate. A sector's source is first
// made smooth across its rays by a closed lift (LiftRays, RayLift). One
// 16-point Gauss–Legendre rule and one tensor integrator serve every panel
// integral in psol (gauss.go).
package ansatz
