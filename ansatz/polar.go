package ansatz

import (
	"fmt"
	"math/big"

	"psol/series"
)

// Step records how one source term was solved, for --steps.
type Step struct {
	Rule   string
	Source series.Sum
	Result series.Sum
}

// NoRule reports a source term no rule covers.
type NoRule struct {
	Term   series.Sum
	Reason string
}

func (e *NoRule) Error() string {
	return fmt.Sprintf("no closed-form particular solution for %s: %s", e.Term.Text(), e.Reason)
}

// polarRule solves Δu = c·r^k (ln r)^j T(mθ) with u = r^s Σ_{i≤j+d} c_i (ln r)^i T(mθ),
// s = k + 2, where d is the resonance degree: Δ acts on r^s (ln r)^i T(mθ) as
//
//	r^(s−2) [ (s²−m²)(ln r)^i + 2s·i (ln r)^(i−1) + i(i−1)(ln r)^(i−2) ] T(mθ),
//
// so the (ln r)^i equation fixes c_{i+d} with the pivot of that degree.
type polarRule struct {
	name    string
	degree  int
	applies func(s *big.Rat, m int) bool
}

// polarRules is tried in order; the first rule that applies is used.
var polarRules = []polarRule{
	{"power-log-trig (double resonance s = m = 0: log degree +2)", 2, func(s *big.Rat, m int) bool { return s.Sign() == 0 && m == 0 }},
	{"power-log-trig (resonance s² = m²: log degree +1)", 1, func(s *big.Rat, m int) bool { return new(big.Rat).Abs(s).Cmp(big.NewRat(int64(m), 1)) == 0 }},
	{"power-log-trig", 0, func(*big.Rat, int) bool { return true }},
}

// pivot is the coefficient of c_{i+d} in the (ln r)^i equation.
func pivot(d int, s *big.Rat, m, i int) *big.Rat {
	switch d {
	case 0:
		return new(big.Rat).Sub(new(big.Rat).Mul(s, s), big.NewRat(int64(m*m), 1))
	case 1:
		return new(big.Rat).Mul(s, big.NewRat(int64(2*(i+1)), 1))
	}
	return big.NewRat(int64((i+2)*(i+1)), 1)
}

// lapCoef is the weight of c_n in the (ln r)^i equation (n ≥ i).
func lapCoef(s *big.Rat, m, i, n int) *big.Rat {
	switch n - i {
	case 0:
		return pivot(0, s, m, i)
	case 1:
		return pivot(1, s, m, i)
	case 2:
		return pivot(2, s, m, i)
	}
	return new(big.Rat)
}

func solvePolarTerm(t series.Term) (series.Sum, string, error) {
	if t.K != 0 {
		return series.Sum{}, "", &NoRule{series.NewSum(t), "a power of theta itself is not single-valued around the origin"}
	}
	s := new(big.Rat).Add(t.P, big.NewRat(2, 1))
	for _, rule := range polarRules {
		if !rule.applies(s, t.M) {
			continue
		}
		d, j := rule.degree, t.L
		c := make([]series.Coef, j+d+1) // c[0..d-1] stay 0: they multiply homogeneous solutions
		for i := j; i >= 0; i-- {
			rhs := series.Coef{}
			if i == j {
				rhs = t.C
			}
			for n := i + d + 1; n <= i+2 && n < len(c); n++ {
				rhs = rhs.Sub(c[n].MulRat(lapCoef(s, t.M, i, n)))
			}
			inv := new(big.Rat).Inv(pivot(d, s, t.M, i))
			c[i+d] = rhs.MulRat(inv)
		}
		terms := make([]series.Term, len(c))
		for i, ci := range c {
			terms[i] = series.Term{C: ci, P: s, L: i, M: t.M, Sin: t.Sin}
		}
		return series.NewSum(terms...), rule.name, nil
	}
	panic("unreachable: the last polar rule applies to every term")
}

// Particular is a particular solution of Δu = f for an exact polar sum f,
// solved term by term, with the rule used for each term.
func Particular(f series.Sum) (series.Sum, []Step, error) {
	var u series.Sum
	var steps []Step
	for _, t := range f.Terms() {
		p, rule, err := solvePolarTerm(t)
		if err != nil {
			return series.Sum{}, nil, err
		}
		u = u.Add(p)
		steps = append(steps, Step{rule, series.NewSum(t), p})
	}
	return u, steps, nil
}
