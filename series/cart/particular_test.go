package cart

import (
	"math/rand"
	"testing"

	"psol/series"
)

func randomPoly(rng *rand.Rand) Poly {
	var p Poly
	for k := rng.Intn(5) + 1; k > 0; k-- {
		c := series.FracCoef(int64(rng.Intn(19)-9), int64(rng.Intn(4)+1))
		if rng.Intn(3) == 0 {
			c = c.Mul(series.SymCoef(series.Param("a")))
		}
		p = p.Add(Monomial(c, rng.Intn(5), rng.Intn(5)))
	}
	return p
}

// The polynomial particular solution satisfies Δu_p = f exactly and
// vanishes on x = 0 and x = L (property test over generated sources).
func TestParticular(t *testing.T) {
	rng := rand.New(rand.NewSource(9))
	L := series.SymCoef(series.Param("L"))
	for k := 0; k < 200; k++ {
		f := randomPoly(rng)
		u := Particular(f, L)
		if !u.Laplacian().Equal(f) {
			t.Fatalf("Δ(%s) = %s, want %s", u.Text(), u.Laplacian().Text(), f.Text())
		}
		if !u.AtX(series.Coef{}).IsZero() || !u.AtX(L).IsZero() {
			t.Fatalf("%s does not vanish on x = 0 and x = L", u.Text())
		}
	}
	// The parabola for a constant source (common practice for channel flow between plates).
	if got, want := Particular(Monomial(series.IntCoef(-1), 0, 0), L), X.Scale(L).Sub(X.Mul(X)).Scale(series.FracCoef(1, 2)); !got.Equal(want) {
		t.Errorf("Δu = −1: %s, want x(L − x)/2", got.Text())
	}
}
