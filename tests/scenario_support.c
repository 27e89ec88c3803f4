/* scenario_support.c: what the scenario test suites share (scenario_support.h): a
 * temporary folder per test case, scenario files written into it, expected errors,
 * round trips through the resolved writer. */
#include <dirent.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#include "scenario_support.h"
#include "suites.h"

char vl_scen_tmp_dir[512];
char vl_scen_cfg_path[1024];

/* A fresh temporary folder per test case (removed even when a test fails). */
void vl_scen_make_dir(void)
{
    const char *base = getenv("TMPDIR");
    snprintf(vl_scen_tmp_dir, sizeof vl_scen_tmp_dir, "%s/vl_scenario_XXXXXX", base && base[0] ? base : "/tmp");
    ck_assert_ptr_nonnull(mkdtemp(vl_scen_tmp_dir));
}

/* Removes the temporary folder and the files in it. */
void vl_scen_remove_dir(void)
{
    DIR *d = opendir(vl_scen_tmp_dir);
    if (!d)
        return;
    char path[2048];
    for (struct dirent *e; (e = readdir(d)) != NULL;) {
        if (strcmp(e->d_name, ".") == 0 || strcmp(e->d_name, "..") == 0)
            continue;
        snprintf(path, sizeof path, "%s/%s", vl_scen_tmp_dir, e->d_name);
        unlink(path);
    }
    closedir(d);
    rmdir(vl_scen_tmp_dir);
}

/* Writes text to vl_scen_tmp_dir/name and returns the path (static buffer). */
const char *vl_scen_write_named(const char *name, const char *text)
{
    snprintf(vl_scen_cfg_path, sizeof vl_scen_cfg_path, "%s/%s", vl_scen_tmp_dir, name);
    FILE *f = fopen(vl_scen_cfg_path, "w");
    ck_assert_ptr_nonnull(f);
    fputs(text, f);
    ck_assert_int_eq(fclose(f), 0);
    return vl_scen_cfg_path;
}

const char *vl_scen_write_cfg(const char *text) { return vl_scen_write_named("x.cfg", text); }

vl_scenario *vl_scen_load_text(const char *text, vl_status *st)
{
    return vl_scenario_load(vl_scen_write_cfg(text), NULL, 0, st);
}

/* Global index of a full key; fails the test if there is none. */
size_t vl_scen_index_of(const char *key)
{
    char full[512];
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, i, &p, &base, &prefix);
        snprintf(full, sizeof full, "%s%s", prefix, p->key);
        if (strcmp(full, key) == 0)
            return i;
    }
    ck_abort_msg("no parameter %s", key);
    return 0;
}

/* Loading text fails with VL_ERR_INPUT at line, naming the file, and the message
 * contains each of the (up to two) needles. */
void vl_scen_expect_error(const char *text, int line, const char *needle, const char *needle2)
{
    vl_status st;
    vl_scenario *sc = vl_scen_load_text(text, &st);
    ck_assert_ptr_null(sc);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_msg(st.line == line, "line %d, expected %d (%s)", st.line, line, st.msg);
    ck_assert_str_eq(st.file, vl_scen_cfg_path);
    ck_assert_msg(strstr(st.msg, needle), "message '%s' lacks '%s'", st.msg, needle);
    if (needle2)
        ck_assert_msg(strstr(st.msg, needle2), "message '%s' lacks '%s'", st.msg, needle2);
}

/* Applying the override to a valid file fails with a --set message containing needle. */
void vl_scen_expect_override_error(const char *assignment, const char *needle)
{
    vl_status st;
    const char *ov[] = {assignment};
    vl_scenario *sc = vl_scenario_load(vl_scen_write_cfg("planet = { orbit_au = 1.52; };\n"), ov, 1, &st);
    ck_assert_ptr_null(sc);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_str_eq(st.file, "");
    ck_assert_int_eq(st.line, 0);
    ck_assert_msg(strncmp(st.msg, "--set ", 6) == 0, "message '%s' lacks --set", st.msg);
    ck_assert_msg(strstr(st.msg, needle), "message '%s' lacks '%s'", st.msg, needle);
}

/* Every stored value of a and b is identical, bit for bit. */
void vl_scen_assert_same_values(const vl_scenario *a, const vl_scenario *b)
{
    char key[512];
    for (size_t i = 0; i < vl_param_count(); i++) {
        const vl_param *p;
        void *ba, *bb;
        const char *prefix;
        vl_param_at(a, i, &p, &ba, &prefix);
        vl_param_at(b, i, &p, &bb, &prefix);
        snprintf(key, sizeof key, "%s%s", prefix, p->key);
        const char *va = (const char *)ba + p->offset, *vb = (const char *)bb + p->offset;
        size_t size = p->type == VL_PT_REAL ? sizeof(double)
                      : p->type == VL_PT_INT ? sizeof(long)
                      : p->type == VL_PT_PATH ? strlen(va) + 1
                                              : sizeof(int);
        ck_assert_msg(memcmp(va, vb, size) == 0, "%s differs after the round trip", key);
    }
}

/* Writes sc resolved into vl_scen_tmp_dir/resolved.cfg and loads it back. */
vl_scenario *vl_scen_round_trip(const vl_scenario *sc)
{
    vl_status st;
    char path[1024];
    snprintf(path, sizeof path, "%s/resolved.cfg", vl_scen_tmp_dir);
    FILE *f = fopen(path, "w");
    ck_assert_ptr_nonnull(f);
    ck_assert_int_eq(vl_scenario_write_resolved(sc, f, &st), VL_OK);
    ck_assert_int_eq(fclose(f), 0);
    vl_scenario *back = vl_scenario_load(path, NULL, 0, &st);
    ck_assert_msg(back != NULL, "resolved file does not load: %s:%d: %s", st.file, st.line, st.msg);
    return back;
}

