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
	u := 0.0
	for m := range psolMapA { // the closed part's mean over the section's symmetries (the identity alone where it has none)
		u += psolClosed(psolMapA[m]*x+psolMapB[m]*y+psolMapE[m], psolMapC[m]*x+psolMapD[m]*y+psolMapF[m]) / float64(len(psolMapA))
	}
	for j := range psolPoleRe {
		dx, dy := (x-psolPoleRe[j])-psolPoleOffRe[j], (y-psolPoleIm[j])-psolPoleOffIm[j] // from the corner, then the offset: digits kept near it
		u += (psolCRe[j]*dx + psolCIm[j]*dy) / (dx*dx + dy*dy)
	}
	var qr, qi [%[2]d]float64
	zr, zi := (x-psolCentreRe)/psolScale, (y-psolCentreIm)/psolScale
	zr, zi = zr*psolPolyRotRe-zi*psolPolyRotIm, zr*psolPolyRotIm+zi*psolPolyRotRe
	for n, wr, wi := 1.0, zr, zi; n < psolPolyPower; n++ { // Z = W^PolyPower
		zr, zi = zr*wr-zi*wi, zr*wi+zi*wr
	}
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
	var vr, vi [%[3]d]float64
	for k := range psolVarKind {
		vr[k], vi[k] = psolVar(k, x, y)
	}
	for m := range psolBeta {
		dx, dy := x-psolWRe[m], y-psolWIm[m]
		sr, si := dx*psolRotRe[m]-dy*psolRotIm[m], dx*psolRotIm[m]+dy*psolRotRe[m]
		if psolPiv[m] != 0 { // a hole's corner: ζ = (z − W)/(z − pivot)
			sr, si = psolDiv(dx, dy, x-psolPivRe[m], y-psolPivIm[m])
		}
		if k := int(psolPowVar[m]); k >= 0 { // a slot's corner: ζ = ((z − W)/T)·exp(−(z − A)/T), T = B·S2/v
			tr, ti := psolDiv(psolVarBRe[k]*psolVarS2[k], psolVarBIm[k]*psolVarS2[k], vr[k], vi[k])
			ar, ai := psolDiv(dx, dy, tr, ti)
			er, ei := psolDiv(x-psolVarARe[k], y-psolVarAIm[k], tr, ti)
			mag := math.Exp(-er)
			cr, ci := mag*math.Cos(ei), -mag*math.Sin(ei)
			sr, si = ar*cr-ai*ci, ar*ci+ai*cr
		}
		if sr == 0 && si == 0 {
			continue
		}
		lr, at := math.Log(math.Hypot(sr, si)), math.Atan2(si, sr)
		mag, arg := math.Exp(psolBeta[m]*lr), psolBeta[m]*at
		pr, pi := mag*math.Cos(arg), mag*math.Sin(arg)
		if psolPLog[m] != 0 { // ζ^β·log ζ
			pr, pi = pr*lr-pi*at, pi*lr+pr*at
		}
		u += psolERe[m]*pr - psolEIm[m]*pi
	}
	for j := range psolLogK {
		if k := int(psolLogVar[j]); k >= 0 { // an elliptical hole: ln|w| = −ln|v|
			u -= psolLogK[j] * 0.5 * math.Log(vr[k]*vr[k]+vi[k]*vi[k])
			continue
		}
		dx, dy := x-psolLogRe[j], y-psolLogIm[j]
		u += psolLogK[j] * 0.5 * math.Log(dx*dx+dy*dy)
	}
	for t := range psolTermJ {
		k := int(psolTermVar[t])
		pr, pi := 1.0, 0.0
		for n := 0; n < int(psolTermJ[t]); n++ {
			pr, pi = pr*vr[k]-pi*vi[k], pr*vi[k]+pi*vr[k]
		}
		u += psolTERe[t]*pr - psolTEIm[t]*pi
	}
	return u
}

// psolClosed is the closed part of u.
func psolClosed(x, y float64) float64 { return %[1]s }

// psolVar is a hole's variable k at (x, y), as real and imaginary parts.
func psolVar(k int, x, y float64) (float64, float64) {
	ar, ai := x-psolVarARe[k], y-psolVarAIm[k]
	switch psolVarKind[k] {
	case 0: // S/(z − A)
		return psolDiv(psolVarS[k], 0, ar, ai)
	case 1: // 1/w, w = (ζ + √(ζ − S)·√(ζ + S))/S2, ζ = (z − A)/B
		zr, zi := psolDiv(ar, ai, psolVarBRe[k], psolVarBIm[k])
		s1r, s1i := psolSqrt(zr-psolVarS[k], zi)
		s2r, s2i := psolSqrt(zr+psolVarS[k], zi)
		wr, wi := (zr+s1r*s2r-s1i*s2i)/psolVarS2[k], (zi+s1r*s2i+s1i*s2r)/psolVarS2[k]
		return psolDiv(1, 0, wr, wi)
	case 2: // ((z − A)/(z − B))/S
		wr, wi := psolDiv(ar, ai, x-psolVarBRe[k], y-psolVarBIm[k])
		return wr / psolVarS[k], wi / psolVarS[k]
	default: // S/((z − A)/(z − B))
		wr, wi := psolDiv(ar, ai, x-psolVarBRe[k], y-psolVarBIm[k])
		return psolDiv(psolVarS[k], 0, wr, wi)
	}
}

// psolDiv is (ar + i·ai)/(br + i·bi).
func psolDiv(ar, ai, br, bi float64) (float64, float64) {
	d := br*br + bi*bi
	return (ar*br + ai*bi) / d, (ai*br - ar*bi) / d
}

// psolSqrt is the principal square root of a + i·b (cut along the negative reals).
func psolSqrt(a, b float64) (float64, float64) {
	if a == 0 && b == 0 {
		return 0, 0
	}
	t := math.Sqrt((math.Abs(a) + math.Hypot(a, b)) / 2)
	if a >= 0 {
		return t, b / (2 * t)
	}
	return math.Abs(b) / (2 * t), math.Copysign(t, b)
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
/* (ar + i*ai)/(br + i*bi). */
static void psolDiv(double ar, double ai, double br, double bi, double *re, double *im) {
	double d = br*br + bi*bi;
	*re = (ar*br + ai*bi)/d;
	*im = (ai*br - ar*bi)/d;
}

/* The principal square root of a + i*b (cut along the negative reals). */
static void psolSqrt(double a, double b, double *re, double *im) {
	if (a == 0 && b == 0) { *re = 0; *im = 0; return; }
	double t = sqrt((fabs(a) + hypot(a, b))/2);
	if (a >= 0) { *re = t; *im = b/(2*t); return; }
	*re = fabs(b)/(2*t);
	*im = copysign(t, b);
}

/* A hole's variable k at (x, y): 0 S/(z - A); 1 1/w, w = (t + sqrt(t - S)*sqrt(t + S))/S2, t = (z - A)/B;
   2 ((z - A)/(z - B))/S; 3 S/((z - A)/(z - B)). */
static void psolVar(int k, double x, double y, double *re, double *im) {
	double ar = x - psolVarARe[k], ai = y - psolVarAIm[k], wr, wi;
	switch ((int)psolVarKind[k]) {
	case 0:
		psolDiv(psolVarS[k], 0, ar, ai, re, im);
		return;
	case 1: {
		double zr, zi, s1r, s1i, s2r, s2i;
		psolDiv(ar, ai, psolVarBRe[k], psolVarBIm[k], &zr, &zi);
		psolSqrt(zr - psolVarS[k], zi, &s1r, &s1i);
		psolSqrt(zr + psolVarS[k], zi, &s2r, &s2i);
		wr = (zr + s1r*s2r - s1i*s2i)/psolVarS2[k];
		wi = (zi + s1r*s2i + s1i*s2r)/psolVarS2[k];
		psolDiv(1, 0, wr, wi, re, im);
		return;
	}
	case 2:
		psolDiv(ar, ai, x - psolVarBRe[k], y - psolVarBIm[k], &wr, &wi);
		*re = wr/psolVarS[k];
		*im = wi/psolVarS[k];
		return;
	default:
		psolDiv(ar, ai, x - psolVarBRe[k], y - psolVarBIm[k], &wr, &wi);
		psolDiv(psolVarS[k], 0, wr, wi, re, im);
	}
}

/* The closed part of u. */
static double psolClosed(double x, double y) { return %[1]s; }

/* u(x, y); link with -lm. */
double u(double x, double y) {
	double u = 0;
	for (int m = 0; m < psolMaps; m++) /* the closed part's mean over the section's symmetries (the identity alone where it has none) */
		u += psolClosed(psolMapA[m]*x + psolMapB[m]*y + psolMapE[m], psolMapC[m]*x + psolMapD[m]*y + psolMapF[m]) / psolMaps;
	for (int j = 0; j < psolPoles; j++) {
		double dx = (x - psolPoleRe[j]) - psolPoleOffRe[j], dy = (y - psolPoleIm[j]) - psolPoleOffIm[j]; /* from the corner, then the offset: digits kept near it */
		u += (psolCRe[j]*dx + psolCIm[j]*dy) / (dx*dx + dy*dy);
	}
	double qr[%[2]d] = {1}, qi[%[2]d] = {0};
	double zr = (x - psolCentreRe)/psolScale, zi = (y - psolCentreIm)/psolScale;
	double wr = zr*psolPolyRotRe - zi*psolPolyRotIm, wi = zr*psolPolyRotIm + zi*psolPolyRotRe;
	zr = wr;
	zi = wi;
	for (int n = 1; n < psolPolyPower; n++) { /* Z = W^PolyPower */
		double r = zr*wr - zi*wi;
		zi = zr*wi + zi*wr;
		zr = r;
	}
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
	double vr[%[3]d] = {0}, vi[%[3]d] = {0};
	for (int k = 0; k < psolVars; k++) {
		psolVar(k, x, y, &vr[k], &vi[k]);
	}
	for (int m = 0; m < psolPowers; m++) {
		double dx = x - psolWRe[m], dy = y - psolWIm[m];
		double sr = dx*psolRotRe[m] - dy*psolRotIm[m], si = dx*psolRotIm[m] + dy*psolRotRe[m];
		if (psolPiv[m] != 0) psolDiv(dx, dy, x - psolPivRe[m], y - psolPivIm[m], &sr, &si); /* a hole's corner */
		int k = (int)psolPowVar[m];
		if (k >= 0) { /* a slot's corner: zeta = ((z - W)/T)*exp(-(z - A)/T), T = B*S2/v */
			double tr, ti, ar, ai, er, ei;
			psolDiv(psolVarBRe[k]*psolVarS2[k], psolVarBIm[k]*psolVarS2[k], vr[k], vi[k], &tr, &ti);
			psolDiv(dx, dy, tr, ti, &ar, &ai);
			psolDiv(x - psolVarARe[k], y - psolVarAIm[k], tr, ti, &er, &ei);
			double mag = exp(-er), cr = mag*cos(ei), ci = -mag*sin(ei);
			sr = ar*cr - ai*ci;
			si = ar*ci + ai*cr;
		}
		if (sr == 0 && si == 0) continue;
		double lr = log(hypot(sr, si)), at = atan2(si, sr);
		double mag = exp(psolBeta[m]*lr), arg = psolBeta[m]*at;
		double pr = mag*cos(arg), pi = mag*sin(arg);
		if (psolPLog[m] != 0) { /* zeta^beta*log(zeta) */
			double t = pr*lr - pi*at;
			pi = pi*lr + pr*at;
			pr = t;
		}
		u += psolERe[m]*pr - psolEIm[m]*pi;
	}
	for (int j = 0; j < psolLogs; j++) {
		int k = (int)psolLogVar[j];
		if (k >= 0) { /* an elliptical hole: ln|w| = -ln|v| */
			u -= psolLogK[j]*0.5*log(vr[k]*vr[k] + vi[k]*vi[k]);
			continue;
		}
		double dx = x - psolLogRe[j], dy = y - psolLogIm[j];
		u += psolLogK[j]*0.5*log(dx*dx + dy*dy);
	}
	for (int t = 0; t < psolTerms; t++) {
		int k = (int)psolTermVar[t];
		double pr = 1, pi = 0;
		for (int n = 0; n < (int)psolTermJ[t]; n++) {
			double r = pr*vr[k] - pi*vi[k];
			pi = pr*vi[k] + pi*vr[k];
			pr = r;
		}
		u += psolTERe[t]*pr - psolTEIm[t]*pi;
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

def _psol_closed(x, y):
    return %[1]s


def u(x, y):
    u = 0.0
    for m in range(len(PSOL_MAPA)):  # the closed part's mean over the section's symmetries (the identity alone where it has none)
        u += _psol_closed(PSOL_MAPA[m]*x + PSOL_MAPB[m]*y + PSOL_MAPE[m], PSOL_MAPC[m]*x + PSOL_MAPD[m]*y + PSOL_MAPF[m]) / len(PSOL_MAPA)
    for j in range(len(PSOL_POLERE)):
        dx, dy = (x - PSOL_POLERE[j]) - PSOL_POLEOFFRE[j], (y - PSOL_POLEIM[j]) - PSOL_POLEOFFIM[j]  # from the corner, then the offset: digits kept near it
        u += (PSOL_CRE[j]*dx + PSOL_CIM[j]*dy) / (dx*dx + dy*dy)
    qr, qi = [1.0] + [0.0]*(%[2]d - 1), [0.0]*%[2]d
    zr, zi = (x - PSOL_CENTRERE)/PSOL_SCALE, (y - PSOL_CENTREIM)/PSOL_SCALE
    wr, wi = zr*PSOL_POLYROTRE - zi*PSOL_POLYROTIM, zr*PSOL_POLYROTIM + zi*PSOL_POLYROTRE
    zr, zi = wr, wi
    for _ in range(int(PSOL_POLYPOWER) - 1):  # Z = W^PolyPower
        zr, zi = zr*wr - zi*wi, zr*wi + zi*wr
    for k in range(%[2]d - 1):
        vr, vi = zr*qr[k] - zi*qi[k], zr*qi[k] + zi*qr[k]
        row = k*(k + 3)//2
        for j in range(k + 1):
            hr, hi = PSOL_HRE[row + j], PSOL_HIM[row + j]
            vr, vi = vr - (hr*qr[j] - hi*qi[j]), vi - (hr*qi[j] + hi*qr[j])
        qr[k + 1], qi[k + 1] = vr/PSOL_HRE[row + k + 1], vi/PSOL_HRE[row + k + 1]
    for k in range(%[2]d):
        u += PSOL_DRE[k]*qr[k] - PSOL_DIM[k]*qi[k]
    v = [_psol_var(k, x, y) for k in range(len(PSOL_VARKIND))]
    for m in range(len(PSOL_BETA)):
        dx, dy = x - PSOL_WRE[m], y - PSOL_WIM[m]
        sr, si = dx*PSOL_ROTRE[m] - dy*PSOL_ROTIM[m], dx*PSOL_ROTIM[m] + dy*PSOL_ROTRE[m]
        if PSOL_PIV[m] != 0:  # a hole's corner: (z - W)/(z - pivot)
            sr, si = _psol_div(dx, dy, x - PSOL_PIVRE[m], y - PSOL_PIVIM[m])
        k = int(PSOL_POWVAR[m])
        if k >= 0:  # a slot's corner: zeta = ((z - W)/T)*exp(-(z - A)/T), T = B*S2/v
            tr, ti = _psol_div(PSOL_VARBRE[k]*PSOL_VARS2[k], PSOL_VARBIM[k]*PSOL_VARS2[k], v[k][0], v[k][1])
            ar, ai = _psol_div(dx, dy, tr, ti)
            er, ei = _psol_div(x - PSOL_VARARE[k], y - PSOL_VARAIM[k], tr, ti)
            mag = math.exp(-er)
            cr, ci = mag*math.cos(ei), -mag*math.sin(ei)
            sr, si = ar*cr - ai*ci, ar*ci + ai*cr
        if sr == 0 and si == 0:
            continue
        lr, at = math.log(math.hypot(sr, si)), math.atan2(si, sr)
        mag, arg = math.exp(PSOL_BETA[m]*lr), PSOL_BETA[m]*at
        pr, pi = mag*math.cos(arg), mag*math.sin(arg)
        if PSOL_PLOG[m] != 0:  # zeta^beta*log(zeta)
            pr, pi = pr*lr - pi*at, pi*lr + pr*at
        u += PSOL_ERE[m]*pr - PSOL_EIM[m]*pi
    for j in range(len(PSOL_LOGK)):
        k = int(PSOL_LOGVAR[j])
        if k >= 0:  # an elliptical hole: ln|w| = -ln|v|
            u -= PSOL_LOGK[j]*0.5*math.log(v[k][0]*v[k][0] + v[k][1]*v[k][1])
            continue
        dx, dy = x - PSOL_LOGRE[j], y - PSOL_LOGIM[j]
        u += PSOL_LOGK[j]*0.5*math.log(dx*dx + dy*dy)
    for t in range(len(PSOL_TERMJ)):
        vr, vi = v[int(PSOL_TERMVAR[t])]
        pr, pi = 1.0, 0.0
        for _ in range(int(PSOL_TERMJ[t])):
            pr, pi = pr*vr - pi*vi, pr*vi + pi*vr
        u += PSOL_TERE[t]*pr - PSOL_TEIM[t]*pi
    return u


def _psol_div(ar, ai, br, bi):
    d = br*br + bi*bi
    return (ar*br + ai*bi)/d, (ai*br - ar*bi)/d


def _psol_sqrt(a, b):
    """The principal square root of a + i*b (cut along the negative reals)."""
    if a == 0 and b == 0:
        return 0.0, 0.0
    t = math.sqrt((abs(a) + math.hypot(a, b))/2)
    if a >= 0:
        return t, b/(2*t)
    return abs(b)/(2*t), math.copysign(t, b)


def _psol_var(k, x, y):
    """A hole's variable k: 0 S/(z - A); 1 1/w, w = (t + sqrt(t - S)*sqrt(t + S))/S2, t = (z - A)/B;
    2 ((z - A)/(z - B))/S; 3 S/((z - A)/(z - B))."""
    ar, ai = x - PSOL_VARARE[k], y - PSOL_VARAIM[k]
    kind = int(PSOL_VARKIND[k])
    if kind == 0:
        return _psol_div(PSOL_VARS[k], 0.0, ar, ai)
    if kind == 1:
        zr, zi = _psol_div(ar, ai, PSOL_VARBRE[k], PSOL_VARBIM[k])
        s1r, s1i = _psol_sqrt(zr - PSOL_VARS[k], zi)
        s2r, s2i = _psol_sqrt(zr + PSOL_VARS[k], zi)
        wr, wi = (zr + s1r*s2r - s1i*s2i)/PSOL_VARS2[k], (zi + s1r*s2i + s1i*s2r)/PSOL_VARS2[k]
        return _psol_div(1.0, 0.0, wr, wi)
    wr, wi = _psol_div(ar, ai, x - PSOL_VARBRE[k], y - PSOL_VARBIM[k])
    if kind == 2:
        return wr/PSOL_VARS[k], wi/PSOL_VARS[k]
    return _psol_div(PSOL_VARS[k], 0.0, wr, wi)
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
	closed, closedText := poly.Code(l), poly.Text()
	if w := sol.Waves; w != nil { // the source's waves in closed form, with the polynomial
		if err := wavesWritable(w); err != nil {
			return err
		}
		closed, closedText = closed+" + "+w.Waves.Code(l), sumText(closedText, w.Waves.Text())
	}
	shape := sectionCodeShapes[l.Name]
	f := sol.Section.Fitted()
	split := func(z []complex128) (re, im []float64) {
		for _, c := range z {
			re, im = append(re, real(c)), append(im, imag(c))
		}
		return re, im
	}
	var b strings.Builder
	fmt.Fprintf(&b, "%s psol %s: u(x, y) = %s + h(x, y), h fitted to the side conditions (largest residual %.1e)\n",
		codeShapes[l.Name].comment, version, closedText, sol.Section.Residual)
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
	table("PoleOff", f.PoleOff)
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
	table("Piv", f.Pivot)
	piv := make([]float64, len(f.Pivoted))
	for m, p := range f.Pivoted {
		if p {
			piv[m] = 1
		}
	}
	b.WriteString(shape.array("Piv", piv))
	plog := make([]float64, len(f.PowerLog))
	for m, l := range f.PowerLog {
		if l {
			plog[m] = 1
		}
	}
	b.WriteString(shape.array("PLog", plog))
	powVar := make([]float64, len(f.PowerVar))
	for m, k := range f.PowerVar {
		powVar[m] = float64(k)
	}
	b.WriteString(shape.array("PowVar", powVar))
	table("Log", f.LogAt)
	b.WriteString(shape.array("LogK", f.LogK))
	logVar := make([]float64, len(f.LogVar))
	for j, k := range f.LogVar {
		logVar[j] = float64(k)
	}
	b.WriteString(shape.array("LogVar", logVar))
	var kind, s1, s2 []float64
	var va, vb, te []complex128
	for _, v := range f.Vars {
		kind, s1, s2 = append(kind, float64(v.Kind)), append(s1, v.S), append(s2, v.S2)
		va, vb = append(va, v.A), append(vb, v.B)
	}
	b.WriteString(shape.array("VarKind", kind))
	table("VarA", va)
	table("VarB", vb)
	b.WriteString(shape.array("VarS", s1))
	b.WriteString(shape.array("VarS2", s2))
	var tv, tj []float64
	for _, t := range f.Terms {
		tv, tj, te = append(tv, float64(t.Var)), append(tj, float64(t.J)), append(te, t.E)
	}
	b.WriteString(shape.array("TermVar", tv))
	b.WriteString(shape.array("TermJ", tj))
	table("TE", te)
	b.WriteString(shape.scalar("CentreRe", real(f.Centre)))
	b.WriteString(shape.scalar("CentreIm", imag(f.Centre)))
	b.WriteString(shape.scalar("Scale", f.Scale))
	b.WriteString(shape.scalar("PolyRotRe", real(f.PolyRot)))
	b.WriteString(shape.scalar("PolyRotIm", imag(f.PolyRot)))
	b.WriteString(shape.scalar("PolyPower", float64(f.PolyPower)))
	var maps [6][]float64
	for _, m := range f.Maps {
		for i := range maps {
			maps[i] = append(maps[i], m[i])
		}
	}
	for i, name := range []string{"A", "B", "C", "D", "E", "F"} {
		b.WriteString(shape.array("Map"+name, maps[i]))
	}
	if l.Name == "c" {
		fmt.Fprintf(&b, "enum { psolPoles = %d, psolPowers = %d, psolLogs = %d, psolVars = %d, psolTerms = %d, psolMaps = %d };\n", len(f.Poles), len(f.Beta), len(f.LogK), len(f.Vars), len(f.Terms), len(f.Maps))
	}
	fmt.Fprintf(&b, shape.body, closed, len(f.D), max(1, len(f.Vars)))
	_, err = io.WriteString(w, b.String())
	return err
}

// decimalCoef is a float64 as an exact coefficient.
func decimalCoef(x float64) series.Coef { return series.RatCoef(new(big.Rat).SetFloat64(x)) }
