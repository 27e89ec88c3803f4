/* test_sources.c: every default's source is traceable (issue 19). The audit
 * (docs/sources.md, `volev processes --sources`) is current and its counts agree with the
 * printed reference; the rule that tells a citation from none is checked on examples; a
 * source without a citation says what it rests on instead; and every file a source
 * names is part of the project. */
#include <ctype.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"
#include "volev/scenario.h"

static char tmpdir[256];

START_TEST(audit_is_current)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-sources");
    ck_assert_int_eq(vl_test_sh(tmpdir, "'%s' processes --sources", vl_test_bin()), 0);
    char *out = vl_test_slurp(tmpdir, "out.txt", NULL);
    char path[1024];
    snprintf(path, sizeof path, "%s/docs", vl_test_top());
    char *doc = vl_test_slurp(path, "sources.md", NULL);
    ck_assert_msg(doc != NULL, "missing docs/sources.md");
    ck_assert_msg(strcmp(doc, out) == 0, "docs/sources.md is stale: run 'make docs'");
    free(doc);
    free(out);
    ck_assert_int_eq(vl_test_sh(tmpdir, "'%s' processes --sources extra", vl_test_bin()), 2);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* The number after "prefix" in text, or -1. */
static long count_after(const char *text, const char *prefix)
{
    const char *s = strstr(text, prefix);
    return s ? strtol(s + strlen(prefix), NULL, 10) : -1;
}

/* The audit's counts against the "source:" lines of `volev processes` counted as text,
 * independently of the classifier (grep -c of the lines, and of those saying "from
 * memory"). */
START_TEST(counts_match_reference)
{
    vl_test_tmp_make(tmpdir, sizeof tmpdir, "volev-sources");
    ck_assert_int_eq(vl_test_sh(tmpdir,
                                "'%s' processes > ref.txt && grep -c '^ *source: ' ref.txt"
                                " > n_src.txt && grep '^ *source: ' ref.txt | grep -c "
                                "'from memory' > n_mem.txt; '%s' processes --sources",
                                vl_test_bin(), vl_test_bin()),
                     0);
    char *audit = vl_test_slurp(tmpdir, "out.txt", NULL);
    char *n_src = vl_test_slurp(tmpdir, "n_src.txt", NULL);
    char *n_mem = vl_test_slurp(tmpdir, "n_mem.txt", NULL);
    ck_assert(audit && n_src && n_mem);
    long src = strtol(n_src, NULL, 10), mem = strtol(n_mem, NULL, 10);
    ck_assert_int_gt(src, 200);
    ck_assert_int_eq(count_after(audit, "of which "), src);
    ck_assert_int_eq(count_after(audit, "say \"from memory\": "), mem);
    ck_assert_int_eq(count_after(audit, "- parameters: ") - src,
                     count_after(audit, "parameters without a source: "));
    ck_assert_int_eq((long)vl_param_count(), count_after(audit, "- parameters: "));
    free(audit);
    free(n_src);
    free(n_mem);
    vl_test_tmp_remove(tmpdir);
}
END_TEST

/* The citation rule on texts of each kind (docs/sources.md states it). */
START_TEST(citation_rule)
{
    ck_assert(vl_source_cites("Gough 1981 (sun_analytic)"));
    ck_assert(vl_source_cites("Kopparapu et al. 2014, ApJL 787:L29"));
    ck_assert(vl_source_cites("~2-3, e.g. Volkov et al. 2011, from memory"));
    ck_assert(vl_source_cites("present Sun (Wood 2004, Living Rev. Sol. Phys. 1:2)"));
    ck_assert(vl_source_cites("(U.S. Standard Atmosphere 1976, NOAA/NASA/USAF)"));
    ck_assert(vl_source_cites("NASA NSSDC Earth fact sheet"));
    ck_assert(vl_source_cites("Earth 3480 / 6371 km (PREM)"));
    /* numbers that are not years, and years without an author, do not cite */
    ck_assert(!vl_source_cites("1200 J/(kg K), chosen here"));
    ck_assert(!vl_source_cites("calibration: 288 K at 1361 W/m^2"));
    ck_assert(!vl_source_cites("above 2000 cm^-1, common practice"));
    ck_assert(!vl_source_cites("~7.7e22 for 2020"));
    ck_assert(!vl_source_cites("common practice"));
    ck_assert(!vl_source_cites(""));
    ck_assert(!vl_source_cites(NULL));
    ck_assert(vl_source_from_memory("Chamberlain & Hunten 1987, from memory"));
    ck_assert(!vl_source_from_memory("Gough 1981"));
}
END_TEST

/* Every parameter's source, through the global index. */
typedef void (*source_check)(const char *key, const char *ref);

static void each_source(source_check check)
{
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        ck_assert_ptr_nonnull(p);
        if (!p->ref || !p->ref[0])
            continue;
        char key[256];
        snprintf(key, sizeof key, "%s%s", prefix, p->key);
        check(key, p->ref);
    }
}

/* A source that cites nothing names the kind of value instead (docs/sources.md). */
static void states_its_kind(const char *key, const char *ref)
{
    if (vl_source_cites(ref))
        return;
    static const char *const kinds[] = {"common practice", "chosen here", "calibration", "[C]"};
    int found = 0;
    for (size_t k = 0; k < sizeof kinds / sizeof kinds[0]; k++)
        found |= strstr(ref, kinds[k]) != NULL;
    ck_assert_msg(found, "%s: source '%s' cites nothing and names no kind", key, ref);
}

START_TEST(uncited_sources_state_their_kind)
{
    each_source(states_its_kind);
}
END_TEST

/* Every project file a source names (docs/..., src/..., tests/..., scripts/...) exists;
 * nothing outside the project is cited (design notes, absolute paths). */
static void names_project_files(const char *key, const char *ref)
{
    static const char *const roots[] = {"docs/", "src/", "tests/", "scripts/"};
    for (size_t r = 0; r < sizeof roots / sizeof roots[0]; r++) {
        for (const char *s = strstr(ref, roots[r]); s; s = strstr(s + 1, roots[r])) {
            if (s > ref && s[-1] != ' ' && s[-1] != '(')
                continue; /* part of a longer path */
            char rel[256];
            size_t len = strcspn(s, " ,;)");
            ck_assert_uint_lt(len, sizeof rel);
            memcpy(rel, s, len);
            rel[len] = '\0';
            ck_assert_msg(vl_test_exists(vl_test_top(), rel),
                          "%s: source names '%s', not in the project", key, rel);
        }
    }
    for (const char *s = strstr(ref, " /"); s; s = strstr(s + 1, " /"))
        ck_assert_msg(!isalpha((unsigned char)s[2]),
                      "%s: source '%s' names an absolute path, outside the project", key, ref);
    ck_assert_msg(!strstr(ref, "science.md") && !strstr(ref, "design"),
                  "%s: source '%s' cites a note outside the project", key, ref);
}

START_TEST(named_files_in_project)
{
    each_source(names_project_files);
}
END_TEST

Suite *vl_suite_sources(void)
{
    Suite *s = suite_create("sources");
    TCase *tc = tcase_create("audit");
    tcase_set_timeout(tc, 60);
    tcase_add_test(tc, audit_is_current);
    tcase_add_test(tc, counts_match_reference);
    tcase_add_test(tc, citation_rule);
    tcase_add_test(tc, uncited_sources_state_their_kind);
    tcase_add_test(tc, named_files_in_project);
    suite_add_tcase(s, tc);
    return s;
}
