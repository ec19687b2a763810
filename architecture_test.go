package psol_test

// The architecture test: psol's packages import one way,
//
//	cmd → parse → domain → ansatz → series (and series/cart under series),
//
// and only cmd may reach the CLI and plotting libraries. It reads the import
// graph from `go list -deps -json`, so it checks what the compiler sees, not
// what a comment claims.

import (
	"encoding/json"
	"io"
	"os/exec"
	"strings"
	"testing"
)

// layer is each psol package's place in the one-way order: a package may
// import only packages of a lower layer (or its own subpackages below it).
var layer = map[string]int{
	"psol/series":      0,
	"psol/series/cart": 1,
	"psol/ansatz":      2,
	"psol/domain":      3,
	"psol/parse":       4,
	"psol/cmd/psol":    5,
}

// cmdOnly are module prefixes that only the CLI may import.
var cmdOnly = []string{"github.com/spf13/cobra", "github.com/spf13/pflag", "gonum.org/v1/plot"}

type listed struct {
	ImportPath string
	Imports    []string
	Deps       []string
	Standard   bool
}

func TestImportsRunOneWay(t *testing.T) {
	out, err := exec.Command("go", "list", "-deps", "-json", "./...").Output()
	if err != nil {
		t.Fatalf("go list: %v", err)
	}
	dec := json.NewDecoder(strings.NewReader(string(out)))
	seen := 0
	for {
		var p listed
		if err := dec.Decode(&p); err == io.EOF {
			break
		} else if err != nil {
			t.Fatal(err)
		}
		if !strings.HasPrefix(p.ImportPath, "psol/") {
			continue // the standard library, dependencies, and this test's own root package
		}
		from, ok := layer[p.ImportPath]
		if !ok {
			t.Errorf("package %s has no place in the import order; add it to layer", p.ImportPath)
			continue
		}
		seen++
		for _, imp := range p.Imports {
			if to, ok := layer[imp]; ok && to >= from {
				t.Errorf("%s imports %s against the one-way order", p.ImportPath, imp)
			}
		}
		if p.ImportPath == "psol/cmd/psol" {
			continue
		}
		for _, dep := range p.Deps {
			for _, banned := range cmdOnly {
				if strings.HasPrefix(dep, banned) {
					t.Errorf("%s depends on %s, which only cmd may use", p.ImportPath, dep)
				}
			}
		}
	}
	if seen != len(layer) {
		t.Errorf("go list showed %d of psol's %d packages", seen, len(layer))
	}
}
