// Package ansatz finds particular solutions of Δu = f term by term, by rules that match the source's form.
package ansatz
