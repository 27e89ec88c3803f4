/* test_faults.c: the program under faults (hardening issue): SIGINT or SIGTERM during a
 * run or a sweep leaves no file under a final name that is incomplete (a run leaves
 * nothing; a sweep keeps its journal and resumes); a full disk (simulated with a file
 * size limit, `ulimit -f`, and SIGXFSZ ignored, so writes fail with EFBIG as they would
 * with ENOSPC) and an unwritable output folder are reported clearly; a sweep resumes
 * after the disk fault and matches an uninterrupted sweep. Expectations: the issue's. */
#define _GNU_SOURCE
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <time.h>
#include <unistd.h>

#include "suites.h"
#include "volev/status.h"

static char tmp[256];

static void nap_ms(long ms)
{
    struct timespec ts = {ms / 1000, (ms % 1000) * 1000000L};
    nanosleep(&ts, NULL);
}

/* Start `volev ARGV...` in tmp in the background, output to out.txt/err.txt. */
static pid_t start(char *const argv[])
{
    pid_t pid = fork();
    ck_assert_int_ge(pid, 0);
    if (pid == 0) {
        if (chdir(tmp) != 0)
            _exit(127);
        FILE *o = freopen("out.txt", "w", stdout), *e = freopen("err.txt", "w", stderr);
        (void)o;
        (void)e;
        execv(vl_test_bin(), argv);
        _exit(127);
    }
    return pid;
}

/* Whether the folder dir (in tmp) holds any entry. */
static int any_file(const char *dir)
{
    return vl_test_sh(tmp, "test -n \"$(ls -A %s 2>/dev/null)\"", dir) == 0;
}

START_TEST(signal_during_run)
{
    static const int sigs[] = {SIGTERM, SIGINT};
    for (int k = 0; k < 2; k++) {
        vl_test_tmp_make(tmp, sizeof tmp, "volev-faults");
        char scen[600];
        snprintf(scen, sizeof scen, "%s/scenarios/mars.cfg", vl_test_top());
        /* a tight tolerance makes the run last seconds: the signal lands mid-run */
        char *argv[] = {"volev", "run", scen, "-o", "out", "--set", "run.rel_tolerance=1e-11",
                        NULL};
        pid_t pid = start(argv);
        for (int w = 0; w < 5000 && !any_file("out"); w++) /* the run has opened its files */
            nap_ms(2);
        ck_assert_msg(any_file("out"), "the run never opened its files");
        nap_ms(50);
        kill(pid, sigs[k]);
        int status;
        ck_assert_int_eq(waitpid(pid, &status, 0), pid);
        ck_assert(WIFEXITED(status));
        ck_assert_int_eq(WEXITSTATUS(status), 128 + sigs[k]);
        vl_test_file_contains(tmp, "err.txt", "interrupted");
        vl_test_file_contains(tmp, "err.txt", "no output written");
        /* nothing under a final name, no temporary files: the folder it made is gone */
        ck_assert_msg(!vl_test_exists(tmp, "out"), "output left behind after signal %d", sigs[k]);
        vl_test_tmp_remove(tmp);
    }
}
END_TEST

START_TEST(signal_during_sweep)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-faults");
    char scen[600];
    snprintf(scen, sizeof scen, "%s/tests/data/sweep/resume.cfg", vl_test_top());
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s' -o ref --quiet", vl_test_bin(), scen), 0);
    char *argv[] = {"volev", "sweep", scen, "-o", "cut", "-j", "2", "--quiet", NULL};
    pid_t pid = start(argv);
    for (int w = 0; w < 5000 && vl_test_sh(tmp, "test \"$(wc -l < cut/sweep.journal 2>/dev/null)\" -ge 3 2>/dev/null") != 0; w++)
        nap_ms(2);
    kill(pid, SIGINT);
    int status;
    ck_assert_int_eq(waitpid(pid, &status, 0), pid);
    ck_assert(WIFEXITED(status));
    ck_assert_int_eq(WEXITSTATUS(status), 128 + SIGINT);
    /* no final file; the journal holds whole lines only (members cut short by the
     * signal are not recorded) and the same command completes the sweep */
    ck_assert(!vl_test_exists(tmp, "cut/members.csv"));
    ck_assert(!vl_test_exists(tmp, "cut/ensemble_summary.csv"));
    ck_assert_int_eq(vl_test_sh(tmp, "test \"$(tail -c 1 cut/sweep.journal | od -An -c | tr -d ' ')\" = '\\n'"), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s' -o cut --quiet", vl_test_bin(), scen), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "cmp ref/members.csv cut/members.csv"), 0);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(full_disk)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-faults");
    const char *bin = vl_test_bin(), *top = vl_test_top();
    /* a run whose series.csv outgrows a 64-block file limit */
    int rc = vl_test_sh(tmp, "trap '' XFSZ; ulimit -f 64; '%s' run '%s/scenarios/mars.cfg' -o out",
                        bin, top);
    ck_assert_int_eq(rc, VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "cannot write");
    vl_test_file_contains(tmp, "err.txt", "File too large");
    ck_assert(!vl_test_exists(tmp, "out"));
    /* a sweep whose journal fills the disk: a clear error, and then it resumes */
    rc = vl_test_sh(tmp, "trap '' XFSZ; ulimit -f 8; '%s' sweep '%s/tests/data/sweep/resume.cfg' "
                         "-o sw --quiet",
                    bin, top);
    ck_assert_int_eq(rc, VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "sweep.journal");
    ck_assert(!vl_test_exists(tmp, "sw/members.csv"));
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/resume.cfg' -o sw --quiet",
                                bin, top),
                     0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/resume.cfg' -o ref --quiet",
                                bin, top),
                     0);
    ck_assert_int_eq(vl_test_sh(tmp, "cmp ref/members.csv sw/members.csv"), 0);
    vl_test_tmp_remove(tmp);
}
END_TEST

START_TEST(unwritable_folder)
{
    vl_test_tmp_make(tmp, sizeof tmp, "volev-faults");
    const char *bin = vl_test_bin(), *top = vl_test_top();
    /* a folder inside a file cannot be made, even by root (ENOTDIR) */
    ck_assert_int_eq(vl_test_sh(tmp, "touch afile"), 0);
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' run '%s/scenarios/mars.cfg' -o afile/out", bin, top),
                     VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "afile/out");
    vl_test_file_contains(tmp, "err.txt", "Not a directory");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' sweep '%s/tests/data/sweep/grid.cfg' -o afile/sw --quiet",
                                bin, top),
                     VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "afile/sw");
    ck_assert_int_eq(vl_test_sh(tmp, "'%s' balance '%s/scenarios/demo.cfg' -o afile/b", bin, top),
                     VL_ERR_IO);
    vl_test_file_contains(tmp, "err.txt", "afile/b");
    ck_assert_int_eq(vl_test_sh(tmp, "cmp -s afile /dev/null"), 0); /* still the empty file */
    vl_test_tmp_remove(tmp);
}
END_TEST

Suite *vl_suite_faults(void)
{
    Suite *s = suite_create("faults");
    TCase *tc = tcase_create("faults");
    tcase_set_timeout(tc, 240);
    tcase_add_test(tc, signal_during_run);
    tcase_add_test(tc, signal_during_sweep);
    tcase_add_test(tc, full_disk);
    tcase_add_test(tc, unwritable_folder);
    suite_add_tcase(s, tc);
    return s;
}
