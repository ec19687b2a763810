// Package parse reads psol's input — equations, boundary conditions,
// expressions, parameter bindings and lengths — and lowers it to the values
// of packages series and domain. It is the one place that knows both the
// syntax tree and those values.
//
// The grammar is participle types with the EBNF in grammar.go (pinned by
// testdata/grammar.ebnf), built once, lazily. Lowering (lower.go) makes of
// every node an affine value lap·Δu + dn·∂u/∂n + u·u + f (value.go), so an
// equation and a condition are read by one mechanism; the statement entry
// points are in entry.go and the limits that keep exact arithmetic bounded in
// limits.go. Errors are *Error, with the input and a caret under the column.
package parse
