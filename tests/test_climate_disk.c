/* test_climate_disk.c: the column climate's table cache on disk (climate_disk.c, format
 * in its header comment and docs/performance.md): points come back bit for bit; torn,
 * corrupted, foreign and out-of-range records and foreign headers are skipped;
 * concurrent writers (processes and threads) lose and mix nothing and respect each
 * other's lock; folder and write errors. The program's runs with the cache:
 * test_climate_disk_run.c. Software-behaviour checks: common practice. */
#define _GNU_SOURCE
#include <errno.h>
#include <fcntl.h>
#include <pthread.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <sys/wait.h>
#include <unistd.h>

#include "suites.h"
#include "volev/climate.h"
#include "../src/physics/climate_disk.h"

static char tmp[256];

static const uint64_t KEY_A = 0x0123456789abcdefULL, KEY_B = 0xfedcba9876543210ULL,
                      KEY_C = 0x1111111111111111ULL;

#define NDBL (sizeof(vl_column_point) / sizeof(double))
#define MAXPTS 8192

/* The point of number i: varied magnitudes and signs, -0 and a subnormal included. */
static void point_of(int i, vl_column_point *p)
{
    double *v = (double *)p;
    for (size_t k = 0; k < NDBL; k++)
        v[k] = ldexp(1.0 + (double)((i * 7919 + (int)k * 104729) % 1000003) / 1000003.0,
                     (int)(k % 61) - 30) * (k % 3 == 0 ? -1.0 : 1.0);
    v[(size_t)i % NDBL] = -0.0;
    v[(size_t)(i + 1) % NDBL] = 4.9e-324;
}

/* Point number i's place in a table: unique for i < 121 * 34 * 37. */
static void place_of(int i, int idx[VL_CT_NDIM], int *j)
{
    *j = i % VL_CT_NT;
    idx[0] = (i / VL_CT_NT) % 34;
    idx[1] = (i / VL_CT_NT / 34) % 37;
    idx[2] = i % 5;
    idx[3] = i % 3;
}

/* The number of a place (inverse of place_of). */
static int number_of(const int idx[VL_CT_NDIM], int j)
{
    return j + VL_CT_NT * (idx[0] + 34 * idx[1]);
}

static void note(uint64_t key, int i)
{
    int idx[VL_CT_NDIM], j;
    vl_column_point p;
    place_of(i, idx, &j);
    point_of(i, &p);
    vl_ct_disk_note(key, idx, j, &p);
}

static void note_range(uint64_t key, int first, int count)
{
    for (int i = first; i < first + count; i++)
        note(key, i);
}

/* What a load gave: the numbers of the points in order, each checked bit for bit. */
typedef struct {
    int n, bad;
    int num[MAXPTS];
} loaded;

static void collect(void *ctx, const int idx[VL_CT_NDIM], int j, const vl_column_point *p)
{
    loaded *l = ctx;
    int i = number_of(idx, j), want[VL_CT_NDIM], wj;
    vl_column_point q;
    place_of(i, want, &wj);
    point_of(i, &q);
    if (memcmp(want, idx, sizeof want) != 0 || memcmp(&q, p, sizeof q) != 0 || l->n >= MAXPTS)
        l->bad++;
    else
        l->num[l->n++] = i;
}

static loaded *load(uint64_t key)
{
    static loaded l;
    memset(&l, 0, sizeof l);
    vl_ct_disk_load(key, collect, &l);
    ck_assert_int_eq(l.bad, 0);
    return &l;
}

static void configure(const char *folder)
{
    vl_status st;
    ck_assert_msg(vl_climate_cache_configure(folder, &st) == VL_OK, "%s: %s", st.file, st.msg);
}

/* The table file of key in folder (relative name into rel). */
static void rel_of(uint64_t key, char *rel, size_t n)
{
    snprintf(rel, n, "column-%016llx.pts", (unsigned long long)key);
}

/* The table file of key: its bytes, the header's length and the record size it gives. */
typedef struct {
    char *bytes;
    long size, hlen, rec;
} table_file;

static table_file read_table(const char *folder, uint64_t key)
{
    char rel[64];
    table_file t;
    rel_of(key, rel, sizeof rel);
    t.bytes = vl_test_slurp(folder, rel, &t.size);
    ck_assert_msg(t.bytes != NULL, "no file %s", rel);
    char *nl = memchr(t.bytes, '\n', (size_t)t.size);
    ck_assert_ptr_nonnull(nl);
    t.hlen = nl - t.bytes + 1;
    char *r = strstr(t.bytes, " record-bytes ");
    ck_assert(r != NULL && r < nl);
    t.rec = strtol(r + 14, NULL, 10);
    /* the documented layout: 32 bytes of key and place, the point, an 8-byte checksum */
    ck_assert_int_eq(t.rec, 32 + (long)sizeof(vl_column_point) + 8);
    return t;
}

static void write_table(const char *folder, uint64_t key, const char *bytes, long size)
{
    char rel[64], path[512];
    rel_of(key, rel, sizeof rel);
    snprintf(path, sizeof path, "%s/%s", folder, rel);
    FILE *f = fopen(path, "wb");
    ck_assert_ptr_nonnull(f);
    ck_assert_int_eq(fwrite(bytes, 1, (size_t)size, f), (size_t)size);
    ck_assert_int_eq(fclose(f), 0);
}

/* FNV-1a 64 (the format's checksum), to write records with a valid checksum. */
static uint64_t fnv1a(const unsigned char *b, size_t n)
{
    uint64_t h = 1469598103934665603ULL;
    for (size_t i = 0; i < n; i++) {
        h ^= b[i];
        h *= 1099511628211ULL;
    }
    return h;
}

/* Record k of t, its checksum recomputed after a change. */
static void reseal(table_file *t, long k)
{
    unsigned char *r = (unsigned char *)t->bytes + t->hlen + k * t->rec;
    uint64_t h = fnv1a(r, (size_t)t->rec - 8);
    memcpy(r + t->rec - 8, &h, 8);
}

/* Counts into *ctx the loaded points equal to unlimited water's test point. */
static void same_point(void *ctx, const int idx[VL_CT_NDIM], int j, const vl_column_point *p)
{
    vl_column_point q;
    point_of(7, &q);
    *(int *)ctx += idx[VL_CT_WATER] == vl_ct_size[VL_CT_WATER] && idx[3] == 3 && j == 4 &&
                   memcmp(&q, p, sizeof q) == 0;
}

static void setup(void) { vl_test_tmp_make(tmp, sizeof tmp, "volev-disk"); }

static void teardown(void)
{
    configure(NULL);
    vl_test_tmp_remove(tmp);
}

START_TEST(round_trip)
{
    configure(tmp);
    for (int i = 0; i < 100; i++) { /* two tables interleaved, more than one batch */
        note(KEY_A, i);
        if (i % 10 == 0)
            note(KEY_B, 1000 + i);
    }
    int idx[VL_CT_NDIM] = {vl_ct_size[VL_CT_WATER], 1, 2, 3}; /* unlimited water */
    vl_column_point p;
    point_of(7, &p);
    vl_ct_disk_note(KEY_C, idx, 4, &p);
    vl_climate_cache_flush();
    ck_assert_ptr_null(vl_climate_cache_error());
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 100);
    for (int i = 0; i < 100; i++)
        ck_assert_int_eq(l->num[i], i);
    l = load(KEY_B);
    ck_assert_int_eq(l->n, 10);
    for (int i = 0; i < 10; i++)
        ck_assert_int_eq(l->num[i], 1000 + 10 * i);
    int got = 0; /* the point past the water grid comes back too */
    vl_ct_disk_load(KEY_C, same_point, &got);
    ck_assert_int_eq(got, 1);
    table_file t = read_table(tmp, KEY_C);
    ck_assert_int_eq(t.size, t.hlen + t.rec);
    free(t.bytes);
    t = read_table(tmp, KEY_A);
    ck_assert_int_eq(t.size, t.hlen + 100 * t.rec);
    ck_assert_int_eq(strncmp(t.bytes, "volev-column-points 1 ", 22), 0);
    ck_assert_ptr_nonnull(strstr(t.bytes, "key 0123456789abcdef\n"));
    free(t.bytes);
    ck_assert_int_eq(load(0x42)->n, 0); /* no file */
    note_range(KEY_A, 200, 3);          /* buffered only: a new configuration writes it */
    configure(NULL);
    ck_assert_int_eq(load(KEY_A)->n, 0); /* off */
    configure(tmp);
    ck_assert_int_eq(load(KEY_A)->n, 103);
}
END_TEST

START_TEST(torn_tail)
{
    configure(tmp);
    note_range(KEY_A, 0, 5);
    vl_climate_cache_flush();
    table_file t = read_table(tmp, KEY_A);
    ck_assert_int_eq(t.size, t.hlen + 5 * t.rec);
    write_table(tmp, KEY_A, t.bytes, t.hlen + 4 * t.rec + t.rec / 2); /* a writer cut short */
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 4);
    for (int i = 0; i < 4; i++)
        ck_assert_int_eq(l->num[i], i);
    free(t.bytes);
    /* the next writer cuts the torn record away before appending */
    note_range(KEY_A, 10, 2);
    vl_climate_cache_flush();
    t = read_table(tmp, KEY_A);
    ck_assert_int_eq(t.size, t.hlen + 6 * t.rec);
    free(t.bytes);
    l = load(KEY_A);
    ck_assert_int_eq(l->n, 6);
    ck_assert_int_eq(l->num[4], 10);
    ck_assert_int_eq(l->num[5], 11);
    /* a header cut short: nothing, and the next writer starts the file again */
    write_table(tmp, KEY_A, "volev-column-po", 15);
    ck_assert_int_eq(load(KEY_A)->n, 0);
    note(KEY_A, 20);
    vl_climate_cache_flush();
    l = load(KEY_A);
    ck_assert_int_eq(l->n, 1);
    ck_assert_int_eq(l->num[0], 20);
}
END_TEST

START_TEST(corrupted_byte)
{
    configure(tmp);
    note_range(KEY_A, 0, 6);
    vl_climate_cache_flush();
    table_file t = read_table(tmp, KEY_A);
    long at[] = {t.rec + 100, 3 * t.rec + t.rec - 1, 4 * t.rec + 9, 5 * t.rec + 2};
    for (size_t k = 0; k < sizeof at / sizeof at[0]; k++) /* point, checksum, place, key */
        t.bytes[t.hlen + at[k]] ^= 0x10;
    write_table(tmp, KEY_A, t.bytes, t.size);
    free(t.bytes);
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 2);
    ck_assert_int_eq(l->num[0], 0);
    ck_assert_int_eq(l->num[1], 2);
}
END_TEST

/* Records with a valid checksum but contents a reader must refuse. */
START_TEST(checked_fields)
{
    configure(tmp);
    note_range(KEY_A, 0, 8);
    vl_climate_cache_flush();
    table_file t = read_table(tmp, KEY_A);
    unsigned char *r = (unsigned char *)t.bytes + t.hlen;
    int32_t v;
    double d;
    memcpy(r + 0 * t.rec, &KEY_B, 8); /* another table's key */
    v = VL_CT_NT;                     /* temperature index past the grid */
    memcpy(r + 1 * t.rec + 24, &v, 4);
    v = -1; /* a negative CO2 index */
    memcpy(r + 2 * t.rec + 12, &v, 4);
    v = vl_ct_size[VL_CT_WATER] + 1; /* water two past its grid */
    memcpy(r + 3 * t.rec + 8, &v, 4);
    v = (int32_t)sizeof(vl_column_point) - 8; /* another point size */
    memcpy(r + 4 * t.rec + 28, &v, 4);
    d = NAN;
    memcpy(r + 5 * t.rec + 32 + 8 * 3, &d, 8);
    d = -HUGE_VAL;
    memcpy(r + 6 * t.rec + 32 + 8 * (NDBL - 1), &d, 8);
    for (long k = 0; k < 7; k++)
        reseal(&t, k);
    write_table(tmp, KEY_A, t.bytes, t.size);
    free(t.bytes);
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 1);
    ck_assert_int_eq(l->num[0], 7);
}
END_TEST

START_TEST(foreign_records)
{
    configure(tmp);
    note_range(KEY_A, 0, 3);
    note_range(KEY_B, 100, 4);
    vl_climate_cache_flush();
    table_file a = read_table(tmp, KEY_A), b = read_table(tmp, KEY_B);
    /* B's records, whole and sound, appended to A's file: not A's points */
    char *both = malloc((size_t)(a.size + b.size - b.hlen));
    ck_assert_ptr_nonnull(both);
    memcpy(both, a.bytes, (size_t)a.size);
    memcpy(both + a.size, b.bytes + b.hlen, (size_t)(b.size - b.hlen));
    write_table(tmp, KEY_A, both, a.size + b.size - b.hlen);
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 3);
    ck_assert_int_eq(l->num[2], 2);
    /* B's whole file under A's name: its header names B */
    write_table(tmp, KEY_A, b.bytes, b.size);
    ck_assert_int_eq(load(KEY_A)->n, 0);
    free(both);
    free(a.bytes);
    free(b.bytes);
}
END_TEST

START_TEST(foreign_header)
{
    configure(tmp);
    note_range(KEY_A, 0, 4);
    vl_climate_cache_flush();
    table_file t = read_table(tmp, KEY_A);
    char *v = strstr(t.bytes, "points 1 ");
    ck_assert_ptr_nonnull(v);
    v[7] = '2'; /* another format version, records unchanged */
    write_table(tmp, KEY_A, t.bytes, t.size);
    ck_assert_int_eq(load(KEY_A)->n, 0);
    v[7] = '1';
    char *s = strstr(t.bytes, "point-bytes 1");
    ck_assert_ptr_nonnull(s);
    s[12] = '9'; /* another point size */
    write_table(tmp, KEY_A, t.bytes, t.size);
    ck_assert_int_eq(load(KEY_A)->n, 0);
    free(t.bytes);
    write_table(tmp, KEY_A, "some,other,file\n1,2,3\n", 22);
    ck_assert_int_eq(load(KEY_A)->n, 0);
    /* the next writer replaces a file that is not ours */
    note_range(KEY_A, 50, 2);
    vl_climate_cache_flush();
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 2);
    ck_assert_int_eq(l->num[0], 50);
    ck_assert_ptr_null(vl_climate_cache_error());
}
END_TEST

START_TEST(non_finite_not_written)
{
    configure(tmp);
    int idx[VL_CT_NDIM], j;
    vl_column_point p;
    place_of(3, idx, &j);
    point_of(3, &p);
    p.f_strat = NAN;
    vl_ct_disk_note(KEY_A, idx, j, &p);
    p.f_strat = 0.0;
    p.olr[1] = HUGE_VAL;
    vl_ct_disk_note(KEY_A, idx, j, &p);
    note(KEY_A, 4);
    vl_climate_cache_flush();
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, 1);
    ck_assert_int_eq(l->num[0], 4);
}
END_TEST

#define NPROC 3
#define PER_PROC 1500
#define NFRESH 40

START_TEST(processes_append_together)
{
    configure(tmp);
    int go[2];
    ck_assert_int_eq(pipe(go), 0);
    pid_t pid[NPROC];
    for (int c = 0; c < NPROC; c++) {
        pid[c] = fork();
        ck_assert_int_ge(pid[c], 0);
        if (pid[c] == 0) { /* start together, write many batches, then the rest */
            char x;
            close(go[1]);
            if (read(go[0], &x, 1) != 0)
                _exit(2);
            for (int k = 0; k < NFRESH; k++) { /* race to start fresh files */
                note(KEY_C + (uint64_t)k, c);
                vl_climate_cache_flush();
            }
            note_range(KEY_A, c * PER_PROC, PER_PROC);
            vl_climate_cache_flush();
            _exit(vl_climate_cache_error() ? 1 : 0);
        }
    }
    close(go[0]);
    close(go[1]); /* all start */
    for (int c = 0; c < NPROC; c++) {
        int status;
        ck_assert_int_eq(waitpid(pid[c], &status, 0), pid[c]);
        ck_assert(WIFEXITED(status));
        ck_assert_int_eq(WEXITSTATUS(status), 0);
    }
    table_file t = read_table(tmp, KEY_A); /* one header, whole records only */
    ck_assert_int_eq(t.size, t.hlen + (long)NPROC * PER_PROC * t.rec);
    free(t.bytes);
    for (int k = 0; k < NFRESH; k++) {
        t = read_table(tmp, KEY_C + (uint64_t)k);
        ck_assert_int_eq(t.size, t.hlen + NPROC * t.rec);
        free(t.bytes);
        ck_assert_int_eq(load(KEY_C + (uint64_t)k)->n, NPROC);
    }
    loaded *l = load(KEY_A);
    ck_assert_int_eq(l->n, NPROC * PER_PROC);
    static char seen[NPROC * PER_PROC];
    for (int i = 0; i < l->n; i++) {
        ck_assert(l->num[i] >= 0 && l->num[i] < NPROC * PER_PROC && !seen[l->num[i]]);
        seen[l->num[i]] = 1;
    }
}
END_TEST

/* The size of the table file of key in tmp (-1 if missing). */
static long size_of(uint64_t key)
{
    char rel[64], path[512];
    struct stat sb;
    rel_of(key, rel, sizeof rel);
    snprintf(path, sizeof path, "%s/%s", tmp, rel);
    return stat(path, &sb) == 0 ? (long)sb.st_size : -1;
}

START_TEST(writer_waits_for_lock)
{
    configure(tmp);
    note(KEY_A, 0);
    vl_climate_cache_flush();
    long size = size_of(KEY_A);
    char rel[64], path[512];
    rel_of(KEY_A, rel, sizeof rel);
    snprintf(path, sizeof path, "%s/%s", tmp, rel);
    int fd = open(path, O_RDONLY);
    ck_assert_int_ge(fd, 0);
    ck_assert_int_eq(flock(fd, LOCK_EX), 0); /* another writer, or a repair, in progress */
    pid_t pid = fork();
    ck_assert_int_ge(pid, 0);
    if (pid == 0) {
        note_range(KEY_A, 1, 3);
        vl_climate_cache_flush();
        _exit(vl_climate_cache_error() ? 1 : 0);
    }
    struct timespec nap = {0, 300000000L};
    nanosleep(&nap, NULL);
    int status;
    ck_assert_int_eq(waitpid(pid, &status, WNOHANG), 0); /* still waiting */
    ck_assert_int_eq(size_of(KEY_A), size);
    ck_assert_int_eq(flock(fd, LOCK_UN), 0);
    ck_assert_int_eq(waitpid(pid, &status, 0), pid);
    ck_assert(WIFEXITED(status) && WEXITSTATUS(status) == 0);
    close(fd);
    ck_assert_int_eq(load(KEY_A)->n, 4);
}
END_TEST

#define NTHREAD 4
#define PER_THREAD 600

static void *thread_notes(void *arg)
{
    int c = (int)(intptr_t)arg;
    for (int i = c * PER_THREAD; i < (c + 1) * PER_THREAD; i++) {
        note(KEY_B, i);
        if (i % 97 == 0)
            vl_climate_cache_flush();
    }
    return NULL;
}

START_TEST(threads_note_together)
{
    configure(tmp);
    pthread_t th[NTHREAD];
    for (int c = 0; c < NTHREAD; c++)
        ck_assert_int_eq(pthread_create(&th[c], NULL, thread_notes, (void *)(intptr_t)c), 0);
    for (int c = 0; c < NTHREAD; c++)
        ck_assert_int_eq(pthread_join(th[c], NULL), 0);
    vl_climate_cache_flush();
    loaded *l = load(KEY_B);
    ck_assert_int_eq(l->n, NTHREAD * PER_THREAD);
    static char seen[NTHREAD * PER_THREAD];
    for (int i = 0; i < l->n; i++) {
        ck_assert(l->num[i] >= 0 && l->num[i] < NTHREAD * PER_THREAD && !seen[l->num[i]]);
        seen[l->num[i]] = 1;
    }
}
END_TEST

START_TEST(folder_errors)
{
    char path[512];
    vl_status st;
    snprintf(path, sizeof path, "%s/a/b/c", tmp); /* parents made too */
    configure(path);
    ck_assert(vl_test_exists(tmp, "a/b/c"));
    /* a folder inside a regular file cannot be made, even by root */
    vl_test_write(tmp, "afile", "");
    snprintf(path, sizeof path, "%s/afile/sub", tmp);
    ck_assert_int_eq(vl_climate_cache_configure(path, &st), VL_ERR_IO);
    ck_assert_ptr_nonnull(strstr(st.file, "afile/sub"));
    ck_assert_ptr_nonnull(strstr(st.msg, strerror(ENOTDIR)));
    snprintf(path, sizeof path, "%s/afile", tmp);
    ck_assert_int_eq(vl_climate_cache_configure(path, &st), VL_ERR_IO);
    ck_assert_ptr_nonnull(strstr(st.file, "afile"));
    if (geteuid() != 0) { /* root writes anywhere: only the check above holds for it */
        snprintf(path, sizeof path, "%s/ro", tmp);
        ck_assert_int_eq(mkdir(path, 0555), 0);
        snprintf(path, sizeof path, "%s/ro/sub", tmp);
        ck_assert_int_eq(vl_climate_cache_configure(path, &st), VL_ERR_IO);
        ck_assert_ptr_nonnull(strstr(st.msg, strerror(EACCES)));
    }
    /* after a failed configuration the cache is off: nothing is buffered */
    note(KEY_A, 1);
    configure(tmp);
    vl_climate_cache_flush();
    ck_assert(!vl_test_exists(tmp, "column-0123456789abcdef.pts"));
}
END_TEST

START_TEST(write_error_turns_off)
{
    configure(tmp);
    char rel[64], path[512];
    rel_of(KEY_A, rel, sizeof rel);
    snprintf(path, sizeof path, "%s/%s", tmp, rel);
    ck_assert_int_eq(mkdir(path, 0777), 0); /* a folder where the file goes: fails for root too */
    note_range(KEY_A, 0, 3);
    note(KEY_B, 5);
    vl_climate_cache_flush();
    const char *e = vl_climate_cache_error();
    ck_assert_ptr_nonnull(e);
    ck_assert_ptr_nonnull(strstr(e, rel));
    ck_assert_ptr_nonnull(strstr(e, strerror(EISDIR)));
    /* off for the rest of the process: B's point dropped, nothing more written or read */
    ck_assert(!vl_test_exists(tmp, "column-fedcba9876543210.pts"));
    note(KEY_B, 6);
    vl_climate_cache_flush();
    ck_assert(!vl_test_exists(tmp, "column-fedcba9876543210.pts"));
    /* a new configuration forgets the error */
    configure(tmp);
    ck_assert_ptr_null(vl_climate_cache_error());
    note(KEY_B, 7);
    vl_climate_cache_flush();
    ck_assert_int_eq(load(KEY_B)->n, 1);
}
END_TEST

Suite *vl_suite_climate_disk(void)
{
    Suite *s = suite_create("climate_disk");
    TCase *tc = tcase_create("files");
    tcase_set_timeout(tc, 60);
    tcase_add_checked_fixture(tc, setup, teardown);
    tcase_add_test(tc, round_trip);
    tcase_add_test(tc, torn_tail);
    tcase_add_test(tc, corrupted_byte);
    tcase_add_test(tc, checked_fields);
    tcase_add_test(tc, foreign_records);
    tcase_add_test(tc, foreign_header);
    tcase_add_test(tc, non_finite_not_written);
    tcase_add_test(tc, processes_append_together);
    tcase_add_test(tc, writer_waits_for_lock);
    tcase_add_test(tc, threads_note_together);
    tcase_add_test(tc, folder_errors);
    tcase_add_test(tc, write_error_turns_off);
    suite_add_tcase(s, tc);
    return s;
}
