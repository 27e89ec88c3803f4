/* sweep_files.c: the final files of a sweep (sweep_internal.h, docs/ensembles.md):
 * members.csv, scenario.resolved.cfg, ensemble_summary.csv, ensemble_series.csv and,
 * for a saltelli design, sensitivity.csv. They are written from the kept members' exact
 * values in member order, so threads, ranks and interruptions do not change them; each
 * under a temporary name, renamed when complete. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "sweep_internal.h"
#include "volev/folder.h"
#include "volev/output.h"
#include "volev/params.h"
#include "volev/scenario.h"

/* A file being written: its temporary and final names. */
typedef struct {
    char tmp[1200], final[1200];
    FILE *f;
} outfile;

/* Opens DIR/.NAME.PID.tmp (vl_folder_temp_name) for writing, to become DIR/NAME. */
static int out_open(outfile *o, const char *dir, const char *name, vl_status *st)
{
    snprintf(o->final, sizeof o->final, "%s/%s", dir, name);
    vl_folder_temp_name(o->tmp, sizeof o->tmp, dir, name);
    o->f = fopen(o->tmp, "w");
    if (!o->f)
        return vl_fail(st, VL_ERR_IO, o->tmp, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}

/* Closes o (if open); a write error is reported. */
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

/* "# volev VERSION" and "# sweep hash HASH of SCENARIO: DESIGN, N members". */
static void header_lines(const vl_cli_sweep_ctx *c, FILE *f)
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
static int write_base(const vl_cli_sweep_ctx *c, outfile *o, vl_status *st)
{
    vl_scenario *base = vl_scenario_load(c->sw->path, NULL, 0, st);
    if (!base)
        return st->code;
    int rc = vl_scenario_write_resolved(base, o->f, st);
    vl_scenario_free(base);
    return rc;
}

/* qsort order of doubles. */
static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return x < y ? -1 : x > y;
}

/* Finite values of v (stride apart) of the members that ran into buf, sorted. */
static size_t gather(const vl_cli_sweep_ctx *c, const double *(*get)(const vl_cli_record *), size_t j,
                     double *buf)
{
    size_t n = 0;
    for (long i = 0; i < c->sw->members; i++) {
        const vl_cli_record *r = &c->rec[i];
        if (r->status != 0)
            continue;
        double v = get(r)[j];
        if (isfinite(v))
            buf[n++] = v;
    }
    qsort(buf, n, sizeof *buf, cmp_double);
    return n;
}

/* Outcomes, water history, O2 history of a record. */
static const double *get_out(const vl_cli_record *r) { return r->out; }
static const double *get_water(const vl_cli_record *r) { return r->water; }
static const double *get_o2(const vl_cli_record *r) { return r->o2; }

static const double quantile_p[5] = {0.05, 0.25, 0.5, 0.75, 0.95};

/* ensemble_summary.csv: quantiles of each outcome, counts of each class. */
static void write_summary(const vl_cli_sweep_ctx *c, FILE *f, double *buf)
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
        vl_output_put(f, ",", "%.10g", sum / (double)n);
        vl_output_put(f, ",", "%.10g", buf[0]);
        for (int q = 0; q < 5; q++)
            vl_output_put(f, ",", "%.10g", vl_quantile_sorted(buf, n, quantile_p[q]));
        vl_output_put(f, ",", "%.10g", buf[n - 1]);
        fprintf(f, ",\n");
    }
    long count[VL_NCLASS] = {0};
    for (long i = 0; i < c->sw->members; i++)
        count[c->rec[i].cls]++;
    for (int k = 0; k < VL_NCLASS; k++) {
        fprintf(f, "class,%s,,%ld,,,,,,,,", vl_class_name[k], count[k]);
        vl_output_put(f, ",", "%.10g", (double)count[k] / (double)c->sw->members);
        fputc('\n', f);
    }
}

/* ensemble_series.csv: water and O2 quantiles at the common ages. */
static void write_series(const vl_cli_sweep_ctx *c, FILE *f, double *buf)
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
        vl_output_put(f, "", "%.10g", c->sw->t_grid_s[j] / 3.15576e7);
        fprintf(f, ",%zu", n);
        for (int k = 0; k < 5; k++)
            vl_output_put(f, ",", "%.10g", n ? vl_quantile_sorted(buf, n, quantile_p[k]) : NAN);
        n = gather(c, get_o2, j, buf);
        for (int k = 0; k < 5; k++)
            vl_output_put(f, ",", "%.10g", n ? vl_quantile_sorted(buf, n, quantile_p[k]) : NAN);
        fputc('\n', f);
    }
}

/* sensitivity.csv: Sobol indices of each sensitivity outcome per axis. */
static int write_sensitivity(const vl_cli_sweep_ctx *c, FILE *f, vl_status *st)
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
        for (size_t a = 0; a < sw->k; a++) {
            const double v[6] = {idx[a].s1, idx[a].s1_lo, idx[a].s1_hi,
                                 idx[a].st, idx[a].st_lo, idx[a].st_hi};
            fprintf(f, "%s,%s", vl_outcome_name[o], sw->axes[a].key);
            for (int q = 0; q < 6; q++) /* an index without a value: empty */
                vl_output_put(f, ",", "%.6g", v[q]);
            fprintf(f, ",%ld\n", used);
        }
    }
    free(y);
    free(idx);
    return rc;
}

/* The files, in the order they are written (members.csv renamed last). */
enum { F_MEMBERS, F_BASE, F_SUMMARY, F_SERIES, F_SENS, NF };
static const char *const file_name[NF] = {"members.csv", "scenario.resolved.cfg",
                                          "ensemble_summary.csv", "ensemble_series.csv",
                                          "sensitivity.csv"};

/* members.csv: header lines, how each axis varied, the columns, one row per member. */
static int write_members(const vl_cli_sweep_ctx *c, FILE *f, vl_status *st)
{
    header_lines(c, f);
    fprintf(f, "# one row per member: its overrides, outcome class and outcomes (empty: "
               "undefined); rerun one with volev run %s --set KEY=VALUE ...\n", c->sw->path);
    axis_lines(c->sw, f);
    int rc = VL_OK;
    char *h = vl_sweep_header(c->sw);
    if (!h)
        rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    else
        fprintf(f, "%s\n", h);
    free(h);
    for (long i = 0; i < c->sw->members && rc == VL_OK; i++) {
        vl_member m;
        vl_cli_sweep_unpack(c, i, &m);
        char *row = vl_sweep_row(c->sw, &m);
        if (!row)
            rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        else
            fprintf(f, "%s\n", row);
        free(row);
    }
    return rc;
}

/* The content of the nf open files o (buf: room for one value per member). */
static int write_contents(const vl_cli_sweep_ctx *c, outfile *o, int nf, double *buf,
                          vl_status *st)
{
    int rc = write_members(c, o[F_MEMBERS].f, st);
    if (rc == VL_OK)
        rc = write_base(c, &o[F_BASE], st);
    if (rc == VL_OK) {
        write_summary(c, o[F_SUMMARY].f, buf);
        write_series(c, o[F_SERIES].f, buf);
        if (nf == NF)
            rc = write_sensitivity(c, o[F_SENS].f, st);
    }
    return rc;
}

/* Closes the nf files; after writing them with result rc, renames them into place
 * (members.csv last: its presence marks a finished sweep) or removes them. */
static int commit(outfile *o, int nf, int rc, vl_status *st)
{
    for (int k = 0; k < nf; k++) {
        int e = out_close(&o[k], st);
        if (rc == VL_OK)
            rc = e;
    }
    for (int k = nf - 1; k >= 0 && rc == VL_OK; k--)
        if (rename(o[k].tmp, o[k].final) != 0)
            rc = vl_fail(st, VL_ERR_IO, o[k].final, 0, "cannot rename into place: %s",
                         strerror(errno));
    if (rc != VL_OK)
        for (int k = 0; k < nf; k++)
            unlink(o[k].tmp);
    return rc;
}

int vl_cli_sweep_write_outputs(const vl_cli_sweep_ctx *c, vl_status *st)
{
    outfile o[NF];
    memset(o, 0, sizeof o);
    int nf = c->sw->design == VL_DESIGN_SALTELLI && !c->sw->catalogue_mode ? NF : NF - 1;
    double *buf = malloc((size_t)c->sw->members * sizeof *buf);
    int rc = buf ? VL_OK : vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    for (int k = 0; k < nf && rc == VL_OK; k++)
        rc = out_open(&o[k], c->dir, file_name[k], st);
    if (rc == VL_OK)
        rc = write_contents(c, o, nf, buf, st);
    rc = commit(o, nf, rc, st);
    free(buf);
    return rc;
}
