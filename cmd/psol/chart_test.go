package main

import (
	"math"
	"slices"
	"testing"

	"gonum.org/v1/plot/vg"
)

// The axes' round values: steps of 1, 2 or 5 times a power of ten (common
// practice for chart axes), every value inside the range, labels with the
// digits their spacing needs.
func TestNiceTicks(t *testing.T) {
	for _, c := range []struct {
		lo, hi float64
		want   int
		major  []float64
		labels []string
	}{
		{0, 2, 5, []float64{0, 0.5, 1, 1.5, 2}, []string{"0", "0.5", "1.0", "1.5", "2.0"}},
		{-1, 1, 5, []float64{-1, -0.5, 0, 0.5, 1}, []string{"-1.0", "-0.5", "0", "0.5", "1.0"}},
		{0, 0.147, 3, []float64{0, 0.05, 0.1}, []string{"0", "0.05", "0.10"}},
		{0, 4.9e-5, 4, []float64{0, 2e-5, 4e-5}, []string{"0", "2e-05", "4e-05"}},
		{0, 0.02, 1, []float64{0, 0.02}, []string{"0", "0.02"}},
		{-0.0423, 0, 4, []float64{-0.04, -0.02, 0}, []string{"-0.04", "-0.02", "0"}},
		{-0.0423, 0, 5, []float64{-0.04, -0.03, -0.02, -0.01, 0}, []string{"-0.04", "-0.03", "-0.02", "-0.01", "0"}},
		{1e5, 3e5, 2, []float64{1e5, 2e5, 3e5}, []string{"1e+05", "2e+05", "3e+05"}},
	} {
		major, minor := niceTicks(c.lo, c.hi, c.want)
		if len(major) != len(c.major) {
			t.Errorf("niceTicks(%g, %g, %d) = %v, want %v", c.lo, c.hi, c.want, major, c.major)
			continue
		}
		for i, v := range major {
			if math.Abs(v-c.major[i]) > 1e-12*math.Max(1, math.Abs(c.major[i])) {
				t.Errorf("niceTicks(%g, %g, %d) = %v, want %v", c.lo, c.hi, c.want, major, c.major)
				break
			}
			if got := tickLabel(v, major); got != c.labels[i] {
				t.Errorf("tickLabel(%g) = %q, want %q", v, got, c.labels[i])
			}
		}
		all := slices.Concat(major, minor)
		for _, v := range all {
			if v < c.lo-1e-12 || v > c.hi+1e-12 {
				t.Errorf("niceTicks(%g, %g): tick %g outside", c.lo, c.hi, v)
			}
		}
	}
	if major, _ := niceTicks(3, 3, 5); len(major) != 1 || major[0] != 3 {
		t.Errorf("an empty range: %v", major)
	}
	// An axis takes at least two labelled values: a colour bar over
	// [0, 4.9e-5], where two ticks a step of 5e-5 apart leave only 0.
	if major, _ := niceTicks(0, 4.9e-5, 2); len(major) != 1 {
		t.Errorf("niceTicks(0, 4.9e-5, 2) = %v: the case below no longer tests the retry", major)
	}
	if major, _ := axisTicks(0, 4.9e-5, 1.5*vg.Inch); len(major) < 2 {
		t.Errorf("axisTicks over [0, 4.9e-5] on 1.5 in: %v", major)
	}
}

// A region thinner than 1:8 is stretched across, and its axis says so.
func TestChartStretch(t *testing.T) {
	m := &mapChart{x0: 0, x1: 1, y0: 0, y1: 0.02}
	wx, wy := m.shownSpans()
	if wx != 1 || math.Abs(wy-1.0/chartMaxAspect) > 1e-15 {
		t.Errorf("shown spans %g, %g", wx, wy)
	}
	if got := axisName("y", wy/0.02); got != "y (stretched ×6.25)" {
		t.Errorf("axis name %q", got)
	}
	if got := axisName("x", 1); got != "x" {
		t.Errorf("axis name %q", got)
	}
}
