package domain

import (
	"math"
	"math/cmplx"
	"testing"
)

// The spread pivot's variable (spreadZeta): its derivative against a
// central difference in z, its zero at the corner, and its limit as the
// focal segment shrinks to the centre, (z − w)/(2(z − c))·e^(−1/2), the
// centre's pivot (the closed forms derived in spreadZeta's comment).
func TestSpreadZeta(t *testing.T) {
	hb := holeBasis{c: complex(0.45, 0.5), focus: 0.2985 * cmplx.Rect(1, 0.4), span: 0.33}
	w := hb.c + cmplx.Rect(1, 0.4)*complex(0.3, 0.03)
	for _, z := range []complex128{0.1 + 0.2i, 0.9 + 0.9i, 0.45 + 0.55i, 0.8 + 0.62i, 2 - 1i} {
		_, d := hb.spreadZeta(z, w)
		const h = 1e-6
		f1, _ := hb.spreadZeta(z+h, w)
		f0, _ := hb.spreadZeta(z-h, w)
		g1, _ := hb.spreadZeta(z+h*1i, w)
		g0, _ := hb.spreadZeta(z-h*1i, w)
		dx, dy := (f1-f0)/(2*h), (g1-g0)/(2*h*1i)
		if abs(d-dx) > 1e-7*abs(d) || abs(d-dy) > 1e-7*abs(d) {
			t.Errorf("ζ'(%v) = %v; differences %v, %v", z, d, dx, dy)
		}
	}
	if z, _ := hb.spreadZeta(w, w); z != 0 {
		t.Errorf("ζ(w) = %v, want 0", z)
	}
	tiny := holeBasis{c: hb.c, focus: 1e-7, span: 0.2}
	for _, z := range []complex128{0.1 + 0.2i, 0.9 + 0.9i} {
		got, _ := tiny.spreadZeta(z, w)
		want := (z - w) / (2 * (z - hb.c)) * complex(math.Exp(-0.5), 0)
		if abs(got-want) > 1e-6*abs(want) {
			t.Errorf("f → 0: ζ(%v) = %v, want the centre's pivot %v", z, got, want)
		}
	}
}

// spreadCutInside against the cut found another way: on a grid over each
// slot, the points where ζ's argument is within 0.02 of π (the principal
// branch's cut) and outside the hole, more than a grid step from its
// sides. A notch near a slot's end (from the top flank down to y = 0.005)
// lies across the cut of the two corners beside it.
func TestSpreadCutInside(t *testing.T) {
	for name, v := range map[string][]float64{
		"rectangle":  {-0.3, -0.03, 0.3, -0.03, 0.3, 0.03, -0.3, 0.03},
		"hexagon":    {-0.3, 0, -0.2, -0.03, 0.2, -0.03, 0.3, 0, 0.2, 0.03, -0.2, 0.03},
		"trapezium":  {-0.3, -0.01, 0.3, -0.05, 0.3, 0.05, -0.3, 0.01},
		"step":       {-0.3, -0.03, 0, -0.03, 0, -0.01, 0.3, -0.01, 0.3, 0.03, -0.3, 0.03},
		"notch":      {-0.3, -0.03, 0.3, -0.03, 0.3, 0.03, 0.26, 0.03, 0.26, 0.005, 0.24, 0.005, 0.24, 0.03, -0.3, 0.03},
		"triangular": {-0.3, 0, 0.3, -0.06, 0.3, 0.06},
	} {
		var xs, ys []float64
		for i := 0; i < len(v); i += 2 {
			xs, ys = append(xs, v[i]), append(ys, v[i+1])
		}
		c, f, m, ok := slotMap(xs, ys, nil)
		if !ok {
			t.Fatalf("%s: no slot map", name)
		}
		hb := holeBasis{c: c, focus: f, span: m}
		rejected := 0
		for k := range xs {
			w := complex(xs[k], ys[k])
			outside := 0
			for i := -400; i <= 400; i++ {
				for j := -100; j <= 100; j++ {
					z := complex(float64(i)*0.001, float64(j)*0.001)
					if z == w {
						continue
					}
					zeta, _ := hb.spreadZeta(z, w)
					if math.Abs(cmplx.Phase(zeta)) > math.Pi-0.02 && !insidePolygon(xs, ys, real(z), imag(z)) && edgeDistance(xs, ys, real(z), imag(z)) > 0.0015 {
						outside++
					}
				}
			}
			if got := spreadCutInside(xs, ys, k, hb); got != (outside == 0) {
				t.Errorf("%s, vertex %d: spreadCutInside %v, but %d grid points of the cut lie outside", name, k, got, outside)
			} else if !got {
				rejected++
			}
		}
		if want := map[bool]int{true: 2}[name == "notch"]; rejected != want {
			t.Errorf("%s: %d corners keep the centre's pivot, want %d", name, rejected, want)
		}
	}
}
