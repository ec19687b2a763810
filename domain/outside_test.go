package domain_test

import (
	"psol/domain"
	"psol/series"
	"strings"
	"testing"
)

// Outside a circle: decaying sources give bounded solutions; a constant source does not.
// u = (r^−2 − 1)/4 solves Δu = r^−4 with u(1) = 0 (direct differentiation, common practice).
func TestOutside(t *testing.T) {
	o := domain.Outside{R: coef(t, "1")}
	sol := solve(t, "lap(u) = r^(-4)", o, "u = 0")
	assertChecks(t, sol)
	if want := expr(t, "(r^(-2) - 1)/4"); !sol.U.Equal(want) {
		t.Errorf("u = %s, want %s", sol.U.Text(), want.Text())
	}
	sol = solve(t, "lap(u) = r^(-3)*cos(theta)", domain.Outside{R: coef(t, "2")}, "dn(u) + u = sin(2theta)")
	assertChecks(t, sol)
	for _, tm := range sol.U.Terms() {
		if tm.P.Sign() > 0 || tm.P.Sign() == 0 && tm.L > 0 {
			t.Errorf("unbounded term %s", series.NewSum(tm).Text())
		}
	}
	for _, c := range []struct{ eq, bc, want string }{
		{"lap(u) = 1", "u = 0", "grows without bound"},
		{"lap(u) = r^(-2)", "u = 0", "grows without bound"},
		{"lap(u) = r^(-4)", "dn(u) = 1", "incompatible"},
	} {
		_, err := trySolve(c.eq, o, []string{c.bc}, nil)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s with %s outside: %v, want %q", c.eq, c.bc, err, c.want)
		}
	}
}
