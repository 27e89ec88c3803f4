/* compare_write.c: the files of `volev compare -o DIR` (compare.h): compare.csv (the
 * table, machine-readable, with the runs' provenance) and compare.FORMAT (the runs'
 * series.csv drawn on shared axes by plots/comparison.gp), both written under temporary
 * names and renamed into place only when both succeeded. */
#include <ctype.h>
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "compare.h"
#include "gnuplot.h"
#include "volev/output.h"

/* s with control characters replaced, for one-line comments. */
static void comment_safe(const char *s, char *out, size_t n)
{
    size_t k = 0;
    for (; *s && k + 1 < n; s++)
        out[k++] = iscntrl((unsigned char)*s) ? '?' : *s;
    out[k] = '\0';
}

static void provenance(FILE *f, const char *key, const vl_compare_run *r)
{
    char label[VL_COMPARE_LABEL_MAX], dir[VL_PATH_MAX];
    comment_safe(r->label, label, sizeof label);
    comment_safe(r->dir, dir, sizeof dir);
    fprintf(f, "# %s = %s: run folder %s (volev %s; resolved scenario hash %s)\n", key, label, dir,
            r->version[0] ? r->version : "unknown", r->hash[0] ? r->hash : "unknown");
}

/* The comment lines and the header of compare.csv. */
static void write_head(FILE *f, const vl_compare_table *t)
{
    fprintf(f, "# volev %s: comparison of two runs\n", vl_version());
    provenance(f, "a", t->a);
    provenance(f, "b", t->b);
    fprintf(f, "# summary rows: every quantity of either run's summary.csv (quantity and unit "
               "as there), its value in a and b as written there, difference = b - a, "
               "ratio = b / a\n");
    fprintf(f, "# event rows: quantity event:KIND, unit yr: the stellar age of the first "
               "occurrence of KIND in each run's events.csv, difference = b - a, ratio = b / a\n");
    fprintf(f, "# an empty a or b: the run lacks the quantity or never logged the event; an "
               "empty difference or ratio: not defined (a value missing or not finite, or "
               "a = 0)\n");
    fprintf(f, "quantity,unit,a,b,difference,ratio\n");
}

/* The summary rows, then the event rows. */
static void write_rows(FILE *f, const vl_compare_table *t)
{
    char diff[64], ratio[64];
    for (size_t i = 0; i < t->nq; i++) {
        const vl_compare_quantity *a = t->q[i].a >= 0 ? &t->a->q[t->q[i].a] : NULL;
        const vl_compare_quantity *b = t->q[i].b >= 0 ? &t->b->q[t->q[i].b] : NULL;
        const vl_compare_quantity *any = a ? a : b;
        vl_compare_table_derived(a ? &a->v : NULL, b ? &b->v : NULL, diff, ratio, sizeof diff);
        fprintf(f, "%s,%s,%s,%s,%s,%s\n", any->name, any->unit, a ? a->text : "",
                b ? b->text : "", diff, ratio);
    }
    for (size_t i = 0; i < t->ne; i++) {
        const vl_compare_event *a = t->e[i].a >= 0 ? &t->a->ev[t->e[i].a] : NULL;
        const vl_compare_event *b = t->e[i].b >= 0 ? &t->b->ev[t->e[i].b] : NULL;
        vl_compare_table_derived(a ? &a->t : NULL, b ? &b->t : NULL, diff, ratio, sizeof diff);
        fprintf(f, "event:%s,yr,%s,%s,%s,%s\n", a ? a->name : b->name, a ? a->text : "",
                b ? b->text : "", diff, ratio);
    }
}

/* Write compare.csv to path (a temporary name; the caller renames it). */
static int write_csv(const char *path, const vl_compare_table *t, vl_status *st)
{
    FILE *f = fopen(path, "w");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    write_head(f, t);
    write_rows(f, t);
    if (ferror(f) | fclose(f))
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot write: %s", strerror(errno));
    return VL_OK;
}

/* Render the figure to fig (a temporary name keeping the extension: comparison.gp picks
 * the format from it) with script. */
static int render(const char *script, const char *fig, const vl_compare_table *t,
                  vl_status *st)
{
    /* gnuplot -c comparison.gp OUT TITLE SERIES_A LABEL_A SERIES_B LABEL_B: each an argv
     * word of its own, so labels and paths need no quoting */
    char fa[VL_PATH_MAX + 32], fb[VL_PATH_MAX + 32], title[2 * VL_COMPARE_LABEL_MAX + 8];
    snprintf(fa, sizeof fa, "%s/series.csv", t->a->dir);
    snprintf(fb, sizeof fb, "%s/series.csv", t->b->dir);
    snprintf(title, sizeof title, "%s and %s", t->a->label, t->b->label);
    const char *const args[] = {fig, title, fa, t->a->label, fb, t->b->label};
    return vl_gnuplot_call(script, args, sizeof args / sizeof args[0], st);
}

/* Temporary and final names of the two outputs in dir. */
typedef struct names {
    char csv_tmp[VL_PATH_MAX + 64], fig_tmp[VL_PATH_MAX + 64];
    char csv[VL_PATH_MAX + 32], fig[VL_PATH_MAX + 32];
} names;

static void make_names(names *n, const char *dir, const char *fmt)
{
    long pid = (long)getpid();
    snprintf(n->csv_tmp, sizeof n->csv_tmp, "%s/.compare.csv.%ld.tmp", dir, pid);
    snprintf(n->fig_tmp, sizeof n->fig_tmp, "%s/.compare.%ld.tmp.%s", dir, pid, fmt);
    snprintf(n->csv, sizeof n->csv, "%s/compare.csv", dir);
    snprintf(n->fig, sizeof n->fig, "%s/compare.%s", dir, fmt);
}

int vl_compare_write_outputs(const char *dir, const char *fmt, const vl_compare_table *t,
                             vl_status *st)
{
    char script[4200];
    if (vl_gnuplot_find_script("comparison.gp", script, sizeof script) != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0,
                       "cannot find plots/comparison.gp (set VOLEV_PLOTS_DIR to the plots "
                       "folder)");
    int created = mkdir(dir, 0777) == 0;
    if (!created && errno != EEXIST)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot create output folder: %s", strerror(errno));
    names n;
    make_names(&n, dir, fmt);
    int renamed_fig = 0;
    if (write_csv(n.csv_tmp, t, st) == VL_OK)
        render(script, n.fig_tmp, t, st);
    if (st->code == VL_OK) {
        if (rename(n.fig_tmp, n.fig) != 0)
            vl_fail(st, VL_ERR_IO, n.fig, 0, "cannot rename into place: %s", strerror(errno));
        else
            renamed_fig = 1;
    }
    if (st->code == VL_OK && rename(n.csv_tmp, n.csv) != 0)
        vl_fail(st, VL_ERR_IO, n.csv, 0, "cannot rename into place: %s", strerror(errno));
    if (st->code != VL_OK) {
        unlink(n.csv_tmp);
        unlink(n.fig_tmp);
        if (renamed_fig)
            unlink(n.fig);
        if (created)
            rmdir(dir);
        return st->code;
    }
    printf("\noutput: %s, %s\n", n.csv, n.fig);
    return VL_OK;
}
