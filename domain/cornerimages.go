package domain

import (
	"math"
	"math/cmplx"
)

// A hole near a straight wall: the harmonic part continues across the wall
// (Schwarz's reflection: the wall's data are analytic), and the continuation
// is singular at the mirror images of the hole's corners, as far outside the
// wall as the corners are inside it. The polynomial and the hole's Laurent
// terms converge no faster than that distance allows against the section's
// size, and the outline's corner poles are the nearest other singular terms:
// a 30 × 30 hole 10 from two walls of a 100 × 60 section took nine fits,
// a polynomial of degree 142 and 65 poles at four corners (7 s). Each
// image takes the corner's singular powers and a few of its poles, mirrored
// (the method of images, common practice; e.g. Jackson, Classical
// Electrodynamics, on images in a plane), and the wall takes rows spread by
// the image's harmonic measure (a Cauchy distribution about its foot, of
// the image's distance), so that the image's columns are determined where
// they act.

// imageReach: a corner is mirrored in a wall nearer than this many times
// its reach (its distance to its hole's farthest vertex).
const imageReach = 0.5

// imagePoles caps the poles an image takes: it lies a corner's distance
// outside the wall, where a few resolve it.
const imagePoles = 8

// mirrorLine is a straight side of the outline: from a to b, its outward
// normal nu, its index among the sides.
type mirrorLine struct {
	a, b, nu complex128
	side     int
}

// cornerImage is corner's image in mirror: where on the side its foot is
// (t0 in [0, 1]) and how far outside it lies.
type cornerImage struct {
	corner int
	mirror mirrorLine
	t0, d  float64
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
			along := (c.w - m.a) / (m.b - m.a)
			t0, d := real(along), imag(along)*abs(m.b-m.a)
			if d < 0 { // the region lies to the left of a side run with the region on its left
				d = -d
			}
			if t0 <= 0 || t0 >= 1 || d >= imageReach*c.reach {
				continue
			}
			out = append(out, cornerImage{corner: k, mirror: m, t0: t0, d: d})
		}
	}
	return out
}

// isometry is the reflection in the mirror's line: z ↦ a + u²·conj(z − a),
// u the line's unit direction.
func (m mirrorLine) isometry() isometry {
	u := (m.b - m.a) / complex(abs(m.b-m.a), 0)
	return isometry{rot: u * u, shift: m.a - u*u*cmplx.Conj(m.a), flip: true}
}

// imageTerms are the image's poles (of the corner's n, at most imagePoles)
// and singular powers, the corner's mirrored.
func (im cornerImage) imageTerms(c corner, scale float64, n, K int) ([]complex128, []cornerPower) {
	g := im.mirror.isometry()
	poles := lightningPoles(c, c.poleScale(scale), min(n, imagePoles))
	for j, p := range poles {
		poles[j] = g.apply(p)
	}
	var powers []cornerPower
	for _, cp := range cornerPowers(c, K) {
		img, _ := powerImage(g, cp)
		powers = append(powers, img)
	}
	return poles, powers
}

// imageFitRows is the fit's rows for an image: two a column of its, its
// poles and powers each a pair.
const imageFitRows = 2 * 2 * (imagePoles + 2*maxCornerPowers)

// imageRows are m parameters on the image's side spread by its harmonic
// measure: t0 + (d/L)·tan(π(u − ½)) at u = (i + off)/m, those inside (0, 1).
func (im cornerImage) imageRows(m int, off float64) []float64 {
	L := abs(im.mirror.b - im.mirror.a)
	var out []float64
	for i := 0; i < m; i++ {
		t := im.t0 + im.d/L*math.Tan(math.Pi*((float64(i)+off)/float64(m)-0.5))
		if t > 0 && t < 1 {
			out = append(out, t)
		}
	}
	return out
}
