package domain_test

import (
	"fmt"
	"math"
	"psol/domain"
	"testing"
)

// The tensor-grid evaluation agrees with point-by-point evaluation, for a
// closed form, a sector series, and jump data with rows next to the rim.
func TestGridMatchesPoints(t *testing.T) {
	for _, sol := range []*domain.Solution{
		solve(t, "lap(u) = x*y - ln(r)", annulus(t, "1/2", "2"), "inner: dn(u) + 3u = cos(theta)", "outer: u = x"),
		solve(t, "lap(u) = -2", sector(t, "1", "3*pi/2"), "arc: u = 0", "start: u = 0", "end: u = 1"),
		solve(t, "lap(u) = 1", unitDisk, "u = 0 < theta < pi ? theta : 0"),
	} {
		ev := evaluator(t, sol, 1e-13)
		rs := []float64{0.55, 0.7, 0.93, 0.999}
		ths := []float64{0.1, 1, 2.5, 4.6}
		if _, ok := sol.Domain.(domain.Sector); ok {
			ths = []float64{0.1, 1, 2.5, 4.6 * 0.95}
		}
		grid, _ := ev.Grid(rs, ths)
		for i, r := range rs {
			for j, th := range ths {
				want, _, _ := ev.At(r, th)
				if math.Abs(grid[i][j]-want) > 1e-11*math.Max(1, math.Abs(want)) {
					t.Errorf("%s at (%g, %g): grid %.14g, point %.14g", sol.Domain.Describe(), r, th, grid[i][j], want)
				}
			}
		}
	}
}

// BenchmarkGridEval evaluates the sector series (50 terms) on n×n grids, no output.
func BenchmarkGridEval(b *testing.B) {
	sol := solve(b, "lap(u) = -2", sector(b, "1", "3*pi/2"), "arc: u = 0", "start: u = 0", "end: u = 0")
	ev, err := sol.Compile(nil, 1e-12, 50)
	if err != nil {
		b.Fatal(err)
	}
	for _, n := range []int{50, 200, 500} {
		b.Run(fmt.Sprintf("n=%d", n), func(b *testing.B) {
			rs, ths := make([]float64, n), make([]float64, n)
			for i := range rs {
				rs[i], ths[i] = float64(i)/float64(n-1), 3*math.Pi/2*float64(i)/float64(n-1)
			}
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				ev.Grid(rs, ths)
			}
		})
	}
}
