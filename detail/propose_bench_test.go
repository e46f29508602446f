package detail

import (
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
		job, err := LoadJob(filepath.Join("..", "testdata", "propose", name))
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
