/* climate_disk.c: the column climate's tables on disk (climate_disk.h).
 *
 * File format ("volev column points", version 1): one file FOLDER/column-KEY.pts per
 * table, KEY the table's key as 16 lower-case hex digits. The file starts with one
 * text line,
 *
 *     volev-column-points 1 point-bytes P record-bytes R order little key KEY\n
 *
 * (P = sizeof(vl_column_point), R = the record size below, order = the byte order of
 * the writer), then fixed-size binary records in the writer's byte order, with no
 * padding:
 *
 *     offset  0  uint64  key            the table's key
 *     offset  8  int32   idx[4]         the node (water, CO2, background, H2)
 *     offset 24  int32   j              the temperature index
 *     offset 28  uint32  point_bytes    P again
 *     offset 32  double  point[P/8]     the vl_column_point, field by field
 *     offset R-8 uint64  checksum       FNV-1a 64 of bytes [0, R-8)
 *
 * A reader compares the whole header line with the one it would write: any difference
 * (version, sizes, byte order, key, a foreign file) ignores the whole file. It then
 * takes each record whose checksum, key, sizes and indices are right and whose values
 * are all finite, skips any other, and stops at a partial record at the end.
 *
 * Writers: processes and threads may append at once. Points are buffered (one buffer
 * for every table, guarded by a mutex) and appended in batches of at most BATCH_BYTES,
 * one batch per table file, with O_APPEND and a single write() under an exclusive
 * flock() on the file; readers take a shared one. Holding the lock, a writer first
 * repairs what an interrupted writer may have left: a torn tail is cut back to whole
 * records, and a file whose header is not ours (another version) is emptied and
 * started again. A write that fails (disk full, read-only folder) turns the cache off
 * for the rest of the process and keeps the first error for vl_climate_cache_error;
 * nothing is printed. */
#define _DEFAULT_SOURCE /* flock */
#include "climate_disk.h"

#include "volev/climate.h"

#include <errno.h>
#include <fcntl.h>
#include <math.h>
#include <pthread.h>
#include <stddef.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <unistd.h>

#define FORMAT_NAME "volev-column-points"
#define FORMAT_VERSION 1
#define BATCH_BYTES 65536 /* one write() per batch: header and records together */
#define HEADER_MAX 160

typedef struct record {
    uint64_t key;
    int32_t idx[VL_CT_NDIM];
    int32_t j;
    uint32_t point_bytes;
    vl_column_point p;
    uint64_t sum;
} record;

_Static_assert(offsetof(record, p) == 32 && offsetof(record, sum) == 32 + sizeof(vl_column_point) &&
                   sizeof(record) == offsetof(record, sum) + sizeof(uint64_t),
               "records have no padding");
_Static_assert(sizeof(vl_column_point) % sizeof(double) == 0, "a point is a row of doubles");

#define BATCH_RECORDS ((BATCH_BYTES - HEADER_MAX) / sizeof(record))

static struct {
    pthread_mutex_t lock;            /* guards everything below */
    char folder[VL_PATH_MAX];        /* "" when the cache is off */
    record buf[BATCH_RECORDS];       /* points not yet written, every table */
    size_t n;
    unsigned char out[BATCH_BYTES];  /* one file's batch being written */
    char error[VL_MSG_MAX];          /* the first write error, "" if none */
    int exit_hook;                   /* flush registered with atexit */
} cache = {.lock = PTHREAD_MUTEX_INITIALIZER};

/* FNV-1a 64 of n bytes at p. */
static uint64_t fnv1a(const void *p, size_t n)
{
    const unsigned char *b = p;
    uint64_t h = 1469598103934665603ULL;
    for (size_t i = 0; i < n; i++) {
        h ^= b[i];
        h *= 1099511628211ULL;
    }
    return h;
}

/* The header line of key's file into buf (HEADER_MAX bytes); its length. */
static size_t header(uint64_t key, char *buf)
{
    const uint16_t one = 1;
    const char *order = *(const unsigned char *)&one ? "little" : "big";
    int n = snprintf(buf, HEADER_MAX, "%s %d point-bytes %zu record-bytes %zu order %s key %016llx\n",
                     FORMAT_NAME, FORMAT_VERSION, sizeof(vl_column_point), sizeof(record), order,
                     (unsigned long long)key);
    return (size_t)n;
}

/* The path of key's file in folder into buf (VL_PATH_MAX bytes). */
static void file_path(const char *folder, uint64_t key, char *buf)
{
    snprintf(buf, VL_PATH_MAX, "%.*s/column-%016llx.pts", VL_PATH_MAX - 32, folder,
             (unsigned long long)key);
}

/* Whether r is a sound record of the table key: checksum, key, size, indices, values. */
static int record_ok(const record *r, uint64_t key)
{
    if (r->sum != fnv1a(r, offsetof(record, sum)) || r->key != key ||
        r->point_bytes != sizeof(vl_column_point) || r->j < 0 || r->j >= VL_CT_NT)
        return 0;
    for (int d = 0; d < VL_CT_NDIM; d++) /* water may sit one past its grid: unlimited */
        if (r->idx[d] < 0 || r->idx[d] >= vl_ct_size[d] + (d == VL_CT_WATER))
            return 0;
    const double *v = (const double *)&r->p;
    for (size_t i = 0; i < sizeof r->p / sizeof *v; i++)
        if (!isfinite(v[i]))
            return 0;
    return 1;
}

/* flock that resumes after a signal; 0 or -1 with errno. */
static int lock_file(int fd, int how)
{
    int rc;
    while ((rc = flock(fd, how)) != 0 && errno == EINTR)
        ;
    return rc;
}

void vl_ct_disk_load(uint64_t key, void (*fn)(void *ctx, const int idx[VL_CT_NDIM], int j,
                                              const vl_column_point *p),
                     void *ctx)
{
    char path[VL_PATH_MAX], want[HEADER_MAX], have[HEADER_MAX];
    pthread_mutex_lock(&cache.lock);
    int on = cache.folder[0] != '\0';
    if (on)
        file_path(cache.folder, key, path);
    pthread_mutex_unlock(&cache.lock);
    int fd = on ? open(path, O_RDONLY | O_CLOEXEC) : -1;
    if (fd < 0)
        return;
    FILE *f = lock_file(fd, LOCK_SH) == 0 ? fdopen(fd, "rb") : NULL;
    if (!f) {
        close(fd);
        return;
    }
    size_t hlen = header(key, want);
    record r;
    int idx[VL_CT_NDIM];
    if (fread(have, 1, hlen, f) == hlen && memcmp(have, want, hlen) == 0)
        while (fread(&r, sizeof r, 1, f) == 1) {
            if (!record_ok(&r, key))
                continue;
            for (int d = 0; d < VL_CT_NDIM; d++)
                idx[d] = r.idx[d];
            fn(ctx, idx, r.j, &r.p);
        }
    fclose(f); /* releases the lock */
}

/* Turn the cache off after an error on path (lock held); keeps the first message. */
static void turn_off(const char *path, int err)
{
    if (!cache.error[0])
        snprintf(cache.error, sizeof cache.error, "%.900s: %s", path, strerror(err));
    cache.folder[0] = '\0';
    cache.n = 0;
}

/* With the file locked: the size at which to append, after cutting a torn tail or
 * emptying a file that is not ours; *fresh set when the header must be written.
 * -1 with errno on failure. */
static off_t prepare(int fd, const char *hdr, size_t hlen, int *fresh)
{
    struct stat sb;
    char have[HEADER_MAX];
    if (fstat(fd, &sb) != 0)
        return -1;
    off_t size = sb.st_size;
    *fresh = size < (off_t)hlen || pread(fd, have, hlen, 0) != (ssize_t)hlen ||
             memcmp(have, hdr, hlen) != 0;
    off_t keep = *fresh ? 0 : size - (size - (off_t)hlen) % (off_t)sizeof(record);
    if (keep != size && ftruncate(fd, keep) != 0)
        return -1;
    return keep;
}

/* Append len bytes of data to fd (opened O_APPEND, locked) in one write(), completed if
 * the system cut it short; on failure the file is cut back to size and -1 returned
 * with errno. */
static int append(int fd, const unsigned char *data, size_t len, off_t size)
{
    size_t done = 0;
    while (done < len) {
        ssize_t w = write(fd, data + done, len - done);
        if (w > 0) {
            done += (size_t)w;
        } else if (w == 0 || errno != EINTR) {
            int err = w == 0 ? ENOSPC : errno;
            int cut = ftruncate(fd, size); /* best effort: the first error is the one kept */
            (void)cut;
            errno = err;
            return -1;
        }
    }
    return 0;
}

/* Write the buffered records of table key to its file and drop them from the buffer
 * (lock held). 0, or -1 with errno and the file's path in path. */
static int write_table(uint64_t key, char *path)
{
    char hdr[HEADER_MAX];
    size_t hlen = header(key, hdr), len = hlen, kept = 0;
    for (size_t i = 0; i < cache.n; i++) {
        if (cache.buf[i].key == key) {
            memcpy(cache.out + len, &cache.buf[i], sizeof(record));
            len += sizeof(record);
        } else {
            cache.buf[kept++] = cache.buf[i];
        }
    }
    cache.n = kept;
    memcpy(cache.out, hdr, hlen);
    file_path(cache.folder, key, path);
    int fd = open(path, O_RDWR | O_APPEND | O_CREAT | O_CLOEXEC, 0666), fresh = 0, rc = -1;
    if (fd < 0)
        return -1;
    off_t size = lock_file(fd, LOCK_EX) == 0 ? prepare(fd, hdr, hlen, &fresh) : -1;
    if (size >= 0) /* the header too when the file starts afresh */
        rc = fresh ? append(fd, cache.out, len, size) : append(fd, cache.out + hlen, len - hlen, size);
    int err = errno;
    if (close(fd) != 0 && rc == 0) /* closing also releases the lock */
        return -1;
    errno = err;
    return rc;
}

/* Write every buffered record, table by table (lock held). */
static void flush_locked(void)
{
    char path[VL_PATH_MAX];
    while (cache.n > 0 && cache.folder[0])
        if (write_table(cache.buf[0].key, path) != 0)
            turn_off(path, errno);
}

void vl_ct_disk_note(uint64_t key, const int idx[VL_CT_NDIM], int j, const vl_column_point *p)
{
    record r;
    memset(&r, 0, sizeof r);
    r.key = key;
    for (int d = 0; d < VL_CT_NDIM; d++)
        r.idx[d] = idx[d];
    r.j = j;
    r.point_bytes = sizeof r.p;
    r.p = *p;
    r.sum = fnv1a(&r, offsetof(record, sum));
    if (!record_ok(&r, key)) /* not a point a reader would take: not worth writing */
        return;
    pthread_mutex_lock(&cache.lock);
    if (cache.folder[0]) {
        cache.buf[cache.n++] = r;
        if (cache.n == BATCH_RECORDS)
            flush_locked();
    }
    pthread_mutex_unlock(&cache.lock);
}

void vl_climate_cache_flush(void)
{
    pthread_mutex_lock(&cache.lock);
    flush_locked();
    pthread_mutex_unlock(&cache.lock);
}

const char *vl_climate_cache_error(void)
{
    pthread_mutex_lock(&cache.lock);
    const char *e = cache.error[0] ? cache.error : NULL;
    pthread_mutex_unlock(&cache.lock);
    return e;
}

/* Make folder and its missing parents; VL_OK or VL_ERR_IO with st filled. */
static int make_folder(const char *folder, vl_status *st)
{
    char path[VL_PATH_MAX];
    size_t n = strlen(folder);
    if (n + 32 >= sizeof path)
        return vl_fail(st, VL_ERR_IO, NULL, 0, "climate cache folder: path longer than %d bytes",
                       VL_PATH_MAX - 32);
    memcpy(path, folder, n + 1);
    for (size_t i = 1; i <= n; i++) {
        if (path[i] != '/' && path[i] != '\0')
            continue;
        char c = path[i];
        path[i] = '\0';
        if (mkdir(path, 0777) != 0 && errno != EEXIST)
            return vl_fail(st, VL_ERR_IO, path, 0, "cannot create the climate cache folder: %s",
                           strerror(errno));
        path[i] = c;
    }
    struct stat sb;
    if (stat(folder, &sb) != 0)
        return vl_fail(st, VL_ERR_IO, folder, 0, "cannot use as the climate cache folder: %s",
                       strerror(errno));
    if (!S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_IO, folder, 0, "cannot use as the climate cache folder: %s",
                       strerror(ENOTDIR));
    return VL_OK;
}

/* The exit hook: write what is left. */
static void flush_at_exit(void) { vl_climate_cache_flush(); }

int vl_climate_cache_configure(const char *folder, vl_status *st)
{
    vl_status_clear(st);
    pthread_mutex_lock(&cache.lock);
    flush_locked();
    cache.folder[0] = '\0';
    cache.error[0] = '\0';
    pthread_mutex_unlock(&cache.lock);
    if (!folder || !folder[0])
        return VL_OK;
    if (make_folder(folder, st) != VL_OK)
        return st->code;
    pthread_mutex_lock(&cache.lock);
    snprintf(cache.folder, sizeof cache.folder, "%s", folder);
    int hook = !cache.exit_hook;
    cache.exit_hook = 1;
    pthread_mutex_unlock(&cache.lock);
    if (hook)
        atexit(flush_at_exit);
    return VL_OK;
}
