package domain

import (
	"fmt"
	"math"
	"math/cmplx"
	"strings"

	"psol/ansatz"
	"psol/series"
	"psol/series/cart"
)

// section is a region whose harmonic part psol fits numerically (lightning.go):
// a polygon or an ellipse. Its geometry in numbers is all the fit needs.
type section interface {
	Domain
	geometry(env series.Env) (sectionGeometry, error)
	// areaCells are the pieces of a rule for ∬ f dA over the section,
	// exact to rounding for smooth f, and refined where f is not
	// (areaNodes): the numeric parts' integrals.
	areaCells(env series.Env) ([]areaCell, error)
}

// sectionGeometry is a section's boundary for the fit: the sides as paths,
// the corners where poles cluster (none on a smooth boundary), and the centre
// and size that scale the polynomial.
type sectionGeometry struct {
	shape   Shape
	corners []corner
	// starts[k] and ends[k] index the corners at side k's ends (−1: none).
	starts, ends []int
	centre       complex128
	scale        float64
	holes        []holeBasis // a hole's centre and radius, for its logarithm and Laurent terms
	// warp, where set, maps a side's uniform samples to its parameter.
	warp []func(t float64) float64
	// mobius, for two circles, adds the Laurent series in the variable that
	// makes them concentric.
	mobius *mobiusMap
	// breaks are the points inside a side where its data are less smooth
	// than the rest (kinkBreaks): each a corner of angle π, whose poles
	// and samples gather there as at a vertex.
	breaks []sideBreak
	// sym is the problem's symmetry, where it has one (symmetry.go).
	sym *symmetry
	// images are the holes' corners mirrored in the outline's straight
	// sides near them (cornerimages.go).
	images []cornerImage
	// holeImages are the smooth holes' Laurent terms mirrored likewise.
	holeImages []holeImageSpec
	// rimImages are Laurent bases about the reflections of smooth holes
	// in a curved outline (ellipseRimImages).
	rimImages []holeBasis
	// shift goes with sym: the particular solution's asymmetric share (particularShift).
	shift func(z complex128) (float64, complex128)
}

// holeBasis is a hole's share of the basis: log|z − c| and the Laurent
// terms (ρ/(z − c))^j, or for an elliptical hole (focus f ≠ 0) log|w| and
// the terms w^(−j) of the map w = (ζ + √(ζ − f)·√(ζ + f))/m, ζ = z − c, m
// the sum of the semi-axes, which takes the outside of the ellipse onto
// |w| > 1 (|v| = |1/w| is 1 on the ellipse as ρ/|z − c| is on a circle): the
// terms decay from the ellipse outwards as the outside's own harmonic
// functions do, where the Laurent series about the centre of an elongated
// hole would not converge on the near parts of the region (common practice:
// the Joukowski map; e.g. Muskhelishvili on elliptical holes).
type holeBasis struct {
	c     complex128
	rho   float64
	focus complex128 // the focus on the major axis relative to c; 0 for a circle
	span  float64    // A + B, for an ellipse: |w| = 1 on it
}

// variable is the terms' variable v at z (term j is v^j) and d(log v)/dz.
func (hb holeBasis) variable(z complex128) (v, dlog complex128) {
	zeta := z - hb.c
	if hb.focus == 0 {
		return complex(hb.rho, 0) / zeta, -1 / zeta
	}
	// In the frame with the foci on the real axis, where the two square
	// roots' cuts join into the segment between the foci, inside the hole.
	dir := hb.axis()
	z1, fl := zeta/dir, complex(abs(hb.focus), 0)
	s := cmplx.Sqrt(z1-fl) * cmplx.Sqrt(z1+fl)
	// On the major axis beyond a focus, z1 is real and its imaginary part
	// a signed zero: z1 + fl turns −0 into +0 while z1 − fl keeps it, and
	// the two roots then come from opposite sides of their cuts. s is
	// √(z1² − f²) on the branch that runs like z1 far out (|w| > 1); a
	// mirrored hole's image (focus −f) read 9 for |v| there, and its terms
	// 10⁶ at points of the section.
	if real(s)*real(z1)+imag(s)*imag(z1) < 0 {
		s = -s
	}
	w := (z1 + s) / complex(hb.span, 0)
	// v = 1/w, dw/dz = w/(s·dir).
	return 1 / w, -1 / (s * dir)
}

// logTerm is the hole's logarithm L(z), whose real part is the basis's
// log term, and L'(z): log(z − c) about a circle's centre or a round
// polygon's; log w for an ellipse or an elongated polygon, w its exterior
// map (variable). Both carry the hole's flux, 2π, but log|z − c| differs
// from log|w| by Re log(w/(z − c)), analytic outside the focal segment,
// whose series in 1/w decays on the ellipse only as (f/m)^j (f the focal
// distance, m the sum of the semi-axes): 0.9 a term for a 10:1 ellipse. The
// hole's terms had to supply it, and a thin ellipse took 230 of them.
// L = log(z − c) + log(e·w/(z − c)), e the major axis's direction: the
// second argument lies in the right half-plane (w/ζ = (1 + √(1 − f²/ζ²))/m
// in the ellipse's frame), so Im L jumps only where arg(z − c) does, and
// L − log(z − c) is single-valued (the area integral relies on it); L is
// log w up to an imaginary constant.
func (hb holeBasis) logTerm(z complex128) (complex128, complex128) {
	d := z - hb.c
	if hb.focus == 0 {
		return cmplx.Log(d), 1 / d
	}
	v, dlog := hb.variable(z) // v = 1/w, dlog = −w'/w
	return cmplx.Log(d) + cmplx.Log(hb.axis()/(v*d)), -dlog
}

// logSlope is L'(z) alone (logTerm): a flux row's share, without the logs.
func (hb holeBasis) logSlope(z complex128) complex128 {
	if hb.focus == 0 {
		return 1 / (z - hb.c)
	}
	_, dlog := hb.variable(z)
	return -dlog
}

// axis is the ellipse's major-axis direction, a unit complex number.
func (hb holeBasis) axis() complex128 { return hb.focus / complex(abs(hb.focus), 0) }

// logValue is Re logTerm(z), the log term's value: log|z − c| or log|w|.
func (hb holeBasis) logValue(z complex128) float64 {
	if hb.focus == 0 {
		return math.Log(abs(z - hb.c))
	}
	v, _ := hb.variable(z)
	return -math.Log(abs(v))
}

// laurentTerms fills f and df with each Laurent term's value and derivative
// at z, a run j = 1, 2, … of one hole's terms by multiplication (a power at
// each term was the fit's largest cost; a callback per term, the next).
func (h *rationalHarmonic) laurentTerms(z complex128, f, df []complex128) {
	var v, dlog, fk complex128
	for k, t := range h.laurent {
		// A run is one hole's j = 1, 2, …: a new one wherever j does not
		// follow on (comparing the holes themselves cost more than the terms).
		if k == 0 || t.j != h.laurent[k-1].j+1 {
			v, dlog = t.hole.variable(z)
			fk = v
			for i := 1; i < t.j; i++ {
				fk *= v
			}
		} else {
			fk *= v
		}
		f[k], df[k] = fk, complex(float64(t.j), 0)*fk*dlog
	}
}

// recip is 1/w by its conjugate: no complex division's special cases (w is
// never 0, ∞ or NaN here), a third of its cost in the fit's inner loops.
func recip(w complex128) complex128 {
	s := 1 / (real(w)*real(w) + imag(w)*imag(w))
	return complex(real(w)*s, -imag(w)*s)
}

// powerTerms fills f and df with each corner power's value and derivative at z. A
// corner's powers ζ^β, β = (k − off)/α, share ζ and log ζ, and come by
// multiplication: (ζ^(1/α))^k times one ζ^(−off/α) per family of offsets (an
// exponential at each power was the fit's largest cost after the poles).
func (h *rationalHarmonic) powerTerms(z complex128, f, df []complex128) {
	var zeta, logZeta, dlog, root, rootK complex128
	var fam [2]struct {
		off float64
		f   complex128
	}
	nfam, kNow := 0, 0
	for k, c := range h.powers {
		if k == 0 || c.w != h.powers[k-1].w || c.pivot != h.powers[k-1].pivot || c.alpha != h.powers[k-1].alpha || c.k < kNow {
			var dzeta complex128
			zeta, dzeta = c.zeta(z)
			nfam, kNow = 0, 0
			if zeta != 0 {
				logZeta = cmplx.Log(zeta)
				dlog = recip(zeta) * dzeta
				root, rootK = cmplx.Exp(logZeta*complex(1/c.alpha, 0)), 1
				fam[0].off, fam[0].f, nfam = 0, 1, 1
				if c.off != 0 {
					fam[0].off, fam[0].f = c.off, cmplx.Exp(logZeta*complex(-c.off/c.alpha, 0))
				}
			}
		}
		if zeta == 0 {
			f[k], df[k] = 0, 0
			continue
		}
		for ; kNow < c.k; kNow++ {
			rootK *= root
		}
		var ff complex128
		found := false
		for i := 0; i < nfam; i++ {
			if fam[i].off == c.off {
				ff, found = fam[i].f, true
				break
			}
		}
		if !found {
			ff = 1
			if c.off != 0 {
				ff = cmplx.Exp(logZeta * complex(-c.off/c.alpha, 0))
			}
			if nfam < len(fam) {
				fam[nfam].off, fam[nfam].f = c.off, ff
				nfam++
			}
		}
		v := rootK * ff
		if c.log {
			f[k], df[k] = v*logZeta, v*(complex(c.beta, 0)*logZeta+1)*dlog
			continue
		}
		f[k], df[k] = v, complex(c.beta, 0)*v*dlog
	}
}

// SectionParts is a section's numeric harmonic part, for printing: its
// poles and polynomial, and how well it meets the side conditions.
type SectionParts struct {
	Corners, Degree int
	Holes           int   // holes, each with its logarithm and Laurent terms in the basis
	Elliptic        bool  // some hole is an ellipse or an elongated polygon: its terms are powers of an exterior map's inverse
	Poles           []int // at each corner, in the order of the vertices
	// Residual is the largest |condition residual| on a sampling of the
	// sides finer than the fit's, at (X, Y) on side Side.
	Residual float64
	X, Y     float64
	Side     string
	// Bound marks Dirichlet conditions on every side: by the maximum
	// principle Residual then bounds the harmonic part's error everywhere.
	Bound bool
	// Symmetries is the order of the problem's symmetry group the fit used
	// (1: none): the fit's rows lie on one of that many congruent parts of
	// the boundary, its terms summed over their images (symmetry.go).
	Symmetries int
	// Turns marks a symmetry group of turns alone (no mirror line).
	Turns bool
	fit   *rationalHarmonic
	quad  []*sideInterpolant // the numeric particular part on each side, if any
}

// attach adds the fitted harmonic part to the evaluator.
func (sp *SectionParts) attach(e *Evaluator, _ *Solution, _ series.Env) error {
	e.parts = append(e.parts, sp.fit)
	return nil
}

// maxSectionSteps caps the fit's refinements (poles per corner 4 + 4·step).
const maxSectionSteps = 12

// maxCornerPowers caps K, each family's count of a corner's own singular
// powers (cornerPowers: exponents (k − off)/α, k = 1..K): 4 + 3·step up to
// it. The first few carry the singularity; higher ones are smooth enough
// for the poles and the polynomial, and cost columns: uncapped they grew
// to a third of a hollow section's (168 of ~540 terms), and each fit's QR
// grows with the columns squared. Capped at 10 (single runs) the L shape's
// fit took 0.26 s instead of 0.45 and a triangular hole's 0.74 s instead of
// 1.54, each to the same residual within 20% and the same J to 12 digits.
const maxCornerPowers = 10

// solveSection is the pipeline on a section: u_p from the ansatz rules
// (closed, whatever the region), its operator on each side sampled, and the
// harmonic part fitted to the rest, refined until the residual on a finer
// sampling meets the tolerance.
func solveSection(d section, p *posed) (*Solution, error) {
	allNeumann := true
	for _, c := range p.conds {
		allNeumann = allNeumann && c.Kind == Neumann
	}
	// The waves (exponentials and trigonometric functions of x and y) in
	// closed form; pq is the problem left to the polar rules and the
	// quadrature, whose source's rest is what no rule closes.
	waves, we, pq, fPolar := splitSectionWaves(p)
	up, rules, err := ansatz.Particular(fPolar)
	if err != nil {
		return nil, unsupported("%w", err)
	}
	geo, err := d.geometry(p.env)
	if err != nil {
		return nil, unsupported("the region needs its sizes as numbers: %w", err)
	}
	var quad *ansatz.Quadrature
	if pq.rest != nil {
		if quad, err = sectionQuadrature(d, geo, pq); err != nil {
			return nil, err
		}
	}
	conds := make([]sideCondition, len(geo.shape.Sides))
	for k, side := range geo.shape.Sides {
		if conds[k], err = compileSideCondition(p.conds[side.Name], up, p.env); err != nil {
			return nil, err
		}
		if quad != nil {
			conds[k].quad = newSideInterpolant(quad, side, p.tol)
			conds[k].degree = -1
		}
		if we != nil { // u_w's trace: no polynomial
			conds[k].waves, conds[k].degree, conds[k].polynomial = we, -1, false
		}
	}
	for k := range conds { // a hole's sides share its value and its flux
		conds[k].group = k
		for j := 0; j < k; j++ {
			if holeGroup(geo.shape.Sides[j].Name) == holeGroup(geo.shape.Sides[k].Name) {
				conds[k].group = j
				break
			}
		}
	}
	keepSpread(&geo, conds)
	addKinkBreaks(&geo, quad)
	addDataKinkBreaks(&geo, p.conds, p.env)
	markSingularCorners(&geo, conds)
	scale := 0.0 // the problem's size on the boundary: the data and u_p's operator
	for k, side := range geo.shape.Sides {
		for j := 0; j <= 64; j++ {
			x, y, nx, ny := side.At(float64(j) / 64)
			g, op := conds[k].parts(float64(j)/64, x, y, nx, ny)
			scale = math.Max(scale, math.Max(math.Abs(g), math.Abs(op)))
		}
	}
	if we != nil {
		// The waves' size inside counts too: their trace can vanish to
		// rounding on every side (sin(x)·sin(y) on the square (0, π)²),
		// where the data's size alone, 1e-16, made the fit's rounding a
		// residual of 0.8 of it and the problem was refused.
		scale = math.Max(scale, waveSize(we, geo.shape.Box, InsideXY(d, p.env)))
	}
	target := p.tol * math.Max(scale, 1e-300)
	if quad == nil && waves == nil && !allNeumann && len(geo.breaks) == 0 && !p.wholeBoundary { // a symmetric problem fits on one chamber (symmetry.go)
		if geo.sym, err = sectionSymmetry(d, &geo, conds, p, 0.01*target); err != nil {
			return nil, err
		}
		if geo.sym != nil {
			geo.shift = particularShift(geo.sym, conds[0])
		}
	}
	constraints, err := floatingConstraints(geo, conds, up, p.env)
	if err != nil {
		return nil, err
	}
	if allNeumann {
		if err := neumannBalance(d, geo, conds, up, quad, p); err != nil {
			return nil, err
		}
	}
	// Gopal & Trefethen's adaptive loop: after each fit, the corners whose
	// nearby residual misses the target get more poles (about √n more), and
	// the polynomial's degree grows while the residual away from the
	// corners misses it.
	poles := make([]int, len(geo.corners))
	for k := range poles {
		poles[k] = 4
	}
	degree := 12
	values := true // a value condition on every side: the residual bounds the error
	for _, c := range conds {
		values = values && c.b == 0
	}
	var best, prev *rationalHarmonic // the best fit, and the runner-up
	var bestPoles []int
	var lastCheck []boundaryPoint
	stalled := 0
	steps, atFloor := 0, false // the fits made, and whether the last stopped at the floor
	for step := 1; step <= maxSectionSteps; step++ {
		steps = step
		fit, check := geo.samples(poles, degree, conds)
		h, err := fitHarmonic(fit, geo, poles, degree, min(4+3*step, maxCornerPowers), allNeumann, constraints)
		if err != nil {
			return nil, unsolvable("%w", err)
		}
		near, far := h.residualsByCorner(check, geo.corners)
		if geo.sym != nil { // a corner's residual is its representative's
			for k, r := range geo.sym.rep {
				near[r] = math.Max(near[r], near[k])
			}
		}
		lastCheck = check
		if best == nil || h.residual < best.residual {
			prev, best, bestPoles, stalled = best, h, append([]int(nil), poles...), 0
		} else {
			if prev == nil || h.residual < prev.residual {
				prev = h // the runner-up, for the estimate
			}
			stalled++
		}
		// At the floor the basis's conditioning sets (the ridge, rounding):
		// within a factor 100 of the target, a fit with more poles that is
		// worse than the best. More fits there gain little and cost much
		// (each about twice the last): a hollow section without symmetry
		// spent 15 of its 24 s on three, to go from 3.1e-13 to 4.6e-14
		// against a target of 6.8e-15. The best stands, its residual
		// printed. (A step that gains little but gains is no floor: an
		// L-shaped section's fit gains 2.7 once, then 100 more.) Floors
		// lie near rounding, below 1e-9 of the data: above that a worse
		// fit is a step of the loop, not a floor (an L-shaped hole at a
		// loose tolerance had its refinement cut short at 1e-7 of the data,
		// by rounding's luck, and was refused).
		//
		// A stall where the fit is worst at a corner with fewer poles than
		// the most refined is no floor but that corner lagging: a corner
		// whose residual was small early gets no poles while the others
		// grow, and once it is the worst more fits do not help until it
		// catches up. Taken for a floor, it stopped an L shape at 8e-11 of
		// its data (given its poles, 2e-14 in six fits more, 0.3 s) and a
		// section with a hole near its walls at 7e-12 against a target of
		// 1e-12, each with a note blaming rounding.
		worstNear, worstCorner, mostPoles := 0.0, -1, 0
		for k, r := range near {
			if r > worstNear {
				worstNear, worstCorner = r, k
			}
			mostPoles = max(mostPoles, poles[k])
		}
		lagging := stalled > 0 && worstCorner >= 0 && worstNear >= far && poles[worstCorner] < mostPoles
		floor := stalled > 0 && !lagging && best.residual <= 100*target && best.residual <= 1e-9*scale
		// With a flux condition a second fit is needed for the estimate.
		if best.residual <= target && (values || prev != nil) || stalled >= 3 || floor {
			atFloor = floor && best.residual > target
			break
		}
		// The corners within a factor 10 of the worst residual, the far
		// one's too: while the residual away from the corners is the
		// worst, poles do not lower it, and a thin ellipse's fit (its
		// flanks the worst for ten fits) took 65 poles at each of the
		// section's corners for nothing (11 s; 4.8 s without them).
		for k := range poles {
			if near[k] > target && near[k] > 0.1*math.Max(worstNear, far) {
				poles[k] += max(4, poles[k]/3)
			}
		}
		if lagging {
			poles[worstCorner] = max(poles[worstCorner], mostPoles/2)
		}
		// The polynomial grows where the residual away from the corners
		// is a good part of the worst (on a smooth boundary, always).
		if far > target && far > 0.3*worstNear || len(geo.corners) == 0 {
			degree += 4 + degree/4
		}
		if geo.sym != nil { // the mirrored corners as their representatives, for the count printed
			for k, r := range geo.sym.rep {
				poles[k] = poles[r]
			}
		}
	}
	// A fit far from the target is no answer: psol refuses it rather than
	// print a value it cannot stand behind.
	if best.residual > math.Max(target, 1e-9*scale) || math.IsNaN(best.residual) {
		why := "the fit could not resolve the section there"
		if quad != nil {
			// The quadrature samples the source on a disk about the
			// section: a singularity there, outside the section, spoils
			// u_q's trace (1/(x + 0.1) beside the unit square).
			why = fmt.Sprintf("the fit could not resolve the section there; the source's part by quadrature is taken on the whole disk of radius %.4g about (%.4g, %.4g), and a singularity or steep growth of %s there, outside the section, would spoil it", quad.R, quad.X0, quad.Y0, pq.rest.Text())
		}
		for k := range geo.corners {
			if math.Abs(geo.corners[k].angle-0.5) < 1e-9 {
				continue // at a right angle mixed conditions converge well
			}
			if on, back := cornerSides(&geo, k); on >= 0 && back >= 0 && (conds[on].b == 0) != (conds[back].b == 0) {
				why = "a corner where a value condition meets a flux or convection condition at an angle other than pi/2 converges slowly with psol's rational fit"
				break
			}
		}
		return nil, unsolvable("the harmonic part's fit on %s reached a residual of only %.1e (relative %.1e) in %d refinements, largest at (x, y) = (%.6g, %.6g) on %s: %s, and psol gives no answer it cannot stand behind", d.Describe(), best.residual, best.residual/math.Max(scale, 1e-300), steps, real(best.worstAt), imag(best.worstAt), geo.shape.Sides[best.worstOn].Name, why)
	}
	parts := &SectionParts{Corners: len(geo.corners), Degree: best.degree * best.polyPower, Residual: best.residual,
		X: real(best.worstAt), Y: imag(best.worstAt), Side: geo.shape.Sides[best.worstOn].Name, Bound: true, fit: best, Poles: bestPoles,
		Holes: len(geo.holes), Symmetries: geo.sym.order(), Turns: geo.sym != nil && !geo.sym.mirrored}
	for _, hb := range geo.holes {
		parts.Elliptic = parts.Elliptic || hb.focus != 0
	}
	for _, c := range conds {
		if c.quad != nil {
			parts.quad = append(parts.quad, c.quad)
		}
	}
	sol := &Solution{Domain: d, Source: p.f, Particular: up, U: up, Rules: rules, Section: parts, stages: []stage{parts}, Numeric: true,
		Quadrature: quad, Rest: pq.rest, Waves: waves}
	if waves != nil {
		sol.stages = append(sol.stages, waves)
	}
	for k, c := range conds {
		if c.floating && c.group == k {
			if sol.Floating == nil {
				sol.Floating = map[string]series.Coef{}
			}
			name := holeGroup(geo.shape.Sides[k].Name)
			sol.Floating[name] = decimal(best.floatingU[k])
			sol.Notes = append(sol.Notes, fmt.Sprintf("u on %s is the constant %s, found with the fit from its net outward flux %.12g", name, series.Const(sol.Floating[name]).TextApprox(), c.flux))
		}
	}
	if allNeumann { // u up to an additive constant, and the value that makes its mean on the boundary 0
		used := map[string]bool{}
		p.f.Params(used)
		for _, c := range p.conds {
			c.G.Exact.Params(used)
		}
		sol.Free = freeName(used)
		sol.U = up.Add(series.Const(series.SymCoef(series.Param(sol.Free))))
		sol.Notes = append(sol.Notes, fmt.Sprintf("pure Neumann data fix u only up to an additive constant %s", sol.Free))
		// The fitted part's own mean on the boundary is moved into its
		// constant, so that h has none and the constant printed is the
		// particular solution's alone: the basis holds combinations close
		// to a constant (a corner's ζ^β·log ζ with the polynomial's), whose
		// share the fit leaves to rounding: with the logs' ridge at 1e-13 it
		// set h to 3.6e-6 on the unit square, and C printed 3.6e-6 away from
		// −5/12 (at 1e-16 it does not, but nothing in the fit promises it).
		mean, hMean, length := 0.0, 0.0, 0.0
		for k, side := range geo.shape.Sides {
			side.panelNodes(uniformEdges(32), ansatz.GaussX, ansatz.GaussW, func(t, w float64) {
				px, py, _, _ := side.At(t)
				r, th := polarOf(px, py)
				hMean += w * best.valueOnly(complex(px, py))
				v := conds[k].up.At(r, th)
				if w := conds[k].waves; w != nil {
					v += w.AtXY(px, py)
				}
				if quad != nil {
					q, _ := quad.At(quad.Local(px, py))
					v += q
				}
				mean, length = mean+w*v, length+w
			})
		}
		best.cPoly[0] -= complex(hMean/length, 0)
		sol.FreeMean = decimal(-mean / length)
	}
	eq := Check{Name: "lap(u_p) - f", Exact: true}
	if r := up.Laplacian().Sub(fPolar); !r.IsZero() {
		eq.Exact, eq.Residual = false, r
	}
	sol.Checks = append(sol.Checks, eq)
	if waves != nil {
		sol.Checks = append(sol.Checks, waves.check())
	}
	for k, side := range geo.shape.Sides {
		cond := p.conds[side.Name]
		parts.Bound = parts.Bound && cond.Kind == Dirichlet
		data := Side{Condition: cond, At: side.Name, AtLaTeX: side.Name, Trace: conds[k].trace, DataText: cond.G.Text(), DataLaTeX: cond.G.LaTeX()}
		if p, err := cart.FromPolar(cond.G.Exact); cond.G.IsExact() && err == nil { // in x and y, as the section prints
			data.DataText, data.DataLaTeX = p.Text(), p.LaTeX()
		}
		sol.Sides = append(sol.Sides, data)
		name := OperatorText(cond, "u") + " - g"
		if cond.Kind == Floating {
			// What worst measures on a floating side is the value against
			// the hole's fitted constant U; its net flux is a constraint of
			// the fit (TestHoleNetFluxHolds), not sampled here.
			name = "u - U"
		}
		sol.Checks = append(sol.Checks, Check{Name: name, Side: side.Name, Numeric: conds[k].worst(best, k, geo.shape.Sides[k], &geo)})
	}
	// The error at a point: for Dirichlet data the maximum principle bounds
	// the harmonic part's error by the boundary residual; with fluxes the
	// residual, times the section's size for a flux, is an estimate.
	// With flux conditions the residual bounds nothing: the estimate is
	// the largest change from the previous fit on the sides, which by the
	// maximum principle (their difference is harmonic) bounds the change
	// everywhere inside, and errs on the safe side for the final fit.
	sol.DataError = best.residual
	if !parts.Bound {
		change := 0.0
		if prev != nil {
			lo, hi := math.Inf(1), math.Inf(-1)
			for _, p := range lastCheck {
				d := best.valueOnly(p.z) - prev.valueOnly(p.z)
				lo, hi = math.Min(lo, d), math.Max(hi, d)
			}
			change = math.Max(math.Abs(lo), math.Abs(hi))
			if allNeumann {
				// u is fixed up to a constant, and each fit's constant is
				// rounding's (best's is moved to its mean above): the
				// change that counts is beside the best constant shift.
				change = (hi - lo) / 2
			}
		}
		sol.DataError = math.Max(best.residual*math.Max(1, geo.scale), change)
	}
	if quad != nil {
		// The quadrature's own error on the sides enters the data, and so
		// (maximum principle) the harmonic part everywhere.
		qerr := 0.0
		for _, side := range geo.shape.Sides {
			for j := 0; j <= 32; j++ {
				x, y, _, _ := side.At(float64(j) / 32)
				_, e := quad.At(quad.Local(x, y))
				qerr = math.Max(qerr, e)
			}
		}
		for _, in := range parts.quad { // the interpolants' own error moves the data too
			qerr = math.Max(qerr, in.err)
		}
		sol.DataError += qerr
		// A section's sides read the kinks' closed form point by point.
		kinkHow := fmt.Sprintf("), evaluated at each boundary point; the fit gathers its poles where the line crosses a side (%d such points), as at a corner", len(geo.breaks))
		note := quadratureNote(quad, pq.rest, quadratureDisk(quad), fmt.Sprintf("FFT in theta with %d samples, modes up to %d; Gauss–Legendre in r", quad.Samples, quad.Modes), kinkHow, false)
		sol.Notes = append(sol.Notes, note)
		qc, err := checkedQuadrature(d, sol, pq)
		if err != nil {
			return nil, err
		}
		sol.Checks = append(sol.Checks, qc)
	}
	bound := "by the maximum principle this bounds the harmonic part's error everywhere inside"
	if !parts.Bound {
		bound = fmt.Sprintf("with flux conditions that is no bound: the error estimate, %.1e, is the largest change from the previous fit", sol.DataError)
	}
	fitText := parts.Describe()
	sol.Steps = append(sol.Steps, fmt.Sprintf("harmonic part: the real part of a rational function (%s) fitted by least squares to the side conditions (Gopal & Trefethen's lightning method)", fitText))
	sol.Notes = append(sol.Notes, fmt.Sprintf("the harmonic part is numeric: the largest residual of the side conditions, on a sampling finer than the fit's, is %.1e; %s", best.residual, bound))
	if best.residual > target {
		why := fmt.Sprintf("in %d refinements", steps)
		if atFloor {
			why = fmt.Sprintf("after %d refinements its residual stopped falling (the floor rounding sets for this fit)", steps)
		}
		sol.Notes = append(sol.Notes, fmt.Sprintf("the fit did not reach the tolerance %.0e (relative to the boundary data's size %.3g): %s", p.tol, scale, why))
	}
	return sol, nil
}

// sideCondition is one side's condition in numbers: a·u + b·∂u/∂n = g, with
// u_p's share (its operator value) to subtract.
type sideCondition struct {
	floating bool             // u is one unknown constant U here, with net outward flux
	flux     float64          // the flux, for a floating side (of its whole hole)
	group    int              // the first side of its hole: one U, one flux for all its sides
	quad     *sideInterpolant // the numeric particular part on the side, where the source has one
	waves    *waveEval        // the particular solution's waves (WavePart), where the source has any
	a, b     float64
	g        series.CompiledField
	up       series.Compiled
	ur, ut   series.Compiled // ∂u_p/∂r and ∂u_p/∂θ
	trace    series.Sum      // u_p's operator on the side, where it prints (Dirichlet: u_p)
	// polynomial: the data and u_p are polynomials in x and y (no
	// quadrature part), whatever the kind of condition.
	polynomial bool
	// degree bounds the whole exponents at which the harmonic part's
	// expansion at a corner of this side can take a logarithm (exponents
	// beyond the data's degree meet no data to resonate with): the degree
	// of h's data as a polynomial in x and y, one more for a flux's; −1
	// where the data are no polynomial (or a Robin side mixes the orders).
	degree int
}

func compileSideCondition(cond Condition, up series.Sum, env series.Env) (sideCondition, error) {
	sc := sideCondition{a: 1}
	switch cond.Kind {
	case Neumann:
		sc.a, sc.b = 0, 1
	case Robin:
		h, err := cond.H.Float(env)
		if err != nil {
			return sc, unsupported("the Robin coefficient on %s needs a value: %w", cond.Side, err)
		}
		sc.a, sc.b = h, 1
	case Floating: // u = U (one more unknown) on the side; its data is the net flux
		c, ok := cond.G.Exact.Const()
		if !ok || !cond.G.IsExact() {
			return sc, unsupported("the net flux on %s must be a constant", cond.Side)
		}
		q, err := c.Float(env)
		if err != nil {
			return sc, unsupported("the net flux on %s needs a value: %w", cond.Side, err)
		}
		sc.floating, sc.flux = true, q
	}
	var err error
	g := cond.G
	if cond.Kind == Floating {
		g = series.ExactField(series.Sum{}) // the value's data: u − U = 0
	}
	if sc.g, err = g.Compile(env); err != nil {
		return sc, unsupported("the data on %s need every parameter's value: %w", cond.Side, err)
	}
	if sc.up, err = up.Compile(env); err != nil {
		return sc, unsupported("the particular solution needs every parameter's value: %w", err)
	}
	if sc.ur, err = up.DR().Compile(env); err != nil {
		return sc, err
	}
	if sc.ut, err = up.DTheta().Compile(env); err != nil {
		return sc, err
	}
	if cond.Kind == Dirichlet {
		sc.trace = up
	}
	sc.degree = dataDegree(cond, g, up)
	if _, err := cart.FromPolar(up); err == nil && g.IsExact() {
		_, err = cart.FromPolar(g.Exact)
		sc.polynomial = err == nil
	}
	return sc, nil
}

// keepSpread keeps a slot corner's spread pivot (holeBasis.spreadZeta)
// where its hole's data are polynomials, and gives it the centre's pivot
// elsewhere. Polynomial data continue h into the hole with no singularity
// but the corners' (the reflection principle, across each straight side),
// and the spread pivot's powers, smooth along the flanks, serve: a 10:1
// slot's fit went from 2.5 to 0.3 s. Data singular inside the hole, as a
// line source's trace is, take a long series in the ellipse's 1/w about
// the focal segment, and the centre's powers, singular at the centre as
// such data are, served them better: a manufactured solution with a log
// and a pole at a 10:1 slot's centre took 8.7 s spread and 0.7 s about
// the centre.
func keepSpread(g *sectionGeometry, conds []sideCondition) {
	for k := range g.corners {
		c := &g.corners[k]
		if c.spread.focus == 0 {
			continue
		}
		on, _ := cornerSides(g, k)
		hole := holeGroup(g.shape.Sides[on].Name)
		for j, side := range g.shape.Sides {
			if holeGroup(side.Name) == hole && !conds[j].polynomial && !conds[j].floating {
				c.spread, c.hasPivot = holeBasis{}, c.centrePivot
				break
			}
		}
	}
}

// dataDegree is sideCondition.degree: the degree of u_p and of the data
// (a flux's plus one) as polynomials in x and y, −1 where either is none
// or the side is a Robin one.
func dataDegree(cond Condition, g series.Field, up series.Sum) int {
	if cond.Kind == Robin || !g.IsExact() {
		return -1
	}
	pu, err := cart.FromPolar(up)
	if err != nil {
		return -1
	}
	pg, err := cart.FromPolar(g.Exact)
	if err != nil {
		return -1
	}
	d := pg.Degree()
	if cond.Kind == Neumann {
		d++
	}
	return max(d, pu.Degree(), 0)
}

// parts are the data g and u_p's operator value at a boundary point, t
// along its side (the numeric particular part is interpolated in t; t < 0
// leaves it out).
func (sc sideCondition) parts(t, x, y, nx, ny float64) (g, op float64) {
	r, th := polarOf(x, y)
	g = sc.g.At(r, th)
	op = sc.a * sc.up.At(r, th)
	if sc.quad != nil && t >= 0 {
		v, dn := sc.quad.at(t)
		op += sc.a*v + sc.b*dn
	}
	if sc.b != 0 {
		grad := sc.particularGradient(r, th)
		op += sc.b * (nx*real(grad) + ny*imag(grad))
	}
	if w := sc.waves; w != nil {
		op += sc.a * w.AtXY(x, y)
		if sc.b != 0 {
			wx, wy := w.grad(x, y)
			op += sc.b * (nx*wx + ny*wy)
		}
	}
	return g, op
}

// particularGradient is ∇u_p at (r, θ) as ∂x + i·∂y.
func (sc sideCondition) particularGradient(r, th float64) complex128 {
	rr := math.Max(r, 1e-300)
	ur, ut := sc.ur.At(rr, th), sc.ut.At(rr, th)/rr
	sin, cos := math.Sincos(th)
	return complex(cos*ur-sin*ut, sin*ur+cos*ut)
}

// sideInterpolant is the numeric particular solution's value and normal
// derivative along one side, as Chebyshev interpolants in the side's even
// parameter u (SidePath.Even: arc length, but an ellipse's eccentric angle,
// in which the trace of a thin one's tips is as smooth as its flanks): the
// fit asks for them at thousands of points, each a quadrature evaluation
// otherwise. Its error, checked at the midpoints between the nodes, joins
// the data's.
type sideInterpolant struct {
	u, v, dn, w []float64 // nodes, values, weights (barycentric)
	err         float64
	evenOf      func(t float64) float64 // u at the side's t
	// kinks are the source's kinks, whose closed part is added at each
	// point rather than interpolated: a side the kink's line crosses has a
	// trace with a jump in its third derivative there, which a polynomial
	// interpolant met only to 1e-9 at 1024 nodes (and the fit to 2e-8).
	kinks []ansatz.Kink
	path  SidePath
}

func newSideInterpolant(q *ansatz.Quadrature, path SidePath, tol float64) *sideInterpolant {
	kinks := q.GlobalKinks()
	eval := func(u float64) (float64, float64) {
		x, y, nx, ny := path.At(path.even(u))
		r, th := q.Local(x, y)
		rr := math.Max(r, 1e-300)
		v, pr, pt := q.ValueGradient(rr, th)
		pt /= rr
		ux, uy := math.Cos(th)*pr-math.Sin(th)*pt, math.Sin(th)*pr+math.Cos(th)*pt
		for _, k := range kinks { // added back exactly by at
			kx, ky := k.GradientXY(x, y)
			v, ux, uy = v-k.ValueXY(x, y), ux-kx, uy-ky
		}
		return v, nx*ux + ny*uy
	}
	// The points of the second kind at n and the midpoints that check them
	// are together the points at 2n (the even and the odd ones): each
	// doubling reuses every value it has, and each point is evaluated once
	// (to three doublings it took 451 evaluations where 257 serve).
	const first = 32
	points := func(n int, odd bool) []float64 {
		var us []float64
		for j := 0; j <= n; j++ {
			if odd && j%2 == 0 {
				continue
			}
			us = append(us, (1-math.Cos(math.Pi*float64(j)/float64(n)))/2)
		}
		return us
	}
	var vs, dns []float64
	for _, u := range points(first, false) {
		v, dn := eval(u)
		vs, dns = append(vs, v), append(dns, dn)
	}
	for n := first; ; n *= 2 {
		in := &sideInterpolant{evenOf: path.evenOf, kinks: kinks, path: path}
		in.u, in.v, in.dn = points(n, false), vs, dns
		in.w = make([]float64, n+1)
		for j := range in.w {
			in.w[j] = 1
			if j%2 == 1 {
				in.w[j] = -1
			}
			if j == 0 || j == n {
				in.w[j] /= 2
			}
		}
		size := 0.0
		for j := range in.v {
			size = math.Max(size, math.Max(math.Abs(in.v[j]), math.Abs(in.dn[j])))
		}
		mids := points(2*n, true)
		midV, midDn := make([]float64, len(mids)), make([]float64, len(mids))
		for j, u := range mids {
			v, dn := eval(u)
			midV[j], midDn[j] = v, dn
			a, b := in.atEven(u)
			in.err = math.Max(in.err, math.Max(math.Abs(a-v), math.Abs(b-dn)))
		}
		if in.err <= tol*math.Max(size, 1e-300) || n >= 1024 {
			return in
		}
		next, nextDn := make([]float64, 2*n+1), make([]float64, 2*n+1)
		for j := 0; j <= 2*n; j++ {
			if j%2 == 0 {
				next[j], nextDn[j] = vs[j/2], dns[j/2]
			} else {
				next[j], nextDn[j] = midV[j/2], midDn[j/2]
			}
		}
		vs, dns = next, nextDn
	}
}

// smooth is the interpolated value and normal derivative at the side's t
// without the kinks' closed parts: the quadrature's own part.
func (in *sideInterpolant) smooth(t float64) (v, dn float64) {
	return in.atEven(in.evenOf(t))
}

// at is the interpolated value and normal derivative at the side's t.
func (in *sideInterpolant) at(t float64) (v, dn float64) {
	v, dn = in.atEven(in.evenOf(t))
	if len(in.kinks) > 0 {
		x, y, nx, ny := in.path.At(t)
		for _, k := range in.kinks {
			kx, ky := k.GradientXY(x, y)
			v, dn = v+k.ValueXY(x, y), dn+nx*kx+ny*ky
		}
	}
	return v, dn
}

// atEven is the interpolated value and normal derivative at u.
func (in *sideInterpolant) atEven(u float64) (v, dn float64) {
	var num, numD, den float64
	for j, uj := range in.u {
		if u == uj {
			return in.v[j], in.dn[j]
		}
		c := in.w[j] / (u - uj)
		num, numD, den = num+c*in.v[j], numD+c*in.dn[j], den+c
	}
	return num / den, numD / den
}

// polarOf is (r, θ) of (x, y), θ in [0, 2π).
func polarOf(x, y float64) (float64, float64) {
	th := math.Atan2(y, x)
	if th < 0 {
		th += 2 * math.Pi
	}
	return math.Hypot(x, y), th
}

// sectionQuadrature is the numeric particular solution of the source's part
// with no closed form: the polar quadrature on the disk about the origin
// that holds the section (any condition on its rim will do: only Δu_p = f
// inside the section matters). The source must be defined on that disk.
func sectionQuadrature(d section, geo sectionGeometry, p *posed) (*ansatz.Quadrature, error) {
	cf, err := series.Field{Rest: p.rest}.Compile(p.env)
	if err != nil {
		return nil, unsupported("the source %s needs every parameter's value: %w", p.rest.Text(), err)
	}
	// The disk is about the section's own centre (its box's), not the
	// origin: the source's extension beyond the section stays near it.
	x0, y0 := (geo.shape.Box.X0+geo.shape.Box.X1)/2, (geo.shape.Box.Y0+geo.shape.Box.Y1)/2
	R := 0.0
	for _, side := range geo.shape.Sides {
		for j := 0; j <= 256; j++ {
			x, y, _, _ := side.At(float64(j) / 256)
			R = math.Max(R, math.Hypot(x-x0, y-y0))
		}
	}
	R *= 1 + 1e-9
	for i := 1; i <= 64; i++ {
		for j := 0; j < 64; j++ {
			r, th := R*float64(i)/64, 2*math.Pi*float64(j)/64
			x, y := x0+r*math.Cos(th), y0+r*math.Sin(th)
			if v := cf.At(polarOf(x, y)); math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, unsolvable("the source %s is not a finite number at (x, y) = (%.4g, %.4g): psol's quadrature for %s needs it on the whole disk of radius %.4g about (%.4g, %.4g), around the section, not only inside", p.rest.Text(), x, y, d.Describe(), R, x0, y0)
			}
		}
	}
	return kinkedQuadrature(p, 0, R, x0, y0)
}

func (sc sideCondition) point(t, x, y, nx, ny float64, side int, geo *sectionGeometry) boundaryPoint {
	g, op := sc.parts(t, x, y, nx, ny)
	p := boundaryPoint{z: complex(x, y), nu: complex(nx, ny), a: sc.a, b: sc.b, data: g - op, side: side, w: 1, floating: -1}
	if sc.floating {
		p.floating = sc.group
	}
	if sc.b != 0 {
		for _, c := range geo.corners {
			p.w = math.Min(p.w, abs(p.z-c.w)/geo.scale)
		}
	}
	return p
}

// worst is the side's largest (weighted) residual on a fine sampling of
// its own: 400 points along it, and toward each end four points a decade
// down to the depth the fit resolves (nearest), where a corner's error
// gathers.
func (sc sideCondition) worst(h *rationalHarmonic, k int, path SidePath, geo *sectionGeometry) float64 {
	out := 0.0
	at := func(t float64) {
		x, y, nx, ny := path.At(t)
		out = math.Max(out, sc.point(t, x, y, nx, ny, k, geo).residual(h))
	}
	for j := 0; j < 400; j++ {
		at(path.even((float64(j) + 0.5) / 400))
	}
	for t := 0.5 / 400; t*path.Length >= nearest*geo.scale; t /= math.Sqrt(math.Sqrt(10)) {
		at(t)
		at(1 - t)
	}
	return out
}

// samples are the fit's points and the finer check points: uniform on each
// side, and at a corner clustered like its poles (three points per pole
// distance for the fit, four between them for the check).
func (g sectionGeometry) samples(poles []int, degree int, conds []sideCondition) (fit, check []boundaryPoint) {
	sides := g.shape.Sides
	// Three rows a column: the polynomial's and each hole's Laurent terms.
	blocks := 1 + len(g.holes) // the polynomial and each hole's Laurent terms
	if g.mobius != nil {
		blocks = 3 // the polynomial, and the Möbius series both ways
	}
	base := 3*(2*degree+2)*blocks/max(len(sides), 1)/2 + 12
	// Around a hole its Laurent terms and the polynomial both act, up to
	// the degree each way: each closed curve, a hole or the outline, needs
	// its own share, split among its sides. (The outline's sides once
	// counted as a curve each: a rectangle's took four shares, two thirds
	// of a hollow section's rows.)
	curve := func(side string) string {
		if g := holeGroup(side); strings.HasPrefix(g, "hole") {
			return g
		}
		return "" // the outline
	}
	members := map[string]int{}
	for _, s := range sides {
		members[curve(s.Name)]++
	}
	perSide := func(k int) int {
		if len(g.holes) == 0 {
			return base
		}
		return max(base, (6*degree+12)/members[curve(sides[k].Name)])
	}
	dists := func(k int) []float64 { return poleDistances(poles[k], g.corners[k].poleScale(g.scale)) }
	add := func(to *[]boundaryPoint, k int, t float64) {
		if t*sides[k].Length < 0.3*nearest*g.scale || (1-t)*sides[k].Length < 0.3*nearest*g.scale {
			return
		}
		x, y, nx, ny := sides[k].At(t)
		*to = append(*to, conds[k].point(t, x, y, nx, ny, k, &g))
	}
	for k, side := range sides {
		uniform := perSide(k)
		warp := side.even
		if k < len(g.warp) && g.warp[k] != nil {
			warp = g.warp[k]
		}
		for i := 0; i < uniform; i++ {
			add(&fit, k, warp((float64(i)+0.5)/float64(uniform)))
		}
		for i := 0; i < 3*uniform; i++ {
			add(&check, k, warp((float64(i)+0.25)/float64(3*uniform)))
		}
		for _, end := range []struct {
			corner int
			at     func(s float64) float64
		}{{g.starts[k], func(s float64) float64 { return s }}, {g.ends[k], func(s float64) float64 { return 1 - s }}} {
			if end.corner < 0 {
				continue
			}
			ds := dists(end.corner)
			// Below its nearest pole a corner had no points: its value at
			// the vertex went unfitted and unchecked, and a corner given
			// few poles was looked at no closer than they reach (a hole's
			// corner read 6e-8 there and 2e-5 at 1e-9 of the section's
			// size). A fit point each decade down to the depth the fit
			// resolves (nearest), a check point between each.
			for d := ds[0] / 10; d >= nearest*g.scale; d /= 10 {
				if s := d / side.Length; s < 0.5 {
					add(&fit, k, end.at(s))
					add(&check, k, end.at(0.3*s))
				}
			}
			for _, d := range ds {
				for _, f := range []float64{0.5, 1, 2} {
					if s := f * d / side.Length; s < 0.5 {
						add(&fit, k, end.at(s))
					}
				}
				for _, f := range []float64{0.35, 0.7, 1.4, 2.8} {
					if s := f * d / side.Length; s < 0.5 {
						add(&check, k, end.at(s))
					}
				}
			}
		}
	}
	for _, b := range g.breaks { // clustered both ways about a break, as about a vertex
		side := sides[b.side]
		ds := dists(b.corner)
		for _, sign := range []float64{-1, 1} {
			at := func(s float64) float64 {
				t := b.t + sign*s
				if b.closed { // a closed side (an ellipse's rim) wraps round
					t -= math.Floor(t)
				}
				return t
			}
			for d := ds[0] / 10; d >= nearest*g.scale; d /= 10 {
				if s := d / side.Length; s < 0.25 {
					add(&fit, b.side, at(s))
					add(&check, b.side, at(0.3*s))
				}
			}
			for _, d := range ds {
				for _, f := range []float64{0.5, 1, 2} {
					if s := f * d / side.Length; s < 0.25 {
						add(&fit, b.side, at(s))
					}
				}
				for _, f := range []float64{0.35, 0.7, 1.4, 2.8} {
					if s := f * d / side.Length; s < 0.25 {
						add(&check, b.side, at(s))
					}
				}
			}
		}
	}
	// Each image's wall, by its harmonic measure (cornerimages.go): m fit
	// rows, three times as many to check.
	wallRows := func(im wallImage, m int) {
		for _, t := range im.rows(m, 0.5) {
			add(&fit, im.mirror.side, t)
		}
		for _, t := range im.rows(3*m, 0.25) {
			add(&check, im.mirror.side, t)
		}
	}
	for _, im := range g.holeImages {
		wallRows(im.wallImage, 2*2*holeImageTerms(degree))
	}
	for _, im := range g.images {
		wallRows(im.wallImage, imageFitRows)
	}
	for _, hb := range g.rimImages { // rows on the rim by each reflection's harmonic measure
		rim := sides[0]
		at := func(t float64) complex128 { x, y, _, _ := rim.At(t - math.Floor(t)); return complex(x, y) }
		t0, d := 0.0, math.Inf(1)
		for j := 0; j < 1024; j++ {
			if dj := abs(at(float64(j)/1024) - hb.c); dj < d {
				t0, d = float64(j)/1024, dj
			}
		}
		const dt = 1e-6
		speed := abs(at(t0+dt)-at(t0-dt)) / (2 * dt)
		m := 2 * 2 * holeImageTerms(degree)
		spread := func(to *[]boundaryPoint, m int, off float64) {
			for i := 0; i < m; i++ {
				t := t0 + d/speed*math.Tan(math.Pi*((float64(i)+off)/float64(m)-0.5))
				if math.Abs(t-t0) < 0.5 {
					add(to, 0, t-math.Floor(t))
				}
			}
		}
		spread(&fit, m, 0.5)
		spread(&check, 3*m, 0.25)
	}
	if g.sym != nil { // the chamber's share: the rest are its images
		keep := func(pts []boundaryPoint) []boundaryPoint {
			out := pts[:0]
			for _, p := range pts {
				if g.sym.inChamber(p.z) {
					out = append(out, p)
				}
			}
			return out
		}
		fit, check = keep(fit), keep(check)
	}
	return fit, check
}

// sectionBoundary is, in one pass over each side's graded panels (F and F'
// evaluated once a point), the harmonic part's area integral and each
// side's flux ∫ ∂u/∂n ds, u_p's share by upOn(k) (a Neumann condition: its
// operator is ∂u_p/∂n).
//
// The integral is by Green's theorem: with h = Re F (F analytic, less the
// holes' logarithms), ∬ h dA = Re[(1/2i) ∮ F z̄ dz]; each hole's
// c·log|z − c| enters through Δw = log|z − c| for w = |z − c|²(log|z − c| − 1)/4,
// ∬ log|z − c| dA = ∮ ∂w/∂n ds.
func sectionBoundary(h *rationalHarmonic, shape Shape, upOn func(k int) sideCondition) (integral float64, fluxes []float64) {
	var total complex128
	logs := 0.0
	edges := gradedEdges()
	for k, side := range shape.Sides {
		up := upOn(k)
		flux := 0.0
		side.closedNodes(edges, closedTrapezoid, func(t, ds float64) {
			px, py, nx, ny := side.At(t)
			z := complex(px, py)
			// dz = (tangent)·ds, the tangent being the normal turned left.
			dz := complex(-ny, nx) * complex(ds, 0)
			f, df := h.complexValue(z)
			if h.shift != nil { // the flux takes ∇h whole: the shift's share too
				_, dc := h.shift(z)
				df += dc
			}
			_, dup := up.parts(t, px, py, nx, ny)
			flux += ds * (dup + real(df*complex(nx, ny)))
			// The holes' logarithms are not single-valued analytic
			// functions: out of F for the integral, and by w below.
			for m, hb := range h.logs {
				f -= complex(h.cLog[m], 0) * cmplx.Log(z-hb.c)
				d := z - hb.c
				grad := d * complex((2*math.Log(abs(d))-1)/4, 0) // ∇w as x + iy
				logs += h.cLog[m] * (real(grad)*nx + imag(grad)*ny) * ds
			}
			total += f * cmplx.Conj(z) * dz
		})
		fluxes = append(fluxes, flux)
	}
	return real(total/complex(0, 2)) + logs, fluxes
}

// complexValue is F(z), whose real part is h less a symmetric fit's shift,
// and F'(z); a symmetric fit's images are terms like any other.
func (h *rationalHarmonic) complexValue(z complex128) (complex128, complex128) {
	return h.evaluate(z, true)
}

// evaluate is complexValue, with F' left 0 unless slope: without it the
// polynomial basis takes half the work (polyBasis), the poles and the
// logarithms less, and F's imaginary part is only what the terms give
// (the logarithms' arg is left out: callers read Re F).
func (h *rationalHarmonic) evaluate(z complex128, slope bool) (complex128, complex128) {
	var f, df complex128
	for j, p := range h.poles {
		d := p.recip(z)
		f += h.cPole[j] * d
		if slope {
			df -= h.cPole[j] * d * d
		}
	}
	q, dq := h.basisScratch()
	if !slope {
		dq = nil
	}
	h.polyBasis(z, q, dq)
	for k := range q {
		f += h.cPoly[k] * q[k]
		if slope {
			df += h.cPoly[k] * dq[k]
		}
	}
	for k, hb := range h.logs {
		if !slope {
			f += complex(h.cLog[k]*hb.logValue(z), 0)
			continue
		}
		lg, dlg := hb.logTerm(z)
		f += complex(h.cLog[k], 0) * lg
		df += complex(h.cLog[k], 0) * dlg
	}
	t, dt := h.terms(len(h.laurent))
	h.laurentTerms(z, t, dt)
	for k, c := range h.cLaurent {
		f += c * t[k]
		df += c * dt[k]
	}
	t, dt = h.terms(len(h.mobiusK))
	if h.mobius != nil {
		h.mobius.terms(z, h.mobiusK, t, dt)
	}
	for k := range h.mobiusK {
		f += h.cMobius[k] * t[k]
		df += h.cMobius[k] * dt[k]
	}
	t, dt = h.terms(len(h.powers))
	h.powerTerms(z, t, dt)
	for k, c := range h.cPower {
		f += c * t[k]
		df += c * dt[k]
	}
	if !slope {
		df = 0
	}
	return f, df
}

// basisScratch are h's scratch slices for the polynomial basis and its
// derivatives (a fresh pair per point above degree 63 was a megabyte an
// evaluation pass); like terms, not for concurrent use.
func (h *rationalHarmonic) basisScratch() (q, dq []complex128) {
	n := h.degree + 1
	if len(h.basis) < 2*n {
		h.basis = make([]complex128, 2*n)
	}
	return h.basis[:n], h.basis[n : 2*n]
}

// terms are h's scratch slices for n terms' values and derivatives: an
// evaluation's buffers, reused (so a rationalHarmonic is not for concurrent
// use; psol evaluates on one goroutine).
func (h *rationalHarmonic) terms(n int) (f, df []complex128) {
	if len(h.scratch) < 2*n {
		h.scratch = make([]complex128, 2*n)
	}
	return h.scratch[:n], h.scratch[n : 2*n]
}

// sectionFigures: the area integral as the particular solution's exact
// integral plus the harmonic part's by Green's theorem; the source's exact
// integral; extremes on a sample of the section; side fluxes by panels (the
// report's generic path).
func sectionFigures(d section, s *Solution, ev *Evaluator, rep *Report, env series.Env) error {
	rep.Area = d.Measures().Area
	shape, err := d.Shape(env)
	if err != nil {
		return err
	}
	if s.Section == nil { // a closed solution: every figure exact
		c, err := d.integral(s.U)
		if err != nil {
			return err
		}
		cv, v, err := sub(c, env)
		if err != nil {
			return err
		}
		rep.IntegralExact, rep.Integral = &cv, v
		if c, err := d.integral(s.Source); err == nil {
			if c, v, err := sub(c, env); err == nil {
				rep.SourceExact, rep.Source = &c, v
				if len(shape.Sides) == 1 { // the one side carries all of it (divergence theorem)
					rep.Sides, rep.Flux, rep.FluxExact = []SideFlux{{Side: shape.Sides[0].Name, Value: v, Exact: &c}}, v, &c
				}
			}
		}
		inside := InsideXY(d, env)
		rep.Max, rep.ArgMax, rep.Min, rep.ArgMin = xyExtremes(shape, inside, ev)
		return nil
	}
	c, err := d.integral(s.Particular)
	if err != nil {
		return err
	}
	_, v, err := sub(c, env)
	if err != nil {
		return err
	}
	up, err := compileSideCondition(Condition{Kind: Neumann, G: series.ExactField(series.Sum{})}, s.Particular, env)
	if err != nil {
		return err
	}
	var we *waveEval
	if s.Waves != nil {
		if we, err = s.Waves.compile(env); err != nil {
			return err
		}
	}
	upOn := func(k int) sideCondition {
		c := up
		if len(s.Section.quad) == len(shape.Sides) {
			c.quad = s.Section.quad[k]
		}
		c.waves = we // the fluxes take ∂u_w/∂n with ∂u_p/∂n
		return c
	}
	hInt, fluxes := sectionBoundary(s.Section.fit, shape, upOn)
	rep.Integral = v + hInt
	if c, err := d.integral(s.Source); err == nil {
		if c, v, err := sub(c, env); err == nil {
			rep.SourceExact, rep.Source = &c, v
		}
	}
	if s.Quadrature != nil { // the numeric particular part and its source, by the area rule
		f, err := series.Field{Rest: s.Rest}.Compile(env)
		if err != nil {
			return err
		}
		nodes, err := areaNodes(d, env, func(x, y float64) float64 { return f.At(polarOf(x, y)) })
		if err != nil {
			return err
		}
		// u_q's share on the boundary (greenBoundary): the quadrature's own
		// part by Green, the kinks' closed parts by the divergence theorem.
		// Green with the kinks in needed ∫∫ w·c|ℓ| by the area rule, which
		// the kink inside its panels left 4.5e-7 out (and the area rule on
		// u_q itself, 1.4e-9).
		green := len(s.Section.quad) == len(shape.Sides)
		fLeft := func(x, y float64) float64 { return 0 }
		if q := s.Quadrature; green && q.Left != nil {
			cl, err := series.Field{Rest: q.Left}.Compile(env)
			if err != nil {
				return err
			}
			fLeft = func(x, y float64) float64 { return cl.At(polarOf(x, y)) }
		}
		kinks := s.Quadrature.GlobalKinks()
		cx, cy := (shape.Box.X0+shape.Box.X1)/2, (shape.Box.Y0+shape.Box.Y1)/2
		for _, n := range nodes {
			rep.Source += n[2] * f.At(polarOf(n[0], n[1]))
			if green { // ∫∫ w·f_left, w below, and the kinks' values
				dx, dy := n[0]-cx, n[1]-cy
				rep.Integral += n[2] * (dx*dx + dy*dy) / 4 * fLeft(n[0], n[1])
				continue
			}
			p, _ := s.Quadrature.At(s.Quadrature.Local(n[0], n[1]))
			rep.Integral += n[2] * p
		}
		if green {
			rep.Integral += greenBoundary(shape, s.Section.quad, kinks, cx, cy)
		}
		rep.SourceExact = nil
	}
	if s.Waves != nil { // u_w and f_w (with the polynomial the waves leave) by the area rule
		u, f, err := s.Waves.integrals(d, env)
		if err != nil {
			return err
		}
		rep.Integral += u
		rep.Source += f
		rep.SourceExact = nil
	}
	inside := InsideXY(d, env)
	rep.Max, rep.ArgMax, rep.Min, rep.ArgMin = xyExtremes(shape, inside, ev)
	rep.Sides, rep.Flux, rep.FluxExact = nil, 0, nil
	for k, side := range shape.Sides {
		f := SideFlux{Side: side.Name, Value: fluxes[k]}
		rep.Sides, rep.Flux = append(rep.Sides, f), rep.Flux+f.Value
	}
	return nil
}

// greenBoundary is the boundary part of ∫∫ u_q dA (u_q less the kinks'
// closed parts) by Green's second
// identity with w = ((x − cx)² + (y − cy)²)/4, Δw = 1:
//
//	∫∫ u_q dA = ∫∫ w f_q dA + ∮ (u_q ∂w/∂n − w ∂u_q/∂n) ds,
//
// u_q and ∂u_q/∂n from the sides' interpolants (the fit's data), on 64
// panels of 16 Gauss–Legendre points a side; the kinks' closed parts add
// their own boundary integrals (Kink.AreaFlux). The area rule's values of u_q
// cost a quadrature evaluation each, every one at a radius of its own:
// 16384 of them took half a second of a Gaussian's --quantity flow on a
// rectangle; f_q at those nodes costs a source evaluation.
func greenBoundary(shape Shape, quad []*sideInterpolant, kinks []ansatz.Kink, cx, cy float64) float64 {
	total := 0.0
	edges := uniformEdges(64)
	for k, side := range shape.Sides {
		side.panelNodes(edges, ansatz.GaussX, ansatz.GaussW, func(t, ds float64) {
			px, py, nx, ny := side.At(t)
			v, dn := quad[k].smooth(t)
			dx, dy := px-cx, py-cy
			w, dw := (dx*dx+dy*dy)/4, (dx*nx+dy*ny)/2
			total += ds * (v*dw - w*dn)
			for _, kk := range kinks { // ∫∫ v_k dA = ∮ F_k·n ds
				total += ds * kk.AreaFlux(px, py, nx, ny)
			}
		})
	}
	return total
}

// gradedEdges are panel edges on [0, 1], graded by quarters 20 times
// towards each end, down to 2⁻⁴⁰/32. A corner's singular term t^β is
// analytic on a panel [a, 4a] in the ellipse with foci at its ends through
// t = 0, ρ = 3: the 16-point rule's error there is about ρ⁻³² = 5·10⁻¹⁶ of
// the panel's share (halvings, ρ = 5.8, took twice the points to reach
// 10⁻²⁴, far below rounding; every point is an evaluation of the fit).
func gradedEdges() []float64 {
	// 0 < 4⁻²⁰/32 < … < 4⁻¹/32 < 1/32 < 2/32 < … < 15/32, then mirrored:
	// increasing (an earlier version graded to 1/4 and then stepped back to
	// 1/32, a panel of negative width that cost the fluxes 8 digits).
	edges := []float64{0}
	for k := 20; k >= 1; k-- {
		edges = append(edges, math.Pow(0.25, float64(k))/32)
	}
	for i := 1; i < 16; i++ {
		edges = append(edges, float64(i)/32)
	}
	n := len(edges)
	for i := n - 1; i >= 0; i-- {
		edges = append(edges, 1-edges[i])
	}
	return edges
}

// xyExtremes samples the region's box on a 96 × 96 grid (inside points
// only, the sides' points too), then refines the best points by a shrinking
// pattern search that stays inside; locations in (r, θ).
func xyExtremes(shape Shape, inside func(x, y float64) bool, ev *Evaluator) (maxV float64, argMax [2]float64, minV float64, argMin [2]float64) {
	u := pointValue(ev)
	b := shape.Box
	maxV, minV = math.Inf(-1), math.Inf(1)
	var pMax, pMin [2]float64
	// A new extreme must beat the old by more than the fit's rounding
	// (10⁻¹⁰ of u's size, from a first scan): where u takes its extreme
	// along a whole side (u = 0 on the sides, a hole held at the largest
	// value) the first point of the scan is kept, whatever the CPU.
	type sample struct{ x, y, v float64 }
	var samples []sample
	size := 0.0
	scan := func(x, y float64) {
		v := u(x, y)
		samples = append(samples, sample{x, y, v})
		if !math.IsNaN(v) {
			size = math.Max(size, math.Abs(v))
		}
	}
	floor := 0.0
	beats := func(v, old float64) bool { return v > old+math.Max(floor, 1e-12*math.Max(1, math.Abs(old))) }
	try := func(x, y, v float64) {
		if math.IsInf(maxV, -1) || beats(v, maxV) {
			maxV, pMax = v, [2]float64{x, y}
		}
		if math.IsInf(minV, 1) || beats(-v, -minV) {
			minV, pMin = v, [2]float64{x, y}
		}
	}
	const n = 96
	for i := 0; i <= n; i++ {
		for j := 0; j <= n; j++ {
			if x, y := b.X0+(b.X1-b.X0)*float64(i)/n, b.Y0+(b.Y1-b.Y0)*float64(j)/n; inside(x, y) {
				scan(x, y)
			}
		}
	}
	for _, side := range shape.Sides {
		for j := 0; j <= 64; j++ {
			x, y, _, _ := side.At(float64(j) / 64)
			scan(x, y)
		}
	}
	floor = 1e-10 * size
	for _, s := range samples {
		try(s.x, s.y, s.v)
	}
	refine := func(p [2]float64, sign float64) ([2]float64, float64) {
		best := sign * u(p[0], p[1])
		dx, dy := (b.X1-b.X0)/n, (b.Y1-b.Y0)/n
		// Steps down to 1e-9 of the box, not below: the containment test
		// takes a point 1e-12 outside for one on the side, and 1e-12 inside
		// a hole, by a re-entrant corner, u's continuation is
		// -(1e-12)^(2/3) in size. A slot's minimum read -2.1e-9 there, where
		// u = 0 on every side. (The place is printed to 1e-6 of the box.)
		for it := 0; it < 80 && (dx > 1e-9*(b.X1-b.X0) || dy > 1e-9*(b.Y1-b.Y0)); it++ {
			moved := false
			for _, st := range [][2]float64{{dx, 0}, {-dx, 0}, {0, dy}, {0, -dy}} {
				q := [2]float64{p[0] + st[0], p[1] + st[1]}
				if !inside(q[0], q[1]) {
					continue
				}
				if v := sign * u(q[0], q[1]); beats(v, best) {
					best, p, moved = v, q, true
				}
			}
			if !moved {
				dx, dy = dx/2, dy/2
			}
		}
		return p, sign * best
	}
	floor = 0 // between the samples, any gain: the place of a flat extreme to its digits
	pMax, maxV = refine(pMax, 1)
	pMin, minV = refine(pMin, -1)
	// A maximum is flat: its place is known to about 1e-6 of the region's
	// size, the value to rounding. Snap the place to that grid, so that
	// rounding (another CPU's) does not move the printed place.
	grid := 1e-6 * math.Max(b.X1-b.X0, b.Y1-b.Y0)
	polar := func(p [2]float64) [2]float64 {
		p = [2]float64{math.Round(p[0]/grid) * grid, math.Round(p[1]/grid) * grid}
		th := math.Atan2(p[1], p[0])
		if th < 0 {
			th += 2 * math.Pi
		}
		return [2]float64{math.Hypot(p[0], p[1]), th}
	}
	return maxV, polar(pMax), minV, polar(pMin)
}

// shapeClaimSide is a claimed solution's residual on one side of a region
// known by its Shape: 48 points along the side, the normal derivative by a
// central difference across it.
func shapeClaimSide(d Domain, side string, cond Condition, claim series.Field, env series.Env) (ClaimCheck, error) {
	shape, err := d.Shape(env)
	if err != nil {
		return ClaimCheck{}, err
	}
	var path *SidePath
	for k := range shape.Sides {
		if shape.Sides[k].Name == side {
			path = &shape.Sides[k]
		}
	}
	if path == nil {
		return ClaimCheck{}, fmt.Errorf("%s has no side %s", d.Describe(), side)
	}
	h := 1e-5 * math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
	polar := polarOf
	return sampledSideResidual(side, cond, claim, env, func(u series.CompiledField, k int) (float64, float64, float64, error) {
		x, y, nx, ny := path.At((float64(k) + 0.5) / 48)
		r, th := polar(x, y)
		ro, to := polar(x+h*nx, y+h*ny)
		ri, ti := polar(x-h*nx, y-h*ny)
		return r, th, (u.At(ro, to) - u.At(ri, ti)) / (2 * h), nil
	})
}

// shapeSamples are up to 72 interior points of a region known by its Shape,
// from a grid over its box.
func shapeSamples(d Domain, env series.Env) ([][2]float64, error) {
	shape, err := d.Shape(env)
	if err != nil {
		return nil, err
	}
	b := shape.Box
	inside := InsideXY(d, env)
	var pts [][2]float64
	for i := 1; i < 12; i++ {
		for j := 1; j < 12; j++ {
			x, y := b.X0+(b.X1-b.X0)*float64(i)/12, b.Y0+(b.Y1-b.Y0)*float64(j)/12
			if inside(x, y) {
				r, th := polarOf(x, y)
				pts = append(pts, [2]float64{r, th})
			}
		}
	}
	return pts, nil
}

// Describe is the fit in words: its poles and its polynomial.
func (sp *SectionParts) Describe() string {
	symmetric := ""
	if sp.Symmetries > 1 {
		kind := "mirror lines through the centroid"
		if sp.Turns {
			kind = "turns about the centroid"
		}
		symmetric = fmt.Sprintf(", each term with its images under the problem's %d symmetries (%s), fitted on 1/%d of the boundary", sp.Symmetries, kind, sp.Symmetries)
	}
	if sp.Corners == 0 {
		return fmt.Sprintf("a polynomial of degree %d%s", sp.Degree, symmetric)
	}
	total := 0
	var each []string
	for _, n := range sp.Poles {
		total += n
		each = append(each, fmt.Sprint(n))
	}
	return fmt.Sprintf("%d poles outside the region at its %d corners (%s) and a polynomial of degree %d%s", total, sp.Corners, strings.Join(each, ", "), sp.Degree, symmetric)
}

// residualsByCorner are the largest residuals at the check points nearest
// each corner (within half their side), and at the points near none.
func (h *rationalHarmonic) residualsByCorner(pts []boundaryPoint, corners []corner) (near []float64, far float64) {
	near = make([]float64, len(corners))
	for _, p := range pts {
		r := p.residual(h)
		if r > h.residual || math.IsNaN(r) {
			h.residual, h.worstAt, h.worstOn = r, p.z, p.side
		}
		k, d := -1, math.Inf(1)
		for j, c := range corners {
			if dj := abs(p.z - c.w); dj < d {
				k, d = j, dj
			}
		}
		if k >= 0 && d < 0.25*h.scale {
			near[k] = math.Max(near[k], r)
		} else {
			far = math.Max(far, r)
		}
	}
	return near, far
}

// markSingularCorners gives each corner the exponent families of its own
// singular powers, by the conditions on its two sides, provided the powers'
// branch cut, the exterior bisector from the corner, stays outside the
// region (it can cross a non-convex outline farther on).
func markSingularCorners(g *sectionGeometry, conds []sideCondition) {
	for k := range g.corners {
		c := &g.corners[k]
		c.families, c.logTop, c.helper = nil, 0, false
		// The poles stay outside the region: at most half way to where
		// their ray meets a side (a hole's far side, a non-convex outline).
		hit := rayHit(g.shape, c.w, c.dir)
		c.maxDist = 0
		if !math.IsInf(hit, 1) {
			c.maxDist = hit / 2
		}
		if !c.hasPivot && !math.IsInf(hit, 1) {
			continue // the poles alone
		}
		on, back := cornerSides(g, k)
		if on < 0 || back < 0 {
			continue
		}
		a, b := conds[on], conds[back]
		robin, mixed := a.b != 0 && a.a != 0 || b.b != 0 && b.a != 0, (a.b == 0) != (b.b == 0)
		switch {
		case a.degree >= 0 && b.degree >= 0:
			c.logTop = float64(max(a.degree, b.degree))
		case robin || mixed || c.angle > 1:
			c.logTop = logTopAll
		default:
			// Data that are no polynomial at a convex corner with the
			// same kind of condition on both sides: the logarithms'
			// coefficients there are the data's incompatibility, small
			// where the data are smooth (a Gaussian bump's rectangle: the
			// source's value at the corner, 1e-3 of its peak), and the
			// poles take them at no more fits; as columns they cost the
			// bump a third of its time (31 → 42 ms).
			c.logTop = 0
		}
		switch {
		// A Robin side, or a re-entrant corner (where the other family
		// helps the poles to fit what its own leave: the L shape converges
		// twice as fast, and still with the logarithms below).
		case robin || c.angle > 1:
			c.families = []float64{0, 0.5}
			c.helper = !robin
		case mixed:
			c.families = []float64{0.5}
		default:
			c.families = []float64{0}
		}
	}
}

// cornerSides are the sides that start and end at corner k.
func cornerSides(g *sectionGeometry, k int) (on, back int) {
	on, back = -1, -1
	for s := range g.starts {
		if g.starts[s] == k {
			on = s
		}
		if g.ends[s] == k {
			back = s
		}
	}
	return on, back
}

// rayCrosses reports whether the ray from w along dir meets a side that
// does not end at w.
func rayCrosses(shape Shape, w, dir complex128) bool { return !math.IsInf(rayHit(shape, w, dir), 1) }

// rayHit is the distance along the ray from w in the direction dir to the
// first side it meets (each side as 64 chords; those at w itself left out),
// +Inf where it meets none.
func rayHit(shape Shape, w, dir complex128) float64 {
	size := math.Max(shape.Box.X1-shape.Box.X0, shape.Box.Y1-shape.Box.Y0)
	best := math.Inf(1)
	for _, side := range shape.Sides {
		const chords = 64
		px, py, _, _ := side.At(0)
		for j := 1; j <= chords; j++ {
			qx, qy, _, _ := side.At(float64(j) / chords)
			a, b := complex(px, py), complex(qx, qy)
			px, py = qx, qy
			if abs(a-w) < 1e-9*size || abs(b-w) < 1e-9*size {
				continue
			}
			// Solve w + t·dir = a + s·(b − a), t > 0, 0 ≤ s ≤ 1.
			e := b - a
			den := imag(cmplx.Conj(dir) * e)
			if den == 0 {
				continue
			}
			d := a - w
			t := imag(cmplx.Conj(d)*e) / den
			s := imag(cmplx.Conj(d)*dir) / den
			if t > 0 && s >= 0 && s <= 1 && t < best {
				best = t
			}
		}
	}
	return best
}

// neumannBalance is the solvability of the pure Neumann problem: the net
// outward flux of the data must equal the source's integral (divergence
// theorem), to about 1e-9 of the larger.
func neumannBalance(d section, geo sectionGeometry, conds []sideCondition, up series.Sum, quad *ansatz.Quadrature, p *posed) error {
	flux := 0.0
	edges := gradedEdges()
	for k, side := range geo.shape.Sides {
		side.panelNodes(edges, ansatz.GaussX, ansatz.GaussW, func(t, ds float64) {
			px, py, _, _ := side.At(t)
			r, th := polarOf(px, py)
			flux += ds * conds[k].g.At(r, th)
		})
	}
	source := 0.0
	c, err := d.integral(p.f)
	if err != nil {
		return unsupported("the source's integral over %s: %w", d.Describe(), err)
	}
	if source, err = c.Float(p.env); err != nil {
		return unsupported("the source's integral needs every parameter's value: %w", err)
	}
	if p.rest != nil { // the quadrature's part and the waves' (p is the problem as posed)
		f, err := series.Field{Rest: p.rest}.Compile(p.env)
		if err != nil {
			return err
		}
		nodes, err := areaNodes(d, p.env, func(x, y float64) float64 { return f.At(polarOf(x, y)) })
		if err != nil {
			return err
		}
		for _, n := range nodes {
			r, th := polarOf(n[0], n[1])
			source += n[2] * f.At(r, th)
		}
	}
	if math.Abs(flux-source) > 1e-9*math.Max(math.Max(math.Abs(flux), math.Abs(source)), geo.scale*geo.scale) {
		return unsolvable("with a flux condition on every side the net outward flux of the data, %.12g, must equal the source's integral over the region, %.12g (divergence theorem); they differ by %.3g, so the problem has no solution", flux, source, flux-source)
	}
	return nil
}

// FittedPart is a section's fitted harmonic part in numbers, for generated
// code: h(x, y) = Re[Σ_j C_j/((z − P_j) − O_j) + Σ_k D_k q_k(Z) + Σ_m E_m ζ_m^β_m],
// z = x + iy, Z = (z − Centre)/Scale, q_0 = 1 and
// q_{k+1} = (Z q_k − Σ_{j≤k} H_k[j] q_j)/H_k[k+1] (Arnoldi's recurrence),
// ζ_m = (z − W_m)·Rot_m on the principal branch.
type FittedPart struct {
	// Poles are the poles' corners P_j, PoleOff their offsets O_j from them
	// (the pole is at P_j + O_j; the difference in that order keeps its
	// digits near the corner).
	Poles, PoleOff, C []complex128
	Centre            complex128
	Scale             float64
	H                 [][]complex128
	D                 []complex128
	W, Rot, E         []complex128
	Beta              []float64
	// Pivot, where Pivoted[m], makes power m's variable ζ = (z − W)/(z − Pivot)
	// (a hole's corner) instead of (z − W)·Rot.
	Pivot   []complex128
	Pivoted []bool
	// PowerVar[m] ≥ 0 (a slot's corner) makes power m's variable the spread
	// pivot's, from the slot's ellipse variable v = Vars[PowerVar[m]]:
	// ζ = ((z − W)/T)·exp(−(z − A)/T), T = B·S2/v (holeBasis.spreadZeta).
	PowerVar []int
	// PowerLog[m]: power m is E·ζ^β·log ζ (β whole), not E·ζ^β.
	PowerLog []bool
	// LogAt and LogK are the holes' logarithms: Σ LogK_k·ln|z − LogAt_k|,
	// or where LogVar_k ≥ 0 (an elliptical or elongated hole), LogK_k·ln|w|
	// = −LogK_k·ln|v|, v = Vars[LogVar_k] (holeBasis.logTerm).
	LogAt  []complex128
	LogK   []float64
	LogVar []int
	// Vars and Terms are the holes' other terms: Re Σ E_t·v(z)^J_t, v one
	// of Vars (HoleVar).
	Vars  []HoleVar
	Terms []HoleTerm
	// PolyRot and PolyPower make the polynomial's variable: Z = W^PolyPower,
	// W = (z − Centre)·PolyRot/Scale (a symmetric fit; 1 and 1 otherwise).
	PolyRot   complex128
	PolyPower int
	// Maps are the section's symmetries as (x, y) ↦ (A·x + B·y + E, C·x + D·y + F),
	// the identity first (alone where it has none): u is the closed part's
	// mean over them plus the fitted part (a symmetric fit's u_p is the mean).
	Maps [][6]float64
}

// HoleVar is a variable of a hole's terms, by Kind:
//
//	0 (Laurent)     v = S/(z − A)
//	1 (ellipse)     v = 1/w, w = (ζ + √(ζ − S)·√(ζ + S))/S2, ζ = (z − A)/B (B the major axis's direction)
//	2 (two circles) v = ((z − A)/(z − B))/S
//	3 (two circles) v = S/((z − A)/(z − B))
type HoleVar struct {
	Kind  int
	A, B  complex128
	S, S2 float64
}

// holeVar is the hole's variable (holeBasis.variable) as a HoleVar.
func (hb holeBasis) holeVar() HoleVar {
	if hb.focus == 0 {
		return HoleVar{Kind: 0, A: hb.c, S: hb.rho}
	}
	return HoleVar{Kind: 1, A: hb.c, B: hb.axis(), S: abs(hb.focus), S2: hb.span}
}

// HoleTerm is E·v^J for the variable Vars[Var].
type HoleTerm struct {
	Var, J int
	E      complex128
}

// Fitted is the fitted part in numbers.
func (sp *SectionParts) Fitted() FittedPart {
	h := sp.fit
	out := FittedPart{C: h.cPole, Centre: h.centre, Scale: h.scale, H: h.hess, D: h.cPoly, E: h.cPower,
		PolyRot: h.polyRot, PolyPower: h.polyPower, Maps: [][6]float64{isometry{rot: 1}.Matrix()}}
	for _, p := range h.poles {
		out.Poles, out.PoleOff = append(out.Poles, p.base), append(out.PoleOff, p.off)
	}
	if h.sym != nil {
		out.Maps = nil
		for _, g := range h.sym.group {
			out.Maps = append(out.Maps, g.Matrix())
		}
	}
	vars := map[HoleVar]int{}
	variable := func(v HoleVar) int {
		if i, ok := vars[v]; ok {
			return i
		}
		vars[v] = len(out.Vars)
		out.Vars = append(out.Vars, v)
		return vars[v]
	}
	for _, c := range h.powers {
		out.W, out.Rot, out.Beta = append(out.W, c.w), append(out.Rot, c.rot), append(out.Beta, c.beta)
		out.Pivot, out.Pivoted = append(out.Pivot, c.pivot), append(out.Pivoted, c.hasPivot && c.spread.focus == 0)
		out.PowerLog = append(out.PowerLog, c.log)
		at := -1
		if c.spread.focus != 0 {
			at = variable(c.spread.holeVar())
		}
		out.PowerVar = append(out.PowerVar, at)
	}
	for k, hb := range h.logs {
		out.LogAt, out.LogK = append(out.LogAt, hb.c), append(out.LogK, h.cLog[k])
		at := -1
		if hb.focus != 0 {
			at = variable(hb.holeVar())
		}
		out.LogVar = append(out.LogVar, at)
	}
	for k, t := range h.laurent {
		out.Terms = append(out.Terms, HoleTerm{Var: variable(t.hole.holeVar()), J: t.j, E: h.cLaurent[k]})
	}
	for k, j := range h.mobiusK {
		m := h.mobius
		v := HoleVar{Kind: 2, A: m.l1, B: m.l2, S: m.hi}
		if j < 0 {
			v = HoleVar{Kind: 3, A: m.l1, B: m.l2, S: m.lo}
		}
		out.Terms = append(out.Terms, HoleTerm{Var: variable(v), J: max(j, -j), E: h.cMobius[k]})
	}
	return out
}

// floatingConstraints are the floating sides' net fluxes as equations of
// the fit: Σ w·∂h/∂n over 256 points of the side (the trapezoidal rule,
// spectrally accurate on a circle) = Q − ∮ ∂u_p/∂n ds.
func floatingConstraints(geo sectionGeometry, conds []sideCondition, up series.Sum, env series.Env) ([]fluxConstraint, error) {
	var out []fluxConstraint
	for k, c := range conds {
		if !c.floating || c.group != k {
			continue
		}
		fc := fluxConstraint{side: k, target: c.flux}
		for m, member := range conds { // every side of the hole
			if member.group != k {
				continue
			}
			flux, err := compileSideCondition(Condition{Kind: Neumann, G: series.ExactField(series.Sum{})}, up, env)
			if err != nil {
				return nil, err
			}
			flux.quad, flux.waves = member.quad, member.waves
			side := geo.shape.Sides[m]
			add := func(t, w float64) {
				x, y, nx, ny := side.At(t)
				_, dn := flux.parts(t, x, y, nx, ny)
				fc.target -= w * dn
				fc.pts = append(fc.pts, boundaryPoint{z: complex(x, y), nu: complex(nx, ny), b: 1, w: w, floating: -1})
			}
			// A circle or an ellipse: 256 nodes of the trapezoidal rule; an
			// edge: panels graded towards its corners.
			side.closedNodes(gradedEdges(), 256, add)
		}
		out = append(out, fc)
	}
	return out, nil
}
