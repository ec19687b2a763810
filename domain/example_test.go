package domain_test

import (
	"fmt"

	"psol/domain"
	"psol/series"
)

// Fully developed flow in a round pipe: Δu = −1 on the unit disk with u = 0
// on the wall. The particular solution −r²/4 plus the constant the wall
// needs gives Poiseuille's profile (1 − r²)/4 (Bird, Stewart & Lightfoot §2.3).
func ExampleSolve() {
	source := series.ExactField(series.Const(series.IntCoef(-1)))
	wall := domain.Condition{Side: "rim", Kind: domain.Dirichlet, G: series.ExactField(series.Sum{})}
	sol, err := domain.Solve(domain.Disk{R: series.IntCoef(1)}, source, []domain.Condition{wall})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("u =", sol.U.Text())
	rep, _ := sol.Figures()
	fmt.Printf("flow rate %.6f (pi/8 = %.6f)\n", rep.Integral, 3.141592653589793/8)
	// Output:
	// u = 1/4 - 1/4*r^2
	// flow rate 0.392699 (pi/8 = 0.392699)
}
