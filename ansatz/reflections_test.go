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

// A source given in Cartesian coordinates too (GXY) is sampled on its rings
// from the table of angles; the quadrature must be the polar one's to
// rounding: the same samples chosen and the same values. The source is the
// speed issue's off-centre hot spot, and a second with a mode of its own.
func TestCartesianRingsMatchPolar(t *testing.T) {
	for _, c := range []struct {
		name string
		xy   func(x, y float64) float64
	}{
		{"hot spot", func(x, y float64) float64 { return math.Exp(-((x-0.3)*(x-0.3) + y*y) / 0.05) }},
		{"skewed", func(x, y float64) float64 { return x*x*y - 3*math.Sin(2*x+y) + 1/(2+x) }},
	} {
		polar := func(r, th float64) float64 { return c.xy(r*math.Cos(th), r*math.Sin(th)) }
		a := &Quadrature{G: polar, R: 1, Tol: 1e-10}
		b := &Quadrature{G: polar, GXY: c.xy, R: 1, Tol: 1e-10}
		if err := a.Prepare(); err != nil {
			t.Fatal(err)
		}
		if err := b.Prepare(); err != nil {
			t.Fatal(err)
		}
		if a.Samples != b.Samples || len(a.coarse) != len(b.coarse) || a.Modes != b.Modes {
			t.Errorf("%s: samples %d / %d, panels %d / %d, modes %d / %d", c.name, a.Samples, b.Samples, len(a.coarse), len(b.coarse), a.Modes, b.Modes)
		}
		for _, p := range [][2]float64{{0.05, 1}, {0.3, 0}, {0.5, 2.5}, {0.9, 4}, {1, 0.3}} {
			va, ea := a.At(p[0], p[1])
			vb, _ := b.At(p[0], p[1])
			if d := math.Abs(va - vb); d > 1e-13*math.Max(math.Abs(va), 1e-3) || d > ea {
				t.Errorf("%s at %v: polar %.17g, Cartesian %.17g (estimate %.1e)", c.name, p, va, vb, ea)
			}
		}
	}
}
