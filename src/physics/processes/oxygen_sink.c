/* oxygen_sink.c: uptake of atmospheric O2 by the surface (oxidation of crust and
 * reduced volcanic gases), first order: dM_O2/dt = -M_O2 / tau. */
#include <stddef.h>

#include "volev/process.h"
#include "volev/units.h"

typedef struct {
    double lifetime_s; /* tau */
} params;

static const vl_param table[] = {
    {"lifetime_myr", VL_PT_REAL, "Myr", 1e6 * VL_YR, 3.7, 1e-6, 1e6, NULL, NULL,
     offsetof(params, lifetime_s), "e-folding time of atmospheric O2 against surface uptake",
     "present O2 inventory 3.7e19 mol over geological sinks ~1e13 mol/yr (Holland 2002), from memory",
     NULL, 0},
};

static const vl_flux_column columns[] = {
    {"o2_sink_kg_s", "atmospheric O2 taken up by surface oxidation (first-order sink)"},
};

enum { O2_TO_OX_ROCK };
static const vl_transfer transfers[] = {[O2_TO_OX_ROCK] = {VL_R_O2, VL_R_OX_ROCK}};

static void rates(const void *pv, const vl_view *v, vl_flux *fx)
{
    const double *y = v->y;
    const params *p = pv;
    double o2 = y[VL_R_O2] > 0.0 ? y[VL_R_O2] : 0.0;
    vl_flux_transfer(fx, O2_TO_OX_ROCK, o2 / p->lifetime_s, 0);
}

const vl_process vl_process_oxygen_sink = {
    .name = "oxygen_sink",
    .summary = "first-order uptake of atmospheric O2 by surface oxidation",
    .refs = "Holland 2002, GCA 66:3811 (sink magnitude)",
    VL_PROCESS_TABLES(table, params, columns),
    VL_PROCESS_TRANSFERS(transfers),
    .default_enabled = 0,
    .rates = rates,
};
