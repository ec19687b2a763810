//go:build !unix

package main

// umask: systems without one create files as 0644.
func umask() uint32 { return 0o022 }
