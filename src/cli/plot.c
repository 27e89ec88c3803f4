/* plot.c: `volev plot DIR... [--format png|pdf|svg] [-o FILE] [--kind NAME] [--title TEXT]` and
 * `volev plot --list`: render the figures of what the folders hold (docs/figures.md).
 *
 *   history     a run's series.csv (+ events.csv)           plots/history.gp
 *   balance     balance.csv of `volev balance`               plots/balance.gp
 *   comparison  2 to 12 run folders                          plots/comparison.gp
 *   ensemble    ensemble_series.csv + ensemble_summary.csv   plots/ensemble.gp
 *   regime_map  members.csv of a grid sweep with two axes:   plots/regime_map.gp
 *               outcome class; water_map: final water
 *
 * Before gnuplot runs, every input file is checked for the columns its figure needs, so
 * a missing or misnamed column is an error naming it (never an empty plot); the CSV
 * reader (csv.h) reads the head of each file: comments, header, first row. Figures are
 * written by gnuplot straight to their final names; a failed render removes its file. */
#include <ctype.h>
#include <errno.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "cli.h"
#include "gnuplot.h"
#include "path_name.h"
#include "plot_text.h"
#include "volev/schema.h"
#include "volev/climate.h"
#include "volev/csv.h"
#include "volev/scenario.h"
#include "volev/star.h"
#include "volev/units.h"

enum { K_HISTORY, K_BALANCE, K_COMPARISON, K_ENSEMBLE, K_REGIME, K_WATER, NKIND };

static const struct {
    const char *name, *script, *holds;
} kinds[NKIND] = {
    {"history", "history.gp",
     "a run folder (series.csv, events.csv): water, partial pressures, temperature with the "
     "regime, escape by channel and element, luminosity and XUV"},
    {"balance", "balance.gp",
     "a `volev balance` folder (balance.csv): OLR and absorbed flux against surface "
     "temperature, albedo, stratospheric water"},
    {"comparison", "comparison.gp",
     "2 to 12 run folders: water, CO2, O2 and temperature of each run on shared axes"},
    {"ensemble", "ensemble.gp",
     "a sweep folder (ensemble_series.csv, ensemble_summary.csv): median and quantile bands "
     "of water and O2 against age, histogram of outcome classes"},
    {"regime_map", "regime_map.gp",
     "a grid sweep over two axes (members.csv): outcome class of every member, with the "
     "habitable-zone limits when one axis is the orbit"},
    {"water_map", "regime_map.gp",
     "a grid sweep over two axes (members.csv): final surface water of every member"},
};

/* Columns each input needs (NULL-terminated). */
/* (a run's series.csv: gnuplot.h's lists, from the output schema) */
static const char *const need_balance[] = {"surface_temp_k", "olr_w_m2", "absorbed_w_m2", NULL};
static const char *const need_ens_series[] = {
    "time_yr", "water_to_p05", "water_to_p25", "water_to_p50", "water_to_p75", "water_to_p95",
    "o2_bar_p05", "o2_bar_p25", "o2_bar_p50", "o2_bar_p75", "o2_bar_p95", NULL};
static const char *const need_ens_summary[] = {"kind", "name", "count", "fraction", NULL};
static const char *const need_members[] = {"final_water_to", "outcome", NULL};

/* ------------------------------------------------------------------ inputs */

static int readable(const char *dir, const char *name)
{
    char p[4200];
    snprintf(p, sizeof p, "%s/%s", dir, name);
    return access(p, R_OK) == 0;
}

/* The head of a CSV output file: its comments, header and first data row, through the
 * CSV reader. Only that much is read, so the file's size does not matter. */
static vl_csv_table *head_of(const char *path, vl_status *st)
{
    static const vl_csv_options head = {0, SIZE_MAX, 0, 1, NULL, NULL};
    return vl_csv_read(path, &head, st);
}

/* A scan's callback: the line of the last record. */
static int last_line(void *ctx, const vl_csv_record *rec, vl_status *st)
{
    (void)st;
    *(int *)ctx = rec->line;
    return VL_OK;
}

/* The whole of path is a complete output file: every row has the header's field count
 * (the CSV reader's check, FILE:LINE) and the last line ends with a line end, as every
 * file volev writes does; a file cut short by a killed writer, a full disk or a copy
 * fails one or the other (docs/figures.md). flags: the CSV reader's (events.csv's detail
 * takes the rest of its line). Streams, so the size does not matter. */
static int check_complete(const char *path, unsigned flags, vl_status *st)
{
    const vl_csv_options whole = {flags, SIZE_MAX, 0, 0, NULL, NULL};
    int line = 0;
    if (vl_csv_scan(path, &whole, last_line, &line, st) != VL_OK)
        return st->code;
    FILE *f = fopen(path, "rb");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot read: %s", strerror(errno));
    int end = fseek(f, -1, SEEK_END) == 0 ? getc(f) : '\n'; /* an empty file: no last line */
    fclose(f);
    if (end != '\n')
        return vl_fail(st, VL_ERR_INPUT, path, line,
                       "the last line is cut short (no line end): the file is incomplete; "
                       "rerun the command that wrote it");
    return VL_OK;
}

/* path must hold every column of need (and extra, if not NULL), for figure `kind`, at
 * least one data row, and be complete (check_complete). */
static int check_columns(const char *path, const char *const *need, const char *const *extra,
                         int kind, vl_status *st)
{
    vl_csv_table *t = head_of(path, st);
    if (!t)
        return st->code;
    if (!t->header_line)
        vl_fail(st, VL_ERR_INPUT, path, 0, "no header line (not a volev output file?)");
    for (int pass = 0; pass < 2 && st->code == VL_OK; pass++) {
        const char *const *list = pass ? extra : need;
        for (size_t i = 0; list && list[i] && st->code == VL_OK; i++)
            if (vl_csv_column(t, list[i]) == VL_CSV_NONE)
                vl_fail(st, VL_ERR_INPUT, path, t->header_line,
                        "no column '%s' (the %s figure needs it)", list[i], kinds[kind].name);
    }
    if (st->code == VL_OK && t->nrows == 0)
        vl_fail(st, VL_ERR_INPUT, path, t->header_line, "no data rows below the header");
    vl_csv_free(t);
    if (st->code == VL_OK)
        check_complete(path, 0, st);
    return st->code;
}

/* ------------------------------------------------------------------ grid sweeps */

typedef struct {
    char key[2][128];
    char scale[2][32];
    int n;           /* axes found */
    int grid;        /* all of them grid axes */
} axes_t;

/* The "# axis KEY grid SPACING FROM TO POINTS" comments above members.csv's header. */
static int read_axes(const char *path, axes_t *ax, vl_status *st)
{
    memset(ax, 0, sizeof *ax);
    ax->grid = 1;
    vl_csv_table *t = head_of(path, st);
    if (!t)
        return st->code;
    for (size_t c = 0; c < t->ncomments; c++) {
        char key[128], kind[32], spacing[32] = "";
        if (t->header_line && t->comments[c].line > t->header_line)
            break;
        if (sscanf(t->comments[c].text, "# axis %127s %31s %31s", key, kind, spacing) < 2)
            continue;
        if (ax->n < 2) {
            snprintf(ax->key[ax->n], sizeof ax->key[0], "%s", key);
            snprintf(ax->scale[ax->n], sizeof ax->scale[0], "%s",
                     strcmp(kind, "grid") == 0 ? spacing : "linear");
        }
        if (strcmp(kind, "grid") != 0)
            ax->grid = 0;
        ax->n++;
    }
    vl_csv_free(t);
    return VL_OK;
}

/* Habitable-zone limits as orbits (au) for the base scenario in dir, when the map's x
 * axis is the orbit: the runaway greenhouse (Kopparapu et al. 2014, for the planet's
 * mass) and the maximum greenhouse (Kopparapu et al. 2013) for the star at the end of
 * the run, whose age the labels give: d = sqrt(L / L_sun / S_eff). "" if not applicable. */
static void hz_lines(const char *dir, const char *xkey, char *out, size_t n)
{
    out[0] = '\0';
    if (strcmp(xkey, "planet.orbit_au") != 0)
        return;
    char path[4200];
    snprintf(path, sizeof path, "%s/scenario.resolved.cfg", dir);
    vl_status st;
    vl_scenario *sc = vl_scenario_load(path, NULL, 0, &st);
    if (!sc)
        return;
    vl_star *s = vl_star_new(&sc->star, sc->run.start_s, sc->run.end_s, &st);
    if (s) {
        vl_star_state ss;
        vl_star_eval(s, sc->run.end_s, &ss);
        double l = ss.l_bol_w / VL_L_SUN;
        double run = vl_hz_seff_runaway_2014(sc->planet.mass_kg / VL_M_EARTH, ss.teff_k);
        double maxg = vl_hz_seff_2013(VL_HZ_MAX_GREENHOUSE, ss.teff_k);
        /* the age of the star, so the reader knows which star the lines are for */
        double age_yr = sc->run.end_s / VL_YR;
        char age[32];
        if (age_yr >= 1e9)
            snprintf(age, sizeof age, "%.3g Gyr", age_yr / 1e9);
        else
            snprintf(age, sizeof age, "%.3g Myr", age_yr / 1e6);
        snprintf(out, n, "runaway greenhouse at %s=%.6g;maximum greenhouse at %s=%.6g", age,
                 sqrt(l / run), age, sqrt(l / maxg));
        vl_star_free(s);
    }
    vl_scenario_free(sc);
}

/* ------------------------------------------------------------------ rendering */

typedef struct {
    const char *fmt;     /* png | pdf | svg */
    const char *out;     /* -o FILE, or NULL */
    const char *title;   /* --title TEXT, or "" (each script's default) */
    int rendered;
} job_t;

static int render(job_t *j, int kind, const char *dir, const char *const *args, size_t nargs,
                  size_t out_index, vl_status *st)
{
    char script[4200], outfile[4200];
    if (vl_gnuplot_find_script(kinds[kind].script, script, sizeof script) != 0)
        return vl_fail(st, VL_ERR_TOOL, NULL, 0,
                       "cannot find plots/%s (set VOLEV_PLOTS_DIR to the plots folder)",
                       kinds[kind].script);
    if (j->out)
        snprintf(outfile, sizeof outfile, "%s", j->out);
    else
        snprintf(outfile, sizeof outfile, "%s/%s.%s", dir, kinds[kind].name, j->fmt);
    const char *a[12];
    for (size_t i = 0; i < nargs && i < 12; i++)
        a[i] = i == out_index ? outfile : args[i];
    if (vl_gnuplot_call(script, a, nargs, st) != VL_OK) {
        unlink(outfile); /* no half-written figure under its final name */
        return st->code;
    }
    printf("%s\n", outfile);
    j->rendered++;
    return VL_OK;
}

static int plot_run(job_t *j, int kind, const char *dir, vl_status *st)
{
    char data[4200], events[4200];
    snprintf(data, sizeof data, "%s/%s", dir, kind == K_HISTORY ? "series.csv" : "balance.csv");
    snprintf(events, sizeof events, "%s/events.csv", dir);
    const char *need_series[VL_NSERIES + 1];
    vl_gnuplot_column_names(vl_gnuplot_history_columns, need_series, VL_NSERIES + 1);
    int rc = check_columns(data, kind == K_HISTORY ? need_series : need_balance, NULL, kind, st);
    if (rc)
        return rc;
    if (kind == K_HISTORY) {
        /* the events in words (plot_text.h), and the title from the scenario */
        char *ev = NULL, title[1200];
        if (readable(dir, "events.csv")) {
            if (check_complete(events, VL_CSV_REST, st) != VL_OK)
                return st->code;
            if (!(ev = vl_plot_events_word(events, st)))
                return st->code;
        }
        if (j->title[0])
            snprintf(title, sizeof title, "%s", j->title);
        else
            vl_plot_run_title(dir, title, sizeof title);
        const char *args[] = {data, "", ev ? ev : "", title};
        rc = render(j, kind, dir, args, 4, 1, st);
        free(ev);
        return rc;
    }
    const char *args[] = {data, "", j->title};
    return render(j, kind, dir, args, 3, 1, st);
}

static int plot_ensemble(job_t *j, const char *dir, vl_status *st)
{
    char ser[4200], sum[4200];
    snprintf(ser, sizeof ser, "%s/ensemble_series.csv", dir);
    snprintf(sum, sizeof sum, "%s/ensemble_summary.csv", dir);
    int rc = check_columns(ser, need_ens_series, NULL, K_ENSEMBLE, st);
    if (!rc)
        rc = check_columns(sum, need_ens_summary, NULL, K_ENSEMBLE, st);
    if (rc)
        return rc;
    const char *args[] = {ser, sum, "", j->title};
    return render(j, K_ENSEMBLE, dir, args, 4, 2, st);
}

static int plot_map(job_t *j, int kind, const char *dir, const axes_t *ax, vl_status *st)
{
    char mem[4200], hz[256];
    snprintf(mem, sizeof mem, "%s/members.csv", dir);
    const char *const keys[] = {ax->key[0], ax->key[1], NULL};
    int rc = check_columns(mem, need_members, keys, kind, st);
    if (rc)
        return rc;
    hz_lines(dir, ax->key[0], hz, sizeof hz);
    const char *args[] = {mem, "", ax->key[0], ax->key[1], kind == K_REGIME ? "class" : "water",
                          ax->scale[0], ax->scale[1], hz, j->title};
    return render(j, kind, dir, args, 9, 1, st);
}

/* 2 to VL_GNUPLOT_MAX_RUNS run folders: one comparison figure, the runs passed to the
 * script as one RUNS argument (gnuplot.h). */
static int plot_comparison(job_t *j, char **dirs, int n, vl_status *st)
{
    static char series[VL_GNUPLOT_MAX_RUNS][4200], label[VL_GNUPLOT_MAX_RUNS][1024];
    const char *files[VL_GNUPLOT_MAX_RUNS], *labels[VL_GNUPLOT_MAX_RUNS];
    const char *need_compare[VL_NSERIES + 1];
    vl_gnuplot_column_names(vl_gnuplot_comparison_columns, need_compare, VL_NSERIES + 1);
    for (int r = 0; r < n; r++) {
        snprintf(series[r], sizeof series[r], "%s/series.csv", dirs[r]);
        int rc = check_columns(series[r], need_compare, NULL, K_COMPARISON, st);
        if (rc)
            return rc;
        vl_cli_path_name(dirs[r], NULL, label[r], sizeof label[r]); /* its folder's name */
        files[r] = series[r];
        labels[r] = label[r];
    }
    char *runs = vl_gnuplot_runs_word(files, labels, n);
    if (!runs)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    const char *args[] = {"", j->title, runs};
    char out[4200];
    if (!j->out) {
        snprintf(out, sizeof out, "comparison.%s", j->fmt);
        j->out = out;
    }
    int rc = render(j, K_COMPARISON, ".", args, 3, 0, st);
    j->out = NULL;
    free(runs);
    return rc;
}

static void list_kinds(void)
{
    printf("figure kinds (volev plot DIR... picks them from what the folders hold):\n");
    for (int k = 0; k < NKIND; k++)
        printf("  %-11s %s\n              script plots/%s\n", kinds[k].name, kinds[k].holds,
               kinds[k].script);
    printf("formats: png (screens), pdf and svg (vector, for papers); docs/figures.md\n");
}

/* The command line. */
typedef struct plot_args {
    const char *fmt, *out, *want, *title;
    char *dirs[VL_GNUPLOT_MAX_RUNS];
    int ndirs;
    int list;        /* --list */
    int kind;        /* the kind --kind names, -1 without */
} plot_args;

/* Reads argv into a (stopping at --list); VL_OK or a usage error (printed). */
static int parse_args(int argc, char **argv, plot_args *a)
{
    *a = (plot_args){NULL, NULL, NULL, "", {NULL}, 0, 0, -1};
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        if (strcmp(s, "--list") == 0) {
            a->list = 1;
            return VL_OK;
        }
        const char **value = !strcmp(s, "--format") || !strcmp(s, "-f") ? &a->fmt
                             : !strcmp(s, "-o")                         ? &a->out
                             : !strcmp(s, "--kind")                     ? &a->want
                             : !strcmp(s, "--title")                    ? &a->title
                                                                        : NULL;
        if (value && i + 1 >= argc)
            return vl_cli_usage_error(argv[0], "%s needs a value", s);
        if (value)
            *value = argv[++i];
        else if (s[0] == '-')
            return vl_cli_usage_error(argv[0], "unknown option '%s'", s);
        else if (a->ndirs < VL_GNUPLOT_MAX_RUNS)
            a->dirs[a->ndirs++] = argv[i];
        else
            return vl_cli_usage_error(argv[0],
                                      "more than %d folders ('%s' is one too many): a "
                                      "comparison figure of more runs cannot be read; plot "
                                      "them in groups",
                                      VL_GNUPLOT_MAX_RUNS, s);
    }
    return VL_OK;
}

/* The format: --format, or the extension of -o, which must agree; png by default. */
static int pick_format(const char *cmd, plot_args *a)
{
    const char *ext = a->out ? strrchr(a->out, '.') : NULL;
    if (a->out && (!ext || (strcmp(ext, ".png") && strcmp(ext, ".pdf") && strcmp(ext, ".svg"))))
        return vl_cli_usage_error(cmd, "-o %s: the file must end in .png, .pdf or .svg", a->out);
    if (a->fmt && strcmp(a->fmt, "png") && strcmp(a->fmt, "pdf") && strcmp(a->fmt, "svg"))
        return vl_cli_usage_error(cmd, "unknown format '%s' (png, pdf or svg)", a->fmt);
    if (a->fmt && ext && strcmp(a->fmt, ext + 1) != 0)
        return vl_cli_usage_error(cmd, "--format %s disagrees with -o %s", a->fmt, a->out);
    if (!a->fmt)
        a->fmt = ext ? ext + 1 : "png";
    return VL_OK;
}

/* Folders given (one to VL_GNUPLOT_MAX_RUNS, no control characters), the format, the
 * kind asked for. */
static int check_args(const char *cmd, plot_args *a)
{
    if (a->ndirs == 0)
        return vl_cli_usage_error(cmd, "missing DIR (a run, balance or sweep folder); "
                                       "'volev plot --list' names the figures");
    int rc = pick_format(cmd, a);
    if (rc)
        return rc;
    for (int k = 0; a->want && k < NKIND; k++)
        if (strcmp(a->want, kinds[k].name) == 0)
            a->kind = k;
    if (a->want && a->kind < 0)
        return vl_cli_usage_error(cmd, "unknown figure kind '%s' (volev plot --list)", a->want);
    for (int d = 0; d < a->ndirs; d++)
        for (const char *c = a->dirs[d]; *c; c++)
            if (iscntrl((unsigned char)*c))
                return vl_cli_usage_error(cmd, "folder names with line breaks or other control "
                                               "characters are not supported");
    return VL_OK;
}

/* Which figures the folder's files make (avail), with the sweep axes of members.csv;
 * returns how many, or -1 with st filled. */
static int find_figures(const char *dir, int avail[NKIND], axes_t *ax, vl_status *st)
{
    memset(ax, 0, sizeof *ax);
    avail[K_HISTORY] = readable(dir, "series.csv");
    avail[K_BALANCE] = readable(dir, "balance.csv");
    avail[K_COMPARISON] = 0;
    avail[K_ENSEMBLE] = readable(dir, "ensemble_series.csv") && readable(dir, "ensemble_summary.csv");
    avail[K_REGIME] = avail[K_WATER] = 0;
    if (readable(dir, "members.csv")) {
        char mem[4200];
        snprintf(mem, sizeof mem, "%s/members.csv", dir);
        if (read_axes(mem, ax, st) != VL_OK)
            return -1;
        avail[K_REGIME] = avail[K_WATER] = ax->grid && ax->n == 2;
    }
    int n = 0;
    for (int k = 0; k < NKIND; k++)
        n += avail[k];
    return n;
}

/* The error for a figure kind the folder cannot make. */
static int unavailable(const char *dir, const plot_args *a, vl_status *st)
{
    int map = a->kind == K_REGIME || a->kind == K_WATER;
    const char *why = a->kind == K_COMPARISON ? "give 2 to 12 run folders"
                      : map && readable(dir, "members.csv")
                          ? "the map needs a grid sweep over exactly two axes"
                          : "the folder lacks its input files (volev plot --list)";
    return vl_fail(st, VL_ERR_INPUT, dir, 0, "no %s figure here: %s", a->want, why);
}

/* One folder: every figure it makes, or the one asked for. */
static int plot_folder(const char *cmd, job_t *j, const plot_args *a, vl_status *st)
{
    const char *dir = a->dirs[0];
    int avail[NKIND];
    axes_t ax;
    int navail = find_figures(dir, avail, &ax, st);
    if (navail < 0)
        return st->code;
    if (a->kind >= 0 && !avail[a->kind])
        return unavailable(dir, a, st);
    if (navail == 0)
        return vl_fail(st, VL_ERR_IO, dir, 0,
                       "nothing to plot: no series.csv (volev run), balance.csv (volev balance) "
                       "or sweep files (volev sweep) here; volev plot --list");
    if (a->out && a->kind < 0 && navail > 1)
        return vl_cli_usage_error(cmd, "%s holds several figures: choose one with --kind (volev "
                                       "plot --list)", dir);
    for (int k = 0; k < NKIND && st->code == VL_OK; k++) {
        if (!avail[k] || (a->kind >= 0 && k != a->kind))
            continue;
        if (k == K_HISTORY || k == K_BALANCE)
            plot_run(j, k, dir, st);
        else if (k == K_ENSEMBLE)
            plot_ensemble(j, dir, st);
        else
            plot_map(j, k, dir, &ax, st);
    }
    return st->code;
}

int vl_cli_plot(int argc, char **argv)
{
    plot_args a;
    int rc = parse_args(argc, argv, &a);
    if (rc == VL_OK && a.list) {
        list_kinds();
        return VL_OK;
    }
    if (rc == VL_OK)
        rc = check_args(argv[0], &a);
    if (rc != VL_OK)
        return rc;
    vl_status st;
    vl_status_clear(&st);
    job_t j = {a.fmt, a.out, a.title, 0};
    if (a.ndirs > 1 && a.kind >= 0 && a.kind != K_COMPARISON)
        return vl_cli_usage_error(argv[0], "several folders make a comparison, not '%s'", a.want);
    if (a.ndirs > 1)
        rc = plot_comparison(&j, a.dirs, a.ndirs, &st);
    else
        rc = plot_folder(argv[0], &j, &a, &st); /* a usage error is printed already */
    return st.code == VL_OK ? rc : vl_cli_report(&st);
}
