package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"testing"
)

// readCSV runs psol with --grid N --csv and returns the header and rows.
func readCSV(t *testing.T, args ...string) ([]string, [][]float64) {
	t.Helper()
	path := filepath.Join(t.TempDir(), "g.csv")
	var out bytes.Buffer
	if code := run(append(args, "--grid", "7", "--csv", path), &out, &out); code != 0 {
		t.Fatalf("exit %d: %s", code, out.String())
	}
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	recs, err := csv.NewReader(f).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	var rows [][]float64
	for _, rec := range recs[1:] {
		var row []float64
		for _, s := range rec {
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Fatal(err)
			}
			row = append(row, v)
		}
		rows = append(rows, row)
	}
	return recs[0], rows
}

// The CSV grid's columns are what their headers say, and its values are the
// solution's: checked against closed forms at every grid point.
func TestGridColumns(t *testing.T) {
	// Plane Poiseuille flow between y = 0 and y = 1 with insulated ends:
	// u = y(1 − y)/2 (common practice), whatever x; a swap of the x and y
	// columns shows at once.
	head, rows := readCSV(t, "solve", "lap(u) = -1", "--rect", "2,1", "--bc", "left: dn(u) = 0", "--bc", "right: dn(u) = 0", "--bc", "bottom: u = 0", "--bc", "top: u = 0")
	if want := []string{"x", "y", "u", "error"}; !equalStrings(head, want) {
		t.Fatalf("header %v, want %v", head, want)
	}
	for _, r := range rows {
		x, y, u := r[0], r[1], r[2]
		if x < -1e-12 || x > 2+1e-12 || y < -1e-12 || y > 1+1e-12 {
			t.Fatalf("point (%g, %g) outside the 2 x 1 rectangle", x, y)
		}
		if want := y * (1 - y) / 2; math.Abs(u-want) > 1e-9 {
			t.Errorf("u(%g, %g) = %g, want y(1 - y)/2 = %g", x, y, u, want)
		}
	}
	// The disk: u = (1 − r²)/4 for Δu = −1, u = 0 on r = 1 (Hagen–Poiseuille);
	// the polar columns agree with the Cartesian ones.
	head, rows = readCSV(t, "solve", "lap(u) = -1", "--disk", "1", "--bc", "u = 0")
	if want := []string{"r", "theta", "x", "y", "u", "error"}; !equalStrings(head, want) {
		t.Fatalf("header %v, want %v", head, want)
	}
	for _, row := range rows {
		r, th, x, y, u := row[0], row[1], row[2], row[3], row[4]
		if math.Abs(x-r*math.Cos(th)) > 1e-9 || math.Abs(y-r*math.Sin(th)) > 1e-9 {
			t.Errorf("(r, theta) = (%g, %g) but (x, y) = (%g, %g)", r, th, x, y)
		}
		if want := (1 - r*r) / 4; math.Abs(u-want) > 1e-12 {
			t.Errorf("u(%g, %g) = %g, want %g", r, th, u, want)
		}
	}
}

func equalStrings(a, b []string) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// The JSON output's structure: the keys scripts rely on (SPEC), with values
// of the right kind, and the figures as objects.
func TestJSONStructure(t *testing.T) {
	var out bytes.Buffer
	args := []string{"solve", "lap(u) = -2", "--disk", "1", "--bc", "u = 0", "--at", "r=0.5,theta=0", "--report", "--quantity", "torsion", "--format", "json"}
	if code := run(args, &out, &out); code != 0 {
		t.Fatalf("exit %d: %s", code, out.String())
	}
	var doc struct {
		Problem, Particular, Trace, Correction, Harmonic, Solution struct {
			Text, LaTeX string
			Exact       bool
		}
		Checks []struct {
			Name     string
			Exact    bool
			Residual float64
		}
		Points []struct{ R, Theta, X, Y, U float64 }
		Report struct {
			Max, Min, Integral, Mean, Flux *float64
			SideFlux                       []struct{ Side string } `json:"side_flux"`
		}
		Quantities []struct {
			Name        string
			Value       *float64
			Exact       string
			Description string
		}
		Warnings []string
	}
	if err := json.Unmarshal(out.Bytes(), &doc); err != nil {
		t.Fatalf("JSON does not parse: %v", err)
	}
	switch {
	case doc.Solution.Text != "u = -1/2*r^2 + 1/2" || !doc.Solution.Exact:
		t.Errorf("solution %+v", doc.Solution)
	case len(doc.Points) != 1 || doc.Points[0].U != 0.375:
		t.Errorf("points %+v, want u(0.5) = 0.375", doc.Points)
	case doc.Report.Max == nil || *doc.Report.Max != 0.5 || len(doc.Report.SideFlux) != 1:
		t.Errorf("report %+v", doc.Report)
	case len(doc.Quantities) < 1 || doc.Quantities[0].Name != "J" || doc.Quantities[0].Exact != "1/2*pi" || doc.Quantities[0].Value == nil:
		t.Errorf("quantities %+v, want J = 1/2*pi (Timoshenko & Goodier, the solid shaft)", doc.Quantities)
	case doc.Warnings == nil:
		t.Errorf("warnings must be a list, even empty")
	}
}

// check's verdicts: a right claim exits 0, a wrong one exits 1 with how far
// off it is (in x and y on the rectangle) and the residual's size in JSON.
func TestCheckVerdicts(t *testing.T) {
	for _, c := range []struct {
		args   []string
		code   int
		offBy  string
		resid  float64
		source string
	}{
		{[]string{"check", "lap(u) = -1", "--disk", "a", "--bc", "u = 0", "--claim", "(a^2 - r^2)/4"}, 0, "", 0, "Hagen–Poiseuille, Bird, Stewart & Lightfoot §2.3"},
		{[]string{"check", "lap(u) = -1", "--disk", "2", "--bc", "u = 0", "--claim", "(4 - r^2)/4 + 1"}, 1, "1", 1, "off by a constant"},
		{[]string{"check", "lap(u) = 2", "--rect", "1,1", "--bc", "left: u = 0", "--bc", "right: u = 1", "--bc", "bottom: u = x^2", "--bc", "top: u = x^2", "--claim", "x^2 + y"}, 1, "y", 1, "x^2 solves it; the claim adds y"},
	} {
		var out bytes.Buffer
		code := run(append(c.args, "--format", "json"), &out, &out)
		if code != c.code {
			t.Errorf("%v: exit %d, want %d (%s)", c.args, code, c.code, out.String())
			continue
		}
		var rep struct {
			Holds  bool   `json:"holds"`
			OffBy  string `json:"off_by"`
			Checks []struct {
				Residual *float64 `json:"residual"`
			} `json:"checks"`
		}
		body := out.Bytes()
		if i := bytes.LastIndex(body, []byte("}")); i >= 0 {
			body = body[:i+1]
		}
		if err := json.Unmarshal(body, &rep); err != nil {
			t.Fatalf("%v: %v\n%s", c.args, err, out.String())
		}
		worst := 0.0
		for _, ch := range rep.Checks {
			if ch.Residual != nil {
				worst = math.Max(worst, *ch.Residual)
			}
		}
		if rep.Holds != (c.code == 0) || rep.OffBy != c.offBy || math.Abs(worst-c.resid) > 1e-12 {
			t.Errorf("%v: holds %v, off by %q, residual %g; want off by %q, residual %g (%s)", c.args, rep.Holds, rep.OffBy, worst, c.offBy, c.resid, c.source)
		}
	}
}

// A capped series is honest on the grid: with --terms 50 every value is
// within its error column of the fully summed value, and the rim row, on
// the arc's Dirichlet data, is the data itself (it read 0 error while off by
// 2.9e-4 when the series was summed there and stopped on a vanishing term).
func TestGridCappedSeriesHonest(t *testing.T) {
	args := []string{"solve", "lap(u) = 1", "--sector", "1,pi/3", "--bc", "u = 0"}
	_, ref := readCSV(t, args...)
	_, capped := readCSV(t, append(args, "--terms", "50")...)
	if len(ref) != len(capped) {
		t.Fatalf("%d rows against %d", len(capped), len(ref))
	}
	for i, r := range capped {
		u, errCol, want := r[4], r[5], ref[i][4]
		if math.Abs(u-want) > 10*errCol+1e-12 {
			t.Errorf("r = %g, theta = %g: u = %.12g with error column %.1g, fully summed %.12g", r[0], r[1], u, errCol, want)
		}
		corner := r[1] < 1e-12 || math.Abs(r[1]-math.Pi/3) < 1e-9 // the rays meet the arc: summed there
		if r[0] == 1 && !corner && (u != 0 || errCol != 0) {
			t.Errorf("on the arc, theta = %g: u = %g (error %g), want the data 0 exactly", r[1], u, errCol)
		}
	}
}

// A section's CSV grid holds the box's points in the region only, and each
// point's error column carries the fit's residual bound. An L shape's
// missing quadrant printed the fit's continuation (1.8e13 at the far
// corner), a hole's points NaN, and every error read 0. Torsion of the L
// (u = 0 outside, Δu = −2): u ≥ 0 inside (maximum principle) and 0 on the
// sides, to the error printed.
func TestSectionGridInRegion(t *testing.T) {
	_, rows := readCSV(t, "solve", "lap(u) = -2", "--polygon", "0,0 2,0 2,1 1,1 1,2 0,2", "--bc", "u = 0")
	if len(rows) != 49-9 { // 7 × 7, less the 3 × 3 beyond x = 1 and y = 1
		t.Errorf("%d rows, want %d", len(rows), 49-9)
	}
	for _, r := range rows {
		x, y, u, e := r[0], r[1], r[2], r[3]
		if x > 1+1e-12 && y > 1+1e-12 {
			t.Errorf("point (%g, %g) in the L's missing quadrant", x, y)
		}
		if e <= 0 || e > 1e-9 {
			t.Errorf("error %g at (%g, %g): want the fit's residual bound", e, x, y)
		}
		if u < -e || math.IsNaN(u) {
			t.Errorf("u(%g, %g) = %g below 0 by more than its error %g", x, y, u, e)
		}
	}
	_, rows = readCSV(t, "solve", "lap(u) = -2", "--rect", "1,1", "--hole", "circle 0.5,0.5,0.3", "--bc", "u = 0")
	for _, r := range rows {
		if math.Hypot(r[0]-0.5, r[1]-0.5) < 0.3-1e-12 || math.IsNaN(r[2]) {
			t.Errorf("point (%g, %g), u = %g, inside the hole", r[0], r[1], r[2])
		}
	}
}
