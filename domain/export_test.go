package domain

import (
	"math"
	"strings"

	"psol/series"
)

// SectionFitValues is a section's fitted harmonic part at z by its two
// evaluations: the value alone, and the value with the derivative.
func SectionFitValues(s *Solution, z complex128) (valueOnly, withSlope float64) {
	v, _ := s.Section.fit.value(z)
	return s.Section.fit.valueOnly(z), v
}

// sectionSamples are section d's fit and check points with n poles at
// every corner, the polynomial of the degree, and value conditions.
func sectionSamples(d Domain, n, degree int) (g sectionGeometry, fit, check []boundaryPoint, err error) {
	if g, err = d.(section).geometry(nil); err != nil {
		return g, nil, nil, err
	}
	conds := make([]sideCondition, len(g.shape.Sides))
	for k := range conds {
		if conds[k], err = compileSideCondition(Condition{Kind: Dirichlet, G: series.ExactField(series.Sum{})}, series.Sum{}, nil); err != nil {
			return g, nil, nil, err
		}
	}
	poles := make([]int, len(g.corners))
	for k := range poles {
		poles[k] = n
	}
	fit, check = g.samples(poles, degree, conds)
	return g, fit, check, nil
}

// SectionSampleDepth is, for section d with n poles at every corner, each
// corner's nearest fit point and nearest check point, over the section's size.
func SectionSampleDepth(d Domain, n int) (fit, check []float64, err error) {
	g, fitPts, checkPts, err := sectionSamples(d, n, 12)
	if err != nil {
		return nil, nil, err
	}
	depth := func(pts []boundaryPoint) []float64 {
		out := make([]float64, len(g.corners))
		for k, c := range g.corners {
			out[k] = math.Inf(1)
			for _, p := range pts {
				out[k] = math.Min(out[k], abs(p.z-c.w)/g.scale)
			}
		}
		return out
	}
	return depth(fitPts), depth(checkPts), nil
}

// SectionFitRowsByCurve counts section d's fit points on its outline and on
// its holes, with n poles at every corner and the polynomial of the degree.
func SectionFitRowsByCurve(d Domain, n, degree int) (outline, holes int, err error) {
	g, fit, _, err := sectionSamples(d, n, degree)
	if err != nil {
		return 0, 0, err
	}
	// The rows the hole's corner images add on the walls are the images'
	// own (cornerimages.go), not the curve's share.
	images := 0
	for _, im := range g.images {
		images += len(im.rows(imageFitRows, 0.5))
	}
	for _, im := range g.holeImages {
		images += len(im.rows(2*2*holeImageTerms(degree), 0.5))
	}
	outline -= images
	for _, p := range fit {
		if strings.HasPrefix(g.shape.Sides[p.side].Name, "hole") {
			holes++
		} else {
			outline++
		}
	}
	return outline, holes, nil
}
