package domain

import (
	"testing"

	"psol/series"
)

// The exact check holds for the rule's images and fails for a wrong one:
// an image at R·a/ρ² instead of R²·a/ρ², or a pair of the wrong sign.
func TestExactImageCheckCatchesWrongImages(t *testing.T) {
	R := series.IntCoef(2)
	disk := Disk{R: R}
	pts := []series.PointSource{{Q: series.IntCoef(1), X: series.FracCoef(1, 2), Y: series.FracCoef(-1, 3)}}
	for _, kind := range []Kind{Dirichlet, Neumann} {
		conds := map[string]Condition{"rim": {Side: "rim", Kind: kind}}
		pp, ok := diskImages(disk, conds, pts)
		if !ok {
			t.Fatal("no disk images")
		}
		if err := harmonicLogs(pp); err != nil {
			t.Fatal(err)
		}
		if err := verifyDisk(disk, conds, pp); err != nil {
			t.Fatalf("%v: the rule's own images fail: %v", kind, err)
		}
		wrong := *pp
		wrong.Logs = append([]PointLog(nil), pp.Logs...)
		img := &wrong.Logs[1]
		img.X, img.Y = img.X.Mul(series.FracCoef(1, 2)), img.Y.Mul(series.FracCoef(1, 2))
		if err := verifyDisk(disk, conds, &wrong); err == nil {
			t.Errorf("%v: an image at R*a/rho^2 passes", kind)
		}
		flipped := *pp
		flipped.Logs = append([]PointLog(nil), pp.Logs...)
		flipped.Logs[1].C = flipped.Logs[1].C.Neg()
		if err := verifyDisk(disk, conds, &flipped); err == nil {
			t.Errorf("%v: an image of the wrong sign passes", kind)
		}
	}
}
