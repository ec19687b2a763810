package domain

import (
	"math/big"

	"psol/series"
)

// Image rules: regions and conditions on which a point source's field with
// finitely many images outside the region meets every side's homogeneous
// condition exactly, so that u_s is a closed form (Jackson, Classical
// Electrodynamics, ch. 2; Bear, Hydraulics of Groundwater, for wells). One
// rule a row; the first that fits is used.
var imageRules = []struct {
	name string
	fits func(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool)
	// verify checks the rule's claims exactly (imagecheck.go).
	verify func(d Domain, conds map[string]Condition, pp *PointPart) error
}{
	{"images in the circle", diskImages, verifyDisk},
	{"images in the rays and the circle", sectorImages, verifySector},
	{"images in the circle", outsideImages, verifyOutside},
	// The walls' row of images leaves the other two sides' traces numeric.
	{"row of images in the walls, summed in closed form", stripImages, verifyStrip},
}

// imagesFor is u_s with images where a rule fits, nil where none does.
func imagesFor(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, error) {
	for _, rule := range imageRules {
		if pp, ok := rule.fits(d, conds, pts); ok {
			pp.Images = rule.name
			pp.verify = func() error { return rule.verify(d, conds, pp) }
			return pp, nil
		}
	}
	return nil, nil
}

// signedPoint is a source or one of its mirror images, with its strength.
type signedPoint struct{ Q, X, Y series.Coef }

// circleImages adds to each point of the orbit its image in the circle of
// radius R — Kelvin's inversion z* = R²z/|z|², the classic image of a line
// charge in a grounded cylinder — with the opposite strength for values
// on the circle and the same for a flux. With values, the pair is
//
//	(Q/4π)·ln( R²|z − a|² / |R² − āz|² ),  zero on |z| = R,
//
// written as (Q/4π)·ln|z − a|² − (Q/4π)·ln((ρ²/R²)·|z − a*|²); with a flux,
// (Q/4π)·(ln|z − a|² + ln((ρ²/R²)·|z − a*|²)), whose normal derivative on
// the circle is Q/(2πR) (the pair's flux 2π(Q/2π) spread evenly). A point
// at the centre has its image at infinity: (Q/4π)·ln r² − (Q/4π)·ln R², or
// (Q/4π)·ln r². It returns the logs (the orbit's own first), the circle's
// trace and the constant; ok is false where ln R² has no exact form.
func circleImages(R series.Coef, orbit []signedPoint, kind Kind) (logs []PointLog, trace, konst series.Coef, ok bool) {
	fourPi := series.IntCoef(4).Mul(series.SymCoef(series.Pi))
	R2 := R.Mul(R)
	var own, images []PointLog
	for _, p := range orbit {
		c, _ := p.Q.Div(fourPi)
		rho2 := p.X.Mul(p.X).Add(p.Y.Mul(p.Y))
		if kind == Neumann {
			trace = trace.Add(mustDiv(p.Q, series.IntCoef(2).Mul(series.SymCoef(series.Pi)).Mul(R)))
		}
		if rho2.IsZero() {
			own = append(own, PointLog{C: c})
			if kind == Dirichlet { // the image at infinity: a constant
				lnR2, err := R2.Ln()
				if err != nil {
					return nil, series.Coef{}, series.Coef{}, false
				}
				konst = konst.Sub(c.Mul(lnR2))
			}
			continue
		}
		own = append(own, PointLog{C: c, X: p.X, Y: p.Y})
		k := mustDiv(R2, rho2)
		img := PointLog{C: c, X: p.X.Mul(k), Y: p.Y.Mul(k), S: mustDiv(rho2, R2)}
		if kind == Dirichlet {
			img.C = c.Neg()
		}
		images = append(images, img)
	}
	return append(own, images...), trace, konst, true
}

func mustDiv(a, b series.Coef) series.Coef {
	q, _ := a.Div(b)
	return q
}

// circleKind is the kind of a circle's condition that images serve: values
// or a flux (Robin has no finite image system).
func circleKind(c Condition) (Kind, bool) {
	return c.Kind, c.Kind == Dirichlet || c.Kind == Neumann
}

// diskImages: a disk with values or a flux on the rim.
func diskImages(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool) {
	disk, ok := d.(Disk)
	if !ok {
		return nil, false
	}
	kind, ok := circleKind(conds["rim"])
	if !ok {
		return nil, false
	}
	var orbit []signedPoint
	for _, p := range pts {
		orbit = append(orbit, signedPoint{p.Q, p.X, p.Y})
	}
	logs, tr, konst, ok := circleImages(disk.R, orbit, kind)
	if !ok {
		return nil, false
	}
	return &PointPart{Sources: pts, Logs: logs, Const: konst, Traces: map[string]series.Field{"rim": constField(tr)}}, true
}

// sectorImages: a sector of angle π/k whose rays carry the same kind of
// condition — values (then the images across the rays alternate in sign)
// or a flux (all of one sign) — and whose arc carries values or a flux: the
// 2k points of the source's orbit under the reflections in the rays, each
// with its image in the circle. The field is odd (values) or even (flux)
// about each ray, so its trace there is zero.
func sectorImages(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool) {
	s, ok := d.(Sector)
	if !ok {
		return nil, false
	}
	q, err := s.Alpha.Div(series.SymCoef(series.Pi))
	if err != nil {
		return nil, false
	}
	frac, ok := q.Rat()
	if !ok || frac.Num().Cmp(big.NewInt(1)) != 0 || !frac.Denom().IsInt64() {
		return nil, false
	}
	k := frac.Denom().Int64()
	if k != 1 && k != 2 && k != 3 && k != 4 && k != 6 {
		return nil, false
	}
	start, end := conds["start"], conds["end"]
	if start.Kind != end.Kind || start.Kind != Dirichlet && start.Kind != Neumann {
		return nil, false
	}
	for _, c := range []Condition{start, end} { // zero flux on a ray; values: a constant, which w carries
		if c.Kind == Neumann && !(c.G.IsExact() && c.G.Exact.IsZero()) {
			return nil, false
		}
	}
	arcKind, ok := circleKind(conds["arc"])
	if !ok {
		return nil, false
	}
	mirror := series.IntCoef(-1)
	if start.Kind == Neumann {
		mirror = series.IntCoef(1)
	}
	var orbit []signedPoint
	for _, p := range pts {
		for j := int64(0); j < k; j++ {
			c, sn, ok := cosSinPi(big.NewRat(2*j, k))
			if !ok {
				return nil, false
			}
			rot := func(x, y series.Coef) (series.Coef, series.Coef) {
				return c.Mul(x).Sub(sn.Mul(y)), sn.Mul(x).Add(c.Mul(y))
			}
			x, y := rot(p.X, p.Y)
			orbit = append(orbit, signedPoint{p.Q, x, y})
			x, y = rot(p.X, p.Y.Neg())
			orbit = append(orbit, signedPoint{p.Q.Mul(mirror), x, y})
		}
	}
	logs, tr, _, ok := circleImages(s.R, orbit, arcKind) // no source at a sector's corner: no constant
	if !ok {
		return nil, false
	}
	// The sources' own logs first: move each source's to the front.
	front := make([]PointLog, 0, len(logs))
	for i := range pts {
		front = append(front, logs[2*k*int64(i)])
	}
	for i, l := range logs {
		if i < len(orbit) && i%int(2*k) == 0 {
			continue
		}
		front = append(front, l)
	}
	zero := constField(series.Coef{})
	return &PointPart{Sources: pts, Logs: front, Traces: map[string]series.Field{"arc": constField(tr), "start": zero, "end": zero}}, true
}

func constField(c series.Coef) series.Field { return series.ExactField(series.Const(c)) }

// cosSinPi is cos(qπ) and sin(qπ) exactly, for q a multiple of 1/2 or 1/3.
func cosSinPi(q *big.Rat) (c, s series.Coef, ok bool) {
	six := new(big.Rat).Mul(q, big.NewRat(6, 1)) // in sixths of π
	if !six.IsInt() {
		return c, s, false
	}
	n := new(big.Int).Mod(six.Num(), big.NewInt(12)).Int64()
	half := series.FracCoef(1, 2)
	root3, _ := series.IntCoef(3).Pow(big.NewRat(1, 2))
	r3 := root3.Mul(half)
	table := map[int64][2]series.Coef{
		0: {series.IntCoef(1), {}}, 2: {half, r3}, 3: {{}, series.IntCoef(1)}, 4: {half.Neg(), r3},
		6: {series.IntCoef(-1), {}}, 8: {half.Neg(), r3.Neg()}, 9: {{}, series.IntCoef(-1)}, 10: {half, r3.Neg()},
	}
	v, ok := table[n]
	return v[0], v[1], ok
}

// outsideImages: outside a circle at fixed values, each source's Kelvin
// image inside the circle with the opposite strength. The pair vanishes on
// the circle and stays bounded far away (it tends to −(Q/4π)·ln(ρ²/R²)),
// the class psol's exterior solutions belong to; the sources' own field
// alone would grow like (Q/2π)·ln r. A flux on the circle has no such pair.
func outsideImages(d Domain, conds map[string]Condition, pts []series.PointSource) (*PointPart, bool) {
	out, ok := d.(Outside)
	if !ok || conds["rim"].Kind != Dirichlet {
		return nil, false
	}
	var orbit []signedPoint
	for _, p := range pts {
		orbit = append(orbit, signedPoint{p.Q, p.X, p.Y})
	}
	logs, _, _, ok := circleImages(out.R, orbit, Dirichlet)
	if !ok {
		return nil, false
	}
	return &PointPart{Sources: pts, Logs: logs, Traces: map[string]series.Field{"rim": constField(series.Coef{})}}, true
}
