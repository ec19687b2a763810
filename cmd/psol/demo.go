package main

import (
	"fmt"
	"io"
	"sort"
	"strings"

	"github.com/spf13/cobra"
)

// scenario is an embedded example of our own, with its physical reading.
type scenario struct {
	name, title, meaning string
	args                 []string
}

const caution = "Caution: an idealised linear model. For design, follow local codes and licensed practice."

var scenarios = []scenario{
	{
		name:  "cable",
		title: "Heated copper cable",
		meaning: "A copper conductor of radius 5 mm carries current that generates q = 2e7 W/m^3 of heat;\n" +
			"k = 400 W/(m K) and the surface is held at 40 C. u is the temperature in C, r in metres.\n" +
			"The peak is at the axis: 40 + q a^2/(4k).",
		args: []string{"solve", "-400*lap(u) = 2e7", "--disk", "0.005", "--bc", "u = 40", "--at", "r=0.0025,theta=0", "--quantity", "peak"},
	},
	{
		name:  "shaft",
		title: "Twisted round shaft (Prandtl stress function)",
		meaning: "Saint-Venant torsion of a round shaft of radius a: the stress function satisfies lap(u) = -2\n" +
			"with u = 0 on the rim; the torsion constant is J = 2 * (area integral of u) = pi a^4/2.",
		args: []string{"solve", "lap(u) = -2", "--disk", "a", "--bc", "u = 0", "--quantity", "torsion"},
	},
	{
		name:  "drum",
		title: "Pressurised drum skin on a warped frame",
		meaning: "A membrane with tension T = 50 N/m under pressure p = 300 Pa, stretched over a circular frame\n" +
			"of radius 0.2 m whose rim is warped by 2 mm in a saddle shape: T lap(w) = -p, w = 0.002 cos(2 theta).\n" +
			"The figure of interest is the sag at the centre, 0.06 m (p a^2/(4T)).",
		args: []string{"solve", "50*lap(u) = -300", "--disk", "0.2", "--bc", "u = 0.002*cos(2theta)", "--at", "x=0,y=0", "--at", "x=0.1,y=0"},
	},
	{
		name:  "sleeve",
		title: "Charged rod inside a grounded sleeve",
		meaning: "The gap between a uniformly charged rod (radius a) and a grounded coaxial sleeve (radius b):\n" +
			"lap(u) = 0 in the gap, Gauss's law fixes the field at the rod, dn(u) = rho*a/(2*eps) there\n" +
			"(outward from the gap is towards the axis), and u = 0 on the sleeve.",
		args: []string{"solve", "lap(u) = 0", "--annulus", "a,b", "--bc", "inner: dn(u) = rho*a/(2*eps)", "--bc", "outer: u = 0"},
	},
	{
		name:  "bracket",
		title: "Twisted bar with a re-entrant corner",
		meaning: "A bar whose section is three quarters of a disk of radius 1 (a 270 degree sector), twisted:\n" +
			"the stress function has lap(u) = -2 and u = 0 on the boundary. The corner exponent 2/3 < 1\n" +
			"says the shear stress is unbounded at the re-entrant corner: real parts need a fillet.",
		args: []string{"solve", "lap(u) = -2", "--sector", "1,3*pi/2", "--bc", "arc: u = 0", "--bc", "start: u = 0", "--bc", "end: u = 0", "--at", "r=0.5,theta=3*pi/4", "--quantity", "torsion"},
	},
	{
		name:  "duct",
		title: "Rectangular air duct in laminar flow",
		meaning: "A 30 cm x 15 cm duct carrying air in fully developed laminar flow: with u the velocity in units\n" +
			"of (-dp/dz) a^2/mu, lap(u) = -1 and u = 0 on the walls; --quantity flow gives the flow rate,\n" +
			"the mean velocity and the friction product fRe that pressure-drop estimates use.",
		args: []string{"solve", "lap(u) = -1", "--rect", "0.3,0.15", "--bc", "left: u = 0", "--bc", "right: u = 0", "--bc", "bottom: u = 0", "--bc", "top: u = 0", "--quantity", "flow"},
	},
	{
		name:  "fin",
		title: "Rectangular cooling fin",
		meaning: "A fin 50 mm long and 10 mm thick, its base held at 100 C, loses heat from its faces and tip to\n" +
			"air at 20 C: lap(u) = 0, u = 100 at the base, dn(u) + (h/k)u = (h/k)*20 elsewhere with h/k = 25 1/m.\n" +
			"The faces are convective (Robin) sides: their series use numeric eigenvalues.",
		args: []string{"solve", "lap(u) = 0", "--rect", "0.05,0.01", "--bc", "left: u = 100", "--bc", "right: dn(u) + 25*u = 500",
			"--bc", "bottom: dn(u) + 25*u = 500", "--bc", "top: dn(u) + 25*u = 500", "--at", "x=0.05,y=0.005", "--at", "x=0.025,y=0.005", "--report"},
	},
	{
		name:  "laser",
		title: "Off-centre laser spot on a cooled disk",
		meaning: "A copper disk of radius 30 mm (k = 400 W/(m K)) absorbs a laser beam 10 mm off its centre,\n" +
			"q = 5e8 exp(-|x - x0|^2/w) W/m^3 with w = 2e-5 m^2, its rim held at 20 C. The Gaussian has no\n" +
			"closed-form particular solution: psol takes it by quadrature and states the error.",
		args: []string{"solve", "-k*lap(u) = q*exp(-((x-0.01)^2 + y^2)/w)", "--disk", "0.03", "--bc", "u = 20", "--let", "k=400,q=5e8,w=2e-5",
			"--at", "x=0.01,y=0", "--at", "x=-0.01,y=0", "--report"},
	},
	{
		name:  "plate",
		title: "Charged disk with a non-uniform charge",
		meaning: "A thin disk of unit radius carries charge density growing to one side, lap(u) = -(1 + x),\n" +
			"with its rim grounded (u = 0). u is the potential in units of rho0 a^2/eps0.",
		args: []string{"solve", "lap(u) = -(1 + x)", "--disk", "1", "--bc", "u = 0", "--steps"},
	}, {
		name:  "hexduct",
		title: "Hexagonal channel of a plate heat exchanger",
		meaning: "Laminar flow in a channel whose section is a regular hexagon of side 4 mm: with u the velocity\n" +
			"in units of (-dp/dz)/mu, lap(u) = -1 and u = 0 on the six walls. The section is not a region\n" +
			"with a series solution: psol fits the harmonic part numerically and prints its accuracy;\n" +
			"fRe, the friction product pressure-drop estimates use, is the figure of interest.",
		args: []string{"solve", "lap(u) = -1", "--polygon", "0.004,0 0.002,0.002*sqrt(3) -0.002,0.002*sqrt(3) -0.004,0 -0.002,-0.002*sqrt(3) 0.002,-0.002*sqrt(3)",
			"--bc", "u = 0", "--quantity", "flow"},
	},
	{
		name:  "lbar",
		title: "Twisted L-shaped bar",
		meaning: "An angle section, legs 40 mm long and 10 mm thick, twisted: the Prandtl stress function has\n" +
			"lap(u) = -2 and u = 0 on the outline. The torsion constant J and the peak shear stress over\n" +
			"G*theta follow; at the re-entrant corner the stress is unbounded in this model (a fillet helps).",
		args: []string{"solve", "lap(u) = -2", "--polygon", "0,0 0.04,0 0.04,0.01 0.01,0.01 0.01,0.04 0,0.04", "--bc", "u = 0", "--quantity", "torsion"},
	},
}

func newDemoCmd() *cobra.Command {
	var format string
	cmd := &cobra.Command{
		Use:   "demo [NAME]",
		Short: "Run the embedded scenarios (all, or the one named)",
		Long:  "Scenarios: " + strings.Join(scenarioNames(), ", "),
		Args:  cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			list := scenarios
			if len(args) == 1 {
				list = nil
				for _, s := range scenarios {
					if s.name == args[0] {
						list = append(list, s)
					}
				}
				if list == nil {
					return usagef("no demo named %q (there are: %s)", args[0], strings.Join(scenarioNames(), ", "))
				}
			}
			if format != "text" {
				if _, ok := renderers[format]; !ok {
					return usagef("--format %q: choose text, latex or json", format)
				}
			}
			return runDemos(cmd.OutOrStdout(), list, format)
		},
	}
	cmd.Flags().StringVar(&format, "format", "text", "output format of each scenario: text, latex or json")
	return cmd
}

func scenarioNames() []string {
	var names []string
	for _, s := range scenarios {
		names = append(names, s.name)
	}
	sort.Strings(names)
	return names
}

func runDemos(w io.Writer, list []scenario, format string) error {
	for i, s := range list {
		if format != "text" {
			s.args = append(append([]string(nil), s.args...), "--format", format)
		}
		if i > 0 {
			fmt.Fprintln(w)
		}
		fmt.Fprintf(w, "== %s: %s\n%s\n\n$ psol %s\n", s.name, s.title, s.meaning, shellQuote(s.args))
		var errb strings.Builder
		if code := run(s.args, w, &errb); code != 0 {
			return fmt.Errorf("demo %s failed: %s", s.name, errb.String())
		}
	}
	fmt.Fprintln(w, "\n"+caution)
	return nil
}

// shellQuote joins args as a shell line a user can paste.
func shellQuote(args []string) string {
	out := make([]string, len(args))
	for i, a := range args {
		if strings.ContainsAny(a, " *()^=;,\"'<>?|&$") {
			a = `"` + strings.ReplaceAll(a, `"`, `\"`) + `"`
		}
		out[i] = a
	}
	return strings.Join(out, " ")
}
