package psol_test

import (
	"os"
	"strings"
	"testing"
)

// Every deliberate bug of .ci/mutations.txt still applies: the text it
// replaces is in its file. .ci/mutate reports a stale one only when run,
// and three had gone stale unnoticed as the code they mutated moved on
// (each then tested nothing).
func TestMutationsApply(t *testing.T) {
	text, err := os.ReadFile(".ci/mutations.txt")
	if err != nil {
		t.Fatal(err)
	}
	blocks := strings.Split(string(text), "\n## ")[1:]
	if len(blocks) == 0 {
		t.Fatal("no mutations read")
	}
	for _, b := range blocks {
		lines := strings.Split(b, "\n")
		desc, path := lines[0], lines[1]
		old, _, ok := strings.Cut(strings.Join(lines[2:], "\n"), "\n=>\n")
		if !ok {
			t.Errorf("%s: no \"=>\" line", desc)
			continue
		}
		src, err := os.ReadFile(path)
		if err != nil {
			t.Errorf("%s: %v", desc, err)
			continue
		}
		if !strings.Contains(string(src), old) {
			t.Errorf("stale mutation %q: its text is not in %s", desc, path)
		}
	}
}
