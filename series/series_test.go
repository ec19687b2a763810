package series

import (
	"fmt"
	"math"
	"math/big"
	"math/rand"
	"testing"
)

func term(c Coef, p int64, l, m int, sin bool) Term {
	return Term{C: c, P: big.NewRat(p, 1), L: l, M: m, Sin: sin}
}

var (
	cos1 = Trig(1, false)
	sin1 = Trig(1, true)
)

// Product-to-sum identities (common practice; any table of trigonometric identities).
func TestTrigProducts(t *testing.T) {
	cases := []struct {
		name string
		got  Sum
		want Sum
	}{
		{"cos^2", cos1.Mul(cos1), Const(FracCoef(1, 2)).Add(Trig(2, false).Scale(FracCoef(1, 2)))},
		{"sin^2", sin1.Mul(sin1), Const(FracCoef(1, 2)).Sub(Trig(2, false).Scale(FracCoef(1, 2)))},
		{"sin cos", sin1.Mul(cos1), Trig(2, true).Scale(FracCoef(1, 2))},
		{"cos^3", cos1.Mul(cos1).Mul(cos1), cos1.Scale(FracCoef(3, 4)).Add(Trig(3, false).Scale(FracCoef(1, 4)))},
		{"sin 2 cos 3", Trig(2, true).Mul(Trig(3, false)), Trig(5, true).Sub(sin1).Scale(FracCoef(1, 2))},
		{"cos^2+sin^2", cos1.Mul(cos1).Add(sin1.Mul(sin1)), Const(IntCoef(1))},
	}
	for _, c := range cases {
		if !c.got.Equal(c.want) {
			t.Errorf("%s: got %s, want %s", c.name, c.got.Text(), c.want.Text())
		}
	}
}

// The Laplacian by the generic chain of ∂r and ∂θ agrees with the closed formula
// Δ[r^s (ln r)^i T(mθ)] = r^(s−2)[(s²−m²)(ln r)^i + 2si(ln r)^(i−1) + i(i−1)(ln r)^(i−2)] T(mθ)
// (the product rule applied by hand; SPEC §4 states it).
func TestLaplacianFormula(t *testing.T) {
	for _, s := range []*big.Rat{big.NewRat(0, 1), big.NewRat(3, 1), big.NewRat(-1, 2), big.NewRat(5, 3)} {
		for i := 0; i <= 3; i++ {
			for m := 0; m <= 3; m++ {
				u := NewSum(Term{C: IntCoef(1), P: s, L: i, M: m, Sin: m%2 == 1})
				p := new(big.Rat).Sub(s, big.NewRat(2, 1))
				ss := new(big.Rat).Mul(s, s)
				c0 := new(big.Rat).Sub(ss, big.NewRat(int64(m*m), 1))
				c1 := new(big.Rat).Mul(s, big.NewRat(int64(2*i), 1))
				var want []Term
				for _, w := range []Term{
					{C: RatCoef(c0), P: p, L: i},
					{C: RatCoef(c1), P: p, L: i - 1},
					{C: IntCoef(int64(i * (i - 1))), P: p, L: i - 2},
				} {
					if w.L >= 0 {
						w.M, w.Sin = m, m%2 == 1
						want = append(want, w)
					}
				}
				if got := u.Laplacian(); !got.Equal(NewSum(want...)) {
					t.Errorf("lap(%s) = %s, want %s", u.Text(), got.Text(), NewSum(want...).Text())
				}
			}
		}
	}
}

// The direct Laplacian agrees with the chain ∂rr + ∂r/r + ∂θθ/r² built from DR and DTheta,
// θ powers included.
func TestLaplacianChain(t *testing.T) {
	rng := rand.New(rand.NewSource(6))
	for i := 0; i < 300; i++ {
		s := randomSum(rng).Mul(NewSum(Term{C: IntCoef(1), K: rng.Intn(3)}))
		d := s.DR()
		chain := d.DR().Add(d.MulR(big.NewRat(-1, 1))).Add(s.DTheta().DTheta().MulR(big.NewRat(-2, 1)))
		if !s.Laplacian().Equal(chain) {
			t.Fatalf("Δ(%s): direct %s, chain %s", s.Text(), s.Laplacian().Text(), chain.Text())
		}
	}
}

func TestExactAtoms(t *testing.T) {
	half := big.NewRat(1, 2)
	r2, _ := IntCoef(2).Pow(half)
	r8, _ := IntCoef(8).Pow(big.NewRat(5, 2))
	ln4, _ := IntCoef(4).Ln()
	ln2, _ := IntCoef(2).Ln()
	q, _ := FracCoef(3, 2).Pow(half)
	cases := []struct {
		name, got, want string
	}{
		{"sqrt2^2", r2.Mul(r2).Text(), "2"},
		{"8^(5/2)", r8.Text(), "128*sqrt(2)"},
		{"ln 4", ln4.Text(), "2*ln(2)"},
		{"ln4 - 2 ln2", ln4.Sub(ln2.MulRat(big.NewRat(2, 1))).Text(), "0"},
		{"(3/2)^(1/2)", q.Text(), "1/2*sqrt(2)*sqrt(3)"},
		{"latex", q.LaTeX(), `\frac{\sqrt{2} \sqrt{3}}{2}`},
		{"params", SymCoef(Param("G")).Mul(SymCoef(Param("a")).Mul(SymCoef(Param("a")))).MulRat(big.NewRat(1, 4)).Mul(mustInv(SymCoef(Param("mu")))).Text(), "1/4*G*a^2/mu"},
		{"params latex", SymCoef(Param("G")).Mul(mustInv(SymCoef(Param("mu")))).MulRat(big.NewRat(1, 4)).LaTeX(), `\frac{G}{4 \mu}`},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("%s: got %q, want %q", c.name, c.got, c.want)
		}
	}
}

func mustInv(c Coef) Coef {
	inv, err := IntCoef(1).Div(c)
	if err != nil {
		panic(err)
	}
	return inv
}

func TestRationalFunctionCoefficients(t *testing.T) {
	a, b := SymCoef(Param("a")), SymCoef(Param("b"))
	q, err := a.Mul(a).Div(a.Mul(a).Add(a.Mul(b)))
	if err != nil {
		t.Fatal(err)
	}
	if got, want := q.Text(), "a/(a + b)"; got != want {
		t.Errorf("a²/(a² + ab) = %q, want %q", got, want)
	}
	back := q.Mul(a.Add(b))
	if !back.Equal(a) {
		t.Errorf("(a/(a+b))·(a+b) = %s, want a", back.Text())
	}
	if _, err := a.Div(Coef{}); err == nil {
		t.Error("division by zero was accepted")
	}
}

// Area integrals against elementary closed forms: ∬(a² − r²)/2 dA = πa⁴/4, so the
// torsion constant J = 2∬φ dA = πa⁴/2 (Timoshenko & Goodier, Theory of Elasticity,
// torsion of a circular shaft); ∬_{r<1} ln r dA = 2π∫_0^1 r ln r dr = −π/2 (elementary).
func TestDiskIntegral(t *testing.T) {
	a := SymCoef(Param("a"))
	phi := Const(a.Mul(a).MulRat(big.NewRat(1, 2))).Sub(R.Mul(R).Scale(FracCoef(1, 2)))
	j, err := phi.DiskIntegral(a)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := j.MulRat(big.NewRat(2, 1)).Text(), "1/2*pi*a^4"; got != want {
		t.Errorf("J = %s, want %s", got, want)
	}
	ln, _ := Apply("ln", ExactField(R))
	v, err := ln.Exact.DiskIntegral(IntCoef(1))
	if err != nil {
		t.Fatal(err)
	}
	if got, want := v.Text(), "-1/2*pi"; got != want {
		t.Errorf("∬ ln r dA = %s, want %s", got, want)
	}
	// With a log of the radius: ∬_{r<2} ln r dA = 2π[2 ln 2 − 1] (same integral, by parts).
	v, _ = ln.Exact.DiskIntegral(IntCoef(2))
	f, _ := v.Float(nil)
	if want := 2 * math.Pi * (2*math.Log(2) - 1); math.Abs(f-want) > 1e-14 {
		t.Errorf("∬_{r<2} ln r dA = %v, want %v", f, want)
	}
}

// randomSum draws a sum of a few terms with small rational coefficients.
func randomSum(rng *rand.Rand) Sum {
	var ts []Term
	for i := rng.Intn(4) + 1; i > 0; i-- {
		c := FracCoef(int64(rng.Intn(19)-9), int64(rng.Intn(5)+1))
		if rng.Intn(3) == 0 {
			c = c.Mul(SymCoef(Param([]string{"a", "mu", "k"}[rng.Intn(3)])))
		}
		ts = append(ts, Term{C: c, P: big.NewRat(int64(rng.Intn(7)-2), int64(rng.Intn(2)+1)), L: rng.Intn(2), M: rng.Intn(4), Sin: rng.Intn(2) == 0})
	}
	return NewSum(ts...)
}

func TestAlgebraLaws(t *testing.T) {
	rng := rand.New(rand.NewSource(1))
	for i := 0; i < 200; i++ {
		a, b, c := randomSum(rng), randomSum(rng), randomSum(rng)
		if !a.Mul(b).Equal(b.Mul(a)) {
			t.Fatalf("ab ≠ ba for a = %s, b = %s", a.Text(), b.Text())
		}
		if !a.Mul(b.Add(c)).Equal(a.Mul(b).Add(a.Mul(c))) {
			t.Fatalf("a(b+c) ≠ ab+ac for a = %s, b = %s, c = %s", a.Text(), b.Text(), c.Text())
		}
		if !a.Mul(b).Laplacian().Equal(a.Laplacian().Mul(b).Add(b.Laplacian().Mul(a)).Add(gradDot(a, b).Scale(IntCoef(2)))) {
			t.Fatalf("Δ(ab) ≠ bΔa + aΔb + 2∇a·∇b for a = %s, b = %s", a.Text(), b.Text())
		}
	}
}

// gradDot is ∇a·∇b = a_r b_r + a_θ b_θ / r².
func gradDot(a, b Sum) Sum {
	return a.DR().Mul(b.DR()).Add(a.DTheta().Mul(b.DTheta()).MulR(big.NewRat(-2, 1)))
}

// Float evaluation agrees with direct arithmetic.
func TestCompiledAt(t *testing.T) {
	s := R.Mul(R).Mul(sin1).Scale(FracCoef(3, 4)).Add(Const(SymCoef(Param("a"))))
	v, err := s.Eval(2, 0.3, Env{"a": FracCoef(1, 10)})
	if err != nil {
		t.Fatal(err)
	}
	if want := 0.75*4*math.Sin(0.3) + 0.1; math.Abs(v-want) > 1e-15 {
		t.Errorf("got %v, want %v", v, want)
	}
	if _, err := s.Eval(1, 0, nil); err == nil {
		t.Error("an unbound parameter evaluated")
	}
}

func ExampleSum_Laplacian() {
	u := R.Mul(R).Mul(R).Mul(sin1).Scale(FracCoef(3, 4)) // 3/4 r³ sin θ
	fmt.Println(u.Laplacian().Text())
	// Output: 6*r*sin(theta)
}

func ExampleSum_LaTeX() {
	u := R.Mul(R).Mul(R).Mul(sin1).Scale(FracCoef(3, 4))
	fmt.Println(u.LaTeX())
	// Output: \frac{3}{4} r^{3} \sin\theta
}

func ExampleCompiled_At() {
	u := Const(IntCoef(1)).Sub(R.Mul(R)) // 1 − r²
	c, _ := u.Compile(nil)
	fmt.Printf("%.4f\n", c.At(0.5, 0))
	// Output: 0.7500
}

func BenchmarkMul(b *testing.B) {
	rng := rand.New(rand.NewSource(2))
	x, y := randomSum(rng), randomSum(rng)
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		_ = x.Mul(y)
	}
}

// decimal12's strconv path must print what big.Float's Text('g', 12) does
// (the decimal conversion it replaces, correctly rounded both): checked on
// float64 values across the exponent range, halfway cases near 12 digits,
// whole numbers and the exponent format's thresholds.
func TestDecimal12MatchesBigFloat(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	values := []float64{0.5, 1e-5, 1e-4, 123456789012, 1234567890123, 1e21, 2.5e-300, 5e-324, math.MaxFloat64, 0.1, 1.0000000000005, 999999999999.5, 3}
	for i := 0; i < 20000; i++ {
		values = append(values, math.Ldexp(rng.Float64(), rng.Intn(400)-200))
	}
	for _, v := range values {
		q := new(big.Rat).SetFloat64(-v)
		want := new(big.Float).SetRat(new(big.Rat).Abs(q)).Text('g', 12)
		if got := decimal12(q); got != want {
			t.Fatalf("%v: %s, big.Float %s", v, got, want)
		}
	}
}
