package domain

import (
	"math"
	"math/cmplx"
)

// A hole near a straight wall: the harmonic part continues across the wall
// (Schwarz's reflection: the wall's data are analytic), and the continuation
// is singular at the mirror images of the hole's singularities, as far
// outside the wall as they are inside it. The polynomial and the hole's
// Laurent terms converge no faster than that distance allows against the
// section's size, and the outline's corner poles are the nearest other
// singular terms: a 30 × 30 hole 10 from two walls of a 100 × 60 section
// took nine fits, a polynomial of degree 142 and 65 poles at four corners
// (15 s); a circle a quarter radius above a wall in a 20 × 8 box was refused
// after 12 refinements.
// So the basis takes images (the method of images, common practice; e.g.
// Jackson, Classical Electrodynamics, on images in a plane): a polygonal
// hole's corner near a wall its singular powers and a few of its poles,
// mirrored; a smooth hole (a circle, an ellipse) its Laurent terms,
// mirrored. The wall takes rows spread by the image's harmonic measure, a
// Cauchy distribution about its foot of the image's distance, two a column,
// so that the image's columns are determined where they act: the mirrored
// poles alone, with the wall's rows as they were, overfit between them (a
// residual of 1e-4 on the check rows where the fit's read 3e-8).

// imageReach: a hole's corner is mirrored in a wall nearer than this many
// times its reach (its distance to its hole's farthest vertex). Half is a
// compromise: a whole reach mirrored in farther walls too and slowed a thin
// tube; a third left a hole 5 from two walls at its 37 s.
const imageReach = 0.5

// holeImageDecay: a smooth hole is mirrored in a wall where its own terms
// v^j decay slowly there, |v| above this somewhere on the wall (|v| is 1
// on the hole). A circle's |v| is ρ/d at the wall's nearest point; an
// ellipse's falls fast past its tips: 0.36 at 0.2 beyond the tips of a
// 10:1 ellipse of half-length 0.3, whose images in the walls there took
// its fit from 1.35 s to 0.13 s (its log being log|w|; with log|z − c| the
// hole's terms converged too slowly for images to matter). An ellipse
// 25 × 12 twenty above a wall reads 0.74 and gained 1.5 → 0.4 s.
const holeImageDecay = 0.3

// imagePoles caps the poles a corner's image takes: it lies a corner's
// distance outside the wall, where a few resolve it.
const imagePoles = 8

// imagePowers caps the count a family of the corner's powers its image
// takes, for the same reason: the first two carry it (the 100 × 60 section
// with its hole near two walls 0.43 → 0.26 s against all ten, the same
// residuals; an asymmetric thin tube 1.23 → 0.98 s).
const imagePowers = 2

// imageFitRows is the fit's rows for a corner's image: two a column of
// its, its poles and powers (two families at most) each a pair.
const imageFitRows = 2 * 2 * (imagePoles + 2*imagePowers)

// holeImageTerms is how many of a hole's Laurent terms its image takes.
func holeImageTerms(degree int) int { return degree / 2 }

// mirrorLine is a straight side of the outline: from a to b, its outward
// normal nu, its index among the sides.
type mirrorLine struct {
	a, b, nu complex128
	side     int
}

// straightSides are the straight sides among sides.
func straightSides(sides []SidePath) []mirrorLine {
	var out []mirrorLine
	for k, side := range sides {
		x0, y0, nx, ny := side.At(0)
		x1, y1, _, _ := side.At(1)
		xm, ym, _, _ := side.At(0.5)
		a, b := complex(x0, y0), complex(x1, y1)
		if b == a || abs(complex(xm, ym)-(a+b)/2) > 1e-12*abs(b-a) {
			continue
		}
		out = append(out, mirrorLine{a: a, b: b, nu: complex(nx, ny), side: k})
	}
	return out
}

// isometry is the reflection in the mirror's line: z ↦ a + u²·conj(z − a),
// u the line's unit direction.
func (m mirrorLine) isometry() isometry {
	u := (m.b - m.a) / complex(abs(m.b-m.a), 0)
	return isometry{rot: u * u, shift: m.a - u*u*cmplx.Conj(m.a), flip: true}
}

// foot is where the perpendicular from z meets the mirror's line, as the
// parameter t along a → b, and z's distance from the line.
func (m mirrorLine) foot(z complex128) (t, d float64) {
	along := (z - m.a) / (m.b - m.a)
	return real(along), math.Abs(imag(along)) * abs(m.b-m.a)
}

// wallImage is an image in a wall: the wall, its foot there (t0 in (0, 1))
// and the scale of the rows it takes about the foot.
type wallImage struct {
	mirror mirrorLine
	t0     float64
	scale  float64
}

// rows are m parameters on the wall spread by the image's harmonic measure:
// t0 + (scale/L)·tan(π(u − ½)) at u = (i + off)/m, those inside (0, 1).
func (im wallImage) rows(m int, off float64) []float64 {
	L := abs(im.mirror.b - im.mirror.a)
	var out []float64
	for i := 0; i < m; i++ {
		t := im.t0 + im.scale/L*math.Tan(math.Pi*((float64(i)+off)/float64(m)-0.5))
		if t > 0 && t < 1 {
			out = append(out, t)
		}
	}
	return out
}

// cornerImage is a hole corner's image in a wall.
type cornerImage struct {
	wallImage
	corner int
}

// cornerImages are the holes' corners (those with a pivot) mirrored in each
// wall whose segment lies beside them, nearer than imageReach times their
// reach.
func cornerImages(corners []corner, mirrors []mirrorLine) []cornerImage {
	var out []cornerImage
	for k, c := range corners {
		if !c.hasPivot {
			continue
		}
		for _, m := range mirrors {
			if t0, d := m.foot(c.w); t0 > 0 && t0 < 1 && d < imageReach*c.reach {
				out = append(out, cornerImage{wallImage{m, t0, d}, k})
			}
		}
	}
	return out
}

// imageTerms are the image's poles (of the corner's n, at most imagePoles)
// and singular powers, the corner's mirrored.
func (im cornerImage) imageTerms(c corner, scale float64, n, K int) ([]pole, []cornerPower) {
	g := im.mirror.isometry()
	poles := lightningPoles(c, c.poleScale(scale), min(n, imagePoles))
	for j, p := range poles {
		poles[j] = pole{g.apply(p.base), g.direction(p.off)}
	}
	var powers []cornerPower
	for _, cp := range cornerPowers(c, min(K, imagePowers)) {
		img, _ := powerImage(g, cp)
		powers = append(powers, img)
	}
	return poles, powers
}

// holeImageSpec is a smooth hole's image in a wall.
type holeImageSpec struct {
	wallImage
	hole int
}

// smoothHoleImages are smooth hole k's images in the walls where its terms
// decay slowly (holeImageDecay, on 64 points of the wall); their rows
// spread by the distance half way from the hole's nearest point (of its
// sides) to its centre.
func smoothHoleImages(k int, sides []SidePath, hb holeBasis, mirrors []mirrorLine) []holeImageSpec {
	var boundary []complex128
	for _, side := range sides {
		for j := 0; j < 64; j++ {
			x, y, _, _ := side.At(float64(j) / 64)
			boundary = append(boundary, complex(x, y))
		}
	}
	var out []holeImageSpec
	for _, m := range mirrors {
		t0, d := m.foot(hb.c)
		if t0 <= 0 || t0 >= 1 {
			continue
		}
		slow := false
		for j := 0; j <= 64 && !slow; j++ {
			v, _ := hb.variable(m.a + (m.b-m.a)*complex(float64(j)/64, 0))
			slow = abs(v) > holeImageDecay
		}
		if !slow {
			continue
		}
		gap := math.Inf(1)
		for _, z := range boundary {
			_, dz := m.foot(z)
			gap = math.Min(gap, dz)
		}
		out = append(out, holeImageSpec{wallImage{m, t0, gap + (d-gap)/2}, k})
	}
	return out
}
