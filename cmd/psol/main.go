// Command psol solves Poisson's equation Δu = f on canonical regions in closed form.
package main

import "os"

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }
