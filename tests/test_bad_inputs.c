/* test_bad_inputs.c: the catalogue of malformed inputs (tests/bad/cases.txt, format at
 * its top). Each case runs the program in a fresh temporary folder holding the case's
 * input and the CSV tables of tests/bad under tests/bad, once without the output folder
 * and once with it made beforehand, and must end with the expected exit code, one clear
 * "volev: ..." line on standard error holding the expected fragment, and nothing left
 * behind. Cases marked '!' (known bugs of the program) are skipped with a note. */
#define _GNU_SOURCE
#include <dirent.h>
#include <ftw.h>
#include <limits.h>
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "suites.h"

#define MAX_CASES 512
#define MIN_CASES 30 /* fewer runnable cases means cases.txt is broken */

typedef struct bad_case {
    int line;           /* line in cases.txt */
    int known_bug;      /* marked '!': skipped */
    char file[256];     /* relative to tests/bad */
    char cmd[16];       /* run, validate, sweep or balance */
    char args[1024];    /* the rest of ARGS, passed through the shell */
    int exit_code;
    char message[512];  /* fragment expected in stderr */
} bad_case;

static bad_case cases[MAX_CASES];
static int ncases;
static char load_error[PATH_MAX + 64]; /* why cases.txt could not be used; "" when it could */
static char top[PATH_MAX];    /* absolute VOLEV_TOP */

static const char *const subcommands[] = {"run", "validate", "sweep", "balance"};

/* Copies text[0..len) into buf (of size n) without surrounding spaces; 0 if too long. */
static int copy_field(char *buf, size_t n, const char *text, size_t len)
{
    while (len && (*text == ' ' || *text == '\t'))
        text++, len--;
    while (len && (text[len - 1] == ' ' || text[len - 1] == '\t'))
        len--;
    if (len >= n)
        return 0;
    memcpy(buf, text, len);
    buf[len] = '\0';
    return 1;
}

/* Parses one FILE|ARGS|EXIT|MESSAGE line (after any '!') into c; 0 and load_error set
 * when it is malformed. */
static int parse_case(char *s, int line, bad_case *c)
{
    char *bar[3];
    char *p = s;
    for (int k = 0; k < 3; k++) {
        bar[k] = strchr(p, '|');
        if (!bar[k]) {
            snprintf(load_error, sizeof load_error,
                     "tests/bad/cases.txt:%d: expected FILE|ARGS|EXIT|MESSAGE", line);
            return 0;
        }
        p = bar[k] + 1;
    }
    char args[1024], code[16];
    if (!copy_field(c->file, sizeof c->file, s, (size_t)(bar[0] - s)) ||
        !copy_field(args, sizeof args, bar[0] + 1, (size_t)(bar[1] - bar[0] - 1)) ||
        !copy_field(code, sizeof code, bar[1] + 1, (size_t)(bar[2] - bar[1] - 1)) ||
        !copy_field(c->message, sizeof c->message, bar[2] + 1, strlen(bar[2] + 1))) {
        snprintf(load_error, sizeof load_error, "tests/bad/cases.txt:%d: a field is too long",
                 line);
        return 0;
    }
    char *end;
    long v = strtol(code, &end, 10);
    if (!c->file[0] || !c->message[0] || end == code || *end || v < 0 || v > 255 ||
        strchr(c->file, '\'') || strstr(c->file, "..")) {
        snprintf(load_error, sizeof load_error,
                 "tests/bad/cases.txt:%d: needs a plain FILE, an EXIT of 0-255 and a MESSAGE",
                 line);
        return 0;
    }
    c->exit_code = (int)v;
    c->line = line;
    /* a leading subcommand word chooses the command; otherwise run */
    size_t w = strcspn(args, " \t");
    snprintf(c->cmd, sizeof c->cmd, "run");
    for (size_t k = 0; k < sizeof subcommands / sizeof *subcommands; k++)
        if (w == strlen(subcommands[k]) && strncmp(args, subcommands[k], w) == 0) {
            snprintf(c->cmd, sizeof c->cmd, "%s", subcommands[k]);
            copy_field(c->args, sizeof c->args, args + w, strlen(args + w));
            return 1;
        }
    snprintf(c->args, sizeof c->args, "%s", args);
    return 1;
}

/* Reads VOLEV_TOP/tests/bad/cases.txt into cases[]; problems go to load_error. */
static void load_cases(void)
{
    ncases = 0;
    load_error[0] = '\0';
    if (!realpath(vl_test_top(), top)) {
        snprintf(load_error, sizeof load_error, "cannot resolve VOLEV_TOP '%s'", vl_test_top());
        return;
    }
    char path[PATH_MAX + 32];
    snprintf(path, sizeof path, "%s/tests/bad/cases.txt", top);
    FILE *f = fopen(path, "r");
    if (!f) {
        snprintf(load_error, sizeof load_error, "cannot open %s", path);
        return;
    }
    char buf[4096];
    for (int line = 1; fgets(buf, sizeof buf, f); line++) {
        size_t len = strlen(buf);
        if (len && buf[len - 1] != '\n' && !feof(f)) {
            snprintf(load_error, sizeof load_error, "tests/bad/cases.txt:%d: line too long", line);
            break;
        }
        buf[strcspn(buf, "\r\n")] = '\0';
        char *s = buf + strspn(buf, " \t");
        if (*s == '\0' || *s == '#')
            continue;
        if (ncases == MAX_CASES) {
            snprintf(load_error, sizeof load_error, "more than %d cases", MAX_CASES);
            break;
        }
        bad_case *c = &cases[ncases];
        memset(c, 0, sizeof *c);
        c->known_bug = *s == '!';
        if (!parse_case(s + c->known_bug, line, c))
            break;
        ncases++;
    }
    fclose(f);
}

/* ---------------------------------------------------------------- folder snapshots */

/* Every path under the folder being listed, one "path size mtime" line each. */
static char *listing;
static size_t listing_len, listing_cap, listing_root;

static int list_one(const char *path, const struct stat *sb, int type, struct FTW *ftw)
{
    (void)type;
    if (ftw->level == 0)
        return 0;
    const char *rel = path + listing_root;
    if (ftw->level == 1 && (strcmp(rel, "out.txt") == 0 || strcmp(rel, "err.txt") == 0))
        return 0;
    char entry[PATH_MAX + 64];
    /* files by size and modification time; folders by name only (their times change
     * when a temporary file comes and goes, which is allowed) */
    int dir = S_ISDIR(sb->st_mode);
    int n = snprintf(entry, sizeof entry, "%s %lld %lld.%09ld\n", rel,
                     dir ? 0LL : (long long)sb->st_size, dir ? 0LL : (long long)sb->st_mtim.tv_sec,
                     dir ? 0L : sb->st_mtim.tv_nsec);
    if (n < 0 || (size_t)n >= sizeof entry)
        return 1;
    if (listing_len + (size_t)n + 1 > listing_cap) {
        size_t cap = listing_cap ? 2 * listing_cap : 16384;
        while (cap < listing_len + (size_t)n + 1)
            cap *= 2;
        char *p = realloc(listing, cap);
        if (!p)
            return 1;
        listing = p;
        listing_cap = cap;
    }
    memcpy(listing + listing_len, entry, (size_t)n + 1);
    listing_len += (size_t)n;
    return 0;
}

/* A new string listing everything under dir but its out.txt and err.txt. */
static char *snapshot(const char *dir)
{
    listing = NULL;
    listing_len = listing_cap = 0;
    listing_root = strlen(dir) + 1;
    ck_assert_msg(nftw(dir, list_one, 16, FTW_PHYS) == 0, "cannot list %s", dir);
    char *s = listing ? listing : strdup("");
    ck_assert_ptr_nonnull(s);
    listing = NULL;
    return s;
}

/* The lines of after that are not lines of before, in a new string. */
static char *new_lines(const char *before, const char *after)
{
    char *out = calloc(1, strlen(after) + 1);
    ck_assert_ptr_nonnull(out);
    for (const char *s = after; *s;) {
        const char *eol = strchr(s, '\n');
        size_t len = eol ? (size_t)(eol - s) + 1 : strlen(s);
        int found = 0;
        for (const char *b = before; !found && *b;) {
            const char *beol = strchr(b, '\n');
            size_t blen = beol ? (size_t)(beol - b) + 1 : strlen(b);
            found = blen == len && memcmp(b, s, len) == 0;
            b += blen;
        }
        if (!found)
            strncat(out, s, len);
        s += len;
    }
    return out;
}

/* Number of entries in dir/rel other than . and .., or -1 if it cannot be opened. */
static int entries(const char *dir, const char *rel)
{
    char path[PATH_MAX + 64];
    snprintf(path, sizeof path, "%s/%s", dir, rel);
    DIR *d = opendir(path);
    if (!d)
        return -1;
    int n = 0;
    for (struct dirent *e; (e = readdir(d)) != NULL;)
        n += strcmp(e->d_name, ".") != 0 && strcmp(e->d_name, "..") != 0;
    closedir(d);
    return n;
}

/* Copies the regular file src to dst; 0 on failure. */
static int copy_file(const char *src, const char *dst)
{
    FILE *in = fopen(src, "rb");
    if (!in)
        return 0;
    FILE *out = fopen(dst, "wb");
    int ok = out != NULL;
    char buf[65536];
    for (size_t n; ok && (n = fread(buf, 1, sizeof buf, in)) > 0;)
        ok = fwrite(buf, 1, n, out) == n;
    ok = ok && !ferror(in);
    fclose(in);
    if (out)
        ok = fclose(out) == 0 && ok;
    return ok;
}

/* Copies src to dst: a regular file, or a folder of regular files. */
static void copy_entry(const char *src, const char *dst)
{
    struct stat sb;
    ck_assert_msg(stat(src, &sb) == 0, "cannot stat %s", src);
    if (!S_ISDIR(sb.st_mode)) {
        ck_assert_msg(copy_file(src, dst), "cannot copy %s to %s", src, dst);
        return;
    }
    ck_assert_int_eq(mkdir(dst, 0755), 0);
    DIR *d = opendir(src);
    ck_assert_ptr_nonnull(d);
    char from[2 * PATH_MAX], to[2 * PATH_MAX];
    for (struct dirent *e; (e = readdir(d)) != NULL;) {
        if (strcmp(e->d_name, ".") == 0 || strcmp(e->d_name, "..") == 0)
            continue;
        snprintf(from, sizeof from, "%s/%s", src, e->d_name);
        snprintf(to, sizeof to, "%s/%s", dst, e->d_name);
        ck_assert_msg(copy_file(from, to), "cannot copy %s (tests/bad holds files and folders "
                      "of files only)", from);
    }
    closedir(d);
}

/* Fills dir/tests/bad with the case's input (unless it is missing on purpose) and every
 * CSV table of tests/bad, which the scenarios name. */
static void copy_inputs(const bad_case *c, const char *dir)
{
    char src[PATH_MAX + 512], dst[PATH_MAX + 512];
    snprintf(dst, sizeof dst, "%s/tests", dir);
    ck_assert_int_eq(mkdir(dst, 0755), 0);
    snprintf(dst, sizeof dst, "%s/tests/bad", dir);
    ck_assert_int_eq(mkdir(dst, 0755), 0);
    snprintf(src, sizeof src, "%s/tests/bad", top);
    DIR *d = opendir(src);
    ck_assert_msg(d != NULL, "cannot open %s", src);
    for (struct dirent *e; (e = readdir(d)) != NULL;) {
        size_t len = strlen(e->d_name);
        int csv = len > 4 && strcmp(e->d_name + len - 4, ".csv") == 0;
        if (!csv && strcmp(e->d_name, c->file) != 0)
            continue;
        snprintf(src, sizeof src, "%s/tests/bad/%s", top, e->d_name);
        snprintf(dst, sizeof dst, "%s/tests/bad/%s", dir, e->d_name);
        copy_entry(src, dst);
    }
    closedir(d);
}

/* nftw callback of remove_tree: removes each entry after its contents. */
static int remove_one(const char *path, const struct stat *sb, int type, struct FTW *ftw)
{
    (void)sb, (void)type, (void)ftw;
    return remove(path) == 0 ? 0 : 1;
}

/* Removes dir/rel and everything in it, if it exists. */
static void remove_tree(const char *dir, const char *rel)
{
    char path[PATH_MAX + 64];
    snprintf(path, sizeof path, "%s%s%s", dir, rel[0] ? "/" : "", rel);
    struct stat sb;
    if (lstat(path, &sb) != 0)
        return;
    ck_assert_msg(nftw(path, remove_one, 16, FTW_DEPTH | FTW_PHYS) == 0, "cannot remove %s",
                  path);
}

/* ---------------------------------------------------------------- one case */

/* Text that only a crash or a sanitizer prints. */
static const char *const crash_marks[] = {
    "AddressSanitizer", "LeakSanitizer", "UndefinedBehaviorSanitizer", "ThreadSanitizer",
    "runtime error:", "Segmentation fault", "core dumped", "Aborted", "double free",
    "malloc(): ", "free(): ", "stack smashing", "Assertion", "terminate called"};

/* The first failure of the catalogue (for the assertion message, which Check limits in
 * size) and the number of failing runs; every failure is also printed in full. */
static char first_failure[2048];
static int nfailed;

/* Records one failure of case c (run how): printed to stderr, the first one kept. */
__attribute__((format(printf, 3, 4)))
static int record(const bad_case *c, const char *how, const char *fmt, ...)
{
    char text[8192];
    int n = snprintf(text, sizeof text, "tests/bad/cases.txt:%d (%s %s, %s): ", c->line, c->cmd,
                     c->file, how);
    va_list ap;
    va_start(ap, fmt);
    if (n >= 0 && (size_t)n < sizeof text)
        vsnprintf(text + n, sizeof text - (size_t)n, fmt, ap);
    va_end(ap);
    fprintf(stderr, "bad_inputs: FAILED %s\n", text);
    if (nfailed++ == 0)
        snprintf(first_failure, sizeof first_failure, "%.2000s", text);
    return 1;
}

/* Whether s is text a terminal shows as it is: well-formed UTF-8 without control
 * characters other than tab and line feed (RFC 3629 for the byte patterns). */
static int printable(const char *s)
{
    const unsigned char *p = (const unsigned char *)s;
    while (*p) {
        unsigned char b = *p;
        int more = b < 0x80 ? 0 : b >= 0xC2 && b <= 0xDF ? 1 : b >= 0xE0 && b <= 0xEF ? 2
                 : b >= 0xF0 && b <= 0xF4 ? 3 : -1;
        if (more < 0 || (b < 0x20 && b != '\n' && b != '\t') || b == 0x7F)
            return 0;
        p++;
        for (int k = 0; k < more; k++, p++)
            if ((*p & 0xC0) != 0x80)
                return 0;
    }
    return 1;
}

/* Checks exit code and standard error of one run; 1 after recording a failure. */
static int check_stderr(const bad_case *c, const char *how, int rc, const char *err)
{
    for (size_t k = 0; k < sizeof crash_marks / sizeof *crash_marks; k++)
        if (strstr(err, crash_marks[k]))
            return record(c, how, "crash or sanitizer report (exit %d):\n%s", rc, err);
    if (rc != c->exit_code)
        return record(c, how, "exit %d, expected %d%s; stderr:\n%s", rc, c->exit_code,
                    rc == 124 ? " (timed out)" : "", err);
    if (!printable(err))
        return record(c, how, "stderr holds control characters or bytes that are not UTF-8 "
                      "(raw input echoed?):\n%s", err);
    if (strncmp(err, "volev: ", 7) != 0)
        return record(c, how, "stderr does not start with 'volev: ':\n%s", err);
    const char *eol = strchr(err, '\n');
    if (!eol)
        return record(c, how, "stderr lacks a final newline:\n%s", err);
    char hint[64];
    snprintf(hint, sizeof hint, "Try 'volev %s --help'.\n", c->cmd);
    if (eol[1] && !(c->exit_code == 2 && strcmp(eol + 1, hint) == 0))
        return record(c, how, "stderr is more than one line:\n%s", err);
    if (!strstr(err, c->message))
        return record(c, how, "stderr lacks '%s':\n%s", c->message, err);
    return 0;
}

/* Runs case c in dir (out made beforehand when premade) and checks what it printed and
 * left; failures are recorded, not fatal, so that one run reports every failing case. */
static void run_once(const bad_case *c, const char *dir, int premade)
{
    const char *how = premade ? "OUT made beforehand" : "no OUT beforehand";
    char out[PATH_MAX + 8];
    snprintf(out, sizeof out, "%s/out", dir);
    if (premade)
        ck_assert_int_eq(mkdir(out, 0755), 0);
    char *before = snapshot(dir);
    int validate = strcmp(c->cmd, "validate") == 0;
    int rc = vl_test_sh(dir, "timeout -k 5 100 '%s' %s 'tests/bad/%s'%s %s", vl_test_bin(),
                        c->cmd, c->file, validate ? "" : " -o out", c->args);
    char *err = vl_test_slurp(dir, "err.txt", NULL);
    ck_assert_ptr_nonnull(err);
    int failed = check_stderr(c, how, rc, err);
    /* nothing left behind */
    int n = entries(dir, "out");
    if (!failed && premade && n != 0)
        failed = record(c, how, "the output folder holds %d entries afterwards", n);
    if (!failed && !premade && (n >= 0 || vl_test_exists(dir, "out")))
        failed = record(c, how, "the output folder exists afterwards");
    char *after = snapshot(dir);
    char *extra = new_lines(before, after);
    char *gone = new_lines(after, before);
    if (!failed && (extra[0] || gone[0]))
        record(c, how, "the folder changed; new:\n%sgone:\n%s", extra, gone);
    free(extra), free(gone), free(after), free(before), free(err);
    remove_tree(dir, "out"); /* a clean slate for the next run, whatever this one left */
}

/* Every case of cases.txt but the known bugs, each in its own temporary folder. */
START_TEST(every_case)
{
    ck_assert_msg(load_error[0] == '\0', "%s", load_error);
    int ran = 0;
    nfailed = 0;
    for (int i = 0; i < ncases; i++) {
        const bad_case *c = &cases[i];
        if (c->known_bug) {
            fprintf(stderr, "bad_inputs: skipped, known bug (tests/bad/cases.txt:%d): %s %s|%s|%d|%s\n",
                    c->line, c->cmd, c->file, c->args, c->exit_code, c->message);
            continue;
        }
        char dir[256];
        vl_test_tmp_make(dir, sizeof dir, "volev-bad");
        copy_inputs(c, dir);
        run_once(c, dir, 0);
        run_once(c, dir, 1);
        remove_tree(dir, "");
        ran++;
    }
    ck_assert_msg(nfailed == 0, "%d failing run(s) in %d cases (each printed above); the "
                  "first: %s", nfailed, ran, first_failure);
    ck_assert_msg(ran >= MIN_CASES, "only %d cases ran, at least %d expected", ran, MIN_CASES);
}
END_TEST

/* cases.txt is readable, well formed and large enough; every input it names exists
 * (or the case expects exit 5); the shared valid scenario is valid. */
START_TEST(catalogue_sound)
{
    ck_assert_msg(load_error[0] == '\0', "%s", load_error);
    int runnable = 0, bugs = 0;
    for (int i = 0; i < ncases; i++) {
        const bad_case *c = &cases[i];
        runnable += !c->known_bug;
        bugs += c->known_bug;
        char rel[512];
        snprintf(rel, sizeof rel, "tests/bad/%s", c->file);
        ck_assert_msg(vl_test_exists(top, rel) || c->exit_code == 5,
                      "tests/bad/cases.txt:%d: %s does not exist", c->line, rel);
    }
    ck_assert_msg(runnable >= MIN_CASES, "only %d runnable cases in tests/bad/cases.txt (%d in "
                  "all), at least %d expected", runnable, ncases, MIN_CASES);
    if (bugs)
        fprintf(stderr, "bad_inputs: %d of %d cases skipped as known bugs (marked '!')\n", bugs,
                ncases);
    char dir[256];
    vl_test_tmp_make(dir, sizeof dir, "volev-bad");
    int rc = vl_test_sh(dir, "'%s' validate '%s/tests/bad/base.cfg'", vl_test_bin(), top);
    vl_test_tmp_remove(dir);
    ck_assert_msg(rc == 0, "tests/bad/base.cfg, the base of the --set cases, does not validate "
                  "(exit %d)", rc);
}
END_TEST

Suite *vl_suite_bad_inputs(void)
{
    load_cases();
    Suite *s = suite_create("bad_inputs");
    TCase *tc = tcase_create("catalogue");
    tcase_set_timeout(tc, 300);
    tcase_add_test(tc, catalogue_sound);
    tcase_add_test(tc, every_case);
    suite_add_tcase(s, tc);
    return s;
}
