/* scenario_read.c: the file walk (scenario_internal.h). The text is checked (binary
 * data, the pre-scan), parsed by libconfig, and every setting is accepted only if its
 * full dotted key names a row of the parameter index, or a group some row lives in;
 * values are read by scenario_value.c. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"
#include "volev/process.h"

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

int vl_scenario_read_memory(vl_scenario *sc, const char *text, size_t len, const char *dir,
                            vl_status *st)
{
    vl_loader ld = {sc, st, sc->path, ""};
    snprintf(ld.dir, sizeof ld.dir, "%s", dir);
    int rc = vl_scenario_check_bytes(text, len, sc->path, st);
    if (rc)
        return rc;
    char *copy = malloc(len + 1);
    if (!copy)
        return vl_fail(st, VL_ERR_INTERNAL, sc->path, 0, "out of memory reading the scenario");
    memcpy(copy, text, len);
    copy[len] = '\0';
    rc = vl_scenario_prescan(copy, sc->path, st);
    if (rc) {
        free(copy);
        return rc;
    }
    config_t cfg;
    config_init(&cfg);
    if (!config_read_string(&cfg, copy))
        rc = vl_fail(st, VL_ERR_INPUT, sc->path, config_error_line(&cfg), "%s",
                     config_error_text(&cfg));
    else
        rc = walk_group(&ld, config_root_setting(&cfg), "");
    config_destroy(&cfg);
    free(copy);
    return rc;
}

/* ------------------------------------------------------------------ the file */

/* The whole file into a new buffer (NUL-terminated; *len bytes before the terminator,
 * which may include NULs: vl_scenario_check_bytes rejects them). */
static int slurp(const char *path, char **text, size_t *len_out, vl_status *st)
{
    FILE *f = fopen(path, "rb");
    if (!f)
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot open the scenario: %s", strerror(errno));
    size_t len = 0, cap = 4096;
    char *buf = malloc(cap);
    while (buf) {
        len += fread(buf + len, 1, cap - len - 1, f);
        if (len < cap - 1)
            break;
        char *bigger = realloc(buf, cap *= 2);
        if (!bigger)
            free(buf);
        buf = bigger;
    }
    int bad = ferror(f), why = errno;
    fclose(f);
    if (!buf)
        return vl_fail(st, VL_ERR_INTERNAL, path, 0, "out of memory reading the scenario");
    if (bad) {
        free(buf);
        return vl_fail(st, VL_ERR_IO, path, 0, "cannot read the scenario: %s", strerror(why));
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
