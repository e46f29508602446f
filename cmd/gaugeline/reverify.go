package main

import (
	"context"
	"fmt"
	"io"

	"github.com/spf13/cobra"

	"gaugeline/detail/jobfile"
	"gaugeline/detail/qa"
	"gaugeline/rules/units"
)

type reverifyOptions struct {
	measured string
	layer    string
	align    string
	part     string
	position string
	diameter string
	format   string
}

func newReverifyCmd(o *rootOptions) *cobra.Command {
	var ro reverifyOptions
	cmd := command("reverify JOB.yaml --measured FILE",
		"QA: check an as-fabricated part from its measured holes",
		"reverify matches the holes measured on a fabricated part (a CSV of x,y,diameter[,id] or a DXF of\n"+
			"the part) to the design in the job, reports each hole's deviation against the fabrication\n"+
			"tolerance, reclassifies enlarged holes, and recomputes every detailing rule and limit state on\n"+
			"the as-built geometry. A measured file is of one piece (--part): that piece's holes are taken as\n"+
			"measured, the other part's as designed. With member.length the member is the whole member: both\n"+
			"ends' holes, each end checked as built, and the contour's length against member.length. Exit 0 accept (within tolerance and passing), 3 review\n"+
			"(out of tolerance but passing as built: engineer of record), 1 reject (fails as built, or holes\n"+
			"missing), 2 bad input.",
		argsExactly(1, "one job file"),
		func(ctx context.Context, args []string) error {
			return runReverify(ctx, o, ro, args[0], o.stdout)
		})
	f := cmd.Flags()
	f.StringVar(&ro.measured, "measured", "", "measured holes: a .csv (x,y,diameter[,id]) or a .dxf of the part")
	f.StringVar(&ro.layer, "layer", "", "DXF: take the circles on this layer (default: every circle inside the part's contour)")
	f.StringVar(&ro.align, "align", "datum", "datum (trust the file's frame) or best-fit (fit shift and rotation)")
	f.StringVar(&ro.part, "part", "member", "the piece measured, as its CAM file names it: member (the job's frame; the whole member with member.length), plate or far-plate (the plate's frame), splice-1 or splice-2 (a splice plate, both members' groups; plate on a splice job is splice-1), near-end or far-end (one end of the member alone, x from its cut end)")
	f.StringVar(&ro.position, "position", "", "position tolerance, radial (default: the job's tolerance, else 1/16 in or 2 mm)")
	f.StringVar(&ro.diameter, "diameter", "", "diameter tolerance over nominal (default: the job's tolerance, else 1/32 in or 1 mm)")
	formatFlag(cmd, &ro.format)
	return cmd
}

// maxTolerance bounds --position and --diameter (the message says
// 100 mm): a larger tolerance is a typo.
const maxTolerance = 100 * units.Millimetre

func runReverify(_ context.Context, _ *rootOptions, ro reverifyOptions, path string, out io.Writer) error {
	opt, err := reverifyFlags(ro)
	if err != nil {
		return err
	}
	job, err := jobfile.LoadJob(path)
	if err != nil {
		return err
	}
	if err := qa.CheckPart(job, opt.Part); err != nil {
		return err
	}
	if err := toleranceFlags(ro, job.Units, &opt.Tolerance); err != nil {
		return err
	}
	target, err := qa.Prepare(job, opt.Part)
	if err != nil {
		return err
	}
	set, err := qa.LoadMeasured(ro.measured, job, ro.layer)
	if err != nil {
		return err
	}
	ab, err := target.Reverify(set, opt)
	if err != nil {
		return &jobfile.InputError{File: path, Msg: err.Error()}
	}
	if err := writeFormat(out, ro.format, ab.JSON, ab.WriteMarkdown, ab.WriteText); err != nil {
		return err
	}
	if code := ab.Exit(); code != exitOK {
		return exitError{code}
	}
	return nil
}

// reverifyFlags checks the flags that need no job (--format, --measured,
// --align, --part) and returns the options they set.
func reverifyFlags(ro reverifyOptions) (qa.ReverifyOptions, error) {
	var opt qa.ReverifyOptions
	if err := checkFormat(ro.format); err != nil {
		return opt, err
	}
	if ro.measured == "" {
		return opt, usageError{fmt.Errorf("--measured is required: the measured holes as .csv or .dxf")}
	}
	var err error
	if opt.Align, err = qa.ParseAlign(ro.align); err != nil {
		return opt, usageError{fmt.Errorf("--align: %w", err)}
	}
	if opt.Part, err = qa.ParsePart(ro.part); err != nil {
		return opt, usageError{fmt.Errorf("--part: %w", err)}
	}
	return opt, nil
}

// toleranceFlags reads --position and --diameter, lengths in the job's
// units, into tol where they are given.
func toleranceFlags(ro reverifyOptions, sys units.System, tol *jobfile.Tolerance) error {
	for _, t := range []struct {
		flag, val string
		dst       *units.Length
	}{{"position", ro.position, &tol.Position}, {"diameter", ro.diameter, &tol.Diameter}} {
		if t.val == "" {
			continue
		}
		v, err := units.ParseLength(t.val, sys)
		if err != nil || !(v > 0) || v > maxTolerance {
			most := "100 mm"
			if sys == units.US {
				most += " (3.94 in)"
			}
			msg := fmt.Sprintf("want a length above 0 and at most %s, not %s", most, t.val)
			if err != nil {
				msg += " (" + err.Error() + ")"
			}
			return usageError{fmt.Errorf("--%s: %s", t.flag, msg)}
		}
		*t.dst = v
	}
	return nil
}
