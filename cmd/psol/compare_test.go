package main

import (
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// numberToken finds decimal numbers in output text.
var numberToken = regexp.MustCompile(`[-+]?\d+(\.\d*)? \\{1,2}cdot 10\^\{[-+]?\d+\}|[-+]?\d+/\d+|[-+]?(\d+\.\d*|\.\d+|\d+)([eE][-+]?\d+)?`)

// sameOutput compares an output with its golden: the text between numbers
// exactly, and numbers within what the computation guarantees, so that the
// goldens survive another CPU (fused multiply-add) and another FFT build:
//   - decimals (with a point or an exponent) to 1e-9 relative or 1e-12
//     absolute (a small coefficient of a numeric part), and any two
//     below 1e-9 in size as equal (residuals and estimates at rounding level);
//   - fractions (a decimal written exactly, 346573590279973/1000000000000000)
//     by their value, to 1e-9 relative;
//   - two-digit figures below 1e-6 in size (d.de−XX: the largest sampled
//     residuals, error estimates) within a factor of 2: an adaptive method's
//     rounding-level decisions (a mode kept or dropped at the noise floor)
//     move them that much between CPUs, and their job is the magnitude;
//   - whole numbers below 10 exactly (exit statuses, small counts), larger
//     ones to 15% (terms summed, panels of an adaptive mesh: counts that
//     rounding can shift, as a panel bisected or not at the noise level).
func sameOutput(got, want string) bool {
	if got == want {
		return true
	}
	// Terms whose coefficient is below 1e-12 are rounding noise of numeric
	// modes (they come and go, and change sign, between CPUs): not compared.
	got, want = noiseTerm.ReplaceAllString(got, ""), noiseTerm.ReplaceAllString(want, "")
	gi, wi := numberToken.FindAllStringIndex(got, -1), numberToken.FindAllStringIndex(want, -1)
	if len(gi) != len(wi) {
		return false
	}
	gp, wp := 0, 0
	for k := range gi {
		if got[gp:gi[k][0]] != want[wp:wi[k][0]] {
			return false
		}
		g, w := got[gi[k][0]:gi[k][1]], want[wi[k][0]:wi[k][1]]
		if g != w && !closeNumbers(g, w) {
			return false
		}
		gp, wp = gi[k][1], wi[k][1]
	}
	return got[gp:] == want[wp:]
}

// noiseTerm is " + (c)*f" or " - c*f" with |c| < 1e-12 and f a power of
// theta or r, or a sine or cosine of a mode.
var noiseTerm = regexp.MustCompile(`\s[+-]\s\(?-?\d+(\.\d+)?e-(1[3-9]|[2-9]\d)\)?\*(theta(\^\d+)?|r(\^\d+)?|(sin|cos)\(\d*\*?theta\))`)

// diagnostic is a figure printed with two significant digits and an exponent.
var diagnostic = regexp.MustCompile(`^\d\.\de[-+]\d+$`)

func closeNumbers(g, w string) bool {
	a, okA := numberValue(g)
	b, okB := numberValue(w)
	if !okA || !okB {
		return false
	}
	whole := regexp.MustCompile(`^[-+]?\d+$`)
	if whole.MatchString(g) && whole.MatchString(w) {
		if math.Abs(a) < 10 || math.Abs(b) < 10 {
			return false
		}
		return math.Abs(a-b) <= 0.15*math.Max(math.Abs(a), math.Abs(b))
	}
	if diagnostic.MatchString(g) && diagnostic.MatchString(w) && math.Abs(a) < 1e-6 && math.Abs(b) < 1e-6 &&
		a*b > 0 && math.Max(a/b, b/a) <= 2 {
		return true
	}
	if math.Abs(a) < 1e-9 && math.Abs(b) < 1e-9 || math.Abs(a-b) <= 1e-12 {
		return true
	}
	return math.Abs(a-b) <= 1e-9*math.Max(math.Abs(a), math.Abs(b))
}

// numberValue reads a decimal, a fraction p/q, or LaTeX's m \cdot 10^{e}.
func numberValue(s string) (float64, bool) {
	if m, e, ok := strings.Cut(s, "cdot 10^{"); ok {
		mant, errM := strconv.ParseFloat(strings.TrimRight(strings.TrimSpace(m), "\\ "), 64)
		exp, errE := strconv.Atoi(strings.TrimSuffix(e, "}"))
		return mant * math.Pow(10, float64(exp)), errM == nil && errE == nil
	}
	if p, q, ok := strings.Cut(s, "/"); ok {
		a, errA := strconv.ParseFloat(p, 64)
		b, errB := strconv.ParseFloat(q, 64)
		return a / b, errA == nil && errB == nil && b != 0
	}
	v, err := strconv.ParseFloat(s, 64)
	return v, err == nil
}

// The comparator's rules, each with a case it must accept and one it must
// refuse: it is what keeps the goldens honest across CPUs.
func TestSameOutput(t *testing.T) {
	for _, c := range []struct {
		got, want string
		same      bool
	}{
		{"u = 0.0563626361051", "u = 0.0563626361051", true},
		{"u = 0.0563626361051", "u = 0.0563626361052", true},  // 1.8e-12 relative
		{"u = 0.0563626361051", "u = 0.0563626371051", false}, // 1.8e-8 relative
		{"residual 2.1e-08 on left", "residual 2.8e-08 on left", true},
		{"residual 2.1e-08 on left", "residual 8.4e-08 on left", false}, // a factor 4
		{"residual 2.1e-08 on left", "residual -2.1e-08 on left", false},
		{"residual 2.1e-05 on left", "residual 2.8e-05 on left", false}, // not at rounding's level
		{"a value 2.1e-08", "a value 2.15e-08", false},                  // three digits: not a diagnostic
		{"on 16 panels", "on 18 panels", true},
		{"on 16 panels", "on 20 panels", false},
		{"exit 1", "exit 2", false},
		{"residual 3.0e-10", "residual 9.0e-11", true}, // both below 1e-9
	} {
		if got := sameOutput(c.got, c.want); got != c.same {
			t.Errorf("sameOutput(%q, %q) = %v, want %v", c.got, c.want, got, c.same)
		}
	}
}
