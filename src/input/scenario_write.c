/* scenario_write.c: the resolved-scenario writer (every parameter after defaults and
 * overrides, as a scenario file that loads back to identical values) and the
 * `validate` listing (scenario.h). The file-unit value of every real is kept by the
 * loader (file_value): the resolved file shows each real as it was written (v * to_si /
 * to_si is often a neighbour of v) and loads back to the identical SI value. */
#include <errno.h>
#include <limits.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "scenario_internal.h"

/* ------------------------------------------------------------------ writing */

static int same_bits(double a, double b) { return memcmp(&a, &b, sizeof a) == 0; }

/* A file-unit value x with x * to_si == si exactly, searched near si / to_si (for SI
 * values stored by code other than the loader); si / to_si if there is none. */
static double preimage(double si, double to_si)
{
    double x0 = si / to_si, up = x0, down = x0;
    for (int k = 0; k < 16; k++) {
        if (same_bits(up * to_si, si))
            return up;
        if (same_bits(down * to_si, si))
            return down;
        up = nextafter(up, HUGE_VAL);
        down = nextafter(down, -HUGE_VAL);
    }
    return x0;
}

/* Row i's real in file units: the value as read when it still matches the stored SI
 * value, else one that maps onto it. */
static double file_real(const vl_scenario *sc, size_t i)
{
    const vl_param *p;
    double si = *(const double *)vl_scenario_slot(sc, i, &p), x = sc->file_value[i];
    return same_bits(x * p->to_si, si) ? x : preimage(si, p->to_si);
}

/* Row i's real in file units, as text that reads back to the same double (the shortest
 * of %.15g, %.16g, %.17g that does; %.17g always does) and that the file format reads as
 * a real (a ".0" added to an integer-looking text; a "-0" read is stored as 0). */
static void real_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    double x = file_real(sc, i);
    for (int digits = 15; digits <= 17; digits++) {
        snprintf(buf, n, "%.*g", digits, x);
        if (same_bits(strtod(buf, NULL), x))
            break;
    }
    if (!strpbrk(buf, ".eEin"))
        strncat(buf, ".0", n - strlen(buf) - 1);
}

/* s as a libconfig string literal. */
static void write_string(FILE *out, const char *s)
{
    fputc('"', out);
    for (; *s; s++) {
        unsigned char c = (unsigned char)*s;
        if (c == '"' || c == '\\')
            fprintf(out, "\\%c", c);
        else if (c == '\n')
            fputs("\\n", out);
        else if (c == '\t')
            fputs("\\t", out);
        else if (c < 0x20 || c == 0x7f)
            fprintf(out, "\\x%02x", c);
        else
            fputc(c, out);
    }
    fputc('"', out);
}

/* Row i's value as it is written in a file (PATH: unquoted). */
static void value_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const void *slot = vl_scenario_slot(sc, i, &p);
    switch (p->type) {
    case VL_PT_REAL: real_text(sc, i, buf, n); break;
    case VL_PT_INT: {
        long v = *(const long *)slot;
        snprintf(buf, n, "%ld%s", v, v < INT_MIN || v > INT_MAX ? "L" : "");
        break;
    }
    case VL_PT_BOOL:
    case VL_PT_CHOICE: vl_scenario_state_text(sc, i, buf, n); break;
    default: snprintf(buf, n, "%s", (const char *)slot); break;
    }
}

static void indent(FILE *out, int depth) { fprintf(out, "%*s", 4 * depth, ""); }

/* One `name = value;` line; rows that would not load back (their needs clause does not
 * hold, or an unset path) are written as comments. */
static void write_row(const vl_scenario *sc, FILE *out, size_t i, const char *name, int depth)
{
    const vl_param *p;
    vl_scenario_slot(sc, i, &p);
    char other[VL_SCENARIO_KEY_MAX], state[128], text[VL_PATH_MAX + 32], list[512];
    const char *values;
    int holds = vl_scenario_needs_hold(sc, i, other, sizeof other, state, sizeof state, &values);
    value_text(sc, i, text, sizeof text);
    indent(out, depth);
    if (!holds || (p->type == VL_PT_PATH && !text[0]))
        fputs("# ", out);
    fprintf(out, "%s = ", name);
    if (p->type == VL_PT_CHOICE || p->type == VL_PT_PATH)
        write_string(out, text);
    else
        fputs(text, out);
    fputc(';', out);
    if (!holds) {
        vl_scenario_list_text(values, "or", list, sizeof list);
        fprintf(out, "  (only used when %s is %s)", other, list);
    } else if (p->type == VL_PT_PATH && !text[0]) {
        fputs("  (not set)", out);
    }
    fputc('\n', out);
}

/* 1 if no row before i has a full key beginning with group. */
static int first_in_group(size_t i, const char *group)
{
    size_t len = strlen(group);
    for (size_t j = 0; j < i; j++)
        if (strncmp(vl_scenario_key(j), group, len) == 0)
            return 0;
    return 1;
}

/* Every row under prefix ("" or "a.b."), subgroups nested where they first appear. */
static void write_group(const vl_scenario *sc, FILE *out, const char *prefix, int depth)
{
    char sub[VL_SCENARIO_KEY_MAX];
    size_t plen = strlen(prefix);
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const char *key = vl_scenario_key(i);
        if (strncmp(key, prefix, plen) != 0)
            continue;
        const char *rest = key + plen, *dot = strchr(rest, '.');
        if (!dot) {
            write_row(sc, out, i, rest, depth);
            continue;
        }
        snprintf(sub, sizeof sub, "%.*s", (int)(dot - key + 1), key);
        if (!first_in_group(i, sub))
            continue;
        if (depth == 0)
            fputc('\n', out);
        indent(out, depth);
        fprintf(out, "%.*s = {\n", (int)(dot - rest), rest);
        write_group(sc, out, sub, depth + 1);
        indent(out, depth);
        fputs("};\n", out);
    }
}

/* The complete resolved scenario; reading it back gives identical values. */
int vl_scenario_write_resolved(const vl_scenario *sc, FILE *out, vl_status *st)
{
    char key[VL_SCENARIO_KEY_MAX];
    for (size_t i = 0, n = vl_param_count(); i < n; i++) {
        const vl_param *p;
        const double *v = vl_scenario_slot(sc, i, &p);
        if (p->type == VL_PT_REAL && !isfinite(*v))
            return vl_fail(st, VL_ERR_INTERNAL, "", 0, "%s is not finite",
                           vl_scenario_param_key(i, key, sizeof key) ? key : "?");
    }
    fputs("# resolved scenario written by volev\n", out);
    write_group(sc, out, "", 0);
    if (fflush(out) != 0 || ferror(out))
        return vl_fail(st, VL_ERR_IO, "", 0, "cannot write the resolved scenario: %s",
                       strerror(errno));
    return VL_OK;
}

/* ------------------------------------------------------------------ listing */

/* Where row i came from, as shown by `validate`. */
static void origin_text(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    char other[VL_SCENARIO_KEY_MAX], state[128];
    const char *values;
    if (sc->origin[i] == VL_FROM_FILE)
        snprintf(buf, n, "%s:%d", sc->path, sc->line[i]);
    else if (sc->origin[i] == VL_FROM_OVERRIDE)
        snprintf(buf, n, "--set");
    else if (sc->origin[i] == VL_FROM_MASS)
        snprintf(buf, n, "from star.mass_msun (main sequence, Eker et al. 2018)");
    else if (!vl_scenario_needs_hold(sc, i, other, sizeof other, state, sizeof state, &values))
        snprintf(buf, n, "default, unused");
    else
        snprintf(buf, n, "default");
}

/* Row i's value in file units with its unit (reals with 10 digits). */
static void shown_value(const vl_scenario *sc, size_t i, char *buf, size_t n)
{
    const vl_param *p;
    const void *slot = vl_scenario_slot(sc, i, &p);
    if (p->type == VL_PT_REAL)
        snprintf(buf, n, "%.10g%s%s", file_real(sc, i), vl_scenario_unit_sep(p), vl_scenario_unit(p));
    else if (p->type == VL_PT_PATH && !((const char *)slot)[0])
        snprintf(buf, n, "(not set)");
    else
        value_text(sc, i, buf, n);
}

/* `key = value unit  [origin]`, one line per parameter, columns aligned. */
void vl_scenario_print(const vl_scenario *sc, FILE *out)
{
    char key[VL_SCENARIO_KEY_MAX], value[VL_PATH_MAX + 64], from[VL_PATH_MAX + 32];
    size_t n = vl_param_count();
    int wkey = 0, wval = 0;
    for (size_t i = 0; i < n; i++) {
        vl_scenario_param_key(i, key, sizeof key);
        int lk = (int)strlen(key);
        shown_value(sc, i, value, sizeof value);
        int lv = (int)strlen(value);
        wkey = lk > wkey ? lk : wkey;
        wval = lv > wval ? lv : wval;
    }
    for (size_t i = 0; i < n; i++) {
        vl_scenario_param_key(i, key, sizeof key);
        shown_value(sc, i, value, sizeof value);
        origin_text(sc, i, from, sizeof from);
        fprintf(out, "%-*s = %-*s  [%s]\n", wkey, key, wval, value, from);
    }
}
