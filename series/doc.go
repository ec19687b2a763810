// Package series is psol's exact term algebra: sums of c·r^p·(ln r)^j·θ^k·trig(mθ) with exact coefficients, their calculus, evaluation and printing.
package series
