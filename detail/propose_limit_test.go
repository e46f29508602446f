package detail

import (
	"bytes"
	"fmt"
	"math"
	"path/filepath"
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
