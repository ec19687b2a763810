package main

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"image/color"
	"image/png"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"psol/domain"
	"psol/parse"
	"psol/series"
)

var codeCases = []struct {
	args []string
	env  string // parameter values as the generated function's trailing arguments
	xy   bool   // a rectangle: the function takes x, y (codePoints read as Cartesian)
}{
	{[]string{"solve", "lap(u) = -1", "--rect", "1,1/2", "--bc", "left: u = 0", "--bc", "right: u = 0", "--bc", "bottom: u = 0", "--bc", "top: dn(u) = 0", "--terms", "400"}, "", true},
	{[]string{"solve", "lap(u) = sin(pi*x)*sin(pi*y) - x*y", "--rect", "1,2", "--bc", "left: u = y", "--bc", "right: u = 0", "--bc", "bottom: u = 0", "--bc", "top: u = 2 - 2x", "--terms", "400"}, "", true},
	{[]string{"solve", "-k*lap(u) = q*(1 + x)", "--disk", "a", "--bc", "u = Ts + cos(2theta)"}, "k=2,q=3,Ts=1,a=1.5", false},
	{[]string{"solve", "lap(u) = -2", "--sector", "1,pi/2", "--bc", "arc: u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0", "--terms", "400"}, "", false},
	{[]string{"solve", "lap(u) = 0", "--disk", "1", "--bc", "u = 0 < theta < pi ? 1 : 0", "--terms", "400"}, "", false},
	// A fitted section: poles, the Arnoldi recurrence and the re-entrant corner's powers.
	{[]string{"solve", "lap(u) = -2 + x", "--polygon", "0,0 1,0 1,1/2 1/2,1/2 1/2,1 0,1", "--bc", "u = 0", "--bc", "s2: dn(u) + 2u = y"}, "", true},
	// Holes: each kind's logarithm and terms (a circle's Laurent terms, an
	// ellipse's exterior map, a polygon hole's pivoted corner powers), and
	// the eccentric annulus's series in the two circles' Möbius variable.
	{[]string{"solve", "lap(u) = -1", "--disk", "1", "--hole", "circle -0.5,0,0.2", "--hole", "ellipse 0,-0.5,0.3,0.15", "--bc", "u = 0", "--bc", "hole1: u = 1", "--bc", "hole2: dn(u) = 0"}, "", true},
	{[]string{"solve", "lap(u) = -1", "--rect", "1,1", "--hole", "polygon 0.6,0.6 0.8,0.6 0.8,0.8 0.6,0.8", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	{[]string{"solve", "lap(u) = -1", "--disk", "1", "--hole", "circle 0.3,-0.1,0.25", "--bc", "u = 0"}, "", true},
	// Symmetric fits (the terms' images are in the tables; u_p's mean over
	// the mirror maps): two mirror lines, and one with an elliptical hole.
	{[]string{"solve", "lap(u) = -1", "--rect", "1,0.6", "--hole", "polygon 0.35,0.15 0.65,0.15 0.65,0.45 0.35,0.45", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	{[]string{"solve", "lap(u) = -1 + (x - 0.5)^2", "--rect", "1,0.6", "--hole", "ellipse 0.5,0.3,0.1,0.05", "--bc", "u = 0", "--bc", "top: dn(u) + 2u = 1", "--tol", "1e-10"}, "", true},
	// Holes near walls: a circle's Laurent terms and a polygon hole's corner
	// powers and poles, mirrored in the walls (domain/cornerimages.go).
	{[]string{"solve", "lap(u) = -1", "--rect", "1,0.6", "--hole", "circle 0.2,0.2,0.15", "--hole", "polygon 0.6,0.1 0.9,0.1 0.9,0.3 0.6,0.3", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	// A tilted slot, 7:1: its terms are powers of an ellipse's exterior map too.
	{[]string{"solve", "lap(u) = -1", "--rect", "1,0.6", "--hole", "polygon 0.45,0.2 0.9,0.35 0.88,0.41 0.43,0.26", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	// A round hole near an elliptical rim: its reflections there, Laurent
	// terms about points outside the ellipse.
	{[]string{"solve", "lap(u) = -1", "--ellipse", "1,0.6", "--hole", "circle -0.5,0,0.2", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	// An L shape whose diagonal mirror runs through its re-entrant corner:
	// that corner's poles and their images, anchored on it (PoleOff).
	{[]string{"solve", "lap(u) = -2", "--polygon", "0,0 2,0 2,1 1,1 1,2 0,2", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	// A 10:1 slot turned 20° about the rectangle's centre: the half turn is
	// the problem's only symmetry, and the polynomial's coefficients in Z = W²
	// are complex (symmetry.go's turns).
	{[]string{"solve", "lap(u) = -1", "--rect", "1,0.6", "--hole", "polygon 0.273627,0.191003 0.743474,0.362013 0.726373,0.408997 0.256526,0.237987", "--bc", "u = 0", "--tol", "1e-10"}, "", true},
	// Point sources off the image systems: the logarithm's exact series on
	// the circles (cos(n*atan t), sin(n*atan t) and ρ^n in the terms).
	{[]string{"solve", "lap(u) = delta(x + 0.3, y - 0.2) - 1", "--disk", "1", "--bc", "dn(u) + 2u = 0"}, "", false},
	{[]string{"solve", "lap(u) = 2*delta(x - 0.5, y + 0.4)", "--annulus", "0.1,1", "--bc", "inner: u = 0", "--bc", "outer: dn(u) + u = 1"}, "", false},
	// A section's waves in closed form beside the polynomial (sectionwaves.go).
	{[]string{"solve", "lap(u) = sin(3*x)*cosh(y) - 1", "--polygon", "0,0 1,0 1,0.6 0,0.6", "--bc", "u = 0", "--bc", "s2: dn(u) = 0", "--tol", "1e-10"}, "", true},
	// A disk's and an annulus's waves, in x = r*cos(theta), y = r*sin(theta)
	// beside the numeric modes of w (circlewaves.go).
	{[]string{"solve", "lap(u) = exp(x) + sin(2*y)", "--disk", "1", "--bc", "dn(u) + u = 0"}, "", false},
	{[]string{"solve", "lap(u) = cos(x)*exp(y) - 1", "--annulus", "0.2,1", "--bc", "inner: dn(u) = 0", "--bc", "outer: u = 0"}, "", false},
	// Kinks: the closed form |l|^3 and the trace's general term in the
	// crossing angle's atoms (atan of a square root).
	{[]string{"solve", "lap(u) = abs(y - 0.3) - 1", "--disk", "1", "--bc", "dn(u) + 2u = 0"}, "", false},
	{[]string{"solve", "lap(u) = 2*abs(x - 2*y + 0.5)", "--annulus", "0.1,1", "--bc", "inner: dn(u) = 0", "--bc", "outer: u = 0"}, "", false},
}

var codePoints = [][2]float64{{0.3, 0.4}, {0.6, 0.1}, {0.2, 0.45}} // inside every case (as r, theta or as x, y)

// psolValues evaluates the same problems in-process, for comparison.
func psolValues(t *testing.T, args []string, env string, xy bool) []float64 {
	o := &solveOptions{tol: 1e-13, terms: 1 << 20}
	cmd := newSolveCmd()
	if err := cmd.Flags().Parse(args[2:]); err != nil {
		t.Fatal(err)
	}
	o.problemFlags.regions = map[string]*string{}
	for _, k := range regionKinds {
		v, _ := cmd.Flags().GetString(k.flag)
		o.problemFlags.regions[k.flag] = &v
	}
	o.bcs = repeatedValues(cmd.Flags(), "bc")
	o.holes = repeatedValues(cmd.Flags(), "hole")
	if env != "" {
		o.lets = []string{env}
	}
	pr, err := o.pose(args[1])
	if err != nil {
		t.Fatal(err)
	}
	opt := domain.Options{Env: pr.env}
	if cmd.Flags().Changed("tol") { // a fitted case's own tolerance: the same fit as the generated code's
		opt.Tol, _ = cmd.Flags().GetFloat64("tol")
	}
	sol, err := domain.SolveWith(pr.domain, pr.source, pr.conds, opt)
	if err != nil {
		t.Fatal(err)
	}
	ev, err := sol.Compile(pr.env, 1e-13, 1<<20)
	if err != nil {
		t.Fatal(err)
	}
	var out []float64
	for _, p := range codePoints {
		r, th := p[0], p[1]
		if xy {
			r, th = math.Hypot(p[0], p[1]), math.Atan2(p[1], p[0])
		}
		v, _, _ := ev.At(r, th)
		out = append(out, v)
	}
	return out
}

func generate(t *testing.T, args []string, lang string) string {
	var out, errb bytes.Buffer
	if code := run(append(append([]string(nil), args...), "--format", "code", "--lang", lang), &out, &errb); code != 0 {
		t.Fatalf("%v: %s", args, errb.String())
	}
	return out.String()
}

func callArgs(env string) string {
	var vals []string
	names := []string{}
	m := map[string]string{}
	for _, kv := range strings.Split(env, ",") {
		if kv == "" {
			continue
		}
		p := strings.SplitN(kv, "=", 2)
		m[p[0]] = p[1]
		names = append(names, p[0])
	}
	sortStrings(names)
	for _, n := range names {
		vals = append(vals, m[n])
	}
	if len(vals) == 0 {
		return ""
	}
	return ", " + strings.Join(vals, ", ")
}

func sortStrings(s []string) {
	for i := 1; i < len(s); i++ {
		for j := i; j > 0 && s[j] < s[j-1]; j-- {
			s[j], s[j-1] = s[j-1], s[j]
		}
	}
}

func parseOutput(t *testing.T, out []byte) []float64 {
	var vs []float64
	for _, f := range strings.Fields(string(out)) {
		v, err := strconv.ParseFloat(f, 64)
		if err != nil {
			t.Fatalf("output %q: %v", out, err)
		}
		vs = append(vs, v)
	}
	return vs
}

// Generated code, compiled and run, gives psol's own values.
func TestGeneratedCode(t *testing.T) {
	dir := t.TempDir()
	for i, c := range codeCases {
		want := psolValues(t, c.args, c.env, c.xy)
		runners := map[string]func(src string) ([]byte, error){
			"go": func(src string) ([]byte, error) {
				var calls strings.Builder
				for _, p := range codePoints {
					fmt.Fprintf(&calls, "\tfmt.Println(U(%v, %v%s))\n", p[0], p[1], callArgs(c.env))
				}
				prog := "package main\n\nimport (\n\t\"fmt\"\n\t\"math\"\n)\n\n" + src + "\nfunc main() {\n" + calls.String() + "}\n"
				path := filepath.Join(dir, fmt.Sprintf("u%d.go", i))
				if err := os.WriteFile(path, []byte(prog), 0o644); err != nil {
					return nil, err
				}
				if out, err := exec.Command("go", "vet", path).CombinedOutput(); err != nil {
					return out, err
				}
				return exec.Command("go", "run", path).CombinedOutput()
			},
			"c": func(src string) ([]byte, error) {
				if _, err := exec.LookPath("gcc"); err != nil {
					t.Skip("gcc not installed")
				}
				var calls strings.Builder
				for _, p := range codePoints {
					fmt.Fprintf(&calls, "\tprintf(\"%%.17g\\n\", u(%v, %v%s));\n", p[0], p[1], callArgs(c.env))
				}
				prog := "#include <stdio.h>\n" + src + "\nint main(void) {\n" + calls.String() + "\treturn 0;\n}\n"
				path := filepath.Join(dir, fmt.Sprintf("u%d.c", i))
				if err := os.WriteFile(path, []byte(prog), 0o644); err != nil {
					return nil, err
				}
				bin := filepath.Join(dir, fmt.Sprintf("u%d", i))
				if out, err := exec.Command("gcc", "-std=c99", "-Wall", "-Werror", "-O1", "-o", bin, path, "-lm").CombinedOutput(); err != nil {
					return out, err
				}
				return exec.Command(bin).CombinedOutput()
			},
			"python": func(src string) ([]byte, error) {
				if _, err := exec.LookPath("python3"); err != nil {
					t.Skip("python3 not installed")
				}
				var calls strings.Builder
				for _, p := range codePoints {
					fmt.Fprintf(&calls, "print(repr(u(%v, %v%s)))\n", p[0], p[1], callArgs(c.env))
				}
				path := filepath.Join(dir, fmt.Sprintf("u%d.py", i)) // a file: the tables can pass the argument limit
				if err := os.WriteFile(path, []byte(src+"\n"+calls.String()), 0o644); err != nil {
					return nil, err
				}
				return exec.Command("python3", "-W", "error", path).CombinedOutput()
			},
		}
		// One subtest per language, in a fixed order: a missing tool skips
		// its own language only, and says so in the log.
		for _, lang := range []string{"go", "c", "python"} {
			runIt := runners[lang]
			t.Run(fmt.Sprintf("%s/%d", lang, i), func(t *testing.T) {
				src := generate(t, c.args, lang)
				out, err := runIt(src)
				if err != nil {
					t.Fatalf("%s for %v: %v\n%s\n%s", lang, c.args, err, out, src)
				}
				got := parseOutput(t, out)
				for k := range want {
					if math.Abs(got[k]-want[k]) > 1e-9*math.Max(1, math.Abs(want[k])) {
						t.Errorf("%s for %v at %v: %.15g, psol %.15g", lang, c.args, codePoints[k], got[k], want[k])
					}
				}
			})
		}
	}
}

// Plot files decode: PNG with image/png, SVG as XML; the map is not blank.
func TestPlotFiles(t *testing.T) {
	dir := t.TempDir()
	for _, name := range []string{"u.png", "u.svg"} {
		path := filepath.Join(dir, name)
		args := []string{"solve", "lap(u) = -2", "--sector", "1,3*pi/2", "--bc", "arc: u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0", "--plot", path}
		var out, errb bytes.Buffer
		if code := run(args, &out, &errb); code != 0 {
			t.Fatalf("%s: %s", name, errb.String())
		}
		data, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		if strings.HasSuffix(name, ".png") {
			img, err := png.Decode(bytes.NewReader(data))
			if err != nil {
				t.Fatal(err)
			}
			b := img.Bounds()
			if b.Dx() < 400 || b.Dy() < 300 {
				t.Errorf("PNG is %v", b)
			}
			// The colour bar lies inside the canvas: the last columns are background.
			for x := b.Max.X - 8; x < b.Max.X; x++ {
				for y := b.Min.Y; y < b.Max.Y; y++ {
					if r, g, bl, _ := img.At(x, y).RGBA(); r < 0xf000 || g < 0xf000 || bl < 0xf000 {
						t.Fatalf("PNG column %d is drawn on at y = %d: the colour bar runs off the canvas", x, y)
					}
				}
			}
			colours := map[color.Color]bool{}
			for y := b.Min.Y; y < b.Max.Y; y += 7 {
				for x := b.Min.X; x < b.Max.X; x += 7 {
					colours[img.At(x, y)] = true
				}
			}
			if len(colours) < 30 {
				t.Errorf("PNG has %d colours: blank?", len(colours))
			}
			continue
		}
		var doc struct {
			XMLName xml.Name
			Width   string `xml:"width,attr"`
		}
		if err := xml.Unmarshal(data, &doc); err != nil || doc.XMLName.Local != "svg" {
			t.Fatalf("SVG does not parse: %v (%s)", err, doc.XMLName.Local)
		}
		if n := strings.Count(string(data), "<path"); n < 100 {
			t.Errorf("SVG has %d paths: blank?", n)
		}
	}
}

// A failed run leaves an existing output file byte for byte as it was.
func TestFailedRunKeepsFiles(t *testing.T) {
	dir := t.TempDir()
	for _, flag := range [][]string{{"--grid", "5", "--csv", "out.csv"}, {"--plot", "out.png"}} {
		path := filepath.Join(dir, flag[len(flag)-1])
		before := []byte("precious data\n")
		if err := os.WriteFile(path, before, 0o644); err != nil {
			t.Fatal(err)
		}
		flag[len(flag)-1] = path
		for _, bad := range [][]string{
			{"solve", "lap(u) = (1 +", "--disk", "1", "--bc", "u = 0"},  // bad input
			{"solve", "lap(u) = 1/r^2", "--disk", "1", "--bc", "u = 0"}, // no solution
			{"solve", "lap(u) = 1", "--disk", "1", "--bc", "dn(u) = 5"}, // incompatible data
		} {
			var out, errb bytes.Buffer
			if code := run(append(bad, flag...), &out, &errb); code == 0 {
				t.Fatalf("%v succeeded", bad)
			}
			after, err := os.ReadFile(path)
			if err != nil || !bytes.Equal(after, before) {
				t.Errorf("%v with %v changed the file: %q (%v)", bad, flag, after, err)
			}
		}
		entries, _ := os.ReadDir(dir)
		for _, e := range entries {
			if strings.Contains(e.Name(), ".tmp") {
				t.Errorf("temporary file %s left behind", e.Name())
			}
		}
	}
}

// benchRun runs the command b.N times, failing on a non-zero exit.
func benchRun(b *testing.B, args []string) {
	for i := 0; i < b.N; i++ {
		var out bytes.Buffer
		if code := run(args, &out, &out); code != 0 {
			b.Fatal(out.String())
		}
	}
}

// BenchmarkGrid evaluates a 50-term series (the sector's) on a 500×500 grid.
func BenchmarkGrid(b *testing.B) {
	path := filepath.Join(b.TempDir(), "g.csv")
	args := []string{"solve", "lap(u) = -2", "--sector", "1,3*pi/2", "--bc", "arc: u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0", "--grid", "500", "--csv", path, "--terms", "50"}
	benchRun(b, args)
}

// BenchmarkPlot draws the PNG of the same solution.
func BenchmarkPlot(b *testing.B) {
	path := filepath.Join(b.TempDir(), "u.png")
	args := []string{"solve", "lap(u) = -2", "--sector", "1,3*pi/2", "--bc", "arc: u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0", "--plot", path, "--terms", "50"}
	benchRun(b, args)
}

// BenchmarkGaussianSource is exp(−r²) on the unit disk from source text to five evaluated points.
func BenchmarkGaussianSource(b *testing.B) {
	b.ReportAllocs()
	args := []string{"solve", "lap(u) = exp(-r^2)", "--disk", "1", "--bc", "u = 0"}
	for _, r := range []string{"0", "0.2", "0.5", "0.7", "0.9"} {
		args = append(args, "--at", "r="+r+",theta=1")
	}
	benchRun(b, args)
}

// BenchmarkOffCentreGaussian is a sharp hot spot, exp(−|x − (0.4, 0)|²/0.02),
// on the unit disk to 1e-9, from source text to five evaluated points.
func BenchmarkOffCentreGaussian(b *testing.B) {
	b.ReportAllocs()
	args := []string{"solve", "lap(u) = exp(-((x - 0.4)^2 + y^2)/0.02)", "--disk", "1", "--bc", "u = 0", "--tol", "1e-9"}
	for _, p := range []string{"x=0.4,y=0", "x=0.3,y=0.1", "x=-0.5,y=0.2", "x=0.1,y=0.5", "x=0.9,y=0"} {
		args = append(args, "--at", p)
	}
	benchRun(b, args)
}

// BenchmarkGaussianHotSpot is the speed issue's row: exp(−|x − (0.3, 0)|²/0.05)
// on the unit disk with u = 0, five points, at two tolerances (the work
// falls as the tolerance loosens).
func BenchmarkGaussianHotSpot(b *testing.B) {
	for _, tol := range []string{"1e-6", "1e-10"} {
		b.Run("tol="+tol, func(b *testing.B) {
			b.ReportAllocs()
			args := []string{"solve", "lap(u) = exp(-((x-0.3)^2+y^2)/0.05)", "--disk", "1", "--bc", "u = 0", "--tol", tol}
			for _, p := range []string{"x=0.3,y=0", "x=0,y=0", "x=0.5,y=0.5", "x=-0.5,y=0.1", "x=0.9,y=0"} {
				args = append(args, "--at", p)
			}
			benchRun(b, args)
		})
	}
}

// BenchmarkKinkedSource is abs(y - 0.3) on the unit disk (the closed form
// abs(l)^3/6 and its trace's ~2000 numeric modes), from text to one point.
func BenchmarkKinkedSource(b *testing.B) {
	b.ReportAllocs()
	benchRun(b, []string{"solve", "lap(u) = abs(y - 0.3)", "--disk", "1", "--bc", "u = 0", "--at", "x=0.1,y=0.2"})
}

// BenchmarkKinkedSector is abs(y - 0.3) on a quarter disk: the sector's
// quadrature of the kinked extension (no closed trace there), from text to
// one point.
func BenchmarkKinkedSector(b *testing.B) {
	b.ReportAllocs()
	benchRun(b, []string{"solve", "lap(u) = abs(y - 0.3)", "--sector", "1,pi/2", "--bc", "u = 0", "--at", "x=0.3,y=0.3"})
}

// BenchmarkSectorRayLift is a source that does not vanish on the Dirichlet
// rays of a quarter disk with a convective arc (the quadrature's ray lift),
// from source text to five evaluated points.
func BenchmarkSectorRayLift(b *testing.B) {
	b.ReportAllocs()
	args := []string{"solve", "lap(u) = -1/(1 + r^2)", "--sector", "1,pi/2", "--bc", "arc: dn(u) + 2u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0"}
	for _, p := range []string{"r=0.1,theta=0.1", "r=0.3,theta=0.7", "r=0.5,theta=0.785", "r=0.7,theta=1.2", "r=0.9,theta=0.4"} {
		args = append(args, "--at", p)
	}
	benchRun(b, args)
}

// BenchmarkRectangleBump is a Gaussian bump on the rectangle (the sine-transform
// quadrature and four numeric side series), from source text to five points.
func BenchmarkRectangleBump(b *testing.B) {
	b.ReportAllocs()
	args := []string{"solve", "lap(u) = -exp(-((x-0.5)^2 + (y-0.3)^2)/0.05)", "--rect", "1,1/2",
		"--bc", "left: u = 0", "--bc", "right: u = 0", "--bc", "bottom: u = 0", "--bc", "top: u = 0"}
	for _, p := range []string{"x=0.5,y=0.3", "x=0.1,y=0.1", "x=0.9,y=0.4", "x=0.3,y=0.25", "x=0.7,y=0.05"} {
		args = append(args, "--at", p)
	}
	benchRun(b, args)
}

// BenchmarkHollowEllipticShaft is the README's hollow elliptical shaft
// with --quantity torsion: the symmetry test's probes and the closed sides'
// scan once (it built a 10⁵-node area rule for 97 probes, and scanned each
// closed side afresh for each of twelve mirror lines).
func BenchmarkHollowEllipticShaft(b *testing.B) {
	b.ReportAllocs()
	benchRun(b, []string{"solve", "lap(u) = -2", "--ellipse", "0.05,0.03", "--hole", "ellipse 0,0,0.025,0.015",
		"--bc", "rim: u = 0", "--bc", "hole1: u = const, flux = 2*pi*0.025*0.015", "--quantity", "torsion"})
}

// BenchmarkHoledReportNumericSource is an L shape less a square, with a
// source the quadrature takes, to its flow figures: the report's interior
// scan asks for containment 16,000 times (a holed region's Contains
// rebuilt its holes each time).
func BenchmarkHoledReportNumericSource(b *testing.B) {
	b.ReportAllocs()
	benchRun(b, []string{"solve", "lap(u) = exp(x*y)", "--polygon", "0,0 2,0 2,1 1,1 1,2 0,2",
		"--hole", "polygon 0.2,0.2 0.6,0.2 0.6,0.6 0.2,0.6", "--bc", "u = 0", "--quantity", "flow"})
}

// A plot of a solution with a numeric part: the title names the whole
// source, and the rings it is sampled on give the values At gives (to the
// bilinear interpolation's h², common practice).
func TestPlotQuadrature(t *testing.T) {
	path := filepath.Join(t.TempDir(), "q.svg")
	args := []string{"solve", "lap(u) = exp(-r^2)", "--disk", "1", "--bc", "u = 0", "--plot", path}
	var out, errb bytes.Buffer
	if code := run(args, &out, &errb); code != 0 {
		t.Fatal(errb.String())
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(string(data), "exp(-r^2)") {
		t.Error("the title does not name the source exp(-r^2)")
	}
	disk := domain.Disk{R: series.IntCoef(1)}
	src, err := parse.Equation("lap(u) = exp(-r^2)", nil)
	if err != nil {
		t.Fatal(err)
	}
	cond, err := parse.Condition("u = 0", disk.Sides(), nil)
	if err != nil {
		t.Fatal(err)
	}
	sol, err := domain.SolveWith(disk, src, []domain.Condition{cond}, domain.Options{Tol: 1e-12})
	if err != nil {
		t.Fatal(err)
	}
	ev, err := sol.Compile(nil, 1e-12, 1<<12)
	if err != nil {
		t.Fatal(err)
	}
	at := polarSampler(ev, 0, 1, 160, 320)
	for _, p := range [][2]float64{{0.1, 0.3}, {0.5, 2}, {0.93, 5.5}, {1, 0}} {
		want, _, _ := ev.At(p[0], p[1])
		if got := at(p[0], p[1]); math.Abs(got-want) > 1e-5*0.2 {
			t.Errorf("sampler at %v: %.9g, At %.9g", p, got, want)
		}
	}
}

// Marching squares on z = x² + y²: the level 1/4 lies on the circle of
// radius 1/2, to the grid's resolution; cells with a NaN corner draw nothing.
func TestIsolines(t *testing.T) {
	const n = 81
	f := &field{x0: -1, y0: -1, dx: 2.0 / (n - 1), dy: 2.0 / (n - 1), nx: n, ny: n, z: make([]float64, n*n)}
	for r := 0; r < n; r++ {
		for c := 0; c < n; c++ {
			x, y := f.X(c), f.Y(r)
			f.z[r*n+c] = x*x + y*y
			if x > 0.8 {
				f.z[r*n+c] = math.NaN()
			}
		}
	}
	l := newIsolines(f, []float64{0.25, 0.81})
	if len(l.segs) < 50 {
		t.Fatalf("%d segments", len(l.segs))
	}
	for _, s := range l.segs {
		for _, p := range [][2]float64{{s[0], s[1]}, {s[2], s[3]}} {
			rad := math.Hypot(p[0], p[1])
			if math.Abs(rad-0.5) > 2e-3 && math.Abs(rad-0.9) > 2e-3 || p[0] > 0.8 {
				t.Errorf("a point of a level line at %v (radius %.4f)", p, rad)
			}
		}
	}
}

// No two contour labels' boxes overlap, and each box lies inside the
// region (on a field with a hole of NaN in the middle).
func TestContourLabelsApart(t *testing.T) {
	const n = 160
	f := &field{x0: -1, y0: -1, dx: 2.0 / (n - 1), dy: 2.0 / (n - 1), nx: n, ny: n, z: make([]float64, n*n), min: math.Inf(1), max: math.Inf(-1)}
	for r := 0; r < n; r++ {
		for c := 0; c < n; c++ {
			x, y := f.X(c), f.Y(r)
			v := math.NaN()
			if h := math.Hypot(x, y); h < 1 && h > 0.2 {
				v = x*x - y + 0.3*math.Sin(5*x)
				f.min, f.max = math.Min(f.min, v), math.Max(f.max, v)
			}
			f.z[r*n+c] = v
		}
	}
	var levels []float64
	for i := 1; i <= 12; i++ {
		levels = append(levels, f.min+(f.max-f.min)*float64(i)/13)
	}
	bw, bh := 0.2, 0.08 // the box contourLabels keeps clear, in data units
	labels := contourLabels(f, levels, bw, bh)
	if len(labels) < 4 {
		t.Fatalf("too few labels placed: %v", labels)
	}
	for i, p := range labels {
		for j, q := range labels[:i] {
			if math.Abs(p.x-q.x) < bw && math.Abs(p.y-q.y) < bh {
				t.Errorf("labels %d (%v) and %d (%v) overlap", i, p, j, q)
			}
		}
		for _, d := range [][2]float64{{0, 0}, {bw, 0}, {0, bh}, {bw, bh}} {
			if h := math.Hypot(p.x+d[0], p.y+d[1]); h >= 1 || h <= 0.2 {
				t.Errorf("label %d's box reaches outside the region at %v", i, d)
			}
		}
	}
}
