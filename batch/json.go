package batch

import (
	"encoding/json"
	"math"

	"gaugeline/detail"
)

// The batch's summary as JSON (--format json on stdout): the run, the
// counts and one entry per job, in the summary's order.

type jsonSummary struct {
	Run     string     `json:"run"`
	Counts  jsonCounts `json:"counts"`
	Jobs    []jsonJob  `json:"jobs"`
	Caution string     `json:"caution"`
}

type jsonCounts struct {
	Jobs   int `json:"jobs"`
	Pass   int `json:"pass"`
	Fail   int `json:"fail"`
	Errors int `json:"error"`
	NotRun int `json:"not_run"`
}

type jsonJob struct {
	File      string   `json:"file"`
	Row       string   `json:"row,omitempty"`
	Mark      string   `json:"mark"`
	Member    string   `json:"member"`
	Verdict   string   `json:"verdict"`
	Governing string   `json:"governing"`
	Ratio     *float64 `json:"ratio"` // null when none
	Bolts     int      `json:"bolts"`
	Set       string   `json:"set"`
	Files     []string `json:"files"`
	Parts     int      `json:"parts"`
	Input     string   `json:"input_sha256"`
	Message   string   `json:"message,omitempty"`
	Hint      string   `json:"hint,omitempty"`
}

// SummaryJSON is the summary as one JSON document.
func SummaryJSON(rows []Row, run string) ([]byte, error) {
	c := Count(rows)
	doc := jsonSummary{Run: run, Counts: jsonCounts{c.Jobs, c.Pass, c.Fail, c.Errors, c.NotRun}, Jobs: []jsonJob{}, Caution: detail.Caution}
	for _, r := range rows {
		j := jsonJob{File: r.File, Row: r.Source, Mark: r.Mark, Member: r.Member, Verdict: r.Verdict.String(),
			Governing: r.Governing, Bolts: r.Bolts, Set: r.Set, Files: r.Files, Parts: len(r.Parts), Input: r.Input,
			Message: r.Message, Hint: r.Hint}
		if j.Files == nil {
			j.Files = []string{}
		}
		if !math.IsNaN(r.Ratio) {
			ratio := math.Round(r.Ratio*1e6) / 1e6
			j.Ratio = &ratio
		}
		doc.Jobs = append(doc.Jobs, j)
	}
	data, err := json.MarshalIndent(doc, "", "  ")
	return append(data, '\n'), err
}
