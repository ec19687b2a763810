package series

import "sync"

// powBases remembers the ratio behind each ρ^n atom, by its text.
var powBases sync.Map // string → Coef

// PowIndex is the atom ρ^n for the index n and a fixed ratio ρ, such as R1/R2
// in an annulus' general term.
func PowIndex(rho Coef) Coef {
	name := rho.Text()
	powBases.LoadOrStore(name, rho)
	return SymCoef(Symbol{kindPowN, name})
}

func powBase(name string) Coef {
	v, _ := powBases.Load(name)
	c, _ := v.(Coef)
	return c
}
