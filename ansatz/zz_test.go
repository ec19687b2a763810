package ansatz
import ("testing";"math")
func TestZZCount(t *testing.T){
 for _, tol := range []float64{1e-6, 1e-10} {
 n := 0
 g := func(r, th float64) float64 { n++; x,y := r*math.Cos(th), r*math.Sin(th); return math.Exp(-((x-0.3)*(x-0.3)+y*y)/0.05) }
 q := &Quadrature{G: g, A: 0, R: 1, Tol: tol}
 if err := q.Prepare(); err != nil { t.Fatal(err) }
 rc, rf, sc, sf := 0, 0, 0, 0
 for _, p := range q.coarse { rc += len(p.s); for _, a := range p.a { sc += 2*(len(a)-1) } }
 for _, p := range q.fine { rf += len(p.s); for _, a := range p.a { sf += 2*(len(a)-1) } }
 t.Logf("tol %g: G calls %d; coarse panels %d rings %d samples~%d; fine panels %d rings %d samples~%d; modes %d samples %d", tol, n, len(q.coarse), rc, sc, len(q.fine), rf, sf, q.Modes, q.Samples)
 for _, p := range q.coarse { t.Logf("  [%.4f, %.4f] n=%d", p.lo, p.hi, 2*(len(p.a[0])-1)) }
 }
}
