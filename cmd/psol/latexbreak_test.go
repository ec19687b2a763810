package main

import (
	"strings"
	"testing"
)

// Every line breakLaTeX makes is balanced on its own (braces and
// \left…\right), the lines rejoin to the formula, and a short formula
// stays on one line.
func TestBreakLaTeX(t *testing.T) {
	long := `\frac{1}{96} r^{5} \sin\theta + \frac{1}{64} r^{5} \sin 3\theta + \frac{1}{2} - \frac{1}{96} r \sin\theta + \frac{1}{2} r^{2} \cos 2\theta - \frac{1}{64} r^{3} \sin 3\theta + \left(\frac{1}{2 \pi} r^{2}\right) \sin\left(2 \theta\right)`
	lines := breakLaTeX(long)
	if len(lines) < 2 {
		t.Fatalf("a long sum stays on one line: %q", lines)
	}
	for _, l := range lines {
		if strings.Count(l, "{") != strings.Count(l, "}") || strings.Count(l, `\left`) != strings.Count(l, `\right`) {
			t.Errorf("unbalanced line %q", l)
		}
	}
	if got := strings.Join(lines, " "); strings.Join(strings.Fields(got), " ") != strings.Join(strings.Fields(long), " ") {
		t.Errorf("the lines rejoin to\n%s\nnot\n%s", got, long)
	}
	if short := `\frac{1}{2} r^{2}`; len(breakLaTeX(short)) != 1 {
		t.Errorf("a short formula is broken: %q", breakLaTeX(short))
	}
	// A wide \ln(...) opens into fixed-size delimiters, cut inside.
	wide := `\frac{1}{4 \pi} \ln\left(1 + \left(\frac{1}{2} - \frac{\sqrt{3}}{5}\right) x + \left(-\frac{1}{5} - \frac{\sqrt{3}}{2}\right) y + \frac{29}{100} x^{2} + \frac{29}{100} y^{2} + \frac{31}{100} x y\right)`
	lines = breakLaTeX(wide)
	if len(lines) < 2 || !strings.Contains(lines[0], `\biggl(`) || !strings.Contains(lines[len(lines)-1], `\biggr)`) {
		t.Errorf("a wide logarithm is not opened: %q", lines)
	}
}
