/* cli.h: the subcommands of the volev program. Each returns an exit code
 * (enum vl_code) and prints errors as "volev: FILE:LINE: message". */
#ifndef VOLEV_CLI_H
#define VOLEV_CLI_H

#include "volev/status.h"

int vl_cli_run(int argc, char **argv);
int vl_cli_validate(int argc, char **argv);
int vl_cli_processes(int argc, char **argv);
int vl_cli_columns(int argc, char **argv);
int vl_cli_plot(int argc, char **argv);
int vl_cli_balance(int argc, char **argv);
int vl_cli_hz(int argc, char **argv);
int vl_cli_sweep(int argc, char **argv);
int vl_cli_compare(int argc, char **argv);
int vl_cli_help(int argc, char **argv);

/* SIGINT and SIGTERM ask running integrations to stop (vl_integrate_request_stop);
 * vl_cli_report then returns 128 + signal. */
void vl_cli_catch_signals(void);

/* The climate table cache (src/cli/cache.c): configured from VOLEV_CACHE_DIR, else
 * $XDG_CACHE_HOME/volev, else $HOME/.cache/volev (a folder that cannot be made: one
 * warning, and the command runs without it), before the first model is built; at the
 * end, flushed, with one warning if a write failed and turned it off. */
void vl_cli_cache_start(void);
void vl_cli_cache_finish(void);

/* Print st to stderr as "volev: FILE:LINE: message" and return its code. */
int vl_cli_report(const vl_status *st);
/* Print a usage error to stderr and return VL_ERR_USAGE. */
int vl_cli_usage_error(const char *cmd, const char *fmt, ...) __attribute__((format(printf, 2, 3)));

#endif
