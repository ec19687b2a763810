// Package parse reads psol's expressions, equations and boundary conditions and lowers them to series values.
package parse
