/* summary.c: the quantities derived from a finished run (schema.h), computed once, and
 * the rows of summary.csv, declared as one table: fixed quantities and generated groups
 * (one row per reservoir, event kind, regime, flux column, element). */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "output_internal.h"
#include "volev/invariants.h"
#include "volev/output.h"
#include "volev/redox_ledger.h"
#include "volev/schema.h"
#include "volev/units.h"

static double clamp0(double v) { return v > 0.0 ? v : 0.0; }

double vl_summary_water_of_h(double h_kg)
{
    double h_per_water = 2.0 * VL_AW_H * 1e-3 / vl_species_molar_mass(VL_SP_H2O);
    return h_kg / h_per_water;
}

void vl_summary_derive(const vl_model *m, const vl_run_stats *stats, vl_summary *out)
{
    const double *y = stats->y_final;
    const vl_env *env = &stats->env_last;
    double pa = m->planet.pa_per_kg / VL_BAR, dh0 = m->sc->inventory.initial_dh;
    out->regime = env->regime;
    out->surface_water_to = clamp0(y[VL_R_WATER]) / VL_TO_KG;
    out->water_lost_to = vl_summary_water_of_h(y[VL_R_SPACE_H]) / VL_TO_KG;
    out->o2_bar = clamp0(y[VL_R_O2]) * pa;
    out->co2_bar = env->mass_kg[VL_GAS_CO2] * pa;
    out->ocean_co2_kg = clamp0(clamp0(y[VL_R_CO2]) - env->mass_kg[VL_GAS_CO2]);
    out->co2_ppmv = env->x[VL_GAS_CO2] * 1e6;
    out->surface_temp_k = env->t_surf_k;
    out->surface_pressure_bar = env->p_surf_pa / VL_BAR;
    out->dh_water = vl_output_dh(y, VL_R_WATER);
    if (isnan(out->dh_water)) /* exhausted: the ratio of its last water, if it had any */
        out->dh_water = stats->water_dh_last > 0.0 ? stats->water_dh_last : NAN;
    out->dh_enrichment = dh0 > 0.0 ? out->dh_water / dh0 : NAN; /* NaN: no value */
}

void vl_event_firsts_note(vl_event_firsts *e, const char *name, double t_s)
{
    for (int k = 0; k < e->n; k++)
        if (strcmp(e->name[k], name) == 0)
            return;
    if (e->n == VL_MAX_EVENT_KINDS)
        return;
    snprintf(e->name[e->n], sizeof e->name[0], "%s", name);
    e->t_s[e->n++] = t_s;
}

/* What a summary row is computed from. */
typedef struct {
    const vl_model *m;
    const vl_run_stats *s;
    const vl_summary *d;
    const vl_event_firsts *ev;
} ctx;

enum { REAL10, SCI3, COUNT, SECONDS };

#define REDOX_UNIT "kg O-eq"

/* One row (fixed: value) or a group of rows (group) of summary.csv; for a group, name
 * is the pattern shown in the column reference. */
typedef struct {
    const char *name, *unit;
    int format;
    const char *meaning;
    double (*value)(const ctx *c);
    int (*group)(FILE *f, const ctx *c);
} item;

/* "name,value,unit": the value through vl_output_number (no value: an empty field). */
static int row(FILE *f, const char *name, const char *unit, int format, double v)
{
    char num[64];
    if (format == COUNT && isfinite(v))
        snprintf(num, sizeof num, "%ld", (long)v);
    else
        vl_output_number(num, sizeof num,
                         format == SCI3 ? "%.3e" : format == SECONDS ? "%.6f" : "%.10g", v);
    return fprintf(f, "%s,%s,%s\n", name, num, unit);
}

static int final_reservoirs(FILE *f, const ctx *c)
{
    char name[64];
    int rc = 0;
    for (int r = 0; r < VL_NRES && rc >= 0; r++) {
        snprintf(name, sizeof name, "final_%s", vl_reservoir_name(r));
        rc = row(f, name, "kg", REAL10, clamp0(c->s->y_final[r]));
    }
    return rc;
}

/* The final state in the units of the scenario's inventory keys: rows named after the
 * key, so that `--set inventory.KEY=VALUE` starts a new run from it (as far as the
 * inventory describes a planet: what escaped, oxidised rock and ferric iron, undelivered
 * impactors and per-reservoir deuterium have no key). Masses as pressures by the
 * thin-shell rule the inputs use (planet.h: pa_per_kg). */
static int final_inventory(FILE *f, const ctx *c)
{
    static const struct {
        const char *key;
        int res, ocean; /* ocean: in TO, else in bar */
    } keys[] = {
        {"surface_water_to", VL_R_WATER, 1},      {"mantle_water_to", VL_R_MANTLE_WATER, 1},
        {"co2_bar", VL_R_CO2, 0},                 {"n2_bar", VL_R_N2, 0},
        {"o2_bar", VL_R_O2, 0},                   {"h2_bar", VL_R_H2, 0},
        {"carbonate_co2_bar", VL_R_CARBONATE, 0}, {"mantle_co2_bar", VL_R_MANTLE_C, 0},
        {"mantle_n2_bar", VL_R_MANTLE_N, 0},
    };
    char name[64];
    int rc = 0;
    double pa = c->m->planet.pa_per_kg / VL_BAR;
    for (size_t k = 0; k < sizeof keys / sizeof keys[0] && rc >= 0; k++) {
        double kg = clamp0(c->s->y_final[keys[k].res]);
        snprintf(name, sizeof name, "final_inventory.%s", keys[k].key);
        rc = row(f, name, keys[k].ocean ? "TO" : "bar", REAL10,
                 keys[k].ocean ? kg / VL_TO_KG : kg * pa);
    }
    return rc;
}

static int first_events(FILE *f, const ctx *c)
{
    char name[64];
    int rc = 0;
    for (int k = 0; k < c->ev->n && rc >= 0; k++) {
        snprintf(name, sizeof name, "first_%s", c->ev->name[k]);
        rc = row(f, name, "yr", REAL10, c->ev->t_s[k] / VL_YR);
    }
    return rc;
}

static int regime_times(FILE *f, const ctx *c)
{
    char name[64];
    int rc = 0;
    for (int r = 0; r < VL_NREGIMES && rc >= 0; r++) {
        snprintf(name, sizeof name, "time_%s", vl_regime_name(r));
        rc = row(f, name, "yr", REAL10, c->s->time_in_regime_s[r] / VL_YR);
    }
    return rc;
}

/* a flux column "x_kg_s" integrates to "total_x" (kg) */
static int channel_totals(FILE *f, const ctx *c)
{
    char name[128];
    int rc = 0;
    for (size_t k = 0; k < c->m->ncolumns && rc >= 0; k++) {
        const char *col = c->m->col_name[k];
        size_t len = strlen(col);
        int tail = len > 5 && strcmp(col + len - 5, "_kg_s") == 0;
        snprintf(name, sizeof name, "total_%.*s", (int)(tail ? len - 5 : len), col);
        if (k < c->m->nflux)
            rc = row(f, name, "kg", REAL10, clamp0(c->s->channel_kg[k]));
        else /* a redox column: signed, in O-equivalent */
            rc = row(f, name, REDOX_UNIT, REAL10, c->s->channel_kg[k]);
    }
    return rc;
}

/* on the state as written (dips below zero as 0), invariants.h's vl_residual: the start
 * holds no dip, so its written and integrated inventories are the same */
static int residuals(FILE *f, const ctx *c)
{
    char name[64];
    int rc = 0;
    for (int el = 0; el < VL_NELEMENTS && rc >= 0; el++) {
        snprintf(name, sizeof name, "residual_%s", vl_element_name(el));
        rc = row(f, name, "relative", SCI3,
                 vl_residual(&c->m->sc->run, el, c->s->totals0[el], c->s->written1[el]));
    }
    return rc;
}

/* the redox ledger (redox_ledger.h): pools from the first and the last state */
static double redox_surface0(const ctx *c) { return c->s->redox0.pool[VL_POOL_SURFACE]; }
static double redox_surface1(const ctx *c) { return c->s->redox1.pool[VL_POOL_SURFACE]; }
static double redox_change(const ctx *c, int pool)
{
    return c->s->redox1.pool[pool] - c->s->redox0.pool[pool];
}
static double redox_to_space(const ctx *c) { return -redox_change(c, VL_POOL_SPACE); }
static double redox_to_rock(const ctx *c) { return redox_change(c, VL_POOL_ROCK); }
static double redox_residual(const ctx *c)
{
    return vl_redox_residual(&c->s->redox0, &c->s->redox1);
}
/* the surface's change against the sum of the redox columns' trapezoid integrals, over
 * the ledger's gross scale */
static double redox_attribution(const ctx *c)
{
    double sum = 0.0;
    for (size_t k = c->m->nflux; k < c->m->ncolumns; k++)
        sum += c->s->channel_kg[k];
    return vl_redox_relative(redox_change(c, VL_POOL_SURFACE) - sum, &c->s->redox0,
                             &c->s->redox1);
}

static double water(const ctx *c) { return c->d->surface_water_to; }
static double water_lost(const ctx *c) { return c->d->water_lost_to; }
static double o2(const ctx *c) { return c->d->o2_bar; }
static double dh(const ctx *c) { return c->d->dh_water; }
static double dh_enrichment(const ctx *c) { return c->d->dh_enrichment; }
static double co2(const ctx *c) { return c->d->co2_bar; }
static double ocean_co2(const ctx *c) { return c->d->ocean_co2_kg; }
static double co2_ppmv(const ctx *c) { return c->d->co2_ppmv; }
/* rows and finals print overshoots below zero as 0; their largest depth is here */
static double overshoot(const ctx *c)
{
    return c->s->min_mass_kg < 0.0 ? -c->s->min_mass_kg : 0.0;
}
static double overshoot_tolerances(const ctx *c) { return c->s->overshoot_tolerances; }
static double rhs_calls(const ctx *c) { return (double)c->s->rhs_calls; }
static double steps(const ctx *c) { return (double)c->s->steps; }
static double events(const ctx *c) { return (double)c->s->events; }
static double nodes(const ctx *c) { return (double)c->s->climate_nodes; }
static double build_s(const ctx *c) { return c->s->climate_build_s; }
static double wall_s(const ctx *c) { return c->s->wall_s; }

static const item items[] = {
    {"final_<reservoir>", "kg", REAL10, "final mass of every reservoir (overshoots below 0 as 0)",
     NULL, final_reservoirs},
    {"final_surface_water_to", "TO", REAL10, "surface water left", water, NULL},
    {"final_inventory.<key>", "TO or bar", REAL10,
     "the final state in the unit of each inventory key (surface_water_to, mantle_water_to, co2_bar, n2_bar, o2_bar, h2_bar, carbonate_co2_bar, mantle_co2_bar, mantle_n2_bar; pressures of the gas alone, CO2 with the ocean's): --set inventory.<key>=<value> starts a run from it, as far as the inventory describes the planet (escaped, oxidised, ferric and undelivered stores and each reservoir's own D/H have no key)",
     NULL, final_inventory},
    {"water_lost_to_space", "TO", REAL10, "water whose hydrogen reached space, all channels",
     water_lost, NULL},
    {"final_o2", "bar", REAL10, "atmospheric O2 at the end as the pressure of the gas alone (its weight per area, m g / A, as final_co2; series.csv's p_o2_bar is its partial pressure in the mixture, which is smaller by the ratio of the mean molar mass to O2's when the air is on average lighter)",
     o2, NULL},
    {"final_dh_water", "ratio", REAL10,
     "D/H atom ratio of the surface water at the end (once exhausted: of its last water above the depletion floor); empty when there is none: no surface water above that floor at the end nor a nonzero ratio at any step before (a run that starts dry, or carries no deuterium and loses its water)", dh, NULL},
    {"dh_enrichment", "ratio", REAL10,
     "final_dh_water over inventory.initial_dh; empty when final_dh_water is, or inventory.initial_dh is 0", dh_enrichment, NULL},
    {"final_co2", "bar", REAL10, "CO2 in the air at the end (pressure of the gas alone)", co2,
     NULL},
    {"final_ocean_co2", "kg", REAL10, "CO2 dissolved in the ocean at the end", ocean_co2, NULL},
    {"final_co2_mole_fraction", "ppmv", REAL10, "CO2 mole fraction of the whole atmosphere",
     co2_ppmv, NULL},
    {"first_<event>", "yr", REAL10, "stellar age of the first event of each kind that happened",
     NULL, first_events},
    {"time_<regime>", "yr", REAL10, "time spent in each regime", NULL, regime_times},
    {"total_<flux>", "kg", REAL10,
     "time integral of each process flux column <flux>_kg_s (trapezoid over accepted steps); for a redox column redox_<process>_kg_s, total_redox_<process> in kg O-eq, signed",
     NULL, channel_totals},
    {"residual_<element>", "relative", SCI3,
     "|final - initial| / max(initial, 1e8 x resolution): the element's inventory over every reservoir, space included, as written (a dip below zero as 0); the resolution is the largest absolute tolerance of a reservoir holding the element times its mass fraction there, so an element the planet lacks is judged against the mass the integrator resolves; a run stops once the residual of the state as integrated exceeds 1e-8, and this one differs from it by the final dips written as 0 (docs/hardening.md, Physical invariants)",
     NULL, residuals},
    {"redox_surface_initial", REDOX_UNIT, REAL10,
     "redox content of the air and ocean at the start, oxygen equivalents relative to H2O, CO2 and N2 (positive: free oxidant; docs/model.md section 1)",
     redox_surface0, NULL},
    {"redox_surface_final", REDOX_UNIT, REAL10, "the same at the end", redox_surface1, NULL},
    {"redox_to_space", REDOX_UNIT, REAL10,
     "oxidant the surface gained from escape: minus the change of the escaped reservoirs' content (hydrogen lost leaves oxidant behind, oxygen lost takes it)",
     redox_to_space, NULL},
    {"redox_to_rock", REDOX_UNIT, REAL10,
     "oxidant taken up by crust, mantle and undelivered impactors: the change of their content",
     redox_to_rock, NULL},
    {"redox_residual", "relative", SCI3,
     "|change of surface + space + rock content| / gross, gross = the sum over every reservoir of |its content| at the start plus at the end (the absolute change when gross is 0): exact from the states, round-off only",
     redox_residual, NULL},
    {"redox_attribution_residual", "relative", SCI3,
     "|change of the surface's content - sum of the total_redox_<process> rows| / the same gross: the trapezoid quadrature error of the per-process attribution (not round-off)",
     redox_attribution, NULL},
    {"reservoir_overshoot", "kg", REAL10,
     "deepest integrator overshoot of a reservoir below zero in an output row (written as 0 there)", overshoot, NULL},
    {"reservoir_overshoot_tolerances", "tolerances", REAL10,
     "deepest overshoot below zero in an output row in units of its reservoir's tolerance, run.abs_tolerance_kg x floor / 1e3 kg + run.rel_tolerance x the largest mass the reservoir held; a run stops beyond 1000 (docs/hardening.md)",
     overshoot_tolerances, NULL},
    {"rhs_evaluations", "count", COUNT, "right-hand-side evaluations, Jacobians included",
     rhs_calls, NULL},
    {"steps", "count", COUNT, "accepted integrator steps", steps, NULL},
    {"events", "count", COUNT, "events logged", events, NULL},
    {"climate_table_nodes", "count", COUNT, "climate table nodes built for the run", nodes, NULL},
    {"climate_table_build_s", "s", SECONDS, "wall time spent building them", build_s, NULL},
    {"wall_time_s", "s", SECONDS, "wall time of the run", wall_s, NULL},
};

int vl_summary_write(FILE *f, const vl_model *m, const vl_run_stats *stats,
                     const vl_event_firsts *events_seen)
{
    vl_summary d;
    vl_summary_derive(m, stats, &d);
    ctx c = {m, stats, &d, events_seen};
    int rc = fprintf(f, "name,value,unit\n");
    for (size_t i = 0; i < sizeof items / sizeof items[0] && rc >= 0; i++)
        rc = items[i].group ? items[i].group(f, &c)
                            : row(f, items[i].name, items[i].unit, items[i].format,
                                  items[i].value(&c));
    return rc < 0 ? -1 : 0;
}

void vl_summary_print_reference(FILE *out)
{
    for (size_t i = 0; i < sizeof items / sizeof items[0]; i++)
        fprintf(out, "| `%s` | %s | %s |\n", items[i].name, items[i].unit, items[i].meaning);
}
