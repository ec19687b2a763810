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
	applies func(s, nu2 series.Coef) bool
}

// polarRules is tried in order; the first rule that applies is used. ν² is
// m² for a Fourier mode and may be symbolic (a sector's ν_n² in n).
var polarRules = []polarRule{
	{"power-log-trig (double resonance s = m = 0: log degree +2)", 2, func(s, nu2 series.Coef) bool { return s.IsZero() && nu2.IsZero() }},
	{"power-log-trig (resonance s² = m²: log degree +1)", 1, func(s, nu2 series.Coef) bool { return s.Mul(s).Equal(nu2) }},
	{"power-log-trig", 0, func(series.Coef, series.Coef) bool { return true }},
}

// weight is the coefficient of c_n in the (ln r)^i equation (n ≥ i).
func weight(s, nu2 series.Coef, i, n int) series.Coef {
	switch n - i {
	case 0:
		return s.Mul(s).Sub(nu2)
	case 1:
		return s.MulRat(big.NewRat(int64(2*(i+1)), 1))
	case 2:
		return series.IntCoef(int64((i + 2) * (i + 1)))
	}
	return series.Coef{}
}

// mulCoef is a·w, fast when w is rational.
func mulCoef(a, w series.Coef) series.Coef {
	if q, ok := w.Rat(); ok {
		return a.MulRat(q)
	}
	return a.Mul(w)
}

// Radial solves ρ” + ρ'/r − ν²ρ/r² = c·r^(s−2) (ln r)^j for ρ = r^s Σ_i c_i (ln r)^i,
// returning the c_i and the rule used. Homogeneous parts (c_i, i < d) are 0.
func Radial(c series.Coef, s *big.Rat, j int, nu2 series.Coef) ([]series.Coef, string) {
	sc := series.RatCoef(s)
	for _, rule := range polarRules {
		if !rule.applies(sc, nu2) {
			continue
		}
		d := rule.degree
		cs := make([]series.Coef, j+d+1)
		for i := j; i >= 0; i-- {
			rhs := series.Coef{}
			if i == j {
				rhs = c
			}
			for n := i + d + 1; n <= i+2 && n < len(cs); n++ {
				rhs = rhs.Sub(mulCoef(cs[n], weight(sc, nu2, i, n)))
			}
			w := weight(sc, nu2, i, i+d) // the rule guarantees a nonzero pivot
			if q, ok := w.Rat(); ok {
				cs[i+d] = rhs.MulRat(new(big.Rat).Inv(q)) // the common case: a rational pivot
			} else {
				cs[i+d], _ = rhs.Div(w)
			}
		}
		return cs, rule.name
	}
	panic("unreachable: the last polar rule applies to every term")
}

func solvePolarTerm(t series.Term) (series.Sum, string, error) {
	if t.K != 0 {
		return series.Sum{}, "", &NoRule{series.NewSum(t), "a power of theta itself is not single-valued around the origin"}
	}
	s := new(big.Rat).Add(t.P, big.NewRat(2, 1))
	cs, rule := Radial(t.C, s, t.L, series.IntCoef(int64(t.M)*int64(t.M)))
	terms := make([]series.Term, len(cs))
	for i, ci := range cs {
		terms[i] = series.Term{C: ci, P: s, L: i, M: t.M, Sin: t.Sin}
	}
	return series.NewSum(terms...), rule, nil
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
