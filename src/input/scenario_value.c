/* scenario_value.c: typed values (scenario_internal.h). One libconfig setting is read
 * as the type of its table row and stored after the row's checks (finite, bounds,
 * choices, paths made absolute); --set values go through the same stores. Every input
 * of a scenario file, the sweep group's included, is read here. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <string.h>
#include <unistd.h>

#include "scenario_internal.h"
#include "volev/text.h"

/* ------------------------------------------------------------------ storing */

int vl_scenario_assign_real(const vl_slot *t, double v, const vl_where *w, vl_status *st)
{
    const vl_param *p = t->p;
    if (!isfinite(v))
        return vl_scenario_fail_at(st, w, "%s = %g is not a finite number", t->key, v);
    if (v < p->lo || v > p->hi)
        return vl_scenario_fail_at(st, w, "%s = %.10g is out of bounds [%g, %g]%s%s", t->key,
                                   v, p->lo, p->hi, vl_scenario_unit_sep(p),
                                   vl_scenario_unit(p));
    if (v == 0.0)
        v = 0.0; /* "-0" is zero: no negative zero reaches the model or scenario.resolved.cfg */
    *(double *)t->at = v * p->to_si;
    if (t->file_value)
        *t->file_value = v;
    return VL_OK;
}

int vl_scenario_assign_int(const vl_slot *t, long v, const vl_where *w, vl_status *st)
{
    const vl_param *p = t->p;
    if ((double)v < p->lo || (double)v > p->hi)
        return vl_scenario_fail_at(st, w, "%s = %ld is out of bounds [%.0f, %.0f]", t->key, v,
                                   p->lo, p->hi);
    *(long *)t->at = v;
    return VL_OK;
}

int vl_scenario_assign_choice(const vl_slot *t, const char *name, const vl_where *w,
                              vl_status *st)
{
    char list[512], shown[VL_EXCERPT_SIZE];
    int k = vl_choice_index(t->p->choices, name);
    if (k < 0) {
        vl_scenario_list_text(t->p->choices, ",", list, sizeof list);
        return vl_scenario_fail_at(st, w, "%s = \"%s\" is not one of: %s", t->key,
                                   vl_text_excerpt_str(name, shown, sizeof shown), list);
    }
    *(int *)t->at = k;
    return VL_OK;
}

int vl_scenario_join_path(const char *dir, const char *rel, char *out, size_t n)
{
    if (rel[0] == '/')
        return snprintf(out, n, "%s", rel) >= (int)n;
    while (rel[0] == '.' && rel[1] == '/')
        rel += 2;
    const char *sep = dir[0] && dir[strlen(dir) - 1] == '/' ? "" : "/";
    return snprintf(out, n, "%s%s%s", dir, sep, rel) >= (int)n;
}

int vl_scenario_assign_path(const vl_slot *t, const char *text, const char *dir,
                            const vl_where *w, vl_status *st)
{
    char full[VL_PATH_MAX];
    if (!text[0])
        return vl_scenario_fail_at(st, w, "%s must name a file, not be empty", t->key);
    if (vl_scenario_join_path(dir, text, full, sizeof full))
        return vl_scenario_fail_at(st, w, "%s: path longer than %d bytes", t->key,
                                   VL_PATH_MAX - 1);
    memcpy(t->at, full, strlen(full) + 1);
    return VL_OK;
}

int vl_scenario_current_dir(char *buf, size_t n, vl_status *st)
{
    if (getcwd(buf, n))
        return VL_OK;
    return vl_fail(st, VL_ERR_IO, "", 0, "cannot determine the current folder: %s",
                   strerror(errno));
}

void vl_scenario_store_default(const vl_slot *t)
{
    const vl_param *p = t->p;
    switch (p->type) {
    case VL_PT_REAL:
        *(double *)t->at = p->def * p->to_si;
        if (t->file_value)
            *t->file_value = p->def;
        break;
    case VL_PT_INT: *(long *)t->at = (long)p->def; break;
    case VL_PT_BOOL: *(int *)t->at = p->def != 0.0; break;
    case VL_PT_CHOICE: *(int *)t->at = (int)p->def; break;
    default: snprintf(t->at, VL_PATH_MAX, "%s", p->def_str ? p->def_str : ""); break;
    }
}

/* ------------------------------------------------------------------ reading a setting */

const char *vl_scenario_type_word(int type)
{
    switch (type) {
    case CONFIG_TYPE_INT:
    case CONFIG_TYPE_INT64: return "an integer";
    case CONFIG_TYPE_FLOAT: return "a real number";
    case CONFIG_TYPE_STRING: return "a string";
    case CONFIG_TYPE_BOOL: return "true/false";
    case CONFIG_TYPE_GROUP: return "a group";
    case CONFIG_TYPE_ARRAY: return "an array";
    case CONFIG_TYPE_LIST: return "a list";
    default: return "an unknown kind of value";
    }
}

/* A real from a numeric setting; 0 if s is not numeric. */
static int setting_real(const config_setting_t *s, double *v)
{
    switch (config_setting_type(s)) {
    case CONFIG_TYPE_INT: *v = (double)config_setting_get_int(s); return 1;
    case CONFIG_TYPE_INT64: *v = (double)config_setting_get_int64(s); return 1;
    case CONFIG_TYPE_FLOAT: *v = config_setting_get_float(s); return 1;
    default: return 0;
    }
}

/* Reads a REAL or INT row from s. */
static int read_number(const config_setting_t *s, const vl_slot *t, const vl_where *w,
                       vl_status *st)
{
    const vl_param *p = t->p;
    int type = config_setting_type(s);
    double v;
    if (p->type == VL_PT_REAL) {
        if (!setting_real(s, &v))
            return vl_scenario_fail_at(st, w, "%s must be a number%s%s, not %s", t->key,
                                       p->unit && p->unit[0] ? " in " : "", vl_scenario_unit(p),
                                       vl_scenario_type_word(type));
        return vl_scenario_assign_real(t, v, w, st);
    }
    if (type == CONFIG_TYPE_INT)
        return vl_scenario_assign_int(t, config_setting_get_int(s), w, st);
    if (type == CONFIG_TYPE_INT64)
        return vl_scenario_assign_int(t, (long)config_setting_get_int64(s), w, st);
    if (type == CONFIG_TYPE_FLOAT)
        return vl_scenario_fail_at(st, w,
                                   "%s must be a whole number written without a decimal point "
                                   "or exponent (got %.10g)",
                                   t->key, config_setting_get_float(s));
    return vl_scenario_fail_at(st, w, "%s must be a whole number, not %s", t->key,
                               vl_scenario_type_word(type));
}

/* Reads a BOOL, CHOICE or PATH row from s. */
static int read_word(const config_setting_t *s, const vl_slot *t, const char *dir,
                     const vl_where *w, vl_status *st)
{
    const vl_param *p = t->p;
    int type = config_setting_type(s);
    char list[512];
    if (p->type == VL_PT_BOOL) {
        if (type != CONFIG_TYPE_BOOL)
            return vl_scenario_fail_at(st, w, "%s must be true or false, not %s", t->key,
                                       vl_scenario_type_word(type));
        *(int *)t->at = config_setting_get_bool(s) != 0;
        return VL_OK;
    }
    if (p->type == VL_PT_CHOICE) {
        if (type == CONFIG_TYPE_STRING)
            return vl_scenario_assign_choice(t, config_setting_get_string(s), w, st);
        vl_scenario_list_text(p->choices, "or", list, sizeof list);
        return vl_scenario_fail_at(st, w, "%s must be a quoted name: %s; not %s", t->key, list,
                                   vl_scenario_type_word(type));
    }
    if (type != CONFIG_TYPE_STRING)
        return vl_scenario_fail_at(st, w, "%s must be a quoted file path, not %s", t->key,
                                   vl_scenario_type_word(type));
    return vl_scenario_assign_path(t, config_setting_get_string(s), dir, w, st);
}

/* 1 if a setting of this type holds several values (group, array, list). */
static int compound(int type)
{
    return type == CONFIG_TYPE_GROUP || type == CONFIG_TYPE_ARRAY || type == CONFIG_TYPE_LIST;
}

int vl_scenario_read_value(const config_setting_t *s, const vl_slot *t, const char *dir,
                           const vl_where *w, vl_status *st)
{
    int type = config_setting_type(s);
    if (compound(type))
        return vl_scenario_fail_at(st, w, "%s must be a single value, not %s", t->key,
                                   vl_scenario_type_word(type));
    if (t->p->type == VL_PT_REAL || t->p->type == VL_PT_INT)
        return read_number(s, t, w, st);
    return read_word(s, t, dir, w, st);
}

int vl_scenario_read_text(const config_setting_t *s, const char *key, const char *what,
                          char *buf, size_t n, const vl_where *w, vl_status *st)
{
    int type = config_setting_type(s);
    if (type != CONFIG_TYPE_STRING)
        return vl_scenario_fail_at(st, w, "%s must be %s in double quotes, not %s", key, what,
                                   vl_scenario_type_word(type));
    const char *text = config_setting_get_string(s);
    size_t len = strlen(text);
    if (len == 0)
        return vl_scenario_fail_at(st, w, "%s must name %s, not be empty", key, what);
    char shown[VL_EXCERPT_SIZE];
    if (len >= n)
        return vl_scenario_fail_at(st, w, "%s: \"%s\" is longer than %zu bytes", key,
                                   vl_text_excerpt(text, len, shown, sizeof shown), n - 1);
    for (size_t i = 0; i < len; i++) /* names are printable ASCII: messages quote them */
        if (text[i] <= ' ' || text[i] > '~')
            return vl_scenario_fail_at(st, w, "%s: \"%s\" is not %s (a space, control "
                                       "character or non-ASCII byte at byte %zu)", key,
                                       vl_text_excerpt(text, len, shown, sizeof shown), what,
                                       i + 1);
    memcpy(buf, text, len + 1);
    return VL_OK;
}
