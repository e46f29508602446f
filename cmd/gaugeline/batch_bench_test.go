package main

import (
	"context"
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"
)

// SPEC §11: 10,000 jobs through batch (check + propose + DXF) in under a
// minute on 2 cores, with flat memory. The benchmark runs 1,000 by default;
// -batch.jobs=10000 runs the full target once by hand:
//
//	go test ./cmd/gaugeline -run '^$' -bench 'Batch/propose' -benchtime 1x -batch.jobs 10000
var benchJobs = flag.Int("batch.jobs", 1000, "jobs in BenchmarkBatch")

// benchProposeJob is job i of a generated propose batch: four connection
// families of our own invention, both unit systems, the load and member
// varied with i. A few jobs (every 97th) ask for more than the stock can
// give, so the batch also writes infeasible proposals.
func benchProposeJob(i int) string {
	heavy := i%97 == 96
	switch i % 4 {
	case 0: // US single angle to a gusset
		sizes := []string{"L4x4x1/2", "L3-1/2x3-1/2x3/8", "L5x5x1/2", "L4x4x3/8"}
		load := 40 + (i/4)%60
		if heavy {
			load = 400
		}
		return fmt.Sprintf(`mark: UA-%d
units: us
standard: aisc360-22
method: lrfd
load:
  required: %d kip
member:
  shape: angle
  size: %s
  grade: A36
  length: 10 ft
plate:
  kind: gusset
  thickness: auto
  grade: A572-50
  width: 12 in
bolts:
  threads: included
  joint: bearing
stock:
  diameters: [3/4 in, 7/8 in]
  grades: [A325]
  max_lines: 2
  max_per_line: 6
  step: 1/4 in
  thicknesses: [3/8 in, 1/2 in, 5/8 in]
`, i, load, sizes[(i/4)%len(sizes)])
	case 1: // SI double angle either side of a gusset, ASD
		load := 150 + 5*((i/4)%50)
		if heavy {
			load = 5000
		}
		return fmt.Sprintf(`mark: SD-%d
units: si
standard: aisc360-16
method: asd
load:
  required: %d kN
member:
  shape: double-angle
  size: L100x100x10
  grade: A572-50
  length: 3 m
plate:
  kind: gusset
  thickness: auto
  grade: A572-50
  width: 300 mm
bolts:
  threads: included
  joint: bearing
stock:
  diameters: [M20, M22]
  grades: [A325M]
  max_lines: 1
  max_per_line: 6
  step: 5 mm
  thicknesses: [12 mm, 16 mm]
`, i, load)
	case 2: // US flat bar tie to a splice plate
		load := 50 + 2*((i/4)%40)
		if heavy {
			load = 900
		}
		return fmt.Sprintf(`mark: UF-%d
units: us
load:
  required: %d kip
member:
  shape: flat
  width: %d in
  thickness: 3/4 in
  grade: A572-50
  length: 10 ft
plate:
  kind: splice
  thickness: 1 in
  grade: A572-50
  width: 16 in
bolts:
  threads: included
stock:
  diameters: [3/4 in, 7/8 in]
  grades: [A325]
  max_lines: 1
  max_per_line: 10
  step: 1/4 in
`, i, load, 6+(i/4)%3)
	default: // SI flat bar to a gusset
		load := 200 + 10*((i/4)%30)
		if heavy {
			load = 9000
		}
		return fmt.Sprintf(`mark: SF-%d
units: si
load:
  required: %d kN
member:
  shape: flat
  width: 200 mm
  thickness: 20 mm
  grade: A572-50
  length: 3 m
plate:
  thickness: 20 mm
  grade: A572-50
  width: 400 mm
bolts:
  threads: included
stock:
  diameters: [M20, M24]
  grades: [A325M]
  max_lines: 1
  max_per_line: 7
  step: 5 mm
`, i, load)
	}
}

// benchCheckJob is job i of a generated check batch: a full layout, both
// unit systems.
func benchCheckJob(i int) string {
	if i%2 == 0 {
		return fmt.Sprintf(`mark: UC-%d
units: us
load:
  required: %d kip
member:
  shape: angle
  size: L4x4x1/2
  grade: A36
  length: 10 ft
plate:
  thickness: 1/2 in
  grade: A572-50
  width: 12 in
  edge: 1-1/2 in
bolts:
  diameter: 3/4 in
  grade: A325
  per_line: 5
  pitch: 3 in
  end: 1-1/2 in
  gage: 2-1/2 in
`, i, 30+(i/2)%40)
	}
	return fmt.Sprintf(`mark: SC-%d
units: si
standard: aisc360-16
method: asd
load:
  required: %d kN
member:
  shape: double-angle
  size: L100x75x8
  grade: A572-50
  length: 3 m
plate:
  thickness: 12 mm
  grade: A36
  width: 260
  edge: 40
bolts:
  diameter: M20
  grade: A325M
  threads: excluded
  per_line: 3
  pitch: 70
  end: 40
  gage: 55
`, i, 100+(i/2)%150)
}

func writeBenchJobs(b *testing.B, n int, job func(int) string) string {
	b.Helper()
	dir := b.TempDir()
	for i := range n {
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("job-%05d.yaml", i)), []byte(job(i)), 0o644); err != nil {
			b.Fatal(err)
		}
	}
	return dir
}

// peakHeap samples the heap in use every 10 ms until stop is called, and
// returns the largest sample.
func peakHeap() (stop func() uint64) {
	var peak uint64
	done := make(chan struct{})
	var wg sync.WaitGroup
	wg.Go(func() {
		t := time.NewTicker(10 * time.Millisecond)
		defer t.Stop()
		var m runtime.MemStats
		for {
			runtime.ReadMemStats(&m)
			peak = max(peak, m.HeapInuse)
			select {
			case <-done:
				return
			case <-t.C:
			}
		}
	})
	return func() uint64 {
		close(done)
		wg.Wait()
		return peak
	}
}

// peakRSS is the process's peak resident set in KiB (Linux: VmHWM), 0
// when unknown. It covers the job generation too.
func peakRSS() int {
	data, err := os.ReadFile("/proc/self/status")
	if err != nil {
		return 0
	}
	for _, l := range strings.Split(string(data), "\n") {
		if v, ok := strings.CutPrefix(l, "VmHWM:"); ok {
			kb, _ := strconv.Atoi(strings.TrimSuffix(strings.TrimSpace(v), " kB"))
			return kb
		}
	}
	return 0
}

// cpuTime is the process's user + system CPU time so far.
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
}

func BenchmarkBatch(b *testing.B) {
	n := *benchJobs
	for _, bb := range []struct {
		name string
		job  func(int) string
		args []string
	}{
		{"propose+sheets", benchProposeJob, []string{"--propose", "--sheets"}},
		{"check+sheets", benchCheckJob, []string{"--sheets"}},
	} {
		b.Run(bb.name, func(b *testing.B) {
			src := writeBenchJobs(b, n, bb.job)
			o := &rootOptions{stdout: io.Discard, stderr: io.Discard}
			bo := batchOptions{propose: bb.args[0] == "--propose", sheets: true, dxf: "2000", format: "text"}
			var summary strings.Builder
			runtime.GC()
			var cpu time.Duration
			stop := peakHeap()
			for i := 0; i < b.N; i++ {
				b.StopTimer()
				out, err := os.MkdirTemp(b.TempDir(), "out")
				if err != nil {
					b.Fatal(err)
				}
				bo.dir = out
				summary.Reset()
				b.StartTimer()
				cpu0 := cpuTime()
				err = runBatch(context.Background(), o, bo, src, &summary)
				cpu += cpuTime() - cpu0
				if ee, ok := err.(exitError); err != nil && (!ok || ee.code == exitInput) {
					b.Fatalf("batch: %v", err)
				}
				b.StopTimer()
				os.RemoveAll(out)
				b.StartTimer()
			}
			peak := stop()
			b.Logf("%s", strings.SplitN(summary.String(), "\n", 2)[0])
			b.ReportMetric(float64(n*b.N)/b.Elapsed().Seconds(), "jobs/s")
			b.ReportMetric(float64(peak)/(1<<20), "peak-heap-MiB")
			if kb := peakRSS(); kb > 0 {
				b.ReportMetric(float64(kb)/1024, "peak-rss-MiB")
			}
			// CPU time (user + system) per job of runBatch alone, not of
			// making and removing the output folder between iterations:
			// what the machine's other load changes least. On 2 idle cores,
			// wall ≈ this / 2.
			b.ReportMetric(cpu.Seconds()*1e3/float64(n*b.N), "cpu-ms/job")
		})
	}
}
