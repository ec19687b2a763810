package parse

import (
	"errors"
	"flag"
	"math"
	"math/big"
	"math/rand"
	"os"
	"strings"
	"testing"

	"psol/domain"
	"psol/series"
)

var update = flag.Bool("update", false, "rewrite golden files")

// The grammar participle derives from the node types is pinned by a golden file.
func TestGrammarGolden(t *testing.T) {
	const path = "../testdata/grammar.ebnf"
	got := Grammar() + "\n"
	if *update {
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if got != string(want) {
		t.Errorf("grammar changed; run go test ./parse -update and review the diff\n%s", got)
	}
}

func TestLowering(t *testing.T) {
	cases := []struct{ in, want string }{
		{"6r*sin(theta)", "6*r*sin(theta)"},
		{"4sin(3theta)", "4*sin(3*theta)"},
		{"3(x+y)", "3*r*cos(theta) + 3*r*sin(theta)"},
		{"x*y", "1/2*r^2*sin(2*theta)"},
		{"x^2 + y^2", "r^2"},
		{"x*r^2", "r^3*cos(theta)"},
		{"cos(theta)^3", "3/4*cos(theta) + 1/4*cos(3*theta)"},
		{"2e5", "200000"},
		{"0.05*a", "1/20*a"},
		{"r**2", "r^2"},
		{"2^-1", "1/2"},
		{"-r^2", "-r^2"},
		{"2r^2", "2*r^2"},
		{"sqrt(r)", "r^(1/2)"},
		{"sqrt(x^2+y^2)", "r"},
		{"ln(r^3)", "3*ln(r)"},
		{"log(r)", "ln(r)"},
		{"sin(-2theta)", "-sin(2*theta)"},
		{"cos(theta - pi/2)", "sin(theta)"},
		{"cos(θ)", "cos(theta)"},
		{"π", "pi"},
		{"G/(4mu)", "1/4*G/mu"},
		{"(a+b)^2", "a^2 + 2*a*b + b^2"},
		{"1/(a+b)", "1/(a + b)"},
		{"exp(-r^2)", "exp(-r^2)"},
		{"1/(1+r^2)", "1/(1 + r^2)"},
		{"sum(n=1..inf, n != 2..4, n != 7, r^n*sin(n*theta)/n)", "sum(n=1..inf, n != 2..4, n != 7, r^(n)*sin(n*theta)*1/n)"},
		{"sum(n=1..inf, n != 2, n != 3, n != 4, r^n/n^2)", "sum(n=1..inf, n != 2..4, r^(n)*1/n^2)"},
		// A single term with a compound coefficient keeps its parentheses as
		// an operand (the printed text once read (1/2*sqrt(3))^n as 1/2*sqrt(3)^n).
		{"sum(n=1..inf, (1/2*sqrt(3))^n*(n - 2)/(n + 1)*r^n*sin(n*theta))", "sum(n=1..inf, (1/2*sqrt(3))^(n)*(-2 + n)*1/(1 + n)*r^(n)*sin(n*theta))"},
	}
	for _, c := range cases {
		f, err := Expression("test", c.in, nil)
		if err != nil {
			t.Errorf("%s: %v", c.in, err)
			continue
		}
		if got := f.Text(); got != c.want {
			t.Errorf("%s: got %s, want %s", c.in, got, c.want)
		}
	}
}

// max and min of two arguments are (a + b ± |a − b|)/2 (an identity for
// all reals, common practice): the lowered field against math.Max and
// math.Min at points, for linear and non-linear arguments.
func TestMaxMin(t *testing.T) {
	pts := [][2]float64{{0.3, 0.2}, {0.7, 2.5}, {1.1, 4.0}, {0.05, 5.9}}
	for _, c := range []struct {
		in   string
		want func(x, y float64) float64
	}{
		{"max(x, y)", math.Max},
		{"min(x - 1/5, 1 - y)", func(x, y float64) float64 { return math.Min(x-0.2, 1-y) }},
		{"max(x^2, y) + 1", func(x, y float64) float64 { return math.Max(x*x, y) + 1 }},
	} {
		f, err := Expression("test", c.in, nil)
		if err != nil {
			t.Fatalf("%s: %v", c.in, err)
		}
		cf, err := f.Compile(nil)
		if err != nil {
			t.Fatalf("%s: %v", c.in, err)
		}
		for _, p := range pts {
			x, y := p[0]*math.Cos(p[1]), p[0]*math.Sin(p[1])
			if got, want := cf.At(p[0], p[1]), c.want(x, y); math.Abs(got-want) > 1e-14 {
				t.Errorf("%s at (%g, %g): %.16g, want %.16g", c.in, x, y, got, want)
			}
		}
	}
}

// Printed remainders read back as the same function: the text is psol's
// syntax, so a claim or a formula copied from the output means what it did.
func TestRemainderTextRoundTrip(t *testing.T) {
	for _, in := range []string{
		"sum(n=1..inf, (1/2*sqrt(3))^n*(n - 2)/(n + 1)*r^n*sin(n*theta))",
		"exp(x)/(2*x + 3) - (x - 1)^3*exp(-y)",
		"atan(2*r*sin(theta)/(1 - r^2))/pi",
		"-sin(pi*x)*sin(pi*y)/(2*pi^2)",
		"(1 + x)^(1/3)*exp(-(x^2 + y^2)/0.05)",
	} {
		f, err := Expression("test", in, nil)
		if err != nil {
			t.Fatalf("%s: %v", in, err)
		}
		g, err := Expression("test", f.Text(), nil)
		if err != nil {
			t.Fatalf("%s printed as %s: %v", in, f.Text(), err)
		}
		cf, err1 := f.Compile(nil)
		cg, err2 := g.Compile(nil)
		if err1 != nil || err2 != nil {
			t.Fatal(err1, err2)
		}
		for _, p := range [][2]float64{{0.3, 0.4}, {0.7, 2.1}, {0.5, -1}} {
			if a, b := cf.At(p[0], p[1]), cg.At(p[0], p[1]); math.Abs(a-b) > 1e-12*math.Max(1, math.Abs(a)) {
				t.Errorf("%s printed as %s: %.15g, read back %.15g", in, f.Text(), a, b)
			}
		}
	}
}

func TestEquations(t *testing.T) {
	cases := []struct{ in, want string }{
		{"lap(u) = 6r*sin(theta)", "6*r*sin(theta)"},
		{"-k*lap(u) = q", "-q/k"},
		{"Δu = 1", "1"},
		{"∇²u = x", "r*cos(theta)"},
		{"∇^2u = x", "r*cos(theta)"},
		{"x^2*y", "1/4*r^3*sin(theta) + 1/4*r^3*sin(3*theta)"},
		{"0 = mu*lap(u) + G", "-G/mu"},
		{"2*lap(u) - 4 = lap(u)", "4"},
		{"lap(u)/3 = r", "3*r"},
	}
	for _, c := range cases {
		f, err := Equation(c.in, nil)
		if err != nil {
			t.Errorf("%s: %v", c.in, err)
			continue
		}
		if got := f.Text(); got != c.want {
			t.Errorf("%s: got %s, want %s", c.in, got, c.want)
		}
	}
}

func TestConditions(t *testing.T) {
	cases := []struct {
		in   string
		kind domain.Kind
		h, g string
	}{
		{"u = 4sin(3theta)", domain.Dirichlet, "0", "4*sin(3*theta)"},
		{"rim: u = 0", domain.Dirichlet, "0", "0"},
		{"dn(u) = 1", domain.Neumann, "0", "1"},
		{"dn(u) + h*u = h*Tinf", domain.Robin, "h", "Tinf*h"},
		{"-k*dn(u) = hc*(u - T)", domain.Robin, "hc/k", "T*hc/k"},
		{"2u = x", domain.Dirichlet, "0", "1/2*r*cos(theta)"},
	}
	for _, c := range cases {
		cond, err := Condition(c.in, []string{"rim"}, nil)
		if err != nil {
			t.Errorf("%s: %v", c.in, err)
			continue
		}
		if cond.Kind != c.kind || cond.H.Text() != c.h || cond.G.Text() != c.g {
			t.Errorf("%s: got %v h=%s g=%s, want %v h=%s g=%s", c.in, cond.Kind, cond.H.Text(), cond.G.Text(), c.kind, c.h, c.g)
		}
	}
}

// Malformed input is refused with an Error that carries the column.
func TestBadInput(t *testing.T) {
	cases := []struct {
		in  string
		col int
		msg string
	}{
		{"lap(u) = (1 + r", 16, "unexpected"},
		{"lap(u) = sine(r)", 10, "unknown function"},
		{"lap(u) = max(x)", 10, "max takes two arguments"},
		{"lap(u) = min(x, y, 1)", 10, "min takes two arguments"},
		{"lap(u) = max(u, 1)", 14, "may not appear inside max"},
		{"u = 1", 1, "u appears outside lap(u)"},
		{"lap(u) = u", 1, "u appears outside lap(u)"},
		{"r*lap(u) = 1", 1, "must be a constant"},
		{"", 1, "empty input"},
		{"lap(u) = r^100000", 12, "beyond the bound"},
		{"lap(u) = (1+r)^65", 16, "power of an expression that expands"},
		{"lap(u) = x^270", 12, "power of an expression that expands"}, // x = r·cos θ expands into 136 modes
		{"lap(u) = (1+a)^-80", 16, "power of an expression that expands"},
		{"lap(u) = ((2^1000)^1000)^10", 20, "exceed 16384 bits"},          // once ran out of memory under the fuzzer
		{"lap(u) = (a^70)^20", 17, "exponent in the result would exceed"}, // a^1400 would not read back
		{"lap(u) = r^999*r^2", 16, "exponent in the result would exceed"},
		{"lap(u) = A/70000^900/7^700", 22, "quotient would exceed 16384 bits"},           // its print, 1/N*A, did not read back (the fuzzer)
		{"lap(u) = delta(x, y)/70000^900/7^700", 32, "quotient would exceed 16384 bits"}, // nor a point source's strength
		{"lap(u) = 1/700^900 + 700^900", 10, "sum would exceed 16384 bits"},
		{"lap(u) + 1/700^900 = -700^900", 1, "result would exceed 16384 bits"},
		{"lap(u) = 1E0700800", 10, "beyond"}, // a leading 0 is decimal, not octal
		{"lap(v) = dn(u)", 13, "applies to the unknown v only"},
		{"lap(theta) = 1", 1, "cannot be the unknown"},
		{"lap(u) = 1e5000", 10, "beyond"},
		{"lap(u) = 2 $ 3", 12, "unexpected"},
		{"lap(u) = theta < x ? 1 : 0", 18, "compares theta with constants"},
		{"lap(u) = theta < 1 ? 1 : 0", 18, "rational multiples of pi"},
		{"lap(u) = sin", 10, "needs an argument"},
		{"lap(u) = r^", 12, "unexpected end of input"},
		{"lap(u) = 1/0", 12, "division by zero"},
		{"lap(u) = sin(1, 2)", 10, "one argument"},
		{"lap(u) = sum(n=1..inf, n != 5..3, r^n/n^2)", 24, "goes up"},
		{"lap(u)*lap(u) = 1", 8, "linear"},
	}
	for _, c := range cases {
		_, err := Equation(c.in, nil)
		var pe *Error
		if !errors.As(err, &pe) {
			t.Errorf("%q: got %v, want a parse error", c.in, err)
			continue
		}
		msg := pe.Error()
		col := strings.SplitN(msg, ":", 3)[1]
		if !strings.Contains(msg, c.msg) || col != itoa(c.col) || !strings.Contains(msg, "\n    "+c.in+"\n") {
			t.Errorf("%q: message %q, want column %d and %q", c.in, msg, c.col, c.msg)
		}
	}
	if _, err := Condition("inner: u = 0", []string{"rim"}, nil); err == nil || !strings.Contains(err.Error(), `no side "inner"`) {
		t.Errorf("a side the disk lacks: %v", err)
	}
	if _, err := Lengths("--disk", "0", 1, nil); err == nil || !strings.Contains(err.Error(), "positive") {
		t.Errorf("--disk 0: %v", err)
	}
	if _, err := Lengths("--disk", "-1", 1, nil); err == nil || !strings.Contains(err.Error(), "positive") {
		t.Errorf("--disk -1: %v", err)
	}
}

func itoa(n int) string { return big.NewInt(int64(n)).String() }

// randomSum draws sums over the whole term algebra, parameters included.
func randomSum(rng *rand.Rand) series.Sum {
	var ts []series.Term
	for i := rng.Intn(5) + 1; i > 0; i-- {
		c := series.FracCoef(int64(rng.Intn(21)-10), int64(rng.Intn(6)+1))
		switch rng.Intn(6) {
		case 0:
			c = c.Mul(series.SymCoef(series.Param([]string{"a", "mu", "T0", "q"}[rng.Intn(4)])))
		case 1:
			c = c.Mul(series.SymCoef(series.Pi))
		case 2:
			r, _ := series.IntCoef(int64(rng.Intn(5) + 2)).Pow(big.NewRat(1, int64(rng.Intn(2)+2)))
			c = c.Mul(r)
		case 3:
			l, _ := series.IntCoef(int64(rng.Intn(5) + 2)).Ln()
			c = c.Add(l)
		case 4: // a rational function of the parameters, either sign
			d := series.SymCoef(series.Param("a")).Add(series.FracCoef(int64(rng.Intn(7)-3), 2).Mul(series.SymCoef(series.Param("mu"))))
			if q, err := c.Div(d); err == nil {
				c = q
			}
		}
		ts = append(ts, series.Term{C: c, P: big.NewRat(int64(rng.Intn(9)-4), int64(rng.Intn(3)+1)), L: rng.Intn(3), K: rng.Intn(2), M: rng.Intn(5), Sin: rng.Intn(2) == 0})
	}
	return series.NewSum(ts...)
}

// Printed text parses back to an equal value (property test over generated sums).
func TestRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewSource(4))
	for i := 0; i < 500; i++ {
		s := randomSum(rng)
		f, err := Expression("round trip", s.Text(), nil)
		if err != nil {
			t.Fatalf("%s: %v", s.Text(), err)
		}
		if !f.IsExact() || !f.Exact.Equal(s) {
			t.Fatalf("%s parsed back as %s", s.Text(), f.Text())
		}
	}
}

func FuzzParse(f *testing.F) {
	for _, s := range []string{"lap(u) = 6r*sin(theta)", "x^2*y", "-k*lap(u) = q", "dn(u) + h*u = g", "rim: u = 4sin(3theta)", "(a+b)^3/(1+r^2)", "theta < pi ? 1 : 0", "2e5*exp(-r^2)", "∇²u = 1",
		"inner: u = const, flux = 2*pi*a^2", "lap(T) = -q/k", "ΔT = x", "u(0, pi/2) = 1", "0,0 1,0 1/2,sqrt(3)/2", "0,0 a,0\ta,b/2",
		"lap(u) = -Q/T*delta(x - 0.3, y) - N/T", "δ(x + 1/2, y - a)*3 + x", "u = delta(x, y)"} {
		f.Add(s)
	}
	f.Fuzz(fuzzParseOne)
}

// fuzzParseOne is FuzzParse's check of one input.
func fuzzParseOne(t *testing.T, in string) {
	checkScanner(t, in)
	if fld, err := Equation(in, nil); err == nil && fld.IsExact() && len(fld.Text()) <= MaxInput {
		read := func(s string) (series.Field, error) { return Expression("fuzz", s, nil) }
		if len(fld.Points) > 0 { // point sources read back as a source
			read = func(s string) (series.Field, error) { return Equation(s, nil) }
		}
		back, err := read(fld.Text())
		if err != nil || !back.Exact.Equal(fld.Exact) || series.PointsText(back.Points) != series.PointsText(fld.Points) {
			t.Fatalf("%q printed as %q, which parses back as %v (%v)", in, fld.Text(), back.Text(), err)
		}
	}
	// Every refusal is a positioned parse error whose offset lies in the input.
	positioned := func(what string, err error) {
		if err == nil {
			return
		}
		var pe *Error
		if !errors.As(err, &pe) {
			t.Fatalf("%s(%q): %v is not a parse error", what, in, err)
		}
		if pe.Offset < 0 || pe.Offset > len(pe.Input) {
			t.Fatalf("%s(%q): offset %d outside the input", what, in, pe.Offset)
		}
		_ = pe.Error() // the caret line must not panic on any input
	}
	_, err := Condition(in, []string{"rim"}, series.Env{"a": series.IntCoef(2)})
	positioned("Condition", err)
	_, err = ConditionIn(Unknown(in), in, []string{"inner", "outer"}, nil)
	positioned("ConditionIn", err)
	_, _, _, err = Fix(in, nil)
	positioned("Fix", err)
	_, err = Bindings("fuzz", in, nil)
	positioned("Bindings", err)
	_, err = Lengths("--rect", in, 2, nil)
	positioned("Lengths", err)
	_, err = ExpressionIn("T", "--claim", in, nil)
	positioned("Expression", err)
	_, _, offsets, err := Vertices("--polygon", in, nil)
	positioned("Vertices", err)
	for _, o := range offsets {
		if o < 0 || o >= len(in) {
			t.Fatalf("Vertices(%q): vertex offset %d outside the input", in, o)
		}
	}
}

func BenchmarkEquation(b *testing.B) {
	for _, in := range []string{"lap(u) = 6r*sin(theta)", "-k*lap(u) = q*(1 + x^2*y - 3r^(1/2)*cos(2theta) + ln(r))"} {
		b.Run(strings.Fields(in)[0]+"_"+itoa(len(in)), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				if _, err := Equation(in, nil); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// A claim may be written u = formula; other equations are refused with the column.
func TestExpressionEquation(t *testing.T) {
	a, err := Expression("claim", "u = x^2 - y", nil)
	b, err2 := Expression("claim", "x^2 - y", nil)
	if err != nil || err2 != nil || !a.Exact.Equal(b.Exact) {
		t.Errorf("u = x^2 - y read as %v (%v), want %v", a.Text(), err, b.Text())
	}
	for _, c := range []struct{ in, msg string }{
		{"2u = x", "expected a formula, or u = formula"},
		{"u + 1 = x", "expected a formula, or u = formula"},
		{"lap(u) = x", "expected a formula, or u = formula"},
		{"rim: u = 1", "not a boundary condition"},
		{"u = u", "without u"},
	} {
		if _, err := Expression("claim", c.in, nil); err == nil || !strings.Contains(err.Error(), c.msg) {
			t.Errorf("%q: %v, want %q", c.in, err, c.msg)
		}
	}
}

// The caret falls under the offending character on a terminal: control
// characters are shown one cell wide, wide characters take two cells.
func TestCaretColumns(t *testing.T) {
	for _, c := range []struct{ in, quoted, caret string }{
		{"lap(u)\t= 1 $", "lap(u)→= 1 $", "           ^"},
		{"lap(u) = 數 + $", "lap(u) = 數 + $", "              ^"},
		{"lap(u) = 1\n$", "lap(u) = 1↵$", "           ^"},
	} {
		_, err := Equation(c.in, nil)
		if err == nil {
			t.Fatalf("%q parsed", c.in)
		}
		lines := strings.Split(err.Error(), "\n")
		if len(lines) != 3 || lines[1] != "    "+c.quoted || lines[2] != "    "+c.caret {
			t.Errorf("%q:\n%s\nwant the quote %q and the caret %q", c.in, err, c.quoted, c.caret)
		}
	}
}

// Vertices: pairs separated by spaces, each a constant; faults at their column.
func TestVertices(t *testing.T) {
	xs, ys, offs, err := Vertices("--polygon", "0,0  1,0 1/2,sqrt(3)/2", nil)
	if err != nil || len(xs) != 3 || ys[2].Text() != "1/2*sqrt(3)" || offs[1] != 5 || offs[2] != 9 {
		t.Fatalf("got %v %v %v (%v)", xs, ys, offs, err)
	}
	for _, c := range []struct {
		in     string
		offset int
	}{
		{"0,0 1,0", 7},       // two vertices
		{"0,0 1;0 0,1", 4},   // no comma
		{"0,0 1,0,2 0,1", 4}, // three coordinates
		{"0,0 1,x 0,1", 6},   // a variable, not a constant
		{"0,0 1,(2 0,1", 8},  // a parse error inside a coordinate
	} {
		_, _, _, err := Vertices("--polygon", c.in, nil)
		var pe *Error
		if !errors.As(err, &pe) || pe.Offset != c.offset {
			t.Errorf("Vertices(%q): %v, want a parse error at %d", c.in, err, c.offset)
		}
	}
}
