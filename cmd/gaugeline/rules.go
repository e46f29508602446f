package main

import (
	"context"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"

	"gaugeline/rules"
	"gaugeline/rules/units"
)

type rulesOptions struct {
	standard string
	units    string
}

func newRulesCmd(o *rootOptions) *cobra.Command {
	var ro rulesOptions
	cmd := command("rules",
		"Print the rule tables in force for a standard and unit system",
		"",
		argsExactly(0, "no arguments"),
		func(_ context.Context, _ []string) error {
			return runRules(ro, o.stdout)
		})
	cmd.Flags().StringVar(&ro.standard, "standard", "aisc360-22", "edition: "+strings.Join(rules.Names(), " or "))
	cmd.Flags().StringVar(&ro.units, "units", "us", "unit system: us or si")
	return cmd
}

func runRules(ro rulesOptions, out io.Writer) error {
	sys, err := units.ParseSystem(ro.units)
	if err != nil {
		return usageError{fmt.Errorf("--units: %w", err)}
	}
	e, err := rules.Lookup(ro.standard, sys)
	if err != nil {
		return usageError{fmt.Errorf("--standard: %w", err)}
	}
	t := ruleTables{e: e, sys: sys, lb: sys.Labels(), tw: tabwriter.NewWriter(out, 0, 0, 2, ' ', 0)}
	t.holes()
	t.boltGrades()
	t.pretension()
	t.steels()
	t.clearances()
	return t.factors()
}

// clearances prints the entering and tightening clearances gage.workable
// reads (US inch bolts only: SI keeps the common-practice wrench rule).
func (t ruleTables) clearances() {
	if t.sys != units.US {
		return
	}
	tw := t.tw
	fmt.Fprintf(tw, "\nBOLT\tTIGHTENING C1\tENTERING C2\t(%s)\n", rules.ClearanceSource)
	for _, d := range t.e.Diameters() {
		c, err := rules.BoltClearances(d)
		if err != nil {
			continue
		}
		fmt.Fprintf(tw, "%s	%s	%s	\n", t.size(d), t.size(c.Tightening), t.size(c.Entering))
	}
	tw.Flush()
}

// ruleTables prints the tables of an edition in one unit system, one
// block after another, each flushed so its columns are its own.
type ruleTables struct {
	e   *rules.Edition
	sys units.System
	lb  units.Labels
	tw  *tabwriter.Writer
}

// size prints a length: US as the shop reads it, SI in bare mm.
func (t ruleTables) size(l units.Length) string {
	if t.sys == units.US {
		return units.FormatLength(l, units.US, units.Shop)
	}
	return units.FormatLength(l, units.SI, units.Job.Bare())
}

// holes prints the title and, per bolt diameter, the hole sizes, the
// minimum edge distance and its increments (Tables J3.3, J3.4).
func (t ruleTables) holes() {
	e, sys, tw := t.e, t.sys, t.tw
	slot := func(h rules.HoleSize) string { return t.size(h.Width) + " x " + t.size(h.Length) }
	lenUnit := "inches"
	if sys == units.SI {
		lenUnit = "mm"
	}
	fmt.Fprintf(tw, "%s — rule tables in %s units (lengths in %s)\n\n", e.Name(), sys, lenUnit)
	fmt.Fprintf(tw, "BOLT\tSTANDARD\tOVERSIZED\tSHORT SLOT\tLONG SLOT\tMIN EDGE\tC2 OVERSIZED\tC2 SHORT SLOT\tC2 LONG SLOT\t(%s, %s)\n",
		e.Clause("Table J3.3"), e.Clause("Table J3.4"))
	for _, d := range e.Diameters() {
		var h [4]rules.HoleSize
		var c2 [3]units.Length
		for i := range h {
			h[i], _ = e.Hole(d, rules.HoleType(i))
		}
		for i := range c2 {
			c2[i], _ = e.EdgeIncrement(d, rules.HoleType(i+1))
		}
		me, _ := e.MinEdge(d)
		name := t.size(d)
		if sys == units.SI {
			name = fmt.Sprintf("M%g", float64(d))
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\t%s\n", name, t.size(h[0].Width), t.size(h[1].Width), slot(h[2]), slot(h[3]),
			t.size(me), t.size(c2[0]), t.size(c2[1]), t.size(c2[2]))
	}
	tw.Flush()
}

// boltGrades prints the nominal stresses of every bolt grade (Table
// J3.2), then the long-joint reduction.
func (t ruleTables) boltGrades() {
	e, sys, tw := t.e, t.sys, t.tw
	fmt.Fprintf(tw, "\nBOLT GRADE\tGROUP\tFnt %s\tFnv threads included\tFnv threads excluded\t(Table J3.2)\n", t.lb.Stress)
	for _, g := range e.BoltGrades() {
		b, err := e.Bolt(g)
		if err != nil {
			continue
		}
		st := func(s units.Stress) string { return fmt.Sprintf("%g", sys.ToJob(float64(s), units.DimStress)) }
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t\n", g, e.GroupName(b.Group), st(b.Fnt), st(b.FnvN), st(b.FnvX))
	}
	tw.Flush()
	lim, f := e.LongJoint()
	fmt.Fprintf(tw, "long joints: Fnv x %g when the pattern is longer than %s\n", f, t.size(lim)+mmSuffix(sys))
}

// pretension prints the minimum pretension of each high-strength grade
// by diameter ("-" where none is tabulated).
func (t ruleTables) pretension() {
	e, sys, tw := t.e, t.sys, t.tw
	fmt.Fprintf(tw, "\nPRETENSION Tb %s\t", t.lb.Force)
	for _, d := range e.Diameters() {
		fmt.Fprintf(tw, "%s\t", t.size(d))
	}
	fmt.Fprintln(tw)
	for _, g := range e.BoltGrades() {
		b, err := e.Bolt(g)
		if err != nil || b.Group == rules.GroupA307 {
			continue
		}
		fmt.Fprintf(tw, "%s\t", g)
		for _, d := range e.Diameters() {
			tb, err := e.Pretension(b, d)
			if err != nil {
				fmt.Fprintf(tw, "-\t")
				continue
			}
			fmt.Fprintf(tw, "%.0f\t", sys.ToJob(float64(tb), units.DimForce))
		}
		fmt.Fprintln(tw)
	}
	tw.Flush()
}

// steels prints Fy and Fu of every steel grade.
func (t ruleTables) steels() {
	e, sys, tw := t.e, t.sys, t.tw
	fmt.Fprintf(tw, "\nSTEEL\tFy %s\tFu %s\n", t.lb.Stress, t.lb.Stress)
	for _, g := range e.SteelGrades() {
		s, err := e.Steel(g)
		if err != nil {
			continue
		}
		fmt.Fprintf(tw, "%s\t%g\t%g\n", s.Name, sys.ToJob(float64(s.Fy), units.DimStress), sys.ToJob(float64(s.Fu), units.DimStress))
	}
	tw.Flush()
}

// factors prints the slip coefficients and the φ and Ω of the limit
// states, the net-area hole allowance and the splice-plate cap.
func (t ruleTables) factors() error {
	e, sys, tw := t.e, t.sys, t.tw
	std, ovs, lng := e.SlipFactor(rules.Standard, rules.Transverse), e.SlipFactor(rules.Oversized, rules.Transverse), e.SlipFactor(rules.LongSlot, rules.Transverse)
	fmt.Fprintf(tw, "\nslip (%s): mu class A %g, class B %g; Du %g; hf %g (one filler or none), %g (two or more)\n",
		e.Clause("J3.8"), e.Mu(rules.ClassA), e.Mu(rules.ClassB), e.Du(), e.Hf(0), e.Hf(2))
	fmt.Fprintf(tw, "slip phi/Omega: standard %g/%g, oversized or short slot along the load %g/%g, long slot %g/%g\n",
		std.Phi, std.Omega, ovs.Phi, ovs.Omega, lng.Phi, lng.Omega)
	y, r := e.YieldFactor(), e.RuptureFactor()
	fmt.Fprintf(tw, "yielding phi/Omega %g/%g; rupture, block shear, bolt shear, bearing %g/%g\n", y.Phi, y.Omega, r.Phi, r.Omega)
	fmt.Fprintf(tw, "hole width for net area: nominal + %s (B4.3)\n", t.size(e.HoleAllowance())+mmSuffix(sys))
	if c, ok := e.SplicePlateCap(); ok {
		fmt.Fprintf(tw, "splice plates: An <= %g Ag (J4.1(b))\n", c)
	}
	return tw.Flush()
}

// mmSuffix labels SI lengths; US lengths carry their inch marks.
func mmSuffix(sys units.System) string {
	if sys == units.SI {
		return " mm"
	}
	return ""
}
