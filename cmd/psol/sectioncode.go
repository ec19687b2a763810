package main

import (
	"fmt"
	"io"
	"math/big"
	"strconv"
	"strings"

	"psol/domain"
	"psol/series"
	"psol/series/cart"
)

// sectionCodeShape spells, in one language, the evaluation of a section's
// solution: the closed particular polynomial in x and y, then the fitted part
// from its tables (domain.FittedPart) in real arithmetic only — poles, the
// Arnoldi recurrence of the polynomial basis, the corners' powers — so that
// the code needs nothing beyond the language's math library.
type sectionCodeShape struct {
	array  func(name string, v []float64) string // a table of numbers
	scalar func(name string, v float64) string
	body   string // the function, with %[1]s the closed part, %[2]d the basis size
}

var sectionCodeShapes = map[string]sectionCodeShape{
	"go": {
		array: func(name string, v []float64) string {
			return fmt.Sprintf("var psol%s = []float64{%s}\n", name, floats(v))
		},
		scalar: func(name string, v float64) string { return fmt.Sprintf("const psol%s = %s\n", name, lit(v)) },
		body: `
// U is u(x, y). It needs: import "math"
func U(x, y float64) float64 {
	u := %[1]s
	for j := range psolPoleRe {
		dx, dy := x-psolPoleRe[j], y-psolPoleIm[j]
		u += (psolCRe[j]*dx + psolCIm[j]*dy) / (dx*dx + dy*dy)
	}
	var qr, qi [%[2]d]float64
	zr, zi := (x-psolCentreRe)/psolScale, (y-psolCentreIm)/psolScale
	qr[0] = 1
	for k := 0; k+1 < %[2]d; k++ {
		vr, vi := zr*qr[k]-zi*qi[k], zr*qi[k]+zi*qr[k]
		row := k * (k + 3) / 2
		for j := 0; j <= k; j++ {
			hr, hi := psolHRe[row+j], psolHIm[row+j]
			vr, vi = vr-(hr*qr[j]-hi*qi[j]), vi-(hr*qi[j]+hi*qr[j])
		}
		qr[k+1], qi[k+1] = vr/psolHRe[row+k+1], vi/psolHRe[row+k+1]
	}
	for k := 0; k < %[2]d; k++ {
		u += psolDRe[k]*qr[k] - psolDIm[k]*qi[k]
	}
	for m := range psolBeta {
		dx, dy := x-psolWRe[m], y-psolWIm[m]
		sr, si := dx*psolRotRe[m]-dy*psolRotIm[m], dx*psolRotIm[m]+dy*psolRotRe[m]
		if sr == 0 && si == 0 {
			continue
		}
		mag, arg := math.Exp(psolBeta[m]*math.Log(math.Hypot(sr, si))), psolBeta[m]*math.Atan2(si, sr)
		u += mag * (psolERe[m]*math.Cos(arg) - psolEIm[m]*math.Sin(arg))
	}
	return u
}
`,
	},
	"c": {
		array: func(name string, v []float64) string {
			if len(v) == 0 { // C has no empty arrays: one unused zero
				v = []float64{0}
			}
			return fmt.Sprintf("static const double psol%s[] = {%s};\n", name, floats(v))
		},
		scalar: func(name string, v float64) string {
			return fmt.Sprintf("static const double psol%s = %s;\n", name, lit(v))
		},
		body: `
/* u(x, y); link with -lm. */
double u(double x, double y) {
	double u = %[1]s;
	for (int j = 0; j < psolPoles; j++) {
		double dx = x - psolPoleRe[j], dy = y - psolPoleIm[j];
		u += (psolCRe[j]*dx + psolCIm[j]*dy) / (dx*dx + dy*dy);
	}
	double qr[%[2]d] = {1}, qi[%[2]d] = {0};
	double zr = (x - psolCentreRe)/psolScale, zi = (y - psolCentreIm)/psolScale;
	for (int k = 0; k + 1 < %[2]d; k++) {
		double vr = zr*qr[k] - zi*qi[k], vi = zr*qi[k] + zi*qr[k];
		int row = k*(k + 3)/2;
		for (int j = 0; j <= k; j++) {
			double hr = psolHRe[row + j], hi = psolHIm[row + j];
			vr -= hr*qr[j] - hi*qi[j];
			vi -= hr*qi[j] + hi*qr[j];
		}
		qr[k + 1] = vr/psolHRe[row + k + 1];
		qi[k + 1] = vi/psolHRe[row + k + 1];
	}
	for (int k = 0; k < %[2]d; k++) {
		u += psolDRe[k]*qr[k] - psolDIm[k]*qi[k];
	}
	for (int m = 0; m < psolPowers; m++) {
		double dx = x - psolWRe[m], dy = y - psolWIm[m];
		double sr = dx*psolRotRe[m] - dy*psolRotIm[m], si = dx*psolRotIm[m] + dy*psolRotRe[m];
		if (sr == 0 && si == 0) continue;
		double mag = exp(psolBeta[m]*log(hypot(sr, si))), arg = psolBeta[m]*atan2(si, sr);
		u += mag*(psolERe[m]*cos(arg) - psolEIm[m]*sin(arg));
	}
	return u;
}
`,
	},
	"python": {
		array: func(name string, v []float64) string {
			return fmt.Sprintf("PSOL_%s = [%s]\n", strings.ToUpper(name), floats(v))
		},
		scalar: func(name string, v float64) string {
			return fmt.Sprintf("PSOL_%s = %s\n", strings.ToUpper(name), lit(v))
		},
		body: `

def u(x, y):
    u = %[1]s
    for j in range(len(PSOL_POLERE)):
        dx, dy = x - PSOL_POLERE[j], y - PSOL_POLEIM[j]
        u += (PSOL_CRE[j]*dx + PSOL_CIM[j]*dy) / (dx*dx + dy*dy)
    qr, qi = [1.0] + [0.0]*(%[2]d - 1), [0.0]*%[2]d
    zr, zi = (x - PSOL_CENTRERE)/PSOL_SCALE, (y - PSOL_CENTREIM)/PSOL_SCALE
    for k in range(%[2]d - 1):
        vr, vi = zr*qr[k] - zi*qi[k], zr*qi[k] + zi*qr[k]
        row = k*(k + 3)//2
        for j in range(k + 1):
            hr, hi = PSOL_HRE[row + j], PSOL_HIM[row + j]
            vr, vi = vr - (hr*qr[j] - hi*qi[j]), vi - (hr*qi[j] + hi*qr[j])
        qr[k + 1], qi[k + 1] = vr/PSOL_HRE[row + k + 1], vi/PSOL_HRE[row + k + 1]
    for k in range(%[2]d):
        u += PSOL_DRE[k]*qr[k] - PSOL_DIM[k]*qi[k]
    for m in range(len(PSOL_BETA)):
        dx, dy = x - PSOL_WRE[m], y - PSOL_WIM[m]
        sr, si = dx*PSOL_ROTRE[m] - dy*PSOL_ROTIM[m], dx*PSOL_ROTIM[m] + dy*PSOL_ROTRE[m]
        if sr == 0 and si == 0:
            continue
        mag, arg = math.exp(PSOL_BETA[m]*math.log(math.hypot(sr, si))), PSOL_BETA[m]*math.atan2(si, sr)
        u += mag*(PSOL_ERE[m]*math.cos(arg) - PSOL_EIM[m]*math.sin(arg))
    return u
`,
	},
}

func lit(v float64) string {
	s := strconv.FormatFloat(v, 'g', 17, 64)
	if !strings.ContainsAny(s, ".eEn") {
		s += ".0"
	}
	return s
}

func floats(v []float64) string {
	parts := make([]string, len(v))
	for i, x := range v {
		parts[i] = lit(x)
	}
	return strings.Join(parts, ", ")
}

// writeSectionCode emits u(x, y) for a polygon or an ellipse: the exact
// particular polynomial and the fitted part's tables.
func writeSectionCode(w io.Writer, l series.Lang, pr *problem, sol *domain.Solution) error {
	if sol.Quadrature != nil {
		return &domain.Unsupported{Reason: "generated code for a source part by quadrature is not written yet"}
	}
	up, err := sol.Particular.Subst(pr.env)
	if err != nil {
		return err
	}
	poly, err := cart.FromPolar(up)
	if err != nil {
		return &domain.Unsupported{Reason: "generated code for a section needs a particular solution that is a polynomial in x and y; this one is " + up.Text()}
	}
	used := map[string]bool{}
	up.Params(used)
	if len(used) > 0 {
		return &domain.Unsupported{Reason: "generated code for a section needs every parameter's value (--let)"}
	}
	if sol.Free != "" { // the pinned constant joins the closed part
		c, err := pr.env[sol.Free].Float(nil)
		if err != nil {
			return err
		}
		poly = poly.Add(cart.Monomial(decimalCoef(c), 0, 0))
	}
	shape := sectionCodeShapes[l.Name]
	f := sol.Section.Fitted()
	if f.Holed {
		return &domain.Unsupported{Reason: "generated code for a section with holes is not written yet; --grid N --csv FILE gives the values"}
	}
	if f.Pivoted {
		return &domain.Unsupported{Reason: "generated code for a polygon hole's corner functions is not written yet; --grid N --csv FILE gives the values"}
	}
	split := func(z []complex128) (re, im []float64) {
		for _, c := range z {
			re, im = append(re, real(c)), append(im, imag(c))
		}
		return re, im
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%s psol %s: u(x, y) = %s + h(x, y), h fitted to the side conditions (largest residual %.1e)\n",
		codeShapes[l.Name].comment, version, poly.Text(), sol.Section.Residual)
	switch l.Name {
	case "python":
		b.WriteString("import math\n\n")
	case "c":
		b.WriteString("#include <math.h>\n\n")
	}
	table := func(name string, z []complex128) {
		re, im := split(z)
		b.WriteString(shape.array(name+"Re", re))
		b.WriteString(shape.array(name+"Im", im))
	}
	table("Pole", f.Poles)
	table("C", f.C)
	var flat []complex128
	for _, row := range f.H {
		flat = append(flat, row...)
	}
	table("H", flat)
	table("D", f.D)
	table("W", f.W)
	table("Rot", f.Rot)
	table("E", f.E)
	b.WriteString(shape.array("Beta", f.Beta))
	b.WriteString(shape.scalar("CentreRe", real(f.Centre)))
	b.WriteString(shape.scalar("CentreIm", imag(f.Centre)))
	b.WriteString(shape.scalar("Scale", f.Scale))
	if l.Name == "c" {
		fmt.Fprintf(&b, "enum { psolPoles = %d, psolPowers = %d };\n", len(f.Poles), len(f.Beta))
	}
	fmt.Fprintf(&b, shape.body, poly.Code(l), len(f.D))
	_, err = io.WriteString(w, b.String())
	return err
}

// decimalCoef is a float64 as an exact coefficient.
func decimalCoef(x float64) series.Coef { return series.RatCoef(new(big.Rat).SetFloat64(x)) }
