package domain

import (
	"math"
	"testing"
)

// The first root of ζ tan ζ = Bi, the eigenvalue of a plane wall with a
// symmetry plane and a convecting face (X'(0) = 0, X'(1) + Bi·X(1) = 0):
// Incropera, Fundamentals of Heat and Mass Transfer, Table 5.1 (values from
// memory, to the table's four decimals).
func TestEigenvaluesBiot(t *testing.T) {
	for _, c := range []struct{ bi, zeta float64 }{{0.1, 0.3111}, {1, 0.8603}, {10, 1.4289}} {
		e := &EigenSide{Wall: Bottom, L: 1, H: 1, Start: End{Kind: Neumann}, End: End{Kind: Robin, H: c.bi}}
		e.constant = false
		if got := e.eigenvalue(1, 1); math.Abs(got-c.zeta) > 5e-5 {
			t.Errorf("Bi = %g: ζ1 = %.6f, table %.4f", c.bi, got, c.zeta)
		}
	}
	// Values at both ends: nπ/ℓ exactly; the eigenfunctions meet their ends.
	e := &EigenSide{Wall: Top, L: 2, H: 1, Start: End{Kind: Dirichlet}, End: End{Kind: Robin, H: 0.7}}
	for n := 1; n <= 5; n++ {
		mu := e.eigenvalue(n, 2)
		d0 := e.Start.phase(mu)
		x := func(s float64) float64 { return math.Cos(mu*s - d0) }
		dx := func(s float64) float64 { return -mu * math.Sin(mu*s-d0) }
		if math.Abs(x(0)) > 1e-14 || math.Abs(dx(2)+0.7*x(2)) > 1e-12 {
			t.Errorf("n = %d, mu = %g: X(0) = %g, X'(2) + 0.7 X(2) = %g", n, mu, x(0), dx(2)+0.7*x(2))
		}
	}
}

// The FFT projections (equal panels, a value or a flux at each end) against
// closed forms: data s², whose integral against cos(μs − δ) has the
// antiderivative s² sin/μ + 2s cos/μ² − 2 sin/μ³ (integration by parts), and
// data cos(μ₃s − δ), which by the eigenfunctions' orthogonality projects
// on mode 3 alone, with ∫ X₃² = ℓ/2.
func TestUniformProjections(t *testing.T) {
	for _, ends := range [][2]Kind{{Dirichlet, Dirichlet}, {Neumann, Neumann}, {Dirichlet, Neumann}, {Neumann, Dirichlet}} {
		e := &EigenSide{L: 1.3, H: 0.7, Start: End{Kind: ends[0]}, End: End{Kind: ends[1]}, Opposite: End{Kind: Dirichlet}, Own: End{Kind: Dirichlet},
			Data: func(s float64) float64 { return 0 }}
		if err := e.Prepare(); err != nil {
			t.Fatal(err)
		}
		l, _ := e.along()
		panels := e.Modes/4 + 16
		nodes := func(f func(s float64) float64) []float64 {
			var cs []float64
			for i := 0; i < panels; i++ {
				lo, hi := l*float64(i)/float64(panels), l*float64(i+1)/float64(panels)
				for _, x := range legendreX {
					cs = append(cs, f((lo+hi)/2+(hi-lo)/2*x))
				}
			}
			return cs
		}
		square := e.uniformProjections(nodes(func(s float64) float64 { return s * s }), panels)
		if square == nil {
			t.Fatalf("%v: no FFT projections", ends)
		}
		for n, mu := range e.mu {
			d := e.delta[n]
			F := func(s float64) float64 {
				sn, c := math.Sincos(mu*s - d)
				return s*s*sn/mu + 2*s*c/(mu*mu) - 2*sn/(mu*mu*mu)
			}
			if want := F(l) - F(0); math.Abs(square[n]-want) > 1e-13 {
				t.Errorf("%v: mode %d of s²: %.16g, want %.16g", ends, n+1, square[n], want)
			}
		}
		mode3 := e.uniformProjections(nodes(func(s float64) float64 { return math.Cos(e.mu[2]*s - e.delta[2]) }), panels)
		for n := range e.mu {
			want := 0.0
			if n == 2 {
				want = l / 2
			}
			if math.Abs(mode3[n]-want) > 1e-14 {
				t.Errorf("%v: mode %d of X_3: %.3g, want %g", ends, n+1, mode3[n], want)
			}
		}
	}
	// A Robin end spaces the μ_n unevenly: no FFT projections.
	e := &EigenSide{L: 1.3, H: 0.7, Start: End{Kind: Robin, H: 2}, End: End{Kind: Dirichlet}, Opposite: End{Kind: Dirichlet}, Own: End{Kind: Dirichlet},
		Data: func(s float64) float64 { return 1 }}
	if err := e.Prepare(); err != nil {
		t.Fatal(err)
	}
	if e.uniformProjections(make([]float64, 16*(e.Modes/4+16)), e.Modes/4+16) != nil {
		t.Error("FFT projections for a Robin end")
	}
}
