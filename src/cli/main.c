/* main.c: the volev command line: subcommand dispatch (the table of help_table.c), the
 * options checked against it, --help, --version. */
#include <signal.h>
#include <stdarg.h>
#include <stdio.h>
#include <string.h>

#include "cli.h"
#include "help.h"
#include "volev/integrate.h"
#include "volev/output.h"

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
    if (cmd && strcmp(cmd, "help") != 0)
        fprintf(stderr, "\nTry 'volev %s --help'.\n", cmd);
    else
        fprintf(stderr, "\nTry 'volev --help'.\n");
    return VL_ERR_USAGE;
}

int main(int argc, char **argv)
{
    if (argc < 2)
        return vl_cli_usage_error(NULL, "missing command");
    if (strcmp(argv[1], "--help") == 0 || strcmp(argv[1], "-h") == 0) {
        vl_cli_help_overview(stdout);
        return VL_OK;
    }
    if (strcmp(argv[1], "--version") == 0) {
        printf("volev %s\n", vl_version());
        return VL_OK;
    }
    const vl_cli_command *c = vl_cli_command_find(argv[1]);
    if (!c) {
        const char *near = vl_cli_command_suggest(argv[1]);
        return vl_cli_usage_error(NULL, "unknown command '%s'%s%s%s", argv[1],
                                  near ? " (did you mean '" : "", near ? near : "",
                                  near ? "'?)" : "");
    }
    int done, rc = vl_cli_check_options(c, argc - 1, argv + 1, &done);
    if (rc != VL_OK || done)
        return rc;
    return c->fn(argc - 1, argv + 1);
}
