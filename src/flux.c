/* flux.c: transfers, reactions and the element ledger (flux.h). */
#include "volev/flux.h"

#include <math.h>
#include <stdio.h>

/* Linear below the floor and continued below zero, so that an integrator overshoot
 * past zero is pulled back (the flow reverses) instead of freezing a negative mass. */
double vl_flux_ramp(int r, double m_kg)
{
    double fl = vl_reservoir_floor(r);
    return m_kg >= fl ? 1.0 : m_kg / fl;
}

double vl_flux_move(vl_flux *fx, int from, int to, double kg_s, int col)
{
    double rate = kg_s * vl_flux_ramp(from, fx->y[from]);
    fx->dydt[from] -= rate;
    fx->dydt[to] += rate;
    if (fx->columns && col >= 0)
        fx->columns[fx->col_base + (size_t)col] += rate;
    return rate;
}

double vl_flux_react(vl_flux *fx, const vl_reaction *r, double mol_s, int col)
{
    double lim = 1.0;
    for (int i = 0; i < r->n; i++)
        if (r->nu[i] < 0.0) {
            double k = vl_flux_ramp(r->res[i], fx->y[r->res[i]]);
            if (k < lim)
                lim = k;
        }
    double rate = mol_s * lim;
    for (int i = 0; i < r->n; i++)
        fx->dydt[r->res[i]] +=
            r->nu[i] * vl_species_molar_mass(vl_reservoir_species(r->res[i])) * rate;
    if (fx->columns && col >= 0)
        fx->columns[fx->col_base + (size_t)col] +=
            fabs(r->nu[0]) * vl_species_molar_mass(vl_reservoir_species(r->res[0])) * rate;
    return rate;
}

int vl_reaction_check(const vl_reaction *r, char *why, size_t n)
{
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double net = 0.0, gross = 0.0;
        for (int i = 0; i < r->n; i++) {
            double a = r->nu[i] * vl_species_atoms(vl_reservoir_species(r->res[i]), el);
            net += a;
            gross += fabs(a);
        }
        if (fabs(net) > 1e-12 * (gross > 0.0 ? gross : 1.0)) {
            snprintf(why, n, "reaction '%s' does not balance %s (net %g atoms)", r->name,
                     vl_element_name(el), net);
            return 1;
        }
    }
    return 0;
}

int vl_move_check(int from, int to)
{
    for (int el = 0; el < VL_NELEMENTS; el++)
        if (fabs(vl_reservoir_element_fraction(from, el) -
                 vl_reservoir_element_fraction(to, el)) > 1e-15)
            return 1;
    return 0;
}

void vl_ledger_totals(const double *y, double out[VL_NELEMENTS])
{
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double s = 0.0;
        for (int r = 0; r < VL_NRES; r++)
            s += y[r] * vl_reservoir_element_fraction(r, el);
        out[el] = s;
    }
}
