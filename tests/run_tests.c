/* run_tests.c: the single Check runner for every suite (tests/suites.def). */
#include <stdlib.h>

#include "suites.h"

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

int main(void)
{
    SRunner *sr = srunner_create(NULL);
#define SUITE(name) srunner_add_suite(sr, vl_suite_##name());
#include "suites.def"
#undef SUITE
    srunner_run_all(sr, CK_NORMAL);
    int failed = srunner_ntests_failed(sr);
    srunner_free(sr);
    return failed == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}
