package main

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"

	"psol/domain"
	"psol/series"
)

// radialRange is the region's range of radii.
func radialRange(d domain.Domain, env series.Env) (lo, hi float64, err error) {
	switch d := d.(type) {
	case domain.Disk:
		hi, err = d.R.Float(env)
	case domain.Sector:
		hi, err = d.R.Float(env)
	case domain.Annulus:
		if lo, err = d.R1.Float(env); err == nil {
			hi, err = d.R2.Float(env)
		}
	case domain.Outside:
		lo, err = d.R.Float(env)
		hi = math.Inf(1)
	default:
		err = fmt.Errorf("no polar range for this region")
	}
	return lo, hi, err
}

// gridAxes is an N×N polar grid over the closed region: r from the inner
// to the outer bound (10R outside a circle), θ over the full turn or the sector.
func gridAxes(d domain.Domain, n int, env series.Env) (rs, ths []float64, err error) {
	rlo, rhi, err := radialRange(d, env)
	if math.IsInf(rhi, 1) { // outside a circle: out to ten radii
		rhi = 10 * rlo
	}
	thi, full := 2*math.Pi, true
	if s, ok := d.(domain.Sector); ok {
		thi, _ = s.Alpha.Float(nil)
		full = false
	}
	for i := 0; i < n; i++ {
		rs = append(rs, rlo+(rhi-rlo)*float64(i)/float64(n-1))
		if full {
			ths = append(ths, thi*float64(i)/float64(n))
		} else {
			ths = append(ths, thi*float64(i)/float64(n-1))
		}
	}
	return rs, ths, err
}

// writeAtomically writes through a temporary file in the target's folder and
// renames it into place only when fill succeeds, so a failed run never
// truncates an existing file.
func writeAtomically(path string, fill func(io.Writer) error) error {
	tmp, err := os.CreateTemp(filepath.Dir(path), "."+filepath.Base(path)+".tmp*")
	if err != nil {
		return err
	}
	defer os.Remove(tmp.Name()) // a no-op after the rename
	bw := bufio.NewWriter(tmp)
	if err := fill(bw); err != nil {
		tmp.Close()
		return err
	}
	if err := bw.Flush(); err != nil {
		tmp.Close()
		return err
	}
	if err := tmp.Close(); err != nil {
		return err
	}
	return os.Rename(tmp.Name(), path)
}

// writeGrid evaluates u on the grid and writes CSV: r,theta,x,y,u,error.
func writeGrid(path string, sol *domain.Solution, env series.Env, n int, tol float64, terms int, progress io.Writer) error {
	ev, err := sol.Compile(env, tol, terms)
	if err != nil {
		return usagef("--grid: %v", err)
	}
	if d, ok := sol.Domain.(domain.Rect); ok {
		return writeRectGrid(path, d, ev, env, n)
	}
	rs, ths, err := gridAxes(sol.Domain, n, env)
	if err != nil {
		return usagef("--grid: %v", err)
	}
	u, errs := ev.Grid(rs, ths)
	return writeAtomically(path, func(w io.Writer) error {
		fmt.Fprintln(w, "r,theta,x,y,u,error")
		var line []byte
		for i, r := range rs {
			for j, th := range ths {
				if r == 0 && j > 0 {
					break // the centre once
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

// writeRectGrid writes u on an N×N Cartesian grid over the rectangle: x,y,u,error.
func writeRectGrid(path string, d domain.Rect, ev *domain.Evaluator, env series.Env, n int) error {
	L, err := d.L.Float(env)
	if err != nil {
		return usagef("--grid: %v", err)
	}
	H, err := d.H.Float(env)
	if err != nil {
		return usagef("--grid: %v", err)
	}
	return writeAtomically(path, func(w io.Writer) error {
		fmt.Fprintln(w, "x,y,u,error")
		var line []byte
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				x, y := L*float64(i)/float64(n-1), H*float64(j)/float64(n-1)
				u, e, _ := ev.At(math.Hypot(x, y), math.Atan2(y, x))
				line = line[:0]
				for k, v := range [4]float64{x, y, u, e} {
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
