/* folder.c: an output folder before a command writes into it (folder.h): its entries,
 * the leftover temporaries of a killed volev, the lock of a sweep folder. */
#include "volev/folder.h"

#include <dirent.h>
#include <errno.h>
#include <fcntl.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <unistd.h>

/* The files volev writes into a run or sweep folder (output.c, src/cli/sweep_files.c). */
static const char *const output_files[] = {
    "series.csv",          "events.csv",           "summary.csv", "scenario.resolved.cfg",
    "members.csv",         "ensemble_summary.csv", "ensemble_series.csv", "sensitivity.csv",
    NULL};

void vl_folder_temp_name(char *buf, size_t n, const char *dir, const char *name)
{
    snprintf(buf, n, "%s/.%s.%ld.tmp", dir, name, (long)getpid());
}

/* The pid of a temporary's name ".NAME.PID.tmp" of an output file NAME: > 0; 0 for the
 * pid-less ".NAME.tmp" of earlier versions; -1 if the name is no volev temporary. */
static long temp_pid(const char *entry)
{
    size_t len = strlen(entry);
    if (entry[0] != '.' || len < 6 || strcmp(entry + len - 4, ".tmp") != 0)
        return -1;
    for (int k = 0; output_files[k]; k++) {
        size_t nl = strlen(output_files[k]);
        if (strncmp(entry + 1, output_files[k], nl) != 0)
            continue;
        const char *p = entry + 1 + nl;
        if (strcmp(p, ".tmp") == 0)
            return 0;
        char *end;
        if (*p != '.' || p[1] < '1' || p[1] > '9')
            continue;
        long pid = strtol(p + 1, &end, 10);
        if (strcmp(end, ".tmp") == 0 && pid > 0)
            return pid;
    }
    return -1;
}

/* Whether process pid runs (this process counts as running). */
static int running(long pid)
{
    if (pid <= 0)
        return 0;
    return pid == (long)getpid() || kill((pid_t)pid, 0) == 0 || errno == EPERM;
}

/* Whether dir/entry is an output file volev wrote: a known name whose first line starts
 * with "# volev ". */
static int volev_file(const char *dir, const char *entry)
{
    int known = 0;
    for (int k = 0; output_files[k]; k++)
        known |= strcmp(entry, output_files[k]) == 0;
    if (!known)
        return 0;
    char path[4200], line[16] = "";
    snprintf(path, sizeof path, "%s/%s", dir, entry);
    FILE *f = fopen(path, "r");
    if (!f)
        return 0;
    int yes = fgets(line, sizeof line, f) && strncmp(line, "# volev ", 8) == 0;
    fclose(f);
    return yes;
}

/* One entry of dir into fs: a leftover temporary removed, a busy one counted. */
static int note_entry(const char *dir, const char *entry, vl_folder_state *fs, vl_status *st)
{
    if (strcmp(entry, ".") == 0 || strcmp(entry, "..") == 0 || strcmp(entry, VL_FOLDER_LOCK) == 0)
        return VL_OK;
    long pid = temp_pid(entry);
    if (pid >= 0 && !running(pid)) {
        char path[4200];
        snprintf(path, sizeof path, "%s/%s", dir, entry);
        if (unlink(path) != 0 && errno != ENOENT)
            return vl_fail(st, VL_ERR_IO, path, 0,
                           "cannot remove this temporary file of a killed volev: %s",
                           strerror(errno));
        fs->removed++;
        return VL_OK;
    }
    fs->busy += pid > 0;
    fs->entries++;
    fs->volev |= volev_file(dir, entry);
    return VL_OK;
}

int vl_folder_inspect(const char *dir, vl_folder_state *fs, vl_status *st)
{
    memset(fs, 0, sizeof *fs);
    struct stat sb;
    if (stat(dir, &sb) != 0) {
        if (errno == ENOENT)
            return VL_OK;
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot read the output folder: %s",
                       strerror(errno));
    }
    if (!S_ISDIR(sb.st_mode))
        return vl_fail(st, VL_ERR_IO, dir, 0, "the output folder is not a folder");
    fs->exists = 1;
    DIR *d = opendir(dir);
    if (!d)
        return vl_fail(st, VL_ERR_IO, dir, 0, "cannot read the output folder: %s",
                       strerror(errno));
    int rc = VL_OK;
    struct dirent *e;
    while (rc == VL_OK && (e = readdir(d)) != NULL)
        rc = note_entry(dir, e->d_name, fs, st);
    closedir(d);
    return rc;
}

/* The pid written in the lock file open at fd, or 0. */
static long holder(int fd)
{
    char text[32];
    ssize_t n = pread(fd, text, sizeof text - 1, 0);
    if (n <= 0)
        return 0;
    text[n] = '\0';
    return strtol(text, NULL, 10);
}

/* The lock file at path opened and locked (fd >= 0), -2 if another process holds it
 * (*pid: its pid, if known), -1 on another error (errno set). */
static int try_lock(const char *path, long *pid)
{
    int fd = open(path, O_RDWR | O_CREAT | O_CLOEXEC, 0666);
    if (fd < 0)
        return -1;
    if (flock(fd, LOCK_EX | LOCK_NB) != 0) {
        int e = errno;
        *pid = holder(fd);
        close(fd);
        errno = e;
        return e == EWOULDBLOCK ? -2 : -1;
    }
    /* the file may have been removed by its last holder between open and flock: then
     * this lock guards nothing, so try again on the file now at path */
    struct stat a, b;
    if (fstat(fd, &a) != 0 || stat(path, &b) != 0 || a.st_ino != b.st_ino || a.st_dev != b.st_dev) {
        close(fd);
        errno = EAGAIN;
        return -3;
    }
    return fd;
}

int vl_folder_lock(const char *dir, vl_status *st)
{
    char path[4200];
    snprintf(path, sizeof path, "%s/%s", dir, VL_FOLDER_LOCK);
    long pid = 0;
    int fd = -3;
    for (int tries = 0; tries < 100 && fd == -3; tries++)
        fd = try_lock(path, &pid);
    if (fd == -2) {
        char who[48] = "";
        if (pid > 0)
            snprintf(who, sizeof who, " (pid %ld)", pid);
        vl_fail(st, VL_ERR_IO, dir, 0,
                "another volev%s is writing into this folder; wait for it to finish, or "
                "choose another -o",
                who);
        return -1;
    }
    if (fd < 0) {
        vl_fail(st, VL_ERR_IO, path, 0, "cannot lock the folder: %s", strerror(errno));
        return -1;
    }
    char text[32];
    int n = snprintf(text, sizeof text, "%ld\n", (long)getpid());
    if (ftruncate(fd, 0) != 0 || pwrite(fd, text, (size_t)n, 0) != n) {
        vl_fail(st, VL_ERR_IO, path, 0, "cannot write the lock file: %s", strerror(errno));
        close(fd);
        return -1;
    }
    return fd;
}

void vl_folder_unlock(const char *dir, int fd)
{
    if (fd < 0)
        return;
    char path[4200];
    snprintf(path, sizeof path, "%s/%s", dir, VL_FOLDER_LOCK);
    unlink(path); /* while still locked: a later locker creates a fresh file */
    close(fd);
}
