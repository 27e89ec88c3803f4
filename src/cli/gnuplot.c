/* gnuplot.c: finding plots/ scripts and running gnuplot (gnuplot.h). */
#include "gnuplot.h"
#include "volev/schema.h"

#include <errno.h>
#include <libgen.h>
#include <spawn.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>
#include <unistd.h>

extern char **environ;

int vl_gnuplot_find_script(const char *name, char *out, size_t n)
{
    const char *env = getenv("VOLEV_PLOTS_DIR");
    if (env) {
        snprintf(out, n, "%s/%s", env, name);
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
        snprintf(out, n, "%s/%s/%s", dir, rel[i], name);
        if (access(out, R_OK) == 0)
            return 0;
    }
    return -1;
}

int vl_gnuplot_call(const char *script, const char *const args[], size_t n, vl_status *st)
{
    /* gnuplot -c SCRIPT ARG1 ... ARGn: the script sees them as ARG1 ... ARGn (ARGC = n) */
    char **argv = malloc((n + 4) * sizeof *argv);
    if (!argv)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory starting gnuplot");
    argv[0] = "gnuplot";
    argv[1] = "-c";
    argv[2] = (char *)script;
    for (size_t i = 0; i < n; i++)
        argv[3 + i] = (char *)(args[i] ? args[i] : "");
    argv[n + 3] = NULL;
    pid_t pid;
    fflush(stdout); /* keep our output ahead of anything gnuplot prints */
    int err = posix_spawnp(&pid, "gnuplot", NULL, NULL, argv, environ);
    free(argv);
    if (err != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0, "cannot run gnuplot: %s (install gnuplot-nox)",
                       strerror(err));
    int status;
    pid_t w;
    while ((w = waitpid(pid, &status, 0)) < 0 && errno == EINTR)
        ;
    if (w < 0)
        return vl_fail(st, VL_ERR_TOOL, script, 0, "lost track of gnuplot: %s", strerror(errno));
    if (WIFSIGNALED(status))
        return vl_fail(st, VL_ERR_TOOL, script, 0, "gnuplot was killed by signal %d",
                       WTERMSIG(status));
    if (!WIFEXITED(status) || WEXITSTATUS(status) != 0)
        return vl_fail(st, VL_ERR_TOOL, script, 0, "gnuplot failed (exit status %d)",
                       WIFEXITED(status) ? WEXITSTATUS(status) : -1);
    return VL_OK;
}

const int vl_gnuplot_history_columns[] = {
    VL_SER_TIME,  VL_SER_REGIME, VL_SER_SURFACE_TEMP, VL_SER_SURFACE_WATER, VL_SER_P_H2O,
    VL_SER_P_CO2, VL_SER_P_N2,   VL_SER_P_O2,         VL_SER_P_H2,          VL_SER_H_ESCAPE,
    VL_SER_O_ESCAPE, VL_SER_C_ESCAPE, VL_SER_N_ESCAPE, VL_SER_F_XUV, VL_SER_LUMINOSITY, -1};
const int vl_gnuplot_comparison_columns[] = {VL_SER_TIME,  VL_SER_REGIME, VL_SER_SURFACE_WATER,
                                             VL_SER_P_CO2, VL_SER_P_O2,   VL_SER_SURFACE_TEMP, -1};

size_t vl_gnuplot_column_names(const int *ids, const char **names, size_t cap)
{
    size_t n = 0;
    while (ids[n] >= 0 && n + 1 < cap) {
        names[n] = vl_series_name(ids[n]);
        n++;
    }
    names[n] = NULL;
    return n;
}

char *vl_gnuplot_runs_word(const char *const *series, const char *const *labels, int n)
{
    size_t len = 1;
    for (int k = 0; k < n; k++)
        len += strlen(series[k]) + strlen(labels[k] ? labels[k] : "") + 2;
    char *s = malloc(len), *p = s;
    if (!s)
        return NULL;
    for (int k = 0; k < n; k++)
        p += sprintf(p, "%s\n%s\n", series[k], labels[k] ? labels[k] : "");
    *p = '\0';
    return s;
}
