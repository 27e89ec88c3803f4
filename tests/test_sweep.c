/* test_sweep.c: `volev sweep` as a user meets it (docs/ensembles.md): designs, the
 * catalogue mode, outcome files, identical results across thread and MPI rank counts,
 * interruption and resume, failing members, bad sweep settings. Runs the program
 * ($VOLEV_BIN; the MPI build $VOLEV_MPI_BIN) on the small scenarios in tests/data/sweep.
 * Every expected value comes from the scenario files themselves or from the program's
 * own uninterrupted / single-threaded output. */
#define _GNU_SOURCE
#include <errno.h>
#include <math.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

#include "suites.h"
#include "volev/design.h"
#include "volev/status.h"

static char tmp[256];

/* volev sweep tests/data/sweep/NAME.cfg -o DIR ARGS (quiet). */
static int sweep(const char *name, const char *dir, const char *args)
{
    return vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/%s.cfg' -o '%s' --quiet %s",
                      vl_test_bin(), vl_test_top(), name, dir, args);
}

static void assert_same(const char *a, const char *b)
{
    char *x = vl_test_slurp(tmp, a, NULL), *y = vl_test_slurp(tmp, b, NULL);
    ck_assert_msg(x && y, "missing %s or %s", a, b);
    ck_assert_msg(strcmp(x, y) == 0, "%s and %s differ", a, b);
    free(x);
    free(y);
}

/* The data rows of a CSV (lines not starting with '#', header excluded): count, and
 * field f (0-based, no quoted commas in the files used with it) of row r into out. */
static int rows(const char *text)
{
    int n = -1;
    for (const char *p = text; *p;) {
        if (*p != '#')
            n++;
        const char *nl = strchr(p, '\n');
        if (!nl)
            break;
        p = nl + 1;
    }
    return n;
}

static const char *row_at(const char *text, int r)
{
    int n = -1;
    for (const char *p = text; *p;) {
        if (*p != '#' && n++ == r)
            return p;
        const char *nl = strchr(p, '\n');
        if (!nl)
            break;
        p = nl + 1;
    }
    return NULL;
}

static void field(const char *text, int r, int f, char *out, size_t n)
{
    const char *p = row_at(text, r);
    ck_assert_ptr_nonnull(p);
    for (int k = 0; k < f; k++) {
        p = strpbrk(p, ",\n");
        ck_assert(p && *p == ',');
        p++;
    }
    size_t len = strcspn(p, ",\n");
    ck_assert(len < n);
    memcpy(out, p, len);
    out[len] = '\0';
}

static double num(const char *text, int r, int f)
{
    char buf[128], *end;
    field(text, r, f, buf, sizeof buf);
    double v = strtod(buf, &end);
    ck_assert_msg(end != buf && *end == '\0', "row %d field %d '%s' is not a number", r, f, buf);
    return v;
}

/* Column index of name in the header row. */
static int col(const char *text, const char *name)
{
    const char *h = row_at(text, -1);
    ck_assert_ptr_nonnull(h);
    int k = 0;
    size_t n = strlen(name);
    for (const char *p = h; *p && *p != '\n'; k++) {
        size_t len = strcspn(p, ",\n");
        if (len == n && strncmp(p, name, n) == 0)
            return k;
        p += len;
        if (*p == ',')
            p++;
    }
    ck_abort_msg("no column %s", name);
    return -1;
}

START_TEST(grid_files)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("grid", "g", "-j 2"), 0);
    char *m = vl_test_slurp(tmp, "g/members.csv", NULL),
         *s = vl_test_slurp(tmp, "g/ensemble_summary.csv", NULL),
         *t = vl_test_slurp(tmp, "g/ensemble_series.csv", NULL);
    ck_assert(m && s && t);
    /* tests/data/sweep/grid.cfg: 3 log-spaced water values x 2 orbits, last axis fastest */
    ck_assert_int_eq(rows(m), 6);
    const double water[3] = {0.01, 0.1, 1.0}, orbit[2] = {0.08, 0.12};
    int cw = col(m, "inventory.surface_water_to"), co = col(m, "planet.orbit_au");
    for (int r = 0; r < 6; r++) {
        ck_assert_int_eq((int)num(m, r, 0), r);
        ck_assert_rel(num(m, r, cw), water[r / 2], 1e-9);
        ck_assert_rel(num(m, r, co), orbit[r % 2], 1e-9);
    }
    /* classes: counts in the summary are those of members.csv, fractions sum to 1 */
    int cc = col(m, "outcome");
    double total = 0.0;
    for (int r = 0; r < rows(s); r++) {
        char kind[32], name[64];
        field(s, r, 0, kind, sizeof kind);
        if (strcmp(kind, "class") != 0)
            continue;
        field(s, r, 1, name, sizeof name);
        int count = 0;
        for (int k = 0; k < 6; k++) {
            char c[64];
            field(m, k, cc, c, sizeof c);
            count += strcmp(c, name) == 0;
        }
        ck_assert_int_eq((int)num(s, r, 3), count);
        total += num(s, r, 12);
    }
    ck_assert_rel(total, 1.0, 1e-12);
    /* the median final water of the summary is the median of the members' values */
    int cf = col(m, "final_water_to");
    double v[6];
    for (int r = 0; r < 6; r++)
        v[r] = num(m, r, cf);
    for (int a = 0; a < 6; a++)
        for (int b = a + 1; b < 6; b++)
            if (v[b] < v[a]) {
                double x = v[a];
                v[a] = v[b];
                v[b] = x;
            }
    ck_assert_rel(num(s, 0, 8) + 1e-300, vl_quantile_sorted(v, 6, 0.5) + 1e-300, 1e-9);
    /* the series: 64 common ages from the run's start (1e7 yr) to its end (3e8 yr) */
    ck_assert_int_eq(rows(t), 64);
    ck_assert_rel(num(t, 0, 0), 1e7, 1e-9);
    ck_assert_rel(num(t, 63, 0), 3e8, 1e-9);
    /* a second call with the same settings finds the sweep finished */
    ck_assert_int_eq(sweep("grid", "g", ""), 0);
    char *o = vl_test_slurp(tmp, "out.txt", NULL);
    ck_assert_ptr_nonnull(strstr(o, "already complete"));
    free(o);
    free(m);
    free(s);
    free(t);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(threads_and_ranks_agree)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("resume", "one", "-j 1"), 0);
    ck_assert_int_eq(sweep("resume", "two", "-j 2"), 0);
    static const char *const files[] = {"members.csv", "ensemble_summary.csv",
                                        "ensemble_series.csv"};
    char a[64], b[64];
    for (int k = 0; k < 3; k++) {
        snprintf(a, sizeof a, "one/%s", files[k]);
        snprintf(b, sizeof b, "two/%s", files[k]);
        assert_same(a, b);
    }
    /* the MPI build with 2 ranks (make check builds it where mpicc exists; .ci/run
     * installs OpenMPI): identical files */
    const char *mpi = getenv("VOLEV_MPI_BIN");
    if (!mpi || !*mpi) {
        ck_assert_msg(getenv("VOLEV_NO_MPI") != NULL,
                      "VOLEV_MPI_BIN is not set: install OpenMPI (scripts/deps.sh) so that make "
                      "check builds build-mpi/volev, or set VOLEV_NO_MPI=1 to skip this check "
                      "knowingly");
    } else {
        int rc = vl_test_sh(tmp,
                            "OMPI_ALLOW_RUN_AS_ROOT=1 OMPI_ALLOW_RUN_AS_ROOT_CONFIRM=1 mpirun "
                            "--oversubscribe -n 2 '%s' sweep '%s/tests/data/sweep/resume.cfg' "
                            "-o mpi -j 1 --quiet",
                            mpi, vl_test_top());
        if (rc != 0) {
            char *e = vl_test_slurp(tmp, "err.txt", NULL);
            ck_abort_msg("mpirun failed (%d): %s", rc, e ? e : "");
        }
        for (int k = 0; k < 3; k++) {
            snprintf(a, sizeof a, "one/%s", files[k]);
            snprintf(b, sizeof b, "mpi/%s", files[k]);
            assert_same(a, b);
        }
    }
    vl_test_tmp_remove(tmp);
}
END_TEST

/* Lines in a file (0 if missing). */
static int count_lines(const char *rel)
{
    char *t = vl_test_slurp(tmp, rel, NULL);
    if (!t)
        return 0;
    int n = 0;
    for (char *p = t; *p; p++)
        n += *p == '\n';
    free(t);
    return n;
}

/* Start a sweep of resume.cfg into dir in the background; its pid. */
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

/* Wait until dir's journal holds at least n member lines (its first line is the tag). */
static void wait_for_members(const char *dir, int n)
{
    char rel[300];
    snprintf(rel, sizeof rel, "%s/sweep.journal", dir);
    for (int k = 0; k < 20000 && count_lines(rel) < n + 1; k++) {
        struct timespec ts = {0, 2000000};
        nanosleep(&ts, NULL);
    }
    ck_assert_int_ge(count_lines(rel), n + 1);
}

START_TEST(kill_and_resume)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("resume", "ref", "-j 1"), 0);
    /* SIGKILL mid-way: no final files; the rerun completes and matches */
    pid_t pid = start_sweep("killed");
    wait_for_members("killed", 4);
    kill(pid, SIGKILL);
    int status;
    ck_assert_int_eq(waitpid(pid, &status, 0), pid);
    ck_assert(WIFSIGNALED(status));
    ck_assert(!vl_test_exists(tmp, "killed/members.csv"));
    ck_assert(vl_test_exists(tmp, "killed/sweep.journal"));
    int before = count_lines("killed/sweep.journal") - 1;
    ck_assert_msg(before < 48, "the sweep finished before it was killed");
    ck_assert_int_eq(sweep("resume", "killed", "-j 2"), 0);
    assert_same("ref/members.csv", "killed/members.csv");
    assert_same("ref/ensemble_summary.csv", "killed/ensemble_summary.csv");
    assert_same("ref/ensemble_series.csv", "killed/ensemble_series.csv");
    ck_assert(!vl_test_exists(tmp, "killed/sweep.journal"));
    /* only the missing members ran the second time */
    char *o = vl_test_slurp(tmp, "out.txt", NULL);
    char want[64];
    snprintf(want, sizeof want, "(%d run now", 48 - before);
    ck_assert_msg(strstr(o, want) != NULL, "'%s' lacks '%s'", o, want);
    free(o);
    /* SIGTERM: a clean stop with exit status 128 + 15 and a message; then resume */
    pid = start_sweep("termed");
    wait_for_members("termed", 2);
    kill(pid, SIGTERM);
    ck_assert_int_eq(waitpid(pid, &status, 0), pid);
    ck_assert(WIFEXITED(status));
    ck_assert_int_eq(WEXITSTATUS(status), 128 + SIGTERM);
    ck_assert(!vl_test_exists(tmp, "termed/members.csv"));
    ck_assert_int_eq(sweep("resume", "termed", ""), 0);
    assert_same("ref/members.csv", "termed/members.csv");
    /* a journal cut in the middle of a line (power cut): the partial line is dropped */
    pid = start_sweep("cut");
    wait_for_members("cut", 3);
    kill(pid, SIGKILL);
    waitpid(pid, &status, 0);
    ck_assert_int_eq(vl_test_sh(tmp, "printf '17\\t0\\t1' >> cut/sweep.journal"), 0);
    ck_assert_int_eq(sweep("resume", "cut", ""), 0);
    assert_same("ref/members.csv", "cut/members.csv");
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(saltelli_layout_and_indices)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("saltelli", "s", ""), 0);
    char *m = vl_test_slurp(tmp, "s/members.csv", NULL),
         *x = vl_test_slurp(tmp, "s/sensitivity.csv", NULL);
    ck_assert(m && x);
    /* tests/data/sweep/saltelli.cfg: 8 base samples, k = 2: 8 (2 + 2) = 32 members */
    ck_assert_int_eq(rows(m), 32);
    /* Saltelli et al. 2010 layout: block j holds A_j, B_j, then A_j with column i from B_j */
    int c0 = col(m, "inventory.surface_water_to"), c1 = col(m, "escape.xuv_efficiency");
    for (int j = 0; j < 8; j++) {
        int a = 4 * j, b = a + 1;
        ck_assert_rel(num(m, a + 2, c0), num(m, b, c0), 1e-12);
        ck_assert_rel(num(m, a + 2, c1), num(m, a, c1), 1e-12);
        ck_assert_rel(num(m, a + 3, c0), num(m, a, c0), 1e-12);
        ck_assert_rel(num(m, a + 3, c1), num(m, b, c1), 1e-12);
        /* the axes' bounds (the scenario) */
        ck_assert(num(m, a, c0) >= 0.01 && num(m, a, c0) <= 1.0);
        ck_assert(num(m, a, c1) >= 0.05 && num(m, a, c1) <= 0.3);
    }
    /* one row per outcome and parameter, finite indices, intervals around them */
    ck_assert_int_eq(rows(x), 4);
    for (int r = 0; r < 4; r++) {
        double s1 = num(x, r, 2), lo = num(x, r, 3), hi = num(x, r, 4), st = num(x, r, 5);
        ck_assert(isfinite(s1) && isfinite(st) && lo <= s1 + 1e-12 && s1 <= hi + 1e-12);
    }
    /* a second run is identical (seeded bootstrap) */
    ck_assert_int_eq(sweep("saltelli", "s2", ""), 0);
    assert_same("s/sensitivity.csv", "s2/sensitivity.csv");
    free(m);
    free(x);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(sampled_values)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("sampled", "r", ""), 0);
    char *m = vl_test_slurp(tmp, "r/members.csv", NULL);
    ck_assert_ptr_nonnull(m);
    ck_assert_int_eq(rows(m), 12);
    /* the members' values are the library's design for the scenario's axes and seed */
    vl_axis ax[4];
    memset(ax, 0, sizeof ax);
    snprintf(ax[0].key, sizeof ax[0].key, "inventory.surface_water_to");
    ax[0].dist = VL_DIST_LOG_UNIFORM, ax[0].low = 0.1, ax[0].high = 10.0;
    snprintf(ax[1].key, sizeof ax[1].key, "inventory.co2_bar");
    ax[1].dist = VL_DIST_UNIFORM, ax[1].low = 1e-4, ax[1].high = 1e-3;
    snprintf(ax[2].key, sizeof ax[2].key, "planet.mass_mearth");
    ax[2].dist = VL_DIST_TRUNC_NORMAL, ax[2].mean = 1.0, ax[2].sd = 0.3, ax[2].low = 0.5,
    ax[2].high = 1.5;
    snprintf(ax[3].key, sizeof ax[3].key, "planet.radius_rearth");
    ax[3].dist = VL_DIST_NORMAL, ax[3].mean = 1.0, ax[3].sd = 0.02;
    double x[12 * 4];
    vl_status st;
    ck_assert_int_eq(vl_design_generate(VL_DESIGN_RANDOM, ax, 4, 12, 2026, x, &st), VL_OK);
    for (int r = 0; r < 12; r++)
        for (int a = 0; a < 4; a++)
            ck_assert_rel(num(m, r, 1 + a), x[r * 4 + a], 1e-9);
    for (int r = 0; r < 12; r++)
        ck_assert(num(m, r, 3) >= 0.5 && num(m, r, 3) <= 1.5);
    free(m);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(catalogue_wet_and_dry)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    ck_assert_int_eq(sweep("catalogue", "c", ""), 0);
    char *m = vl_test_slurp(tmp, "c/members.csv", NULL);
    ck_assert_ptr_nonnull(m);
    /* tests/data/sweep/candidates.csv: 3 candidates x water_to = [1, 1e-4] */
    ck_assert_int_eq(rows(m), 6);
    ck_assert_ptr_nonnull(strstr(m, "\n0,Kestrel b,"));
    ck_assert_ptr_nonnull(strstr(m, "\n2,\"Kestrel c, outer\","));
    ck_assert_ptr_nonnull(strstr(m, "\n4,Wren d,,,,0.5,0.8,,1,"));
    ck_assert_ptr_nonnull(strstr(m, "\n5,Wren d,,,,0.5,0.8,,0.0001,"));
    /* each candidate's dry member ends with no more water than its wet one */
    int cw = col(m, "final_water_to"), cs = col(m, "status");
    for (int r = 4; r < 6; r++) {
        char s[16];
        field(m, r, cs, s, sizeof s);
        ck_assert_str_eq(s, "ok");
    }
    ck_assert(num(m, 5, cw) <= num(m, 4, cw));
    free(m);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(failing_member_recorded)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    /* a grid whose last water value (-1 TO) is out of bounds: that member fails alone */
    char text[2048];
    snprintf(text, sizeof text,
             "planet: { mass_mearth = 1.0; radius_rearth = 1.0; orbit_au = 1.0; };\n"
             "inventory: { surface_water_to = 1.0; n2_bar = 0.78; co2_bar = 3e-4; "
             "mantle_co2_bar = 100.0; };\n"
             "climate: { model = \"hz_fit\"; };\n"
             "run: { start_yr = 4.0e9; end_yr = 4.01e9; log_points = 5; linear_points = 5; };\n"
             "sweep: { design = \"grid\"; axes = ( { key = \"inventory.surface_water_to\"; "
             "spacing = \"linear\"; from = 1.0; to = -1.0; points = 3; } ); };\n");
    vl_test_write(tmp, "bad.cfg", text);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep bad.cfg -o b --quiet", vl_test_bin()), 0);
    char *m = vl_test_slurp(tmp, "b/members.csv", NULL);
    ck_assert_ptr_nonnull(m);
    ck_assert_int_eq(rows(m), 3);
    ck_assert_ptr_nonnull(strstr(m, "\n0,1,ok,"));
    ck_assert_ptr_nonnull(strstr(m, "\n2,-1,failed,failed,"));
    ck_assert_ptr_nonnull(strstr(m, "out of bounds"));
    free(m);
    vl_test_tmp_remove(tmp);
}
END_TEST

/* A scenario with the given sweep group; returns the exit status of sweeping it. */
static int sweep_text(const char *group)
{
    char text[2048];
    int len = snprintf(text, sizeof text,
                       "planet: { mass_mearth = 1.0; radius_rearth = 1.0; orbit_au = 1.0; };\n"
                       "inventory: { surface_water_to = 1.0; n2_bar = 0.78; co2_bar = 3e-4; "
                       "mantle_co2_bar = 100.0; };\n"
                       "climate: { model = \"hz_fit\"; };\n"
                       "run: { start_yr = 4.0e9; end_yr = 4.01e9; };\n%s\n",
                       group);
    ck_assert(len >= 0 && (size_t)len < sizeof text);
    vl_test_write(tmp, "s.cfg", text);
    return vl_test_sh(tmp, "'%s' sweep s.cfg -o o --quiet", vl_test_bin());
}

START_TEST(bad_settings)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-sweep");
    struct {
        const char *group, *needle;
    } bad[] = {
        {"", "no sweep group"},
        {"sweep = 3;", "must be a group"},
        {"sweep: { design = \"grid\"; };", "needs axes"},
        {"sweep: { design = \"cube\"; };", "sweep.design = \"cube\" is not one of: grid, random"},
        {"sweep: { design = \"random\"; axes = ( { key = \"planet.orbit_au\"; distribution = "
         "\"uniform\"; low = 1.0; high = 2.0; } ); };",
         "needs members"},
        {"sweep: { design = \"random\"; members = 4; axes = ( { key = \"planet.orbit_au\"; "
         "distribution = \"uniform\"; low = 2.0; high = 1.0; } ); };",
         "s.cfg:5"},
        {"sweep: { design = \"random\"; members = 4; axes = ( { key = \"planet.orbitt_au\"; "
         "distribution = \"uniform\"; low = 1.0; high = 2.0; } ); };",
         "unknown key"},
        {"sweep: { design = \"grid\"; seed = 3; axes = ( { key = \"planet.orbit_au\"; spacing = "
         "\"linear\"; from = 1.0; to = 2.0; points = 2; } ); };",
         "sweep.seed has no meaning"},
        {"sweep: { design = \"grid\"; axes = ( { key = \"planet.orbit_au\"; spacing = "
         "\"linear\"; from = 1.0; to = 2.0; } ); };",
         "needs points"},
        {"sweep: { design = \"random\"; members = 4; axes = ( { key = \"planet.orbit_au\"; "
         "distribution = \"normal\"; mean = 1.0; sd = 0.1; low = 0.5; } ); };",
         "low has no meaning"},
        {"sweep: { design = \"saltelli\"; members = 4; sensitivity = [\"water\"]; axes = ( { key "
         "= \"planet.orbit_au\"; distribution = \"uniform\"; low = 1.0; high = 2.0; } ); };",
         "unknown outcome 'water'"},
        {"sweep: { catalogue = \"missing.csv\"; };", "missing.csv"},
        {"sweep: { colour = 1; };", "unknown key 'sweep.colour'"},
    };
    for (size_t k = 0; k < sizeof bad / sizeof bad[0]; k++) {
        int rc = sweep_text(bad[k].group);
        ck_assert_msg(rc == VL_ERR_INPUT || rc == VL_ERR_IO, "case %zu: exit %d", k, rc);
        vl_test_file_contains(tmp, "err.txt", bad[k].needle);
        ck_assert_msg(!vl_test_exists(tmp, "o/members.csv") &&
                          !vl_test_exists(tmp, "o/sweep.journal"),
                      "case %zu left output", k);
    }
    /* a folder holding another sweep's results is not overwritten */
    ck_assert_int_eq(sweep("sampled", "o", ""), 0);
    ck_assert_int_eq(sweep("saltelli", "o", ""), VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "another sweep");
    /* command line */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep", vl_test_bin()), VL_ERR_USAGE);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep s.cfg -j 0", vl_test_bin()), VL_ERR_USAGE);
    /* volev run runs the base scenario of a sweep scenario, and says so */
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' run '%s/tests/data/sweep/sampled.cfg' -o base",
                                vl_test_bin(), vl_test_top()),
                     0);
    vl_test_file_contains(tmp, "err.txt", "volev sweep");
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_sweep(void)
{
    Suite *s = suite_create("sweep");
    TCase *tc = tcase_create("ensembles");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, grid_files);
    tcase_add_test(tc, threads_and_ranks_agree);
    tcase_add_test(tc, kill_and_resume);
    tcase_add_test(tc, saltelli_layout_and_indices);
    tcase_add_test(tc, sampled_values);
    tcase_add_test(tc, catalogue_wet_and_dry);
    tcase_add_test(tc, failing_member_recorded);
    tcase_add_test(tc, bad_settings);
    suite_add_tcase(s, tc);
    return s;
}
