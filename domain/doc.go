// Package domain solves for the harmonic part on each region psol knows and checks the assembled solution.
package domain
