package series

import "sort"

// Canonical puts a list of terms in canonical form, the one every sum-like
// type in psol keeps (Sum, Poly, and cart's Poly and Waves): sorted by less,
// alike terms (same) merged by add, and terms isZero reports dropped. With a
// nil less the terms keep the order they first appear in and are merged
// wherever they are alike (for types with no natural order, and few terms).
//
// Canonical reuses ts's storage, so callers pass a slice they own; the
// terms themselves are values (add returns a new one), which keeps the
// operands of the algebra's operations unchanged.
func Canonical[T any](ts []T, less, same func(a, b T) bool, add func(a, b T) T, isZero func(T) bool) []T {
	out := ts[:0]
	if less != nil {
		sort.SliceStable(ts, func(i, j int) bool { return less(ts[i], ts[j]) })
		for _, t := range ts {
			if n := len(out); n > 0 && same(out[n-1], t) {
				out[n-1] = add(out[n-1], t)
				continue
			}
			out = append(out, t)
		}
	} else {
	terms:
		for _, t := range ts {
			for i := range out {
				if same(out[i], t) {
					out[i] = add(out[i], t)
					continue terms
				}
			}
			out = append(out, t)
		}
	}
	kept := out[:0]
	for _, t := range out {
		if !isZero(t) {
			kept = append(kept, t)
		}
	}
	return kept
}
