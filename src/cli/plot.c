/* plot.c: `volev plot DIR [--format png|pdf|svg]`: render DIR/history.FORMAT from
 * DIR/series.csv with plots/history.gp through gnuplot. */
#include <errno.h>
#include <libgen.h>
#include <spawn.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

#include "cli.h"

extern char **environ;

/* Find history.gp: $VOLEV_PLOTS_DIR, then ../plots and ../share/volev/plots beside the
 * executable. */
static int find_script(char *out, size_t n)
{
    const char *env = getenv("VOLEV_PLOTS_DIR");
    if (env) {
        snprintf(out, n, "%s/history.gp", env);
        return access(out, R_OK);
    }
    char exe[4096];
    ssize_t len = readlink("/proc/self/exe", exe, sizeof exe - 1);
    if (len <= 0)
        return -1;
    exe[len] = '\0';
    const char *dir = dirname(exe);
    static const char *const rel[] = {"../plots", "../share/volev/plots", "plots"};
    for (size_t i = 0; i < sizeof rel / sizeof rel[0]; i++) {
        snprintf(out, n, "%s/%s/history.gp", dir, rel[i]);
        if (access(out, R_OK) == 0)
            return 0;
    }
    return -1;
}

int vl_cli_plot(int argc, char **argv)
{
    const char *dir = NULL, *fmt = "png";
    for (int i = 1; i < argc; i++) {
        if (strcmp(argv[i], "--format") == 0 || strcmp(argv[i], "-f") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error(argv[0], "%s needs png, pdf or svg", argv[i]);
            fmt = argv[++i];
        } else if (argv[i][0] == '-') {
            return vl_cli_usage_error(argv[0], "unknown option '%s'", argv[i]);
        } else if (dir) {
            return vl_cli_usage_error(argv[0], "more than one folder");
        } else {
            dir = argv[i];
        }
    }
    if (!dir)
        return vl_cli_usage_error(argv[0], "missing DIR (the output folder of a run)");
    if (strcmp(fmt, "png") && strcmp(fmt, "pdf") && strcmp(fmt, "svg"))
        return vl_cli_usage_error(argv[0], "unknown format '%s' (png, pdf or svg)", fmt);
    if (strchr(dir, '\'') || strchr(dir, '\\'))
        return vl_cli_usage_error(argv[0], "folder names with quotes or backslashes are not supported");

    vl_status st;
    vl_status_clear(&st);
    char series[4200], events[4200], outfile[4200], script[4200], expr[16384];
    snprintf(series, sizeof series, "%s/series.csv", dir);
    snprintf(events, sizeof events, "%s/events.csv", dir);
    snprintf(outfile, sizeof outfile, "%s/history.%s", dir, fmt);
    if (access(series, R_OK) != 0) {
        vl_fail(&st, VL_ERR_IO, series, 0, "cannot read: %s (is %s the output of 'volev run'?)",
                strerror(errno), dir);
        return vl_cli_report(&st);
    }
    if (find_script(script, sizeof script) != 0) {
        vl_fail(&st, VL_ERR_TOOL, NULL, 0,
                "cannot find plots/history.gp (set VOLEV_PLOTS_DIR to the plots folder)");
        return vl_cli_report(&st);
    }
    snprintf(expr, sizeof expr, "datafile='%s'; eventfile='%s'; outfile='%s'; fmt='%s'", series,
             events, outfile, fmt);
    char *args[] = {"gnuplot", "-e", expr, script, NULL};
    pid_t pid;
    int err = posix_spawnp(&pid, "gnuplot", NULL, NULL, args, environ);
    if (err != 0) {
        vl_fail(&st, VL_ERR_TOOL, NULL, 0, "cannot run gnuplot: %s (install gnuplot-nox)",
                strerror(err));
        return vl_cli_report(&st);
    }
    int status;
    if (waitpid(pid, &status, 0) < 0 || !WIFEXITED(status) || WEXITSTATUS(status) != 0) {
        remove(outfile);
        vl_fail(&st, VL_ERR_TOOL, script, 0, "gnuplot failed rendering %s", outfile);
        return vl_cli_report(&st);
    }
    printf("%s\n", outfile);
    return VL_OK;
}
