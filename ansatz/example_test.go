package ansatz_test

import (
	"fmt"

	"psol/ansatz"
	"psol/series"
)

// A resonant source: Δu = cos 2θ. The plain ansatz c·r²cos 2θ is harmonic
// and cannot produce it, so the rule takes the logarithm: Δ[r² ln r cos 2θ]
// = 4 cos 2θ (by hand: Δ[r^s ln r T_m] = ((s² − m²) ln r + 2s) r^(s−2) T_m).
func ExampleParticular() {
	f := series.Trig(2, false)
	up, steps, err := ansatz.Particular(f)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("u_p =", up.Text())
	fmt.Println("rule:", steps[0].Rule)
	fmt.Println("check:", up.Laplacian().Sub(f).IsZero())
	// Output:
	// u_p = 1/4*r^2*ln(r)*cos(2*theta)
	// rule: power-log-trig (resonance s² = m²: log degree +1)
	// check: true
}
