package main

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// A new user's printed report: the demo's calculation page printed to PDF
// by headless Chromium (Debian's chromium, an independent renderer) has
// every page numbered "page N of M" and none blank, read back by
// pdftotext (poppler-utils). Skipped where either is not installed.
func TestPrintedReportPagesNumbered(t *testing.T) {
	chromium, err1 := exec.LookPath("chromium")
	pdftotext, err2 := exec.LookPath("pdftotext")
	if err1 != nil || err2 != nil {
		t.Skip("chromium and pdftotext (Debian: apt-get install chromium poppler-utils) print and read the report")
	}
	out := t.TempDir()
	if r := gaugeline(t, ".", "demo", "-o", out); r.code != 0 {
		t.Fatalf("demo: exit %d %s", r.code, r.stderr)
	}
	for _, mark := range []string{"PR-KB3", "PR-VB2"} {
		page := filepath.Join(out, mark, mark+".html")
		pdf := filepath.Join(t.TempDir(), mark+".pdf")
		cmd := exec.Command(chromium, "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
			"--disable-background-networking", "--disable-component-update", "--disable-sync",
			"--user-data-dir="+t.TempDir(), "--no-pdf-header-footer", "--print-to-pdf="+pdf, "file://"+page)
		if b, err := cmd.CombinedOutput(); err != nil {
			t.Fatalf("chromium: %v\n%s", err, b)
		}
		text, err := exec.Command(pdftotext, "-layout", pdf, "-").Output()
		if err != nil {
			t.Fatalf("pdftotext: %v", err)
		}
		pages := bytes.Split(bytes.TrimRight(text, "\f\n"), []byte("\f"))
		if len(pages) < 2 {
			t.Fatalf("%s: %d pages", mark, len(pages))
		}
		for i, p := range pages {
			s := string(p)
			if want := fmt.Sprintf("page %d of %d", i+1, len(pages)); !strings.Contains(s, want) {
				t.Errorf("%s page %d: no %q", mark, i+1, want)
			}
			if !strings.Contains(s, mark) {
				t.Errorf("%s page %d: no running header with the mark", mark, i+1)
			}
			// a page used: more than its header and footer
			if n := len(strings.Fields(s)); n < 40 {
				t.Errorf("%s page %d holds %d words: a page left nearly blank", mark, i+1, n)
			}
		}
		if os.Getenv("GAUGELINE_KEEP_PDF") != "" {
			t.Logf("%s: %s", mark, pdf)
		}
	}
}
