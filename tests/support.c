/* support.c: helpers for tests that run the built program in a temporary folder
 * (test_cli.c, test_compare.c, test_sweep.c). Declared in suites.h. */
#define _GNU_SOURCE
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <sys/wait.h>

#include "suites.h"

/* DIR/REL into path (of size n); fails the test if it does not fit. */
static void path_of(char *path, size_t n, const char *dir, const char *rel)
{
    int len = snprintf(path, n, "%s/%s", dir, rel);
    ck_assert_msg(len >= 0 && (size_t)len < n, "path %s/%s too long", dir, rel);
}

void vl_test_tmp_make(char *dir, size_t n, const char *tag)
{
    int len = snprintf(dir, n, "/tmp/%s-XXXXXX", tag);
    ck_assert_msg(len >= 0 && (size_t)len < n, "temporary folder name for %s too long", tag);
    ck_assert_ptr_nonnull(mkdtemp(dir));
}

void vl_test_tmp_remove(const char *dir)
{
    char cmd[4352];
    int len = snprintf(cmd, sizeof cmd, "rm -rf '%s'", dir);
    ck_assert(len >= 0 && (size_t)len < sizeof cmd);
    ck_assert_int_eq(system(cmd), 0);
}

int vl_test_sh(const char *dir, const char *fmt, ...)
{
    char args[8192], cmd[12288];
    va_list ap;
    va_start(ap, fmt);
    int len = vsnprintf(args, sizeof args, fmt, ap);
    va_end(ap);
    ck_assert_msg(len >= 0 && (size_t)len < sizeof args, "command too long: %s", args);
    len = snprintf(cmd, sizeof cmd, "cd '%s' && %s >out.txt 2>err.txt", dir, args);
    ck_assert_msg(len >= 0 && (size_t)len < sizeof cmd, "command too long: %s", cmd);
    int rc = system(cmd);
    ck_assert(rc != -1 && WIFEXITED(rc));
    return WEXITSTATUS(rc);
}

int vl_test_have_gnuplot(void) { return system("command -v gnuplot >/dev/null 2>&1") == 0; }

char *vl_test_slurp(const char *dir, const char *rel, long *size)
{
    char path[4096];
    path_of(path, sizeof path, dir, rel);
    FILE *f = fopen(path, "rb");
    if (!f)
        return NULL;
    fseek(f, 0, SEEK_END);
    long n = ftell(f);
    fseek(f, 0, SEEK_SET);
    char *buf = malloc((size_t)n + 1);
    ck_assert_ptr_nonnull(buf);
    ck_assert_int_eq(fread(buf, 1, (size_t)n, f), (size_t)n);
    buf[n] = '\0';
    fclose(f);
    if (size)
        *size = n;
    return buf;
}

int vl_test_exists(const char *dir, const char *rel)
{
    char path[4096];
    struct stat sb;
    path_of(path, sizeof path, dir, rel);
    return stat(path, &sb) == 0;
}

void vl_test_write(const char *dir, const char *rel, const char *text)
{
    char path[4096];
    path_of(path, sizeof path, dir, rel);
    FILE *f = fopen(path, "w");
    ck_assert_msg(f != NULL, "cannot write %s", path);
    fputs(text, f);
    fclose(f);
}

void vl_test_file_contains(const char *dir, const char *rel, const char *needle)
{
    char *s = vl_test_slurp(dir, rel, NULL);
    ck_assert_msg(s != NULL, "missing %s", rel);
    ck_assert_msg(strstr(s, needle) != NULL, "%s '%s' lacks '%s'", rel, s, needle);
    free(s);
}
