package main

import (
	"os"
	"runtime/pprof"
)

// startProfile writes a CPU profile to the file PSOL_CPUPROFILE names, for
// contributors timing a whole command (see DEVELOPERS.md); with the variable
// unset it does nothing. The returned function stops the profile.
func startProfile() func() {
	path := os.Getenv("PSOL_CPUPROFILE")
	if path == "" {
		return func() {}
	}
	f, err := os.Create(path)
	if err != nil {
		return func() {}
	}
	if err := pprof.StartCPUProfile(f); err != nil {
		f.Close()
		return func() {}
	}
	return func() {
		pprof.StopCPUProfile()
		f.Close()
	}
}
