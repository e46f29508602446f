package main

import (
	"context"
	"fmt"
	"io"

	"github.com/spf13/cobra"

	"gaugeline/detail"
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
	cmd := &cobra.Command{
		Use:   "reverify JOB.yaml --measured FILE",
		Short: "QA: check an as-fabricated part from its measured holes",
		Long: "reverify matches the holes measured on a fabricated part (a CSV of x,y,diameter[,id] or a DXF of\n" +
			"the part) to the design in the job, reports each hole's deviation against the fabrication\n" +
			"tolerance, reclassifies enlarged holes, and recomputes every detailing rule and limit state on\n" +
			"the as-built geometry. A measured file is of one part (--part): that part's holes are taken as\n" +
			"measured, the other part's as designed. Exit 0 accept (within tolerance and passing), 3 review\n" +
			"(out of tolerance but passing as built: engineer of record), 1 reject (fails as built, or holes\n" +
			"missing), 2 bad input.",
		Args: argsExactly(1, "one job file"),
		RunE: func(cmd *cobra.Command, args []string) error {
			return runReverify(cmd.Context(), o, ro, args[0], o.stdout)
		},
	}
	f := cmd.Flags()
	f.StringVar(&ro.measured, "measured", "", "measured holes: a .csv (x,y,diameter[,id]) or a .dxf of the part")
	f.StringVar(&ro.layer, "layer", "", "DXF: take the circles on this layer (default: every circle inside the part's contour)")
	f.StringVar(&ro.align, "align", "datum", "datum (trust the file's frame) or best-fit (fit shift and rotation)")
	f.StringVar(&ro.part, "part", "member", "the part measured: member (job frame, as its CAM file) or plate (the plate's frame, as its CAM file)")
	f.StringVar(&ro.position, "position", "", "position tolerance, radial (default: the job's tolerance, else 1/16 in or 2 mm)")
	f.StringVar(&ro.diameter, "diameter", "", "diameter tolerance over nominal (default: the job's tolerance, else 1/32 in or 1 mm)")
	f.StringVar(&ro.format, "format", "text", "output format: text, json or markdown")
	return cmd
}

// maxTolerance bounds --position and --diameter (the message says
// 100 mm): a larger tolerance is a typo.
const maxTolerance = 100 * units.Millimetre

func runReverify(_ context.Context, _ *rootOptions, ro reverifyOptions, path string, out io.Writer) error {
	switch ro.format {
	case "text", "json", "markdown":
	default:
		return usageError{fmt.Errorf("--format: unknown format %q (want text, json or markdown)", ro.format)}
	}
	if ro.measured == "" {
		return usageError{fmt.Errorf("--measured is required: the measured holes as .csv or .dxf")}
	}
	align, err := qa.ParseAlign(ro.align)
	if err != nil {
		return usageError{fmt.Errorf("--align: %w", err)}
	}
	part, err := qa.ParsePart(ro.part)
	if err != nil {
		return usageError{fmt.Errorf("--part: %w", err)}
	}
	job, err := jobfile.LoadJob(path)
	if err != nil {
		return err
	}
	if part == qa.MeasuredPlate && job.Plate == nil {
		return &jobfile.InputError{File: path, Field: "--part", Msg: "the job has no plate to measure",
			Hint: "--part plate needs the job's plate block; a measured member is --part member"}
	}
	opt := qa.ReverifyOptions{Align: align, Part: part}
	for _, t := range []struct {
		flag, val string
		dst       *units.Length
	}{{"position", ro.position, &opt.Tolerance.Position}, {"diameter", ro.diameter, &opt.Tolerance.Diameter}} {
		if t.val == "" {
			continue
		}
		v, err := units.ParseLength(t.val, job.Units)
		if err != nil || !(v > 0) || v > maxTolerance {
			most := "100 mm"
			if job.Units == units.US {
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
	d, err := detail.Build(job)
	if err != nil {
		return err
	}
	set, err := qa.LoadMeasured(ro.measured, job, ro.layer)
	if err != nil {
		return err
	}
	ab, err := qa.Reverify(d, set, opt)
	if err != nil {
		return &jobfile.InputError{File: path, Msg: err.Error()}
	}
	switch ro.format {
	case "json":
		b, err := ab.JSON()
		if err != nil {
			return err
		}
		if _, err := out.Write(b); err != nil {
			return err
		}
	case "markdown":
		if err := ab.WriteMarkdown(out); err != nil {
			return err
		}
	default:
		if err := ab.WriteText(out); err != nil {
			return err
		}
	}
	if code := ab.Exit(); code != exitOK {
		return exitError{code}
	}
	return nil
}
