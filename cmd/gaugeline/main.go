// Command gaugeline checks bolted tension connections against AISC 360
// and turns them into shop drawings. See README.md.
package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/detail"
	"gaugeline/detail/jobfile"
)

// Exit codes, one table for every command (SPEC §2).
const (
	exitOK     = 0
	exitFail   = 1 // a limit state or detailing rule fails; reverify: reject
	exitInput  = 2 // bad input or usage
	exitReview = 3 // reverify: out of tolerance but still passing
	// exitInternal: gaugeline itself failed (a panic), whatever the input.
	exitInternal = 4
	// exitInterrupted: a batch stopped by SIGINT or SIGTERM; the jobs it
	// started are whole, the others not run (summary.md says which).
	exitInterrupted = 5
)

// exitError carries an exit code for an outcome that is not an error
// message (a failing connection is a result, not an error).
type exitError struct{ code int }

func (e exitError) Error() string { return fmt.Sprintf("exit %d", e.code) }

// usageError is a mistake on the command line.
type usageError struct{ err error }

func (e usageError) Error() string { return e.err.Error() }

type rootOptions struct {
	stdout, stderr io.Writer
}

func main() {
	os.Exit(run(context.Background(), os.Args[1:], os.Stdout, os.Stderr))
}

func run(ctx context.Context, args []string, stdout, stderr io.Writer) int {
	o := &rootOptions{stdout: stdout, stderr: stderr}
	return execute(ctx, newRootCmd(o), args, stdout, stderr)
}

// execute runs the root command and maps its outcome to an exit code. A
// panic is gaugeline's own failure, not the input's: it is reported as an
// internal error with what to send, without the stack trace, and exits
// with its own code.
func execute(ctx context.Context, root *cobra.Command, args []string, stdout, stderr io.Writer) (code int) {
	defer func() {
		if v := recover(); v != nil {
			fmt.Fprintf(stderr, "gaugeline: internal error: %v\n", v)
			fmt.Fprintf(stderr, "gaugeline: hint: this is a fault in gaugeline, not in the input; please report it with the command line (%s), "+
				"the job file and any other file it reads, and gaugeline version %s\n", commandLine(args), version())
			code = exitInternal
		}
	}()
	root.SetArgs(args)
	root.SetOut(stdout)
	root.SetErr(stderr)
	return exitCode(root.ExecuteContext(ctx), stderr)
}

// commandLine writes the arguments as a shell would read them back.
func commandLine(args []string) string {
	q := []string{"gaugeline"}
	for _, a := range args {
		if a == "" || strings.ContainsAny(a, " \t\n\"'\\$`*?[]{}()<>|&;#~") {
			a = strconv.Quote(a)
		}
		q = append(q, a)
	}
	return strings.Join(q, " ")
}

// version is the build's version, commit and Go version, from the build
// information the Go tool embeds: "(devel) commit 1a2b… (modified), go1.26.0".
func version() string {
	bi, ok := debug.ReadBuildInfo()
	if !ok {
		return "unknown (no build information)"
	}
	return versionOf(bi)
}

func versionOf(bi *debug.BuildInfo) string {
	v := bi.Main.Version
	if v == "" {
		v = "(devel)"
	}
	var rev, modified string
	for _, s := range bi.Settings {
		switch s.Key {
		case "vcs.revision":
			rev = s.Value
		case "vcs.modified":
			modified = s.Value
		}
	}
	if rev != "" {
		v += " commit " + rev
		if modified == "true" {
			v += " (modified)"
		}
	}
	return v + ", " + bi.GoVersion
}

func newRootCmd(o *rootOptions) *cobra.Command {
	root := &cobra.Command{
		Use:   "gaugeline",
		Short: "Bolted tension connections to AISC 360, from layout to shop drawing",
		Long: "gaugeline turns a bolted tension connection (angle, double angle, flat bar, WT, channel or W\n" +
			"to a gusset or splice plate) into a bolt layout the shop can cut: it checks a layout against every detailing rule\n" +
			"and tension limit state of AISC 360-22 or 360-16 (check), proposes the best compliant one (propose),\n" +
			"draws the DXF cut sheet and CAM files (sheet), writes the calculation (report), re-verifies a\n" +
			"fabricated part from its measured holes (reverify), runs whole job lists (batch) and checks that an\n" +
			"output folder's file sets are whole and of one run (audit).\n" +
			"Try 'gaugeline demo' for the whole loop on an invented example.\n\n" +
			detail.Caution,
		Version:       version(),
		SilenceErrors: true,
		SilenceUsage:  true,
	}
	root.SetFlagErrorFunc(func(_ *cobra.Command, err error) error { return usageError{err} })
	root.AddCommand(newCheckCmd(o), newProposeCmd(o), newRulesCmd(o), newDemoCmd(o), newSheetCmd(o), newReverifyCmd(o), newBatchCmd(o), newReportCmd(o), newAuditCmd(o))
	return root
}

// exitCode prints an error the way every command does and maps it to the
// exit code table.
func exitCode(err error, stderr io.Writer) int {
	if err == nil {
		return exitOK
	}
	var ee exitError
	if errors.As(err, &ee) {
		return ee.code
	}
	var ie *jobfile.InputError
	if errors.As(err, &ie) {
		fmt.Fprintf(stderr, "gaugeline: error: %s\n", ie.Error())
		if ie.Hint != "" {
			fmt.Fprintf(stderr, "gaugeline: hint: %s\n", ie.Hint)
		}
		return exitInput
	}
	fmt.Fprintf(stderr, "gaugeline: error: %s\n", err)
	var ue usageError
	if errors.As(err, &ue) || isCobraUsage(err) {
		fmt.Fprintf(stderr, "gaugeline: hint: run 'gaugeline help' for usage\n")
	}
	return exitInput
}

// isCobraUsage recognises cobra's own argument errors ("unknown command",
// "accepts 1 arg(s)"), which it returns as plain errors.
func isCobraUsage(err error) bool {
	s := err.Error()
	for _, p := range []string{"unknown command", "accepts ", "requires ", "unknown flag", "unknown shorthand"} {
		if strings.Contains(s, p) {
			return true
		}
	}
	return false
}

// argsExactly is cobra.ExactArgs with an error the exit-code table knows.
func argsExactly(n int, what string) cobra.PositionalArgs {
	return func(_ *cobra.Command, args []string) error {
		if len(args) != n {
			return usageError{fmt.Errorf("want %s, got %d argument(s)", what, len(args))}
		}
		return nil
	}
}

// command is a subcommand: its usage line, its one-line and its long help
// ("" for none), the arguments it takes and what it runs with the
// command's context and those arguments. The constructor adds the flags.
func command(use, short, long string, args cobra.PositionalArgs, run func(ctx context.Context, args []string) error) *cobra.Command {
	return &cobra.Command{Use: use, Short: short, Long: long, Args: args,
		RunE: func(cmd *cobra.Command, args []string) error { return run(cmd.Context(), args) }}
}
