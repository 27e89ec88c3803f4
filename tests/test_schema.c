/* test_schema.c: the output schema (schema.h) is the one source of the outputs' columns:
 * the generated reference (docs/columns.md) is current, every file's header matches its
 * rows and is documented, and every column the figures and the validation script look
 * up by name exists. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

static char tmpdir[256];

/* The names in the first column of the markdown tables of section `section` of the
 * reference text (rows "| `name` | ..."), as one string "|a|b|c|". */
static char *names_in(const char *ref, const char *section)
{
    const char *s = strstr(ref, section);
    ck_assert_msg(s != NULL, "no section %s in the column reference", section);
    const char *end = strstr(s + 1, "\n## ");
    size_t cap = strlen(s) + 2, n = 0;
    char *out = malloc(cap);
    ck_assert_ptr_nonnull(out);
    out[n++] = '|';
    for (const char *p = s; p && (!end || p < end); p = strchr(p + 1, '\n')) {
        const char *q = p[0] == '\n' ? p + 1 : p;
        if (strncmp(q, "| `", 3) != 0)
            continue;
        q += 3;
        const char *e = strchr(q, '`');
        memcpy(out + n, q, (size_t)(e - q));
        n += (size_t)(e - q);
        out[n++] = '|';
    }
    out[n] = '\0';
    return out;
}

static int listed(const char *names, const char *name)
{
    char key[256];
    snprintf(key, sizeof key, "|%s|", name);
    return strstr(names, key) != NULL;
}

/* The reference as `volev columns` prints it. */
static char *reference(void)
{
    ck_assert_int_eq(vl_test_sh(tmpdir, "%s columns", vl_test_bin()), 0);
    return vl_test_slurp(tmpdir, "out.txt", NULL);
}

START_TEST(reference_is_current)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-schema");
    char *ref = reference();
    char path[1024];
    snprintf(path, sizeof path, "%s/docs", vl_test_top());
    char *doc = vl_test_slurp(path, "columns.md", NULL);
    ck_assert_msg(doc != NULL, "missing docs/columns.md");
    const char *body = strstr(doc, "## series.csv");
    ck_assert_ptr_nonnull(body);
    ck_assert_msg(strcmp(body, ref) == 0, "docs/columns.md is stale: run 'make docs'");
    free(doc);
    free(ref);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* Every name a script looks up with `pattern NAME` (pattern e.g. 'column("') in file
 * rel must be in names. */
static void lookups_exist(const char *rel, const char *pattern, const char *stop,
                          const char *names)
{
    char *text = vl_test_slurp(vl_test_top(), rel, NULL);
    ck_assert_msg(text != NULL, "missing %s", rel);
    int found = 0;
    for (const char *p = strstr(text, pattern); p; p = strstr(p + 1, pattern)) {
        const char *q = p + strlen(pattern);
        size_t len = strcspn(q, stop);
        char name[128];
        snprintf(name, sizeof name, "%.*s", (int)len, q);
        ck_assert_msg(listed(names, name), "%s looks up '%s', which no output has", rel, name);
        found++;
    }
    ck_assert_msg(found > 0, "no '%s' lookups found in %s", pattern, rel);
    free(text);
}

START_TEST(scripts_look_up_existing_columns)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-schema");
    char *ref = reference();
    char *series = names_in(ref, "## series.csv");
    char *summary = names_in(ref, "## summary.csv");
    lookups_exist("plots/history.gp", "column(\"", "\"", series);
    lookups_exist("plots/comparison.gp", "column(\"", "\"", series);
    lookups_exist("scripts/validation.sh", "last \"$d\" ", ")\" ", series);
    lookups_exist("scripts/validation.sh", "sum \"$d\" ", ")\" ", summary);
    free(series);
    free(summary);
    free(ref);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* Count the fields of a CSV line (no quoting in series.csv). */
static size_t fields(const char *line, size_t len)
{
    size_t n = 1;
    for (size_t i = 0; i < len; i++)
        n += line[i] == ',';
    return n;
}

START_TEST(headers_match_rows_and_are_documented)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-schema");
    char *ref = reference();
    char *series = names_in(ref, "## series.csv");
    ck_assert_int_eq(vl_test_sh(tmpdir, "%s run %s/scenarios/demo.cfg --set run.end_yr=2e8 "
                                        "--set run.log_points=20 --set run.linear_points=5 -o r",
                                vl_test_bin(), vl_test_top()),
                     0);
    char *text = vl_test_slurp(tmpdir, "r/series.csv", NULL);
    ck_assert_ptr_nonnull(text);
    const char *line = text;
    while (line[0] == '#')
        line = strchr(line, '\n') + 1;
    size_t hlen = strcspn(line, "\n"), nhead = fields(line, hlen), rows = 0;
    /* every header name is documented */
    for (const char *p = line; p < line + hlen;) {
        size_t len = strcspn(p, ",\n");
        char name[128];
        snprintf(name, sizeof name, "%.*s", (int)len, p);
        ck_assert_msg(listed(series, name), "series.csv column '%s' is not in the reference",
                      name);
        p += len + 1;
    }
    /* every row has as many fields as the header */
    for (const char *p = line + hlen + 1; *p; p += strcspn(p, "\n") + 1, rows++)
        ck_assert_uint_eq(fields(p, strcspn(p, "\n")), nhead);
    ck_assert_uint_gt(rows, 20);
    free(text);
    free(series);
    free(ref);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

Suite *vl_suite_schema(void)
{
    Suite *s = suite_create("schema");
    TCase *tc = tcase_create("core");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, reference_is_current);
    tcase_add_test(tc, scripts_look_up_existing_columns);
    tcase_add_test(tc, headers_match_rows_and_are_documented);
    suite_add_tcase(s, tc);
    return s;
}
