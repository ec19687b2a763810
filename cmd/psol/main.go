// Command psol solves Poisson's equation Δu = f on canonical regions in closed form.
package main

import (
	"os"
	"os/signal"
	"syscall"
)

func main() {
	// An interrupt must not leave a half-written temporary file beside a
	// target: remove every staged file, then stop as interrupted runs do.
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, os.Interrupt, syscall.SIGTERM)
	go func() {
		s := <-sig
		removeTemporaries()
		code := 130 // 128 + SIGINT
		if s == syscall.SIGTERM {
			code = 143
		}
		os.Exit(code)
	}()
	stop := startProfile()
	code := run(os.Args[1:], os.Stdout, os.Stderr)
	stop()
	os.Exit(code)
}
