package domain_test

import (
	"fmt"
	"math"
	"testing"

	"psol/domain"
	"psol/series"
)

// fdHoledTorsion is the torsion constant 2∫u of Δu = −2 on [0, L] × [0, H]
// less the square hole [a, b] × [a, b], u = 0 on both, by the five-point
// Laplacian on square cells of side h (h dividing every edge) and
// successive over-relaxation; ∫u by the nodes' sum (the trapezoidal rule:
// u vanishes on every edge).
func fdHoledTorsion(L, H, a, b, h float64) float64 {
	n, m := int(math.Round(L/h)), int(math.Round(H/h))
	ia, ib := int(math.Round(a/h)), int(math.Round(b/h))
	u := make([]float64, (n+1)*(m+1))
	free := func(i, j int) bool {
		return i > 0 && i < n && j > 0 && j < m && !(i >= ia && i <= ib && j >= ia && j <= ib)
	}
	omega := 2 / (1 + math.Sin(math.Pi*h/math.Max(L, H)))
	for it := 0; it < 100000; it++ {
		change := 0.0
		for i := 1; i < n; i++ {
			for j := 1; j < m; j++ {
				if !free(i, j) {
					continue
				}
				k := i*(m+1) + j
				v := (u[k-1] + u[k+1] + u[k-m-1] + u[k+m+1] + 2*h*h) / 4
				change = math.Max(change, math.Abs(v-u[k]))
				u[k] += omega * (v - u[k])
			}
		}
		if change < 1e-13 {
			break
		}
	}
	sum := 0.0
	for _, v := range u {
		sum += v
	}
	return 2 * sum * h * h
}

// A square hole near two walls of a rectangular bar in torsion: its
// corners' images in the walls join the basis (cornerimages.go). The
// torsion constant against finite differences on three grids, extrapolated
// with the error's two leading orders, h^(4/3) from the hole's re-entrant
// corners (their singular exponent 2/3; common practice, e.g. Strang & Fix,
// An Analysis of the Finite Element Method) and h² (to 5e-6 of J); the fit with the
// images needs a polynomial of degree 50 at most, where without them it
// took 142 and 65 poles at four corners.
func TestHoleNearWallsTakesImages(t *testing.T) {
	d := domain.Holed{Outer: polygonXY(0, 0, 10, 0, 10, 6, 0, 6), Holes: []domain.CircleHole{{Poly: polygonXY(1, 1, 4, 1, 4, 4, 1, 4)}}}
	sol := solveWith(t, "lap(u) = -2", d, domain.Options{Tol: 1e-12}, append(sidesOf(d, "s", "u = 0"), sidesOf(d, "hole1", "u = 0")...)...)
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	J := 2 * rep.Integral
	// J_h = J + c₁h^(4/3) + c₂h² on three grids, solved for J.
	hs := []float64{0.25, 0.125, 0.0625}
	var rows [][]float64
	var js []float64
	for _, h := range hs {
		rows = append(rows, []float64{1, math.Pow(h, 4.0/3), h * h})
		js = append(js, fdHoledTorsion(10, 6, 1, 4, h))
	}
	fd := solve3(rows, js)
	j1, j2, j3 := js[0], js[1], js[2]
	if math.Abs(J-fd) > 2e-5*J {
		t.Errorf("J = %.10g, finite differences extrapolated %.10g (%.10g, %.10g, %.10g)", J, fd, j1, j2, j3)
	}
	if deg := sol.Section.Degree; deg > 50 {
		t.Errorf("the fit took a polynomial of degree %d: the corners' images should keep it at 50 or less", deg)
	}
}

// solve3 is x[0] of the 3 × 3 system A·x = b, by Cramer's rule.
func solve3(A [][]float64, b []float64) float64 {
	det := func(m [][]float64) float64 {
		return m[0][0]*(m[1][1]*m[2][2]-m[1][2]*m[2][1]) - m[0][1]*(m[1][0]*m[2][2]-m[1][2]*m[2][0]) + m[0][2]*(m[1][0]*m[2][1]-m[1][1]*m[2][0])
	}
	col := [][]float64{{b[0], A[0][1], A[0][2]}, {b[1], A[1][1], A[1][2]}, {b[2], A[2][1], A[2][2]}}
	return det(col) / det(A)
}

// A cylinder of radius a at unit potential above a grounded plane, its
// centre h above it (h/a = 1.25: a gap of a quarter radius), in a 20 × 8
// box whose other walls carry the exact potential: u = ln(|z − is|/|z + is|)/ln k,
// s = √(h² − a²), k = (h − s)/a, and the charge per unit length on the
// cylinder, the hole's flux, 2π/arccosh(h/a) (bipolar coordinates; Smythe,
// Static and Dynamic Electricity; Jackson, Classical Electrodynamics, the
// image line charges). The hole's Laurent terms mirrored in the plane join
// the basis, and the wall the image's rows: without the image the fit was
// refused after 5 s and 12 refinements (7.6e-9 against 1e-12), without its
// rows at once.
func TestCylinderAboveWall(t *testing.T) {
	h, a := 1.25, 1.0
	s := math.Sqrt(h*h - a*a)
	k := (h - s) / a
	d := domain.Holed{Outer: polygonXY(-10, 0, 10, 0, 10, 8, -10, 8), Holes: []domain.CircleHole{{X: series.Coef{}, Y: decimalCoef(h), R: decimalCoef(a)}}}
	exact := fmt.Sprintf("u = ln((x^2 + (y - %.17g)^2)/(x^2 + (y + %.17g)^2))/%.17g", s, s, 2*math.Log(k))
	sol := solveWith(t, "lap(u) = 0", d, domain.Options{Tol: 1e-12}, "s1: u = 0", "s2: "+exact, "s3: "+exact, "s4: "+exact, "hole1: u = 1")
	ev := evaluator(t, sol, 1e-12)
	for _, p := range [][2]float64{{0, 0.1}, {0.5, 0.2}, {2, 3}, {-1.2, 1.3}, {8, 6}} {
		got, _, _ := ev.AtXY(p[0], p[1])
		if want := math.Log(math.Hypot(p[0], p[1]-s)/math.Hypot(p[0], p[1]+s)) / math.Log(k); math.Abs(got-want) > 1e-12 {
			t.Errorf("u%v = %.15f, bipolar closed form %.15f", p, got, want)
		}
	}
	rep, err := sol.Report(nil, 1e-12)
	if err != nil {
		t.Fatal(err)
	}
	hole := fluxThrough(rep, "hole1")
	if want := 2 * math.Pi / math.Acosh(h/a); math.Abs(hole-want) > 1e-10*want {
		t.Errorf("flux through the cylinder %.13g, 2π/arccosh(h/a) = %.13g", hole, want)
	}
	if deg := sol.Section.Degree; deg > 50 {
		t.Errorf("the fit took a polynomial of degree %d: the hole's image should keep it at 50 or less", deg)
	}
}
