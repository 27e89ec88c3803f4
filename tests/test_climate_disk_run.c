/* test_climate_disk_run.c: the program with the column climate's table cache on disk
 * (climate_disk.c, src/cli/cache.c): a run repeated with the cache gives the same
 * files and computes no table point; where the program looks for the cache folder
 * (VOLEV_CACHE_DIR, XDG_CACHE_HOME, HOME; empty: off); a folder that cannot be made and
 * a write error each give one warning and change no result. Software-behaviour checks:
 * common practice. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "suites.h"

static char tmp[256];

/* climate_table_nodes of DIR/summary.csv in tmp. */
static long nodes_of(const char *dir)
{
    char rel[128];
    snprintf(rel, sizeof rel, "%s/summary.csv", dir);
    char *s = vl_test_slurp(tmp, rel, NULL);
    ck_assert_ptr_nonnull(s);
    char *r = strstr(s, "\nclimate_table_nodes,");
    ck_assert_ptr_nonnull(r);
    long n = strtol(r + 21, NULL, 10);
    free(s);
    return n;
}

/* Whether err.txt in tmp is empty. */
static int quiet(void)
{
    long n;
    char *s = vl_test_slurp(tmp, "err.txt", &n);
    ck_assert_ptr_nonnull(s);
    free(s);
    return n == 0;
}

/* Whether err.txt in tmp is one line, a warning containing needle. */
static int one_warning(const char *needle)
{
    char *s = vl_test_slurp(tmp, "err.txt", NULL);
    ck_assert_ptr_nonnull(s);
    char *nl = strchr(s, '\n');
    int ok = strncmp(s, "volev: warning: ", 16) == 0 && nl && !nl[1] && strstr(s, needle);
    if (!ok)
        fprintf(stderr, "err.txt: %s\n", s);
    free(s);
    return ok;
}

/* Runs "ENV volev run tests/data/mars_today.cfg -o OUT" in tmp; its exit status. */
static int run(const char *env, const char *out)
{
    return vl_test_sh(tmp, "env %s '%s' run '%s/tests/data/mars_today.cfg' -o %s", env,
                      vl_test_bin(), vl_test_top(), out);
}

START_TEST(program_runs)
{
    ck_assert_int_eq(run("VOLEV_CACHE_DIR=cache", "r1"), 0);
    ck_assert(quiet());
    ck_assert_int_eq(run("VOLEV_CACHE_DIR=cache", "r2"), 0);
    ck_assert(quiet());
    ck_assert_int_eq(vl_test_sh(tmp, "cmp r1/series.csv r2/series.csv && "
                                     "cmp r1/events.csv r2/events.csv"),
                     0);
    long first = nodes_of("r1");
    ck_assert_int_gt(first, 0);
    ck_assert_int_eq(nodes_of("r2"), 0); /* every point was kept */
    /* the folder: VOLEV_CACHE_DIR if set (empty: off), else XDG_CACHE_HOME/volev, else
     * HOME/.cache/volev; a cache found there computes nothing */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir -p home/.cache xdg && cp -r cache home/.cache/volev && "
                                     "cp -r cache xdg/volev && mkdir empty"),
                     0);
    ck_assert_int_eq(run("-u VOLEV_CACHE_DIR -u XDG_CACHE_HOME HOME=$PWD/home", "r3"), 0);
    ck_assert_int_eq(nodes_of("r3"), 0);
    ck_assert_int_eq(run("-u VOLEV_CACHE_DIR XDG_CACHE_HOME=$PWD/xdg HOME=$PWD/empty", "r4"), 0);
    ck_assert_int_eq(nodes_of("r4"), 0);
    ck_assert(!vl_test_exists(tmp, "empty/.cache"));
    ck_assert_int_eq(run("VOLEV_CACHE_DIR= XDG_CACHE_HOME=$PWD/xdg HOME=$PWD/home", "r5"), 0);
    ck_assert_int_eq(nodes_of("r5"), first); /* off */
    ck_assert(quiet());
    /* a folder that cannot be made: one warning, the run goes on without the cache */
    vl_test_write(tmp, "afile", "");
    ck_assert_int_eq(run("VOLEV_CACHE_DIR=afile/sub", "r6"), 0);
    ck_assert(one_warning("afile/sub"));
    ck_assert_int_eq(nodes_of("r6"), first);
    /* a write error: one warning at the end, same results */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir bad && for f in cache/*.pts; do mkdir bad/${f#cache/}; "
                                     "done"),
                     0);
    ck_assert_int_eq(run("VOLEV_CACHE_DIR=bad", "r7"), 0);
    ck_assert(one_warning("climate table cache turned off: bad/column-"));
    ck_assert_int_eq(vl_test_sh(tmp, "cmp r1/series.csv r7/series.csv"), 0);
}
END_TEST

/* The bytes of every table file in the cache folder dir (in tmp). */
static long cache_bytes(const char *dir)
{
    ck_assert_int_eq(vl_test_sh(tmp, "cat %s/column-*.pts | wc -c", dir), 0);
    char *s = vl_test_slurp(tmp, "out.txt", NULL);
    ck_assert_ptr_nonnull(s);
    long n = strtol(s, NULL, 10);
    free(s);
    return n;
}

/* sweep and balance read and write the cache too; so do 2 MPI ranks at once */
START_TEST(sweep_and_balance)
{
    const char *bin = vl_test_bin(), *top = vl_test_top(), *mpi = getenv("VOLEV_MPI_BIN");
    char *base = vl_test_slurp(top, "tests/data/mars_today.cfg", NULL), text[16384];
    ck_assert_ptr_nonnull(base);
    int n = snprintf(text, sizeof text,
                     "%s\nsweep: { design = \"grid\"; axes = ({ key = \"planet.orbit_au\"; "
                     "spacing = \"linear\"; from = 1.50; to = 1.55; points = 2; }); };\n",
                     base);
    ck_assert(n > 0 && (size_t)n < sizeof text);
    free(base);
    vl_test_write(tmp, "ms.cfg", text);
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=sc '%s' sweep ms.cfg -o s1 -j 2 --quiet", bin),
                     0);
    ck_assert(quiet());
    long written = cache_bytes("sc");
    ck_assert_int_gt(written, 0);
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=sc '%s' sweep ms.cfg -o s2 -j 2 --quiet", bin),
                     0);
    ck_assert_int_eq(cache_bytes("sc"), written); /* nothing computed again */
    ck_assert_int_eq(vl_test_sh(tmp, "cmp s1/members.csv s2/members.csv"), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=sc '%s' balance ms.cfg -o b1", bin), 0);
    ck_assert(quiet());
    written = cache_bytes("sc");
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=sc '%s' balance ms.cfg -o b2", bin), 0);
    ck_assert_int_eq(cache_bytes("sc"), written);
    ck_assert_int_eq(vl_test_sh(tmp, "cmp b1/balance.csv b2/balance.csv"), 0);
    if (!mpi || !*mpi)
        return; /* test_sweep.c insists on the MPI build */
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=mc OMPI_ALLOW_RUN_AS_ROOT=1 "
                                     "OMPI_ALLOW_RUN_AS_ROOT_CONFIRM=1 mpirun --oversubscribe -n 2 "
                                     "'%s' sweep ms.cfg -o m1 -j 1 --quiet",
                                mpi),
                     0);
    written = cache_bytes("mc");
    ck_assert_int_gt(written, 0);
    /* every point the two ranks wrote reads back whole: nothing is computed again */
    ck_assert_int_eq(vl_test_sh(tmp, "VOLEV_CACHE_DIR=mc '%s' sweep ms.cfg -o m2 --quiet", bin), 0);
    ck_assert_int_eq(cache_bytes("mc"), written);
    ck_assert_int_eq(vl_test_sh(tmp, "cmp s1/members.csv m1/members.csv && "
                                     "cmp s1/members.csv m2/members.csv"),
                     0);
}
END_TEST

static void setup(void) { vl_test_tmp_make(tmp, sizeof tmp, "volev-disk-run"); }

static void teardown(void) { vl_test_tmp_remove(tmp); }

Suite *vl_suite_climate_disk_run(void)
{
    Suite *s = suite_create("climate_disk_run");
    TCase *tc = tcase_create("program");
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, program_runs);
    tcase_add_test(tc, sweep_and_balance);
    suite_add_tcase(s, tc);
    return s;
}
