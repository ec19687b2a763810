package parse_test

import (
	"fmt"

	"psol/parse"
	"psol/series"
)

// An equation is lowered to the source f of Δu = f, in the polar form the
// algebra keeps: with k = 2 bound, −xy/k = −r² sin 2θ/4 exactly.
func ExampleEquation() {
	f, err := parse.Equation("k*lap(u) = -x*y", series.Env{"k": series.IntCoef(2)})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("lap(u) =", f.Text())
	// Output:
	// lap(u) = -1/4*r^2*sin(2*theta)
}
