package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"strconv"

	"psol/domain"
	"psol/series"
)

// polarBox is the region as a box in (r, θ); a region that is none has no polar grid.
func polarBox(d domain.Domain, env series.Env) (*domain.PolarBox, error) {
	shape, err := d.Shape(env)
	if err != nil {
		return nil, err
	}
	if shape.Polar == nil {
		return nil, fmt.Errorf("no polar range for this region")
	}
	return shape.Polar, nil
}

// gridAxes is an N×N polar grid over the closed region: r from the inner
// to the outer bound (10R outside a circle), θ over the full turn or the sector.
func gridAxes(box *domain.PolarBox, n int) (rs, ths []float64) {
	rlo, rhi := box.RMin, box.Reach()
	for i := 0; i < n; i++ {
		rs = append(rs, rlo+(rhi-rlo)*float64(i)/float64(n-1))
		if box.FullTurn {
			ths = append(ths, box.Span*float64(i)/float64(n))
		} else {
			ths = append(ths, box.Span*float64(i)/float64(n-1))
		}
	}
	return rs, ths
}

// writeGrid evaluates u on the grid and writes CSV: r,theta,x,y,u,error.
func writeGrid(files *stagedFiles, path string, sol *domain.Solution, n int, progress io.Writer) error {
	env := sol.Options.Env
	ev, err := sol.Evaluator(sol.Options.Terms)
	if err != nil {
		return usagef("--grid: %w", err)
	}
	shape, err := sol.Domain.Shape(env)
	if err != nil {
		return usagef("--grid: %w", err)
	}
	if shape.Polar == nil {
		return writeCartesianGrid(files, path, shape.Box, domain.InsideXY(sol.Domain, env), ev, n, sol.DataError)
	}
	rs, ths := gridAxes(shape.Polar, n)
	u, errs := ev.Grid(rs, ths)
	return files.stage(path, func(w io.Writer) error {
		fmt.Fprintln(w, "r,theta,x,y,u,error")
		var line []byte
		for i, r := range rs {
			for j, th := range ths {
				if r == 0 && j > 0 {
					break // the centre once
				}
				if math.IsInf(u[i][j], 0) {
					continue // a point source: u is infinite there (its regular part is --at's)
				}
				line = line[:0]
				for k, v := range [6]float64{r, th, r * math.Cos(th), r * math.Sin(th), u[i][j], errs[i][j] + sol.DataError} {
					if k > 0 {
						line = append(line, ',')
					}
					line = strconv.AppendFloat(line, v, 'g', []int{12, 12, 12, 12, 15, 3}[k], 64)
				}
				line = append(line, '\n')
				if _, err := w.Write(line); err != nil {
					return err
				}
			}
			if progress != nil && i%50 == 0 {
				fmt.Fprintf(progress, "\rgrid %3d%%", 100*i/len(rs))
			}
		}
		if progress != nil {
			fmt.Fprint(progress, "\rgrid 100%\n")
		}
		return nil
	})
}

// terminal reports whether w is a terminal, for progress output.
func terminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}

// writeCartesianGrid writes u on an N×N Cartesian grid over the region's box,
// its points in the region: x,y,u,error.
// dataErr, the numeric parts' error (a section's fit residual, by the
// maximum principle a bound inside), joins each point's own, as on the
// polar grid: without it a section's column read 0.
func writeCartesianGrid(files *stagedFiles, path string, box domain.Box, inside func(x, y float64) bool, ev *domain.Evaluator, n int, dataErr float64) error {
	return files.stage(path, func(w io.Writer) error {
		fmt.Fprintln(w, "x,y,u,error")
		var line []byte
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				x, y := box.X0+(box.X1-box.X0)*float64(i)/float64(n-1), box.Y0+(box.Y1-box.Y0)*float64(j)/float64(n-1)
				if !inside(x, y) {
					// The box's points outside the region (an L shape's
					// missing quadrant, an ellipse's corners, a hole): the
					// fit's continuation there is no answer (it read
					// 1.8e13 at an L shape's far corner), and a hole's
					// read NaN.
					continue
				}
				u, e, _ := ev.AtXY(x, y)
				if math.IsInf(u, 0) {
					continue // a point source: u is infinite there (its regular part is --at's)
				}
				line = line[:0]
				for k, v := range [4]float64{x, y, u, e + dataErr} {
					if k > 0 {
						line = append(line, ',')
					}
					line = strconv.AppendFloat(line, v, 'g', []int{12, 12, 15, 3}[k], 64)
				}
				line = append(line, '\n')
				if _, err := w.Write(line); err != nil {
					return err
				}
			}
		}
		return nil
	})
}
