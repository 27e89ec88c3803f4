/* plot.c: `volev plot DIR [--format png|pdf|svg]`: render the figures of what DIR
 * holds through gnuplot: DIR/history.FORMAT from a run's series.csv (plots/history.gp),
 * DIR/balance.FORMAT from `volev balance`'s balance.csv (plots/balance.gp). */
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#include "cli.h"
#include "gnuplot.h"

/* Render DIR/FIGURE.FMT from DIR/DATA with plots/SCRIPT; prints the figure's path. */
static int render(const char *dir, const char *data, const char *script_name, const char *figure,
                  const char *fmt, vl_status *st)
{
    char datafile[4200], events[4200], outfile[4200], script[4200], expr[16384];
    snprintf(datafile, sizeof datafile, "%s/%s", dir, data);
    snprintf(events, sizeof events, "%s/events.csv", dir);
    snprintf(outfile, sizeof outfile, "%s/%s.%s", dir, figure, fmt);
    if (vl_gnuplot_find_script(script_name, script, sizeof script) != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0,
                       "cannot find plots/%s (set VOLEV_PLOTS_DIR to the plots folder)",
                       script_name);
    snprintf(expr, sizeof expr, "datafile='%s'; eventfile='%s'; outfile='%s'; fmt='%s'", datafile,
             access(events, R_OK) == 0 ? events : "", outfile, fmt);
    if (vl_gnuplot_run(script, expr, outfile, st) != VL_OK)
        return st->code;
    printf("%s\n", outfile);
    return VL_OK;
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

    static const struct {
        const char *data, *script, *figure;
    } kinds[] = {{"series.csv", "history.gp", "history"}, {"balance.csv", "balance.gp", "balance"}};
    vl_status st;
    vl_status_clear(&st);
    int found = 0;
    for (size_t k = 0; k < sizeof kinds / sizeof kinds[0] && st.code == VL_OK; k++) {
        char data[4200];
        snprintf(data, sizeof data, "%s/%s", dir, kinds[k].data);
        if (access(data, R_OK) != 0)
            continue;
        found = 1;
        render(dir, kinds[k].data, kinds[k].script, kinds[k].figure, fmt, &st);
    }
    if (!found && st.code == VL_OK)
        vl_fail(&st, VL_ERR_IO, dir, 0,
                "nothing to plot: no series.csv (volev run) or balance.csv (volev balance) here");
    return st.code == VL_OK ? VL_OK : vl_cli_report(&st);
}
