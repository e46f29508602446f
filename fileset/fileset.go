// Package fileset is the layout of gaugeline's output folders: one folder
// per mark holding a whole file set and its manifest, written together and
// swapped in as one; the stamp every file carries; the folder's lock; and
// the audit that checks a folder. It imports only the standard library.
package fileset

import (
	"bufio"
	"bytes"
	"crypto/sha256"
	"encoding/json"
	"errors"
	"fmt"
	"html"
	"os"
	"path/filepath"
	"slices"
	"strings"
)

// File sets. Everything gaugeline writes for one mark (its JSON, cut
// sheet, CAM files, report) is one set, kept in its own folder DIR/MARK/
// with a manifest MARK.files. A set is replaced as a whole: it is written
// into a hidden staging folder beside it and swapped in by rename, so that
// whenever a run stops (killed, crashed, full disk) each mark's folder
// holds the old set, the new set, or nothing, never a mixture. Nothing is
// flushed to the disk (no fsync): after a power cut or a crash of the
// system itself, the file system may have kept a rename but not all the
// data before it, leaving files of the new set empty or short. The
// manifest's SHA-256s make `gaugeline audit` report such a set, and the
// next run replaces it. Every file
// of a set carries the same stamp (tool version, what made it, the input's
// SHA-256), in the form its format allows, and the manifest lists each
// file's SHA-256; `gaugeline audit DIR` checks both.
//
// Naming is here and nowhere else: a set's folder is its mark, so two
// marks' files can never collide; marks that differ only in case are one
// folder on Windows and macOS and are refused as duplicates by batch.

// ManifestExt ends the manifest's name: MARK.files.
const ManifestExt = ".files"

// LockName is the lock a run holds on an output folder while it writes.
const LockName = ".gaugeline.lock"

// The batch summary's files in an output folder, and its parts list of
// every set (written with cut sheets); no mark may have their names.
// UnfinishedTitle starts summary.md while a run is under way.
const (
	SummaryCSV      = "summary.csv"
	SummaryMD       = "summary.md"
	PartsCSV        = "parts.csv"
	UnfinishedTitle = "# Batch summary: RUN NOT FINISHED"
)

var indexFiles = []string{SummaryCSV, SummaryMD, PartsCSV}

// StampPrefix starts the stamp in the comment of every format that takes
// one (the DXF 999 comment included).
const StampPrefix = "gaugeline stamp: "

// File is one output file: its name in its folder and its bytes.
type File struct {
	Name string
	Data []byte
}

// Set is one mark's files, written together.
type Set struct {
	Name  string // the mark: the set's folder and the manifest's name
	Stamp string
	Files []File // names inside the set's folder
}

// Stamp is the stamp of a set made by tool ("gaugeline v1.2, go1.26"),
// in mode ("check", "propose"), from an input of the given SHA-256 (hex).
func Stamp(tool, mode, inputSHA256 string) string {
	return fmt.Sprintf("%s; %s; input sha256 %s", tool, mode, inputSHA256)
}

// StampInput is the input SHA-256 a stamp names ("" when it names none).
func StampInput(stamp string) string {
	_, in, ok := strings.Cut(stamp, "; input sha256 ")
	if !ok {
		return ""
	}
	return in
}

// CheckName refuses a mark that cannot name a set folder: empty,
// hidden or option-like, a path, or a batch file's name.
func CheckName(mark string) error {
	switch {
	case mark == "":
		return errors.New("a file set needs a mark")
	case strings.HasPrefix(mark, ".") || strings.HasPrefix(mark, "-"):
		return fmt.Errorf("mark %q starts with %q: it would name a hidden file or read as an option", mark, mark[:1])
	case mark != filepath.Base(mark) || !filepath.IsLocal(mark) || strings.ContainsAny(mark, `/\:*?"<>|`):
		return fmt.Errorf("mark %q does not make a safe folder name", mark)
	}
	for _, b := range indexFiles {
		if strings.EqualFold(mark, b) {
			return fmt.Errorf("mark %q is the name of the batch's own %s", mark, b)
		}
	}
	return nil
}

// Stamped returns f with the stamp in it where f's format takes a comment
// line and gaugeline does not already write one (JSON, HTML and DXF carry
// the job's stamp from detail and dxfout).
func Stamped(f File, stamp string) File {
	switch filepath.Ext(f.Name) {
	case ".yaml", ".csv":
		f.Data = append([]byte("# "+StampPrefix+stamp+"\n"), f.Data...)
	case ".md":
		f.Data = append([]byte("<!-- "+StampPrefix+stamp+" -->\n"), f.Data...)
	}
	return f
}

// FileStamp reads the stamp a file of a set carries; ok is false when it
// carries none.
func FileStamp(name string, data []byte) (stamp string, ok bool) {
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
		return strings.CutPrefix(strings.TrimRight(lines[1], "\r"), StampPrefix)
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
		return strings.CutPrefix(first(), "# "+StampPrefix)
	case ".nc1": // DSTV NC1: a "**" comment after the ST line (package ncout)
		lines := strings.SplitN(string(data), "\n", 3)
		if len(lines) < 2 || strings.TrimRight(lines[0], "\r") != "ST" {
			return "", false
		}
		return strings.CutPrefix(strings.TrimRight(lines[1], "\r"), "** "+StampPrefix)
	case ".md":
		s, ok := strings.CutPrefix(first(), "<!-- "+StampPrefix)
		if !ok {
			return "", false
		}
		return strings.CutSuffix(s, " -->")
	}
	return "", false
}

// manifest is the set's list of files: the stamp, then each file's
// SHA-256 and name, in the set's order.
func (s Set) Manifest() []byte {
	var b bytes.Buffer
	fmt.Fprintf(&b, "# gaugeline file set %s: these files were written together; check with 'gaugeline audit'.\n", s.Name)
	fmt.Fprintf(&b, "stamp: %s\n", s.Stamp)
	for _, f := range s.Files {
		fmt.Fprintf(&b, "%x  %s\n", sha256.Sum256(f.Data), f.Name)
	}
	return b.Bytes()
}

// manifestEntry is one file a manifest lists.
type manifestEntry struct{ sum, name string }

// ReadManifest parses a manifest written by fileSet.manifest.
func ReadManifest(data []byte) (stamp string, entries []manifestEntry, err error) {
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

// IsSet reports whether dir is a set folder gaugeline wrote (it holds the
// manifest of its own name) or an empty folder.
func IsSet(dir string) bool {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return false
	}
	if len(entries) == 0 {
		return true
	}
	_, err = os.Stat(filepath.Join(dir, filepath.Base(dir)+ManifestExt))
	return err == nil
}

// Write writes the set into out/NAME, replacing what an earlier run
// left there as a whole. A folder of that name that is not a set gaugeline
// wrote is never touched.
func Write(out string, s Set) error {
	if err := CheckName(s.Name); err != nil {
		return err
	}
	seen := map[string]bool{strings.ToLower(s.Name + ManifestExt): true}
	for _, f := range s.Files {
		if f.Name != filepath.Base(f.Name) || !filepath.IsLocal(f.Name) || seen[strings.ToLower(f.Name)] {
			panic(fmt.Sprintf("fileset: set %s: file name %q is not one of its own", s.Name, f.Name))
		}
		seen[strings.ToLower(f.Name)] = true
	}
	target := filepath.Join(out, s.Name)
	fi, err := os.Lstat(target)
	exists := err == nil
	if exists && (!fi.IsDir() || !IsSet(target)) {
		return fmt.Errorf("%s exists and is not a gaugeline file set: move it away, or write to another folder", target)
	}
	// The output folder is made only when the staging folder cannot be:
	// in a batch it exists, and a stat per set is not worth asking.
	stage, err := os.MkdirTemp(out, "."+s.Name+".new-")
	if err != nil {
		if err := os.MkdirAll(out, 0o755); err != nil {
			return fmt.Errorf("cannot create the output directory: %w", err)
		}
		if stage, err = os.MkdirTemp(out, "."+s.Name+".new-"); err != nil {
			return fmt.Errorf("cannot write into %s: %w", out, err)
		}
	}
	if err := writeStage(stage, s); err != nil {
		os.RemoveAll(stage)
		return err
	}
	return swapIn(stage, target, exists)
}

// writeStage writes the set's files and manifest into the staging folder.
func writeStage(stage string, s Set) error {
	if err := os.Chmod(stage, 0o755); err != nil {
		return err
	}
	files := append(slices.Clone(s.Files), File{Name: s.Name + ManifestExt, Data: s.Manifest()})
	for _, f := range files {
		if err := createFile(filepath.Join(stage, f.Name), f.Data); err != nil {
			return fmt.Errorf("cannot write %s: %w", f.Name, err)
		}
	}
	return nil
}

// swapIn puts the staged folder in target's place. Where the system can
// exchange two names in one step (Linux renameat2), there is no moment
// without a set; elsewhere the old set is first moved aside, so a stop in
// between leaves the mark without a set, never with a mixed one. exists
// is whether Write saw a set at target (under the folder's lock nothing
// else changes that; a set that appeared since makes the rename fail, one
// that went makes the exchange fail: an error either way, never a mix).
func swapIn(stage, target string, exists bool) error {
	if !exists {
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
	i := strings.LastIndex(stage, ".new-")
	old := stage[:i] + ".old-" + stage[i+len(".new-"):]
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

// Remove takes a mark's set away as a whole (a job that no longer
// passes, or no longer reads, must not keep an old cut sheet). A folder
// that is not a set is left alone.
func Remove(out, name string) {
	target := filepath.Join(out, name)
	if CheckName(name) != nil || !IsSet(target) {
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

// IsLeftover reports whether an output folder entry is a staging folder
// (.NAME.new-RAND, .NAME.old-RAND) or a temporary file (.NAME.RAND.tmp)
// an interrupted run left behind; a hidden file of anyone else's (.notes,
// .new-ideas) is not.
func IsLeftover(name string) bool {
	rest, hidden := strings.CutPrefix(name, ".")
	if !hidden || name == LockName || rest == "" || rest[0] == '.' {
		return false
	}
	for _, m := range []string{".new-", ".old-"} {
		if i := strings.LastIndex(rest, m); i > 0 && i+len(m) < len(rest) {
			return true
		}
	}
	base, tmp := strings.CutSuffix(rest, ".tmp")
	return tmp && strings.LastIndex(base, ".") > 0
}

// CleanLeftovers removes what interrupted runs left in out. Call it only
// while holding the folder's lock, so no running writer owns them.
func CleanLeftovers(out string) {
	entries, err := os.ReadDir(out)
	if err != nil {
		return
	}
	for _, e := range entries {
		if IsLeftover(e.Name()) {
			os.RemoveAll(filepath.Join(out, e.Name()))
		}
	}
}

// Lock creates out if needed, takes its lock (calling wait once, then
// waiting, while another gaugeline run writes there) and cleans what
// interrupted runs left. unlock releases it; the system releases it too
// when the process ends, however it ends.
func Lock(out string, wait func()) (unlock func(), err error) {
	if err := os.MkdirAll(out, 0o755); err != nil {
		return nil, fmt.Errorf("cannot create the output directory: %w", err)
	}
	unlock, err = lockFile(filepath.Join(out, LockName), wait)
	if err != nil {
		return nil, fmt.Errorf("cannot lock the output directory: %w", err)
	}
	CleanLeftovers(out)
	return unlock, nil
}

// WriteFile writes one file that is not part of a set (a batch summary, a
// report or job asked for by path): to a temporary file beside it, then
// renamed into place, so path is never half-written. The folder is
// created if missing.
func WriteFile(path string, data []byte) error {
	dir := filepath.Dir(path)
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return fmt.Errorf("cannot create the output directory: %w", err)
	}
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".*.tmp")
	if err != nil {
		return fmt.Errorf("cannot write into %s: %w", dir, err)
	}
	_, err = tmp.Write(data)
	if err == nil {
		err = tmp.Chmod(0o644)
	}
	if cerr := tmp.Close(); err == nil {
		err = cerr
	}
	if err == nil {
		err = os.Rename(tmp.Name(), path)
	}
	if err != nil {
		os.Remove(tmp.Name())
		return fmt.Errorf("cannot write %s: %w", filepath.Base(path), err)
	}
	return nil
}
