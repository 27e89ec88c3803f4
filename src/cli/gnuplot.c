/* gnuplot.c: finding plots/ scripts and running gnuplot (gnuplot.h). */
#include "gnuplot.h"

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

int vl_gnuplot_run(const char *script, const char *expr, const char *outfile, vl_status *st)
{
    char *args[] = {"gnuplot", "-e", (char *)expr, (char *)script, NULL};
    pid_t pid;
    fflush(stdout); /* keep our output ahead of anything gnuplot prints */
    int err = posix_spawnp(&pid, "gnuplot", NULL, NULL, args, environ);
    if (err != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0, "cannot run gnuplot: %s (install gnuplot-nox)",
                       strerror(err));
    int status;
    if (waitpid(pid, &status, 0) < 0 || !WIFEXITED(status) || WEXITSTATUS(status) != 0) {
        remove(outfile);
        return vl_fail(st, VL_ERR_TOOL, script, 0, "gnuplot failed rendering %s", outfile);
    }
    return VL_OK;
}

int vl_gnuplot_quote(const char *s, char *out, size_t n)
{
    size_t k = 0;
    for (; *s; s++) {
        size_t need = *s == '\'' ? 2 : 1;
        if (k + need >= n)
            return -1;
        out[k++] = *s;
        if (*s == '\'')
            out[k++] = '\'';
    }
    if (n == 0)
        return -1;
    out[k] = '\0';
    return 0;
}
