package detail

import (
	"gaugeline/detail/jobfile"
	"path/filepath"
	"testing"
)

// BenchmarkCheck measures a full check (every limit state and detailing
// rule) of a built design: a single angle and a two-line staggered flat.
func BenchmarkCheck(b *testing.B) {
	for _, job := range []string{"us-single-angle.yaml", "us-staggered-flat.yaml"} {
		j, err := jobfile.LoadJob(filepath.Join("..", "testdata", "jobs", job))
		if err != nil {
			b.Fatal(err)
		}
		d, err := Build(j)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(job, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, err := Check(d); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
