/* compare_write.c: the files of `volev compare -o DIR` (compare.h): compare.csv (the
 * table, machine-readable, with the runs' provenance and each row's topic) and
 * compare.FORMAT (the runs' series.csv drawn on shared axes by plots/comparison.gp),
 * both written under temporary names and renamed into place only when both
 * succeeded. */
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

static void provenance(FILE *f, int k, const vl_compare_run *r)
{
    char label[VL_COMPARE_LABEL_MAX], dir[VL_PATH_MAX];
    comment_safe(r->label, label, sizeof label);
    comment_safe(r->dir, dir, sizeof dir);
    fprintf(f, "# %c = %s: run folder %s (volev %s; resolved scenario hash %s)\n",
            vl_compare_letter(k) - 'A' + 'a', label, dir, r->version[0] ? r->version : "unknown",
            r->hash[0] ? r->hash : "unknown");
}

/* The comment lines and the header of compare.csv (docs/figures.md, "The table of
 * volev compare"): with two runs quantity,unit,a,b,difference,ratio,group; with more,
 * quantity,unit,a,b,c,...,ratio_b,ratio_c,...,group. */
static void write_head(FILE *f, const vl_compare_table *t)
{
    int n = t->nruns;
    fprintf(f, "# volev %s: comparison of %d runs\n", vl_version(), n);
    for (int k = 0; k < n; k++)
        provenance(f, k, &t->runs[k]);
    fprintf(f, "# summary rows: every quantity of any run's summary.csv (quantity and unit as "
               "there), each run's value as written there%s\n",
            n == 2 ? ", difference = b - a, ratio = b / a" : ", ratio_x = x / a");
    fprintf(f, "# event rows: quantity event:KIND, unit yr: the stellar age of the first "
               "occurrence of KIND in each run's events.csv\n");
    fprintf(f, "# group: the topic, in the order of the rows: final_state, budgets, redox, "
               "isotopes, regimes_events, other, numerics (conservation, integrator and cost)\n");
    fprintf(f, "# an empty value: the run lacks the quantity or never logged the event; an "
               "empty difference: a value missing; an empty ratio: a value missing or not "
               "above the quantity's numerical resolution (a reservoir's mass below its "
               "depletion floor, a quantity derived from such a reservoir, or a value "
               "subnormal or under 1e-30 of the largest of the row)\n");
    fprintf(f, "quantity,unit");
    for (int k = 0; k < n; k++)
        fprintf(f, ",%c", vl_compare_letter(k) - 'A' + 'a');
    if (n == 2)
        fprintf(f, ",difference,ratio");
    else
        for (int k = 1; k < n; k++)
            fprintf(f, ",ratio_%c", vl_compare_letter(k) - 'A' + 'a');
    fprintf(f, ",group\n");
}

/* The derived fields of row i (events: ev), each preceded by a comma. */
static void write_derived(FILE *f, const vl_compare_table *t, size_t i, int ev)
{
    char text[64];
    if (t->nruns == 2) {
        vl_compare_difference(t, i, ev, 1, text, sizeof text);
        fprintf(f, ",%s", text);
    }
    for (int k = 1; k < t->nruns; k++) {
        vl_compare_ratio(t, i, ev, k, text, sizeof text);
        fprintf(f, ",%s", text);
    }
}

/* The summary rows by topic, the event rows with their topic's. */
static void write_rows(FILE *f, const vl_compare_table *t)
{
    for (size_t i = 0; i <= t->nq; i++) {
        int g = i < t->nq ? t->q[i].group : VL_NCOMPARE_GROUPS;
        int g_before = i > 0 ? t->q[i - 1].group : -1;
        if (g_before <= VL_CG_TIMES && g > VL_CG_TIMES) /* the events close their topic */
            for (size_t e = 0; e < t->ne; e++) {
                const vl_compare_event *any = NULL;
                for (int k = 0; k < t->nruns && !any; k++)
                    any = vl_compare_event_cell(t, e, k);
                fprintf(f, "event:%s,yr", any->name);
                for (int k = 0; k < t->nruns; k++) {
                    const vl_compare_event *x = vl_compare_event_cell(t, e, k);
                    fprintf(f, ",%s", x ? x->text : "");
                }
                write_derived(f, t, e, 1);
                fprintf(f, ",%s\n", vl_compare_group_id(VL_CG_TIMES));
            }
        if (i == t->nq)
            break;
        const vl_compare_quantity *any = NULL;
        for (int k = 0; k < t->nruns && !any; k++)
            any = vl_compare_cell(t, i, k);
        fprintf(f, "%s,%s", any->name, any->unit);
        for (int k = 0; k < t->nruns; k++) {
            const vl_compare_quantity *x = vl_compare_cell(t, i, k);
            fprintf(f, ",%s", x ? x->text : "");
        }
        write_derived(f, t, i, 0);
        fprintf(f, ",%s\n", vl_compare_group_id(g));
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
    /* gnuplot -c comparison.gp OUT TITLE RUNS: RUNS holds every run's series.csv and
     * label, one per line; each an argv word of its own, so nothing needs quoting */
    static char series[VL_COMPARE_MAX_RUNS][VL_PATH_MAX + 32];
    const char *files[VL_COMPARE_MAX_RUNS], *labels[VL_COMPARE_MAX_RUNS];
    char title[3 * VL_COMPARE_LABEL_MAX + 32];
    for (int k = 0; k < t->nruns; k++) {
        snprintf(series[k], sizeof series[k], "%s/series.csv", t->runs[k].dir);
        files[k] = series[k];
        labels[k] = t->runs[k].label;
    }
    /* "a and b", "a, b and c"; "" (the script's "comparison of N runs") when too long */
    size_t used = 0;
    title[0] = '\0';
    for (int k = 0; k < t->nruns && used < sizeof title; k++) {
        const char *sep = k == 0 ? "" : k + 1 < t->nruns ? ", " : " and ";
        int w = snprintf(title + used, sizeof title - used, "%s%s", sep, labels[k]);
        used += w > 0 ? (size_t)w : 0;
    }
    if (used > 90)
        title[0] = '\0';
    char *runs = vl_gnuplot_runs_word(files, labels, t->nruns);
    if (!runs)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    const char *const args[] = {fig, title, runs};
    int rc = vl_gnuplot_call(script, args, sizeof args / sizeof args[0], st);
    free(runs);
    return rc;
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
