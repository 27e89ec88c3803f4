/* suites.h: declarations of every Check suite and small test helpers. */
#ifndef VOLEV_TESTS_SUITES_H
#define VOLEV_TESTS_SUITES_H

#include <check.h>
#include <math.h>
#include <stddef.h>

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

struct vl_work;
struct vl_climate;
struct vl_climate_work;
/* The test's workspace for m (made on first use, freed by vl_test_model_free). */
struct vl_work *vl_test_work(const struct vl_model *m);
/* Frees m and its test workspace. */
void vl_test_model_free(struct vl_model *m);
/* The same for a bare climate. */
struct vl_climate_work *vl_test_climate_work(const struct vl_climate *c);
void vl_test_climate_free(struct vl_climate *c);

struct vl_process;
struct vl_env;
/* Process name alone at (y, env), with m's parameters for it (the scenario's when m has
 * it switched off): its tendencies into dydt (VL_NRES entries) and its columns into
 * cols, both zeroed first. */
const struct vl_process *vl_test_process_rates(const struct vl_model *m, const char *name,
                                               const double *y, const struct vl_env *env,
                                               double *dydt, double *cols);

/* Index of m's output column called name; fails the test if there is none. */
size_t vl_test_column(const struct vl_model *m, const char *name);

/* Runs the scenario VOLEV_TOP/rel with the overrides to its end; the environment of its
 * last output row into last and, unless NULL, its final state (VL_NSTATE) into y_final. */
void vl_test_final_env(const char *rel, const char *const *sets, size_t n, struct vl_env *last,
                       double *y_final);

/* Paths for tests that run the program or read bundled files. */
const char *vl_test_bin(void);   /* $VOLEV_BIN or "build/volev" */
const char *vl_test_top(void);   /* $VOLEV_TOP or "." */

/* Command-line tests: the program run in a temporary folder DIR; REL is relative to it. */
/* A fresh folder /tmp/TAG-XXXXXX (mkdtemp) written into dir (of size n). */
void vl_test_tmp_make(char *dir, size_t n, const char *tag);
/* Removes dir and everything in it. */
void vl_test_tmp_remove(const char *dir);
/* Runs "cd DIR && CMD >out.txt 2>err.txt" through system(), CMD built from fmt;
 * asserts the shell exited normally and returns its exit status. */
int vl_test_sh(const char *dir, const char *fmt, ...) __attribute__((format(printf, 2, 3)));
/* Whether gnuplot is on PATH. */
int vl_test_have_gnuplot(void);
/* The contents of DIR/REL, malloc'd and NUL-terminated, NULL if it cannot be opened;
 * its length in *size unless size is NULL. */
char *vl_test_slurp(const char *dir, const char *rel, long *size);
/* The value of row name ("name,value,unit") in the text of a summary.csv; the test fails
 * when there is no such row. */
double vl_test_summary_row(const char *text, const char *name);
/* The same read from dir/rel. */
double vl_test_summary_value(const char *dir, const char *rel, const char *name);
/* Whether DIR/REL exists. */
int vl_test_exists(const char *dir, const char *rel);
/* Writes text to DIR/REL (replacing it). */
void vl_test_write(const char *dir, const char *rel, const char *text);
/* Asserts that DIR/REL exists and contains needle; the message shows the text. */
void vl_test_file_contains(const char *dir, const char *rel, const char *needle);

#endif
