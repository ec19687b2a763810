package main

import (
	"bytes"
	"flag"
	"fmt"
	"math/rand"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the golden testdata files")

// A golden case: a command line, then its expected output indented by a tab
// (stdout, then stderr), then "exit N" when the status is not 0.
type golden struct {
	comment []string
	command string
	output  string
}

func readGolden(t *testing.T, path string) []golden {
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	var cases []golden
	var comment []string
	for _, ln := range strings.Split(strings.TrimRight(string(data), "\n"), "\n") {
		switch {
		case strings.HasPrefix(ln, "\t"):
			if len(cases) == 0 {
				t.Fatalf("%s: output before any command", path)
			}
			cases[len(cases)-1].output += ln[1:] + "\n"
		case strings.HasPrefix(ln, "#") || strings.TrimSpace(ln) == "":
			comment = append(comment, ln)
		default:
			cases = append(cases, golden{comment: comment, command: ln})
			comment = nil
		}
	}
	return cases
}

func runLine(t *testing.T, command string) string {
	args, err := splitShell(command)
	if err != nil {
		t.Fatalf("%s: %v", command, err)
	}
	if len(args) == 0 || args[0] != "psol" {
		t.Fatalf("a golden command starts with psol: %s", command)
	}
	var stdout, stderr bytes.Buffer
	code := run(args[1:], &stdout, &stderr)
	out := stdout.String() + stderr.String()
	if code != 0 {
		out += fmt.Sprintf("exit %d\n", code)
	}
	return out
}

// TestGolden runs every case of testdata/*.txt in-process.
func TestGolden(t *testing.T) {
	files, _ := filepath.Glob("../../testdata/*.txt")
	if len(files) == 0 {
		t.Fatal("no golden files")
	}
	for _, path := range files {
		cases := readGolden(t, path)
		var rewritten strings.Builder
		for _, c := range cases {
			got := runLine(t, c.command)
			if sameOutput(got, c.output) {
				got = c.output // within the numbers' precision: keep the golden as it is
			}
			if !sameOutput(got, c.output) && !*update {
				t.Errorf("%s: %s\n--- got\n%s--- want\n%s", filepath.Base(path), c.command, got, c.output)
			}
			for _, ln := range c.comment {
				rewritten.WriteString(ln + "\n")
			}
			rewritten.WriteString(c.command + "\n")
			for _, ln := range strings.SplitAfter(got, "\n") {
				if ln != "" {
					rewritten.WriteString("\t" + ln)
				}
			}
		}
		if *update {
			if err := os.WriteFile(path, []byte(rewritten.String()), 0o644); err != nil {
				t.Fatal(err)
			}
		}
	}
}

// splitShell splits a command line as a POSIX shell would for the quoting
// the golden files use: single quotes, double quotes with \" and \\, and spaces.
func splitShell(s string) ([]string, error) {
	var args []string
	var cur strings.Builder
	inWord := false
	for i := 0; i < len(s); i++ {
		c := s[i]
		switch {
		case c == ' ' || c == '\t':
			if inWord {
				args = append(args, cur.String())
				cur.Reset()
				inWord = false
			}
		case c == '\'':
			j := strings.IndexByte(s[i+1:], '\'')
			if j < 0 {
				return nil, fmt.Errorf("unclosed single quote")
			}
			cur.WriteString(s[i+1 : i+1+j])
			i += j + 1
			inWord = true
		case c == '"':
			i++
			for ; i < len(s) && s[i] != '"'; i++ {
				if s[i] == '\\' && i+1 < len(s) && (s[i+1] == '"' || s[i+1] == '\\') {
					i++
				}
				cur.WriteByte(s[i])
			}
			if i == len(s) {
				return nil, fmt.Errorf("unclosed double quote")
			}
			inWord = true
		default:
			cur.WriteByte(c)
			inWord = true
		}
	}
	if inWord {
		args = append(args, cur.String())
	}
	return args, nil
}

// Every bad input exits 2 with the input quoted and a caret, and never panics.
func TestBadInputExitCodes(t *testing.T) {
	cases := [][]string{
		{"solve", "lap(u) = (1 + r", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = sine(r)", "--disk", "1", "--bc", "u = 0"},
		{"solve", "3 = 4", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "inner: u = 0"},
		{"solve", "", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = r^100000", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "0", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "-1", "--bc", "u = 0"},
		{"solve", "r*lap(u) = 1", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = "},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "lap(u) = 0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--let", "a="},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--let", "a=r"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--at", "r=2,theta=0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--at", "r=0.5"},
		{"solve", "lap(u) = 2e99999", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 2 $ 3", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1,2", "--bc", "u = 0"},
		{"solve", "lap(u) = dn(u)", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u*u = 0"},
		{"particular", "lap(u) = (x"},
	}
	for _, args := range cases {
		var stdout, stderr bytes.Buffer
		code := run(args, &stdout, &stderr)
		msg := stderr.String()
		if code != 2 || !strings.Contains(msg, "^") || !strings.HasPrefix(msg, "psol: ") {
			t.Errorf("%q: exit %d, stderr %q; want exit 2 and a caret", args, code, msg)
		}
		if stdout.Len() != 0 {
			t.Errorf("%q: wrote %q to stdout on failure", args, stdout.String())
		}
	}
	// Bad input that is not a formula: exit 2 with a plain message.
	for _, args := range [][]string{
		{"solve", "lap(u) = 1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--format", "pdf"},
		{"solve"},
		{"demo", "nosuch"},
		{"nosuch"},
	} {
		var stdout, stderr bytes.Buffer
		if code := run(args, &stdout, &stderr); code != 2 || stderr.Len() == 0 {
			t.Errorf("%q: exit %d, stderr %q; want exit 2 with a message", args, code, stderr.String())
		}
	}
}

func TestUnsolvableExitCode(t *testing.T) {
	for _, args := range [][]string{
		{"solve", "lap(u) = 1/r^2", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = theta", "--disk", "1", "--bc", "u = 0"},
	} {
		var stdout, stderr bytes.Buffer
		if code := run(args, &stdout, &stderr); code != 1 || stderr.Len() == 0 {
			t.Errorf("%q: exit %d, stderr %q; want exit 1 with the reason", args, code, stderr.String())
		}
	}
}

func TestDemosRun(t *testing.T) {
	var stdout, stderr bytes.Buffer
	if code := run([]string{"demo"}, &stdout, &stderr); code != 0 {
		t.Fatalf("demo: exit %d: %s", code, stderr.String())
	}
	out := stdout.String()
	for _, s := range scenarios {
		if !strings.Contains(out, "== "+s.name+":") {
			t.Errorf("demo output lacks %s", s.name)
		}
	}
	if !strings.Contains(out, "licensed practice") {
		t.Error("demo output lacks the caution")
	}
}

var benchArgs = []string{"solve", "lap(u) = 6r*sin(theta) - 2 + x^2*y + ln(r) + r^2*cos(4theta)", "--disk", "2", "--bc", "u = 4sin(3theta) + x*y"}

// BenchmarkSolveInProcess is a five-term closed-form disk problem, from argument text to printed answer.
func BenchmarkSolveInProcess(b *testing.B) {
	b.ReportAllocs()
	var out bytes.Buffer
	for i := 0; i < b.N; i++ {
		out.Reset()
		if code := run(benchArgs, &out, &out); code != 0 {
			b.Fatal(out.String())
		}
	}
}

// BenchmarkCommand runs the built binary, start to answer.
func BenchmarkCommand(b *testing.B) {
	bin := filepath.Join(b.TempDir(), "psol")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		b.Fatalf("build: %v\n%s", err, out)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if out, err := exec.Command(bin, benchArgs...).CombinedOutput(); err != nil {
			b.Fatalf("%v\n%s", err, out)
		}
	}
}

// Random combinations of equations, regions, conditions and options never
// panic, and always end with one of the three exit codes.
func TestNoPanics(t *testing.T) {
	eqs := []string{"lap(u) = 1", "lap(u) = x*y", "lap(u) = theta < pi ? 1 : 0", "lap(u) = exp(x)", "lap(u) = r^(-3)", "lap(u) = ln(r)",
		"lap(u) = sum(n=1..inf, r^n/n^2)", "lap(u) = 1/0", "lap(u) = abs(sin(theta))", "lap(u) = -2", "lap(u) = a*r^(1/2)*cos(2theta)"}
	doms := [][]string{{"--disk", "1"}, {"--annulus", "1,2"}, {"--outside", "1"}, {"--sector", "1,pi/2"}, {"--sector", "1,2*pi"},
		{"--rect", "1,2"}, {"--disk", "a"}, {"--rect", "a,b"}, {"--sector", "a,3*pi/2"}}
	bcs := []string{"u = 0", "dn(u) = 1", "dn(u) + u = x", "u = theta < pi ? 1 : 0", "u = abs(sin(theta))", "u = exp(cos(theta))",
		"dn(u) = 0", "u = 1", "u = y^2", "dn(u) - 2u = 0", "u = a"}
	sides := map[string][]string{"--disk": {"rim"}, "--outside": {"rim"}, "--annulus": {"inner", "outer"}, "--sector": {"arc", "start", "end"}, "--rect": {"left", "right", "bottom", "top"}}
	extras := [][]string{{"--report"}, {"--at", "r=0.5,theta=1"}, {"--format", "json"}, {"--format", "latex"}, {"--format", "code"}, {"--let", "a=2,b=1"}, {"--quantity", "peak"}, {"--steps"}}
	rng := rand.New(rand.NewSource(13))
	for i := 0; i < 150; i++ {
		d := doms[rng.Intn(len(doms))]
		args := []string{"solve", eqs[rng.Intn(len(eqs))], d[0], d[1]}
		for _, s := range sides[d[0]] {
			args = append(args, "--bc", s+": "+bcs[rng.Intn(len(bcs))])
		}
		for _, e := range extras {
			if rng.Intn(4) == 0 {
				args = append(args, e...)
			}
		}
		var out bytes.Buffer
		code := -1
		func() {
			defer func() {
				if r := recover(); r != nil {
					t.Errorf("panic %v for %q", r, args)
				}
			}()
			code = run(args, &out, &out)
		}()
		if code < 0 || code > 2 {
			t.Errorf("%q: exit %d", args, code)
		}
	}
}
