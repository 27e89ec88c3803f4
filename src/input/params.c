/* params.c: helpers over the declarative parameter tables: choice lists, edit distance,
 * one global index over the core table and every process table, and the printed
 * parameter reference (`volev processes`). */
#include "volev/params.h"

#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "volev/process.h"
#include "volev/scenario.h"

/* Prefix of each process's keys, in registry order (the registry is built from the same
 * list, so the two cannot drift apart; the loader still checks them against each other). */
static const char *const proc_prefix[] = {
#define VL_PROCESS(name) "processes." #name ".",
#include "../physics/processes/processes.def"
#undef VL_PROCESS
};
#define N_PREFIX (sizeof proc_prefix / sizeof proc_prefix[0])

/* The synthetic switch row of a process; two copies because the default differs. */
#define SWITCH_ROW(d)                                                                    \
    {"enabled", VL_PT_BOOL, "", 1.0, d, 0.0, 1.0, NULL, NULL,                            \
     offsetof(vl_process_cfg, enabled), "switch the process on or off", "", NULL, 0}
static const vl_param switch_off = SWITCH_ROW(0.0);
static const vl_param switch_on = SWITCH_ROW(1.0);

/* Index of name in the '|'-separated list choices, or -1. */
int vl_choice_index(const char *choices, const char *name)
{
    size_t len = strlen(name);
    int i = 0;
    for (const char *c = choices; c; i++) {
        const char *bar = strchr(c, '|');
        size_t n = bar ? (size_t)(bar - c) : strlen(c);
        if (n == len && strncmp(c, name, n) == 0)
            return i;
        c = bar ? bar + 1 : NULL;
    }
    return -1;
}

/* Copies choice i (or "" if there is none) into buf; returns buf. */
char *vl_choice_name(const char *choices, int i, char *buf, size_t n)
{
    const char *c = choices;
    for (int k = 0; c && k < i; k++) {
        c = strchr(c, '|');
        if (c)
            c++;
    }
    if (n == 0)
        return buf;
    buf[0] = '\0';
    if (!c || i < 0)
        return buf;
    const char *bar = strchr(c, '|');
    size_t len = bar ? (size_t)(bar - c) : strlen(c);
    if (len >= n)
        len = n - 1;
    memcpy(buf, c, len);
    buf[len] = '\0';
    return buf;
}

static size_t min3(size_t a, size_t b, size_t c)
{
    size_t m = a < b ? a : b;
    return m < c ? m : c;
}

/* Levenshtein distance (unit-cost insert, delete, substitute); SIZE_MAX if out of memory. */
size_t vl_edit_distance(const char *a, const char *b)
{
    size_t na = strlen(a), nb = strlen(b);
    size_t *row = malloc((nb + 1) * sizeof *row);
    if (!row)
        return SIZE_MAX;
    for (size_t j = 0; j <= nb; j++)
        row[j] = j;
    for (size_t i = 1; i <= na; i++) {
        size_t diag = row[0];
        row[0] = i;
        for (size_t j = 1; j <= nb; j++) {
            size_t up = row[j];
            row[j] = min3(up + 1, row[j - 1] + 1, diag + (a[i - 1] != b[j - 1]));
            diag = up;
        }
    }
    size_t d = row[nb];
    free(row);
    return d;
}

/* Core rows, then per process its switch and its table rows. */
size_t vl_param_count(void)
{
    size_t n = vl_core_nparams;
    for (size_t k = 0; k < vl_nprocesses; k++)
        n += 1 + vl_processes[k]->nparams;
    return n;
}

/* Row i of the global index; base is NULL when sc is NULL; *p is NULL if i is out of range. */
void vl_param_at(const vl_scenario *sc, size_t i, const vl_param **p, void **base,
                 const char **prefix)
{
    *p = NULL;
    *base = NULL;
    *prefix = "";
    if (i < vl_core_nparams) {
        *p = &vl_core_params[i];
        *base = (void *)sc;
        return;
    }
    i -= vl_core_nparams;
    for (size_t k = 0; k < vl_nprocesses && k < N_PREFIX; k++) {
        const vl_process *proc = vl_processes[k];
        if (i <= proc->nparams) {
            *prefix = proc_prefix[k];
            if (i == 0) {
                *p = proc->default_enabled ? &switch_on : &switch_off;
                *base = sc ? (void *)&sc->proc[k] : NULL;
            } else {
                *p = &proc->params[i - 1];
                *base = sc ? sc->proc[k].params : NULL;
            }
            return;
        }
        i -= 1 + proc->nparams;
    }
}

static const char *type_name(int type)
{
    switch (type) {
    case VL_PT_REAL: return "real";
    case VL_PT_INT: return "integer";
    case VL_PT_BOOL: return "bool";
    case VL_PT_CHOICE: return "choice";
    case VL_PT_PATH: return "path";
    default: return "?";
    }
}

/* The default of p as it would be written in a scenario file. */
static void default_text(const vl_param *p, char *buf, size_t n)
{
    char name[128];
    switch (p->type) {
    case VL_PT_REAL: snprintf(buf, n, "%g", p->def); break;
    case VL_PT_INT: snprintf(buf, n, "%.0f", p->def); break;
    case VL_PT_BOOL: snprintf(buf, n, "%s", p->def != 0.0 ? "true" : "false"); break;
    case VL_PT_CHOICE:
        snprintf(buf, n, "\"%s\"", vl_choice_name(p->choices, (int)p->def, name, sizeof name));
        break;
    default:
        snprintf(buf, n, "%s", p->def_str && p->def_str[0] ? p->def_str : "(not set)");
        break;
    }
}

/* One parameter: key, type, unit, default and range; then doc, reference, condition. */
static void print_param(FILE *out, const char *prefix, const vl_param *p)
{
    char key[512], def[160];
    snprintf(key, sizeof key, "%s%s", prefix, p->key);
    default_text(p, def, sizeof def);
    const char *unit = p->unit && p->unit[0] ? p->unit : "-";
    fprintf(out, "  %-44s %-7s %-11s default %s", key, type_name(p->type), unit, def);
    if (p->type == VL_PT_REAL || p->type == VL_PT_INT)
        fprintf(out, ", range [%g, %g]", p->lo, p->hi);
    else if (p->type == VL_PT_CHOICE)
        fprintf(out, ", one of %s", p->choices ? p->choices : "");
    fprintf(out, "%s\n", p->required ? ", required" : "");
    fprintf(out, "      %s\n", p->doc ? p->doc : "");
    if (p->ref && p->ref[0])
        fprintf(out, "      source: %s\n", p->ref);
    if (p->needs)
        fprintf(out, "      only when %s\n", p->needs);
}

/* One process: summary, references, switch default, output columns, parameters. */
static void print_process(FILE *out, size_t k, size_t first_index)
{
    const vl_process *proc = vl_processes[k];
    fprintf(out, "\nprocess %s (%s by default)\n", proc->name,
            proc->default_enabled ? "on" : "off");
    fprintf(out, "  %s\n", proc->summary ? proc->summary : "");
    if (proc->refs && proc->refs[0])
        fprintf(out, "  references: %s\n", proc->refs);
    fprintf(out, "  output columns (kg/s):");
    for (size_t c = 0; c < proc->ncolumns; c++)
        fprintf(out, "%s%s", c ? ", " : " ", proc->columns[c].name);
    fprintf(out, "%s\n", proc->ncolumns ? "" : " none");
    for (size_t j = 0; j <= proc->nparams; j++) {
        const vl_param *p;
        void *base;
        const char *prefix;
        vl_param_at(NULL, first_index + j, &p, &base, &prefix);
        print_param(out, prefix, p);
    }
}

/* The core groups, then every registered process, in registry order. */
void vl_params_print_reference(FILE *out)
{
    fprintf(out, "volev parameters: key, type, unit, default and range (in the units of the file)\n");
    fprintf(out, "\ncore groups: star, planet, inventory, climate, run\n");
    for (size_t i = 0; i < vl_core_nparams; i++)
        print_param(out, "", &vl_core_params[i]);
    size_t first = vl_core_nparams;
    for (size_t k = 0; k < vl_nprocesses; k++) {
        print_process(out, k, first);
        first += 1 + vl_processes[k]->nparams;
    }
}
