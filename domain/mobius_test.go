package domain

import (
	"math"
	"math/cmplx"
	"testing"
)

// The two circles' terms by multiplication (mobiusMap.terms) against
// cmplx.Pow of the same bases, and their derivatives against a central
// difference in z (an independent path each).
func TestMobiusTermsByMultiplication(t *testing.T) {
	m := &mobiusMap{l1: complex(0.3, 0.1), l2: complex(3.1, 1.05), lo: 0.11, hi: 0.27}
	var ks []int
	for j := 1; j <= 86; j++ {
		ks = append(ks, j, -j)
	}
	f, df := make([]complex128, len(ks)), make([]complex128, len(ks))
	fp, dfp := make([]complex128, len(ks)), make([]complex128, len(ks))
	fm, dfm := make([]complex128, len(ks)), make([]complex128, len(ks))
	for _, z := range []complex128{complex(0.5, 0.2), complex(-0.4, 0.6), complex(0.9, -0.1)} {
		m.terms(z, ks, f, df)
		const h = 1e-6
		m.terms(z+h, ks, fp, dfp)
		m.terms(z-h, ks, fm, dfm)
		w := m.w(z)
		for i, k := range ks {
			base := w / complex(m.hi, 0)
			if k < 0 {
				base = complex(m.lo, 0) / w
			}
			want := cmplx.Pow(base, complex(math.Abs(float64(k)), 0))
			if abs(f[i]-want) > 1e-12*abs(want) {
				t.Errorf("z %v, k %d: term %v, cmplx.Pow %v", z, k, f[i], want)
			}
			if d := (fp[i] - fm[i]) / (2 * h); abs(df[i]-d) > 1e-6*(abs(d)+abs(f[i])) {
				t.Errorf("z %v, k %d: derivative %v, central difference %v", z, k, df[i], d)
			}
		}
	}
}
