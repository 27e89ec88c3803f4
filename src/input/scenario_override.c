/* scenario_override.c: --set KEY=VALUE (scenario.h): the value is parsed as text for the
 * key's row and stored through the same checks as a value read from the file. */
#include <ctype.h>
#include <errno.h>
#include <stdlib.h>
#include <string.h>
#include <strings.h>

#include "scenario_internal.h"
#include "volev/number.h"
#include "volev/text.h"

/* text[0..len) without surrounding white space: its start, and its length in *len. */
static const char *trim(const char *text, size_t *len)
{
    while (*len && isspace((unsigned char)*text)) {
        text++;
        (*len)--;
    }
    while (*len && isspace((unsigned char)text[*len - 1]))
        (*len)--;
    return text;
}

/* Copies text without surrounding white space into buf; 0 if it does not fit. */
static int trimmed(const char *text, size_t len, char *buf, size_t n)
{
    text = trim(text, &len);
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

/* Parses a real (vl_number_parse: decimal only, no underflow) or a whole number (decimal
 * digits after an optional sign) for t and stores it. nan and inf reach the store, whose
 * message names the key. */
static int assign_number(const vl_slot *t, char *value, const vl_where *w, vl_status *st)
{
    char shown[VL_EXCERPT_SIZE], *end;
    vl_text_excerpt_str(value, shown, sizeof shown);
    if (t->p->type == VL_PT_REAL) {
        double v;
        int kind = vl_number_parse_str(value, &v);
        if (kind == VL_NUMBER_OK || kind == VL_NUMBER_WORD || kind == VL_NUMBER_OVERFLOW)
            return vl_scenario_assign_real(t, v, w, st);
        return vl_scenario_fail_at(st, w, "'%s' %s", shown, vl_number_why(kind));
    }
    size_t sign = value[0] == '-' || value[0] == '+';
    if (!value[sign] || strspn(value + sign, "0123456789") != strlen(value + sign))
        return vl_scenario_fail_at(st, w, "'%s' is not a whole number", shown);
    errno = 0;
    long v = strtol(value, &end, 10);
    if (errno == ERANGE)
        return vl_scenario_fail_at(st, w, "'%s' is too large", shown);
    return vl_scenario_assign_int(t, v, w, st);
}

/* Parses an override value for t and stores it. */
static int assign_text(const vl_slot *t, char *value, const vl_where *w, vl_status *st)
{
    char cwd[VL_PATH_MAX], shown[VL_EXCERPT_SIZE];
    switch (t->p->type) {
    case VL_PT_REAL:
    case VL_PT_INT: return assign_number(t, value, w, st);
    case VL_PT_BOOL:
        if (strcasecmp(value, "true") && strcasecmp(value, "false"))
            return vl_scenario_fail_at(st, w, "'%s' is not true or false",
                                       vl_text_excerpt_str(value, shown, sizeof shown));
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
    char key[VL_SCENARIO_KEY_MAX], value[VL_PATH_MAX + 2], shown[VL_EXCERPT_SIZE],
        msg[VL_MSG_MAX];
    const char *eq = strchr(assignment, '=');
    size_t key_len = eq ? (size_t)(eq - assignment) : 0;
    const char *key_text = trim(assignment, &key_len);
    vl_text_excerpt_str(assignment, shown, sizeof shown);
    if (!eq || key_len == 0)
        return vl_fail(st, VL_ERR_INPUT, "", 0, "--set %s: expected KEY=VALUE", shown);
    if (!trimmed(key_text, key_len, key, sizeof key)) { /* longer than any key */
        vl_text_excerpt(key_text, key_len, shown, sizeof shown);
        return vl_fail(st, VL_ERR_INPUT, "", 0, "--set %s: unknown key '%s': a full key is at "
                       "most %d bytes", shown, shown, VL_SCENARIO_KEY_MAX - 1);
    }
    vl_text_excerpt_str(key, shown, sizeof shown);
    vl_where w = {NULL, 0, shown};
    if (!trimmed(eq + 1, strlen(eq + 1), value, sizeof value))
        return vl_scenario_fail_at(st, &w, "value longer than %d bytes", VL_PATH_MAX);
    if (!vl_scenario_check_key(key, msg, sizeof msg))
        return vl_scenario_fail_at(st, &w, "%s", msg);
    long i = vl_scenario_find_key(key);
    vl_slot t = vl_scenario_row_slot(sc, (size_t)i);
    int rc = assign_text(&t, value, &w, st);
    if (rc == VL_OK)
        vl_scenario_mark(sc, (size_t)i, VL_FROM_OVERRIDE, 0);
    return rc;
}
