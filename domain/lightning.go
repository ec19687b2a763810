package domain

import (
	"fmt"
	"math"
	"math/cmplx"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// The harmonic part on a general section (a polygon, an ellipse) is the real
// part of a rational function fitted to the side conditions by least squares:
//
//	h(z) = Re[ Σ_corners Σ_j c_j/(z − p_j) + Σ_k d_k q_k((z − z_c)/s) ],
//
// with poles p_j outside the region on each corner's exterior bisector at
// distances exponentially clustered towards the corner, and a polynomial in
// the orthogonal basis q_k that Arnoldi's process builds on the sample
// points (Vandermonde with Arnoldi: well conditioned at any degree). The
// method and its parameters (σ = 4, clustered samples, degree growing with
// the poles) are those of Gopal & Trefethen, "Solving Laplace problems with
// corner singularities via rational functions", SIAM J. Numer. Anal. 57
// (2019), and of Brubeck, Nakatsukasa & Trefethen, "Vandermonde with
// Arnoldi", SIAM Review 63 (2021). A smooth boundary (the ellipse) has no
// corners and needs the polynomial only.

// boundaryPoint is one sample of a side condition: a·h + b·∂h/∂n = data at
// z, with ν the outward unit normal as a complex number.
type boundaryPoint struct {
	z, nu complex128
	a, b  float64 // Dirichlet 1, 0; Neumann 0, 1; Robin h, 1
	data  float64
	side  int
	// floating is the side whose unknown value U the row's u equals (a
	// floating side), or −1.
	floating int
	// w weighs the row: 1 for a value condition; for a flux or Robin one
	// the distance to the nearest corner over the section's size (capped
	// at 1), so that its residual, like a value's, is what it moves u by
	// (a flux error δ over a distance d moves u by about δ·d). Near a
	// corner where a value meets a flux the gradient is singular, and the
	// unweighted flux residual would measure that, not the fit (Gopal &
	// Trefethen weight so).
	w float64
}

// residual is the point's weighted condition residual for h.
func (p boundaryPoint) residual(h *rationalHarmonic) float64 {
	if p.b == 0 { // a value condition reads no derivative
		v := h.valueOnly(p.z)
		if p.floating >= 0 {
			v -= h.floatingU[p.floating]
		}
		return p.w * math.Abs(p.a*v-p.data)
	}
	v, df := h.value(p.z)
	if p.floating >= 0 {
		v -= h.floatingU[p.floating]
	}
	return p.w * math.Abs(p.a*v+p.b*real(df*p.nu)-p.data)
}

// corner is where poles cluster: the vertex and the unit direction, outside
// the region, along which its poles lie.
type corner struct {
	w, dir complex128
	// angle is the interior angle over π. families are the exponent
	// families of the corner's own singular powers that join the fit
	// (cornerPowers): whole (k/α: the same kind of condition on both
	// sides), half (k − ½)/α: a value meets a flux), both (a Robin side).
	angle    float64
	families []float64 // the offsets: 0 for k/α, ½ for (k − ½)/α
	reach    float64   // the distance to the farthest vertex
	// pivot: a hole's corner takes its powers about a point inside the
	// hole (cornerPower.pivot), where hasPivot.
	pivot    complex128
	hasPivot bool
	// maxDist caps the poles' distance (0: none): half way to where the
	// exterior bisector meets a side again.
	maxDist float64
	// logTop is the largest whole exponent β that takes ζ^β·log ζ
	// (cornerPowers); 0: none.
	logTop float64
	// helper: of families {0, ½}, ½ only helps the poles (a re-entrant
	// corner with the same kind of condition on both sides): its
	// exponents are no singular functions here, and take no logarithm.
	helper bool
	// spread, where its focus is set (a slot's corner), spreads the pivot
	// over the slot's focal segment (holeBasis.spreadZeta); centrePivot is
	// then hasPivot for the centre's pivot, should the data call for it
	// (keepSpread).
	spread      holeBasis
	centrePivot bool
}

// logTopAll is a corner's logTop where its sides' data set no bound (no
// polynomial) and the corner is re-entrant, mixed or on a Robin side
// (markSingularCorners): every whole exponent may then resonate, but the
// logarithms' coefficients fall with the data's Taylor terms, and past the
// first few the poles carry them at the fit's accuracy. A Robin rectangle
// went from 2 s, short of its target, to 0.05 s, e^x on an L shape from
// 0.6 to 0.16 s, as much with 6 as with 24, which cost more columns.
const logTopAll = 6

// poleScale is the poles' largest distance: the section's size, or less
// where the bisector meets a side.
func (c corner) poleScale(s float64) float64 {
	if c.maxDist > 0 {
		return math.Min(s, c.maxDist)
	}
	return s
}

// cornerPower is one singular function at a corner:
// ζ^β with ζ = (z − w)·rot/s, rot turning the interior bisector onto the
// positive axis, so that the branch cut lies along the exterior bisector.
type cornerPower struct {
	w, rot complex128
	beta   float64
	// beta = (k − off)/alpha: ζ^β = (ζ^(1/α))^k·ζ^(−off/α), which lets a
	// corner's powers come by multiplication (powerTerms).
	k          int
	off, alpha float64
	// pivot, at a hole's corner, is a point inside the hole: ζ is then
	// (z − w)/(z − pivot), whose principal branch cuts only the segment from
	// the corner to the pivot, inside the hole (the exterior bisector would
	// run through the hole into the region).
	pivot    complex128
	hasPivot bool
	// log: the term is ζ^β·log ζ, β a whole number.
	log bool
	// spread, where its focus is set, makes ζ the slot's spread-pivot
	// variable (holeBasis.spreadZeta) instead of (z − w)/(z − pivot).
	spread holeBasis
}

// zeta is ζ at z and dζ/dz.
func (c cornerPower) zeta(z complex128) (complex128, complex128) {
	if c.spread.focus != 0 {
		return c.spread.spreadZeta(z, c.w)
	}
	if c.hasPivot {
		d := z - c.pivot
		return (z - c.w) / d, (c.w - c.pivot) / (d * d)
	}
	return (z - c.w) * c.rot, c.rot
}

// cornerPowers are a corner's exponents β = (k − offset)/α, k = 1..K, for
// its families' offsets: the separated solutions of Laplace's equation in a
// wedge of angle απ with Dirichlet or Neumann sides (offset 0), and with one
// of each (offset ½) (common practice; e.g. Grisvard, Elliptic Problems in
// Nonsmooth Domains). A whole β is the polynomial's as a power, but where
// the data's Taylor term of that degree resonates with it the expansion
// takes ζ^β·log ζ, which poles fit only slowly (a right angle with u = 0
// and Δu = −2 takes (2/π)·Re(i·z²·log z)): those up to the corner's logTop
// join as such. Exponents stop at 24.
func cornerPowers(c corner, K int) []cornerPower {
	var out []cornerPower
	rot := 1 / -c.dir / complex(c.reach, 0) // the exterior bisector onto −1, the farthest vertex to |ζ| = 1
	for k := 1; k <= K; k++ {
		for _, off := range c.families {
			beta := (float64(k) - off) / c.angle
			whole := math.Abs(beta-math.Round(beta)) <= 1e-9
			if whole {
				beta = math.Round(beta)
			}
			if beta <= 24 && (!whole || beta <= c.logTop && !(c.helper && off != 0)) {
				out = append(out, cornerPower{w: c.w, rot: rot, beta: beta, k: k, off: off, alpha: c.angle, pivot: c.pivot, hasPivot: c.hasPivot, log: whole, spread: c.spread})
			}
		}
	}
	return out
}

// rationalHarmonic is the fitted h: its poles and coefficients, and the
// Arnoldi recurrence that evaluates the polynomial part anywhere.
type rationalHarmonic struct {
	scratch  []complex128 // terms' buffers (terms)
	basis    []complex128 // the polynomial basis's buffers (basisScratch)
	poles    []pole
	cPole    []complex128 // h's pole part: Re Σ cPole_j/(z − p_j)
	powers   []cornerPower
	cPower   []complex128
	logs     []holeBasis // each hole's log|z − c|, with real coefficients
	cLog     []float64
	laurent  []laurentTerm
	cLaurent []complex128
	mobius   *mobiusMap
	// floatingU is each floating side's value U, found with the fit.
	floatingU map[int]float64
	mobiusK   []int // the powers of w, ±1..±degree
	// sym, where set, is the symmetry the fit used (its terms' images are
	// among the terms; generated code takes its maps for u_p's mean).
	sym *symmetry
	// polyRot and polyPower make the polynomial's variable (polyVar).
	polyRot   complex128
	polyPower int
	// shift is the known harmonic c = ū_p − u_p that a symmetric fit adds
	// (particularShift): h = (the symmetric fitted part) + c.
	shift    func(z complex128) (float64, complex128)
	cMobius  []complex128
	centre   complex128
	scale    float64
	hess     [][]complex128 // Arnoldi's Hessenberg matrix, column k: the coefficients of q_{k+1}
	realHess bool           // its entries are real (a symmetric fit's basis): real products
	cPoly    []complex128   // Re Σ cPoly_k q_k
	degree   int
	residual float64 // the largest |condition residual| on the check sampling
	worstAt  complex128
	worstOn  int
}

// polyVar is the polynomial's variable at z and its derivative in z:
// Z = (z − z_c)/s, or with a symmetry whose turns are by 2π/n, Z = W^n,
// W = (z − z_c)·ρ/s with ρ turning a mirror line (if any) onto the real axis.
// Then the symmetric analytic functions are those of W^n (the turn by 2π/n:
// F(W·e^{2πi/n}) = F(W)), with real coefficients where there are mirror
// lines (a mirror: F(W̄) is the conjugate of F(W)) and the basis one real
// column a degree of Z; with turns alone, two columns a degree.
func (h *rationalHarmonic) polyVar(z complex128) (Z, dZ complex128) {
	d := h.polyRot / complex(h.scale, 0)
	W := (z - h.centre) * d
	if h.polyPower <= 1 {
		return W, d
	}
	Wn1 := W
	for k := 2; k < h.polyPower; k++ {
		Wn1 *= W
	}
	return Wn1 * W, complex(float64(h.polyPower), 0) * Wn1 * d
}

// polyBasis is q_0..q_D at z and their derivatives in z, by the stored
// recurrence: q_{k+1} = (Z q_k − Σ_{j≤k} H[j][k] q_j)/H[k+1][k], Z from polyVar.
// With dq nil only the values: half the work, which is O(D²).
func (h *rationalHarmonic) polyBasis(z complex128, q, dq []complex128) {
	Z, dZ := h.polyVar(z)
	if dq == nil {
		h.polyValues(Z, q)
		return
	}
	q[0], dq[0] = 1, 0
	for k := 0; k < h.degree; k++ {
		v := Z * q[k]
		dv := q[k]*dZ + Z*dq[k]
		if h.realHess {
			// Even and odd j apart: eight independent sums (see polyValues).
			vr, vi, dvr, dvi := real(v), imag(v), real(dv), imag(dv)
			var wr, wi, dwr, dwi float64
			row, j := h.hess[k][:k+1], 0
			for ; j+1 < len(row); j += 2 {
				c0, c1 := real(row[j]), real(row[j+1])
				vr -= c0 * real(q[j])
				vi -= c0 * imag(q[j])
				dvr -= c0 * real(dq[j])
				dvi -= c0 * imag(dq[j])
				wr -= c1 * real(q[j+1])
				wi -= c1 * imag(q[j+1])
				dwr -= c1 * real(dq[j+1])
				dwi -= c1 * imag(dq[j+1])
			}
			if j < len(row) {
				c := real(row[j])
				vr -= c * real(q[j])
				vi -= c * imag(q[j])
				dvr -= c * real(dq[j])
				dvi -= c * imag(dq[j])
			}
			v, dv = complex(vr+wr, vi+wi), complex(dvr+dwr, dvi+dwi)
		} else {
			for j := 0; j <= k; j++ {
				v -= h.hess[k][j] * q[j]
				dv -= h.hess[k][j] * dq[j]
			}
		}
		// The subdiagonal is a real norm: a scaling, not a complex division.
		inv := 1 / real(h.hess[k][k+1])
		q[k+1], dq[k+1] = complex(real(v)*inv, imag(v)*inv), complex(real(dv)*inv, imag(dv)*inv)
	}
}

// polyValues is polyBasis's values alone, at Z = polyVar(z).
func (h *rationalHarmonic) polyValues(Z complex128, q []complex128) {
	q[0] = 1
	for k := 0; k < h.degree; k++ {
		v := Z * q[k]
		if h.realHess {
			// Two sums each, even and odd j: independent chains the
			// processor overlaps (one chain waits on every add).
			vr, vi, wr, wi := real(v), imag(v), 0.0, 0.0
			row, j := h.hess[k][:k+1], 0
			for ; j+1 < len(row); j += 2 {
				c0, c1 := real(row[j]), real(row[j+1])
				vr -= c0 * real(q[j])
				vi -= c0 * imag(q[j])
				wr -= c1 * real(q[j+1])
				wi -= c1 * imag(q[j+1])
			}
			if j < len(row) {
				vr -= real(row[j]) * real(q[j])
				vi -= real(row[j]) * imag(q[j])
			}
			v = complex(vr+wr, vi+wi)
		} else {
			for j, c := range h.hess[k][:k+1] {
				v -= c * q[j]
			}
		}
		inv := 1 / real(h.hess[k][k+1])
		q[k+1] = complex(real(v)*inv, imag(v)*inv)
	}
}

// valueOnly is h(z) without the derivative (value), for points where a
// value is all that is read: about half the work (evaluate).
func (h *rationalHarmonic) valueOnly(z complex128) float64 {
	f, _ := h.evaluate(z, false)
	v := real(f)
	if h.shift != nil {
		c, _ := h.shift(z)
		v += c
	}
	return v
}

// value is h(z) and the derivative F'(z) of the F with h = Re F
// (∇h = (Re F', −Im F')).
func (h *rationalHarmonic) value(z complex128) (float64, complex128) {
	f, df := h.complexValue(z)
	if h.shift != nil {
		c, dc := h.shift(z)
		return real(f) + c, df + dc
	}
	return real(f), df
}

// AtXY is h(x, y).
func (h *rationalHarmonic) AtXY(x, y float64) float64 { return h.valueOnly(complex(x, y)) }

// arnoldi builds the Hessenberg matrix of the polynomial basis on the
// sample points Z (scaled), orthonormal in the mean over them; with realCoef
// the basis polynomials have real coefficients, orthonormal in the real part
// of that inner product (the symmetric basis, polyVar).
func arnoldi(Z []complex128, degree int, realCoef bool) [][]complex128 {
	m := len(Z)
	Q := [][]complex128{make([]complex128, m)}
	for i := range Q[0] {
		Q[0][i] = 1
	}
	hess := make([][]complex128, degree)
	for k := 0; k < degree; k++ {
		v := make([]complex128, m)
		for i := range v {
			v[i] = Z[i] * Q[k][i]
		}
		hess[k] = make([]complex128, k+2)
		for pass := 0; pass < 2; pass++ { // twice: classical Gram–Schmidt, reorthogonalised
			for j := 0; j <= k; j++ {
				var c complex128
				for i := range v {
					c += cmplx.Conj(Q[j][i]) * v[i]
				}
				c /= complex(float64(m), 0)
				if realCoef {
					c = complex(real(c), 0)
				}
				hess[k][j] += c
				for i := range v {
					v[i] -= c * Q[j][i]
				}
			}
		}
		norm := 0.0
		for _, x := range v {
			norm += real(x)*real(x) + imag(x)*imag(x)
		}
		norm = math.Sqrt(norm / float64(m))
		hess[k][k+1] = complex(norm, 0)
		for i := range v {
			v[i] /= complex(norm, 0)
		}
		Q = append(Q, v)
	}
	return hess
}

// nearest is the smallest distance from a corner, relative to the section's
// size, that the fit resolves: its nearest poles, and its nearest samples
// (the residual is measured on the sides from there on).
const nearest = 1e-9

// laurentTerm is a hole's j-th Laurent term (holeBasis.term).
type laurentTerm struct {
	hole holeBasis
	j    int
}

// A pole p = base + off is kept as its corner (base) and its offset from
// it: 1/(z − p) is taken as 1/((z − base) − off), and z − base is exact
// for z near the corner (Sterbenz), where the pole's own position, rounded
// to 1e-16 of the section's size, is 1e-7 of its distance off at 1e-9 from
// the corner. A symmetric fit's image of a pole is then exact to rounding
// relative to its distance: across a mirror line through a corner the
// images of that corner's poles, rounded apiece, made the symmetrised terms
// asymmetric by 1e-7 of their size there.
type pole struct{ base, off complex128 }

// recip is 1/(z − p).
func (p pole) recip(z complex128) complex128 { return recip((z - p.base) - p.off) }

// lightningPoles are n poles at a corner: w + dir·d_j (poleDistances).
func lightningPoles(c corner, s float64, n int) []pole {
	out := make([]pole, n)
	for j, d := range poleDistances(n, s) {
		out[j] = pole{c.w, c.dir * complex(d, 0)}
	}
	return out
}

// poleDistances are d_j = s·e^(−σ(√n − √j)), j = 1..n, with σ = 4, but no
// nearer than nearest·s: a point and a pole closer than that differ by
// little more than float64 resolves against the coordinates' size, and
// 1/(z − p) loses its digits (σ shrinks as n grows to keep the nearest there).
func poleDistances(n int, s float64) []float64 {
	sigma := 4.0
	if n > 1 {
		sigma = math.Min(sigma, -math.Log(nearest)/(math.Sqrt(float64(n))-1))
	}
	out := make([]float64, n)
	for j := 1; j <= n; j++ {
		out[j-1] = s * math.Exp(-sigma*(math.Sqrt(float64(n))-math.Sqrt(float64(j))))
	}
	return out
}

// fitHarmonic solves the least-squares problem on the samples for n[k]
// poles at corner k and the given degree.
// fluxConstraint is a floating side's net flux: Σ of the flux rows at pts
// (their weights w the quadrature's) equals target.
type fluxConstraint struct {
	side   int
	pts    []boundaryPoint
	target float64
}

func fitHarmonic(pts []boundaryPoint, geo sectionGeometry, n []int, degree, powers int, freeConstant bool, constraints []fluxConstraint) (*rationalHarmonic, error) {
	corners, centre, scale := geo.corners, geo.centre, geo.scale
	if geo.sym != nil { // the polynomial about the symmetry's centre keeps each term's parity
		centre = geo.sym.centre
	}
	h := &rationalHarmonic{centre: centre, scale: scale, degree: degree, logs: geo.holes, mobius: geo.mobius, sym: geo.sym, shift: geo.shift, polyRot: 1, polyPower: 1}
	if geo.sym != nil {
		h.polyRot, h.polyPower = cmplx.Conj(geo.sym.walls[0]), geo.sym.turnOrder()
	}
	// The rows' data less the known shift's share: what the fitted part must supply.
	shiftOp := func(p boundaryPoint) float64 {
		if h.shift == nil {
			return 0
		}
		c, dc := h.shift(p.z)
		return p.a*c + p.b*real(dc*p.nu)
	}
	if geo.mobius != nil {
		// The Laurent series in w with log|w| is complete on the two
		// circles' region: the polynomial in z would only repeat it (and
		// spoil the conditioning), so it keeps its constant alone.
		for j := 1; j <= degree; j++ {
			h.mobiusK = append(h.mobiusK, j, -j)
		}
		degree, h.degree = 0, 0
	}
	for _, hb := range geo.holes {
		for j := 1; j <= degree && geo.mobius == nil; j++ { // the Möbius series has them
			h.laurent = append(h.laurent, laurentTerm{hb, j})
		}
	}
	var imaged []complex128 // the image centres taken, with their images under the symmetry
	for _, im := range geo.holeImages {
		if geo.mobius != nil {
			break
		}
		g := im.mirror.isometry()
		first, _ := holeImage(g, geo.holes[im.hole], 1)
		if slices.ContainsFunc(imaged, func(c complex128) bool { return abs(c-first.c) <= 1e-9*scale }) {
			continue // the symmetry's image of one taken: its terms come with that one's
		}
		imaged = append(imaged, first.c)
		if geo.sym != nil {
			for _, e := range geo.sym.group {
				imaged = append(imaged, e.inverse().apply(first.c))
			}
		}
		for j := 1; j <= holeImageTerms(degree); j++ {
			hb, _ := holeImage(g, geo.holes[im.hole], j)
			h.laurent = append(h.laurent, laurentTerm{hb, j})
		}
	}
	for _, hb := range geo.rimImages { // smooth holes' reflections in a curved outline
		if slices.ContainsFunc(imaged, func(c complex128) bool { return abs(c-hb.c) <= 1e-9*scale }) {
			continue // the symmetry's image of one taken, as above
		}
		imaged = append(imaged, hb.c)
		if geo.sym != nil {
			for _, e := range geo.sym.group {
				imaged = append(imaged, e.inverse().apply(hb.c))
			}
		}
		for j := 1; j <= holeImageTerms(degree); j++ {
			h.laurent = append(h.laurent, laurentTerm{hb, j})
		}
	}
	if h.polyPower > 1 { // degree in z, over n: the same resolution in Z = W^n
		degree = (degree + h.polyPower - 1) / h.polyPower
		h.degree = degree
	}
	for k, c := range corners {
		if geo.sym != nil && geo.sym.rep[k] != k {
			continue // its orbit's representative's poles, mirrored, serve it
		}
		h.poles = append(h.poles, lightningPoles(c, c.poleScale(scale), n[k])...)
		h.powers = append(h.powers, cornerPowers(c, powers)...)
		for _, im := range geo.images { // the corner's images in the walls beside it (cornerimages.go)
			if im.corner == k {
				ps, pw := im.imageTerms(c, scale, n[k], powers)
				h.poles, h.powers = append(h.poles, ps...), append(h.powers, pw...)
			}
		}
	}
	// With a symmetry the columns are the representatives' pairs, and the
	// basis is expanded into every image of each term (symmetry.go), each
	// image adding its share to its representative's pair.
	nPole, nPower, nLaurent := len(h.poles), len(h.powers), len(h.laurent)
	pivoted := make([]bool, nPower) // a hole corner's powers and every log power, by representative (their ridge below)
	for e, c := range h.powers {
		pivoted[e] = c.hasPivot || c.log
	}
	poleImg, powerImg, laurentImg := identityImages(nPole), identityImages(nPower), identityImages(nLaurent)
	if geo.sym != nil {
		var poles []pole
		var powers []cornerPower
		var laurent []laurentTerm
		poleImg, powerImg, laurentImg = nil, nil, nil
		for _, g := range geo.sym.group {
			for j, p := range h.poles {
				q, m := poleImage(g, p)
				if k := cornerAt(corners, q.base, geo.sym.eps); k >= 0 {
					q.base = corners[k].w // anchored on the corner itself
				}
				m.rep = j
				poles, poleImg = append(poles, q), append(poleImg, m)
			}
			for j, c := range h.powers {
				c2, m := powerImage(g, c)
				if k := cornerAt(corners, c2.w, geo.sym.eps); k >= 0 {
					c2.w = corners[k].w // the branch point on the corner itself, not 1e-16 off
				}
				m.rep = j
				powers, powerImg = append(powers, c2), append(powerImg, m)
			}
			for j, t := range h.laurent {
				hb, m := holeImage(g, t.hole, t.j)
				m.rep = j
				laurent, laurentImg = append(laurent, laurentTerm{hb, t.j}), append(laurentImg, m)
			}
		}
		h.poles, h.powers, h.laurent = poles, powers, laurent
	}
	// The polynomial is symmetric by its variable (polyVar).
	Z := make([]complex128, len(pts))
	for i, p := range pts {
		Z[i], _ = h.polyVar(p.z)
	}
	mirrored := geo.sym != nil && geo.sym.mirrored // real coefficients
	h.hess, h.realHess = arnoldi(Z, degree, mirrored), mirrored
	// Columns: Re and Im of each pole's and each polynomial's operator value.
	nc := 2*nPole + 2*(degree+1) + 2*nPower + 2*len(h.logs) + 2*nLaurent + 2*len(h.mobiusK)
	// A floating side's value U is one more unknown (its column: −1 on its
	// rows), and its net flux one more equation: the sum over quadrature
	// points of the flux rows, weighted heavily so that it holds.
	uCol := map[int]int{}
	for _, c := range constraints {
		uCol[c.side] = nc + 2*len(uCol)
	}
	nc += 2 * len(uCol) // a pair, the second empty, like every column
	rows := len(pts) + len(constraints)
	// nc rows more, empty: room for the ridge rows below, so the solve
	// works in this one matrix.
	A := mat.NewDense(rows+nc, nc, nil)
	b := mat.NewVecDense(rows+nc, nil)
	q := make([]complex128, degree+1)
	dq := make([]complex128, degree+1)
	// raw is each column's norm before the images' sum: a column the sum
	// cancels to rounding (a term of the wrong parity) is dropped below.
	raw := make([]float64, nc)
	logCol := 2*nPole + 2*(degree+1) + 2*nPower // the hole logarithms' first column
	// fill adds point p's row (scaled) to row i. With netFlux, p is a point
	// of a hole's net-flux quadrature and only the hole logarithms are
	// filled: every other term is Re F of an F analytic and single-valued
	// in the section (poles and powers have their singularities and cuts
	// outside it, or at a corner where F vanishes), so its flux through a
	// closed curve, Im ∮ F'(z) dz, is exactly 0 by Cauchy's theorem. The
	// quadrature gave that 0 only to its own error, on some 7000 points a
	// hole: three times the fit's rows, filled in full.
	fill := func(i int, p boundaryPoint, scaleBy float64, netFlux bool) {
		row := A.RawRowView(i) // the row in place: At and Set's checks were a fifth of the fit
		add := func(_, col int, v float64) {
			row[col] += v
			raw[col] += v * v
		}
		z, nu := p.z, p.nu
		// The row's operator on a term (f, f'): ca·f + cb·f'.
		ca, cb := complex(p.a*p.w*scaleBy, 0), complex(p.b*p.w*scaleBy, 0)*nu
		val := func(f, df complex128) complex128 { return ca*f + cb*df }
		// u = Re(c·ψ) = a·Re ψ + b·Im ψ for c = a − ib; Re(c̄·ψ) = a·Re ψ − b·Im ψ.
		// The images' loops are written out: a call per term was most of the fit.
		images := func(first int, img []imageTerm, f, df []complex128) {
			for e, m := range img {
				w := m.factor * (ca*f[e] + cb*df[e])
				col := first + 2*m.rep
				re, im := real(w), imag(w)
				if m.conj {
					im = -im
				}
				row[col] += re
				raw[col] += re * re
				row[col+1] += im
				raw[col+1] += im * im
			}
		}
		// log|z − c| alone (each hole's centre is fixed by a symmetry): the
		// pair's second column, arg(z − c), is multivalued around the hole
		// and stays 0 (dropped as empty).
		logs := func() {
			for k, hb := range h.logs {
				v, dv := hb.logValue(z), 0.0
				if p.b != 0 {
					dv = real(nu * hb.logSlope(z))
				}
				add(i, logCol+2*k, scaleBy*p.w*(p.a*v+p.b*dv))
			}
		}
		if netFlux { // only the hole logarithms: see above
			logs()
			return
		}
		for e, pole := range h.poles {
			d := pole.recip(z)
			m := poleImg[e]
			w := m.factor * (ca*d - cb*d*d)
			re, im := real(w), imag(w)
			if m.conj {
				im = -im
			}
			row[2*m.rep] += re
			raw[2*m.rep] += re * re
			row[2*m.rep+1] += im
			raw[2*m.rep+1] += im * im
		}
		col := 2 * nPole
		h.polyBasis(z, q, dq)
		for k := range q {
			w := val(q[k], dq[k])
			add(i, col, real(w))
			if !mirrored { // with a mirror line, real coefficients: the Im column would be antisymmetric
				add(i, col+1, imag(w))
			}
			col += 2
		}
		t, dt := h.terms(len(h.powers))
		h.powerTerms(z, t, dt)
		images(col, powerImg, t, dt)
		col += 2 * nPower
		logs()
		col += 2 * len(h.logs)
		t, dt = h.terms(len(h.laurent))
		h.laurentTerms(z, t, dt)
		images(col, laurentImg, t, dt)
		col += 2 * nLaurent
		t, dt = h.terms(len(h.mobiusK))
		if h.mobius != nil {
			h.mobius.terms(z, h.mobiusK, t, dt)
		}
		for k := range h.mobiusK {
			w := val(t[k], dt[k])
			add(i, col, real(w))
			// Two circles' only mirror runs through their centres, and so
			// through the limiting points: there w(g(z)) = conj(w(z)), and
			// the symmetric terms are those with real coefficients.
			if !mirrored {
				add(i, col+1, imag(w))
			}
			col += 2
		}
		if c, ok := uCol[p.floating]; ok && p.floating >= 0 {
			add(i, c, -scaleBy*p.w*p.a)
		}
	}
	for i, p := range pts {
		fill(i, p, 1, false)
		b.SetVec(i, p.w*(p.data-shiftOp(p)))
	}
	for k, c := range constraints {
		const heavy = 1e3
		target := c.target
		for _, p := range c.pts {
			fill(len(pts)+k, p, heavy, true)
			target -= p.w * shiftOp(p)
		}
		b.SetVec(len(pts)+k, heavy*target)
	}
	// Scale the columns to unit norm (the poles nearest a corner are large
	// there) and keep only the live ones: Im q_0 = 0 always, and a pure
	// Neumann problem leaves the constant, Re q_0, to the caller.
	constCol := 2 * nPole
	norms := columnNorms(A, rows, nc)
	var live []int
	for j := 0; j < nc; j++ {
		if norms[j] <= 1e-5*math.Sqrt(raw[j]) || freeConstant && j == constCol {
			norms[j] = 0
			continue
		}
		live = append(live, j)
	}
	// A small Tikhonov term (rows √λ·I, λ = 1e-26 against unit columns)
	// keeps the coefficients bounded where the basis is nearly dependent
	// (a corner's poles and its own powers describe the same singularity):
	// without it QR, which does not pivot, returns huge coefficients that
	// cancel, and the residual is rounding of them.
	const ridge = 1e-13
	// A hole corner's powers (about a pivot inside the hole) take almost
	// none: at 1e-13 their ridge set a floor near the hole's corners, about
	// 1e-11 of the data, that more poles never lowered (a square hole in a
	// square stopped there against a target of 1e-12; its tube took ten
	// fits). Lowered on these columns alone the fits reach their targets
	// (the square hole 6.5e-13, a triangular hole 3.7e-13 against 5e-13) and
	// the tube needs fewer fits; lowered everywhere, an L shape's re-entrant
	// corner stalled at 1e-10. Anything from 1e-16 to 0 gave the same fits.
	// A corner's ζ^β·log ζ likewise: at 1e-13 the L-shaped hole's fit
	// stalled near 3e-9 of its 12.5 (with fused multiply-add, or without:
	// the path was rounding's), and with 1e-16 reached 2e-12 either way.
	const pivotRidge = 1e-16
	// The live columns scaled, moved left in place (c ≤ j), and the ridge
	// rows under them: the least-squares matrix is A's top-left corner.
	raw2 := A.RawMatrix()
	for i := 0; i < rows; i++ {
		row := raw2.Data[i*raw2.Stride : i*raw2.Stride+nc]
		for c, j := range live {
			row[c] = row[j] / norms[j]
		}
	}
	powerCol := 2*nPole + 2*(degree+1) // the corner powers' first column
	for c, j := range live {
		r := ridge
		if e := (j - powerCol) / 2; j >= powerCol && e < nPower && pivoted[e] {
			r = pivotRidge
		}
		A.Set(rows+c, c, r)
	}
	B := raw2
	B.Rows, B.Cols = rows+len(live), len(live)
	// An ill-conditioned basis (exponentially clustered poles) is expected:
	// the least-squares fit is still good where the residual says so, and
	// the residual is measured afterwards; only a failed solve is an error.
	y, err := leastSquaresInPlace(B, b.RawVector().Data[:rows+len(live)])
	if err != nil {
		return nil, fmt.Errorf("the least-squares fit failed: %w", err)
	}
	x := mat.NewVecDense(nc, nil)
	for c, j := range live {
		x.SetVec(j, y[c])
	}
	coef := func(j int) float64 {
		if norms[j] == 0 {
			return 0
		}
		return x.AtVec(j) / norms[j]
	}
	// u = a·Re φ + b·Im φ = Re((a − ib)φ).
	pair := func(col int) complex128 { return complex(coef(col), -coef(col+1)) }
	h.cPole = make([]complex128, len(h.poles))
	for e, m := range poleImg {
		h.cPole[e] = m.coef(pair(2 * m.rep))
	}
	h.cPoly = make([]complex128, degree+1)
	for k := range h.cPoly {
		h.cPoly[k] = pair(constCol + 2*k)
	}
	first := constCol + 2*(degree+1)
	h.cPower = make([]complex128, len(h.powers))
	for e, m := range powerImg {
		h.cPower[e] = m.coef(pair(first + 2*m.rep))
	}
	first += 2 * nPower
	h.cLog = make([]float64, len(h.logs))
	for k := range h.cLog {
		h.cLog[k] = coef(first + 2*k) // Re log|z − c|; the Im column, multivalued, is 0 on purpose
	}
	first += 2 * len(h.logs)
	h.cLaurent = make([]complex128, len(h.laurent))
	for e, m := range laurentImg {
		h.cLaurent[e] = m.coef(pair(first + 2*m.rep))
	}
	first += 2 * nLaurent
	h.cMobius = make([]complex128, len(h.mobiusK))
	for k := range h.cMobius {
		h.cMobius[k] = complex(coef(first+2*k), -coef(first+2*k+1))
	}
	h.floatingU = map[int]float64{}
	for side, c := range uCol {
		h.floatingU[side] = coef(c)
	}
	return h, nil
}

// columnNorms is the 2-norm of each of a's first nc columns over its first
// m rows (below them the ridge rows are still 0), read row by row. A norm
// per column (mat.Norm of a column view) read the row-major matrix across
// its stride, a cache line an element, and took a quarter of a thin slot's
// fit (1 of its 4 s). The sums are BLAS's scaled ones (dnrm2: a running
// scale, the largest |a_ij| so far, and the sum of squares of a_ij/scale)
// in the order gonum's column norm takes them, so each norm is bit for bit
// the one it gave: the fits' adaptive paths are sensitive to rounding
// (TestGolden's L-shaped hole prints other residuals after a change in the
// last bit of a column's scale), and the explicit conversions keep a fused
// multiply-add out of both updates for the same reason.
func columnNorms(a *mat.Dense, m, nc int) []float64 {
	raw := a.RawMatrix()
	scale := make([]float64, nc)
	ssq := make([]float64, nc)
	for j := range ssq {
		ssq[j] = 1
	}
	for i := 0; i < m; i++ {
		row := raw.Data[i*raw.Stride : i*raw.Stride+nc]
		for j, v := range row {
			if v == 0 {
				continue
			}
			av := math.Abs(v)
			if av > scale[j] {
				t := scale[j] / av
				ssq[j] = 1 + float64(float64(ssq[j]*t)*t)
				scale[j] = av
			} else {
				t := av / scale[j]
				ssq[j] += float64(t * t)
			}
		}
	}
	for j := range ssq {
		ssq[j] = scale[j] * math.Sqrt(ssq[j]) // NaN in, NaN out; ∞ likewise
	}
	return ssq
}

// residualOn is the largest condition residual on the points.
func (h *rationalHarmonic) residualOn(pts []boundaryPoint) {
	h.residual = 0
	for _, p := range pts {
		r := p.residual(h)
		if r > h.residual || math.IsNaN(r) {
			h.residual, h.worstAt, h.worstOn = r, p.z, p.side
		}
	}
}

// identityImages are n terms that are their own representatives.
func identityImages(n int) []imageTerm {
	out := make([]imageTerm, n)
	for j := range out {
		out[j] = imageTerm{rep: j, factor: 1}
	}
	return out
}
