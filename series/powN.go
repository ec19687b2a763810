package series

import "sync"

// registry remembers the coefficient behind an atom's name (its text): a
// ρ^n atom's ratio, an angle atom's t.
type registry struct{ m sync.Map } // string → Coef

func (r *registry) name(c Coef) string {
	n := c.Text()
	r.m.LoadOrStore(n, c)
	return n
}

func (r *registry) coef(name string) Coef {
	v, _ := r.m.Load(name)
	c, _ := v.(Coef)
	return c
}

// powBases remembers the ratio behind each ρ^n atom.
var powBases registry

// PowIndex is the atom ρ^n for the index n and a fixed ratio ρ, such as R1/R2
// in an annulus' general term.
func PowIndex(rho Coef) Coef { return SymCoef(Symbol{kindPowN, powBases.name(rho)}) }

func powBase(name string) Coef { return powBases.coef(name) }
