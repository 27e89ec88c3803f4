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

/* Paths for tests that run the program or read bundled files. */
const char *vl_test_bin(void);   /* $VOLEV_BIN or "build/volev" */
const char *vl_test_top(void);   /* $VOLEV_TOP or "." */

#endif
