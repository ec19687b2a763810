package ansatz

import (
	"fmt"
	"math"
	"math/big"
	"math/rand"
	"strings"
	"testing"

	"psol/series"
)

func single(c series.Coef, p *big.Rat, l, m int, sin bool) series.Sum {
	return series.NewSum(series.Term{C: c, P: p, L: l, M: m, Sin: sin})
}

func rat(a, b int64) *big.Rat { return big.NewRat(a, b) }

// Particular solutions checked by hand differentiation (each satisfies Δu = f
// by the r^s (ln r)^i rule of SPEC §4; the textbook forms are common practice).
func TestPolarRules(t *testing.T) {
	one := series.IntCoef(1)
	cases := []struct {
		name   string
		source series.Sum
		want   string
		rule   string
	}{
		{"r^2 cos 4θ (resonance)", single(one, rat(2, 1), 0, 4, false), "1/8*r^4*ln(r)*cos(4*theta)", "resonance"},
		{"ln r", single(one, rat(0, 1), 1, 0, false), "-1/4*r^2 + 1/4*r^2*ln(r)", "power-log-trig"},
		{"r^(1/2) cos θ", single(one, rat(1, 2), 0, 1, false), "4/21*r^(5/2)*cos(theta)", "power-log-trig"},
		{"r cos 3θ (resonance)", single(one, rat(1, 1), 0, 3, false), "1/6*r^3*ln(r)*cos(3*theta)", "resonance"},
		{"1/r^2 (double resonance)", single(one, rat(-2, 1), 0, 0, false), "1/2*ln(r)^2", "double"},
		{"constant", single(series.IntCoef(-2), rat(0, 1), 0, 0, false), "-1/2*r^2", "power-log-trig"},
		{"6 r sin θ", single(series.IntCoef(6), rat(1, 1), 0, 1, true), "3/4*r^3*sin(theta)", "power-log-trig"},
		{"cos θ / r (resonance s = m)", single(one, rat(-1, 1), 0, 1, false), "1/2*r*ln(r)*cos(theta)", "resonance"},
		{"sin 2θ / r^4 (resonance s = −m)", single(one, rat(-4, 1), 0, 2, true), "-1/4*r^(-2)*ln(r)*sin(2*theta)", "resonance"},
	}
	for _, c := range cases {
		got, steps, err := Particular(c.source)
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if got.Text() != c.want {
			t.Errorf("%s: got %s, want %s", c.name, got.Text(), c.want)
		}
		if !got.Laplacian().Equal(c.source) {
			t.Errorf("%s: Δ(%s) = %s ≠ source", c.name, got.Text(), got.Laplacian().Text())
		}
		if len(steps) != 1 || !strings.Contains(steps[0].Rule, c.rule) {
			t.Errorf("%s: rule %v, want one containing %q", c.name, steps, c.rule)
		}
	}
}

// Every term of the power-log-trig form gets a particular solution with Δu_p = f,
// including every resonance (property test over generated terms).
func TestPolarRulesProperty(t *testing.T) {
	rng := rand.New(rand.NewSource(3))
	for i := 0; i < 500; i++ {
		m := rng.Intn(5)
		var p *big.Rat
		if rng.Intn(2) == 0 {
			s := int64(rng.Intn(2*m+1) - m) // s = k + 2 ∈ [−m, m]: hits s = ±m and s = 0
			p = rat(s-2, 1)
		} else {
			p = rat(int64(rng.Intn(13)-6), int64(rng.Intn(3)+1))
		}
		c := series.FracCoef(int64(rng.Intn(9)+1), int64(rng.Intn(4)+1)).Mul(series.SymCoef(series.Param("q")))
		f := single(c, p, rng.Intn(4), m, rng.Intn(2) == 0)
		u, _, err := Particular(f)
		if err != nil {
			t.Fatalf("%s: %v", f.Text(), err)
		}
		if !u.Laplacian().Equal(f) {
			t.Fatalf("Δ(%s) = %s, want %s", u.Text(), u.Laplacian().Text(), f.Text())
		}
	}
}

func TestAngleSourceRefused(t *testing.T) {
	f := series.Theta.Mul(series.R)
	if _, _, err := Particular(f); err == nil {
		t.Error("a source with a power of theta got a polar particular solution")
	}
}

func ExampleParticular() {
	f := single(series.IntCoef(1), rat(0, 1), 1, 0, false) // ln r
	u, _, _ := Particular(f)
	fmt.Println(u.Text())
	// Output: -1/4*r^2 + 1/4*r^2*ln(r)
}

func BenchmarkParticular(b *testing.B) {
	for _, n := range []int{1, 5, 25} {
		var ts []series.Term
		for i := 0; i < n; i++ {
			ts = append(ts, series.Term{C: series.FracCoef(int64(i+1), 3), P: rat(int64(i%4), 1), L: i % 3, M: i%5 + 1, Sin: i%2 == 0})
		}
		f := series.NewSum(ts...)
		b.Run(fmt.Sprintf("terms=%d", f.Len()), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				if _, _, err := Particular(f); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// The centre's product rule for mode 0's log kernel integrates t ln t·t^k
// exactly for k ≤ 15: ∫_0^1 t^(k+1) ln t dt = −1/(k + 2)² (integration by
// parts, common practice).
func TestCentreLogWeights(t *testing.T) {
	w := centreLogWeights()
	for k := 0; k <= 15; k++ {
		got := 0.0
		for i, x := range GaussX {
			got += w[i] * math.Pow((x+1)/2, float64(k))
		}
		want := -1 / float64((k+2)*(k+2))
		if math.Abs(got-want) > 1e-15 {
			t.Errorf("k = %d: %.17g, want %.17g", k, got, want)
		}
	}
}
