/* test_outputs.c: what volev writes and where (docs/hardening.md, "Outputs"): no nan, inf
 * or -0 in any file, empty fields where a quantity has no value; the output folder rules
 * of run and sweep (an occupied folder refused unless --replace, temporaries of a killed
 * volev removed, a sweep folder locked against a second writer, MPI included); plot
 * refusing an incomplete file; catalogue names neutralised against spreadsheet formulas.
 * Runs the program ($VOLEV_BIN; the MPI build $VOLEV_MPI_BIN) through the shell. */
#define _GNU_SOURCE
#include <ctype.h>
#include <fcntl.h>
#include <math.h>
#include <signal.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/file.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

#include "suites.h"
#include "volev/csv.h"
#include "volev/output.h"

static char tmp[256];

/* Run "volev ARGS" in tmp; stdout and stderr into out.txt and err.txt; the exit code. */
static int volev(const char *fmt, ...) __attribute__((format(printf, 1, 2)));
static int volev(const char *fmt, ...)
{
    char args[4096];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(args, sizeof args, fmt, ap);
    va_end(ap);
    return vl_test_sh(tmp, "'%s' %s", vl_test_bin(), args);
}

/* A fast scenario: present Earth for 100 Myr (as in test_cli.c). */
static const char *quick =
    "planet: { mass_mearth = 1.0; radius_rearth = 1.0; orbit_au = 1.0; };\n"
    "inventory: { surface_water_to = 1.0; n2_bar = 0.78; co2_bar = 3e-4; mantle_co2_bar = 100.0; };\n"
    "run: { start_yr = 4.0e9; end_yr = 4.1e9; log_points = 20; linear_points = 20; };\n";

/* ------------------------------------------------------------------ no nan, inf, -0 */

/* The number rule itself (docs/columns.md, first paragraph): printf prints the sign of a
 * negative zero and "nan"/"inf" (ISO/IEC 9899:2018 7.21.6.1); vl_output_number does not. */
START_TEST(number_rule)
{
    char buf[64];
    ck_assert_uint_eq(vl_output_number(buf, sizeof buf, "%.10g", -0.0), 1);
    ck_assert_str_eq(buf, "0");
    vl_output_number(buf, sizeof buf, "%.3e", -0.0);
    ck_assert_str_eq(buf, "0.000e+00");
    vl_output_number(buf, sizeof buf, "%.6f", -1e-9); /* rounds to a signed zero */
    ck_assert_str_eq(buf, "0.000000");
    ck_assert_uint_eq(vl_output_number(buf, sizeof buf, "%.10g", NAN), 0);
    ck_assert_str_eq(buf, "");
    vl_output_number(buf, sizeof buf, "%.10g", -INFINITY);
    ck_assert_str_eq(buf, "");
    vl_output_number(buf, sizeof buf, "%.10g", -1.5e-300); /* a tiny value keeps its sign */
    ck_assert_str_eq(buf, "-1.5e-300");
    vl_output_number(buf, sizeof buf, "%.6f", -0.25);
    ck_assert_str_eq(buf, "-0.250000");
}
END_TEST

/* Every field of every non-comment line of rel (split at commas; a quoted text piece is
 * no number) is no nan/inf and no signed zero; returns the data lines seen. The rule:
 * docs/columns.md, first paragraph (vl_output_number). */
static int assert_clean_numbers(const char *rel)
{
    char *text = vl_test_slurp(tmp, rel, NULL);
    ck_assert_msg(text != NULL, "missing %s", rel);
    int line = 0, rows = 0;
    for (char *save = NULL, *l = strtok_r(text, "\n", &save); l; l = strtok_r(NULL, "\n", &save)) {
        line++;
        if (l[0] == '#')
            continue;
        rows++;
        for (char *fs = NULL, *f = strtok_r(l, ",", &fs); f; f = strtok_r(NULL, ",", &fs)) {
            char *end;
            double v = strtod(f, &end);
            if (end == f || *end != '\0')
                continue; /* text, or empty */
            ck_assert_msg(isfinite(v), "%s:%d: '%s' is not finite", rel, line, f);
            ck_assert_msg(!(v == 0.0 && f[0] == '-'), "%s:%d: a signed zero '%s'", rel, line, f);
        }
    }
    free(text);
    return rows;
}

/* The value of summary.csv's row `name` in run folder dir (malloc'd), NULL if no row. */
static char *summary_value(const char *dir, const char *name)
{
    char rel[300], want[128];
    snprintf(rel, sizeof rel, "%s/summary.csv", dir);
    snprintf(want, sizeof want, "\n%s,", name);
    char *text = vl_test_slurp(tmp, rel, NULL);
    ck_assert_ptr_nonnull(text);
    char *p = strstr(text, want), *v = NULL;
    if (p) {
        p += strlen(want);
        v = strndup(p, strcspn(p, ","));
    }
    free(text);
    return v;
}

START_TEST(no_nan_once_the_water_is_gone)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    static const char *const files[] = {"series.csv", "events.csv", "summary.csv"};
    /* Venus loses all its surface water (docs/validation.md); a dry start never has any */
    ck_assert_int_eq(volev("run '%s/scenarios/venus.cfg' -o venus", vl_test_top()), 0);
    vl_test_write(tmp, "quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o dry --set inventory.surface_water_to=0"), 0);
    for (int d = 0; d < 2; d++)
        for (int k = 0; k < 3; k++) {
            char rel[64];
            snprintf(rel, sizeof rel, "%s/%s", d ? "dry" : "venus", files[k]);
            ck_assert_int_gt(assert_clean_numbers(rel), 1);
        }
    /* Venus: its water is gone, the ratio of its last water is a value (docs/columns.md) */
    char *v = summary_value("venus", "final_surface_water_to");
    ck_assert_double_lt(strtod(v, NULL), 1e-20);
    free(v);
    v = summary_value("venus", "final_dh_water");
    ck_assert_msg(v && *v, "Venus's final_dh_water is the ratio of its last water");
    free(v);
    /* the dry start: no water ever, so no D/H ratio: documented empty (docs/columns.md) */
    static const char *const empty[] = {"final_dh_water", "dh_enrichment"};
    for (int k = 0; k < 2; k++) {
        v = summary_value("dry", empty[k]);
        ck_assert_msg(v != NULL, "no row %s", empty[k]);
        ck_assert_msg(*v == '\0', "%s of a dry run is '%s', not empty", empty[k], v);
        free(v);
    }
    /* no initial deuterium: an enrichment (a ratio to 0) has no value */
    ck_assert_int_eq(volev("run quick.cfg -o nod --set inventory.initial_dh=0"), 0);
    v = summary_value("nod", "dh_enrichment");
    ck_assert_str_eq(v, "");
    free(v);
    vl_test_tmp_remove(tmp);
}
END_TEST

/* ------------------------------------------------------------------ catalogue sweep */

/* Invented candidates whose names start like spreadsheet formulas, each wet and dry. */
static void write_catalogue(void)
{
    vl_test_write(tmp, "cands.csv",
                  "name,planet_mass_mearth,orbit_au\n"
                  "\"=HYPERLINK(\"\"http://example.invalid\"\",\"\"x\"\")\",1.0,0.8\n"
                  "+cmd,1.0,1.0\n"
                  "-2+3,1.0,1.2\n"
                  "@SUM(A1),1.0,1.4\n"
                  "plain,+1.0,1.1\n");
    char *base = vl_test_slurp(vl_test_top(), "tests/data/sweep/catalogue.cfg", NULL);
    ck_assert_ptr_nonnull(base);
    char *cut = strstr(base, "sweep:");
    ck_assert_ptr_nonnull(cut);
    *cut = '\0';
    char cfg[4096];
    snprintf(cfg, sizeof cfg, "%ssweep: { catalogue = \"cands.csv\"; water_to = [1.0, 0.0]; };\n",
             base);
    free(base);
    vl_test_write(tmp, "cat.cfg", cfg);
}

START_TEST(catalogue_names_neutralised_and_no_nan)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    write_catalogue();
    ck_assert_int_eq(volev("sweep cat.cfg -o cat --quiet"), 0);
    static const char *const files[] = {"cat/members.csv", "cat/ensemble_summary.csv",
                                        "cat/ensemble_series.csv"};
    for (int k = 0; k < 3; k++)
        assert_clean_numbers(files[k]);
    char path[600];
    snprintf(path, sizeof path, "%s/cat/members.csv", tmp);
    static const vl_csv_options quoted = {VL_CSV_QUOTES, 0, 0, 0, NULL, NULL};
    vl_status st;
    vl_csv_table *t = vl_csv_read(path, &quoted, &st);
    ck_assert_msg(t != NULL, "members.csv is no valid CSV: %s", st.msg);
    size_t name = vl_csv_column(t, "candidate"), mass = vl_csv_column(t, "planet_mass_mearth"),
           dh = vl_csv_column(t, "dh_enrichment"), water = vl_csv_column(t, "initial_water_to");
    ck_assert(name != VL_CSV_NONE && mass != VL_CSV_NONE && dh != VL_CSV_NONE &&
              water != VL_CSV_NONE);
    ck_assert_uint_eq(t->nrows, 10);
    /* OWASP "CSV Injection": a leading single quote before = + - @; a number stays one */
    static const char *const want[] = {"'=HYPERLINK(\"http://example.invalid\",\"x\")", "'+cmd",
                                       "'-2+3", "'@SUM(A1)", "plain"};
    for (size_t r = 0; r < t->nrows; r++) {
        ck_assert_str_eq(t->rows[r].field[name], want[r / 2]);
        ck_assert_str_eq(t->rows[r].field[mass], r / 2 == 4 ? "+1.0" : "1.0");
        /* a dry member has no D/H ratio: its dh_enrichment is empty (docs/ensembles.md) */
        if (strtod(t->rows[r].field[water], NULL) == 0.0)
            ck_assert_str_eq(t->rows[r].field[dh], "");
        else
            ck_assert_str_ne(t->rows[r].field[dh], "");
    }
    vl_csv_free(t);
    vl_test_tmp_remove(tmp);
}
END_TEST

/* ------------------------------------------------------------------ run folders */

/* A pid that no process has: a child that exited and was reaped. */
static long dead_pid(void)
{
    pid_t pid = fork();
    ck_assert_int_ge(pid, 0);
    if (pid == 0)
        _exit(0);
    int status;
    ck_assert_int_eq(waitpid(pid, &status, 0), pid);
    return (long)pid;
}

START_TEST(run_folder_rules)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    vl_test_write(tmp, "quick.cfg", quick);
    /* an empty existing folder is fine (tests/bad makes them) */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir empty"), 0);
    ck_assert_int_eq(volev("run quick.cfg -o empty"), 0);
    ck_assert(vl_test_exists(tmp, "empty/summary.csv"));
    /* an earlier result: refused (exit 5, file I/O: volev(1)), untouched */
    char *before = vl_test_slurp(tmp, "empty/series.csv", NULL);
    ck_assert_int_eq(volev("run quick.cfg -o empty --set planet.orbit_au=0.9"), 5);
    vl_test_file_contains(tmp, "err.txt", "empty: the output folder is not empty");
    vl_test_file_contains(tmp, "err.txt", "earlier volev command");
    vl_test_file_contains(tmp, "err.txt", "--replace");
    char *after = vl_test_slurp(tmp, "empty/series.csv", NULL);
    ck_assert_str_eq(before, after);
    free(after);
    /* --replace writes over it */
    ck_assert_int_eq(volev("run quick.cfg -o empty --replace --set planet.orbit_au=0.9"), 0);
    after = vl_test_slurp(tmp, "empty/series.csv", NULL);
    ck_assert_str_ne(before, after);
    free(before), free(after);
    /* files volev did not write: refused, kept; with --replace kept beside the run's */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir mine"), 0);
    vl_test_write(tmp, "mine/notes.txt", "keep\n");
    ck_assert_int_eq(volev("run quick.cfg -o mine"), 5);
    vl_test_file_contains(tmp, "err.txt", "files volev did not write");
    ck_assert(!vl_test_exists(tmp, "mine/series.csv"));
    ck_assert_int_eq(volev("run quick.cfg -o mine --replace"), 0);
    vl_test_file_contains(tmp, "mine/notes.txt", "keep");
    ck_assert(vl_test_exists(tmp, "mine/summary.csv"));
    /* a file, not a folder */
    ck_assert_int_eq(volev("run quick.cfg -o quick.cfg --replace"), 5);
    /* --replace means a named folder */
    ck_assert_int_eq(volev("run quick.cfg --replace"), 2);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(leftovers_of_a_killed_run)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    vl_test_write(tmp, "quick.cfg", quick);
    /* what a run killed before its rename leaves: hidden temporaries with its pid */
    long gone = dead_pid();
    char rel[2][128];
    snprintf(rel[0], sizeof rel[0], "left/.series.csv.%ld.tmp", gone);
    snprintf(rel[1], sizeof rel[1], "left/.summary.csv.%ld.tmp", gone);
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir left"), 0);
    for (int k = 0; k < 2; k++)
        vl_test_write(tmp, rel[k], "time_yr,regime\n1,2\n");
    ck_assert_int_eq(volev("run quick.cfg -o left"), 0);
    vl_test_file_contains(tmp, "err.txt", "removed 2 temporary files left by a killed run");
    for (int k = 0; k < 2; k++)
        ck_assert_msg(!vl_test_exists(tmp, rel[k]), "%s is still there", rel[k]);
    ck_assert(vl_test_exists(tmp, "left/series.csv"));
    /* a temporary of a process that still runs (this test) is not touched, and the
     * folder is busy */
    char live[128];
    snprintf(live, sizeof live, "busy/.series.csv.%ld.tmp", (long)getpid());
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir busy"), 0);
    vl_test_write(tmp, live, "time_yr\n");
    ck_assert_int_eq(volev("run quick.cfg -o busy"), 5);
    vl_test_file_contains(tmp, "err.txt", "another volev run is writing into it");
    ck_assert(vl_test_exists(tmp, live));
    /* a sweep folder: the same for a sweep's temporaries */
    snprintf(rel[0], sizeof rel[0], "sw/.members.csv.%ld.tmp", gone);
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir sw"), 0);
    vl_test_write(tmp, rel[0], "member\n");
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o sw --quiet", vl_test_top()), 0);
    vl_test_file_contains(tmp, "err.txt", "removed 1 temporary file left by a killed volev");
    ck_assert(!vl_test_exists(tmp, rel[0]));
    ck_assert(vl_test_exists(tmp, "sw/members.csv"));
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(sweep_folder_rules)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    const char *top = vl_test_top();
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir other"), 0);
    vl_test_write(tmp, "other/notes.txt", "keep\n");
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o other --quiet", top), 5);
    vl_test_file_contains(tmp, "err.txt", "files volev did not write");
    ck_assert(!vl_test_exists(tmp, "other/sweep.journal"));
    ck_assert(!vl_test_exists(tmp, "other/.volev.lock"));
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o other --quiet --replace", top),
                     0);
    vl_test_file_contains(tmp, "other/notes.txt", "keep");
    /* the same sweep again: finished already; another sweep: refused unless --replace */
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o other --quiet", top), 0);
    vl_test_file_contains(tmp, "out.txt", "already complete");
    write_catalogue();
    ck_assert_int_eq(volev("sweep cat.cfg -o other --quiet"), 5);
    vl_test_file_contains(tmp, "err.txt", "holds the results of another sweep");
    ck_assert_int_eq(volev("sweep cat.cfg -o other --quiet --replace"), 0);
    vl_test_file_contains(tmp, "other/members.csv", "'+cmd");
    ck_assert(!vl_test_exists(tmp, "other/.volev.lock"));
    vl_test_tmp_remove(tmp);
}
END_TEST

/* ------------------------------------------------------------------ the sweep lock */

/* Holds DIR/.volev.lock as a sweep does (flock, the holder's pid inside); the fd. */
static int hold_lock(const char *dir, long pid)
{
    char path[600], text[32];
    snprintf(path, sizeof path, "%s/%s/.volev.lock", tmp, dir);
    int fd = open(path, O_RDWR | O_CREAT, 0666);
    ck_assert_int_ge(fd, 0);
    ck_assert_int_eq(flock(fd, LOCK_EX | LOCK_NB), 0);
    int n = snprintf(text, sizeof text, "%ld\n", pid);
    ck_assert_int_eq(write(fd, text, (size_t)n), n);
    return fd;
}

/* Start a sweep of resume.cfg into dir in the background (as test_sweep.c); its pid. */
static pid_t start_sweep(const char *dir)
{
    pid_t pid = fork();
    ck_assert_int_ge(pid, 0);
    if (pid == 0) {
        char scen[600], out[600];
        snprintf(scen, sizeof scen, "%s/tests/data/sweep/resume.cfg", vl_test_top());
        snprintf(out, sizeof out, "%s/%s", tmp, dir);
        FILE *o = freopen("/dev/null", "w", stdout), *e = freopen("/dev/null", "w", stderr);
        (void)o;
        (void)e;
        execl(vl_test_bin(), "volev", "sweep", scen, "-o", out, "-j", "1", "--quiet", (char *)NULL);
        _exit(127);
    }
    return pid;
}

START_TEST(sweep_folder_locked)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    const char *top = vl_test_top();
    /* two identical sweeps into one folder: the second refuses at once (exit 5) */
    pid_t first = start_sweep("two");
    char journal[600];
    snprintf(journal, sizeof journal, "%s/two/sweep.journal", tmp);
    for (int k = 0; k < 20000 && access(journal, F_OK) != 0; k++) {
        struct timespec ts = {0, 1000000};
        nanosleep(&ts, NULL);
    }
    ck_assert_msg(access(journal, F_OK) == 0, "the first sweep did not start");
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/resume.cfg' -o two --quiet", top), 5);
    ck_assert_msg(!vl_test_exists(tmp, "two/members.csv"),
                  "the first sweep finished before the second started: no test");
    char want[64];
    snprintf(want, sizeof want, "another volev (pid %ld) is writing into this folder",
             (long)first);
    vl_test_file_contains(tmp, "err.txt", want);
    int status;
    ck_assert_int_eq(waitpid(first, &status, 0), first);
    ck_assert(WIFEXITED(status) && WEXITSTATUS(status) == 0);
    ck_assert(vl_test_exists(tmp, "two/members.csv"));
    ck_assert(!vl_test_exists(tmp, "two/.volev.lock"));
    /* a lock held: refused, nothing written */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir held"), 0);
    int fd = hold_lock("held", (long)getpid());
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o held --quiet", top), 5);
    ck_assert(!vl_test_exists(tmp, "held/sweep.journal"));
    /* the MPI build: rank 0 holds the lock for every rank */
    const char *mpi = getenv("VOLEV_MPI_BIN");
    if (!mpi || !*mpi) {
        ck_assert_msg(getenv("VOLEV_NO_MPI") != NULL,
                      "VOLEV_MPI_BIN is not set: install OpenMPI (scripts/deps.sh) so that make "
                      "check builds build-mpi/volev, or set VOLEV_NO_MPI=1 to skip this check "
                      "knowingly");
    } else {
        static const char *const mpirun = "OMPI_ALLOW_RUN_AS_ROOT=1 "
                                          "OMPI_ALLOW_RUN_AS_ROOT_CONFIRM=1 mpirun "
                                          "--oversubscribe -n 2";
        ck_assert_int_ne(vl_test_sh(tmp, "%s '%s' sweep '%s/tests/data/sweep/grid.cfg' -o held "
                                         "--quiet", mpirun, mpi, top),
                         0);
        vl_test_file_contains(tmp, "err.txt", "is writing into this folder");
        ck_assert(!vl_test_exists(tmp, "held/sweep.journal"));
        ck_assert_int_eq(vl_test_sh(tmp, "%s '%s' sweep '%s/tests/data/sweep/grid.cfg' -o mpi "
                                         "--quiet", mpirun, mpi, top),
                         0);
        ck_assert(vl_test_exists(tmp, "mpi/members.csv"));
        ck_assert(!vl_test_exists(tmp, "mpi/.volev.lock"));
    }
    /* a stale lock file (its holder gone, pid inside) blocks nothing */
    close(fd);
    char stale[32];
    snprintf(stale, sizeof stale, "%ld\n", dead_pid());
    vl_test_write(tmp, "held/.volev.lock", stale);
    ck_assert_int_eq(volev("sweep '%s/tests/data/sweep/grid.cfg' -o held --quiet", top), 0);
    ck_assert(vl_test_exists(tmp, "held/members.csv"));
    ck_assert(!vl_test_exists(tmp, "held/.volev.lock"));
    vl_test_tmp_remove(tmp);
}
END_TEST

/* ------------------------------------------------------------------ plot */

START_TEST(plot_refuses_incomplete_files)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-outputs");
    vl_test_write(tmp, "quick.cfg", quick);
    ck_assert_int_eq(volev("run quick.cfg -o run"), 0);
    long n = 0;
    char *series = vl_test_slurp(tmp, "run/series.csv", &n);
    ck_assert_int_gt(n, 100);
    /* the last line of the file: where a cut lands */
    int lines = 0;
    for (long i = 0; i < n; i++)
        lines += series[i] == '\n';
    char *last = series + n - 2;
    while (last > series && last[-1] != '\n')
        last--;
    size_t row = strlen(last); /* the last row, newline included */
    static const struct {
        const char *dir;
        long keep;      /* bytes kept from the end of the last row: cut there */
        int newline;    /* then a line end */
        const char *msg;
    } cuts[] = {
        {"cut_mid_row", -1, 0, "fields, but the header on line"},  /* half the row */
        {"cut_last_field", 1, 0, "the last line is cut short"},   /* before its line end */
        {"short_row", -1, 1, "fields, but the header on line"},    /* a short row, ended */
    };
    for (size_t c = 0; c < sizeof cuts / sizeof cuts[0]; c++) {
        char rel[128];
        snprintf(rel, sizeof rel, "mkdir %s", cuts[c].dir);
        ck_assert_int_eq(vl_test_sh(tmp, "%s", rel), 0);
        long keep = cuts[c].keep < 0 ? (long)row / 2 : (long)row - cuts[c].keep;
        long len = (long)(last - series) + keep;
        char *text = strndup(series, (size_t)len);
        snprintf(rel, sizeof rel, "%s/series.csv", cuts[c].dir);
        if (cuts[c].newline) {
            char *t2 = NULL;
            ck_assert_int_ge(asprintf(&t2, "%s\n", text), 0);
            free(text);
            text = t2;
        }
        vl_test_write(tmp, rel, text);
        free(text);
        ck_assert_int_eq(volev("plot %s", cuts[c].dir), 3);
        char where[128];
        snprintf(where, sizeof where, "%s/series.csv:%d: ", cuts[c].dir, lines);
        vl_test_file_contains(tmp, "err.txt", where);
        vl_test_file_contains(tmp, "err.txt", cuts[c].msg);
        snprintf(rel, sizeof rel, "%s/history.png", cuts[c].dir);
        ck_assert(!vl_test_exists(tmp, rel));
    }
    /* a row with a field too many in the middle */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir extra && (sed '10s/$/,1/' run/series.csv > "
                                     "extra/series.csv)"),
                     0);
    ck_assert_int_eq(volev("plot extra"), 3);
    vl_test_file_contains(tmp, "err.txt", "extra/series.csv:10: ");
    /* a cut events.csv beside a whole series.csv */
    ck_assert_int_eq(vl_test_sh(tmp, "mkdir ev && cp run/series.csv ev/ && (head -c -2 "
                                     "run/events.csv > ev/events.csv)"),
                     0);
    ck_assert_int_eq(volev("plot ev"), 3);
    vl_test_file_contains(tmp, "err.txt", "ev/events.csv:");
    vl_test_file_contains(tmp, "err.txt", "the last line is cut short");
    free(series);
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_outputs(void)
{
    Suite *s = suite_create("outputs");
    TCase *tc = tcase_create("outputs");
    tcase_set_timeout(tc, 600);
    tcase_add_test(tc, number_rule);
    tcase_add_test(tc, no_nan_once_the_water_is_gone);
    tcase_add_test(tc, catalogue_names_neutralised_and_no_nan);
    tcase_add_test(tc, run_folder_rules);
    tcase_add_test(tc, leftovers_of_a_killed_run);
    tcase_add_test(tc, sweep_folder_rules);
    tcase_add_test(tc, sweep_folder_locked);
    tcase_add_test(tc, plot_refuses_incomplete_files);
    suite_add_tcase(s, tc);
    return s;
}
