package domain

// SectionFitValues is a section's fitted harmonic part at z by its two
// evaluations: the value alone, and the value with the derivative.
func SectionFitValues(s *Solution, z complex128) (valueOnly, withSlope float64) {
	v, _ := s.Section.fit.value(z)
	return s.Section.fit.valueOnly(z), v
}
