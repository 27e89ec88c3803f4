/* flux.c: transfers, reactions and the element ledger (flux.h). */
#include "volev/flux.h"

#include <math.h>
#include <stdio.h>
#include <stdlib.h>

/* The depletion band of reservoir r under demand kg/s (vl_flux_ramp_for). */
static double ramp_band(int r, double demand_kg_s)
{
    return fmax(vl_reservoir_floor(r), fabs(demand_kg_s) * VL_DRAIN_TIME_S);
}

/* With x = m / band: 1 for x >= 1, x (2 - x) inside the band and 2 x below zero, so that
 * an integrator overshoot past zero is pulled back (the flow reverses) instead of
 * freezing a negative mass; continuous with its first derivative. The band is the
 * reservoir's floor, or the mass the demand would remove in VL_DRAIN_TIME_S if that is
 * larger: a reservoir never empties faster than over about that time. Without this, a
 * demand of 1e5 kg/s on a 1e3 kg floor band leaves a millisecond time scale that a
 * float clock at 1e14-1e17 s (resolution 0.02-64 s) cannot step through, and the stiff
 * stepper fails (seen with O2 pickup on dry planets). */
static double ramp_of(double x) { return x >= 1.0 ? 1.0 : x > 0.0 ? x * (2.0 - x) : 2.0 * x; }

double vl_flux_ramp_for(int r, double m_kg, double demand_kg_s)
{
    return ramp_of(m_kg / ramp_band(r, demand_kg_s));
}

double vl_flux_ramp(int r, double m_kg) { return vl_flux_ramp_for(r, m_kg, 0.0); }

/* The share of a reversed flow that its giver r can supply. A flow reverses when the
 * ramp of a source the integrator carried below zero turns negative (above): the
 * receiving end then gives back, and a giver is a source like any other, so its own
 * ramp at the reversed rate kg_s applies, never below 0: a reversal never takes from an
 * empty reservoir (nor from one below zero: reversals do not chain), and the dip then
 * stays as it is, within the tolerances that let it happen. Without this a reversal
 * made matter out of nothing: 2.2e7 kg of O2 left below zero after 8e18 kg of it had
 * gone into rock and, last, into water by H2 oxidation (below the 8e11 kg that rel_tol
 * allows a reservoir that held 8e18 kg) reversed the Jeans escape of oxygen a gigayear
 * later at 44 kg/s and took 1.2e6 kg from a space_o that never held any (campaign
 * member 29, issue 18). Space is read only here, and only by such a reversal. */
static double give_back(const vl_flux *fx, int r, double kg_s)
{
    double g = vl_flux_ramp_for(r, fx->y[r], kg_s);
    return g > 0.0 ? g : 0.0;
}

/* The share of a reaction run backwards at rate mol/s (< 0) that its products can give
 * back: the scarcest one's (give_back). */
static double products_give(const vl_flux *fx, const vl_reaction *r, double rate)
{
    double g = 1.0;
    for (int i = 0; i < r->n; i++)
        if (r->nu[i] > 0.0) {
            int res = r->res[i];
            double kg_s = -r->nu[i] * vl_species_molar_mass(vl_reservoir_species(res)) * rate;
            g = fmin(g, give_back(fx, res, kg_s));
        }
    return g;
}

/* Deuterium carried by hydrogen leaving reservoir `from` at rate kg/s (of `from`'s
 * species; demand kg/s before the depletion ramp): the same share of its deuterium
 * companion, times the fractionation factor f_d (D/H of the flux over D/H of the
 * source). 0 for a reservoir without deuterium. The share rate / m tends to
 * 2 demand / band as the carrier's mass m empties (vl_flux_ramp_for), and keeps that
 * value at and below zero: the companion follows its carrier out even once the carrier
 * itself has overshot, and the share is continuous in m. A companion the integrator has
 * carried below zero (a step that overshot a draining reservoir) gives a negative
 * share: the deuterium flows back from where the hydrogen goes (restore_share), so the
 * dip relaxes to zero at the hydrogen's own rate, as the ramp does for masses, instead
 * of staying frozen and showing in the written residual (docs/hardening.md, "Physical
 * invariants"). */
static double deuterium_out(const vl_flux *fx, int from, double rate, double demand,
                            double f_d)
{
    int d = vl_reservoir_deuterium(from);
    if (d < 0)
        return 0.0;
    double m = fx->y[from];
    double share = m > 0.0 ? rate / m : 2.0 * fabs(demand) / ramp_band(from, demand);
    return f_d * share * fx->y[d];
}

/* The share of a flow-back (a negative deuterium_out of `from`) that deuterium
 * companion `dto` can give: 1 while it holds at least the deficit, x (2 - x) with
 * x = held / deficit below that, 0 once it is empty. So a flow-back never drives a
 * small companion (the D of a trace H2) below zero in turn; the dip then waits for the
 * companion to refill. 1 when `from` is not in deficit. */
static double restore_share(const vl_flux *fx, int from, int dto)
{
    int d = vl_reservoir_deuterium(from);
    if (d < 0 || dto < 0 || !(fx->y[d] < 0.0))
        return 1.0;
    return fmax(ramp_of(fx->y[dto] / -fx->y[d]), 0.0); /* the ramp with the deficit as band */
}

/* A declaration index outside the process's tables is a programming error that the
 * model's build-time check cannot see: stop loudly rather than move mass unchecked. */
static void undeclared(const char *what, int k, size_t n)
{
    fprintf(stderr, "volev: internal error: %s %d used, %zu declared\n", what, k, n);
    abort();
}

double vl_flux_transfer(vl_flux *fx, int k, double kg_s, int col)
{
    return vl_flux_transfer_f(fx, k, kg_s, col, 1.0);
}

double vl_flux_transfer_f(vl_flux *fx, int k, double kg_s, int col, double f_d)
{
    if (k < 0 || (size_t)k >= fx->ntransfers)
        undeclared("transfer", k, fx->ntransfers);
    int from = fx->transfers[k].from, to = fx->transfers[k].to;
    double rate = kg_s * vl_flux_ramp_for(from, fx->y[from], kg_s);
    if (kg_s > 0.0 && rate < 0.0) /* reversed by the ramp: `to` gives back what it can */
        rate *= give_back(fx, to, -rate);
    fx->dydt[from] -= rate;
    fx->dydt[to] += rate;
    int dto = vl_reservoir_deuterium(to), dfrom = vl_reservoir_deuterium(from);
    if (dfrom >= 0 && dto >= 0) {
        double d = deuterium_out(fx, from, rate, kg_s, f_d) * restore_share(fx, from, dto);
        fx->dydt[dfrom] -= d;
        fx->dydt[dto] += d;
    }
    if (fx->columns && col >= 0)
        fx->columns[fx->col_base + (size_t)col] += rate;
    return rate;
}

double vl_flux_react(vl_flux *fx, int k, double mol_s, int col)
{
    return vl_flux_react_f(fx, k, mol_s, col, 1.0);
}

void vl_flux_add_column(vl_flux *fx, int col, double kg_s)
{
    if (fx->columns && col >= 0)
        fx->columns[fx->col_base + (size_t)col] += kg_s;
}

/* restore_share over the H-bearing products of r: the smallest. */
static double product_share(const vl_flux *fx, const vl_reaction *r, int from)
{
    double share = 1.0;
    for (int i = 0; i < r->n; i++)
        if (r->nu[i] > 0.0 && vl_species_atoms(vl_reservoir_species(r->res[i]), VL_EL_H) > 0)
            share = fmin(share, restore_share(fx, from, vl_reservoir_deuterium(r->res[i])));
    return share;
}

double vl_flux_react_f(vl_flux *fx, int k, double mol_s, int col, double f_d)
{
    if (k < 0 || (size_t)k >= fx->nreactions)
        undeclared("reaction", k, fx->nreactions);
    const vl_reaction *r = &fx->reactions[k];
    double lim = 1.0;
    for (int i = 0; i < r->n; i++)
        if (r->nu[i] < 0.0) {
            int res = r->res[i];
            double demand = -r->nu[i] * vl_species_molar_mass(vl_reservoir_species(res)) * mol_s;
            double ramp = vl_flux_ramp_for(res, fx->y[res], demand);
            if (ramp < lim)
                lim = ramp;
        }
    double rate = mol_s * lim;
    if (mol_s > 0.0 && rate < 0.0) /* reversed by a ramp: the products give back */
        rate *= products_give(fx, r, rate);
    double d_total = 0.0, h_products = 0.0;
    for (int i = 0; i < r->n; i++) {
        int res = r->res[i];
        double kg = r->nu[i] * vl_species_molar_mass(vl_reservoir_species(res)) * rate;
        fx->dydt[res] += kg;
        int d = vl_reservoir_deuterium(res);
        if (d < 0)
            continue;
        if (r->nu[i] < 0.0) { /* deuterium leaves with the hydrogen of a reactant */
            double demand = -r->nu[i] * vl_species_molar_mass(vl_reservoir_species(res)) * mol_s;
            double out = deuterium_out(fx, res, -kg, demand, f_d) * product_share(fx, r, res);
            fx->dydt[d] -= out;
            d_total += out;
        } else {
            h_products += r->nu[i] * vl_species_atoms(vl_reservoir_species(res), VL_EL_H);
        }
    }
    for (int i = 0; i < r->n && h_products > 0.0; i++) { /* ... and goes with it */
        int d = vl_reservoir_deuterium(r->res[i]);
        if (d >= 0 && r->nu[i] > 0.0)
            fx->dydt[d] += d_total * r->nu[i] *
                           vl_species_atoms(vl_reservoir_species(r->res[i]), VL_EL_H) / h_products;
    }
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
