/* run_tests.c: the single Check runner for every suite (tests/suites.def). */
#include <stdlib.h>

#include <stdio.h>

#include "suites.h"
#include "volev/climate.h"
#include "volev/model.h"

const char *vl_test_bin(void)
{
    const char *s = getenv("VOLEV_BIN");
    return s ? s : "build/volev";
}

const char *vl_test_top(void)
{
    const char *s = getenv("VOLEV_TOP");
    return s ? s : ".";
}

vl_scenario *vl_test_scenario(const char *rel, const char *const *sets, size_t n)
{
    vl_status st;
    vl_scenario *sc;
    if (rel) {
        char path[4096];
        snprintf(path, sizeof path, "%s/%s", vl_test_top(), rel);
        sc = vl_scenario_load(path, sets, n, &st);
        ck_assert_msg(sc != NULL, "%s:%d: %s", st.file, st.line, st.msg);
        return sc;
    }
    sc = vl_scenario_new();
    ck_assert_ptr_nonnull(sc);
    for (size_t i = 0; i < n; i++)
        ck_assert_msg(vl_scenario_override(sc, sets[i], &st) == VL_OK, "%s", st.msg);
    return sc;
}

vl_model *vl_test_model(const vl_scenario *sc)
{
    vl_status st;
    vl_model *m = vl_model_new(sc, &st);
    ck_assert_msg(m != NULL, "%s", st.msg);
    return m;
}

int main(void)
{
    /* the climate tables' disk cache for the in-process runs too, so that the suites'
     * forked tests share the points they compute (make check sets a fresh folder) */
    const char *cache = getenv("VOLEV_CACHE_DIR");
    vl_status st;
    if (cache && cache[0] && vl_climate_cache_configure(cache, &st) != VL_OK)
        fprintf(stderr, "run_tests: climate cache off: %s\n", st.msg);
    SRunner *sr = srunner_create(NULL);
#define SUITE(name) srunner_add_suite(sr, vl_suite_##name());
#include "suites.def"
#undef SUITE
    srunner_run_all(sr, CK_NORMAL);
    int failed = srunner_ntests_failed(sr);
    srunner_free(sr);
    return failed == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}
