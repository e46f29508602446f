// Package propose finds the best passing bolt layout for a job within its
// stock (SPEC §6): every candidate is built with detail.Builder and
// checked with detail.Check, and the search prunes on what the limit
// states and rules guarantee (more pitch, end or edge never lowers a
// strength). WriteJob writes the chosen layout back into the job file.
package propose
