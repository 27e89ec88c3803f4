/* output_internal.h: what the writers in src/output share. Private to src/output. */
#ifndef VOLEV_OUTPUT_INTERNAL_H
#define VOLEV_OUTPUT_INTERNAL_H

#include <stdio.h>

/* The summary.csv part of the column reference (summary.c): a markdown table's rows. */
void vl_summary_print_reference(FILE *out);

#endif
