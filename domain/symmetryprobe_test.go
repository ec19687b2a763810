package domain

import (
	"math"
	"testing"
)

// symmetryProbes on a slanted slab 0.02 thick in its 1 × 1.02 box (2% of
// the box inside): 97 probes, each inside, none another's image under the
// box's mirror lines or its half turn (a probe and its image would test a
// symmetric pair twice and an odd source's symmetry not at all).
func TestSymmetryProbes(t *testing.T) {
	inside := func(x, y float64) bool { return x > 0 && x < 1 && y > x && y < x+0.02 }
	box := Box{X0: 0, X1: 1, Y0: 0, Y1: 1.02}
	probes := symmetryProbes(box, inside)
	if len(probes) != 97 {
		t.Fatalf("%d probes, want 97", len(probes))
	}
	cx, cy := 0.5, 0.51
	for i, p := range probes {
		if !inside(p[0], p[1]) {
			t.Errorf("probe %d at (%g, %g) is outside", i, p[0], p[1])
		}
		for j, q := range probes {
			for _, img := range [][2]float64{{2*cx - q[0], q[1]}, {q[0], 2*cy - q[1]}, {2*cx - q[0], 2*cy - q[1]}} {
				if math.Hypot(p[0]-img[0], p[1]-img[1]) < 1e-9 {
					t.Errorf("probe %d is probe %d's image", i, j)
				}
			}
		}
	}
	if got := symmetryProbes(box, func(x, y float64) bool { return false }); len(got) != 0 {
		t.Errorf("%d probes in an empty region", len(got))
	}
}
