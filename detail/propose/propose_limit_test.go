package propose

import (
	"bytes"
	"errors"
	"fmt"
	"gaugeline/detail/jobfile"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"sync/atomic"
	"testing"
)

// loadProposeJob reads a job of testdata/propose.
func loadProposeJob(t *testing.T, name string) *jobfile.Job {
	t.Helper()
	job, err := jobfile.LoadJob(filepath.Join("../..", "testdata", "propose", name))
	if err != nil {
		t.Fatal(err)
	}
	return job
}

// proposeJSON runs Propose and returns its JSON, failing the test on an
// error or a panic (a caller must not be able to make Propose panic).
func proposeJSON(t *testing.T, job *jobfile.Job, opt ProposeOptions) []byte {
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
	src, err := os.ReadFile(filepath.Join("../..", "testdata", "propose", "us-angle-brace.yaml"))
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
			job, err := jobfile.ParseJob("fine.yaml", []byte(strings.Replace(string(src), "step: 1/4 in", "step: "+c.step, 1)))
			if err != nil {
				// The parser already refuses lengths under 0.001 mm (1e-300 in, 1e-9 in).
				if c.ok || !strings.Contains(err.Error(), "stock.step") {
					t.Fatal(err)
				}
				return
			}
			p, err := Propose(job, ProposeOptions{})
			var ie *jobfile.InputError
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

// progressLog records Progress calls and fails on calls that overlap or
// go backwards.
type progressLog struct {
	t           *testing.T
	busy        atomic.Bool
	calls       int
	done, total int
}

func (l *progressLog) note(done, total int) {
	if !l.busy.CompareAndSwap(false, true) {
		l.t.Error("Progress called from two goroutines at once")
		return
	}
	defer l.busy.Store(false)
	if l.calls > 0 && (done < l.done || total != l.total) {
		l.t.Errorf("Progress(%d, %d) after (%d, %d): want done not decreasing and the same total", done, total, l.done, l.total)
	}
	l.calls++
	l.done, l.total = done, total
}

// TestProposeMaxCandidatesExhaustive: the exhaustive search checks the
// space against the limit before it starts (no Progress, nothing
// checked); within the limit it returns exactly what it returns without
// one, reporting progress up to the space.
func TestProposeMaxCandidatesExhaustive(t *testing.T) {
	job := loadProposeJob(t, "us-angle-brace.yaml")
	p, err := Propose(job, ProposeOptions{}) // the space, as the search counts it
	if err != nil {
		t.Fatal(err)
	}
	log := &progressLog{t: t}
	_, err = Propose(job, ProposeOptions{Mode: Exhaustive, MaxCandidates: 1000, Progress: log.note})
	var le *SearchLimitError
	if !errors.As(err, &le) || le.Mode != Exhaustive || le.Space != p.Space || le.Limit != 1000 || le.Checked != 0 {
		t.Fatalf("error %#v, want a SearchLimitError with space %d and limit 1000", err, p.Space)
	}
	if !strings.Contains(le.Error(), strconv.Itoa(p.Space)) || !strings.Contains(le.Error(), "1000") {
		t.Errorf("%q does not name the space %d and the limit", le.Error(), p.Space)
	}
	if log.calls != 0 {
		t.Errorf("the search ran (%d progress calls) before it was refused", log.calls)
	}

	job = loadProposeJob(t, "us-flat-shear.yaml")
	want := proposeJSON(t, job, ProposeOptions{Mode: Exhaustive, Alternatives: 3})
	space, err := Propose(job, ProposeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	log = &progressLog{t: t}
	got := proposeJSON(t, job, ProposeOptions{Mode: Exhaustive, Alternatives: 3, MaxCandidates: space.Space, Progress: log.note})
	if !bytes.Equal(got, want) {
		t.Errorf("with the limit at the space the proposal differs:\n%s\nwant\n%s", got, want)
	}
	if log.calls == 0 || log.done != space.Space || log.total != space.Space {
		t.Errorf("%d progress calls, last (%d, %d); want the last at (%d, %d)", log.calls, log.done, log.total, space.Space, space.Space)
	}
}

// TestProposeMaxCandidatesPruned: the pruned search cannot know its count
// up front; it stops at the limit, exactly: a limit of the checks it
// needs gives the proposal it gives without a limit, one less stops it.
// The same holds for the checks that explain an infeasible job.
func TestProposeMaxCandidatesPruned(t *testing.T) {
	for _, name := range []string{"us-angle-brace.yaml", "infeasible-bolts.yaml"} {
		t.Run(name, func(t *testing.T) {
			job := loadProposeJob(t, name)
			log := &progressLog{t: t}
			want := proposeJSON(t, job, ProposeOptions{Alternatives: 3, Progress: log.note})
			checks := log.done
			if log.calls != checks || log.total != -1 || checks == 0 {
				t.Fatalf("%d progress calls, last (%d, %d); want one per check, total -1 (unknown)", log.calls, log.done, log.total)
			}
			if got := proposeJSON(t, job, ProposeOptions{Alternatives: 3, MaxCandidates: checks}); !bytes.Equal(got, want) {
				t.Errorf("with the limit at the %d checks needed the proposal differs:\n%s\nwant\n%s", checks, got, want)
			}
			_, err := Propose(job, ProposeOptions{Alternatives: 3, MaxCandidates: checks - 1})
			var le *SearchLimitError
			if !errors.As(err, &le) || le.Mode != Pruned || le.Checked != checks-1 || le.Limit != checks-1 || le.Space == 0 {
				t.Fatalf("limit %d: error %#v, want a SearchLimitError after %d checks", checks-1, err, checks-1)
			}
		})
	}
}

// TestProposeCallbackPanicReachesCaller: a panic in the exhaustive search's
// workers (here in the caller's Progress, which they call) reaches the
// goroutine that called Propose, where a caller can recover it; on a
// worker it would end the process.
func TestProposeCallbackPanicReachesCaller(t *testing.T) {
	job := loadProposeJob(t, "us-flat-shear.yaml")
	var got any
	func() {
		defer func() { got = recover() }()
		Propose(job, ProposeOptions{Mode: Exhaustive, Progress: func(done, _ int) {
			if done > 0 {
				panic("progress: boom")
			}
		}})
	}()
	if got != "progress: boom" {
		t.Errorf("recovered %v, want the callback's panic", got)
	}
}

func TestSaturatingCount(t *testing.T) {
	const m = math.MaxInt
	for _, c := range []struct{ a, b, sum, prod int }{
		{0, 0, 0, 0}, {3, 4, 7, 12}, {m, 0, m, 0}, {m, 1, m, m}, {m - 1, 1, m, m - 1},
		{1 << 32, 1 << 31, 1<<32 + 1<<31, m}, {m / 2, 3, m/2 + 3, m}, {m, m, m, m},
	} {
		if s := addSat(c.a, c.b); s != c.sum {
			t.Errorf("addSat(%d, %d) = %d, want %d", c.a, c.b, s, c.sum)
		}
		if p := mulSat(c.a, c.b); p != c.prod {
			t.Errorf("mulSat(%d, %d) = %d, want %d", c.a, c.b, p, c.prod)
		}
	}
}
