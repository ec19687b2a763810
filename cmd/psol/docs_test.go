package main

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// The README's examples are real output: every "$ psol ..." block is rerun.
func TestReadmeExamples(t *testing.T) {
	data, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	blocks := strings.Split(string(data), "```")
	n := 0
	for i := 1; i < len(blocks); i += 2 {
		body := strings.TrimPrefix(blocks[i], "\n")
		if tag, rest, ok := strings.Cut(body, "\n"); ok && tag != "" && !strings.Contains(tag, " ") && strings.HasPrefix(rest, "$ psol ") {
			t.Errorf("README block tagged %q holds a psol example: drop the tag so that the example is checked", tag)
			continue
		}
		if !strings.HasPrefix(body, "$ psol ") {
			continue
		}
		cmdLine, want, _ := strings.Cut(body, "\n")
		if strings.Contains(cmdLine, "--plot") {
			continue // the picture beside it is the output
		}
		got := runLine(t, strings.TrimPrefix(cmdLine, "$ "))
		if i := strings.LastIndex(got, "exit "); i >= 0 && strings.HasSuffix(got, "\n") && !strings.Contains(got[i:len(got)-1], "\n") {
			got = got[:i] // a shell shows no exit line
		}
		if sameOutput(got, want) {
			got = want
		}
		if got != want && *update {
			blocks[i] = "\n" + cmdLine + "\n" + got
		} else if got != want {
			t.Errorf("README example %s\n--- got\n%s--- README\n%s (go test ./cmd/psol -update rewrites it)", cmdLine, got, want)
		}
		n++
	}
	if *update {
		if err := os.WriteFile("../../README.md", []byte(strings.Join(blocks, "```")), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	if n < 4 {
		t.Errorf("found %d README examples, want at least 4", n)
	}
}

// The LaTeX output compiles in a plain amsmath document (skipped without pdflatex).
func TestLaTeXCompiles(t *testing.T) {
	if _, err := exec.LookPath("pdflatex"); err != nil {
		t.Skip("pdflatex not installed (Debian: texlive-latex-base)")
	}
	doc := `\documentclass{article}\usepackage{amsmath}\begin{document}` + "\n"
	for _, c := range []string{
		`psol solve "lap(u) = 6r*sin(theta)" --disk 2 --bc "u = 4sin(3theta)" --format latex`,
		`psol solve "mu*lap(u) = -G + r^2*cos(4theta)" --disk a --bc "u = 0" --format latex`,
		`psol solve "lap(u) = r^(1/2)*cos(theta) + ln(r)" --disk 2 --bc "u = x*y" --format latex`,
		`psol particular "ln(r)" --format latex`,
		`psol solve "lap(u) = -2" --sector 1,3*pi/2 --bc "arc: u = 0" --bc "start: u = 0" --bc "end: u = 0" --format latex`,
		`psol solve "-k*lap(u) = q" --disk 1 --bc "u = theta < pi/2 ? 100 : 20" --format latex`,
		`psol solve "lap(u) = 0" --disk 1 --bc "u = exp(cos(theta))" --format latex`,
		`psol solve "-eps*lap(u) = lam*delta(x - a, y)" --disk R --bc "u = 0" --format latex`,
		`psol solve "lap(u) = -delta(x - 0.5, y - 0.2)" --sector 1,pi/3 --bc "arc: dn(u) = 0" --bc "start: u = 0" --bc "end: u = 0" --format latex`,
		`psol solve "lap(u) = -1" --rect 1,1 --bc "left: u = 0" --bc "right: u = 0" --bc "bottom: u = 0" --bc "top: u = 0" --format latex`,
		`psol solve "lap(u) = abs(y - 0.3)" --disk 1 --bc "u = 0" --format latex`, // hundreds of numeric terms, shortened
	} {
		doc += runLine(t, c)
	}
	// Every LaTeX example of the README.
	readme, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	for _, ln := range strings.Split(string(readme), "\n") {
		if strings.HasPrefix(ln, "$ psol ") && strings.Contains(ln, "--format latex") {
			doc += runLine(t, strings.TrimPrefix(ln, "$ "))
		}
	}
	// Every demo's LaTeX: the formulas between "% psol:" and "% check".
	for _, d := range scenarios {
		on := false
		for _, ln := range strings.SplitAfter(runLine(t, "psol demo "+d.name+" --format latex"), "\n") {
			if strings.HasPrefix(ln, "% psol:") {
				on = true
			}
			if on {
				doc += ln
			}
			if strings.HasPrefix(ln, "% check") {
				on = false
			}
		}
	}
	// Compiled, not held to the width: a series whose general term is one
	// fraction wider than a line (its denominator cannot be broken).
	unchecked := strings.Count(doc, "\n") + 1
	for _, c := range []string{
		`psol solve "lap(u) = x" --sector 2,pi/3 --bc "arc: dn(u) = 0" --bc "start: dn(u) = 0" --bc "end: u = 1" --format latex`,
		`psol solve "lap(u) = 0" --annulus 1,2 --bc "inner: u = abs(sin(theta))" --bc "outer: u = 0" --format latex`,
	} {
		doc += runLine(t, c)
	}
	doc += `\end{document}` + "\n"
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, "t.tex"), []byte(doc), 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command("pdflatex", "-interaction=nonstopmode", "-halt-on-error", "t.tex")
	cmd.Dir = dir
	if out, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("pdflatex: %v\n%s\n%s", err, out, doc)
	}
	// No line past the margin by more than 10 pt (long sums are broken
	// across lines), and nothing undefined.
	log, err := os.ReadFile(filepath.Join(dir, "t.log"))
	if err != nil {
		t.Fatal(err)
	}
	over := regexp.MustCompile(`Overfull \\[hv]box \(([0-9.]+)pt too (wide|high)\)[^\n]*?(line|lines) ([0-9]+)`)
	texLines := strings.Split(doc, "\n")
	for _, m := range over.FindAllStringSubmatch(string(log), -1) {
		n, _ := strconv.Atoi(m[4])
		if pt, _ := strconv.ParseFloat(m[1], 64); pt > 10 && n < unchecked {
			at := "" // the block's widest line: "detected at" names the end of a display
			for k := n - 1; k >= 0 && k < len(texLines); k-- {
				if len(texLines[k]) > len(at) {
					at = texLines[k]
				}
				if strings.HasPrefix(texLines[k], `\begin`) || k < n-40 {
					break
				}
			}
			t.Errorf("pdflatex: %s:\n%s", m[0], at)
		}
	}
	if strings.Contains(string(log), "Undefined control sequence") {
		t.Error("pdflatex: an undefined control sequence")
	}
}

// Every flag that --help lists is documented in the README.
func TestReadmeDocumentsEveryFlag(t *testing.T) {
	data, err := os.ReadFile("../../README.md")
	if err != nil {
		t.Fatal(err)
	}
	flag := regexp.MustCompile(`--[a-z]+`)
	for _, cmd := range []string{"solve", "check", "particular", "demo"} {
		var out bytes.Buffer
		run([]string{cmd, "--help"}, &out, &out)
		for _, f := range flag.FindAllString(out.String(), -1) {
			if f != "--help" && !strings.Contains(string(data), "`"+f) {
				t.Errorf("psol %s --help lists %s, which the README does not document", cmd, f)
			}
		}
	}
}
