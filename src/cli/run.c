/* run.c: `volev run SCENARIO [-o DIR [--replace]] [--set KEY=VALUE]...` */
#include <errno.h>
#include <stdio.h>
#include <string.h>
#include <sys/stat.h>

#include "args.h"
#include "cli.h"
#include "run_report.h"
#include "volev/folder.h"
#include "volev/integrate.h"
#include "volev/output.h"
#include "volev/schema.h"
#include "volev/units.h"

/* Default output folder: the scenario's name, or NAME.1, NAME.2, ... if taken. */
static int default_dir(const vl_scenario *sc, char *buf, size_t n)
{
    struct stat sb;
    snprintf(buf, n, "%s", sc->name);
    for (int k = 1; k < 10000 && stat(buf, &sb) == 0; k++)
        snprintf(buf, n, "%s.%d", sc->name, k);
    return stat(buf, &sb) == 0 ? -1 : 0;
}

/* The folder -o names, before the run writes into it: temporaries a killed run left
 * there removed (and said so); refused when it holds anything else, unless --replace
 * (docs/hardening.md, "Outputs"). An empty or missing folder is fine. */
static int check_folder(const char *dir, int replace, vl_status *st)
{
    vl_folder_state fs;
    if (vl_folder_inspect(dir, &fs, st) != VL_OK)
        return st->code;
    if (fs.removed)
        fprintf(stderr, "volev: note: %s: removed %ld temporary file%s left by a killed run\n",
                dir, fs.removed, fs.removed == 1 ? "" : "s");
    if (fs.entries == 0 || replace)
        return VL_OK;
    return vl_fail(st, VL_ERR_IO, dir, 0,
                   "the output folder is not empty (%s); choose another -o, or add --replace "
                   "to write this run's files over it",
                   fs.busy  ? "another volev run is writing into it"
                   : fs.volev ? "it holds the results of an earlier volev command"
                              : "it holds files volev did not write");
}

int vl_cli_run(int argc, char **argv)
{
    vl_cli_args a;
    vl_status st;
    vl_scenario *sc;
    vl_model *m;
    vl_cli_cache_start();
    if (vl_cli_start(argc, argv, 2, &a, &sc, &m, &st)) {
        vl_cli_args_free(&a);
        return VL_ERR_USAGE;
    }
    vl_output *out = NULL;
    char dir[VL_PATH_MAX];
    if (sc && sc->sweep_line)
        fprintf(stderr,
                "volev: note: %s:%d: the sweep group is for 'volev sweep'; this runs the base "
                "scenario\n",
                sc->path, sc->sweep_line);
    if (m) {
        if (a.out) {
            snprintf(dir, sizeof dir, "%s", a.out);
            check_folder(dir, a.replace, &st);
        } else if (default_dir(sc, dir, sizeof dir) != 0)
            vl_fail(&st, VL_ERR_IO, NULL, 0, "no free output folder name for '%s'", sc->name);
        if (st.code == VL_OK)
            out = vl_output_open(dir, m, &st);
    }
    if (out) {
        vl_cli_catch_signals();
        vl_run_sink sink = vl_output_sink(out);
        vl_run_stats stats;
        if (vl_integrate(m, &sink, &stats, &st) == VL_OK) {
            vl_event_firsts events;
            vl_output_events(out, &events);
            if (vl_output_commit(out, &stats, &st) == VL_OK)
                vl_run_report(stdout, m, &stats, &events, dir);
        } else {
            vl_output_abort(out);
        }
    }
    vl_cli_cache_finish();
    return vl_cli_finish(&a, sc, m, &st);
}
