package propose

import (
	"gaugeline/detail/jobfile"
	"path/filepath"
	"testing"
)

// benchProposeJobs are the jobs both propose benchmarks run: a US angle to
// an auto-thickness gusset with three diameters and two lines, the
// hand-calculated US flat, the SI double angle in ASD and the staggered
// US flat with two grades.
var benchProposeJobs = []string{"us-angle-brace.yaml", "us-flat-shear.yaml", "si-double-angle-asd.yaml", "us-staggered-flat.yaml"}

func benchPropose(b *testing.B, mode SearchMode) {
	for _, name := range benchProposeJobs {
		job, err := jobfile.LoadJob(filepath.Join("../..", "testdata", "propose", name))
		if err != nil {
			b.Fatal(err)
		}
		b.Run(name, func(b *testing.B) {
			var p *Proposal
			for b.Loop() {
				p, err = Propose(job, ProposeOptions{Mode: mode})
				if err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(p.Evaluated), "checked/op")
			b.ReportMetric(float64(p.Space), "space/op")
		})
	}
}

// BenchmarkProposeFast is the pruned search, without alternatives.
func BenchmarkProposeFast(b *testing.B) { benchPropose(b, Pruned) }

// BenchmarkProposeExhaustive checks every candidate of the same jobs.
func BenchmarkProposeExhaustive(b *testing.B) { benchPropose(b, Exhaustive) }

// BenchmarkProposeRate measures how many candidates a second each search
// gets through: the exhaustive search's candidates of the space (on every
// core) and the pruned search's checks (on one), over the same jobs. The
// default of `propose --max-candidates` rests on it.
func BenchmarkProposeRate(b *testing.B) {
	for _, mode := range []SearchMode{Exhaustive, Pruned} {
		name := map[SearchMode]string{Exhaustive: "exhaustive", Pruned: "pruned"}[mode]
		b.Run(name, func(b *testing.B) {
			var jobs []*jobfile.Job
			for _, f := range benchProposeJobs {
				job, err := jobfile.LoadJob(filepath.Join("../..", "testdata", "propose", f))
				if err != nil {
					b.Fatal(err)
				}
				jobs = append(jobs, job)
			}
			n := 0
			for b.Loop() {
				for _, job := range jobs {
					checks := 0
					p, err := Propose(job, ProposeOptions{Mode: mode, Alternatives: 3, Progress: func(done, _ int) { checks = done }})
					if err != nil {
						b.Fatal(err)
					}
					if mode == Exhaustive {
						n += p.Space
					} else {
						n += checks
					}
				}
			}
			b.ReportMetric(float64(n)/b.Elapsed().Seconds(), "candidates/s")
		})
	}
}
