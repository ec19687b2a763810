package domain

import (
	"math"
	"math/big"
	"math/cmplx"
	"testing"
)

// A pole 1e-9 from its corner, evaluated 1e-9 from the pole: 1/(z − p)
// against the same quantity in exact arithmetic on the same float64 inputs
// (math/big, an independent path), where p = corner + offset. Kept as its
// corner and offset the pole loses nothing; at its rounded position
// (1e-16 of the coordinates' size) it lost 1e-7 of the value.
func TestPoleKeepsDigitsNearItsCorner(t *testing.T) {
	w := complex(0.7, 0.3) // no binary fraction: rounding in w + off
	for _, c := range []struct {
		off, step complex128
	}{
		{cmplx.Rect(1e-9, 2.3), cmplx.Rect(2e-9, 1.1)},
		{cmplx.Rect(3e-9, -0.7), cmplx.Rect(1e-9, 0.4)},
		{cmplx.Rect(1e-8, math.Pi/4), cmplx.Rect(5e-9, -2)},
	} {
		p := pole{w, c.off}
		z := w + c.step // a point near the corner, as a float64 sample is
		exact := exactRecip(z, w, c.off)
		got := p.recip(z)
		if rel := abs(got-exact) / abs(exact); rel > 1e-13 {
			t.Errorf("pole %v off %v: 1/(z − p) = %v, exactly %v (relative %.1g)", w, c.off, got, exact, rel)
		}
	}
}

// exactRecip is 1/(z − (w + off)) in 200-bit arithmetic on the float64s.
func exactRecip(z, w, off complex128) complex128 {
	f := func(x float64) *big.Float { return new(big.Float).SetPrec(200).SetFloat64(x) }
	re := f(real(z))
	re.Sub(re, f(real(w))).Sub(re, f(real(off)))
	im := f(imag(z))
	im.Sub(im, f(imag(w))).Sub(im, f(imag(off)))
	a, _ := re.Float64()
	b, _ := im.Float64()
	return 1 / complex(a, b)
}
