package detail

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// loadProposeJob reads a job of testdata/propose.
func loadProposeJob(t *testing.T, name string) *Job {
	t.Helper()
	job, err := LoadJob(filepath.Join("..", "testdata", "propose", name))
	if err != nil {
		t.Fatal(err)
	}
	return job
}

// proposeJSON runs Propose and returns its JSON, failing the test on an
// error or a panic (a caller must not be able to make Propose panic).
func proposeJSON(t *testing.T, job *Job, opt ProposeOptions) []byte {
	t.Helper()
	var p *Proposal
	var err error
	func() {
		defer func() {
			if r := recover(); r != nil {
				err = fmt.Errorf("panic: %v", r)
			}
		}()
		p, err = Propose(job, opt)
	}()
	if err != nil {
		t.Fatalf("Propose(%+v): %v", opt, err)
	}
	b, err := p.JSON(opt.Mode)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// TestProposeHugeAlternatives: asking for more alternatives than an int
// can count past (1 + math.MaxInt overflowed, and the search indexed a
// list at −2⁶³) lists every arrangement, as any count above their number
// does.
func TestProposeHugeAlternatives(t *testing.T) {
	job := loadProposeJob(t, "us-flat-shear.yaml")
	for _, mode := range []SearchMode{Pruned, Exhaustive} {
		// 1000 is more than the job's arrangements (1 diameter, 1 grade,
		// 1 line of at most 10 bolts): every one is listed.
		want := proposeJSON(t, job, ProposeOptions{Mode: mode, Alternatives: 1000})
		for _, n := range []int{math.MaxInt, math.MaxInt - 1} {
			if got := proposeJSON(t, job, ProposeOptions{Mode: mode, Alternatives: n}); !bytes.Equal(got, want) {
				t.Errorf("mode %d, %d alternatives: the proposal differs from 1000 alternatives'", mode, n)
			}
		}
	}
}

// TestProposeStepTooFine: a step so fine that a searched range holds more
// than maxGridValues values is bad input at stock.step. 1e-300 in made
// the grid indexes overflow (the search then found "no candidate fits");
// 1e-9 in tried to list billions of pitches and ran out of memory.
func TestProposeStepTooFine(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("..", "testdata", "propose", "us-angle-brace.yaml"))
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		step string
		ok   bool
	}{
		// The widest range is 4·d = 4 in of the largest bolt (1 in) or
		// the 4 in leg of L4x4x1/2 (catalog): at 1/64 in it holds 256
		// values, at 1/512 in 2048.
		{"1e-300 in", false}, {"1e-9 in", false}, {"1/512 in", false}, {"1/64 in", true},
	} {
		t.Run(c.step, func(t *testing.T) {
			job, err := ParseJob("fine.yaml", []byte(strings.Replace(string(src), "step: 1/4 in", "step: "+c.step, 1)))
			if err != nil {
				t.Fatal(err)
			}
			p, err := Propose(job, ProposeOptions{})
			var ie *InputError
			switch {
			case c.ok && err != nil:
				t.Fatalf("step %s: %v", c.step, err)
			case c.ok && !p.Found():
				t.Fatalf("step %s: nothing found: %s", c.step, p.Summary)
			case !c.ok && (!errors.As(err, &ie) || ie.Field != "stock.step" || !strings.Contains(ie.Msg, "at most 1000")):
				t.Fatalf("step %s: error %v, want bad input at stock.step naming the bound", c.step, err)
			}
		})
	}
}
