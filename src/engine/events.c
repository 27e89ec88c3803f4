/* events.c: the event watch of a history (integrate_internal.h). The regime is a mode
 * held fixed between events; CVODE watches root functions (every armed reservoir's mass
 * above its floor, and whether the conditions still call for the regime in force) and
 * locates where one falls through zero on its interpolant. */
#include <string.h>

#include "integrate_internal.h"

/* The armed reservoirs below their floor in y (bit r). */
static unsigned long below_floor(const double *y, unsigned long armed)
{
    unsigned long ex = 0;
    for (int r = 0; r < VL_NRES; r++)
        if ((armed >> r & 1UL) && y[r] < vl_reservoir_floor(r))
            ex |= 1UL << r;
    return ex;
}

vl_signature vl_events_signature(const vl_ode *ode, double t, const double *y, int regime,
                                 unsigned long armed, double *cols)
{
    const vl_model *m = ode->m;
    vl_env env;
    vl_signature s = {0, 0};
    if (cols) {
        double dydt[VL_NSTATE];
        vl_model_rhs(m, ode->w, t, y, regime, dydt, cols, &env);
    } else {
        vl_model_env(m, ode->w, t, y, regime, &env);
    }
    s.regime = vl_model_classify(m, ode->w, y, &env);
    if (s.regime != regime) {
        /* take a change only to a regime consistent with itself: where the regime in force
         * calls for another that, evaluated in its own right, calls straight back (the
         * boundary moves with the regime, e.g. the ocean's CO2 uptake shifts the runaway
         * limit), keep the one in force instead of switching back and forth every
         * event tolerance (docs/model.md section 6) */
        vl_env other;
        vl_model_env(m, ode->w, t, y, s.regime, &other);
        if (vl_model_classify(m, ode->w, y, &other) == regime)
            s.regime = regime;
    }
    s.exhausted = below_floor(y, armed);
    return s;
}

int vl_events_same(vl_signature sig, int regime)
{
    return sig.regime == regime && sig.exhausted == 0;
}

int vl_events_settle(const vl_ode *ode, double t, const double *y, int regime)
{
    for (int pass = 0; pass < 4; pass++) {
        vl_signature s = vl_events_signature(ode, t, y, regime, 0, NULL);
        if (s.regime == regime)
            break;
        regime = s.regime;
    }
    return regime;
}

unsigned long vl_events_rearm(const double *y, unsigned long armed)
{
    for (int r = 0; r < VL_NRES; r++)
        if (y[r] > 100.0 * vl_reservoir_floor(r))
            armed |= 1UL << r;
    return armed;
}

void vl_events_roots(vl_ode *ode, double t, const double *y, double *g)
{
    for (int r = 0; r < VL_NRES; r++)
        g[r] = (ode->armed >> r & 1UL) ? y[r] - vl_reservoir_floor(r) : 1.0;
    /* the regime has no continuous margin (the column climate's regime is which branches
     * of the energy balance have a root): a sign, bracketed by CVODE on its interpolant;
     * a new regime is held run.event_tolerance before it may change again, or a state
     * that crosses a boundary both ways (the dry limit, with outgassing refilling what
     * escape drains) would switch at every round-off of the age */
    vl_signature s = vl_events_signature(ode, t, y, ode->regime, 0, ode->g_cols);
    g[VL_NRES] = s.regime == ode->regime || t < ode->hold_until ? 1.0 : -1.0;
    ode->g_regime = s.regime;
    ode->g_t = t;
    memcpy(ode->g_y, y, sizeof ode->g_y);
    ode->g_valid = 1;
}

void vl_events_directions(int *dir)
{
    for (int k = 0; k < VL_NROOTS; k++)
        dir[k] = -1;
}

vl_signature vl_events_at(vl_ode *ode, double t, const double *y, double *cols)
{
    if (!(ode->g_valid && ode->g_t == t && memcmp(ode->g_y, y, sizeof ode->g_y) == 0))
        return vl_events_signature(ode, t, y, ode->regime, ode->armed, cols);
    memcpy(cols, ode->g_cols, ode->m->ncolumns * sizeof *cols);
    return (vl_signature){ode->g_regime, below_floor(y, ode->armed)};
}
