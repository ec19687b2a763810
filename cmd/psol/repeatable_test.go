package main

import (
	"strings"
	"testing"

	"github.com/spf13/pflag"
)

// repeatedValues are the values given to the repeatable flag name of f
// (pflag's GetStringArray reads only its own array flags).
func repeatedValues(f *pflag.FlagSet, name string) []string {
	if fl := f.Lookup(name); fl != nil {
		if r, ok := fl.Value.(repeatable); ok {
			return *r.values
		}
	}
	return nil
}

// A repeatable flag keeps each value whole, commas and all, in the order
// given, and shows no default in help when none is given.
func TestRepeatableFlag(t *testing.T) {
	var bcs []string
	f := pflag.NewFlagSet("t", pflag.ContinueOnError)
	repeatableVar(f, &bcs, "bc", "a condition")
	if usage := f.FlagUsages(); strings.Contains(usage, "default") || !strings.Contains(usage, "--bc stringArray") {
		t.Errorf("help %q: want the array flag's form and no default", usage)
	}
	if err := f.Parse([]string{"--bc", "u = const, flux = 2", "--bc=left: u = 0"}); err != nil {
		t.Fatal(err)
	}
	want := []string{"u = const, flux = 2", "left: u = 0"}
	if got := repeatedValues(f, "bc"); strings.Join(got, "|") != strings.Join(want, "|") || strings.Join(bcs, "|") != strings.Join(want, "|") {
		t.Errorf("values %q (bound %q), want %q", got, bcs, want)
	}
}
