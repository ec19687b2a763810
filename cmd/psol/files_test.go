package main

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A run that fails late (a bad flag found before the work, an output
// directory missing, a point outside) leaves every existing file as it was:
// the outputs are staged and committed only when the whole run succeeds.
func TestLateFailureKeepsFiles(t *testing.T) {
	dir := t.TempDir()
	csv, png := filepath.Join(dir, "out.csv"), filepath.Join(dir, "keep.png")
	for _, p := range []string{csv, png} {
		if err := os.WriteFile(p, []byte("keep"), 0o640); err != nil {
			t.Fatal(err)
		}
	}
	base := []string{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0"}
	for _, extra := range [][]string{
		{"--grid", "5", "--csv", csv, "--quantity", "bogus"},
		{"--grid", "5", "--csv", csv, "--format", "code", "--lang", "cobol"},
		{"--plot", png, "--grid", "5", "--csv", filepath.Join(dir, "nodir", "x.csv")},
		{"--plot", png, "--at", "r=2,theta=0"}, // outside the disk: found after the solve
	} {
		var out, errOut bytes.Buffer
		if code := run(append(append([]string(nil), base...), extra...), &out, &errOut); code == 0 {
			t.Errorf("%v: exit 0, want a failure", extra)
		}
		for _, p := range []string{csv, png} {
			if b, _ := os.ReadFile(p); string(b) != "keep" {
				t.Errorf("%v: %s was replaced", extra, filepath.Base(p))
			}
		}
		if names, _ := filepath.Glob(filepath.Join(dir, ".*tmp*")); len(names) > 0 {
			t.Errorf("%v: temporary files left: %v", extra, names)
		}
		if strings.Contains(errOut.String(), ".tmp") {
			t.Errorf("%v: the message names a temporary file: %s", extra, errOut.String())
		}
	}
	// A successful run replaces the file, keeps its mode, and writes through a link.
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink(csv, link); err != nil {
		t.Fatal(err)
	}
	var out bytes.Buffer
	if code := run(append(base, "--grid", "3", "--csv", link), &out, &out); code != 0 {
		t.Fatalf("exit %d: %s", code, out.String())
	}
	if info, err := os.Lstat(link); err != nil || info.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced by a file")
	}
	info, err := os.Stat(csv)
	if err != nil || info.Mode().Perm() != 0o640 {
		t.Errorf("the target's mode is %v, want 0640 kept", info.Mode().Perm())
	}
	if b, _ := os.ReadFile(csv); !strings.HasPrefix(string(b), "r,theta,x,y,u,error\n") {
		t.Errorf("the target holds %q", b)
	}
}

// failingWriter is stdout on a full disk.
type failingWriter struct{}

func (failingWriter) Write([]byte) (int, error) { return 0, errors.New("no space left on device") }

// An output failure is its own status (4), never bad input.
func TestOutputFailureStatus(t *testing.T) {
	var errOut bytes.Buffer
	for _, args := range [][]string{
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--format", "json"},
		{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0", "--format", "code"},
	} {
		if code := run(args, failingWriter{}, &errOut); code != 4 {
			t.Errorf("%v to a full disk: exit %d, want 4", args, code)
		}
	}
}

// Flags out of range are bad input naming the flag and its range.
func TestFlagRanges(t *testing.T) {
	base := []string{"solve", "lap(u) = 1", "--disk", "1", "--bc", "u = 0"}
	for _, c := range []struct {
		args []string
		want string
	}{
		{[]string{"--tol", "-1"}, "--tol -1: choose a tolerance between 0 and 1"},
		{[]string{"--tol=-1"}, "--tol -1: choose"},
		{[]string{"--terms", "0"}, "--terms 0: choose 1 to"},
		{[]string{"--terms=-1"}, "--terms -1: choose 1 to"},
		{[]string{"--grid=-5", "--csv", "a.csv"}, "--grid -5: choose 2 to 2000"},
		{[]string{"--plot", ""}, "--plot needs a file name"},
		{[]string{"--csv", "", "--grid", "5"}, "--csv needs a file name"},
	} {
		var out, errOut bytes.Buffer
		code := run(append(append([]string(nil), base...), c.args...), &out, &errOut)
		if code != 2 || !strings.Contains(errOut.String(), c.want) {
			t.Errorf("%v: exit %d, %q; want 2 and %q", c.args, code, errOut.String(), c.want)
		}
	}
}
