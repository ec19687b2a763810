// Package cart is the Cartesian term algebra for rectangles: exact polynomials in x and y, their Laplacian, particular solutions and side traces.
package cart
