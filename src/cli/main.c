/* main.c: the volev command line: subcommand dispatch, --help, --version. */
#include <signal.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "volev/integrate.h"
#include "volev/output.h"

static const struct {
    const char *name;
    int (*fn)(int, char **);
    const char *usage;
} commands[] = {
    {"run", vl_cli_run, "run SCENARIO [-o DIR [--replace]] [--set KEY=VALUE]...  simulate one history (DIR empty or new, unless --replace)"},
    {"validate", vl_cli_validate, "validate SCENARIO [--set KEY=VALUE]...  check a scenario, list every parameter"},
    {"balance", vl_cli_balance, "balance SCENARIO [--age-yr AGE] [-o DIR] [--set KEY=VALUE]...  energy-balance curves at one age"},
    {"processes", vl_cli_processes, "processes  list processes and parameters with units, defaults, bounds, references"},
    {"columns", vl_cli_columns, "columns  list every output column and summary row with its unit and meaning"},
    {"sweep", vl_cli_sweep, "sweep SCENARIO [-o DIR] [-j THREADS] [--quiet] [--replace]  run the ensemble of the scenario's sweep group (resumes an interrupted one)"},
    {"plot", vl_cli_plot, "plot DIR [--format png|pdf|svg]  render the history figure of a run"},
    {"compare", vl_cli_compare, "compare DIR_A DIR_B [-o DIR] [--format png|pdf|svg] [--labels A,B]  side-by-side table and figure of two runs"},
    {NULL, NULL, NULL},
};

static void help(FILE *f)
{
    fprintf(f, "volev %s: volatile and atmosphere evolution of rocky planets\n\n"
               "usage: volev COMMAND [ARGS]\n",
            vl_version());
    for (int i = 0; commands[i].name; i++)
        fprintf(f, "  volev %s\n", commands[i].usage);
    fprintf(f, "  volev --help | --version\n\n"
               "exit codes: 0 success, 1 internal error, 2 bad command line,\n"
               "  3 bad scenario or input data, 4 integration failed, 5 file I/O error\n"
               "  (or the output folder is taken: not empty, or locked by another sweep),\n"
               "  6 external program (gnuplot) missing or failed,\n"
               "  128 + signal: stopped by SIGINT or SIGTERM (nothing incomplete left behind)\n"
               "See volev(1) and docs/model.md.\n");
}

int vl_cli_report(const vl_status *st)
{
    char buf[VL_MSG_MAX + VL_PATH_MAX + 32];
    vl_status_format(st, buf, sizeof buf);
    if (st->code == VL_ERR_STOPPED) {
        int sig = vl_integrate_stop_signal();
        fprintf(stderr, "volev: interrupted (%s): %s; no output written\n",
                sig == SIGINT ? "SIGINT" : sig == SIGTERM ? "SIGTERM" : "signal", buf);
        return sig > 0 ? 128 + sig : 130;
    }
    fprintf(stderr, "volev: %s\n", buf);
    return st->code;
}

static void on_stop(int sig) { vl_integrate_request_stop(sig); }

void vl_cli_catch_signals(void)
{
    struct sigaction sa;
    memset(&sa, 0, sizeof sa);
    sa.sa_handler = on_stop;
    sigemptyset(&sa.sa_mask);
    sigaction(SIGINT, &sa, NULL);
    sigaction(SIGTERM, &sa, NULL);
}

int vl_cli_usage_error(const char *cmd, const char *fmt, ...)
{
    va_list ap;
    fprintf(stderr, "volev: %s%s", cmd ? cmd : "", cmd ? ": " : "");
    va_start(ap, fmt);
    vfprintf(stderr, fmt, ap);
    va_end(ap);
    fprintf(stderr, "\nTry 'volev --help'.\n");
    return VL_ERR_USAGE;
}

int main(int argc, char **argv)
{
    if (argc < 2)
        return vl_cli_usage_error(NULL, "missing command");
    if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
        help(stdout);
        return VL_OK;
    }
    if (strcmp(argv[1], "--version") == 0) {
        printf("volev %s\n", vl_version());
        return VL_OK;
    }
    for (int i = 0; commands[i].name; i++)
        if (strcmp(argv[1], commands[i].name) == 0)
            return commands[i].fn(argc - 1, argv + 1);
    return vl_cli_usage_error(NULL, "unknown command '%s'", argv[1]);
}
