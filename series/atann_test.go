package series

import (
	"math"
	"math/big"
	"testing"
)

// cos nφ and sin nφ for φ = atan2(y, x) in every quadrant, on and off the
// multiples of π/4: the exact value at a whole n (from (1 + it)^n) and the
// float64 one, both against math.Cos(n·atan2(y, x)) (the definition).
func TestIndexTrig(t *testing.T) {
	points := [][2]int64{{3, 2}, {-3, 2}, {-3, -2}, {3, -2}, {1, 7}, {2, 0}, {-1, 0}, {0, 5}, {0, -1}, {4, 4}, {-2, 2}}
	for _, p := range points {
		c, s, ok := IndexTrig(IntCoef(p[0]), IntCoef(p[1]))
		if !ok {
			t.Fatalf("(%d, %d): no exact atoms", p[0], p[1])
		}
		phi := math.Atan2(float64(p[1]), float64(p[0]))
		for n := int64(1); n <= 9; n++ {
			env := Env{Index: IntCoef(n)}
			for i, v := range []Coef{c, s} {
				want := math.Cos(float64(n) * phi)
				if i == 1 {
					want = math.Sin(float64(n) * phi)
				}
				exact, err := v.Subst(env)
				if err != nil {
					t.Fatalf("(%d, %d) n = %d: %v", p[0], p[1], n, err)
				}
				ev, err := exact.Float(nil)
				if err != nil {
					t.Fatal(err)
				}
				fl, err := v.Float(env)
				if err != nil {
					t.Fatal(err)
				}
				if math.Abs(ev-want) > 1e-14 || math.Abs(fl-want) > 1e-13 {
					t.Errorf("(%d, %d) n = %d, %s: exact %.16g, float %.16g, want %.16g", p[0], p[1], n, v.Text(), ev, fl, want)
				}
			}
		}
	}
	// With roots: the angle of (−√2, 3) and of (1/2, −√5/3), and the
	// angles themselves (Angle) against math.Atan2.
	sqrt := func(q int64) Coef { c, _ := IntCoef(q).Pow(big.NewRat(1, 2)); return c }
	for _, p := range [][2]Coef{{sqrt(2).Neg(), IntCoef(3)}, {FracCoef(1, 2), sqrt(5).MulRat(big.NewRat(-1, 3))}, {sqrt(3), IntCoef(1)}} {
		c, s, ok := IndexTrig(p[0], p[1])
		x, _ := p[0].Float(nil)
		y, _ := p[1].Float(nil)
		phi := math.Atan2(y, x)
		if !ok {
			t.Fatalf("(%s, %s): no atoms", p[0].Text(), p[1].Text())
		}
		for n := int64(1); n <= 7; n++ {
			for i, v := range []Coef{c, s} {
				want := math.Cos(float64(n) * phi)
				if i == 1 {
					want = math.Sin(float64(n) * phi)
				}
				exact, err := v.Subst(Env{Index: IntCoef(n)})
				if err != nil {
					t.Fatal(err)
				}
				ev, _ := exact.Float(nil)
				if math.Abs(ev-want) > 1e-13 {
					t.Errorf("(%s, %s) n = %d: %.16g, want %.16g", p[0].Text(), p[1].Text(), n, ev, want)
				}
			}
		}
		a, ok := Angle(p[0], p[1])
		if v, _ := a.Float(nil); !ok || math.Abs(v-phi) > 1e-15 {
			t.Errorf("angle of (%s, %s): %s = %v, want %v", p[0].Text(), p[1].Text(), a.Text(), v, phi)
		}
	}
	if _, _, ok := IndexTrig(Coef{}, Coef{}); ok {
		t.Error("the origin has no angle")
	}
	if _, _, ok := IndexTrig(SymCoef(Param("a")), IntCoef(1)); ok {
		t.Error("a parameter's angle is not exact")
	}
}

// The series with general term cos(n·atan t) sums, in float64, to the
// closed form Re Σ w^n/n = −ln|1 − w| for w = m·e^{iφ} (common practice).
func TestFourierFieldSum(t *testing.T) {
	c, s, _ := IndexTrig(IntCoef(-3), IntCoef(2))
	m := FracCoef(1, 2)
	w := complex(0.5*-3/math.Sqrt(13), 0.5*2/math.Sqrt(13))
	perN, _ := PowIndex(m).Div(IndexCoef)
	fc := FourierCoefficients{A: perN.Mul(c), B: perN.Mul(s)}
	f := FourierField(fc)
	cf, err := f.Compile(nil)
	if err != nil {
		t.Fatal(err)
	}
	for _, th := range []float64{0, 0.7, 2, -2.5} {
		// Σ (m^n/n)(cos nφ cos nθ + sin nφ sin nθ) = −ln|1 − w e^{−iθ}|.
		z := w * complex(math.Cos(-th), math.Sin(-th))
		want := -math.Log(math.Hypot(1-real(z), imag(z)))
		if got := cf.At(1, th); math.Abs(got-want) > 1e-14 {
			t.Errorf("theta = %g: %.16g, want %.16g", th, got, want)
		}
	}
	on, ok := f.Scale(IntCoef(2)).Add(ExactField(Const(IntCoef(1)))).FourierOn(IntCoef(1))
	if !ok || !on.A0.Equal(IntCoef(1)) || !on.A.Equal(fc.A.Mul(IntCoef(2))) {
		t.Errorf("coefficients of 1 + 2·series: %+v, %v", on, ok)
	}
	if txt := f.Text(); txt != "(sum(n=1..inf, ((-1)^n*(1/2)^n*cos(n*atan(2/3))/n)*cos(n*theta)) + sum(n=1..inf, (-(-1)^n*(1/2)^n*sin(n*atan(2/3))/n)*sin(n*theta)))" {
		t.Errorf("text %s", txt)
	}
}
