package ansatz

import (
	"math"
	"testing"
)

// The kink's closed form: Δv = C|ℓ| by central differences away from the
// line (common practice: d²/ds² |s|³/6 = |s|), its gradient against
// differences, and its Fourier modes on a circle against a direct
// Gauss–Legendre sum between the crossings.
func TestKinkClosedForm(t *testing.T) {
	k := Kink{C: -2.0 / 3, A: 1, B: -1, D: 0.2}
	const h = 1e-4
	for _, p := range [][2]float64{{0.3, 0.1}, {-0.4, 0.5}, {0.7, -0.2}, {0.05, 0.9}} {
		x, y := p[0], p[1]
		lap := (k.ValueXY(x+h, y) + k.ValueXY(x-h, y) + k.ValueXY(x, y+h) + k.ValueXY(x, y-h) - 4*k.ValueXY(x, y)) / (h * h)
		r, th := math.Hypot(x, y), math.Atan2(y, x)
		if want := k.Source(r, th); math.Abs(lap-want) > 1e-6 {
			t.Errorf("Δv(%g, %g) = %.9g by differences, want C|ℓ| = %.9g", x, y, lap, want)
		}
		vr, vt := k.Gradient(r, th)
		dr := (k.Value(r+h, th) - k.Value(r-h, th)) / (2 * h)
		dt := (k.Value(r, th+h) - k.Value(r, th-h)) / (2 * h)
		if math.Abs(vr-dr) > 1e-8 || math.Abs(vt-dt) > 1e-8 {
			t.Errorf("grad v at (%g, %g) = (%g, %g), differences (%g, %g)", x, y, vr, vt, dr, dt)
		}
	}
	p, dp := k.Modes(0.8, 64)
	th, w := arcNodesFor(k.breaks(0.8), 256)
	for _, m := range []int{0, 1, 2, 7, 40} {
		var a, b, da float64
		for i, t := range th {
			f := w[i] / math.Pi
			if m == 0 {
				f /= 2
			}
			vr, _ := k.Gradient(0.8, t)
			a += f * k.Value(0.8, t) * math.Cos(float64(m)*t)
			b += f * k.Value(0.8, t) * math.Sin(float64(m)*t)
			da += f * vr * math.Cos(float64(m)*t)
		}
		if math.Abs(p[m][0]-a) > 1e-14 || math.Abs(p[m][1]-b) > 1e-14 || math.Abs(dp[m][0]-da) > 1e-13 {
			t.Errorf("mode %d: (%.3g, %.3g, %.3g) by FFT, (%.3g, %.3g, %.3g) by Gauss–Legendre", m, p[m][0], p[m][1], dp[m][0], a, b, da)
		}
	}
}

// The divergence theorem on the kink's closed form: the flux through the
// circle equals the source's integral over the disk, both computed by the
// kink's own rules.
func TestKinkIntegralsAgree(t *testing.T) {
	k := Kink{C: 1.5, A: 0, B: 1, D: -0.3}
	src, _ := k.Integrals(0, 1, 0, 2*math.Pi)
	if flux := k.Flux(1, 0, 2*math.Pi); math.Abs(flux-src) > 1e-13 {
		t.Errorf("flux %.15g, source integral %.15g", flux, src)
	}
}
