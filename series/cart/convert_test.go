package cart

import (
	"math"
	"math/big"
	"math/rand"
	"psol/series"
	"testing"
)

// Polar polynomials convert exactly: both forms agree at scattered points
// (direct evaluation of r^p cos mθ against the polynomial, an independent path).
func TestFromPolar(t *testing.T) {
	rng := rand.New(rand.NewSource(10))
	for k := 0; k < 100; k++ {
		var ts []series.Term
		for n := rng.Intn(3) + 1; n > 0; n-- {
			m := rng.Intn(5)
			p := m + 2*rng.Intn(3)
			ts = append(ts, series.Term{C: series.FracCoef(int64(rng.Intn(9)+1), 3), P: big.NewRat(int64(p), 1), M: m, Sin: m > 0 && rng.Intn(2) == 0})
		}
		s := series.NewSum(ts...)
		poly, err := FromPolar(s)
		if err != nil {
			t.Fatal(err)
		}
		for i := 0; i < 5; i++ {
			x, y := rng.Float64()*2-1, rng.Float64()*2-1
			want, _ := s.Eval(math.Hypot(x, y), math.Atan2(y, x), nil)
			got, _ := poly.Eval(x, y, nil)
			if math.Abs(got-want) > 1e-12*math.Max(1, math.Abs(want)) {
				t.Fatalf("%s at (%g, %g): polynomial %s gives %g, want %g", s.Text(), x, y, poly.Text(), got, want)
			}
		}
	}
	if _, err := FromPolar(series.NewSum(series.Term{C: series.IntCoef(1), P: big.NewRat(1, 1), L: 1})); err == nil {
		t.Error("r ln r converted to a polynomial")
	}
}

// Sine coefficients of a side polynomial: exact general term against gonum-free
// midpoint quadrature (an independent numeric path), and x(L − x) on [0, L]
// whose coefficients are 4L²(1 − (−1)^n)/(nπ)³ (an elementary integral, common practice).
func TestSineCoefficient(t *testing.T) {
	L := series.IntCoef(2)
	p := X.Scale(L).Sub(X.Mul(X))
	cs, ok := p.Coefficients()
	if !ok {
		t.Fatal("not one variable")
	}
	b, err := series.SineCoefficient(cs, L)
	if err != nil {
		t.Fatal(err)
	}
	for n := 1; n <= 6; n++ {
		v, err := series.Coefficient(b, n)
		if err != nil {
			t.Fatal(err)
		}
		got, _ := v.Float(nil)
		want := 16 * (1 - math.Pow(-1, float64(n))) / math.Pow(float64(n)*math.Pi, 3)
		num := 0.0
		const N = 200000
		for i := 0; i < N; i++ {
			s := 2 * (float64(i) + 0.5) / N
			num += s * (2 - s) * math.Sin(float64(n)*math.Pi*s/2)
		}
		num *= 2.0 / N
		if math.Abs(got-want) > 1e-14 || math.Abs(got-num) > 1e-9 {
			t.Errorf("b_%d = %.15g; closed form %.15g, quadrature %.15g", n, got, want, num)
		}
	}
}

// ModCircle: x² + y² − 4 vanishes on the circle of radius 2; x·y³ reduces
// to x·y·(4 − x²); a polynomial that does not vanish there stays nonzero.
func TestModCircle(t *testing.T) {
	four := series.IntCoef(4)
	if p := X.Mul(X).Add(Y.Mul(Y)).Sub(Monomial(four, 0, 0)); !p.ModCircle(four).IsZero() {
		t.Errorf("x^2 + y^2 - 4 reduces to %s", p.ModCircle(four).Text())
	}
	xy3 := X.Mul(Y).Mul(Y).Mul(Y)
	want := X.Mul(Y).Mul(Monomial(four, 0, 0).Sub(X.Mul(X)))
	if got := xy3.ModCircle(four); !got.Equal(want) {
		t.Errorf("x*y^3 reduces to %s, want %s", got.Text(), want.Text())
	}
	if X.Add(Y).ModCircle(four).IsZero() {
		t.Error("x + y reduces to zero")
	}
}
