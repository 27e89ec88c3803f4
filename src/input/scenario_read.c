/* scenario_read.c: the file walk (scenario_internal.h). The text is checked (binary
 * data, the pre-scan), parsed by libconfig, and every setting is accepted only if its
 * full dotted key names a row of the parameter index, or a group some row lives in;
 * values are read by scenario_value.c. */
#include <errno.h>
#include <fcntl.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <sys/stat.h>
#include <unistd.h>

#include "scenario_internal.h"
#include "volev/process.h"
#include "volev/text.h"

/* ------------------------------------------------------------------ settings */

/* Reads the setting s into row i and records its line. */
static int read_scalar(vl_loader *ld, const config_setting_t *s, size_t i, int line)
{
    vl_where w = {ld->path, line, NULL};
    vl_slot t = vl_scenario_row_slot(ld->sc, i);
    int rc = vl_scenario_read_value(s, &t, ld->dir, &w, ld->st);
    if (rc == VL_OK)
        vl_scenario_mark(ld->sc, i, VL_FROM_FILE, line);
    return rc;
}

/* A setting under `processes` that is not a registered process. */
static int unknown_process(vl_loader *ld, const char *full, int line)
{
    char hint[VL_SCENARIO_KEY_MAX + 32] = "", names[1024] = "";
    vl_where w = {ld->path, line, NULL};
    vl_scenario_suggest(full, 1, hint, sizeof hint);
    if (hint[0])
        return vl_scenario_fail_at(ld->st, &w, "unknown process '%s'%s", full, hint);
    for (size_t k = 0; k < vl_nprocesses; k++) {
        size_t len = strlen(names);
        snprintf(names + len, sizeof names - len, "%s%s", k ? ", " : "", vl_processes[k]->name);
    }
    return vl_scenario_fail_at(ld->st, &w, "unknown process '%s' (known processes: %s)", full,
                               names);
}

/* A setting that is neither a known key nor a known group (at the top level the sweep
 * group is a candidate too). */
static int unknown_setting(vl_loader *ld, const char *full, int group, int line)
{
    static const char *const sweep[] = {"sweep"};
    char hint[VL_SCENARIO_KEY_MAX + 32];
    vl_where w = {ld->path, line, NULL};
    vl_scenario_suggest(full, group, hint, sizeof hint);
    if (!hint[0] && !strchr(full, '.'))
        vl_scenario_suggest_among(full, "", sweep, 1, hint, sizeof hint);
    return vl_scenario_fail_at(ld->st, &w, "unknown %s '%s'%s", group ? "group" : "key", full,
                               hint);
}

/* A single value written where a group belongs. */
static int value_for_group(vl_loader *ld, const char *full, int line)
{
    char sw[VL_SCENARIO_KEY_MAX + 16];
    vl_where w = {ld->path, line, NULL};
    snprintf(sw, sizeof sw, "%s.enabled", full);
    if (vl_scenario_find_key(sw) >= 0)
        return vl_scenario_fail_at(ld->st, &w,
                                   "'%s' is a group: switch the process with %s = { enabled = "
                                   "true; } (or false)",
                                   full, full);
    return vl_scenario_fail_at(ld->st, &w, "'%s' is a group: write %s = { ... };", full, full);
}

static int walk_group(vl_loader *ld, const config_setting_t *g, const char *prefix);

/* One setting of the file, with its full key. */
static int visit(vl_loader *ld, const config_setting_t *s, const char *full, const char *prefix)
{
    int line = (int)config_setting_source_line(s);
    int grp = config_setting_is_group(s);
    if (prefix[0] == '\0' && strcmp(full, "sweep") == 0)
        return vl_sweep_spec_read(ld, s, line); /* the ensemble settings: sweep_spec.c */
    if (vl_scenario_is_group(full))
        return grp ? walk_group(ld, s, full) : value_for_group(ld, full, line);
    if (strcmp(prefix, "processes") == 0)
        return unknown_process(ld, full, line);
    long i = vl_scenario_find_key(full);
    if (i < 0)
        return unknown_setting(ld, full, grp, line);
    return read_scalar(ld, s, (size_t)i, line);
}

/* Every setting of group g, whose full key is prefix ("" for the root). */
static int walk_group(vl_loader *ld, const config_setting_t *g, const char *prefix)
{
    int n = config_setting_length(g);
    for (int k = 0; k < n; k++) {
        const config_setting_t *s = config_setting_get_elem(g, (unsigned)k);
        const char *name = config_setting_name(s);
        char full[VL_SCENARIO_KEY_MAX];
        snprintf(full, sizeof full, "%s%s%s", prefix, prefix[0] ? "." : "", name ? name : "?");
        int rc = visit(ld, s, full, prefix);
        if (rc)
            return rc;
    }
    return VL_OK;
}

/* ------------------------------------------------------------------ the text */

static int too_large(const char *path, vl_status *st);

/* A UTF-8 byte-order mark at the very start is skipped, as by the CSV reader (csv.h). */
static const char *skip_bom(const char *text, size_t *len)
{
    if (*len >= 3 && memcmp(text, "\xEF\xBB\xBF", 3) == 0) {
        *len -= 3;
        return text + 3;
    }
    return text;
}

int vl_scenario_read_memory(vl_scenario *sc, const char *text, size_t len, const char *dir,
                            vl_status *st)
{
    vl_loader ld = {sc, st, sc->path, ""};
    snprintf(ld.dir, sizeof ld.dir, "%s", dir);
    if (len > VL_SCENARIO_SIZE_MAX)
        return too_large(sc->path, st);
    text = skip_bom(text, &len);
    int rc = vl_scenario_check_bytes(text, len, sc->path, st);
    if (rc)
        return rc;
    char *copy = malloc(len + 1);
    if (!copy)
        return vl_fail(st, VL_ERR_INTERNAL, sc->path, 0, "out of memory reading the scenario");
    memcpy(copy, text, len);
    copy[len] = '\0';
    char *parsed = vl_scenario_prescan(copy, len, sc->path, st);
    free(copy);
    if (!parsed)
        return st->code;
    config_t cfg;
    config_init(&cfg);
    if (!config_read_string(&cfg, parsed))
        rc = vl_fail(st, VL_ERR_INPUT, sc->path, config_error_line(&cfg), "%s",
                     config_error_text(&cfg));
    else
        rc = walk_group(&ld, config_root_setting(&cfg), "");
    config_destroy(&cfg);
    free(parsed);
    return rc;
}

/* ------------------------------------------------------------------ the file */

static int too_large(const char *path, vl_status *st)
{
    return vl_fail(st, VL_ERR_INPUT, path, 0,
                   "the scenario is larger than the limit of %zu bytes (1 MiB)",
                   VL_SCENARIO_SIZE_MAX);
}

/* Opens path for reading if it is a regular file of at most VL_SCENARIO_SIZE_MAX bytes;
 * -1 otherwise, st filled. Opened without blocking, so a FIFO is refused, not waited on;
 * a device or a folder is refused before anything is read. */
static int open_regular(const char *path, vl_status *st)
{
    int fd = open(path, O_RDONLY | O_NONBLOCK | O_CLOEXEC), flags;
    if (fd < 0) {
        vl_fail(st, VL_ERR_IO, path, 0, "cannot open the scenario: %s", strerror(errno));
        return -1;
    }
    struct stat sb;
    if (fstat(fd, &sb) != 0 || (flags = fcntl(fd, F_GETFL)) < 0 ||
        fcntl(fd, F_SETFL, flags & ~O_NONBLOCK) != 0)
        vl_fail(st, VL_ERR_IO, path, 0, "cannot read the scenario: %s", strerror(errno));
    else if (!S_ISREG(sb.st_mode))
        vl_fail(st, VL_ERR_INPUT, path, 0, "cannot read the scenario: it is %s, not a regular file",
                vl_text_file_kind(sb.st_mode));
    else if ((uintmax_t)sb.st_size > VL_SCENARIO_SIZE_MAX)
        too_large(path, st);
    else
        return fd;
    close(fd);
    return -1;
}

/* The whole file into a new buffer (NUL-terminated; *len bytes before the terminator,
 * which may include NULs: vl_scenario_check_bytes rejects them). At most
 * VL_SCENARIO_SIZE_MAX bytes are read even if the file grows meanwhile. */
static int slurp(const char *path, char **text, size_t *len_out, vl_status *st)
{
    int fd = open_regular(path, st);
    if (fd < 0)
        return st->code;
    size_t len = 0, cap = VL_SCENARIO_SIZE_MAX + 2;
    char *buf = malloc(cap);
    ssize_t got = 1;
    while (buf && len < cap - 1 && got > 0) {
        got = read(fd, buf + len, cap - 1 - len);
        if (got > 0)
            len += (size_t)got;
        else if (got < 0 && errno == EINTR)
            got = 1;
    }
    int why = errno;
    close(fd);
    if (!buf)
        return vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the scenario");
    if (got < 0 || len > VL_SCENARIO_SIZE_MAX) {
        free(buf);
        return got < 0 ? vl_fail(st, VL_ERR_IO, path, 0, "cannot read the scenario: %s",
                                 strerror(why))
                       : too_large(path, st);
    }
    buf[len] = '\0';
    *text = buf;
    *len_out = len;
    return VL_OK;
}

/* The absolute folder of path into out. */
static int folder_of(const char *path, char *out, size_t n, vl_status *st)
{
    char cwd[VL_PATH_MAX], dir[VL_PATH_MAX];
    const char *slash = strrchr(path, '/');
    if (!slash)
        return vl_scenario_current_dir(out, n, st);
    snprintf(dir, sizeof dir, "%.*s", slash == path ? 1 : (int)(slash - path), path);
    if (dir[0] == '/') {
        snprintf(out, n, "%s", dir);
        return VL_OK;
    }
    int rc = vl_scenario_current_dir(cwd, sizeof cwd, st);
    if (rc)
        return rc;
    if (vl_scenario_join_path(cwd, strcmp(dir, ".") == 0 ? "" : dir, out, n))
        return vl_fail(st, VL_ERR_INPUT, path, 0, "scenario folder path too long");
    return VL_OK;
}

int vl_scenario_read_file(vl_scenario *sc, vl_status *st)
{
    char dir[VL_PATH_MAX], *text = NULL;
    size_t len = 0;
    int rc = folder_of(sc->path, dir, sizeof dir, st);
    if (!rc)
        rc = slurp(sc->path, &text, &len, st);
    if (!rc)
        rc = vl_scenario_read_memory(sc, text, len, dir, st);
    free(text);
    return rc;
}
