package main

import (
	"bufio"
	"bytes"
	"crypto/sha256"
	"encoding/json"
	"errors"
	"fmt"
	"html"
	"io/fs"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"gaugeline/detail"
	"gaugeline/dxfout"
)

// File sets. Everything gaugeline writes for one mark (its JSON, cut
// sheet, CAM files, report) is one set, kept in its own folder DIR/MARK/
// with a manifest MARK.files. A set is replaced as a whole: it is written
// into a hidden staging folder beside it and swapped in by rename, so that
// whenever a run stops (killed, power cut, full disk) each mark's folder
// holds the old set, the new set, or nothing, never a mixture. Every file
// of a set carries the same stamp (tool version, what made it, the input's
// SHA-256), in the form its format allows, and the manifest lists each
// file's SHA-256; `gaugeline audit DIR` checks both.
//
// Naming is here and nowhere else: a set's folder is its mark, so two
// marks' files can never collide; marks that differ only in case are one
// folder on Windows and macOS and are refused as duplicates by batch.

// manifestExt ends the manifest's name: MARK.files.
const manifestExt = ".files"

// lockName is the lock a run holds on an output folder while it writes.
const lockName = ".gaugeline.lock"

// batchFiles are a batch's own files in the output folder; no mark may
// have their names.
var batchFiles = []string{"summary.csv", "summary.md"}

// stampPrefix starts the stamp line in the formats that take a comment.
const stampPrefix = "gaugeline stamp: "

// fileSet is one mark's files, written together.
type fileSet struct {
	name  string // the mark: the set's folder and the manifest's name
	stamp string
	files []dxfout.File // names inside the set's folder
}

// toolVersion names this build in a stamp: "gaugeline " and version().
func toolVersion() string { return "gaugeline " + version() }

// stampFor is the stamp of a set made by mode ("check", "propose") from
// the job's file.
func stampFor(mode string, job *detail.Job) string {
	return fmt.Sprintf("%s; %s; input sha256 %s", toolVersion(), mode, job.SHA256)
}

// checkSetName refuses a mark that cannot name a set folder: empty,
// hidden or option-like, a path, or a batch file's name.
func checkSetName(mark string) error {
	switch {
	case mark == "":
		return errors.New("a file set needs a mark")
	case strings.HasPrefix(mark, ".") || strings.HasPrefix(mark, "-"):
		return fmt.Errorf("mark %q starts with %q: it would name a hidden file or read as an option", mark, mark[:1])
	case mark != filepath.Base(mark) || !filepath.IsLocal(mark) || strings.ContainsAny(mark, `/\:*?"<>|`):
		return fmt.Errorf("mark %q does not make a safe folder name", mark)
	}
	for _, b := range batchFiles {
		if strings.EqualFold(mark, b) {
			return fmt.Errorf("mark %q is the name of the batch's own %s", mark, b)
		}
	}
	return nil
}

// stamped returns f with the stamp in it where f's format takes a comment
// line and gaugeline does not already write one (JSON, HTML and DXF carry
// the job's stamp from detail and dxfout).
func stamped(f dxfout.File, stamp string) dxfout.File {
	switch filepath.Ext(f.Name) {
	case ".yaml", ".csv":
		f.Data = append([]byte("# "+stampPrefix+stamp+"\n"), f.Data...)
	case ".md":
		f.Data = append([]byte("<!-- "+stampPrefix+stamp+" -->\n"), f.Data...)
	}
	return f
}

// fileStamp reads the stamp a file of a set carries; ok is false when it
// carries none.
func fileStamp(name string, data []byte) (stamp string, ok bool) {
	first := func() string {
		line, _, _ := bytes.Cut(data, []byte("\n"))
		return strings.TrimRight(string(line), "\r")
	}
	switch filepath.Ext(name) {
	case ".json":
		var doc struct {
			Stamp string `json:"stamp"`
		}
		if err := json.Unmarshal(data, &doc); err != nil || doc.Stamp == "" {
			return "", false
		}
		return doc.Stamp, true
	case ".dxf":
		lines := strings.SplitN(string(data), "\n", 3)
		if len(lines) < 2 || strings.TrimSpace(lines[0]) != "999" {
			return "", false
		}
		return strings.CutPrefix(strings.TrimRight(lines[1], "\r"), dxfout.CommentPrefix)
	case ".html":
		const open = `<meta name="gaugeline-stamp" content="`
		_, rest, found := bytes.Cut(data, []byte(open))
		if !found {
			return "", false
		}
		v, _, found := bytes.Cut(rest, []byte(`">`))
		if !found {
			return "", false
		}
		return html.UnescapeString(string(v)), true
	case ".yaml", ".csv":
		return strings.CutPrefix(first(), "# "+stampPrefix)
	case ".md":
		s, ok := strings.CutPrefix(first(), "<!-- "+stampPrefix)
		if !ok {
			return "", false
		}
		return strings.CutSuffix(s, " -->")
	}
	return "", false
}

// manifest is the set's list of files: the stamp, then each file's
// SHA-256 and name, in the set's order.
func (s fileSet) manifest() []byte {
	var b bytes.Buffer
	fmt.Fprintf(&b, "# gaugeline file set %s: these files were written together; check with 'gaugeline audit'.\n", s.name)
	fmt.Fprintf(&b, "stamp: %s\n", s.stamp)
	for _, f := range s.files {
		fmt.Fprintf(&b, "%x  %s\n", sha256.Sum256(f.Data), f.Name)
	}
	return b.Bytes()
}

// manifestEntry is one file a manifest lists.
type manifestEntry struct{ sum, name string }

// readManifest parses a manifest written by fileSet.manifest.
func readManifest(data []byte) (stamp string, entries []manifestEntry, err error) {
	sc := bufio.NewScanner(bytes.NewReader(data))
	for n := 1; sc.Scan(); n++ {
		line := sc.Text()
		switch {
		case strings.HasPrefix(line, "#") || line == "":
		case strings.HasPrefix(line, "stamp: "):
			stamp = strings.TrimPrefix(line, "stamp: ")
		default:
			sum, name, ok := strings.Cut(line, "  ")
			if !ok || len(sum) != 64 || name == "" {
				return "", nil, fmt.Errorf("line %d is not 'SHA256  NAME'", n)
			}
			entries = append(entries, manifestEntry{sum, name})
		}
	}
	if stamp == "" {
		return "", nil, errors.New("no stamp line")
	}
	return stamp, entries, sc.Err()
}

// isSet reports whether dir is a set folder gaugeline wrote (it holds the
// manifest of its own name) or an empty folder.
func isSet(dir string) bool {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return false
	}
	if len(entries) == 0 {
		return true
	}
	_, err = os.Stat(filepath.Join(dir, filepath.Base(dir)+manifestExt))
	return err == nil
}

// writeSet writes the set into out/NAME, replacing what an earlier run
// left there as a whole. A folder of that name that is not a set gaugeline
// wrote is never touched.
func writeSet(out string, s fileSet) error {
	if err := checkSetName(s.name); err != nil {
		return err
	}
	seen := map[string]bool{strings.ToLower(s.name + manifestExt): true}
	for _, f := range s.files {
		if f.Name != filepath.Base(f.Name) || !filepath.IsLocal(f.Name) || seen[strings.ToLower(f.Name)] {
			panic(fmt.Sprintf("gaugeline: file set %s: file name %q is not one of its own", s.name, f.Name))
		}
		seen[strings.ToLower(f.Name)] = true
	}
	if err := os.MkdirAll(out, 0o755); err != nil {
		return fmt.Errorf("cannot create the output directory: %w", err)
	}
	target := filepath.Join(out, s.name)
	if fi, err := os.Lstat(target); err == nil && (!fi.IsDir() || !isSet(target)) {
		return fmt.Errorf("%s exists and is not a gaugeline file set: move it away, or write to another folder", target)
	}
	stage, err := os.MkdirTemp(out, "."+s.name+".new-")
	if err != nil {
		return fmt.Errorf("cannot write into %s: %w", out, err)
	}
	if err := writeStage(stage, s); err != nil {
		os.RemoveAll(stage)
		return err
	}
	return swapIn(stage, target)
}

// writeStage writes the set's files and manifest into the staging folder.
func writeStage(stage string, s fileSet) error {
	if err := os.Chmod(stage, 0o755); err != nil {
		return err
	}
	files := append(slices.Clone(s.files), dxfout.File{Name: s.name + manifestExt, Data: s.manifest()})
	for _, f := range files {
		if err := os.WriteFile(filepath.Join(stage, f.Name), f.Data, 0o644); err != nil {
			return fmt.Errorf("cannot write %s: %w", f.Name, err)
		}
	}
	return nil
}

// swapIn puts the staged folder in target's place. Where the system can
// exchange two names in one step (Linux renameat2), there is no moment
// without a set; elsewhere the old set is first moved aside, so a stop in
// between leaves the mark without a set, never with a mixed one.
func swapIn(stage, target string) error {
	if _, err := os.Lstat(target); errors.Is(err, fs.ErrNotExist) {
		if err := os.Rename(stage, target); err != nil {
			os.RemoveAll(stage)
			return fmt.Errorf("cannot write %s: %w", target, err)
		}
		return nil
	}
	if exchange(stage, target) == nil {
		os.RemoveAll(stage) // now the old set
		return nil
	}
	old := stage[:strings.LastIndex(stage, ".new-")] + ".old-" + stage[strings.LastIndex(stage, ".new-")+5:]
	if err := os.Rename(target, old); err != nil {
		os.RemoveAll(stage)
		return fmt.Errorf("cannot replace %s: %w", target, err)
	}
	if err := os.Rename(stage, target); err != nil {
		os.Rename(old, target) // put the old set back
		os.RemoveAll(stage)
		return fmt.Errorf("cannot replace %s: %w", target, err)
	}
	os.RemoveAll(old)
	return nil
}

// removeSet takes a mark's set away as a whole (a job that no longer
// passes, or no longer reads, must not keep an old cut sheet). A folder
// that is not a set is left alone.
func removeSet(out, name string) {
	target := filepath.Join(out, name)
	if checkSetName(name) != nil || !isSet(target) {
		return
	}
	old, err := os.MkdirTemp(out, "."+name+".old-")
	if err != nil {
		return
	}
	os.Remove(old)
	if os.Rename(target, old) == nil {
		os.RemoveAll(old)
	}
}

// isLeftover reports whether an output folder entry is a staging folder
// or temporary file an interrupted run left behind.
func isLeftover(name string) bool {
	return strings.HasPrefix(name, ".") && name != lockName &&
		(strings.Contains(name, ".new-") || strings.Contains(name, ".old-") || strings.HasSuffix(name, ".tmp"))
}

// cleanLeftovers removes what interrupted runs left in out. Call it only
// while holding the folder's lock, so no running writer owns them.
func cleanLeftovers(out string) {
	entries, err := os.ReadDir(out)
	if err != nil {
		return
	}
	for _, e := range entries {
		if isLeftover(e.Name()) {
			os.RemoveAll(filepath.Join(out, e.Name()))
		}
	}
}

// lockOutput creates out if needed, takes its lock (waiting, with a note
// on stderr, while another gaugeline run writes there) and cleans what
// interrupted runs left. unlock releases it; the system releases it too
// when the process ends, however it ends.
func lockOutput(out string, note func(string)) (unlock func(), err error) {
	if err := os.MkdirAll(out, 0o755); err != nil {
		return nil, &detail.InputError{File: out, Msg: "cannot create the output directory: " + errText(err)}
	}
	unlock, err = lockFile(filepath.Join(out, lockName), func() {
		note(fmt.Sprintf("waiting for another gaugeline run writing into %s", out))
	})
	if err != nil {
		return nil, &detail.InputError{File: out, Msg: "cannot lock the output directory: " + errText(err)}
	}
	cleanLeftovers(out)
	return unlock, nil
}
