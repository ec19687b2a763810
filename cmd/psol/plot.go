package main

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/palette/moreland"
	"gonum.org/v1/plot/plotter"
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
func bounds(d domain.Domain, env series.Env) (x0, x1, y0, y1 float64, edges []plotter.XYs, err error) {
	shape, err := d.Shape(env)
	if err != nil {
		return 0, 0, 0, 0, nil, err
	}
	for _, line := range shape.Outline(200) {
		xy := make(plotter.XYs, len(line))
		for i, p := range line {
			xy[i] = plotter.XY{X: p[0], Y: p[1]}
		}
		edges = append(edges, xy)
	}
	b := shape.Box
	return b.X0, b.X1, b.Y0, b.Y1, edges, nil
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
func plotSolution(w io.Writer, format string, title string, sol *domain.Solution, scale *[2]float64) error {
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
		box, err := polarBox(sol.Domain, env)
		if err != nil {
			return usagef("--plot: %w", err)
		}
		rlo, rhi := box.RMin, box.RMax
		if math.IsInf(rhi, 1) { // outside a circle: out to the picture's corner
			rhi = math.Hypot(math.Max(-x0, x1), math.Max(-y0, y1))
		}
		at = polarSampler(ev, rlo, rhi, n, 2*n)
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
			if math.Hypot(x-s.X, y-s.Y) < clip {
				return true
			}
		}
		return false
	}
	for r := 0; r < n; r++ {
		for c := 0; c < n; c++ {
			x, y := f.X(c), f.Y(r)
			rad, th := math.Hypot(x, y), math.Atan2(y, x)
			if th < 0 {
				th += 2 * math.Pi
			}
			v := math.NaN()
			if in, _ := sol.Domain.Contains(rad, th, env); in {
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
	p := plot.New()
	p.Title.Text = title
	p.X.Label.Text = "x"
	p.Y.Label.Text = "y"
	heat := plotter.NewHeatMap(f, cm.Palette(255))
	heat.NaN = color.Transparent
	heat.Rasterized = true // one image, without seams between the cells
	heat.Min, heat.Max = f.min, f.max
	p.Add(heat)
	var levels []float64
	for i := 1; i <= 8; i++ {
		levels = append(levels, f.min+(f.max-f.min)*float64(i)/9)
	}
	p.Add(newIsolines(f, levels, draw.LineStyle{Color: color.NRGBA{A: 200}, Width: vg.Points(0.6)}))
	for _, e := range edges {
		l, err := plotter.NewLine(e)
		if err != nil {
			return err
		}
		l.Width = vg.Points(1.5)
		p.Add(l)
	}
	if len(sources) > 0 { // each point source marked
		sc, err := plotter.NewScatter(sources)
		if err != nil {
			return err
		}
		sc.GlyphStyle = draw.GlyphStyle{Shape: draw.CrossGlyph{}, Radius: vg.Points(4), Color: color.NRGBA{R: 200, A: 255}}
		p.Add(sc)
	}
	// Equal scales on both axes, so that the domain keeps its true shape.
	if w, h := x1-x0, y1-y0; w > h {
		c := (y0 + y1) / 2
		y0, y1 = c-w/2, c+w/2
	} else {
		c := (x0 + x1) / 2
		x0, x1 = c-h/2, c+h/2
	}
	p.X.Min, p.X.Max, p.Y.Min, p.Y.Max = x0, x1, y0, y1
	// Labels last: their boxes depend on the window's size in data units.
	if labels := contourLabels(f, levels, x1-x0, y1-y0); labels != nil {
		p.Add(labels)
	}
	cb := &plotter.ColorBar{ColorMap: cm, Vertical: true}
	bar2 := plot.New()
	bar2.Add(cb)
	bar2.HideX()
	bar2.Y.Label.Text = "u"

	width, height := 7*vg.Inch, 5.6*vg.Inch
	var canvas vg.CanvasWriterTo
	switch format {
	case "svg":
		canvas = vgsvg.New(width, height)
	default:
		canvas = vgimg.PngCanvas{Canvas: vgimg.New(width, height)}
	}
	dc := draw.New(canvas)
	main := draw.Crop(dc, 0, -1.4*vg.Inch, 0, 0)
	// The colour bar sits inside the canvas, with a margin on the right.
	side := draw.Crop(dc, width-1.45*vg.Inch, -0.3*vg.Inch, 0.45*vg.Inch, -0.6*vg.Inch)
	p.Draw(main)
	bar2.Draw(side)
	_, err = canvas.WriteTo(w)
	return err
}

// plainPalette is a one-colour palette for contour lines.
type plainPalette []color.Color

func (p plainPalette) Colors() []color.Color { return p }

// contourLabels puts each level's value beside a grid point where u is
// closest to it, away from the others.
func contourLabels(f *field, levels []float64, winW, winH float64) *plotter.Labels {
	var xys plotter.XYs
	var texts []string
	// A label's box in cells: about six characters wide and one line tall
	// on the 160-point field (a 10 pt font on a map about 5 inches wide).
	// The text starts at its point and runs right and up from it: about
	// 0.45 in by 0.17 in on a map about 5.3 in by 4.6 in (a 10 pt font),
	// in cells of the field, which covers only part of the window.
	bw := max(int(math.Ceil(0.45/5.3*winW/f.dx)), 2)
	bh := max(int(math.Ceil(0.17/4.6*winH/f.dy)), 1)
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
		xys = append(xys, plotter.XY{X: f.X(bc), Y: f.Y(br)})
		texts = append(texts, fmt.Sprintf("%.3g", lv))
	}
	if len(xys) == 0 {
		return nil
	}
	l, err := plotter.NewLabels(plotter.XYLabels{XYs: xys, Labels: texts})
	if err != nil {
		return nil
	}
	return l
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
func pointSources(sol *domain.Solution) (plotter.XYs, error) {
	if sol.Points == nil {
		return nil, nil
	}
	var out plotter.XYs
	for _, p := range sol.Points.Sources {
		x, err := p.X.Float(sol.Options.Env)
		if err != nil {
			return nil, err
		}
		y, err := p.Y.Float(sol.Options.Env)
		if err != nil {
			return nil, err
		}
		out = append(out, plotter.XY{X: x, Y: y})
	}
	return out, nil
}
