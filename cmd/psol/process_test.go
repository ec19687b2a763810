package main

import (
	"bytes"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"syscall"
	"testing"
	"time"
)

// buildPsol builds the command once for the process-level tests.
func buildPsol(t *testing.T) string {
	t.Helper()
	if testing.Short() {
		t.Skip("process-level tests build the binary")
	}
	bin := filepath.Join(t.TempDir(), "psol")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	return bin
}

var nonFinite = regexp.MustCompile(`\b(NaN|[+-]?Inf)\b`)

// TestProcessHostile runs the built binary on generated hostile commands:
// every exit status is one of the documented ones, nothing prints NaN or
// Inf, and a run interrupted while writing a grid leaves no temporary file.
func TestProcessHostile(t *testing.T) {
	bin := buildPsol(t)
	regions := [][]string{{"--disk", "1"}, {"--annulus", "1,2"}, {"--sector", "1,pi/2"}, {"--rect", "2,1"}, {"--outside", "1"}, {"--disk", "1e200"}, {"--rect", "1e-9,1e9"}}
	sources := []string{"lap(u) = 1", "lap(u) = exp(800*x)", "lap(u) = sqrt(x - 2)", "lap(u) = 1/(x - 5)", "lap(u) = ((", "lap(u) = r^999", "lap(u) = abs(abs(x))"}
	extras := [][]string{{"--at", "r=0.5,theta=1e999"}, {"--tol", "0"}, {"--terms", "-3"}, {"--format", "json", "--at", "x=0.5,y=0.25"}, {"--report"}, {"--quantity", "flow"}}
	n := 0
	for i, src := range sources {
		for j, region := range regions {
			extra := extras[(i+j)%len(extras)]
			args := append(append([]string{"solve", src}, region...), "--bc", "u = 0")
			args = append(args, extra...)
			cmd := exec.Command(bin, args...)
			var out, errOut bytes.Buffer
			cmd.Stdout, cmd.Stderr = &out, &errOut
			done := make(chan error, 1)
			if err := cmd.Start(); err != nil {
				t.Fatal(err)
			}
			go func() { done <- cmd.Wait() }()
			var err error
			start := time.Now()
			select {
			case err = <-done:
			case <-time.After(60 * time.Second):
				cmd.Process.Kill()
				t.Fatalf("%v: still running after a minute", args)
			}
			if d := time.Since(start); d > 2*time.Second {
				t.Logf("%v took %v", args, d)
			}
			code := 0
			var exit *exec.ExitError
			if errors.As(err, &exit) {
				code = exit.ExitCode()
			}
			if code < 0 || code > 4 {
				t.Errorf("%v: exit %d, outside the documented 0–4", args, code)
			}
			if strings.Contains(errOut.String(), "internal error") || code == 3 {
				t.Errorf("%v: internal error: %s", args, errOut.String())
			}
			if m := nonFinite.FindString(out.String()); m != "" {
				t.Errorf("%v: prints %s:\n%s", args, m, out.String())
			}
			n++
		}
	}
	t.Logf("%d commands", n)

	// An interrupt during a grid leaves the target as it was and no temporary file.
	dir := t.TempDir()
	target := filepath.Join(dir, "g.csv")
	if err := os.WriteFile(target, []byte("keep"), 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(bin, "solve", "lap(u) = -1", "--rect", "2,1", "--bc", "u = 0", "--grid", "3000", "--csv", target)
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	time.Sleep(700 * time.Millisecond)
	cmd.Process.Signal(syscall.SIGINT)
	cmd.Wait()
	if b, _ := os.ReadFile(target); string(b) != "keep" && !strings.HasPrefix(string(b), "x,y,u,error") {
		t.Errorf("the target holds neither the old nor a whole new grid")
	}
	if names, _ := filepath.Glob(filepath.Join(dir, ".*tmp*")); len(names) > 0 {
		t.Errorf("temporary files left after an interrupt: %v", names)
	}
}
