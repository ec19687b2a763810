package ansatz

import (
	"math"
	"testing"
)

// A ring under Reflect takes its modes from its first quarter by the
// quarter's transform; they equal the full FFT's of the extension built by
// index (sample j's reflection into the first quarter, 0 on an image of a
// ray the extension is odd about), for the four pairs of parities and a
// quarter's function symmetric about nothing, so that a wrong index,
// family or scale shows; and the samples taken are a quarter's.
func TestQuarterRingAgainstFFT(t *testing.T) {
	const alpha = 0.9
	src := func(r, th float64) float64 { return math.Exp(r*math.Cos(th)) + 3*th*th - th + r }
	for _, odd := range [][2]bool{{true, true}, {false, false}, {true, false}, {false, true}} {
		s0, s1 := 1.0, 1.0
		if odd[0] {
			s0 = -1
		}
		if odd[1] {
			s1 = -1
		}
		for _, n := range []int{16, 64, 512} {
			q := n / 4
			angle := func(j int) float64 { return 4 * alpha * float64(j) / float64(n) }
			x := make([]float64, n) // the extension, reflected by index
			for j := range x {
				i, sign := j, 1.0
				if i >= 2*q {
					i, sign = i-2*q, s0*s1
				}
				if i > q {
					i, sign = 2*q-i, sign*s1
				}
				if i == 0 && odd[0] || i == q && odd[1] {
					continue
				}
				x[j] = sign * src(0.7, angle(i))
			}
			full := &Quadrature{G: func(r, th float64) float64 { return x[int(math.Round(th/(4*alpha)*float64(n)))%n] }, R: 1, Period: 4 * alpha}
			calls := 0
			quarter := &Quadrature{G: func(r, th float64) float64 {
				calls++
				j := int(math.Round(th / (4 * alpha) * float64(n)))
				if j > q {
					t.Fatalf("%v n %d: a sample at θ = %g, past the first quarter", odd, n, th)
				}
				return x[j]
			}, R: 1, Period: 4 * alpha, Reflect: &odd}
			a0, b0 := full.ring(0.7, n)
			a1, b1 := quarter.ring(0.7, n)
			if calls > q+1 {
				t.Errorf("%v n %d: %d samples, want a quarter's", odd, n, calls)
			}
			size := 0.0
			for k := range a0 {
				size = math.Max(size, math.Max(math.Abs(a0[k]), math.Abs(b0[k])))
			}
			for k := range a0 {
				if math.Abs(a0[k]-a1[k]) > 1e-13*size || math.Abs(b0[k]-b1[k]) > 1e-13*size {
					t.Fatalf("%v n %d mode %d: quarter (%.15g, %.15g), full FFT (%.15g, %.15g)", odd, n, k, a1[k], b1[k], a0[k], b0[k])
				}
			}
		}
	}
}
