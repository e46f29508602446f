package main

import (
	"io"
	"os"
	"sync"
	"time"

	"github.com/schollz/progressbar/v3"
	"golang.org/x/term"
)

// progressBar returns a progress report for a count whose total the first
// report gives (-1: unknown, shown as a spinner with the count): a bar on
// stderr when it is a terminal, nothing otherwise; finish ends the bar and
// clears its line. report may be called from any goroutine.
func progressBar(stderr io.Writer, desc, unit string) (report func(done, total int), finish func()) {
	f, ok := stderr.(*os.File)
	if !ok || !term.IsTerminal(int(f.Fd())) {
		return func(int, int) {}, func() {}
	}
	var mu sync.Mutex
	var bar *progressbar.ProgressBar
	report = func(done, total int) {
		mu.Lock()
		defer mu.Unlock()
		if bar == nil {
			bar = progressbar.NewOptions(total,
				progressbar.OptionSetWriter(f),
				progressbar.OptionSetDescription(desc),
				progressbar.OptionShowCount(),
				progressbar.OptionShowIts(),
				progressbar.OptionSetItsString(unit),
				progressbar.OptionSetPredictTime(total > 0),
				progressbar.OptionThrottle(100*time.Millisecond),
				progressbar.OptionClearOnFinish(),
				progressbar.OptionSetRenderBlankState(true), // shown at once, not after the first throttle
			)
		}
		bar.Set(done)
	}
	finish = func() {
		mu.Lock()
		defer mu.Unlock()
		if bar != nil {
			bar.Finish()
		}
	}
	return report, finish
}
