/* csv_file.h: a CSV file a command writes beside a run's (balance.csv, hz.csv):
 * through a temporary renamed into place, with the provenance lines every volev CSV
 * starts with (csv_file.c). */
#ifndef VOLEV_CLI_CSV_FILE_H
#define VOLEV_CLI_CSV_FILE_H

#include <stdio.h>

#include "volev/scenario.h"
#include "volev/status.h"

/* Opens path's temporary, path.tmp (its name into tmp, n bytes), and writes the version
 * and the resolved scenario hash of sc as '#' lines. NULL with st filled on error. */
FILE *vl_cli_csv_begin(const char *path, const vl_scenario *sc, char *tmp, size_t n,
                       vl_status *st);

/* Closes f and renames tmp to path; on any write error removes tmp instead.
 * VL_OK or VL_ERR_IO with st filled. */
int vl_cli_csv_commit(FILE *f, const char *tmp, const char *path, vl_status *st);

#endif
