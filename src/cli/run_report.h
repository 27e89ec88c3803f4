/* run_report.h: the end-of-run report of `volev run` (run_report.c). */
#ifndef VOLEV_RUN_REPORT_H
#define VOLEV_RUN_REPORT_H

#include <stdio.h>

#include "volev/integrate.h"
#include "volev/model.h"
#include "volev/schema.h"

/* The report of a run of m that ended with s, its events ev, written into dir. */
void vl_run_report(FILE *out, const vl_model *m, const vl_run_stats *s,
                   const vl_event_firsts *ev, const char *dir);

#endif
