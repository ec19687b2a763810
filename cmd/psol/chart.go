package main

import (
	"image"
	"image/color"
	"math"
	"strconv"
	"strings"
	"sync"

	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/font/liberation"
	"gonum.org/v1/plot/palette"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// The map is drawn straight onto a gonum vg canvas, with gonum/plot's
// drawing packages but not its root package: that package parses twelve
// fonts in its init, which every run paid (2–3 ms of a 15 ms one-liner,
// pictures or not). The fonts load here on the first picture.
var chartFonts = sync.OnceValue(func() *font.Cache { return font.NewCache(liberation.Collection()) })

// chartText is the pictures' text style: Liberation Serif at size points.
func chartText(size vg.Length, xa draw.XAlignment, ya draw.YAlignment) draw.TextStyle {
	return draw.TextStyle{
		Color:   color.Black,
		Font:    font.Font{Typeface: "Liberation", Variant: "Serif", Size: size},
		XAlign:  xa,
		YAlign:  ya,
		Handler: text.Plain{Fonts: chartFonts()},
	}
}

// mapChart is one picture: the field as colours, its level lines, the
// region's outline, point sources, contour labels, axes, a colour bar and a title.
type mapChart struct {
	title          string
	unknown        string // the colour bar's name: the equation's unknown
	f              *field
	colours        palette.ColorMap // over [f.min, f.max]
	lines          *isolines
	lineStyle      draw.LineStyle
	edges          [][][2]float64
	sources        [][2]float64
	levels         []float64 // the lines' values, labelled where there is room
	x0, x1, y0, y1 float64   // the window in data units
}

// chartLabel is a text whose lower left corner sits at (x, y) in data units.
type chartLabel struct {
	x, y float64
	text string
}

// The layout: the canvas is chartWidth wide; the map's margins are in
// inches, its ticks in points.
const (
	chartWidth  = 7
	chartLeft   = 0.75 // y ticks, values and name
	chartRight  = 1.3  // the colour bar and its values
	chartBottom = 0.6  // x ticks, values and name
	chartTop    = 0.15 // above the title's lines
	chartMaxMap = 4.6  // the map's largest height
	chartMinH   = 2.6  // the canvas's least height
	chartMinBar = 1.5  // the colour bar's least height
	chartPad    = 5    // points between the map and its axes
	chartMajor  = 5    // a major tick's length in points
	chartMinor  = 2.5
	chartBarW   = 0.3  // the colour bar's width, inches
	chartBarGap = 0.25 // from the map's right margin to the bar, inches
)

// titleLines are the title's lines and their height each.
func (m *mapChart) titleLines() ([]string, vg.Length) {
	return strings.Split(m.title, "\n"), chartText(vg.Points(12), draw.XCenter, draw.YTop).FontExtents().Height
}

// chartMaxAspect is the most one side of the map may exceed the other: a
// thinner region is stretched across, and its axis says by how much.
const chartMaxAspect = 8

// shownSpans are the window's width and height as drawn: the true spans,
// the shorter stretched to 1/chartMaxAspect of the longer if it is less.
func (m *mapChart) shownSpans() (wx, wy float64) {
	wx, wy = m.x1-m.x0, m.y1-m.y0
	return max(wx, wy/chartMaxAspect), max(wy, wx/chartMaxAspect)
}

// size is the canvas: chartWidth wide, and as tall as the map at equal
// scales needs (a wide region takes a short picture), within limits.
func (m *mapChart) size() (w, h vg.Length) {
	lines, lineH := m.titleLines()
	mapW := (chartWidth - chartLeft - chartRight) * vg.Inch
	wx, wy := m.shownSpans()
	mapH := min(mapW*vg.Length(wy/wx), chartMaxMap*vg.Inch)
	h = mapH + (chartBottom+chartTop)*vg.Inch + vg.Length(len(lines))*lineH + vg.Points(6)
	return chartWidth * vg.Inch, max(h, chartMinH*vg.Inch)
}

// draw lays the chart out on c with equal scales on both axes.
func (m *mapChart) draw(c draw.Canvas) {
	titleStyle := chartText(vg.Points(12), draw.XCenter, draw.YTop)
	tickStyle := chartText(vg.Points(10), draw.XCenter, draw.YTop)
	nameStyle := chartText(vg.Points(12), draw.XCenter, draw.YTop)
	titleLines, lineH := m.titleLines()

	// The area left for the map, then the largest rectangle of the
	// window's shape in it, centred.
	left, right := c.Min.X+chartLeft*vg.Inch, c.Max.X-chartRight*vg.Inch
	bottom, top := c.Min.Y+chartBottom*vg.Inch, c.Max.Y-chartTop*vg.Inch-vg.Length(len(titleLines))*lineH-vg.Points(6)
	wx, wy := m.shownSpans()
	s := math.Min(float64(right-left)/wx, float64(top-bottom)/wy)
	mx0 := left + (right-left-vg.Length(s*wx))/2
	my0 := bottom + (top-bottom-vg.Length(s*wy))/2
	// Points a data unit along each axis: equal unless stretched.
	sx, sy := s*wx/(m.x1-m.x0), s*wy/(m.y1-m.y0)
	at := func(x, y float64) vg.Point {
		return vg.Point{X: mx0 + vg.Length(sx*(x-m.x0)), Y: my0 + vg.Length(sy*(y-m.y0))}
	}
	xName, yName := axisName("x", sx/s), axisName("y", sy/s)
	mapMin, mapMax := at(m.x0, m.y0), at(m.x1, m.y1)

	// The field, one pixel a grid point, each point the centre of its cell.
	f := m.f
	img := image.NewNRGBA(image.Rect(0, 0, f.nx, f.ny))
	for r := 0; r < f.ny; r++ {
		for col := 0; col < f.nx; col++ {
			if z := f.Z(col, r); !math.IsNaN(z) {
				img.Set(col, f.ny-1-r, m.colour(z))
			}
		}
	}
	c.DrawImage(vg.Rectangle{
		Min: at(f.X(0)-f.dx/2, f.Y(0)-f.dy/2),
		Max: at(f.X(f.nx-1)+f.dx/2, f.Y(f.ny-1)+f.dy/2),
	}, img)

	c.SetLineStyle(m.lineStyle)
	for _, sg := range m.lines.segs {
		c.Stroke(vg.Path{{Type: vg.MoveComp, Pos: at(sg[0], sg[1])}, {Type: vg.LineComp, Pos: at(sg[2], sg[3])}})
	}
	edge := draw.LineStyle{Color: color.Black, Width: vg.Points(1.5)}
	for _, e := range m.edges {
		pts := make([]vg.Point, len(e))
		for i, p := range e {
			pts[i] = at(p[0], p[1])
		}
		c.StrokeLines(edge, pts)
	}
	cross := draw.GlyphStyle{Shape: draw.CrossGlyph{}, Radius: vg.Points(4), Color: color.NRGBA{R: 200, A: 255}}
	for _, p := range m.sources {
		c.DrawGlyph(cross, at(p[0], p[1]))
	}
	// The labels' boxes: about 0.45 in by 0.17 in of 10 pt text, in data units.
	labelStyle := chartText(vg.Points(10), draw.XLeft, draw.YBottom)
	for _, l := range contourLabels(f, m.levels, float64(0.45*vg.Inch)/sx, float64(0.17*vg.Inch)/sy) {
		c.FillText(labelStyle, at(l.x, l.y), l.text)
	}

	// Axes, set off from the map by chartPad.
	axis := draw.LineStyle{Color: color.Black, Width: vg.Points(0.5)}
	pad := vg.Points(chartPad)
	yAxis, xAxis := mapMin.X-pad, mapMin.Y-pad
	c.StrokeLine2(axis, mapMin.X, xAxis, mapMax.X, xAxis)
	c.StrokeLine2(axis, yAxis, mapMin.Y, yAxis, mapMax.Y)
	// Ticks about an inch apart; a value that would touch the last one
	// written is left out.
	major, minor := axisTicks(m.x0, m.x1, mapMax.X-mapMin.X)
	for _, v := range minor {
		x := at(v, 0).X
		c.StrokeLine2(axis, x, xAxis, x, xAxis-vg.Points(chartMinor))
	}
	last := vg.Length(math.Inf(-1))
	for _, v := range major {
		x := at(v, 0).X
		c.StrokeLine2(axis, x, xAxis, x, xAxis-vg.Points(chartMajor))
		lbl := tickLabel(v, major)
		if w := tickStyle.Width(lbl); x-w/2 > last+vg.Points(4) {
			c.FillText(tickStyle, vg.Point{X: x, Y: xAxis - vg.Points(chartMajor+2)}, lbl)
			last = x + w/2
		}
	}
	c.FillText(nameStyle, vg.Point{X: (mapMin.X + mapMax.X) / 2, Y: xAxis - vg.Points(chartMajor+4) - tickStyle.FontExtents().Height}, xName)
	yTick := chartText(vg.Points(10), draw.XRight, draw.YCenter)
	major, minor = axisTicks(m.y0, m.y1, mapMax.Y-mapMin.Y)
	for _, v := range minor {
		y := at(0, v).Y
		c.StrokeLine2(axis, yAxis, y, yAxis-vg.Points(chartMinor), y)
	}
	widest, last, textH := vg.Length(0), vg.Length(math.Inf(-1)), yTick.FontExtents().Height
	for _, v := range major {
		y := at(0, v).Y
		c.StrokeLine2(axis, yAxis, y, yAxis-vg.Points(chartMajor), y)
		if y-last < textH+vg.Points(2) {
			continue
		}
		lbl := tickLabel(v, major)
		widest = max(widest, yTick.Width(lbl))
		c.FillText(yTick, vg.Point{X: yAxis - vg.Points(chartMajor+2), Y: y}, lbl)
		last = y
	}
	// The name turned a quarter, centred half its height left of the values.
	yStyle := chartText(vg.Points(12), draw.XCenter, draw.YCenter)
	yStyle.Rotation = math.Pi / 2
	c.FillText(yStyle, vg.Point{X: yAxis - vg.Points(chartMajor+6) - widest - yStyle.FontExtents().Height/2, Y: (mapMin.Y + mapMax.Y) / 2}, yName)

	// The title, centred over the map.
	for i, line := range titleLines {
		c.FillText(titleStyle, vg.Point{X: (mapMin.X + mapMax.X) / 2, Y: c.Max.Y - 0.08*vg.Inch - vg.Length(i)*lineH}, line)
	}

	// The colour bar, as tall as the map (but readable beside a thin one),
	// its ticks and values on the right.
	// It starts just right of the map (the map is centred in its area, so
	// a tall region leaves a gap), and its values keep 0.75 in of the canvas.
	bx0 := min(mapMax.X+pad, right) + chartBarGap*vg.Inch
	bx0 = min(bx0, c.Max.X-0.75*vg.Inch-chartBarW*vg.Inch)
	bx1 := bx0 + chartBarW*vg.Inch
	const steps = 255
	bar := image.NewNRGBA(image.Rect(0, 0, 1, steps))
	for i := 0; i < steps; i++ {
		bar.Set(0, steps-1-i, m.colour(f.min+(f.max-f.min)*(float64(i)+0.5)/steps))
	}
	barH := max(mapMax.Y-mapMin.Y, chartMinBar*vg.Inch)
	by0 := (mapMin.Y+mapMax.Y)/2 - barH/2
	by1 := by0 + barH
	c.DrawImage(vg.Rectangle{Min: vg.Point{X: bx0, Y: by0}, Max: vg.Point{X: bx1, Y: by1}}, bar)
	valueStyle := chartText(vg.Points(10), draw.XLeft, draw.YCenter)
	major, _ = axisTicks(f.min, f.max, barH)
	for _, v := range major {
		y := by0 + barH*vg.Length((v-f.min)/(f.max-f.min))
		c.StrokeLine2(axis, bx1, y, bx1+vg.Points(chartMajor), y)
		c.FillText(valueStyle, vg.Point{X: bx1 + vg.Points(chartMajor+2), Y: y}, tickLabel(v, major))
	}
	c.FillText(chartText(vg.Points(12), draw.XCenter, draw.YBottom), vg.Point{X: (bx0 + bx1) / 2, Y: by1 + vg.Points(4)}, m.unknown)
}

// colour is z's colour on the map's scale (clamped to its ends).
func (m *mapChart) colour(z float64) color.Color {
	z = math.Max(m.colours.Min(), math.Min(m.colours.Max(), z))
	c, err := m.colours.At(z)
	if err != nil { // only NaN reaches here, and NaN is not drawn
		return color.Transparent
	}
	return c
}

// axisTicks are niceTicks for an axis length long: about one every
// 0.8 in, at least two.
func axisTicks(lo, hi float64, length vg.Length) (major, minor []float64) {
	for want := max(2, min(6, int(length/(0.8*vg.Inch)+0.5))); ; want *= 2 {
		major, minor = niceTicks(lo, hi, want)
		if len(major) >= 2 || want > 64 {
			return major, minor
		}
	}
}

// axisName is an axis's name, with the stretch if its scale is stretched.
func axisName(name string, stretch float64) string {
	if stretch < 1.001 {
		return name
	}
	return name + " (stretched ×" + strconv.FormatFloat(stretch, 'g', 3, 64) + ")"
}

// niceTicks are the round values in [lo, hi] a step of 1, 2 or 5 times a
// power of ten apart, about want of them, and the minor ticks between them
// (fifths, or quarters of a step of 2).
func niceTicks(lo, hi float64, want int) (major, minor []float64) {
	span := hi - lo
	if !(span > 0) || math.IsInf(span, 0) {
		return []float64{lo}, nil
	}
	raw := span / float64(want)
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	step, parts := 10*mag, 5
	for _, m := range []struct {
		f     float64
		parts int
	}{{1, 5}, {2, 4}, {5, 5}} {
		if m.f*mag >= raw*0.999 {
			step, parts = m.f*mag, m.parts
			break
		}
	}
	sub := step / float64(parts)
	first := math.Ceil(lo/sub - 1e-9)
	for i := first; i*sub <= hi+1e-9*span; i++ {
		v := i * sub
		if math.Abs(v) < 1e-9*span {
			v = 0
		}
		if math.Mod(math.Abs(i), float64(parts)) == 0 {
			major = append(major, v)
		} else {
			minor = append(minor, v)
		}
	}
	return major, minor
}

// tickLabel writes v with as many digits as its neighbours' spacing needs:
// fixed point for everyday sizes, an exponent for very small or large ones.
func tickLabel(v float64, ticks []float64) string {
	if v == 0 {
		return "0"
	}
	step := math.Inf(1)
	for i := 1; i < len(ticks); i++ {
		step = math.Min(step, ticks[i]-ticks[i-1])
	}
	if math.IsInf(step, 1) {
		return strconv.FormatFloat(v, 'g', 4, 64)
	}
	size := 0.0
	for _, t := range ticks {
		size = math.Max(size, math.Abs(t))
	}
	if step >= 1e-3 && size < 1e5 {
		return strconv.FormatFloat(v, 'f', max(0, int(-math.Floor(math.Log10(step)+1e-9))), 64)
	}
	digits := int(math.Floor(math.Log10(size))-math.Floor(math.Log10(step)+1e-9)) + 1
	return strconv.FormatFloat(v, 'g', max(1, digits), 64)
}
