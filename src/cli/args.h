/* args.h: parsed arguments of run and validate. */
#ifndef VOLEV_CLI_ARGS_H
#define VOLEV_CLI_ARGS_H

#include <stddef.h>

#include "volev/status.h"

typedef struct vl_cli_args {
    const char *scenario;  /* borrowed from argv */
    const char *out;       /* -o DIR or NULL */
    int replace;           /* --replace (allow_out 2 only) */
    const char **sets;     /* owned array of borrowed "KEY=VALUE" */
    size_t nsets;
} vl_cli_args;

/* Parse argv[1..]; argv[0] is the subcommand name; allow_out: 1 takes -o DIR, 2 also
 * --replace. 0 or VL_ERR_USAGE (message printed). */
int vl_cli_parse_args(int argc, char **argv, int allow_out, vl_cli_args *a);
void vl_cli_args_free(vl_cli_args *a);

struct vl_scenario;
struct vl_model;
/* Parse argv (see vl_cli_parse_args), load the scenario with its overrides and build
 * its model. Returns VL_ERR_USAGE (printed) for a bad command line; otherwise 0, with
 * *sc and *m NULL and st filled if loading failed. */
int vl_cli_start(int argc, char **argv, int allow_out, vl_cli_args *a, struct vl_scenario **sc,
                 struct vl_model **m, vl_status *st);

/* Report st if it holds an error, free what vl_cli_start made; returns the exit code. */
int vl_cli_finish(vl_cli_args *a, struct vl_scenario *sc, struct vl_model *m,
                  const vl_status *st);

/* Parse and remove "--age-yr AGE" from argv (balance, hz): *given set when it was
 * there. 0, or VL_ERR_USAGE (printed). */
int vl_cli_take_age(int *argc, char **argv, double *age_yr, int *given);

#endif
