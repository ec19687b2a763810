package main

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"psol/domain"
	"psol/parse"
)

// A section with a source by quadrature plots (it was refused: "no polar
// range for this region", the ring sampler being the circles'), and each
// pixel's value is the evaluator's with its estimate, to rounding.
func TestPlotSectionQuadrature(t *testing.T) {
	path := filepath.Join(t.TempDir(), "s.svg")
	args := []string{"solve", "lap(u) = exp(-((x-0.3)^2+y^2)/0.05)", "--polygon", "0,0 1,0 1,1 0,1", "--bc", "u = 0", "--plot", path}
	var out, errb bytes.Buffer
	if code := run(args, &out, &errb); code != 0 {
		t.Fatal(errb.String())
	}
	data, err := os.ReadFile(path)
	if err != nil || !strings.Contains(string(data), "<svg") {
		t.Fatalf("no picture written (%v)", err)
	}
	xs, ys, _, err := parse.Vertices("--polygon", "0,0 1,0 1,1 0,1", nil)
	if err != nil {
		t.Fatal(err)
	}
	sq := domain.Polygon{X: xs, Y: ys}
	src, err := parse.Equation("lap(u) = exp(-((x-0.3)^2+y^2)/0.05)", nil)
	if err != nil {
		t.Fatal(err)
	}
	var conds []domain.Condition
	for _, s := range sq.Sides() {
		c, err := parse.Condition(s+": u = 0", sq.Sides(), nil)
		if err != nil {
			t.Fatal(err)
		}
		conds = append(conds, c)
	}
	sol, err := domain.SolveWith(sq, src, conds, domain.Options{Tol: 1e-12})
	if err != nil {
		t.Fatal(err)
	}
	ev, err := sol.Compile(nil, 1e-12, 1<<12)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range [][2]float64{{0.5, 0.7}, {0.3, 0.2}} {
		r, th := math.Hypot(p[0], p[1]), math.Atan2(p[1], p[0])
		want, _, _ := ev.At(r, th)
		if got := ev.Value(r, th); math.Abs(got-want) > 1e-15 {
			t.Errorf("Value(%v) = %.16f, At %.16f", p, got, want)
		}
	}
}
