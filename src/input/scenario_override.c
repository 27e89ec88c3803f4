/* scenario_override.c: --set KEY=VALUE (scenario.h): the value is parsed as text for the
 * key's row and stored through the same checks as a value read from the file. */
#include <ctype.h>
#include <errno.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "scenario_internal.h"

/* Copies text without surrounding white space into buf; 0 if it does not fit. */
static int trimmed(const char *text, size_t len, char *buf, size_t n)
{
    while (len && isspace((unsigned char)*text)) {
        text++;
        len--;
    }
    while (len && isspace((unsigned char)text[len - 1]))
        len--;
    if (len >= n)
        return 0;
    memcpy(buf, text, len);
    buf[len] = '\0';
    return 1;
}

/* Drops one pair of surrounding double quotes. */
static char *unquoted(char *v)
{
    size_t len = strlen(v);
    if (len >= 2 && v[0] == '"' && v[len - 1] == '"') {
        v[len - 1] = '\0';
        return v + 1;
    }
    return v;
}

/* Parses a real or whole number for t and stores it. */
static int assign_number(const vl_slot *t, char *value, const vl_where *w, vl_status *st)
{
    char *end;
    errno = 0;
    if (t->p->type == VL_PT_REAL) {
        double v = strtod(value, &end);
        if (end == value || *end)
            return vl_scenario_fail_at(st, w, "'%s' is not a number", value);
        return vl_scenario_assign_real(t, v, w, st);
    }
    long v = strtol(value, &end, 10);
    if (end == value || *end)
        return vl_scenario_fail_at(st, w, "'%s' is not a whole number", value);
    if (errno == ERANGE)
        return vl_scenario_fail_at(st, w, "'%s' is too large", value);
    return vl_scenario_assign_int(t, v, w, st);
}

/* Parses an override value for t and stores it. */
static int assign_text(const vl_slot *t, char *value, const vl_where *w, vl_status *st)
{
    char cwd[VL_PATH_MAX];
    switch (t->p->type) {
    case VL_PT_REAL:
    case VL_PT_INT: return assign_number(t, value, w, st);
    case VL_PT_BOOL:
        if (strcasecmp(value, "true") && strcasecmp(value, "false"))
            return vl_scenario_fail_at(st, w, "'%s' is not true or false", value);
        *(int *)t->at = strcasecmp(value, "true") == 0;
        return VL_OK;
    case VL_PT_CHOICE: return vl_scenario_assign_choice(t, unquoted(value), w, st);
    default: {
        int rc = vl_scenario_current_dir(cwd, sizeof cwd, st);
        return rc ? rc : vl_scenario_assign_path(t, unquoted(value), cwd, w, st);
    }
    }
}

/* Applies "KEY=VALUE"; relative paths resolve against the current folder, where the
 * command was typed. */
int vl_scenario_override(vl_scenario *sc, const char *assignment, vl_status *st)
{
    char key[VL_SCENARIO_KEY_MAX], value[VL_PATH_MAX + 2], hint[VL_SCENARIO_KEY_MAX + 32];
    const char *eq = strchr(assignment, '=');
    if (!eq || !trimmed(assignment, (size_t)(eq - assignment), key, sizeof key) || !key[0])
        return vl_fail(st, VL_ERR_INPUT, "", 0, "--set %s: expected KEY=VALUE", assignment);
    vl_where w = {NULL, 0, key};
    if (!trimmed(eq + 1, strlen(eq + 1), value, sizeof value))
        return vl_scenario_fail_at(st, &w, "value longer than %d bytes", VL_PATH_MAX);
    long i = vl_scenario_find_key(key);
    if (i < 0 && vl_scenario_is_group(key))
        return vl_scenario_fail_at(st, &w, "'%s' is a group, not a parameter", key);
    if (i < 0) {
        vl_scenario_suggest(key, 0, hint, sizeof hint);
        return vl_scenario_fail_at(st, &w, "unknown key '%s'%s", key, hint);
    }
    vl_slot t = vl_scenario_row_slot(sc, (size_t)i);
    int rc = assign_text(&t, value, &w, st);
    if (rc == VL_OK)
        vl_scenario_mark(sc, (size_t)i, VL_FROM_OVERRIDE, 0);
    return rc;
}
