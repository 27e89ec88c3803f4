/* suites.h: declarations of every Check suite and small test helpers. */
#ifndef VOLEV_TESTS_SUITES_H
#define VOLEV_TESTS_SUITES_H

#include <check.h>
#include <math.h>

#define SUITE(name) Suite *vl_suite_##name(void);
#include "suites.def"
#undef SUITE

/* Relative closeness |a-b| <= rel*|b|, with a message naming the expression. */
#define ck_assert_rel(a, b, rel)                                                        \
    do {                                                                                \
        double ck_a_ = (a), ck_b_ = (b), ck_r_ = (rel);                                 \
        ck_assert_msg(isfinite(ck_a_) && fabs(ck_a_ - ck_b_) <= ck_r_ * fabs(ck_b_),    \
                      "%s = %.10g, expected %.10g within %.3g relative", #a, ck_a_,    \
                      ck_b_, ck_r_);                                                    \
    } while (0)

struct vl_scenario;
struct vl_model;
/* A scenario with its defaults (rel NULL) or loaded from VOLEV_TOP/rel, then the
 * overrides "KEY=VALUE"; fails the test with the loader's message on error. */
struct vl_scenario *vl_test_scenario(const char *rel, const char *const *sets, size_t n);
/* The model of sc; fails the test with the message on error. */
struct vl_model *vl_test_model(const struct vl_scenario *sc);

/* Paths for tests that run the program or read bundled files. */
const char *vl_test_bin(void);   /* $VOLEV_BIN or "build/volev" */
const char *vl_test_top(void);   /* $VOLEV_TOP or "." */

#endif
