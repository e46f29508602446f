// Command gaugeline checks bolted tension connections against AISC 360
// and turns them into shop drawings. See README.md.
package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"strings"

	"github.com/spf13/cobra"

	"gaugeline/detail"
)

// Exit codes, one table for every command (SPEC §2).
const (
	exitOK     = 0
	exitFail   = 1 // a limit state or detailing rule fails; reverify: reject
	exitInput  = 2 // bad input or usage
	exitReview = 3 // reverify: out of tolerance but still passing
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
	root := newRootCmd(o)
	root.SetArgs(args)
	root.SetOut(stdout)
	root.SetErr(stderr)
	return exitCode(root.ExecuteContext(ctx), stderr)
}

func newRootCmd(o *rootOptions) *cobra.Command {
	root := &cobra.Command{
		Use:   "gaugeline",
		Short: "Bolted tension connections to AISC 360, from layout to shop drawing",
		Long: "gaugeline turns a bolted tension connection (angle, double angle or flat bar to a gusset or\n" +
			"splice plate) into a bolt layout the shop can cut: it checks a layout against every detailing rule\n" +
			"and tension limit state of AISC 360-22 or 360-16 (check), proposes the best compliant one (propose),\n" +
			"draws the DXF cut sheet and CAM files (sheet), writes the calculation (report), re-verifies a\n" +
			"fabricated part from its measured holes (reverify) and runs whole job lists (batch).\n" +
			"Try 'gaugeline demo' for the whole loop on an invented example.\n\n" +
			detail.Caution,
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
	var ie *detail.InputError
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
