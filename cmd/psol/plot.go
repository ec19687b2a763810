package main

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/palette/moreland"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"

	"psol/domain"
	"psol/series"
)

// plotPalette is psol's own ramp, from deep blue-green through olive to a
// pale sand; its luminance rises throughout, so it reads in greyscale too.
func plotPalette() palette.ColorMap {
	cm, err := moreland.NewLuminance([]color.Color{
		color.NRGBA{R: 24, G: 40, B: 72, A: 255},
		color.NRGBA{R: 30, G: 110, B: 110, A: 255},
		color.NRGBA{R: 140, G: 170, B: 70, A: 255},
		color.NRGBA{R: 246, G: 236, B: 196, A: 255},
	})
	if err != nil {
		panic("psol: palette: " + err.Error()) // fixed controls: cannot fail
	}
	return cm
}

// field is u on a Cartesian grid, NaN outside the domain.
type field struct {
	x0, y0, dx, dy float64
	nx, ny         int
	z              []float64
	min, max       float64
}

func (f *field) Dims() (c, r int)   { return f.nx, f.ny }
func (f *field) Z(c, r int) float64 { return f.z[r*f.nx+c] }
func (f *field) X(c int) float64    { return f.x0 + f.dx*float64(c) }
func (f *field) Y(r int) float64    { return f.y0 + f.dy*float64(r) }
func (f *field) Min() float64       { return f.min }
func (f *field) Max() float64       { return f.max }

// bounds is the region's bounding box (a window around an unbounded one)
// and its sides as polylines.
func bounds(d domain.Domain, env series.Env) (x0, x1, y0, y1 float64, edges [][][2]float64, err error) {
	shape, err := d.Shape(env)
	if err != nil {
		return 0, 0, 0, 0, nil, err
	}
	b := shape.Box
	return b.X0, b.X1, b.Y0, b.Y1, shape.Outline(200), nil
}

// polarSampler evaluates u on nr + 1 rings from rlo to rhi, nt angles each
// (Grid, which takes a ring's modes once), and returns its bilinear
// interpolant in r (clamped to the rings) and θ (periodic): plenty for a
// picture of a solution whose numeric part costs a set of modes per radius.
func polarSampler(ev *domain.Evaluator, rlo, rhi float64, nr, nt int) func(r, th float64) float64 {
	rs, ths := make([]float64, nr+1), make([]float64, nt)
	for i := range rs {
		rs[i] = rlo + (rhi-rlo)*float64(i)/float64(nr)
	}
	for j := range ths {
		ths[j] = 2 * math.Pi * float64(j) / float64(nt)
	}
	u, _ := ev.Grid(rs, ths)
	return func(r, th float64) float64 {
		a := math.Max(0, math.Min((r-rlo)/(rhi-rlo)*float64(nr), float64(nr)-1e-9))
		b := th / (2 * math.Pi) * float64(nt)
		i, j := int(a), int(b)
		a, b = a-float64(i), b-float64(j)
		j %= nt
		j1 := (j + 1) % nt
		return (1-a)*((1-b)*u[i][j]+b*u[i][j1]) + a*((1-b)*u[i+1][j]+b*u[i+1][j1])
	}
}

// plotSolution draws a filled map of u over the true domain, labelled
// contour lines, the boundary, a colour bar, axes and a title.
func plotSolution(w io.Writer, format string, title, unknown string, sol *domain.Solution, scale *[2]float64) error {
	env := sol.Options.Env
	x0, x1, y0, y1, edges, err := bounds(sol.Domain, env)
	if err != nil {
		return usagef("--plot: %w", err)
	}
	ev, err := sol.Evaluator(domain.PictureTerms)
	if err != nil {
		return usagef("--plot: %w", err)
	}
	const n = 160
	f := &field{x0: x0, y0: y0, dx: (x1 - x0) / (n - 1), dy: (y1 - y0) / (n - 1), nx: n, ny: n, z: make([]float64, n*n), min: math.Inf(1), max: math.Inf(-1)}
	at := func(r, th float64) float64 { u, _, _ := ev.At(r, th); return u }
	if sol.Quadrature != nil { // its modes are per radius: sample rings, interpolate
		if box, err := polarBox(sol.Domain, env); err == nil {
			rlo, rhi := box.RMin, box.RMax
			if math.IsInf(rhi, 1) { // outside a circle: out to the picture's corner
				rhi = math.Hypot(math.Max(-x0, x1), math.Max(-y0, y1))
			}
			at = polarSampler(ev, rlo, rhi, n, 2*n)
		} else {
			// A section's quadrature is about its own centre, not in the
			// plane's rings: each pixel's value from the halved mesh alone
			// (the plot refused these regions).
			at = ev.Value
		}
	}
	sources, err := pointSources(sol)
	if err != nil {
		return usagef("--plot: %w", err)
	}
	// The colour scale leaves out a few cells round each point source, where
	// u grows like a logarithm: those cells take the scale's end colour.
	clip := 3 * math.Max(f.dx, f.dy)
	nearSource := func(x, y float64) bool {
		for _, s := range sources {
			if math.Hypot(x-s[0], y-s[1]) < clip {
				return true
			}
		}
		return false
	}
	inside := domain.InsideXY(sol.Domain, env) // built once: a holed region's Contains rebuilds its holes
	for r := 0; r < n; r++ {
		for c := 0; c < n; c++ {
			x, y := f.X(c), f.Y(r)
			rad, th := math.Hypot(x, y), math.Atan2(y, x)
			if th < 0 {
				th += 2 * math.Pi
			}
			v := math.NaN()
			if inside(x, y) {
				v = at(rad, th)
				if !nearSource(x, y) {
					f.min, f.max = math.Min(f.min, v), math.Max(f.max, v)
				}
			}
			f.z[r*n+c] = v
		}
	}
	if scale != nil { // the user's ends: values beyond take the end colours
		f.min, f.max = scale[0], scale[1]
	}
	for i, v := range f.z {
		if !math.IsNaN(v) {
			f.z[i] = math.Max(f.min, math.Min(f.max, v))
		}
	}
	if !(f.max > f.min) {
		f.max = f.min + 1
	}
	cm := plotPalette()
	cm.SetMin(f.min)
	cm.SetMax(f.max)
	var levels []float64
	for i := 1; i <= 8; i++ {
		levels = append(levels, f.min+(f.max-f.min)*float64(i)/9)
	}
	// Equal scales on both axes, so that the domain keeps its true shape.
	chart := &mapChart{
		title: title, unknown: unknown, f: f, colours: cm, edges: edges, sources: sources,
		lines:     newIsolines(f, levels),
		lineStyle: draw.LineStyle{Color: color.NRGBA{A: 200}, Width: vg.Points(0.6)},
		levels:    levels,
		x0:        x0, x1: x1, y0: y0, y1: y1,
	}
	width, height := chart.size()
	var canvas vg.CanvasWriterTo
	switch format {
	case "svg":
		canvas = vgsvg.New(width, height)
	default:
		canvas = vgimg.PngCanvas{Canvas: vgimg.New(width, height)}
	}
	chart.draw(draw.New(canvas))
	_, err = canvas.WriteTo(w)
	return err
}

// contourLabels puts each level's value beside a grid point where u is
// closest to it, away from the others. A label's box is boxW by boxH in
// data units; its text starts at its point and runs right and up.
func contourLabels(f *field, levels []float64, boxW, boxH float64) []chartLabel {
	var out []chartLabel
	bw := max(int(math.Ceil(boxW/f.dx)), 2)
	bh := max(int(math.Ceil(boxH/f.dy)), 1)
	inside := func(c, r int) bool {
		for _, d := range [][2]int{{0, 0}, {bw, 0}, {0, bh}, {bw, bh}, {bw / 2, bh / 2}, {-1, -1}, {bw + 1, bh + 1}} {
			cc, rr := c+d[0], r+d[1]
			if cc < 0 || rr < 0 || cc >= f.nx || rr >= f.ny || math.IsNaN(f.Z(cc, rr)) {
				return false
			}
		}
		return true
	}
	var placed [][2]int
	clear := func(c, r int) bool {
		for _, p := range placed {
			if abs(c-p[0]) < bw+2 && abs(r-p[1]) < bh+2 {
				return false
			}
		}
		return true
	}
	span := f.max - f.min
	for _, lv := range levels {
		// Candidates: points on the level (to a hundredth of the range),
		// whole box inside the region; the first clear of the labels placed.
		best, bc, br := math.Inf(1), -1, -1
		for r := f.ny / 8; r < 7*f.ny/8; r += 2 {
			for c := 0; c < f.nx; c += 2 {
				z := f.Z(c, r)
				if math.IsNaN(z) || math.Abs(z-lv) > 0.01*span || !inside(c, r) || !clear(c, r) {
					continue
				}
				// Prefer the middle of the map: labels at the edges crowd the boundary.
				d := math.Abs(z-lv)/span + 0.001*math.Hypot(float64(c-f.nx/2), float64(r-f.ny/2))
				if d < best {
					best, bc, br = d, c, r
				}
			}
		}
		if bc < 0 {
			continue // no clear place: drop the label rather than overlap
		}
		placed = append(placed, [2]int{bc, br})
		out = append(out, chartLabel{x: f.X(bc), y: f.Y(br), text: fmt.Sprintf("%.3g", lv)})
	}
	return out
}

func abs(n int) int {
	if n < 0 {
		return -n
	}
	return n
}

// plotFormat picks PNG or SVG from the file name.
func plotFormat(path string) (string, error) {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".png":
		return "png", nil
	case ".svg":
		return "svg", nil
	}
	return "", usagef("--plot %s: the file name must end in .png or .svg", path)
}

// pointSources are the positions of the solution's point sources.
func pointSources(sol *domain.Solution) ([][2]float64, error) {
	if sol.Points == nil {
		return nil, nil
	}
	var out [][2]float64
	for _, p := range sol.Points.Sources {
		x, err := p.X.Float(sol.Options.Env)
		if err != nil {
			return nil, err
		}
		y, err := p.Y.Float(sol.Options.Env)
		if err != nil {
			return nil, err
		}
		out = append(out, [2]float64{x, y})
	}
	return out, nil
}
