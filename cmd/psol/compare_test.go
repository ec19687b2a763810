package main

import (
	"math"
	"regexp"
	"strconv"
	"strings"
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
//   - whole numbers below 10 exactly (exit statuses, small counts), larger
//     ones to 10% (terms summed, panels of an adaptive mesh: counts that
//     rounding can shift).
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
		return math.Abs(a-b) <= 0.1*math.Max(math.Abs(a), math.Abs(b))
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
