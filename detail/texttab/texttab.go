// Package texttab writes the text report's aligned tables and wraps its notes
// to a line width (standard library only: detail and detail/bom share it).
package texttab

import (
	"strings"
	"unicode/utf8"
)

// Width is the width the text report's tables and notes fit: 100
// columns, a terminal's or a printed page's line.
const Width = 100

// minLast is the narrowest a table's last column is wrapped in beside its
// row; narrower, it goes under the row.
const minLast = 36

// Table writes rows as an aligned table two spaces between columns,
// every column but the last padded to its widest cell and the last
// wrapped at word boundaries so that a line fits width; a continuation
// line leaves the other columns blank. Where the columns before the last
// leave it less than minLast characters, a last cell that does not fit
// beside its row goes under it instead, indented, wrapped to the width.
func Table(b *strings.Builder, rows [][]string, width int) {
	if len(rows) == 0 {
		return
	}
	n := 0
	for _, r := range rows {
		n = max(n, len(r))
	}
	widths := make([]int, n)
	for _, r := range rows {
		for i, c := range r[:len(r)-1] {
			widths[i] = max(widths[i], utf8.RuneCountInString(c))
		}
	}
	lead := 0
	for _, w := range widths[:n-1] {
		lead += w + 2
	}
	room := width - lead
	for _, r := range rows {
		var pre strings.Builder
		for i := 0; i < n-1; i++ {
			c := ""
			if i < len(r)-1 {
				c = r[i]
			}
			pre.WriteString(c)
			pre.WriteString(strings.Repeat(" ", widths[i]-utf8.RuneCountInString(c)+2))
		}
		last := ""
		if len(r) == n {
			last = r[n-1]
		}
		if room < minLast && utf8.RuneCountInString(last) > room {
			// too narrow beside the row: under it, indented
			b.WriteString(strings.TrimRight(pre.String(), " "))
			b.WriteByte('\n')
			for _, line := range Wrap(last, width-4) {
				b.WriteString("    " + line + "\n")
			}
			continue
		}
		for k, line := range Wrap(last, room) {
			if k == 0 {
				b.WriteString(strings.TrimRight(pre.String()+line, " "))
			} else {
				b.WriteString(strings.Repeat(" ", lead) + line)
			}
			b.WriteByte('\n')
		}
	}
}

// Wrap breaks s into lines of at most width runes at spaces (a word
// longer than width stands on a line of its own); "" is one empty line.
func Wrap(s string, width int) []string {
	words := strings.Fields(s)
	if len(words) == 0 {
		return []string{""}
	}
	var lines []string
	cur := words[0]
	for _, w := range words[1:] {
		if utf8.RuneCountInString(cur)+1+utf8.RuneCountInString(w) > width {
			lines = append(lines, cur)
			cur = w
			continue
		}
		cur += " " + w
	}
	return append(lines, cur)
}
