/* sweep.c: `volev sweep SCENARIO [-o DIR] [-j THREADS] [--quiet] [--replace]`: run the members of the
 * scenario's sweep group (src/ensembles/sweep.c) on threads (OpenMP) and, in a `make MPI=1` build,
 * on MPI ranks; write members.csv, ensemble_summary.csv, ensemble_series.csv and, for a
 * saltelli design, sensitivity.csv (docs/ensembles.md).
 *
 * Robustness: every finished member is appended at once to DIR/sweep.journal (exact
 * numbers), so an interrupted sweep (signal, kill, crash, power cut short of the page
 * cache) resumes with the same command and recomputes only the members it lacks; a
 * line cut short by the interruption is dropped. The final files are written under
 * temporary names and renamed when complete; the journal is removed last. Identical
 * settings give identical files whatever the thread count, rank count or interruptions:
 * each member is computed alone and the files are written in member order from the
 * journal's exact values. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "cli.h"
#include "sweep_internal.h"
#include "volev/folder.h"

/* ------------------------------------------------------------------ arguments */

typedef struct {
    const char *scenario, *out;
    int threads, quiet, replace;
} sweep_args;

/* SCENARIO, -o DIR, -j THREADS, --quiet, --replace. */
static int parse(int argc, char **argv, sweep_args *a)
{
    memset(a, 0, sizeof *a);
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        if (strcmp(s, "-o") == 0 || strcmp(s, "-j") == 0) {
            if (i + 1 >= argc)
                return vl_cli_usage_error("sweep", "%s needs a value", s);
            if (s[1] == 'o') {
                a->out = argv[++i];
            } else {
                char *end;
                long j = strtol(argv[++i], &end, 10);
                if (*end || j < 1 || j > 1024)
                    return vl_cli_usage_error("sweep", "-j: expected a thread count 1-1024, got '%s'",
                                              argv[i]);
                a->threads = (int)j;
            }
        } else if (strcmp(s, "--quiet") == 0) {
            a->quiet = 1;
        } else if (strcmp(s, "--replace") == 0) {
            a->replace = 1;
        } else if (s[0] == '-') {
            return vl_cli_usage_error("sweep", "unknown option '%s'", s);
        } else if (!a->scenario) {
            a->scenario = s;
        } else {
            return vl_cli_usage_error("sweep", "unexpected argument '%s'", s);
        }
    }
    if (!a->scenario)
        return vl_cli_usage_error("sweep", "missing SCENARIO");
    return VL_OK;
}

/* ------------------------------------------------------------------ steps */

/* The output folder: -o, else the scenario's file name (without ".cfg") + "-sweep". */
static void output_dir(const vl_sweep *sw, const char *out, char *dir, size_t n)
{
    if (out)
        snprintf(dir, n, "%s", out);
    else
        snprintf(dir, n, "%.*s-sweep", (int)(n - 8),
                 strrchr(sw->path, '/') ? strrchr(sw->path, '/') + 1 : sw->path);
    char *dot = strrchr(dir, '.');
    if (!out && dot && strcmp(dot, ".cfg-sweep") == 0)
        strcpy(dot, "-sweep");
}

/* The sweep, its folder and a record per member into c. */
static int start(vl_cli_sweep_ctx *c, const vl_sweep *sw, const char *out, char *dir, size_t n,
                 vl_status *st)
{
    c->sw = sw;
    output_dir(sw, out, dir, n);
    c->dir = dir;
    c->rec = calloc((size_t)sw->members, sizeof *c->rec);
    if (!c->rec)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory for %ld members",
                       sw->members);
    return VL_OK;
}

/* The summary printed at the end: members, classes, the folder. */
static void report(const vl_cli_sweep_ctx *c, double wall)
{
    long count[VL_NCLASS] = {0};
    for (long i = 0; i < c->sw->members; i++)
        count[c->rec[i].cls]++;
    printf("members: %ld (%ld run now, %.1f s)\n", c->sw->members, c->done - c->done_at_start, wall);
    for (int k = VL_NCLASS - 1; k >= 0; k--)
        if (count[k])
            printf("  %-11s %ld (%.1f %%)\n", vl_class_name[k], count[k],
                   100.0 * (double)count[k] / (double)c->sw->members);
    printf("output: %s\n", c->dir);
}

/* Rank 0, once the members ran: the journal closed; then the final files, the journal
 * removed and the report, or why not (a stop by a signal: 128 + signal). */
static int conclude(vl_cli_sweep_ctx *c, vl_status *st)
{
    vl_cli_sweep_progress(c, 1);
    if (c->journal && fclose(c->journal) != 0 && !c->io_error) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "%.900s/%s: %s", c->dir, VL_CLI_JOURNAL,
                 strerror(errno));
    }
    c->journal = NULL;
    int stop = vl_cli_sweep_stopped();
    if (c->io_error)
        return vl_fail(st, VL_ERR_IO, NULL, 0, "%s", c->io_msg);
    if (c->done < c->sw->members) {
        fprintf(stderr, "volev: sweep %s: %ld of %ld members done; run the same command to resume\n",
                stop ? "interrupted" : "incomplete", c->done, c->sw->members);
        return stop ? 128 + stop : VL_ERR_INTERNAL;
    }
    int rc = vl_cli_sweep_write_outputs(c, st);
    if (rc == VL_OK) {
        char path[1200];
        snprintf(path, sizeof path, "%s/%s", c->dir, VL_CLI_JOURNAL);
        unlink(path);
        report(c, vl_cli_sweep_now() - c->t_start);
    }
    return rc;
}

/* Rank 0: the folder locked and checked (vl_cli_sweep_prepare_dir), a note on the
 * leftovers it removed; *already: it holds this sweep's results. */
static int prepare(vl_cli_sweep_ctx *c, int replace, int *already, vl_status *st)
{
    int p = vl_cli_sweep_prepare_dir(c, replace, st);
    if (c->removed)
        fprintf(stderr, "volev: note: %s: removed %ld temporary file%s left by a killed volev\n",
                c->dir, c->removed, c->removed == 1 ? "" : "s");
    *already = p < 0;
    return p < 0 ? VL_OK : p;
}

/* Frees what the command holds. */
static void release(vl_cli_sweep_ctx *c, char *done, vl_sweep *sw)
{
    if (c->journal)
        fclose(c->journal);
    c->journal = NULL;
    vl_folder_unlock(c->dir, c->lock);
    c->lock = -1;
    for (long i = 0; c->rec && i < sw->members; i++)
        free(c->rec[i].reason);
    free(c->rec);
    free(done);
    vl_sweep_free(sw);
}

/* Loads the sweep, prepares the folder (rank 0), shares the state with every rank, runs
 * the members still to run, and (rank 0) writes the final files. */
int vl_cli_sweep(int argc, char **argv)
{
    sweep_args a;
    if (parse(argc, argv, &a))
        return VL_ERR_USAGE;
    vl_cli_sweep_ctx c = {0};
    c.lock = -1;
    vl_cli_sweep_mpi_start(&argc, &argv, &c, &a.threads);
    vl_status st;
    vl_status_clear(&st);
    vl_cli_cache_start();
    vl_sweep *sw = vl_sweep_load(a.scenario, &st);
    char dir[1024], *done = NULL;
    int rc = sw ? start(&c, sw, a.out, dir, sizeof dir, &st) : st.code, already = 0;
    if (rc == VL_OK && c.rank == 0)
        rc = prepare(&c, a.replace, &already, &st);
    if (vl_cli_sweep_share_state(&c, &rc, already)) { /* another rank, told to stop */
        release(&c, done, sw);
        vl_cli_sweep_mpi_end();
        /* rank 0 reports and carries the status: a non-zero exit here would let mpirun
         * abort rank 0 before its message is written */
        return VL_OK;
    }
    if (rc == VL_OK && !already)
        rc = vl_cli_sweep_share_done(&c, &done, &st);
    if (rc == VL_OK && !already) {
        rc = vl_cli_sweep_run(&c, done, a.threads, a.quiet, &st);
        if (c.rank == 0)
            rc = conclude(&c, &st);
    }
    if (already && c.rank == 0)
        printf("sweep already complete in %s (same settings): nothing to do\n", dir);
    vl_cli_cache_finish();
    release(&c, done, sw);
    vl_cli_sweep_mpi_end();
    if (c.rank != 0)
        return VL_OK;
    if (rc > 0 && rc < 128 && st.code)
        return vl_cli_report(&st);
    return rc;
}
