/* compare_groups.c: the topics of `volev compare`'s table (compare.h) and the numerical
 * resolution of each quantity, below which a value is round-off and a ratio with it
 * means nothing (docs/figures.md, "The table of volev compare").
 *
 * A summary row is placed by the most specific rule its name matches: a rule is a name
 * pattern with at most one '*' (any text, or none), and the rule with the longest fixed
 * text wins (so final_space_* before final_*, and final_*_d before final_*). Within a
 * topic rows keep the order of the rules, then of the summary. */
#include <float.h>
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "compare.h"
#include "volev/reservoir.h"

static const struct {
    const char *heading, *id;
} groups[VL_NCOMPARE_GROUPS] = {
    {"final state", "final_state"},
    {"water and escape budgets (time integrals of the process fluxes)", "budgets"},
    {"redox budget (oxygen equivalents)", "redox"},
    {"isotopes (deuterium)", "isotopes"},
    {"time in regimes and first events", "regimes_events"},
    {"other quantities", "other"},
    {"conservation, numerics and cost", "numerics"},
};

/* The rules, in the order rows are shown within their topic. */
static const struct {
    const char *pattern;
    int group;
} rules[] = {
    {"final:regime", VL_CG_FINAL},
    {"final:surface_temp_k", VL_CG_FINAL},
    {"final:p_surf_bar", VL_CG_FINAL},
    {"final_surface_water_to", VL_CG_FINAL},
    {"final_o2", VL_CG_FINAL},
    {"final_co2", VL_CG_FINAL},
    {"final_co2_mole_fraction", VL_CG_FINAL},
    {"final_ocean_co2", VL_CG_FINAL},
    {"final_*", VL_CG_FINAL},
    {"water_lost_to_space", VL_CG_BUDGET},
    {"final_space_*", VL_CG_BUDGET},
    {"total_*", VL_CG_BUDGET},
    {"redox_surface_*", VL_CG_REDOX},
    {"redox_to_*", VL_CG_REDOX},
    {"total_redox_*", VL_CG_REDOX},
    {"final_dh_water", VL_CG_ISOTOPE},
    {"dh_enrichment", VL_CG_ISOTOPE},
    {"final_*_d", VL_CG_ISOTOPE},
    {"time_*", VL_CG_TIMES},
    {"first_*", VL_CG_TIMES},
    {"residual_*", VL_CG_NUMERICS},
    {"redox_residual", VL_CG_NUMERICS},
    {"redox_attribution_residual", VL_CG_NUMERICS},
    {"reservoir_overshoot*", VL_CG_NUMERICS},
    {"rhs_evaluations", VL_CG_NUMERICS},
    {"steps", VL_CG_NUMERICS},
    {"events", VL_CG_NUMERICS},
    {"climate_table_*", VL_CG_NUMERICS},
    {"wall_time_s", VL_CG_NUMERICS},
};
enum { NRULES = sizeof rules / sizeof rules[0] };

const char *vl_compare_group_heading(int group) { return groups[group].heading; }
const char *vl_compare_group_id(int group) { return groups[group].id; }

/* Length of pattern's fixed text if name matches it, else -1. */
static int match(const char *pattern, const char *name)
{
    const char *star = strchr(pattern, '*');
    size_t lp = strlen(pattern), ln = strlen(name);
    if (!star)
        return strcmp(pattern, name) == 0 ? (int)lp : -1;
    size_t head = (size_t)(star - pattern), tail = lp - head - 1;
    if (ln < head + tail || strncmp(name, pattern, head) != 0 ||
        strcmp(name + ln - tail, star + 1) != 0)
        return -1;
    return (int)(head + tail);
}

int vl_compare_group_of(const char *name, const char *unit, int *rank)
{
    (void)unit; /* a name places its row whatever the unit (kg and TO rows side by side) */
    int best = -1, fixed = -1;
    for (int r = 0; r < NRULES; r++) {
        int m = match(rules[r].pattern, name);
        if (m > fixed) {
            fixed = m;
            best = r;
        }
    }
    *rank = best >= 0 ? best : NRULES;
    return best >= 0 ? rules[best].group : VL_CG_OTHER;
}

/* ---------------------------------------------------------------- resolution */

/* The reservoir whose final mass row is name (final_<reservoir>, kg), or -1. */
static int reservoir_of_row(const char *name, const char *unit)
{
    if (strcmp(unit, "kg") != 0 || strncmp(name, "final_", 6) != 0)
        return -1;
    for (int r = 0; r < VL_NRES; r++)
        if (strcmp(name + 6, vl_reservoir_name(r)) == 0)
            return r;
    return -1;
}

/* Summary rows computed from one reservoir's final mass (output/summary.c): they carry
 * no information once it is below its floor. final_dh_water is not among them: it keeps
 * the ratio of the last water above the floor. */
static const struct {
    const char *name, *unit;
    int reservoir;
} derived[] = {
    {"final_surface_water_to", "TO", VL_R_WATER},
    {"final_o2", "bar", VL_R_O2},
    {"final_co2", "bar", VL_R_CO2},
    {"final_co2_mole_fraction", "ppmv", VL_R_CO2},
    {"final_ocean_co2", "kg", VL_R_CO2},
};

/* Run k's final mass of reservoir r as its summary gives it: 1 at or above the floor,
 * 0 below, -1 when the summary lacks the row. */
static int reservoir_above_floor(const vl_compare_run *run, int r)
{
    char name[64];
    snprintf(name, sizeof name, "final_%s", vl_reservoir_name(r));
    for (size_t j = 0; j < run->nq; j++)
        if (strcmp(run->q[j].name, name) == 0 && strcmp(run->q[j].unit, "kg") == 0)
            return run->q[j].v >= vl_reservoir_floor(r);
    return -1;
}

/* The rule for any other value: a normal number (a subnormal one, like 1.5e-318, is
 * what is left of a quantity that decayed to nothing) of at least 1e-30 of the largest
 * magnitude of the row over the runs (more than the 16 decades double precision holds
 * on any sum that mixed the two). */
static int above_relative_floor(double v, double largest)
{
    double a = fabs(v);
    return isfinite(v) && a >= DBL_MIN && a >= 1e-30 * largest;
}

int vl_compare_resolved(const vl_compare_table *t, size_t i, int k)
{
    const vl_compare_quantity *q = vl_compare_cell(t, i, k);
    if (!q || q->categorical || !isfinite(q->v))
        return 0;
    int r = reservoir_of_row(q->name, q->unit);
    if (r >= 0)
        return q->v >= vl_reservoir_floor(r);
    for (size_t d = 0; d < sizeof derived / sizeof derived[0]; d++)
        if (strcmp(q->name, derived[d].name) == 0 && strcmp(q->unit, derived[d].unit) == 0) {
            int above = reservoir_above_floor(&t->runs[k], derived[d].reservoir);
            if (above == 0)
                return 0;
        }
    double largest = 0.0;
    for (int j = 0; j < t->nruns; j++) {
        const vl_compare_quantity *o = vl_compare_cell(t, i, j);
        if (o && isfinite(o->v) && fabs(o->v) > largest)
            largest = fabs(o->v);
    }
    return above_relative_floor(q->v, largest);
}

int vl_compare_event_resolved(const vl_compare_table *t, size_t i, int k)
{
    const vl_compare_event *e = vl_compare_event_cell(t, i, k);
    return e && isfinite(e->t) && e->t >= DBL_MIN;
}
