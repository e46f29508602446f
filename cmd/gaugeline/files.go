package main

import (
	"fmt"
	"os"
	"path/filepath"

	"gaugeline/dxfout"
)

// writeAll writes every file into dir, creating it if missing: each to a
// temporary file in dir first, then all renamed into place, so that no
// file is ever half-written.
func writeAll(dir string, files []dxfout.File) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return fmt.Errorf("cannot create the output directory: %w", err)
	}
	var temps []string
	clean := func() {
		for _, t := range temps {
			os.Remove(t)
		}
	}
	for _, f := range files {
		tmp, err := os.CreateTemp(dir, "."+f.Name+".*.tmp")
		if err != nil {
			clean()
			return fmt.Errorf("cannot write into %s: %w", dir, err)
		}
		temps = append(temps, tmp.Name())
		_, err = tmp.Write(f.Data)
		if err == nil {
			err = tmp.Chmod(0o644)
		}
		if cerr := tmp.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			clean()
			return fmt.Errorf("cannot write %s: %w", f.Name, err)
		}
	}
	for i, f := range files {
		if err := os.Rename(temps[i], filepath.Join(dir, f.Name)); err != nil {
			clean()
			return fmt.Errorf("cannot write %s: %w", f.Name, err)
		}
	}
	return nil
}
