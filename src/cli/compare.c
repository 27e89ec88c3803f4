/* compare.c: `volev compare DIR_A DIR_B [DIR...] [-o DIR] [--format png|pdf|svg]
 * [--labels A,B,...]`: two to VL_COMPARE_MAX_RUNS runs side by side. Reads each folder's
 * summary.csv, events.csv and the last row of series.csv and prints a table of every
 * summary quantity by topic (each run's value; with two runs also B - A and B / A) and
 * the stellar age at which each kind of event first happened in each run. With -o it
 * also writes DIR/compare.csv (the same table, machine-readable) and DIR/compare.FORMAT,
 * the runs' series.csv drawn on shared axes by plots/comparison.gp. Both files are
 * written under temporary names and renamed into place only when both succeeded. This file holds the command line;
 * compare_read.c, compare_table.c, compare_groups.c, compare_print.c and compare_write.c
 * the rest. */
#define _XOPEN_SOURCE 700 /* realpath */
#include <ctype.h>
#include <errno.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>

#include "cli.h"
#include "compare.h"
#include "path_name.h"

enum { LABEL_MAX = VL_COMPARE_LABEL_MAX };

/* The command line. */
typedef struct options {
    const char *dirs[VL_COMPARE_MAX_RUNS]; /* borrowed from argv */
    int ndirs;
    const char *out, *fmt, *labels;
} options;

/* The last component of path, for a default label; "." and ".." are resolved. */
static void base_name(const char *path, char *out, size_t n)
{
    vl_cli_path_name(path, NULL, out, n);
    if (strcmp(out, ".") != 0 && strcmp(out, "..") != 0)
        return;
    char *real = realpath(path, NULL);
    if (real) {
        vl_cli_path_name(real, NULL, out, n);
        free(real);
    }
}

static int has_control(const char *s)
{
    for (; *s; s++)
        if (iscntrl((unsigned char)*s))
            return 1;
    return 0;
}

/* The folder exists and is a folder. */
static int check_dir(const char *dir, vl_status *st)
{
    struct stat sb;
    if (stat(dir, &sb) != 0)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot read run folder: %s", strerror(errno));
    if (!S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_INPUT, dir, 0,
                       "not a folder (compare needs the output folders of `volev run`s)");
    return VL_OK;
}

/* Options that take a value, what the value must be, and where it goes. */
static const struct {
    const char *name, *needs;
    size_t offset;
} value_options[] = {
    {"--format", "png, pdf or svg", offsetof(options, fmt)},
    {"-f", "png, pdf or svg", offsetof(options, fmt)},
    {"-o", "a folder", offsetof(options, out)},
    {"--output", "a folder", offsetof(options, out)},
    {"--labels", "one name per folder, A,B,...", offsetof(options, labels)},
};

/* Reads argv into o; VL_OK or a usage error (printed). */
static int parse_options(int argc, char **argv, options *o)
{
    const char *cmd = argv[0];
    *o = (options){{NULL}, 0, NULL, "png", NULL};
    for (int i = 1; i < argc; i++) {
        const char *s = argv[i];
        size_t v = 0, nv = sizeof value_options / sizeof value_options[0];
        while (v < nv && strcmp(s, value_options[v].name) != 0)
            v++;
        if (v < nv && i + 1 >= argc)
            return vl_cli_usage_error(cmd, "%s needs %s", s, value_options[v].needs);
        if (v < nv)
            *(const char **)((char *)o + value_options[v].offset) = argv[++i];
        else if (s[0] == '-' && s[1] != '\0')
            return vl_cli_usage_error(cmd, "unknown option '%s'", s);
        else if (o->ndirs == VL_COMPARE_MAX_RUNS)
            return vl_cli_usage_error(cmd,
                                      "more than %d folders ('%s' is one too many): a "
                                      "comparison of more runs cannot be read; compare "
                                      "them in groups, or sweep them (volev sweep)",
                                      VL_COMPARE_MAX_RUNS, s);
        else
            o->dirs[o->ndirs++] = s;
    }
    return VL_OK;
}

/* Two folders or more, a known format, names that fit and print on one line. */
static int check_options(const char *cmd, const options *o)
{
    if (o->ndirs < 2)
        return vl_cli_usage_error(cmd, "%s (two to %d output folders of `volev run`)",
                                  o->ndirs ? "missing DIR_B" : "missing DIR_A and DIR_B",
                                  VL_COMPARE_MAX_RUNS);
    if (strcmp(o->fmt, "png") && strcmp(o->fmt, "pdf") && strcmp(o->fmt, "svg"))
        return vl_cli_usage_error(cmd, "unknown format '%s' (png, pdf or svg)", o->fmt);
    for (int k = 0; k < o->ndirs; k++)
        if (strlen(o->dirs[k]) >= VL_PATH_MAX - 32 || has_control(o->dirs[k]))
            return vl_cli_usage_error(cmd, "folder name '%s' is too long or has control characters",
                                      o->dirs[k]);
    if (o->out && (strlen(o->out) >= VL_PATH_MAX - 32 || has_control(o->out)))
        return vl_cli_usage_error(cmd, "output folder name is too long or has control characters");
    return VL_OK;
}

/* Default labels: the folders' names; a name two different folders share (as in x/run
 * and y/run) gives way to the paths as given. */
static void default_labels(const options *o, vl_compare_run *r)
{
    for (int k = 0; k < o->ndirs; k++)
        base_name(o->dirs[k], r[k].label, LABEL_MAX);
    int shared[VL_COMPARE_MAX_RUNS] = {0};
    for (int k = 0; k < o->ndirs; k++)
        for (int j = 0; j < o->ndirs; j++)
            if (j != k && strcmp(r[k].label, r[j].label) == 0 &&
                strcmp(o->dirs[k], o->dirs[j]) != 0)
                shared[k] = 1;
    for (int k = 0; k < o->ndirs; k++)
        if (shared[k])
            snprintf(r[k].label, LABEL_MAX, "%s", o->dirs[k]);
}

/* The runs' labels: --labels A,B,... (one non-empty name per folder), or the defaults. */
static int set_labels(const char *cmd, const options *o, vl_compare_run *r)
{
    const char *s = o->labels;
    if (!s) {
        default_labels(o, r);
        return VL_OK;
    }
    int n = 0, bad = has_control(s);
    for (const char *p = s; !bad; n++) {
        const char *comma = strchr(p, ',');
        size_t len = comma ? (size_t)(comma - p) : strlen(p);
        bad = len == 0 || len >= LABEL_MAX || n >= o->ndirs;
        if (!bad)
            snprintf(r[n].label, LABEL_MAX, "%.*s", (int)len, p);
        if (!comma)
            break;
        p = comma + 1;
    }
    if (bad || n + 1 != o->ndirs)
        return vl_cli_usage_error(cmd,
                                  "--labels '%s': expected %d names separated by commas, one "
                                  "per folder, e.g. --labels %s",
                                  s, o->ndirs,
                                  o->ndirs == 2 ? "wet,dry" : o->ndirs == 3 ? "wet,dry,icy"
                                                                            : "a,b,c,...");
    return VL_OK;
}

/* Reads the runs (their series checked for the figure with -o), prints the table and writes the
 * outputs. */
static int compare(const options *o, vl_compare_run *r, vl_status *st)
{
    for (int k = 0; k < o->ndirs && st->code == VL_OK; k++)
        if (check_dir(r[k].dir, st) == VL_OK)
            vl_compare_read_run(&r[k], st);
    for (int k = 0; k < o->ndirs && st->code == VL_OK; k++)
        vl_compare_read_series(&r[k], o->out != NULL, st);
    if (st->code != VL_OK)
        return st->code;
    vl_compare_table t;
    if (vl_compare_table_merge(r, o->ndirs, &t, st) == VL_OK) {
        vl_compare_table_print(&t);
        if (o->out)
            vl_compare_write_outputs(o->out, o->fmt, &t, st);
    }
    vl_compare_table_free(&t);
    return st->code;
}

int vl_cli_compare(int argc, char **argv)
{
    options o;
    int rc = parse_options(argc, argv, &o);
    if (rc == VL_OK)
        rc = check_options(argv[0], &o);
    vl_compare_run r[VL_COMPARE_MAX_RUNS];
    memset(r, 0, sizeof r);
    for (int k = 0; k < o.ndirs && rc == VL_OK; k++)
        r[k].dir = o.dirs[k];
    if (rc == VL_OK)
        rc = set_labels(argv[0], &o, r);
    if (rc != VL_OK)
        return rc;
    vl_status st;
    vl_status_clear(&st);
    compare(&o, r, &st);
    for (int k = 0; k < o.ndirs; k++)
        vl_compare_read_free(&r[k]);
    return st.code == VL_OK ? VL_OK : vl_cli_report(&st);
}
