package main

import (
	"fmt"

	"gaugeline/detail/jobfile"
	"gaugeline/fileset"
)

// toolVersion names this build in a stamp: "gaugeline " and version().
func toolVersion() string { return "gaugeline " + version() }

// stampFor is the stamp of a set made by mode ("check", "propose") from
// the job's file.
func stampFor(mode string, job *jobfile.Job) string {
	return fileset.Stamp(toolVersion(), mode, job.SHA256)
}

// lockOutput takes the output folder's lock (see fileset.Lock), saying so
// through note while another run holds it; its errors are bad input at
// the folder.
func lockOutput(out string, note func(string)) (unlock func(), err error) {
	unlock, err = fileset.Lock(out, func() {
		note(fmt.Sprintf("waiting for another gaugeline run writing into %s", out))
	})
	if err != nil {
		return nil, &jobfile.InputError{File: out, Msg: err.Error()}
	}
	return unlock, nil
}
