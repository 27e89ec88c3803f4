/* registry.c: the table of every process (processes.def) and the check of what each
 * declares it may do to the state. */
#include <stdio.h>
#include <string.h>

#include "volev/process.h"

#define VL_PROCESS(name) extern const vl_process vl_process_##name;
#include "processes.def"
#undef VL_PROCESS

const vl_process *const vl_processes[] = {
#define VL_PROCESS(name) &vl_process_##name,
#include "processes.def"
#undef VL_PROCESS
};

const size_t vl_nprocesses = sizeof vl_processes / sizeof vl_processes[0];

int vl_process_find(const char *name)
{
    for (size_t i = 0; i < vl_nprocesses; i++)
        if (strcmp(vl_processes[i]->name, name) == 0)
            return (int)i;
    return -1;
}

static int valid_reservoir(int r) { return r >= 0 && r < VL_NRES; }

/* Transfer k of p: two distinct, valid reservoirs of the same element make-up. */
static int check_transfer(const vl_process *p, size_t k, vl_status *st)
{
    int from = p->transfers[k].from, to = p->transfers[k].to;
    if (!valid_reservoir(from) || !valid_reservoir(to) || from == to)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0,
                       "process '%s': transfer %zu names reservoirs %d -> %d", p->name, k, from,
                       to);
    if (vl_move_check(from, to))
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0,
                       "process '%s': transfer %zu (%s -> %s) does not conserve every "
                       "element: the two reservoirs differ in make-up",
                       p->name, k, vl_reservoir_name(from), vl_reservoir_name(to));
    return VL_OK;
}

/* Reaction k of p: valid reservoirs, at least one term consumed, every element balanced. */
static int check_reaction(const vl_process *p, size_t k, vl_status *st)
{
    const vl_reaction *r = &p->reactions[k];
    int consumed = 0;
    if (r->n < 2 || r->n > VL_REACTION_MAX)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "process '%s': reaction '%s' has %d terms",
                       p->name, r->name, r->n);
    for (int i = 0; i < r->n; i++) {
        if (!valid_reservoir(r->res[i]))
            return vl_fail(st, VL_ERR_INTERNAL, NULL, 0,
                           "process '%s': reaction '%s' names reservoir %d", p->name, r->name,
                           r->res[i]);
        consumed |= r->nu[i] < 0.0;
    }
    char why[256];
    if (!consumed)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0,
                       "process '%s': reaction '%s' consumes nothing", p->name, r->name);
    if (vl_reaction_check(r, why, sizeof why))
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "process '%s': %s", p->name, why);
    return VL_OK;
}

int vl_process_check_declarations(const vl_process *p, vl_status *st)
{
    for (size_t k = 0; k < p->ntransfers; k++)
        if (check_transfer(p, k, st) != VL_OK)
            return st->code;
    for (size_t k = 0; k < p->nreactions; k++)
        if (check_reaction(p, k, st) != VL_OK)
            return st->code;
    return VL_OK;
}
