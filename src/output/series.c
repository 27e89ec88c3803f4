/* series.c: the columns of series.csv (schema.h, series.def): how each is computed, the
 * header comments and header line, and the rows. Masses and fluxes are written clamped
 * at 0: an integrator overshoot below zero (restored by the depletion ramp, at the
 * level of the tolerances) is not a mass, and fluxes are one-way by name. Every number
 * follows vl_output_number's rule: a quantity without a value is an empty field. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "volev/numfmt.h"
#include "volev/redox_ledger.h"
#include "volev/reservoir.h"
#include "volev/schema.h"
#include "volev/units.h"

static double clamp0(double v) { return v > 0.0 ? v : 0.0; }

#define BAR (1.0 / VL_BAR)

static double get_TIME(const vl_row *r) { return r->t_s / VL_YR; }
static double get_REGIME(const vl_row *r) { return r->env->regime; }
static double get_SURFACE_TEMP(const vl_row *r) { return r->env->t_surf_k; }
static double get_SURFACE_WATER(const vl_row *r) { return clamp0(r->y[VL_R_WATER]) / VL_TO_KG; }
static double get_OCEAN(const vl_row *r) { return r->env->ocean_kg / VL_TO_KG; }
static double get_P_SURF(const vl_row *r) { return r->env->p_surf_pa * BAR; }
static double get_P_H2O(const vl_row *r) { return r->env->p_pa[VL_GAS_H2O] * BAR; }
static double get_P_CO2(const vl_row *r) { return r->env->p_pa[VL_GAS_CO2] * BAR; }
static double get_P_N2(const vl_row *r) { return r->env->p_pa[VL_GAS_N2] * BAR; }
static double get_P_O2(const vl_row *r) { return r->env->p_pa[VL_GAS_O2] * BAR; }
static double get_P_H2(const vl_row *r) { return r->env->p_pa[VL_GAS_H2] * BAR; }
static double get_INSTELLATION(const vl_row *r) { return r->env->instellation; }
static double get_S_EFF(const vl_row *r) { return r->env->s_eff; }
static double get_F_XUV(const vl_row *r) { return r->env->f_xuv; }
static double get_LUMINOSITY(const vl_row *r) { return r->env->star.l_bol_w / VL_L_SUN; }
static double get_STRAT_H2O(const vl_row *r) { return r->env->f_strat; }
static double get_H_ESCAPE(const vl_row *r) { return clamp0(r->dydt[VL_R_SPACE_H]); }
static double get_O_ESCAPE(const vl_row *r) { return clamp0(r->dydt[VL_R_SPACE_O]); }
static double get_C_ESCAPE(const vl_row *r) { return clamp0(r->dydt[VL_R_SPACE_C]); }
static double get_N_ESCAPE(const vl_row *r) { return clamp0(r->dydt[VL_R_SPACE_N]); }
static double get_EXOBASE_TEMP(const vl_row *r) { return r->env->upper.t_exo_k; }
static double get_EXOBASE_ALT(const vl_row *r)
{
    return (r->env->upper.r_exo_m - r->m->planet.radius_m) * 1e-3;
}
static double get_MAGNETOPAUSE(const vl_row *r) { return r->env->upper.r_mp_rp; }
static double get_LAMBDA_H(const vl_row *r) { return r->env->escape.lambda_h; }
static double get_H_LIMIT(const vl_row *r) { return r->env->escape.h_limit; }
/* the surface CO2 less the atmospheric part the ocean partition left in env */
static double get_OCEAN_CO2(const vl_row *r)
{
    return clamp0(clamp0(r->y[VL_R_CO2]) - r->env->mass_kg[VL_GAS_CO2] - r->env->melt.co2_kg);
}
static double get_MANTLE_TEMP(const vl_row *r) { return r->y[VL_S_MANTLE_TP]; }
static double get_MELT_FRACTION(const vl_row *r)
{
    return r->env->melt.mantle_kg > 0.0 ? r->env->melt.melt_kg / r->env->melt.mantle_kg : 0.0;
}
static double get_MAGMA_DEPTH(const vl_row *r) { return r->env->melt.depth_m * 1e-3; }
static double get_MELT_WATER(const vl_row *r) { return clamp0(r->env->melt.water_kg); }
static double get_MELT_CO2(const vl_row *r) { return clamp0(r->env->melt.co2_kg); }
static double get_MANTLE_FE3(const vl_row *r) { return r->env->melt.fe3_ratio; }
/* vl_reservoir_dh: NAN (an empty field) below the water's depletion floor */
static double get_DH_WATER(const vl_row *r) { return vl_reservoir_dh(r->y, VL_R_WATER); }
static double get_DH_ENRICHMENT(const vl_row *r)
{
    double r0 = r->m->sc->inventory.initial_dh;
    return r0 > 0.0 ? vl_reservoir_dh(r->y, VL_R_WATER) / r0 : NAN;
}
/* the raw state (an overshoot below zero included): the ledger's own number */
static double get_SURFACE_OXIDANT(const vl_row *r)
{
    vl_redox_state s;
    vl_redox_pools(r->y, &s);
    return s.pool[VL_POOL_SURFACE];
}

const vl_series_column vl_series_columns[VL_NSERIES] = {
#define VL_SERIES(id, name, unit, kind, meaning) {name, unit, VL_COL_##kind, meaning, get_##id},
#include "volev/series.def"
#undef VL_SERIES
};

const char *vl_series_name(int id) { return vl_series_columns[id].name; }

void vl_series_codes(int id, char *buf, size_t n)
{
    static const char *const limits[] = {"diffusion", "jeans", "energy"};
    size_t k = 0;
    buf[0] = '\0';
    if (id == VL_SER_REGIME)
        for (int r = 0; r < VL_NREGIMES && k < n; r++)
            k += (size_t)snprintf(buf + k, n - k, "%s%d=%s", r ? " " : "", r, vl_regime_name(r));
    if (id == VL_SER_H_LIMIT)
        for (int r = 0; r < 3 && k < n; r++)
            k += (size_t)snprintf(buf + k, n - k, "%s%d=%s", r ? " " : "", r, limits[r]);
}

int vl_series_write_header(FILE *f, const vl_model *m)
{
    char codes[256];
    for (int id = 0; id < VL_NSERIES; id++)
        if (vl_series_columns[id].kind == VL_COL_CODE) {
            vl_series_codes(id, codes, sizeof codes);
            fprintf(f, "# %s: %s\n", vl_series_columns[id].name, codes);
        }
    fprintf(f, "# p_*_bar: partial pressures (mole fraction x surface pressure); *_to: "
               "terrestrial oceans of %.4g kg; *_kg_s: process fluxes (redox_*_kg_s: kg O-equivalent/s, signed); every column's unit "
               "and meaning: volev columns (docs/columns.md)\n",
            VL_TO_KG);
    for (int id = 0; id < VL_NSERIES; id++)
        fprintf(f, "%s%s", id ? "," : "", vl_series_columns[id].name);
    for (int r = 0; r < VL_NRES; r++)
        fprintf(f, ",%s_kg", vl_reservoir_name(r));
    for (size_t c = 0; c < m->ncolumns; c++)
        fprintf(f, ",%s", m->col_name[c]);
    return fputc('\n', f) == EOF ? -1 : 0;
}

/* sep then v as "%.10g" writes it (numfmt.h: the same bytes, a tenth of the work), under
 * the output number rule (vl_output_number): a value that is not finite has none and is
 * an empty field, a zero is written without a sign. */
static void put_number(FILE *f, const char *sep, double v)
{
    char buf[48];
    fputs(sep, f);
    if (isfinite(v))
        fwrite(buf, 1, (size_t)vl_format_g(buf, sizeof buf, 10, v == 0.0 ? 0.0 : v), f);
}

int vl_series_write_row(FILE *f, const vl_row *r)
{
    for (int id = 0; id < VL_NSERIES; id++) {
        const vl_series_column *c = &vl_series_columns[id];
        double v = c->value(r);
        if (c->kind == VL_COL_CODE && isfinite(v))
            fprintf(f, "%s%d", id ? "," : "", (int)v);
        else /* no value (not finite): an empty field */
            put_number(f, id ? "," : "", v);
    }
    for (int q = 0; q < VL_NRES; q++)
        put_number(f, ",", clamp0(r->y[q]));
    for (size_t c = 0; c < r->m->ncolumns; c++) /* the redox columns are signed */
        put_number(f, ",", c < r->m->nflux ? clamp0(r->columns[c]) : r->columns[c]);
    return fputc('\n', f) == EOF ? -1 : 0;
}
