/* sweep.c: `volev sweep SCENARIO [-o DIR] [-j THREADS] [--quiet]`: run the members of the
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
#include <fcntl.h>
#include <math.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <time.h>
#include <unistd.h>

#ifdef _OPENMP
#include <omp.h>
#endif
#ifdef VL_MPI
#include <mpi.h>
#endif

#include "cli.h"
#include "volev/integrate.h"
#include "volev/output.h"
#include "volev/params.h"
#include "volev/sweep.h"

#define JOURNAL "sweep.journal"
#define JOURNAL_TAG "# volev sweep journal "

static volatile sig_atomic_t stop_signal;

/* Stop taking members, and stop the running ones (they are not recorded). */
static void on_signal(int sig)
{
    stop_signal = sig;
    vl_integrate_request_stop(sig);
}

/* Compact record of a finished member (the reason only when it failed). */
typedef struct {
    int have;
    int status, regime, cls;
    long steps;
    double out[VL_NOUT];
    double water[VL_SWEEP_NT], o2[VL_SWEEP_NT];
    char *reason;
} record;

typedef struct {
    const vl_sweep *sw;
    const char *dir;
    record *rec;
    long done;              /* members with a record */
    FILE *journal;          /* rank 0 */
    volatile int io_error;
    char io_msg[VL_MSG_MAX];
    int progress;           /* print a progress line (terminal, not --quiet) */
    double t_start, t_last;
    long done_at_start;
    int rank, size;
} sweep_ctx;

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

static void keep(sweep_ctx *c, const vl_member *m)
{
    record *r = &c->rec[m->index];
    if (r->have)
        return;
    r->have = 1;
    r->status = m->status;
    r->regime = m->regime;
    r->cls = m->cls;
    r->steps = m->steps;
    memcpy(r->out, m->out, sizeof r->out);
    memcpy(r->water, m->water_to, sizeof r->water);
    memcpy(r->o2, m->o2_bar, sizeof r->o2);
    r->reason = m->status != 0 && m->reason[0] ? strdup(m->reason) : NULL;
    c->done++;
}

static void unpack(const sweep_ctx *c, long i, vl_member *m)
{
    const record *r = &c->rec[i];
    memset(m, 0, sizeof *m);
    m->index = i;
    m->status = r->status;
    m->regime = r->regime;
    m->cls = r->cls;
    m->steps = r->steps;
    memcpy(m->out, r->out, sizeof r->out);
    memcpy(m->water_to, r->water, sizeof r->water);
    memcpy(m->o2_bar, r->o2, sizeof r->o2);
    if (r->reason)
        snprintf(m->reason, sizeof m->reason, "%s", r->reason);
}

static void show_progress(sweep_ctx *c, int final)
{
    if (!c->progress)
        return;
    double t = now_s();
    if (!final && t - c->t_last < 0.5)
        return;
    c->t_last = t;
    long new_done = c->done - c->done_at_start;
    double rate = (double)new_done / fmax(t - c->t_start, 1e-9);
    double left = rate > 0.0 ? (double)(c->sw->members - c->done) / rate : 0.0;
    fprintf(stderr, "\rvolev sweep: %ld/%ld members, %.1f/s, %02d:%02d:%02d left   ", c->done,
            c->sw->members, rate, (int)(left / 3600.0), (int)fmod(left / 60.0, 60.0),
            (int)fmod(left, 60.0));
    if (final)
        fputc('\n', stderr);
    fflush(stderr);
}

/* Rank 0: a finished member's journal line into the journal and the records. */
static void take_line(sweep_ctx *c, const char *line)
{
    vl_member m;
    if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
        return;
    if (c->rec[m.index].have)
        return;
    if (!c->io_error && (fputs(line, c->journal) < 0 || fflush(c->journal) != 0)) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "%s/%s: cannot append: %s", c->dir, JOURNAL,
                 strerror(errno));
    }
    keep(c, &m);
    show_progress(c, 0);
}

#ifdef VL_MPI
enum { TAG_LINE = 1, TAG_DONE = 2 };

/* Rank 0: receive what is waiting (block: wait for one message). Returns 1 for a
 * TAG_DONE message. */
static int receive_one(sweep_ctx *c, int block)
{
    MPI_Status ms;
    int flag = 1;
    if (block)
        MPI_Probe(MPI_ANY_SOURCE, MPI_ANY_TAG, MPI_COMM_WORLD, &ms);
    else
        MPI_Iprobe(MPI_ANY_SOURCE, MPI_ANY_TAG, MPI_COMM_WORLD, &flag, &ms);
    if (!flag)
        return -1;
    int len;
    MPI_Get_count(&ms, MPI_CHAR, &len);
    char *buf = malloc((size_t)len + 1);
    if (!buf) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "out of memory");
        MPI_Abort(MPI_COMM_WORLD, 1);
    }
    MPI_Recv(buf, len, MPI_CHAR, ms.MPI_SOURCE, ms.MPI_TAG, MPI_COMM_WORLD, MPI_STATUS_IGNORE);
    buf[len] = '\0';
    if (ms.MPI_TAG == TAG_LINE)
        take_line(c, buf);
    free(buf);
    return ms.MPI_TAG == TAG_DONE;
}
#endif

/* A member finished on this rank (called inside a critical section). */
static void finished(sweep_ctx *c, const vl_member *m)
{
    char *line = vl_sweep_journal_line(m);
    if (!line) {
        c->io_error = 1;
        snprintf(c->io_msg, sizeof c->io_msg, "out of memory");
        return;
    }
    if (c->rank == 0) {
        take_line(c, line);
#ifdef VL_MPI
        while (c->size > 1 && receive_one(c, 0) >= 0)
            ;
#endif
    } else {
#ifdef VL_MPI
        MPI_Send(line, (int)strlen(line), MPI_CHAR, 0, TAG_LINE, MPI_COMM_WORLD);
#endif
    }
    free(line);
}

/* ------------------------------------------------------------------ journal */

static int read_journal(sweep_ctx *c, const char *path, vl_status *st)
{
    FILE *f = fopen(path, "r+");
    if (!f)
        return errno == ENOENT ? VL_OK
                               : vl_fail(st, VL_ERR_IO, path, 0, "cannot open: %s", strerror(errno));
    char *line = NULL;
    size_t cap = 0;
    ssize_t len;
    long good_end = 0, lineno = 0;
    int rc = VL_OK;
    while ((len = getline(&line, &cap, f)) > 0) {
        lineno++;
        if (lineno == 1) {
            char want[128];
            snprintf(want, sizeof want, "%s%s\n", JOURNAL_TAG, c->sw->hash);
            if (strcmp(line, want) != 0) {
                rc = vl_fail(st, VL_ERR_INPUT, path, 1,
                             "this folder holds an interrupted sweep with other settings (or "
                             "another volev version); remove it or choose another -o");
                break;
            }
            good_end = ftell(f);
            continue;
        }
        vl_member m;
        if (vl_sweep_journal_parse(line, &m) != 0 || m.index >= c->sw->members)
            break; /* cut short by the interruption: drop it and what follows */
        keep(c, &m);
        good_end = ftell(f);
    }
    free(line);
    if (rc == VL_OK && lineno == 0)
        good_end = 0;
    if (rc == VL_OK && ftruncate(fileno(f), good_end) != 0)
        rc = vl_fail(st, VL_ERR_IO, path, 0, "cannot truncate: %s", strerror(errno));
    fclose(f);
    return rc;
}

/* The hash recorded in a finished members.csv (its second line), or "". */
static void finished_hash(const char *path, char out[17])
{
    out[0] = '\0';
    FILE *f = fopen(path, "r");
    if (!f)
        return;
    char line[512];
    for (int k = 0; k < 4 && fgets(line, sizeof line, f); k++) {
        const char *h = strstr(line, "sweep hash ");
        if (h && line[0] == '#') {
            snprintf(out, 17, "%.16s", h + 11);
            break;
        }
    }
    fclose(f);
}

/* ------------------------------------------------------------------ final files */

typedef struct {
    char tmp[1200], final[1200];
    FILE *f;
} outfile;

static int out_open(outfile *o, const char *dir, const char *name, vl_status *st)
{
    snprintf(o->final, sizeof o->final, "%s/%s", dir, name);
    snprintf(o->tmp, sizeof o->tmp, "%s/.%s.tmp", dir, name);
    o->f = fopen(o->tmp, "w");
    if (!o->f)
        return vl_fail(st, VL_ERR_IO, o->tmp, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}

static int out_close(outfile *o, vl_status *st)
{
    if (!o->f)
        return VL_OK;
    int bad = ferror(o->f) | fclose(o->f);
    o->f = NULL;
    if (bad)
        return vl_fail(st, VL_ERR_IO, o->tmp, 0, "write error: %s", strerror(errno));
    return VL_OK;
}

static void header_lines(const sweep_ctx *c, FILE *f)
{
    char design[64];
    vl_choice_name(VL_DESIGN_CHOICES, c->sw->design, design, sizeof design);
    fprintf(f, "# volev %s\n", vl_version());
    fprintf(f, "# sweep hash %s of %s: %s, %ld members\n", c->sw->hash, c->sw->path,
            c->sw->catalogue_mode ? "catalogue" : design, c->sw->members);
}

/* "# axis KEY grid SPACING FROM TO POINTS" or "# axis KEY DISTRIBUTION P1 P2": how each
 * axis varied (the figures read it: docs/figures.md). */
static void axis_lines(const vl_sweep *sw, FILE *f)
{
    char name[64];
    for (size_t a = 0; a < sw->k; a++) {
        const vl_axis *x = &sw->axes[a];
        if (sw->design == VL_DESIGN_GRID)
            fprintf(f, "# axis %s grid %s %.17g %.17g %ld\n", x->key,
                    vl_choice_name(VL_SPACING_CHOICES, x->spacing, name, sizeof name), x->from,
                    x->to, x->points);
        else if (x->dist == VL_DIST_NORMAL)
            fprintf(f, "# axis %s normal %.17g %.17g\n", x->key, x->mean, x->sd);
        else if (x->dist == VL_DIST_TRUNC_NORMAL)
            fprintf(f, "# axis %s truncated_normal %.17g %.17g %.17g %.17g\n", x->key, x->mean,
                    x->sd, x->low, x->high);
        else
            fprintf(f, "# axis %s %s %.17g %.17g\n", x->key,
                    vl_choice_name(VL_DIST_CHOICES, x->dist, name, sizeof name), x->low, x->high);
    }
}

/* The base scenario, resolved (every parameter), as DIR/scenario.resolved.cfg: what the
 * members share; the figures read the star and planet from it. */
static int write_base(const sweep_ctx *c, outfile *o, vl_status *st)
{
    vl_scenario *base = vl_scenario_load(c->sw->path, NULL, 0, st);
    if (!base)
        return st->code;
    int rc = vl_scenario_write_resolved(base, o->f, st);
    vl_scenario_free(base);
    return rc;
}

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return x < y ? -1 : x > y;
}

/* Finite values of v (stride apart) of the members that ran into buf, sorted. */
static size_t gather(const sweep_ctx *c, const double *(*get)(const record *), size_t j,
                     double *buf)
{
    size_t n = 0;
    for (long i = 0; i < c->sw->members; i++) {
        const record *r = &c->rec[i];
        if (r->status != 0)
            continue;
        double v = get(r)[j];
        if (isfinite(v))
            buf[n++] = v;
    }
    qsort(buf, n, sizeof *buf, cmp_double);
    return n;
}

static const double *get_out(const record *r) { return r->out; }
static const double *get_water(const record *r) { return r->water; }
static const double *get_o2(const record *r) { return r->o2; }

static const double quantile_p[5] = {0.05, 0.25, 0.5, 0.75, 0.95};

static void write_summary(const sweep_ctx *c, FILE *f, double *buf)
{
    header_lines(c, f);
    fprintf(f, "# quantiles over the members that ran (count); classes over all members\n");
    fprintf(f, "kind,name,unit,count,mean,min,p05,p25,p50,p75,p95,max,fraction\n");
    for (int o = 0; o < VL_NOUT; o++) {
        size_t n = gather(c, get_out, (size_t)o, buf);
        fprintf(f, "outcome,%s,%s,%zu", vl_outcome_name[o], vl_outcome_unit[o], n);
        if (n == 0) {
            fprintf(f, ",,,,,,,,,\n");
            continue;
        }
        double sum = 0.0;
        for (size_t k = 0; k < n; k++)
            sum += buf[k];
        fprintf(f, ",%.10g,%.10g", sum / (double)n, buf[0]);
        for (int q = 0; q < 5; q++)
            fprintf(f, ",%.10g", vl_quantile_sorted(buf, n, quantile_p[q]));
        fprintf(f, ",%.10g,\n", buf[n - 1]);
    }
    long count[VL_NCLASS] = {0};
    for (long i = 0; i < c->sw->members; i++)
        count[c->rec[i].cls]++;
    for (int k = 0; k < VL_NCLASS; k++)
        fprintf(f, "class,%s,,%ld,,,,,,,,,%.10g\n", vl_class_name[k], count[k],
                (double)count[k] / (double)c->sw->members);
}

static void write_series(const sweep_ctx *c, FILE *f, double *buf)
{
    header_lines(c, f);
    fprintf(f, "# quantiles over the members that ran, at common ages (log-spaced over the "
               "base run); empty where no member covers the age\n");
    fprintf(f, "time_yr,members");
    static const char *const q[5] = {"p05", "p25", "p50", "p75", "p95"};
    for (int k = 0; k < 5; k++)
        fprintf(f, ",water_to_%s", q[k]);
    for (int k = 0; k < 5; k++)
        fprintf(f, ",o2_bar_%s", q[k]);
    fputc('\n', f);
    for (size_t j = 0; j < VL_SWEEP_NT; j++) {
        size_t n = gather(c, get_water, j, buf);
        fprintf(f, "%.10g,%zu", c->sw->t_grid_s[j] / 3.15576e7, n);
        for (int k = 0; k < 5; k++)
            n ? fprintf(f, ",%.10g", vl_quantile_sorted(buf, n, quantile_p[k])) : fprintf(f, ",");
        n = gather(c, get_o2, j, buf);
        for (int k = 0; k < 5; k++)
            n ? fprintf(f, ",%.10g", vl_quantile_sorted(buf, n, quantile_p[k])) : fprintf(f, ",");
        fputc('\n', f);
    }
}

static int write_sensitivity(const sweep_ctx *c, FILE *f, vl_status *st)
{
    const vl_sweep *sw = c->sw;
    header_lines(c, f);
    fprintf(f, "# first-order (Saltelli et al. 2010) and total (Jansen 1999) Sobol indices, "
               "%ld bootstrap resamples, %.3g intervals; blocks: base samples used\n",
            sw->bootstrap, sw->confidence);
    fprintf(f, "outcome,parameter,s1,s1_low,s1_high,st,st_low,st_high,blocks\n");
    double *y = malloc((size_t)sw->members * sizeof *y);
    vl_sobol_index *idx = malloc(sw->k * sizeof *idx);
    int rc = VL_OK;
    if (!y || !idx)
        rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    for (size_t s = 0; s < sw->nsens && rc == VL_OK; s++) {
        int o = sw->sens[s];
        for (long i = 0; i < sw->members; i++)
            y[i] = c->rec[i].status == 0 ? c->rec[i].out[o] : NAN;
        long used = 0;
        vl_status e;
        if (vl_sobol_indices(y, sw->n, sw->k, sw->bootstrap, sw->confidence, sw->seed, idx, &used,
                             &e) != VL_OK) {
            /* not computable for this outcome (e.g. constant): say so in the file */
            fprintf(f, "# %s: %s\n", vl_outcome_name[o], e.msg);
            continue;
        }
        for (size_t a = 0; a < sw->k; a++)
            fprintf(f, "%s,%s,%.6g,%.6g,%.6g,%.6g,%.6g,%.6g,%ld\n", vl_outcome_name[o],
                    sw->axes[a].key, idx[a].s1, idx[a].s1_lo, idx[a].s1_hi, idx[a].st,
                    idx[a].st_lo, idx[a].st_hi, used);
    }
    free(y);
    free(idx);
    return rc;
}

static int write_outputs(sweep_ctx *c, vl_status *st)
{
    enum { F_MEMBERS, F_BASE, F_SUMMARY, F_SERIES, F_SENS, NF };
    static const char *const names[NF] = {"members.csv", "scenario.resolved.cfg",
                                          "ensemble_summary.csv", "ensemble_series.csv",
                                          "sensitivity.csv"};
    outfile o[NF];
    memset(o, 0, sizeof o);
    int nf = c->sw->design == VL_DESIGN_SALTELLI && !c->sw->catalogue_mode ? NF : NF - 1;
    double *buf = malloc((size_t)c->sw->members * sizeof *buf);
    int rc = buf ? VL_OK : vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    for (int k = 0; k < nf && rc == VL_OK; k++)
        rc = out_open(&o[k], c->dir, names[k], st);
    if (rc == VL_OK) {
        FILE *f = o[F_MEMBERS].f;
        header_lines(c, f);
        fprintf(f, "# one row per member: its overrides, outcome class and outcomes (empty: "
                   "undefined); rerun one with volev run %s --set KEY=VALUE ...\n", c->sw->path);
        axis_lines(c->sw, f);
        char *h = vl_sweep_header(c->sw);
        if (!h)
            rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        else
            fprintf(f, "%s\n", h);
        free(h);
        for (long i = 0; i < c->sw->members && rc == VL_OK; i++) {
            vl_member m;
            unpack(c, i, &m);
            char *row = vl_sweep_row(c->sw, &m);
            if (!row)
                rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
            else
                fprintf(f, "%s\n", row);
            free(row);
        }
    }
    if (rc == VL_OK)
        rc = write_base(c, &o[F_BASE], st);
    if (rc == VL_OK) {
        write_summary(c, o[F_SUMMARY].f, buf);
        write_series(c, o[F_SERIES].f, buf);
        if (nf == NF)
            rc = write_sensitivity(c, o[F_SENS].f, st);
    }
    for (int k = 0; k < nf; k++) {
        int e = out_close(&o[k], st);
        if (rc == VL_OK)
            rc = e;
    }
    /* members.csv last: its presence marks a finished sweep */
    for (int k = nf - 1; k >= 0 && rc == VL_OK; k--)
        if (rename(o[k].tmp, o[k].final) != 0)
            rc = vl_fail(st, VL_ERR_IO, o[k].final, 0, "cannot rename into place: %s",
                         strerror(errno));
    if (rc != VL_OK)
        for (int k = 0; k < nf; k++)
            unlink(o[k].tmp);
    free(buf);
    return rc;
}

/* ------------------------------------------------------------------ command */

typedef struct {
    const char *scenario, *out;
    int threads, quiet;
} sweep_args;

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

/* Rank 0: output folder, earlier state. Returns VL_OK to go on, -1 if already finished. */
static int prepare_dir(sweep_ctx *c, vl_status *st)
{
    char path[1200];
    if (mkdir(c->dir, 0777) != 0 && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "cannot create folder: %s", strerror(errno));
    struct stat sb;
    if (stat(c->dir, &sb) != 0 || !S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_IO, c->dir, 0, "not a folder");
    snprintf(path, sizeof path, "%s/members.csv", c->dir);
    if (access(path, F_OK) == 0) {
        char h[17];
        finished_hash(path, h);
        if (strcmp(h, c->sw->hash) == 0)
            return -1;
        return vl_fail(st, VL_ERR_IO, c->dir, 0,
                       "holds the results of another sweep; remove it or choose another -o");
    }
    snprintf(path, sizeof path, "%s/%s", c->dir, JOURNAL);
    int rc = read_journal(c, path, st);
    if (rc)
        return rc;
    c->journal = fopen(path, "a");
    if (!c->journal)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    if (ftell(c->journal) == 0 &&
        (fprintf(c->journal, "%s%s\n", JOURNAL_TAG, c->sw->hash) < 0 || fflush(c->journal) != 0))
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}

static void report(const sweep_ctx *c, double wall)
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

int vl_cli_sweep(int argc, char **argv)
{
    sweep_args a;
    if (parse(argc, argv, &a))
        return VL_ERR_USAGE;
    int rank = 0, size = 1;
#ifdef VL_MPI
    int provided;
    MPI_Init_thread(&argc, &argv, MPI_THREAD_SERIALIZED, &provided);
    MPI_Comm_rank(MPI_COMM_WORLD, &rank);
    MPI_Comm_size(MPI_COMM_WORLD, &size);
    if (provided < MPI_THREAD_SERIALIZED)
        a.threads = 1; /* members on one thread per rank */
#endif
    vl_status st;
    vl_status_clear(&st);
    vl_sweep *sw = vl_sweep_load(a.scenario, &st);
    sweep_ctx c = {0};
    c.rank = rank;
    c.size = size;
    char dir[1024];
    int rc = sw ? VL_OK : st.code, already = 0;
    if (sw) {
        c.sw = sw;
        if (a.out)
            snprintf(dir, sizeof dir, "%s", a.out);
        else
            snprintf(dir, sizeof dir, "%.*s-sweep", (int)(sizeof dir - 8),
                     strrchr(sw->path, '/') ? strrchr(sw->path, '/') + 1 : sw->path);
        char *dot = strrchr(dir, '.');
        if (!a.out && dot && strcmp(dot, ".cfg-sweep") == 0)
            strcpy(dot, "-sweep");
        c.dir = dir;
        c.rec = calloc((size_t)sw->members, sizeof *c.rec);
        if (!c.rec)
            rc = vl_fail(&st, VL_ERR_INTERNAL, NULL, 0, "out of memory for %ld members",
                         sw->members);
    }
    if (rc == VL_OK && rank == 0) {
        int p = prepare_dir(&c, &st);
        if (p < 0)
            already = 1;
        else
            rc = p;
    }
    /* every rank learns the state: go on or not, and which members are done */
    char *done = NULL;
#ifdef VL_MPI
    int state[2] = {rc, already};
    MPI_Bcast(state, 2, MPI_INT, 0, MPI_COMM_WORLD);
    if (rank != 0 && (state[0] != VL_OK || state[1])) {
        vl_sweep_free(sw);
        free(c.rec);
        MPI_Finalize();
        return state[0];
    }
#endif
    if (rc == VL_OK && !already) {
        done = calloc((size_t)sw->members, 1);
        if (!done)
            rc = vl_fail(&st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        for (long i = 0; done && i < sw->members; i++)
            done[i] = (char)c.rec[i].have;
#ifdef VL_MPI
        MPI_Bcast(done, (int)sw->members, MPI_CHAR, 0, MPI_COMM_WORLD);
#endif
    }
    if (rc == VL_OK && !already) {
        struct sigaction sa;
        memset(&sa, 0, sizeof sa);
        sa.sa_handler = on_signal;
        sigaction(SIGINT, &sa, NULL);
        sigaction(SIGTERM, &sa, NULL);
        long npend = 0;
        for (long i = 0; i < sw->members; i++)
            if (!done[i])
                npend++;
        long *mine = malloc((size_t)(npend ? npend : 1) * sizeof *mine), nmine = 0, k = 0;
        for (long i = 0; mine && i < sw->members; i++)
            if (!done[i] && k++ % size == rank)
                mine[nmine++] = i;
        c.progress = rank == 0 && !a.quiet && isatty(STDERR_FILENO);
        c.t_start = c.t_last = now_s();
        c.done_at_start = c.done;
        if (!mine)
            rc = vl_fail(&st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        int threads = a.threads;
#ifdef _OPENMP
        if (threads < 1)
            threads = omp_get_max_threads();
#else
        threads = 1;
#endif
        (void)threads;
        long sent = 0;
#pragma omp parallel for schedule(dynamic, 1) num_threads(threads) reduction(+ : sent)
        for (long j = 0; j < (mine ? nmine : 0); j++) {
            if (stop_signal || c.io_error) /* an unwritable journal: stop taking members */
                continue;
            vl_member *m = malloc(sizeof *m);
            if (!m)
                continue;
            vl_sweep_run_member(sw, mine[j], m);
            if (m->status != VL_ERR_STOPPED) { /* a member cut short is run again on resume */
#pragma omp critical(volev_sweep_out)
                finished(&c, m);
                sent++;
            }
            free(m);
        }
#ifdef VL_MPI
        if (rank != 0) {
            long s = sent;
            MPI_Send(&s, (int)sizeof s, MPI_CHAR, 0, TAG_DONE, MPI_COMM_WORLD);
        } else {
            for (int left = size - 1; left > 0;)
                if (receive_one(&c, 1) == 1)
                    left--;
        }
#endif
        free(mine);
        if (rank == 0) {
            show_progress(&c, 1);
            if (c.journal && fclose(c.journal) != 0 && !c.io_error) {
                c.io_error = 1;
                snprintf(c.io_msg, sizeof c.io_msg, "%.900s/%s: %s", dir, JOURNAL, strerror(errno));
            }
            c.journal = NULL;
            if (c.io_error) {
                rc = vl_fail(&st, VL_ERR_IO, NULL, 0, "%s", c.io_msg);
            } else if (c.done < sw->members) {
                fprintf(stderr,
                        "volev: sweep %s: %ld of %ld members done; run the same command to "
                        "resume\n",
                        stop_signal ? "interrupted" : "incomplete", c.done, sw->members);
                rc = stop_signal ? 128 + stop_signal : VL_ERR_INTERNAL;
            } else {
                rc = write_outputs(&c, &st);
                if (rc == VL_OK) {
                    char path[1200];
                    snprintf(path, sizeof path, "%s/%s", dir, JOURNAL);
                    unlink(path);
                    report(&c, now_s() - c.t_start);
                }
            }
        }
    }
    if (already && rank == 0)
        printf("sweep already complete in %s (same settings): nothing to do\n", dir);
    if (c.journal)
        fclose(c.journal);
    if (c.rec)
        for (long i = 0; i < sw->members; i++)
            free(c.rec[i].reason);
    free(c.rec);
    free(done);
    vl_sweep_free(sw);
#ifdef VL_MPI
    MPI_Finalize();
#endif
    if (rank != 0)
        return VL_OK;
    if (rc > 0 && rc < 128 && st.code)
        return vl_cli_report(&st);
    return rc;
}
